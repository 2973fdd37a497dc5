/** Something that runs one job at a time per slot: an in-thread function, a worker pool, web workers. */
export interface BatchRunner<Job, Result> {
  /** How many jobs it runs at once. */
  readonly size: number;
  run(job: Job): Promise<Result>;
}

/** Options of runBatch. */
export interface BatchOptions<Result> {
  /** Results already done, by key: those jobs are skipped (resuming a stopped batch). */
  done?: Readonly<Record<string, Result>>;
  /** Called after each job finishes (also once at the start with the skipped count). */
  onProgress?: (progress: BatchProgress<Result>) => void;
  /** Cancels the batch: no new job starts; the running ones finish and are kept. */
  signal?: AbortSignal;
}

/** Progress of a batch. */
export interface BatchProgress<Result> {
  done: number;
  total: number;
  /** The job just finished, when there is one. */
  key?: string;
  result?: Result;
}

/** What a batch hands back: every result so far by key, and whether it was cut short. */
export interface BatchOutcome<Result> {
  results: Record<string, Result>;
  cancelled: boolean;
}

/** A runner that calls a function in this thread (for small batches, tests and the browser fallback). */
export function inThreadRunner<Job, Result>(task: (job: Job) => Result): BatchRunner<Job, Result> {
  return { size: 1, run: async (job) => task(job) };
}

/**
 * Runs every job through the runner, keeping `runner.size` in flight, skipping those whose key
 * is already in `options.done`, reporting progress after each, and stopping cleanly when the
 * signal aborts (what finished is kept, so passing the outcome's results back as `done`
 * resumes). A job that throws rejects the whole batch with that error once the jobs in flight
 * have settled. Knows nothing about threads: any runner will do.
 */
export async function runBatch<Job, Result>(
  jobs: readonly Job[],
  keyOf: (job: Job) => string,
  runner: BatchRunner<Job, Result>,
  options: BatchOptions<Result> = {},
): Promise<BatchOutcome<Result>> {
  const results: Record<string, Result> = { ...(options.done ?? {}) };
  const pending = jobs.filter((job) => !(keyOf(job) in results));
  const total = jobs.length;
  let finished = total - pending.length;
  options.onProgress?.({ done: finished, total });
  let next = 0;
  let failure: unknown;
  const lane = async (): Promise<void> => {
    while (next < pending.length && failure === undefined && !options.signal?.aborted) {
      const job = pending[next++]!;
      const key = keyOf(job);
      try {
        const result = await runner.run(job);
        results[key] = result;
        finished++;
        options.onProgress?.({ done: finished, total, key, result });
      } catch (error) {
        failure ??= error;
      }
    }
  };
  await Promise.all(Array.from({ length: Math.max(1, Math.min(runner.size, pending.length)) }, lane));
  if (failure !== undefined) throw failure;
  return { results, cancelled: finished < total };
}
