// The bar file's `material` and `grain` (contract: `*.bar.json`, with the turn-2 additions): the
// modulus along the grain and the density, the shear modulus of the vertical plane or Poisson's
// ratio, optionally the wood's other orthotropic constants, the pitch's temperature coefficient,
// or a preset by name; and how the growth rings run through the thickness.
import { InputError } from './InputError.ts';
import { isMaterialPresetName, materialPresetNames } from './materialPresetNames.ts';
import { isJsonObject as isObject, type JsonObject as Json, positiveNumber } from './jsonFields.ts';

/** The orthotropic constants a wooden bar's material may add (GPa; Poisson ratios ν_ij = −ε_j/ε_i under stress along i). */
export interface OrthotropicConstants {
  E_R_GPa?: number;
  E_T_GPa?: number;
  G_LR_GPa?: number;
  G_LT_GPa?: number;
  G_RT_GPa?: number;
  nu_LR?: number;
  nu_LT?: number;
  nu_RT?: number;
}

/** Names of the orthotropic constants, in file order. */
export const orthotropicConstantNames = ['E_R_GPa', 'E_T_GPa', 'G_LR_GPa', 'G_LT_GPa', 'G_RT_GPa', 'nu_LR', 'nu_LT', 'nu_RT'] as const;

/** Fields every material form may carry. */
interface MaterialCommon {
  shear_coefficient?: number;
  /** How the bar's partials move per °C (cents/°C; wood about −2, common practice). */
  pitch_cents_per_c?: number;
}

/**
 * The bar file's material: explicit values (E_GPa along the grain = E_L, GPa; kg/m³), optionally
 * with the orthotropic constants of wood; or a preset name.
 */
export type BarFileMaterial =
  | ({
      E_GPa: number;
      density_kg_m3: number;
      G_GPa?: number;
      poisson?: number;
    } & OrthotropicConstants &
      MaterialCommon)
  | ({ preset: string } & MaterialCommon);

/**
 * How the growth rings run through the bar's thickness: `radial` (quarter-sawn: the radial
 * direction R is through the thickness), `tangential` (flat-sawn: T through the thickness), or the
 * rings' angle to the thickness direction in degrees (0 = radial, 90 = tangential). Default radial.
 */
export type BarFileGrain = { through_thickness: 'radial' | 'tangential' } | { ring_angle_deg: number };

function parseShearCoefficient(source: string, value: unknown): number | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0 || value > 1)
    throw new InputError(source, 'material.shear_coefficient', `must be a number greater than 0 and at most 1 (got ${JSON.stringify(value)})`);
  return value;
}

function parsePoisson(source: string, field: string, value: unknown, low: number, high: number): number | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= low || value >= high)
    throw new InputError(source, field, `must be a number between ${low} and ${high} (got ${JSON.stringify(value)})`);
  return value;
}

/** Largest |pitch coefficient| accepted, cents/°C: wood about −2 (common practice), so ±20 is far outside any real bar. */
const pitchCoefficientLimit = 20;

function parseCommon(source: string, value: Json): MaterialCommon {
  const common: MaterialCommon = {};
  const shear = parseShearCoefficient(source, value.shear_coefficient);
  if (shear !== undefined) common.shear_coefficient = shear;
  if (value.pitch_cents_per_c !== undefined) {
    const c = value.pitch_cents_per_c;
    if (typeof c !== 'number' || !Number.isFinite(c) || Math.abs(c) > pitchCoefficientLimit)
      throw new InputError(source, 'material.pitch_cents_per_c', `must be a number of cents per °C between −${pitchCoefficientLimit} and ${pitchCoefficientLimit} (got ${JSON.stringify(c)})`);
    common.pitch_cents_per_c = c;
  }
  return common;
}

/**
 * Which rule of positive definiteness orthotropic constants break, as the field and the rule, or
 * null: for each pair, ν_ij² < E_i/E_j, and 1 − ν_LR ν_RL − ν_LT ν_TL − ν_RT ν_TR − 2 ν_LR ν_RT ν_TL > 0
 * with ν_ji = ν_ij E_j/E_i (Lekhnitskii; Jones, Mechanics of Composite Materials, 2nd ed., §2.4).
 * Only the constants present are checked: the bar file checks what it gives, the solid model
 * the full set after completing it from ratio tables (resolveWoodConstants).
 */
export function complianceViolation(E_L: number, constants: OrthotropicConstants): { field: string; rule: string } | null {
  const E = { L: E_L, R: constants.E_R_GPa, T: constants.E_T_GPa };
  const pairs = [
    ['nu_LR', 'L', 'R'],
    ['nu_LT', 'L', 'T'],
    ['nu_RT', 'R', 'T'],
  ] as const;
  for (const [name, i, j] of pairs) {
    const nu = constants[name];
    const Ei = E[i];
    const Ej = E[j];
    if (nu === undefined || Ei === undefined || Ej === undefined) continue;
    if (nu * nu >= Ei / Ej) return { field: `material.${name}`, rule: `${nu} makes the compliance not positive definite: ${name}² must be below E_${i}/E_${j} = ${(Ei / Ej).toFixed(3)}` };
  }
  const { nu_LR, nu_LT, nu_RT } = constants;
  if (E.R !== undefined && E.T !== undefined && nu_LR !== undefined && nu_LT !== undefined && nu_RT !== undefined) {
    const nu_RL = (nu_LR * E.R) / E.L;
    const nu_TL = (nu_LT * E.T) / E.L;
    const nu_TR = (nu_RT * E.T) / E.R;
    const determinant = 1 - nu_LR * nu_RL - nu_LT * nu_TL - nu_RT * nu_TR - 2 * nu_LR * nu_RT * nu_TL;
    if (!(determinant > 0))
      return {
        field: 'material.nu_RT',
        rule: `the Poisson ratios nu_LR ${nu_LR}, nu_LT ${nu_LT}, nu_RT ${nu_RT} make the compliance not positive definite (1 − Σν_ijν_ji − 2ν_LRν_RTν_TL = ${determinant.toFixed(4)} must be > 0)`,
      };
  }
  return null;
}

function checkCompliance(source: string, E_L: number, constants: OrthotropicConstants): void {
  const violation = complianceViolation(E_L, constants);
  if (violation) throw new InputError(source, violation.field, violation.rule);
}

/** The ring angle (degrees from the thickness direction: 0 radial, 90 tangential) of a grain description. */
export function ringAngleDegrees(grain: BarFileGrain | undefined): number {
  if (!grain) return 0;
  if ('ring_angle_deg' in grain) return grain.ring_angle_deg;
  return grain.through_thickness === 'radial' ? 0 : 90;
}

/**
 * Shear modulus (GPa) of the bar's vertical plane (length × thickness) for rings at angle θ to the
 * thickness direction: 1/G = cos²θ/G_LR + sin²θ/G_LT (rotation of the orthotropic compliance about
 * the grain axis L; Lekhnitskii, Anisotropic Plates, §1.5). θ = 0 gives G_LR, 90° gives G_LT.
 */
export function verticalShearModulusGPa(G_LR: number, G_LT: number, ringAngleDeg: number): number {
  const angle = (ringAngleDeg * Math.PI) / 180;
  return 1 / (Math.cos(angle) ** 2 / G_LR + Math.sin(angle) ** 2 / G_LT);
}

/** Relative disagreement allowed between G_GPa and the vertical-plane modulus from G_LR/G_LT. */
const shearAgreement = 5e-3;

/** Validates the bar file's `material` (see BarFileMaterial); `grain` is the bar's, for the G_GPa check. */
export function parseBarFileMaterial(source: string, value: unknown, grain: BarFileGrain | undefined): BarFileMaterial {
  if (!isObject(value)) throw new InputError(source, 'material', 'must be an object with E_GPa and density_kg_m3, or a preset');
  const common = parseCommon(source, value);
  if (value.preset !== undefined) {
    if (!isMaterialPresetName(value.preset))
      throw new InputError(source, 'material.preset', `unknown preset ${JSON.stringify(value.preset)} (known: ${materialPresetNames.join(', ')})`);
    return { preset: value.preset, ...common };
  }
  const E_GPa = positiveNumber(source, 'material.E_GPa', value.E_GPa, 'GPa');
  const material: BarFileMaterial = { E_GPa, density_kg_m3: positiveNumber(source, 'material.density_kg_m3', value.density_kg_m3, 'kg/m³') };
  if (value.G_GPa !== undefined) material.G_GPa = positiveNumber(source, 'material.G_GPa', value.G_GPa, 'GPa');
  const poisson = parsePoisson(source, 'material.poisson', value.poisson, -1, 0.5);
  if (poisson !== undefined) material.poisson = poisson;
  const constants: OrthotropicConstants = {};
  for (const name of orthotropicConstantNames) {
    const item = value[name];
    if (item === undefined) continue;
    constants[name] = name.startsWith('nu_') ? parsePoisson(source, `material.${name}`, item, -1, 1.5)! : positiveNumber(source, `material.${name}`, item, 'GPa');
  }
  checkCompliance(source, E_GPa, constants);
  if (material.G_GPa !== undefined && constants.G_LR_GPa !== undefined && constants.G_LT_GPa !== undefined) {
    const angle = ringAngleDegrees(grain);
    const vertical = verticalShearModulusGPa(constants.G_LR_GPa, constants.G_LT_GPa, angle);
    if (Math.abs(material.G_GPa - vertical) > shearAgreement * vertical)
      throw new InputError(source, 'material.G_GPa', `${material.G_GPa} GPa must equal the vertical plane's shear modulus for rings at ${angle}° to the thickness (${vertical.toFixed(3)} GPa from G_LR_GPa and G_LT_GPa), or be left out`);
  }
  return { ...material, ...constants, ...common };
}

/** Validates the bar file's `grain` (see BarFileGrain). */
export function parseBarFileGrain(source: string, value: unknown): BarFileGrain | undefined {
  if (value === undefined) return undefined;
  const rule = 'must be { "through_thickness": "radial" } (quarter-sawn), { "through_thickness": "tangential" } (flat-sawn) or { "ring_angle_deg": 0…90 }';
  if (!isObject(value)) throw new InputError(source, 'grain', rule);
  if (value.through_thickness !== undefined) {
    if (value.through_thickness !== 'radial' && value.through_thickness !== 'tangential')
      throw new InputError(source, 'grain.through_thickness', `must be "radial" (quarter-sawn) or "tangential" (flat-sawn), got ${JSON.stringify(value.through_thickness)}`);
    return { through_thickness: value.through_thickness };
  }
  if (value.ring_angle_deg !== undefined) {
    const angle = value.ring_angle_deg;
    if (typeof angle !== 'number' || !Number.isFinite(angle) || angle < 0 || angle > 90)
      throw new InputError(source, 'grain.ring_angle_deg', `must be an angle from 0 (radial through the thickness) to 90 degrees (tangential), got ${JSON.stringify(angle)}`);
    return { ring_angle_deg: angle };
  }
  throw new InputError(source, 'grain', rule);
}
