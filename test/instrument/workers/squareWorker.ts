// A pool worker for the pool's own tests: squares numbers, fails on request.
import { serveWorkerTasks } from '../../../src/instrument/serveWorkerTasks.ts';
import { InputError } from '../../../src/fileFormats/InputError.ts';
import { threadId } from 'node:worker_threads';

serveWorkerTasks((job: { value: number; fail?: 'input' | 'internal'; spinMs?: number }) => {
  if (job.fail === 'input') throw new InputError('job', 'value', `cannot take ${job.value}`);
  if (job.fail === 'internal') throw new Error('boom');
  const until = Date.now() + (job.spinMs ?? 0);
  while (Date.now() < until) {
    // busy: stands in for a bar design
  }
  return { square: job.value * job.value, thread: threadId };
});
