// The tuning view's small judgements about a bar's rounds (no DOM): whether it was cut since it was
// last struck, when it may still be warm from a cut, the last air temperature read, whether stored
// advice answers what is asked now, and how a background problem reads.
import { warmBarMinutes, type ProjectBar } from '../src/index.ts';
import type { TaskProblem } from './controllers/TaskController.ts';
import type { AdviceTheory } from './adviceTheory.ts';

/** True when the bar's shape differs from the one last struck (a cut was made since). */
export function cutSinceLastRound(bar: ProjectBar): boolean {
  const last = bar.session.steps[bar.session.steps.length - 1];
  return last !== undefined && JSON.stringify(last.bar) !== JSON.stringify(bar.current);
}

/** The air temperature of the bar's last round, if recorded, °C. */
export function lastAirC(bar: ProjectBar): number | null {
  for (let index = bar.session.steps.length - 1; index >= 0; index--) {
    const air = bar.session.steps[index]!.air_temperature_c;
    if (air !== undefined) return air;
  }
  return null;
}

/**
 * When the cut the bar may still be warm from was finished, for the rest timer: the last cut's
 * time until the bar is struck, and after a round struck while it was warm (until the re-strike);
 * empty otherwise.
 */
export function restingSince(bar: ProjectBar): string {
  const finished = bar.cut_finished_at;
  if (!finished) return '';
  if (cutSinceLastRound(bar)) return finished;
  const last = bar.session.steps[bar.session.steps.length - 1];
  const warm = last?.cut_finished_at === finished && Date.parse(last.recorded_at ?? '') - Date.parse(finished) < warmBarMinutes * 60_000;
  return warm ? finished : '';
}

/** The bar's stored advice when it answers what is asked now (these very rounds, on `theory`'s model), else null. */
export function adviceFor(bar: ProjectBar, theory: AdviceTheory): ProjectBar['advice'] {
  const advice = bar.advice;
  if (!advice || advice.from_steps !== bar.session.steps.length) return null;
  return (advice.theory ?? 'line') === theory ? advice : null;
}

/** A background problem of the advice in words. */
export function adviceProblemText(problem: TaskProblem): string {
  switch (problem.status) {
    case 'stale':
      return 'The rounds changed while the advice was worked out; it was not kept.';
    case 'input-error':
      return `${problem.field}: ${problem.rule}`;
    case 'unavailable':
      return `${problem.what} is not available yet.`;
    case 'failed':
      return `The advice could not be worked out: ${problem.message}`;
    case 'cancelled':
      return 'Cancelled.';
  }
}
