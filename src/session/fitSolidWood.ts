// The real wood, fitted on the solid model: the stiffness along the grain and the shear stiffness
// that make the 3D model of the bar as it is now sound as it was struck.
import type { Material } from '../material/Material.ts';
import { solidMaterialOf } from '../material/solidElasticity.ts';
import type { BarModel } from '../modes/BarModel.ts';
import { solidBendingPartials } from '../modes/solidBendingPartials.ts';

/** The solid model's wood after the fit, and how well it explains the readings. */
export interface SolidWoodFit {
  /** The material with the fitted constants (SI), for every later solid analysis of this bar. */
  readonly material: Material;
  /** Young's modulus along the grain, Pa. */
  readonly youngLongitudinal: number;
  /** Every shear modulus of the wood as a share of what the bar file gives (1: as given). */
  readonly shearScale: number;
  /** The solid model's tuned partials of the bar now with the fitted wood, cents above 1 Hz. */
  readonly cents: number[];
  /** Reading − fitted solid model, cents, per partial read (what the two constants cannot explain). */
  readonly residualCents: number[];
  /** Solid analyses the fit took. */
  readonly solves: number;
}

/** d(cents)/d(ln s) when every modulus is multiplied by s: f ∝ √s exactly, so 1200/(2 ln 2). */
const centsPerLnScale = 1200 / (2 * Math.LN2);
/** Step in ln(shear ratio) for the finite-difference derivative. */
const shearStep = 0.2;
/** One-sigma prior of ln(shear ratio) around the start: ±35 %, the session's prior on G (calibrationPriors). */
const lnShearPriorSigma = 0.35;
/** Weight of each reading, cents: the tuner's ±0.5 with the solid model's own allowance (unmeasured transverse constants, holes), ±2 (barwright's own). */
const readingSigmaCents = Math.hypot(0.5, 2);
/** The fit has settled when a Gauss–Newton step moves ln(shear ratio) by less than this. */
const settledStep = 0.03;
/** Most Gauss–Newton steps (two solid analyses each). */
const maxSteps = 2;

/** A material with every modulus multiplied by `scale` and every shear modulus further by `shearRatio` (isotropic solids: the scale only). */
export function scaledSolidMaterial(material: Material, scale: number, shearRatio: number): Material {
  const choice = solidMaterialOf(material);
  const elasticity = material.elasticity;
  if (choice.kind === 'isotropic') {
    const young = elasticity?.kind === 'isotropic' ? elasticity.youngModulus : material.youngModulus;
    const poisson = elasticity?.kind === 'isotropic' ? elasticity.poisson : material.youngModulus / (2 * material.shearModulus) - 1;
    return {
      ...material,
      youngModulus: material.youngModulus * scale,
      shearModulus: material.shearModulus * scale,
      elasticity: { kind: 'isotropic', youngModulus: young * scale, poisson, assumed: elasticity?.assumed ?? [] },
    };
  }
  const c = choice.constants!;
  const shear = scale * shearRatio;
  return {
    ...material,
    youngModulus: material.youngModulus * scale,
    shearModulus: material.shearModulus * shear,
    elasticity: {
      kind: 'orthotropic',
      grain: elasticity?.kind === 'orthotropic' ? elasticity.grain : { ringAngle: 0 },
      assumed: choice.assumed,
      constants: {
        ...c,
        youngLongitudinal: c.youngLongitudinal * scale,
        youngRadial: c.youngRadial * scale,
        youngTangential: c.youngTangential * scale,
        shearLongitudinalRadial: c.shearLongitudinalRadial * shear,
        shearLongitudinalTangential: c.shearLongitudinalTangential * shear,
        shearRadialTangential: c.shearRadialTangential * shear,
      },
    },
  };
}

/** The solid model's first `partials` vertical bending partials of a shape, cents above 1 Hz. */
export function solidPartialCents(model: BarModel, partials: number): number[] {
  return solidBendingPartials(model, partials).hz.map((hz) => 1200 * Math.log2(hz));
}

/**
 * Fits the wood of a bar on the solid model: two constants, a scale s on every modulus and a ratio
 * q on the shear moduli (the transverse moduli follow E_L, being unmeasured), so that the 3D model
 * of `model` (SI, its material the maker's guess) reproduces `readingCents` (cents above 1 Hz, the
 * partials read, in order; at least one). Method: Gauss–Newton in (ln s, ln q) with q's derivative
 * by a finite difference (one more solid analysis) and s's exact (f ∝ √s), a ±35 % prior on q
 * around `start.shearRatio`, readings weighed alike (±2.1 cents); with one partial read, or an
 * isotropic solid, only s is fitted (q stays at its start). 1–5 solid analyses. `start` is where
 * the search begins: the scale and shear ratio the line model's calibration implies.
 */
export function fitSolidWood(model: BarModel, readingCents: readonly number[], start: { readonly scale: number; readonly shearRatio: number }): SolidWoodFit {
  const read = readingCents.length;
  if (read === 0) throw new Error('internal: fitSolidWood needs at least one reading');
  const isotropic = solidMaterialOf(model.material).kind === 'isotropic';
  const fitsShear = !isotropic && read >= 2;
  const priorShear = Math.log(start.shearRatio);
  let lnScale = Math.log(start.scale);
  let lnShear = priorShear;
  let solves = 0;
  const solve = (ls: number, lq: number): number[] => {
    solves++;
    return solidPartialCents({ ...model, material: scaledSolidMaterial(model.material, Math.exp(ls), Math.exp(lq)) }, read);
  };
  // Exact in ln s: the weighted mean of the misfit over the exact slope.
  const rescale = (cents: readonly number[]): number => readingCents.reduce((sum, m, n) => sum + (m - cents[n]!), 0) / read / centsPerLnScale;
  let cents = solve(lnScale, lnShear);
  if (fitsShear) {
    for (let step = 0; step < maxSteps; step++) {
      const shifted = solve(lnScale, lnShear + shearStep);
      const slope = cents.map((c, n) => (shifted[n]! - c) / shearStep);
      // Normal equations of min Σ (r_n − A·a − J_n·b)²/σ² + ((lnShear + b − prior)/σ_q)² in (a, b).
      const w = 1 / readingSigmaCents ** 2;
      const residual = readingCents.map((m, n) => m - cents[n]!);
      const saa = w * read * centsPerLnScale ** 2;
      const sab = w * centsPerLnScale * slope.reduce((s, j) => s + j, 0);
      const sbb = w * slope.reduce((s, j) => s + j * j, 0) + 1 / lnShearPriorSigma ** 2;
      const ra = w * centsPerLnScale * residual.reduce((s, r) => s + r, 0);
      const rb = w * slope.reduce((s, j, n) => s + j * residual[n]!, 0) - (lnShear - priorShear) / lnShearPriorSigma ** 2;
      const determinant = saa * sbb - sab * sab;
      const b = (saa * rb - sab * ra) / determinant;
      lnShear += b;
      cents = solve(lnScale, lnShear);
      if (Math.abs(b) < settledStep) break;
    }
  }
  const a = rescale(cents);
  lnScale += a;
  cents = cents.map((c) => c + centsPerLnScale * a);
  const scale = Math.exp(lnScale);
  const shearRatio = Math.exp(lnShear);
  const material = scaledSolidMaterial(model.material, scale, shearRatio);
  const constants = material.elasticity?.kind === 'orthotropic' ? material.elasticity.constants : null;
  return {
    material,
    youngLongitudinal: constants ? constants.youngLongitudinal : material.youngModulus,
    shearScale: isotropic ? scale : scale * shearRatio,
    cents,
    residualCents: readingCents.map((m, n) => m - cents[n]!),
    solves,
  };
}
