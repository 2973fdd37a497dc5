import { describe, expect, it } from 'vitest';
import { barModelFromFile, InputError, parseBarFile } from '../../src/index.ts';

const good = {
  format: 'barwright.bar',
  version: 1,
  label: 'F4 practice bar',
  length_mm: 380,
  section: { shape: 'rect', width_mm: 55, thickness_mm: 22 },
  profile_mm: [
    [0, 22],
    [80, 22],
    [140, 11],
    [190, 8],
    [240, 11],
    [300, 22],
    [380, 22],
  ],
  material: { E_GPa: 12.0, G_GPa: 0.95, density_kg_m3: 750 },
};

function messageOf(value: unknown): string {
  try {
    parseBarFile(value, 'bar.json');
  } catch (error) {
    expect(error).toBeInstanceOf(InputError);
    return (error as Error).message;
  }
  throw new Error('expected an InputError');
}

describe('bar file validation', () => {
  it('accepts the contract example unchanged', () => {
    expect(parseBarFile(good, 'bar.json')).toEqual(good);
  });
  it('names the file, the field and the rule (contract example message)', () => {
    const bad = structuredClone(good);
    bad.profile_mm[3] = [190, 23];
    expect(messageOf(bad)).toBe("bar.json: profile_mm[3]: thickness 23 mm exceeds the blank's 22 mm");
  });
  it.each([
    [{ ...good, length_mm: -1 }, 'bar.json: length_mm: must be greater than 0 mm (got -1)'],
    [{ ...good, length_mm: 'long' }, 'bar.json: length_mm: must be a number in mm'],
    [{ ...good, section: { shape: 'oval' } }, 'bar.json: section.shape: must be "rect", "tube" or "round" (got "oval")'],
    [{ ...good, profile_mm: [[0, 22], [200, 10], [150, 10], [380, 22]] }, "bar.json: profile_mm[2]: position 150 mm must be greater than the previous station's 200 mm"],
    [{ ...good, profile_mm: [[5, 22], [380, 22]] }, 'bar.json: profile_mm[0]: the first station must be at 0 mm (got 5 mm)'],
    [{ ...good, profile_mm: [[0, 22], [370, 22]] }, 'bar.json: profile_mm[1]: the last station must be at length_mm = 380 mm (got 370 mm)'],
    [{ ...good, profile_mm: [[0, 22], [190, 0], [380, 22]] }, 'bar.json: profile_mm[1]: thickness 0 mm must be greater than 0'],
    [{ ...good, material: { E_GPa: 12 } }, 'bar.json: material.density_kg_m3: must be a number in kg/m³'],
    [{ ...good, material: { preset: 'unobtainium' } }, 'bar.json: material.preset: unknown preset'],
    [{ ...good, material: { ...good.material, poisson: 0.6 } }, 'bar.json: material.poisson: must be a number between -1 and 0.5 (got 0.6)'],
    [{ ...good, section: { shape: 'tube', outer_diameter_mm: 20, wall_mm: 10 } }, 'bar.json: section.wall_mm: wall 10 mm must be less than half the outer diameter (10 mm)'],
    [{ ...good, format: 'other' }, 'bar.json: format: must be "barwright.bar" (got "other")'],
  ])('rejects %#', (value, expected) => {
    expect(messageOf(value)).toContain(expected);
  });
  it('refuses a profile on a tube', () => {
    expect(messageOf({ ...good, section: { shape: 'tube', outer_diameter_mm: 25, wall_mm: 1.6 } })).toContain('profile_mm: only a rect section can have a profile');
  });
});

describe('bar model (SI) from a bar file', () => {
  it('converts mm and GPa to SI and derives G from ν when G is absent (contract: G = E/(2(1+ν)), ν default 0.3)', () => {
    const model = barModelFromFile(parseBarFile({ ...good, profile_mm: undefined, material: { E_GPa: 70, density_kg_m3: 2700 } }));
    expect(model.length).toBeCloseTo(0.38, 15);
    expect(model.material.shearModulus).toBeCloseTo(70e9 / 2.6, 3);
    expect(model.profile.thicknesses[0]).toBeCloseTo(0.022, 15);
  });
  it('resolves a preset', () => {
    const model = barModelFromFile(parseBarFile({ ...good, material: { preset: 'aluminium-6061-t6' } }));
    expect(model.material.youngModulus).toBe(68.9e9);
    expect(model.material.shearModulus).toBeCloseTo(68.9e9 / (2 * 1.33), 0);
  });
});
