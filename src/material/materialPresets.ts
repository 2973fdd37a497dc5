import type { MaterialPresetName } from '../fileFormats/materialPresetNames.ts';
import { hardwoodRatiosSource, resolveWoodConstants, type WoodConstants } from '../fileFormats/woodConstants.ts';

/** A named material preset, in the bar file's units (GPa, kg/m³), each value with its source. */
export interface MaterialPreset {
  /** Name used in bar files: `"material": { "preset": NAME }` (the bar file format lists the names). */
  readonly name: MaterialPresetName;
  /** Plain description for lists. */
  readonly label: string;
  readonly kind: 'wood' | 'metal' | 'demo';
  readonly E_GPa: number;
  /** Shear modulus for vertical bending (woods); metals derive G from ν. */
  readonly G_GPa?: number;
  readonly poisson: number;
  /** How the partials move per °C, cents (wood about −2, common practice; metals a few tenths). */
  readonly pitch_cents_per_c: number;
  /** Where pitch_cents_per_c comes from ("common practice", "from memory", a publication, or "demo"). */
  readonly pitch_source: string;
  readonly density_kg_m3: number;
  /** Where each value comes from: a publication and table, "from memory", or "demo". */
  readonly sources: { readonly E: string; readonly G: string; readonly density: string; readonly poisson: string; readonly orthotropic?: string };
  /** Woods: the full orthotropic set (GPa) for the solid model, with G_LR = G_GPa (radial through the thickness). */
  readonly orthotropic?: WoodConstants;
}

/**
 * A wood preset's orthotropic set: E_L and G_LR its own, the rest by the hardwood ratios
 * (E_R, E_T from E_L; G_LT, G_RT scaled to G_LR; Poisson's ratios as tabulated).
 */
function woodSet(E_GPa: number, G_GPa: number): WoodConstants {
  const resolved = resolveWoodConstants({ E_GPa, G_GPa }, { through_thickness: 'radial' });
  if ('rule' in resolved) throw new Error(`internal: preset constants break ${resolved.field}: ${resolved.rule}`);
  // Three significant digits, as a table would print them.
  const set = { ...resolved.constants };
  for (const key of Object.keys(set) as (keyof WoodConstants)[]) set[key] = +set[key].toPrecision(3);
  return set;
}

const woodOrthotropicSource = `E_L and G_LR (= G) as above; E_R, E_T, G_LT, G_RT and the Poisson's ratios from the ${hardwoodRatiosSource}`;
const woodPitchSource = 'common practice: a wooden bar’s pitch falls about 2 cents per °C as it warms; not measured for this species';
const aluminiumPitchSource = 'from memory: the modulus falls about 0.045 % per °C (f ∝ √E); thermal expansion adds about +0.01 cent per °C';

const woodShear =
  'E/G ≈ 12–16 for hardwoods along the grain (USDA Wood Handbook FPL-GTR-190, table 5-1 ratios; from memory): fit per blank';

/**
 * barwright's material presets. Woods vary ±20 % blank to blank: these are starting guesses that
 * a session calibrates from measurements. Static-bending moduli from the USDA species sheets read
 * roughly 10 % below the dynamic modulus a bar shows (from memory).
 */
export const materialPresets: readonly MaterialPreset[] = [
  {
    name: 'demo-tropical-hardwood',
    label: 'Generic dense tropical hardwood (the demo workshop’s stock)',
    kind: 'demo',
    E_GPa: 18,
    G_GPa: 1.3,
    poisson: 0.37,
    pitch_cents_per_c: -2,
    pitch_source: woodPitchSource,
    density_kg_m3: 1000,
    orthotropic: woodSet(18, 1.3),
    sources: { E: 'demo (invented, plausible for a dense tropical hardwood)', G: 'demo (E/G ≈ 14)', density: 'demo', poisson: 'demo', orthotropic: `demo: ${woodOrthotropicSource}` },
  },
  {
    name: 'rosewood-dense',
    label: 'Dense rosewood (Dalbergia, air-dry)',
    kind: 'wood',
    E_GPa: 20,
    G_GPa: 1.45,
    poisson: 0.37,
    pitch_cents_per_c: -2,
    pitch_source: woodPitchSource,
    density_kg_m3: 1000,
    orthotropic: woodSet(20, 1.45),
    sources: {
      E: 'secondary sources give E_L 17–26 GPa (from memory); mid value',
      G: woodShear,
      density: 'USDA Forest Products Laboratory species sheet: air-dry 930–1090 kg/m³ (published)',
      poisson: 'typical hardwood ν_LR (from memory)',
      orthotropic: woodOrthotropicSource,
    },
  },
  {
    name: 'rosewood-medium',
    label: 'Medium-density rosewood (Dalbergia, air-dry)',
    kind: 'wood',
    E_GPa: 13.0,
    G_GPa: 0.95,
    poisson: 0.37,
    pitch_cents_per_c: -2,
    pitch_source: woodPitchSource,
    density_kg_m3: 835,
    orthotropic: woodSet(13.0, 0.95),
    sources: {
      E: 'USDA Forest Products Laboratory species sheet, static bending modulus 13.0 GPa (published)',
      G: woodShear,
      density: 'USDA Forest Products Laboratory species sheet: 750–900 kg/m³ (published); mid value',
      poisson: 'typical hardwood ν_LR (from memory)',
      orthotropic: woodOrthotropicSource,
    },
  },
  {
    name: 'padauk',
    label: 'African padauk (Pterocarpus, air-dry)',
    kind: 'wood',
    E_GPa: 11.5,
    G_GPa: 0.85,
    poisson: 0.37,
    pitch_cents_per_c: -2,
    pitch_source: woodPitchSource,
    density_kg_m3: 745,
    orthotropic: woodSet(11.5, 0.85),
    sources: {
      E: 'USDA Forest Products Laboratory species sheet, 10.8–12.1 GPa (published); mid value',
      G: woodShear,
      density: 'USDA Forest Products Laboratory species sheet: 670–820 kg/m³ (published); mid value',
      poisson: 'typical hardwood ν_LR (from memory)',
      orthotropic: woodOrthotropicSource,
    },
  },
  {
    name: 'aluminium-6061-t6',
    label: 'Aluminium alloy 6061-T6',
    kind: 'metal',
    E_GPa: 68.9,
    poisson: 0.33,
    pitch_cents_per_c: -0.4,
    pitch_source: aluminiumPitchSource,
    density_kg_m3: 2700,
    sources: { E: "producers' data sheets (published)", G: 'E/(2(1+ν)) (isotropic)', density: "producers' data sheets (published)", poisson: "producers' data sheets (published)" },
  },
  {
    name: 'aluminium-2024-t3',
    label: 'Aluminium alloy 2024-T3',
    kind: 'metal',
    E_GPa: 73.1,
    poisson: 0.33,
    pitch_cents_per_c: -0.4,
    pitch_source: aluminiumPitchSource,
    density_kg_m3: 2780,
    sources: { E: "producers' data sheets (published)", G: 'E/(2(1+ν)) (isotropic)', density: 'from memory', poisson: 'from memory' },
  },
  {
    name: 'steel-carbon',
    label: 'Plain carbon steel',
    kind: 'metal',
    E_GPa: 205,
    poisson: 0.29,
    pitch_cents_per_c: -0.2,
    pitch_source: 'from memory: the modulus falls about 0.025 % per °C (f ∝ √E)',
    density_kg_m3: 7850,
    sources: { E: '200–210 GPa (from memory); mid value', G: 'E/(2(1+ν)) (isotropic)', density: 'from memory', poisson: 'from memory' },
  },
  {
    name: 'stainless-304',
    label: 'Stainless steel 304',
    kind: 'metal',
    E_GPa: 193,
    poisson: 0.29,
    pitch_cents_per_c: -0.35,
    pitch_source: 'from memory: the modulus falls about 0.04 % per °C (f ∝ √E)',
    density_kg_m3: 8000,
    sources: { E: 'from memory', G: 'E/(2(1+ν)) (isotropic)', density: 'from memory', poisson: 'from memory' },
  },
  {
    name: 'brass-70-30',
    label: 'Cartridge brass 70/30',
    kind: 'metal',
    E_GPa: 110,
    poisson: 0.35,
    pitch_cents_per_c: -0.35,
    pitch_source: 'from memory: the modulus falls about 0.04 % per °C (f ∝ √E)',
    density_kg_m3: 8530,
    sources: { E: 'from memory', G: 'E/(2(1+ν)) (isotropic)', density: 'from memory', poisson: 'from memory' },
  },
  {
    name: 'phosphor-bronze-c51000',
    label: 'Phosphor bronze C51000',
    kind: 'metal',
    E_GPa: 110,
    poisson: 0.34,
    pitch_cents_per_c: -0.35,
    pitch_source: 'from memory: the modulus falls about 0.04 % per °C (f ∝ √E)',
    density_kg_m3: 8800,
    sources: { E: "producers' data sheets (published)", G: 'E/(2(1+ν)) (isotropic)', density: "producers' data sheets (published)", poisson: "producers' data sheets (published)" },
  },
];

/** The preset with this name, or undefined. */
export function findMaterialPreset(name: string): MaterialPreset | undefined {
  return materialPresets.find((preset) => preset.name === name);
}
