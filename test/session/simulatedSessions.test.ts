// Simulated tune-and-trim sessions: a "real" bar whose material and physics differ from the
// solver's is cut as recommended and measured after every cut. Each session starts from the uncut
// blank. The real bar differs from the maker's guess by ±15 % in E and ±30 % in G, its physics by
// local stiffness knock-downs that put it 2–3 % below classical Timoshenko on a deep arch (brief.md,
// "The real bar is not the model"; see simulatedBar.ts), it is solved on a mesh eight times finer,
// every partial is read with uniform noise of ±0.5 cent, and in half the sessions the maker's cut
// removes up to ±10 % more or less depth than planned while recording the plan.
import { readFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { parseBarFile, type BarFile } from '../../src/fileFormats/barFile.ts';
import { barModelFromFile } from '../../src/modes/BarModel.ts';
import { thicknessAt } from '../../src/section/ThicknessProfile.ts';
import { runSimulatedSession, type SimulatedSessionOutcome } from './simulatedSession.ts';

/** The maker's guess for the demo timber (the demo preset's values). */
const guess = { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1000 };

interface Blank {
  name: string;
  bar: BarFile;
  hz: number;
  ratios: number[];
  tolerance: number[];
  minThicknessMm: number;
}

/** Invented blanks of the demo keyboard (A4 = 442 Hz): three marimba-type (1:4:10), two xylophone-type (1:3). */
const blanks: Blank[] = [
  { name: 'F3 1:4:10', bar: { length_mm: 440, section: { shape: 'rect', width_mm: 58, thickness_mm: 24 }, material: guess }, hz: 175.41, ratios: [1, 4, 10], tolerance: [2, 5, 15], minThicknessMm: 6 },
  { name: 'A3 1:4:10', bar: { length_mm: 370, section: { shape: 'rect', width_mm: 56, thickness_mm: 22 }, material: guess }, hz: 221.0, ratios: [1, 4, 10], tolerance: [2, 5, 15], minThicknessMm: 5.5 },
  { name: 'C4 1:4:10', bar: { length_mm: 328, section: { shape: 'rect', width_mm: 52, thickness_mm: 21 }, material: guess }, hz: 262.81, ratios: [1, 4, 10], tolerance: [2, 5, 15], minThicknessMm: 5.3 },
  { name: 'C5 1:3', bar: { length_mm: 300, section: { shape: 'rect', width_mm: 40, thickness_mm: 22 }, material: guess }, hz: 525.63, ratios: [1, 3], tolerance: [2, 5], minThicknessMm: 8 },
  { name: 'G5 1:3', bar: { length_mm: 250, section: { shape: 'rect', width_mm: 38, thickness_mm: 20 }, material: guess }, hz: 787.5, ratios: [1, 3], tolerance: [2, 5], minThicknessMm: 7 },
];

/** The real material as factors on the guess: every corner of ±15 % E × ±30 % G. */
const materials: [number, number][] = [
  [1.15, 0.7],
  [0.85, 1.3],
  [1.15, 1.3],
  [0.85, 0.7],
];

/** Measurement noise, cents (uniform ±). */
const noiseCents = 0.5;
/** Most cuts allowed to reach every tolerance (the issue's requirement). */
const maxCuts = 8;

const outcomes: { name: string; outcome: SimulatedSessionOutcome; tolerance: number[] }[] = [];

/** Checks every promise of a session: done within the cuts, within tolerance, no wood added, never below the minimum. */
function expectTuned(outcome: SimulatedSessionOutcome, tolerance: readonly number[], minThicknessMm: number): void {
  expect(outcome.status).toBe('done');
  expect(outcome.cuts).toBeLessThanOrEqual(maxCuts);
  // The real bar's partials within tolerance; the session judged "done" on readings with ±0.5
  // cent of noise, so the truth may sit up to that much further out.
  outcome.finalCents.forEach((cents, n) => expect(Math.abs(cents)).toBeLessThanOrEqual(tolerance[n]! + noiseCents));
  // Wood never added: every recommended bar is no thicker and no longer than the bar before it.
  expect(outcome.largestAddedMm).toBeLessThanOrEqual(1e-9); // mm: floating-point noise of mm ↔ m conversions
  // No recommended shape below the minimum thickness (0.01 mm: the file's rounding step).
  for (const result of outcome.results) {
    const profile = barModelFromFile(parseBarFile(result.bar_after)).profile;
    expect(Math.min(...profile.thicknesses) * 1e3).toBeGreaterThanOrEqual(minThicknessMm - 0.01);
  }
  // The real bar too, even with the maker's execution error.
  expect(outcome.thinnestMm).toBeGreaterThanOrEqual(minThicknessMm - 0.01);
  // A clean session raises no false alarm.
  expect(outcome.results.flatMap((r) => r.calibration.flags)).toEqual([]);
}

function mm(value: number): number {
  return Math.round(value * 100) / 100;
}

describe('simulated tune-and-trim sessions from the blank', () => {
  blanks.forEach((blank, b) => {
    materials.forEach(([youngFactor, shearFactor], m) => {
      const execution = (b + m) % 2 === 1 ? 0.1 : 0;
      it(`${blank.name}, real E ×${youngFactor}, G ×${shearFactor}, cut error ±${execution * 100} %`, () => {
        const outcome = runSimulatedSession({
          blank: { format: 'barwright.bar', version: 1, ...blank.bar },
          youngFactor,
          shearFactor,
          target: { hz: blank.hz, ratios: blank.ratios, tolerance_cents: blank.tolerance },
          limits: { min_thickness_mm: blank.minThicknessMm },
          noiseCents,
          executionError: execution,
          seed: 1000 * b + 17 * m + 5,
          maxCuts,
        });
        outcomes.push({ name: `${blank.name} E×${youngFactor} G×${shearFactor} ±${execution * 100}%`, outcome, tolerance: blank.tolerance });
        expectTuned(outcome, blank.tolerance, blank.minThicknessMm);
      }, 120_000);
    });
  });

  // The contract's own example starts from a rough-cut bar with no blank measurement: the priors
  // must carry the first cut. The rough cut is the demo F3 bar (fixtures/f3-rough.bar.json), 830
  // cents sharp with the maker's guess and its third partial well below its share.
  const rough = JSON.parse(readFileSync(new URL('../../fixtures/f3-rough.bar.json', import.meta.url), 'utf8')) as BarFile;
  materials.forEach(([youngFactor, shearFactor], m) => {
    const execution = m % 2 === 0 ? 0.1 : 0;
    it(`F3 from the rough cut, no blank step, real E ×${youngFactor}, G ×${shearFactor}, cut error ±${execution * 100} %`, () => {
      const outcome = runSimulatedSession({
        blank: rough,
        youngFactor,
        shearFactor,
        target: { hz: 175.41, ratios: [1, 4, 10], tolerance_cents: [2, 5, 15] },
        limits: { min_thickness_mm: 6 },
        noiseCents,
        executionError: execution,
        seed: 77 + m,
        maxCuts,
      });
      outcomes.push({ name: `F3 rough E×${youngFactor} G×${shearFactor} ±${execution * 100}%`, outcome, tolerance: [2, 5, 15] });
      expectTuned(outcome, [2, 5, 15], 6);
    }, 120_000);
  });

  it('never plans a profile thicker than the bar now at any station (checked between steps)', () => {
    expect(outcomes.length).toBeGreaterThan(0);
    for (const { outcome } of outcomes) {
      const steps = (outcome.session.steps as { bar: BarFile }[]).map((s) => s.bar);
      for (let k = 1; k < steps.length; k++) {
        const before = barModelFromFile(parseBarFile(steps[k - 1]!)).profile;
        const after = barModelFromFile(parseBarFile(steps[k]!)).profile;
        const trim = ((steps[k - 1]!.length_mm - steps[k]!.length_mm) / 2) * 1e-3;
        for (const x of after.positions) expect(thicknessAt(after, x)).toBeLessThanOrEqual(thicknessAt(before, x + trim) + 1e-12);
      }
    }
  });

  afterAll(() => {
    if (outcomes.length === 0) return;
    const distribution = new Map<number, number>();
    for (const { outcome } of outcomes) distribution.set(outcome.cuts, (distribution.get(outcome.cuts) ?? 0) + 1);
    const worst = outcomes.map(({ outcome, tolerance }) => Math.max(...outcome.finalCents.map((c, n) => Math.abs(c) / tolerance[n]!)));
    const lines = [
      `simulated sessions: ${outcomes.length}; cuts needed: ${[...distribution.entries()].sort((a, b) => a[0] - b[0]).map(([cuts, count]) => `${cuts} cuts × ${count}`).join(', ')}`,
      `worst final error as a share of its tolerance: ${Math.max(...worst).toFixed(2)}`,
      ...outcomes.map(({ name, outcome }) => `  ${name}: ${outcome.status} after ${outcome.cuts} cuts, final ${outcome.finalCents.map((c) => c.toFixed(2)).join(' / ')} cents, thinnest ${mm(outcome.thinnestMm)} mm`),
    ];
    console.info(lines.join('\n'));
  });
});
