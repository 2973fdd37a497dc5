import type { LotBarRecord } from '../fileFormats/lotFile.ts';
import { defaultCalibrationPriors, type CalibrationPriors } from './calibrationPriors.ts';
import type { PitchCoefficientPrior } from './sessionTemperature.ts';

/** A Gaussian belief: mean and one-sigma. */
export interface Belief {
  readonly mean: number;
  readonly sigma: number;
}

/** What the finished bars of one lot say about the next bar cut from it: the calibration's prior. */
export interface LotPrior {
  readonly lot: string;
  /** The bars it was learnt from (labels or notes), oldest first. */
  readonly bars: readonly string[];
  /** ln(E/ρ) and ln(G/ρ), E and G in Pa, ρ in kg/m³: what the partials decide (the density is each bar's own). */
  readonly lnSpecificYoung: Belief;
  readonly lnSpecificShear: Belief;
  /** Per partial: the 1D model's correction, fraction of frequency per unit arch depth. */
  readonly corrections: readonly Belief[];
  /** The pitch's temperature coefficient, when a bar of the lot learnt its own. */
  readonly pitch: PitchCoefficientPrior | null;
}

/**
 * How much bars cut from one board differ, one sigma, before the lot's own spread is known
 * (barwright's own allowances, a quarter to a third of the blank-to-blank spread of
 * defaultCalibrationPriors: the wood of one board is one tree's): E 5 %, G 10 %, the correction
 * per partial 0.01 per unit depth (a fifth of its blank-to-blank prior), the temperature
 * coefficient 0.2 cent per °C.
 */
export const withinLotSpread = { lnYoung: 0.05, lnShear: 0.1, correction: 0.01, pitchCentsPerC: 0.2 } as const;

/** Weight (in bars) of withinLotSpread against the lot's observed spread. */
const spreadPseudoBars = 2;

function pooled(values: readonly number[], sigmas: readonly number[], spreadPrior: number, ceiling: number): Belief {
  const n = values.length;
  const weights = sigmas.map((s) => 1 / Math.max(s, 1e-9) ** 2);
  const total = weights.reduce((a, b) => a + b, 0);
  const mean = values.reduce((sum, v, i) => sum + v * weights[i]!, 0) / total;
  const scatter = values.reduce((sum, v) => sum + (v - mean) ** 2, 0);
  const within = (spreadPseudoBars * spreadPrior ** 2 + scatter) / (spreadPseudoBars + n - 1);
  const ownVariance = sigmas.reduce((sum, s) => sum + s * s, 0) / n;
  const sigma = Math.sqrt(within * (1 + 1 / n) + ownVariance / n);
  return { mean, sigma: Math.min(sigma, ceiling) };
}

/**
 * The prior for the next bar of a lot from the records of its finished bars (lotFile): for ln(E/ρ),
 * ln(G/ρ), each partial's correction and, where learnt, the temperature coefficient, the
 * precision-weighted mean of the bars and a predictive sigma √(s²(1 + 1/n) + σ̄²/n), s² the
 * within-lot variance (the bars' scatter pooled with withinLotSpread at the weight of two bars),
 * σ̄² the bars' own mean variance; never wider than the prior without the lot. Null for no bars.
 */
export function lotPrior(lot: string, records: readonly LotBarRecord[], priors: CalibrationPriors = defaultCalibrationPriors): LotPrior | null {
  if (records.length === 0) return null;
  const young = pooled(
    records.map((r) => Math.log((r.E_GPa * 1e9) / r.density_kg_m3)),
    records.map((r) => r.E_uncertainty_percent / 100),
    withinLotSpread.lnYoung,
    priors.lnYoungSigma,
  );
  const shear = pooled(
    records.map((r) => Math.log((r.G_GPa * 1e9) / r.density_kg_m3)),
    records.map((r) => r.G_uncertainty_percent / 100),
    withinLotSpread.lnShear,
    priors.lnShearSigma,
  );
  const partials = Math.max(...records.map((r) => r.correction_per_depth.length));
  const corrections = Array.from({ length: partials }, (_, n) => {
    const known = records.filter((r) => n < r.correction_per_depth.length);
    return pooled(
      known.map((r) => r.correction_per_depth[n]!),
      known.map((r) => r.correction_sigma[n] ?? priors.correctionSigma),
      withinLotSpread.correction,
      priors.correctionSigma,
    );
  });
  const learntPitch = records.filter((r) => r.pitch_cents_per_c !== undefined && r.pitch_learnt);
  let pitch: PitchCoefficientPrior | null = null;
  if (learntPitch.length > 0) {
    const belief = pooled(
      learntPitch.map((r) => r.pitch_cents_per_c!),
      learntPitch.map((r) => r.pitch_sigma ?? withinLotSpread.pitchCentsPerC),
      withinLotSpread.pitchCentsPerC,
      Infinity,
    );
    pitch = { centsPerC: belief.mean, sigma: belief.sigma, from: 'lot', source: `lot ${lot}: learnt by ${learntPitch.map((r) => r.bar).join(', ')}` };
  }
  return { lot, bars: records.map((r) => r.bar), lnSpecificYoung: young, lnSpecificShear: shear, corrections, pitch };
}
