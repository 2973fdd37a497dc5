import type { Material } from '../material/Material.ts';
import type { BarModel } from '../modes/BarModel.ts';
import { solveBending, type BendingSolution } from '../modes/solveBending.ts';
import { shearStiffnessShare } from './shearStiffnessShare.ts';

/** Cents per neper: 1200 / ln 2 (a change of ln f by 1 is this many cents). */
export const centsPerNeper = 1200 / Math.LN2;

/** The partials of a bar model with given moduli, as absolute pitch `1200·log2(f / 1 Hz)` (cents). */
export interface PartialEvaluation {
  /** 1200·log2(f_n) for each mode n (cents above 1 Hz). */
  readonly cents: Float64Array;
  /** ∂cents/∂ln E at fixed G, per mode. */
  readonly perLnYoung: Float64Array;
  /** ∂cents/∂ln G at fixed E, per mode. */
  readonly perLnShear: Float64Array;
  /** The bending solution at the given moduli (for sensitivities). */
  readonly solution: BendingSolution;
}

/** The model with Young's and shear moduli replaced (Pa); everything else kept. */
export function withModuli(model: BarModel, youngModulus: number, shearModulus: number): BarModel {
  const material: Material = { ...model.material, youngModulus, shearModulus };
  return { ...model, material };
}

/** Absolute pitch of each frequency (Hz) in cents above 1 Hz. */
export function hzToAbsoluteCents(hz: ArrayLike<number>): Float64Array {
  return Float64Array.from(hz as ArrayLike<number>, (f) => 1200 * Math.log2(f));
}

/**
 * The lowest `modes` vertical bending partials of `model` at moduli E, G (Pa), Timoshenko finite
 * elements (solveBending, automatic mesh), with their derivatives: ∂ln f/∂ln G is half the
 * mode's shear share of stiffness (shearStiffnessShare, exact for the discrete model), and
 * ∂ln f/∂ln E follows from the exact scaling law — every partial scales as √(E/ρ) when E and G
 * scale together, so ∂ln f/∂ln E + ∂ln f/∂ln G = ½. One solve. `derivatives` = false skips the
 * shear integral.
 */
export function evaluatePartials(model: BarModel, youngModulus: number, shearModulus: number, modes: number, derivatives = true): PartialEvaluation {
  const solution = solveBending(withModuli(model, youngModulus, shearModulus), { modes });
  const cents = hzToAbsoluteCents(solution.frequencies);
  const perLnShear = new Float64Array(cents.length);
  const perLnYoung = new Float64Array(cents.length).fill(centsPerNeper / 2);
  if (derivatives) {
    const share = shearStiffnessShare(solution);
    for (let n = 0; n < cents.length; n++) {
      perLnShear[n] = (centsPerNeper / 2) * share[n]!;
      perLnYoung[n] = centsPerNeper / 2 - perLnShear[n]!;
    }
  }
  return { cents, perLnYoung, perLnShear, solution };
}
