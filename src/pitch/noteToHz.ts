import { InputError } from '../project/InputError.ts';
import { parseNote } from './parseNote.ts';

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

/** Frequency (Hz) of a note name in scientific pitch notation at the given A4 (Hz); see parseNote. */
export function noteToHz(name: string, a4Hz: number = standardA4Hz, source = 'note', field = 'note'): number {
  checkA4(a4Hz, source, 'a4');
  return midiToHz(parseNote(name, source, field).midi, a4Hz);
}
