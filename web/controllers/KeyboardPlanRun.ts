// The whole-keyboard plan as the workbench runs it: planKeyboard on a pool of web workers, with
// progress, cancel and resume from the plan stored in the project, and the result stored in the
// project through the app shell's keeper. One run at a time for the page; it carries on while
// the maker looks at other views, and any view can show its progress. The run's bookkeeping
// (running, stopping, progress, the result bound to the project and keyboard it was asked for)
// is a TaskBook's, in cancel mode 'finish': Cancel stops after the tasks in flight and what is
// done is still stored.
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import { InputError, isInputError, keyboardFileFromProject, planKeyboard, stableHash, storePlanInProject, withKeyboardPlan, type KeyboardFile, type KeyboardPlan, type PlanProgress, type ProjectFile, type ProjectPlanChoice } from '../../src/index.ts';
import { KeyboardWorkerPool, planWorkerCount } from '../worker/KeyboardWorkerPool.ts';
import { sendEdit, type EditOutcome } from '../events.ts';
import { TaskBook, type TaskBinding } from './TaskController.ts';

/** Where a run stands, for the views. */
export interface PlanRunState {
  running: boolean;
  /** Cancel was pressed: the tasks in progress finish, then what is done is stored. */
  stopping: boolean;
  progress: PlanProgress | null;
  /** Bars taken over from the stored plan when the design step started (resume). */
  kept: number | null;
  /** Workers in the pool of the run in progress (or the last). */
  workers: number;
  /** The last run's outcome, one calm line. */
  message: string;
  /** A rule the maker's choice broke (field and rule), or an internal failure (field ''). */
  problem: { field: string; rule: string } | null;
}

/** Options of a run. */
export interface PlanRunOptions {
  /** Ignore the stored plan and start over. */
  fresh?: boolean;
  /** `solid`: design every bar on the 3D model (a few seconds a bar); default the line model. */
  theory?: 'timoshenko' | 'solid';
  /** Applies an edit to the open project (the app shell's keeper); returns its outcome. */
  apply: (change: (project: ProjectFile) => ProjectFile) => EditOutcome;
}

/** The book's one subject: a page runs one keyboard plan at a time. */
const subject = 'keyboard-plan';

/** What a run was asked for, to store its plan with. */
interface RunInputs {
  projectId: string;
  keyboard: KeyboardFile;
  apply: PlanRunOptions['apply'];
}

/** Runs keyboard plans for the page and tells its subscribers. */
export class KeyboardPlanRun {
  private readonly listeners = new Set<(state: PlanRunState) => void>();
  private readonly book = new TaskBook<KeyboardPlan, PlanProgress>({ cancelMode: 'finish', onResult: (plan, binding) => this.store(plan, binding) }, () => this.notify());
  private extra: Pick<PlanRunState, 'kept' | 'workers' | 'message' | 'problem'> = { kept: null, workers: planWorkerCount(), message: '', problem: null };
  private inputs = new Map<string, RunInputs>();

  /** The run's state now. */
  get state(): PlanRunState {
    const task = this.book.state(subject);
    const failed = task.problem && !task.running ? task.problem : null;
    const problem = failed?.status === 'input-error' ? { field: failed.field, rule: failed.rule } : failed?.status === 'failed' ? { field: '', rule: failed.message } : this.extra.problem;
    return { running: task.running, stopping: task.stopping, progress: task.progress, ...this.extra, problem };
  }

  /** Calls `listener` on every change; returns an unsubscribe function. */
  subscribe(listener: (state: PlanRunState) => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  private notify(): void {
    const state = this.state;
    for (const listener of this.listeners) listener(state);
  }

  private set(change: Partial<typeof this.extra>): void {
    this.extra = { ...this.extra, ...change };
    this.notify();
  }

  /** Stops the run after the tasks in progress; what is done is stored. */
  cancel(): void {
    this.book.cancel(subject);
  }

  /**
   * Plans the chosen notes of the project: derives the keyboard file, resumes from the stored
   * plan (unless `fresh`), runs on the worker pool and stores the plan (complete or cut short)
   * with every designed bar's plan on the project's matching bar — on the project it was asked
   * for. A choice that breaks a rule is reported with its field and nothing runs.
   */
  start(project: ProjectFile, choice: ProjectPlanChoice, options: PlanRunOptions): void {
    if (this.state.running) return;
    let keyboard: KeyboardFile;
    try {
      keyboard = keyboardFileFromProject(project, choice);
    } catch (error) {
      if (!isInputError(error)) throw error;
      this.set({ problem: { field: error.field, rule: error.rule }, message: '' });
      return;
    }
    const stored = options.fresh ? undefined : project.keyboard_plan?.plan;
    const workers = planWorkerCount();
    const theory = options.theory ?? 'timoshenko';
    const key = stableHash({ project: project.id, keyboard, stored: stored ?? null, theory });
    this.inputs = new Map([[key, { projectId: project.id, keyboard, apply: options.apply }]]);
    this.set({ kept: null, workers, message: '', problem: null });
    this.book.run({ subject, key }, async ({ signal, onProgress }) => {
      const pool = new KeyboardWorkerPool(workers);
      const started = performance.now();
      try {
        const plan = await planKeyboard(keyboard, {
          runner: pool,
          theory,
          ...(stored ? { previous: { bars: stored.bars, advice: stored.advice } } : {}),
          signal,
          onProgress: (progress) => {
            if (progress.stage === 'design' && progress.note === undefined) this.set({ kept: progress.done });
            onProgress(progress);
          },
        });
        return { status: 'ok', value: plan, elapsedMs: performance.now() - started };
      } catch (error) {
        this.set({ message: 'The plan stopped on a problem; the plan stored before is unchanged.' });
        return isInputError(error)
          ? { status: 'input-error', source: error.source, field: error.field, rule: error.rule, message: error.message }
          : { status: 'failed', message: error instanceof Error ? error.message : String(error) };
      } finally {
        pool.close();
      }
    });
  }

  /** Stores a finished (or stopped) plan on the project it was asked for; returns a problem, if any. */
  private store(plan: KeyboardPlan, binding: TaskBinding): string | void {
    const inputs = this.inputs.get(binding.key);
    if (!inputs) return;
    const at = new Date().toISOString();
    let missing: string[] = [];
    const outcome = inputs.apply((current) => {
      if (current.id !== inputs.projectId) throw new InputError('plan', 'project', 'the plan was made for another project, which is no longer open');
      const placed = storePlanInProject(current, plan, at);
      missing = placed.missing;
      return withKeyboardPlan(placed.project, inputs.keyboard, plan, at);
    });
    const s = plan.summary;
    const counts = `${s.in_tolerance} in tolerance, ${s.out_of_tolerance} out of tolerance, ${s.infeasible} cannot be made on their blank`;
    const message = !outcome.ok
      ? `The plan could not be stored (${outcome.error.rule}); the plan stored before is unchanged.`
      : s.complete
        ? `Planned ${s.bars} bars: ${counts}.${missing.length ? ` ${missing.length} planned notes have no bar in the project yet; they are in the cut list and the templates.` : ''}`
        : `Stopped: ${s.designed} of ${s.bars} bars planned (${counts}). Press “Resume plan” to carry on from here.`;
    this.set({ message, problem: outcome.ok ? null : { field: '', rule: outcome.error.rule } });
  }
}

/** The page's one keyboard-plan run. */
export const keyboardPlanRun = new KeyboardPlanRun();

/** Re-renders its host on every change of the page's keyboard-plan run. */
export class KeyboardPlanRunController implements ReactiveController {
  private unsubscribe: (() => void) | null = null;

  constructor(
    private readonly host: ReactiveControllerHost,
    readonly run: KeyboardPlanRun = keyboardPlanRun,
  ) {
    host.addController(this);
  }

  /** The run's state now. */
  get state(): PlanRunState {
    return this.run.state;
  }

  hostConnected(): void {
    this.unsubscribe = this.run.subscribe(() => this.host.requestUpdate());
  }

  hostDisconnected(): void {
    this.unsubscribe?.();
    this.unsubscribe = null;
  }
}

/**
 * The app shell above an element (the first `bw-app` across shadow roots), which outlives the
 * views: a run started in one view stores its plan even if the maker has moved on.
 */
export function shellOf(element: Element): EventTarget {
  let node: Node | null = element;
  while (node) {
    if (node instanceof Element && node.localName === 'bw-app') return node;
    node = node.parentNode ?? (node instanceof ShadowRoot ? node.host : null);
  }
  return element;
}

/** Sends an edit to the app shell above `element`. */
export function applyThroughShell(element: Element): PlanRunOptions['apply'] {
  const shell = shellOf(element);
  return (change) => sendEdit(shell, change);
}
