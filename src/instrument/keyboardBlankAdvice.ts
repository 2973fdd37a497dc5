import { adviseBlankLength } from '../design/adviseBlankLength.ts';
import type { CutLimitsInput } from '../design/cutLimits.ts';
import type { BarFileMaterial } from '../fileFormats/barFile.ts';
import type { KeyboardFile } from '../fileFormats/keyboardFileTypes.ts';
import { keyboardLimits, type KeyboardNote } from './keyboardNotes.ts';
import { defaultWorkshop, type Workshop } from '../fileFormats/workshopFile.ts';
import type { LengthWindow } from './smoothLengths.ts';
import { stableHash } from './stableHash.ts';
import { defined } from '../fileFormats/jsonFields.ts';

/** One blank-advice task: plain data, for any worker. */
export interface BlankAdviceJob {
  key: string;
  fingerprint: string;
  note: string;
  midi: number;
  section: { shape: 'rect'; width_mm: number; thickness_mm: number };
  material: BarFileMaterial;
  target: { hz: number; ratios: number[]; tolerance_cents: number[] };
  limits: CutLimitsInput;
  workshop: Workshop;
}

/** The blank advisor's answer for one note, as stored in a plan (mm). */
export interface StoredBlankAdvice {
  note: string;
  midi: number;
  fingerprint: string;
  feasible: boolean;
  shortest_mm?: number;
  longest_mm?: number;
  recommended_mm?: number;
  /** Length at which the uncut blank sounds the note. */
  uncut_length_mm: number;
  reason?: string;
  solves: number;
}

/** Where a note's window of blank lengths comes from. */
export interface NoteBlankWindow {
  window?: LengthWindow;
  /** 'advised': the advisor ran on this note; 'interpolated': between advised notes of the same span. */
  from: 'advised' | 'interpolated';
  /** The advised notes it rests on. */
  anchors: string[];
  /** Why no length works, when none does (the advisor's words). */
  reason?: string;
  /** Length (mm) at which the uncut blank sounds the note (advised, or interpolated in ln L). */
  uncut_length_mm: number;
}

/** The advice job of a note (its section, material, target, ratios, tolerances, workshop and limits). */
export function blankAdviceJob(file: KeyboardFile, note: KeyboardNote): BlankAdviceJob {
  const inputs = {
    section: { shape: 'rect' as const, width_mm: note.width_mm, thickness_mm: note.thickness_mm },
    material: note.material,
    target: { hz: note.target_hz, ratios: note.ratios, tolerance_cents: note.tolerance_cents },
    limits: keyboardLimits(file, note),
    workshop: file.workshop ?? defaultWorkshop,
  };
  return { key: note.name, fingerprint: stableHash(inputs), note: note.name, midi: note.midi, ...inputs };
}

/** Runs the designer's blank advisor on one note (pure, synchronous: a worker's unit of work). */
export function adviseKeyboardBlank(job: BlankAdviceJob): StoredBlankAdvice {
  const advice = adviseBlankLength({ section: job.section, material: job.material }, { target: job.target, limits: job.limits, workshop: job.workshop }, {}, `blank ${job.note}`);
  const stored: StoredBlankAdvice = { note: job.note, midi: job.midi, fingerprint: job.fingerprint, feasible: advice.feasible, uncut_length_mm: advice.uncut_length_mm, solves: advice.solves };
  if (advice.shortest_mm !== undefined) stored.shortest_mm = advice.shortest_mm;
  if (advice.longest_mm !== undefined) stored.longest_mm = advice.longest_mm;
  if (advice.recommended_mm !== undefined) stored.recommended_mm = advice.recommended_mm;
  if (advice.reason !== undefined) stored.reason = advice.reason;
  return stored;
}

/**
 * Runs of adjacent notes that share everything the advice depends on except the pitch: section,
 * minimum thickness, material, ratios and tolerances. Within a run the comfortable blank length
 * changes smoothly with pitch (for a fixed section f ∝ t/L², so L ∝ f^(−½): Blevins 1979,
 * table 8-1), which is what lets the schedule advise a few notes and interpolate the rest.
 */
export function adviceSpans(notes: readonly KeyboardNote[]): KeyboardNote[][] {
  const spans: KeyboardNote[][] = [];
  const signature = (n: KeyboardNote) => stableHash([n.width_mm, n.thickness_mm, n.min_thickness_mm, n.material, n.ratios, n.tolerance_cents]);
  for (const note of notes) {
    const last = spans[spans.length - 1];
    if (last && signature(last[last.length - 1]!) === signature(note)) last.push(note);
    else spans.push([note]);
  }
  return spans;
}

/** Longest run of notes between two advised ones before another is advised in the middle. */
const maxGap = 7;

/**
 * The notes still to advise, given those advised so far: both ends of every span; the middle of
 * any gap longer than maxGap; and, where one advised note can be cut and its neighbour cannot,
 * the middle note between them (bisection to the boundary: for a fixed section, a higher note
 * means a stubbier bar and higher partials harder to reach, so feasibility changes once).
 */
export function notesToAdvise(spans: readonly (readonly KeyboardNote[])[], advised: ReadonlyMap<string, { feasible: boolean }>): KeyboardNote[] {
  const wanted: KeyboardNote[] = [];
  const adviceFor = (name: string) => defined(advised.get(name), `blank advice for ${name}`);
  for (const span of spans) {
    const ends = [span[0]!, span[span.length - 1]!];
    const missingEnds = ends.filter((n) => !advised.has(n.name));
    if (missingEnds.length) {
      wanted.push(...new Set(missingEnds));
      continue;
    }
    const known = span.map((n, i) => ({ n, i })).filter(({ n }) => advised.has(n.name));
    for (let k = 0; k + 1 < known.length; k++) {
      const a = known[k]!;
      const b = known[k + 1]!;
      if (b.i - a.i <= 1) continue;
      const differ = adviceFor(a.n.name).feasible !== adviceFor(b.n.name).feasible;
      const bothFeasible = adviceFor(a.n.name).feasible && adviceFor(b.n.name).feasible;
      if (differ || (bothFeasible && b.i - a.i > maxGap)) wanted.push(span[Math.floor((a.i + b.i) / 2)]!);
    }
  }
  return wanted;
}

/** The advisor's answer as a window of lengths, when it found one. */
function windowOf(advice: StoredBlankAdvice): LengthWindow | undefined {
  if (!advice.feasible || advice.shortest_mm === undefined || advice.longest_mm === undefined || advice.recommended_mm === undefined) return undefined;
  return { preferred_mm: advice.recommended_mm, min_mm: advice.shortest_mm, max_mm: advice.longest_mm };
}

/**
 * Every note's window of blank lengths from the advice: its own when advised; otherwise, between
 * the nearest advised notes of its span, each bound interpolated linearly in ln L against the
 * note number (exact for a geometric run); no window when those notes have none.
 */
export function noteBlankWindows(spans: readonly (readonly KeyboardNote[])[], advised: ReadonlyMap<string, StoredBlankAdvice>): Map<string, NoteBlankWindow> {
  const result = new Map<string, NoteBlankWindow>();
  const adviceFor = (name: string) => defined(advised.get(name), `blank advice for ${name}`);
  for (const span of spans) {
    const known = span.filter((n) => advised.has(n.name));
    for (const note of span) {
      const own = advised.get(note.name);
      if (own) {
        const window = windowOf(own);
        result.set(note.name, { ...(window ? { window } : {}), from: 'advised', anchors: [note.name], uncut_length_mm: own.uncut_length_mm, ...(own.reason && !window ? { reason: own.reason } : {}) });
        continue;
      }
      const below = [...known].reverse().find((n) => n.midi < note.midi);
      const above = known.find((n) => n.midi > note.midi);
      if (!below || !above) throw new Error(`internal: ${note.name} lies outside its span's advised notes`);
      const a = adviceFor(below.name);
      const b = adviceFor(above.name);
      const wa = windowOf(a);
      const wb = windowOf(b);
      const anchors = [below.name, above.name];
      const s = (note.midi - below.midi) / (above.midi - below.midi);
      const lerp = (x: number, y: number) => Math.exp((1 - s) * Math.log(x) + s * Math.log(y));
      const uncut = lerp(a.uncut_length_mm, b.uncut_length_mm);
      if (wa && wb) {
        result.set(note.name, { window: { preferred_mm: lerp(wa.preferred_mm, wb.preferred_mm), min_mm: lerp(wa.min_mm, wb.min_mm), max_mm: lerp(wa.max_mm, wb.max_mm) }, from: 'interpolated', anchors, uncut_length_mm: uncut });
      } else {
        const source = wa ? b : a;
        result.set(note.name, { from: 'interpolated', anchors, uncut_length_mm: uncut, reason: `as at ${source.note}: ${source.reason ?? 'no comfortable length'}` });
      }
    }
  }
  return result;
}
