import { cutLimitsToInput, resolveCutLimits, type CutLimits, type CutLimitsInput } from '../design/cutLimits.ts';
import { InputError, isInputError } from '../fileFormats/InputError.ts';
import type { BarFile } from '../fileFormats/barFile.ts';
import { parseSessionFile, sessionTargetHz, type SessionLog } from '../fileFormats/sessionFile.ts';
import { cents } from '../pitch/cents.ts';
import { barFileFromModel, shapeAfterFile } from './barFileFromModel.ts';
import { predictShape } from './predictShape.ts';
import { calibrateSession, type MeasurementFlag, type SessionCalibration } from './calibrateSession.ts';
import type { CalibrationPriors } from './calibrationPriors.ts';
import { cutCautions } from './cutCautions.ts';
import { cutInstructions, type CutInstructions } from './cutInstructions.ts';
import { cuttingGrid } from './cuttingGrid.ts';
import { planCut, type PlannedCut } from './planCut.ts';
import { centsPerNeper } from './partialModel.ts';
import { stuckReason } from './stuckReason.ts';
import { defaultStepPolicy, type StepPolicy } from './stepPolicy.ts';
import { millimetre as mm } from '../units/units.ts';
import { sectionDepth } from '../section/Section.ts';
import { sectionFromFile } from '../modes/BarModel.ts';

/** Options of nextCut. */
export interface NextCutOptions {
  readonly policy?: StepPolicy;
  readonly priors?: CalibrationPriors;
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
  /** The partials now (the last step's measurements; the model's where a partial was not measured). */
  now_hz: number[];
  now_cents: number[];
  predicted_cents: number[];
  /** Each predicted partial's range at the policy's confidence (± confidence · sigma), cents. */
  predicted_range_cents: [number, number][];
  /** `hold`: fundamental kept a few cents sharp while the overtones are placed; `close-in`. */
  phase: 'hold' | 'close-in';
  cut: CutInstructions | null;
  binding: string[];
  calibration: CalibrationReport;
  limits: ReturnType<typeof cutLimitsToInput>;
  warnings: string[];
  cautions: string[];
}

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

function report(calibration: SessionCalibration): CalibrationReport {
  const depth = calibration.steps[calibration.steps.length - 1]!.depth;
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
  };
}

/**
 * The next cut of a tune-and-trim session (contract: `barwright next-cut`). Validates the session
 * (a session file value, parsed or raw), calibrates the model to every measurement
 * (calibrateSession), and from the bar now — its last step — plans the smallest removal toward the
 * target (planCut) within the workshop limits and the step policy. Status `done` when every tuned
 * partial is within tolerance; `stuck` with a reason when no removal helps (or when the last
 * measurement contradicts the session: re-measure first); otherwise `cut`, with the bar after the
 * cut (never adding wood), the predicted partials and the cut written out for the workshop. Pure
 * and synchronous (calibration ≈ 10 solves per step, planning ≈ 30 solves).
 */
export function nextCut(session: unknown, options: NextCutOptions = {}): NextCutResult {
  const source = options.source ?? 'session';
  const log = parseSessionFile(session, source);
  if (log.steps.length === 0) throw new InputError(source, 'steps', 'needs at least one measured step (the bar as it is now, with its partials)');
  const policy = options.policy ?? defaultStepPolicy;
  const limits = sessionLimits(log, source);
  const targetHz = sessionTargetHz(log.target);
  const tolerance = log.target.tolerance_cents;
  const tuned = targetHz.length;
  options.onProgress?.('calibrating', 0);
  const calibration = calibrateSession(log, options.priors ? { priors: options.priors } : {});
  options.onProgress?.('planning', 0.5);
  const lastIndex = log.steps.length - 1;
  const last = log.steps[lastIndex]!;
  const lastCalibrated = calibration.steps[lastIndex]!;
  const warnings = [...calibration.warnings, ...calibration.flags.filter((f) => f.step <= lastIndex).map((f) => `${f.reason} — set aside`)];
  const fittedNow = Array.from(calibration.current.cents.subarray(0, tuned), (c, n) => c + centsPerNeper * (calibration.corrections[n] ?? 0) * lastCalibrated.depth);
  const flaggedNow = calibration.flags.filter((f) => f.step === lastIndex + 1 && f.partial <= tuned);
  const nowHz = targetHz.map((_, n) => (n < last.measured_hz.length && !flaggedNow.some((f) => f.partial === n + 1) ? last.measured_hz[n]! : 2 ** (fittedNow[n]! / 1200)));
  const nowCents = nowHz.map((hz, n) => cents(hz, targetHz[n]!));
  const base = {
    calibrated_material: { E_GPa: calibration.youngModulus / 1e9, G_GPa: calibration.shearModulus / 1e9, density_kg_m3: calibration.density },
    target_hz: targetHz,
    tolerance_cents: [...tolerance],
    now_hz: nowHz,
    now_cents: nowCents,
    calibration: report(calibration),
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
      binding,
      warnings,
    };
    if (reason !== undefined) result.reason = reason;
    return result;
  };
  if (flaggedNow.length > 0)
    return unchanged('stuck', `re-measure before cutting: ${flaggedNow.map((f) => f.reason).join('; ')}. No cut is planned from a measurement the session cannot explain.`, 'hold');
  const inTolerance = nowCents.every((c, n) => Math.abs(c) <= tolerance[n]!);
  if (inTolerance) {
    const unmeasured = targetHz.map((_, n) => n).filter((n) => n >= last.measured_hz.length);
    if (unmeasured.length > 0) warnings.push(`partial${unmeasured.length > 1 ? 's' : ''} ${unmeasured.map((n) => n + 1).join(', ')} not measured: the model puts ${unmeasured.length > 1 ? 'them' : 'it'} in tolerance; strike the bar and check`);
    return unchanged('done', undefined, 'close-in');
  }
  const trimmedSoFar = Math.max(0, log.steps[0]!.bar.length_mm - last.bar.length_mm) * mm;
  const stepLimits: CutLimits = { ...limits, maxShortening: limits.allowShortening ? Math.max(0, limits.maxShortening - trimmedSoFar) : 0 };
  const model = cuttingGrid(lastCalibrated.model, stepLimits.uncutLeft, lastCalibrated.model.length - stepLimits.uncutRight);
  const plan: PlannedCut = planCut({ calibration, model, errorCents: nowCents, toleranceCents: tolerance, limits: stepLimits, policy });
  const barAfter = barFileFromModel(last.bar, model, plan.model);
  const instructions = cutInstructions(last.bar, barAfter);
  // Predictions for the bar file as written (thicknesses rounded up to 0.01 mm), from the bar now.
  const now = predictShape(calibration, model, false);
  const after = predictShape(calibration, shapeAfterFile(last.bar, model, barAfter), false);
  const predictedCents = nowCents.map((c, n) => c + after.cents[n]! - now.cents[n]!);
  const progress = predictedCents.some((c, n) => {
    const allowed = tolerance[n]!;
    const before = nowCents[n]!;
    if (Math.abs(before) <= allowed) return false;
    return Math.abs(c) <= allowed || Math.abs(before) - Math.abs(c) >= Math.max(minimumProgress * allowed, minimumShareOfError * Math.abs(before));
  });
  if (!progress) return unchanged('stuck', stuckReason({ calibration, model, errorCents: nowCents, toleranceCents: tolerance, limits: stepLimits, plan }), plan.aims.phase, plan.binding);
  options.onProgress?.('done', 1);
  return {
    status: 'cut',
    bar_after: barAfter,
    predicted_hz: predictedCents.map((c, n) => targetHz[n]! * 2 ** (c / 1200)),
    ...base,
    predicted_cents: predictedCents,
    predicted_range_cents: predictedCents.map((c, n) => [c - policy.confidence * plan.uncertaintyCents[n]!, c + policy.confidence * plan.uncertaintyCents[n]!]),
    phase: plan.aims.phase,
    cut: instructions,
    binding: plan.binding,
    warnings,
  };
}
