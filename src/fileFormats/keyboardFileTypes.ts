// Types of barwright's keyboard file (`*.keyboard.json`, format "barwright.keyboard"): one
// instrument described by register — range, pitch, timber, section and tuning schedules, cutting
// limits, blanks and resonators — from which a whole keyboard is planned.
import type { BarFileMaterial } from './barFile.ts';
import type { Workshop } from './workshopFile.ts';

/** A run of adjacent notes, both ends included, by note name (scientific pitch notation). */
export interface NoteSpan {
  from: string;
  to: string;
}

/** Blank section for a span of notes, mm; optional thinnest allowed point under the arch. */
export interface SectionEntry extends NoteSpan {
  width_mm: number;
  thickness_mm: number;
  min_thickness_mm?: number;
}

/** Tuning targets for a span: partial ratios to the fundamental (first 1) and ± tolerances, cents. */
export interface TuningEntry extends NoteSpan {
  ratios: number[];
  tolerance_cents: number[];
}

/** Resonator bore for a span, mm. */
export interface ResonatorEntry extends NoteSpan {
  inner_diameter_mm: number;
}

/** Limits applied to every bar, overriding what the workshop's tools set (per-span minimum thickness in `sections` wins). */
export interface KeyboardLimits {
  /** Thinnest point as a fraction of the blank thickness where a span gives no min_thickness_mm (default 0.25). */
  min_thickness_fraction?: number;
  /** Steepest slope of the cut surface, rise over run (default: the workshop's steepest-walled finishing tool). */
  max_slope?: number;
  /** Smallest radius of the cutting tool, mm (default: the workshop's smallest finishing tool; 0 for no limit). */
  min_tool_radius_mm?: number;
}

/** How blanks are cut to length from stock. */
export interface BlankStock {
  /** Blank lengths are rounded to this step, mm (default 1). */
  length_step_mm?: number;
  /** Lengths already cut (or wanted), by note: kept as they are. */
  lengths_mm?: Record<string, number>;
}

/** Resonator sizing for the keyboard. */
export interface KeyboardResonators {
  /** Air temperature of the room the instrument will be played in, °C. */
  air_temperature_c: number;
  /** Open top end: plain tube (unflanged) or with a flange. */
  open_end: 'unflanged' | 'flanged';
  diameters: ResonatorEntry[];
}

/** The keyboard file, version 1. */
export interface KeyboardFile {
  format: 'barwright.keyboard';
  version: 1;
  name: string;
  range: { lowest: string; highest: string };
  /** Note names in outputs: with sharps (C#4) or flats (Db4); default sharp. */
  spelling: 'sharp' | 'flat';
  /** Equal temperament at this A4, each note optionally moved by a few cents. */
  pitch: { a4_hz: number; offsets_cents: Record<string, number> };
  /** The timber of every bar unless a bar has its own. */
  material: BarFileMaterial;
  /** Characterised blanks: a note's own material, measured from its blank. */
  bar_materials: Record<string, BarFileMaterial>;
  sections: SectionEntry[];
  tuning: TuningEntry[];
  limits: KeyboardLimits;
  /** The workshop the bars are cut in (its tools set the limits; `limits` given here override). Absent: barwright's default workshop. */
  workshop?: Workshop;
  blanks: BlankStock;
  resonators?: KeyboardResonators;
}

/** The `format` value of a keyboard file. */
export const keyboardFileFormat = 'barwright.keyboard';

/** Current version of the keyboard file format. */
export const keyboardFileVersion = 1;
