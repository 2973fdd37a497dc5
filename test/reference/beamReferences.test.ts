import { describe, expect, it } from 'vitest';
import { eulerBernoulliFreeFreeNodes, eulerBernoulliFreeFreeRoots } from './eulerBernoulliFreeFree.ts';
import { huangFreeFreeFrequencies, huangFreeFreeRoots, type UniformBeam } from './huangFreeFree.ts';
import { simplySupportedTimoshenkoFrequency } from './simplySupportedTimoshenko.ts';
import { timoshenkoShootingFrequencies, type BeamSectionFunctions } from './timoshenkoShooting.ts';
import { profileStations, rectangularBarSection, type RectangularBar } from './rectangularBarSection.ts';

/** Uniform rectangular beam b × h, E, G, ρ, κ in SI. */
function uniformBeam(length: number, width: number, height: number, youngModulus: number, shearModulus: number, density: number, kappa: number): UniformBeam {
  const area = width * height;
  const second = (width * height ** 3) / 12;
  return {
    length,
    bendingStiffness: youngModulus * second,
    shearStiffness: kappa * shearModulus * area,
    massPerLength: density * area,
    rotaryInertiaPerLength: density * second,
  };
}

function constantSection(beam: UniformBeam): BeamSectionFunctions {
  return {
    bendingStiffness: () => beam.bendingStiffness,
    shearStiffness: () => beam.shearStiffness,
    massPerLength: () => beam.massPerLength,
    rotaryInertiaPerLength: () => beam.rotaryInertiaPerLength,
  };
}

function eulerBernoulliHz(beam: UniformBeam, betaL: number): number {
  return ((betaL * betaL) / (2 * Math.PI * beam.length ** 2)) * Math.sqrt(beam.bendingStiffness / beam.massPerLength);
}

/** The brief's worked example: 400 × 50 × 20 mm, E 20 GPa, G = E/12, ρ 1000, κ 5/6. */
const workedExample = uniformBeam(0.4, 0.05, 0.02, 20e9, 20e9 / 12, 1000, 5 / 6);

describe('Euler–Bernoulli free–free closed form (test reference)', () => {
  it('finds the βL roots of cos βL cosh βL = 1 of reference-values.md', () => {
    // Source: reference-values.md (Blevins 1979, table 8-1, memory; 12 digits computed).
    // Tolerance 1e-10: the table's last digit is 1e-11; Brent stops at a few ulps.
    const table = [4.73004074486, 7.8532046241, 10.995607838, 14.1371654913, 17.2787596574, 20.4203522456];
    eulerBernoulliFreeFreeRoots(6).forEach((root, i) => expect(Math.abs(root - table[i]!)).toBeLessThan(1e-10));
  });

  it('agrees with the published 4–5 digit roots and ratios', () => {
    // Source: W. T. Thomson, Theory of Vibration with Applications, appendix D (published):
    // 4.7300, 7.8532, 10.9956; ratios 2.7565, 5.4039. Tolerance: half a unit in the last digit.
    const roots = eulerBernoulliFreeFreeRoots(3);
    [4.73, 7.8532, 10.9956].forEach((value, i) => expect(Math.abs(roots[i]! - value)).toBeLessThan(5e-5));
    expect(Math.abs((roots[1]! / roots[0]!) ** 2 - 2.7565)).toBeLessThan(5e-5);
    expect(Math.abs((roots[2]! / roots[0]!) ** 2 - 5.4039)).toBeLessThan(5e-5);
  });

  it('places the nodes at the x/L of reference-values.md', () => {
    // Source: reference-values.md (computed, 6 digits). Tolerance 1e-6, one unit in the 6th
    // digit: the table's inner mode-3 nodes 0.355804 / 0.644196 are off by one there (the true
    // values are 0.3558035 / 0.6441965, see the next test).
    const table = [[0.224158, 0.775842], [0.132108, 0.5, 0.867892], [0.094443, 0.355804, 0.644196, 0.905557]];
    table.forEach((nodes, i) => {
      const ours = eulerBernoulliFreeFreeNodes(i + 1);
      expect(ours).toHaveLength(nodes.length);
      ours.forEach((x, j) => expect(Math.abs(x - nodes[j]!)).toBeLessThan(1e-6));
    });
  });

  it('places the mode-3 nodes at the 12-digit values', () => {
    // Source: computed independently with 30-digit arithmetic (mpmath findroot on
    // cosh βx + cos βx − σ(sinh βx + sin βx), βL = 10.99560783800167): x/L = 0.0944428431220,
    // 0.355803453972594. Tolerance 1e-11 (Brent stops at 1e-13; the double-precision shape
    // loses ~3 digits to cancellation of cosh and σ sinh).
    const ours = eulerBernoulliFreeFreeNodes(3);
    expect(Math.abs(ours[0]! - 0.094442843122)).toBeLessThan(1e-11);
    expect(Math.abs(ours[1]! - 0.355803453972594)).toBeLessThan(1e-11);
    expect(Math.abs(ours[2]! - (1 - 0.355803453972594))).toBeLessThan(1e-11);
  });
});

describe('Huang free–free Timoshenko frequency equation (test reference)', () => {
  it('reduces to cos βL cosh βL = 1 when r = s = 0', () => {
    // Closed form: with r = s = 0, α = β = b^(-1/2) and the equation becomes 2 − 2 cosh cos = 0.
    // Tolerance 1e-12 relative: both are Brent roots of the same function to machine precision.
    const eb = eulerBernoulliFreeFreeRoots(5);
    huangFreeFreeRoots(0, 0, 5).forEach((b, i) => expect(Math.abs(b / eb[i]! ** 2 - 1)).toBeLessThan(1e-12));
  });

  it('reproduces the Timoshenko/EB ratio table of reference-values.md (E/G = 12, κ = 5/6)', () => {
    // Source: reference-values.md, T/EB ratio table (computed, 4 digits). Tolerance 5e-5: half a
    // unit in the 4th digit.
    const table: Record<number, number[]> = {
      10: [0.919, 0.7846, 0.662],
      15: [0.9609, 0.8836, 0.7958],
      20: [0.9774, 0.9289, 0.8674],
      30: [0.9897, 0.9662, 0.9335],
    };
    const eb = eulerBernoulliFreeFreeRoots(3);
    for (const [slenderness, ratios] of Object.entries(table)) {
      const r2 = 1 / (12 * Number(slenderness) ** 2);
      const s2 = (r2 * 12) / (5 / 6);
      huangFreeFreeRoots(r2, s2, 3).forEach((b, i) => expect(Math.abs(b / eb[i]! ** 2 - ratios[i]!)).toBeLessThan(5e-5));
    }
  });
});

describe('Timoshenko shooting solver (test reference)', () => {
  it('agrees with the Huang roots on uniform bars to 1e-8 (two independent methods)', () => {
    // Source: Huang frequency equation (closed form, root-found) vs numerical shooting.
    // Tolerance 1e-8 relative: dopri's 1e-10 step tolerance gives ~1e-11 here (measured), with
    // margin for the stiffer shear-soft case.
    for (const beam of [workedExample, uniformBeam(0.3, 0.04, 0.03, 12e9, 0.8e9, 750, 5 / 6), uniformBeam(0.5, 0.03, 0.012, 69e9, 26e9, 2700, 0.85)]) {
      const expected = huangFreeFreeFrequencies(beam, 4);
      const shot = timoshenkoShootingFrequencies(constantSection(beam), beam.length, 4);
      shot.forEach((hz, i) => expect(Math.abs(hz / expected[i]! - 1)).toBeLessThan(1e-8));
    }
  });

  it('tells the correct Huang equation from the r/s-swapped variant', () => {
    // reference-values.md warns that a variant with r and s swapped gives wrong roots: the
    // shooting solver must side with one of them, by a margin far above its own error.
    const beam = uniformBeam(0.3, 0.04, 0.03, 12e9, 0.8e9, 750, 5 / 6);
    const r2 = beam.rotaryInertiaPerLength / (beam.massPerLength * beam.length ** 2);
    const s2 = beam.bendingStiffness / (beam.shearStiffness * beam.length ** 2);
    const shot = timoshenkoShootingFrequencies(constantSection(beam), beam.length, 2);
    const scale = eulerBernoulliHz(beam, 1);
    const swapped = huangFreeFreeRoots(s2, r2, 2).map((b) => b * scale);
    swapped.forEach((hz, i) => expect(Math.abs(hz / shot[i]! - 1)).toBeGreaterThan(1e-3));
  });

  it('gives the Euler–Bernoulli closed form in its EB limit', () => {
    // Source: cos βL cosh βL = 1 (Blevins 1979, table 8-1). Tolerance 1e-9 relative (shooting
    // with step tolerance 1e-10; measured ~2e-13).
    const roots = eulerBernoulliFreeFreeRoots(5);
    const shot = timoshenkoShootingFrequencies(constantSection(workedExample), workedExample.length, 5, { theory: 'euler-bernoulli' });
    shot.forEach((hz, i) => expect(Math.abs(hz / eulerBernoulliHz(workedExample, roots[i]!) - 1)).toBeLessThan(1e-9));
  });

  it('reproduces the worked example of brief.md §2 (modes 1–5 at 0.977 … 0.736 of EB)', () => {
    // Source: brief.md §2 worked example (computed there by an independent shooting solver,
    // 3 digits). Tolerance 5e-4: half a unit in the 3rd digit.
    const roots = eulerBernoulliFreeFreeRoots(5);
    const shot = timoshenkoShootingFrequencies(constantSection(workedExample), workedExample.length, 5);
    [0.977, 0.929, 0.867, 0.801, 0.736].forEach((ratio, i) =>
      expect(Math.abs(shot[i]! / eulerBernoulliHz(workedExample, roots[i]!) - ratio)).toBeLessThan(5e-4));
  });

  it('matches the simply supported closed form with its simply supported ends', () => {
    // Source: simply supported Timoshenko closed form (reference-values.md). Tolerance 1e-8
    // relative, as for the free–free comparison.
    const beam = uniformBeam(0.3, 0.04, 0.03, 12e9, 0.8e9, 750, 5 / 6);
    const shot = timoshenkoShootingFrequencies(constantSection(beam), beam.length, 4, { ends: 'simply-supported' });
    shot.forEach((hz, i) => expect(Math.abs(hz / simplySupportedTimoshenkoFrequency(beam, i + 1) - 1)).toBeLessThan(1e-8));
  });

  it('gives the same frequencies for a profile and its mirror image', () => {
    // Symmetry of the free–free problem under x → L − x; the shooting starts from x = 0 so an
    // asymmetric profile is integrated differently each way. Tolerance 1e-8 relative.
    const bar: RectangularBar = {
      length: 0.36, width: 0.05, youngModulus: 14e9, shearModulus: 1.1e9, density: 900, shearCoefficient: 5 / 6,
      profile: [[0, 0.022], [0.06, 0.022], [0.15, 0.009], [0.21, 0.012], [0.3, 0.02], [0.36, 0.022]],
    };
    const mirrored: RectangularBar = { ...bar, profile: [...bar.profile].reverse().map(([x, t]) => [bar.length - x, t] as const) };
    const forward = timoshenkoShootingFrequencies(rectangularBarSection(bar), bar.length, 3, { stations: profileStations(bar) });
    const backward = timoshenkoShootingFrequencies(rectangularBarSection(mirrored), bar.length, 3, { stations: profileStations(mirrored) });
    forward.forEach((hz, i) => expect(Math.abs(hz / backward[i]! - 1)).toBeLessThan(1e-8));
  });
});

describe('simply supported Timoshenko closed form (test reference)', () => {
  it('has the Euler–Bernoulli and Rayleigh limits', () => {
    // Closed forms: κGA → ∞ gives the Rayleigh beam ω² = EI k⁴/(ρA + ρI k²); with ρI = 0 as
    // well, Euler–Bernoulli ω² = EI k⁴/ρA. Tolerance 1e-9 relative (κGA = 1e12·EI/L² leaves a
    // shear correction of ~1e-11).
    const beam = uniformBeam(0.4, 0.05, 0.02, 20e9, 20e9 / 12, 1000, 5 / 6);
    const stiff = { ...beam, shearStiffness: (1e12 * beam.bendingStiffness) / beam.length ** 2 };
    for (let n = 1; n <= 4; n++) {
      const k = (n * Math.PI) / beam.length;
      const rayleigh = Math.sqrt((beam.bendingStiffness * k ** 4) / (beam.massPerLength + beam.rotaryInertiaPerLength * k * k)) / (2 * Math.PI);
      expect(Math.abs(simplySupportedTimoshenkoFrequency(stiff, n) / rayleigh - 1)).toBeLessThan(1e-9);
      const euler = Math.sqrt((beam.bendingStiffness * k ** 4) / beam.massPerLength) / (2 * Math.PI);
      expect(Math.abs(simplySupportedTimoshenkoFrequency({ ...stiff, rotaryInertiaPerLength: 0 }, n) / euler - 1)).toBeLessThan(1e-9);
      expect(simplySupportedTimoshenkoFrequency(beam, n)).toBeLessThan(rayleigh);
    }
  });
});
