import { InputError } from './InputError.ts';
import { parseBarFileGrain, parseBarFileMaterial, type BarFileGrain, type BarFileMaterial } from './barFileMaterial.ts';
import { isWoodMaterial, resolveWoodConstants } from './woodConstants.ts';
import { isJsonObject as isObject, positiveNumber } from './jsonFields.ts';

export type { BarFileGrain, BarFileMaterial } from './barFileMaterial.ts';

/** The bar file's section, in millimetres (contract: `*.bar.json`). */
export type BarFileSection =
  | { shape: 'rect'; width_mm: number; thickness_mm: number }
  | { shape: 'tube'; outer_diameter_mm: number; wall_mm: number }
  | { shape: 'round'; diameter_mm: number };

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
  /** How the growth rings run through the thickness (rect wooden bars; default radial). */
  grain?: BarFileGrain;
  /** The board or batch the bar was cut from. */
  lot?: string;
  /** Cord holes drilled across the width (rect only). */
  holes?: BarFileHole[];
}

/** A cord hole drilled across the width, mm: its centre's position from the left end, its diameter, and its height above the underside (default: centred in the thickness there). */
export interface BarFileHole {
  x_mm: number;
  diameter_mm: number;
  z_mm?: number;
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

/** Longest lot name (characters). */
const lotLimit = 200;

/** Thickness (mm) of a bar at x (mm): the profile, linear between stations, or the blank. */
function thicknessAtMm(bar: BarFile, x: number): number {
  const section = bar.section;
  if (section.shape !== 'rect') return 0;
  const profile = bar.profile_mm;
  if (!profile) return section.thickness_mm;
  for (let k = 1; k < profile.length; k++) {
    const [x0, t0] = profile[k - 1]!;
    const [x1, t1] = profile[k]!;
    if (x <= x1) return t0 + ((t1 - t0) * (x - x0)) / (x1 - x0);
  }
  return profile[profile.length - 1]![1];
}

function parseHoles(source: string, value: unknown, bar: BarFile): BarFileHole[] {
  if (bar.section.shape !== 'rect') throw new InputError(source, 'holes', `only a rect bar is drilled for cords across its width (this bar is a ${bar.section.shape})`);
  if (!Array.isArray(value)) throw new InputError(source, 'holes', 'must be a list such as [{ "x_mm": 88, "diameter_mm": 6 }]');
  return value.map((item: unknown, index) => {
    const field = `holes[${index}]`;
    if (!isObject(item)) throw new InputError(source, field, 'must be an object with x_mm and diameter_mm (and optionally z_mm)');
    const diameter = positiveNumber(source, `${field}.diameter_mm`, item.diameter_mm, 'mm');
    const x = item.x_mm;
    if (typeof x !== 'number' || !Number.isFinite(x)) throw new InputError(source, `${field}.x_mm`, 'must be a number in mm');
    if (x - diameter / 2 < 0 || x + diameter / 2 > bar.length_mm) throw new InputError(source, `${field}.x_mm`, `a ${diameter} mm hole at ${x} mm does not fit on the ${bar.length_mm} mm bar`);
    const thickness = Math.min(thicknessAtMm(bar, x - diameter / 2), thicknessAtMm(bar, x), thicknessAtMm(bar, x + diameter / 2));
    const hole: BarFileHole = { x_mm: x, diameter_mm: diameter };
    let z = thickness / 2;
    if (item.z_mm !== undefined) {
      z = positiveNumber(source, `${field}.z_mm`, item.z_mm, 'mm');
      hole.z_mm = z;
    }
    if (z - diameter / 2 <= 0 || z + diameter / 2 >= thickness)
      throw new InputError(source, `${field}.diameter_mm`, `a ${diameter} mm hole ${item.z_mm === undefined ? 'centred' : `at ${z} mm above the underside`} breaks out of the bar, which is ${roundTo(thickness)} mm thick there`);
    return hole;
  });
}

/** `value` to 0.01 (for messages). */
function roundTo(value: number): number {
  return Math.round(value * 100) / 100;
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
  const grain = parseBarFileGrain(source, value.grain);
  const material = parseBarFileMaterial(source, value.material, grain);
  if (!('preset' in material) && isWoodMaterial(material, grain)) {
    // The solid model completes a wooden material from ratio tables: the completed set must hold too.
    const resolved = resolveWoodConstants(material, grain);
    if ('rule' in resolved) throw new InputError(source, resolved.field, resolved.rule);
  }
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
  if (grain) {
    if (section.shape !== 'rect') throw new InputError(source, 'grain', `only a rect (wooden) bar has a grain orientation (this bar is a ${section.shape})`);
    bar.grain = grain;
  }
  if (value.lot !== undefined) {
    if (typeof value.lot !== 'string' || value.lot.trim() === '' || value.lot.length > lotLimit) throw new InputError(source, 'lot', `must be a name of 1 to ${lotLimit} characters`);
    bar.lot = value.lot;
  }
  if (value.holes !== undefined) bar.holes = parseHoles(source, value.holes, bar);
  return bar;
}
