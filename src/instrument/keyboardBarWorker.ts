// Node worker-thread module for keyboard planning: one task (blank advice or bar design) at a time (see workerPool.ts).
import { runKeyboardTask } from './keyboardTask.ts';
import { serveWorkerTasks } from './serveWorkerTasks.ts';

serveWorkerTasks(runKeyboardTask);
