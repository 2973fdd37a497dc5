import FFT from 'fft.js';
import { hannWindow, windowPowerSum, windowSum } from './windows.ts';

/** The one-sided power spectrum of a Hann-windowed, zero-padded stretch of samples. */
export interface PowerSpectrum {
  /** |X_k|² for k = 0 … fftSize/2 (window not normalised). */
  power: Float64Array;
  /** FFT length (a power of two ≥ the window). */
  fftSize: number;
  /** Window length, samples. */
  windowLength: number;
  /** First sample of the stretch. */
  start: number;
  /** Samples per second, Hz. */
  sampleRate: number;
  /** Hz per FFT bin: sampleRate / fftSize. */
  binHz: number;
  /** Σ w: a steady sinusoid of amplitude A peaks at |X| = A · windowSum / 2. */
  windowSum: number;
  /** Σ w²: white noise of variance σ² has E|X|² = σ² · windowPowerSum. */
  windowPowerSum: number;
}

/** FFT plans with their input/output scratch, by size (reused between calls). */
const transforms = new Map<number, { transform: FFT; input: Float64Array; output: Float64Array }>();
const windows = new Map<number, Float64Array>();

function transformOfSize(size: number): { transform: FFT; input: Float64Array; output: Float64Array } {
  let plan = transforms.get(size);
  if (!plan) {
    plan = { transform: new FFT(size), input: new Float64Array(size), output: new Float64Array(2 * size) };
    transforms.set(size, plan);
  }
  return plan;
}

function hannOfLength(length: number): Float64Array {
  let window = windows.get(length);
  if (!window) {
    window = hannWindow(length);
    if (windows.size > 16) windows.clear();
    windows.set(length, window);
  }
  return window;
}

/** Smallest power of two ≥ n. */
export function nextPowerOfTwo(n: number): number {
  let size = 1;
  while (size < n) size *= 2;
  return size;
}

/**
 * Power spectrum of samples[start, start + windowLength) under a Hann window, zero-padded to the
 * smallest power of two of at least `zeroPadFactor` × windowLength (real FFT by fft.js).
 * Zero-padding by ≥ 2.5 keeps the bias of quadratic peak interpolation under about 0.1 % of a
 * bin (J. O. Smith, Spectral Audio Signal Processing, table 5.3: Hamming 2.4, Blackman 1.8).
 */
export function powerSpectrum(samples: Float64Array, sampleRate: number, start: number, windowLength: number, zeroPadFactor = 2.5): PowerSpectrum {
  const fftSize = Math.max(4, nextPowerOfTwo(Math.ceil(windowLength * zeroPadFactor)));
  const window = hannOfLength(windowLength);
  const { transform, input, output } = transformOfSize(fftSize);
  for (let n = 0; n < windowLength; n++) input[n] = samples[start + n]! * window[n]!;
  input.fill(0, windowLength);
  transform.realTransform(output, input);
  const half = fftSize / 2;
  const power = new Float64Array(half + 1);
  for (let k = 0; k <= half; k++) {
    const re = output[2 * k]!;
    const im = output[2 * k + 1]!;
    power[k] = re * re + im * im;
  }
  return {
    power,
    fftSize,
    windowLength,
    start,
    sampleRate,
    binHz: sampleRate / fftSize,
    windowSum: windowSum(window),
    windowPowerSum: windowPowerSum(window),
  };
}
