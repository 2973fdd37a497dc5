// The page's side of the job protocol (jobProtocol.ts), shared by every worker the workbench
// starts: typed requests, one promise per job that never rejects, progress callbacks, and
// cancel of that one job. Each kind runs on a lane:
// - a shared lane (any name): one worker for all jobs of the lane; cancel is cooperative — the
//   worker aborts that job's signal, the job stops at its next check (or, if it is a short one,
//   finishes and its answer is dropped); the other jobs on the worker are untouched;
// - 'own': a job that cannot stop mid-way (a synchronous design) gets a worker of its own;
//   cancel ends that worker, which held no other job. Idle workers are kept for the next job,
//   and at most `ownLimit` run at once (the rest wait their turn; a waiting job cancelled is
//   simply dropped).
// A cancelled job resolves 'cancelled' at once; anything its worker still sends for it is ignored.
import { outcomeOf, type FromJobWorker, type JobCatalog, type JobKind, type JobOutcome, type ToJobWorker } from './jobProtocol.ts';

/** The worker interface the client needs (a real Worker, or a stand-in in unit tests). */
export interface JobWorkerLike {
  postMessage(message: ToJobWorker<JobCatalog>, transfer?: Transferable[]): void;
  addEventListener(type: 'message', listener: (event: MessageEvent<FromJobWorker>) => void): void;
  addEventListener(type: 'error', listener: (event: ErrorEvent) => void): void;
  terminate(): void;
}

/** Where a kind of job runs: a named shared worker, or a worker of its own per job. */
export type JobLane = 'own' | (string & {});

/** How a client is set up. */
export interface JobClientOptions<C extends JobCatalog> {
  /** Prefix of the workers' names (shown in the browser's task manager and devtools). */
  name: string;
  /** Starts one worker (named `name`). */
  spawn: (name: string) => JobWorkerLike;
  /** The lane of each kind (default: the shared lane 'main'). */
  lanes?: Partial<Record<JobKind<C>, JobLane>>;
  /** Most own-lane workers running at once (default 2). */
  ownLimit?: number;
  /** Idle own-lane workers kept for reuse (default 1). */
  spareWorkers?: number;
}

/** Options of one request. */
export interface JobRequestOptions {
  onProgress?: (done: number, total: number) => void;
  /** Aborting it cancels this job only. */
  signal?: AbortSignal;
  /** Buffers to transfer with the payload (they become unusable on the page). */
  transfer?: Transferable[];
}

interface WorkerSlot {
  readonly handle: JobWorkerLike;
  readonly lane: string;
  /** Jobs on it now (own lane: at most one). */
  readonly jobs: Set<number>;
}

interface Job {
  readonly id: number;
  readonly lane: string;
  readonly message: ToJobWorker<JobCatalog>;
  readonly transfer: Transferable[];
  readonly resolve: (outcome: JobOutcome<unknown>) => void;
  readonly onProgress: ((done: number, total: number) => void) | undefined;
  worker: WorkerSlot | null;
}

/** A client for one worker module. */
export class JobClient<C extends JobCatalog> {
  private readonly shared = new Map<string, WorkerSlot>();
  private readonly idle: WorkerSlot[] = [];
  private readonly ownRunning = new Set<WorkerSlot>();
  private readonly waiting: Job[] = [];
  private readonly jobs = new Map<number, Job>();
  private nextId = 1;
  private started = 0;
  private readonly ownLimit: number;
  private readonly spareWorkers: number;

  constructor(private readonly options: JobClientOptions<C>) {
    this.ownLimit = Math.max(1, Math.floor(options.ownLimit ?? 2));
    this.spareWorkers = Math.max(0, Math.floor(options.spareWorkers ?? 1));
  }

  /** Jobs sent or waiting and not yet finished. */
  get pendingCount(): number {
    return this.jobs.size;
  }

  /** Workers alive now (shared, own-lane running and idle). */
  get workerCount(): number {
    return this.shared.size + this.ownRunning.size + this.idle.length;
  }

  /** Runs one job; resolves with its outcome (never rejects). */
  request<K extends JobKind<C>>(kind: K, payload: C[K]['payload'], options: JobRequestOptions = {}): Promise<JobOutcome<C[K]['result']>> {
    return new Promise((resolve) => {
      if (options.signal?.aborted) {
        resolve({ status: 'cancelled' });
        return;
      }
      const id = this.nextId++;
      const lane = this.options.lanes?.[kind] ?? 'main';
      const job: Job = {
        id,
        lane,
        message: { type: 'request', id, kind, payload } as ToJobWorker<JobCatalog>,
        transfer: options.transfer ?? [],
        resolve: resolve as (outcome: JobOutcome<unknown>) => void,
        onProgress: options.onProgress,
        worker: null,
      };
      this.jobs.set(id, job);
      options.signal?.addEventListener('abort', () => this.cancel(id), { once: true });
      if (lane === 'own') {
        this.waiting.push(job);
        this.startWaiting();
      } else this.send(job, this.sharedWorker(lane));
    });
  }

  /** Ends every worker; jobs still pending resolve 'failed'. */
  dispose(): void {
    for (const job of [...this.jobs.values()]) this.finish(job, { status: 'failed', message: 'the workers were closed' });
    for (const worker of [...this.shared.values(), ...this.ownRunning, ...this.idle]) worker.handle.terminate();
    this.shared.clear();
    this.ownRunning.clear();
    this.idle.length = 0;
    this.waiting.length = 0;
  }

  private spawn(lane: string): WorkerSlot {
    this.started += 1;
    const handle = this.options.spawn(`${this.options.name}-${lane === 'own' ? `own-${this.started}` : lane}`);
    const worker: WorkerSlot = { handle, lane, jobs: new Set() };
    handle.addEventListener('message', (event: MessageEvent<FromJobWorker>) => this.receive(worker, event.data));
    handle.addEventListener('error', (event: ErrorEvent) => this.lose(worker, `the worker stopped: ${event.message || 'unknown error'}`));
    return worker;
  }

  private sharedWorker(lane: string): WorkerSlot {
    let worker = this.shared.get(lane);
    if (!worker) {
      worker = this.spawn(lane);
      this.shared.set(lane, worker);
    }
    return worker;
  }

  private send(job: Job, worker: WorkerSlot): void {
    job.worker = worker;
    worker.jobs.add(job.id);
    worker.handle.postMessage(job.message, job.transfer);
  }

  /** Starts waiting own-lane jobs while there is room, on idle workers first. */
  private startWaiting(): void {
    while (this.waiting.length > 0 && this.ownRunning.size < this.ownLimit) {
      const job = this.waiting.shift()!;
      const worker = this.idle.pop() ?? this.spawn('own');
      this.ownRunning.add(worker);
      this.send(job, worker);
    }
  }

  private receive(worker: WorkerSlot, message: FromJobWorker): void {
    const job = this.jobs.get(message.id);
    if (!job || job.worker !== worker) return;
    if (message.type === 'progress') {
      job.onProgress?.(message.done, message.total);
      return;
    }
    this.finish(job, outcomeOf(message));
  }

  /** Resolves a job and frees its place (an own-lane worker goes back to idle, or ends). */
  private finish(job: Job, outcome: JobOutcome<unknown>, workerUsable = true): void {
    if (!this.jobs.delete(job.id)) return;
    const waitingAt = this.waiting.indexOf(job);
    if (waitingAt >= 0) this.waiting.splice(waitingAt, 1);
    const worker = job.worker;
    if (worker) {
      worker.jobs.delete(job.id);
      if (worker.lane === 'own' && this.ownRunning.delete(worker)) {
        if (workerUsable && this.idle.length < this.spareWorkers) this.idle.push(worker);
        else worker.handle.terminate();
      }
    }
    job.resolve(outcome);
    this.startWaiting();
  }

  /** Cancels job `id` alone. */
  private cancel(id: number): void {
    const job = this.jobs.get(id);
    if (!job) return;
    const worker = job.worker;
    if (worker && worker.lane !== 'own') worker.handle.postMessage({ type: 'cancel', id });
    // An own-lane worker held only this job, which cannot stop mid-way: it ends with it.
    this.finish(job, { status: 'cancelled' }, false);
  }

  /** A worker died: its jobs (and only its) fail; a shared lane starts afresh on its next job. */
  private lose(worker: WorkerSlot, message: string): void {
    worker.handle.terminate();
    if (this.shared.get(worker.lane) === worker) this.shared.delete(worker.lane);
    const idleAt = this.idle.indexOf(worker);
    if (idleAt >= 0) this.idle.splice(idleAt, 1);
    for (const id of [...worker.jobs]) {
      const job = this.jobs.get(id);
      if (job) this.finish(job, { status: 'failed', message }, false);
    }
    this.ownRunning.delete(worker);
    this.startWaiting();
  }
}
