// The solid model's vertical bending partials alone, with their thickness sensitivities: what a
// session needs of the 3D bar, without the torsion and sideways families analyzeBar also finds.
import type { BarModel } from './BarModel.ts';
import { solidBarOf } from './analyzeSolidBar.ts';
import { solidMeshFor, solidModesOf, solveSolidPart, type SolidPartSolution } from './solidBarModes.ts';
import { solidThicknessSensitivities } from './solidSensitivities.ts';

/** The first vertical bending partials of a rectangular bar on the solid model. */
export interface SolidBendingPartials {
  /** Frequencies, Hz, ascending. */
  readonly hz: number[];
  /** Per partial, d(cents)/d(t_j) at every station j of the bar's profile, cents per metre (empty unless asked). */
  readonly centsPerMetre: Float64Array[];
}

/** Lanczos relative residual: analyzeBar's own (frequencies to about 1e-8), so both give the same partials. */
const tolerance = 1e-4;

/**
 * The first `count` vertical bending partials of a rectangular bar (SI model) on the solid model,
 * solving only the half that holds them (the symmetric half about mid-width, or the full body when
 * the grain is not aligned), on analyzeBar's meshes; with `sensitivities`, each partial's exact
 * thickness sensitivity at every profile station (solidThicknessSensitivities, dλ/dt_j, as
 * cents: (1200/ln 2)·dλ/(2λ) per metre). More modes are asked for until `count` bending ones are
 * found. About half the cost of analyzeBar's solid analysis.
 */
export function solidBendingPartials(model: BarModel, count: number, sensitivities = false): SolidBendingPartials {
  const bar = solidBarOf(model);
  const part = bar.mirrorSymmetric ? 'symmetric' : 'full';
  const mesh = solidMeshFor(part);
  let asked = count + 1;
  let solution: SolidPartSolution;
  for (;;) {
    solution = solveSolidPart(bar, part, mesh, { count: asked }, tolerance);
    const bending = solidModesOf([solution]).filter((mode) => mode.kind === 'bending');
    if (bending.length >= count || asked > count + 12) break;
    asked += 2;
  }
  const bending = solidModesOf([solution])
    .filter((mode) => mode.kind === 'bending')
    .slice(0, count);
  if (bending.length < count) throw new Error(`internal: the solid model found ${bending.length} of ${count} bending partials`);
  const centsPerNeper = 1200 / Math.LN2;
  return {
    hz: bending.map((mode) => mode.hz),
    centsPerMetre: sensitivities ? bending.map((mode) => Float64Array.from(solidThicknessSensitivities(solution, mode.vectorIndex), (d) => (centsPerNeper * d) / (2 * mode.eigenvalue))) : [],
  };
}
