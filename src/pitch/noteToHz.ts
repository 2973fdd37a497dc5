import { checkA4, midiToHz, standardA4Hz } from '../fileFormats/concertPitch.ts';
import { parseNote } from '../fileFormats/noteName.ts';

/** Frequency (Hz) of a note name in scientific pitch notation at the given A4 (Hz); see parseNote. */
export function noteToHz(name: string, a4Hz: number = standardA4Hz, source = 'note', field = 'note'): number {
  checkA4(a4Hz, source, 'a4');
  return midiToHz(parseNote(name, source, field).midi, a4Hz);
}
