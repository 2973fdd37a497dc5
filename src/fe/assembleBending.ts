import { bandedAddBlock, createBandedMatrix, type BandedMatrix } from '../eigen/BandedMatrix.ts';
import { beamElement, beamElementScratch } from './beamElement.ts';
import { elementTypeFor, type BeamElementType, type BeamTheory } from './beamElementType.ts';
import type { BeamLine } from './BeamLine.ts';
import { elementThicknesses } from './elementThicknesses.ts';
import { drilledElementRule, elementHoles } from './holeQuadrature.ts';

/**
 * Assembled bending matrices of a beam line. Global dofs run element by element: node e's
 * [w, θ] at offset(e) = e·(2 + internalDofs), then element e's internal dofs, then node e+1.
 */
export interface BendingSystem {
  readonly nodes: Float64Array;
  readonly theory: BeamTheory;
  readonly element: BeamElementType;
  readonly stiffness: BandedMatrix;
  readonly mass: BandedMatrix;
  /** Each element's thickness at its two ends (m) and its profile interval. */
  readonly thickness: { interval: Int32Array; start: Float64Array; end: Float64Array };
  /** Each element's cord hole (index into the line's holes), or −1 where it is not drilled. */
  readonly holes: Int32Array;
}

/** First global dof of element e (its left node's deflection). */
export function elementOffset(system: BendingSystem, e: number): number {
  return e * (2 + system.element.internalDofs);
}

/**
 * Assembles the global symmetric banded stiffness and mass matrices of a beam line on the given
 * mesh with the chosen theory's element (see beamElementType.ts); elements inside a cord hole's
 * span are integrated with the hole's own rule (holeQuadrature.ts).
 */
export function assembleBending(nodes: Float64Array, line: BeamLine, theory: BeamTheory): BendingSystem {
  const element = elementTypeFor(theory);
  const elements = nodes.length - 1;
  const stride = 2 + element.internalDofs;
  const size = elements * stride + 2;
  // Envelope: an element's dofs couple only to each other, so row d reaches back to the first
  // dof of the first element holding d.
  const firstColumn = new Int32Array(size);
  for (let e = elements - 1; e >= 0; e--) for (let a = 0; a < element.localDofs; a++) firstColumn[e * stride + a] = e * stride;
  const stiffness = createBandedMatrix(size, element.localDofs - 1, firstColumn);
  const mass = createBandedMatrix(size, element.localDofs - 1, firstColumn);
  const thickness = elementThicknesses(nodes, line.profile);
  const n = element.localDofs;
  const ke = new Float64Array(n * n);
  const me = new Float64Array(n * n);
  const scratch = beamElementScratch(element);
  const holes = elementHoles(nodes, line.holes);
  for (let e = 0; e < elements; e++) {
    const hole = holes[e]!;
    const drilled = hole >= 0 ? drilledElementRule(nodes[e]!, nodes[e + 1]!, line.holes![hole]!) : undefined;
    beamElement(element, nodes[e + 1]! - nodes[e]!, thickness.start[e]!, thickness.end[e]!, line.law, ke, me, scratch, drilled);
    bandedAddBlock(stiffness, e * stride, n, ke);
    bandedAddBlock(mass, e * stride, n, me);
  }
  return { nodes, theory, element, stiffness, mass, thickness, holes };
}

/**
 * Kind (0 deflection, 1 rotation) and position x (m) of every global dof of a bending system.
 */
export function bendingDofLayout(system: BendingSystem): { kind: Uint8Array; position: Float64Array } {
  const { nodes, element } = system;
  const size = system.stiffness.size;
  const kind = new Uint8Array(size);
  const position = new Float64Array(size);
  const stride = 2 + element.internalDofs;
  for (let e = 0; e + 1 < nodes.length; e++) {
    const x0 = nodes[e]!;
    const h = nodes[e + 1]! - x0;
    for (let a = 0; a < element.localDofs; a++) {
      kind[e * stride + a] = element.dofKind[a]!;
      position[e * stride + a] = x0 + element.dofPosition[a]! * h;
    }
  }
  return { kind, position };
}

/**
 * The two rigid-body modes of a free–free bending system: translation (w = 1, θ = 0) and
 * rotation about x = 0 (w = x, θ = 1). Both are exactly in every element's space.
 */
export function bendingRigidModes(system: BendingSystem): Float64Array[] {
  const { kind, position } = bendingDofLayout(system);
  const translation = new Float64Array(kind.length);
  const rotation = new Float64Array(kind.length);
  for (let i = 0; i < kind.length; i++) {
    translation[i] = kind[i] === 0 ? 1 : 0;
    rotation[i] = kind[i] === 0 ? position[i]! : 1;
  }
  return [translation, rotation];
}
