// Marking the advised cut as made, all of it or part of it, and taking that back while no round
// has been struck since. Pure edits of a project, like projectFileEdits.
import type { BarFile } from '../fileFormats/barFile.ts';
import { InputError } from '../fileFormats/InputError.ts';
import { roundDecimals } from '../fileFormats/roundDecimals.ts';
import { assertNoMaterialAdded, thicknessAtMm } from './projectFileEdits.ts';
import type { CaliperCheckpoint, ProjectBar, ProjectFile } from './projectFileTypes.ts';
import { replaceBar } from './replaceBar.ts';

/** The smallest part of an advised cut recorded as made, percent (less is no cut worth a round). */
export const smallestPartialCutPercent = 10;

/** How much of the advised cut was made: all of it (default) or a share of every depth, percent. */
export interface CutMade {
  /** Share of each advised depth taken off, percent (10–100); 100 = the whole cut. */
  percent?: number;
}

/**
 * `now` with `share` (0–1) of the way to `after` taken off at every station of either shape
 * (thickness now − share × (now − after)); the same length (a cut that shortens is not split).
 */
export function partOfCut(now: BarFile, after: BarFile, share: number): BarFile {
  if (now.section.shape !== 'rect' || after.section.shape !== 'rect') throw new InputError('round', 'cut', 'only an undercut can be made in part');
  if (Math.abs(now.length_mm - after.length_mm) > 1e-6) throw new InputError('round', 'cut', 'this cut shortens the bar: make it whole, or enter the shape you made in the Shape view');
  const positions = new Set<number>([0, now.length_mm]);
  for (const [x] of now.profile_mm ?? []) positions.add(x);
  for (const [x] of after.profile_mm ?? []) positions.add(x);
  const profile = [...positions]
    .sort((a, b) => a - b)
    .map((x) => {
      const before = thicknessAtMm(now, x);
      return [x, roundDecimals(before - share * (before - thicknessAtMm(after, x)), 3)] as [number, number];
    });
  return { ...structuredClone(now), profile_mm: profile };
}


/**
 * The maker has made the advised cut: the bar's shape becomes the advice's `bar_after` (checked
 * to remove material only), the time `at` is kept as when the cut was finished (the bar rests
 * before it is struck, and the next round records it), and the advice's caliper checkpoints wait
 * for the readings. Marks the bar "done" when the advice said it was done.
 *
 * With `made.percent` below 100 only that share of every advised depth was taken off: the shape
 * becomes `partOfCut`, the checkpoints expect its thicknesses, nothing is expected of its sound
 * (the advice predicted the whole cut), and the next round records the cut as planned with a note
 * of the part made — the calibration fits the shape actually cut.
 */
export function markCutDone(project: ProjectFile, barId: string, at: string, made: CutMade = {}): ProjectFile {
  const percent = made.percent ?? 100;
  if (!(Number.isFinite(percent) && percent >= smallestPartialCutPercent && percent <= 100))
    throw new InputError('round', 'part of the cut', `must lie within ${smallestPartialCutPercent}–100 %`);
  return replaceBar(project, barId, (bar) => {
    if (!bar.advice) throw new InputError('round', 'advice', 'there is no advised cut to mark as done');
    if (bar.advice.status === 'stuck') throw new InputError('round', 'advice', 'the advice is that no cut reaches the target; nothing to mark');
    if (bar.advice.status === 'done') return { ...bar, state: 'done', advice: null, updated_at: at };
    assertNoMaterialAdded(bar.current, bar.advice.bar_after, 'advice');
    const whole = percent >= 100;
    const shape = whole ? structuredClone(bar.advice.bar_after) : partOfCut(bar.current, bar.advice.bar_after, percent / 100);
    const next: ProjectBar = { ...bar, current: shape, state: 'tuning', advice: null, cut_finished_at: at, updated_at: at };
    delete next.expected_hz;
    delete next.cut_note;
    delete next.checkpoints;
    if (whole) next.expected_hz = [...bar.advice.predicted_hz];
    else next.cut_note = `part of the advised cut: ${roundDecimals(percent, 0)} % of each depth`;
    const points: CaliperCheckpoint[] = (bar.advice.checkpoints ?? []).map((point) => (whole ? { ...point } : { x_mm: point.x_mm, thickness_mm: roundDecimals(thicknessAtMm(shape, point.x_mm), 2) }));
    if (points.length > 0) next.checkpoints = points;
    return next;
  });
}

/** What taking back a marked cut needs: the bar as it was before the mark, and the project's lots then (a done bar teaches its lot). */
export interface MarkedCut {
  readonly bar: ProjectBar;
  readonly lots: ProjectFile['lots'];
}

/**
 * Takes back "I made this cut" (or "mark the bar done"): the bar returns to `before.bar` (its
 * shape, advice and state) and the lots to `before.lots`, as long as no round was recorded since
 * and the bar still has the shape the mark gave it; otherwise refused (record or remove the round first).
 */
export function undoMarkedCut(project: ProjectFile, before: MarkedCut, at: string): ProjectFile {
  const now = project.bars.find((bar) => bar.id === before.bar.id);
  if (!now) throw new InputError('project', 'bar', `no bar with id "${before.bar.id}"`);
  if (now.session.steps.length !== before.bar.session.steps.length) throw new InputError('round', 'undo', 'a round was recorded since the cut: remove that round first');
  const next = replaceBar(project, before.bar.id, () => ({ ...structuredClone(before.bar), updated_at: at }));
  const lots = before.lots === undefined ? undefined : structuredClone(before.lots);
  if (lots === undefined) {
    const copy = { ...next };
    delete copy.lots;
    return copy;
  }
  return { ...next, lots };
}
