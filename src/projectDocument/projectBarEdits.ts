// Adding, removing, ordering and naming a project's bars. Pure edits: each takes a project and
// returns a new one (the input is never changed), checking what the maker typed and keeping each
// bar's session target in step with its note. Times and ids are passed in or derived, never read
// from a clock.
import { InputError } from '../fileFormats/InputError.ts';
import { parseBarFile, type BarFile } from '../fileFormats/barFile.ts';
import { midiToNoteName, parseNote } from '../fileFormats/noteName.ts';
import { materialFamily } from '../material/materialFamily.ts';
import { materialFromFile } from '../modes/BarModel.ts';
import { syncSessionTargets } from './projectFileEdits.ts';
import { checkPlayableNote } from './projectSetup.ts';
import { chimePieceBlank, projectChimeSet } from './projectChimeSet.ts';
import type { ProjectBar, ProjectFile, Register } from './projectFileTypes.ts';
import { replaceBar } from './replaceBar.ts';

/** Longest bar name, characters. */
export const barNameLimit = 80;


/** The name a bar goes by: its label, or its note when it has none. */
export function barName(bar: ProjectBar): string {
  return bar.current.label ?? bar.blank.label ?? bar.note;
}

/** Whether a bar (or blank) is timber or metal (materialFamily of its material): the words shown with it depend on it. */
export function barMaterialFamily(bar: BarFile): 'timber' | 'metal' {
  return materialFileFamily(bar.material);
}

/** Whether a bar-file material (explicit values or a preset) is timber or metal (materialFamily). */
export function materialFileFamily(material: BarFile['material']): 'timber' | 'metal' {
  return materialFamily(materialFromFile(material));
}

/** Checks a bar name: trimmed, 1–80 characters. */
export function checkBarName(name: string, source = 'bar'): string {
  const trimmed = typeof name === 'string' ? name.trim().replace(/\s+/g, ' ') : '';
  if (trimmed === '' || trimmed.length > barNameLimit) throw new InputError(source, 'name', `must hold 1–${barNameLimit} characters (it has ${trimmed.length})`);
  return trimmed;
}

/** The register of `registerId`, or InputError naming the field. */
function registerById(project: ProjectFile, registerId: string): Register {
  const register = project.instrument.registers.find((candidate) => candidate.id === registerId);
  if (!register) throw new InputError('bar', 'register', `names no register of the instrument ("${registerId}")`);
  return register;
}

/**
 * The register a new bar of MIDI note `midi` belongs to when the maker does not say: that of the
 * nearest keyboard bar at or below it (else above it), as the keyboard plan does; with no keyboard
 * bar, the first keyboard register (else the first register).
 */
export function registerForNote(project: ProjectFile, midi: number): Register {
  const keyboardIds = new Set(project.instrument.registers.filter((register) => register.family === 'keyboard').map((register) => register.id));
  const keyboardBars = project.bars.filter((bar) => keyboardIds.has(bar.register)).map((bar) => ({ bar, midi: parseNote(bar.note).midi }));
  const below = keyboardBars.filter((entry) => entry.midi <= midi).sort((a, b) => b.midi - a.midi)[0];
  const above = keyboardBars.filter((entry) => entry.midi > midi).sort((a, b) => a.midi - b.midi)[0];
  const nearest = below ?? above;
  if (nearest) return registerById(project, nearest.bar.register);
  return project.instrument.registers.find((register) => register.family === 'keyboard') ?? project.instrument.registers[0]!;
}

/** A suggested blank for a new bar, and where the suggestion came from. */
export interface BlankSuggestion {
  blank: BarFile;
  /** The note of the bar it was scaled from, or null when no bar of the register exists yet. */
  scaledFrom: string | null;
  /** How the length was found, in words. */
  rule: string;
}


/** Starting section of a keyboard bar when the register has no bar yet (common practice, from memory). */
const firstKeyboardBlank = { width_mm: 50, thickness_mm: 20, lengthAtMiddleC_mm: 330 } as const;

/**
 * A blank for a new bar of `note` in `register`: from the nearest bar of that register, the same
 * section and material with the length scaled by 2^(−semitones/24) (f ∝ 1/L² for one section and
 * material: a uniform beam's closed form), rounded to whole mm. With no bar in the register yet, a
 * keyboard bar gets a 50 × 20 mm blank 330 mm long at C4, halving every two octaves (a starting
 * point, common practice — plan the bar to get its real length). A chime is cut from the project's
 * chime set at the set's length for the note (chimeLengthMm: the one computation of a chime's
 * length, which the set view shows too).
 */
export function suggestBlank(project: ProjectFile, note: string, registerId: string): BlankSuggestion {
  const midi = checkPlayableNote(note, 'bar', 'note').midi;
  const register = registerById(project, registerId);
  if (register.family === 'chime') {
    const set = projectChimeSet(project);
    return { blank: chimePieceBlank(set, note), scaledFrom: null, rule: `the chime set's length for ${note} (its stock, ${set.tune === 'strike' ? 'strike note' : 'fundamental'} tuned)` };
  }
  const neighbours = project.bars.filter((bar) => bar.register === register.id).map((bar) => ({ bar, distance: Math.abs(parseNote(bar.note).midi - midi), midi: parseNote(bar.note).midi }));
  neighbours.sort((a, b) => a.distance - b.distance || a.midi - b.midi);
  const nearest = neighbours[0];
  if (nearest) {
    const blank = structuredClone(nearest.bar.blank);
    delete blank.profile_mm;
    delete blank.holes;
    const semitones = midi - nearest.midi;
    blank.length_mm = Math.max(10, Math.round(nearest.bar.blank.length_mm * 2 ** (-semitones / 24)));
    blank.label = note;
    const exponent = `${semitones > 0 ? '−' : ''}${Math.abs(semitones)}/24`;
    return { blank, scaledFrom: nearest.bar.note, rule: `${nearest.bar.note}'s blank, its length × 2^(${exponent}) (a bar of one section sounds ∝ 1/length²)` };
  }
  const material = structuredClone(project.instrument.material);
  const length = Math.round(firstKeyboardBlank.lengthAtMiddleC_mm * 2 ** (-(midi - 60) / 24));
  return {
    blank: { format: 'barwright.bar', version: 1, label: note, length_mm: length, section: { shape: 'rect', width_mm: firstKeyboardBlank.width_mm, thickness_mm: firstKeyboardBlank.thickness_mm }, material },
    scaledFrom: null,
    rule: 'a starting blank (330 mm at C4, halving every two octaves; plan the bar for its real length)',
  };
}

/** A bar id not yet used in the project: `bar-NOTE`, then `bar-NOTE-2`, … */
function freshBarId(project: ProjectFile, note: string): string {
  const stem = `bar-${note.replace(/[^A-Za-z0-9#]+/g, '')}`;
  const taken = new Set(project.bars.map((bar) => bar.id));
  if (!taken.has(stem)) return stem;
  for (let count = 2; ; count += 1) if (!taken.has(`${stem}-${count}`)) return `${stem}-${count}`;
}

/** What a new bar is made from. */
export interface NewBar {
  note: string;
  /** Register id (default: registerForNote). */
  registerId?: string;
  /** The blank (default: suggestBlank). Its label, if any, is the bar's name. */
  blank?: BarFile;
  /** A name for the bar (default: the blank's label, else the note). */
  name?: string;
  at: string;
}

/** Index at which a bar of MIDI note `midi` in `registerId` keeps the list in order of register and pitch. */
function insertionIndex(project: ProjectFile, registerId: string, midi: number): number {
  const order = project.instrument.registers.map((register) => register.id);
  const rank = (bar: ProjectBar) => [order.indexOf(bar.register), parseNote(bar.note).midi] as const;
  const mine = [order.indexOf(registerId), midi] as const;
  const index = project.bars.findIndex((bar) => {
    const [registerRank, barMidi] = rank(bar);
    return registerRank > mine[0] || (registerRank === mine[0] && barMidi > mine[1]);
  });
  return index < 0 ? project.bars.length : index;
}

/** The minimum thickness a new bar's advice keeps to: a quarter of a rectangular blank (the designer's default), else 1 mm. */
function defaultMinimumThickness(blank: BarFile): number {
  return blank.section.shape === 'rect' ? Math.round(blank.section.thickness_mm * 25) / 100 : 1;
}

/**
 * Adds a bar: a note (A0–C8), its register, and a blank (checked like a bar file; suggested when
 * not given). Refuses a note the register already has. The bar is not started, with an empty
 * session aimed at its note, and goes where its pitch puts it within its register.
 */
export function addBar(project: ProjectFile, options: NewBar): { project: ProjectFile; barId: string } {
  const note = checkPlayableNote(options.note, 'bar', 'note');
  const register = options.registerId ? registerById(project, options.registerId) : registerForNote(project, note.midi);
  const twin = project.bars.find((bar) => bar.register === register.id && parseNote(bar.note).midi === note.midi);
  if (twin) throw new InputError('bar', 'note', `${register.label} already has a bar ${twin.note}; rename that one or choose another note`);
  const blank = parseBarFile(options.blank ?? suggestBlank(project, note.name, register.id).blank, 'blank');
  delete blank.profile_mm;
  const name = options.name !== undefined ? checkBarName(options.name) : (blank.label ?? note.name);
  blank.label = name;
  const id = freshBarId(project, note.name);
  const bar: ProjectBar = {
    id,
    note: note.name,
    register: register.id,
    state: 'not-started',
    blank: structuredClone(blank),
    current: structuredClone(blank),
    design: null,
    session: { format: 'barwright.session', version: 1, target: { note: note.name, ratios: [...register.ratios], tolerance_cents: [...register.tolerance_cents] }, limits: { min_thickness_mm: defaultMinimumThickness(blank) }, steps: [] },
    advice: null,
    notes: '',
    updated_at: options.at,
  };
  const bars = project.bars.slice();
  bars.splice(insertionIndex(project, register.id, note.midi), 0, bar);
  return { project: syncSessionTargets({ ...project, bars }), barId: id };
}

/**
 * Adds a bar for every note from `lowest` to `highest` (sharps or flats) that the register does
 * not have yet, each with a suggested blank scaled from its nearest bar (bars added earlier in the
 * same call count as neighbours). Returns the notes added and those skipped as already present.
 */
export function addBarsInRange(
  project: ProjectFile,
  range: { lowest: string; highest: string; registerId?: string; spelling?: 'sharp' | 'flat'; at: string },
): { project: ProjectFile; added: string[]; skipped: string[] } {
  const low = checkPlayableNote(range.lowest, 'range', 'lowest note');
  const high = checkPlayableNote(range.highest, 'range', 'highest note');
  if (high.midi < low.midi) throw new InputError('range', 'highest note', `${high.name} is below the lowest note ${low.name}`);
  if (high.midi - low.midi > 87) throw new InputError('range', 'highest note', 'a range holds at most 88 notes');
  let next = project;
  const added: string[] = [];
  const skipped: string[] = [];
  for (let midi = low.midi; midi <= high.midi; midi += 1) {
    const note = midiToNoteName(midi, range.spelling ?? 'sharp');
    const registerId = range.registerId ?? registerForNote(next, midi).id;
    if (next.bars.some((bar) => bar.register === registerId && parseNote(bar.note).midi === midi)) {
      skipped.push(note);
      continue;
    }
    next = addBar(next, { note, registerId, at: range.at }).project;
    added.push(note);
  }
  return { project: next, added, skipped };
}

/**
 * Turns the stored keyboard plan's notes that have no keyboard bar into bars: each gets the plan's
 * blank (length × width × thickness, with the material the plan used) and the planned undercut as
 * its plan. Returns the notes added.
 */
export function addBarsFromPlan(project: ProjectFile, at: string): { project: ProjectFile; added: string[] } {
  const record = project.keyboard_plan;
  if (!record) throw new InputError('plan', 'keyboard_plan', 'there is no keyboard plan yet: plan every bar first');
  const keyboardIds = new Set(project.instrument.registers.filter((register) => register.family === 'keyboard').map((register) => register.id));
  const present = new Set(project.bars.filter((bar) => keyboardIds.has(bar.register)).map((bar) => parseNote(bar.note).midi));
  let next = project;
  const added: string[] = [];
  for (const planned of Object.values(record.plan.bars).sort((a, b) => a.midi - b.midi)) {
    if (present.has(planned.midi)) continue;
    const blank: BarFile = { ...structuredClone(planned.bar), label: planned.note, length_mm: planned.blank.length_mm, section: { shape: 'rect', width_mm: planned.blank.width_mm, thickness_mm: planned.blank.thickness_mm } };
    delete blank.profile_mm;
    delete blank.holes;
    const result = addBar(next, { note: planned.note, registerId: registerForNote(next, planned.midi).id, blank, at });
    next = replaceBar(result.project, result.barId, (bar) => ({
      ...bar,
      design: {
        feasible: planned.status === 'in-tolerance',
        bar: parseBarFile(planned.bar, 'plan'),
        target_hz: [...planned.target_hz],
        predicted_hz: [...planned.check.hz],
        cents_error: [...planned.check.cents_error],
        ...(planned.reason ? { reason: planned.reason } : {}),
        planned_at: record.planned_at,
      },
    }));
    present.add(planned.midi);
    added.push(planned.note);
  }
  return { project: next, added };
}


/** A bar taken out of a project, with where it stood (to put it back). */
export interface RemovedBar {
  bar: ProjectBar;
  index: number;
}

/** Removes a bar (its blank, rounds and plan go with it); returns what was removed so it can be restored. */
export function removeBar(project: ProjectFile, barId: string): { project: ProjectFile; removed: RemovedBar } {
  const index = project.bars.findIndex((bar) => bar.id === barId);
  if (index < 0) throw new InputError('project', 'bar', `no bar with id "${barId}"`);
  const bars = project.bars.slice();
  const [bar] = bars.splice(index, 1);
  return { project: { ...project, bars }, removed: { bar: structuredClone(bar!), index } };
}

/** Puts a removed bar back where it stood (refused if its id or note is taken meanwhile). */
export function restoreBar(project: ProjectFile, removed: RemovedBar): ProjectFile {
  if (project.bars.some((bar) => bar.id === removed.bar.id)) throw new InputError('project', 'bar', `a bar with id "${removed.bar.id}" is already there`);
  registerById(project, removed.bar.register);
  const midi = parseNote(removed.bar.note).midi;
  if (project.bars.some((bar) => bar.register === removed.bar.register && parseNote(bar.note).midi === midi)) throw new InputError('bar', 'note', `a bar ${removed.bar.note} was added meanwhile`);
  const bars = project.bars.slice();
  bars.splice(Math.min(removed.index, bars.length), 0, structuredClone(removed.bar));
  return syncSessionTargets({ ...project, bars });
}

/** Moves a bar to position `toIndex` (0 = first) of the list; other bars keep their order. */
export function moveBar(project: ProjectFile, barId: string, toIndex: number): ProjectFile {
  const from = project.bars.findIndex((bar) => bar.id === barId);
  if (from < 0) throw new InputError('project', 'bar', `no bar with id "${barId}"`);
  if (!Number.isInteger(toIndex) || toIndex < 0 || toIndex >= project.bars.length) throw new InputError('project', 'position', `must be a whole number from 1 to ${project.bars.length}`);
  const bars = project.bars.slice();
  const [bar] = bars.splice(from, 1);
  bars.splice(toIndex, 0, bar!);
  return { ...project, bars };
}

/** Orders the bars by register (as the instrument lists them), then by pitch. */
export function sortBarsByPitch(project: ProjectFile): ProjectFile {
  const order = project.instrument.registers.map((register) => register.id);
  const bars = project.bars
    .map((bar, index) => ({ bar, index, register: order.indexOf(bar.register), midi: parseNote(bar.note).midi }))
    .sort((a, b) => a.register - b.register || a.midi - b.midi || a.index - b.index)
    .map((entry) => entry.bar);
  return { ...project, bars };
}

/**
 * Renames a bar: its name (the label of its blank and present shape) and/or its note. A new note
 * must be playable and not already in the bar's register; the session then aims at the new note
 * (rounds already recorded stay as they were heard).
 */
export function renameBar(project: ProjectFile, barId: string, change: { name?: string; note?: string }, at: string): ProjectFile {
  const target = project.bars.find((bar) => bar.id === barId);
  if (!target) throw new InputError('project', 'bar', `no bar with id "${barId}"`);
  const name = change.name !== undefined ? checkBarName(change.name) : undefined;
  let note: string | undefined;
  if (change.note !== undefined) {
    const checked = checkPlayableNote(change.note, 'bar', 'note');
    const twin = project.bars.find((bar) => bar.id !== barId && bar.register === target.register && parseNote(bar.note).midi === checked.midi);
    if (twin) throw new InputError('bar', 'note', `${registerById(project, target.register).label} already has a bar ${twin.note}`);
    note = checked.name;
  }
  const next = replaceBar(project, barId, (bar) => {
    const renamed: ProjectBar = { ...bar, updated_at: at };
    // A bar named after its note keeps following its note unless it is given a name of its own.
    const label = name ?? (note !== undefined && barName(bar) === bar.note ? note : undefined);
    if (label !== undefined) {
      renamed.blank = { ...bar.blank, label };
      renamed.current = { ...bar.current, label };
    }
    if (note !== undefined) renamed.note = note;
    return renamed;
  });
  return syncSessionTargets(next);
}
