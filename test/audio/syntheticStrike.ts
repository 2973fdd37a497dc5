// Test-only signal generator: a struck bar as a sum of exponentially decaying sinusoids, with a
// strike-noise burst, mains hum and white noise, all known exactly so tests can check readings.

/** One decaying partial of the synthetic bar. */
export interface SyntheticPartial {
  hz: number;
  /** Amplitude at the strike, full scale = 1. */
  amplitude: number;
  /** Time to fall 60 dB, s. */
  decayS: number;
}

/** Everything that goes into one synthetic recording. */
export interface StrikeScene {
  sampleRate: number;
  durationS: number;
  /** When the mallet hits, s (the quiet before it holds only hum and noise). */
  strikeS: number;
  partials: readonly SyntheticPartial[];
  /** Peak amplitude of the strike's broadband noise burst and its time constant, s. */
  strikeNoise?: { amplitude: number; timeConstantS: number };
  /** Mains hum: fundamental (50 or 60 Hz), amplitudes of harmonics 1, 2, 3, … */
  hum?: { hz: number; amplitudes: readonly number[] };
  /** RMS of steady white noise, full scale = 1. */
  noiseRms?: number;
  /** Seed of the noise generator (deterministic). */
  seed?: number;
}

/** A small deterministic pseudo-random generator (mulberry32), uniform on [0, 1). */
function randomSource(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal deviates from a uniform source (Box–Muller). */
function gaussianSource(uniform: () => number): () => number {
  return () => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
}

/**
 * Renders the scene: Σ A_k e^(−t/τ_k) sin(2π f_k t + φ_k) from the strike on (τ_k = T60_k / ln 1000,
 * φ_k random), plus a noise burst decaying from the strike, hum harmonics at random phases and
 * white noise throughout.
 */
export function synthesizeStrike(scene: StrikeScene): Float64Array {
  const { sampleRate } = scene;
  const length = Math.round(scene.durationS * sampleRate);
  const out = new Float64Array(length);
  const uniform = randomSource(scene.seed ?? 1);
  const gaussian = gaussianSource(uniform);
  const strikeIndex = Math.round(scene.strikeS * sampleRate);
  for (const partial of scene.partials) {
    const timeConstant = partial.decayS / Math.log(1000);
    const phase = 2 * Math.PI * uniform();
    const omega = (2 * Math.PI * partial.hz) / sampleRate;
    const decayPerSample = Math.exp(-1 / (timeConstant * sampleRate));
    let envelope = partial.amplitude;
    for (let i = strikeIndex; i < length; i++) {
      out[i]! += envelope * Math.sin(omega * (i - strikeIndex) + phase);
      envelope *= decayPerSample;
    }
  }
  if (scene.strikeNoise) {
    const { amplitude, timeConstantS } = scene.strikeNoise;
    const end = Math.min(length, strikeIndex + Math.round(12 * timeConstantS * sampleRate));
    for (let i = strikeIndex; i < end; i++) out[i]! += amplitude * Math.exp(-(i - strikeIndex) / (timeConstantS * sampleRate)) * (2 * uniform() - 1);
  }
  if (scene.hum) {
    scene.hum.amplitudes.forEach((amplitude, index) => {
      const omega = (2 * Math.PI * scene.hum!.hz * (index + 1)) / sampleRate;
      const phase = 2 * Math.PI * uniform();
      for (let i = 0; i < length; i++) out[i]! += amplitude * Math.sin(omega * i + phase);
    });
  }
  if (scene.noiseRms) for (let i = 0; i < length; i++) out[i]! += scene.noiseRms * gaussian();
  return out;
}
