import { parseBarFile, type BarFile } from '../../src/fileFormats/barFile.ts';
import { analyzeBarModel } from '../../src/modes/analyzeBar.ts';
import type { BarModel } from '../../src/modes/BarModel.ts';
import { nextCut } from '../../src/session/nextCut.ts';
import { nextCutSolid } from '../../src/session/nextCutSolid.ts';
import { runSimulatedSession } from './simulatedSession.ts';

const guess = { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1000 };
const blank = (length_mm: number, width_mm: number): BarFile => ({ format: 'barwright.bar', version: 1, length_mm, section: { shape: 'rect', width_mm, thickness_mm: 22 }, material: guess });
function solidReal(real: BarModel, modes: number): number[] {
  const elasticity = real.material.elasticity;
  if (elasticity?.kind !== 'orthotropic') throw new Error('wood expected');
  const c = elasticity.constants;
  const constants = { ...c, youngLongitudinal: c.youngLongitudinal * 1.15, shearLongitudinalRadial: c.shearLongitudinalRadial * 0.7, shearLongitudinalTangential: c.shearLongitudinalTangential * 0.7, shearRadialTangential: c.shearRadialTangential * 0.7 };
  return analyzeBarModel({ ...real, material: { ...real.material, elasticity: { ...elasticity, constants } } }, { theory: 'solid', modes }).bending.map((m) => m.hz);
}
const cases = [
  { name: 'A3 1:4:10', bar: blank(370, 56), target: { hz: 221, ratios: [1, 4, 10], tolerance_cents: [2, 5, 15] } },
  { name: 'C5 1:3', bar: blank(300, 40), target: { hz: 525.6, ratios: [1, 3], tolerance_cents: [2, 5] } },
];
const exec = Number(process.env.EXEC ?? 0.1);
const seeds = (process.env.SEEDS ?? '1').split(',').map(Number);
for (const c of cases) for (const seed of seeds) for (const [tool, advise] of (process.env.TOOLS === 'solid' ? [['solid', nextCutSolid]] : [['line', nextCut], ['solid', nextCutSolid]]) as [string, unknown][]) {
  const t0 = Date.now();
  const out = runSimulatedSession({ blank: c.bar, youngFactor: 1, shearFactor: 1, target: c.target, limits: { min_thickness_mm: 5.5 }, noiseCents: 0.5, executionError: exec, seed, maxCuts: 12, strikeModel: solidReal, advise: advise as never });
  console.log(`${c.name} seed ${seed} ${tool}: ${out.status} after ${out.cuts} cuts, final ${out.finalCents.map((x) => x.toFixed(1)).join('/')}; first-cut error ${out.firstCutErrorCents?.map((x) => x.toFixed(1)).join('/')}; ${((Date.now() - t0) / 1000).toFixed(0)} s`);
  console.log('   true cents by step: ' + out.trueCentsByStep.map((s) => s.map((x) => x.toFixed(1)).join('/')).join('  '));
  out.results.forEach((r, k) => console.log(`   advice ${k + 1}: now ${r.now_cents.map((x) => x.toFixed(1)).join('/')} → predicted ${r.predicted_cents.map((x) => x.toFixed(1)).join('/')} range ${r.predicted_range_cents.map(([a, b]) => ((b - a) / 4).toFixed(2)).join('/')} σ; phase ${r.phase}; corr ${r.calibration.correction_percent.map((x) => x.toFixed(2)).join('/')}%; E ${r.calibration.E_GPa.toFixed(2)} G ${r.calibration.G_GPa.toFixed(2)}`));
}
