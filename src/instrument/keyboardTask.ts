import { designKeyboardBar, type StoredKeyboardBar } from './designKeyboardBar.ts';
import { adviseKeyboardBlank, type BlankAdviceJob, type StoredBlankAdvice } from './keyboardBlankAdvice.ts';
import type { KeyboardBarJob } from './keyboardBarJobs.ts';

/** A unit of keyboard planning work for a worker: advise a blank length, or design a bar. */
export type KeyboardTask = { kind: 'advise'; job: BlankAdviceJob } | { kind: 'design'; job: KeyboardBarJob };

/** What a keyboard task hands back. */
export type KeyboardTaskResult = { kind: 'advise'; result: StoredBlankAdvice } | { kind: 'design'; result: StoredKeyboardBar };

/**
 * Runs one keyboard task (pure, synchronous): the function every worker serves — a Node worker
 * thread (keyboardBarWorker.ts) or a web worker (`onmessage = (e) => postMessage(runKeyboardTask(e.data))`).
 */
export function runKeyboardTask(task: KeyboardTask): KeyboardTaskResult {
  return task.kind === 'advise' ? { kind: 'advise', result: adviseKeyboardBlank(task.job) } : { kind: 'design', result: designKeyboardBar(task.job) };
}
