import type { KeyboardFile } from '../fileFormats/keyboardFileTypes.ts';
import { blankSchedule, type ScheduledBlank } from './blankSchedule.ts';
import type { StoredKeyboardBar } from './designKeyboardBar.ts';
import { adviceSpans, blankAdviceJob, noteBlankWindows, notesToAdvise, type StoredBlankAdvice } from './keyboardBlankAdvice.ts';
import { keyboardBarJobs, type KeyboardBarJob } from './keyboardBarJobs.ts';
import { keyboardNotes } from './keyboardNotes.ts';
import type { KeyboardTask, KeyboardTaskResult } from './keyboardTask.ts';
import { runBatch, type BatchRunner } from './runBatch.ts';
import { woodCautions } from './workshopCautions.ts';
import { defaultWorkshop } from '../fileFormats/workshopFile.ts';
import { defined } from '../fileFormats/jsonFields.ts';

/** A keyboard plan: blank advice, schedule and every designed bar, as stored and resumed (format "barwright.keyboard-plan"). */
export interface KeyboardPlan {
  format: 'barwright.keyboard-plan';
  version: 1;
  name: string;
  a4_hz: number;
  range: { lowest: string; highest: string };
  /** Notes from the lowest: the order of `schedule` and of the cut list. */
  notes: string[];
  /** The blank advisor's answers, by note (only the notes it was run on). */
  advice: Record<string, StoredBlankAdvice>;
  schedule: ScheduledBlank[];
  /** Designed bars by note (missing ones are not done yet: the batch was cancelled). */
  bars: Record<string, StoredKeyboardBar>;
  /** The workshop the bars were planned for (its name). */
  workshop?: string;
  /** `solid` when the bars were designed on the 3D model. */
  theory?: 'solid';
  summary: { bars: number; designed: number; in_tolerance: number; out_of_tolerance: number; infeasible: number; advised: number; complete: boolean };
  cautions: readonly string[];
}

/** Progress of a keyboard plan: which stage, and how far. */
export interface PlanProgress {
  stage: 'advice' | 'design';
  done: number;
  total: number;
  /** The note just finished, when there is one. */
  note?: string;
}

/** Options of planKeyboard. */
export interface PlanKeyboardOptions {
  /**
   * Who runs the tasks: a Node worker pool, web workers, or `inThreadRunner(runKeyboardTask)`.
   * Given by the caller so the planner itself never loads the designer (a page's main bundle
   * stays free of it: the work happens in the workers).
   */
  runner: BatchRunner<KeyboardTask, KeyboardTaskResult>;
  /** An earlier plan (or part of it) to resume from: advice and bars with unchanged inputs are kept. */
  previous?: Partial<Pick<KeyboardPlan, 'bars' | 'advice'>>;
  onProgress?: (progress: PlanProgress) => void;
  signal?: AbortSignal;
  /** `solid`: every bar is designed on the 3D model (a few seconds a bar); default the line model. */
  theory?: 'timoshenko' | 'solid';
}

/** Stored results whose fingerprints match the jobs': the work a resumed batch skips. */
export function reusableResults<T extends { fingerprint: string }>(jobs: readonly { key: string; fingerprint: string }[], stored: Readonly<Record<string, T>> | undefined): Record<string, T> {
  const done: Record<string, T> = {};
  for (const job of jobs) {
    const result = stored?.[job.key];
    if (result && result.fingerprint === job.fingerprint) done[job.key] = result;
  }
  return done;
}

/** Counts of a plan's bars by status. */
export function summarisePlan(notes: readonly string[], bars: Readonly<Record<string, StoredKeyboardBar>>, advised: number): KeyboardPlan['summary'] {
  const done = notes.map((n) => bars[n]).filter((b): b is StoredKeyboardBar => b !== undefined);
  return {
    bars: notes.length,
    designed: done.length,
    in_tolerance: done.filter((b) => b.status === 'in-tolerance').length,
    out_of_tolerance: done.filter((b) => b.status === 'out-of-tolerance').length,
    infeasible: done.filter((b) => b.status === 'infeasible').length,
    advised,
    complete: done.length === notes.length,
  };
}

/** A runner of one task kind on a keyboard-task runner. */
function runnerFor<K extends KeyboardTask['kind']>(runner: BatchRunner<KeyboardTask, KeyboardTaskResult>, kind: K) {
  type Job = Extract<KeyboardTask, { kind: K }>['job'];
  type Result = Extract<KeyboardTaskResult, { kind: K }>['result'];
  return {
    size: runner.size,
    run: async (job: Job): Promise<Result> => {
      const answer = await runner.run({ kind, job } as KeyboardTask);
      if (answer.kind !== kind) throw new Error(`internal: a ${kind} task came back as ${answer.kind}`);
      return answer.result as Result;
    },
  };
}

/**
 * Plans a whole keyboard end to end:
 * 1. notes from the file's schedules (keyboardNotes);
 * 2. blank advice in rounds through the runner — both ends of every span of notes sharing a
 *    section, material and tuning, the middle of long spans, and a bisection to the note where
 *    the targets stop being reachable (notesToAdvise); the other notes' windows interpolated
 *    (noteBlankWindows);
 * 3. the blank schedule, one smooth progression through the windows (blankSchedule);
 * 4. every bar designed through the runner (designKeyboardBar), with its check, cord holes and
 *    resonator.
 * Advice and bars already in `previous` with the same inputs are skipped; progress is reported
 * after every task; the signal stops the plan after the tasks in flight (summary.complete false).
 */
export async function planKeyboard(file: KeyboardFile, options: PlanKeyboardOptions): Promise<KeyboardPlan> {
  const runner = options.runner;
  const notes = keyboardNotes(file);
  const spans = adviceSpans(notes);
  const adviceJobs = new Map(notes.map((note) => [note.name, blankAdviceJob(file, note)]));
  const advice: Record<string, StoredBlankAdvice> = reusableResults([...adviceJobs.values()], options.previous?.advice);
  const base = { name: file.name, a4_hz: file.pitch.a4_hz, range: { ...file.range }, notes: notes.map((n) => n.name), workshop: (file.workshop ?? defaultWorkshop).name ?? 'workshop', ...(options.theory === 'solid' ? { theory: 'solid' as const } : {}), cautions: woodCautions } as const;
  const adviseRunner = runnerFor(runner, 'advise');
  let roundsDone = 0;
  for (;;) {
    const advised = new Map(Object.entries(advice));
    const wanted = notesToAdvise(spans, advised).map((n) => defined(adviceJobs.get(n.name), `blank advice for ${n.name}`));
    if (wanted.length === 0 || options.signal?.aborted) break;
    const outcome = await runBatch(wanted, (job) => job.key, adviseRunner, {
      ...(options.signal ? { signal: options.signal } : {}),
      onProgress: (p) => p.key && options.onProgress?.({ stage: 'advice', done: Object.keys(advice).length + p.done, total: Object.keys(advice).length + p.total, note: p.key }),
    });
    Object.assign(advice, outcome.results);
    if (outcome.cancelled || ++roundsDone > 64) break;
  }
  if (notesToAdvise(spans, new Map(Object.entries(advice))).length > 0) {
    return { format: 'barwright.keyboard-plan', version: 1, ...base, advice, schedule: [], bars: {}, summary: summarisePlan(base.notes, {}, Object.keys(advice).length) };
  }
  const schedule = blankSchedule(file, notes, noteBlankWindows(spans, new Map(Object.entries(advice))));
  const jobs: KeyboardBarJob[] = keyboardBarJobs(file, notes, schedule, options.theory ?? 'timoshenko');
  const outcome = await runBatch(jobs, (job) => job.key, runnerFor(runner, 'design'), {
    done: reusableResults(jobs, options.previous?.bars),
    ...(options.signal ? { signal: options.signal } : {}),
    onProgress: (p) => options.onProgress?.({ stage: 'design', done: p.done, total: p.total, ...(p.key ? { note: p.key } : {}) }),
  });
  return { format: 'barwright.keyboard-plan', version: 1, ...base, advice, schedule, bars: outcome.results, summary: summarisePlan(base.notes, outcome.results, Object.keys(advice).length) };
}
