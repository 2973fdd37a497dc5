// What a wooden bar file means for the solid model: the constants filled in from the hardwood
// table (and named), the G_GPa rule, the completed set's checks, and the line model's G.
import { describe, expect, it } from 'vitest';
import {
  barModelFromFile,
  bendingPlaneShearModuli,
  hardwoodRatios,
  InputError,
  materialPresets,
  orthotropicFromGPa,
  parseBarFile,
  resolveWoodConstants,
  complianceViolation,
  solidMaterialOf,
  verticalShearModulusGPa,
} from '../../src/index.ts';

const bar = {
  length_mm: 380,
  section: { shape: 'rect', width_mm: 55, thickness_mm: 22 },
  material: { E_GPa: 12, E_R_GPa: 1.2, E_T_GPa: 0.6, G_LR_GPa: 0.95, G_LT_GPa: 0.75, G_RT_GPa: 0.25, density_kg_m3: 750 },
};

function messageOf(value: unknown): string {
  try {
    parseBarFile(value, 'bar.json');
  } catch (error) {
    expect(error).toBeInstanceOf(InputError);
    const message = (error as Error).message;
    expect(message.includes('\n')).toBe(false);
    return message;
  }
  throw new Error('expected an InputError');
}

describe('a wooden material for the solid model', () => {
  it('keeps the given constants, fills the rest from the hardwood ratios and names them; tangential grain gives the line model G_LT', () => {
    const model = barModelFromFile(parseBarFile({ ...bar, grain: { through_thickness: 'tangential' } }));
    const elasticity = model.material.elasticity!;
    if (elasticity.kind !== 'orthotropic') throw new Error('expected wood');
    expect(elasticity.assumed).toEqual(['nu_LR', 'nu_LT', 'nu_RT']);
    expect(elasticity.constants.poissonRadialTangential).toBe(hardwoodRatios.nu_RT);
    expect(model.material.shearModulus).toBeCloseTo(0.75e9, 3);
  });
  it('a file with only E and G keeps its line-model values and gets a full set, G_LR = G_GPa for radial grain and G_LT in the tabulated proportion', () => {
    const model = barModelFromFile(parseBarFile({ ...bar, material: { E_GPa: 12, G_GPa: 0.95, density_kg_m3: 750 } }));
    expect(model.material.youngModulus).toBe(12e9);
    expect(model.material.shearModulus).toBe(0.95e9);
    const elasticity = model.material.elasticity!;
    if (elasticity.kind !== 'orthotropic') throw new Error('expected wood');
    expect(elasticity.constants.shearLongitudinalRadial).toBeCloseTo(0.95e9, 3);
    expect(elasticity.assumed).toEqual(['E_R_GPa', 'E_T_GPa', 'G_LT_GPa', 'G_RT_GPa', 'nu_LR', 'nu_LT', 'nu_RT']);
    expect(elasticity.constants.shearLongitudinalTangential / elasticity.constants.shearLongitudinalRadial).toBeCloseTo(hardwoodRatios.G_LT_GPa / hardwoodRatios.G_LR_GPa, 12);
  });
  it('a ring angle scales the missing shear moduli so the vertical plane has G_GPa (checked by inverting the rotated 6 × 6 stiffness)', () => {
    const model = barModelFromFile(parseBarFile({ ...bar, material: { E_GPa: 12, G_GPa: 0.9, density_kg_m3: 750 }, grain: { ring_angle_deg: 30 } }));
    const elasticity = model.material.elasticity!;
    if (elasticity.kind !== 'orthotropic') throw new Error('expected wood');
    expect(bendingPlaneShearModuli(elasticity.constants, elasticity.grain).vertical).toBeCloseTo(0.9e9, 0);
    expect(model.material.shearModulus).toBe(0.9e9);
  });
  it('the bar file’s vertical-plane rule agrees with the rotated compliance of the solid model for any ring angle (1e-12)', () => {
    const constants = orthotropicFromGPa({ E_GPa: 12, E_R_GPa: 1.2, E_T_GPa: 0.6, G_LR_GPa: 0.95, G_LT_GPa: 0.75, G_RT_GPa: 0.25, nu_LR: 0.38, nu_LT: 0.47, nu_RT: 0.71 });
    for (const degrees of [0, 17, 45, 72, 90]) {
      const rotated = bendingPlaneShearModuli(constants, { ringAngle: (degrees * Math.PI) / 180 });
      expect(Math.abs(verticalShearModulusGPa(0.95, 0.75, degrees) * 1e9 - rotated.vertical)).toBeLessThan(1e-12 * rotated.vertical);
      // The lateral plane is the vertical one a quarter turn on.
      expect(Math.abs(verticalShearModulusGPa(0.95, 0.75, 90 - degrees) * 1e9 - rotated.lateral)).toBeLessThan(1e-12 * rotated.lateral);
    }
  });
  it('metals and E/G ≤ 3 stay isotropic; every wood preset carries a full positive definite set with its source', () => {
    expect(barModelFromFile(parseBarFile({ ...bar, material: { preset: 'aluminium-6061-t6' } })).material.elasticity!.kind).toBe('isotropic');
    expect(solidMaterialOf(barModelFromFile(parseBarFile({ ...bar, material: { E_GPa: 70, G_GPa: 26, density_kg_m3: 2700 } })).material).kind).toBe('isotropic');
    for (const preset of materialPresets) {
      if (preset.kind === 'metal') {
        expect(preset.orthotropic).toBeUndefined();
        continue;
      }
      const set = preset.orthotropic!;
      expect(complianceViolation(set.E_GPa, set)).toBeNull();
      expect(set.G_LR_GPa).toBe(preset.G_GPa);
      expect(preset.sources.orthotropic).toMatch(/FPL-GTR-190/);
    }
  });
});

describe('the completed set is checked where the file is read', () => {
  it('a given E_T above E_R that breaks ν_RT² < E_R/E_T with the table’s ν_RT is refused, naming the field and that the value came from the table', () => {
    // E_R/E_T = 0.25 < 0.71².
    const message = messageOf({ ...bar, material: { E_GPa: 12, E_R_GPa: 0.5, E_T_GPa: 2, density_kg_m3: 750 } });
    expect(message).toMatch(/^bar\.json: material\.nu_RT: 0\.71 makes the compliance not positive definite/);
    expect(message).toMatch(/nu_RT from the hardwood table/);
  });
  it('G_GPa above what the given shear moduli allow for an oblique grain is refused', () => {
    expect(messageOf({ ...bar, material: { E_GPa: 12, G_LR_GPa: 0.8, G_GPa: 2, density_kg_m3: 750 }, grain: { ring_angle_deg: 30 } })).toMatch(/^bar\.json: material\.G_GPa: 2 GPa is more than/);
  });
  it('the table alone never breaks a rule, whatever E_L and G (existing files keep loading)', () => {
    for (const [E, G] of [
      [12, 0.95],
      [25, 1],
      [8, 2],
    ])
      expect('rule' in resolveWoodConstants({ E_GPa: E!, G_GPa: G! }, undefined)).toBe(false);
  });
});
