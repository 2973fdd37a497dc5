// The bar file's turn-2 additions (contract): orthotropic constants, grain, lot, holes,
// pitch_cents_per_c — each accepted when right and refused with the field and the rule when not.
import { describe, expect, it } from 'vitest';
import { InputError, parseBarFile, verticalShearModulusGPa } from '../../src/index.ts';

const wood = {
  length_mm: 380,
  section: { shape: 'rect', width_mm: 55, thickness_mm: 22 },
  profile_mm: [[0, 22], [80, 22], [140, 11], [190, 8], [240, 11], [300, 22], [380, 22]],
  // The deep-arch bar of issue 15: E_L 12, E_R 1.2, E_T 0.6, G_LR 0.95, G_LT 0.75, G_RT 0.25 GPa.
  material: { E_GPa: 12, E_R_GPa: 1.2, E_T_GPa: 0.6, G_LR_GPa: 0.95, G_LT_GPa: 0.75, G_RT_GPa: 0.25, nu_LR: 0.37, nu_LT: 0.45, nu_RT: 0.6, density_kg_m3: 750 },
};

function messageOf(change: (bar: Record<string, any>) => void): string {
  const bar = structuredClone(wood) as Record<string, any>;
  change(bar);
  try {
    parseBarFile(bar, 'bar.json');
  } catch (error) {
    expect(error).toBeInstanceOf(InputError);
    return (error as Error).message;
  }
  throw new Error('expected an InputError');
}

describe('bar file additions', () => {
  it('keeps the orthotropic constants, grain, lot, holes and the pitch coefficient as given', () => {
    const bar = parseBarFile({ ...wood, grain: { through_thickness: 'tangential' }, lot: 'board 7', holes: [{ x_mm: 85, diameter_mm: 5 }], material: { ...wood.material, pitch_cents_per_c: -2 } });
    expect(bar.material).toMatchObject({ E_R_GPa: 1.2, G_RT_GPa: 0.25, nu_RT: 0.6, pitch_cents_per_c: -2 });
    expect(bar.grain).toEqual({ through_thickness: 'tangential' });
    expect(bar.lot).toBe('board 7');
    expect(bar.holes).toEqual([{ x_mm: 85, diameter_mm: 5 }]);
  });
  it('files without the additions parse exactly as before', () => {
    const plain = { length_mm: 300, section: { shape: 'rect', width_mm: 50, thickness_mm: 20 }, material: { E_GPa: 12, G_GPa: 0.95, density_kg_m3: 750 } };
    expect(parseBarFile(plain)).toEqual({ format: 'barwright.bar', version: 1, ...plain });
  });
  it('the vertical-plane shear modulus: G_LR quarter-sawn, G_LT flat-sawn, the harmonic blend between (compliance rotation)', () => {
    expect(verticalShearModulusGPa(0.95, 0.75, 0)).toBeCloseTo(0.95, 12);
    expect(verticalShearModulusGPa(0.95, 0.75, 90)).toBeCloseTo(0.75, 12);
    // 1/G = cos²45°/0.95 + sin²45°/0.75 (closed form).
    expect(verticalShearModulusGPa(0.95, 0.75, 45)).toBeCloseTo(1 / (0.5 / 0.95 + 0.5 / 0.75), 12);
  });
  it('G_GPa beside G_LR/G_LT must be the vertical plane modulus of the grain given', () => {
    expect(parseBarFile({ ...wood, material: { ...wood.material, G_GPa: 0.95 } }).material).toMatchObject({ G_GPa: 0.95 });
    expect(messageOf((b) => (b.material.G_GPa = 0.95, b.grain = { through_thickness: 'tangential' }))).toMatch(/^bar\.json: material\.G_GPa: .*0\.750 GPa/);
  });
  it.each([
    [(b: Record<string, any>) => (b.material.E_R_GPa = 0), /material\.E_R_GPa: must be greater than 0/],
    [(b: Record<string, any>) => (b.material.G_RT_GPa = -0.1), /material\.G_RT_GPa: must be greater than 0/],
    // ν_LR² < E_L/E_R = 10 always holds; ν_RT² < E_R/E_T = 2 fails at 1.45 (Jones §2.4 restrictions).
    [(b: Record<string, any>) => (b.material.nu_RT = 1.45), /material\.nu_RT: .*not positive definite/],
    // Each pair within its bound, the determinant 1 − Σν_ijν_ji − 2ν_LRν_RTν_TL = −0.47 (computed by hand) is not.
    [(b: Record<string, any>) => (b.material.nu_LT = 1.4, b.material.nu_LR = 1.4, b.material.nu_RT = 1.35), /material\.nu_RT: the Poisson ratios .*not positive definite/],
    [(b: Record<string, any>) => (b.grain = { through_thickness: 'diagonal' }), /grain\.through_thickness: must be "radial"/],
    [(b: Record<string, any>) => (b.grain = { ring_angle_deg: 120 }), /grain\.ring_angle_deg: must be an angle from 0/],
    [(b: Record<string, any>) => (b.grain = 'quarter'), /grain: must be/],
    [(b: Record<string, any>) => (b.lot = ''), /lot: must be a name/],
    [(b: Record<string, any>) => (b.holes = [{ x_mm: 190, diameter_mm: 9 }]), /holes\[0\]\.diameter_mm: .*breaks out of the bar, which is 8 mm thick/],
    [(b: Record<string, any>) => (b.holes = [{ x_mm: 1, diameter_mm: 6 }]), /holes\[0\]\.x_mm: .*does not fit/],
    [(b: Record<string, any>) => (b.holes = [{ x_mm: 80, diameter_mm: 6, z_mm: 20 }]), /holes\[0\]\.diameter_mm: .*20 mm above the underside/],
    [(b: Record<string, any>) => (b.material.pitch_cents_per_c = 'cold'), /material\.pitch_cents_per_c: must be a number of cents per °C/],
  ])('refuses a bad value with its field and rule (%#)', (change, pattern) => {
    expect(messageOf(change)).toMatch(pattern);
  });
  it('refuses grain and holes on a tube', () => {
    const tube = { length_mm: 500, section: { shape: 'tube', outer_diameter_mm: 25, wall_mm: 1.5 }, material: { preset: 'aluminium-6061-t6' } };
    expect(() => parseBarFile({ ...tube, grain: { through_thickness: 'radial' } }, 'chime.json')).toThrow(/chime\.json: grain: only a rect/);
    expect(() => parseBarFile({ ...tube, holes: [{ x_mm: 100, diameter_mm: 3 }] }, 'chime.json')).toThrow(/chime\.json: holes: only a rect/);
  });
});
