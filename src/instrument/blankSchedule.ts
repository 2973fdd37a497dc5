import type { KeyboardFile } from '../fileFormats/keyboardFileTypes.ts';
import type { KeyboardNote } from './keyboardNotes.ts';
import type { NoteBlankWindow } from './keyboardBlankAdvice.ts';
import { smoothLengths, type LengthWindow } from './smoothLengths.ts';

/** One note's blank in the schedule (mm). */
export interface ScheduledBlank {
  note: string;
  midi: number;
  length_mm: number;
  width_mm: number;
  thickness_mm: number;
  /** The blank advisor's window for this note and section; absent when no length works. */
  window?: LengthWindow;
  /** Whether the advisor ran on this note or the window is interpolated between advised notes. */
  window_from: 'advised' | 'interpolated';
  /** The advised notes the window rests on. */
  anchors: string[];
  /** Length given in the keyboard file (kept as is). */
  fixed: boolean;
  /** Whether the length lies inside the window (a fixed length counts as inside only if it does). */
  inside: boolean;
  /** Why the note is flagged, when it is. */
  reason?: string;
}

/** Typical blank length over the uncut length when no note has a comfortable window (about 0.6: the advisor's answers on demo bass bars). */
const defaultUncutFraction = 0.6;

/**
 * The blank schedule of a keyboard: for every note the window of comfortable blank lengths with
 * its section (from the blank advisor, on the note itself or interpolated between advised notes
 * of its span: see noteBlankWindows), then one smooth, non-increasing progression through them
 * cut to the file's stock step (smoothLengths), lengths given in the file kept. Notes where no length works
 * with the chosen section, or whose scheduled length falls outside the window, are flagged with
 * the reason; they still get a length (the progression leans on the usual fraction of the uncut
 * length there) so the plan can design and show them.
 */
export function blankSchedule(file: KeyboardFile, notes: readonly KeyboardNote[], windows: ReadonlyMap<string, NoteBlankWindow>): ScheduledBlank[] {
  const found = notes.map((note) => {
    const entry = windows.get(note.name);
    if (!entry) throw new Error(`internal: no blank advice for ${note.name}`);
    return entry;
  });
  const lengthWindows = found.map((entry) => entry.window);
  const fixed = new Map<number, number>();
  notes.forEach((note, i) => note.fixed_length_mm !== undefined && fixed.set(i, note.fixed_length_mm));
  // Where no length is comfortable, lean on the fraction of the uncut length that the nearest
  // comfortable note with the same ratios uses (else the nearest of any), so the progression keeps
  // a physical trend through the gap.
  const fractionNear = (i: number): number => {
    let best: { distance: number; fraction: number } | undefined;
    for (const sameRatios of [true, false]) {
      found.forEach((entry, j) => {
        if (!entry.window || (sameRatios && notes[j]!.ratios.join(':') !== notes[i]!.ratios.join(':'))) return;
        const distance = Math.abs(notes[j]!.midi - notes[i]!.midi);
        if (!best || distance < best.distance) best = { distance, fraction: entry.window.preferred_mm / entry.uncut_length_mm };
      });
      if (best) return best.fraction;
    }
    return defaultUncutFraction;
  };
  const fallback_mm = found.map((entry, i) => (entry.window ? undefined : fractionNear(i) * entry.uncut_length_mm));
  const smoothed = smoothLengths(lengthWindows, { step_mm: file.blanks.length_step_mm ?? 1, fixed, fallback_mm });
  return notes.map((note, i) => {
    const window = lengthWindows[i];
    const length = smoothed[i]!.length_mm;
    const isFixed = fixed.has(i);
    const inside = window !== undefined && length >= window.min_mm - 1e-9 && length <= window.max_mm + 1e-9;
    const entry: ScheduledBlank = { note: note.name, midi: note.midi, length_mm: length, width_mm: note.width_mm, thickness_mm: note.thickness_mm, window_from: found[i]!.from, anchors: found[i]!.anchors, fixed: isFixed, inside };
    if (window) entry.window = window;
    if (!window) entry.reason = `blank advice${found[i]!.from === 'interpolated' ? ' (interpolated)' : ''}: ${found[i]!.reason ?? `no length reaches ${note.ratios.join(':')} comfortably with the ${note.width_mm} × ${note.thickness_mm} mm section`}`;
    else if (!inside)
      entry.reason = `${isFixed ? 'the given' : 'the scheduled'} ${length} mm blank lies outside the comfortable ${window.min_mm.toFixed(0)}–${window.max_mm.toFixed(0)} mm for this section`;
    return entry;
  });
}
