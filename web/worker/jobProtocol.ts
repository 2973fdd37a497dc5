// The one message protocol between the workbench page and every worker it starts (solver,
// keyboard planning, listening). The page sends a request (id, kind, payload) and may later send
// a cancel for that id; the worker answers with any number of progress messages and exactly one
// final message: a result, an error, or "cancelled". Ids are the page's; each worker module
// declares its kinds as a job catalog (payload and result per kind).

/** A worker's jobs: for each kind, what the page sends and what the worker answers. */
export type JobCatalog = { [kind: string]: { payload: unknown; result: unknown } };

/** A kind of job of a catalog. */
export type JobKind<C extends JobCatalog> = keyof C & string;

/** Page → worker: run a job. */
export type JobRequestMessage<C extends JobCatalog> = { [K in JobKind<C>]: { type: 'request'; id: number; kind: K; payload: C[K]['payload'] } }[JobKind<C>];

/** Page → worker: stop job `id` (the worker aborts that job's signal; other jobs are untouched). */
export interface JobCancelMessage {
  type: 'cancel';
  id: number;
}

/** Everything the page sends a worker. */
export type ToJobWorker<C extends JobCatalog> = JobRequestMessage<C> | JobCancelMessage;

/** Why a job gave no result: a rule its input broke (field and rule), a kind not offered, or an internal failure. */
export type JobError =
  | { kind: 'input'; source: string; field: string; rule: string; message: string }
  | { kind: 'unavailable'; what: string }
  | { kind: 'failed'; message: string };

/** Everything a worker sends the page. */
export type FromJobWorker =
  | { type: 'progress'; id: number; done: number; total: number }
  | { type: 'result'; id: number; value: unknown; elapsedMs: number }
  | { type: 'error'; id: number; error: JobError }
  | { type: 'cancelled'; id: number };

/** How a job ended, as the page sees it (never thrown). */
export type JobOutcome<R> =
  | { status: 'ok'; value: R; elapsedMs: number }
  | { status: 'input-error'; source: string; field: string; rule: string; message: string }
  | { status: 'unavailable'; what: string }
  | { status: 'failed'; message: string }
  | { status: 'cancelled' };

/** Any outcome but a result. */
export type JobProblem = Exclude<JobOutcome<unknown>, { status: 'ok' }>;

/** Progress of a job: `done` of at most `total` steps (the unit is the job's own). */
export interface JobProgress {
  done: number;
  total: number;
}

/** The page's outcome for a worker's final message. */
export function outcomeOf<R>(message: Exclude<FromJobWorker, { type: 'progress' }>): JobOutcome<R> {
  switch (message.type) {
    case 'result':
      return { status: 'ok', value: message.value as R, elapsedMs: message.elapsedMs };
    case 'cancelled':
      return { status: 'cancelled' };
    case 'error': {
      const error = message.error;
      if (error.kind === 'input') return { status: 'input-error', source: error.source, field: error.field, rule: error.rule, message: error.message };
      if (error.kind === 'unavailable') return { status: 'unavailable', what: error.what };
      return { status: 'failed', message: error.message };
    }
  }
}
