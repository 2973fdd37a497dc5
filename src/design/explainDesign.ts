import type { CutLimits } from './cutLimits.ts';
import type { DesignGrid } from './designGrid.ts';
import type { DesignTarget } from './designTarget.ts';
import { millimetre as mm } from '../units/units.ts';

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

function describeLimit(limit: BindingLimit, limits: CutLimits): string {
  switch (limit) {
    case 'min-thickness':
      return `the minimum thickness (${fmt(limits.minThickness)})`;
    case 'uncut-end':
      return `the uncut ends (${fmt(limits.uncutLeft)} and ${fmt(limits.uncutRight)})`;
    case 'max-slope':
      return `the largest slope (${+limits.maxSlope.toFixed(3)})`;
    case 'tool-radius':
      return `the tool radius (${fmt(limits.minToolRadius)})`;
  }
}

/** "or allowing shortening", or, when it was allowed, what more would take. */
function shorteningHelp(limits: CutLimits): string {
  return limits.allowShortening ? `or allowing more shortening than the ${fmt(limits.maxShortening)} given` : 'or allowing shortening';
}

const ordinal = (k: number): string => (k === 0 ? 'the fundamental' : k === 1 ? 'the 2nd partial' : k === 2 ? 'the 3rd partial' : `partial ${k + 1}`);
const signed = (c: number): string => `${c >= 0 ? '+' : '−'}${Math.abs(c).toFixed(1)} cents`;

/** The same design with the fundamental left free (ratios only): what it reached. */
export interface RatioProbe {
  /** Cents of each partial's ratio to the fundamental from its target ratio (entry 0 is 0). */
  readonly ratioCents: ArrayLike<number>;
  /** Where the fundamental then lands, cents from its target. */
  readonly fundamentalCents: number;
  readonly binding: readonly BindingLimit[];
}

/** What the explanation needs about the closest shape found. */
export interface Shortfall {
  readonly target: DesignTarget;
  readonly limits: CutLimits;
  /** Bar length (m) the design was for. */
  readonly length: number;
  /** Cents from the targets of the closest shape. */
  readonly cents: ArrayLike<number>;
  /** Cents of the uncut bar (before any new cut). */
  readonly uncutCents: ArrayLike<number>;
  readonly binding: readonly BindingLimit[];
  readonly ratioProbe?: RatioProbe;
}

/**
 * One or two sentences for a maker: which partials miss and by how much, which limit binds, and
 * what would help (a longer, shorter or thinner blank, other ratios, easier limits). With a ratio
 * probe it tells a blank of the wrong length (ratios reachable, fundamental off) from ratios out
 * of reach on this section. Length estimates use f₁ ∝ 1/L² (uniform bar scaling, Blevins 1979,
 * table 8-1): rough guides.
 */
export function shortfallReason(shortfall: Shortfall): string {
  const { target, limits, length, cents, uncutCents, binding, ratioProbe } = shortfall;
  const tolerance = target.toleranceCents;
  if (uncutCents[0]! < -tolerance[0]!) {
    const shorter = length * 2 ** (uncutCents[0]! / 2400);
    return (
      `the bar is already ${Math.abs(uncutCents[0]!).toFixed(1)} cents flat of ${target.fundamentalHz.toFixed(2)} Hz before any cut, and removing wood from the arch only lowers it: ` +
      `use a shorter blank (under about ${fmt(shorter)}), ${limits.allowShortening ? `or allow more shortening than the ${fmt(limits.maxShortening)} given` : 'or allow shortening'}`
    );
  }
  const misses: string[] = [];
  for (let k = 0; k < cents.length; k++) if (Math.abs(cents[k]!) > tolerance[k]!) misses.push(`${ordinal(k)} ${signed(cents[k]!)} (±${tolerance[k]})`);
  const closest = `closest shape: ${misses.join(', ') || 'within tolerance before the final clipping to the limits'}`;
  const limitList = (limitsHit: readonly BindingLimit[]): string => limitsHit.map((b) => describeLimit(b, limits)).join(', ');
  if (ratioProbe) {
    const ratioMisses: string[] = [];
    let flat = false;
    let sharp = false;
    for (let k = 1; k < cents.length; k++) {
      const c = ratioProbe.ratioCents[k]!;
      if (Math.abs(c) <= tolerance[k]!) continue;
      ratioMisses.push(`${ordinal(k)} ${signed(c)} from ${target.ratios[k]}× the fundamental`);
      if (c < 0) flat = true;
      else sharp = true;
    }
    if (ratioMisses.length === 0) {
      const c = ratioProbe.fundamentalCents;
      const suggested = fmt(length * 2 ** (c / 2400));
      if (c < 0)
        return `${closest}. The arch that gives ${target.ratios.join(':')} takes the fundamental ${Math.abs(c).toFixed(0)} cents flat: the blank is too long for this note. What would help: a shorter blank (about ${suggested}), ${shorteningHelp(limits)}`;
      return `${closest}. The arch that gives ${target.ratios.join(':')} leaves the fundamental ${c.toFixed(0)} cents sharp${binding.length ? ` (limited by ${limitList(binding)})` : ''}: the blank is too short or too thick for this note. What would help: a longer blank (about ${suggested}) or a thinner one${binding.includes('min-thickness') ? ', or a smaller minimum thickness' : ''}`;
    }
    const help: string[] = [];
    if (flat) help.push('a thinner blank for its length (slender bars reach higher ratios)');
    if (sharp) help.push('a thicker blank for its length');
    help.push(target.ratios.length > 2 ? `other ratios (such as ${target.ratios.slice(0, 2).join(':')})` : 'other ratios');
    if (ratioProbe.binding.includes('max-slope') || ratioProbe.binding.includes('tool-radius')) help.push('a steeper-cutting or smaller tool');
    if (ratioProbe.binding.includes('uncut-end')) help.push('shorter uncut ends');
    return `${closest}. Even with the fundamental left free the ratios stay out of reach (${ratioMisses.join(', ')})${ratioProbe.binding.length ? `, limited by ${limitList(ratioProbe.binding)}` : ''}. What would help: ${help.join('; ')}`;
  }
  const help: string[] = [];
  const fundamental = cents[0]!;
  if (fundamental > tolerance[0]!) help.push('a longer or thinner blank' + (binding.includes('min-thickness') ? ', a smaller minimum thickness' : '') + (binding.includes('uncut-end') ? ', shorter uncut ends' : ''));
  if (fundamental < -tolerance[0]!) help.push(`a shorter blank (about ${fmt(length * 2 ** (fundamental / 2400))}) ${shorteningHelp(limits)}`);
  if (Array.from(cents).some((c, k) => k > 0 && Math.abs(c) > tolerance[k]!)) help.push('other ratios');
  return `${closest}${binding.length ? `; limited by ${limitList(binding)}` : ''}. What would help: ${help.join('; ') || 'easier limits'}`;
}
