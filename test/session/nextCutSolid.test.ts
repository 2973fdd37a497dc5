// The next cut with the solid model's correction: a "real bar" that is the solid model with wood
// constants the tool does not know (E along the grain ×1.15, every shear modulus ×0.7).
import { afterAll, describe, expect, it } from 'vitest';
import { parseBarFile, type BarFile } from '../../src/fileFormats/barFile.ts';
import { barModelFromFile } from '../../src/modes/BarModel.ts';
import { analyzeBarModel } from '../../src/modes/analyzeBar.ts';
import { nextCut } from '../../src/session/nextCut.ts';
import { nextCutSolid } from '../../src/session/nextCutSolid.ts';

const guess = { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1000 };
const blank = (length_mm: number, width_mm: number): BarFile => ({ format: 'barwright.bar', version: 1, length_mm, section: { shape: 'rect', width_mm, thickness_mm: 22 }, material: guess });

/** The real bar's partials: the solid model with the true constants (the tool only sees these numbers). */
function realHz(bar: BarFile, partials: number): number[] {
  const model = barModelFromFile(parseBarFile(bar));
  const elasticity = model.material.elasticity;
  if (elasticity?.kind !== 'orthotropic') throw new Error('a wooden bar was expected');
  const c = elasticity.constants;
  const constants = { ...c, youngLongitudinal: c.youngLongitudinal * 1.15, shearLongitudinalRadial: c.shearLongitudinalRadial * 0.7, shearLongitudinalTangential: c.shearLongitudinalTangential * 0.7, shearRadialTangential: c.shearRadialTangential * 0.7 };
  return analyzeBarModel({ ...model, material: { ...model.material, elasticity: { ...elasticity, constants } } }, { theory: 'solid', modes: partials }).bending.map((mode) => mode.hz);
}

const report: string[] = [];
afterAll(() => console.log(`first cut, real bar after it − the advice's prediction (cents):\n${report.join('\n')}`));

describe('the first cut on a bar whose wood the tool does not know', () => {
  const cases = [
    { name: 'A3 1:4:10', bar: blank(370, 56), target: { hz: 221, ratios: [1, 4, 10], tolerance_cents: [2, 5, 15] } },
    { name: 'C5 1:3', bar: blank(300, 40), target: { hz: 525.6, ratios: [1, 3], tolerance_cents: [2, 5] } },
  ];
  for (const { name, bar, target } of cases) {
    it(`${name}: with the solid model's correction the cut lands within 10 cents of its prediction on every partial; the line model alone misses by more than 30`, () => {
      const partials = target.ratios.length;
      // The blank as struck, exactly (no tuner noise, a perfect hand: only the model's error is left).
      const session = { format: 'barwright.session', version: 1, target, limits: { min_thickness_mm: 5.5 }, steps: [{ bar, measured_hz: realHz(bar, partials) }] };
      const miss = (advice: { bar_after: BarFile; predicted_hz: number[] }) => realHz(advice.bar_after, partials).map((hz, n) => 1200 * Math.log2(hz / advice.predicted_hz[n]!));
      const line = nextCut(session);
      const solid = nextCutSolid(session);
      expect(line.status).toBe('cut');
      expect(solid.status).toBe('cut');
      expect(solid.solid).not.toBeNull();
      const lineMiss = miss(line);
      const solidMiss = miss(solid);
      report.push(`  ${name}: line model alone ${lineMiss.map((c) => c.toFixed(1)).join(' / ')}; with the solid model ${solidMiss.map((c) => c.toFixed(1)).join(' / ')} (${solid.solid!.solid_solves} solid analyses)`);
      for (const c of solidMiss) expect(Math.abs(c)).toBeLessThan(10);
      expect(Math.max(...lineMiss.map(Math.abs))).toBeGreaterThan(30);
    }, 300_000);
  }
});

describe('the grain from a torsion mode read on the bar', () => {
  it('a blank quarter-sawn in its file whose rings really run at 60° (wood ×1.15 along the grain, shear ×0.7): the torsion mode read puts the rings within 10° of 60° and says so', () => {
    const bar = blank(370, 56);
    const model = barModelFromFile(parseBarFile(bar));
    const elasticity = model.material.elasticity;
    if (elasticity?.kind !== 'orthotropic') throw new Error('a wooden bar was expected');
    const c = elasticity.constants;
    const constants = { ...c, youngLongitudinal: c.youngLongitudinal * 1.15, shearLongitudinalRadial: c.shearLongitudinalRadial * 0.7, shearLongitudinalTangential: c.shearLongitudinalTangential * 0.7, shearRadialTangential: c.shearRadialTangential * 0.7 };
    const truth = analyzeBarModel({ ...model, material: { ...model.material, elasticity: { ...elasticity, constants, grain: { ringAngle: Math.PI / 3 } } } }, { theory: 'solid', modes: 3 });
    const target = { hz: 221, ratios: [1, 4, 10], tolerance_cents: [2, 5, 15] };
    const session = { format: 'barwright.session', version: 1, target, limits: { min_thickness_mm: 5.5 }, steps: [{ bar, measured_hz: truth.bending.map((m) => m.hz), measured_torsion_hz: truth.torsion[0]!.hz }] };
    const advice = nextCutSolid(session);
    const grain = advice.solid!.grain!;
    report.push(`  grain: rings really at 60°, fitted ${grain.ring_angle_deg.toFixed(1)}° (torsion ${truth.torsion[0]!.hz.toFixed(1)} Hz read, reading − model ${grain.residual_hz.torsion!.toFixed(2)} Hz); wood E_L ${advice.solid!.E_L_GPa.toFixed(2)} GPa (true ${(constants.youngLongitudinal / 1e9).toFixed(2)}), shear ×${advice.solid!.shear_scale.toFixed(2)} (true ×0.70)`);
    // 10°: on the uncut blank the bending partials pin the shear moduli only to about ±10 %, and torsion goes as √G: ±5 % in f, a fifth of the 22 % the grain spans from 0° to 90°.
    expect(Math.abs(grain.ring_angle_deg - 60)).toBeLessThan(10);
    expect(advice.warnings.some((w) => /growth rings run at about \d+°/.test(w))).toBe(true);
  }, 300_000);
});

