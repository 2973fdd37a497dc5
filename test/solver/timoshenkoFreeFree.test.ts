import { describe, expect, it } from 'vitest';
import { analyzeBar } from '../../src/index.ts';
import { eulerBernoulliFreeFreeRoots } from '../reference/eulerBernoulliFreeFree.ts';
import { huangFreeFreeFrequencies } from '../reference/huangFreeFree.ts';
import { barFileOf, eulerBernoulliHz, uniformBar, uniformBeamOf, workedExampleBar } from './referenceBars.ts';

const roots = eulerBernoulliFreeFreeRoots(5);

describe('uniform free–free bar, Timoshenko', () => {
  const cases = [
    { slenderness: 8, modulusRatio: 12 },
    { slenderness: 12, modulusRatio: 20 },
    { slenderness: 20, modulusRatio: 2.6 },
    { slenderness: 20, modulusRatio: 16 },
    { slenderness: 30, modulusRatio: 12 },
  ];
  for (const { slenderness, modulusRatio } of cases) {
    it(`matches the Huang frequency equation for L/h = ${slenderness}, E/G = ${modulusRatio}`, () => {
      // Source: Huang (1961) free–free frequency equation in the notation of Han, Benaroya & Wei,
      // J. Sound Vib. 225 (1999) 935 (reference-values.md; root-found by
      // test/reference/huangFreeFree.ts, itself checked against the shooting solver to 1e-8).
      // Tolerance 1e-7 relative: O(h⁸) element, measured ≤ 1.9e-11 (worked example, modes 1–4)
      // at 32 elements and 1.4e-11 on the 40 used here; the stockier cases converge more slowly.
      const thickness = 0.022;
      const bar = uniformBar(slenderness * thickness, 0.055, thickness, 14e9, 14e9 / modulusRatio, 850);
      const expected = huangFreeFreeFrequencies(uniformBeamOf(bar), 4);
      const analysis = analyzeBar(barFileOf(bar), { elements: 40, modes: 4 });
      analysis.bending.forEach((mode, i) => expect(Math.abs(mode.hz / expected[i]! - 1)).toBeLessThan(1e-7));
    });
  }

  it('reproduces the Timoshenko/EB ratio table of reference-values.md (E/G = 12, κ = 5/6)', () => {
    // Source: reference-values.md, T/EB ratio table (computed, 4 digits), EB from
    // cos βL cosh βL = 1. Tolerance 5e-5 + 1e-6: half a unit in the 4th digit plus the FE error
    // bound (≤ 1e-7 at this mesh, see above).
    const table: Record<number, number[]> = {
      10: [0.919, 0.7846, 0.662],
      15: [0.9609, 0.8836, 0.7958],
      20: [0.9774, 0.9289, 0.8674],
      30: [0.9897, 0.9662, 0.9335],
    };
    for (const [slenderness, ratios] of Object.entries(table)) {
      const thickness = 0.02;
      const bar = uniformBar(Number(slenderness) * thickness, 0.05, thickness, 20e9, 20e9 / 12, 1000);
      const analysis = analyzeBar(barFileOf(bar), { elements: 32, modes: 3 });
      const beam = uniformBeamOf(bar);
      ratios.forEach((ratio, i) => expect(Math.abs(analysis.bending[i]!.hz / eulerBernoulliHz(beam, roots[i]!) - ratio)).toBeLessThan(5e-5 + 1e-6));
    }
  });

  it('reproduces the worked example of brief.md §2 with the default mesh', () => {
    // Source: brief.md §2 (computed there by an independent shooting solver, 3 digits):
    // 400 × 50 × 20 mm, E 20 GPa, G = E/12, ρ 1000, κ 5/6 → modes 1–5 at 0.977, 0.929, 0.867,
    // 0.801, 0.736 of Euler–Bernoulli. Tolerance 5e-4: half a unit in the 3rd digit.
    const analysis = analyzeBar(barFileOf(workedExampleBar), { modes: 5 });
    const beam = uniformBeamOf(workedExampleBar);
    [0.977, 0.929, 0.867, 0.801, 0.736].forEach((ratio, i) =>
      expect(Math.abs(analysis.bending[i]!.hz / eulerBernoulliHz(beam, roots[i]!) - ratio)).toBeLessThan(5e-4));
  });

  it('rod and tube sections use Cowper\'s κ and match the Huang equation', () => {
    // Sources: Huang frequency equation (as above) with I = πd⁴/64 (rod) or π(D⁴ − d⁴)/64
    // (tube), the contract's default κ (Cowper 1966: 6(1+ν)/(7+6ν) for a solid circle, the
    // hollow-circle formula with m = r_i/r_o for a tube) and G = E/(2(1+ν)). Tolerance 1e-7
    // relative (O(h⁸) element on 40 elements, as above).
    const steelRod = { diameter: 0.012, length: 0.3, youngModulus: 200e9, density: 7850, poisson: 0.29 };
    const aluminiumTube = { outer: 0.025, wall: 0.0015, length: 0.6, youngModulus: 68.9e9, density: 2700, poisson: 0.33 };
    const cases = [
      {
        file: {
          format: 'barwright.bar' as const, version: 1 as const, label: 'rod', length_mm: 300,
          section: { shape: 'round' as const, diameter_mm: 12 },
          material: { E_GPa: 200, density_kg_m3: 7850, poisson: 0.29 },
        },
        area: (Math.PI * steelRod.diameter ** 2) / 4,
        second: (Math.PI * steelRod.diameter ** 4) / 64,
        kappa: (6 * (1 + 0.29)) / (7 + 6 * 0.29),
        ...steelRod,
      },
      {
        file: {
          format: 'barwright.bar' as const, version: 1 as const, label: 'tube', length_mm: 600,
          section: { shape: 'tube' as const, outer_diameter_mm: 25, wall_mm: 1.5 },
          material: { E_GPa: 68.9, density_kg_m3: 2700, poisson: 0.33 },
        },
        area: (Math.PI * (0.025 ** 2 - 0.022 ** 2)) / 4,
        second: (Math.PI * (0.025 ** 4 - 0.022 ** 4)) / 64,
        kappa: (() => {
          const m = 0.011 / 0.0125;
          const q = (1 + m * m) ** 2;
          return (6 * (1 + 0.33) * q) / ((7 + 6 * 0.33) * q + (20 + 12 * 0.33) * m * m);
        })(),
        ...aluminiumTube,
      },
    ];
    for (const { file, area, second, kappa, length, youngModulus, density, poisson } of cases) {
      const shearModulus = youngModulus / (2 * (1 + poisson));
      const expected = huangFreeFreeFrequencies(
        { length, bendingStiffness: youngModulus * second, shearStiffness: kappa * shearModulus * area, massPerLength: density * area, rotaryInertiaPerLength: density * second },
        4,
      );
      const analysis = analyzeBar(file, { elements: 40, modes: 4 });
      analysis.bending.forEach((mode, i) => expect(Math.abs(mode.hz / expected[i]! - 1)).toBeLessThan(1e-7));
      // Both bending planes coincide for a round section: no lateral collision warnings.
      expect(analysis.warnings.filter((w) => w.includes('lateral'))).toEqual([]);
    }
  });
});
