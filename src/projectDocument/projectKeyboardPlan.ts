// The keyboard plan a project keeps (optional field `keyboard_plan` of the project file): the
// keyboard file it was planned from and the plan as planKeyboard returned it, so a reload shows
// it and a new run resumes from it. Checked with the project (zod), each bar's planned shape by
// the bar-file rules.
import { z } from 'zod';
import type { KeyboardPlan } from '../instrument/planKeyboard.ts';
import { parseBarFile } from '../fileFormats/barFile.ts';
import { isInputError } from '../fileFormats/InputError.ts';
import { parseKeyboardFile } from '../fileFormats/keyboardFile.ts';
import type { KeyboardFile } from '../fileFormats/keyboardFileTypes.ts';

/** A project's stored keyboard plan: its input, the plan (maybe cut short) and when it was stored. */
export interface KeyboardPlanRecord {
  keyboard: KeyboardFile;
  plan: KeyboardPlan;
  planned_at: string;
}

/** A schema that runs an InputError-throwing parser and reports its field and rule. */
function parsedBy<T>(parse: (value: unknown) => T) {
  return z.unknown().transform((value, context): T => {
    try {
      return parse(value);
    } catch (error) {
      if (!isInputError(error)) throw error;
      context.addIssue({ code: 'custom', path: error.field.split('.'), message: error.rule, input: value });
      return z.NEVER;
    }
  });
}

const finite = z.number({ error: 'must be a number' }).refine(Number.isFinite, { error: 'must be finite' });
const text = z.string({ error: 'must be text' });

const plannedBarSchema = z.looseObject({
  note: text,
  midi: z.number().int({ error: 'must be a whole number' }),
  index: z.number().int({ error: 'must be a whole number' }),
  fingerprint: text,
  status: z.enum(['in-tolerance', 'out-of-tolerance', 'infeasible'], { error: 'must be "in-tolerance", "out-of-tolerance" or "infeasible"' }),
  reason: text.optional(),
  bar: parsedBy((value) => parseBarFile(value, 'planned bar')),
  blank: z.looseObject({ length_mm: finite, width_mm: finite, thickness_mm: finite }),
  target_hz: z.array(finite),
  check: z.looseObject({ hz: z.array(finite), cents_error: z.array(finite) }),
  cord_holes_mm: z.array(finite).length(2, { error: 'must hold two positions' }),
});

/** Schema of the stored keyboard plan (unknown extra fields kept). */
export const keyboardPlanRecordSchema = z.looseObject({
  keyboard: parsedBy((value) => parseKeyboardFile(value, 'keyboard plan')),
  planned_at: z.string({ error: 'must be a date and time (ISO 8601)' }).refine((t) => !Number.isNaN(Date.parse(t)), { error: 'must be a date and time (ISO 8601)' }),
  plan: z.looseObject({
    format: z.literal('barwright.keyboard-plan', { error: 'must be "barwright.keyboard-plan"' }),
    version: z.literal(1, { error: 'must be 1' }),
    notes: z.array(text),
    advice: z.record(z.string(), z.looseObject({ fingerprint: text, note: text })),
    schedule: z.array(z.looseObject({ note: text, length_mm: finite })),
    bars: z.record(z.string(), plannedBarSchema),
    summary: z.looseObject({ bars: finite, designed: finite, complete: z.boolean() }),
    cautions: z.array(text),
  }),
});
