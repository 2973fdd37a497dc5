// The project's chime set (`chime_set`, optional): the stock, the notes and which pitch is tuned,
// as a chime-set file (`barwright chime` reads it as is). One computation gives a chime's length
// for a note (chimeForNote: Timoshenko with Cowper's κ, plugs as rigid end masses), used by the set
// view's plan and by every chime piece the project adds, so the two always agree.
import { InputError } from '../fileFormats/InputError.ts';
import type { BarFile } from '../fileFormats/barFile.ts';
import { parseChimeSetFile, type ChimeSetFile } from '../fileFormats/chimeSetFile.ts';
import { midiToHz } from '../fileFormats/concertPitch.ts';
import { parseNote } from '../fileFormats/noteName.ts';
import { chimeForNote } from '../instrument/index.ts';
import type { ProjectBar, ProjectFile } from './projectFileTypes.ts';

/** The stock a chime set starts from when the project has none: a common 1 in aluminium tube, 25.4 × 1.6 mm. */
const firstChimeStock: ChimeSetFile['stock'] = { section: { shape: 'tube', outer_diameter_mm: 25.4, wall_mm: 1.6 }, material: { preset: 'aluminium-6061-t6' } };

/** The notes a chime set starts with when the project has no chime piece: a pentatonic octave from C5 (common practice for wind chimes). */
const firstChimeNotes = ['C5', 'D5', 'E5', 'G5', 'A5', 'C6'] as const;

/** The project's chime pieces: its bars in chime registers. */
export function chimePieces(project: ProjectFile): ProjectBar[] {
  const chimeRegisters = new Set(project.instrument.registers.filter((register) => register.family === 'chime').map((register) => register.id));
  return project.bars.filter((bar) => chimeRegisters.has(bar.register));
}

/**
 * The chime set a project without one starts from: its chime pieces' notes, the stock (section and
 * metal) of its first tube or rod piece (else a 1 in aluminium tube), the project's A4, the
 * fundamental tuned, no plugs. What older project files are given when they are read.
 */
export function chimeSetFromPieces(project: ProjectFile): ChimeSetFile {
  const pieces = chimePieces(project);
  const stockPiece = pieces.find((bar) => bar.blank.section.shape !== 'rect');
  const section = stockPiece?.blank.section;
  const stock: ChimeSetFile['stock'] =
    stockPiece && section && section.shape !== 'rect' ? { section: structuredClone(section), material: structuredClone(stockPiece.blank.material) } : structuredClone(firstChimeStock);
  const pieceNotes = [...new Set(pieces.map((bar) => parseNote(bar.note).midi))].sort((a, b) => a - b).map((midi) => pieces.find((bar) => parseNote(bar.note).midi === midi)!.note);
  const notes = pieceNotes.length > 0 ? pieceNotes : [...firstChimeNotes];
  return parseChimeSetFile({ format: 'barwright.chime-set', version: 1, name: `${project.name}: chimes`, a4_hz: project.instrument.a4_hz, notes, tune: 'fundamental', stock, end_masses: [], saw_kerf_mm: 2 }, 'chime set');
}

/** The project's chime set (its `chime_set`, else chimeSetFromPieces), at the project's A4. */
export function projectChimeSet(project: ProjectFile): ChimeSetFile {
  const set = project.chime_set ?? chimeSetFromPieces(project);
  return { ...set, a4_hz: project.instrument.a4_hz };
}

/** The target (Hz) of a note of the set: at its A4, with its offset in cents if it has one. */
function noteTargetHz(set: ChimeSetFile, note: string): number {
  const midi = parseNote(note).midi;
  let offset = 0;
  for (const [key, value] of Object.entries(set.offsets_cents)) if (parseNote(key).midi === midi) offset = value;
  return midiToHz(midi, set.a4_hz) * 2 ** (offset / 1200);
}

/**
 * The length (mm, to 0.1 mm) at which a chime of the set's stock sounds `note` on the tuned pitch:
 * chimeForNote, the one computation of a chime's length (the set's plan uses it too).
 */
export function chimeLengthMm(set: ChimeSetFile, note: string): number {
  const stock = { section: set.stock.section, material: set.stock.material, end_masses: set.end_masses };
  return Math.round(chimeForNote(stock, noteTargetHz(set, note), { tune: set.tune }).length_mm * 10) / 10;
}

/** The blank of a chime piece of `note` cut from the set's stock, at chimeLengthMm. */
export function chimePieceBlank(set: ChimeSetFile, note: string): BarFile {
  return { format: 'barwright.bar', version: 1, label: note, length_mm: chimeLengthMm(set, note), section: structuredClone(set.stock.section), material: structuredClone(set.stock.material) };
}

/**
 * Stores a chime set in the project (validated as a chime-set file; its A4 is the project's).
 * Throws InputError naming the field and the rule, e.g. `chime set: notes[2]: …`.
 */
export function setChimeSet(project: ProjectFile, value: unknown): ProjectFile {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) throw new InputError('chime set', 'chime set', 'must be a chime-set object');
  const set = parseChimeSetFile({ ...value, a4_hz: project.instrument.a4_hz }, 'chime set');
  return { ...project, chime_set: set };
}
