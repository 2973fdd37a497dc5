import { designBar, type DesignResult } from '../design/designBar.ts';
import { analyzeBar } from '../modes/analyzeBar.ts';
import { InputError } from '../fileFormats/InputError.ts';
import { bellBarForNote, type BellBarForNote, type BellBarStock } from './bellBarForNote.ts';

/** Options of tuneBellBarOvertone. */
export interface OvertoneTuningOptions {
  /** Thinnest the shallow undercut may go, mm (default 70 % of the bar thickness: a shallow cut). */
  min_thickness_mm?: number;
  /** ± tolerance of the fundamental and of the tuned overtone, cents (default 2 and 5). */
  tolerance_cents?: [number, number];
}

/** A bell bar with its second partial tuned: the uniform bar it starts from, and the design. */
export interface OvertoneTuning {
  uniform: BellBarForNote;
  /** The designer's answer: a shallow undercut, the ends trimmed to keep the fundamental. */
  design: DesignResult;
  /** The tuned bar's mode collisions (torsion, lateral) after the cut. */
  warnings: string[];
}

/**
 * Tunes a bell bar's second partial to `ratio` × the fundamental through the designer: the
 * uniform bar for the note (bellBarForNote) is the blank; designBar plans a shallow undercut
 * (no thinner than min_thickness_mm) with end trimming allowed (a cut lowers the fundamental;
 * shortening both ends brings it back up — on a uniform bar, trimming alone scales every partial
 * alike and cannot move a ratio). The result says whether the ratio was reached and, if not,
 * which limit binds.
 */
export function tuneBellBarOvertone(stock: BellBarStock, targetHz: number, ratio: number, options: OvertoneTuningOptions = {}, source = 'bell bar'): OvertoneTuning {
  if (!Number.isFinite(ratio) || ratio <= 1.5 || ratio > 8) throw new InputError(source, 'overtone ratio', `must be a number above 1.5 and at most 8 (got ${ratio})`);
  const uniform = bellBarForNote(stock, targetHz);
  const minimum = options.min_thickness_mm ?? 0.7 * stock.thickness_mm;
  const [fundamentalTolerance, overtoneTolerance] = options.tolerance_cents ?? [2, 5];
  const design = designBar(
    uniform.bar,
    {
      target: { hz: targetHz, ratios: [1, ratio], tolerance_cents: [fundamentalTolerance, overtoneTolerance] },
      limits: { min_thickness_mm: minimum, allow_shortening: true },
    },
    {},
    source,
  );
  return { uniform, design, warnings: analyzeBar(design.bar, { modes: 3 }).warnings };
}
