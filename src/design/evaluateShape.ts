import type { BeamTheory } from '../fe/beamElementType.ts';
import type { BeamLine } from '../fe/BeamLine.ts';
import { buildMesh } from '../fe/buildMesh.ts';
import type { BarModel } from '../modes/BarModel.ts';
import { bendingSensitivities } from '../modes/bendingSensitivities.ts';
import { bendingLine, solveBendingLine, type BendingSolution } from '../modes/solveBending.ts';
import type { CutLimits } from './cutLimits.ts';
import type { DesignTarget } from './designTarget.ts';
import type { ShapeFamily, ShapeSpace } from './ShapeFamily.ts';

/** Everything fixed during one design (SI): the bar, where its stations are, what to reach, what is allowed. */
export interface DesignProblem {
  /** The bar as it is now (original profile). */
  readonly model: BarModel;
  readonly space: ShapeSpace;
  readonly target: DesignTarget;
  readonly limits: CutLimits;
  readonly theory: BeamTheory;
  /** Target element count for the solver's mesh (stations are nodes on top of it). */
  readonly elements: number;
  /** Bar width (m), for volumes. */
  readonly width: number;
  /** The bending line of the original bar (its law is reused with each new profile). */
  readonly line: BeamLine;
  /**
   * Aim at the ratios only, the fundamental left free: cents_k become the cents of f_k/f₁ from
   * ratio_k (k ≥ 2) and the fundamental's entry is 0 (used to explain an infeasible target).
   */
  readonly ratioOnly?: boolean;
}

/** A shape of a family evaluated by the solver, with first derivatives. */
export interface ShapeEvaluation {
  readonly family: ShapeFamily;
  readonly q: Float64Array;
  /** Depth of the family's surface below the blank at each station (m). */
  readonly depth: Float64Array;
  /** ∂depth/∂q, row-major station × parameter. */
  readonly depthJacobian: Float64Array;
  /** The bar's thickness min(original, T − depth) at each station (m). */
  readonly thickness: Float64Array;
  /** 1 where the surface is below the original (material removed), else 0. */
  readonly cut: Uint8Array;
  readonly solution: BendingSolution;
  /** Frequencies of the tuned partials (Hz). */
  readonly hz: Float64Array;
  /** Cents from each target partial (signed, + sharp). */
  readonly cents: Float64Array;
  /** ∂cents/∂q, row-major partial × parameter. */
  readonly centsJacobian: Float64Array;
  /** Volume removed from the original (m³). */
  readonly volume: number;
  /** ∂volume/∂q (m³ per unit q). */
  readonly volumeGradient: Float64Array;
}

/** cents per unit relative change of λ = ω²: dc = (1200 / ln 2)·dλ/(2λ). */
const centsPerLogEigenvalue = 1200 / Math.LN2 / 2;

/** Solves the bending modes of a bar whose thickness at the grid stations is `thickness` (m). */
function solveProfile(problem: DesignProblem, thickness: Float64Array, modes: number): BendingSolution {
  const profile = { positions: problem.space.grid.positions, thicknesses: thickness };
  const line: BeamLine = { ...problem.line, profile };
  return solveBendingLine(line, buildMesh(profile, problem.elements, line.holes), problem.theory, modes);
}

/** The bending line of a model (re-exported here so the designer does not reach into modes/). */
export function designLine(model: BarModel): BeamLine {
  return bendingLine(model, 'vertical');
}

/**
 * Evaluates a shape q of `family`: the bar's thickness at every station, its tuned partials by
 * the finite-element solver, cents from the targets, and exact first derivatives of the cents
 * (station sensitivities dλ/dt_j of bendingSensitivities chained through ∂t_j/∂q: ∂t_j/∂q =
 * −∂d_j/∂q where the surface cuts, 0 where the original is already thinner) and of the removed
 * volume (trapezoid rule, exact for a piecewise-linear profile).
 */
export function evaluateShape(problem: DesignProblem, family: ShapeFamily, q: ArrayLike<number>): ShapeEvaluation {
  const { space, target } = problem;
  const grid = space.grid;
  const n = grid.positions.length;
  const m = family.parameterCount(space);
  const depth = new Float64Array(n);
  const depthJacobian = new Float64Array(n * m);
  family.depths(space, q, depth, depthJacobian);
  const thickness = new Float64Array(n);
  const cut = new Uint8Array(n);
  for (let j = 0; j < n; j++) {
    const surface = space.blankThickness - depth[j]!;
    if (surface < grid.original[j]!) {
      thickness[j] = surface;
      cut[j] = 1;
    } else thickness[j] = grid.original[j]!;
  }
  const partials = target.hz.length;
  const solution = solveProfile(problem, thickness, partials);
  if (solution.frequencies.length < partials) throw new Error(`internal: the solver found ${solution.frequencies.length} of ${partials} modes`);
  const sensitivities = bendingSensitivities(solution);
  const hz = solution.frequencies.slice(0, partials);
  const cents = Float64Array.from(hz, (f, k) => 1200 * Math.log2(f / target.hz[k]!));
  const centsJacobian = new Float64Array(partials * m);
  for (let k = 0; k < partials; k++) {
    const scale = centsPerLogEigenvalue / solution.eigenvalues[k]!;
    const station = sensitivities[k]!;
    for (let j = 0; j < n; j++) {
      if (!cut[j]) continue;
      const dCents = -scale * station[j]!;
      for (let p = 0; p < m; p++) centsJacobian[k * m + p]! += dCents * depthJacobian[j * m + p]!;
    }
  }
  if (problem.ratioOnly) {
    for (let k = partials - 1; k >= 0; k--) {
      cents[k] = k === 0 ? 0 : cents[k]! - cents[0]!;
      for (let p = 0; p < m; p++) centsJacobian[k * m + p] = k === 0 ? 0 : centsJacobian[k * m + p]! - centsJacobian[p]!;
    }
  }
  let volume = 0;
  const volumeGradient = new Float64Array(m);
  for (let j = 0; j < n; j++) {
    const left = j > 0 ? grid.positions[j]! - grid.positions[j - 1]! : 0;
    const right = j + 1 < n ? grid.positions[j + 1]! - grid.positions[j]! : 0;
    const weight = 0.5 * (left + right) * problem.width;
    volume += weight * (grid.original[j]! - thickness[j]!);
    if (cut[j]) for (let p = 0; p < m; p++) volumeGradient[p]! += weight * depthJacobian[j * m + p]!;
  }
  return { family, q: Float64Array.from(q), depth, depthJacobian, thickness, cut, solution, hz, cents, centsJacobian, volume, volumeGradient };
}
