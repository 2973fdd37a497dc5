import { InputError } from '../fileFormats/InputError.ts';
import { findStrike } from './findStrike.ts';
import { noiseFloor, type NoiseFloor } from './noiseFloor.ts';
import { pickPeaks, type SpectralPeak } from './pickPeaks.ts';
import { powerSpectrum, type PowerSpectrum } from './powerSpectrum.ts';
import { componentAmplitude, trackDecay, type DecayFit } from './trackDecay.ts';

/** One partial read from a recording. */
export interface MeasuredPartial {
  /** Frequency, Hz. */
  hz: number;
  /** Amplitude at the strike's onset (decay fit extrapolated), dB re a full-scale sine (0 dB = amplitude 1). */
  levelDb: number;
  /** Time for the partial to fall 60 dB, s (from the fitted exponential decay). */
  decayS: number;
  /** Peak above the local noise floor in the spectrum it was read from, dB. */
  snrDb: number;
}

/** What the partial finder read from a recording. */
export interface PartialAnalysis {
  sampleRate: number;
  /** Length of the recording, s. */
  durationS: number;
  /** Time of the strike's onset, s. */
  strikeS: number;
  /** Start of the stretch analysed (strike plus the skipped transient), s. */
  analysisStartS: number;
  /** The partials found, in ascending frequency. */
  partials: MeasuredPartial[];
}

/** Settings of the partial finder; every field has a default. */
export interface PartialOptions {
  /** At most this many partials, the strongest (default 8). */
  maxPartials?: number;
  /** Search band, Hz (default 30 Hz up to 21 kHz or 98 % of the Nyquist frequency). */
  minHz?: number;
  maxHz?: number;
  /** Time skipped after the strike so its noise has died away, s (default 0.01). */
  skipS?: number;
  /** Partials more than this far below the strongest are dropped, dB (default 50). */
  dynamicRangeDb?: number;
  /** A peak must stand this far above the noise floor, dB (default 18). */
  thresholdDb?: number;
}

/** The longest window analysed, samples: its ≥ 2.5× zero-padded FFT stays at 2^17 points. */
const longestWindow = 52_428;
/** Each shorter window is a quarter of the one before. */
const windowRatio = 4;
/** Noise-floor medians are taken over blocks this many (unpadded) bins wide. */
const floorBlockBins = 64;
/** Envelope frames must reach this far above the noise, dB. */
const envelopeSnrDb = 12;
/** A component decaying slower than this is steady background (hum, a fan), dB/s. */
const steadyDbPerSecond = 0.5;
/** Background: a component already within this many dB of its strike level before the strike. */
const backgroundMarginDb = 10;

interface Candidate {
  /** Peaks of this candidate, by window index. */
  peaks: Map<number, SpectralPeak>;
  hz: number;
}

/**
 * Finds the partials of a struck bar in a mono recording (full scale = 1):
 * 1. the strike is the largest sample; `skipS` after it the analysis starts;
 * 2. a ladder of Hann windows from that point (the longest the recording allows, then quarters
 *    down to about 4 ms) are zero-padded ≥ 2.5× and transformed (fft.js), so slow partials are
 *    resolved by the long windows and fast-decaying high ones caught by the short;
 * 3. in each spectrum, peaks above a median noise floor, refined by log-quadratic interpolation,
 *    sidelobes rejected (pickPeaks); peaks within a main lobe of each other across windows merge;
 * 4. each partial's frequency comes from the window where it is read most precisely (highest
 *    SNR × window length, resolved from its neighbours); its envelope, demodulated in frames that
 *    keep neighbours out, gives an exponential decay fit (trackDecay), its level at the strike
 *    and the T60 decay time. Peaks without a clean decay, steady ones (decaying < 0.5 dB/s) and
 *    ones already present before the strike (hum) are dropped.
 * Throws InputError(source, …) when the recording is too short or silent.
 */
export function findPartials(samples: Float64Array, sampleRate: number, options: PartialOptions = {}, source = 'recording'): PartialAnalysis {
  const maxPartials = options.maxPartials ?? 8;
  const minHz = options.minHz ?? 30;
  const maxHz = Math.min(options.maxHz ?? 21_000, 0.98 * (sampleRate / 2));
  const skipS = options.skipS ?? 0.01;
  const dynamicRangeDb = options.dynamicRangeDb ?? 50;
  const thresholdDb = options.thresholdDb ?? 18;
  if (!(maxPartials >= 1)) throw new InputError(source, 'partials', 'at least one partial must be asked for');

  const signal = withoutDc(samples);
  const strike = findStrike(signal, sampleRate);
  if (strike.peakMagnitude <= 0) throw new InputError(source, 'samples', 'the recording is silent');
  const start = strike.peakIndex + Math.round(skipS * sampleRate);
  const available = signal.length - start;
  const shortestWindow = Math.max(128, Math.round(0.004 * sampleRate));
  if (available < Math.round(0.1 * sampleRate)) {
    throw new InputError(source, 'duration', `only ${(available / sampleRate).toFixed(3)} s of sound after the strike; record at least 0.1 s`);
  }

  const spectra: PowerSpectrum[] = [];
  const floors: NoiseFloor[] = [];
  const peaksByWindow: SpectralPeak[][] = [];
  for (let length = Math.min(available, longestWindow); length >= shortestWindow; length = Math.floor(length / windowRatio)) {
    const spectrum = powerSpectrum(signal, sampleRate, start, length);
    const pad = spectrum.fftSize / length;
    const floor = noiseFloor(spectrum.power, floorBlockBins * pad, pad);
    spectra.push(spectrum);
    floors.push(floor);
    peaksByWindow.push(pickPeaks(spectrum, floor, { minHz, maxHz, thresholdDb, maskMarginDb: 6 }));
  }

  const candidates = mergeAcrossWindows(peaksByWindow, spectra);
  // Rank by the strongest apparent amplitude; only a few times the asked-for number are tracked.
  const ranked = candidates
    .map((candidate) => ({ candidate, apparent: Math.max(...[...candidate.peaks.values()].map((p) => p.amplitude)) }))
    .sort((a, b) => b.apparent - a.apparent)
    .slice(0, 4 * maxPartials + 8)
    .map((entry) => entry.candidate);

  const longest = spectra[0]!;
  const found: MeasuredPartial[] = [];
  for (const candidate of ranked) {
    const neighbourGapHz = nearestGap(candidate.hz, candidates);
    const best = bestReading(candidate, spectra, neighbourGapHz);
    if (!best) continue;
    const hz = best.hz;
    // Noise variance near hz from the longest window's floor (median |X|² = ln 2 · σ² Σw²).
    const noiseVariance = floors[0]!.at(hz / longest.binHz) / (Math.LN2 * longest.windowPowerSum);
    const fit = fitDecay(signal, sampleRate, hz, start, neighbourGapHz, noiseVariance);
    if (!fit) continue;
    const decayDbPerSecond = 60 / fit.decayS;
    if (!(decayDbPerSecond > steadyDbPerSecond)) continue;
    const strikeAmplitude = fit.amplitudeAt(strike.onsetIndex / sampleRate);
    if (presentBeforeStrike(signal, sampleRate, hz, strike.onsetIndex, neighbourGapHz, strikeAmplitude)) continue;
    found.push({ hz, levelDb: 20 * Math.log10(strikeAmplitude), decayS: fit.decayS, snrDb: best.snrDb });
  }
  found.sort((a, b) => b.levelDb - a.levelDb);
  const strongest = found[0]?.levelDb ?? 0;
  const partials = found
    .filter((p) => p.levelDb >= strongest - dynamicRangeDb)
    .slice(0, maxPartials)
    .sort((a, b) => a.hz - b.hz);
  return {
    sampleRate,
    durationS: samples.length / sampleRate,
    strikeS: strike.onsetIndex / sampleRate,
    analysisStartS: start / sampleRate,
    partials,
  };
}

/** A copy of the samples with their mean removed. */
function withoutDc(samples: Float64Array): Float64Array {
  let mean = 0;
  for (let i = 0; i < samples.length; i++) mean += samples[i]!;
  mean /= samples.length || 1;
  const out = new Float64Array(samples.length);
  for (let i = 0; i < samples.length; i++) out[i] = samples[i]! - mean;
  return out;
}

/**
 * Groups peaks of the window ladder (longest first): a peak joins the nearest candidate within
 * its own main lobe (2 bins, widened for a broadened peak), or starts a new one.
 */
function mergeAcrossWindows(peaksByWindow: readonly SpectralPeak[][], spectra: readonly PowerSpectrum[]): Candidate[] {
  const candidates: Candidate[] = [];
  peaksByWindow.forEach((peaks, windowIndex) => {
    const binHz = spectra[windowIndex]!.sampleRate / spectra[windowIndex]!.windowLength;
    for (const peak of peaks) {
      const reach = 2 * binHz * Math.max(1, peak.widthBins / 2);
      let nearest: Candidate | undefined;
      for (const candidate of candidates) {
        const distance = Math.abs(candidate.hz - peak.hz);
        if (distance <= reach && !candidate.peaks.has(windowIndex) && (!nearest || distance < Math.abs(nearest.hz - peak.hz))) nearest = candidate;
      }
      if (nearest) nearest.peaks.set(windowIndex, peak);
      else candidates.push({ peaks: new Map([[windowIndex, peak]]), hz: peak.hz });
    }
  });
  return candidates;
}

/** Distance to the nearest other candidate, Hz (or to the spectrum's edge image at 2f). */
function nearestGap(hz: number, candidates: readonly Candidate[]): number {
  let gap = 2 * hz;
  for (const other of candidates) {
    const distance = Math.abs(other.hz - hz);
    if (distance > 0 && distance < gap) gap = distance;
  }
  return gap;
}

/**
 * The reading to trust: among the windows that resolve the candidate from its nearest neighbour
 * (≥ 4 bins apart under Hann), the one with the largest SNR (dB) + 20 log10(window length) —
 * frequency precision grows with both.
 */
function bestReading(candidate: Candidate, spectra: readonly PowerSpectrum[], gapHz: number): SpectralPeak | null {
  let best: SpectralPeak | null = null;
  let bestScore = Number.NEGATIVE_INFINITY;
  let fallback: SpectralPeak | null = null;
  for (const [windowIndex, peak] of candidate.peaks) {
    const spectrum = spectra[windowIndex]!;
    if (!fallback) fallback = peak;
    if (gapHz < (4 * spectrum.sampleRate) / spectrum.windowLength) continue;
    const score = peak.snrDb + 20 * Math.log10(spectrum.windowLength);
    if (score > bestScore) {
      bestScore = score;
      best = peak;
    }
  }
  return best ?? fallback;
}

/**
 * Decay fit with the shortest frames that keep the nearest neighbour outside the Blackman–Harris
 * main lobe (6 bins) and hold 8 periods; while fewer than 8 frames clear the noise, the frames
 * are doubled (more signal per frame, for weak or fast-decaying partials) up to a quarter of the
 * recording, which also caps the first length. The fit with the most frames wins.
 */
function fitDecay(signal: Float64Array, sampleRate: number, hz: number, start: number, gapHz: number, noiseVariance: number): DecayFit | null {
  const longestFrame = Math.floor((signal.length - start) / 4);
  let frameLength = Math.min(longestFrame, Math.max(Math.ceil((8 * sampleRate) / hz), Math.ceil((6 * sampleRate) / gapHz), 64));
  let best: DecayFit | null = null;
  for (; frameLength <= longestFrame; frameLength *= 2) {
    const fit = trackDecay(signal, sampleRate, hz, start, signal.length, { frameLength, noiseVariance, minimumSnrDb: envelopeSnrDb });
    if (fit && (!best || fit.frameCount > best.frameCount)) best = fit;
    if (best && best.frameCount >= 8) break;
  }
  return best;
}

/**
 * True when a component at `hz` is already there before the strike within `backgroundMarginDb`
 * of its strike amplitude (hum, a steady tone): checked on the quiet before the onset when it is
 * long enough to keep the nearest neighbour out (Blackman–Harris, ≥ 6 bins).
 */
function presentBeforeStrike(signal: Float64Array, sampleRate: number, hz: number, onsetIndex: number, gapHz: number, strikeAmplitude: number): boolean {
  const quietEnd = onsetIndex - Math.round(0.005 * sampleRate);
  const needed = Math.max(Math.ceil((6 * sampleRate) / gapHz), Math.ceil((8 * sampleRate) / hz));
  if (quietEnd < needed) return false;
  const length = Math.min(quietEnd, Math.max(needed, Math.round(0.5 * sampleRate)));
  return componentAmplitude(signal, sampleRate, hz, quietEnd - length, length) > strikeAmplitude * 10 ** (-backgroundMarginDb / 20);
}
