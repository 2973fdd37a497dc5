// Tuning a piece by its length alone (chime tubes and rods, plain bars): the length sensitivity
// against the closed form, the trim against an exact inverse, and the verdicts.
import { describe, expect, it } from 'vitest';
import { analyzeLineBar, InputError, lengthTrim, defaultShortenAt, type BarFile } from '../../src/index.ts';

/** A 1 in aluminium tube (25.4 × 1.6 mm; 6061-T6 values from producers' data sheets, as the preset). */
const tube = (lengthMm: number): BarFile => ({
  format: 'barwright.bar',
  version: 1,
  length_mm: lengthMm,
  section: { shape: 'tube', outer_diameter_mm: 25.4, wall_mm: 1.6 },
  material: { E_GPa: 68.9, density_kg_m3: 2700, poisson: 0.33 },
});

/** A slender steel rod, ⌀ 6 mm × 900 mm (L/D = 150: shear and rotary inertia negligible). */
const rod: BarFile = { format: 'barwright.bar', version: 1, length_mm: 900, section: { shape: 'round', diameter_mm: 6 }, material: { E_GPa: 200, density_kg_m3: 7850, poisson: 0.29 } };

const fundamental = (bar: BarFile): number => analyzeLineBar(bar, { modes: 1 }).bending[0]!.hz;
const cents = (a: number, b: number): number => 1200 * Math.log2(a / b);

describe('lengthTrim', () => {
  it('rises at the closed-form rate of a free–free beam, f ∝ 1/L² so Δf/f ≈ −2ΔL/L', () => {
    // Closed form: Euler–Bernoulli free–free beam, f = (βL)²/(2πL²)·√(EI/ρA) (Blevins 1979, table 8-1).
    const slender = lengthTrim({ bar: rod, measuredHz: fundamental(rod), targetHz: fundamental(rod), toleranceCents: 2 });
    // L/D = 150: Timoshenko's shear and rotary-inertia share is below 0.05 % (tolerance 0.3 %).
    expect(slender.cents_per_mm / slender.closed_form_cents_per_mm).toBeCloseTo(1, 2);
    expect(Math.abs(slender.cents_per_mm / slender.closed_form_cents_per_mm - 1)).toBeLessThan(0.003);
    // A chime tube of L/D ≈ 21: shear lowers the rate a little (Timoshenko), within 3 %.
    const chime = lengthTrim({ bar: tube(540), measuredHz: 520, targetHz: 525.6, toleranceCents: 3 });
    expect(chime.cents_per_mm).toBeGreaterThan(0.97 * chime.closed_form_cents_per_mm);
    expect(chime.cents_per_mm).toBeLessThan(1.0 * chime.closed_form_cents_per_mm);
  });

  it('trims a slender rod by the closed-form length, L(1 − √(f/f_target))', () => {
    // Closed form f ∝ 1/L² (uniform free–free beam): the length sounding f_target is L·√(f/f_target).
    const measured = 410;
    const target = 420;
    const trim = lengthTrim({ bar: rod, measuredHz: measured, targetHz: target, toleranceCents: 2 });
    const closedForm = rod.length_mm * (1 - Math.sqrt(measured / target));
    expect(trim.status).toBe('trim');
    // Tolerance 0.05 mm: the rod's Timoshenko correction is below 0.05 % of 10.6 mm.
    expect(Math.abs(trim.exact_mm - closedForm)).toBeLessThan(0.05);
  });

  it('finds the length the model itself sounds at (inverse check on a chime with end shear), and lands flat within tolerance', () => {
    // The model's own fundamental at 533 mm is the target; the tube is 540 mm and "heard" as modelled.
    const target = fundamental(tube(533));
    const trim = lengthTrim({ bar: tube(540), measuredHz: fundamental(tube(540)), targetHz: target, toleranceCents: 3 });
    expect(trim.status).toBe('trim');
    expect(trim.exact_mm).toBeCloseTo(7, 1);
    // The advised trim aims half a tolerance flat: it lands within tolerance, never sharp of it.
    const after = cents(fundamental(tube(540 - trim.trim_mm)), target);
    expect(after).toBeLessThanOrEqual(0);
    expect(after).toBeGreaterThan(-3);
    expect(cents(trim.predicted_hz, target)).toBeCloseTo(after, 1);
    expect(trim.advice).toContain(`Trim ${trim.trim_mm.toFixed(1)} mm off the free end`);
  });

  it('uses the calibration from the reading: a tube heard 1 % low is trimmed as if its material were 2 % softer', () => {
    const modelled = fundamental(tube(540));
    const heard = modelled * 0.99;
    const trim = lengthTrim({ bar: tube(540), measuredHz: heard, targetHz: modelled, toleranceCents: 2 });
    // f ∝ 1/L²: 1 % in pitch needs about 0.5 % of the length, 2.7 mm.
    expect(trim.exact_mm).toBeGreaterThan(2.6);
    expect(trim.exact_mm).toBeLessThan(2.8);
  });

  it('says in tune within tolerance, and that a sharp piece needs a longer one (trimming only raises it)', () => {
    const f = fundamental(tube(500));
    const inTune = lengthTrim({ bar: tube(500), measuredHz: f * 2 ** (1 / 1200), targetHz: f, toleranceCents: 3 });
    expect(inTune.status).toBe('in-tune');
    expect(inTune.trim_mm).toBe(0);
    const sharp = lengthTrim({ bar: tube(500), measuredHz: f * 2 ** (20 / 1200), targetHz: f, toleranceCents: 3 });
    expect(sharp.status).toBe('sharp');
    expect(sharp.trim_mm).toBe(0);
    expect(sharp.exact_mm).toBeLessThan(0);
    expect(sharp.advice).toMatch(/lowering it needs a new, longer piece/);
  });

  it('trims a bar on cords half from each end; the usual end follows the section', () => {
    const plain: BarFile = { format: 'barwright.bar', version: 1, length_mm: 300, section: { shape: 'rect', width_mm: 30, thickness_mm: 8 }, material: { E_GPa: 200, density_kg_m3: 7850, poisson: 0.29 } };
    expect(defaultShortenAt(plain)).toBe('both-ends');
    expect(defaultShortenAt(tube(500))).toBe('free-end');
    const f = fundamental(plain);
    const trim = lengthTrim({ bar: plain, measuredHz: f, targetHz: f * 2 ** (30 / 1200), toleranceCents: 3 });
    expect(trim.shorten_at).toBe('both-ends');
    expect(trim.advice).toContain(`(${(trim.trim_mm / 2).toFixed(2)} mm each end)`);
  });

  it('refuses absurd input with the field and the rule', () => {
    expect(() => lengthTrim({ bar: tube(500), measuredHz: 0, targetHz: 500, toleranceCents: 3 })).toThrow(InputError);
    expect(() => lengthTrim({ bar: tube(500), measuredHz: 500, targetHz: 500, toleranceCents: 0 })).toThrow(/tolerance_cents/);
    const undercut: BarFile = { format: 'barwright.bar', version: 1, length_mm: 300, section: { shape: 'rect', width_mm: 40, thickness_mm: 20 }, profile_mm: [[0, 20], [150, 10], [300, 20]], material: { E_GPa: 12, density_kg_m3: 800, poisson: 0.3 } };
    expect(() => lengthTrim({ bar: undercut, measuredHz: 300, targetHz: 310, toleranceCents: 3 })).toThrow(/next-cut advice/);
  });
});
