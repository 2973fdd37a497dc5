import { gaussLegendre } from './gaussLegendre.ts';
import type { SectionLaw } from './sectionLaw.ts';

const properties = new Float64Array(2);

/** Quadratic Lagrange shape functions on ξ ∈ [0, 1], nodes at ξ = 0, ½, 1, and d/dξ. */
export function quadraticShapeFunctions(xi: number, values: Float64Array, slopes: Float64Array): void {
  values[0] = (1 - xi) * (1 - 2 * xi);
  values[1] = 4 * xi * (1 - xi);
  values[2] = xi * (2 * xi - 1);
  slopes[0] = 4 * xi - 3;
  slopes[1] = 4 - 8 * xi;
  slopes[2] = 4 * xi - 1;
}

const n = new Float64Array(3);
const { points: gaussPoints, weights: gaussWeights } = gaussLegendre(4);
const dn = new Float64Array(3);

/**
 * Stiffness and mass (row-major 3×3, dofs [ψ₁, ψ_mid, ψ₂] of twist angle) of one St-Venant
 * torsion element with quadratic Lagrange interpolation (eigenvalue error O(h⁴)), thickness
 * linear from thickness0 to thickness1: K = ∫ GJ·N′ᵀN′ dx, M = ∫ ρI_p·NᵀN dx, 4-point Gauss.
 */
export function torsionElement(h: number, thickness0: number, thickness1: number, law: SectionLaw, stiffness: Float64Array, mass: Float64Array): void {
  stiffness.fill(0);
  mass.fill(0);
  for (let g = 0; g < 4; g++) {
    law.evaluate(thickness0 + gaussPoints[g]! * (thickness1 - thickness0), properties);
    quadraticShapeFunctions(gaussPoints[g]!, n, dn);
    const weight = gaussWeights[g]! * h;
    const k = (weight * properties[0]!) / (h * h);
    const m = weight * properties[1]!;
    for (let a = 0; a < 3; a++) {
      for (let b = 0; b <= a; b++) {
        stiffness[a * 3 + b]! += k * dn[a]! * dn[b]!;
        mass[a * 3 + b]! += m * n[a]! * n[b]!;
      }
    }
  }
  for (let a = 0; a < 3; a++) {
    for (let b = 0; b < a; b++) {
      stiffness[b * 3 + a] = stiffness[a * 3 + b]!;
      mass[b * 3 + a] = mass[a * 3 + b]!;
    }
  }
}
