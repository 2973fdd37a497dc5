import { parseNote } from '../fileFormats/noteName.ts';
import { setDesign } from './projectFileEdits.ts';
import type { ProjectFile } from './projectFileTypes.ts';
import type { KeyboardPlan } from '../instrument/planKeyboard.ts';

/** What storePlanInProject did. */
export interface StoredPlan {
  project: ProjectFile;
  /** Notes whose planned undercut was stored on the project's bar. */
  stored: string[];
  /** Planned notes with no keyboard bar in the project (add the bar first). */
  missing: string[];
}

/**
 * Stores a keyboard plan's designs in a project: every keyboard bar of the project whose note
 * (compared by MIDI number, so A#3 and Bb3 match) has a designed bar in the plan gets that design
 * as its plan (bar with profile, target, predicted partials on the check mesh, cents, and the
 * reason when flagged), through the project's own setDesign. Pure: returns a new project.
 */
export function storePlanInProject(project: ProjectFile, plan: Pick<KeyboardPlan, 'bars'>, at: string): StoredPlan {
  const planned = new Map(Object.values(plan.bars).map((bar) => [bar.midi, bar]));
  let next = project;
  const stored: string[] = [];
  const registers = new Map(project.instrument.registers.map((r) => [r.id, r]));
  const present = new Set<number>();
  for (const bar of project.bars) {
    if (registers.get(bar.register)?.family !== 'keyboard') continue;
    const midi = parseNote(bar.note).midi;
    present.add(midi);
    const design = planned.get(midi);
    if (!design) continue;
    next = setDesign(
      next,
      bar.id,
      {
        feasible: design.status === 'in-tolerance',
        bar: design.bar,
        target_hz: design.target_hz,
        predicted_hz: design.check.hz,
        cents_error: design.check.cents_error,
        ...(design.reason ? { reason: design.reason } : {}),
      },
      at,
    );
    stored.push(bar.note);
  }
  const missing = [...planned.values()].filter((bar) => !present.has(bar.midi)).sort((a, b) => a.midi - b.midi).map((bar) => bar.note);
  return { project: next, stored, missing };
}
