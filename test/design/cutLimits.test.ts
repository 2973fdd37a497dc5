import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  checkProfile,
  cutLimitsToInput,
  defaultCutLimits,
  mergeStations,
  projectRemoval,
  resolveCutLimits,
  trimProfile,
  type CutLimits,
} from '../../src/design/cutLimits.ts';
import { InputError } from '../../src/fileFormats/InputError.ts';
import { thicknessAt, type ThicknessProfile } from '../../src/section/ThicknessProfile.ts';

const mm = 1e-3;
const profile = (pairs: [number, number][]): ThicknessProfile => ({
  positions: Float64Array.from(pairs, ([x]) => x * mm),
  thicknesses: Float64Array.from(pairs, ([, t]) => t * mm),
});
const blank = { length: 0.4, thickness: 0.022 };
const limits: CutLimits = { ...defaultCutLimits(blank), uncutLeft: 0.08, uncutRight: 0.08, maxSlope: 0.5, minToolRadius: 0.02 };
const uniform = profile([
  [0, 22],
  [400, 22],
]);
const rules = (p: ThicknessProfile, original = uniform, l = limits): string[] => checkProfile(p, original, l).map((v) => v.rule);

describe('cut limits: defaults and validation', () => {
  it('defaults to a quarter of the blank, the cord-hole regions uncut, length fixed', () => {
    // Quarter thickness: common practice (brief §3, thinnest point a quarter to a third).
    const d = defaultCutLimits(blank);
    expect(d.minThickness).toBeCloseTo(0.0055, 12);
    expect(d.uncutLeft).toBeCloseTo(0.18 * 0.4, 12);
    expect(d.uncutRight).toBe(d.uncutLeft);
    expect(d.allowShortening).toBe(false);
    expect(d.maxShortening).toBe(0);
  });
  it('reads mm input and writes it back', () => {
    const l = resolveCutLimits({ min_thickness_mm: 6, uncut_end_mm: 90, uncut_right_mm: 70, max_slope: 0.4, min_tool_radius_mm: 25, allow_shortening: true, max_shortening_mm: 12 }, blank);
    expect(l.minThickness).toBeCloseTo(0.006, 12);
    expect(l.uncutLeft).toBeCloseTo(0.09, 12);
    expect(l.uncutRight).toBeCloseTo(0.07, 12);
    expect(cutLimitsToInput(l)).toEqual({ min_thickness_mm: 6, uncut_left_mm: 90, uncut_right_mm: 70, max_slope: 0.4, min_tool_radius_mm: 25, allow_shortening: true, max_shortening_mm: 12 });
  });
  it.each([
    [{ min_thickness_mm: 22 }, 'limits: min_thickness_mm: 22 mm is not less than the blank\'s 22 mm'],
    [{ min_thickness_mm: -1 }, 'limits: min_thickness_mm: must be greater than 0 mm (got -1)'],
    [{ uncut_end_mm: 190 }, 'limits: uncut_end_mm: 190 mm leaves no room for an arch on a 400 mm bar (at most 45 % of the length)'],
    [{ max_slope: 0 }, 'limits: max_slope: must be greater than 0 and at most 10 (rise over run; got 0)'],
    [{ min_tool_radius_mm: 'wide' }, 'limits: min_tool_radius_mm: must be a number (got "wide")'],
    [{ max_shortening_mm: 5 }, 'limits: max_shortening_mm: needs allow_shortening: true'],
    [{ allow_shortening: 'yes' }, 'limits: allow_shortening: must be true or false'],
  ])('rejects %j with a message naming the field', (input, message) => {
    expect(() => resolveCutLimits(input as never, blank)).toThrow(InputError);
    expect(() => resolveCutLimits(input as never, blank)).toThrow(message);
  });
});

describe('checkProfile', () => {
  const good = profile([
    [0, 22],
    [80, 22],
    [120, 16],
    [160, 12],
    [200, 11],
    [240, 12],
    [280, 16],
    [320, 22],
    [400, 22],
  ]);
  it('passes a gentle arch clear of the ends', () => {
    expect(rules(good)).toEqual([]);
  });
  it('finds material put back', () => {
    expect(rules(good, profile([[0, 22], [200, 10], [400, 22]]))).toContain('added-material');
  });
  it('finds a cut below the minimum thickness', () => {
    expect(rules(profile([[0, 22], [80, 22], [150, 14], [200, 5], [250, 14], [320, 22], [400, 22]]), uniform, { ...limits, maxSlope: 10, minToolRadius: 0 })).toEqual(['min-thickness']);
  });
  it('finds a cut inside an uncut end, also between stations', () => {
    // Stations at 0 and 100 mm only: the cut starts at 0 mm, inside the 80 mm uncut end.
    expect(rules(profile([[0, 22], [100, 21], [300, 21], [400, 22]]), uniform, { ...limits, maxSlope: 10, minToolRadius: 0 })).toContain('uncut-end');
  });
  it('finds a slope steeper than allowed and a curve tighter than the tool', () => {
    expect(rules(profile([[0, 22], [80, 22], [90, 12], [310, 12], [320, 22], [400, 22]]), uniform, { ...limits, minToolRadius: 0 })).toEqual(['max-slope', 'max-slope']);
    // A shallow V: 2(s₊ − s₋)/(h₋ + h₊) = 2·(0.1 + 0.1)/(40 mm) = 0.01 /mm, a 100 mm radius: a 20 mm tool makes it.
    expect(rules(profile([[0, 22], [180, 22], [200, 20], [220, 22], [400, 22]]))).toEqual([]);
    // Depth 6 mm over ±20 mm: curvature 2·(0.3 + 0.3)/40 = 0.03 /mm, radius 33 mm: fails a 50 mm tool.
    expect(rules(profile([[0, 22], [180, 22], [200, 16], [220, 22], [400, 22]]), uniform, { ...limits, minToolRadius: 0.05, maxSlope: 1 })).toEqual(['tool-radius']);
  });
  it('exempts the untouched parts of an existing profile', () => {
    // The original already has a steep step at 100 mm; the proposal cuts only the middle.
    const original = profile([[0, 22], [100, 22], [101, 14], [400, 14]]);
    const proposal = profile([[0, 22], [100, 22], [101, 14], [200, 14], [250, 13.5], [300, 14], [400, 14]]);
    expect(rules(proposal, original, { ...limits, uncutRight: 0.01 })).toEqual([]);
  });
  it('checks the length: shortening only when allowed, and only so far', () => {
    const shorter = profile([[0, 22], [390, 22]]);
    expect(rules(shorter)).toEqual(['length']);
    expect(rules(shorter, uniform, { ...limits, allowShortening: true, maxShortening: 0.02 })).toEqual([]);
    expect(rules(shorter, uniform, { ...limits, allowShortening: true, maxShortening: 0.005 })).toEqual(['length']);
  });
});

describe('projectRemoval', () => {
  it('leaves an allowed cut alone', () => {
    const arch = profile([[0, 22], [80, 22], [120, 16], [160, 12], [200, 11], [240, 12], [280, 16], [320, 22], [400, 22]]);
    const projected = projectRemoval(arch, uniform, limits);
    for (const x of arch.positions) expect(thicknessAt(projected, x)).toBeCloseTo(thicknessAt(arch, x), 12);
  });
  it('fills a notch up to what the tool can make, never below the request', () => {
    const notch = profile([[0, 22], [190, 22], [200, 12], [210, 22], [400, 22]]);
    const projected = projectRemoval(notch, uniform, limits);
    expect(checkProfile(projected, uniform, limits)).toEqual([]);
    expect(thicknessAt(projected, 0.2)).toBeGreaterThan(0.012);
    for (const x of projected.positions) expect(thicknessAt(projected, x)).toBeGreaterThanOrEqual(thicknessAt(notch, x) - 1e-12);
  });

  // Random originals (uniform or already rough-cut, symmetric or not) and random proposals.
  const originalArbitrary = fc.record({
    kind: fc.constantFrom('uniform', 'rough'),
    depth: fc.double({ min: 0, max: 8, noNaN: true }),
    centre: fc.double({ min: 150, max: 250, noNaN: true }),
  });
  const candidateArbitrary = fc.array(fc.double({ min: 2, max: 24, noNaN: true }), { minLength: 5, maxLength: 40 });
  const limitsArbitrary = fc.record({
    minThickness: fc.double({ min: 3, max: 12, noNaN: true }),
    uncut: fc.double({ min: 0, max: 120, noNaN: true }),
    maxSlope: fc.double({ min: 0.1, max: 2, noNaN: true }),
    radius: fc.double({ min: 0, max: 80, noNaN: true }),
  });
  it('always returns a profile that passes checkProfile, never adds material, never cuts deeper than asked (property)', () => {
    fc.assert(
      fc.property(originalArbitrary, candidateArbitrary, limitsArbitrary, (o, depths, l) => {
        const original =
          o.kind === 'uniform'
            ? uniform
            : profile([[0, 22], [o.centre - 90, 22], [o.centre - 30, 22 - o.depth * 0.6], [o.centre, 22 - o.depth], [o.centre + 60, 22 - o.depth * 0.3], [o.centre + 120, 22], [400, 22]]);
        const positions = depths.map((_, i) => (400 * i) / (depths.length - 1));
        const candidate = profile(positions.map((x, i) => [x, depths[i]!]));
        const cutLimits: CutLimits = { minThickness: l.minThickness * mm, uncutLeft: l.uncut * mm, uncutRight: l.uncut * mm, maxSlope: l.maxSlope, minToolRadius: l.radius * mm, allowShortening: false, maxShortening: 0 };
        const projected = projectRemoval(candidate, original, cutLimits);
        expect(checkProfile(projected, original, cutLimits)).toEqual([]);
        for (const x of projected.positions) {
          expect(thicknessAt(projected, x)).toBeLessThanOrEqual(thicknessAt(original, x) + 1e-12);
          expect(thicknessAt(projected, x)).toBeGreaterThanOrEqual(Math.min(thicknessAt(original, x), thicknessAt(candidate, x)) - 1e-12);
        }
        // Idempotent: a projected profile is already within the limits.
        const again = projectRemoval(projected, original, cutLimits);
        for (const x of again.positions) expect(thicknessAt(again, x)).toBeCloseTo(thicknessAt(projected, x), 9);
      }),
      { numRuns: 60, seed: 20240611 },
    );
  });
});

describe('station helpers', () => {
  it('merges station lists, the first list winning near-ties', () => {
    expect(Array.from(mergeStations([[0, 0.1, 0.4], [0.1000001, 0.2]], 1e-5))).toEqual([0, 0.1, 0.2, 0.4]);
  });
  it('trims a profile at both ends and re-bases it', () => {
    const trimmed = trimProfile(profile([[0, 22], [100, 20], [300, 20], [400, 22]]), 0.01, 0.02);
    expect(Array.from(trimmed.positions, (x) => +(x / mm).toFixed(9))).toEqual([0, 90, 290, 370]);
    expect(thicknessAt(trimmed, 0) / mm).toBeCloseTo(21.8, 9);
  });
});
