import { checkA4, standardA4Hz } from '../fileFormats/concertPitch.ts';
import { noteToHz } from '../pitch/noteToHz.ts';
import { InputError } from '../fileFormats/InputError.ts';

/** Named ratio sets a maker asks for (trade practice, brief §1). */
export const ratioPresets: Readonly<Record<string, readonly number[]>> = {
  '1:4:10': [1, 4, 10],
  '1:4': [1, 4],
  '1:3': [1, 3],
  '1:3:6': [1, 3, 6],
  fundamental: [1],
};

/**
 * Default tolerance (cents, ±) of partial k (0-based): fundamental 2, second partial 5, third 15,
 * higher 20 (common practice: ±1–2, ±5, ±10–20, brief §3).
 */
export function defaultToleranceCents(partial: number): number {
  return partial === 0 ? 2 : partial === 1 ? 5 : partial === 2 ? 15 : 20;
}

/** What a maker asks for, as a file, a form or a command line gives it. */
export interface DesignTargetInput {
  /** Note name in scientific pitch notation (e.g. "F3", "Bb5"); or give `hz`. */
  note?: string;
  /** Fundamental frequency (Hz); or give `note`. */
  hz?: number;
  /** Reference pitch of A4 (Hz), default 440 (contract). */
  a4?: number;
  /** A preset name ("1:4:10", "1:4", "1:3", "1:3:6", "fundamental"), a custom "1:3.9:9.8", or numbers. Default 1:4:10. */
  ratios?: string | readonly number[];
  /** Tolerance (± cents) per partial; missing entries take the defaults. */
  tolerance_cents?: readonly number[];
}

/** A resolved design target: what each tuned partial should sound, in Hz, and how close is enough. */
export interface DesignTarget {
  /** Fundamental (Hz). */
  readonly fundamentalHz: number;
  /** A4 reference (Hz) the note was read at. */
  readonly a4Hz: number;
  /** The note name if one was given. */
  readonly note?: string;
  /** Ratios to the fundamental, starting with 1. */
  readonly ratios: readonly number[];
  /** Target frequency of each tuned partial (Hz): fundamentalHz × ratio. */
  readonly hz: readonly number[];
  /** ± tolerance per partial (cents). */
  readonly toleranceCents: readonly number[];
}

/**
 * Parses ratios: a preset name or colon-separated numbers starting with 1, strictly increasing,
 * at most 5 partials ("1:4:10", "1:3.95"). Throws InputError naming `field`.
 */
export function parseRatios(value: string | readonly number[], source = 'target', field = 'ratios'): number[] {
  let ratios: number[];
  if (typeof value === 'string') {
    const preset = ratioPresets[value.trim().toLowerCase()];
    if (preset) return [...preset];
    const parts = value.split(':').map((part) => part.trim());
    ratios = parts.map(Number);
    if (parts.some((part) => part === '') || ratios.some((r) => !Number.isFinite(r)))
      throw new InputError(source, field, `"${value}" is neither a preset (${Object.keys(ratioPresets).join(', ')}) nor numbers separated by colons such as 1:4:10`);
  } else if (Array.isArray(value)) {
    ratios = [...value];
    if (ratios.some((r) => typeof r !== 'number' || !Number.isFinite(r))) throw new InputError(source, field, 'must all be numbers');
  } else {
    throw new InputError(source, field, 'must be a preset name or a list of numbers');
  }
  if (ratios.length < 1 || ratios.length > 5) throw new InputError(source, field, `give 1 to 5 ratios (got ${ratios.length})`);
  if (ratios[0] !== 1) throw new InputError(source, field, `the first ratio is the fundamental and must be 1 (got ${ratios[0]})`);
  for (let i = 1; i < ratios.length; i++)
    if (!(ratios[i]! > ratios[i - 1]! * 1.05)) throw new InputError(source, field, `ratios must increase by more than 5 % each (${ratios[i - 1]} then ${ratios[i]})`);
  if (ratios[ratios.length - 1]! > 40) throw new InputError(source, field, `ratio ${ratios[ratios.length - 1]} is beyond what a bar's bending partials reach (at most 40)`);
  return ratios;
}

/**
 * Resolves a target: the fundamental from a note (equal temperament at `a4`, MIDI 1.0) or a
 * frequency, the ratios (default 1:4:10) and the tolerances (defaults of defaultToleranceCents).
 * Throws InputError for missing, conflicting or out-of-range input.
 */
export function resolveDesignTarget(input: DesignTargetInput, source = 'target'): DesignTarget {
  if (typeof input !== 'object' || input === null) throw new InputError(source, 'target', 'must be an object with a note or hz');
  const a4Hz = input.a4 === undefined ? standardA4Hz : checkA4(input.a4, source, 'a4');
  if (input.note !== undefined && input.hz !== undefined) throw new InputError(source, 'note', 'give a note or hz, not both');
  let fundamentalHz: number;
  if (input.note !== undefined) fundamentalHz = noteToHz(input.note, a4Hz, source, 'note');
  else if (input.hz !== undefined) {
    if (typeof input.hz !== 'number' || !Number.isFinite(input.hz) || input.hz < 20 || input.hz > 20000)
      throw new InputError(source, 'hz', `must be a frequency from 20 to 20000 Hz (got ${JSON.stringify(input.hz)})`);
    fundamentalHz = input.hz;
  } else throw new InputError(source, 'note', 'give the note (e.g. F3) or the fundamental in Hz');
  const ratios = parseRatios(input.ratios ?? '1:4:10', source, 'ratios');
  const given = input.tolerance_cents ?? [];
  if (!Array.isArray(given)) throw new InputError(source, 'tolerance_cents', 'must be a list of numbers (cents)');
  if (given.length > ratios.length) throw new InputError(source, 'tolerance_cents', `${given.length} tolerances for ${ratios.length} partials`);
  const toleranceCents = ratios.map((_, k) => {
    const tolerance = given[k] ?? defaultToleranceCents(k);
    if (typeof tolerance !== 'number' || !Number.isFinite(tolerance) || tolerance < 0.1 || tolerance > 100)
      throw new InputError(source, `tolerance_cents[${k}]`, `must be from 0.1 to 100 cents (got ${JSON.stringify(tolerance)})`);
    return tolerance;
  });
  const target: DesignTarget = {
    fundamentalHz,
    a4Hz,
    ratios,
    hz: ratios.map((r) => r * fundamentalHz),
    toleranceCents,
    ...(input.note !== undefined ? { note: input.note.trim() } : {}),
  };
  return target;
}

/** Parses a tolerance list such as "2,5,15" (cents). Throws InputError naming `field`. */
export function parseToleranceList(text: string, source = 'command line', field = '--tolerance-cents'): number[] {
  const values = text.split(/[,:]/).map((part) => Number(part.trim()));
  if (text.trim() === '' || values.some((v) => !Number.isFinite(v))) throw new InputError(source, field, `"${text}" is not a list of numbers such as 2,5,15`);
  return values;
}
