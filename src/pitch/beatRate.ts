/**
 * Beats per second heard between two simultaneous tones of nearly equal frequency (Hz):
 * |f1 − f2| (the envelope of a sum of two sinusoids). For a partial against its target tone.
 */
export function beatRate(hz: number, targetHz: number): number {
  return Math.abs(hz - targetHz);
}
