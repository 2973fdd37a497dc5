import { parseArgs, type ParseArgsConfig } from 'node:util';
import { InputError } from '../fileFormats/index.ts';

/** Where a command writes; tests pass their own to capture output. */
export interface CommandIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** Reads a file as UTF-8 text (relative to the working directory). */
  readText: (path: string) => Promise<string>;
  /** Reads a file as bytes. */
  readBytes: (path: string) => Promise<Uint8Array>;
  /** Writes a file (UTF-8 text or bytes). */
  writeFile: (path: string, data: string | Uint8Array) => Promise<void>;
}

/** One `barwright <name>` sub-command. Returns the exit code (0 ok, 2 bad input, 1 internal). */
export interface Command {
  name: string;
  /** One line for `barwright help`. */
  summary: string;
  /** The usage line(s), e.g. `barwright modes BAR [--modes N] [--json]`. */
  usage: string;
  run: (args: string[], io: CommandIo) => Promise<number>;
}

/**
 * Parses command-line options with node's util.parseArgs, turning its errors into InputError
 * (source "command line") so they exit 2 with a one-line message.
 */
export function parseOptions<T extends NonNullable<ParseArgsConfig['options']>>(
  args: string[],
  options: T,
): { values: ReturnType<typeof parseArgs<{ options: T; allowPositionals: true; strict: true }>>['values']; positionals: string[] } {
  try {
    const parsed = parseArgs({ args, options, allowPositionals: true, strict: true });
    return { values: parsed.values, positionals: parsed.positionals };
  } catch (error) {
    const message = error instanceof Error ? (error.message.split('\n')[0] ?? error.message) : String(error);
    throw new InputError('command line', 'options', message);
  }
}

/** Parses a number option; throws InputError naming the option when it is not a finite number. */
export function numberOption(value: string | undefined, name: string, rule?: (n: number) => string | null): number | undefined {
  if (value === undefined) return undefined;
  const n = Number(value);
  if (!Number.isFinite(n) || value.trim() === '') throw new InputError('command line', `--${name}`, `"${value}" is not a number`);
  const problem = rule?.(n);
  if (problem) throw new InputError('command line', `--${name}`, problem);
  return n;
}

/** Reads and parses a JSON file, reporting a syntax error as InputError on that file. */
export async function readJsonFile(path: string, io: CommandIo): Promise<unknown> {
  let text: string;
  try {
    text = await io.readText(path);
  } catch (error) {
    const code = (error as { code?: string }).code;
    throw new InputError(path, 'file', code === 'ENOENT' ? 'file not found' : `cannot be read (${code ?? String(error)})`);
  }
  try {
    return JSON.parse(text);
  } catch (error) {
    throw new InputError(path, 'JSON', `not valid JSON (${error instanceof Error ? error.message : String(error)})`);
  }
}

/**
 * Serialises a result for `--json`: exactly one JSON document. Refuses NaN/Infinity (which JSON
 * would silently turn into null) so a numerical failure surfaces as an internal error, never as a
 * plausible-looking result.
 */
export function toJson(value: unknown): string {
  return JSON.stringify(
    value,
    (key, v) => {
      if (typeof v === 'number' && !Number.isFinite(v)) throw new Error(`internal: non-finite number in result field "${key}"`);
      return v;
    },
    2,
  );
}

/** Formats rows as a plain aligned text table (first row is the header). */
export function formatTable(rows: readonly (readonly string[])[]): string {
  const widths: number[] = [];
  for (const row of rows) row.forEach((cell, i) => (widths[i] = Math.max(widths[i] ?? 0, cell.length)));
  return rows
    .map((row) => row.map((cell, i) => (i === row.length - 1 ? cell : cell.padEnd(widths[i]!))).join('  ').trimEnd())
    .join('\n');
}

/** Formats a number with fixed decimals for tables; never prints NaN. */
export function fixed(value: number, decimals: number): string {
  if (!Number.isFinite(value)) throw new Error('internal: non-finite number in table');
  return value.toFixed(decimals);
}
