import { gaussLegendre, type QuadratureRule } from './gaussLegendre.ts';
import type { DrilledRule } from './holeQuadrature.ts';
import { lagrangeBasis } from './lagrangeBasis.ts';
import type { SectionLaw } from './sectionLaw.ts';

/**
 * A St-Venant torsion element: Lagrange interpolation of the twist angle of the given degree on
 * equally spaced reference points, dofs [ψ at ξ = 0, interior points…, ψ at ξ = 1] (consecutive
 * elements share their end dofs). Eigenvalue error O(h^{2·degree}) (Strang & Fix, An Analysis of
 * the Finite Element Method, §6.3).
 */
export interface TorsionElementType {
  readonly degree: number;
  readonly localDofs: number;
  /** Reference positions ξ of the dofs. */
  readonly points: readonly number[];
  readonly quadrature: QuadratureRule;
  /** Basis values and ξ-slopes at each quadrature point (row g, column = local dof). */
  readonly values: Float64Array;
  readonly slopes: Float64Array;
}

/**
 * The torsion element of a given degree, with a Gauss rule of degree + 2 points: exact for a
 * linearly tapering rectangle's mass integrand (ρI_p cubic in t, so degree 2·degree + 3).
 */
export function lagrangeTorsionElement(degree: number): TorsionElementType {
  const points = Array.from({ length: degree + 1 }, (_, k) => k / degree);
  const quadrature = gaussLegendre(degree + 2);
  const localDofs = degree + 1;
  const values = new Float64Array(quadrature.points.length * localDofs);
  const slopes = new Float64Array(quadrature.points.length * localDofs);
  const v = new Float64Array(localDofs);
  const s = new Float64Array(localDofs);
  quadrature.points.forEach((xi, g) => {
    lagrangeBasis(points, xi, v, s);
    values.set(v, g * localDofs);
    slopes.set(s, g * localDofs);
  });
  return { degree, localDofs, points, quadrature, values, slopes };
}

/**
 * The torsion element barwright uses: quartic twist (eigenvalue error O(h⁸)), so torsion is as
 * well resolved as bending on the same mesh (measured 8.5e-5 cent on torsion modes 1–5 of the
 * bench's deep undercut at its default 19-element mesh, where quadratic elements on the same
 * mesh were 1.3 cent off on mode 5; ≤ 1.2e-3 cent on four test bars).
 */
export const torsionElementType: TorsionElementType = lagrangeTorsionElement(4);

const properties = new Float64Array(2);
const drilledValues = new Float64Array(16);
const drilledSlopes = new Float64Array(16);

/**
 * Stiffness and mass (row-major, localDofs square) of one St-Venant torsion element of length h
 * (m), thickness linear from thickness0 to thickness1 (m), by Gauss quadrature over the real
 * varying section: K = ∫ GJ·N′ᵀN′ dx, M = ∫ ρI_p·NᵀN dx; inside a cord hole's span (`drilled`)
 * with the hole's angle rule and the net section (holeQuadrature.ts). Elements know nothing
 * about supports.
 */
export function torsionElement(
  h: number,
  thickness0: number,
  thickness1: number,
  law: SectionLaw,
  stiffness: Float64Array,
  mass: Float64Array,
  type: TorsionElementType = torsionElementType,
  drilled?: DrilledRule,
): void {
  const n = type.localDofs;
  stiffness.fill(0);
  mass.fill(0);
  const add = (weight: number, values: Float64Array, slopes: Float64Array, row: number): void => {
    const k = (weight * properties[0]!) / (h * h);
    const m = weight * properties[1]!;
    for (let a = 0; a < n; a++) {
      const ka = k * slopes[row + a]!;
      const ma = m * values[row + a]!;
      for (let b = 0; b <= a; b++) {
        stiffness[a * n + b]! += ka * slopes[row + b]!;
        mass[a * n + b]! += ma * values[row + b]!;
      }
    }
  };
  if (drilled) {
    if (!law.evaluateDrilled) throw new Error('internal: a cord hole in a section that cannot be drilled');
    const values = drilledValues.subarray(0, n);
    const slopes = drilledSlopes.subarray(0, n);
    for (let g = 0; g < drilled.xi.length; g++) {
      const xi = drilled.xi[g]!;
      law.evaluateDrilled(thickness0 + xi * (thickness1 - thickness0), drilled.chord[g]!, drilled.depthBelowTop, properties);
      lagrangeBasis(type.points, xi, values, slopes);
      add(drilled.weight[g]!, values, slopes, 0);
    }
  } else {
    const { points, weights } = type.quadrature;
    for (let g = 0; g < points.length; g++) {
      law.evaluate(thickness0 + points[g]! * (thickness1 - thickness0), properties);
      add(weights[g]! * h, type.values, type.slopes, g * n);
    }
  }
  for (let a = 0; a < n; a++) {
    for (let b = 0; b < a; b++) {
      stiffness[b * n + a] = stiffness[a * n + b]!;
      mass[b * n + a] = mass[a * n + b]!;
    }
  }
}
