import { resolveWoodConstants } from '../fileFormats/woodConstants.ts';
import { gigapascal as GPa } from '../units/units.ts';
import type { Material } from './Material.ts';
import { grainIsAligned, isotropicStiffness, orthotropicStiffness, radialThroughThickness, type OrthotropicElasticity, type VoigtStiffness } from './orthotropicStiffness.ts';

/** The elastic solid's material: Voigt stiffness in the bar's axes (Pa) and density (kg/m³). */
export interface SolidMaterial {
  readonly stiffness: VoigtStiffness;
  readonly density: number;
}

/** A material ready for the solid model, with what that took. */
export interface SolidMaterialChoice {
  readonly material: SolidMaterial;
  /** True when the mid-width plane is a plane of material symmetry (isotropic, or R and T along the width and thickness). */
  readonly mirrorSymmetric: boolean;
  /** 'orthotropic' wood or an 'isotropic' solid. */
  readonly kind: 'orthotropic' | 'isotropic';
  /** Bar-file fields that were not given and were assumed (hardwood ratios, or ν = 0.3). */
  readonly assumed: readonly string[];
  /** The orthotropic constants used (SI), for wood. */
  readonly constants?: OrthotropicElasticity;
}


/**
 * The solid model's material for a Material: its `elasticity` when it has one, otherwise (a
 * material built by hand, e.g. by a calibration) isotropic when E/G ≤ 3 (ν = E/(2G) − 1) and
 * otherwise wood with radial grain whose missing constants follow the bar file's rules
 * (resolveWoodConstants: hardwood ratios, shear scaled to G).
 */
export function solidMaterialOf(material: Material): SolidMaterialChoice {
  const elasticity = material.elasticity;
  if (elasticity?.kind === 'orthotropic') {
    return {
      material: { stiffness: orthotropicStiffness(elasticity.constants, elasticity.grain), density: material.density },
      mirrorSymmetric: grainIsAligned(elasticity.grain),
      kind: 'orthotropic',
      assumed: elasticity.assumed,
      constants: elasticity.constants,
    };
  }
  if (elasticity?.kind === 'isotropic') {
    return { material: { stiffness: isotropicStiffness(elasticity.youngModulus, elasticity.poisson), density: material.density }, mirrorSymmetric: true, kind: 'isotropic', assumed: elasticity.assumed };
  }
  const ratio = material.youngModulus / material.shearModulus;
  if (ratio <= 3) {
    return { material: { stiffness: isotropicStiffness(material.youngModulus, ratio / 2 - 1), density: material.density }, mirrorSymmetric: true, kind: 'isotropic', assumed: [] };
  }
  const resolved = resolveWoodConstants({ E_GPa: material.youngModulus / GPa, G_GPa: material.shearModulus / GPa }, { through_thickness: 'radial' });
  if ('rule' in resolved) throw new Error(`internal: ${resolved.field}: ${resolved.rule}`);
  const constants = orthotropicFromGPa(resolved.constants);
  return {
    material: { stiffness: orthotropicStiffness(constants, radialThroughThickness), density: material.density },
    mirrorSymmetric: true,
    kind: 'orthotropic',
    assumed: resolved.assumed,
    constants,
  };
}

/** Orthotropic constants from the bar file's units (GPa) to SI. */
export function orthotropicFromGPa(c: { E_GPa: number; E_R_GPa: number; E_T_GPa: number; G_LR_GPa: number; G_LT_GPa: number; G_RT_GPa: number; nu_LR: number; nu_LT: number; nu_RT: number }): OrthotropicElasticity {
  return {
    youngLongitudinal: c.E_GPa * GPa,
    youngRadial: c.E_R_GPa * GPa,
    youngTangential: c.E_T_GPa * GPa,
    shearLongitudinalRadial: c.G_LR_GPa * GPa,
    shearLongitudinalTangential: c.G_LT_GPa * GPa,
    shearRadialTangential: c.G_RT_GPa * GPa,
    poissonLongitudinalRadial: c.nu_LR,
    poissonLongitudinalTangential: c.nu_LT,
    poissonRadialTangential: c.nu_RT,
  };
}
