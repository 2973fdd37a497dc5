// Reading and validating chime-set files (`*.chimes.json`, format "barwright.chime-set"): a scale
// of notes cut from one tube or rod stock.
import { checkA4 } from './concertPitch.ts';
import { parseNote } from './noteName.ts';
import { parseBarFile, type BarFileMaterial } from './barFile.ts';
import { InputError, isInputError } from './InputError.ts';
import { isJsonObject as isObject } from './jsonFields.ts';

/** A chime-set file, version 1 (mm, g, Hz, cents). */
export interface ChimeSetFile {
  format: 'barwright.chime-set';
  version: 1;
  name: string;
  a4_hz: number;
  spelling: 'sharp' | 'flat';
  /** The notes of the set, in scientific pitch notation, in any order. */
  notes: string[];
  /** Per-note pitch offsets, cents. */
  offsets_cents: Record<string, number>;
  /** Which pitch is tuned to the note: mode 1 (wind chimes) or the strike note (tubular bells). */
  tune: 'fundamental' | 'strike';
  stock: {
    section: { shape: 'tube'; outer_diameter_mm: number; wall_mm: number } | { shape: 'round'; diameter_mm: number };
    material: BarFileMaterial;
    /** Length of the stock bars bought, mm (for the cutting plan); absent: no cutting plan. */
    bar_length_mm?: number;
  };
  /** Plugs or caps at the ends (rigid masses), moving the hanging point. */
  end_masses: { end: 'top' | 'bottom'; mass_g: number; length_mm: number; diameter_mm?: number }[];
  /** Saw cut width, mm (default 2). */
  saw_kerf_mm: number;
}


function positive(source: string, field: string, value: unknown, unit: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new InputError(source, field, `must be a number in ${unit}`);
  if (value <= 0) throw new InputError(source, field, `must be greater than 0 ${unit} (got ${value})`);
  return value;
}

/** The `format` value of a chime-set file. */
export const chimeSetFileFormat = 'barwright.chime-set';

/**
 * Validates a parsed JSON value as a chime-set file and returns it typed with defaults filled;
 * throws InputError(source, field, rule) on the first problem (stock section and material by the
 * bar-file rules; notes named once each).
 */
export function parseChimeSetFile(value: unknown, source = 'chimes'): ChimeSetFile {
  if (!isObject(value)) throw new InputError(source, 'chime set', 'must be a JSON object');
  if (value.format !== chimeSetFileFormat) throw new InputError(source, 'format', `must be "${chimeSetFileFormat}" (got ${JSON.stringify(value.format)})`);
  if (value.version !== 1) throw new InputError(source, 'version', `must be 1 (got ${JSON.stringify(value.version)})`);
  const known = ['format', 'version', 'name', 'a4_hz', 'spelling', 'notes', 'offsets_cents', 'tune', 'stock', 'end_masses', 'saw_kerf_mm'];
  for (const key of Object.keys(value)) if (!known.includes(key)) throw new InputError(source, key, `is not a chime-set field (known: ${known.join(', ')})`);
  const name = value.name ?? '';
  if (typeof name !== 'string') throw new InputError(source, 'name', 'must be a string');
  const a4 = value.a4_hz ?? 440;
  if (typeof a4 !== 'number') throw new InputError(source, 'a4_hz', 'must be a number in Hz');
  checkA4(a4, source, 'a4_hz');
  const spelling = value.spelling ?? 'sharp';
  if (spelling !== 'sharp' && spelling !== 'flat') throw new InputError(source, 'spelling', `must be "sharp" or "flat" (got ${JSON.stringify(spelling)})`);
  if (!Array.isArray(value.notes) || value.notes.length === 0 || value.notes.length > 128) throw new InputError(source, 'notes', 'must be a list of 1 to 128 note names');
  const seen = new Map<number, string>();
  const notes = value.notes.map((note: unknown, i) => {
    if (typeof note !== 'string') throw new InputError(source, `notes[${i}]`, 'must be a note name such as C5');
    const midi = parseNote(note, source, `notes[${i}]`).midi;
    if (seen.has(midi)) throw new InputError(source, `notes[${i}]`, `${note} is the same note as ${seen.get(midi)}`);
    seen.set(midi, note);
    return note;
  });
  const offsets: Record<string, number> = {};
  if (value.offsets_cents !== undefined) {
    if (!isObject(value.offsets_cents)) throw new InputError(source, 'offsets_cents', 'must be an object keyed by note name');
    for (const [key, offset] of Object.entries(value.offsets_cents)) {
      const midi = parseNote(key, source, `offsets_cents.${key}`).midi;
      if (!seen.has(midi)) throw new InputError(source, `offsets_cents.${key}`, `${key} is not one of the set's notes`);
      if (typeof offset !== 'number' || !Number.isFinite(offset) || Math.abs(offset) > 50) throw new InputError(source, `offsets_cents.${key}`, 'must be a number of cents within ±50');
      offsets[key] = offset;
    }
  }
  const tune = value.tune ?? 'fundamental';
  if (tune !== 'fundamental' && tune !== 'strike') throw new InputError(source, 'tune', `must be "fundamental" or "strike" (got ${JSON.stringify(tune)})`);
  if (!isObject(value.stock)) throw new InputError(source, 'stock', 'must be an object with section and material');
  let bar;
  try {
    bar = parseBarFile({ length_mm: 1000, section: value.stock.section, material: value.stock.material }, source);
  } catch (error) {
    if (isInputError(error)) throw new InputError(source, `stock.${error.field}`, error.rule);
    throw error;
  }
  if (bar.section.shape === 'rect') throw new InputError(source, 'stock.section.shape', 'a chime is a "tube" or a "round" rod (for flat bars use barwright bellbar)');
  const stock: ChimeSetFile['stock'] = { section: bar.section, material: bar.material };
  if (value.stock.bar_length_mm !== undefined) stock.bar_length_mm = positive(source, 'stock.bar_length_mm', value.stock.bar_length_mm, 'mm');
  const boreOrDiameter = bar.section.shape === 'tube' ? bar.section.outer_diameter_mm - 2 * bar.section.wall_mm : bar.section.diameter_mm;
  const endMasses: ChimeSetFile['end_masses'] = [];
  if (value.end_masses !== undefined) {
    if (!Array.isArray(value.end_masses) || value.end_masses.length > 2) throw new InputError(source, 'end_masses', 'must be a list of at most two plugs or caps');
    value.end_masses.forEach((entry: unknown, i) => {
      const field = `end_masses[${i}]`;
      if (!isObject(entry)) throw new InputError(source, field, 'must be an object { "end": "top" | "bottom", "mass_g", "length_mm" }');
      if (entry.end !== 'top' && entry.end !== 'bottom') throw new InputError(source, `${field}.end`, `must be "top" or "bottom" (got ${JSON.stringify(entry.end)})`);
      if (endMasses.some((m) => m.end === entry.end)) throw new InputError(source, `${field}.end`, `the ${entry.end} end already has a plug`);
      const mass: ChimeSetFile['end_masses'][number] = {
        end: entry.end,
        mass_g: positive(source, `${field}.mass_g`, entry.mass_g, 'g'),
        length_mm: positive(source, `${field}.length_mm`, entry.length_mm, 'mm'),
      };
      if (entry.diameter_mm !== undefined) mass.diameter_mm = positive(source, `${field}.diameter_mm`, entry.diameter_mm, 'mm');
      if (mass.diameter_mm === undefined && boreOrDiameter <= 0) throw new InputError(source, `${field}.diameter_mm`, 'is needed');
      endMasses.push(mass);
    });
  }
  const kerf = value.saw_kerf_mm ?? 2;
  if (typeof kerf !== 'number' || !Number.isFinite(kerf) || kerf < 0 || kerf > 20) throw new InputError(source, 'saw_kerf_mm', 'must be a number from 0 to 20 mm');
  return { format: chimeSetFileFormat, version: 1, name, a4_hz: a4, spelling, notes, offsets_cents: offsets, tune, stock, end_masses: endMasses, saw_kerf_mm: kerf };
}
