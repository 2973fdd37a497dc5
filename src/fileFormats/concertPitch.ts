// Concert pitch as the files give it: the A4 reference and the MIDI note-number convention that
// turns a note name into a frequency. Part of the file-format floor because the bar, session and
// keyboard files name notes and an A4 and must check them where they are read.
import { InputError } from './InputError.ts';

/** ISO 16:1975 concert pitch, Hz. */
export const standardA4Hz = 440;

/** MIDI number of A4 (MIDI 1.0). */
export const midiA4 = 69;

/** Checks a reference pitch for A4 (Hz): finite and within 300–600 Hz; throws InputError otherwise. */
export function checkA4(a4Hz: number, source = 'a4', field = 'a4'): number {
  if (!Number.isFinite(a4Hz) || a4Hz < 300 || a4Hz > 600) throw new InputError(source, field, `A4 reference ${String(a4Hz)} Hz is outside 300–600 Hz`);
  return a4Hz;
}

/**
 * Equal-tempered frequency (Hz) of a MIDI note number (fractional numbers allowed):
 * f = f_A4 · 2^((m − 69)/12) (MIDI 1.0; ISO 16 sets f_A4 = 440 Hz).
 */
export function midiToHz(midi: number, a4Hz: number = standardA4Hz): number {
  return a4Hz * 2 ** ((midi - midiA4) / 12);
}
