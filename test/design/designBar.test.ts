import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyzeBar } from '../../src/modes/analyzeBar.ts';
import { barModelFromFile } from '../../src/modes/BarModel.ts';
import { parseBarFile, type BarFile } from '../../src/fileFormats/barFile.ts';
import { thicknessAt } from '../../src/section/ThicknessProfile.ts';
import { checkProfile, resolveCutLimits } from '../../src/design/cutLimits.ts';
import { designBar, type DesignRequest, type DesignResult } from '../../src/design/designBar.ts';

const fixture = (name: string): BarFile => parseBarFile(JSON.parse(readFileSync(`fixtures/${name}.bar.json`, 'utf8')), name);
/** An invented uniform blank of the demo workshop's generic dense hardwood. */
const blank = (length_mm: number, width_mm: number, thickness_mm: number): BarFile => ({
  format: 'barwright.bar',
  version: 1,
  label: `blank ${length_mm} × ${width_mm} × ${thickness_mm}`,
  length_mm,
  section: { shape: 'rect', width_mm, thickness_mm },
  material: { preset: 'demo-tropical-hardwood' },
});

/** Re-analysis mesh: about 1000 elements, some 20–60 times finer than the designer's own. */
const fineElements = 1000;

/** Checks every promise a feasible design makes, against an independent fine-mesh analysis. */
function expectGoodDesign(bar: BarFile, request: DesignRequest, result: DesignResult): number {
  expect(result.feasible).toBe(true);
  expect(result.reason).toBeUndefined();
  // The returned bar is a valid bar file of the same blank.
  const designed = parseBarFile(JSON.parse(JSON.stringify(result.bar)), 'designed');
  expect(designed.section).toEqual(bar.section);
  // Every workshop limit holds against the bar as it was: those the design reports, which keep
  // every limit given explicitly.
  const original = barModelFromFile(bar);
  const limits = resolveCutLimits(result.limits, { length: original.length, thickness: (bar.section.shape === 'rect' ? bar.section.thickness_mm : 0) * 1e-3 });
  expect(checkProfile(barModelFromFile({ ...designed, holes: undefined }).profile, original.profile, limits)).toEqual([]);
  for (const [key, value] of Object.entries(request.limits ?? {})) if (key !== 'uncut_end_mm') expect(result.limits[key as keyof typeof result.limits]).toBe(value);
  // A station at least every 10 mm over the arch (contract).
  const pairs = designed.profile_mm!;
  const blankThickness = bar.section.shape === 'rect' ? bar.section.thickness_mm : 0;
  for (let i = 0; i + 1 < pairs.length; i++) {
    const cutHere = pairs[i]![1] < blankThickness - 1e-6 || pairs[i + 1]![1] < blankThickness - 1e-6;
    if (cutHere) expect(pairs[i + 1]![0] - pairs[i]![0]).toBeLessThanOrEqual(10 + 1e-9);
  }
  // The targets are met on a much finer mesh, within the maker's tolerances.
  const fine = analyzeBar(designed, { modes: Math.max(3, result.target_hz.length), elements: fineElements });
  let worst = 0;
  result.target_hz.forEach((target, k) => {
    const cents = 1200 * Math.log2(fine.bending[k]!.hz / target);
    expect(Math.abs(cents)).toBeLessThanOrEqual(result.tolerance_cents[k]!);
    // The design's own prediction agrees with the fine mesh to 0.05 cent (mesh convergence).
    expect(Math.abs(cents - result.cents_error[k]!)).toBeLessThan(0.05);
    worst = Math.max(worst, Math.abs(cents) / result.tolerance_cents[k]!);
  });
  // Cord holes are the nodes of the fundamental of the final shape (fine mesh to 0.1 mm rounding);
  // the holes the design drills sit there within 0.5 mm, and clear of the arch by the workshop's
  // 3 mm (default workshop).
  expect(result.cord_holes_mm).toHaveLength(2);
  result.cord_holes_mm.forEach((x, i) => expect(Math.abs(x - fine.bending[0]!.nodes_mm![i]!)).toBeLessThan(0.1));
  expect(designed.holes).toHaveLength(2);
  designed.holes!.forEach((hole, i) => {
    expect(Math.abs(hole.x_mm - fine.bending[0]!.nodes_mm![i === 0 ? 0 : fine.bending[0]!.nodes_mm!.length - 1]!)).toBeLessThan(0.5);
    const profile = barModelFromFile(designed).profile;
    for (let x = hole.x_mm - hole.diameter_mm / 2 - 3; x <= hole.x_mm + hole.diameter_mm / 2 + 3; x += 0.25) expect(1e3 * thicknessAt(profile, x * 1e-3)).toBeCloseTo(blankThickness, 9);
  });
  expect(result.removed_volume_mm3).toBeGreaterThan(0);
  // Drilling the holes moves each partial by the difference between the drilled and undrilled bar.
  const undrilled = analyzeBar({ ...designed, holes: undefined }, { modes: Math.max(3, result.target_hz.length), elements: fineElements });
  result.cord_holes!.shift_cents!.forEach((shift, k) => expect(shift).toBeCloseTo(1200 * Math.log2(fine.bending[k]!.hz / undrilled.bending[k]!.hz), 1));
  expect(JSON.stringify(result)).not.toMatch(/NaN|Infinity|null/);
  return worst;
}

// Lengths from the blank advisor's comfortable ranges for these sections (see adviseBlankLength.test.ts).
const keyboard: [string, BarFile, DesignRequest][] = [
  ['A2 1:4:10, low (demo blank)', fixture('a2-blank'), { target: { note: 'A2', a4: 442, ratios: '1:4:10' } }],
  ['A2 1:3, low', blank(843, 64, 25), { target: { note: 'A2', a4: 442, ratios: '1:3' } }],
  ['F3 1:4:10, low-middle', blank(462, 58, 24), { target: { note: 'F3', a4: 442, ratios: '1:4:10' } }],
  ['C4 1:4:10, middle', blank(353, 55, 22), { target: { note: 'C4', a4: 442, ratios: '1:4:10' } }],
  ['C5 1:4, middle (demo blank)', fixture('c5-blank'), { target: { note: 'C5', a4: 442, ratios: '1:4' } }],
  ['C5 1:3, middle', blank(340, 50, 21), { target: { note: 'C5', a4: 442, ratios: '1:3' } }],
  ['C6 1:3, high', blank(219, 45, 19), { target: { note: 'C6', a4: 442, ratios: '1:3' } }],
  ['C7 1:3, top', blank(139, 40, 19), { target: { note: 'C7', a4: 442, ratios: '1:3' } }],
  ['C7 fundamental only, top (demo blank)', fixture('c7-blank'), { target: { note: 'C7', a4: 442, ratios: 'fundamental' } }],
  // A xylophone-type blank a maker has at hand, with barwright's default workshop.
  ['G4 1:3, xylophone-type 300 × 40 × 20 mm', blank(300, 40, 20), { target: { note: 'G4', a4: 442, ratios: '1:3' } }],
];

describe('designBar over the range of a keyboard', () => {
  it.each(keyboard)('%s: meets the targets on a fine mesh, within every limit', (_name, bar, request) => {
    const result = designBar(bar, request);
    const worst = expectGoodDesign(bar, request, result);
    expect(worst).toBeLessThanOrEqual(1);
  });

  it('continues an asymmetric rough cut, removing only from what is there', () => {
    const rough: BarFile = {
      ...blank(462, 58, 24),
      profile_mm: [[0, 24], [120, 24], [170, 21], [215, 19.5], [250, 20.5], [300, 23], [330, 24], [462, 24]],
    };
    const request: DesignRequest = { target: { note: 'F3', a4: 442, ratios: '1:4:10' } };
    const result = designBar(rough, request);
    expectGoodDesign(rough, request, result);
    for (const [x, t] of rough.profile_mm!) {
      const designed = result.bar.profile_mm!;
      const k = designed.findIndex(([p]) => p >= x - 1e-9);
      expect(designed[k]![0]).toBeCloseTo(x, 6);
      expect(designed[k]![1]).toBeLessThanOrEqual(t + 1e-9);
    }
  });

  it('honours custom limits: thicker minimum, longer uncut ends, a gentler slope and a larger tool', () => {
    const request: DesignRequest = {
      target: { note: 'C4', a4: 442, ratios: '1:4:10' },
      limits: { min_thickness_mm: 7, uncut_end_mm: 55, max_slope: 0.45, min_tool_radius_mm: 30 },
    };
    const bar = blank(353, 55, 22);
    const result = designBar(bar, request);
    expect(result.limits).toMatchObject({ min_thickness_mm: 7, max_slope: 0.45, min_tool_radius_mm: 30 });
    // The uncut ends given, or longer where the cord holes need it.
    expect(result.limits.uncut_left_mm).toBeGreaterThanOrEqual(55);
    expect(result.limits.uncut_right_mm).toBeGreaterThanOrEqual(55);
    expect(result.limit_sources.max_slope).toBe('given');
    expect(result.thinnest_mm).toBeGreaterThanOrEqual(7 - 1e-6);
    const original = barModelFromFile(bar);
    expect(checkProfile(barModelFromFile({ ...result.bar, holes: undefined }).profile, original.profile, resolveCutLimits({ ...request.limits, uncut_end_mm: 55 }, { length: 0.353, thickness: 0.022 }))).toEqual([]);
    // Milder than the defaults where it matters for C4 on this blank (a 30 mm tool and 0.45 slope
    // still leave the arch room): the design must succeed, and succeed well.
    expect(result.feasible, result.reason).toBe(true);
    expectGoodDesign(bar, request, result);
  });

  it('says which limit binds when custom limits leave no room: a 15 mm minimum on a 22 mm C4 blank', () => {
    const request: DesignRequest = { target: { note: 'C4', a4: 442, ratios: '1:4:10' }, limits: { min_thickness_mm: 15 } };
    const result = designBar(blank(353, 55, 22), request);
    expect(result.feasible).toBe(false);
    expect(result.reason).toMatch(/minimum thickness|min-thickness/);
    expect(result.thinnest_mm).toBeGreaterThanOrEqual(15 - 1e-6);
  });

  it('shortens a blank that is too long when allowed, and only then', () => {
    // Some 10 % longer than a comfortable C4 blank: the arch for 1:4:10 takes the fundamental
    // flat, so the length must come down.
    const bar = blank(410, 55, 22);
    const fixed = designBar(bar, { target: { note: 'C4', a4: 442, ratios: '1:4:10' } });
    expect(fixed.feasible).toBe(false);
    expect(fixed.shortened_mm).toBe(0);
    expect(fixed.reason).toMatch(/Remedies, cheapest first: .*the blank sawn to \d+ mm \(from 410 mm\)/);
    const request: DesignRequest = { target: { note: 'C4', a4: 442, ratios: '1:4:10' }, limits: { allow_shortening: true, max_shortening_mm: 60 } };
    const shortened = designBar(bar, request);
    expect(shortened.feasible).toBe(true);
    expect(shortened.shortened_mm).toBeGreaterThan(0);
    expect(shortened.shortened_mm).toBeLessThanOrEqual(60);
    expect(shortened.bar.length_mm).toBeCloseTo(410 - shortened.shortened_mm, 6);
    const fine = analyzeBar(shortened.bar, { modes: 3, elements: fineElements });
    fine.bending.slice(0, 3).forEach((mode, k) => expect(Math.abs(1200 * Math.log2(mode.hz / shortened.target_hz[k]!))).toBeLessThanOrEqual(shortened.tolerance_cents[k]!));
    expect(checkProfile(barModelFromFile({ ...shortened.bar, holes: undefined }).profile, barModelFromFile(bar).profile, resolveCutLimits(shortened.limits, { length: 0.41, thickness: 0.022 }), { trimLeft: shortened.shortened_mm * 5e-4 })).toEqual([]);
  }, 600_000);
});

describe('cord holes', () => {
  it('keeps them clear of the arch even when shorter uncut ends are given: the arch moves in', () => {
    const bar: BarFile = { length_mm: 353, section: { shape: 'rect', width_mm: 60, thickness_mm: 24 }, material: { preset: 'demo-tropical-hardwood' } };
    const result = designBar(bar, { target: { note: 'C4', a4: 442 }, limits: { uncut_end_mm: 10 } });
    const profile = barModelFromFile(result.bar).profile;
    expect(result.bar.holes).toHaveLength(2);
    for (const hole of result.bar.holes!) for (const x of [hole.x_mm - 6, hole.x_mm, hole.x_mm + 6]) expect(1e3 * thicknessAt(profile, x * 1e-3)).toBeCloseTo(24, 9);
    expect(result.limit_sources.uncut_end_mm).toBe('given, and clear of the cord holes');
    expect(result.warnings).toEqual([]);
  });
  it('keeps the holes a bar already has, designs around them and says when they are off the nodes', () => {
    // Drilled 12 mm inside the uniform bar's nodes (0.2242 L, Blevins 1979, table 8-1): the
    // designed arch moves the nodes further out still.
    const bar: BarFile = { ...blank(353, 55, 22), holes: [{ x_mm: 91, diameter_mm: 6 }, { x_mm: 262, diameter_mm: 6 }] };
    const result = designBar(bar, { target: { note: 'C4', a4: 442, ratios: '1:4' } });
    expect(result.bar.holes).toEqual(bar.holes);
    expect(result.cord_holes!.drilled_already).toBe(true);
    expect(result.cord_holes!.shift_cents).toBeNull();
    expect(result.limits.uncut_left_mm).toBeGreaterThanOrEqual(91 + 3 + 3);
    expect(result.warnings.some((w) => /cord hole at 91 mm is [\d.]+ mm from the node/.test(w))).toBe(true);
  });
  it('drills none in a workshop that hangs its bars without holes', () => {
    const result = designBar(blank(353, 55, 22), { target: { note: 'C4', a4: 442, ratios: '1:4' }, workshop: { tools: [{ kind: 'drum', radius_mm: 20 }], cord_holes: { diameter_mm: 0, clearance_mm: 3 } } });
    expect(result.bar.holes).toBeUndefined();
    expect(result.cord_holes).toBeNull();
    expect(result.limit_sources.uncut_end_mm).toBe("barwright's rule: 0.18 of the length");
  });
});

describe('designBar when the targets cannot be met', () => {
  it('says so in one story — the closest shape, the limits and what sets them, the remedies — and still returns a shape within the limits', () => {
    // The top bar cannot reach 1:4:10: its partials are far too close on so short and thick a bar.
    const bar = fixture('c7-blank');
    const result = designBar(bar, { target: { note: 'C7', a4: 442, ratios: '1:4:10' } });
    expect(result.feasible).toBe(false);
    expect(result.reason).toMatch(/^closest shape: (the fundamental|the 2nd partial|the 3rd partial) [+−][\d.]+ cents \(±\d+\)/);
    // One set of figures: no second account of where the fundamental would be.
    expect(result.reason!.match(/cents \(±/g)!.length).toBeLessThanOrEqual(3);
    expect(result.reason).toMatch(/Remedies, cheapest first: .*tune the fundamental alone instead of 1:4:10/);
    expect(result.remedies!.map((r) => r.kind)).toContain('ratios');
    expect(result.cents_error.some((c, k) => Math.abs(c) > result.tolerance_cents[k]!)).toBe(true);
    const original = barModelFromFile(bar);
    expect(checkProfile(barModelFromFile({ ...result.bar, holes: undefined }).profile, original.profile, resolveCutLimits(result.limits, { length: original.length, thickness: 0.019 }))).toEqual([]);
    expect(JSON.stringify(result)).not.toMatch(/NaN|Infinity|null/);
  }, 180_000);
  it('tells a blank that is already flat before any cut', () => {
    const result = designBar(fixture('a2-blank'), { target: { note: 'C5', a4: 442, ratios: '1:4:10' }, remedies: false });
    expect(result.feasible).toBe(false);
    expect(result.reason).toMatch(/already \d+(\.\d)? cents flat before any cut/);
  });
});

describe('designBar as a worker calls it', () => {
  const bar = blank(353, 55, 22);
  const request: DesignRequest = { target: { note: 'C4', a4: 442, ratios: '1:4:10' } };
  it('reports progress and stops when the callback returns false, returning a valid shape', () => {
    const seen: number[] = [];
    const result = designBar(bar, request, { onProgress: (p) => (seen.push(p.solves), p.solves < 8) });
    expect(seen.length).toBeGreaterThan(0);
    expect(result.cancelled).toBe(true);
    expect(result.feasible).toBe(false);
    expect(result.solves).toBeLessThan(20);
    expect(checkProfile(barModelFromFile({ ...result.bar, holes: undefined }).profile, barModelFromFile(bar).profile, resolveCutLimits(result.limits, { length: 0.353, thickness: 0.022 }))).toEqual([]);
  });
  it('stops on an aborted signal', () => {
    const controller = new AbortController();
    controller.abort();
    const result = designBar(bar, request, { signal: controller.signal });
    expect(result.cancelled).toBe(true);
    expect(result.solves).toBeLessThan(5);
  });
  it('returns plain JSON data (survives structured cloning unchanged)', () => {
    const result = designBar(bar, request);
    expect(structuredClone(result)).toEqual(result);
    expect(JSON.parse(JSON.stringify(result))).toEqual(result);
  });
  it.each([
    [{ target: { note: 'C4' }, families: ['bell-curve'] }, 'design: families: unknown arch family "bell-curve"'],
    [{ target: { note: 'C4' }, station_spacing_mm: 30 }, 'design: station_spacing_mm: must be from 1 to 10 mm (got 30)'],
    [{ target: { note: 'C4' }, limits: { min_thickness_mm: 40 } }, "design: min_thickness_mm: 40 mm is not less than the blank's 22 mm"],
    [{ target: {} }, 'design: note: give the note'],
  ])('rejects a bad request %j', (bad, message) => {
    expect(() => designBar(bar, bad as DesignRequest)).toThrow(message);
  });
  it('rejects a tube', () => {
    expect(() => designBar(fixture('chime-g4'), request)).toThrow('design: section.shape: only rect bars are undercut (this bar is a tube)');
  });
});
