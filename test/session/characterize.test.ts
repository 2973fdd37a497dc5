// Blank characterisation: a Timoshenko inversion of tapped partials for E and G.
// Synthetic partials come from the independent closed-form free–free Timoshenko frequency
// equation (Huang 1961, as in Han, Benaroya & Wei, J. Sound Vib. 225 (1999) 935; memory;
// test/reference/huangFreeFree.ts), not from the finite elements being inverted.
import { describe, expect, it } from 'vitest';
import { parseBarFile, type BarFile } from '../../src/fileFormats/barFile.ts';
import { characterizeBlank } from '../../src/session/characterizeBlank.ts';
import { huangFreeFreeFrequencies } from '../reference/huangFreeFree.ts';
import { seededRandom } from './simulatedBar.ts';

interface Blank {
  name: string;
  lengthMm: number;
  widthMm: number;
  thicknessMm: number;
  E_GPa: number;
  G_GPa: number;
  density: number;
  /** The maker's guess, deliberately off. */
  guess: { E_GPa: number; G_GPa: number; density_kg_m3: number };
}

/** Invented blanks: three woods (E/G 10–18) of different slenderness, and an aluminium bar (E/G ≈ 2.66). */
const blanks: Blank[] = [
  { name: 'F3 hardwood 440×58×24', lengthMm: 440, widthMm: 58, thicknessMm: 24, E_GPa: 19.3, G_GPa: 1.1, density: 985, guess: { E_GPa: 17.2, G_GPa: 1.25, density_kg_m3: 985 } },
  { name: 'C5 hardwood 330×50×21', lengthMm: 330, widthMm: 50, thicknessMm: 21, E_GPa: 16.1, G_GPa: 1.55, density: 1010, guess: { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1010 } },
  { name: 'C7 hardwood 170×38×18', lengthMm: 170, widthMm: 38, thicknessMm: 18, E_GPa: 21.4, G_GPa: 1.45, density: 1050, guess: { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1050 } },
  { name: 'aluminium 300×38×12', lengthMm: 300, widthMm: 38, thicknessMm: 12, E_GPa: 68.9, G_GPa: 25.9, density: 2700, guess: { E_GPa: 70, G_GPa: 26.3, density_kg_m3: 2700 } },
];

const kappa = 5 / 6;

function barOf(blank: Blank): BarFile {
  return parseBarFile({ length_mm: blank.lengthMm, section: { shape: 'rect', width_mm: blank.widthMm, thickness_mm: blank.thicknessMm }, material: blank.guess });
}

/** Exact partials (Hz) of the uniform blank by the closed-form frequency equation. */
function exactPartials(blank: Blank, count: number): number[] {
  const b = blank.widthMm * 1e-3;
  const t = blank.thicknessMm * 1e-3;
  const area = b * t;
  const inertia = (b * t ** 3) / 12;
  return huangFreeFreeFrequencies(
    { length: blank.lengthMm * 1e-3, bendingStiffness: blank.E_GPa * 1e9 * inertia, shearStiffness: kappa * blank.G_GPa * 1e9 * area, massPerLength: blank.density * area, rotaryInertiaPerLength: blank.density * inertia },
    count,
  );
}

function massGrams(blank: Blank): number {
  return blank.lengthMm * blank.widthMm * blank.thicknessMm * 1e-9 * blank.density * 1e3;
}

describe('characterizeBlank', () => {
  for (const blank of blanks) {
    it(`recovers E and G of a uniform ${blank.name} within 1 % from noise-free partials`, () => {
      const hz = exactPartials(blank, 3);
      const result = characterizeBlank({ bar: barOf(blank), measuredHz: hz, massGrams: massGrams(blank) });
      // 1 %: the requirement. The finite elements converge to well under 0.001 cent
      // (src/modes/meshDensity.ts), so the recovery is in fact far better.
      expect(Math.abs(result.material.E_GPa / blank.E_GPa - 1)).toBeLessThan(0.01);
      expect(Math.abs(result.material.G_GPa / blank.G_GPa - 1)).toBeLessThan(0.01);
      expect(result.material.density_kg_m3).toBeCloseTo(blank.density, 6);
      expect(result.consistent).toBe(true);
      expect(result.warnings).toEqual([]);
      result.residual_cents.forEach((r) => expect(Math.abs(r)).toBeLessThan(0.01));
    });
  }

  it('is tighter than 0.01 % when the partials are exact (the inversion itself adds nothing)', () => {
    const blank = blanks[0]!;
    const result = characterizeBlank({ bar: barOf(blank), measuredHz: exactPartials(blank, 2) });
    expect(Math.abs(result.material.E_GPa / blank.E_GPa - 1)).toBeLessThan(1e-4);
    expect(Math.abs(result.material.G_GPa / blank.G_GPa - 1)).toBeLessThan(1e-4);
  });

  it('reports an uncertainty that covers the truth under ±0.5 cent noise, wider than with exact readings', () => {
    const random = seededRandom(11);
    for (const blank of blanks.slice(0, 3)) {
      const exact = exactPartials(blank, 3);
      const precise = characterizeBlank({ bar: barOf(blank), measuredHz: exact, massGrams: massGrams(blank), uncertaintyCents: 0.05 });
      let covered = 0;
      const trials = 12;
      for (let trial = 0; trial < trials; trial++) {
        const noisy = exact.map((f) => f * 2 ** (((2 * random() - 1) * 0.5) / 1200));
        const result = characterizeBlank({ bar: barOf(blank), measuredHz: noisy, massGrams: massGrams(blank), uncertaintyCents: 0.5 });
        expect(result.uncertainty.from_partials.G_GPa).toBeGreaterThan(precise.uncertainty.from_partials.G_GPa);
        expect(result.uncertainty.from_partials.E_GPa).toBeGreaterThan(precise.uncertainty.from_partials.E_GPa);
        expect(result.uncertainty.total.E_GPa).toBeGreaterThanOrEqual(result.uncertainty.from_partials.E_GPa);
        const zE = Math.abs(result.material.E_GPa - blank.E_GPa) / result.uncertainty.total.E_GPa;
        const zG = Math.abs(result.material.G_GPa - blank.G_GPa) / result.uncertainty.total.G_GPa;
        if (zE <= 2 && zG <= 2) covered++;
        expect(result.consistent).toBe(true);
      }
      // Two sigmas cover about 95 % of a Gaussian; the noise here is uniform ±0.5 cent, inside the
      // 0.5-cent sigma assumed, so every trial should be covered.
      expect(covered).toBe(trials);
    }
  });

  it('widens the uncertainty when three partials scatter more than the readings claim', () => {
    const blank = blanks[1]!;
    const exact = exactPartials(blank, 3);
    const calm = characterizeBlank({ bar: barOf(blank), measuredHz: exact, uncertaintyCents: 0.5 });
    const scattered = characterizeBlank({ bar: barOf(blank), measuredHz: [exact[0]!, exact[1]! * 2 ** (4 / 1200), exact[2]! * 2 ** (-4 / 1200)], uncertaintyCents: 0.5 });
    expect(scattered.uncertainty.from_partials.G_GPa).toBeGreaterThan(1.2 * calm.uncertainty.from_partials.G_GPa);
  });

  it('flags inconsistent partials instead of fitting them quietly', () => {
    const blank = blanks[0]!;
    const exact = exactPartials(blank, 3);
    // Third partial 100 cents off: no single material explains all three.
    const off = characterizeBlank({ bar: barOf(blank), measuredHz: [exact[0]!, exact[1]!, exact[2]! * 2 ** (100 / 1200)] });
    expect(off.consistent).toBe(false);
    expect(off.warnings.join(' ')).toMatch(/do not fit one material/);
    // Second "partial" above anything shear can give (the Euler–Bernoulli ratio 2.7565 is the
    // ceiling, Blevins 1979 table 8-1): a torsion or side-to-side mode taken for bending.
    const ceiling = characterizeBlank({ bar: barOf(blank), measuredHz: [exact[0]!, exact[0]! * 2.9] });
    expect(ceiling.consistent).toBe(false);
    expect(ceiling.warnings.join(' ')).toMatch(/above what any shear modulus gives/);
    // Partials out of order are refused with the field named.
    expect(() => characterizeBlank({ bar: barOf(blank), measuredHz: [exact[1]!, exact[0]!] })).toThrow(/partials\[1\]: .* ascending order \(swapped\?\)/);
  });

  it('with a single partial finds E at the bar file’s E/G and says so', () => {
    const blank = blanks[0]!;
    const result = characterizeBlank({ bar: barOf(blank), measuredHz: exactPartials(blank, 1) });
    expect(result.E_over_G).toBeCloseTo(blank.guess.E_GPa / blank.guess.G_GPa, 6);
    expect(result.warnings.join(' ')).toMatch(/only one partial/);
  });
});
