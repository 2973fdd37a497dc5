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
  /** Every shear modulus of the wood as a share of what the bar file gives (1: as given; metal: as E). */
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
/** Step in ln b for the finite-difference derivative of the shear column. */
const shearStep = 0.2;
/** One-sigma prior of ln b around its start: ±35 %, the session's prior on G (calibrationPriors). */
const lnShearPriorSigma = 0.35;
/** Weight of each reading, cents: the tuner's ±0.5 with the solid model's own allowance (unmeasured transverse constants, holes), ±2 (barwright's own). */
const readingSigmaCents = Math.hypot(0.5, 2);
/** The fit has settled when a Gauss–Newton step moves ln a and ln b by less than this (0.5 %: a cent or so on the partials). */
const settledStep = 0.005;
/** Most Gauss–Newton steps (two solid analyses each). */
const maxSteps = 3;

/**
 * A material with Young's modulus along the grain multiplied by `young` and every shear modulus by
 * `shear` (the transverse Young's moduli and Poisson's ratios as given: bending barely hears them).
 * An isotropic solid scales as a whole by `young` (its shear modulus follows at a fixed ν).
 */
export function scaledSolidMaterial(material: Material, young: number, shear: number): Material {
  const choice = solidMaterialOf(material);
  const elasticity = material.elasticity;
  if (choice.kind === 'isotropic') {
    const modulus = elasticity?.kind === 'isotropic' ? elasticity.youngModulus : material.youngModulus;
    const poisson = elasticity?.kind === 'isotropic' ? elasticity.poisson : material.youngModulus / (2 * material.shearModulus) - 1;
    return {
      ...material,
      youngModulus: material.youngModulus * young,
      shearModulus: material.shearModulus * young,
      elasticity: { kind: 'isotropic', youngModulus: modulus * young, poisson, assumed: elasticity?.assumed ?? [] },
    };
  }
  const c = choice.constants!;
  return {
    ...material,
    youngModulus: material.youngModulus * young,
    shearModulus: material.shearModulus * shear,
    elasticity: {
      kind: 'orthotropic',
      grain: elasticity?.kind === 'orthotropic' ? elasticity.grain : { ringAngle: 0 },
      assumed: choice.assumed,
      constants: {
        ...c,
        youngLongitudinal: c.youngLongitudinal * young,
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
 * Fits the wood of a bar on the solid model: E along the grain (× a) and the shear moduli (× b)
 * of the bar file's wood, so that the 3D model of `model` (SI, its material the maker's guess)
 * reproduces `readingCents` (cents above 1 Hz, the partials read, in order; at least one). Method:
 * Gauss–Newton in (ln a, ln b) from `start`, the shear column by a finite difference (one more
 * solid analysis per step) and the E column from it: scaling every modulus by s moves every
 * partial by exactly (1200/(2 ln 2))·ln s cents, and the transverse moduli barely move bending, so
 * ∂c/∂ln a ≈ 1200/(2 ln 2) − ∂c/∂ln b. A ±35 % prior on b around its start; readings weighed
 * alike (±2.1 cents). With one partial read, or an isotropic solid, only a is fitted (b = a for
 * metal, which scales as a whole). Up to 3 steps; 1–7 solid analyses.
 */
export function fitSolidWood(model: BarModel, readingCents: readonly number[], start: { readonly young: number; readonly shear: number }): SolidWoodFit {
  const read = readingCents.length;
  if (read === 0) throw new Error('internal: fitSolidWood needs at least one reading');
  const isotropic = solidMaterialOf(model.material).kind === 'isotropic';
  const fitsShear = !isotropic && read >= 2;
  const priorShear = Math.log(start.shear);
  let lnYoung = Math.log(start.young);
  let lnShear = isotropic ? lnYoung : priorShear;
  let solves = 0;
  const solve = (): number[] => {
    solves++;
    return solidPartialCents({ ...model, material: scaledSolidMaterial(model.material, Math.exp(lnYoung), Math.exp(lnShear)) }, read);
  };
  let cents = solve();
  const w = 1 / readingSigmaCents ** 2;
  for (let step = 0; step < maxSteps; step++) {
    const residual = readingCents.map((m, n) => m - cents[n]!);
    if (!fitsShear) {
      // Only the overall stiffness: exact for metal (f ∝ √E at fixed ν), first order for wood.
      const a = residual.reduce((sum, r) => sum + r, 0) / read / centsPerLnScale;
      lnYoung += a;
      if (isotropic) {
        lnShear = lnYoung;
        cents = cents.map((c) => c + centsPerLnScale * a);
        break;
      }
      cents = solve();
      if (Math.abs(a) < settledStep) break;
      continue;
    }
    lnShear += shearStep;
    const shifted = solve();
    lnShear -= shearStep;
    const shearSlope = cents.map((c, n) => (shifted[n]! - c) / shearStep);
    const youngSlope = shearSlope.map((j) => centsPerLnScale - j);
    // Normal equations of min Σ (r_n − A_n·a − J_n·b)²/σ² + ((lnShear + b − prior)/σ_b)².
    const saa = w * youngSlope.reduce((sum, j) => sum + j * j, 0);
    const sab = w * youngSlope.reduce((sum, j, n) => sum + j * shearSlope[n]!, 0);
    const sbb = w * shearSlope.reduce((sum, j) => sum + j * j, 0) + 1 / lnShearPriorSigma ** 2;
    const ra = w * youngSlope.reduce((sum, j, n) => sum + j * residual[n]!, 0);
    const rb = w * shearSlope.reduce((sum, j, n) => sum + j * residual[n]!, 0) - (lnShear - priorShear) / lnShearPriorSigma ** 2;
    const determinant = saa * sbb - sab * sab;
    const a = (sbb * ra - sab * rb) / determinant;
    const b = (saa * rb - sab * ra) / determinant;
    lnYoung += a;
    lnShear += b;
    cents = solve();
    if (Math.abs(a) < settledStep && Math.abs(b) < settledStep) break;
  }
  const material = scaledSolidMaterial(model.material, Math.exp(lnYoung), Math.exp(lnShear));
  const constants = material.elasticity?.kind === 'orthotropic' ? material.elasticity.constants : null;
  return {
    material,
    youngLongitudinal: constants ? constants.youngLongitudinal : material.youngModulus,
    shearScale: Math.exp(lnShear),
    cents,
    residualCents: readingCents.map((m, n) => m - cents[n]!),
    solves,
  };
}
