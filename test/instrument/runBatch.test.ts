import { afterAll, describe, expect, it } from 'vitest';
import { inThreadRunner, runBatch } from '../../src/instrument/runBatch.ts';
import { createWorkerPool } from '../../src/instrument/workerPool.ts';
import { isInputError } from '../../src/fileFormats/InputError.ts';

type Job = { value: number; fail?: 'input' | 'internal'; spinMs?: number };
type Result = { square: number; thread: number };
const keyOf = (job: Job) => `n${job.value}`;

describe('runBatch (any runner)', () => {
  const square = inThreadRunner((job: Job): Result => ({ square: job.value * job.value, thread: 0 }));
  const jobs: Job[] = Array.from({ length: 10 }, (_, i) => ({ value: i }));

  it('runs every job, keyed, with progress after each', async () => {
    const seen: number[] = [];
    const outcome = await runBatch(jobs, keyOf, square, { onProgress: (p) => seen.push(p.done) });
    expect(outcome.cancelled).toBe(false);
    expect(Object.keys(outcome.results)).toHaveLength(10);
    expect(outcome.results.n7!.square).toBe(49);
    expect(seen).toEqual([0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10]);
  });

  it('stops when cancelled and resumes from what was done, skipping it', async () => {
    const controller = new AbortController();
    const first = await runBatch(jobs, keyOf, square, { signal: controller.signal, onProgress: (p) => p.done === 4 && controller.abort() });
    expect(first.cancelled).toBe(true);
    expect(Object.keys(first.results)).toHaveLength(4);
    const ran: number[] = [];
    const counting = inThreadRunner((job: Job): Result => (ran.push(job.value), { square: job.value * job.value, thread: 0 }));
    const second = await runBatch(jobs, keyOf, counting, { done: first.results });
    expect(second.cancelled).toBe(false);
    expect(Object.keys(second.results)).toHaveLength(10);
    expect(ran).toEqual([4, 5, 6, 7, 8, 9]);
  });

  it('rejects with the error a job threw', async () => {
    const failing = inThreadRunner((job: Job): Result => {
      if (job.value === 3) throw new Error('bad bar');
      return { square: 0, thread: 0 };
    });
    await expect(runBatch(jobs, keyOf, failing)).rejects.toThrow('bad bar');
  });
});

describe('worker pool (node:worker_threads, TypeScript through tsx)', () => {
  const pool = createWorkerPool<Job, Result>(new URL('./workers/squareWorker.ts', import.meta.url), { size: 2 });
  afterAll(() => pool.close());

  it('spreads the jobs over its threads and returns every result', async () => {
    const jobs: Job[] = Array.from({ length: 8 }, (_, i) => ({ value: i, spinMs: 30 }));
    const outcome = await runBatch(jobs, keyOf, pool);
    expect(Object.values(outcome.results).map((r) => r.square).sort((a, b) => a - b)).toEqual([0, 1, 4, 9, 16, 25, 36, 49]);
    // Both threads took work (each job busy 30 ms, two lanes).
    expect(new Set(Object.values(outcome.results).map((r) => r.thread)).size).toBe(2);
  });

  it('brings an InputError back as an InputError and an internal error as an Error', async () => {
    const input = await pool.run({ value: 2, fail: 'input' }).catch((e: unknown) => e);
    expect(isInputError(input)).toBe(true);
    expect((input as Error).message).toBe('job: value: cannot take 2');
    await expect(pool.run({ value: 2, fail: 'internal' })).rejects.toThrow('boom');
    // The pool still works afterwards.
    expect((await pool.run({ value: 5 })).square).toBe(25);
  });
});
