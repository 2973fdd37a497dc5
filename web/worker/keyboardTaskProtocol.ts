// Messages between the page and a keyboard-planning worker (keyboardTaskWorker.ts): one task in,
// exactly one reply out.
import type { KeyboardTask, KeyboardTaskResult } from '../../src/index.ts';

/** Page → worker: run this task. */
export interface KeyboardTaskRequest {
  id: number;
  task: KeyboardTask;
}

/** Worker → page: the task's result, the rule its input broke, or an internal failure. */
export type KeyboardTaskReply =
  | { id: number; type: 'result'; result: KeyboardTaskResult }
  | { id: number; type: 'input-error'; source: string; field: string; rule: string }
  | { id: number; type: 'failed'; message: string };
