import { InputError } from './InputError.ts';
import { isMaterialPresetName, materialPresetNames } from './materialPresetNames.ts';

/** The bar file's section, in millimetres (contract: `*.bar.json`). */
export type BarFileSection =
  | { shape: 'rect'; width_mm: number; thickness_mm: number }
  | { shape: 'tube'; outer_diameter_mm: number; wall_mm: number }
  | { shape: 'round'; diameter_mm: number };

/** The bar file's material: explicit values (GPa, kg/m³) or a preset name. */
export type BarFileMaterial =
  | {
      E_GPa: number;
      density_kg_m3: number;
      G_GPa?: number;
      poisson?: number;
      shear_coefficient?: number;
    }
  | { preset: string; shear_coefficient?: number };

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
}

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

function parseMaterial(source: string, value: unknown): BarFileMaterial {
  if (!isObject(value)) throw new InputError(source, 'material', 'must be an object with E_GPa and density_kg_m3, or a preset');
  const shear_coefficient = parseShearCoefficient(source, value.shear_coefficient);
  if (value.preset !== undefined) {
    if (!isMaterialPresetName(value.preset))
      throw new InputError(source, 'material.preset', `unknown preset ${JSON.stringify(value.preset)} (known: ${materialPresetNames.join(', ')})`);
    return shear_coefficient === undefined ? { preset: value.preset } : { preset: value.preset, shear_coefficient };
  }
  const material: BarFileMaterial = {
    E_GPa: positiveNumber(source, 'material.E_GPa', value.E_GPa, 'GPa'),
    density_kg_m3: positiveNumber(source, 'material.density_kg_m3', value.density_kg_m3, 'kg/m³'),
  };
  if (value.G_GPa !== undefined) material.G_GPa = positiveNumber(source, 'material.G_GPa', value.G_GPa, 'GPa');
  const poisson = parsePoisson(source, value.poisson);
  if (poisson !== undefined) material.poisson = poisson;
  if (shear_coefficient !== undefined) material.shear_coefficient = shear_coefficient;
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
  const material = parseMaterial(source, value.material);
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
  };
  return bar;
}
