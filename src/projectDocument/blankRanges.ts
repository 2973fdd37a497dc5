// What a blank's sizes and material can physically be, so an absurd value is refused where it is
// typed (the range stated in the refusal) and never reaches a save.
import type { BarFile } from '../fileFormats/barFile.ts';
import { InputError } from '../fileFormats/InputError.ts';

/**
 * Allowed range of each blank field, [lowest, highest] in the field's unit. Sizes: a bar of a
 * mallet instrument is 10 mm to 3 m long, 5–300 mm wide, 1–150 mm thick; tubes and rods
 * 2–200 mm across with walls of 0.2–30 mm (barwright's own bounds, wide of any keyboard or chime).
 * Young's modulus 0.5–450 GPa (balsa across the grain to tungsten, from memory), shear modulus
 * 0.05–200 GPa, density 100–22 000 kg/m³ (balsa to osmium, from memory).
 */
export const blankFieldRanges = {
  length_mm: [10, 3000],
  'section.width_mm': [5, 300],
  'section.thickness_mm': [1, 150],
  'section.outer_diameter_mm': [2, 200],
  'section.wall_mm': [0.2, 30],
  'section.diameter_mm': [2, 200],
  'material.E_GPa': [0.5, 450],
  'material.G_GPa': [0.05, 200],
  'material.density_kg_m3': [100, 22000],
} as const satisfies Record<string, readonly [number, number]>;

/** A field of blankFieldRanges. */
export type BlankRangeField = keyof typeof blankFieldRanges;

function valueAt(bar: BarFile, path: BlankRangeField): unknown {
  const [head, tail] = path.split('.') as [string, string | undefined];
  const outer = (bar as unknown as Record<string, unknown>)[head];
  return tail === undefined ? outer : outer && typeof outer === 'object' ? (outer as Record<string, unknown>)[tail] : undefined;
}

/** The unit a field of blankFieldRanges is given in. */
export function blankRangeUnit(path: BlankRangeField): string {
  return path.endsWith('_GPa') ? 'GPa' : path.endsWith('_kg_m3') ? 'kg/m³' : 'mm';
}

/** Throws an InputError naming the first field of `bar` outside blankFieldRanges, with the range. */
export function checkBlankRanges(bar: BarFile, source = 'blank'): void {
  for (const [path, [low, high]] of Object.entries(blankFieldRanges) as [BlankRangeField, readonly [number, number]][]) {
    const value = valueAt(bar, path);
    if (typeof value !== 'number') continue;
    if (!(Number.isFinite(value) && value >= low && value <= high)) throw new InputError(source, path, `must lie within ${low}–${high} ${blankRangeUnit(path)}`);
  }
}
