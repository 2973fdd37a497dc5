import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import type { BenchRow, BenchSuite } from '../measure.ts';

const root = fileURLToPath(new URL('../../../', import.meta.url));
/** The launcher `npx barwright` runs (package.json `bin`); BARWRIGHT_LAUNCHER measures another checkout's. */
const launcher = process.env.BARWRIGHT_LAUNCHER ?? fileURLToPath(new URL('../../../src/cli/barwright.mjs', import.meta.url));
/** Optionally another checkout's launcher (e.g. an older commit) timed in the same run, taking turns with this one. */
const otherLauncher = process.env.BARWRIGHT_COMPARE_LAUNCHER;

/** Whole-process runs per case (the median is reported); the cases take turns run by run. */
const runs = 11;

/**
 * What the command line cost before it was built ahead of time, when the launcher loaded the
 * TypeScript sources through tsx at every start: excess over bare Node in ms, as issue 14
 * measured it (whole-process medians on the project's 2-core machine). A record, not a target;
 * BARWRIGHT_COMPARE_LAUNCHER times such a checkout in the same run.
 */
const before = { help: 943, modes: 824 } as const;

interface Case {
  name: string;
  key: string;
  args: string[];
  /** Allowed excess over bare Node, ms (issue 14). */
  budgetMs?: number;
  /** Issue 14's figure for the same command before, ms over bare Node. */
  beforeMs?: number;
}

const cases: Case[] = [
  { name: 'node -e 0 (bare Node, the baseline)', key: 'node', args: ['-e', '0'] },
  { name: 'barwright --help', key: 'help', args: [launcher, '--help'], budgetMs: 150, beforeMs: before.help },
  { name: 'barwright modes fixtures/f4-practice.bar.json', key: 'modes', args: [launcher, 'modes', 'fixtures/f4-practice.bar.json'], budgetMs: 300, beforeMs: before.modes },
  ...(otherLauncher
    ? [
        { name: `${otherLauncher} --help`, key: 'other-help', args: [otherLauncher, '--help'] },
        { name: `${otherLauncher} modes fixtures/f4-practice.bar.json`, key: 'other-modes', args: [otherLauncher, 'modes', 'fixtures/f4-practice.bar.json'] },
      ]
    : []),
];

/**
 * Preloaded into every timed process (bare Node too): at exit it writes the process's CPU time
 * (all threads, user + system, µs) to stderr after a marker. CPU time moves far less with the
 * machine's load than wall time, so it is reported beside it.
 */
const cpuProbe = `data:text/javascript,process.on('exit',()=>{const u=process.cpuUsage();process.stderr.write('\\n@cpu '+(u.user+u.system)+'\\n')})`;

/** Wall and CPU time of one whole process, ms; throws if it fails (a benchmark of a failing command means nothing). */
function timeProcess(args: string[]): { wall: number; cpu: number } {
  const start = performance.now();
  const result = spawnSync(process.execPath, ['--import', cpuProbe, ...args], { cwd: root, encoding: 'utf8' });
  const wall = performance.now() - start;
  const probe = /\n@cpu (\d+)\n$/.exec(result.stderr);
  if (result.status !== 0 || !probe) throw new Error(`node ${args.join(' ')} exited ${result.status}: ${result.stderr}`);
  return { wall, cpu: Number(probe[1]) / 1000 };
}

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

/**
 * Command-line start-up as a maker meets it: whole processes (`node <launcher> …`, what the
 * `barwright` bin runs, build/cli/barwright.js behind it), median of 11 runs each, against a bare
 * `node -e 0` timed in the same run, the cases taking turns so a busy moment hits all alike; the
 * processes' CPU time beside the wall time. One untimed run of each first
 * (it also rebuilds a stale build/cli, as the launcher would). Targets: --help at most 150 ms and
 * modes at most 300 ms more than bare Node.
 */
export const startupSuite: BenchSuite = {
  name: 'startup',
  run() {
    for (const entry of cases) timeProcess(entry.args);
    const times = new Map<string, number[]>(cases.map((entry) => [entry.key, []]));
    const cpuTimes = new Map<string, number[]>(cases.map((entry) => [entry.key, []]));
    for (let run = 0; run < runs; run++) {
      for (const entry of cases) {
        const { wall, cpu } = timeProcess(entry.args);
        times.get(entry.key)!.push(wall);
        cpuTimes.get(entry.key)!.push(cpu);
      }
    }
    const bare = median(times.get('node')!);
    const bareCpu = median(cpuTimes.get('node')!);
    return cases.map((entry): BenchRow => {
      const value = median(times.get(entry.key)!);
      const cpu = median(cpuTimes.get(entry.key)!);
      if (entry.key === 'node') return { suite: 'startup', case: entry.name, median_ms: value, runs, detail: { cpu_ms: cpu } };
      const excess = value - bare;
      const detail: Record<string, number | string> = { over_bare_node_ms: excess, cpu_over_bare_node_ms: cpu - bareCpu };
      if (entry.budgetMs !== undefined) Object.assign(detail, { budget_ms: entry.budgetMs, within_budget: excess <= entry.budgetMs ? 'yes' : 'no' });
      if (entry.beforeMs !== undefined) detail.issue_before_over_bare_node_ms = entry.beforeMs;
      return { suite: 'startup', case: entry.name, median_ms: value, runs, detail };
    });
  },
};
