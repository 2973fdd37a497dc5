// A keyboard-planning worker: runs keyboard tasks (advise a blank length, or design a bar)
// through the library's runKeyboardTask, in the workbench's job protocol. Several of these form
// the pool in KeyboardWorkerPool.ts.
import { runKeyboardTask } from '../../src/index.ts';
import { serveJobs } from './serveJobs.ts';
import type { KeyboardJobs } from './keyboardTaskProtocol.ts';

serveJobs<KeyboardJobs>({ keyboardTask: (task) => runKeyboardTask(task) });
