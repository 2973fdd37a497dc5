// Events the workbench's elements send up to the app shell. An edit carries a pure change of the
// project; the shell applies it through the ProjectKeeper and writes the outcome back on the
// event before dispatchEvent returns, so the sender can show an error beside its field.
import type { InputError, ProjectFile } from '../src/index.ts';

/** Outcome written on an edit event by the shell. */
export type EditOutcome = { ok: true } | { ok: false; error: InputError };

/** "Apply this change to the project" (bubbles, composed). */
export class ProjectEditEvent extends Event {
  outcome: EditOutcome | null = null;
  constructor(readonly change: (project: ProjectFile) => ProjectFile) {
    super('project-edit', { bubbles: true, composed: true });
  }
}

/** Where the shell can go. */
export type ViewName = 'keyboard' | 'shape' | 'tuning' | 'resonators' | 'template' | 'chimes' | 'workshop' | 'plan-print';

/** "Show this view (and bar)" (bubbles, composed). */
export class NavigateEvent extends Event {
  constructor(
    readonly view: ViewName,
    readonly barId?: string,
  ) {
    super('navigate', { bubbles: true, composed: true });
  }
}

/** Sends an edit from `element` and returns its outcome. */
export function sendEdit(element: EventTarget, change: (project: ProjectFile) => ProjectFile): EditOutcome {
  const event = new ProjectEditEvent(change);
  element.dispatchEvent(event);
  return event.outcome ?? { ok: false, error: { name: 'InputError', message: 'the change was not applied', source: 'workbench', field: 'project', rule: 'the change was not applied' } as InputError };
}
