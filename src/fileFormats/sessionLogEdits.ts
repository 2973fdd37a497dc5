// Growing a session log without rewriting it: steps are only ever appended, and any other change
// between two versions of a log is reported so it can be shown to the maker before it is saved.
import { InputError } from './InputError.ts';
import { parseSessionFile, type SessionLogStep } from './sessionFile.ts';
import { isJsonObject } from './jsonFields.ts';
import { parseSessionLogStep } from './sessionFileSteps.ts';

/** One difference between an older and a newer version of a session log. */
export interface SessionLogChange {
  kind: 'step-added' | 'step-changed' | 'step-removed' | 'header-changed';
  /** Step number (1-based) for step changes. */
  step?: number;
  /** The top-level field for header changes (`target`, `limits`, …). */
  field?: string;
}

/** Structural equality of JSON values (key order ignored). */
function sameJson(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && a.every((item, index) => sameJson(item, b[index]));
  if (isJsonObject(a) && isJsonObject(b)) {
    const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
    for (const key of keys) if (!sameJson(a[key], b[key])) return false;
    return true;
  }
  return false;
}

/**
 * Every difference between two versions of a session log (raw JSON values): steps added at the
 * end, steps changed or removed, header fields changed. An empty list or only `step-added`
 * entries means `after` merely extends `before`; anything else is a rewrite that must be shown
 * to the maker, never saved silently.
 */
export function sessionLogChanges(before: unknown, after: unknown): SessionLogChange[] {
  if (!isJsonObject(before) || !isJsonObject(after)) throw new InputError('session', 'session', 'must be a JSON object');
  const changes: SessionLogChange[] = [];
  const keys = new Set([...Object.keys(before), ...Object.keys(after)]);
  for (const key of keys) if (key !== 'steps' && !sameJson(before[key], after[key])) changes.push({ kind: 'header-changed', field: key });
  const old = Array.isArray(before.steps) ? before.steps : [];
  const now = Array.isArray(after.steps) ? after.steps : [];
  for (let index = 0; index < Math.max(old.length, now.length); index++) {
    if (index >= now.length) changes.push({ kind: 'step-removed', step: index + 1 });
    else if (index >= old.length) changes.push({ kind: 'step-added', step: index + 1 });
    else if (!sameJson(old[index], now[index])) changes.push({ kind: 'step-changed', step: index + 1 });
  }
  return changes;
}

/** True when `after` only appends steps to `before` (no rewrite). */
export function sessionLogOnlyExtends(before: unknown, after: unknown): boolean {
  return sessionLogChanges(before, after).every((change) => change.kind === 'step-added');
}

/**
 * A new session log (raw JSON value) with `step` appended: the existing log is validated, deep
 * copied and left exactly as it was (fields barwright does not know included); the new step is
 * validated like any step of the file. Pure: `session` itself is not modified.
 */
export function appendSessionStep(session: unknown, step: SessionLogStep | Record<string, unknown>, source = 'session'): Record<string, unknown> {
  const parsed = parseSessionFile(session, source);
  const field = `steps[${parsed.steps.length}]`;
  parseSessionLogStep(source, field, step);
  const copy = structuredClone(session) as Record<string, unknown>;
  copy.steps = [...(copy.steps as unknown[]), structuredClone(step)];
  parseSessionFile(copy, source);
  return copy;
}
