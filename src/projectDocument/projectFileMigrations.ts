// Migrations of the project file from older versions to the current one. Each step takes the
// plain JSON of version n and returns version n + 1; they run in order before validation.
import { InputError } from '../fileFormats/InputError.ts';
import { projectFileFormat, projectFileVersion } from './projectFileTypes.ts';

type JsonObject = Record<string, unknown>;

function isObject(value: unknown): value is JsonObject {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** A short, stable identifier derived from text (FNV-1a, 32 bit, hex). */
function stableId(text: string): string {
  let hash = 0x811c9dc5;
  for (let index = 0; index < text.length; index += 1) {
    hash ^= text.charCodeAt(index);
    hash = Math.imul(hash, 0x01000193) >>> 0;
  }
  return hash.toString(16).padStart(8, '0');
}

/** Bar states of version 1 and their version-2 names. */
const stateNamesV1: Record<string, string> = { new: 'not-started', cut: 'rough', tuning: 'tuning', finished: 'done' };

/**
 * Version 1 (the first layout) kept A4 at the top level, called the present shape `shape` and the
 * bar state `status` (new / cut / tuning / finished), and had no project id, no revision counter
 * and no save time. Version 2 moves A4 into the instrument, renames those fields, adds the plan
 * and advice slots (empty), and the resonator end (unflanged, the usual plain tube).
 */
function migrate1to2(v1: JsonObject, source: string): JsonObject {
  const instrument = isObject(v1.instrument) ? { ...v1.instrument } : {};
  if (!('a4_hz' in instrument)) instrument.a4_hz = v1.a4_hz;
  if (!('resonator_end' in instrument)) instrument.resonator_end = 'unflanged';
  if (!Array.isArray(v1.bars)) throw new InputError(source, 'bars', 'must be a list of bars');
  const savedAt = typeof v1.saved_at === 'string' ? v1.saved_at : null;
  const bars = v1.bars.map((bar: unknown) => {
    if (!isObject(bar)) return bar;
    const { shape, status, ...rest } = bar;
    return {
      ...rest,
      current: shape ?? bar.blank,
      state: typeof status === 'string' ? (stateNamesV1[status] ?? status) : 'not-started',
      design: null,
      advice: null,
      notes: typeof bar.notes === 'string' ? bar.notes : '',
      updated_at: savedAt ?? '1970-01-01T00:00:00.000Z',
    };
  });
  const { a4_hz: _a4, ...rest } = v1;
  return { ...rest, version: 2, id: `project-${stableId(String(v1.name ?? ''))}`, revision: 0, saved_at: savedAt, instrument, bars };
}

/** Migration steps keyed by the version they start from. */
const migrations: Record<number, (value: JsonObject, source: string) => JsonObject> = { 1: migrate1to2 };

/**
 * Brings a parsed project file of any known version to the current version (plain JSON, not yet
 * validated). Throws InputError when it is not a project file, or when its version is unknown or
 * newer than this barwright reads. Never mutates its input.
 */
export function migrateProjectFile(value: unknown, source: string): JsonObject {
  if (!isObject(value)) throw new InputError(source, '(file)', 'must be a JSON object (a barwright project file)');
  if (value.format !== projectFileFormat) throw new InputError(source, 'format', `must be "${projectFileFormat}" (this is not a barwright project file)`);
  const version = value.version;
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 1) throw new InputError(source, 'version', 'must be a whole number from 1');
  if (version > projectFileVersion) throw new InputError(source, 'version', `is ${version}, newer than this barwright reads (up to ${projectFileVersion}); update barwright`);
  let current: JsonObject = structuredClone(value);
  for (let from = version; from < projectFileVersion; from += 1) {
    const step = migrations[from];
    if (!step) throw new InputError(source, 'version', `no migration from version ${from}`);
    current = step(current, source);
  }
  return current;
}
