import { bandedAddBlock, createBandedMatrix, type BandedMatrix } from '../eigen/BandedMatrix.ts';
import type { BeamLine } from './BeamLine.ts';
import { elementThicknesses } from './elementThicknesses.ts';
import { drilledElementRule, elementHoles } from './holeQuadrature.ts';
import { torsionElement, torsionElementType, type TorsionElementType } from './torsionElement.ts';

/**
 * Assembled torsion matrices. With element degree p, dof p·e is mesh node e and dofs p·e + 1 …
 * p·e + p − 1 are element e's interior points.
 */
export interface TorsionSystem {
  readonly nodes: Float64Array;
  readonly element: TorsionElementType;
  readonly stiffness: BandedMatrix;
  readonly mass: BandedMatrix;
  readonly thickness: { interval: Int32Array; start: Float64Array; end: Float64Array };
  /** Each element's cord hole (index into the line's holes), or −1. */
  readonly holes: Int32Array;
}

/** Assembles St-Venant torsion of a beam line (half-bandwidth = element degree); cord holes as in assembleBending. */
export function assembleTorsion(nodes: Float64Array, line: BeamLine, element: TorsionElementType = torsionElementType): TorsionSystem {
  const elements = nodes.length - 1;
  const degree = element.degree;
  const n = element.localDofs;
  const size = degree * elements + 1;
  // Envelope: row d reaches back to the first dof of the first element holding d.
  const firstColumn = new Int32Array(size);
  for (let e = elements - 1; e >= 0; e--) for (let a = 0; a < n; a++) firstColumn[degree * e + a] = degree * e;
  const stiffness = createBandedMatrix(size, degree, firstColumn);
  const mass = createBandedMatrix(size, degree, firstColumn);
  const thickness = elementThicknesses(nodes, line.profile);
  const ke = new Float64Array(n * n);
  const me = new Float64Array(n * n);
  const holes = elementHoles(nodes, line.holes);
  for (let e = 0; e < elements; e++) {
    const hole = holes[e]!;
    const drilled = hole >= 0 ? drilledElementRule(nodes[e]!, nodes[e + 1]!, line.holes![hole]!) : undefined;
    torsionElement(nodes[e + 1]! - nodes[e]!, thickness.start[e]!, thickness.end[e]!, line.law, ke, me, element, drilled);
    bandedAddBlock(stiffness, degree * e, n, ke);
    bandedAddBlock(mass, degree * e, n, me);
  }
  return { nodes, element, stiffness, mass, thickness, holes };
}

/** The rigid-body mode of free–free torsion: the same twist everywhere. */
export function torsionRigidMode(size: number): Float64Array {
  return new Float64Array(size).fill(1);
}
