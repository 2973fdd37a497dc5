import { midiToNoteName } from './noteName.ts';
import { parseNote } from './noteName.ts';
import { InputError } from './InputError.ts';
import type { NoteSpan } from './keyboardFileTypes.ts';

import type { JsonObject as Json } from './jsonFields.ts';

/**
 * Validates a schedule of note spans (`[{ "from": NOTE, "to": NOTE, … }]`) that must cover the
 * keyboard from `lowest` to `highest` (MIDI) in order, each span following on from the one
 * before without gap or overlap. `parseEntry` checks the span's own fields.
 */
export function parseSpans<T extends object>(
  source: string,
  field: string,
  value: unknown,
  lowest: number,
  highest: number,
  parseEntry: (field: string, entry: Json) => T,
): (NoteSpan & T)[] {
  if (!Array.isArray(value) || value.length === 0) throw new InputError(source, field, 'must be a list of spans [{ "from": NOTE, "to": NOTE, … }] covering the range');
  const spans: (NoteSpan & T)[] = [];
  let next = lowest;
  value.forEach((entry: unknown, i) => {
    const at = `${field}[${i}]`;
    if (typeof entry !== 'object' || entry === null || Array.isArray(entry)) throw new InputError(source, at, 'must be an object with "from" and "to" notes');
    const json = entry as Json;
    if (typeof json.from !== 'string') throw new InputError(source, `${at}.from`, 'must be a note name such as A2');
    if (typeof json.to !== 'string') throw new InputError(source, `${at}.to`, 'must be a note name such as B3');
    const from = parseNote(json.from, source, `${at}.from`).midi;
    const to = parseNote(json.to, source, `${at}.to`).midi;
    if (from !== next) {
      const expected = midiToNoteName(next);
      throw new InputError(source, `${at}.from`, i === 0 ? `${json.from} must be the keyboard's lowest note ${expected}` : `${json.from} does not follow ${field}[${i - 1}].to (expected ${expected})`);
    }
    if (to < from) throw new InputError(source, `${at}.to`, `${json.to} is below ${json.from}`);
    if (to > highest) throw new InputError(source, `${at}.to`, `${json.to} lies above the keyboard's highest note ${midiToNoteName(highest)}`);
    spans.push({ ...parseEntry(at, json), from: json.from, to: json.to });
    next = to + 1;
  });
  if (next !== highest + 1) throw new InputError(source, `${field}[${value.length - 1}].to`, `the spans stop before the keyboard's highest note ${midiToNoteName(highest)}`);
  return spans;
}

/** Index of the span holding the MIDI note `midi` in a validated schedule. */
export function spanIndexOf(spans: readonly NoteSpan[], midi: number): number {
  const index = spans.findIndex((span) => parseNote(span.from).midi <= midi && midi <= parseNote(span.to).midi);
  if (index < 0) throw new Error(`internal: MIDI ${midi} is in no span (the file was not validated)`);
  return index;
}
