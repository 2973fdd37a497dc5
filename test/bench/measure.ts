/** One line of the benchmark table. */
export interface BenchRow {
  suite: string;
  case: string;
  /** Median wall time of one run, milliseconds (absent for a row that measures a size). */
  median_ms?: number;
  /** How many timed runs the median is over. */
  runs: number;
  /** Free-form extra figures: ratios against a baseline in the same run, solve counts, sizes… */
  detail?: Record<string, number | string>;
}

/** A benchmark suite: a named group of measurements, run in this process. */
export interface BenchSuite {
  name: string;
  run: () => Promise<BenchRow[]> | BenchRow[];
}

/**
 * Times `fn` repeatedly (after `warmup` untimed runs) until at least `minRuns` runs and
 * `minTimeMs` have passed, and returns the median in milliseconds (performance.now()).
 */
export async function measure(
  fn: () => unknown | Promise<unknown>,
  { warmup = 3, minRuns = 7, minTimeMs = 300, maxRuns = 10_000 }: { warmup?: number; minRuns?: number; minTimeMs?: number; maxRuns?: number } = {},
): Promise<{ median_ms: number; runs: number }> {
  for (let i = 0; i < warmup; i++) await fn();
  const times: number[] = [];
  const start = performance.now();
  while (times.length < maxRuns && (times.length < minRuns || performance.now() - start < minTimeMs)) {
    const t0 = performance.now();
    await fn();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  const mid = times.length >> 1;
  const median = times.length % 2 ? times[mid]! : (times[mid - 1]! + times[mid]!) / 2;
  return { median_ms: median, runs: times.length };
}
