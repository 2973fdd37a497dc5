import { InputError } from './InputError.ts';

/** A parsed JSON object (not an array, not null), its fields not yet checked. */
export type JsonObject = Record<string, unknown>;

/** True when a parsed JSON value is an object (not an array, not null). */
export function isJsonObject(value: unknown): value is JsonObject {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/**
 * A field that must be a finite number greater than 0, in the unit named (refused with a one-line
 * InputError naming the file, the field and the rule).
 */
export function positiveNumber(source: string, field: string, value: unknown, unit: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new InputError(source, field, `must be a number${unit ? ` in ${unit}` : ''}`);
  if (value <= 0) throw new InputError(source, field, `must be greater than 0${unit ? ` ${unit}` : ''} (got ${value})`);
  return value;
}

/**
 * Checked access where a lookup may miss: the value, or an internal error naming what was looked
 * for. For lookups the code's own bookkeeping guarantees (a key it inserted itself); user input
 * is refused earlier with an InputError.
 */
export function defined<T>(value: T | undefined, what: string): T {
  if (value === undefined) throw new Error(`internal: ${what} is missing`);
  return value;
}
