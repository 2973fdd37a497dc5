import type { NoiseFloor } from './noiseFloor.ts';
import type { PowerSpectrum } from './powerSpectrum.ts';

/** A peak found in one power spectrum. */
export interface SpectralPeak {
  /** Refined peak frequency, Hz. */
  hz: number;
  /** Refined peak power, dB (10 log10 |X|²). */
  powerDb: number;
  /** Peak power above the local noise floor, dB. */
  snrDb: number;
  /** Full width at −6 dB, in bins of the unpadded window (a steady tone under Hann: 2.0). */
  widthBins: number;
  /** Amplitude a steady sinusoid would need to give this peak: 2 |X| / Σw (full scale = 1). */
  amplitude: number;
}

/** How peaks are picked. */
export interface PeakOptions {
  /** Lowest and highest frequency searched, Hz. */
  minHz: number;
  maxHz: number;
  /** A peak must stand this far above the noise floor, dB. */
  thresholdDb: number;
  /** A peak must stand this far above the leakage of any stronger peak, dB. */
  maskMarginDb: number;
}

const decibel = 10 / Math.LN10;

/**
 * Hann leakage envelope, dB relative to the peak, at `distanceBins` (unpadded bins) from it:
 * −31.5 dB at the first sidelobe (2.5 bins) falling 18 dB per octave (Harris, Proc. IEEE 66
 * (1978) 51, table 1). Inside 2.5 bins everything belongs to the peak's main lobe.
 */
export function hannLeakageDb(distanceBins: number): number {
  if (distanceBins < 2.5) return 0;
  return -31.5 - 60 * Math.log10(distanceBins / 2.5);
}

/**
 * Picks the peaks of a power spectrum: local maxima over ±1 unpadded bin that stand
 * `thresholdDb` above the noise floor, refined to sub-bin precision by fitting a parabola to the
 * log power of the three top bins (J. O. Smith, Spectral Audio Signal Processing, "quadratic
 * interpolation of spectral peaks"), then rid of sidelobes: a peak must clear the Hann leakage
 * envelope of every stronger peak (its distance scaled by that peak's measured width, so peaks
 * broadened by a fast decay mask a wider band) by `maskMarginDb`. Strongest first.
 */
export function pickPeaks(spectrum: PowerSpectrum, floor: NoiseFloor, options: PeakOptions): SpectralPeak[] {
  const { power, binHz } = spectrum;
  const pad = spectrum.fftSize / spectrum.windowLength;
  const radius = Math.max(1, Math.round(pad));
  const threshold = 10 ** (options.thresholdDb / 10);
  const first = Math.max(radius + 1, Math.ceil(options.minHz / binHz));
  const last = Math.min(power.length - radius - 2, Math.floor(options.maxHz / binHz));
  const found: SpectralPeak[] = [];
  for (let k = first; k <= last; k++) {
    const p = power[k]!;
    let isMaximum = true;
    for (let j = k - radius; j <= k + radius; j++) {
      if (j !== k && (power[j]! > p || (power[j]! === p && j < k))) {
        isMaximum = false;
        break;
      }
    }
    if (!isMaximum) continue;
    const floorPower = floor.at(k);
    if (p <= floorPower * threshold) continue;
    const below = Math.log(power[k - 1]!);
    const top = Math.log(p);
    const above = Math.log(power[k + 1]!);
    const curvature = below - 2 * top + above;
    const offset = curvature < 0 ? (0.5 * (below - above)) / curvature : 0;
    const logPeak = top - 0.25 * (below - above) * offset;
    const peakPower = Math.exp(logPeak);
    found.push({
      hz: (k + offset) * binHz,
      powerDb: logPeak * decibel,
      snrDb: (logPeak - Math.log(floorPower)) * decibel,
      widthBins: halfPowerWidth(power, k, peakPower) / pad,
      amplitude: (2 * Math.sqrt(peakPower)) / spectrum.windowSum,
    });
  }
  found.sort((a, b) => b.powerDb - a.powerDb);
  const unpaddedBinHz = spectrum.sampleRate / spectrum.windowLength;
  const kept: SpectralPeak[] = [];
  for (const peak of found) {
    const masked = kept.some((stronger) => {
      const scale = Math.max(1, stronger.widthBins / 2);
      const distance = Math.abs(peak.hz - stronger.hz) / unpaddedBinHz / scale;
      return peak.powerDb < stronger.powerDb + hannLeakageDb(distance) + options.maskMarginDb;
    });
    if (!masked) kept.push(peak);
  }
  return kept;
}

/** Full width (padded bins) where the power stays above a quarter (−6 dB) of the peak's. */
function halfPowerWidth(power: Float64Array, k: number, peakPower: number): number {
  const level = peakPower / 4;
  let left = k;
  while (left > 0 && power[left]! > level) left--;
  let right = k;
  while (right < power.length - 1 && power[right]! > level) right++;
  const leftEdge = power[left]! > level ? left : left + (level - power[left]!) / (power[left + 1]! - power[left]!);
  const rightEdge = power[right]! > level ? right : right - (level - power[right]!) / (power[right - 1]! - power[right]!);
  return Math.max(0, rightEdge - leftEdge);
}
