import { InputError } from '../fileFormats/InputError.ts';
import type { CutLimitsInput } from '../fileFormats/cutLimitsInput.ts';
import { thicknessAt, type ThicknessProfile } from '../section/ThicknessProfile.ts';
import { millimetre as mm } from '../units/units.ts';

/**
 * What a workshop can cut, in SI (metres; slope dimensionless). Shared by the undercut designer
 * and by tune-and-trim sessions: every profile either hands back passes `checkProfile`.
 */
export interface CutLimits {
  /** Thinnest the bar may be anywhere material is removed (m). */
  readonly minThickness: number;
  /** Length kept at its current thickness from the left end (m): the cord-hole region. */
  readonly uncutLeft: number;
  /** Length kept at its current thickness from the right end (m). */
  readonly uncutRight: number;
  /** Largest |dt/dx| of the cut surface (rise over run, dimensionless). */
  readonly maxSlope: number;
  /**
   * Smallest radius (m) of the cutting tool (drum, wheel): the cut surface may not curve more
   * tightly than this where it is concave seen from the tool, i.e. d²t/dx² ≤ 1/radius. 0: any tool.
   */
  readonly minToolRadius: number;
  /** Whether the bar may be shortened (trimmed equally at both ends). */
  readonly allowShortening: boolean;
  /** Most length (m) that may be trimmed off in total when shortening is allowed. */
  readonly maxShortening: number;
}

export type { CutLimitsInput };

/** The blank the limits apply to (SI): its length and its full (uncut) thickness. */
export interface CutBlank {
  readonly length: number;
  readonly thickness: number;
}

/**
 * Default fraction of the blank thickness that is the minimum thickness: a quarter (common
 * practice: the thinnest point of a low marimba-type bar is a quarter to a third of the blank).
 */
export const defaultMinThicknessFraction = 0.25;
/**
 * Default uncut length at each end as a fraction of the bar length: 0.18 L keeps the region out
 * to just short of the cord holes (the mode-1 nodes sit at 0.2242 L on a uniform bar, Blevins
 * 1979 table 8-1, and move out to about 0.20–0.21 L on a tuned arch; common practice keeps the
 * ends outside the holes full thickness so the hole never breaks out).
 */
export const defaultUncutEndFraction = 0.18;
/** Default largest slope of the cut (rise over run): 0.5, about 27° (common practice: a shallow arch). */
export const defaultMaxSlope = 0.5;
/** Default smallest tool radius (m): 20 mm, a 40 mm sanding drum (common practice). */
export const defaultMinToolRadius = 0.02;

/** The default workshop limits for a blank (SI). Shortening is off by default: length fixed. */
export function defaultCutLimits(blank: CutBlank): CutLimits {
  const uncut = defaultUncutEndFraction * blank.length;
  return {
    minThickness: defaultMinThicknessFraction * blank.thickness,
    uncutLeft: uncut,
    uncutRight: uncut,
    maxSlope: defaultMaxSlope,
    minToolRadius: defaultMinToolRadius,
    allowShortening: false,
    maxShortening: 0,
  };
}

function optionalNumber(source: string, field: string, value: unknown, rule: (n: number) => string | null): number | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new InputError(source, field, `must be a number (got ${JSON.stringify(value)})`);
  const problem = rule(value);
  if (problem) throw new InputError(source, field, problem);
  return value;
}

/**
 * Validates cut limits given in mm against the blank (SI) and fills the defaults. Throws
 * InputError(source, field, rule) naming the offending field, e.g.
 * `limits: min_thickness_mm: 30 mm is not less than the blank's 22 mm`.
 */
export function resolveCutLimits(input: CutLimitsInput | undefined, blank: CutBlank, source = 'limits'): CutLimits {
  const defaults = defaultCutLimits(blank);
  if (input === undefined) return defaults;
  if (typeof input !== 'object' || input === null || Array.isArray(input)) throw new InputError(source, 'limits', 'must be an object');
  const blankMm = blank.thickness / mm;
  const lengthMm = blank.length / mm;
  const minThickness = optionalNumber(source, 'min_thickness_mm', input.min_thickness_mm, (n) =>
    n <= 0 ? `must be greater than 0 mm (got ${n})` : n >= blankMm ? `${n} mm is not less than the blank's ${blankMm} mm` : null,
  );
  const endRule = (n: number): string | null => (n < 0 ? `must be 0 mm or more (got ${n})` : n >= 0.45 * lengthMm ? `${n} mm leaves no room for an arch on a ${lengthMm} mm bar (at most 45 % of the length)` : null);
  const both = optionalNumber(source, 'uncut_end_mm', input.uncut_end_mm, endRule);
  const left = optionalNumber(source, 'uncut_left_mm', input.uncut_left_mm, endRule) ?? both;
  const right = optionalNumber(source, 'uncut_right_mm', input.uncut_right_mm, endRule) ?? both;
  const maxSlope = optionalNumber(source, 'max_slope', input.max_slope, (n) => (n <= 0 || n > 10 ? `must be greater than 0 and at most 10 (rise over run; got ${n})` : null));
  const radius = optionalNumber(source, 'min_tool_radius_mm', input.min_tool_radius_mm, (n) =>
    n < 0 ? `must be 0 mm or more (got ${n})` : n > 10 * lengthMm ? `${n} mm is more than ten bar lengths` : null,
  );
  if (input.allow_shortening !== undefined && typeof input.allow_shortening !== 'boolean') throw new InputError(source, 'allow_shortening', 'must be true or false');
  const allowShortening = input.allow_shortening ?? false;
  const maxShortening = optionalNumber(source, 'max_shortening_mm', input.max_shortening_mm, (n) =>
    n < 0 ? `must be 0 mm or more (got ${n})` : n >= 0.5 * lengthMm ? `${n} mm is half the bar or more` : null,
  );
  if (maxShortening !== undefined && !allowShortening && maxShortening > 0) throw new InputError(source, 'max_shortening_mm', 'needs allow_shortening: true');
  const uncutLeft = left === undefined ? defaults.uncutLeft : left * mm;
  const uncutRight = right === undefined ? defaults.uncutRight : right * mm;
  if (uncutLeft + uncutRight >= 0.9 * blank.length)
    throw new InputError(source, 'uncut_end_mm', `the uncut ends (${+(uncutLeft / mm).toFixed(3)} + ${+(uncutRight / mm).toFixed(3)} mm) leave no room for an arch`);
  return {
    minThickness: minThickness === undefined ? defaults.minThickness : minThickness * mm,
    uncutLeft,
    uncutRight,
    maxSlope: maxSlope ?? defaults.maxSlope,
    minToolRadius: radius === undefined ? defaults.minToolRadius : radius * mm,
    allowShortening,
    maxShortening: allowShortening ? (maxShortening === undefined ? 0.25 * blank.length : maxShortening * mm) : 0,
  };
}

/** Cut limits back in mm for JSON output (the inverse of resolveCutLimits, every field filled). */
export function cutLimitsToInput(limits: CutLimits): Required<Omit<CutLimitsInput, 'uncut_end_mm' | 'shorten_at'>> {
  const round = (metres: number): number => Math.round((metres / mm) * 1e6) / 1e6;
  return {
    min_thickness_mm: round(limits.minThickness),
    uncut_left_mm: round(limits.uncutLeft),
    uncut_right_mm: round(limits.uncutRight),
    max_slope: limits.maxSlope,
    min_tool_radius_mm: round(limits.minToolRadius),
    allow_shortening: limits.allowShortening,
    max_shortening_mm: round(limits.maxShortening),
  };
}

/** Which limit a profile breaks. */
export type LimitRule = 'added-material' | 'min-thickness' | 'uncut-end' | 'max-slope' | 'tool-radius' | 'length';

/** One broken limit: where, by how much (as a thickness, m) and a sentence for the maker. */
export interface LimitViolation {
  readonly rule: LimitRule;
  /** Position along the (possibly shortened) bar, m from its left end. */
  readonly position: number;
  /** How far out, expressed as the thickness change (m) that would fix it (length: m of length). */
  readonly excess: number;
  readonly message: string;
}

/** Options for checkProfile. */
export interface CheckOptions {
  /** Thickness slack (m) below which a difference is not a violation (default 1e-7 m = 0.1 µm). */
  readonly tolerance?: number;
  /** Length trimmed off the left end of the original (m), when shortened (default: half the difference). */
  readonly trimLeft?: number;
}

/** Default slack of checkProfile and projectRemoval, m (0.1 µm, far below what any tool cuts). */
export const cutTolerance = 1e-7;

const fmt = (metres: number): string => `${+(metres / mm).toFixed(2)} mm`;

/**
 * Whether `profile` (what is proposed) can be cut from `original` (what is there now) within the
 * limits. Returns every violation (empty when the profile is fine). Rules:
 * - never thicker than the original anywhere (checked at the stations of both profiles, which is
 *   exact for piecewise-linear profiles);
 * - where material is removed, no thinner than minThickness;
 * - unchanged within the uncut ends;
 * - slope: |Δt/Δx| ≤ maxSlope on every span with a cut end;
 * - tool radius: the discrete second derivative 2(s₊ − s₋)/(h₋ + h₊) ≤ 1/radius at every
 *   station next to a cut (conservative: the true curvature κ = t''/(1+t'²)^{3/2} is smaller);
 *   spans and stations untouched by the cut are exempt (they are not cut);
 * - length unchanged unless shortening is allowed, then at most maxShortening shorter.
 * Positions are those of the proposed profile; the original is shifted by trimLeft.
 */
export function checkProfile(profile: ThicknessProfile, original: ThicknessProfile, limits: CutLimits, options: CheckOptions = {}): LimitViolation[] {
  const tolerance = options.tolerance ?? cutTolerance;
  const violations: LimitViolation[] = [];
  const x = profile.positions;
  const t = profile.thicknesses;
  const n = x.length;
  const length = x[n - 1]! - x[0]!;
  const originalLength = original.positions[original.positions.length - 1]! - original.positions[0]!;
  const shortening = originalLength - length;
  const trimLeft = options.trimLeft ?? shortening / 2;
  if (shortening < -tolerance) violations.push({ rule: 'length', position: length, excess: -shortening, message: `the bar is ${fmt(-shortening)} longer than the blank` });
  else if (shortening > tolerance && !limits.allowShortening) violations.push({ rule: 'length', position: length, excess: shortening, message: `the bar is ${fmt(shortening)} shorter but shortening is not allowed` });
  else if (shortening > limits.maxShortening + tolerance)
    violations.push({ rule: 'length', position: length, excess: shortening - limits.maxShortening, message: `the bar is ${fmt(shortening)} shorter, more than the ${fmt(limits.maxShortening)} allowed` });
  const originalAt = (position: number): number => thicknessAt(original, position + trimLeft);
  // Material added: at the stations of both profiles.
  const checkAdded = (position: number): void => {
    if (position < -tolerance || position > length + tolerance) return;
    const excess = thicknessAt(profile, position) - originalAt(position);
    if (excess > tolerance) violations.push({ rule: 'added-material', position, excess, message: `${fmt(excess)} thicker than the bar at ${fmt(position)}: material cannot be put back` });
  };
  for (let i = 0; i < n; i++) checkAdded(x[i]!);
  for (const p of original.positions) checkAdded(p - trimLeft);
  const cut = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const position = x[i]!;
    if (originalAt(position) - t[i]! <= tolerance) continue;
    cut[i] = 1;
    if (t[i]! < limits.minThickness - tolerance)
      violations.push({ rule: 'min-thickness', position, excess: limits.minThickness - t[i]!, message: `${fmt(t[i]!)} at ${fmt(position)} is thinner than the ${fmt(limits.minThickness)} minimum` });
  }
  // Uncut ends: the removal is piecewise linear, so its largest value over an end region is at a
  // station of either profile inside it or at the region's boundary.
  const uncutProbes = [...x, ...Array.from(original.positions, (p) => p - trimLeft), limits.uncutLeft, length - limits.uncutRight];
  for (const position of uncutProbes) {
    const inside = position >= -tolerance && position <= length + tolerance && (position <= limits.uncutLeft + tolerance || position >= length - limits.uncutRight - tolerance);
    if (!inside) continue;
    const removed = originalAt(position) - thicknessAt(profile, position);
    if (removed > tolerance) violations.push({ rule: 'uncut-end', position, excess: removed, message: `${fmt(removed)} removed at ${fmt(position)}, inside the uncut end` });
  }
  for (let i = 0; i + 1 < n; i++) {
    if (!cut[i] && !cut[i + 1]) continue;
    const h = x[i + 1]! - x[i]!;
    const excess = Math.abs(t[i + 1]! - t[i]!) - limits.maxSlope * h;
    if (excess > tolerance)
      violations.push({ rule: 'max-slope', position: 0.5 * (x[i]! + x[i + 1]!), excess, message: `slope ${+(Math.abs(t[i + 1]! - t[i]!) / h).toFixed(3)} near ${fmt(0.5 * (x[i]! + x[i + 1]!))} is steeper than ${limits.maxSlope}` });
  }
  if (limits.minToolRadius > 0) {
    for (let i = 1; i + 1 < n; i++) {
      if (!cut[i - 1] && !cut[i] && !cut[i + 1]) continue;
      const excess = curvatureExcess(x, t, i, 1 / limits.minToolRadius);
      if (excess > tolerance)
        violations.push({ rule: 'tool-radius', position: x[i]!, excess, message: `the cut at ${fmt(x[i]!)} curves more tightly than a ${fmt(limits.minToolRadius)} radius tool can make` });
    }
  }
  return violations;
}

/**
 * How far (m) station i sits below the lowest thickness the curvature limit allows given its
 * neighbours: from 2/(h₀+h₁)·((t₊−t)/h₁ − (t−t₋)/h₀) ≤ k, t ≥ (t₊/h₁ + t₋/h₀ − k(h₀+h₁)/2)/(1/h₀+1/h₁).
 */
function curvatureExcess(x: ArrayLike<number>, t: ArrayLike<number>, i: number, maxCurvature: number): number {
  return curvatureFloor(x, t, i, maxCurvature) - t[i]!;
}

function curvatureFloor(x: ArrayLike<number>, t: ArrayLike<number>, i: number, maxCurvature: number): number {
  const h0 = x[i]! - x[i - 1]!;
  const h1 = x[i + 1]! - x[i]!;
  return (t[i + 1]! / h1 + t[i - 1]! / h0 - (maxCurvature * (h0 + h1)) / 2) / (1 / h0 + 1 / h1);
}

/**
 * Merged, sorted station positions (m) of several lists, dropping any closer than `gap` (m) to
 * the previous kept one (the first list's stations win ties, so pass the original first).
 */
export function mergeStations(lists: readonly ArrayLike<number>[], gap = 1e-5): Float64Array {
  const all: { x: number; rank: number }[] = [];
  lists.forEach((list, rank) => {
    for (let i = 0; i < list.length; i++) all.push({ x: list[i]!, rank });
  });
  all.sort((a, b) => a.x - b.x || a.rank - b.rank);
  const kept: { x: number; rank: number }[] = [];
  for (const station of all) {
    const last = kept[kept.length - 1];
    if (last && station.x - last.x < gap) {
      if (station.rank < last.rank) kept[kept.length - 1] = station;
      continue;
    }
    kept.push(station);
  }
  return Float64Array.from(kept, (s) => s.x);
}

/**
 * Clips a proposed shape to what can be cut: returns the profile closest to `candidate` from above
 * (never removing more than the candidate asks at any station, never adding material) that passes
 * `checkProfile` against `original`. Same length as the original (shorten first with trimProfile).
 * Stations: those of both profiles plus the uncut-end boundaries. Method: clamp to
 * [max(min(original, minThickness)), original], fix the uncut ends, then raise stations
 * (Gauss–Seidel sweeps, monotone, bounded by the original) until the slope and tool-radius limits
 * hold; a limit that raising cannot meet (a sharp corner already in the original) is met by
 * leaving that part uncut.
 */
export function projectRemoval(candidate: ThicknessProfile, original: ThicknessProfile, limits: CutLimits, tolerance = cutTolerance): ThicknessProfile {
  const length = original.positions[original.positions.length - 1]!;
  const boundaries = [limits.uncutLeft, length - limits.uncutRight].filter((p) => p > 0 && p < length);
  const x = mergeStations([original.positions, boundaries, candidate.positions]);
  x[0] = 0;
  x[x.length - 1] = length;
  const n = x.length;
  const top = Float64Array.from(x, (p) => thicknessAt(original, p));
  const t = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const inUncut = x[i]! < limits.uncutLeft + tolerance * 10 || x[i]! > length - limits.uncutRight - tolerance * 10;
    t[i] = inUncut ? top[i]! : Math.min(top[i]!, Math.max(thicknessAt(candidate, x[i]!), Math.min(top[i]!, limits.minThickness)));
  }
  const slack = tolerance / 100;
  const isCut = (i: number): boolean => t[i]! < top[i]! - tolerance;
  const raise = (i: number, value: number): boolean => {
    const next = Math.min(top[i]!, value);
    if (next > t[i]! + slack) {
      t[i] = next;
      return true;
    }
    return false;
  };
  const maxCurvature = limits.minToolRadius > 0 ? 1 / limits.minToolRadius : 0;
  for (let sweep = 0; sweep < 200 * n + 1000; sweep++) {
    let changed = false;
    for (let i = 0; i + 1 < n; i++) {
      if (!isCut(i) && !isCut(i + 1)) continue;
      const rise = limits.maxSlope * (x[i + 1]! - x[i]!);
      const [low, high] = t[i]! < t[i + 1]! ? [i, i + 1] : [i + 1, i];
      if (t[high]! - t[low]! <= rise) continue;
      // Raise the low end; if it is uncut already the high end was cut too deep for this limit: leave it uncut.
      if (isCut(low)) changed = raise(low, t[high]! - rise) || changed;
      if (t[high]! - t[low]! > rise + slack) changed = raise(high, top[high]!) || changed;
    }
    if (maxCurvature > 0) {
      for (let i = 1; i + 1 < n; i++) {
        if (!isCut(i - 1) && !isCut(i) && !isCut(i + 1)) continue;
        if (curvatureExcess(x, t, i, maxCurvature) <= slack) continue;
        changed = raise(i, curvatureFloor(x, t, i, maxCurvature)) || changed;
        if (curvatureExcess(x, t, i, maxCurvature) > slack) {
          changed = raise(i - 1, top[i - 1]!) || changed;
          changed = raise(i + 1, top[i + 1]!) || changed;
        }
      }
    }
    if (!changed) break;
  }
  let profile: ThicknessProfile = { positions: x, thicknesses: t };
  // Safety net: anything still out of limits is left uncut (cannot happen after convergence, but a
  // returned profile must always pass).
  for (let guard = 0; guard < n; guard++) {
    const violations = checkProfile(profile, original, limits, { tolerance });
    if (violations.length === 0) break;
    for (const v of violations) {
      const i = Math.min(n - 1, Math.max(0, nearestStation(x, v.position)));
      for (const j of [i - 1, i, i + 1]) if (j >= 0 && j < n) t[j] = top[j]!;
    }
    profile = { positions: x, thicknesses: t };
  }
  return profile;
}

function nearestStation(x: Float64Array, position: number): number {
  let best = 0;
  for (let i = 1; i < x.length; i++) if (Math.abs(x[i]! - position) < Math.abs(x[best]! - position)) best = i;
  return best;
}

/**
 * The original profile with `left` and `right` metres trimmed off its ends (shortening), positions
 * re-based to start at 0.
 */
export function trimProfile(profile: ThicknessProfile, left: number, right: number): ThicknessProfile {
  const length = profile.positions[profile.positions.length - 1]!;
  const end = length - right;
  if (left < 0 || right < 0 || end - left <= 0) throw new RangeError('trimProfile: trims must be non-negative and leave some bar');
  const inner = Array.from(profile.positions).filter((p) => p > left + 1e-9 && p < end - 1e-9);
  const positions = Float64Array.from([left, ...inner, end], (p) => p - left);
  const thicknesses = Float64Array.from([left, ...inner, end], (p) => thicknessAt(profile, p));
  return { positions, thicknesses };
}
