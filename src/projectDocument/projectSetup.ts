// Setting up a project of one's own: an empty project of a chosen kind, its name (checked and
// never silently the same as another's), a copy, and its range of notes. Pure: ids and times are
// passed in.
import { InputError } from '../fileFormats/InputError.ts';
import { checkA4 } from '../fileFormats/concertPitch.ts';
import { midiToNoteName, parseNote } from '../fileFormats/noteName.ts';
import type { BarFileMaterial } from '../fileFormats/barFile.ts';
import type { MaterialPresetName } from '../fileFormats/materialPresetNames.ts';
import { findMaterialPreset } from '../material/materialPresets.ts';
import { syncSessionTargets } from './projectFileEdits.ts';
import { projectFileFormat, projectFileVersion, type ProjectFile, type Register } from './projectFileTypes.ts';

/**
 * Renames the project: trimmed, 1–200 characters, and (given the other stored projects' names)
 * not the name of another project. See checkProjectName.
 */
export function renameProject(project: ProjectFile, name: string, otherNames: readonly string[] = []): ProjectFile {
  return { ...project, name: checkProjectName(name, otherNames) };
}

/** Longest project name, characters (the project file's own limit). */
export const projectNameLimit = 200;

/**
 * The notes a bar of barwright's may sound: A0 to C8 (MIDI 21–108, the span of the largest
 * keyboard instruments; a bar outside it would be metres long or millimetres short).
 */
export const playableNotes = { lowest: 'A0', highest: 'C8', lowestMidi: 21, highestMidi: 108 } as const;

/**
 * A project name as the maker typed it, trimmed; refuses an empty name, one longer than 200
 * characters, and (given `otherNames`) one another stored project already has (case and spacing
 * ignored), so two projects never look alike in the list.
 */
export function checkProjectName(name: string, otherNames: readonly string[] = [], source = 'project'): string {
  const trimmed = typeof name === 'string' ? name.trim().replace(/\s+/g, ' ') : '';
  if (trimmed === '') throw new InputError(source, 'name', `must hold 1–${projectNameLimit} characters (it is empty)`);
  if (trimmed.length > projectNameLimit) throw new InputError(source, 'name', `must hold 1–${projectNameLimit} characters (it has ${trimmed.length})`);
  const key = nameKey(trimmed);
  if (otherNames.some((other) => nameKey(other) === key)) throw new InputError(source, 'name', `“${trimmed}” is already the name of another project; choose another`);
  return trimmed;
}

function nameKey(name: string): string {
  return name.trim().replace(/\s+/g, ' ').toLocaleLowerCase();
}

/**
 * `name` if no other project has it, else the first free "name (2)", "name (3)", … (a trailing
 * " (n)" of the name itself is replaced, so copies of copies do not pile up brackets).
 */
export function uniqueProjectName(name: string, takenNames: readonly string[]): string {
  const taken = new Set(takenNames.map(nameKey));
  const trimmed = name.trim().replace(/\s+/g, ' ') || 'Project';
  if (!taken.has(nameKey(trimmed))) return trimmed.slice(0, projectNameLimit);
  const stem = trimmed.replace(/ \(\d+\)$/, '');
  for (let count = 2; ; count += 1) {
    const suffix = ` (${count})`;
    const candidate = `${stem.slice(0, projectNameLimit - suffix.length)}${suffix}`;
    if (!taken.has(nameKey(candidate))) return candidate;
  }
}

/**
 * A note name a bar may sound (A0–C8, see playableNotes), checked and returned with its MIDI
 * number; the rule broken names the range.
 */
export function checkPlayableNote(name: string, source = 'note', field = 'note'): { name: string; midi: number } {
  const parsed = parseNote(name, source, field);
  if (parsed.midi < playableNotes.lowestMidi || parsed.midi > playableNotes.highestMidi) {
    throw new InputError(source, field, `${String(name).trim()} is outside ${playableNotes.lowest}–${playableNotes.highest}, the notes a bar can sound`);
  }
  return { name: String(name).trim(), midi: parsed.midi };
}

/** The kinds of project a maker can start empty, with the trade's usual targets (common practice). */
export const projectKinds = {
  'wooden-keyboard': { label: 'Wooden keyboard, tuned 1 : 4 : 10', family: 'keyboard', registerLabel: 'Keyboard bars', ratios: [1, 4, 10], tolerance: [2, 5, 15], preset: 'demo-tropical-hardwood' },
  xylophone: { label: 'Xylophone-type keyboard, tuned 1 : 3', family: 'keyboard', registerLabel: 'Keyboard bars', ratios: [1, 3], tolerance: [2, 5], preset: 'padauk' },
  'metal-bars': { label: 'Aluminium bars, tuned 1 : 4', family: 'keyboard', registerLabel: 'Metal bars', ratios: [1, 4], tolerance: [2, 5], preset: 'aluminium-6061-t6' },
  chimes: { label: 'Chime tubes (fundamental)', family: 'chime', registerLabel: 'Chime tubes', ratios: [1], tolerance: [3], preset: 'aluminium-6061-t6' },
} as const satisfies Record<string, { label: string; family: Register['family']; registerLabel: string; ratios: readonly number[]; tolerance: readonly number[]; preset: MaterialPresetName }>;

/** A kind of project (projectKinds). */
export type ProjectKind = keyof typeof projectKinds;

/**
 * A preset's values as an explicit bar-file material with its label, so the maker can see and
 * adjust each value (E along the bar, G where the preset gives one, else Poisson's ratio).
 */
export function materialFromPreset(name: string, source = 'material'): BarFileMaterial {
  const preset = findMaterialPreset(name);
  if (!preset) throw new InputError(source, 'preset', `“${name}” is not one of the material presets`);
  const material: { E_GPa: number; density_kg_m3: number; poisson: number; G_GPa?: number; label: string } = { E_GPa: preset.E_GPa, density_kg_m3: preset.density_kg_m3, poisson: preset.poisson, label: preset.label };
  if (preset.G_GPa !== undefined) material.G_GPa = preset.G_GPa;
  return material;
}

/** What an empty project starts with. */
export interface EmptyProjectOptions {
  id: string;
  name: string;
  kind: ProjectKind;
  lowestNote: string;
  highestNote: string;
  a4Hz: number;
  /** A material preset name (default: the kind's usual one). */
  materialPreset?: string;
  /** Names of the projects already stored (the new one must differ). */
  otherNames?: readonly string[];
}

/**
 * An empty project: the instrument (name, range, A4, timber or metal, one register with the
 * kind's usual ratios and tolerances), no bars yet, never saved. Air 20 °C, plain tube ends.
 */
export function emptyProject(options: EmptyProjectOptions): ProjectFile {
  const name = checkProjectName(options.name, options.otherNames ?? []);
  const kind = projectKinds[options.kind];
  if (!kind) throw new InputError('project', 'kind', `must be one of ${Object.keys(projectKinds).join(', ')}`);
  const range = checkRange(options.lowestNote, options.highestNote);
  const a4 = checkA4(options.a4Hz, 'project', 'a4_hz');
  return {
    format: projectFileFormat,
    version: projectFileVersion,
    id: options.id,
    name,
    revision: 0,
    saved_at: null,
    instrument: {
      name,
      lowest_note: range.lowest,
      highest_note: range.highest,
      a4_hz: a4,
      material: materialFromPreset(options.materialPreset ?? kind.preset),
      registers: [{ id: 'main', label: kind.registerLabel, family: kind.family, ratios: [...kind.ratios], tolerance_cents: [...kind.tolerance] }],
      air_temperature_c: 20,
      resonator_end: 'unflanged',
    },
    bars: [],
  };
}

/** Checks a range of notes: both playable, the lowest not above the highest. */
function checkRange(lowest: string, highest: string): { lowest: string; highest: string; lowestMidi: number; highestMidi: number } {
  const low = checkPlayableNote(lowest, 'range', 'lowest note');
  const high = checkPlayableNote(highest, 'range', 'highest note');
  if (high.midi < low.midi) throw new InputError('range', 'highest note', `${high.name} is below the lowest note ${low.name}`);
  return { lowest: low.name, highest: high.name, lowestMidi: low.midi, highestMidi: high.midi };
}

/**
 * Sets the instrument's range (lowest and highest note, each within A0–C8). Refuses a range that
 * would leave a keyboard bar outside it, naming the bars, so nothing disappears from view.
 */
export function setInstrumentRange(project: ProjectFile, lowestNote: string, highestNote: string): ProjectFile {
  const range = checkRange(lowestNote, highestNote);
  const families = new Map(project.instrument.registers.map((register) => [register.id, register.family]));
  const outside = project.bars.filter((bar) => {
    if (families.get(bar.register) !== 'keyboard') return false;
    const midi = parseNote(bar.note).midi;
    return midi < range.lowestMidi || midi > range.highestMidi;
  });
  if (outside.length > 0) {
    throw new InputError('range', outside.some((bar) => parseNote(bar.note).midi < range.lowestMidi) ? 'lowest note' : 'highest note', `${outside.map((bar) => bar.note).join(', ')} would lie outside ${range.lowest}–${range.highest}; remove ${outside.length === 1 ? 'that bar' : 'those bars'} first or choose a wider range`);
  }
  return syncSessionTargets({ ...project, instrument: { ...project.instrument, lowest_note: range.lowest, highest_note: range.highest } });
}

/** Every note name from `lowest` to `highest` (inclusive), spelt with sharps or flats. */
export function notesInRange(lowest: string, highest: string, spelling: 'sharp' | 'flat' = 'sharp'): string[] {
  const range = checkRange(lowest, highest);
  const notes: string[] = [];
  for (let midi = range.lowestMidi; midi <= range.highestMidi; midi += 1) notes.push(midiToNoteName(midi, spelling));
  return notes;
}

/**
 * A copy of a project under a new id and a name no other project has ("… (copy)", then
 * "… (copy) (2)"…): every bar, round, plan and setting kept; never saved yet.
 */
export function duplicateProject(project: ProjectFile, options: { id: string; takenNames: readonly string[] }): ProjectFile {
  const copy = structuredClone(project);
  return { ...copy, id: options.id, name: uniqueProjectName(`${project.name} (copy)`, options.takenNames), revision: 0, saved_at: null };
}
