// Keeping the torsion, lateral and longitudinal modes of a solid design clear of its tuned
// partials: the check after each design, and the search over how far the arch is kept from the
// ends (the lever that moves those modes against the tuned partials while the partials are tuned).
import { collisionRuleText, otherModeClearances, type OtherMode, type OtherModeClearance } from '../modes/collisionWarnings.ts';

/** One solid design as the clearance search sees it. */
export interface ClearanceTrial {
  /** The solid model's tuned partials of the arch, Hz. */
  readonly solidHz: readonly number[];
  /** True when the solid partials meet every tolerance (and the line design behind it is feasible). */
  readonly meetsTargets: boolean;
  /** The arch's other modes on the solid model. */
  readonly others: readonly OtherMode[];
  /** The uncut ends the design kept (the larger of the two), mm. */
  readonly uncutEndMm: number;
  /** Solid analyses the design took. */
  readonly solidSolves: number;
}

/** The other modes against the beating rule, before and after the search (mm, Hz). */
export interface OtherModesReport {
  /** The rule in words (6 Hz below 1 kHz, 15 Hz below 2 kHz, 30 Hz above). */
  rule: string;
  /** The designer was asked to keep them clear (`keep_other_modes_clear`, default true). */
  kept_clear: boolean;
  /** True when every other mode of the returned arch is farther than the rule's distance from every tuned partial. */
  holds: boolean;
  /** The first design's other modes (the arch made for the partials alone), tightest first. */
  before: OtherModeClearance[];
  /** The returned arch's other modes, tightest first. */
  after: OtherModeClearance[];
  /** How far the arch was kept from each end, mm: first design and returned design (null: unchanged). */
  uncut_end_mm: { from: number; to: number } | null;
  /** Uncut ends tried beyond the first design, mm, in order. */
  uncut_ends_tried_mm: number[];
  /** Solid analyses spent on the search (beyond the first design's). */
  solid_solves: number;
}

/** Most designs tried beyond the first. */
const maxTrials = 4;
/** First step of the uncut ends, as a fraction of the bar's length (measured: about 1.5–2 Hz per mm on a torsion mode near partial 3 of an A2 bar). */
const firstStepFraction = 0.015;
/** Smallest and largest step, mm and fraction of the length. */
const smallestStepMm = 2;
const largestStepFraction = 0.1;
/** The arch keeps at least this share of the length in its middle (uncut ends at most (1 − share)/2 of it). */
const smallestArchShare = 0.2;
/** The search aims the tightest mode this far beyond the rule's distance (times the distance), for the step after. */
const aimBeyondRule = 1.5;

const tightest = (trial: ClearanceTrial): OtherModeClearance | undefined => otherModeClearances(trial.solidHz, trial.others)[0];
const allClear = (trial: ClearanceTrial): boolean => otherModeClearances(trial.solidHz, trial.others).every((c) => c.clear);
const sameMode = (a: OtherModeClearance, b: OtherModeClearance): boolean => a.family === b.family && a.mode === b.mode && a.partial === b.partial;

/**
 * Keeps every other mode (torsion, lateral, longitudinal) of a solid design farther from every
 * tuned partial than the beating rule's distance (collisionDistanceHz), with the tuned partials
 * still within their tolerances. The lever is the uncut ends: a narrower arch (kept farther from
 * the ends) moves torsion and lateral modes against the tuned partials by several Hz per mm while
 * the design keeps the partials on target (barwright's own solid runs: an A2 bar's torsion mode 2
 * rose from 6 to 26 Hz above its partial 3 as the uncut ends went from 124 to 136 mm; a change of
 * arch family moved it 2 Hz, shortening the blank by 15–30 mm 6–13 Hz with no steady direction).
 * It only ever lengthens the uncut ends, so every arch tried stays within the shop's limits. Steps:
 * 1.5 % of the length first, then a secant on the tightest mode's distance aimed 1.5 times the
 * rule's distance beyond its partial, at most four designs; stops at the first design whose
 * partials meet their tolerances with every other mode clear, or when a narrower arch no longer
 * meets the targets. `designAt(uncutEndMm, from)` designs again with those uncut ends (from the
 * trial it steps from); it returns undefined when stopped. Returns the design to keep (the first
 * clear one; when none is, the first design: a narrower arch that does not clear them is not
 * worth the change) and the report.
 */
export function keepOtherModesClear<T extends ClearanceTrial>(
  first: T,
  designAt: (uncutEndMm: number, from: T) => T | undefined,
  options: { readonly lengthMm: number; readonly keep: boolean },
): { chosen: T; report: OtherModesReport } {
  const before = otherModeClearances(first.solidHz, first.others);
  const tried: T[] = [];
  let chosen = first;
  if (options.keep && first.meetsTargets && !allClear(first)) {
    const largestEnd = ((1 - smallestArchShare) / 2) * options.lengthMm;
    let current = first;
    let previous: T | undefined;
    for (let trial = 0; trial < maxTrials; trial++) {
      const worst = tightest(current)!;
      let step = firstStepFraction * options.lengthMm;
      const earlier = previous && tightest(previous);
      if (previous && earlier && sameMode(earlier, worst) && current.uncutEndMm > previous.uncutEndMm) {
        const rate = (worst.apart_hz - earlier.apart_hz) / (current.uncutEndMm - previous.uncutEndMm);
        const aim = Math.sign(rate) * aimBeyondRule * worst.allowed_hz;
        if (rate !== 0 && (aim - worst.apart_hz) / rate > 0) step = (aim - worst.apart_hz) / rate;
      }
      step = Math.min(Math.max(step, smallestStepMm), largestStepFraction * options.lengthMm);
      const uncut = Math.round(Math.min(current.uncutEndMm + step, largestEnd) * 2) / 2;
      if (uncut <= current.uncutEndMm + 0.25) break;
      const next = designAt(uncut, current);
      if (!next) break;
      tried.push(next);
      if (!next.meetsTargets) break;
      if (allClear(next)) {
        chosen = next;
        break;
      }
      previous = current;
      current = next;
    }
  }
  const after = otherModeClearances(chosen.solidHz, chosen.others);
  return {
    chosen,
    report: {
      rule: collisionRuleText,
      kept_clear: options.keep,
      holds: after.every((c) => c.clear),
      before,
      after,
      uncut_end_mm: chosen === first ? null : { from: first.uncutEndMm, to: chosen.uncutEndMm },
      uncut_ends_tried_mm: tried.map((t) => t.uncutEndMm),
      solid_solves: tried.reduce((sum, t) => sum + t.solidSolves, 0),
    },
  };
}

/** A clearance in words: "torsion mode 2 is 6.3 Hz above partial 3 (rule: 15 Hz)". */
export function clearanceText(c: OtherModeClearance): string {
  return `${c.family} mode ${c.mode} is ${Math.abs(c.apart_hz).toFixed(1)} Hz ${c.apart_hz >= 0 ? 'above' : 'below'} partial ${c.partial} (rule: ${c.allowed_hz} Hz)`;
}
