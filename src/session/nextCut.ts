import { cutLimitsToInput, resolveCutLimits, type CutLimits, type CutLimitsInput } from '../design/cutLimits.ts';
import { InputError, isInputError } from '../fileFormats/InputError.ts';
import type { BarFile } from '../fileFormats/barFile.ts';
import { parseSessionFile, sessionTargetHz, type SessionLog } from '../fileFormats/sessionFile.ts';
import { cents } from '../pitch/cents.ts';
import { barFileFromModel, shapeAfterFile } from './barFileFromModel.ts';
import { predictShape } from './predictShape.ts';
import { calibrateSession, type MeasurementFlag, type SessionCalibration, type SolidSlope } from './calibrateSession.ts';
import type { CalibrationPriors } from './calibrationPriors.ts';
import { cutCautions } from './cutCautions.ts';
import { cutInstructions, type CutInstructions } from './cutInstructions.ts';
import { cuttingGrid } from './cuttingGrid.ts';
import { planCut, type PlannedCut } from './planCut.ts';
import { centsPerNeper } from './partialModel.ts';
import { stuckReason } from './stuckReason.ts';
import { defaultStepPolicy, type StepPolicy } from './stepPolicy.ts';
import { millimetre as mm } from '../units/units.ts';
import type { BarModel } from '../modes/BarModel.ts';
import { sectionDepth } from '../section/Section.ts';
import { sectionFromFile } from '../modes/BarModel.ts';
import { roundDecimals as round } from '../fileFormats/roundDecimals.ts';
import { cutCheckpoints, cutsAgainstPlan, type Checkpoint, type CutAgainstPlan } from './cutCheckpoints.ts';
import type { LotPrior } from './lotPrior.ts';
import { warmBarMinutes, type WarmReading } from './warmReadings.ts';
import { handBias, handCutScatter } from './handBias.ts';

/** Options of nextCut. */
export interface NextCutOptions {
  readonly policy?: StepPolicy;
  readonly priors?: CalibrationPriors;
  /** What finished bars of the same lot taught (lotPrior): the calibration starts from it. */
  readonly lot?: LotPrior | null;
  /** The correction's prior from a finer model (see CalibrateOptions; nextCutSolid sets it). */
  readonly correctionPrior?: readonly { readonly mean: number; readonly sigma: number }[];
  /** The solid model's first-order difference on the bar now (nextCutSolid sets it; see SolidSlope). */
  readonly solidSlope?: SolidSlope;
  /** Name used in error messages (a file name). */
  readonly source?: string;
  /** Called as the work advances (stage name, fraction 0…1): calibration, then planning. */
  readonly onProgress?: (stage: 'calibrating' | 'planning' | 'done', fraction: number) => void;
}

/** The calibrated model in contract units. */
export interface CalibrationReport {
  E_GPa: number;
  G_GPa: number;
  /** One-sigma relative uncertainties of E and G, percent. */
  E_uncertainty_percent: number;
  G_uncertainty_percent: number;
  /** Per partial: the correction the 1D model needs at the current arch depth, percent of frequency. */
  correction_percent: number[];
  arch_depth: number;
  /** Per step: measured − calibrated model, cents (null where a measurement was set aside). */
  residual_cents: (number | null)[][];
  /** Measurements no plausible model explains: set aside, never absorbed. */
  flags: MeasurementFlag[];
  /** How deep each cut recorded as planned really went, percent of the plan (100 = as planned), with one sigma. */
  cut_depth_percent: { step: number; percent: number; uncertainty_percent: number }[];
  /** Cuts checked with the caliper (measured_thickness_mm): how far each went from its plan. */
  cut_from_plan: CutAgainstPlan[];
  /** Readings taken within 10 minutes of a cut (a warm bar reads flat). */
  warm_readings: WarmReading[];
  /** The lot the calibration started from, and the bars it learnt from; null without one. */
  lot: { name: string; bars: string[] } | null;
  /** How deep the maker's caliper-checked cuts run against their plans (percent, one sigma, the steps); the next cut's depths are asked in proportion. Null without a checked cut. */
  hand: { depth_percent: number; uncertainty_percent: number; steps: number[] } | null;
}

/** How the readings were moved to the playing temperature. */
export interface TemperatureReport {
  playing_temperature_c: number;
  /** The last step's air temperature (null: not recorded, taken as the playing temperature). */
  reading_temperature_c: number | null;
  /** The coefficient used, cents per °C, its one-sigma, and where it comes from. */
  pitch_cents_per_c: number;
  pitch_sigma_cents_per_c: number;
  pitch_from: 'bar file' | 'preset' | 'default' | 'lot' | 'learnt';
  pitch_source: string;
  /** What this session's own re-strikes at different temperatures showed, if any did. */
  learnt: { pitch_cents_per_c: number; sigma: number; steps: [number, number][] } | null;
  /** Cents added to the last readings to project them, and the one-sigma of that projection. */
  shift_cents: number;
  shift_sigma_cents: number;
}

/** nextCut's result: the contract's fields first, then barwright's additions. JSON-serialisable. */
export interface NextCutResult {
  status: 'cut' | 'done' | 'stuck';
  reason?: string;
  bar_after: BarFile;
  predicted_hz: number[];
  calibrated_material: { E_GPa: number; G_GPa: number; density_kg_m3: number };
  target_hz: number[];
  tolerance_cents: number[];
  /** The last step's readings projected to the playing temperature (contract, turn 2). */
  readings_at_playing_temperature_hz: number[];
  /** The last step's readings as taken, at its air temperature. */
  readings_as_taken_hz: number[];
  /** The partials now at the playing temperature (the last step's readings projected; the model's where a partial was not measured). */
  now_hz: number[];
  now_cents: number[];
  predicted_cents: number[];
  /** Each predicted partial's range at the policy's confidence (± confidence · sigma), cents. */
  predicted_range_cents: [number, number][];
  /** `hold`: fundamental kept a few cents sharp while the overtones are placed; `close-in`. */
  phase: 'hold' | 'close-in';
  cut: CutInstructions | null;
  /** Where to check the cut with a caliper and the thickness to expect (contract, turn 2); empty without an undercut. */
  checkpoints: Checkpoint[];
  temperature: TemperatureReport;
  /** Minutes still to wait before the last reading counts (it was taken on a bar warm from the cut); 0 when it is cool. */
  wait_minutes: number;
  binding: string[];
  calibration: CalibrationReport;
  limits: ReturnType<typeof cutLimitsToInput>;
  warnings: string[];
  cautions: string[];
}

/**
 * The step policy once the maker's habit is known from caliper-checked cuts: the execution share of
 * the change's uncertainty falls from a careful maker's 10 % (defaultStepPolicy) to the habit's own
 * uncertainty with a 5 % cut-to-cut scatter (handBias); the model's share stays. Never bolder than
 * the policy given when no cut was checked.
 */
function policyForHand(policy: StepPolicy, hand: CalibrationReport['hand']): StepPolicy {
  if (!hand) return policy;
  const execution = Math.hypot(hand.uncertainty_percent / 100, handCutScatter);
  const model = Math.sqrt(Math.max(0, policy.changeSigma ** 2 - carefulExecution ** 2));
  return { ...policy, changeSigma: Math.min(policy.changeSigma, Math.hypot(model, execution)) };
}
/** A careful maker's cut matches its plan to about 10 % (common practice; the execution share of defaultStepPolicy.changeSigma). */
const carefulExecution = 0.1;

/**
 * A cut must bring some partial that is out of tolerance into it, or closer to its target by at
 * least this share of its tolerance… (a smaller effect is no progress: status `stuck`)
 */
const minimumProgress = 0.2;
/** …and by at least this share of how far it is off (a far-off bar needs a real step). */
const minimumShareOfError = 0.02;

/** The blank's depth (m) the limits compare with: sectionDepth of the bar's section (tubes: outer diameter). */
function blankThickness(bar: BarFile): number {
  return sectionDepth(sectionFromFile(bar.section));
}

function sessionLimits(log: SessionLog, source: string): CutLimits {
  const first = log.steps[0]!.bar;
  try {
    return resolveCutLimits(log.limits as CutLimitsInput, { length: first.length_mm * mm, thickness: blankThickness(first) }, source);
  } catch (error) {
    if (isInputError(error)) throw new InputError(source, error.field === 'limits' ? 'limits' : `limits.${error.field}`, error.rule);
    throw error;
  }
}

function report(log: SessionLog, calibration: SessionCalibration): CalibrationReport {
  const depth = calibration.steps[calibration.steps.length - 1]!.depth;
  const hand = handBias(log, calibration);
  return {
    E_GPa: calibration.youngModulus / 1e9,
    G_GPa: calibration.shearModulus / 1e9,
    E_uncertainty_percent: 100 * calibration.lnYoungSigma,
    G_uncertainty_percent: 100 * calibration.lnShearSigma,
    correction_percent: calibration.corrections.map((c) => 100 * (Math.exp(c * depth) - 1)),
    arch_depth: depth,
    residual_cents: calibration.steps.map((step) => step.residualCents),
    flags: calibration.flags,
    cut_depth_percent: calibration.cutDepths.map((d) => ({ step: d.step, percent: 100 * (1 + d.scale), uncertainty_percent: 100 * d.sigma })),
    cut_from_plan: cutsAgainstPlan(log, calibration),
    warm_readings: calibration.warm,
    lot: calibration.lot ? { name: calibration.lot.lot, bars: [...calibration.lot.bars] } : null,
    hand: hand ? { depth_percent: round(100 * hand.scale, 1), uncertainty_percent: round(100 * hand.sigma, 1), steps: hand.steps } : null,
  };
}

function temperatureReport(calibration: SessionCalibration): TemperatureReport {
  const t = calibration.temperature;
  const last = t.readingC.length - 1;
  return {
    playing_temperature_c: t.playingC,
    reading_temperature_c: t.readingC[last] ?? null,
    pitch_cents_per_c: round(t.centsPerC, 3),
    pitch_sigma_cents_per_c: round(t.sigma, 3),
    pitch_from: t.from,
    pitch_source: t.source,
    learnt: t.learnt ? { pitch_cents_per_c: round(t.learnt.centsPerC, 3), sigma: round(t.learnt.sigma, 3), steps: t.learnt.steps } : null,
    shift_cents: t.shiftCents[last]!,
    shift_sigma_cents: t.shiftSigmaCents[last]!,
  };
}

/** Warnings about the temperatures of the readings: the projection, and when it is too uncertain to trust a verdict. */
function temperatureWarnings(calibration: SessionCalibration, tolerance: readonly number[]): string[] {
  const t = calibration.temperature;
  const last = t.readingC.length - 1;
  const reading = t.readingC[last];
  const warnings: string[] = [];
  if (t.from === 'default') warnings.push(`temperature: ${t.source}`);
  if (reading !== null && reading !== undefined && t.shiftSigmaCents[last]! > 0.5 * tolerance[0]!)
    warnings.push(
      `the last reading was taken at ${reading} °C and projected to ${t.playingC} °C with ${t.centsPerC.toFixed(2)} ± ${t.sigma.toFixed(2)} cents per °C (±${t.shiftSigmaCents[last]!.toFixed(1)} cents): check it near ${t.playingC} °C before delivery, or strike the bar unchanged at another temperature so barwright learns its own coefficient`,
    );
  return warnings;
}

/** The advice, and when it is a cut, the calibrated bar now and as the cut should leave it (SI models, the calibrated moduli). */
export interface PlannedNextCut {
  readonly result: NextCutResult;
  readonly shapes: { readonly now: BarModel; readonly after: BarModel } | null;
}

/**
 * The next cut of a tune-and-trim session, with the shapes it was planned on. Validates the session
 * (a session file value, parsed or raw), calibrates the model to every measurement projected to the
 * playing temperature (calibrateSession; from a lot's prior when `lot` is given), and from the bar
 * now — its last step, as the caliper measured it if it did — plans the smallest removal toward the
 * target (planCut) within the workshop limits and the step policy. Status `done` when every tuned
 * partial, at the playing temperature, is within tolerance; `stuck` with a reason when no removal
 * helps (or when the last measurement contradicts the session: re-measure first); otherwise `cut`,
 * with the bar after the cut (never adding wood), the predicted partials, the cut written out for
 * the workshop and 3–5 caliper checkpoints. A last reading taken on a bar still warm from its cut
 * gives `wait_minutes` and a warning. Pure and synchronous (calibration ≈ 10 solves per step,
 * planning ≈ 30 solves).
 */
export function planNextCut(session: unknown, options: NextCutOptions = {}): PlannedNextCut {
  const source = options.source ?? 'session';
  const log = parseSessionFile(session, source);
  if (log.steps.length === 0) throw new InputError(source, 'steps', 'needs at least one measured step (the bar as it is now, with its partials)');
  const policy = options.policy ?? defaultStepPolicy;
  const limits = sessionLimits(log, source);
  const targetHz = sessionTargetHz(log.target);
  const tolerance = log.target.tolerance_cents;
  const tuned = targetHz.length;
  options.onProgress?.('calibrating', 0);
  const fitted = calibrateSession(log, { ...(options.priors ? { priors: options.priors } : {}), lot: options.lot ?? null, ...(options.correctionPrior ? { correctionPrior: options.correctionPrior } : {}) });
  const calibration = options.solidSlope ? { ...fitted, solidSlope: options.solidSlope } : fitted;
  options.onProgress?.('planning', 0.5);
  const lastIndex = log.steps.length - 1;
  const last = log.steps[lastIndex]!;
  const lastCalibrated = calibration.steps[lastIndex]!;
  const warnings = [...calibration.warnings, ...temperatureWarnings(calibration, tolerance), ...calibration.flags.filter((f) => f.step <= lastIndex).map((f) => `${f.reason} — set aside`)];
  const fittedNow = Array.from(calibration.current.cents.subarray(0, tuned), (c, n) => c + centsPerNeper * (calibration.corrections[n] ?? 0) * lastCalibrated.depth);
  const flaggedNow = calibration.flags.filter((f) => f.step === lastIndex + 1 && f.partial <= tuned);
  // The last readings at the playing temperature: what the verdict and every display go by.
  const projected = lastCalibrated.measuredHz;
  const nowHz = targetHz.map((_, n) => (n < projected.length && !flaggedNow.some((f) => f.partial === n + 1) ? projected[n]! : 2 ** (fittedNow[n]! / 1200)));
  const nowCents = nowHz.map((hz, n) => cents(hz, targetHz[n]!));
  const warmNow = calibration.warm.find((w) => w.step === lastIndex + 1);
  const waitMinutes = warmNow ? Math.max(0, Math.ceil(warmBarMinutes - warmNow.minutes_after_cut)) : 0;
  const base = {
    calibrated_material: { E_GPa: calibration.youngModulus / 1e9, G_GPa: calibration.shearModulus / 1e9, density_kg_m3: calibration.density },
    target_hz: targetHz,
    tolerance_cents: [...tolerance],
    readings_at_playing_temperature_hz: [...projected],
    readings_as_taken_hz: [...last.measured_hz],
    now_hz: nowHz,
    now_cents: nowCents,
    temperature: temperatureReport(calibration),
    wait_minutes: waitMinutes,
    calibration: report(log, calibration),
    limits: cutLimitsToInput(limits),
    cautions: [...cutCautions],
  };
  const unchanged = (status: 'done' | 'stuck', reason: string | undefined, phase: 'hold' | 'close-in', binding: string[] = []): NextCutResult => {
    options.onProgress?.('done', 1);
    const result: NextCutResult = {
      status,
      bar_after: structuredClone(last.bar),
      predicted_hz: [...nowHz],
      ...base,
      predicted_cents: [...nowCents],
      predicted_range_cents: nowCents.map((c) => [c - policy.confidence * calibration.measurementSigmaCents, c + policy.confidence * calibration.measurementSigmaCents]),
      phase,
      cut: null,
      checkpoints: [],
      binding,
      warnings,
    };
    if (reason !== undefined) result.reason = reason;
    return result;
  };
  if (flaggedNow.length > 0)
    return { result: unchanged('stuck', `re-measure before cutting: ${flaggedNow.map((f) => f.reason).join('; ')}. No cut is planned from a measurement the session cannot explain.`, 'hold'), shapes: null };
  const checked = base.calibration.cut_from_plan.find((entry) => entry.step === lastIndex + 1);
  if (checked && checked.percent !== null && Math.abs(checked.percent - 100) > 10)
    warnings.push(`the caliper says the last cut went ${checked.percent.toFixed(0)} % as deep as planned (${checked.percent > 100 ? 'deeper' : 'shallower'}): the session uses the bar as measured`);
  if (warmNow) warnings.push(`the last reading was taken ${warmNow.minutes_after_cut.toFixed(0)} minutes after the cut: a warm bar reads flat; strike it again in ${waitMinutes} minutes before trusting this advice`);
  const inTolerance = nowCents.every((c, n) => Math.abs(c) <= tolerance[n]!);
  if (inTolerance) {
    const unmeasured = targetHz.map((_, n) => n).filter((n) => n >= last.measured_hz.length);
    if (unmeasured.length > 0) warnings.push(`partial${unmeasured.length > 1 ? 's' : ''} ${unmeasured.map((n) => n + 1).join(', ')} not measured: the model puts ${unmeasured.length > 1 ? 'them' : 'it'} in tolerance; strike the bar and check`);
    return { result: unchanged('done', undefined, 'close-in'), shapes: null };
  }
  const trimmedSoFar = Math.max(0, log.steps[0]!.bar.length_mm - last.bar.length_mm) * mm;
  const stepLimits: CutLimits = { ...limits, maxShortening: limits.allowShortening ? Math.max(0, limits.maxShortening - trimmedSoFar) : 0 };
  const model = cuttingGrid(lastCalibrated.model, stepLimits.uncutLeft, lastCalibrated.model.length - stepLimits.uncutRight);
  const plan: PlannedCut = planCut({ calibration, model, errorCents: nowCents, toleranceCents: tolerance, limits: stepLimits, policy: policyForHand(policy, base.calibration.hand) });
  // A maker whose checked cuts run deep (or shallow) is asked for proportionally less (or more), so the cut lands as planned.
  const handScale = base.calibration.hand ? base.calibration.hand.depth_percent / 100 : 1;
  if (base.calibration.hand && Math.abs(handScale - 1) > 0.03)
    warnings.push(`your caliper-checked cuts have run ${base.calibration.hand.depth_percent.toFixed(0)} % as deep as planned: the depths below are asked ${handScale > 1 ? 'shallower' : 'deeper'} in proportion, so the cut lands where the model needs it`);
  const barAfter = barFileFromModel(last.bar, model, plan.model, 1 / handScale);
  const instructions = cutInstructions(last.bar, barAfter);
  // Predictions for the bar file as written (thicknesses rounded up to 0.01 mm), from the bar now.
  const now = predictShape(calibration, model, false);
  const expectedAfter = shapeAfterFile(last.bar, model, barAfter, handScale);
  const after = predictShape(calibration, expectedAfter, false);
  const predictedCents = nowCents.map((c, n) => c + after.cents[n]! - now.cents[n]!);
  const progress = predictedCents.some((c, n) => {
    const allowed = tolerance[n]!;
    const before = nowCents[n]!;
    if (Math.abs(before) <= allowed) return false;
    return Math.abs(c) <= allowed || Math.abs(before) - Math.abs(c) >= Math.max(minimumProgress * allowed, minimumShareOfError * Math.abs(before));
  });
  if (!progress) return { result: unchanged('stuck', stuckReason({ calibration, model, errorCents: nowCents, toleranceCents: tolerance, limits: stepLimits, plan }), plan.aims.phase, plan.binding), shapes: null };
  options.onProgress?.('done', 1);
  const result: NextCutResult = {
    status: 'cut',
    bar_after: barAfter,
    predicted_hz: predictedCents.map((c, n) => targetHz[n]! * 2 ** (c / 1200)),
    ...base,
    predicted_cents: predictedCents,
    predicted_range_cents: predictedCents.map((c, n) => [c - policy.confidence * plan.uncertaintyCents[n]!, c + policy.confidence * plan.uncertaintyCents[n]!]),
    phase: plan.aims.phase,
    cut: instructions,
    checkpoints: cutCheckpoints(last.bar, barAfter, expectedAfter),
    binding: plan.binding,
    warnings,
  };
  return { result, shapes: { now: model, after: expectedAfter } };
}

/**
 * The next cut of a tune-and-trim session (contract: `barwright next-cut`): planNextCut's advice.
 */
export function nextCut(session: unknown, options: NextCutOptions = {}): NextCutResult {
  return planNextCut(session, options).result;
}
