import { bandedAddElement, createBandedMatrix, type BandedMatrix } from '../eigen/BandedMatrix.ts';
import type { BeamLine } from './BeamLine.ts';
import { elementThicknesses } from './elementThicknesses.ts';
import { torsionElement } from './torsionElement.ts';

/** Assembled torsion matrices; dof 2e is mesh node e, dof 2e+1 the midpoint of element e. */
export interface TorsionSystem {
  readonly nodes: Float64Array;
  readonly stiffness: BandedMatrix;
  readonly mass: BandedMatrix;
  readonly thickness: { interval: Int32Array; start: Float64Array; end: Float64Array };
}

/** Assembles St-Venant torsion (quadratic elements, half-bandwidth 2) of a beam line. */
export function assembleTorsion(nodes: Float64Array, line: BeamLine): TorsionSystem {
  const elements = nodes.length - 1;
  const size = 2 * elements + 1;
  const stiffness = createBandedMatrix(size, 2);
  const mass = createBandedMatrix(size, 2);
  const thickness = elementThicknesses(nodes, line.profile);
  const ke = new Float64Array(9);
  const me = new Float64Array(9);
  const dofs = new Int32Array(3);
  for (let e = 0; e < elements; e++) {
    torsionElement(nodes[e + 1]! - nodes[e]!, thickness.start[e]!, thickness.end[e]!, line.law, ke, me);
    dofs[0] = 2 * e;
    dofs[1] = 2 * e + 1;
    dofs[2] = 2 * e + 2;
    bandedAddElement(stiffness, dofs, ke);
    bandedAddElement(mass, dofs, me);
  }
  return { nodes, stiffness, mass, thickness };
}

/** The rigid-body mode of free–free torsion: the same twist everywhere. */
export function torsionRigidMode(size: number): Float64Array {
  return new Float64Array(size).fill(1);
}
