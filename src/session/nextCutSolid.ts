// The next cut with the solid model's word on the wood and on the shape about to be cut.
import { barModelFromFile, type BarModel } from '../modes/BarModel.ts';
import { parseBarFile } from '../fileFormats/barFile.ts';
import { parseSessionFile } from '../fileFormats/sessionFile.ts';
import { archDepth } from './archDepth.ts';
import { evaluatePartials } from './partialModel.ts';
import { planNextCut, type NextCutOptions, type NextCutResult } from './nextCut.ts';
import type { SolidSlope } from './calibrateSession.ts';
import { solidBendingPartials } from '../modes/solidBendingPartials.ts';
import { bendingSensitivities } from '../modes/bendingSensitivities.ts';
import { defaultStepPolicy } from './stepPolicy.ts';
import { fitSolidWood, solidPartialCents, type SolidWoodFit } from './fitSolidWood.ts';
import { fitSolidGrain } from './fitSolidGrain.ts';

/**
 * One-sigma of the solid model's correction prior, per unit arch depth (barwright's own: with the
 * wood fitted to the readings the solid model still carries the wood's unmeasured constants — the
 * transverse moduli and the grain — which move the line-to-solid gap by about a tenth of itself on
 * the demo bars, 0.5–1 % of frequency per unit depth).
 */
export const solidCorrectionSigma = 0.01;
/** Below this arch depth the gap is too small to tell a correction per unit depth from noise. */
const shallowestDepth = 0.05;
/** Most solid analyses of planned shapes per call: the planned shape moves with the correction, so the correction is taken again on it. */
const maxRounds = 3;
/** The correction has settled when the solid model's gap on the new plan is within this of what the prior assumed there, cents. */
const settledCents = 3;

/**
 * Within this many cents of every target (barwright's own), a step is small enough for the solid
 * model's first-order change: a 50-cent step thins the bar by a few percent where it is cut, and
 * the sensitivities, going as thickness cubed, move by about that share of themselves.
 */
const closeInCents = 50;

/** The solid model's sensitivities less the line model's on the bar now (SolidSlope), with the fitted wood and the calibrated E and G. */
function slopeOf(now: BarModel, wood: BarModel['material'], calibrated: NextCutResult['calibrated_material'], tuned: number): SolidSlope {
  const solid = solidBendingPartials({ ...now, material: wood }, tuned, true);
  const line = evaluatePartials(now, calibrated.E_GPa * 1e9, calibrated.G_GPa * 1e9, tuned, false).solution;
  const lineSensitivities = bendingSensitivities(line);
  const centsPerNeper = 1200 / Math.LN2;
  return {
    positions: Float64Array.from(now.profile.positions),
    thicknesses: Float64Array.from(now.profile.thicknesses),
    centsPerMetre: solid.centsPerMetre.map((perStation, n) => Float64Array.from(perStation, (value, j) => value - (centsPerNeper * lineSensitivities[n]![j]!) / (2 * line.eigenvalues[n]!))),
  };
}

/** What the solid model said in a session step. */
export interface SolidSessionReport {
  /** The wood fitted on the solid model to the bar now (as calibrated): E along the grain, GPa, and the shear moduli as a share of the bar file's. */
  E_L_GPa: number;
  shear_scale: number;
  /** Reading − solid model with the fitted wood, cents per partial read: what the two constants cannot explain. */
  fit_residual_cents: number[];
  /** The grain fitted to a torsion or sideways mode read on the bar now (ring angle, degrees, 0 quarter-sawn, 90 flat-sawn) and reading − model, Hz; null when none was read. */
  grain: { ring_angle_deg: number; residual_hz: { torsion?: number; lateral?: number } } | null;
  /** The planned shape's arch depth (1 − thinnest/blank); null when the bar is too shallow for a correction. */
  arch_depth: number | null;
  /** Solid minus line model on the planned shape, cents per partial (negative: the line model is sharp); empty when shallow. */
  solid_minus_line_cents: number[];
  /** The correction prior given to the calibration, fraction of frequency per unit arch depth; empty when shallow. */
  correction_per_depth: number[];
  /** True when the step was planned with the solid model's own sensitivities (closing in: within 50 cents of every target). */
  solid_sensitivities: boolean;
  /** Solid analyses in all (the wood's fit, the sensitivities and the planned shapes). */
  solid_solves: number;
}

/** nextCut's result on the solid model; `solid` is null when it was not consulted (a round or tube bar, or no cut to plan). */
export type SolidNextCutResult = NextCutResult & { solid: SolidSessionReport | null };

/** The bar now with the maker's guess of its wood: the calibrated shape (each earlier cut at its fitted depth) and the bar file's material. */
function woodNow(session: unknown, source: string, calibratedNow: BarModel): BarModel {
  const log = parseSessionFile(session, source);
  const guess = barModelFromFile(parseBarFile(log.steps[log.steps.length - 1]!.bar, 'bar now')).material;
  return { ...calibratedNow, material: guess };
}

/**
 * The next cut with the solid model in the calibration.
 * 1. Plan as nextCut does (the line model, calibrated to every reading of the session).
 * 2. Fit the wood on the solid model to the bar as it is now (fitSolidWood: the stiffness along
 *    the grain and the shear stiffness, from the line calibration's E and G), and the grain when a
 *    torsion or sideways mode was read on it (fitSolidGrain).
 * 3. Closing in (every partial within 50 cents), give the planner the solid model's own thickness
 *    sensitivities less the line model's (SolidSlope): small steps then move as the solid model
 *    says, which the line model's per-partial correction cannot (it scales with the arch's depth,
 *    not with where a small cut is taken).
 * 4. Analyse the planned shape on the solid model and on the line model; give the calibration
 *    their gap per unit arch depth as the correction's prior (±solidCorrectionSigma) and plan
 *    again, again on the new plan while the gap there differs from what the prior assumed by more
 *    than 3 cents (at most 3 analyses). The readings still move the correction.
 * The step policy is nextCut's (defaultStepPolicy unless given). About a second per solid
 * analysis, 3–8 in all (more with an off-axis grain, which solves the full body). Rectangular bars
 * only: others get nextCut's answer with `solid: null`.
 */
export function nextCutSolid(session: unknown, options: NextCutOptions = {}): SolidNextCutResult {
  const policy = options.policy ?? defaultStepPolicy;
  const first = planNextCut(session, { ...options, policy });
  let result = first.result;
  if (!first.shapes || first.shapes.now.section.shape !== 'rect') return { ...result, solid: null };
  const now = woodNow(session, options.source ?? 'session', first.shapes.now);
  const tuned = result.target_hz.length;
  const read = Math.min(tuned, result.readings_at_playing_temperature_hz.length);
  const readingCents = result.readings_at_playing_temperature_hz.slice(0, read).map((hz) => 1200 * Math.log2(hz));
  let wood: SolidWoodFit = fitSolidWood(now, readingCents, { young: (result.calibrated_material.E_GPa * 1e9) / now.material.youngModulus, shear: (result.calibrated_material.G_GPa * 1e9) / now.material.shearModulus });
  let solves = wood.solves;
  // A torsion or sideways mode read on the bar now tells the grain (moved to the playing temperature as the partials are).
  const last = parseSessionFile(session, options.source ?? 'session').steps.at(-1)!;
  const shift = 2 ** (result.temperature.shift_cents / 1200);
  const otherReadings = { ...(last.measured_torsion_hz === undefined ? {} : { torsionHz: last.measured_torsion_hz * shift }), ...(last.measured_lateral_hz === undefined ? {} : { lateralHz: last.measured_lateral_hz * shift }) };
  const grainWarnings: string[] = [];
  const grain = Object.keys(otherReadings).length > 0 && wood.material.elasticity?.kind === 'orthotropic' ? fitSolidGrain({ ...now, material: wood.material }, otherReadings) : null;
  if (grain) {
    solves += grain.solves;
    const given = wood.material.elasticity?.kind === 'orthotropic' ? wood.material.elasticity.constants.shearLongitudinalRadial : 1;
    const fitted = grain.material.elasticity?.kind === 'orthotropic' ? grain.material.elasticity.constants.shearLongitudinalRadial : 1;
    wood = { ...wood, material: grain.material, shearScale: (wood.shearScale * fitted) / given };
    const believed = now.material.elasticity?.kind === 'orthotropic' ? now.material.elasticity.grain.ringAngle : 0;
    if (Math.abs(grain.ringAngle - believed) > (20 * Math.PI) / 180)
      grainWarnings.push(
        `the ${otherReadings.torsionHz !== undefined ? 'torsion' : 'sideways'} mode read says the growth rings run at about ${Math.round((grain.ringAngle * 180) / Math.PI)}° to the thickness, where the bar file says ${Math.round((believed * 180) / Math.PI)}°: the solid model uses the fitted grain; correct the bar file if the end grain agrees`,
      );
  }
  // Closing in, the solid model's own sensitivities set the change to first order (SolidSlope).
  const closing = Math.max(...result.now_cents.map(Math.abs)) <= closeInCents;
  const solidSlope = closing ? slopeOf(first.shapes.now, wood.material, result.calibrated_material, tuned) : undefined;
  if (solidSlope) solves++;
  const withSlope = solidSlope ? { solidSlope } : {};
  let gap: number[] = [];
  let perDepth: number[] = [];
  let depthPlanned: number | null = null;
  let replanned = false;
  for (let round = 0; round < maxRounds && result.status === 'cut'; round++) {
    const planned = barModelFromFile(parseBarFile(result.bar_after, 'planned bar'));
    const depth = archDepth(planned);
    if (depth < shallowestDepth) break;
    const young = result.calibrated_material.E_GPa * 1e9;
    const shear = result.calibrated_material.G_GPa * 1e9;
    const line = evaluatePartials(planned, young, shear, tuned, false).cents;
    const solid = solidPartialCents({ ...planned, material: wood.material }, tuned);
    solves++;
    const gapCents = Array.from({ length: tuned }, (_, n) => solid[n]! - line[n]!);
    // The gap grows faster than the depth: what the last prior assumed at this depth, against what the solid model says.
    const assumed = perDepth.length ? perDepth.map((c) => (1200 * c * depth) / Math.LN2) : null;
    if (assumed && gapCents.every((g, n) => Math.abs(g - assumed[n]!) <= settledCents)) break;
    gap = gapCents;
    depthPlanned = depth;
    perDepth = gapCents.map((cents) => (cents * Math.LN2) / 1200 / depth);
    result = planNextCut(session, { ...options, policy, ...withSlope, correctionPrior: perDepth.map((mean) => ({ mean, sigma: solidCorrectionSigma })) }).result;
    replanned = true;
  }
  if (solidSlope && !replanned) result = planNextCut(session, { ...options, policy, solidSlope }).result;
  return {
    ...result,
    warnings: [...result.warnings, ...grainWarnings],
    solid: {
      E_L_GPa: wood.youngLongitudinal / 1e9,
      grain: grain ? { ring_angle_deg: (grain.ringAngle * 180) / Math.PI, residual_hz: grain.residualHz } : null, shear_scale: wood.shearScale, fit_residual_cents: wood.residualCents, arch_depth: depthPlanned, solid_minus_line_cents: gap, correction_per_depth: perDepth, solid_sensitivities: solidSlope !== undefined, solid_solves: solves },
  };
}
