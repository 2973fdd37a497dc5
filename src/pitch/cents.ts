/**
 * Interval from `referenceHz` to `hz` in cents: 1200 · log2(hz / referenceHz). Positive when `hz`
 * is sharp of the reference. Both must be positive and finite (the caller validates input).
 */
export function cents(hz: number, referenceHz: number): number {
  return 1200 * Math.log2(hz / referenceHz);
}

/** Frequency (Hz) lying `centsOffset` cents from `referenceHz`: referenceHz · 2^(cents/1200). */
export function shiftByCents(referenceHz: number, centsOffset: number): number {
  return referenceHz * 2 ** (centsOffset / 1200);
}

/** "sharp", "flat" or "in tune" for a signed cents deviation, with `toleranceCents` counted as in tune. */
export function sharpOrFlat(centsDeviation: number, toleranceCents = 0): 'sharp' | 'flat' | 'in tune' {
  if (centsDeviation > toleranceCents) return 'sharp';
  if (centsDeviation < -toleranceCents) return 'flat';
  return 'in tune';
}
