/** The equal-tempered interval nearest to a frequency ratio, and how far the ratio is from it. */
export interface NearestInterval {
  /** Whole semitones of the nearest equal-tempered interval (12 per octave). */
  readonly semitones: number;
  /** Its name, e.g. "2 octaves + major third". */
  readonly name: string;
  /** The ratio's signed distance from that interval, cents (−50 … +50). */
  readonly cents: number;
}

/** Names of the intervals within one octave, by semitones (common music-theory names). */
const simpleIntervals = [
  'unison', 'minor second', 'major second', 'minor third', 'major third', 'perfect fourth',
  'tritone', 'perfect fifth', 'minor sixth', 'major sixth', 'minor seventh', 'major seventh',
] as const;

/** Name of an interval of `semitones` ≥ 0 equal-tempered semitones: octaves plus a simple interval. */
export function intervalName(semitones: number): string {
  const octaves = Math.floor(semitones / 12);
  const rest = semitones - 12 * octaves;
  if (octaves === 0) return simpleIntervals[rest]!;
  const octaveText = octaves === 1 ? 'octave' : `${octaves} octaves`;
  return rest === 0 ? octaveText : `${octaveText} + ${simpleIntervals[rest]}`;
}

/**
 * The equal-tempered interval nearest to a ratio ≥ 1 (a partial over the fundamental): semitones
 * = round(12·log₂ ratio), cents = 1200·log₂ ratio − 100·semitones.
 */
export function nearestInterval(ratio: number): NearestInterval {
  const total = 1200 * Math.log2(ratio);
  const semitones = Math.max(0, Math.round(total / 100));
  return { semitones, name: intervalName(semitones), cents: total - 100 * semitones };
}
