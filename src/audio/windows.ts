/**
 * Analysis windows, as Float64Array of `length` samples, symmetric about the centre and never
 * exactly zero at the ends (sample n at phase (n + ½)/length).
 */

/** Hann window w = sin²(π (n + ½) / L) (Harris, Proc. IEEE 66 (1978) 51: highest sidelobe −31.5 dB, 18 dB/octave). */
export function hannWindow(length: number): Float64Array {
  const window = new Float64Array(length);
  for (let n = 0; n < length; n++) {
    const s = Math.sin((Math.PI * (n + 0.5)) / length);
    window[n] = s * s;
  }
  return window;
}

/** Recently made Blackman–Harris windows by length (callers must not write to them). */
const blackmanHarrisCache = new Map<number, Float64Array>();

/**
 * Four-term Blackman–Harris window (Harris 1978, table 1: highest sidelobe −92 dB, main lobe
 * ±4 bins), used where a weak component must be read beside a strong one. Cached by length:
 * treat the returned array as read-only.
 */
export function blackmanHarrisWindow(length: number): Float64Array {
  const cached = blackmanHarrisCache.get(length);
  if (cached) return cached;
  const window = new Float64Array(length);
  for (let n = 0; n < length; n++) {
    const phase = (2 * Math.PI * (n + 0.5)) / length;
    window[n] = 0.35875 - 0.48829 * Math.cos(phase) + 0.14128 * Math.cos(2 * phase) - 0.01168 * Math.cos(3 * phase);
  }
  if (blackmanHarrisCache.size >= 64) blackmanHarrisCache.clear();
  blackmanHarrisCache.set(length, window);
  return window;
}

/** Sum of a window's samples (its DC gain). */
export function windowSum(window: Float64Array): number {
  let sum = 0;
  for (let n = 0; n < window.length; n++) sum += window[n]!;
  return sum;
}

/** Sum of a window's squared samples (its white-noise power gain). */
export function windowPowerSum(window: Float64Array): number {
  let sum = 0;
  for (let n = 0; n < window.length; n++) sum += window[n]! * window[n]!;
  return sum;
}
