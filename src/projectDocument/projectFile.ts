// Reading, validating and writing barwright project files (`*.project.json`).
import { InputError } from '../fileFormats/InputError.ts';
import { migrateProjectFile } from './projectFileMigrations.ts';
import { chimePieces, chimeSetFromPieces } from './projectChimeSet.ts';
import { barFileSchema, projectFileSchema, sessionFileSchema } from './projectFileSchema.ts';
import { issuesToInputErrors, plainRules } from './projectFileIssues.ts';
import type { BarFile } from '../fileFormats/barFile.ts';
import type { ProjectBar, ProjectFile, SessionFile } from './projectFileTypes.ts';


/** Outcome of checking a project file: the project, or every problem found. */
export type ProjectFileCheck = { ok: true; project: ProjectFile } | { ok: false; errors: InputError[] };

/** Adds the bar's note to a `bars[i]…` field name so the maker sees which bar is meant. */
function withBarNote(error: InputError, raw: unknown): InputError {
  const match = /^bars\[(\d+)\]/.exec(error.field);
  if (!match) return error;
  const bars = (raw as { bars?: unknown } | null)?.bars;
  const note = Array.isArray(bars) ? (bars[Number(match[1])] as { note?: unknown } | undefined)?.note : undefined;
  if (typeof note !== 'string') return error;
  return new InputError(error.source, error.field, `${error.rule} (bar ${note})`);
}

/**
 * Checks a parsed JSON value as a project file of any known version: migrates it, then validates
 * every field. Never throws for bad input; the input is not modified.
 */
export function checkProjectFile(value: unknown, source: string): ProjectFileCheck {
  let migrated: Record<string, unknown>;
  try {
    migrated = migrateProjectFile(value, source);
  } catch (error) {
    if (error instanceof InputError) return { ok: false, errors: [error] };
    throw error;
  }
  const result = projectFileSchema.safeParse(migrated, { error: plainRules });
  if (!result.success) return { ok: false, errors: issuesToInputErrors(source, result.error.issues).map((error) => withBarNote(error, migrated)) };
  const project = result.data as ProjectFile;
  // A file from before the chime set was kept in the project gets one from its chime pieces.
  if (project.chime_set === undefined && chimePieces(project).length > 0) project.chime_set = chimeSetFromPieces(project);
  return { ok: true, project };
}

/**
 * Parses a project file value (any known version) into the current version; throws the first
 * problem as an InputError (`source: field: rule`, with "and N more problems" when there are more).
 */
export function parseProjectFile(value: unknown, source: string): ProjectFile {
  const check = checkProjectFile(value, source);
  if (check.ok) return check.project;
  const [first, ...others] = check.errors;
  if (others.length === 0) throw first!;
  throw new InputError(first!.source, first!.field, `${first!.rule} (and ${others.length} more problem${others.length === 1 ? '' : 's'})`);
}

/** Parses the text of a project file (JSON) and validates it; see parseProjectFile. */
export function readProjectFileText(text: string, source: string): ProjectFile {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    throw new InputError(source, '(file)', `is not valid JSON (${error instanceof Error ? error.message : String(error)})`);
  }
  return parseProjectFile(value, source);
}

/** Throws when any number in `value` is NaN or infinite (JSON cannot carry them honestly). */
function assertFiniteNumbers(value: unknown, path: string, source: string): void {
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new InputError(source, path || '(file)', `is ${String(value)}; only finite numbers can be saved`);
  } else if (Array.isArray(value)) {
    value.forEach((item, index) => assertFiniteNumbers(item, `${path}[${index}]`, source));
  } else if (typeof value === 'object' && value !== null) {
    for (const [key, item] of Object.entries(value)) assertFiniteNumbers(item, path ? `${path}.${key}` : key, source);
  }
}

/** Writes a project as the text of a project file (validated first; 2-space indented JSON). */
export function serializeProjectFile(project: ProjectFile, source = 'project'): string {
  assertFiniteNumbers(project, '', source);
  const validated = parseProjectFile(project, source);
  return `${JSON.stringify(validated, null, 2)}\n`;
}

/** Validates a bar file value (contract format); throws InputError naming the field and rule. */
export function checkBarFile(value: unknown, source: string): BarFile {
  const result = barFileSchema.safeParse(value, { error: plainRules });
  if (!result.success) throw issuesToInputErrors(source, result.error.issues)[0]!;
  return result.data as BarFile;
}

/** Validates a session file value (contract format); throws InputError naming the field and rule. */
export function checkSessionFile(value: unknown, source: string): SessionFile {
  const result = sessionFileSchema.safeParse(value, { error: plainRules });
  if (!result.success) throw issuesToInputErrors(source, result.error.issues)[0]!;
  return result.data as SessionFile;
}

/** The bar now, as a stand-alone bar file for the CLI (`barwright modes`). */
export function exportBarFile(bar: ProjectBar): BarFile {
  return structuredClone({ ...bar.current, label: bar.current.label ?? bar.note });
}

/** The bar's session, as a stand-alone session file for the CLI (`barwright next-cut`). */
export function exportSessionFile(bar: ProjectBar): SessionFile {
  return structuredClone(bar.session);
}
