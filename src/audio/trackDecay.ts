import { blackmanHarrisWindow, windowPowerSum, windowSum } from './windows.ts';

/** The exponential decay of one partial, fitted to its envelope. */
export interface DecayFit {
  /** Time for the level to fall 60 dB, s (6.908 time constants). */
  decayS: number;
  /** Amplitude time constant τ of A(t) = A₀ e^(−t/τ), s. */
  timeConstantS: number;
  /** Amplitude (full scale = 1) of the partial at time t (s from the first sample). */
  amplitudeAt: (timeS: number) => number;
  /** Number of envelope frames the fit used. */
  frameCount: number;
  /** Time span the fitted frames cover, s. */
  spanS: number;
  /** Weighted root-mean-square misfit of the log envelope, dB. */
  residualDb: number;
}

/** How the envelope is tracked. */
export interface DecayOptions {
  /** Envelope frame length, samples (Blackman–Harris; ≥ 4.5 bins from any neighbour keeps it out). */
  frameLength: number;
  /** Variance of the (locally white) noise around `hz`, full scale = 1. */
  noiseVariance: number;
  /** Frames must stand this far above the noise, dB. */
  minimumSnrDb: number;
}

const nepersToDb = 20 / Math.LN10;

/**
 * Tracks a partial's envelope by complex demodulation at `hz`: the signal times e^(−iωn),
 * summed under a four-term Blackman–Harris window in frames hopping half a frame, from sample
 * `from` up to `to`. Frames that stand `minimumSnrDb` above the noise, from the first (among
 * the first three) until one falls below, have the mean noise power subtracted and get a
 * weighted least-squares line through ln(amplitude) against time (weights ∝ SNR, capped at
 * 20 dB). For a pure exponential the frame magnitudes decay exactly as the signal does, whatever
 * the frame length; the frame's own exponential weighting is divided out when the amplitude is
 * read. Returns null when fewer than three frames qualify.
 */
export function trackDecay(samples: Float64Array, sampleRate: number, hz: number, from: number, to: number, options: DecayOptions): DecayFit | null {
  const frameLength = Math.max(16, Math.min(Math.floor(options.frameLength), to - from));
  const window = blackmanHarrisWindow(frameLength);
  const gain = windowSum(window);
  const hop = Math.max(1, frameLength >> 1);
  const omega = (2 * Math.PI * hz) / sampleRate;
  // White noise of variance σ² shows |X| ≈ σ √(Σw²) in a frame; as an amplitude, 2 σ √(Σw²) / Σw.
  const noiseAmplitude = (2 * Math.sqrt(options.noiseVariance * windowPowerSum(window))) / gain;
  const threshold = noiseAmplitude * 10 ** (options.minimumSnrDb / 20);

  const noisePower = noiseAmplitude * noiseAmplitude;
  const times: number[] = [];
  const logAmplitudes: number[] = [];
  const weights: number[] = [];
  for (let start = from; start + frameLength <= to; start += hop) {
    const amplitude = demodulatedAmplitude(samples, omega, start, window, gain);
    // Noise adds its power on average: subtract it before taking the log (removes the bias that
    // would flatten the decay as it sinks towards the noise).
    const signalPower = amplitude * amplitude - noisePower;
    if (!(amplitude >= threshold) || signalPower <= 0) {
      // A struck partial is strongest at the start: give up after two quiet frames at the start.
      if (times.length > 0 || start - from >= 2 * hop) break;
      continue;
    }
    times.push((start + (frameLength - 1) / 2) / sampleRate);
    logAmplitudes.push(0.5 * Math.log(signalPower));
    // The variance of ln|X| falls as 1 / SNR; weights follow it, capped at 20 dB so the strongest
    // frames do not drown the rest of the decay.
    weights.push(Math.min(100, noisePower > 0 ? signalPower / noisePower : 100));
  }
  const count = times.length;
  if (count < 3) return null;
  let weightSum = 0;
  let meanT = 0;
  let meanY = 0;
  for (let i = 0; i < count; i++) {
    weightSum += weights[i]!;
    meanT += weights[i]! * times[i]!;
    meanY += weights[i]! * logAmplitudes[i]!;
  }
  meanT /= weightSum;
  meanY /= weightSum;
  let stt = 0;
  let sty = 0;
  for (let i = 0; i < count; i++) {
    stt += weights[i]! * (times[i]! - meanT) ** 2;
    sty += weights[i]! * (times[i]! - meanT) * (logAmplitudes[i]! - meanY);
  }
  const slope = sty / stt;
  const intercept = meanY - slope * meanT;
  let residual = 0;
  for (let i = 0; i < count; i++) residual += weights[i]! * (logAmplitudes[i]! - intercept - slope * times[i]!) ** 2;
  const timeConstantS = slope < 0 ? -1 / slope : Number.POSITIVE_INFINITY;
  // A frame centred on t reads A(t) · Σ w_n e^(−(t_n − t)/τ) / Σ w_n: divide that factor out.
  let weighted = 0;
  if (slope < 0) {
    for (let n = 0; n < frameLength; n++) weighted += window[n]! * Math.exp((slope * (n - (frameLength - 1) / 2)) / sampleRate);
  }
  const frameFactor = slope < 0 ? weighted / gain : 1;
  return {
    decayS: timeConstantS * Math.log(1000),
    timeConstantS,
    amplitudeAt: (timeS) => Math.exp(intercept + slope * timeS) / frameFactor,
    frameCount: count,
    spanS: times[count - 1]! - times[0]!,
    residualDb: Math.sqrt(residual / weightSum) * nepersToDb,
  };
}

/**
 * Amplitude (full scale = 1) of the component at `hz` in samples[from, from + length) under a
 * four-term Blackman–Harris window: 2 |Σ w_n x_n e^(−iω n)| / Σ w_n.
 */
export function componentAmplitude(samples: Float64Array, sampleRate: number, hz: number, from: number, length: number): number {
  const window = blackmanHarrisWindow(length);
  return demodulatedAmplitude(samples, (2 * Math.PI * hz) / sampleRate, from, window, windowSum(window));
}

/** 2 |Σ w_n x_(start+n) e^(−iω (start+n))| / gain, the phasor advanced by rotation. */
function demodulatedAmplitude(samples: Float64Array, omega: number, start: number, window: Float64Array, gain: number): number {
  const stepCos = Math.cos(omega);
  const stepSin = Math.sin(omega);
  let phaseRe = Math.cos(omega * start);
  let phaseIm = -Math.sin(omega * start);
  let sumRe = 0;
  let sumIm = 0;
  for (let n = 0; n < window.length; n++) {
    const value = samples[start + n]! * window[n]!;
    sumRe += value * phaseRe;
    sumIm += value * phaseIm;
    const nextRe = phaseRe * stepCos + phaseIm * stepSin;
    phaseIm = phaseIm * stepCos - phaseRe * stepSin;
    phaseRe = nextRe;
  }
  return (2 * Math.hypot(sumRe, sumIm)) / gain;
}
