// The wood fitted on the solid model: the exact scaling law, recovery of known constants, metal.
import { describe, expect, it } from 'vitest';
import { parseBarFile, type BarFile } from '../../src/fileFormats/barFile.ts';
import { barModelFromFile, type BarModel } from '../../src/modes/BarModel.ts';
import { fitSolidWood, scaledSolidMaterial, solidPartialCents } from '../../src/session/fitSolidWood.ts';

/** An A3-sized bar with a deep parabolic arch (22 → 9 mm over the middle 200 mm), the maker's guess of the wood. */
const arched: BarFile = {
  format: 'barwright.bar',
  version: 1,
  length_mm: 370,
  section: { shape: 'rect', width_mm: 56, thickness_mm: 22 },
  material: { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1000 },
  profile_mm: [[0, 22], [85, 22], [110, 17.2], [135, 13.5], [160, 10.8], [185, 9.2], [210, 10.8], [235, 13.5], [260, 17.2], [285, 22], [370, 22]],
};

function model(bar: BarFile): BarModel {
  return barModelFromFile(parseBarFile(bar));
}

const aluminium: BarFile = { format: 'barwright.bar', version: 1, length_mm: 300, section: { shape: 'rect', width_mm: 38, thickness_mm: 12 }, material: { E_GPa: 69, G_GPa: 26, density_kg_m3: 2700 } };

describe('fitSolidWood', () => {
  it('scaling E of an isotropic bar by s at fixed ν scales every frequency by √s (closed form: K → sK leaves M, so ω² → sω²)', () => {
    const bar = model(aluminium);
    const base = solidPartialCents(bar, 3);
    const scaled = solidPartialCents({ ...bar, material: scaledSolidMaterial(bar.material, 1.21, 1) }, 3);
    // √1.21 = 1.1 exactly: 1200·log2(1.1) cents; the solver's own round-off is far below 1e-6 cents.
    for (let n = 0; n < 3; n++) expect(scaled[n]! - base[n]!).toBeCloseTo(1200 * Math.log2(1.1), 6);
  }, 120_000);

  it('recovers wood of its family (E along the grain ×1.15, every shear modulus ×0.7 of the guess) from three partials of an arched bar, from a start at the guess', () => {
    const bar = model(arched);
    const truth = scaledSolidMaterial(bar.material, 1.15, 0.7);
    const readings = solidPartialCents({ ...bar, material: truth }, 3);
    const fit = fitSolidWood(bar, readings, { young: 1, shear: 1 });
    const given = bar.material.elasticity?.kind === 'orthotropic' ? bar.material.elasticity.constants.youngLongitudinal : NaN;
    // Tolerances: the steps stop once ln a and ln b move by < 0.005 and the ±35 % prior pulls b toward its start (about 1 % here); the residual then is the last step's size, a cent or two at most.
    expect(Math.abs(fit.youngLongitudinal / given / 1.15 - 1)).toBeLessThan(0.01);
    expect(Math.abs(fit.shearScale / 0.7 - 1)).toBeLessThan(0.03);
    for (const residual of fit.residualCents) expect(Math.abs(residual)).toBeLessThan(1);
    expect(fit.solves).toBeLessThanOrEqual(7);
  }, 300_000);

  it('on a metal bar fits the one modulus that matters in one analysis, exactly (isotropic: f ∝ √E at fixed ν)', () => {
    const bar = model(aluminium);
    const readings = solidPartialCents({ ...bar, material: scaledSolidMaterial(bar.material, 0.96, 1) }, 2);
    const fit = fitSolidWood(bar, readings, { young: 1, shear: 1 });
    expect(fit.solves).toBe(1);
    expect(fit.youngLongitudinal / bar.material.youngModulus).toBeCloseTo(0.96, 9);
    for (const residual of fit.residualCents) expect(Math.abs(residual)).toBeLessThan(1e-6);
  }, 120_000);
});
