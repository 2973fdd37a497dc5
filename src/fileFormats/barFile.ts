import { InputError } from './InputError.ts';
import { isMaterialPresetName, materialPresetNames } from './materialPresetNames.ts';
import { resolveWoodConstants, woodConstantFields, type BarFileGrain, type WoodConstantField } from './woodConstants.ts';

/** The bar file's section, in millimetres (contract: `*.bar.json`). */
export type BarFileSection =
  | { shape: 'rect'; width_mm: number; thickness_mm: number }
  | { shape: 'tube'; outer_diameter_mm: number; wall_mm: number }
  | { shape: 'round'; diameter_mm: number };

/**
 * The bar file's material: explicit values (GPa, kg/m³) or a preset name. For wood, the optional
 * orthotropic constants (`E_R_GPa` … `nu_RT`, see woodConstants.ts); `pitch_cents_per_c`: how
 * the partials move per °C (checked here, used by the temperature features).
 */
export type BarFileMaterial =
  | ({
      E_GPa: number;
      density_kg_m3: number;
      G_GPa?: number;
      poisson?: number;
      shear_coefficient?: number;
      pitch_cents_per_c?: number;
    } & Partial<Record<WoodConstantField, number>>)
  | { preset: string; shear_coefficient?: number; pitch_cents_per_c?: number };

/** A bar file (`*.bar.json`, format `barwright.bar` version 1), exactly as the contract gives it. */
export interface BarFile {
  format?: 'barwright.bar';
  version?: 1;
  label?: string;
  length_mm: number;
  section: BarFileSection;
  /** `[position_mm, thickness_mm]` pairs, rect only; absent means a uniform blank. */
  profile_mm?: [number, number][];
  material: BarFileMaterial;
  /** How the growth rings run through the section (default radial through the thickness). */
  grain?: BarFileGrain;
}

export type { BarFileGrain } from './woodConstants.ts';

type Json = Record<string, unknown>;

function isObject(value: unknown): value is Json {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function positiveNumber(source: string, field: string, value: unknown, unit: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new InputError(source, field, `must be a number${unit ? ` in ${unit}` : ''}`);
  if (value <= 0) throw new InputError(source, field, `must be greater than 0${unit ? ` ${unit}` : ''} (got ${value})`);
  return value;
}

function parseSection(source: string, value: unknown): BarFileSection {
  if (!isObject(value)) throw new InputError(source, 'section', 'must be an object with a "shape" of rect, tube or round');
  switch (value.shape) {
    case 'rect':
      return {
        shape: 'rect',
        width_mm: positiveNumber(source, 'section.width_mm', value.width_mm, 'mm'),
        thickness_mm: positiveNumber(source, 'section.thickness_mm', value.thickness_mm, 'mm'),
      };
    case 'tube': {
      const outer = positiveNumber(source, 'section.outer_diameter_mm', value.outer_diameter_mm, 'mm');
      const wall = positiveNumber(source, 'section.wall_mm', value.wall_mm, 'mm');
      if (2 * wall >= outer) throw new InputError(source, 'section.wall_mm', `wall ${wall} mm must be less than half the outer diameter (${outer / 2} mm)`);
      return { shape: 'tube', outer_diameter_mm: outer, wall_mm: wall };
    }
    case 'round':
      return { shape: 'round', diameter_mm: positiveNumber(source, 'section.diameter_mm', value.diameter_mm, 'mm') };
    default:
      throw new InputError(source, 'section.shape', `must be "rect", "tube" or "round" (got ${JSON.stringify(value.shape)})`);
  }
}

function parseShearCoefficient(source: string, value: unknown): number | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0 || value > 1)
    throw new InputError(source, 'material.shear_coefficient', `must be a number greater than 0 and at most 1 (got ${JSON.stringify(value)})`);
  return value;
}

function parsePoisson(source: string, value: unknown): number | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= -1 || value >= 0.5)
    throw new InputError(source, 'material.poisson', `must be a number between -1 and 0.5 (got ${JSON.stringify(value)})`);
  return value;
}

function parsePitchPerDegree(source: string, value: unknown): number | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'number' || !Number.isFinite(value) || Math.abs(value) > 50)
    throw new InputError(source, 'material.pitch_cents_per_c', `must be a number of cents per °C between -50 and 50 (got ${JSON.stringify(value)})`);
  return value;
}

/** The grain orientation: `{ "through_thickness": "radial" | "tangential" }` or `{ "ring_angle_deg": 0 … 90 }`. */
function parseGrain(source: string, value: unknown): BarFileGrain {
  if (!isObject(value)) throw new InputError(source, 'grain', 'must be an object with "through_thickness" ("radial" or "tangential") or "ring_angle_deg"');
  const hasThrough = value.through_thickness !== undefined;
  const hasAngle = value.ring_angle_deg !== undefined;
  if (hasThrough === hasAngle) throw new InputError(source, 'grain', 'give exactly one of "through_thickness" ("radial" or "tangential") and "ring_angle_deg"');
  if (hasThrough) {
    if (value.through_thickness !== 'radial' && value.through_thickness !== 'tangential')
      throw new InputError(source, 'grain.through_thickness', `must be "radial" or "tangential" (got ${JSON.stringify(value.through_thickness)})`);
    return { through_thickness: value.through_thickness };
  }
  const angle = value.ring_angle_deg;
  if (typeof angle !== 'number' || !Number.isFinite(angle) || angle < 0 || angle > 90)
    throw new InputError(source, 'grain.ring_angle_deg', `must be the growth rings' angle to the thickness direction, from 0 to 90 degrees (got ${JSON.stringify(angle)})`);
  return { ring_angle_deg: angle };
}

/** True when an explicit material is wood for the solid model: orthotropic constants or a grain given, or E/G above 3 (an isotropic solid has E/G = 2(1 + ν) < 3). */
export function isWoodMaterial(material: BarFileMaterial, grain: BarFileGrain | undefined): boolean {
  if ('preset' in material) return false;
  if (grain !== undefined || woodConstantFields.some((field) => material[field] !== undefined)) return true;
  return material.G_GPa !== undefined && material.E_GPa / material.G_GPa > 3;
}

function parseMaterial(source: string, value: unknown, grain: BarFileGrain | undefined): BarFileMaterial {
  if (!isObject(value)) throw new InputError(source, 'material', 'must be an object with E_GPa and density_kg_m3, or a preset');
  const shear_coefficient = parseShearCoefficient(source, value.shear_coefficient);
  const pitch_cents_per_c = parsePitchPerDegree(source, value.pitch_cents_per_c);
  if (value.preset !== undefined) {
    if (!isMaterialPresetName(value.preset))
      throw new InputError(source, 'material.preset', `unknown preset ${JSON.stringify(value.preset)} (known: ${materialPresetNames.join(', ')})`);
    const fromPreset = woodConstantFields.find((field) => value[field] !== undefined);
    if (fromPreset) throw new InputError(source, `material.${fromPreset}`, 'a preset carries its own constants: give E_GPa and the constants instead of a preset');
    return {
      preset: value.preset,
      ...(shear_coefficient === undefined ? {} : { shear_coefficient }),
      ...(pitch_cents_per_c === undefined ? {} : { pitch_cents_per_c }),
    };
  }
  const material: BarFileMaterial = {
    E_GPa: positiveNumber(source, 'material.E_GPa', value.E_GPa, 'GPa'),
    density_kg_m3: positiveNumber(source, 'material.density_kg_m3', value.density_kg_m3, 'kg/m³'),
  };
  if (value.G_GPa !== undefined) material.G_GPa = positiveNumber(source, 'material.G_GPa', value.G_GPa, 'GPa');
  const poisson = parsePoisson(source, value.poisson);
  if (poisson !== undefined) material.poisson = poisson;
  if (shear_coefficient !== undefined) material.shear_coefficient = shear_coefficient;
  if (pitch_cents_per_c !== undefined) material.pitch_cents_per_c = pitch_cents_per_c;
  for (const field of woodConstantFields) {
    if (value[field] === undefined) continue;
    material[field] = positiveNumber(source, `material.${field}`, value[field], field.endsWith('_GPa') ? 'GPa' : '');
  }
  if (isWoodMaterial(material, grain)) {
    const resolved = resolveWoodConstants(material, grain);
    if ('rule' in resolved) throw new InputError(source, resolved.field, resolved.rule);
  }
  return material;
}

/** Absolute slack (mm) when comparing a profile's ends and thicknesses with the blank's. */
const profileSlackMm = 1e-9;

function parseProfile(source: string, value: unknown, length: number, blankThickness: number): [number, number][] {
  if (!Array.isArray(value)) throw new InputError(source, 'profile_mm', 'must be an array of [position_mm, thickness_mm] pairs');
  if (value.length < 2) throw new InputError(source, 'profile_mm', 'needs at least two stations (one at 0 and one at length_mm)');
  const profile: [number, number][] = [];
  value.forEach((pair: unknown, i) => {
    const field = `profile_mm[${i}]`;
    if (!Array.isArray(pair) || pair.length !== 2) throw new InputError(source, field, 'must be a [position_mm, thickness_mm] pair');
    const [position, thickness] = pair as unknown[];
    if (typeof position !== 'number' || !Number.isFinite(position)) throw new InputError(source, field, 'position must be a number in mm');
    if (typeof thickness !== 'number' || !Number.isFinite(thickness)) throw new InputError(source, field, 'thickness must be a number in mm');
    if (thickness <= 0) throw new InputError(source, field, `thickness ${thickness} mm must be greater than 0`);
    if (thickness > blankThickness + profileSlackMm) throw new InputError(source, field, `thickness ${thickness} mm exceeds the blank's ${blankThickness} mm`);
    if (i > 0 && position <= profile[i - 1]![0]) throw new InputError(source, field, `position ${position} mm must be greater than the previous station's ${profile[i - 1]![0]} mm`);
    profile.push([position, Math.min(thickness, blankThickness)]);
  });
  if (Math.abs(profile[0]![0]) > profileSlackMm) throw new InputError(source, 'profile_mm[0]', `the first station must be at 0 mm (got ${profile[0]![0]} mm)`);
  const last = profile.length - 1;
  if (Math.abs(profile[last]![0] - length) > profileSlackMm)
    throw new InputError(source, `profile_mm[${last}]`, `the last station must be at length_mm = ${length} mm (got ${profile[last]![0]} mm)`);
  profile[0]![0] = 0;
  profile[last]![0] = length;
  return profile;
}

/**
 * Validates a parsed JSON value as a bar file and returns it typed. Throws InputError naming
 * `source` (a file name), the field and the rule broken, e.g.
 * `bar.json: profile_mm[3]: thickness 23 mm exceeds the blank's 22 mm`.
 * Unknown extra fields are kept out of the result.
 */
export function parseBarFile(value: unknown, source = 'bar'): BarFile {
  if (!isObject(value)) throw new InputError(source, 'bar', 'must be a JSON object');
  if (value.format !== undefined && value.format !== 'barwright.bar')
    throw new InputError(source, 'format', `must be "barwright.bar" (got ${JSON.stringify(value.format)})`);
  if (value.version !== undefined && value.version !== 1) throw new InputError(source, 'version', `must be 1 (got ${JSON.stringify(value.version)})`);
  if (value.label !== undefined && typeof value.label !== 'string') throw new InputError(source, 'label', 'must be a string');
  const length_mm = positiveNumber(source, 'length_mm', value.length_mm, 'mm');
  const section = parseSection(source, value.section);
  const grain = value.grain === undefined ? undefined : parseGrain(source, value.grain);
  const material = parseMaterial(source, value.material, grain);
  let profile_mm: [number, number][] | undefined;
  if (value.profile_mm !== undefined) {
    if (section.shape !== 'rect') throw new InputError(source, 'profile_mm', `only a rect section can have a profile (this bar is a ${section.shape})`);
    profile_mm = parseProfile(source, value.profile_mm, length_mm, section.thickness_mm);
  }
  const bar: BarFile = {
    format: 'barwright.bar',
    version: 1,
    ...(typeof value.label === 'string' ? { label: value.label } : {}),
    length_mm,
    section,
    ...(profile_mm ? { profile_mm } : {}),
    material,
    ...(grain ? { grain } : {}),
  };
  return bar;
}
