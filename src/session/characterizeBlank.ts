import { gram } from '../units/units.ts';
import { InputError } from '../fileFormats/InputError.ts';
import type { BarFile } from '../fileFormats/barFile.ts';
import { barModelFromFile, type BarModel } from '../modes/BarModel.ts';
import { fitModuli, type FitShape, type LinearPrior } from './fitModuli.ts';
import { hzToAbsoluteCents } from './partialModel.ts';
import { defaultMeasurementUncertaintyCents } from '../fileFormats/sessionFile.ts';

/** What a blank characterisation needs: the blank, its tapped partials, optionally its mass. */
export interface CharacterizeInput {
  /** The blank as measured (any section; a uniform rect blank is the usual case). */
  readonly bar: BarFile;
  /** Tapped vertical-bending partials, Hz, ascending (1 = fundamental). Two or more fix E and G. */
  readonly measuredHz: readonly number[];
  /** Mass of the blank, grams: sets the density (mass / volume); otherwise the bar file's density. */
  readonly massGrams?: number;
  /** One-sigma uncertainty of each partial, cents (default 0.5). */
  readonly uncertaintyCents?: number;
  /** One-sigma uncertainty of the caliper and scale readings (defaults in `defaultMeasurementPrecision`). */
  readonly precision?: Partial<MeasurementPrecision>;
}

/** One-sigma precision of the blank's measured dimensions (mm) and mass (g). */
export interface MeasurementPrecision {
  length_mm: number;
  width_mm: number;
  thickness_mm: number;
  mass_g: number;
}

/**
 * Default precision of a maker's readings: steel rule ±0.5 mm on the length, caliper ±0.05 mm on
 * width and thickness, kitchen or bench scale ±0.5 g (common practice).
 */
export const defaultMeasurementPrecision: MeasurementPrecision = { length_mm: 0.5, width_mm: 0.05, thickness_mm: 0.05, mass_g: 0.5 };

/** The characterisation's result (contract units: GPa, kg/m³, Hz, cents). JSON-serialisable. */
export interface BlankCharacterization {
  material: { E_GPa: number; G_GPa: number; density_kg_m3: number };
  /** One-sigma uncertainties: from the partials' cents uncertainty and, with `total`, also the dimensions and mass. */
  uncertainty: {
    from_partials: { E_GPa: number; G_GPa: number };
    total: { E_GPa: number; G_GPa: number };
  };
  E_over_G: number;
  density_from: 'mass' | 'bar file';
  measured_hz: number[];
  fitted_hz: number[];
  residual_cents: number[];
  /** False when the partials do not fit one material (see warnings). */
  consistent: boolean;
  warnings: string[];
  /** The bar file with the characterised material (ready for design or a session). */
  bar: BarFile;
}

/** Range of E/G the inversion may use: from 1.2 (stiffer in shear than any isotropic solid needs) to 100. */
const ratioRange: readonly [number, number] = [Math.log(1.2), Math.log(100)];
/** Plausible E/G for bar materials: metals about 2.6, hardwoods along the grain 9–25 (reference-values.md, Wood Handbook ratios, from memory). */
const plausibleRatio = [2, 40] as const;
/** Plausible E along the bar for any bar material, GPa (soft woods ~5, steels ~210). */
const plausibleYoungGPa = [1, 450] as const;
/**
 * 1D-model allowance on a uniform blank, cents (one sigma): Timoshenko agrees with a converged 2D
 * model within 0.25 % (≈ 4 cents) on a uniform bar (brief.md): taken as about a 2.5-sigma bound.
 */
export const uniformModelAllowanceCents = 1.7;
/** A partial is inconsistent when its residual exceeds this many sigmas and `inconsistentFloorCents`. */
const inconsistentSigmas = 4;
const inconsistentFloorCents = 5;

function blankVolume(model: BarModel): number {
  const section = model.section;
  if (section.shape === 'round') return Math.PI * (section.diameter / 2) ** 2 * model.length;
  if (section.shape === 'tube') return Math.PI * ((section.outerDiameter / 2) ** 2 - (section.outerDiameter / 2 - section.wall) ** 2) * model.length;
  const { positions, thicknesses } = model.profile;
  let area = 0;
  for (let k = 0; k + 1 < positions.length; k++) area += 0.5 * (thicknesses[k]! + thicknesses[k + 1]!) * (positions[k + 1]! - positions[k]!);
  return area * section.width;
}

function checkInput(input: CharacterizeInput): void {
  const hz = input.measuredHz;
  if (hz.length < 1) throw new InputError('characterize', 'partials', 'give at least one measured partial (two or more to find the shear modulus)');
  hz.forEach((f, i) => {
    if (!Number.isFinite(f) || f <= 0) throw new InputError('characterize', `partials[${i}]`, `must be a frequency above 0 Hz (got ${f})`);
    if (i > 0 && f <= hz[i - 1]!) throw new InputError('characterize', `partials[${i}]`, `${f} Hz is not above partial ${i}'s ${hz[i - 1]} Hz: list the partials in ascending order (swapped?)`);
  });
  if (input.massGrams !== undefined && (!Number.isFinite(input.massGrams) || input.massGrams <= 0)) throw new InputError('characterize', 'mass_g', `must be greater than 0 g (got ${input.massGrams})`);
  if (input.uncertaintyCents !== undefined && !(input.uncertaintyCents > 0 && input.uncertaintyCents <= 50)) throw new InputError('characterize', 'uncertainty_cents', 'must be greater than 0 and at most 50 cents');
}

interface Inversion {
  lnE: number;
  lnG: number;
  density: number;
  covariance: number[][];
  fittedCents: Float64Array;
  residualCents: number[];
  ratioAtBound: boolean;
}

function invert(bar: BarFile, measuredHz: readonly number[], massGrams: number | undefined, sigmaCents: number): Inversion {
  const base = barModelFromFile(bar);
  const density = massGrams === undefined ? base.material.density : (massGrams * gram) / blankVolume(base);
  const model: BarModel = { ...base, material: { ...base.material, density: density } };
  const guessRatio = Math.log(base.material.youngModulus / base.material.shearModulus);
  const sigma = Math.hypot(sigmaCents, measuredHz.length > 1 ? uniformModelAllowanceCents : 0);
  const shape: FitShape = { model, measuredCents: Array.from(hzToAbsoluteCents(measuredHz)), sigmaCents: measuredHz.map(() => sigma) };
  // One partial cannot separate E from G: hold E/G at the bar file's ratio.
  const priors: LinearPrior[] = measuredHz.length === 1 ? [{ coefficients: [1, -1], mean: guessRatio, sigma: 1e-6 }] : [];
  const start = [Math.log(model.material.youngModulus), Math.log(model.material.youngModulus) - Math.min(ratioRange[1], Math.max(ratioRange[0], guessRatio))];
  const fit = fitModuli({ shapes: [shape], corrections: 0, priors, start, lnRatioRange: ratioRange });
  return {
    lnE: fit.parameters[0]!,
    lnG: fit.parameters[1]!,
    density,
    covariance: fit.covariance,
    fittedCents: fit.fittedCents[0]!,
    residualCents: fit.residualCents[0]!.map((r) => r ?? 0),
    ratioAtBound: fit.ratioAtBound,
  };
}

function perturbedBar(bar: BarFile, field: 'length' | 'width' | 'thickness', deltaMm: number): BarFile {
  const copy = structuredClone(bar);
  if (field === 'length') {
    const scale = (copy.length_mm + deltaMm) / copy.length_mm;
    copy.length_mm += deltaMm;
    if (copy.profile_mm) copy.profile_mm = copy.profile_mm.map(([x, t]) => [x * scale, t]);
  } else if (copy.section.shape === 'rect') {
    if (field === 'width') copy.section.width_mm += deltaMm;
    else {
      const scale = (copy.section.thickness_mm + deltaMm) / copy.section.thickness_mm;
      copy.section.thickness_mm += deltaMm;
      if (copy.profile_mm) copy.profile_mm = copy.profile_mm.map(([x, t]) => [x, t * scale]);
    }
  } else if (copy.section.shape === 'round') copy.section.diameter_mm += field === 'thickness' ? deltaMm : 0;
  else if (field === 'thickness') copy.section.outer_diameter_mm += deltaMm;
  return copy;
}

/**
 * Characterises a blank from its dimensions, its mass (density) and its tapped partials: a
 * Timoshenko inversion by Gauss–Newton on the cents of each partial. f1 sets E/ρ (nearly alone);
 * f2/f1 sets E/G through the shear softening; further partials over-determine the fit and test
 * it. Uncertainty: linearised covariance from the partials' cents uncertainty (plus the 1D-model
 * allowance on a uniform bar), widened by √(χ²/dof) when three or more partials scatter more than
 * that, and a total that adds the dimension and mass readings propagated by
 * re-running the inversion with each reading moved by its one-sigma precision. Warnings when the
 * partials do not fit one material, when f2/f1 is beyond what any shear modulus gives, or when
 * the material found is implausible. Pure and synchronous (a few dozen solves).
 */
export function characterizeBlank(input: CharacterizeInput): BlankCharacterization {
  checkInput(input);
  const sigmaCents = input.uncertaintyCents ?? defaultMeasurementUncertaintyCents;
  const precision = { ...defaultMeasurementPrecision, ...input.precision };
  const result = invert(input.bar, input.measuredHz, input.massGrams, sigmaCents);
  const E = Math.exp(result.lnE);
  const G = Math.exp(result.lnG);
  const twoPartials = input.measuredHz.length > 1;
  // With more partials than moduli the residuals show how well the partials really agree: when they
  // scatter more than assumed, the uncertainty widens by √(χ²/dof) (never narrows).
  const sigmaAssumed = Math.hypot(sigmaCents, uniformModelAllowanceCents);
  const freedom = input.measuredHz.length - 2;
  const chiSquare = result.residualCents.reduce((sum, r) => sum + (r / sigmaAssumed) ** 2, 0);
  const spread = freedom > 0 ? Math.max(1, chiSquare / freedom) : 1;
  const partialVarianceE = result.covariance[0]![0]! * E * E * spread;
  const partialVarianceG = twoPartials ? result.covariance[1]![1]! * G * G * spread : 0;
  // Dimensions and mass: one re-inversion per reading, moved by its one-sigma precision.
  let varianceE = partialVarianceE;
  let varianceG = partialVarianceG;
  const readings: [BarFile, number | undefined][] = [
    [perturbedBar(input.bar, 'length', precision.length_mm), input.massGrams],
    [perturbedBar(input.bar, 'thickness', precision.thickness_mm), input.massGrams],
  ];
  if (input.bar.section.shape === 'rect' && input.massGrams !== undefined) readings.push([perturbedBar(input.bar, 'width', precision.width_mm), input.massGrams]);
  if (input.massGrams !== undefined) readings.push([input.bar, input.massGrams + precision.mass_g]);
  for (const [bar, mass] of readings) {
    const moved = invert(bar, input.measuredHz, mass, sigmaCents);
    varianceE += (Math.exp(moved.lnE) - E) ** 2;
    if (twoPartials) varianceG += (Math.exp(moved.lnG) - G) ** 2;
  }
  const warnings: string[] = [];
  let consistent = true;
  const sigmaTotal = sigmaAssumed;
  if (result.ratioAtBound) {
    consistent = false;
    const ratio = input.measuredHz[1]! / input.measuredHz[0]!;
    warnings.push(
      E / G <= Math.exp(ratioRange[0]) * 1.0001
        ? `f2/f1 = ${ratio.toFixed(4)} is above what any shear modulus gives this blank: is partial 2 really the second vertical bending mode (not a torsion or side-to-side mode), and are the dimensions right?`
        : `f2/f1 = ${ratio.toFixed(4)} is so low that E/G would exceed ${Math.exp(ratioRange[1]).toFixed(0)}: a crack, a misread partial, or a partial missed in between?`,
    );
  }
  if (input.measuredHz.length > 2) {
    const worst = result.residualCents.reduce((best, residual, n) => (Math.abs(residual) > Math.abs(result.residualCents[best]!) ? n : best), 0);
    if (Math.abs(result.residualCents[worst]!) > Math.max(inconsistentSigmas * sigmaTotal, inconsistentFloorCents)) {
      consistent = false;
      const list = result.residualCents.map((r) => `${r >= 0 ? '+' : ''}${r.toFixed(1)}`).join(', ');
      warnings.push(
        `the partials do not fit one material: residuals ${list} cents (largest at partial ${worst + 1}, ${input.measuredHz[worst]!.toFixed(2)} Hz). A misread partial, a torsion or side-to-side mode taken for a bending one, a crack, or wrong dimensions? With ${input.measuredHz.length} partials and two moduli the fit cannot say which partial is wrong: re-tap.`,
      );
    }
  }
  const ratio = E / G;
  if (twoPartials && !result.ratioAtBound && (ratio < plausibleRatio[0] || ratio > plausibleRatio[1]))
    warnings.push(`E/G = ${ratio.toFixed(1)} is outside the ${plausibleRatio[0]}–${plausibleRatio[1]} usual for bar materials (metals ≈ 2.6, hardwoods 9–25): check the partials and dimensions`);
  if (E / 1e9 < plausibleYoungGPa[0] || E / 1e9 > plausibleYoungGPa[1]) warnings.push(`E = ${(E / 1e9).toFixed(2)} GPa is outside ${plausibleYoungGPa[0]}–${plausibleYoungGPa[1]} GPa: check the dimensions, mass and fundamental`);
  const fileDensity = barModelFromFile(input.bar).material.density;
  if (input.massGrams !== undefined && Math.abs(result.density / fileDensity - 1) > 0.25)
    warnings.push(`the density from the mass (${result.density.toFixed(0)} kg/m³) is ${(100 * (result.density / fileDensity - 1)).toFixed(0)} % from the bar file's ${fileDensity.toFixed(0)} kg/m³: check the mass and dimensions`);
  if (!twoPartials) warnings.push('only one partial: E found with E/G held at the bar file’s ratio; tap the second partial to find G');
  const material = { E_GPa: E / 1e9, G_GPa: G / 1e9, density_kg_m3: result.density };
  const original = input.bar.material;
  const extras: { poisson: number; shear_coefficient?: number } = { poisson: barModelFromFile(input.bar).material.poisson };
  if (original.shear_coefficient !== undefined) extras.shear_coefficient = original.shear_coefficient;
  return {
    material,
    uncertainty: {
      from_partials: { E_GPa: Math.sqrt(partialVarianceE) / 1e9, G_GPa: Math.sqrt(partialVarianceG) / 1e9 },
      total: { E_GPa: Math.sqrt(varianceE) / 1e9, G_GPa: Math.sqrt(varianceG) / 1e9 },
    },
    E_over_G: ratio,
    density_from: input.massGrams === undefined ? 'bar file' : 'mass',
    measured_hz: [...input.measuredHz],
    fitted_hz: Array.from(result.fittedCents.subarray(0, input.measuredHz.length), (c) => 2 ** (c / 1200)),
    residual_cents: result.residualCents,
    consistent,
    warnings,
    bar: { ...structuredClone(input.bar), material: { ...material, ...extras } },
  };
}
