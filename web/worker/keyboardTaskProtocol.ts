// The keyboard-planning worker's one job (keyboardTaskWorker.ts), in the workbench's job
// protocol (jobProtocol.ts): a keyboard task in (advise a blank length, or design a bar), its
// result out.
import type { KeyboardTask, KeyboardTaskResult } from '../../src/index.ts';

/** The keyboard-planning job catalog. */
export type KeyboardJobs = {
  keyboardTask: { payload: KeyboardTask; result: KeyboardTaskResult };
};
