import { cents } from './cents.ts';
import { midiA4, standardA4Hz } from './noteToHz.ts';

/** Sharp and flat spellings of the twelve pitch classes, from C. */
const sharpNames = ['C', 'C#', 'D', 'D#', 'E', 'F', 'F#', 'G', 'G#', 'A', 'A#', 'B'] as const;
const flatNames = ['C', 'Db', 'D', 'Eb', 'E', 'F', 'Gb', 'G', 'Ab', 'A', 'Bb', 'B'] as const;

/**
 * Fractional MIDI note number of a frequency (Hz) at the given A4: 69 + 12 · log2(f / f_A4)
 * (MIDI 1.0).
 */
export function hzToMidi(hz: number, a4Hz: number = standardA4Hz): number {
  return midiA4 + 12 * Math.log2(hz / a4Hz);
}

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

/** The nearest equal-tempered note to a frequency, and how far the frequency is from it. */
export interface NearestNote {
  /** Name in scientific pitch notation. */
  name: string;
  /** MIDI note number of the nearest note. */
  midi: number;
  /** Equal-tempered frequency of that note, Hz. */
  noteHz: number;
  /** Signed cents of `hz` from the note (−50 … +50). */
  cents: number;
}

/** Nearest equal-tempered note to `hz` (Hz) at the given A4, with the signed cents from it. */
export function hzToNote(hz: number, a4Hz: number = standardA4Hz, spelling: 'sharp' | 'flat' = 'sharp'): NearestNote {
  const midi = Math.round(hzToMidi(hz, a4Hz));
  const noteHz = a4Hz * 2 ** ((midi - midiA4) / 12);
  return { name: midiToNoteName(midi, spelling), midi, noteHz, cents: cents(hz, noteHz) };
}
