// The bar file's orthotropic material fields and grain (contract, "Additions (turn 2)"): what
// they mean, what is filled in, and the one-line errors for bad input.
import { describe, expect, it } from 'vitest';
import {
  barModelFromFile,
  bendingPlaneShear,
  bendingPlaneShearModuli,
  hardwoodRatios,
  InputError,
  materialPresets,
  orthotropicFromGPa,
  parseBarFile,
  resolveWoodConstants,
  solidMaterialOf,
  woodDefinitenessViolation,
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

describe('orthotropic material fields', () => {
  it('keeps the given constants and the grain, and fills the rest from the hardwood ratios, naming them', () => {
    const parsed = parseBarFile({ ...bar, grain: { through_thickness: 'tangential' } });
    expect(parsed.grain).toEqual({ through_thickness: 'tangential' });
    const model = barModelFromFile(parsed);
    const elasticity = model.material.elasticity!;
    expect(elasticity.kind).toBe('orthotropic');
    expect(elasticity.assumed).toEqual(['nu_LR', 'nu_LT', 'nu_RT']);
    if (elasticity.kind !== 'orthotropic') throw new Error('unreachable');
    expect(elasticity.constants.poissonRadialTangential).toBe(hardwoodRatios.nu_RT);
    // Tangential grain: the beam's G is the vertical plane's, G_LT.
    expect(model.material.shearModulus).toBeCloseTo(0.75e9, 3);
  });
  it('a file with only E and G keeps its line-model values and gets a full set for the solid model, G_LR = G_GPa for radial grain', () => {
    const model = barModelFromFile(parseBarFile({ ...bar, material: { E_GPa: 12, G_GPa: 0.95, density_kg_m3: 750 } }));
    expect(model.material.youngModulus).toBe(12e9);
    expect(model.material.shearModulus).toBe(0.95e9);
    const elasticity = model.material.elasticity!;
    if (elasticity.kind !== 'orthotropic') throw new Error('expected wood');
    expect(elasticity.constants.shearLongitudinalRadial).toBeCloseTo(0.95e9, 3);
    expect(elasticity.assumed).toEqual(['E_R_GPa', 'E_T_GPa', 'G_LT_GPa', 'G_RT_GPa', 'nu_LR', 'nu_LT', 'nu_RT']);
    // G_LT in the tabulated proportion to G_LR (hardwood means, from memory).
    expect(elasticity.constants.shearLongitudinalTangential / elasticity.constants.shearLongitudinalRadial).toBeCloseTo(hardwoodRatios.G_LT_GPa / hardwoodRatios.G_LR_GPa, 12);
  });
  it('a ring angle scales the missing shear moduli so the vertical plane has G_GPa (1/G = cos²α/G_LT + sin²α/G_LR, checked against the rotated compliance)', () => {
    const model = barModelFromFile(parseBarFile({ ...bar, material: { E_GPa: 12, G_GPa: 0.9, density_kg_m3: 750 }, grain: { ring_angle_deg: 30 } }));
    const elasticity = model.material.elasticity!;
    if (elasticity.kind !== 'orthotropic') throw new Error('expected wood');
    // Independent route: invert the rotated 6 × 6 stiffness and read 1/S_xz,xz.
    expect(bendingPlaneShearModuli(elasticity.constants, elasticity.grain).vertical).toBeCloseTo(0.9e9, 0);
    expect(model.material.shearModulus).toBe(0.9e9);
  });
  it('bendingPlaneShear agrees with the rotated compliance for any ring angle (1e-12)', () => {
    const constants = orthotropicFromGPa({ E_GPa: 12, E_R_GPa: 1.2, E_T_GPa: 0.6, G_LR_GPa: 0.95, G_LT_GPa: 0.75, G_RT_GPa: 0.25, nu_LR: 0.38, nu_LT: 0.47, nu_RT: 0.71 });
    for (const degrees of [0, 17, 45, 72, 90]) {
      const closed = bendingPlaneShear(0.95, 0.75, degrees);
      const rotated = bendingPlaneShearModuli(constants, { ringAngle: (degrees * Math.PI) / 180 });
      expect(Math.abs(closed.vertical * 1e9 - rotated.vertical)).toBeLessThan(1e-12 * rotated.vertical);
      expect(Math.abs(closed.lateral * 1e9 - rotated.lateral)).toBeLessThan(1e-12 * rotated.lateral);
    }
  });
  it('metals and E/G ≤ 3 stay isotropic; a preset wood carries a full set (positive definite)', () => {
    expect(barModelFromFile(parseBarFile({ ...bar, material: { preset: 'aluminium-6061-t6' } })).material.elasticity!.kind).toBe('isotropic');
    expect(solidMaterialOf(barModelFromFile(parseBarFile({ ...bar, material: { E_GPa: 70, G_GPa: 26, density_kg_m3: 2700 } })).material).kind).toBe('isotropic');
    for (const preset of materialPresets) {
      if (preset.kind === 'metal') {
        expect(preset.orthotropic).toBeUndefined();
        continue;
      }
      expect(preset.orthotropic).toBeDefined();
      expect(woodDefinitenessViolation(preset.orthotropic!)).toBeNull();
      expect(preset.orthotropic!.G_LR_GPa).toBe(preset.G_GPa);
      expect(preset.sources.orthotropic).toMatch(/FPL-GTR-190/);
    }
  });
  it('files without the new fields load as before (contract example: same model)', () => {
    const plain = { ...bar, material: { E_GPa: 12, G_GPa: 0.95, density_kg_m3: 750 } };
    expect(parseBarFile(plain)).toEqual({ format: 'barwright.bar', version: 1, ...plain });
  });
});

describe('bad orthotropic input: one line naming the field and the rule', () => {
  it.each([
    [{ ...bar, material: { ...bar.material, E_R_GPa: 0 } }, 'bar.json: material.E_R_GPa: must be greater than 0 GPa (got 0)'],
    [{ ...bar, material: { ...bar.material, G_RT_GPa: -0.2 } }, 'bar.json: material.G_RT_GPa: must be greater than 0 GPa (got -0.2)'],
    [{ ...bar, material: { ...bar.material, nu_LT: 0 } }, 'bar.json: material.nu_LT: must be greater than 0 (got 0)'],
    [{ ...bar, material: { ...bar.material, nu_LR: 'high' } }, 'bar.json: material.nu_LR: must be a number'],
    // ν_RT² < E_R/E_T = 2 breaks at ν_RT = 1.5.
    [{ ...bar, material: { ...bar.material, nu_RT: 1.5 } }, 'bar.json: material.nu_RT: its square must be less than E_R/E_T = 2'],
    // ν_LT² < E_L/E_T = 20 breaks at ν_LT = 5.
    [{ ...bar, material: { ...bar.material, nu_LT: 5 } }, 'bar.json: material.nu_LT: its square must be less than E_L/E_T = 20'],
    [{ ...bar, material: { ...bar.material, G_GPa: 0.9 } }, "bar.json: material.G_GPa: must equal the shear modulus of the bar's vertical plane for its grain, 0.95 GPa"],
    [{ ...bar, grain: { through_thickness: 'diagonal' } }, 'bar.json: grain.through_thickness: must be "radial" or "tangential" (got "diagonal")'],
    [{ ...bar, grain: { ring_angle_deg: 120 } }, "bar.json: grain.ring_angle_deg: must be the growth rings' angle to the thickness direction, from 0 to 90 degrees (got 120)"],
    [{ ...bar, grain: { through_thickness: 'radial', ring_angle_deg: 10 } }, 'bar.json: grain: give exactly one of'],
    [{ ...bar, grain: 'quarter' }, 'bar.json: grain: must be an object'],
    [{ ...bar, material: { preset: 'padauk', E_R_GPa: 1 } }, 'bar.json: material.E_R_GPa: a preset carries its own constants'],
    [{ ...bar, material: { ...bar.material, pitch_cents_per_c: 'cold' } }, 'bar.json: material.pitch_cents_per_c: must be a number of cents per °C between -50 and 50'],
  ])('rejects %#', (value, expected) => {
    expect(messageOf(value)).toContain(expected);
  });
  it('names the determinant rule when only it breaks (Jones 1999, §2.4): ν_LR 0.9, ν_LT 0.9, ν_RT 1.2 on E 12 / 1.2 / 0.6', () => {
    const constants = { E_GPa: 12, E_R_GPa: 1.2, E_T_GPa: 0.6, G_LR_GPa: 0.95, G_LT_GPa: 0.75, G_RT_GPa: 0.25, nu_LR: 0.9, nu_LT: 0.9, nu_RT: 1.2 };
    // Pairs: 0.81 < 10, 0.81 < 20, 1.44 < 2; determinant 1 − 0.081 − 0.72 − 0.0405 − 0.0972 = 0.061 > 0, fine;
    // ν_RT 1.35 keeps its pair (1.82 < 2) but gives 1 − 0.081 − 0.911 − 0.0405 − 0.109 = −0.142.
    expect(woodDefinitenessViolation(constants)).toBeNull();
    const broken = woodDefinitenessViolation({ ...constants, nu_RT: 1.35 });
    expect(broken?.field).toBe('nu_RT');
    expect(broken?.rule).toMatch(/must be positive/);
    expect(messageOf({ ...bar, material: { ...bar.material, nu_LR: 0.9, nu_LT: 0.9, nu_RT: 1.35 } })).toMatch(/^bar\.json: material\.nu_RT: .*must be positive/);
  });
  it('an assumed Poisson ratio that clashes with given moduli is named as the hardwood default', () => {
    // E_T given above E_R: ν_RT² < E_R/E_T = 0.25 fails for the default ν_RT = 0.71.
    const result = resolveWoodConstants({ E_GPa: 12, E_R_GPa: 0.5, E_T_GPa: 2 }, undefined);
    expect('rule' in result && result.field).toBe('material.nu_RT');
    expect('rule' in result && result.rule).toMatch(/hardwood default/);
  });
});
