import type { SessionLog, SessionLogStep } from '../fileFormats/sessionFile.ts';

/**
 * How long a bar stays warm after a cut, minutes: a bar warm from the sander reads flat, so wait
 * about 10 minutes before measuring (common practice, brief.md §3).
 */
export const warmBarMinutes = 10;

/** A reading taken while the bar was still warm from its cut. */
export interface WarmReading {
  /** Step number, 1-based. */
  step: number;
  /** Minutes between the end of the cut and the reading. */
  minutes_after_cut: number;
  /** A later step (1-based) that read the same shape cool, and so governs; null when none has yet. */
  superseded_by: number | null;
}

/** The geometry of a step's bar (length, section, profile) as text, for "same shape" checks. */
function geometryKey(step: SessionLogStep): string {
  const bar = step.bar;
  return JSON.stringify([bar.length_mm, bar.section, bar.profile_mm ?? null]);
}

/**
 * For each step, the index (0-based) of the first step of its run of unchanged readings: a step
 * whose bar has the same length, section and profile as the step before and records no cut is a
 * re-strike of the same shape (at another time or temperature).
 */
export function sameShapeRuns(log: SessionLog): number[] {
  const runs: number[] = [];
  log.steps.forEach((step, k) => {
    const unchanged = k > 0 && step.cut === undefined && geometryKey(step) === geometryKey(log.steps[k - 1]!);
    runs.push(unchanged ? runs[k - 1]! : k);
  });
  return runs;
}

/**
 * The readings of a session taken within `warmBarMinutes` of the end of a cut (`cut_finished_at`,
 * or the last one recorded earlier in the same run of unchanged readings, beside `recorded_at`).
 * Each names the later step, if any, that read the same shape after the bar cooled: that reading
 * governs the calibration, and the warm one is set aside; without one, the warm reading is only
 * weighted down.
 */
export function warmReadings(log: SessionLog): WarmReading[] {
  const runs = sameShapeRuns(log);
  const cutTimes: (number | null)[] = [];
  log.steps.forEach((step, k) => {
    const own = step.cut_finished_at !== undefined ? Date.parse(step.cut_finished_at) : null;
    cutTimes.push(own ?? (runs[k] !== k ? cutTimes[k - 1]! : null));
  });
  const minutesAfter = log.steps.map((step, k) => {
    const cut = cutTimes[k];
    if (cut === null || cut === undefined || step.recorded_at === undefined) return null;
    return (Date.parse(step.recorded_at) - cut) / 60_000;
  });
  const warm: WarmReading[] = [];
  minutesAfter.forEach((minutes, k) => {
    if (minutes === null || minutes >= warmBarMinutes) return;
    let later: number | null = null;
    for (let j = k + 1; j < log.steps.length && runs[j] === runs[k]; j++) {
      const after = minutesAfter[j];
      if (after === null || after === undefined || after >= warmBarMinutes) {
        later = j + 1;
        break;
      }
    }
    warm.push({ step: k + 1, minutes_after_cut: minutes, superseded_by: later });
  });
  return warm;
}
