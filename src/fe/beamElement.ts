import type { BeamElementType } from './beamElementType.ts';
import type { DrilledRule } from './holeQuadrature.ts';
import type { SectionLaw } from './sectionLaw.ts';

/** Scratch space for one element type (allocated once per assembly, reused for every element). */
export interface BeamElementScratch {
  readonly properties: Float64Array;
  readonly deflection: Float64Array;
  readonly rotation: Float64Array;
  readonly curvature: Float64Array;
  readonly shear: Float64Array;
}

/** Scratch arrays sized for an element type. */
export function beamElementScratch(type: BeamElementType): BeamElementScratch {
  const n = type.localDofs;
  return { properties: new Float64Array(4), deflection: new Float64Array(n), rotation: new Float64Array(n), curvature: new Float64Array(n), shear: new Float64Array(n) };
}

/**
 * Stiffness and mass (row-major, localDofs square) of one beam element of length h (m) whose
 * thickness varies linearly from thickness0 to thickness1 (m), by Gauss quadrature over the real
 * varying section:
 * K = ∫ EI·B_bᵀB_b + κGA·B_sᵀB_s dx,   M = ∫ ρA·N_wᵀN_w + ρI·N_θᵀN_θ dx.
 * Euler–Bernoulli elements have no shear strain and, as in the classical model
 * (EI w″)″ = ρAω²w, no rotary inertia. Inside a cord hole's span (`drilled`), the hole's angle
 * rule replaces the element's own (holeQuadrature.ts) and the law gives the net section there.
 * Elements know nothing about supports.
 */
export function beamElement(
  type: BeamElementType,
  h: number,
  thickness0: number,
  thickness1: number,
  law: SectionLaw,
  stiffness: Float64Array,
  mass: Float64Array,
  scratch: BeamElementScratch = beamElementScratch(type),
  drilled?: DrilledRule,
): void {
  const n = type.localDofs;
  const { properties, deflection, rotation, curvature, shear } = scratch;
  stiffness.fill(0);
  mass.fill(0);
  if (drilled) {
    if (!law.evaluateDrilled) throw new Error('internal: a cord hole in a section that cannot be drilled');
    for (let g = 0; g < drilled.xi.length; g++) {
      const xi = drilled.xi[g]!;
      law.evaluateDrilled(thickness0 + xi * (thickness1 - thickness0), drilled.chord[g]!, drilled.depthBelowTop, properties);
      type.evaluate(xi, h, deflection, rotation, curvature, shear);
      accumulate(type, drilled.weight[g]!, scratch, stiffness, mass);
    }
  } else {
    const { points, weights } = type.quadrature;
    for (let g = 0; g < points.length; g++) {
      law.evaluate(thickness0 + points[g]! * (thickness1 - thickness0), properties);
      type.evaluateAtQuadraturePoint(g, h, deflection, rotation, curvature, shear);
      accumulate(type, weights[g]! * h, scratch, stiffness, mass);
    }
  }
  for (let a = 0; a < n; a++) {
    for (let b = 0; b < a; b++) {
      stiffness[b * n + a] = stiffness[a * n + b]!;
      mass[b * n + a] = mass[a * n + b]!;
    }
  }
}

/**
 * Adds one quadrature point's share (weight in m) to the lower triangles of K and M, each
 * product only over the dofs where its factors can be non-zero (both index lists are ascending,
 * so (a, b) with b ≤ a stays in the lower triangle). Properties and fields are in the scratch.
 */
function accumulate(type: BeamElementType, weight: number, scratch: BeamElementScratch, stiffness: Float64Array, mass: Float64Array): void {
  const n = type.localDofs;
  const { properties, deflection, rotation, curvature, shear } = scratch;
  const wDofs = type.deflectionDofs;
  const tDofs = type.rotationDofs;
  const bending = weight * properties[0]!;
  const massPerLength = weight * properties[2]!;
  for (let ia = 0; ia < tDofs.length; ia++) {
    const a = tDofs[ia]!;
    const ba = bending * curvature[a]!;
    const row = a * n;
    for (let ib = 0; ib <= ia; ib++) {
      const b = tDofs[ib]!;
      stiffness[row + b]! += ba * curvature[b]!;
    }
  }
  for (let ia = 0; ia < wDofs.length; ia++) {
    const a = wDofs[ia]!;
    const ma = massPerLength * deflection[a]!;
    const row = a * n;
    for (let ib = 0; ib <= ia; ib++) {
      const b = wDofs[ib]!;
      mass[row + b]! += ma * deflection[b]!;
    }
  }
  if (type.theory !== 'timoshenko') return;
  const shearStiffness = weight * properties[1]!;
  const rotary = weight * properties[3]!;
  for (let a = 0; a < n; a++) {
    const sa = shearStiffness * shear[a]!;
    const row = a * n;
    for (let b = 0; b <= a; b++) stiffness[row + b]! += sa * shear[b]!;
  }
  for (let ia = 0; ia < tDofs.length; ia++) {
    const a = tDofs[ia]!;
    const ra = rotary * rotation[a]!;
    const row = a * n;
    for (let ib = 0; ib <= ia; ib++) {
      const b = tDofs[ib]!;
      mass[row + b]! += ra * rotation[b]!;
    }
  }
}
