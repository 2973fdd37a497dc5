// nextCut against the contract: statuses, a bar_after that never adds wood and can be cut from,
// JSON-serialisable and pure output, shortening when flat, tubes, and the minimum thickness.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { toJson } from '../../src/cli/command.ts';
import { barModelFromFile } from '../../src/modes/BarModel.ts';
import { analyzeBar } from '../../src/modes/analyzeBar.ts';
import { parseBarFile, type BarFile } from '../../src/fileFormats/barFile.ts';
import { thicknessAt } from '../../src/section/ThicknessProfile.ts';
import { nextCut } from '../../src/session/nextCut.ts';
import { runSimulatedSession } from './simulatedSession.ts';

const fixture = JSON.parse(readFileSync(new URL('../../fixtures/f3-workshop.session.json', import.meta.url), 'utf8')) as Record<string, any>;

function deepFreeze<T>(value: T): T {
  if (typeof value === 'object' && value !== null) {
    Object.values(value).forEach(deepFreeze);
    Object.freeze(value);
  }
  return value;
}

/**
 * Largest thickness (mm) by which `after` exceeds `before` anywhere (stations of both; ends trimmed
 * equally). Compared to 1e-9 mm: floating-point noise of mm ↔ m conversions, a millionth of a micron.
 */
function largestExcessMm(before: BarFile, after: BarFile): number {
  const a = barModelFromFile(parseBarFile(before)).profile;
  const b = barModelFromFile(parseBarFile(after)).profile;
  const trim = ((before.length_mm - after.length_mm) / 2) * 1e-3;
  let worst = -Infinity;
  for (const x of [...b.positions, ...Array.from(a.positions, (p) => p - trim)]) {
    if (x < -1e-12 || x > after.length_mm * 1e-3 + 1e-12) continue;
    worst = Math.max(worst, thicknessAt(b, x) - thicknessAt(a, x + trim));
  }
  return worst * 1e3;
}

const guess = { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1000 };

/** A C4 bar tuned to done by a simulated session (its session log). */
const tuned = runSimulatedSession({
  blank: { format: 'barwright.bar', version: 1, length_mm: 328, section: { shape: 'rect', width_mm: 52, thickness_mm: 21 }, material: guess },
  youngFactor: 1.1,
  shearFactor: 0.8,
  target: { hz: 262.81, ratios: [1, 4, 10], tolerance_cents: [2, 5, 15] },
  limits: { min_thickness_mm: 5.3 },
  noiseCents: 0.5,
  executionError: 0.05,
  seed: 3,
});

describe('nextCut on the demo session (fixtures/f3-workshop.session.json)', () => {
  const frozen = deepFreeze(structuredClone(fixture));
  const result = nextCut(frozen);

  it('recommends a cut the contract allows: never thicker, never longer, a valid bar file', () => {
    expect(result.status).toBe('cut');
    const now = fixture.steps[fixture.steps.length - 1].bar as BarFile;
    expect(() => parseBarFile(result.bar_after, 'bar_after')).not.toThrow();
    expect(result.bar_after.length_mm).toBeLessThanOrEqual(now.length_mm);
    expect(largestExcessMm(now, result.bar_after)).toBeLessThanOrEqual(1e-9);
    expect(result.predicted_hz).toHaveLength(3);
    expect(result.cautions.length).toBeGreaterThanOrEqual(3);
  });

  it('gives stations at most 10 mm apart wherever it cuts (contract: fine enough to cut from)', () => {
    const profile = result.bar_after.profile_mm!;
    const cut = result.cut!;
    expect(cut.stations.length).toBeGreaterThan(0);
    for (let j = 0; j + 1 < profile.length; j++) {
      const [x0] = profile[j]!;
      const [x1] = profile[j + 1]!;
      const inCut = cut.regions_mm.some(([a, b]) => x1 > a && x0 < b);
      if (inCut) expect(x1 - x0).toBeLessThanOrEqual(10 + 1e-9);
    }
    // The table agrees with the two bar files.
    for (const station of cut.stations) expect(station.remove_mm).toBeCloseTo(station.thickness_now_mm - station.thickness_after_mm, 2);
  });

  it('is pure and JSON-serialisable: same answer twice, input untouched, one finite JSON document', () => {
    expect(frozen).toEqual(fixture);
    expect(nextCut(frozen)).toEqual(result);
    const text = toJson(result);
    expect(JSON.parse(text)).toEqual(JSON.parse(JSON.stringify(result)));
  });

  it('keeps the fundamental sharp while the overtones are still out, and never plans it flat', () => {
    expect(result.phase).toBe('hold');
    expect(result.predicted_range_cents[0]![0]).toBeGreaterThanOrEqual(-result.tolerance_cents[0]! * 1.1);
    result.predicted_cents.forEach((c, n) => expect(c).toBeLessThan(result.now_cents[n]!));
  });

  it('predicts what its documented model gives for the bar file it hands back, solved independently', () => {
    // The prediction (README, sessions) is the reading now moved by what the calibrated model says
    // the cut does: the model is the Timoshenko partials at the fitted E and G times exp(c_n·depth),
    // depth = 1 − thinnest / blank thickness, c_n from the correction reported at today's depth.
    // Rebuilt here from the result's own report with analyzeBar on a 400-element mesh (a different
    // pipeline and mesh from the session's), for the bar now and the bar after.
    const session = structuredClone(fixture);
    session.steps[2].cut = { made: 'as-done' };
    const planned = nextCut(session);
    expect(planned.status).toBe('cut');
    const { E_GPa, G_GPa } = planned.calibration;
    const depthOf = (bar: BarFile): number => {
      const blank = bar.section.shape === 'rect' ? bar.section.thickness_mm : 0;
      return 1 - Math.min(...(bar.profile_mm ?? [[0, blank]]).map(([, t]) => t)) / blank;
    };
    const withMaterial = (bar: BarFile): BarFile => ({ ...bar, material: { E_GPa, G_GPa, density_kg_m3: planned.calibrated_material.density_kg_m3 } });
    const barNow = parseBarFile(session.steps[2].bar);
    const depthNow = depthOf(barNow);
    const exponents = planned.calibration.correction_percent.map((percent) => Math.log(1 + percent / 100) / depthNow);
    const solve = (bar: BarFile) => analyzeBar(withMaterial(bar), { modes: 3, elements: 400 }).bending.map((m, n) => m.hz * Math.exp(exponents[n]! * depthOf(bar)));
    const now = solve(barNow);
    const after = solve(planned.bar_after);
    // Within 0.1 cent: the report rounds nothing, the bar file rounds thicknesses to 0.01 mm and
    // both are accounted; what is left is the two meshes' discretisation (≤ 0.01 cent, O(h⁸)).
    planned.predicted_hz.forEach((hz, n) => expect(Math.abs(1200 * Math.log2(hz / (planned.now_hz[n]! * (after[n]! / now[n]!)))), `partial ${n + 1}`).toBeLessThan(0.1));
  });

  it('reports progress through its stages', () => {
    const stages: string[] = [];
    nextCut(fixture, { onProgress: (stage, fraction) => stages.push(`${stage}:${fraction}`) });
    expect(stages).toEqual(['calibrating:0', 'planning:0.5', 'done:1']);
  });
});

describe('nextCut statuses', () => {
  it('done: every partial within tolerance, bar_after is the bar now', () => {
    expect(tuned.status).toBe('done');
    const result = nextCut(tuned.session);
    const steps = tuned.session.steps as { bar: BarFile; measured_hz: number[] }[];
    expect(result.status).toBe('done');
    expect(result.bar_after).toEqual(steps[steps.length - 1]!.bar);
    expect(result.cut).toBeNull();
    result.now_cents.forEach((c, n) => expect(Math.abs(c)).toBeLessThanOrEqual(result.tolerance_cents[n]!));
  });

  it('flat fundamental: stuck with the shortening that would help, or a shortening cut when allowed', () => {
    const flat = structuredClone(tuned.session) as Record<string, any>;
    flat.target.hz *= 2 ** (25 / 1200);
    const stuck = nextCut(flat);
    expect(stuck.status).toBe('stuck');
    expect(stuck.reason).toMatch(/flat beyond its tolerance.*shortening by about \d+\.\d mm.*"allow_shortening": true/);
    flat.limits.allow_shortening = true;
    const shorter = nextCut(flat);
    expect(shorter.status).toBe('cut');
    expect(shorter.cut!.shortening_mm).toBeGreaterThan(0);
    expect(shorter.bar_after.length_mm).toBeLessThan(flat.steps[flat.steps.length - 1].bar.length_mm);
    expect(largestExcessMm(flat.steps[flat.steps.length - 1].bar, shorter.bar_after)).toBeLessThanOrEqual(1e-9);
    // Raised toward the target: the fundamental comes up, and is not left flat beyond tolerance.
    expect(shorter.predicted_cents[0]!).toBeGreaterThan(shorter.now_cents[0]!);
    expect(shorter.predicted_range_cents[0]![0]).toBeGreaterThan(-2.2);
  });

  it('stuck at the minimum thickness: a sharp blank that may lose no more than 0.01 mm', () => {
    const session = {
      format: 'barwright.session',
      version: 1,
      target: { hz: 262.81, ratios: [1, 4, 10], tolerance_cents: [2, 5, 15] },
      limits: { min_thickness_mm: 20.99 },
      steps: [{ bar: { length_mm: 328, section: { shape: 'rect', width_mm: 52, thickness_mm: 21 }, material: guess }, measured_hz: [890, 2180, 3700] }],
    };
    const result = nextCut(session);
    expect(result.status).toBe('stuck');
    expect(result.reason).toMatch(/minimum thickness of 20\.99 mm/);
    expect(result.bar_after).toEqual(parseBarFile(session.steps[0]!.bar));
  });

  it('a chime tube: sharp is stuck (nothing lowers it); flat is shortened in steps that never overshoot sharp', () => {
    const tube = (hz: number) => ({
      format: 'barwright.session',
      version: 1,
      target: { hz: 523.25, ratios: [1], tolerance_cents: [3] },
      limits: { min_thickness_mm: 1, allow_shortening: true },
      steps: [{ bar: { length_mm: 535, section: { shape: 'tube', outer_diameter_mm: 25.4, wall_mm: 1.6 }, material: { preset: 'aluminium-6061-t6' } }, measured_hz: [hz] }],
    });
    const sharp = nextCut(tube(560));
    expect(sharp.status).toBe('stuck');
    expect(sharp.reason).toMatch(/tube cannot be undercut/);
    const flat = nextCut(tube(500));
    expect(flat.status).toBe('cut');
    expect(flat.cut!.shortening_mm).toBeGreaterThan(0);
    expect(flat.predicted_range_cents[0]![1]).toBeLessThanOrEqual(3 * 1.1);
  });

  it('bad input is an InputError naming the field', () => {
    expect(() => nextCut({ ...structuredClone(fixture), steps: [] }, { source: 'f3.json' })).toThrow(/^f3\.json: steps: needs at least one measured step/);
    expect(() => nextCut({ ...structuredClone(fixture), limits: { min_thickness_mm: 30 } }, { source: 'f3.json' })).toThrow(/^f3\.json: limits\.min_thickness_mm: 30 mm is not less than the blank's 24 mm/);
  });
});
