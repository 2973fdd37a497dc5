import type { CutLimitsInput } from '../design/cutLimits.ts';
import { midiToNoteName } from '../fileFormats/noteName.ts';
import { midiToHz } from '../fileFormats/concertPitch.ts';
import { parseNote } from '../fileFormats/noteName.ts';
import type { BarFileMaterial } from '../fileFormats/barFile.ts';
import { spanIndexOf, spanMidi, type KeyboardFile } from '../fileFormats/keyboardFile.ts';

/** One note of a keyboard with everything its bar is planned from (mm, Hz, cents). */
export interface KeyboardNote {
  /** 0 for the lowest bar. */
  index: number;
  name: string;
  midi: number;
  /** Equal-tempered frequency at the file's A4 moved by the note's offset, Hz. */
  target_hz: number;
  offset_cents: number;
  /** Partial ratios (first 1) and ± tolerances, cents, from the tuning schedule. */
  ratios: number[];
  tolerance_cents: number[];
  width_mm: number;
  thickness_mm: number;
  /** Thinnest allowed point, mm (span's own, else the fraction of the blank thickness). */
  min_thickness_mm: number;
  material: BarFileMaterial;
  /** Whether the material is this bar's own (a characterised blank) or the keyboard's. */
  material_from: 'bar' | 'keyboard';
  /** A blank length given in the file for this note, mm. */
  fixed_length_mm?: number;
  /** Resonator bore, mm, when the file sizes resonators. */
  resonator_inner_diameter_mm?: number;
}

/** Default thinnest point as a fraction of the blank thickness (the designer's default, common practice). */
const defaultMinThicknessFraction = 0.25;

/** Finds a note-keyed entry whatever its spelling (A#3 or Bb3). */
function byMidi<T>(record: Readonly<Record<string, T>>, midi: number): T | undefined {
  for (const [key, value] of Object.entries(record)) if (parseNote(key).midi === midi) return value;
  return undefined;
}

/**
 * Every note of a validated keyboard file from the lowest up, with its target frequency
 * (f = f_A4 · 2^((m − 69)/12) · 2^(offset/1200); MIDI 1.0), section, tuning, minimum thickness,
 * material and resonator bore looked up in the schedules. Pure.
 */
export function keyboardNotes(file: KeyboardFile): KeyboardNote[] {
  const lowest = parseNote(file.range.lowest).midi;
  const highest = parseNote(file.range.highest).midi;
  const notes: KeyboardNote[] = [];
  for (let midi = lowest; midi <= highest; midi++) {
    const section = file.sections[spanIndexOf(file.sections, midi)]!;
    const tuning = file.tuning[spanIndexOf(file.tuning, midi)]!;
    const offset = byMidi(file.pitch.offsets_cents, midi) ?? 0;
    const own = byMidi(file.bar_materials, midi);
    const fixed = byMidi(file.blanks.lengths_mm ?? {}, midi);
    const note: KeyboardNote = {
      index: midi - lowest,
      name: midiToNoteName(midi, file.spelling),
      midi,
      target_hz: midiToHz(midi, file.pitch.a4_hz) * 2 ** (offset / 1200),
      offset_cents: offset,
      ratios: [...tuning.ratios],
      tolerance_cents: [...tuning.tolerance_cents],
      width_mm: section.width_mm,
      thickness_mm: section.thickness_mm,
      min_thickness_mm: section.min_thickness_mm ?? (file.limits.min_thickness_fraction ?? file.workshop?.min_thickness_fraction ?? defaultMinThicknessFraction) * section.thickness_mm,
      material: own ?? file.material,
      material_from: own ? 'bar' : 'keyboard',
    };
    if (fixed !== undefined) note.fixed_length_mm = fixed;
    if (file.resonators) note.resonator_inner_diameter_mm = file.resonators.diameters[spanIndexOf(file.resonators.diameters, midi)]!.inner_diameter_mm;
    notes.push(note);
  }
  return notes;
}

/** The span ends of a schedule as MIDI numbers (for overviews that draw registers). */
export function scheduleBoundaries(file: KeyboardFile): { sections: [number, number][]; tuning: [number, number][] } {
  return { sections: file.sections.map(spanMidi), tuning: file.tuning.map(spanMidi) };
}

/** The limits a keyboard file sets for a note over its workshop's (mm): the thinnest point always (per span, or the file's or workshop's fraction), the slope and tool radius when the file gives them. */
export function keyboardLimits(file: KeyboardFile, note: KeyboardNote): CutLimitsInput {
  const limits: CutLimitsInput = { min_thickness_mm: note.min_thickness_mm };
  if (file.limits.max_slope !== undefined) limits.max_slope = file.limits.max_slope;
  if (file.limits.min_tool_radius_mm !== undefined) limits.min_tool_radius_mm = file.limits.min_tool_radius_mm;
  return limits;
}
