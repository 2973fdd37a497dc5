// The keyboard file the workbench plans from: derived from a project's instrument, registers and
// the keyboard bars already set up, over a range of notes the maker chooses.
import { midiToNoteName } from '../fileFormats/noteName.ts';
import { parseNote } from '../fileFormats/noteName.ts';
import type { BarFileMaterial } from '../fileFormats/barFile.ts';
import { InputError } from '../fileFormats/InputError.ts';
import { parseKeyboardFile } from '../fileFormats/keyboardFile.ts';
import type { KeyboardFile, ResonatorEntry, SectionEntry, TuningEntry } from '../fileFormats/keyboardFileTypes.ts';
import type { ProjectBar, ProjectFile, Register } from './projectFileTypes.ts';
import { defined } from '../fileFormats/jsonFields.ts';

/** What the maker chooses when planning from a project: which notes, and whether cut blanks keep their length. */
export interface ProjectPlanChoice {
  lowest: string;
  highest: string;
  /** Keep the length of the blanks already cut for bars set up in the project (default true). */
  keepBlankLengths?: boolean;
}

/** Where the keyboard-plan choices are reported (field names of InputError). */
const source = 'keyboard plan';

/** Material values compared without their label. */
function sameMaterial(a: BarFileMaterial, b: BarFileMaterial): boolean {
  const strip = (m: BarFileMaterial): string => {
    const { label: _label, ...rest } = m as BarFileMaterial & { label?: string };
    return JSON.stringify(Object.entries(rest).sort(([x], [y]) => x.localeCompare(y)));
  };
  return strip(a) === strip(b);
}

/** Joins runs of neighbouring notes with equal values into spans. */
function spansOf<T extends object>(notes: readonly number[], valueOf: (midi: number) => T, spelling: 'sharp' | 'flat'): (T & { from: string; to: string })[] {
  const spans: (T & { from: string; to: string })[] = [];
  let key = '';
  for (const midi of notes) {
    const value = valueOf(midi);
    const next = JSON.stringify(value);
    const last = spans[spans.length - 1];
    if (last && next === key) last.to = midiToNoteName(midi, spelling);
    else spans.push({ ...value, from: midiToNoteName(midi, spelling), to: midiToNoteName(midi, spelling) });
    key = next;
  }
  return spans;
}

/**
 * A keyboard file for the notes `lowest`–`highest` of a project. Each note takes its blank
 * section, tuning (ratios, tolerances), thinnest point and resonator bore from the keyboard bar
 * set up nearest below it (the lowest bar for notes beneath every bar), so the sections step
 * where the maker's blanks step; timber and A4 from the instrument, a bar's own timber where it
 * differs; resonators at the instrument's air temperature and open end when every register used
 * has a bore; the project's workshop (absent: barwright's default). Blanks already cut keep their length unless `keepBlankLengths` is false. Throws
 * InputError(keyboard plan, field, rule) for a range outside the instrument or with no bars.
 */
export function keyboardFileFromProject(project: ProjectFile, choice: ProjectPlanChoice): KeyboardFile {
  const instrument = project.instrument;
  const lowest = parseNote(choice.lowest, source, 'lowest note').midi;
  const highest = parseNote(choice.highest, source, 'highest note').midi;
  const rangeLow = parseNote(instrument.lowest_note).midi;
  const rangeHigh = parseNote(instrument.highest_note).midi;
  if (lowest < rangeLow || lowest > rangeHigh) throw new InputError(source, 'lowest note', `${choice.lowest} lies outside the instrument's range ${instrument.lowest_note}–${instrument.highest_note}`);
  if (highest < rangeLow || highest > rangeHigh) throw new InputError(source, 'highest note', `${choice.highest} lies outside the instrument's range ${instrument.lowest_note}–${instrument.highest_note}`);
  if (highest < lowest) throw new InputError(source, 'highest note', `${choice.highest} is below the lowest note ${choice.lowest}`);
  const registers = new Map(instrument.registers.map((r) => [r.id, r]));
  const bars = project.bars
    .filter((bar) => registers.get(bar.register)?.family === 'keyboard' && bar.blank.section.shape === 'rect')
    .map((bar) => ({ bar, midi: parseNote(bar.note).midi, register: defined(registers.get(bar.register), `register ${bar.register} of ${bar.note}`) }))
    .sort((a, b) => a.midi - b.midi);
  if (bars.length === 0) throw new InputError(source, 'bars', 'set up at least one keyboard bar (rectangular blank) first: its section and register are the plan’s starting point');
  const governing = (midi: number): { bar: ProjectBar; register: Register } => [...bars].reverse().find((entry) => entry.midi <= midi) ?? bars[0]!;
  const notes = Array.from({ length: highest - lowest + 1 }, (_, i) => lowest + i);
  const spelling = 'sharp';
  const sections: SectionEntry[] = spansOf(
    notes,
    (midi) => {
      const { bar } = governing(midi);
      const section = bar.blank.section as { width_mm: number; thickness_mm: number };
      const thinnest = bar.session.limits.min_thickness_mm;
      return { width_mm: section.width_mm, thickness_mm: section.thickness_mm, ...(thinnest > 0 && thinnest < section.thickness_mm ? { min_thickness_mm: thinnest } : {}) };
    },
    spelling,
  );
  const tuning: TuningEntry[] = spansOf(notes, (midi) => {
    const { register } = governing(midi);
    return { ratios: [...register.ratios], tolerance_cents: [...register.tolerance_cents] };
  }, spelling);
  const bores = notes.map((midi) => governing(midi).register.resonator_inner_diameter_mm);
  const diameters: ResonatorEntry[] | null = bores.every((bore) => bore !== undefined) ? spansOf(notes, (midi) => ({ inner_diameter_mm: governing(midi).register.resonator_inner_diameter_mm! }), spelling) : null;
  const inRange = bars.filter((entry) => entry.midi >= lowest && entry.midi <= highest);
  const barMaterials: Record<string, BarFileMaterial> = {};
  const lengths: Record<string, number> = {};
  for (const { bar, midi } of inRange) {
    const name = midiToNoteName(midi, spelling);
    if (!sameMaterial(bar.blank.material, instrument.material)) barMaterials[name] = bar.blank.material;
    if (choice.keepBlankLengths !== false) lengths[name] = bar.blank.length_mm;
  }
  const material = { ...instrument.material } as BarFileMaterial & { label?: string };
  delete material.label;
  const raw = {
    format: 'barwright.keyboard',
    version: 1,
    name: instrument.name,
    range: { lowest: midiToNoteName(lowest, spelling), highest: midiToNoteName(highest, spelling) },
    spelling,
    pitch: { a4_hz: instrument.a4_hz, offsets_cents: {} },
    material,
    bar_materials: barMaterials,
    sections,
    tuning,
    limits: {},
    ...(project.workshop ? { workshop: project.workshop } : {}),
    blanks: { length_step_mm: 1, lengths_mm: lengths },
    ...(diameters ? { resonators: { air_temperature_c: instrument.air_temperature_c, open_end: instrument.resonator_end, diameters } } : {}),
  };
  return parseKeyboardFile(raw, source);
}
