// Reading and validating keyboard files (`*.keyboard.json`). Every rule broken is reported as
// `source: field: rule`, naming the note where a note is concerned.
import { checkA4 } from './concertPitch.ts';
import { parseNote } from './noteName.ts';
import { parseBarFile, type BarFileMaterial } from './barFile.ts';
import { InputError, isInputError } from './InputError.ts';
import { keyboardFileFormat, keyboardFileVersion, type KeyboardFile, type KeyboardLimits, type KeyboardResonators, type NoteSpan } from './keyboardFileTypes.ts';
import { parseSpans } from './keyboardFileSpans.ts';
import { midiToNoteName } from './noteName.ts';
import { parseWorkshop } from './workshopFile.ts';
import { isJsonObject as isObject } from './jsonFields.ts';

export * from './keyboardFileTypes.ts';
export { spanIndexOf } from './keyboardFileSpans.ts';

function number(source: string, field: string, value: unknown, rule: (n: number) => string | null): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new InputError(source, field, `must be a number (got ${JSON.stringify(value)})`);
  const problem = rule(value);
  if (problem) throw new InputError(source, field, problem);
  return value;
}

const positive = (unit: string) => (n: number) => (n > 0 ? null : `must be greater than 0 ${unit} (got ${n})`);

/** Validates a material through the bar-file rules, reporting it under `field`. */
function parseMaterial(source: string, field: string, value: unknown): BarFileMaterial {
  try {
    return parseBarFile({ length_mm: 1, section: { shape: 'rect', width_mm: 1, thickness_mm: 1 }, material: value }, source).material;
  } catch (error) {
    if (isInputError(error)) throw new InputError(source, error.field.replace(/^material/, field), error.rule);
    throw error;
  }
}

/** MIDI number of a note name used as a key or a range end, checked to lie in the keyboard. */
function noteInRange(source: string, field: string, name: unknown, lowest: number, highest: number): number {
  if (typeof name !== 'string') throw new InputError(source, field, 'must be a note name such as A2, F#3 or Bb5');
  const midi = parseNote(name, source, field).midi;
  if (midi < lowest || midi > highest) throw new InputError(source, field, `${name} lies outside the keyboard's range`);
  return midi;
}

/** A record keyed by note name, each key checked to be in range and named once. */
function noteRecord<T>(source: string, field: string, value: unknown, lowest: number, highest: number, parse: (key: string, entry: unknown) => T): Record<string, T> {
  if (value === undefined) return {};
  if (!isObject(value)) throw new InputError(source, field, 'must be an object keyed by note name');
  const seen = new Map<number, string>();
  const result: Record<string, T> = {};
  for (const [key, entry] of Object.entries(value)) {
    const midi = noteInRange(source, `${field}.${key}`, key, lowest, highest);
    const earlier = seen.get(midi);
    if (earlier !== undefined) throw new InputError(source, `${field}.${key}`, `names the same note as ${earlier}`);
    seen.set(midi, key);
    result[key] = parse(`${field}.${key}`, entry);
  }
  return result;
}

function parseRatios(source: string, field: string, value: unknown): number[] {
  if (!Array.isArray(value) || value.length === 0 || value.length > 5) throw new InputError(source, field, 'must be a list of 1 to 5 partial ratios starting with 1, e.g. [1, 4, 10]');
  const ratios = value.map((r, i) => number(source, `${field}[${i}]`, r, positive('')));
  if (ratios[0] !== 1) throw new InputError(source, `${field}[0]`, `the fundamental's ratio must be 1 (got ${ratios[0]})`);
  ratios.forEach((r, i) => {
    if (i > 0 && r <= ratios[i - 1]!) throw new InputError(source, `${field}[${i}]`, `ratio ${r} must be greater than the one before (${ratios[i - 1]})`);
  });
  return ratios;
}

function parseLimits(source: string, value: unknown): KeyboardLimits {
  if (value === undefined) return {};
  if (!isObject(value)) throw new InputError(source, 'limits', 'must be an object');
  const limits: KeyboardLimits = {};
  const known = ['min_thickness_fraction', 'max_slope', 'min_tool_radius_mm'];
  for (const key of Object.keys(value)) if (!known.includes(key)) throw new InputError(source, `limits.${key}`, `is not a keyboard limit (known: ${known.join(', ')})`);
  if (value.min_thickness_fraction !== undefined)
    limits.min_thickness_fraction = number(source, 'limits.min_thickness_fraction', value.min_thickness_fraction, (n) => (n > 0 && n < 1 ? null : `must lie between 0 and 1 (got ${n})`));
  if (value.max_slope !== undefined) limits.max_slope = number(source, 'limits.max_slope', value.max_slope, (n) => (n > 0 && n <= 10 ? null : `must be greater than 0 and at most 10 (got ${n})`));
  if (value.min_tool_radius_mm !== undefined) limits.min_tool_radius_mm = number(source, 'limits.min_tool_radius_mm', value.min_tool_radius_mm, (n) => (n >= 0 ? null : `must be 0 mm or more (got ${n})`));
  return limits;
}

function parseResonators(source: string, value: unknown, lowest: number, highest: number): KeyboardResonators | undefined {
  if (value === undefined) return undefined;
  if (!isObject(value)) throw new InputError(source, 'resonators', 'must be an object with air_temperature_c, open_end and diameters');
  const air = number(source, 'resonators.air_temperature_c', value.air_temperature_c, (n) => (n >= -30 && n <= 60 ? null : `${n} °C is outside −30…60 °C`));
  const end = value.open_end ?? 'unflanged';
  if (end !== 'unflanged' && end !== 'flanged') throw new InputError(source, 'resonators.open_end', `must be "unflanged" or "flanged" (got ${JSON.stringify(end)})`);
  const diameters = parseSpans(source, 'resonators.diameters', value.diameters, lowest, highest, (field, entry) => ({
    inner_diameter_mm: number(source, `${field}.inner_diameter_mm`, entry.inner_diameter_mm, positive('mm')),
  }));
  return { air_temperature_c: air, open_end: end, diameters };
}

/**
 * The tuning of a keyboard file that gives none, by register (common practice, from memory: a
 * wooden keyboard's bars tune three partials, 1:4:10, up to about E4, two, 1:4, up to about C6,
 * and the fundamental alone above, where the overtones lie beyond what matters to the ear and a
 * short bar cannot reach them). Tolerances ±2, 5, 15 cents (common practice). Spans cut to the
 * keyboard's range (MIDI lowest–highest).
 */
export function commonPracticeTuning(lowest: number, highest: number): KeyboardFile['tuning'] {
  const registers = [
    { top: 64, ratios: [1, 4, 10], tolerance_cents: [2, 5, 15] }, // to E4
    { top: 84, ratios: [1, 4], tolerance_cents: [2, 5] }, // to C6
    { top: 127, ratios: [1], tolerance_cents: [2] },
  ];
  const spans: KeyboardFile['tuning'] = [];
  let from = lowest;
  for (const register of registers) {
    const to = Math.min(register.top, highest);
    if (to < from) continue;
    spans.push({ from: midiToNoteName(from), to: midiToNoteName(to), ratios: [...register.ratios], tolerance_cents: [...register.tolerance_cents] });
    from = to + 1;
    if (from > highest) break;
  }
  return spans;
}

/**
 * Validates a parsed JSON value as a keyboard file (format "barwright.keyboard", version 1) and
 * returns it typed, with defaults filled. Throws InputError(source, field, rule) on the first
 * problem, e.g. `demo.keyboard.json: sections[1].from: E3 does not follow sections[0].to C3
 * (expected C#3)`. Unknown top-level fields are refused so a misspelt one is not silently ignored.
 */
export function parseKeyboardFile(value: unknown, source = 'keyboard'): KeyboardFile {
  if (!isObject(value)) throw new InputError(source, 'keyboard', 'must be a JSON object');
  if (value.format !== keyboardFileFormat) throw new InputError(source, 'format', `must be "${keyboardFileFormat}" (got ${JSON.stringify(value.format)})`);
  if (value.version !== keyboardFileVersion) throw new InputError(source, 'version', `must be ${keyboardFileVersion} (got ${JSON.stringify(value.version)})`);
  const known = ['format', 'version', 'name', 'range', 'spelling', 'pitch', 'material', 'bar_materials', 'sections', 'tuning', 'limits', 'workshop', 'blanks', 'resonators'];
  for (const key of Object.keys(value)) if (!known.includes(key)) throw new InputError(source, key, `is not a keyboard-file field (known: ${known.join(', ')})`);
  const name = value.name ?? '';
  if (typeof name !== 'string') throw new InputError(source, 'name', 'must be a string');
  if (!isObject(value.range)) throw new InputError(source, 'range', 'must be an object { "lowest": NOTE, "highest": NOTE }');
  if (typeof value.range.lowest !== 'string') throw new InputError(source, 'range.lowest', 'must be a note name such as A2');
  if (typeof value.range.highest !== 'string') throw new InputError(source, 'range.highest', 'must be a note name such as C7');
  const lowest = parseNote(value.range.lowest, source, 'range.lowest').midi;
  const highest = parseNote(value.range.highest, source, 'range.highest').midi;
  if (highest < lowest) throw new InputError(source, 'range.highest', `${value.range.highest} is below the lowest note ${value.range.lowest}`);
  if (highest - lowest > 96) throw new InputError(source, 'range.highest', `a keyboard of ${highest - lowest + 1} notes is more than eight octaves`);
  const spelling = value.spelling ?? 'sharp';
  if (spelling !== 'sharp' && spelling !== 'flat') throw new InputError(source, 'spelling', `must be "sharp" or "flat" (got ${JSON.stringify(spelling)})`);
  if (!isObject(value.pitch)) throw new InputError(source, 'pitch', 'must be an object { "a4_hz": 442, "offsets_cents": { … } }');
  const a4 = number(source, 'pitch.a4_hz', value.pitch.a4_hz, () => null);
  checkA4(a4, source, 'pitch.a4_hz');
  const offsets = noteRecord(source, 'pitch.offsets_cents', value.pitch.offsets_cents, lowest, highest, (field, entry) =>
    number(source, field, entry, (n) => (Math.abs(n) <= 50 ? null : `an offset of ${n} cents is more than a quarter tone`)),
  );
  const material = parseMaterial(source, 'material', value.material);
  const barMaterials = noteRecord(source, 'bar_materials', value.bar_materials, lowest, highest, (field, entry) => parseMaterial(source, field, entry));
  const sections = parseSpans(source, 'sections', value.sections, lowest, highest, (field, entry) => {
    const width = number(source, `${field}.width_mm`, entry.width_mm, positive('mm'));
    const thickness = number(source, `${field}.thickness_mm`, entry.thickness_mm, positive('mm'));
    const section: { width_mm: number; thickness_mm: number; min_thickness_mm?: number } = { width_mm: width, thickness_mm: thickness };
    if (entry.min_thickness_mm !== undefined)
      section.min_thickness_mm = number(source, `${field}.min_thickness_mm`, entry.min_thickness_mm, (n) => (n > 0 && n < thickness ? null : `${n} mm must be greater than 0 and less than the blank's ${thickness} mm`));
    return section;
  });
  const tuning = value.tuning === undefined ? commonPracticeTuning(lowest, highest) : parseSpans(source, 'tuning', value.tuning, lowest, highest, (field, entry) => {
    const ratios = parseRatios(source, `${field}.ratios`, entry.ratios);
    if (!Array.isArray(entry.tolerance_cents) || entry.tolerance_cents.length !== ratios.length)
      throw new InputError(source, `${field}.tolerance_cents`, `must list one tolerance per ratio (${ratios.length})`);
    const tolerance = entry.tolerance_cents.map((t: unknown, i: number) => number(source, `${field}.tolerance_cents[${i}]`, t, (n) => (n > 0 && n <= 100 ? null : `must be greater than 0 and at most 100 cents (got ${n})`)));
    return { ratios, tolerance_cents: tolerance };
  });
  const limits = parseLimits(source, value.limits);
  const workshop = value.workshop === undefined ? undefined : parseWorkshop(value.workshop, source, 'workshop.');
  let blanks: KeyboardFile['blanks'] = {};
  if (value.blanks !== undefined) {
    if (!isObject(value.blanks)) throw new InputError(source, 'blanks', 'must be an object');
    const step = value.blanks.length_step_mm === undefined ? undefined : number(source, 'blanks.length_step_mm', value.blanks.length_step_mm, (n) => (n > 0 && n <= 50 ? null : `must be greater than 0 and at most 50 mm (got ${n})`));
    const lengths = noteRecord(source, 'blanks.lengths_mm', value.blanks.lengths_mm, lowest, highest, (field, entry) => number(source, field, entry, positive('mm')));
    blanks = { ...(step === undefined ? {} : { length_step_mm: step }), lengths_mm: lengths };
  }
  const resonators = parseResonators(source, value.resonators, lowest, highest);
  return {
    format: keyboardFileFormat,
    version: keyboardFileVersion,
    name,
    range: { lowest: value.range.lowest, highest: value.range.highest },
    spelling,
    pitch: { a4_hz: a4, offsets_cents: offsets },
    material,
    bar_materials: barMaterials,
    sections,
    tuning,
    limits,
    ...(workshop ? { workshop } : {}),
    blanks,
    ...(resonators ? { resonators } : {}),
  };
}

/** Parses the text of a keyboard file (JSON) and validates it; see parseKeyboardFile. */
export function readKeyboardFileText(text: string, source = 'keyboard'): KeyboardFile {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    throw new InputError(source, 'JSON', `not valid JSON (${error instanceof Error ? error.message : String(error)})`);
  }
  return parseKeyboardFile(value, source);
}

/** The MIDI numbers of a span's ends (a validated file's spans always parse). */
export function spanMidi(span: NoteSpan): [number, number] {
  return [parseNote(span.from).midi, parseNote(span.to).midi];
}
