import { orthotropicConstantNames, type BarFileMaterial } from '../fileFormats/barFileMaterial.ts';
import { findMaterialPreset } from './materialPresets.ts';

/** How a bar's partials move with temperature, and where that figure comes from. */
export interface PitchTemperatureCoefficient {
  /** Cents per °C (negative: the bar goes flat as it warms). */
  readonly centsPerC: number;
  /** Where the figure comes from: the bar file, a preset (its source), or a default (said so). */
  readonly from: 'bar file' | 'preset' | 'default';
  /** The figure's source in words, for outputs ("common practice", "from memory", …). */
  readonly source: string;
  /** One-sigma uncertainty, cents per °C: how far a particular bar may be from the figure. */
  readonly sigma: number;
}

/**
 * Default for a wooden bar whose material gives none: −2 cents per °C (common practice: a
 * wooden bar's pitch falls about 2 cents per °C as it warms, brief.md §3).
 */
export const defaultWoodPitchCentsPerC = -2;
/**
 * Default for a metal bar whose material gives none: −0.3 cents per °C (from memory: metals'
 * moduli fall 0.025–0.045 % per °C, and f ∝ √E; aluminium about −0.4).
 */
export const defaultMetalPitchCentsPerC = -0.3;
/**
 * One-sigma spread of a particular bar around the figure it is given: a quarter of the figure, at
 * least 0.1 cent per °C (barwright's own allowance: the trade's "about 2 cents" leaves room).
 * A session narrows it by learning the bar's own coefficient.
 */
export function pitchCoefficientSigma(centsPerC: number): number {
  return Math.max(0.1, 0.25 * Math.abs(centsPerC));
}

/**
 * True when a bar-file material is wood: a wood preset, orthotropic constants, or an E/G above 3
 * (an isotropic solid has E/G = 2(1 + ν) < 3); metals give ν or an E/G below 3.
 */
export function isWoodFileMaterial(material: BarFileMaterial): boolean {
  if ('preset' in material) return findMaterialPreset(material.preset)?.kind !== 'metal';
  if (orthotropicConstantNames.some((key) => material[key] !== undefined)) return true;
  return material.G_GPa !== undefined && material.E_GPa / material.G_GPa > 3;
}

/**
 * The pitch's temperature coefficient of a bar-file material (cents per °C): the material's own
 * `pitch_cents_per_c`, else its preset's (with the preset's source), else the default for wood
 * (−2, common practice) or metal (−0.3, from memory), said so in `source`.
 */
export function pitchTemperatureCoefficient(material: BarFileMaterial): PitchTemperatureCoefficient {
  if (material.pitch_cents_per_c !== undefined) return { centsPerC: material.pitch_cents_per_c, from: 'bar file', source: 'the bar file’s material.pitch_cents_per_c', sigma: pitchCoefficientSigma(material.pitch_cents_per_c) };
  if ('preset' in material) {
    const preset = findMaterialPreset(material.preset);
    if (preset) return { centsPerC: preset.pitch_cents_per_c, from: 'preset', source: `preset ${preset.name}: ${preset.pitch_source}`, sigma: pitchCoefficientSigma(preset.pitch_cents_per_c) };
  }
  if (isWoodFileMaterial(material))
    return { centsPerC: defaultWoodPitchCentsPerC, from: 'default', source: 'default for wood, −2 cents per °C (common practice): give material.pitch_cents_per_c, or strike the unchanged bar at two temperatures to learn its own', sigma: pitchCoefficientSigma(defaultWoodPitchCentsPerC) };
  return { centsPerC: defaultMetalPitchCentsPerC, from: 'default', source: 'default for metal, −0.3 cents per °C (from memory): give material.pitch_cents_per_c to use your own', sigma: pitchCoefficientSigma(defaultMetalPitchCentsPerC) };
}
