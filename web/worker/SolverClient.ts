// The page's solver: one JobClient for the solver worker module, with three lanes. Quick jobs
// (a bar's modes while dragging, a chime set, resonators) share one worker so they answer at
// once; the keyboard overview's many-bar analysis has a worker of its own and stops between
// bars when cancelled; a design and next-cut advice, which cannot stop mid-way, each get a
// worker of their own (at most two at once), so cancelling one never touches another job. The 3D
// model has a worker module of its own (solidWorker.ts), started per job.
import { JobClient, type JobWorkerLike } from './JobClient.ts';
import type { SolidJobs, SolverJobs } from './solverProtocol.ts';

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
      lanes: { analyze: 'quick', chimeSet: 'quick', resonators: 'quick', analyzeMany: 'batch', design: 'own', nextCut: 'own' },
      ownLimit: 2,
      spareWorkers: 1,
    });
  }
}

/** The page's one solver client. */
export const solver = new SolverClient();

/** Starts one 3D-model worker (Vite bundles it from this URL pattern). */
export function startSolidWorker(name: string): JobWorkerLike {
  return new Worker(new URL('./solidWorker.ts', import.meta.url), { type: 'module', name }) as unknown as JobWorkerLike;
}

/** The page's 3D-model client (the shape view's check, the tuning view's advice on the 3D model): a job at a time in a worker of its own, kept for the next one (a cancel terminates only it). */
export const solidSolver = new JobClient<SolidJobs>({ name: 'barwright-solid', spawn: startSolidWorker, lanes: { solidModes: 'own', nextCutSolid: 'own' }, ownLimit: 1, spareWorkers: 1 });
