// The page's solver: one JobClient for the solver worker module, with three lanes. Quick jobs
// (a bar's modes while dragging, a chime set, resonators) share one worker so they answer at
// once; the keyboard overview's many-bar analysis has a worker of its own and stops between
// bars when cancelled; a design and next-cut advice, which cannot stop mid-way, each get a
// worker of their own (at most two at once), as does a bar on the 3D solid model, so cancelling
// one never touches another job.
import { JobClient, type JobWorkerLike } from './JobClient.ts';
import type { SolverJobs } from './solverProtocol.ts';

/** Starts one solver worker (Vite bundles it from this URL pattern). */
export function startSolverWorker(name: string): JobWorkerLike {
  return new Worker(new URL('./solverWorker.ts', import.meta.url), { type: 'module', name }) as unknown as JobWorkerLike;
}

/** A solver client: the solver worker module on its lanes. */
export class SolverClient extends JobClient<SolverJobs> {
  constructor(spawn: (name: string) => JobWorkerLike = startSolverWorker) {
    super({
      name: 'barwright-solver',
      spawn,
      lanes: { analyze: 'quick', chimeSet: 'quick', resonators: 'quick', analyzeMany: 'batch', design: 'own', nextCut: 'own', solidModes: 'own' },
      ownLimit: 2,
      spareWorkers: 1,
    });
  }
}

/** The page's one solver client. */
export const solver = new SolverClient();
