import type { BarModel } from '../modes/BarModel.ts';
import { bendingSensitivities } from '../modes/bendingSensitivities.ts';
import { archDepth } from './archDepth.ts';
import { denseCholeskyInPlace, denseCholeskySolveInPlace, symmetricPositiveInverse } from '../eigen/denseCholesky.ts';
import { centsPerNeper, evaluatePartials, type PartialEvaluation } from './partialModel.ts';
import { thicknessAt } from '../section/ThicknessProfile.ts';

/**
 * A thickness removal whose size is a fit parameter: the shape's thickness at each station is
 * lowered by p[parameter] · values[station] (m). Used for cuts recorded as planned, whose real
 * depth is learned from the partials.
 */
export interface FitRemoval {
  readonly parameter: number;
  readonly values: Float64Array;
}

/** One measured shape in a fit: the recorded model (density etc. fixed), the partials, and any fitted removals. */
export interface FitShape {
  /** The shape as recorded; its stations carry the removals below. */
  readonly model: BarModel;
  /** Measured pitch of each partial, `1200·log2(f/1 Hz)`, or null where not used. */
  readonly measuredCents: readonly (number | null)[];
  /** One-sigma uncertainty of each measurement, cents. */
  readonly sigmaCents: readonly number[];
  readonly removals?: readonly FitRemoval[];
  /** Offsets added to every partial of this shape: p[parameter] · cents (e.g. a temperature coefficient's error times the reading's distance from the playing temperature). */
  readonly offsets?: readonly { readonly parameter: number; readonly cents: number }[];
  /** Thicknesses measured on this shape (m, at x m), each with its one-sigma (m): fitted beside the partials through the removals. */
  readonly thicknessReadings?: readonly { readonly x: number; readonly thickness: number; readonly sigma: number }[];
}

/** A Gaussian prior on a linear combination of the parameters: (coefficients · p − mean)/sigma. */
export interface LinearPrior {
  readonly coefficients: readonly number[];
  readonly mean: number;
  readonly sigma: number;
}

/**
 * A fit problem: parameters p = [ln E, ln G, c_1 … c_m, then any removal sizes and offset
 * parameters] (E, G in Pa; c_n the per-partial corrections, fraction of frequency per unit arch depth).
 */
export interface FitProblem {
  readonly shapes: readonly FitShape[];
  /** How many per-partial corrections (0: material only). */
  readonly corrections: number;
  readonly priors: readonly LinearPrior[];
  /** Starting parameters; their count is the number of parameters. */
  readonly start: readonly number[];
  /** Allowed range of ln(E/G), the shear softening (keeps a bad measurement from running off). */
  readonly lnRatioRange: readonly [number, number];
}

/** The fitted parameters with their linearised posterior covariance and the residuals. */
export interface FitResult {
  readonly parameters: number[];
  /** Posterior covariance of the parameters (inverse of the Gauss–Newton normal matrix). */
  readonly covariance: number[][];
  /** Per shape, per partial: measured − fitted, cents (null where no measurement). */
  readonly residualCents: (number | null)[][];
  /** Per shape, per partial: the fitted prediction, cents above 1 Hz (every mode evaluated). */
  readonly fittedCents: Float64Array[];
  /** Per shape, per measurement used: leverage h (0…1) of that measurement in the fit. */
  readonly leverage: (number | null)[][];
  /** Per shape: the shape with the fitted removals applied (recorded moduli kept). */
  readonly models: BarModel[];
  /** Per shape: its arch depth with the fitted removals. */
  readonly depths: number[];
  /** Per shape: the partial evaluation at the fitted moduli. */
  readonly evaluations: PartialEvaluation[];
  /** Whether ln(E/G) ended on a bound of its allowed range. */
  readonly ratioAtBound: boolean;
  readonly iterations: number;
}

/** Most change of ln E or ln G in one Gauss–Newton step (keeps early steps from overshooting). */
const maxModulusStep = 0.5;
/** Most change of a removal size in one step (a cut 30 % off its record is already extreme). */
const maxRemovalStep = 0.3;
const maxIterations = 30;
/** Gauss–Newton stops when no parameter moves more than this (1e-7 in ln E ≈ 0.0001 cent). */
const convergence = 1e-7;

/** The shape with its removals sized by the parameters. */
function shapeAt(shape: FitShape, p: readonly number[]): BarModel {
  if (!shape.removals || shape.removals.length === 0) return shape.model;
  const floor = shape.model.section.shape === 'rect' ? 0.02 * shape.model.section.thickness : 0;
  const thicknesses = Float64Array.from(shape.model.profile.thicknesses, (t, j) => {
    let value = t;
    for (const removal of shape.removals!) value -= p[removal.parameter]! * removal.values[j]!;
    return Math.max(floor, value);
  });
  return { ...shape.model, profile: { positions: shape.model.profile.positions, thicknesses } };
}

interface ShapeState {
  model: BarModel;
  depth: number;
  evaluation: PartialEvaluation;
  /** Per partial: predicted cents and the Jacobian row (unweighted). */
  predicted: number[];
  rows: number[][];
}

function evaluateShape(shape: FitShape, p: readonly number[], corrections: number, modes: number): ShapeState {
  const size = p.length;
  const model = shapeAt(shape, p);
  const depth = archDepth(model);
  const evaluation = evaluatePartials(model, Math.exp(p[0]!), Math.exp(p[1]!), modes);
  const removals = shape.removals ?? [];
  const sensitivities = removals.length > 0 ? bendingSensitivities(evaluation.solution) : [];
  const thicknesses = model.profile.thicknesses;
  let thinnest = 0;
  for (let j = 1; j < thicknesses.length; j++) if (thicknesses[j]! < thicknesses[thinnest]!) thinnest = j;
  const blank = model.section.shape === 'rect' ? model.section.thickness : 1;
  const predicted: number[] = [];
  const rows: number[][] = [];
  for (let n = 0; n < evaluation.cents.length; n++) {
    const correction = n < corrections ? p[2 + n]! : 0;
    let offset = 0;
    for (const item of shape.offsets ?? []) offset += p[item.parameter]! * item.cents;
    predicted.push(evaluation.cents[n]! + centsPerNeper * correction * depth + offset);
    const row = new Array<number>(size).fill(0);
    row[0] = evaluation.perLnYoung[n]!;
    row[1] = evaluation.perLnShear[n]!;
    if (n < corrections) row[2 + n] = centsPerNeper * depth;
    for (const item of shape.offsets ?? []) row[item.parameter]! += item.cents;
    if (removals.length > 0) {
      const perThickness = sensitivities[n]!;
      const scale = centsPerNeper / (2 * evaluation.solution.eigenvalues[n]!);
      for (const removal of removals) {
        let derivative = 0;
        for (let j = 0; j < perThickness.length; j++) derivative -= scale * perThickness[j]! * removal.values[j]!;
        // Depth grows when the thinnest station loses wood: c_n·depth moves with it.
        derivative += (centsPerNeper * correction * removal.values[thinnest]!) / blank;
        row[removal.parameter]! += derivative;
      }
    }
    rows.push(row);
  }
  return { model, depth, evaluation, predicted, rows };
}

function modesNeeded(shapes: readonly FitShape[]): number {
  return Math.max(1, ...shapes.map((s) => s.measuredCents.length));
}

/** Solves the (positive-definite, priors included) normal equations N·x = r by dense Cholesky. */
function solveNormalEquations(normal: readonly (readonly number[])[], rhs: readonly number[]): number[] {
  const n = rhs.length;
  const factor = Float64Array.from(normal.flat());
  if (!denseCholeskyInPlace(factor, n)) throw new Error('internal: calibration normal matrix is not positive definite');
  const x = Float64Array.from(rhs);
  denseCholeskySolveInPlace(factor, n, x);
  return Array.from(x);
}

/** The inverse of the normal matrix (the parameters' covariance), as rows. */
function inverseOfNormal(normal: readonly (readonly number[])[]): number[][] {
  const n = normal.length;
  const inverse = symmetricPositiveInverse(Float64Array.from(normal.flat()), n);
  return Array.from({ length: n }, (_, i) => Array.from(inverse.subarray(i * n, i * n + n)));
}

/**
 * Fits E, G, optional per-partial corrections and optional removal sizes to the measured
 * partials of one or more shapes of a bar, by Gauss–Newton on the cents residuals with Gaussian
 * (Tikhonov) priors: predicted_n(shape) = cents_n(E, G; shape with removals) +
 * (1200/ln 2)·c_n·depth(shape) + Σ offsets, and caliper readings against the shape's thickness
 * with its removals. Each iteration solves every shape once (evaluatePartials; exact
 * moduli derivatives) and, for shapes with fitted removals, takes their derivatives from the exact
 * eigenvalue sensitivities. ln(E/G) is kept in `lnRatioRange`. Returns the fit, its covariance and
 * each measurement's leverage (for leave-one-out checks).
 */
export function fitModuli(problem: FitProblem): FitResult {
  const { shapes, corrections, priors } = problem;
  const size = problem.start.length;
  const modes = modesNeeded(shapes);
  let p = [...problem.start];
  let states: ShapeState[] = [];
  let normal: number[][] = [];
  let iterations = 0;
  let converged = false;
  const clampRatio = (params: number[]): boolean => {
    const ratio = params[0]! - params[1]!;
    const [low, high] = problem.lnRatioRange;
    if (ratio < low || ratio > high) {
      params[1] = params[0]! - Math.min(high, Math.max(low, ratio));
      return true;
    }
    return false;
  };
  let ratioAtBound = clampRatio(p);
  for (; iterations < maxIterations; iterations++) {
    states = shapes.map((shape) => evaluateShape(shape, p, corrections, modes));
    normal = Array.from({ length: size }, () => new Array<number>(size).fill(0));
    const gradient = new Array<number>(size).fill(0);
    shapes.forEach((shape, k) => {
      const state = states[k]!;
      shape.measuredCents.forEach((measured, n) => {
        if (measured === null || n >= state.predicted.length) return;
        const sigma = shape.sigmaCents[n]!;
        const row = state.rows[n]!;
        const residual = (measured - state.predicted[n]!) / sigma;
        for (let i = 0; i < size; i++) {
          const a = row[i]! / sigma;
          if (a === 0) continue;
          gradient[i]! += a * residual;
          for (let j = 0; j < size; j++) normal[i]![j]! += (a * row[j]!) / sigma;
        }
      });
    });
    shapes.forEach((shape, k) => {
      // Caliper readings: the shape's thickness there, less each fitted removal (linear in its size).
      const state = states[k]!;
      for (const reading of shape.thicknessReadings ?? []) {
        const residual = (reading.thickness - thicknessAt(state.model.profile, reading.x)) / reading.sigma;
        const row = new Array<number>(size).fill(0);
        for (const removal of shape.removals ?? []) row[removal.parameter]! -= thicknessAt({ positions: shape.model.profile.positions, thicknesses: removal.values }, reading.x) / reading.sigma;
        for (let i = 0; i < size; i++) {
          if (row[i] === 0) continue;
          gradient[i]! += row[i]! * residual;
          for (let j = 0; j < size; j++) normal[i]![j]! += row[i]! * row[j]!;
        }
      }
    });
    for (const prior of priors) {
      let value = 0;
      for (let i = 0; i < size; i++) value += prior.coefficients[i]! * p[i]!;
      const residual = (prior.mean - value) / prior.sigma;
      for (let i = 0; i < size; i++) {
        const a = prior.coefficients[i]! / prior.sigma;
        if (a === 0) continue;
        gradient[i]! += a * residual;
        for (let j = 0; j < size; j++) normal[i]![j]! += a * (prior.coefficients[j]! / prior.sigma);
      }
    }
    const step = solveNormalEquations(normal, gradient);
    let scale = 1;
    step.forEach((s, i) => {
      const cap = i < 2 ? maxModulusStep : i >= 2 + corrections ? maxRemovalStep : Infinity;
      if (Math.abs(s) * scale > cap) scale = cap / Math.abs(s);
    });
    const next = p.map((value, i) => value + scale * step[i]!);
    ratioAtBound = clampRatio(next);
    const change = Math.max(...next.map((value, i) => Math.abs(value - p[i]!)));
    if (change < convergence) {
      // The last step was negligible: keep the states (and normal matrix) at the current point.
      converged = true;
      break;
    }
    p = next;
  }
  if (!converged) states = shapes.map((shape) => evaluateShape(shape, p, corrections, modes));
  const covariance = inverseOfNormal(normal);
  const residualCents = shapes.map((shape, k) => shape.measuredCents.map((measured, n) => (measured === null || n >= states[k]!.predicted.length ? null : measured - states[k]!.predicted[n]!)));
  const leverage = shapes.map((shape, k) =>
    shape.measuredCents.map((measured, n) => {
      if (measured === null || n >= states[k]!.predicted.length) return null;
      const sigma = shape.sigmaCents[n]!;
      const row = states[k]!.rows[n]!;
      let h = 0;
      for (let i = 0; i < size; i++) for (let j = 0; j < size; j++) h += row[i]! * covariance[i]![j]! * row[j]!;
      return Math.min(1, Math.max(0, h / (sigma * sigma)));
    }),
  );
  return {
    parameters: p,
    covariance,
    residualCents,
    fittedCents: states.map((state) => Float64Array.from(state.predicted)),
    leverage,
    models: states.map((state) => state.model),
    depths: states.map((state) => state.depth),
    evaluations: states.map((state) => state.evaluation),
    ratioAtBound,
    iterations,
  };
}
