// A keyboard-planning worker: runs one keyboard task at a time (advise a blank length, or design
// a bar) through the library's runKeyboardTask and posts the result back. Several of these form
// the pool in KeyboardWorkerPool.ts.
import { isInputError, runKeyboardTask } from '../../src/index.ts';
import type { KeyboardTaskReply, KeyboardTaskRequest } from './keyboardTaskProtocol.ts';

function post(message: KeyboardTaskReply): void {
  (self as unknown as Worker).postMessage(message);
}

self.addEventListener('message', (event: MessageEvent<KeyboardTaskRequest>) => {
  const { id, task } = event.data;
  try {
    post({ id, type: 'result', result: runKeyboardTask(task) });
  } catch (error) {
    if (isInputError(error)) post({ id, type: 'input-error', source: error.source, field: error.field, rule: error.rule });
    else post({ id, type: 'failed', message: error instanceof Error ? error.message : String(error) });
  }
});
