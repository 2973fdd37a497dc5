import { cents } from './cents.ts';
import { midiA4, standardA4Hz } from '../fileFormats/concertPitch.ts';
import { midiToNoteName } from '../fileFormats/noteName.ts';

/**
 * Fractional MIDI note number of a frequency (Hz) at the given A4: 69 + 12 · log2(f / f_A4)
 * (MIDI 1.0).
 */
export function hzToMidi(hz: number, a4Hz: number = standardA4Hz): number {
  return midiA4 + 12 * Math.log2(hz / a4Hz);
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
