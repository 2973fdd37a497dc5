import { designBar } from '../design/designBar.ts';
import { describePlannedBar, type KeyboardBarResult } from './keyboardBarResult.ts';
import type { KeyboardBarJob } from './keyboardBarJobs.ts';

/** A planned bar with the fingerprint of the job it came from (for resuming). */
export interface StoredKeyboardBar extends KeyboardBarResult {
  fingerprint: string;
}

/**
 * Designs one keyboard bar: the undercut for its blank, target, ratios, tolerances and limits
 * (the designer's designBar), then the check on a fine mesh, thicknesses, arch, cord holes and
 * resonator (describePlannedBar). Pure and synchronous: the unit of work of a batch, safe to run
 * in any worker (Node worker thread or web worker).
 */
export function designKeyboardBar(job: KeyboardBarJob): StoredKeyboardBar {
  const design = designBar(job.blank, { target: { hz: job.target_hz, ratios: job.ratios, tolerance_cents: job.tolerance_cents }, limits: job.limits }, {}, `bar ${job.note}`);
  const result = describePlannedBar(design.bar, {
    note: job.note,
    midi: job.midi,
    index: job.index,
    ratios: job.ratios,
    tolerance_cents: job.tolerance_cents,
    target_hz: design.target_hz,
    feasible: design.feasible,
    predicted_hz: design.predicted_hz,
    ...(design.reason ? { reason: design.reason } : {}),
    ...(job.resonator ? { resonator: job.resonator } : {}),
    ...(job.schedule_note ? { notes: [job.schedule_note] } : {}),
  });
  return { ...result, fingerprint: job.fingerprint };
}
