import { InputError } from './InputError.ts';

/** A note name in scientific pitch notation, taken apart. */
export interface ParsedNote {
  /** Natural letter, upper case: C D E F G A B. */
  letter: 'C' | 'D' | 'E' | 'F' | 'G' | 'A' | 'B';
  /** Semitones added by the accidentals: +1 per sharp, −1 per flat (−2 … +2). */
  alteration: number;
  /** Octave number of scientific pitch notation (C4 is middle C). */
  octave: number;
  /** MIDI note number (MIDI 1.0: C4 = 60, A4 = 69); may fall outside 0–127 for extreme octaves. */
  midi: number;
}

/** Semitones of each natural letter above C in the same octave. */
const letterSemitones = { C: 0, D: 2, E: 4, F: 5, G: 7, A: 9, B: 11 } as const;

const notePattern = /^([A-Ga-g])(#{1,2}|♯{1,2}|x|𝄪|b{1,2}|♭{1,2}|𝄫|♮)?(-?\d{1,2})$/u;

/** Accidental spellings and the semitones they add. */
function alterationOf(accidental: string | undefined): number {
  switch (accidental) {
    case undefined:
    case '♮':
      return 0;
    case '#':
    case '♯':
      return 1;
    case '##':
    case '♯♯':
    case 'x':
    case '𝄪':
      return 2;
    case 'b':
    case '♭':
      return -1;
    case 'bb':
    case '♭♭':
    case '𝄫':
      return -2;
    default:
      return Number.NaN;
  }
}

/**
 * Parses a note name in scientific pitch notation: a letter A–G, an optional accidental
 * (`#`/`♯`, `b`/`♭`, doubled, `x` for double sharp, `♮`), then an octave number −1…10, e.g.
 * `C4`, `F#3`, `G♭3`, `Bb5`, `Cb4` (= B3), `C-1` (MIDI 0). MIDI number from the MIDI 1.0
 * convention C4 = 60: midi = 12 (octave + 1) + letter + alteration.
 * Throws InputError(source, field, rule) for anything else.
 */
export function parseNote(name: string, source = 'note', field = 'note'): ParsedNote {
  const trimmed = typeof name === 'string' ? name.trim() : '';
  const match = notePattern.exec(trimmed);
  const rule = `"${String(name)}" is not a note name in scientific pitch notation (letter A–G, optional # or b, octave −1…10, e.g. F#3, Bb5, C4)`;
  if (!match) throw new InputError(source, field, rule);
  const letter = match[1]!.toUpperCase() as ParsedNote['letter'];
  const alteration = alterationOf(match[2]);
  const octave = Number(match[3]);
  if (!Number.isFinite(alteration) || octave < -1 || octave > 10) throw new InputError(source, field, rule);
  const midi = 12 * (octave + 1) + letterSemitones[letter] + alteration;
  return { letter, alteration, octave, midi };
}

/** Sharp and flat spellings of the twelve pitch classes, from C. */
const sharpNames = ['C', 'C#', 'D', 'D#', 'E', 'F', 'F#', 'G', 'G#', 'A', 'A#', 'B'] as const;
const flatNames = ['C', 'Db', 'D', 'Eb', 'E', 'F', 'Gb', 'G', 'Ab', 'A', 'Bb', 'B'] as const;

/**
 * Name of an integer MIDI note number in scientific pitch notation (C4 = 60), spelt with sharps
 * (`C#4`) or flats (`Db4`).
 */
export function midiToNoteName(midi: number, spelling: 'sharp' | 'flat' = 'sharp'): string {
  const rounded = Math.round(midi);
  const pitchClass = ((rounded % 12) + 12) % 12;
  const octave = Math.floor(rounded / 12) - 1;
  return `${(spelling === 'flat' ? flatNames : sharpNames)[pitchClass]}${octave}`;
}
