import { bandedAddBlock, createBandedMatrix, type BandedMatrix } from '../eigen/BandedMatrix.ts';
import { beamElement, beamElementScratch } from './beamElement.ts';
import { elementTypeFor, type BeamElementType, type BeamTheory } from './beamElementType.ts';
import type { BeamLine, LineHole } from './BeamLine.ts';
import type { SectionLaw } from './sectionLaw.ts';
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
    const h = nodes[e + 1]! - nodes[e]!;
    if (hole >= 0) {
      const matrices = drilledElement(element, nodes[e]!, h, thickness.start[e]!, thickness.end[e]!, line.law, line.holes![hole]!, scratch);
      bandedAddBlock(stiffness, e * stride, n, matrices.stiffness);
      bandedAddBlock(mass, e * stride, n, matrices.mass);
      continue;
    }
    beamElement(element, h, thickness.start[e]!, thickness.end[e]!, line.law, ke, me, scratch);
    bandedAddBlock(stiffness, e * stride, n, ke);
    bandedAddBlock(mass, e * stride, n, me);
  }
  return { nodes, theory, element, stiffness, mass, thickness, holes };
}

/** Drilled elements already integrated, by law (the designer re-assembles the same drilled ends hundreds of times). */
const drilledCache = new WeakMap<SectionLaw, Map<string, { stiffness: Float64Array; mass: Float64Array }>>();
/** Entries kept per law before the cache starts afresh. */
const drilledCacheSize = 64;

/**
 * The matrices of an element inside a cord hole's span (the hole's angle rule), from the cache
 * when the same element (type, length, thicknesses, place in the hole) was integrated with the
 * same law before. The cached arrays are shared: read only.
 */
function drilledElement(type: BeamElementType, x0: number, h: number, t0: number, t1: number, law: SectionLaw, hole: LineHole, scratch: ReturnType<typeof beamElementScratch>): { stiffness: Float64Array; mass: Float64Array } {
  let byKey = drilledCache.get(law);
  if (!byKey) {
    byKey = new Map();
    drilledCache.set(law, byKey);
  }
  const key = `${type.theory}${type.localDofs}|${h}|${t0}|${t1}|${x0 - hole.position}|${hole.radius}|${hole.depthBelowTop}`;
  const known = byKey.get(key);
  if (known) return known;
  const n = type.localDofs;
  const matrices = { stiffness: new Float64Array(n * n), mass: new Float64Array(n * n) };
  beamElement(type, h, t0, t1, law, matrices.stiffness, matrices.mass, scratch, drilledElementRule(x0, x0 + h, hole));
  if (byKey.size >= drilledCacheSize) byKey.clear();
  byKey.set(key, matrices);
  return matrices;
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
