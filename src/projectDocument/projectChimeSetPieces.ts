// The project's chime set beside its chime pieces: which notes of the set are pieces to tune, at
// what length they were cut, whether that is the set's length, and adding the missing ones.
import { InputError } from '../fileFormats/InputError.ts';
import { parseNote } from '../fileFormats/noteName.ts';
import { addBar } from './projectBarEdits.ts';
import { chimePieceBlank, chimePieces, projectChimeSet } from './projectChimeSet.ts';
import type { BarState, ProjectFile } from './projectFileTypes.ts';

/** Largest difference (mm) between a piece's blank and the set's length still counted as the same: the set's 0.1 mm rounding. */
const sameLengthMm = 0.05;

/** One note of the set beside the project's piece of that note. */
export interface ChimeSetPieceRow {
  note: string;
  /** The set's length for the note (mm, 0.1 mm), as planned. */
  planned_mm: number;
  /** The project's chime piece of that note: its id, state and the length its blank was cut to (mm); null when none. */
  piece: { id: string; state: BarState; length_mm: number } | null;
  /** True when the piece's blank is the set's length (within its 0.1 mm rounding). */
  agrees: boolean;
}

/**
 * The set's notes (from its plan: note and length in mm) beside the project's chime pieces, by
 * pitch. A piece whose blank differs from the set's length was cut from other stock or an older
 * set: it is listed, not changed.
 */
export function chimeSetPieceRows(project: ProjectFile, planned: readonly { note: string; length_mm: number }[]): ChimeSetPieceRow[] {
  const pieces = chimePieces(project);
  return planned.map((row) => {
    const midi = parseNote(row.note).midi;
    const plannedMm = Math.round(row.length_mm * 10) / 10;
    const bar = pieces.find((candidate) => parseNote(candidate.note).midi === midi);
    const piece = bar ? { id: bar.id, state: bar.state, length_mm: bar.blank.length_mm } : null;
    return { note: row.note, planned_mm: plannedMm, piece, agrees: piece !== null && Math.abs(piece.length_mm - plannedMm) <= sameLengthMm };
  });
}

/**
 * Adds a chime piece for every note of the project's chime set that has none, each cut at the
 * set's length from its stock (chimePieceBlank), into the first chime register. Throws when the
 * project has no chime register.
 */
export function addMissingChimePieces(project: ProjectFile, at: string): { project: ProjectFile; added: string[] } {
  const register = project.instrument.registers.find((candidate) => candidate.family === 'chime');
  if (!register) throw new InputError('chime set', 'pieces', 'the project has no chime register to put pieces in');
  const set = projectChimeSet(project);
  const have = new Set(chimePieces(project).map((bar) => parseNote(bar.note).midi));
  let next = project;
  const added: string[] = [];
  for (const note of set.notes) {
    if (have.has(parseNote(note).midi)) continue;
    next = addBar(next, { note, registerId: register.id, blank: chimePieceBlank(set, note), name: `${note} chime`, at }).project;
    added.push(note);
  }
  return { project: next, added };
}
