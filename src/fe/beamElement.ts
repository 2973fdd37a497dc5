import type { BeamElementType } from './beamElementType.ts';
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
 * (EI w″)″ = ρAω²w, no rotary inertia. Elements know nothing about supports.
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
): void {
  const n = type.localDofs;
  const timoshenko = type.theory === 'timoshenko';
  const { points, weights } = type.quadrature;
  const { properties, deflection, rotation, curvature, shear } = scratch;
  stiffness.fill(0);
  mass.fill(0);
  for (let g = 0; g < points.length; g++) {
    const xi = points[g]!;
    law.evaluate(thickness0 + xi * (thickness1 - thickness0), properties);
    type.evaluateAtQuadraturePoint(g, h, deflection, rotation, curvature, shear);
    const weight = weights[g]! * h;
    const bending = weight * properties[0]!;
    const shearStiffness = timoshenko ? weight * properties[1]! : 0;
    const massPerLength = weight * properties[2]!;
    const rotary = timoshenko ? weight * properties[3]! : 0;
    for (let a = 0; a < n; a++) {
      const ba = bending * curvature[a]!;
      const sa = shearStiffness * shear[a]!;
      const ma = massPerLength * deflection[a]!;
      const ra = rotary * rotation[a]!;
      const row = a * n;
      for (let b = 0; b <= a; b++) {
        stiffness[row + b]! += ba * curvature[b]! + sa * shear[b]!;
        mass[row + b]! += ma * deflection[b]! + ra * rotation[b]!;
      }
    }
  }
  for (let a = 0; a < n; a++) {
    for (let b = 0; b < a; b++) {
      stiffness[b * n + a] = stiffness[a * n + b]!;
      mass[b * n + a] = mass[a * n + b]!;
    }
  }
}
