import type { CutLimits } from './cutLimits.ts';
import type { DesignGrid } from './designGrid.ts';
import type { DesignTarget } from './designTarget.ts';
import { millimetre as mm } from '../units/units.ts';
import type { LimitName } from './workshopLimits.ts';

/** A workshop limit a design presses against. */
export type BindingLimit = 'min-thickness' | 'uncut-end' | 'max-slope' | 'tool-radius';

const fmt = (metres: number): string => `${+(metres / mm).toFixed(1)} mm`;

/**
 * The limits a profile (thickness at the grid stations, m) sits on: thinnest point within 0.02 mm
 * of the minimum, material removed right up to an uncut end, a span within 1 % of the largest
 * slope, a station within 1 % of the tool's curvature.
 */
export function bindingLimits(grid: DesignGrid, thickness: ArrayLike<number>, limits: CutLimits): BindingLimit[] {
  const x = grid.positions;
  const n = x.length;
  const cut = (j: number): boolean => thickness[j]! < grid.original[j]! - 1e-7;
  const found = new Set<BindingLimit>();
  for (let j = 0; j < n; j++) {
    if (!cut(j)) continue;
    if (thickness[j]! <= limits.minThickness + 2e-5) found.add('min-thickness');
    const nearEdge = grid.offset[j]! >= grid.maxHalfSpan - 1.01 * grid.spacing;
    if (nearEdge) found.add('uncut-end');
  }
  for (let j = 0; j + 1 < n; j++) {
    if (!cut(j) && !cut(j + 1)) continue;
    if (Math.abs(thickness[j + 1]! - thickness[j]!) >= 0.99 * limits.maxSlope * (x[j + 1]! - x[j]!)) found.add('max-slope');
  }
  if (limits.minToolRadius > 0) {
    for (let j = 1; j + 1 < n; j++) {
      if (!cut(j)) continue;
      const h0 = x[j]! - x[j - 1]!;
      const h1 = x[j + 1]! - x[j]!;
      const curvature = (2 / (h0 + h1)) * ((thickness[j + 1]! - thickness[j]!) / h1 - (thickness[j]! - thickness[j - 1]!) / h0);
      if (curvature >= 0.99 / limits.minToolRadius) found.add('tool-radius');
    }
  }
  return [...found];
}

/** A limit as the maker reads it, with its value. */
export function describeLimit(limit: BindingLimit, limits: CutLimits): string {
  switch (limit) {
    case 'min-thickness':
      return `the minimum thickness (${fmt(limits.minThickness)})`;
    case 'uncut-end':
      return `the uncut ends (${fmt(limits.uncutLeft)} and ${fmt(limits.uncutRight)})`;
    case 'max-slope':
      return `the steepest wall (${+limits.maxSlope.toFixed(3)})`;
    case 'tool-radius':
      return `the tool radius (${fmt(limits.minToolRadius)})`;
  }
}

/** The source key of each binding limit. */
const sourceKey: Record<BindingLimit, LimitName> = {
  'min-thickness': 'min_thickness_mm',
  'uncut-end': 'uncut_end_mm',
  'max-slope': 'max_slope',
  'tool-radius': 'tool_radius_mm',
};

const ordinal = (k: number): string => (k === 0 ? 'the fundamental' : k === 1 ? 'the 2nd partial' : k === 2 ? 'the 3rd partial' : `partial ${k + 1}`);
const signed = (c: number): string => `${c >= 0 ? '+' : '−'}${Math.abs(c).toFixed(1)} cents`;

/** What the first part of the story needs about the closest shape found. */
export interface ClosestShape {
  readonly target: DesignTarget;
  readonly limits: CutLimits;
  /** Cents from the targets of the closest shape. */
  readonly cents: ArrayLike<number>;
  /** Cents of the uncut bar (before any new cut). */
  readonly uncutCents: ArrayLike<number>;
  readonly binding: readonly BindingLimit[];
  /** Which tool or rule sets each limit. */
  readonly sources: Readonly<Record<LimitName, string>>;
}

/**
 * The first part of the one story an infeasible design tells: one set of figures (the closest
 * shape's misses, each with its tolerance), whether the bar was already flat before any cut (no
 * removal can raise it), and the limits the shape presses against, each with the tool or rule
 * that sets it. designRemedies adds what relaxing each buys and the remedies.
 */
export function closestShapeReason(closest: ClosestShape): string {
  const { target, limits, cents, uncutCents, binding, sources } = closest;
  const tolerance = target.toleranceCents;
  const misses: string[] = [];
  for (let k = 0; k < cents.length; k++) if (Math.abs(cents[k]!) > tolerance[k]!) misses.push(`${ordinal(k)} ${signed(cents[k]!)} (±${tolerance[k]})`);
  let text = `closest shape: ${misses.join(', ') || 'within tolerance before the final clipping to the limits'}`;
  if (uncutCents[0]! < -tolerance[0]!) text += `; the bar is already ${Math.abs(uncutCents[0]!).toFixed(1)} cents flat before any cut, and removing wood from the arch only lowers it`;
  if (binding.length) text += `; limited by ${binding.map((b) => `${describeLimit(b, limits)}, set by ${sources[sourceKey[b]]}`).join('; ')}`;
  return text;
}

/** The same design with the fundamental left free (ratios only): what it reached. */
export interface RatioProbe {
  /** Cents of each partial's ratio to the fundamental from its target ratio (entry 0 is 0). */
  readonly ratioCents: ArrayLike<number>;
  /** Where the fundamental then lands, cents from its target. */
  readonly fundamentalCents: number;
  readonly binding: readonly BindingLimit[];
}

