// A xylophone-type keyboard planned end to end with barwright's default workshop: the demo's
// 3½ octaves F4–C8 (invented demo data), 1:3 up to B6 and the fundamental alone above.
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { StoredKeyboardBar } from '../../src/instrument/designKeyboardBar.ts';
import type { KeyboardTask, KeyboardTaskResult } from '../../src/instrument/keyboardTask.ts';
import { planKeyboard, type KeyboardPlan } from '../../src/instrument/planKeyboard.ts';
import { createWorkerPool, type WorkerPool } from '../../src/instrument/workerPool.ts';
import { analyzeBar } from '../../src/modes/analyzeBar.ts';
import { parseKeyboardFile } from '../../src/fileFormats/keyboardFile.ts';

const file = parseKeyboardFile(JSON.parse(readFileSync(new URL('../../fixtures/demo-xylophone.keyboard.json', import.meta.url), 'utf8')), 'demo-xylophone.keyboard.json');
const cents = (a: number, b: number): number => 1200 * Math.log2(a / b);

let pool: WorkerPool<KeyboardTask, KeyboardTaskResult>;
let plan: KeyboardPlan;
let bars: StoredKeyboardBar[];

beforeAll(async () => {
  pool = createWorkerPool<KeyboardTask, KeyboardTaskResult>(new URL('../../src/instrument/keyboardBarWorker.ts', import.meta.url), { size: 2 });
  plan = await planKeyboard(file, { runner: pool });
  bars = plan.notes.map((n) => plan.bars[n]!);
}, 600_000);

afterAll(() => pool?.close());

describe('the demo xylophone (44 bars, F4–C8) with the default workshop', () => {
  it('plans every bar within its tolerances, checked on an independent 400-element mesh', () => {
    expect(plan.notes).toHaveLength(44);
    expect(plan.summary).toMatchObject({ bars: 44, designed: 44, in_tolerance: 44, complete: true });
    for (const bar of bars) {
      expect(bar.ratios, bar.note).toEqual(bar.midi <= 95 ? [1, 3] : [1]);
      const fine = analyzeBar(bar.bar, { modes: Math.max(2, bar.ratios.length), elements: 400 });
      bar.ratios.forEach((r, k) => expect(Math.abs(cents(fine.bending[k]!.hz, bar.target_hz[0]! * r)), `${bar.note} partial ${k + 1}`).toBeLessThanOrEqual(bar.tolerance_cents[k]!));
    }
  });
  it('never reports a blank it chose as wrong: no bar is left with a closest shape and remedies', () => {
    for (const bar of bars) {
      expect(bar.status, bar.note).toBe('in-tolerance');
      expect(bar.reason ?? '', bar.note).not.toMatch(/closest shape|Remedies/);
    }
  });
  it('drills each bar’s cord holes at its nodes within 0.5 mm', () => {
    for (const bar of bars) {
      const nodes = analyzeBar(bar.bar, { modes: 1 }).bending[0]!.nodes_mm!;
      expect(bar.bar.holes, bar.note).toHaveLength(2);
      bar.bar.holes!.forEach((hole, i) => expect(Math.abs(hole.x_mm - nodes[i === 0 ? 0 : nodes.length - 1]!), `${bar.note} hole ${i + 1}`).toBeLessThan(0.5));
    }
  });
});
