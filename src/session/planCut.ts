import type { CutLimits } from '../design/cutLimits.ts';
import type { BarModel } from '../modes/BarModel.ts';
import { bendingSensitivities } from '../modes/bendingSensitivities.ts';
import { applyCut, noCut, type CutAmounts } from './applyCut.ts';
import type { SessionCalibration } from './calibrateSession.ts';
import { cutConstraints, type LinearInequality } from './cutConstraints.ts';
import { cutRegions, type CutRegions } from './cutRegions.ts';
import { centsPerNeper } from './partialModel.ts';
import { changeUncertaintyCents, predictShape, type ShapePrediction } from './predictShape.ts';
import { solveQuadraticProgram } from '../optimize/quadraticProgram.ts';
import { defaultStepPolicy, stepAims, type StepAims, type StepPolicy } from './stepPolicy.ts';
import { millimetre as mm } from '../units/units.ts';

/** What planCut needs: the calibrated model, the bar now on a cutting grid, where it stands. */
export interface PlanCutInput {
  readonly calibration: SessionCalibration;
  /** The bar now (cutting grid, SI, calibrated moduli). */
  readonly model: BarModel;
  /** Each tuned partial's error now, cents (+ sharp), from the last measurement. */
  readonly errorCents: readonly number[];
  readonly toleranceCents: readonly number[];
  /** Workshop limits; `maxShortening` is what may still be trimmed off in this step. */
  readonly limits: CutLimits;
  readonly policy?: StepPolicy;
}

/** The planned cut and what the calibrated model predicts for it. */
export interface PlannedCut {
  readonly cut: CutAmounts;
  readonly regions: CutRegions | null;
  /** The bar after the cut (SI). */
  readonly model: BarModel;
  /** Each tuned partial's predicted error after the cut, cents (+ sharp). */
  readonly predictedErrorCents: number[];
  /** One-sigma uncertainty of each predicted change, cents. */
  readonly uncertaintyCents: number[];
  readonly aims: StepAims;
  /** The limits that bind the cut (`min-thickness`, `max-slope`, `tool-radius`, `overshoot`, `shortening`). */
  readonly binding: string[];
}

/** Most predicted change (cents) of any partial in one linearised step: the model is re-solved before going further. */
const trustCents = 300;
const maxIterations = 12;
/** Most shortening (fraction of the length) in one step: about 50 cents; re-measure before trimming more. */
const shorteningStepFraction = 0.03;
/** Relative weight of the smoothness (Tikhonov) term against the fit to the aims. */
const smoothnessWeight = 1e-3;
/** Relative weight of the smallest-removal (ridge) term against the fit to the aims. */
const smallestRemovalWeight = 1e-5;
/** The linearised steps stop once no partial would move more than this (cents). */
const convergedCents = 0.05;
/** Relative deepening of a cut used to measure how its result depends on the cut's depth. */
const executionProbe = 0.05;

type Kind = 'non-negative' | 'shortening' | 'min-thickness' | 'max-slope' | 'tool-radius' | 'overshoot' | 'overshoot-sharp';

interface Linearisation {
  /** d(error_n)/d(variable), cents per mm, one row per tuned partial. */
  matrix: number[][];
  /** Errors at the candidate (cents). */
  errors: number[];
}

/** The errors at a candidate cut and their derivatives with respect to each cut variable. */
function linearise(input: PlanCutInput, regions: CutRegions | null, now: ShapePrediction, candidate: ShapePrediction, cut: CutAmounts, variables: number): Linearisation {
  const tuned = input.errorCents.length;
  const errors = input.errorCents.map((e, n) => e + candidate.cents[n]! - now.cents[n]!);
  const matrix = Array.from({ length: tuned }, () => new Array<number>(variables).fill(0));
  if (regions) {
    const solution = candidate.evaluation.solution;
    const sensitivities = bendingSensitivities(solution);
    const positions = candidate.model.profile.positions;
    const offset = 0.5 * cut.shorteningMm * mm;
    const shapes = cut.shorteningMm > 0 ? cutRegions(Float64Array.from(positions, (y) => y + offset), regions.start, regions.end, regions.offsets.length).shapes : regions.shapes;
    const thicknesses = candidate.model.profile.thicknesses;
    let thinnest = 0;
    for (let j = 1; j < thicknesses.length; j++) if (thicknesses[j]! < thicknesses[thinnest]!) thinnest = j;
    const blank = candidate.model.section.shape === 'rect' ? candidate.model.section.thickness : 1;
    const slope = input.calibration.solidSlope;
    for (let n = 0; n < tuned; n++) {
      const lambda = solution.eigenvalues[n]!;
      const perThickness = sensitivities[n]!;
      const correction = input.calibration.corrections[n] ?? 0;
      shapes.forEach((shape, k) => {
        let column = 0;
        for (let j = 0; j < shape.length; j++) column -= ((centsPerNeper * perThickness[j]!) / (2 * lambda)) * shape[j]! * mm;
        // The correction c_n·depth moves too when the thinnest station is cut deeper.
        column += centsPerNeper * correction * ((shape[thinnest]! * mm) / blank);
        // And the solid model's difference, on the bar now's stations (the same grid unless shortened).
        if (slope && slope.positions.length === shape.length) for (let j = 0; j < shape.length; j++) column -= slope.centsPerMetre[n]![j]! * shape[j]! * mm;
        matrix[n]![k] = column;
      });
    }
  }
  if (variables > (regions?.shapes.length ?? 0)) {
    const shorter = predictShape(input.calibration, applyCut(input.model, regions, { amplitudes: cut.amplitudes, shorteningMm: cut.shorteningMm + 1 }), false);
    for (let n = 0; n < tuned; n++) matrix[n]![variables - 1] = shorter.cents[n]! - candidate.cents[n]!;
  }
  return { matrix, errors };
}

/**
 * One-sigma uncertainty (cents) of each partial after a cut: the measurement now, the calibration's
 * uncertainty of the change, and `changeSigma` times `executionEffect` — how much the result moves
 * if the whole cut is made deeper in proportion (d result / d scale of the cut, which exceeds the
 * change itself on a deep cut because stiffness goes as thickness cubed).
 */
/**
 * Roughness of a combination of the regions: Q with aᵀQa = Σ_j h_j·(d²D/dx²)_j² for the depth
 * D = Σ a_k·shape_k, by the same discrete second derivative as the tool-radius check.
 */
function roughnessMatrix(positions: Float64Array, shapes: readonly Float64Array[]): number[][] {
  const count = shapes.length;
  const matrix = Array.from({ length: count }, () => new Array<number>(count).fill(0));
  const second = new Float64Array(count);
  for (let j = 1; j + 1 < positions.length; j++) {
    const h0 = positions[j]! - positions[j - 1]!;
    const h1 = positions[j + 1]! - positions[j]!;
    shapes.forEach((shape, k) => (second[k] = (2 / (h0 + h1)) * ((shape[j + 1]! - shape[j]!) / h1 - (shape[j]! - shape[j - 1]!) / h0)));
    const weight = 0.5 * (h0 + h1);
    for (let a = 0; a < count; a++) for (let b = 0; b < count; b++) matrix[a]![b]! += weight * second[a]! * second[b]!;
  }
  return matrix;
}

function uncertaintyOf(input: PlanCutInput, now: ShapePrediction, candidate: ShapePrediction, executionEffect: readonly number[] | null, policy: StepPolicy): number[] {
  const calibrationPart = changeUncertaintyCents(input.calibration, now, candidate);
  return calibrationPart.subarray(0, input.errorCents.length).reduce<number[]>((list, part, n) => {
    list.push(Math.sqrt(input.calibration.measurementSigmaCents ** 2 + part ** 2 + (executionEffect ? (policy.changeSigma * executionEffect[n]!) ** 2 : 0)));
    return list;
  }, []);
}

/**
 * Plans the smallest removal that moves the tuned partials toward their aims (stepAims): a
 * non-negative combination of smooth symmetric regions (cutRegions) between the uncut ends, plus
 * shortening when some partial is flat beyond tolerance and the limits allow it. Method: sequential
 * quadratic programming — at each candidate the calibrated model is re-solved, its exact eigenvalue
 * sensitivities (bendingSensitivities) give the derivatives, and an active-set QP
 * (solveQuadraticProgram) minimises Σ((error − aim)/tolerance)² plus small Tikhonov terms on the cut's
 * roughness (its second derivative, so the arch stays one smooth curve) and its removed area, subject to the workshop limits (cutConstraints) and the overshoot rule; linearised steps
 * are capped at 300 predicted cents per partial. The result is re-solved exactly and, if the
 * overshoot rule is broken, scaled back.
 */
export function planCut(input: PlanCutInput): PlannedCut {
  const policy = input.policy ?? defaultStepPolicy;
  const { model, limits, toleranceCents } = input;
  const tuned = input.errorCents.length;
  const now = predictShape(input.calibration, model, true);
  const length = model.length;
  const anyFlat = input.errorCents.some((e, n) => e < -toleranceCents[n]!);
  const shorteningCap = limits.allowShortening && anyFlat ? Math.min(limits.maxShortening, shorteningStepFraction * length) / mm : 0;
  const margin = 0.5 * shorteningCap * mm;
  const spanStart = limits.uncutLeft + margin;
  const spanEnd = length - limits.uncutRight - margin;
  const regions = model.section.shape === 'rect' && spanEnd - spanStart > 0.02 ? cutRegions(model.profile.positions, spanStart, spanEnd) : null;
  const regionCount = regions?.shapes.length ?? 0;
  const variables = regionCount + (shorteningCap > 0 ? 1 : 0);
  const baseUncertainty = uncertaintyOf(input, now, now, null, policy);
  if (variables === 0) {
    const aims = stepAims(input.errorCents, toleranceCents, baseUncertainty, policy);
    return { cut: noCut(0), regions, model, predictedErrorCents: [...input.errorCents], uncertaintyCents: baseUncertainty, aims, binding: [] };
  }
  const limitRows: LinearInequality[] = regions ? cutConstraints(model.profile, regions.shapes, limits) : [];
  const areaScale = regions ? regions.areas.reduce((a, b) => a + b, 0) / regionCount : 1;
  const roughness = regions ? roughnessMatrix(model.profile.positions, regions.shapes) : [];
  const cutOf = (values: readonly number[]): CutAmounts => ({ amplitudes: values.slice(0, regionCount), shorteningMm: shorteningCap > 0 ? Math.max(0, values[variables - 1]!) : 0 });
  let x = new Array<number>(variables).fill(0);
  let candidate = now;
  let candidateUncertainty: number[] | null = null;
  let binding: string[] = [];
  for (let iteration = 0; iteration < maxIterations; iteration++) {
    const { matrix, errors } = linearise(input, regions, now, candidate, cutOf(x), variables);
    const aims = candidateUncertainty ? stepAims(input.errorCents, toleranceCents, candidateUncertainty, policy, true) : stepAims(input.errorCents, toleranceCents, baseUncertainty, policy);
    // Objective Σ w_n (S_n·x − g_n)² + γ Σ r_k x_k², g_n = aim_n − error_n(candidate) + S_n·x_c.
    const weights = toleranceCents.map((t) => 1 / (t * t));
    const offsetAt = (row: readonly number[]): number => row.reduce((sum, s, i) => sum + s * x[i]!, 0);
    const goal = matrix.map((row, n) => input.errorCents[n]! + aims.desired[n]! - errors[n]! + offsetAt(row));
    const hessian = Array.from({ length: variables }, (_, i) => Array.from({ length: variables }, (_, j) => 2 * matrix.reduce((sum, row, n) => sum + weights[n]! * row[i]! * row[j]!, 0)));
    const linear = Array.from({ length: variables }, (_, i) => 2 * matrix.reduce((sum, row, n) => sum + weights[n]! * row[i]! * goal[n]!, 0));
    let trace = 0;
    for (let i = 0; i < variables; i++) trace += hessian[i]![i]!;
    trace = Math.max(trace, 1e-9);
    let roughTrace = 0;
    for (let i = 0; i < regionCount; i++) roughTrace += roughness[i]![i]!;
    for (let i = 0; i < regionCount; i++) for (let j = 0; j < regionCount; j++) hessian[i]![j]! += (2 * smoothnessWeight * trace * roughness[i]![j]!) / Math.max(roughTrace, 1e-30);
    for (let i = 0; i < variables; i++) {
      const relative = i < regionCount && regions ? regions.areas[i]! / areaScale : 1;
      hessian[i]![i]! += (2 * smallestRemovalWeight * trace * Math.max(relative * relative, 1e-6)) / variables;
    }
    const rows: number[][] = [];
    const bounds: number[] = [];
    const kinds: Kind[] = [];
    const push = (coefficients: number[], bound: number, kind: Kind): void => {
      rows.push(coefficients);
      bounds.push(bound);
      kinds.push(kind);
    };
    for (let i = 0; i < variables; i++) push(Array.from({ length: variables }, (_, j) => (j === i ? 1 : 0)), 0, 'non-negative');
    if (shorteningCap > 0) push(Array.from({ length: variables }, (_, j) => (j === variables - 1 ? -1 : 0)), -shorteningCap, 'shortening');
    for (const row of limitRows) push(Array.from({ length: variables }, (_, j) => (j < regionCount ? -row.coefficients[j]! : 0)), -row.bound, row.rule);
    for (let n = 0; n < tuned; n++) {
      const floor = input.errorCents[n]! + aims.lowestChange[n]!;
      push([...matrix[n]!], floor - errors[n]! + offsetAt(matrix[n]!), 'overshoot');
      if (!regions) {
        // Nothing can lower a tube or rod again: it must not end sharp beyond tolerance either.
        const sigma = candidateUncertainty?.[n] ?? baseUncertainty[n]!;
        const ceiling = Math.max(input.errorCents[n]!, toleranceCents[n]! - policy.confidence * sigma);
        push(matrix[n]!.map((v) => -v), -(ceiling - errors[n]! + offsetAt(matrix[n]!)), 'overshoot-sharp');
      }
    }
    const program = {
      size: variables,
      hessian: Float64Array.from(hessian.flat()),
      gradient: Float64Array.from(linear, (v) => -v),
      constraintCount: rows.length,
      constraints: Float64Array.from(rows.flat()),
      lowerBounds: Float64Array.from(bounds),
    };
    // From the current cut (the solver falls back to its interior-point method when the
    // re-linearised limits no longer hold it).
    const result = solveQuadraticProgram({ ...program, start: Float64Array.from(x) });
    if (!result.converged) break;
    let step = Array.from(result.x, (v, i) => Math.max(0, v) - x[i]!);
    const largest = Math.max(...matrix.map((row) => Math.abs(row.reduce((sum, s, i) => sum + s * step[i]!, 0))));
    if (largest > trustCents) step = step.map((s) => (s * trustCents) / largest);
    x = x.map((v, i) => Math.max(0, v + step[i]!));
    binding = [...new Set(result.active.map((index) => kinds[index]!).filter((kind) => kind !== 'non-negative'))];
    const evaluated = evaluateCut(input, policy, now, regions, cutOf(x));
    candidate = evaluated.after;
    candidateUncertainty = evaluated.uncertainty;
    if (largest < convergedCents) break;
  }
  return verifyAndScale(input, policy, now, regions, cutOf(x), binding, baseUncertainty);
}

/** A cut evaluated exactly: the shape after, its errors and the full uncertainty of each. */
interface EvaluatedCut {
  readonly cut: CutAmounts;
  readonly after: ShapePrediction;
  readonly errors: number[];
  readonly uncertainty: number[];
}

/** Solves the calibrated model after the cut, and once more with the cut 5 % deeper for the execution term. */
function evaluateCut(input: PlanCutInput, policy: StepPolicy, now: ShapePrediction, regions: CutRegions | null, cut: CutAmounts): EvaluatedCut {
  const after = predictShape(input.calibration, applyCut(input.model, regions, cut), true);
  const deeper = predictShape(input.calibration, applyCut(input.model, regions, { amplitudes: cut.amplitudes.map((a) => a * (1 + executionProbe)), shorteningMm: cut.shorteningMm * (1 + executionProbe) }), false);
  const errors = input.errorCents.map((e, n) => e + after.cents[n]! - now.cents[n]!);
  const effect = errors.map((_, n) => (deeper.cents[n]! - after.cents[n]!) / executionProbe);
  return { cut, after, errors, uncertainty: uncertaintyOf(input, now, after, effect, policy) };
}

/**
 * Checks the planned cut, solved exactly, against the overshoot rule with the full uncertainty
 * (calibration, execution, measurement); if it is broken, the cut is scaled back by bisection (six
 * halvings) to the largest fraction that keeps it.
 */
function verifyAndScale(input: PlanCutInput, policy: StepPolicy, now: ShapePrediction, regions: CutRegions | null, cut: CutAmounts, binding: string[], baseUncertainty: readonly number[]): PlannedCut {
  const broken = (evaluated: EvaluatedCut): boolean =>
    evaluated.errors.some((error, n) => {
      const change = error - input.errorCents[n]!;
      const tolerance = input.toleranceCents[n]!;
      if (change > 0 && !regions) return error + policy.confidence * evaluated.uncertainty[n]! > Math.max(input.errorCents[n]!, 1.1 * tolerance);
      if (change >= 0) return false;
      // Already within reach of the flat limit: no lowering beyond a tenth of the tolerance.
      if (input.errorCents[n]! - policy.confidence * baseUncertainty[n]! < -tolerance) return change < -0.1 * tolerance;
      return error - policy.confidence * evaluated.uncertainty[n]! < -1.1 * tolerance;
    });
  const scaled = (fraction: number): EvaluatedCut => evaluateCut(input, policy, now, regions, { amplitudes: cut.amplitudes.map((a) => a * fraction), shorteningMm: cut.shorteningMm * fraction });
  let best = scaled(1);
  if (broken(best)) {
    let low = 0;
    let high = 1;
    best = scaled(0);
    for (let halving = 0; halving < 6; halving++) {
      const middle = 0.5 * (low + high);
      const trial = scaled(middle);
      if (broken(trial)) high = middle;
      else {
        low = middle;
        best = trial;
      }
    }
    binding = [...new Set([...binding, 'overshoot'])];
  }
  const aims = stepAims(input.errorCents, input.toleranceCents, best.uncertainty, policy, true);
  return { cut: best.cut, regions, model: best.after.model, predictedErrorCents: best.errors, uncertaintyCents: best.uncertainty, aims, binding };
}
