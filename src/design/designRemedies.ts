import type { BarFile } from '../fileFormats/barFile.ts';
import { roundDecimals as round } from '../fileFormats/roundDecimals.ts';
import { thicknessAt } from '../section/ThicknessProfile.ts';
import { millimetre as mm } from '../units/units.ts';
import { trimProfile } from './cutLimits.ts';
import type { DesignRequest, DesignRunOptions, DesignState } from './designRequest.ts';
import type { DesignResult, Relaxation, Remedy, RemedyKind } from './designResult.ts';
import type { DesignTarget } from './designTarget.ts';

/**
 * The cost of each change to the maker, lowest first: a smaller drum or sleeve (a cheap tool), a
 * tool that finishes steeper walls, cutting closer to the cord holes, then the blank — sawing the
 * one at hand shorter or planing it thinner, before buying a longer or thicker one — and last
 * the tuning itself (it changes the instrument's voice). barwright's own order.
 */
function costRank(kind: RemedyKind, value: number | number[], before: number): number {
  switch (kind) {
    case 'tool_radius_mm':
      return 1;
    case 'max_slope':
      return 2;
    case 'uncut_end_mm':
      return 3;
    case 'blank_length_mm':
      return (value as number) < before ? 4 : 6;
    case 'blank_thickness_mm':
      return (value as number) < before ? 5 : 7;
    case 'ratios':
      return 8;
  }
}

/** Σ over partials of the cents beyond each tolerance: what a remedy must recover. */
export function shortfallCents(result: Pick<DesignResult, 'cents_error' | 'tolerance_cents'>): number {
  return result.cents_error.reduce((sum, c, k) => sum + Math.max(0, Math.abs(c) - result.tolerance_cents[k]!), 0);
}

/**
 * The bar and request with one change made, exactly as the remedy search designs them (and as a
 * maker, or a test, re-runs them): a limit given explicitly; a blank of another length (the bar
 * as it is sawn shorter, both ends alike, when it is already cut; otherwise a fresh blank) or
 * thickness (a fresh blank); or other ratios (the last partial dropped).
 */
export function applyRemedy(bar: BarFile, request: DesignRequest, remedy: Pick<Remedy, 'kind' | 'value'>): { bar: BarFile; request: DesignRequest } {
  const limits = { ...(request.limits ?? {}) };
  const fresh = (length_mm: number, thickness_mm: number): BarFile => {
    if (bar.section.shape !== 'rect') throw new Error('internal: remedies are for rect bars');
    const { profile_mm: _profile, holes: _holes, ...rest } = bar;
    return { ...rest, length_mm, section: { ...bar.section, thickness_mm } };
  };
  switch (remedy.kind) {
    case 'tool_radius_mm':
      return { bar, request: { ...request, limits: { ...limits, min_tool_radius_mm: remedy.value as number } } };
    case 'max_slope':
      return { bar, request: { ...request, limits: { ...limits, max_slope: remedy.value as number } } };
    case 'uncut_end_mm': {
      delete limits.uncut_left_mm;
      delete limits.uncut_right_mm;
      return { bar, request: { ...request, limits: { ...limits, uncut_end_mm: remedy.value as number } } };
    }
    case 'blank_length_mm': {
      if (bar.section.shape !== 'rect') throw new Error('internal: remedies are for rect bars');
      const length = remedy.value as number;
      if (length < bar.length_mm && bar.profile_mm) {
        const trim = (bar.length_mm - length) / 2;
        const profile = trimProfile(
          { positions: Float64Array.from(bar.profile_mm, ([x]) => x), thicknesses: Float64Array.from(bar.profile_mm, ([, t]) => t) },
          trim,
          trim,
        );
        const holes = bar.holes?.map((hole) => ({ ...hole, x_mm: hole.x_mm - trim })).filter((hole) => hole.x_mm - hole.diameter_mm / 2 > 0 && hole.x_mm + hole.diameter_mm / 2 < length);
        const { holes: _holes, ...rest } = bar;
        return {
          bar: { ...rest, length_mm: length, profile_mm: Array.from(profile.positions, (x, i) => [x, profile.thicknesses[i]!] as [number, number]), ...(holes && holes.length ? { holes } : {}) },
          request,
        };
      }
      return { bar: fresh(length, bar.section.thickness_mm), request };
    }
    case 'blank_thickness_mm': {
      if (bar.section.shape !== 'rect') throw new Error('internal: remedies are for rect bars');
      const thickness = remedy.value as number;
      if (limits.min_thickness_mm !== undefined && limits.min_thickness_mm >= 0.9 * thickness) delete limits.min_thickness_mm;
      return { bar: fresh(bar.length_mm, thickness), request: { ...request, limits } };
    }
    case 'ratios': {
      const ratios = remedy.value as number[];
      const tolerance = request.target.tolerance_cents?.slice(0, ratios.length);
      return { bar, request: { ...request, target: { ...request.target, ratios, ...(tolerance ? { tolerance_cents: tolerance } : {}) } } };
    }
  }
}

/** One change tried: its value and what the design made of it. */
interface Trial {
  readonly value: number;
  readonly result: DesignResult;
}

/** A one-dimensional search over one kind of change. */
interface Search {
  readonly kind: RemedyKind;
  /** The value now (the limit as it was, the blank's length or thickness). */
  readonly from: number;
  /** Values to try, nearest first: the search stops at the first that meets the target. */
  readonly ladder: readonly number[];
  /** Snaps a value to what a maker would use (0.5 mm of radius, 0.05 of slope, 1 mm of length…). */
  readonly snap: (value: number) => number;
  /** Narrow down even when the first value met the target (a ladder that starts at its far end). */
  readonly narrowFirst?: boolean;
}

/** Bisection steps between the last value that missed and the first that met the target. */
const bisectionSteps = 3;

/**
 * Runs a search: designs at each ladder value (remedies off) until one meets the target — giving
 * up on a ladder as soon as a change leaves the design further off than it was (`now`, the
 * shortfall before) — then, when the first value that met it was not the first tried, narrows
 * towards the value now by bisection on the snapped grid, so the remedy asks for as small a
 * change as the steps found. Every value reported was designed.
 */
function runSearch(search: Search, now: number, attempt: (value: number) => DesignResult): { met?: Trial; tried: Trial[] } {
  const tried: Trial[] = [];
  const trial = (value: number): Trial => {
    const made = { value, result: attempt(value) };
    tried.push(made);
    return made;
  };
  let near = search.from;
  let met: Trial | undefined;
  for (const raw of search.ladder) {
    const value = search.snap(raw);
    if (value === search.from || tried.some((t) => t.value === value)) continue;
    const t = trial(value);
    if (t.result.feasible) {
      met = t;
      break;
    }
    if (t.result.cancelled || shortfallCents(t.result) > now) return { tried };
    near = value;
  }
  if (!met) return { tried };
  if (near === search.from && !search.narrowFirst) return { met, tried };
  for (let step = 0; step < bisectionSteps; step++) {
    const middle = search.snap((near + met.value) / 2);
    if (middle === near || middle === met.value) break;
    const t = trial(middle);
    if (t.result.cancelled) break;
    if (t.result.feasible) met = t;
    else near = middle;
  }
  return { met, tried };
}

/** Values from `from` towards `to`, each `factor` times further (a geometric ladder of changes). */
function ladder(from: number, to: number, first: number, steps: number): number[] {
  const values: number[] = [];
  for (let k = 0; k < steps; k++) {
    const change = first * 2 ** k;
    const value = from + Math.sign(to - from) * change;
    if ((to - from) * (value - to) >= 0) {
      values.push(to);
      break;
    }
    values.push(value);
  }
  return values;
}

/** What the remedy search adds to an infeasible design. */
export interface RemedyOutcome {
  reason: string;
  relaxations: Relaxation[];
  remedies: Remedy[];
}

/** Options of designRemedies. */
export interface RemedyOptions {
  readonly run: DesignRunOptions;
  /** The designer (designBar), called with each change made (remedies off). */
  readonly designAgain: (bar: BarFile, request: DesignRequest, run: DesignRunOptions) => DesignResult;
  /** Only these kinds (default: every kind that applies). The keyboard plan asks for the blank only. */
  readonly kinds?: readonly RemedyKind[];
  /** Stop at the first kind whose search meets the target (the keyboard plan needs one blank, not a list). */
  readonly firstOnly?: boolean;
}

/** Smallest tool radius (mm) a remedy offers: a 6 mm spindle sleeve, about the smallest sold (common practice). */
const smallestToolRadius = 3;
/** Steepest wall a remedy offers (rise over run, about 72°). */
const steepestWall = 3;

/**
 * What would meet a target the design missed. For each limit the closest shape presses against
 * (tool radius, steepest wall, uncut ends) and for the blank's length and thickness and the
 * ratios, it designs again with the change made (applyRemedy; a ladder of growing changes, then
 * bisection), so every remedy is one that was designed and met the target. Returns the remedies
 * cheapest to the maker first (costRank), what relaxing each buys (cents per unit, from the
 * smallest change tried that gained anything), and the whole story: the closest shape's figures,
 * then the remedies.
 */
export function designRemedies(bar: BarFile, request: DesignRequest, result: DesignResult, target: DesignTarget, state: DesignState, options: RemedyOptions): RemedyOutcome {
  if (bar.section.shape !== 'rect') throw new Error('internal: remedies are for rect bars');
  const shortfall = round(shortfallCents(result), 2);
  const run: DesignRunOptions = {
    ...(options.run.signal ? { signal: options.run.signal } : {}),
    ...(options.run.onProgress ? { onProgress: (p) => options.run.onProgress!({ ...p, stage: 'remedies' }) } : {}),
  };
  const design = (kind: RemedyKind, value: number | number[]): DesignResult => {
    const changed = applyRemedy(bar, request, { kind, value });
    return options.designAgain(changed.bar, { ...changed.request, remedies: false }, run);
  };
  const wanted = (kind: RemedyKind): boolean => !options.kinds || options.kinds.includes(kind);
  const searches: Search[] = [];
  const limits = result.limits;
  const binding = result.binding_limits;
  if (wanted('tool_radius_mm') && binding.includes('tool-radius') && limits.min_tool_radius_mm > smallestToolRadius)
    searches.push({ kind: 'tool_radius_mm', from: limits.min_tool_radius_mm, ladder: [smallestToolRadius], snap: (v) => Math.max(smallestToolRadius, Math.floor(v * 2 + 1e-9) / 2), narrowFirst: true });
  if (wanted('max_slope') && binding.includes('max-slope') && limits.max_slope < steepestWall)
    searches.push({ kind: 'max_slope', from: limits.max_slope, ladder: [steepestWall], snap: (v) => Math.min(steepestWall, Math.ceil(v * 20 - 1e-9) / 20), narrowFirst: true });
  const holesFloor = uncutFloor(result, state);
  const uncutNow = Math.min(limits.uncut_left_mm, limits.uncut_right_mm);
  if (wanted('uncut_end_mm') && binding.includes('uncut-end') && uncutNow > holesFloor + 1)
    searches.push({ kind: 'uncut_end_mm', from: round(uncutNow, 3), ladder: [holesFloor], snap: (v) => Math.max(Math.ceil(holesFloor), Math.floor(v + 1e-9)), narrowFirst: true });
  const sharp = result.cents_error[0]! > result.tolerance_cents[0]!;
  const flat = result.cents_error[0]! < -result.tolerance_cents[0]!;
  const length = bar.length_mm;
  const thickness = bar.section.thickness_mm;
  if (wanted('blank_length_mm')) {
    // A sharp fundamental wants a longer blank (f₁ ∝ 1/L², Blevins 1979, table 8-1), a flat one
    // a shorter: that way first. The other way too: a blank too long for the ratios leaves the
    // closest shape's fundamental sharp while the overtones fall flat (the search gives a way
    // up after its first step when that step loses ground).
    const directions = sharp ? [1, -1] : [-1, 1];
    for (const direction of directions)
      searches.push({ kind: 'blank_length_mm', from: length, ladder: ladder(length, length * (1 + 0.3 * direction), 0.03 * length, 4), snap: (v) => Math.round(v) });
  }
  if (wanted('blank_thickness_mm')) {
    // A thinner blank lowers the fundamental (f₁ ∝ t) and, more slender, reaches higher ratios.
    const directions = flat ? [1, -1] : [-1, 1];
    for (const direction of directions)
      searches.push({ kind: 'blank_thickness_mm', from: thickness, ladder: ladder(thickness, thickness * (1 + 0.35 * direction), 0.5, 4), snap: (v) => Math.round(v * 2) / 2 });
  }
  const relaxations: Relaxation[] = [];
  const remedies: (Remedy & { rank: number })[] = [];
  for (const search of searches) {
    if (options.run.signal?.aborted || (options.firstOnly && remedies.length > 0)) break;
    const { met, tried } = runSearch(search, shortfall, (value) => design(search.kind, value));
    const gains = tried.map((t) => ({ value: t.value, gained: round(shortfall - shortfallCents(t.result), 2), met: t.result.feasible }));
    const nearest = gains.filter((g) => g.gained > 0).sort((a, b) => Math.abs(a.value - search.from) - Math.abs(b.value - search.from))[0] ?? gains[0];
    if (nearest)
      relaxations.push({
        kind: search.kind,
        from: search.from,
        to: nearest.value,
        cents_gained: round(nearest.gained, 2),
        cents_per_unit: round(nearest.gained / Math.abs(nearest.value - search.from), 3),
        meets_target: nearest.met,
      });
    if (met) remedies.push({ kind: search.kind, value: met.value, cents_gained: round(shortfall, 2), change: describeChange(search.kind, met.value, search.from), rank: costRank(search.kind, met.value, search.from) });
  }
  if (wanted('ratios') && !options.run.signal?.aborted && !(options.firstOnly && remedies.length > 0)) {
    // Fewer partials, one at a time (1:4:10 → 1:4 → the fundamental alone): the first that works.
    for (let count = target.ratios.length - 1; count >= 1; count--) {
      const fewer = target.ratios.slice(0, count);
      if (design('ratios', fewer).feasible) {
        remedies.push({ kind: 'ratios', value: fewer, cents_gained: round(shortfall, 2), change: `tune ${fewer.length > 1 ? fewer.join(':') : 'the fundamental alone'} instead of ${target.ratios.join(':')}`, rank: costRank('ratios', fewer, 0) });
        break;
      }
      if (options.run.signal?.aborted) break;
    }
  }
  remedies.sort((a, b) => a.rank - b.rank);
  return { reason: story(result.reason ?? '', relaxations, remedies, shortfall), relaxations, remedies: remedies.map(({ rank: _rank, ...remedy }) => remedy) };
}

/** The smallest uncut end (mm) the cord holes allow: their far edges plus the clearance (0.05 of the length without holes). */
function uncutFloor(result: DesignResult, state: DesignState): number {
  const plan = state.holes;
  if (!plan) return 0.05 * (result.bar.length_mm);
  const length = state.model.length;
  const reach = plan.diameter / 2 + plan.clearance;
  let floor = 0;
  for (const x of plan.positions) floor = Math.max(floor, (x <= length / 2 ? x : length - x) + reach);
  // The thickness there must also be what it was: only the blank's uncut ends count.
  return thicknessAt(state.original, floor) > 0 ? floor / mm : 0;
}

/** A change in a maker's words. */
function describeChange(kind: RemedyKind, value: number, from: number): string {
  switch (kind) {
    case 'tool_radius_mm':
      return `a drum or spindle sleeve of ${value} mm radius (${2 * value} mm across) instead of ${from} mm`;
    case 'max_slope':
      return `walls as steep as ${value} (${Math.round((Math.atan(value) * 180) / Math.PI)}°) instead of ${from}: a tool that finishes them, such as a spindle sander or a router with a template`;
    case 'uncut_end_mm':
      return `uncut ends of ${value} mm instead of ${from} mm`;
    case 'blank_length_mm':
      return value < from ? `the blank sawn to ${value} mm (from ${from} mm)` : `a blank ${value} mm long instead of ${from} mm`;
    case 'blank_thickness_mm':
      return value < from ? `the blank planed to ${value} mm thick (from ${from} mm)` : `a blank ${value} mm thick instead of ${from} mm`;
    case 'ratios':
      return `other ratios`;
  }
}

const units: Record<RemedyKind, string> = {
  tool_radius_mm: 'per mm of tool radius',
  max_slope: 'per unit of slope',
  uncut_end_mm: 'per mm of uncut end',
  blank_length_mm: 'per mm of blank length',
  blank_thickness_mm: 'per mm of blank thickness',
  ratios: '',
};

/** The whole story: the closest shape (first part, from designResult), what each change buys, the remedies. */
function story(closest: string, relaxations: readonly Relaxation[], remedies: readonly Remedy[], shortfall: number): string {
  const parts = [closest];
  const buys = relaxations.filter((r) => r.cents_gained > 0).map((r) => `${r.kind.replace(/_mm$/, '').replace(/_/g, ' ')} ${r.from} → ${r.to}: ${r.cents_gained.toFixed(1)} of ${shortfall.toFixed(1)} cents (${r.cents_per_unit.toFixed(2)} cents ${units[r.kind]})`);
  if (buys.length) parts.push(`What each change buys: ${buys.join('; ')}`);
  parts.push(remedies.length ? `Remedies, cheapest first: ${remedies.map((r) => r.change).join('; ')}` : 'No single change tried meets the target');
  return parts.join('. ');
}
