import type { CutLimits } from '../design/cutLimits.ts';
import type { ThicknessProfile } from '../section/ThicknessProfile.ts';

/** A linear inequality on the region amplitudes (mm): coefficients · amplitudes ≤ bound. */
export interface LinearInequality {
  readonly coefficients: Float64Array;
  readonly bound: number;
  /** Which workshop limit the row stands for. */
  readonly rule: 'min-thickness' | 'max-slope' | 'tool-radius';
}

const mmPerMetre = 1e3;
/** Region shape values below this count as zero (outside the region). */
const negligible = 1e-12;

function scaled(coefficients: Float64Array, bound: number, rule: LinearInequality['rule']): LinearInequality {
  let largest = 0;
  for (const c of coefficients) largest = Math.max(largest, Math.abs(c));
  if (largest === 0) return { coefficients, bound, rule };
  return { coefficients: coefficients.map((c) => c / largest), bound: bound / largest, rule };
}

/**
 * The workshop limits as linear inequalities on the amplitudes (mm) of the cut regions, for a
 * profile on a cutting grid (metres) and each region's shape at its stations. The cut is
 * removal-only by construction (non-negative amplitudes of non-negative shapes); these rows add,
 * wherever a region reaches: thickness ≥ the minimum (no removal where the bar is already at or
 * below it); |slope| ≤ the limit or, where the bar is already steeper, no steeper than now; and
 * the tool radius, d²t/dx² ≤ 1/radius (discrete, as checkProfile measures it) or no tighter than
 * now. Rows are scaled to unit largest coefficient.
 */
export function cutConstraints(profile: ThicknessProfile, shapes: readonly Float64Array[], limits: CutLimits): LinearInequality[] {
  const x = profile.positions;
  const t = profile.thicknesses;
  const n = x.length;
  const count = shapes.length;
  const touched = (j: number): boolean => shapes.some((shape) => shape[j]! > negligible);
  const rows: LinearInequality[] = [];
  for (let j = 0; j < n; j++) {
    if (!touched(j)) continue;
    const coefficients = Float64Array.from(shapes, (shape) => shape[j]!);
    rows.push(scaled(coefficients, Math.max(0, t[j]! - limits.minThickness) * mmPerMetre, 'min-thickness'));
  }
  for (let j = 0; j + 1 < n; j++) {
    if (!touched(j) && !touched(j + 1)) continue;
    const h = x[j + 1]! - x[j]!;
    const rise = t[j + 1]! - t[j]!;
    const allowed = Math.max(limits.maxSlope * h, Math.abs(rise));
    const change = Float64Array.from(shapes, (shape) => shape[j + 1]! - shape[j]!);
    if (change.every((c) => Math.abs(c) < negligible)) continue;
    // after = rise − change·a/1000; require −allowed ≤ after ≤ allowed.
    rows.push(scaled(change.map((c) => -c), (allowed - rise) * mmPerMetre, 'max-slope'));
    rows.push(scaled(change, (allowed + rise) * mmPerMetre, 'max-slope'));
  }
  if (limits.minToolRadius > 0) {
    const cap = 1 / limits.minToolRadius;
    const curvature = (values: ArrayLike<number>, j: number): number => {
      const h0 = x[j]! - x[j - 1]!;
      const h1 = x[j + 1]! - x[j]!;
      return (2 / (h0 + h1)) * ((values[j + 1]! - values[j]!) / h1 - (values[j]! - values[j - 1]!) / h0);
    };
    for (let j = 1; j + 1 < n; j++) {
      if (!touched(j - 1) && !touched(j) && !touched(j + 1)) continue;
      const now = curvature(t, j);
      const coefficients = new Float64Array(count);
      shapes.forEach((shape, k) => (coefficients[k] = -curvature(shape, j)));
      if (coefficients.every((c) => Math.abs(c) < negligible)) continue;
      rows.push(scaled(coefficients, (Math.max(cap, now) - now) * mmPerMetre, 'tool-radius'));
    }
  }
  return rows;
}
