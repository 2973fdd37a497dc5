// Whole simulated sessions against a "real bar" that is the solid model with wood constants the
// tool does not know (E along the grain ×1.15, every shear modulus ×0.7 of the bar file's): the
// session on the solid model (nextCutSolid) against the line model alone (nextCut), same bar, same
// hand (each cut removes (1 ± 10 %) × the plan, uniform), same tuner (±0.5 cents), same seeds.
import { expect } from 'vitest';
import type { BarFile } from '../../src/fileFormats/barFile.ts';
import { analyzeBarModel } from '../../src/modes/analyzeBar.ts';
import type { BarModel } from '../../src/modes/BarModel.ts';
import { nextCut } from '../../src/session/nextCut.ts';
import { nextCutSolid } from '../../src/session/nextCutSolid.ts';
import { runSimulatedSession, type SimulatedSessionOutcome } from './simulatedSession.ts';

const guess = { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1000 };

/** A 22 mm blank of the maker's guessed wood. */
export const blank = (length_mm: number, width_mm: number): BarFile => ({ format: 'barwright.bar', version: 1, length_mm, section: { shape: 'rect', width_mm, thickness_mm: 22 }, material: guess });

/** The real bar: the solid model of the shape as really cut, with the true constants (the tool only hears these partials). */
function realPartials(real: BarModel, modes: number): number[] {
  const elasticity = real.material.elasticity;
  if (elasticity?.kind !== 'orthotropic') throw new Error('a wooden bar was expected');
  const c = elasticity.constants;
  const constants = { ...c, youngLongitudinal: c.youngLongitudinal * 1.15, shearLongitudinalRadial: c.shearLongitudinalRadial * 0.7, shearLongitudinalTangential: c.shearLongitudinalTangential * 0.7, shearRadialTangential: c.shearRadialTangential * 0.7 };
  return analyzeBarModel({ ...real, material: { ...real.material, elasticity: { ...elasticity, constants } } }, { theory: 'solid', modes }).bending.map((mode) => mode.hz);
}

type Target = { hz: number; ratios: number[]; tolerance_cents: number[] };

function run(bar: BarFile, target: Target, seed: number, advise: typeof nextCut): SimulatedSessionOutcome {
  return runSimulatedSession({ blank: bar, youngFactor: 1, shearFactor: 1, target, limits: { min_thickness_mm: 5.5 }, noiseCents: 0.5, executionError: 0.1, seed, maxCuts: 12, strikeModel: realPartials, advise });
}

const describeOutcome = (outcome: SimulatedSessionOutcome): string => `${outcome.cuts} cuts (true ${outcome.finalCents.map((c) => c.toFixed(1)).join(' / ')})`;

/**
 * Runs the seeds on both models and checks: every session ends `done` with the real bar (its own
 * partials, not the readings) within each tolerance and the ±0.5 cents of the readings the verdict
 * was made on, never thinner than the limit, never adding wood; the solid model never takes more
 * cuts than the line model on a seed, and fewer over the seeds. Returns the lines for the report.
 */
export function compareSessions(name: string, bar: BarFile, target: Target, seeds: readonly number[]): string[] {
  const lines: string[] = [];
  let lineCuts = 0;
  let solidCuts = 0;
  for (const seed of seeds) {
    const line = run(bar, target, seed, nextCut);
    const solid = run(bar, target, seed, nextCutSolid);
    lines.push(`  ${name}, seed ${seed}: line model alone ${describeOutcome(line)}; on the solid model ${describeOutcome(solid)}`);
    for (const outcome of [line, solid]) {
      expect(outcome.status).toBe('done');
      outcome.finalCents.forEach((c, n) => expect(Math.abs(c)).toBeLessThanOrEqual(target.tolerance_cents[n]! + 0.5));
      expect(outcome.thinnestMm).toBeGreaterThanOrEqual(5.5 - 0.01);
      expect(outcome.largestAddedMm).toBeLessThanOrEqual(1e-9);
    }
    expect(solid.cuts).toBeLessThanOrEqual(line.cuts);
    lineCuts += line.cuts;
    solidCuts += solid.cuts;
  }
  lines.push(`  ${name}, all seeds: line model alone ${lineCuts} cuts, on the solid model ${solidCuts}`);
  expect(solidCuts).toBeLessThan(lineCuts);
  return lines;
}
