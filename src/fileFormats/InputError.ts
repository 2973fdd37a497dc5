/**
 * A problem with what the user gave us: a file, a field, a command-line option.
 * The message always reads `source: field: rule` so a maker can find and fix it; the CLI maps it
 * to exit code 2 and the web app shows it next to the field.
 */
export class InputError extends Error {
  readonly source: string;
  readonly field: string;
  readonly rule: string;

  constructor(source: string, field: string, rule: string) {
    super(`${source}: ${field}: ${rule}`);
    this.name = 'InputError';
    this.source = source;
    this.field = field;
    this.rule = rule;
  }
}

/** True when `error` is an InputError (also across realms/workers where instanceof may fail). */
export function isInputError(error: unknown): error is InputError {
  return error instanceof InputError || (typeof error === 'object' && error !== null && (error as { name?: unknown }).name === 'InputError');
}
