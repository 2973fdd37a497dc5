// Edits of a project's stored keyboard plan (pure: each returns a new project).
import type { KeyboardFile } from '../fileFormats/keyboardFileTypes.ts';
import type { KeyboardPlan } from '../instrument/planKeyboard.ts';
import type { ProjectFile } from './projectFileTypes.ts';

/**
 * The project with its keyboard plan replaced (pure): the keyboard file planned from, the plan
 * and the time. A plan cut short is kept too, so the next run resumes from it.
 */
export function withKeyboardPlan(project: ProjectFile, keyboard: KeyboardFile, plan: KeyboardPlan, at: string): ProjectFile {
  return { ...project, keyboard_plan: structuredClone({ keyboard, plan, planned_at: at }) };
}

/** The project without a stored keyboard plan (pure). */
export function withoutKeyboardPlan(project: ProjectFile): ProjectFile {
  const next = { ...project };
  delete next.keyboard_plan;
  return next;
}
