// The grain fitted from a torsion or sideways mode on the solid model: recovery of known ring angles.
import { describe, expect, it } from 'vitest';
import { parseBarFile, type BarFile } from '../../src/fileFormats/barFile.ts';
import { barModelFromFile, type BarModel } from '../../src/modes/BarModel.ts';
import { analyzeBarModel } from '../../src/modes/analyzeBar.ts';
import { fitSolidGrain } from '../../src/session/fitSolidGrain.ts';
import { fitSolidWood } from '../../src/session/fitSolidWood.ts';

/** An A3-sized bar with a deep arch, quarter-sawn in its file (the maker's belief). */
const arched: BarFile = {
  format: 'barwright.bar',
  version: 1,
  length_mm: 370,
  section: { shape: 'rect', width_mm: 56, thickness_mm: 22 },
  material: { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1000 },
  profile_mm: [[0, 22], [85, 22], [135, 13.5], [185, 9.2], [235, 13.5], [285, 22], [370, 22]],
};
const degree = Math.PI / 180;

function atAngle(model: BarModel, ringAngle: number): BarModel {
  const elasticity = model.material.elasticity;
  if (elasticity?.kind !== 'orthotropic') throw new Error('wood expected');
  return { ...model, material: { ...model.material, elasticity: { ...elasticity, grain: { ringAngle } } } };
}

/** As a session does it: the wood fitted to the bending partials at the file's grain, then the grain to the other modes. */
function fitBoth(believed: BarModel, truth: ReturnType<typeof analyzeBarModel>, readings: { torsionHz?: number; lateralHz?: number }) {
  const wood = fitSolidWood(believed, truth.bending.slice(0, 3).map((mode) => 1200 * Math.log2(mode.hz)), { young: 1, shear: 1 });
  return fitSolidGrain({ ...believed, material: wood.material }, readings);
}

describe('fitSolidGrain (after the wood is fitted to the bending partials at the file\'s grain)', () => {
  const believed = barModelFromFile(parseBarFile(arched));
  // Tolerance 3°: the sin² interpolation between the aligned grains is good to about 1 % in f² (measured on this bar), one secant step follows when it misses by more than 0.5 % in frequency, and the wood's fit to the bending partials leaves about a cent.
  it('recovers rings at 60° to the thickness from the first torsion mode alone (the file said quarter-sawn)', () => {
    const truth = analyzeBarModel(atAngle(believed, 60 * degree), { theory: 'solid', modes: 3 });
    const fit = fitBoth(believed, truth, { torsionHz: truth.torsion[0]!.hz });
    expect(Math.abs(fit.ringAngle / degree - 60)).toBeLessThan(3);
    expect(Math.abs(fit.residualHz.torsion!)).toBeLessThan(0.005 * truth.torsion[0]!.hz);
    expect(fit.solves).toBeLessThanOrEqual(4);
  }, 300_000);

  it('recovers rings at 30° from the torsion and sideways modes together', () => {
    const truth = analyzeBarModel(atAngle(believed, 30 * degree), { theory: 'solid', modes: 3 });
    const fit = fitBoth(believed, truth, { torsionHz: truth.torsion[0]!.hz, lateralHz: truth.lateral[0]!.hz });
    expect(Math.abs(fit.ringAngle / degree - 30)).toBeLessThan(3);
    expect(Object.keys(fit.residualHz).sort()).toEqual(['lateral', 'torsion']);
  }, 300_000);

  it('a flat-sawn bar (its file says quarter-sawn) is fitted flat-sawn', () => {
    const flat = atAngle(believed, 90 * degree);
    const truth = analyzeBarModel(flat, { theory: 'solid', modes: 3 });
    const fit = fitBoth(believed, truth, { torsionHz: truth.torsion[0]!.hz });
    // The bending fit leaves a cent or so, so the torsion lands within a few tenths of a degree of the clamp at 90°.
    expect(fit.ringAngle / degree).toBeGreaterThan(85);
    expect(Math.abs(fit.residualHz.torsion!)).toBeLessThan(0.005 * truth.torsion[0]!.hz);
  }, 300_000);
});
