// The next cut with the solid model's word on the shape about to be cut.
import { barModelFromFile, type BarModel } from '../modes/BarModel.ts';
import { analyzeBarModel } from '../modes/analyzeBar.ts';
import { parseBarFile } from '../fileFormats/barFile.ts';
import { archDepth } from './archDepth.ts';
import { evaluatePartials } from './partialModel.ts';
import { nextCut, type NextCutOptions, type NextCutResult } from './nextCut.ts';

/**
 * One-sigma of the solid model's correction prior, per unit arch depth (barwright's own: the
 * solid model with the session's calibrated E and G still carries the wood's unmeasured
 * constants — the transverse moduli and the in-plane shear moduli, tens of percent off any table —
 * which move the line-to-solid gap by about a tenth of itself on the demo bars, 0.5–1 % of
 * frequency per unit depth).
 */
export const solidCorrectionSigma = 0.01;
/** Below this arch depth the gap is too small to tell a correction per unit depth from noise. */
const shallowestDepth = 0.05;
/** Most solid analyses per call: the planned shape moves with the correction, so the correction is taken again on it. */
const maxRounds = 3;
/** The correction has settled when the solid model's gap on the new plan is within this of what the prior assumed there, cents. */
const settledCents = 3;

/** What the solid model said about the shape the first plan would cut. */
export interface SolidCorrectionReport {
  /** The planned shape's arch depth (1 − thinnest/blank). */
  arch_depth: number;
  /** Solid minus line model on that shape, cents per partial (negative: the line model is sharp). */
  solid_minus_line_cents: number[];
  /** The correction prior given to the calibration, fraction of frequency per unit arch depth. */
  correction_per_depth: number[];
  /** Solid analyses it took (the planned shape moves with the correction; up to 3). */
  rounds: number;
}

/** nextCut's result with the solid model's correction, when it was consulted. */
export type SolidNextCutResult = NextCutResult & { solid_correction: SolidCorrectionReport | null };

/** The model with its moduli scaled to the calibration: E along the grain and every shear modulus by the calibrated ratios. */
function calibratedModel(model: BarModel, youngModulus: number, shearModulus: number): BarModel {
  const material = model.material;
  const young = youngModulus / material.youngModulus;
  const shear = shearModulus / material.shearModulus;
  const elasticity = material.elasticity;
  const scaled =
    elasticity?.kind === 'orthotropic'
      ? {
          ...elasticity,
          constants: {
            ...elasticity.constants,
            youngLongitudinal: elasticity.constants.youngLongitudinal * young,
            shearLongitudinalRadial: elasticity.constants.shearLongitudinalRadial * shear,
            shearLongitudinalTangential: elasticity.constants.shearLongitudinalTangential * shear,
            shearRadialTangential: elasticity.constants.shearRadialTangential * shear,
          },
        }
      : elasticity;
  return { ...model, material: { ...material, youngModulus, shearModulus, ...(scaled ? { elasticity: scaled } : {}) } };
}

/**
 * The next cut, with the 1D model's correction taken from the solid model instead of assumed:
 * plan once as nextCut does; analyse the planned shape with the solid model (the session's
 * calibrated E and G, the other constants scaled with them) and with the line model; give the
 * calibration their gap per unit arch depth as the correction's prior (±solidCorrectionSigma);
 * plan again, and again on the new plan while the gap there differs from what the prior assumed by
 * more than 3 cents (the gap grows faster than the depth; at most 3 solid analyses). The
 * measurements still move the correction: the solid model only replaces the guess of zero that a
 * session starts from. About a second per solid analysis;
 * rectangular wooden or metal bars only — others, and bars barely cut, get nextCut's answer.
 */
export function nextCutSolid(session: unknown, options: NextCutOptions = {}): SolidNextCutResult {
  let result = nextCut(session, options);
  let report: SolidCorrectionReport | null = null;
  let analyses = 0;
  for (let round = 0; round < maxRounds && result.status === 'cut'; round++) {
    const planned = barModelFromFile(parseBarFile(result.bar_after, 'planned bar'));
    const depth = archDepth(planned);
    if (planned.section.shape !== 'rect' || depth < shallowestDepth) break;
    const partials = result.target_hz.length;
    const model = calibratedModel(planned, result.calibrated_material.E_GPa * 1e9, result.calibrated_material.G_GPa * 1e9);
    const line = evaluatePartials(model, model.material.youngModulus, model.material.shearModulus, partials, false).cents;
    const solid = analyzeBarModel(model, { theory: 'solid', modes: partials }).bending.map((mode) => 1200 * Math.log2(mode.hz));
    analyses++;
    if (report) report.rounds = analyses;
    const gapCents = Array.from({ length: partials }, (_, n) => solid[n]! - line[n]!);
    // The gap grows faster than the depth: what the last prior assumed at this depth, against what the solid model says.
    const assumed: number[] = report ? report.correction_per_depth.map((c) => (1200 * c * depth) / Math.LN2) : gapCents.map(() => 0);
    const settled = gapCents.every((g, n) => Math.abs(g - assumed[n]!) <= settledCents);
    if (settled && report) break;
    const perDepth = gapCents.map((cents) => (cents * Math.LN2) / 1200 / depth);
    report = { arch_depth: depth, solid_minus_line_cents: gapCents, correction_per_depth: perDepth, rounds: analyses };
    result = nextCut(session, { ...options, correctionPrior: perDepth.map((mean) => ({ mean, sigma: solidCorrectionSigma })) });
  }
  return { ...result, solid_correction: report };
}
