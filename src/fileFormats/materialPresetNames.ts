// The names a bar file may give as `"material": { "preset": NAME }`. The bar file format fixes the
// set (like an enumeration in a schema) so files are checked where they are read; the values
// behind each name, with their sources, live in src/material/materialPresets.ts, whose table is
// typed against this list.

/** Every material preset name a bar file may use. */
export const materialPresetNames = [
  'demo-tropical-hardwood',
  'rosewood-dense',
  'rosewood-medium',
  'padauk',
  'aluminium-6061-t6',
  'aluminium-2024-t3',
  'steel-carbon',
  'stainless-304',
  'brass-70-30',
  'phosphor-bronze-c51000',
] as const;

/** A material preset name (see materialPresetNames). */
export type MaterialPresetName = (typeof materialPresetNames)[number];

/** True when `name` is one of the material preset names. */
export function isMaterialPresetName(name: unknown): name is MaterialPresetName {
  return typeof name === 'string' && (materialPresetNames as readonly string[]).includes(name);
}
