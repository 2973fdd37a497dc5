import { defaultMeasurementUncertaintyCents, sessionPlayingTemperatureC, type SessionLog } from '../fileFormats/sessionFile.ts';
import { pitchTemperatureCoefficient } from '../material/pitchTemperatureCoefficient.ts';
import { sameShapeRuns, type WarmReading } from './warmReadings.ts';

/** A coefficient before the session's own readings: the material's, or what a lot taught. */
export interface PitchCoefficientPrior {
  /** Cents per °C. */
  readonly centsPerC: number;
  /** One-sigma, cents per °C. */
  readonly sigma: number;
  readonly from: 'bar file' | 'preset' | 'default' | 'lot';
  readonly source: string;
}

/** What the session's re-strikes of unchanged shapes at different temperatures say about the coefficient. */
export interface LearntPitchCoefficient {
  /** The readings' own estimate, cents per °C, and its one-sigma. */
  readonly centsPerC: number;
  readonly sigma: number;
  /** Pairs of steps (1-based) of the same shape at different temperatures that were used. */
  readonly steps: [number, number][];
  /** The largest temperature difference between readings of one shape, °C. */
  readonly spreadC: number;
}

/** How a session's readings are moved to the playing temperature. */
export interface SessionTemperature {
  /** The temperature the instrument is tuned for, °C. */
  readonly playingC: number;
  /** The coefficient used (cents per °C) and its one-sigma after what the session learnt. */
  readonly centsPerC: number;
  readonly sigma: number;
  /** `learnt` once the session's own readings decide it. */
  readonly from: PitchCoefficientPrior['from'] | 'learnt';
  readonly source: string;
  readonly prior: PitchCoefficientPrior;
  readonly learnt: LearntPitchCoefficient | null;
  /** Per step: the air temperature of the reading (°C; null when not recorded: taken as the playing temperature). */
  readonly readingC: (number | null)[];
  /** Per step: cents added to every reading to project it to the playing temperature, and its one-sigma. */
  readonly shiftCents: number[];
  readonly shiftSigmaCents: number[];
}

/** Slopes of single partials further than this many sigmas (and 0.5 cent/°C) from the median are left out (a misread partial). */
const outlierSigmas = 4;
const outlierFloor = 0.5;

/**
 * The pitch's temperature coefficient a session's readings show: within each run of unchanged
 * readings (sameShapeRuns) and for each partial, the least-squares slope of cents against the
 * air temperature; pooled over runs and partials with weights Σ(T − T̄)², slopes far from the
 * median dropped. Readings without a temperature, warm readings and partials out of order are
 * left out. Null when no run spans two temperatures.
 */
export function learnPitchCoefficient(log: SessionLog, warm: readonly WarmReading[] = []): LearntPitchCoefficient | null {
  const sigmaMeasure = log.measurement_uncertainty_cents ?? defaultMeasurementUncertaintyCents;
  const runs = sameShapeRuns(log);
  const isWarm = (k: number): boolean => warm.some((w) => w.step === k + 1);
  const byRun = new Map<number, number[]>();
  log.steps.forEach((step, k) => {
    if (step.air_temperature_c === undefined || isWarm(k)) return;
    byRun.set(runs[k]!, [...(byRun.get(runs[k]!) ?? []), k]);
  });
  const slopes: { slope: number; weight: number }[] = [];
  const pairs: [number, number][] = [];
  let spread = 0;
  for (const members of byRun.values()) {
    if (members.length < 2) continue;
    const temperatures = members.map((k) => log.steps[k]!.air_temperature_c!);
    const range = Math.max(...temperatures) - Math.min(...temperatures);
    if (range <= 0) continue;
    spread = Math.max(spread, range);
    const coldest = members[temperatures.indexOf(Math.min(...temperatures))]!;
    const warmest = members[temperatures.indexOf(Math.max(...temperatures))]!;
    pairs.push([Math.min(coldest, warmest) + 1, Math.max(coldest, warmest) + 1]);
    const partials = Math.min(...members.map((k) => log.steps[k]!.measured_hz.length));
    for (let n = 0; n < partials; n++) {
      if (members.some((k) => n > 0 && log.steps[k]!.measured_hz[n]! <= log.steps[k]!.measured_hz[n - 1]!)) continue;
      const x = temperatures;
      const y = members.map((k) => 1200 * Math.log2(log.steps[k]!.measured_hz[n]!));
      const meanX = x.reduce((a, b) => a + b, 0) / x.length;
      const meanY = y.reduce((a, b) => a + b, 0) / y.length;
      let sxx = 0;
      let sxy = 0;
      x.forEach((value, i) => {
        sxx += (value - meanX) ** 2;
        sxy += (value - meanX) * (y[i]! - meanY);
      });
      slopes.push({ slope: sxy / sxx, weight: sxx });
    }
  }
  if (slopes.length === 0) return null;
  const sorted = slopes.map((s) => s.slope).sort((a, b) => a - b);
  const median = sorted[Math.floor((sorted.length - 1) / 2)]! / 2 + sorted[Math.ceil((sorted.length - 1) / 2)]! / 2;
  const kept = slopes.filter((s) => Math.abs(s.slope - median) <= Math.max(outlierFloor, (outlierSigmas * sigmaMeasure) / Math.sqrt(s.weight)));
  const weight = kept.reduce((sum, s) => sum + s.weight, 0);
  const centsPerC = kept.reduce((sum, s) => sum + s.slope * s.weight, 0) / weight;
  return { centsPerC, sigma: sigmaMeasure / Math.sqrt(weight), steps: pairs, spreadC: spread };
}

/** The prior coefficient of a session's bar: its first step's material (bar file, preset, or the stated default). */
export function materialPitchPrior(log: SessionLog): PitchCoefficientPrior {
  const coefficient = pitchTemperatureCoefficient(log.steps[0]!.bar.material);
  return { centsPerC: coefficient.centsPerC, sigma: coefficient.sigma, from: coefficient.from, source: coefficient.source };
}

/**
 * How the session's readings move to the playing temperature (target.playing_temperature_c,
 * default 20 °C): projected cents = read cents + k·(T_playing − T_reading), k the coefficient in
 * cents per °C. k is the prior (the material's, or a lot's) combined with what the session's own
 * re-strikes of unchanged shapes at different temperatures show (learnPitchCoefficient), by
 * inverse-variance weighting: two readings 10 °C apart decide it to a few hundredths, so from then
 * on the bar's own coefficient is used. Each step's shift carries the coefficient's uncertainty
 * times its distance from the playing temperature. A step without an air temperature is taken as
 * read at the playing temperature (no shift), so older files behave as before.
 */
export function sessionTemperature(log: SessionLog, prior: PitchCoefficientPrior = materialPitchPrior(log), warm: readonly WarmReading[] = []): SessionTemperature {
  const playingC = sessionPlayingTemperatureC(log.target);
  const learnt = learnPitchCoefficient(log, warm);
  let centsPerC = prior.centsPerC;
  let sigma = prior.sigma;
  if (learnt) {
    const precision = 1 / prior.sigma ** 2 + 1 / learnt.sigma ** 2;
    centsPerC = (prior.centsPerC / prior.sigma ** 2 + learnt.centsPerC / learnt.sigma ** 2) / precision;
    sigma = 1 / Math.sqrt(precision);
  }
  const decided = learnt !== null && learnt.sigma < prior.sigma;
  const readingC = log.steps.map((step) => step.air_temperature_c ?? null);
  const shiftCents = readingC.map((t) => (t === null ? 0 : centsPerC * (playingC - t)));
  const shiftSigmaCents = readingC.map((t) => (t === null ? 0 : sigma * Math.abs(playingC - t)));
  return {
    playingC,
    centsPerC,
    sigma,
    from: decided ? 'learnt' : prior.from,
    source: decided ? `learnt from steps ${learnt.steps.map(([a, b]) => `${a} and ${b}`).join(', ')} (the same shape ${learnt.spreadC.toFixed(1)} °C apart)` : prior.source,
    prior,
    learnt,
    readingC,
    shiftCents,
    shiftSigmaCents,
  };
}

/** A step's readings (Hz) projected to the playing temperature. */
export function projectedHz(measuredHz: readonly number[], shiftCents: number): number[] {
  return measuredHz.map((hz) => hz * 2 ** (shiftCents / 1200));
}
