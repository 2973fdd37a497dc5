// What a bar file's material means for the solid model: the orthotropic constants it gives, the
// ones it leaves to the published hardwood ratios, and the rules a set must keep. The file format
// fixes these defaults (as it fixes ν = 0.3 and κ = 5/6), so files are checked where they are read.

/** The grain orientation of a bar file (contract, "Additions (turn 2)"). */
export type BarFileGrain = { through_thickness: 'radial' | 'tangential' } | { ring_angle_deg: number };

/** Orthotropic wood constants in the bar file's units: moduli in GPa, Poisson's ratios plain (ν_ij = −ε_j/ε_i). */
export interface WoodConstants {
  E_GPa: number;
  E_R_GPa: number;
  E_T_GPa: number;
  G_LR_GPa: number;
  G_LT_GPa: number;
  G_RT_GPa: number;
  nu_LR: number;
  nu_LT: number;
  nu_RT: number;
}

/** The optional orthotropic fields of a bar file's material, in the order outputs list them. */
export const woodConstantFields = ['E_R_GPa', 'E_T_GPa', 'G_LR_GPa', 'G_LT_GPa', 'G_RT_GPa', 'nu_LR', 'nu_LT', 'nu_RT'] as const;

/** One of the optional orthotropic fields. */
export type WoodConstantField = (typeof woodConstantFields)[number];

/**
 * Hardwood ratios for constants a file leaves out: E_R, E_T and the shear moduli as fractions of
 * E_L, and the Poisson's ratios, each the mean over the hardwood species of the USDA Forest
 * Products Laboratory's Wood Handbook (FPL-GTR-190, 2010), table 5-1 (elastic ratios, 14
 * species, balsa left out; G_RT 6 species) and table 5-2 (Poisson's ratios, 15 species). The
 * species rows are from memory, not re-read; the table's layout was confirmed against its
 * 2021 edition (FPL-GTR-282, table 5-1). The spread between species is wide (E_R/E_L
 * 0.07–0.20, G_LR/E_L 0.06–0.15): fit a session to the real blank.
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

/** Where hardwoodRatios come from, for outputs that list assumed constants. */
export const hardwoodRatiosSource =
  'hardwood means of the USDA Wood Handbook (FPL-GTR-190, 2010), tables 5-1 and 5-2 (species rows from memory): E_R, E_T as fractions of E_L; missing shear moduli in the tabulated proportions, scaled so the vertical plane has G_GPa (or as fractions of E_L without it)';

/** The ring angle (degrees) of a grain: the growth rings' angle to the thickness direction (tangential 0, radial 90; default radial). */
export function ringAngleDegrees(grain: BarFileGrain | undefined): number {
  if (!grain) return 90;
  if ('ring_angle_deg' in grain) return grain.ring_angle_deg;
  return grain.through_thickness === 'radial' ? 90 : 0;
}

/**
 * Shear moduli of the bar's two bending planes from G_LR and G_LT for a ring angle α (T at α to
 * the thickness direction): 1/G_vertical = cos²α/G_LT + sin²α/G_LR and
 * 1/G_lateral = sin²α/G_LT + cos²α/G_LR (the L–R and L–T shear compliances resolved onto the
 * planes x–z and x–y; Bodig & Jayne, Mechanics of Wood and Wood Composites (1982), ch. 3).
 */
export function bendingPlaneShear(shearLR: number, shearLT: number, ringAngleDeg: number): { vertical: number; lateral: number } {
  const a = (ringAngleDeg * Math.PI) / 180;
  const c2 = Math.cos(a) ** 2;
  const s2 = Math.sin(a) ** 2;
  return { vertical: 1 / (c2 / shearLT + s2 / shearLR), lateral: 1 / (s2 / shearLT + c2 / shearLR) };
}

/**
 * Which rule of positive definiteness a set of orthotropic constants breaks (field and rule), or
 * null: ν_ij² < E_i/E_j for each pair, and 1 − ν_LR ν_RL − ν_RT ν_TR − ν_TL ν_LT − 2 ν_LR ν_RT ν_TL > 0
 * (the compliance matrix's normal block is positive definite; Jones, Mechanics of Composite
 * Materials, 2nd ed. (1999), §2.4). The field named is the Poisson's ratio involved.
 */
export function woodDefinitenessViolation(c: WoodConstants): { field: WoodConstantField; rule: string } | null {
  const pairs: [WoodConstantField, number, number, number, string][] = [
    ['nu_LR', c.nu_LR, c.E_GPa, c.E_R_GPa, 'E_L/E_R'],
    ['nu_LT', c.nu_LT, c.E_GPa, c.E_T_GPa, 'E_L/E_T'],
    ['nu_RT', c.nu_RT, c.E_R_GPa, c.E_T_GPa, 'E_R/E_T'],
  ];
  for (const [field, nu, ei, ej, name] of pairs) {
    if (nu * nu >= ei / ej) return { field, rule: `its square must be less than ${name} = ${+(ei / ej).toPrecision(4)} for the compliance to be positive definite (got ${nu})` };
  }
  const nuRL = (c.nu_LR * c.E_R_GPa) / c.E_GPa;
  const nuTL = (c.nu_LT * c.E_T_GPa) / c.E_GPa;
  const nuTR = (c.nu_RT * c.E_T_GPa) / c.E_R_GPa;
  const determinant = 1 - c.nu_LR * nuRL - c.nu_RT * nuTR - nuTL * c.nu_LT - 2 * c.nu_LR * c.nu_RT * nuTL;
  if (!(determinant > 0))
    return { field: 'nu_RT', rule: `with nu_LR and nu_LT it makes 1 − ν_LR·ν_RL − ν_RT·ν_TR − ν_TL·ν_LT − 2·ν_LR·ν_RT·ν_TL = ${+determinant.toPrecision(3)}, which must be positive (compliance not positive definite)` };
  return null;
}

/** The constants a wood material gives (any subset of the orthotropic fields beside E_GPa and maybe G_GPa). */
export type GivenWoodConstants = { E_GPa: number; G_GPa?: number } & Partial<Record<WoodConstantField, number>>;

/** A wood material's full constants and which fields came from hardwoodRatios (and how the shear moduli were scaled). */
export interface ResolvedWoodConstants {
  constants: WoodConstants;
  /** The fields filled in, in woodConstantFields order. */
  assumed: WoodConstantField[];
  /** When shear moduli were filled in: scaled so the vertical plane matches G_GPa, or as fractions of E_L. */
  shearScaling?: 'G_GPa' | 'E_GPa';
}

/**
 * The full orthotropic constants of a wood material and its grain, or the field and rule it
 * breaks. Missing E_R, E_T and Poisson's ratios come from hardwoodRatios (times E_L). Missing
 * shear moduli come from the ratios too, scaled so the vertical plane's shear modulus (see
 * bendingPlaneShear) equals G_GPa when the file gives it, otherwise as fractions of E_L. A
 * G_GPa given beside the shear moduli that set the vertical plane must equal it (within 0.5 %).
 */
export function resolveWoodConstants(given: GivenWoodConstants, grain: BarFileGrain | undefined): ResolvedWoodConstants | { field: string; rule: string } {
  const eL = given.E_GPa;
  const angle = ringAngleDegrees(grain);
  const assumed: WoodConstantField[] = [];
  const value = (field: WoodConstantField, fill: () => number): number => {
    const v = given[field];
    if (v !== undefined) return v;
    assumed.push(field);
    return fill();
  };
  const E_R_GPa = value('E_R_GPa', () => hardwoodRatios.E_R_GPa * eL);
  const E_T_GPa = value('E_T_GPa', () => hardwoodRatios.E_T_GPa * eL);
  // Shear: weights of G_LR and G_LT in the vertical plane's compliance.
  const a = (angle * Math.PI) / 180;
  const weight = { G_LR_GPa: Math.sin(a) ** 2, G_LT_GPa: Math.cos(a) ** 2 };
  let scale = eL;
  let shearScaling: 'G_GPa' | 'E_GPa' | undefined;
  const missingShear = (['G_LR_GPa', 'G_LT_GPa', 'G_RT_GPa'] as const).filter((f) => given[f] === undefined);
  if (missingShear.length) shearScaling = 'E_GPa';
  if (given.G_GPa !== undefined) {
    let givenCompliance = 0;
    let missingCompliance = 0;
    for (const f of ['G_LR_GPa', 'G_LT_GPa'] as const) {
      const w = weight[f];
      if (w < 1e-12) continue;
      const v = given[f];
      if (v !== undefined) givenCompliance += w / v;
      else missingCompliance += w / hardwoodRatios[f];
    }
    if (missingCompliance > 0) {
      const rest = 1 / given.G_GPa - givenCompliance;
      if (!(rest > 0)) return { field: 'material.G_GPa', rule: `${given.G_GPa} GPa is more than the given G_LR_GPa/G_LT_GPa allow for the vertical plane of this grain` };
      scale = missingCompliance / rest;
      shearScaling = 'G_GPa';
    } else {
      const vertical = bendingPlaneShear(given.G_LR_GPa!, given.G_LT_GPa!, angle).vertical;
      if (Math.abs(vertical - given.G_GPa) > 0.005 * given.G_GPa)
        return {
          field: 'material.G_GPa',
          rule: `must equal the shear modulus of the bar's vertical plane for its grain, ${+vertical.toPrecision(4)} GPa from G_LR_GPa and G_LT_GPa (got ${given.G_GPa})`,
        };
    }
  }
  // With radial or tangential grain the vertical plane is one material plane: a missing G of that
  // plane is G_GPa itself (given, not assumed).
  const fromVertical = (field: 'G_LR_GPa' | 'G_LT_GPa'): number | undefined =>
    given.G_GPa !== undefined && given[field] === undefined && weight[field] > 1 - 1e-12 ? given.G_GPa : undefined;
  const G_LR_GPa = fromVertical('G_LR_GPa') ?? value('G_LR_GPa', () => hardwoodRatios.G_LR_GPa * scale);
  const G_LT_GPa = fromVertical('G_LT_GPa') ?? value('G_LT_GPa', () => hardwoodRatios.G_LT_GPa * scale);
  const G_RT_GPa = value('G_RT_GPa', () => hardwoodRatios.G_RT_GPa * scale);
  const constants: WoodConstants = {
    E_GPa: eL,
    E_R_GPa,
    E_T_GPa,
    G_LR_GPa,
    G_LT_GPa,
    G_RT_GPa,
    nu_LR: value('nu_LR', () => hardwoodRatios.nu_LR),
    nu_LT: value('nu_LT', () => hardwoodRatios.nu_LT),
    nu_RT: value('nu_RT', () => hardwoodRatios.nu_RT),
  };
  const violation = woodDefinitenessViolation(constants);
  if (violation) return { field: `material.${violation.field}`, rule: violation.rule + (assumed.includes(violation.field) ? ' (its value is the hardwood default; give it in the file)' : '') };
  assumed.sort((p, q) => woodConstantFields.indexOf(p) - woodConstantFields.indexOf(q));
  return { constants, assumed, ...(shearScaling ? { shearScaling } : {}) };
}
