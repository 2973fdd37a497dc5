// The lot file (`*.lots.json`, format "barwright.lots", version 1): what the finished bars of each
// board or batch of wood taught, bar by bar, so the next bar cut from the same lot starts from it.
// Written by `barwright lots add`, read by `next-cut --lots` and `plan --lots`.
import { InputError } from './InputError.ts';
import { parseNote } from './noteName.ts';
import { isJsonObject } from './jsonFields.ts';

/** What one finished bar's session learnt about its wood. */
export interface LotBarRecord {
  /** The bar: its label, note or file name (unique within the lot; learning the same bar again replaces it). */
  bar: string;
  /** The bar's note, when known. */
  note?: string;
  /** When it was learnt (ISO 8601). */
  learnt_at: string;
  /** How many measured steps the session had. */
  steps: number;
  /** Calibrated moduli (GPa) and the density they go with (kg/m³; the partials decide E/ρ and G/ρ). */
  E_GPa: number;
  G_GPa: number;
  density_kg_m3: number;
  /** One-sigma relative uncertainties of E and G, percent. */
  E_uncertainty_percent: number;
  G_uncertainty_percent: number;
  /** Per partial: the 1D model's correction, fraction of frequency per unit arch depth, and its one-sigma. */
  correction_per_depth: number[];
  correction_sigma: number[];
  /** The finished bar's arch depth, 1 − thinnest/blank (how far its corrections were tested). */
  arch_depth: number;
  /** The temperature coefficient used (cents per °C), its one-sigma, and whether the bar's own readings decided it. */
  pitch_cents_per_c?: number;
  pitch_sigma?: number;
  pitch_learnt?: boolean;
}

/** One lot: the notes it is meant for (optional) and what its finished bars taught. */
export interface LotEntry {
  /** The notes still to be cut from this lot (for `plan --lots`), both ends included. */
  notes?: { from: string; to: string };
  bars: LotBarRecord[];
}

/** The lot file, version 1. */
export interface LotFile {
  format: 'barwright.lots';
  version: 1;
  lots: Record<string, LotEntry>;
}

/** An empty lot file. */
export function emptyLotFile(): LotFile {
  return { format: 'barwright.lots', version: 1, lots: {} };
}

function finite(source: string, field: string, value: unknown, rule: (n: number) => string | null): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new InputError(source, field, 'must be a number');
  const broken = rule(value);
  if (broken) throw new InputError(source, field, broken);
  return value;
}

const positive = (unit: string) => (n: number) => (n > 0 ? null : `must be greater than 0 ${unit} (got ${n})`);
const nonNegative = (n: number) => (n >= 0 ? null : `must be 0 or more (got ${n})`);

function numberList(source: string, field: string, value: unknown, rule: (n: number) => string | null): number[] {
  if (!Array.isArray(value)) throw new InputError(source, field, 'must be a list of numbers');
  return value.map((item, index) => finite(source, `${field}[${index}]`, item, rule));
}

function parseRecord(source: string, field: string, value: unknown): LotBarRecord {
  if (!isJsonObject(value)) throw new InputError(source, field, 'must be an object with what a finished bar learnt (bar, learnt_at, E_GPa, G_GPa, density_kg_m3, …)');
  if (typeof value.bar !== 'string' || value.bar.trim() === '') throw new InputError(source, `${field}.bar`, 'must name the bar');
  if (typeof value.learnt_at !== 'string' || Number.isNaN(Date.parse(value.learnt_at))) throw new InputError(source, `${field}.learnt_at`, 'must be a date and time (ISO 8601)');
  const record: LotBarRecord = {
    bar: value.bar,
    learnt_at: value.learnt_at,
    steps: finite(source, `${field}.steps`, value.steps, (n) => (Number.isInteger(n) && n >= 1 ? null : `must be a whole number of steps, at least 1 (got ${n})`)),
    E_GPa: finite(source, `${field}.E_GPa`, value.E_GPa, positive('GPa')),
    G_GPa: finite(source, `${field}.G_GPa`, value.G_GPa, positive('GPa')),
    density_kg_m3: finite(source, `${field}.density_kg_m3`, value.density_kg_m3, positive('kg/m³')),
    E_uncertainty_percent: finite(source, `${field}.E_uncertainty_percent`, value.E_uncertainty_percent, nonNegative),
    G_uncertainty_percent: finite(source, `${field}.G_uncertainty_percent`, value.G_uncertainty_percent, nonNegative),
    correction_per_depth: numberList(source, `${field}.correction_per_depth`, value.correction_per_depth, (n) => (Math.abs(n) <= 1 ? null : `${n} is beyond ±1 per unit depth: not a correction of the 1D model`)),
    correction_sigma: numberList(source, `${field}.correction_sigma`, value.correction_sigma, (n) => (n > 0 ? null : `must be greater than 0 (got ${n})`)),
    arch_depth: finite(source, `${field}.arch_depth`, value.arch_depth, (n) => (n >= 0 && n < 1 ? null : `must lie from 0 to below 1 (got ${n})`)),
  };
  if (record.correction_sigma.length !== record.correction_per_depth.length)
    throw new InputError(source, `${field}.correction_sigma`, `needs one sigma per correction (${record.correction_per_depth.length}), got ${record.correction_sigma.length}`);
  if (value.note !== undefined) {
    if (typeof value.note !== 'string') throw new InputError(source, `${field}.note`, 'must be a note name such as F3');
    parseNote(value.note, source, `${field}.note`);
    record.note = value.note;
  }
  if (value.pitch_cents_per_c !== undefined)
    record.pitch_cents_per_c = finite(source, `${field}.pitch_cents_per_c`, value.pitch_cents_per_c, (n) => (Math.abs(n) <= 20 ? null : `must be between −20 and 20 cents per °C (got ${n})`));
  if (value.pitch_sigma !== undefined) record.pitch_sigma = finite(source, `${field}.pitch_sigma`, value.pitch_sigma, positive('cents per °C'));
  if (value.pitch_learnt !== undefined) {
    if (typeof value.pitch_learnt !== 'boolean') throw new InputError(source, `${field}.pitch_learnt`, 'must be true or false');
    record.pitch_learnt = value.pitch_learnt;
  }
  return record;
}

/**
 * Validates a parsed JSON value as a lot file; throws InputError(source, field, rule), e.g.
 * `oak.lots.json: lots.board-7.bars[1].E_GPa: must be greater than 0 GPa (got -3)`.
 */
export function parseLotFile(value: unknown, source = 'lots'): LotFile {
  if (!isJsonObject(value)) throw new InputError(source, 'lots file', 'must be a JSON object');
  if (value.format !== 'barwright.lots') throw new InputError(source, 'format', `must be "barwright.lots" (got ${JSON.stringify(value.format)})`);
  if (value.version !== 1) throw new InputError(source, 'version', `must be 1 (got ${JSON.stringify(value.version)})`);
  if (!isJsonObject(value.lots)) throw new InputError(source, 'lots', 'must be an object with one entry per lot name');
  const lots: Record<string, LotEntry> = {};
  for (const [name, entry] of Object.entries(value.lots)) {
    const field = `lots.${name}`;
    if (name.trim() === '' || name.length > 200) throw new InputError(source, field, 'a lot name must have 1 to 200 characters');
    if (!isJsonObject(entry)) throw new InputError(source, field, 'must be an object with "bars"');
    if (!Array.isArray(entry.bars)) throw new InputError(source, `${field}.bars`, 'must be a list of finished bars');
    const bars = entry.bars.map((record, index) => parseRecord(source, `${field}.bars[${index}]`, record));
    const seen = new Set<string>();
    bars.forEach((record, index) => {
      if (seen.has(record.bar)) throw new InputError(source, `${field}.bars[${index}].bar`, `"${record.bar}" is listed twice in lot ${name}`);
      seen.add(record.bar);
    });
    const lot: LotEntry = { bars };
    if (entry.notes !== undefined) {
      const notes = entry.notes;
      if (!isJsonObject(notes) || typeof notes.from !== 'string' || typeof notes.to !== 'string') throw new InputError(source, `${field}.notes`, 'must be { "from": NOTE, "to": NOTE }');
      const from = parseNote(notes.from, source, `${field}.notes.from`);
      const to = parseNote(notes.to, source, `${field}.notes.to`);
      if (to.midi < from.midi) throw new InputError(source, `${field}.notes.to`, `${notes.to} is below ${notes.from}`);
      lot.notes = { from: notes.from, to: notes.to };
    }
    lots[name] = lot;
  }
  return { format: 'barwright.lots', version: 1, lots };
}

/** The lot file with `record` added to lot `name` (replacing a record of the same bar). Pure. */
export function withLotRecord(file: LotFile, name: string, record: LotBarRecord, notes?: { from: string; to: string }): LotFile {
  const copy = structuredClone(file);
  const entry = copy.lots[name] ?? { bars: [] };
  entry.bars = [...entry.bars.filter((existing) => existing.bar !== record.bar), structuredClone(record)];
  if (notes) entry.notes = { ...notes };
  copy.lots[name] = entry;
  return copy;
}
