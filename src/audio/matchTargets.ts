import { cents } from '../pitch/cents.ts';

/** A target partial and the measured partial taken to be it. */
export interface TargetMatch {
  /** Index into the targets (0 = fundamental). */
  target: number;
  /** Index into the measured partials, or null when none lies near enough. */
  partial: number | null;
  /** Measured minus target, cents (positive = sharp), or null. */
  cents: number | null;
  /** Beats per second heard against a reference tone at the target: |f − f_target|, or null. */
  beatsPerSecond: number | null;
}

/**
 * Pairs target frequencies (Hz) with measured partials (Hz) one-to-one, closest pair (in cents)
 * first, each within `toleranceCents` (default 300: a rough-cut bar can be far off); or, given
 * labels (bending mode numbers, 1 = fundamental, per measured partial), target k takes the
 * partial labelled k + 1.
 */
export function matchTargets(partialHz: readonly number[], targetHz: readonly number[], options: { toleranceCents?: number; modes?: readonly (number | null)[] } = {}): TargetMatch[] {
  const tolerance = options.toleranceCents ?? 300;
  const chosen = new Map<number, number>();
  if (options.modes) {
    options.modes.forEach((mode, partial) => {
      if (mode !== null && mode >= 1 && mode <= targetHz.length && !chosen.has(mode - 1)) chosen.set(mode - 1, partial);
    });
  } else {
    const pairs: { target: number; partial: number; distance: number }[] = [];
    targetHz.forEach((target, t) => {
      partialHz.forEach((hz, p) => {
        const distance = Math.abs(cents(hz, target));
        if (distance <= tolerance) pairs.push({ target: t, partial: p, distance });
      });
    });
    pairs.sort((a, b) => a.distance - b.distance);
    const used = new Set<number>();
    for (const { target, partial } of pairs) {
      if (chosen.has(target) || used.has(partial)) continue;
      chosen.set(target, partial);
      used.add(partial);
    }
  }
  return targetHz.map((target, index) => {
    const partial = chosen.get(index);
    if (partial === undefined) return { target: index, partial: null, cents: null, beatsPerSecond: null };
    const hz = partialHz[partial]!;
    return { target: index, partial, cents: cents(hz, target), beatsPerSecond: Math.abs(hz - target) };
  });
}
