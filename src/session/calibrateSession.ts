import type { BarModel } from '../modes/BarModel.ts';
import { InputError } from '../fileFormats/InputError.ts';
import { defaultMeasurementUncertaintyCents, type SessionLog } from '../fileFormats/sessionFile.ts';
import { defaultCalibrationPriors, flagFloorCents, flagSigmas, maxFlagged, type CalibrationPriors } from './calibrationPriors.ts';
import { fitModuli, type FitResult, type FitShape, type LinearPrior } from './fitModuli.ts';
import { sessionShapes } from './sessionShapes.ts';
import { uniformModelAllowanceCents } from './characterizeBlank.ts';
import { hzToAbsoluteCents, type PartialEvaluation } from './partialModel.ts';
import { sessionLogWarnings } from './sessionLogWarnings.ts';
import { materialPitchPrior, sessionTemperature, type SessionTemperature } from './sessionTemperature.ts';
import { warmBarMinutes, warmReadings, type WarmReading } from './warmReadings.ts';
import type { LotPrior } from './lotPrior.ts';
import { thicknessAt } from '../section/ThicknessProfile.ts';
import { defined } from '../fileFormats/jsonFields.ts';

/** A measurement set aside because no plausible model explains it. */
export interface MeasurementFlag {
  /** Step number, 1-based. */
  step: number;
  /** Partial number, 1-based. */
  partial: number;
  hz: number;
  /** How far (cents) the measurement lies from what the rest of the session predicts for it; null for an out-of-order list. */
  residual_cents: number | null;
  reason: string;
}

/** The fitted depth of a cut recorded as planned: the maker removed (1 + scale) × the planned depth. */
export interface CutDepthEstimate {
  /** Step number (1-based) the cut led to. */
  step: number;
  scale: number;
  /** One-sigma uncertainty of the scale. */
  sigma: number;
}

/** One step as the calibration sees it. */
export interface CalibratedStep {
  /** The step's estimated real shape in SI (measured thicknesses and fitted cut depths applied), with the calibrated moduli. */
  readonly model: BarModel;
  readonly depth: number;
  /** The readings projected to the playing temperature (Hz): what the calibration fits. */
  readonly measuredHz: readonly number[];
  /** The readings as taken (Hz), at the step's air temperature. */
  readonly readHz: readonly number[];
  /** The calibrated model's partials for this shape at the playing temperature (Hz), as many as measured. */
  readonly fittedHz: number[];
  /** Measured − fitted, cents; null where the measurement was set aside. */
  readonly residualCents: (number | null)[];
  /** The one-sigma allowance each measurement was weighed with, cents. */
  readonly sigmaCents: number[];
}

/** The calibrated model of the bar in a session: material, per-partial corrections, their uncertainty. */
export interface SessionCalibration {
  /** Young's modulus (Pa) and shear modulus (Pa) fitted; density (kg/m³) from the bar file. */
  readonly youngModulus: number;
  readonly shearModulus: number;
  readonly density: number;
  /** Posterior one-sigma of ln E and ln G (relative uncertainties). */
  readonly lnYoungSigma: number;
  readonly lnShearSigma: number;
  /** Per-partial corrections c_n (fraction of frequency per unit arch depth). */
  readonly corrections: number[];
  /** The fitted depth of each cut recorded as planned since the last anchored step. */
  readonly cutDepths: CutDepthEstimate[];
  /** Parameters [ln E, ln G, c_1…, cut depth scales…] and their posterior covariance. */
  readonly parameters: number[];
  readonly covariance: number[][];
  readonly steps: CalibratedStep[];
  readonly flags: MeasurementFlag[];
  readonly warnings: string[];
  /** The partial evaluation of the current (last) shape at the calibrated moduli. */
  readonly current: PartialEvaluation;
  /** How many partials the calibrated model carries. */
  readonly modes: number;
  readonly priors: CalibrationPriors;
  readonly measurementSigmaCents: number;
  /** How the readings were moved to the playing temperature (the coefficient, learnt or given). */
  readonly temperature: SessionTemperature;
  /** Readings taken while the bar was warm from a cut (set aside when a later reading of the shape governs). */
  readonly warm: WarmReading[];
  /** The lot's prior the calibration started from, if any. */
  readonly lot: LotPrior | null;
  /** A finer model's first-order word on small changes of the bar now (nextCutSolid sets it; predictShape adds it). */
  readonly solidSlope?: SolidSlope;
}

/**
 * What the solid model's thickness sensitivities add to the line model's on the bar now: per
 * tuned partial and profile station x_j (m) of the bar now (thickness t_j, m), the solid's
 * d(cents)/dt_j minus the line model's, cents per metre. A shape then predicts
 * Σ_j slope_n,j·(t(x_j) − t_j) cents more than the line model: the solid model's change to first
 * order, for the small steps of closing in.
 */
export interface SolidSlope {
  readonly positions: Float64Array;
  readonly thicknesses: Float64Array;
  readonly centsPerMetre: readonly Float64Array[];
}

/** Options of calibrateSession. */
export interface CalibrateOptions {
  readonly priors?: CalibrationPriors;
  /** What finished bars of the same lot taught: the prior for E/ρ, G/ρ, the corrections and the temperature coefficient. */
  readonly lot?: LotPrior | null;
  /**
   * The per-partial correction's prior from a finer model (the solid model's gap to the line model
   * on the shape about to be cut, per unit arch depth): replaces the default and the lot's.
   */
  readonly correctionPrior?: readonly { readonly mean: number; readonly sigma: number }[];
}

/** One-sigma precision of a caliper reading, m: a dial caliper reads to 0.02 mm and the bar sits a little off square (common practice). */
export const caliperSigma = 3e-5;
/**
 * How far a real cut departs from its plan scaled in depth, as a share of the cut's depth at the
 * reading (barwright's own allowance: a cut placed a few mm aside or smeared by sanding is not a
 * scaled copy of the plan, so the readings pin the cut's depth without being fitted exactly).
 */
export const cutFormShare = 0.1;

/**
 * One-sigma allowance for a reading taken while the bar is still warm from a cut, cents (barwright's
 * own: a warm bar reads flat by a few cents for several minutes, common practice). Such a reading
 * counts about a tenth as much as a cool one.
 */
export const warmReadingSigmaCents = 5;

const warmBarMinutesText = String(warmBarMinutes);

/** Most partials a calibration uses (higher ones are seldom read reliably and never tuned). */
const maxPartials = 6;
const ratioRange: readonly [number, number] = [Math.log(1.2), Math.log(100)];
const centsPerDepth = 1200 / Math.LN2;
/** Below this 1 − leverage a measurement is its own explanation and the leave-one-out check says nothing. */
const minimumComplement = 0.02;

function outOfOrderFlags(log: SessionLog): MeasurementFlag[] {
  const flags: MeasurementFlag[] = [];
  log.steps.forEach((step, k) => {
    for (let n = 1; n < step.measured_hz.length; n++) {
      if (step.measured_hz[n]! > step.measured_hz[n - 1]!) continue;
      for (const partial of [n, n + 1])
        if (!flags.some((f) => f.step === k + 1 && f.partial === partial))
          flags.push({ step: k + 1, partial, hz: step.measured_hz[partial - 1]!, residual_cents: null, reason: `partials ${n} and ${n + 1} of step ${k + 1} are out of order (${step.measured_hz[n - 1]} Hz, then ${step.measured_hz[n]} Hz): swapped or misread` });
    }
  });
  return flags;
}

/**
 * Calibrates the model of a session's bar to every measurement so far: E and G plus a
 * per-partial correction c_n that scales with arch depth (what the 1D model misses), by
 * Gauss–Newton least squares with Gaussian priors around the maker's guess (defaultCalibrationPriors),
 * or around what finished bars of the same lot taught (`lot`, see lotPrior). The model of the bar
 * is evaluatePartials (partialModel.ts), the one function a finer model would replace.
 * Every reading is first projected to the playing temperature (sessionTemperature: the material's
 * coefficient, or the bar's own once two readings of an unchanged shape at different temperatures
 * decide it); the coefficient's remaining error is one more fitted parameter (prior its sigma),
 * moving each step by −δk·(T_playing − T_reading). A reading taken within 10 minutes of a cut
 * (warmReadings) is weighted down (±5 cents), or set aside when a later cool reading of the same
 * shape exists: that one governs.
 * Each measurement is weighed with the measurement uncertainty, the 1D model's allowance on a
 * uniform bar, and allowances for what the correction cannot capture: growing with the shape's
 * depth, and with depth × its distance in depth from the current one (the chord error of a linear
 * correction). Each cut
 * recorded as planned gets a fitted depth scale (prior ±10 %), so the session learns a cut not
 * made quite as planned (see sessionShapes). A measurement that no plausible model
 * explains — leave-one-out residual beyond 4 sigma (allowing ±15 % of the change to the nearer
 * neighbouring step for the model's form, so a misreading is told from model error only when it is
 * larger than that share of the change) and 10 cents, or a list out of order — is
 * flagged and set aside, never absorbed (a misread partial, a crack, a cut not made as planned).
 */
export function calibrateSession(log: SessionLog, options: CalibrateOptions = {}): SessionCalibration {
  if (log.steps.length === 0) throw new InputError('session', 'steps', 'needs at least one measured step');
  const priors = options.priors ?? defaultCalibrationPriors;
  const lot = options.lot ?? null;
  const sigmaMeasure = log.measurement_uncertainty_cents ?? defaultMeasurementUncertaintyCents;
  const shapes = sessionShapes(log);
  const models = shapes.map((shape) => shape.model);
  const depthOf = (model: BarModel): number => (model.section.shape === 'rect' ? Math.max(0, 1 - Math.min(...model.profile.thicknesses) / model.section.thickness) : 0);
  const depthNow = depthOf(models[models.length - 1]!);
  const modes = Math.min(maxPartials, Math.max(log.target.ratios.length, ...log.steps.map((s) => s.measured_hz.length)));
  const corrections = modes;
  const flags = outOfOrderFlags(log);
  const warm = warmReadings(log);
  const temperature = sessionTemperature(log, lot?.pitch ?? materialPitchPrior(log), warm);
  // Every reading projected to the playing temperature before it is fitted.
  const measured = log.steps.map((step, k) => Array.from(hzToAbsoluteCents(step.measured_hz.slice(0, modes)), (c) => c + temperature.shiftCents[k]!));
  const warmAt = (k: number): WarmReading | undefined => warm.find((w) => w.step === k + 1);
  const sigmas = log.steps.map((_, k) =>
    measured[k]!.map(() => {
      const depth = depthOf(models[k]!);
      // The correction is exact (zero) on the uncut blank and fitted at the current depth; between
      // them its linear form errs most, like the error of a chord: ∝ depth·(distance to now).
      const form = priors.correctionFormSigma * centsPerDepth * depth * Math.abs(depthNow - depth);
      const remainder = priors.modelFormSigma * centsPerDepth * depth;
      const heat = warmAt(k) ? warmReadingSigmaCents : 0;
      return Math.sqrt(sigmaMeasure ** 2 + uniformModelAllowanceCents ** 2 + form ** 2 + remainder ** 2 + heat ** 2);
    }),
  );
  // One depth scale per cut recorded as planned (shared by every later step that inherits it).
  const cutIndex = new Map<number, number>();
  for (const shape of shapes) for (const removal of shape.removals) if (!cutIndex.has(removal.cut)) cutIndex.set(removal.cut, 2 + corrections + cutIndex.size);
  // The coefficient's own error, δk (cents per °C), moves every projected reading by −δk·(T_playing − T_reading): one parameter.
  const away = temperature.readingC.map((t) => (t === null ? 0 : temperature.playingC - t));
  const temperatureIndex = away.some((d) => d !== 0) ? 2 + corrections + cutIndex.size : null;
  const size = 2 + corrections + cutIndex.size + (temperatureIndex === null ? 0 : 1);
  const guess = models[0]!.material;
  const unit = (i: number): number[] => Array.from({ length: size }, (_, j) => (j === i ? 1 : 0));
  const youngPrior = lot ? { mean: lot.lnSpecificYoung.mean + Math.log(guess.density), sigma: lot.lnSpecificYoung.sigma } : { mean: Math.log(guess.youngModulus), sigma: priors.lnYoungSigma };
  const shearPrior = lot ? { mean: lot.lnSpecificShear.mean + Math.log(guess.density), sigma: lot.lnSpecificShear.sigma } : { mean: Math.log(guess.shearModulus), sigma: priors.lnShearSigma };
  const correctionPrior = (n: number): { mean: number; sigma: number } => options.correctionPrior?.[n] ?? lot?.corrections[n] ?? { mean: 0, sigma: priors.correctionSigma };
  const linearPriors: LinearPrior[] = [
    { coefficients: unit(0), ...youngPrior },
    { coefficients: unit(1), ...shearPrior },
    ...Array.from({ length: corrections }, (_, n) => ({ coefficients: unit(2 + n), ...correctionPrior(n) })),
    ...[...cutIndex.values()].map((index) => ({ coefficients: unit(index), mean: 0, sigma: priors.plannedCutSigma })),
    ...(temperatureIndex === null ? [] : [{ coefficients: unit(temperatureIndex), mean: 0, sigma: temperature.sigma }]),
  ];
  // Caliper readings weigh the caliper's precision and how far a real cut departs from a scaled copy of its plan.
  const readingsOf = (shape: (typeof shapes)[number]): { x: number; thickness: number; sigma: number }[] => {
    const last = shape.removals[shape.removals.length - 1];
    return shape.readings!.map((reading) => {
      const depth = last ? thicknessAt({ positions: shape.model.profile.positions, thicknesses: last.values }, reading.x) : 0;
      return { ...reading, sigma: Math.hypot(caliperSigma, cutFormShare * depth) };
    });
  };
  // A warm reading that a later, cool reading of the same shape supersedes is set aside: the later one governs.
  const excluded = (k: number, n: number): boolean => flags.some((f) => f.step === k + 1 && f.partial === n + 1) || (warmAt(k)?.superseded_by ?? null) !== null;
  const shapesFor = (): FitShape[] =>
    shapes.map((shape, k) => ({
      model: shape.model,
      measuredCents: measured[k]!.map((c, n) => (excluded(k, n) ? null : c)),
      sigmaCents: sigmas[k]!,
      removals: shape.removals.map((removal) => ({ parameter: defined(cutIndex.get(removal.cut), 'the cut a removal belongs to'), values: removal.values })),
      ...(temperatureIndex === null || away[k] === 0 ? {} : { offsets: [{ parameter: temperatureIndex, cents: -away[k]! }] }),
      ...(shape.readings ? { thicknessReadings: readingsOf(shape) } : {}),
    }));
  /** The nearest reading of partial n before (direction −1) or after (+1) step k that is not set aside. */
  const nearestKept = (k: number, n: number, direction: -1 | 1): number | undefined => {
    for (let j = k + direction; j >= 0 && j < measured.length; j += direction) if (measured[j]![n] !== undefined && !excluded(j, n)) return measured[j]![n];
    return undefined;
  };
  let start = [youngPrior.mean, shearPrior.mean, ...Array.from({ length: corrections }, (_, n) => correctionPrior(n).mean), ...new Array<number>(size - 2 - corrections).fill(0)];
  let fit: FitResult = fitModuli({ shapes: shapesFor(), corrections, priors: linearPriors, start, lnRatioRange: ratioRange });
  for (let round = 0; round < maxFlagged; round++) {
    let worst: { k: number; n: number; z: number; predictive: number } | null = null;
    fit.residualCents.forEach((row, k) =>
      row.forEach((residual, n) => {
        if (residual === null) return;
        const complement = 1 - fit.leverage[k]![n]!;
        // A measurement that alone determines a parameter cannot be checked against the others.
        if (complement < minimumComplement) return;
        const predictive = residual / complement;
        // The rest of the session predicts this reading from its neighbours through the model:
        // allow the model's form error over the smaller change to a neighbouring step (the nearest
        // reading of the same partial not set aside, on either side).
        const neighbours = [nearestKept(k, n, -1), nearestKept(k, n, 1)].filter((c): c is number => c !== undefined);
        const nearest = neighbours.length ? Math.min(...neighbours.map((c) => Math.abs(measured[k]![n]! - c))) : 0;
        const change = priors.changeFormSigma * nearest;
        const z = predictive / Math.sqrt(sigmas[k]![n]! ** 2 / complement + change ** 2);
        if (Math.abs(z) > flagSigmas && Math.abs(predictive) > flagFloorCents && (worst === null || Math.abs(z) > Math.abs(worst.z))) worst = { k, n, z, predictive };
      }),
    );
    if (worst === null) break;
    const { k, n, predictive } = worst as { k: number; n: number; z: number; predictive: number };
    flags.push({
      step: k + 1,
      partial: n + 1,
      hz: log.steps[k]!.measured_hz[n]!,
      residual_cents: predictive,
      reason: `partial ${n + 1} of step ${k + 1} (${log.steps[k]!.measured_hz[n]!.toFixed(2)} Hz) is ${predictive >= 0 ? '+' : ''}${predictive.toFixed(1)} cents from what the rest of the session explains: a misread partial, a crack, or a cut not made as recorded?`,
    });
    start = fit.parameters;
    fit = fitModuli({ shapes: shapesFor(), corrections, priors: linearPriors, start, lnRatioRange: ratioRange });
  }
  const p = fit.parameters;
  const youngModulus = Math.exp(p[0]!);
  const shearModulus = Math.exp(p[1]!);
  const steps: CalibratedStep[] = fit.models.map((model, k) => ({
    model: { ...model, material: { ...model.material, youngModulus, shearModulus } },
    depth: fit.depths[k]!,
    measuredHz: log.steps[k]!.measured_hz.map((hz) => hz * 2 ** (temperature.shiftCents[k]! / 1200)),
    readHz: log.steps[k]!.measured_hz,
    fittedHz: Array.from(fit.fittedCents[k]!.subarray(0, log.steps[k]!.measured_hz.length), (c) => 2 ** ((c + (temperatureIndex === null ? 0 : p[temperatureIndex]! * away[k]!)) / 1200)),
    residualCents: fit.residualCents[k]!,
    sigmaCents: sigmas[k]!,
  }));
  const cutDepths: CutDepthEstimate[] = [...cutIndex.entries()].map(([step, index]) => ({ step, scale: p[index]!, sigma: Math.sqrt(fit.covariance[index]![index]!) }));
  const warnings = [...sessionLogWarnings(log)];
  if (Math.abs(p[0]! - youngPrior.mean) > 3 * youngPrior.sigma)
    warnings.push(
      lot
        ? `the calibrated E (${(youngModulus / 1e9).toFixed(2)} GPa) is far from what lot ${lot.lot} taught (${(Math.exp(youngPrior.mean) / 1e9).toFixed(2)} GPa at this density): is this bar really from that lot?`
        : `the calibrated E (${(youngModulus / 1e9).toFixed(2)} GPa) is far from the starting guess (${(guess.youngModulus / 1e9).toFixed(2)} GPa): check the bar file's dimensions, density and material`,
    );
  for (const w of warm)
    warnings.push(
      w.superseded_by !== null
        ? `step ${w.step} was read ${w.minutes_after_cut.toFixed(0)} minutes after the cut (a warm bar reads flat): step ${w.superseded_by}'s later reading of the same shape governs`
        : `step ${w.step} was read ${w.minutes_after_cut.toFixed(0)} minutes after the cut: a warm bar reads flat, so it counts little; strike it again when it has rested ${warmBarMinutesText} minutes`,
    );
  p.slice(2, 2 + corrections).forEach((c, n) => {
    if (Math.abs(c) > 3 * priors.correctionSigma && depthNow > 0)
      warnings.push(`partial ${n + 1} needs a ${(100 * c * depthNow).toFixed(1)} % correction at this depth, beyond the 2–3 % the 1D model usually misses: a crack, or cuts not as recorded?`);
  });
  for (const estimate of cutDepths)
    if (Math.abs(estimate.scale) > 2 * priors.plannedCutSigma && !log.steps[estimate.step - 1]?.measured_thickness_mm?.length)
      warnings.push(`the cut before step ${estimate.step} reads as about ${(100 * Math.abs(estimate.scale)).toFixed(0)} % ${estimate.scale > 0 ? 'deeper' : 'shallower'} than recorded: measure the thicknesses at a few stations and record them with the step`);
  return {
    youngModulus,
    shearModulus,
    density: guess.density,
    lnYoungSigma: Math.sqrt(fit.covariance[0]![0]!),
    lnShearSigma: Math.sqrt(fit.covariance[1]![1]!),
    corrections: p.slice(2, 2 + corrections),
    cutDepths,
    parameters: p,
    covariance: fit.covariance,
    steps,
    flags,
    warnings,
    current: fit.evaluations[fit.evaluations.length - 1]!,
    modes,
    priors,
    measurementSigmaCents: sigmaMeasure,
    temperature,
    warm,
    lot,
  };
}
