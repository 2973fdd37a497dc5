import { describe, expect, it } from 'vitest';
import { cowperHollowCircle, cowperRectangle, cowperSolidCircle } from '../../src/section/shearCoefficient.ts';
import {
  rectangleTorsionCoefficient,
  rectangleTorsionConstant,
  rectangleTorsionConstantDerivative,
} from '../../src/section/rectangleTorsionConstant.ts';

describe('Cowper shear coefficients', () => {
  it('match the table of reference-values.md', () => {
    // Source: Cowper, J. Appl. Mech. 33 (1966) 335, formulas (memory), values in
    // reference-values.md (computed, 4 digits). Tolerance 5e-5: half a unit in the 4th digit.
    const table = [
      { nu: 0.29, rectangle: 0.8492, solid: 0.8856, hollow: 0.5321 },
      { nu: 0.33, rectangle: 0.8509, solid: 0.8886, hollow: 0.5354 },
    ];
    for (const row of table) {
      expect(Math.abs(cowperRectangle(row.nu) - row.rectangle)).toBeLessThan(5e-5);
      expect(Math.abs(cowperSolidCircle(row.nu) - row.solid)).toBeLessThan(5e-5);
      expect(Math.abs(cowperHollowCircle(row.nu, 0.9) - row.hollow)).toBeLessThan(5e-5);
    }
  });

  it('make the hollow circle a solid one at m = 0', () => {
    // Closed form: Cowper's hollow-circle formula at m = 0 is 6(1+ν)/(7+6ν). Tolerance 1e-15
    // (the same arithmetic up to rounding).
    for (const nu of [0, 0.25, 0.3, 0.45]) expect(Math.abs(cowperHollowCircle(nu, 0) - cowperSolidCircle(nu))).toBeLessThan(1e-15);
  });
});

describe('St-Venant torsion of a rectangle', () => {
  it('gives β(b/t) of the Timoshenko & Goodier series table', () => {
    // Source: Timoshenko & Goodier, Theory of Elasticity (series, memory), values in
    // reference-values.md (computed, 5 digits). Tolerance 5e-6: half a unit in the 5th digit.
    const table: [number, number][] = [[1, 0.14058], [1.5, 0.19576], [2, 0.22868], [2.5, 0.24937], [3, 0.26332], [4, 0.28081], [5, 0.29132], [6, 0.29832], [10, 0.31233]];
    for (const [aspect, beta] of table) expect(Math.abs(rectangleTorsionCoefficient(aspect) - beta)).toBeLessThan(5e-6);
  });

  it('tends to 1/3 for a thin strip', () => {
    // Closed form: β → 1/3 − 0.21 t/b as b/t → ∞ (thin-strip limit; the series' tanh terms → 1 and
    // (192/π⁵)·Σ 1/n⁵ over odd n = (192/π⁵)(31/32)ζ(5) = 0.63025). Tolerance 1e-9 at b/t = 1e4.
    const aspect = 1e4;
    const thinStrip = (1 / 3) * (1 - ((192 / Math.PI ** 5) * (31 / 32) * 1.03692775514337) / aspect);
    expect(Math.abs(rectangleTorsionCoefficient(aspect) - thinStrip)).toBeLessThan(1e-9);
  });

  it('agrees with Roark\'s approximation within 0.001', () => {
    // Source: Roark's Formulas for Stress and Strain, rectangle in torsion (memory):
    // J ≈ b t³ [1/3 − 0.21 (t/b)(1 − (t/b)⁴/12)]. reference-values.md states agreement within 0.001.
    for (let aspect = 1; aspect <= 20; aspect += 0.25) {
      const r = 1 / aspect;
      const roark = 1 / 3 - 0.21 * r * (1 - r ** 4 / 12);
      expect(Math.abs(rectangleTorsionCoefficient(aspect) - roark)).toBeLessThan(1e-3);
    }
  });

  it('is the same either way up and scales as β b t³', () => {
    // Definition J = β b t³ with b the long side. Tolerance 1e-15 relative (rounding).
    const j = rectangleTorsionConstant(0.05, 0.02);
    expect(Math.abs(rectangleTorsionConstant(0.02, 0.05) / j - 1)).toBeLessThan(1e-15);
    expect(Math.abs(j / (rectangleTorsionCoefficient(2.5) * 0.05 * 0.02 ** 3) - 1)).toBeLessThan(1e-14);
  });

  it('has the derivative dJ/dt of central finite differences', () => {
    // Computed: central difference with step 1e-6 t (truncation ~1e-12 relative, rounding
    // ~1e-16/1e-6 = 1e-10). Tolerance 1e-7 relative. Both t < b and t > b (thickness the long side).
    for (const [width, thickness] of [[0.05, 0.02], [0.05, 0.008], [0.05, 0.049], [0.02, 0.03]] as const) {
      const step = 1e-6 * thickness;
      const difference = (rectangleTorsionConstant(width, thickness + step) - rectangleTorsionConstant(width, thickness - step)) / (2 * step);
      expect(Math.abs(rectangleTorsionConstantDerivative(width, thickness) / difference - 1)).toBeLessThan(1e-7);
    }
  });
});
