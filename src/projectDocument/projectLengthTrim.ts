// Pieces tuned by their length (chime tubes and rods, plain bell bars): the shortening switch and
// where a shortening is taken, the length the maker trimmed recorded as cut, and the trim advice
// for the piece from its last round. Pure edits: a new project is returned, the input is untouched.
import { InputError } from '../fileFormats/InputError.ts';
import { defaultShortenAt, type LengthTrimInput, type ShortenAt } from '../session/index.ts';
import { barTargetHz, registerOf } from './projectFileTargets.ts';
import { lastReadingAtPlayingHz } from './projectSessionContext.ts';
import type { ProjectBar, ProjectFile } from './projectFileTypes.ts';
import { replaceBar } from './replaceBar.ts';


/** True for a piece tuned by its length alone: a tube or rod (never undercut). */
export function tunedByLength(bar: ProjectBar): boolean {
  return bar.current.section.shape !== 'rect';
}

/** Where this bar's shortenings are taken: the session's choice, else the usual place for its section. */
export function barShortenAt(bar: ProjectBar): ShortenAt {
  return bar.session.limits.shorten_at ?? defaultShortenAt(bar.current);
}

/** Whether advice may shorten the bar: always for a piece tuned by length, else the session's switch (default off). */
export function barMayShorten(bar: ProjectBar): boolean {
  return tunedByLength(bar) || bar.session.limits.allow_shortening === true;
}

/**
 * Turns shortening on or off for a bar's advice (`limits.allow_shortening` of its session):
 * sharpening a flat bar by shortening it costs length. Dropping the switch also drops any
 * shortening allowance. A piece tuned by length is always shortened: the switch is refused there.
 */
export function setAllowShortening(project: ProjectFile, barId: string, allow: boolean, at: string): ProjectFile {
  return replaceBar(project, barId, (bar) => {
    if (tunedByLength(bar) && !allow) throw new InputError('limits', 'allow_shortening', 'a tube or rod is tuned by its length alone: shortening cannot be turned off');
    const limits = { ...bar.session.limits, allow_shortening: allow };
    if (!allow) delete limits.max_shortening_mm;
    return { ...bar, session: { ...bar.session, limits }, advice: null, updated_at: at };
  });
}

/** Sets where the bar's shortenings are taken: its free end (a hung chime) or half from each end (a bar on cords). */
export function setShortenAt(project: ProjectFile, barId: string, shortenAt: ShortenAt, at: string): ProjectFile {
  if (shortenAt !== 'free-end' && shortenAt !== 'both-ends') throw new InputError('limits', 'shorten_at', 'must be "free-end" or "both-ends"');
  return replaceBar(project, barId, (bar) => ({ ...bar, session: { ...bar.session, limits: { ...bar.session.limits, shorten_at: shortenAt } }, advice: null, updated_at: at }));
}

/** Largest trim recorded at once, as a fraction of the piece (a trim is a few mm; this only stops a mistyped figure). */
const largestTrimFraction = 0.25;

/** The range (mm) a trim of this bar may take: 0.05 mm to a quarter of its length. */
export function trimRangeMm(bar: ProjectBar): { min: number; max: number } {
  return { min: 0.05, max: Math.floor(bar.current.length_mm * largestTrimFraction * 10) / 10 };
}

/**
 * The maker has shortened the piece by `trimmedMm` (mm, at the bar's shorten-at end): its length
 * now is that much less, and the time is kept as when the cut was finished (the next round records
 * the cut with the length taken off, see recordStep). Refuses a trim outside trimRangeMm.
 */
export function recordShortening(project: ProjectFile, barId: string, trimmedMm: number, at: string): ProjectFile {
  return replaceBar(project, barId, (bar) => {
    const range = trimRangeMm(bar);
    if (!Number.isFinite(trimmedMm) || trimmedMm < range.min || trimmedMm > range.max)
      throw new InputError('trim', 'shortened_mm', `must lie within ${range.min}–${range.max} mm (a quarter of the ${bar.current.length_mm} mm piece at most)`);
    const length = Math.round((bar.current.length_mm - trimmedMm) * 100) / 100;
    const next: ProjectBar = { ...bar, current: { ...bar.current, length_mm: length }, advice: null, cut_finished_at: at, state: bar.state === 'not-started' ? 'tuning' : bar.state, updated_at: at };
    delete next.expected_hz;
    return next;
  });
}

/**
 * What the trim advice for a piece tuned by its length is worked out from (lengthTrim's input): its
 * shape now, its last round's fundamental projected to the playing temperature, the target and the
 * tolerance. Null before the first round, or while the piece has been trimmed since it was last
 * struck (strike it first).
 */
export function barLengthTrimInput(project: ProjectFile, bar: ProjectBar): LengthTrimInput | null {
  const last = bar.session.steps[bar.session.steps.length - 1];
  if (!last || last.bar.length_mm !== bar.current.length_mm) return null;
  const reading = lastReadingAtPlayingHz(project, bar)?.[0];
  if (reading === undefined) return null;
  const register = registerOf(project, bar);
  return { bar: bar.current, measuredHz: reading, targetHz: barTargetHz(project, bar)[0]!, toleranceCents: register.tolerance_cents[0]!, shortenAt: barShortenAt(bar) };
}
