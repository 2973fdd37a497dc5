// The workbench's one way to run background work for a view: every worker job (and the keyboard
// plan) goes through a TaskBook, and a view holds it as a Lit TaskController.
// - Each piece of work is bound to a subject (a bar id, or a fixed name) and a key (a
//   fingerprint of the inputs it was asked for). Its result goes to `onResult` with that binding —
//   never to "whatever the view shows now" — and is dropped when `isCurrent(binding)` says the
//   inputs have changed since.
// - Progress and the last value or problem are kept per subject, for the view to render.
// - Cancel stops one subject's work only. Policy 'restart': new inputs for a subject cancel the
//   work running for it. Policy 'latest' (while dragging): the running work finishes, and only the
//   newest inputs given meanwhile follow it. Cancel mode 'finish' (a batch that keeps what it has
//   done): cancel asks the work to stop and its partial result is still delivered.
// - A view that goes away cancels its work (TaskController.hostDisconnected).
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import type { JobCatalog, JobKind, JobOutcome, JobProblem, JobProgress } from '../worker/jobProtocol.ts';
import type { JobClient } from '../worker/JobClient.ts';

/** What a piece of work was asked for: whose it is, and a fingerprint of its inputs. */
export interface TaskBinding {
  readonly subject: string;
  readonly key: string;
}

/** Why a subject shows no new value: the job's own problem, or a result dropped as stale. */
export type TaskProblem = JobProblem | { status: 'stale' };

/** Where one subject's work stands (what a view renders). */
export interface TaskState<R, P = JobProgress> {
  /** The inputs of the work running or waiting, else of the last work. */
  binding: TaskBinding | null;
  /** Work is running or waiting. */
  running: boolean;
  /** Cancel was pressed and the work is finishing what it holds (cancel mode 'finish'). */
  stopping: boolean;
  progress: P | null;
  /** The last result delivered (kept while newer work runs and after a problem). */
  value: R | null;
  /** What `value` was computed for. */
  valueBinding: TaskBinding | null;
  /** The newest finished work's problem, when it had one. */
  problem: TaskProblem | null;
  /** From the newest inputs being given to their outcome, ms (page clock). */
  latencyMs: number | null;
  /** Worker time of the last result, ms. */
  workerMs: number | null;
}

/** What the work gets: its own signal and a progress callback. */
export interface TaskRun<P> {
  readonly signal: AbortSignal;
  onProgress(progress: P): void;
}

/** A piece of background work: resolves with its outcome, never rejects. */
export type TaskWork<R, P = JobProgress> = (run: TaskRun<P>) => Promise<JobOutcome<R>>;

/** How a book treats its work. */
export interface TaskOptions<R> {
  /** New inputs while work runs: 'restart' cancels it (default); 'latest' lets it finish, then runs the newest. */
  policy?: 'restart' | 'latest';
  /** Cancel: 'drop' the work's outcome (default), or let it 'finish' and deliver what it has. */
  cancelMode?: 'drop' | 'finish';
  /** Is a result for `binding` still wanted? Asked when it arrives; if not, it is dropped as stale. */
  isCurrent?: (binding: TaskBinding) => boolean;
  /**
   * A current result, with the binding it was asked for and when its inputs were given
   * (performance.now()). May return a message when it could not be used (shown as a problem).
   */
  onResult?: (value: R, binding: TaskBinding, givenAt: number) => string | void;
  /** Work that ended without a result (not when superseded or forgotten; after cancel, 'cancelled' is only in the state). */
  onProblem?: (problem: TaskProblem, binding: TaskBinding) => void;
}

interface Running<R, P> {
  readonly binding: TaskBinding;
  readonly controller: AbortController;
  readonly givenAt: number;
  readonly work: TaskWork<R, P>;
  stopping: boolean;
}

interface Entry<R, P> {
  state: TaskState<R, P>;
  current: Running<R, P> | null;
  waiting: { binding: TaskBinding; work: TaskWork<R, P>; givenAt: number } | null;
}

/** The state of a subject with no work yet. */
export function idleTaskState<R, P = JobProgress>(): TaskState<R, P> {
  return { binding: null, running: false, stopping: false, progress: null, value: null, valueBinding: null, problem: null, latencyMs: null, workerMs: null };
}

/** A worker job as task work: `client.request(kind, payload)` with the run's signal and progress. */
export function workerJob<C extends JobCatalog, K extends JobKind<C>>(client: JobClient<C>, kind: K, payload: C[K]['payload']): TaskWork<C[K]['result']> {
  return ({ signal, onProgress }) => client.request(kind, payload, { signal, onProgress: (done, total) => onProgress({ done, total }) });
}

/** Background work per subject, without Lit (the page-wide keyboard plan uses it directly). */
export class TaskBook<R, P = JobProgress> {
  private readonly entries = new Map<string, Entry<R, P>>();

  constructor(
    private readonly options: TaskOptions<R>,
    private readonly changed: () => void,
  ) {}

  /** Where `subject`'s work stands. */
  state(subject: string): TaskState<R, P> {
    return this.entries.get(subject)?.state ?? idleTaskState<R, P>();
  }

  /** The states of every subject with work running, oldest first. */
  active(): TaskState<R, P>[] {
    return [...this.entries.values()].filter((entry) => entry.state.running).map((entry) => entry.state);
  }

  /** Runs `work` for `binding.subject` (see the policy for work already running there). */
  run(binding: TaskBinding, work: TaskWork<R, P>, givenAt: number = performance.now()): void {
    let entry = this.entries.get(binding.subject);
    if (!entry) {
      entry = { state: idleTaskState<R, P>(), current: null, waiting: null };
      this.entries.set(binding.subject, entry);
    }
    const current = entry.current;
    if (current && !current.stopping) {
      if ((this.options.policy ?? 'restart') === 'latest') {
        entry.waiting = current.binding.key === binding.key ? null : { binding, work, givenAt };
        entry.state = { ...entry.state, binding, running: true };
        this.changed();
        return;
      }
      if (current.binding.key === binding.key) return;
      current.controller.abort();
      entry.current = null;
    }
    entry.waiting = null;
    this.start(entry, binding, work, givenAt);
  }

  /** Cancels `subject`'s work (and only its). */
  cancel(subject: string): void {
    const entry = this.entries.get(subject);
    if (!entry) return;
    entry.waiting = null;
    const current = entry.current;
    if (!current || current.stopping) return;
    current.controller.abort();
    if (this.options.cancelMode === 'finish') {
      current.stopping = true;
      entry.state = { ...entry.state, stopping: true };
    } else {
      entry.current = null;
      entry.state = { ...entry.state, running: false, stopping: false, progress: null, problem: { status: 'cancelled' } };
    }
    this.changed();
  }

  /** Cancels every subject's work. */
  cancelAll(): void {
    for (const subject of [...this.entries.keys()]) this.cancel(subject);
  }

  /** Cancels `subject`'s work and forgets its state (its late outcome is ignored). */
  forget(subject: string): void {
    const entry = this.entries.get(subject);
    if (!entry) return;
    entry.current?.controller.abort();
    this.entries.delete(subject);
    this.changed();
  }

  private start(entry: Entry<R, P>, binding: TaskBinding, work: TaskWork<R, P>, givenAt: number): void {
    const running: Running<R, P> = { binding, controller: new AbortController(), givenAt, work, stopping: false };
    entry.current = running;
    const keepProblem = this.options.policy === 'latest';
    entry.state = { ...entry.state, binding, running: true, stopping: false, progress: null, problem: keepProblem ? entry.state.problem : null };
    this.changed();
    const onProgress = (progress: P) => {
      if (entry.current !== running) return;
      entry.state = { ...entry.state, progress };
      this.changed();
    };
    void work({ signal: running.controller.signal, onProgress }).then(
      (outcome) => this.settle(entry, running, outcome),
      (error: unknown) => this.settle(entry, running, { status: 'failed', message: error instanceof Error ? error.message : String(error) }),
    );
  }

  private settle(entry: Entry<R, P>, running: Running<R, P>, outcome: JobOutcome<R>): void {
    // Superseded, cancelled (drop) or forgotten: its outcome belongs to nobody now.
    if (entry.current !== running || this.entries.get(running.binding.subject) !== entry) return;
    entry.current = null;
    const latencyMs = performance.now() - running.givenAt;
    const next = entry.waiting;
    entry.waiting = null;
    const base = { ...entry.state, running: next !== null, stopping: false, progress: null, latencyMs };
    if (outcome.status !== 'ok') {
      entry.state = { ...base, problem: outcome };
      this.options.onProblem?.(outcome, running.binding);
    } else if (this.options.isCurrent && !this.options.isCurrent(running.binding)) {
      entry.state = { ...base, problem: { status: 'stale' } };
      this.options.onProblem?.({ status: 'stale' }, running.binding);
    } else {
      entry.state = { ...base, value: outcome.value, valueBinding: running.binding, problem: null, workerMs: outcome.elapsedMs };
      const failure = this.options.onResult?.(outcome.value, running.binding, running.givenAt);
      if (failure) entry.state = { ...entry.state, problem: { status: 'failed', message: failure } };
    }
    this.changed();
    if (next) this.start(entry, next.binding, next.work, next.givenAt);
  }
}

/** A TaskBook held by a Lit element: it re-renders on every change and cancels its work when it goes away. */
export class TaskController<R, P = JobProgress> extends TaskBook<R, P> implements ReactiveController {
  constructor(host: ReactiveControllerHost, options: TaskOptions<R> = {}) {
    super(options, () => host.requestUpdate());
    host.addController(this);
  }

  hostConnected(): void {}

  hostDisconnected(): void {
    this.cancelAll();
  }
}
