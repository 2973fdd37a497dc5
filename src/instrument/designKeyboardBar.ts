import { designBar, type DesignRequest, type DesignResult } from '../design/designBar.ts';
import { applyRemedy } from '../design/designRemedies.ts';
import { designBarSolid } from '../design/designBarSolid.ts';
import { describePlannedBar, type KeyboardBarResult } from './keyboardBarResult.ts';
import type { KeyboardBarJob } from './keyboardBarJobs.ts';

/** A planned bar with the fingerprint of the job it came from (for resuming). */
export interface StoredKeyboardBar extends KeyboardBarResult {
  fingerprint: string;
}

/**
 * Designs one keyboard bar: the undercut for its blank, target, ratios, tolerances, workshop and
 * limits (the designer's designBar), then the check on a fine mesh, thicknesses, arch, cord holes
 * and resonator (describePlannedBar). A plan never keeps a blank it chose that cannot be cut to
 * its note: when the design misses, the designer's remedies for the blank (its length, then its
 * thickness, each checked by designing again) give the blank the plan uses instead, and the bar
 * says so. A blank the keyboard file gives (one already cut) is kept as it is. With `job.theory`
 * 'solid' the design is made on the 3D model (designBarSolid: the line model's targets corrected
 * by the solid model in outer rounds) and the bar's partials are the solid model's. Pure and synchronous: the unit of work of a batch, safe to run in any worker (Node
 * worker thread or web worker).
 */
export function designKeyboardBar(job: KeyboardBarJob): StoredKeyboardBar {
  const source = `bar ${job.note}`;
  const request: DesignRequest = {
    target: { hz: job.target_hz, ratios: job.ratios, tolerance_cents: job.tolerance_cents },
    limits: job.limits,
    workshop: job.workshop,
    limits_given_by: 'the keyboard file',
    remedy_kinds: ['blank_length_mm', 'blank_thickness_mm'],
    remedy_first_only: true,
    // A blank the keyboard file gives (one already cut) is the bar: nothing to choose again.
    ...(job.blank_given ? { remedies: false } : {}),
  };
  const design3d = (bar: typeof job.blank, given: DesignRequest): DesignResult => {
    const solid = designBarSolid(bar, given, {}, source);
    const { solid: report, theory: _theory, ...rest } = solid;
    const moved = report.collisions.uncut_end_mm;
    solidNote = `3D model: ${report.solid_solves} solid solves; the line model would call this arch ${report.line_model_cents.map((c) => `${c >= 0 ? '+' : ''}${c.toFixed(1)}`).join(' / ')} cents${moved && report.collisions.holds ? `; the arch kept ${moved.to.toFixed(1)} mm from each end (not ${moved.from.toFixed(1)}) to keep the torsion and lateral modes clear of the partials` : ''}`;
    return { ...rest, theory: 'timoshenko' };
  };
  let solidNote: string | null = null;
  const designOnce = (bar: typeof job.blank, given: DesignRequest): DesignResult => (job.theory === 'solid' ? design3d(bar, given) : designBar(bar, given, {}, source));
  let design: DesignResult = designOnce(job.blank, request);
  const notes: string[] = job.schedule_note ? [job.schedule_note] : [];
  if (!design.feasible && !job.blank_given && design.remedies?.length) {
    const remedy = design.remedies.find((r) => r.kind === 'blank_length_mm') ?? design.remedies.find((r) => r.kind === 'blank_thickness_mm');
    if (remedy) {
      const changed = applyRemedy(job.blank, request, remedy);
      const again = designOnce(changed.bar, { ...changed.request, remedies: false });
      if (again.feasible) {
        notes.push(`the plan changed the blank: ${remedy.change} (the scheduled blank could not reach the targets)`);
        design = again;
      }
    }
  }
  if (solidNote) notes.push(solidNote);
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
    ...(notes.length ? { notes } : {}),
    ...(job.theory === 'solid' ? { solid: { hz: design.predicted_hz, nodes_mm: design.cord_holes_mm } } : {}),
  });
  return { ...result, fingerprint: job.fingerprint };
}
