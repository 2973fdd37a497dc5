// What a wooden bar file's material means for the solid model: the orthotropic constants it
// gives, the ones it leaves to published hardwood ratios, and the full set's checks. The file
// format fixes these defaults (as it fixes ν = 0.3 and κ = 5/6), so a file is checked where it is
// read: parseBarFile completes a wooden material here and refuses a set that breaks a rule.
import {
  complianceViolation,
  orthotropicConstantNames,
  ringAngleDegrees,
  verticalShearModulusGPa,
  type BarFileGrain,
  type BarFileMaterial,
} from './barFileMaterial.ts';

/** One of the optional orthotropic fields of a bar file's material. */
export type WoodConstantField = (typeof orthotropicConstantNames)[number];

/** A wood's full orthotropic set in the bar file's units: moduli in GPa, Poisson's ratios plain (ν_ij = −ε_j/ε_i). */
export type WoodConstants = { E_GPa: number } & Record<WoodConstantField, number>;

/**
 * Hardwood ratios for constants a file leaves out: E_R, E_T and the shear moduli as fractions of
 * E_L, and the Poisson's ratios, each the mean over the hardwood species of the USDA Forest
 * Products Laboratory's Wood Handbook (FPL-GTR-190, 2010), table 5-1 (elastic ratios, 14
 * species, balsa left out; G_RT 6 species) and table 5-2 (Poisson's ratios, 15 species). The
 * species rows are from memory, not re-read; the table's layout was confirmed against its 2021
 * edition (FPL-GTR-282, table 5-1). The spread between species is wide (E_R/E_L 0.07–0.20,
 * G_LR/E_L 0.06–0.15): fit a session to the real blank.
 */
export const hardwoodRatios: Readonly<Record<WoodConstantField, number>> = {
  E_R_GPa: 0.119,
  E_T_GPa: 0.06,
  G_LR_GPa: 0.092,
  G_LT_GPa: 0.069,
  G_RT_GPa: 0.02,
  nu_LR: 0.38,
  nu_LT: 0.47,
  nu_RT: 0.71,
};

/** Where hardwoodRatios come from and how they are applied, for outputs that list assumed constants. */
export const hardwoodRatiosSource =
  'hardwood means of the USDA Wood Handbook (FPL-GTR-190, 2010), tables 5-1 and 5-2 (species rows from memory): E_R, E_T as fractions of E_L; missing shear moduli in the tabulated proportions, scaled so the vertical plane has G_GPa (or as fractions of E_L without it)';

/**
 * True when an explicit material is wood for the solid model: orthotropic constants or a grain
 * given, or E/G above 3 (an isotropic solid has E/G = 2(1 + ν) < 3). Presets say it themselves.
 */
export function isWoodMaterial(material: BarFileMaterial, grain: BarFileGrain | undefined): boolean {
  if ('preset' in material) return false;
  if (grain !== undefined || orthotropicConstantNames.some((field) => material[field] !== undefined)) return true;
  return material.G_GPa !== undefined && material.E_GPa / material.G_GPa > 3;
}

/** A wood material's full constants and which fields came from hardwoodRatios. */
export interface ResolvedWoodConstants {
  constants: WoodConstants;
  /** The fields filled in, in file order. */
  assumed: WoodConstantField[];
}

/**
 * The full orthotropic constants of a wooden material and its grain, or the field and rule the
 * full set breaks. Missing E_R, E_T and Poisson's ratios come from hardwoodRatios (times E_L).
 * Missing shear moduli come from the ratios too, scaled so the vertical plane's shear modulus
 * (verticalShearModulusGPa) equals G_GPa when the file gives it, otherwise as fractions of E_L;
 * with radial or tangential grain a missing G of the vertical plane is G_GPa itself (given, not
 * assumed). The completed set must make a positive definite compliance (complianceViolation).
 */
export function resolveWoodConstants(given: { E_GPa: number; G_GPa?: number } & Partial<Record<WoodConstantField, number>>, grain: BarFileGrain | undefined): ResolvedWoodConstants | { field: string; rule: string } {
  const eL = given.E_GPa;
  const angle = (ringAngleDegrees(grain) * Math.PI) / 180;
  const assumed: WoodConstantField[] = [];
  const value = (field: WoodConstantField, fill: () => number): number => {
    const v = given[field];
    if (v !== undefined) return v;
    assumed.push(field);
    return fill();
  };
  // Weights of G_LR and G_LT in the vertical plane's shear compliance.
  const weight = { G_LR_GPa: Math.cos(angle) ** 2, G_LT_GPa: Math.sin(angle) ** 2 };
  let scale = eL;
  if (given.G_GPa !== undefined) {
    let givenCompliance = 0;
    let missingCompliance = 0;
    for (const field of ['G_LR_GPa', 'G_LT_GPa'] as const) {
      const w = weight[field];
      if (w < 1e-12) continue;
      const v = given[field];
      if (v !== undefined) givenCompliance += w / v;
      else missingCompliance += w / hardwoodRatios[field];
    }
    if (missingCompliance > 0) {
      const rest = 1 / given.G_GPa - givenCompliance;
      if (!(rest > 0)) return { field: 'material.G_GPa', rule: `${given.G_GPa} GPa is more than the given G_LR_GPa/G_LT_GPa allow for the vertical plane of this grain` };
      scale = missingCompliance / rest;
    }
  }
  const fromVertical = (field: 'G_LR_GPa' | 'G_LT_GPa'): number | undefined => (given.G_GPa !== undefined && given[field] === undefined && weight[field] > 1 - 1e-12 ? given.G_GPa : undefined);
  const constants: WoodConstants = {
    E_GPa: eL,
    E_R_GPa: value('E_R_GPa', () => hardwoodRatios.E_R_GPa * eL),
    E_T_GPa: value('E_T_GPa', () => hardwoodRatios.E_T_GPa * eL),
    G_LR_GPa: fromVertical('G_LR_GPa') ?? value('G_LR_GPa', () => hardwoodRatios.G_LR_GPa * scale),
    G_LT_GPa: fromVertical('G_LT_GPa') ?? value('G_LT_GPa', () => hardwoodRatios.G_LT_GPa * scale),
    G_RT_GPa: value('G_RT_GPa', () => hardwoodRatios.G_RT_GPa * scale),
    nu_LR: value('nu_LR', () => hardwoodRatios.nu_LR),
    nu_LT: value('nu_LT', () => hardwoodRatios.nu_LT),
    nu_RT: value('nu_RT', () => hardwoodRatios.nu_RT),
  };
  const violation = complianceViolation(eL, constants);
  if (violation) {
    return { field: violation.field, rule: violation.rule + (assumed.length ? ` (with ${assumed.join(', ')} from the hardwood table; give them in the file)` : '') };
  }
  assumed.sort((p, q) => orthotropicConstantNames.indexOf(p) - orthotropicConstantNames.indexOf(q));
  return { constants, assumed };
}

/** The vertical plane's shear modulus (GPa) of a full set for a grain (see verticalShearModulusGPa). */
export function verticalShearOf(constants: WoodConstants, grain: BarFileGrain | undefined): number {
  return verticalShearModulusGPa(constants.G_LR_GPa, constants.G_LT_GPa, ringAngleDegrees(grain));
}
