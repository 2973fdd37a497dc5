// Turning zod's validation issues into barwright's `source: field: rule` errors.
import type { z } from 'zod';
import { InputError } from '../fileFormats/InputError.ts';

/** Writes a zod path as a field name: `bars[2].blank.profile_mm[3]`. */
export function formatFieldPath(path: readonly PropertyKey[]): string {
  let text = '';
  for (const key of path) {
    if (typeof key === 'number') text += `[${key}]`;
    else text += text === '' ? String(key) : `.${String(key)}`;
  }
  return text === '' ? '(file)' : text;
}

/** A plain-words rule for zod's built-in issues that have no message of ours. */
export const plainRules: z.core.$ZodErrorMap = (issue) => {
  switch (issue.code) {
    case 'invalid_type':
      return issue.input === undefined ? `is missing (must be ${issue.expected})` : `must be ${issue.expected === 'array' ? 'a list' : issue.expected}`;
    case 'too_small':
      return issue.origin === 'array' ? `needs at least ${String(issue.minimum)} entries` : `must be ${issue.inclusive ? 'at least' : 'greater than'} ${String(issue.minimum)}`;
    case 'too_big':
      return issue.origin === 'array' ? `allows at most ${String(issue.maximum)} entries` : `must be ${issue.inclusive ? 'at most' : 'less than'} ${String(issue.maximum)}`;
    case 'invalid_value':
      return `must be one of ${issue.values.map((value) => JSON.stringify(value)).join(', ')}`;
    default:
      return undefined;
  }
};

/** Converts zod issues to InputErrors with the given source (file name or "import"). */
export function issuesToInputErrors(source: string, issues: readonly z.core.$ZodIssue[]): InputError[] {
  return issues.map((issue) => new InputError(source, formatFieldPath(issue.path), issue.message));
}
