import { readFileSync } from 'node:fs';
import type { KeyboardTask, KeyboardTaskResult } from '../../../src/instrument/keyboardTask.ts';
import { planKeyboard, type KeyboardPlan } from '../../../src/instrument/planKeyboard.ts';
import { planChimeSet } from '../../../src/instrument/chimeSetPlan.ts';
import { createWorkerPool } from '../../../src/instrument/workerPool.ts';
import { parseChimeSetFile } from '../../../src/fileFormats/chimeSetFile.ts';
import { parseKeyboardFile } from '../../../src/fileFormats/keyboardFile.ts';
import { measure, type BenchRow, type BenchSuite } from '../measure.ts';

const keyboardPath = new URL('../../../fixtures/demo.keyboard.json', import.meta.url);
const chimesPath = new URL('../../../fixtures/demo.chimes.json', import.meta.url);
const workerModule = new URL('../../../src/instrument/keyboardBarWorker.ts', import.meta.url);

/** What one timed plan did: the plan, when the advice stage ended, and the CPU it used. */
interface PlanRun {
  plan: KeyboardPlan;
  adviceMs: number;
  cpuMs: number;
}

/**
 * Plans the demo keyboard on a fresh pool of `size` workers (pool start-up included: the wall time
 * a maker waits), noting when the advice stage ended and the process CPU time (all threads).
 */
async function planWithPool(size: number, previous?: Pick<KeyboardPlan, 'advice'>): Promise<PlanRun> {
  const file = parseKeyboardFile(JSON.parse(readFileSync(keyboardPath, 'utf8')), 'demo.keyboard.json');
  const cpu = process.cpuUsage();
  const start = performance.now();
  let adviceMs = 0;
  const pool = createWorkerPool<KeyboardTask, KeyboardTaskResult>(workerModule, { size });
  try {
    const plan = await planKeyboard(file, { runner: pool, ...(previous ? { previous } : {}), onProgress: (p) => p.stage === 'design' && adviceMs === 0 && (adviceMs = performance.now() - start) });
    const used = process.cpuUsage(cpu);
    return { plan, adviceMs, cpuMs: (used.user + used.system) / 1000 };
  } finally {
    await pool.close();
  }
}

/**
 * The 52-bar demo keyboard (A2–C7) planned end to end — blank schedule, every bar designed and
 * checked on the fine mesh — with the worker pool on both cores and with a single worker, in the
 * same run (target: under 15 s with the pool). One timed run each after no warm-up: a plan is
 * seconds long and each run starts its own threads. Details split the wall time into the blank
 * advice and the design stages and give the CPU time of all threads (wall ≈ CPU / cores when the
 * machine is otherwise idle; more when other work shares the cores). Plus the demo chime set.
 */
export const planSuite: BenchSuite = {
  name: 'plan',
  async run() {
    const rows: BenchRow[] = [];
    const timings: Record<number, number> = {};
    for (const size of [2, 1]) {
      let run: PlanRun | undefined;
      const timing = await measure(async () => void (run = await planWithPool(size)), { warmup: 0, minRuns: 1, minTimeMs: 0 });
      timings[size] = timing.median_ms;
      const summary = run!.plan.summary;
      rows.push({
        suite: 'plan',
        case: `52-bar keyboard, ${size} worker${size === 1 ? '' : 's'}`,
        ...timing,
        detail: {
          bars: summary.bars,
          in_tolerance: summary.in_tolerance,
          flagged: summary.bars - summary.in_tolerance,
          advised: summary.advised,
          advice_ms: run!.adviceMs,
          design_ms: timing.median_ms - run!.adviceMs,
          cpu_ms: run!.cpuMs,
          target_ms: size === 2 ? 15000 : 'none',
        },
      });
    }
    rows[0]!.detail!.speedup_vs_1 = timings[1]! / timings[2]!;
    // Re-planning with the blank advice stored from a first plan (the usual second run: the
    // schedule and every bar are redone, the advisor is not): the design stage alone.
    const stored = await planWithPool(2);
    const replanned: Record<number, number> = {};
    for (const size of [2, 1]) {
      let run: PlanRun | undefined;
      const timing = await measure(async () => void (run = await planWithPool(size, { advice: stored.plan.advice })), { warmup: 0, minRuns: 1, minTimeMs: 0 });
      replanned[size] = timing.median_ms;
      rows.push({
        suite: 'plan',
        case: `52-bar keyboard, stored blank advice, ${size} worker${size === 1 ? '' : 's'}`,
        ...timing,
        detail: { in_tolerance: run!.plan.summary.in_tolerance, cpu_ms: run!.cpuMs, target_ms: size === 2 ? 15000 : 'none' },
      });
    }
    rows[rows.length - 2]!.detail!.speedup_vs_1 = replanned[1]! / replanned[2]!;
    const chimes = parseChimeSetFile(JSON.parse(readFileSync(chimesPath, 'utf8')), 'demo.chimes.json');
    const chimeTiming = await measure(() => planChimeSet(chimes), { warmup: 1, minRuns: 3, minTimeMs: 0 });
    rows.push({ suite: 'plan', case: 'demo chime set (6 tubes), this thread', ...chimeTiming, detail: { chimes: chimes.notes.length } });
    return rows;
  },
};
