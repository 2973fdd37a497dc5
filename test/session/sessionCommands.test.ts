// The session additions on the command line: `lots add` / `lots show`, `next-cut --lots`, and one
// truth — `modes --session` and `design --session` predict a measured bar's partials from the
// session's calibrated model, as next-cut does, and say so.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import { parseLotFile } from '../../src/fileFormats/lotFile.ts';
import type { BarFile } from '../../src/fileFormats/barFile.ts';
import { nextCut } from '../../src/session/nextCut.ts';
import { captureIo } from '../cli/captureIo.ts';
import { runSimulatedSession } from './simulatedSession.ts';

const guess = { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1000 };
const scratch = mkdtempSync(join(tmpdir(), 'barwright-sessions-'));

/** A finished C5 (1:3) session from one board, and a fresh one from the same board. */
const finished = runSimulatedSession({
  blank: { format: 'barwright.bar', version: 1, length_mm: 300, section: { shape: 'rect', width_mm: 40, thickness_mm: 22 }, material: guess, lot: 'board-7' },
  youngFactor: 1.12,
  shearFactor: 0.78,
  target: { hz: 525.63, ratios: [1, 3], tolerance_cents: [2, 5] },
  limits: { min_thickness_mm: 8 },
  noiseCents: 0.5,
  executionError: 0,
  seed: 3,
  maxCuts: 10,
});
const finishedPath = join(scratch, 'c5.session.json');
writeFileSync(finishedPath, JSON.stringify({ ...finished.session, label: 'C5 bar' }));
const nextBar = { format: 'barwright.session', version: 1, target: { hz: 590.0, ratios: [1, 3], tolerance_cents: [2, 5] }, limits: { min_thickness_mm: 8 }, steps: [{ bar: { format: 'barwright.bar', version: 1, length_mm: 285, section: { shape: 'rect', width_mm: 40, thickness_mm: 22 }, material: guess, lot: 'board-7' }, measured_hz: [1140.0, 2830.0] }] };
const nextPath = join(scratch, 'd5.session.json');
writeFileSync(nextPath, JSON.stringify(nextBar));

describe('barwright lots', () => {
  const lotsPath = join(scratch, 'shop.lots.json');

  it('learns a finished session into the lot its bar names, and shows what the next bar starts from', async () => {
    expect(finished.status).toBe('done');
    const io = captureIo({ writes: 'disk' });
    expect(await main(['lots', 'add', lotsPath, finishedPath, '--notes', 'C5:G5'], io)).toBe(0);
    expect(io.err).toEqual([]);
    const file = parseLotFile(JSON.parse(await io.readText(lotsPath)), lotsPath);
    expect(file.lots['board-7']!.bars.map((b) => b.bar)).toEqual(['C5 bar']);
    expect(file.lots['board-7']!.notes).toEqual({ from: 'C5', to: 'G5' });
    expect(io.out.join('\n')).toMatch(/Learnt C5 bar into lot board-7 \(1 finished bar\)/);
    const show = captureIo();
    expect(await main(['lots', 'show', lotsPath, '--json'], show)).toBe(0);
    const shown = JSON.parse(show.out[0]!);
    expect(shown.lots[0].lot).toBe('board-7');
    expect(shown.lots[0].next_bar.specific_E.mean_MPa_per_kg_m3).toBeGreaterThan(0);
  });

  it('starts next-cut of another bar of the lot from it (--lots), and says which bars taught it', async () => {
    const io = captureIo();
    expect(await main(['next-cut', nextPath, '--lots', lotsPath, '--json'], io)).toBe(0);
    const result = JSON.parse(io.out[0]!);
    expect(result.calibration.lot).toEqual({ name: 'board-7', bars: ['C5 bar'] });
    const text = captureIo();
    expect(await main(['next-cut', nextPath, '--lots', lotsPath], text)).toBe(0);
    expect(text.out.join('\n')).toMatch(/Started from lot board-7, learnt from C5 bar/);
  });

  it('refuses an unfinished session and a bar without a lot, naming the file and the field', async () => {
    const io = captureIo({ writes: 'disk' });
    expect(await main(['lots', 'add', lotsPath, nextPath], io)).toBe(2);
    expect(io.err[0]).toMatch(new RegExp(`^${nextPath.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}: steps: the session is not done \\(status (cut|stuck)\\): only a finished bar teaches its lot$`));
    const unnamed = join(scratch, 'unnamed.session.json');
    writeFileSync(unnamed, JSON.stringify({ ...finished.session, steps: (finished.session.steps as { bar: BarFile }[]).map((s) => ({ ...s, bar: { ...s.bar, lot: undefined } })) }));
    const second = captureIo({ writes: 'disk' });
    expect(await main(['lots', 'add', lotsPath, unnamed], second)).toBe(2);
    expect(second.err[0]).toMatch(/unnamed\.session\.json: steps\[0\]\.bar\.lot: the bar names no lot/);
  });
});

describe('one truth: a measured bar’s partials come from its calibrated model everywhere', () => {
  const demo = 'fixtures/f3-workshop.session.json';

  it('modes --session gives the bar now the partials next-cut knows, and says so', async () => {
    const session = JSON.parse(await captureIo().readText(demo));
    const last = session.steps[session.steps.length - 1].bar;
    const barPath = join(scratch, 'f3-now.bar.json');
    writeFileSync(barPath, JSON.stringify(last));
    const advice = nextCut(session);
    const io = captureIo();
    expect(await main(['modes', barPath, '--modes', '3', '--session', demo, '--json'], io)).toBe(0);
    const analysis = JSON.parse(io.out[0]!);
    expect(analysis.calibration.steps).toBe(3);
    // next-cut's "now" is the last reading (at the playing temperature); the calibrated model of
    // the same shape explains it to within its residual (the calibration's own).
    analysis.bending.slice(0, 3).forEach((mode: { hz: number }, n: number) => {
      const residual = advice.calibration.residual_cents[2]![n] ?? 0;
      expect(1200 * Math.log2(mode.hz / advice.now_hz[n]!)).toBeCloseTo(-residual, 0);
    });
    // Without the session, the starting guess: far from what the bar sounds.
    const plain = captureIo();
    expect(await main(['modes', barPath, '--modes', '3', '--json'], plain)).toBe(0);
    const guessHz = JSON.parse(plain.out[0]!).bending[0].hz;
    expect(Math.abs(1200 * Math.log2(guessHz / advice.now_hz[0]!))).toBeGreaterThan(20);
    const text = captureIo();
    expect(await main(['modes', barPath, '--session', demo], text)).toBe(0);
    expect(text.out.join('\n')).toMatch(/Calibrated: partials from the calibrated model of fixtures\/f3-workshop\.session\.json \(3 measured steps\)/);
  });

  it('design --session plans with the calibrated model and reports the calibrated prediction', async () => {
    const session = JSON.parse(await captureIo().readText(demo));
    const barPath = join(scratch, 'f3-now-2.bar.json');
    writeFileSync(barPath, JSON.stringify(session.steps[session.steps.length - 1].bar));
    const io = captureIo();
    expect(await main(['design', barPath, '--note', 'F3', '--a4', '442', '--min-thickness-mm', '6', '--session', demo, '--json'], io)).toBe(0);
    const result = JSON.parse(io.out[0]!);
    expect(result.calibration.E_GPa).toBeCloseTo(advice().calibrated_material.E_GPa, 6);
    // The reported prediction is the calibrated model's for the designed shape, against the real targets.
    const check = captureIo();
    const designed = join(scratch, 'f3-designed.bar.json');
    writeFileSync(designed, JSON.stringify(result.bar));
    expect(await main(['modes', designed, '--modes', '3', '--session', demo, '--json'], check)).toBe(0);
    const calibrated = JSON.parse(check.out[0]!).bending.map((m: { hz: number }) => m.hz);
    result.predicted_hz.forEach((hz: number, n: number) => expect(Math.abs(1200 * Math.log2(hz / calibrated[n]!))).toBeLessThan(0.5));
    function advice() {
      return nextCut(session);
    }
  }, 300_000);

  it('refuses --lots without --session and another theory with it', async () => {
    const io = captureIo();
    expect(await main(['modes', 'fixtures/f4-practice.bar.json', '--lots', 'x.lots.json'], io)).toBe(2);
    expect(io.err[0]).toBe('command line: --lots: goes with --session (the lot of the session’s bar)');
    const theory = captureIo();
    expect(await main(['modes', 'fixtures/f4-practice.bar.json', '--session', demo, '--theory', 'euler-bernoulli'], theory)).toBe(2);
    expect(theory.err[0]).toMatch(/^command line: --theory: a session calibrates the timoshenko model/);
  });
});
