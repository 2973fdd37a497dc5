// A small pool of keyboard-planning web workers behind the library's BatchRunner interface, so
// planKeyboard runs every blank-advice and bar-design task off the main thread, several at once.
import { InputError, type BatchRunner, type KeyboardTask, type KeyboardTaskResult } from '../../src/index.ts';
import type { KeyboardTaskReply, KeyboardTaskRequest } from './keyboardTaskProtocol.ts';

/** The minimal worker interface the pool needs (a real Worker, or a stand-in). */
export interface TaskWorkerLike {
  postMessage(message: KeyboardTaskRequest): void;
  addEventListener(type: 'message', listener: (event: MessageEvent<KeyboardTaskReply>) => void): void;
  addEventListener(type: 'error', listener: (event: ErrorEvent) => void): void;
  terminate(): void;
}

/** Starts one keyboard-planning worker module (Vite bundles it from this URL pattern). */
export function startKeyboardTaskWorker(index: number): TaskWorkerLike {
  return new Worker(new URL('./keyboardTaskWorker.ts', import.meta.url), { type: 'module', name: `barwright-plan-${index + 1}` }) as unknown as TaskWorkerLike;
}

/** Workers for a plan on this machine: one core left for the page, at least 1, at most 4. */
export function planWorkerCount(cores: number | undefined = globalThis.navigator?.hardwareConcurrency): number {
  const available = typeof cores === 'number' && Number.isFinite(cores) ? Math.floor(cores) : 2;
  return Math.max(1, Math.min(4, available - 1));
}

interface Slot {
  worker: TaskWorkerLike;
  /** Reserved for a task (set before the task is posted, so two runs never share a worker). */
  busy: boolean;
  pending: { id: number; resolve: (result: KeyboardTaskResult) => void; reject: (error: unknown) => void } | null;
}

/**
 * A pool of `size` workers, started on first use; each runs one task at a time. A task whose
 * input breaks a rule rejects with that InputError; a worker that dies rejects its task and is
 * replaced on the next one. `close()` ends every worker (tasks still running reject).
 */
export class KeyboardWorkerPool implements BatchRunner<KeyboardTask, KeyboardTaskResult> {
  readonly size: number;
  private readonly slots: (Slot | null)[];
  private readonly waiting: ((slot: Slot) => void)[] = [];
  private nextId = 1;
  private closed = false;

  constructor(size: number = planWorkerCount(), private readonly spawn: (index: number) => TaskWorkerLike = startKeyboardTaskWorker) {
    this.size = Math.max(1, Math.floor(size));
    this.slots = Array.from({ length: this.size }, () => null);
  }

  private slot(index: number): Slot {
    const existing = this.slots[index];
    if (existing) return existing;
    const slot: Slot = { worker: this.spawn(index), busy: false, pending: null };
    slot.worker.addEventListener('message', (event) => this.receive(index, slot, event.data));
    slot.worker.addEventListener('error', (event) => this.fail(index, slot, new Error(`a planning worker stopped: ${event.message || 'unknown error'}`)));
    this.slots[index] = slot;
    return slot;
  }

  private receive(index: number, slot: Slot, reply: KeyboardTaskReply): void {
    const pending = slot.pending;
    if (!pending || pending.id !== reply.id) return;
    slot.pending = null;
    if (reply.type === 'result') pending.resolve(reply.result);
    else if (reply.type === 'input-error') pending.reject(new InputError(reply.source, reply.field, reply.rule));
    else pending.reject(new Error(reply.message));
    this.release(index, slot);
  }

  private fail(index: number, slot: Slot, error: Error): void {
    const pending = slot.pending;
    slot.pending = null;
    slot.worker.terminate();
    this.slots[index] = null;
    pending?.reject(error);
    if (!this.closed && this.waiting.length > 0) this.release(index, this.slot(index));
  }

  /** Hands a worker that finished to the next waiting task, or marks it free. */
  private release(_index: number, slot: Slot): void {
    const next = this.waiting.shift();
    if (next) next(slot);
    else slot.busy = false;
  }

  private acquire(): Promise<Slot> {
    for (let index = 0; index < this.size; index++) {
      const current = this.slots[index];
      if (!current || !current.busy) {
        const slot = this.slot(index);
        slot.busy = true;
        return Promise.resolve(slot);
      }
    }
    return new Promise((resolve) => this.waiting.push((slot) => {
      slot.busy = true;
      resolve(slot);
    }));
  }

  /** Runs one task on a free worker. */
  async run(task: KeyboardTask): Promise<KeyboardTaskResult> {
    if (this.closed) throw new Error('the planning workers were closed');
    const slot = await this.acquire();
    return new Promise<KeyboardTaskResult>((resolve, reject) => {
      const id = this.nextId++;
      slot.pending = { id, resolve, reject };
      slot.worker.postMessage({ id, task });
    });
  }

  /** Ends every worker. */
  close(): void {
    this.closed = true;
    this.slots.forEach((slot, index) => {
      if (!slot) return;
      const pending = slot.pending;
      slot.pending = null;
      slot.worker.terminate();
      this.slots[index] = null;
      pending?.reject(new Error('the planning workers were closed'));
    });
  }
}
