// zod schemas for the project file and the bar and session files it embeds. Rules read as plain
// sentences so a rejected import names the field and the rule broken (see projectFileIssues.ts).
import { z } from 'zod';
import { parseNote } from '../fileFormats/noteName.ts';
import { isMaterialPresetName } from '../fileFormats/materialPresetNames.ts';
import { parseBarFile } from '../fileFormats/barFile.ts';
import { parseSessionFile } from '../fileFormats/sessionFile.ts';
import { isInputError } from '../fileFormats/InputError.ts';
import { keyboardPlanRecordSchema } from './projectKeyboardPlan.ts';
import { parseLotFile } from '../fileFormats/lotFile.ts';
import { parseChimeSetFile } from '../fileFormats/chimeSetFile.ts';
import { parseWorkshop } from '../fileFormats/workshopFile.ts';

/** A finite number > 0 with a unit in the rule. */
function positive(unit: string) {
  return z.number({ error: `must be a number (${unit})` }).refine((value) => Number.isFinite(value) && value > 0, { error: `must be greater than 0 ${unit}` });
}

/** A note name in scientific pitch notation, checked by the pitch module. */
const noteName = z.string({ error: 'must be a note name such as A2, F#3 or Bb5' }).refine(
  (name) => {
    try {
      parseNote(name);
      return true;
    } catch {
      return false;
    }
  },
  { error: 'must be a note name in scientific pitch notation (letter A–G, optional # or b, octave, e.g. F#3)' },
);

const isoTime = z.string({ error: 'must be a date and time (ISO 8601)' }).refine((text) => !Number.isNaN(Date.parse(text)), { error: 'must be a date and time (ISO 8601)' });

/** Bar-file material: explicit values or a preset name. */
const barMaterialSchema = z.union(
  [
    z.looseObject({ preset: z.string({ error: 'must be a preset name' }).refine((name) => isMaterialPresetName(name), { error: 'must name one of the material presets' }), label: z.string().optional() }),
    z
      .looseObject({
        E_GPa: positive('GPa'),
        G_GPa: positive('GPa').optional(),
        poisson: z.number({ error: 'must be a number' }).refine((v) => v > -1 && v < 0.5, { error: 'must lie between −1 and 0.5' }).optional(),
        density_kg_m3: positive('kg/m³'),
        shear_coefficient: z.number({ error: 'must be a number' }).refine((v) => v > 0 && v <= 1, { error: 'must lie in (0, 1]' }).optional(),
        label: z.string().optional(),
      }),
  ],
  { error: 'must give E_GPa and density_kg_m3 (and G_GPa or poisson), or a preset name' },
);

/** Splits a field name such as `profile_mm[3]` or `section.wall_mm` into a zod path. */
function fieldToPath(field: string): (string | number)[] {
  const path: (string | number)[] = [];
  for (const part of field.split('.')) {
    const match = /^([^[\]]*)((?:\[\d+\])*)$/.exec(part);
    if (!match) {
      path.push(part);
      continue;
    }
    if (match[1]) path.push(match[1]);
    for (const index of match[2]!.matchAll(/\[(\d+)\]/g)) path.push(Number(index[1]));
  }
  return path.filter((key) => key !== 'bar');
}

/**
 * The contract's bar file, checked by the same parser the CLI uses (parseBarFile), so a project
 * accepts exactly the bars `barwright modes` accepts. The result is the parsed, normalised bar.
 */
export const barFileSchema = z.unknown().transform((value, context) => {
  try {
    return parseBarFile(value, 'bar');
  } catch (error) {
    if (!isInputError(error)) throw error;
    context.addIssue({ code: 'custom', path: fieldToPath(error.field), message: error.rule, input: value });
    return z.NEVER;
  }
});

const ratioList = z.array(positive('(ratio)'), { error: 'must be a list of ratios' }).min(1, { error: 'needs at least one ratio' });
const toleranceList = z.array(positive('cents'), { error: 'must be a list of tolerances in cents' }).min(1, { error: 'needs at least one tolerance' });
const hzList = z.array(positive('Hz'), { error: 'must be a list of frequencies in Hz' });

/**
 * The contract's session file, checked by the session parser the CLI uses (parseSessionFile), so
 * a project's sessions export as files `barwright next-cut` accepts. The workbench always keeps
 * a minimum thickness limit.
 */
export const sessionFileSchema = z.unknown().transform((value, context) => {
  try {
    const session = parseSessionFile(value, 'session');
    if (!(typeof session.limits.min_thickness_mm === 'number' && session.limits.min_thickness_mm > 0)) {
      context.addIssue({ code: 'custom', path: ['limits', 'min_thickness_mm'], message: 'must be greater than 0 mm', input: value });
      return z.NEVER;
    }
    return session;
  } catch (error) {
    if (!isInputError(error)) throw error;
    context.addIssue({ code: 'custom', path: fieldToPath(error.field).filter((key) => key !== 'session'), message: error.rule, input: value });
    return z.NEVER;
  }
});

const registerSchema = z.looseObject({
  id: z.string({ error: 'must be text' }).min(1, { error: 'must not be empty' }),
  label: z.string({ error: 'must be text' }),
  family: z.enum(['keyboard', 'chime'], { error: 'must be "keyboard" or "chime"' }),
  ratios: ratioList,
  tolerance_cents: toleranceList,
  resonator_inner_diameter_mm: positive('mm').optional(),
});

/** Where to check a cut with the caliper: positions (mm from the left end) and thicknesses to expect (mm). */
const checkpointsSchema = z.array(z.looseObject({ x_mm: z.number({ error: 'must be a number (mm)' }).refine((v) => Number.isFinite(v) && v >= 0, { error: 'must be 0 mm or more' }), thickness_mm: positive('mm') }), { error: 'must be a list of caliper checkpoints' });

/** One finished bar's lot record, checked by the lot file's parser. */
const lotRecordSchema = z.unknown().transform((value, context) => {
  try {
    return parseLotFile({ format: 'barwright.lots', version: 1, lots: { lot: { bars: [value] } } }, 'lot_record').lots['lot']!.bars[0]!;
  } catch (error) {
    if (!isInputError(error)) throw error;
    context.addIssue({ code: 'custom', path: fieldToPath(error.field).slice(4), message: error.rule, input: value });
    return z.NEVER;
  }
});

const designSchema = z.looseObject({
  feasible: z.boolean({ error: 'must be true or false' }),
  bar: barFileSchema,
  target_hz: hzList,
  predicted_hz: hzList,
  cents_error: z.array(z.number({ error: 'must be a number (cents)' }).refine(Number.isFinite, { error: 'must be finite' })),
  reason: z.string().optional(),
  planned_at: isoTime,
});

/** What the 3D model said in a step (SolidSessionReport): the fitted wood is checked, the rest kept as given. */
const solidReportSchema = z.looseObject({
  E_L_GPa: positive('GPa'),
  shear_scale: positive('(a share of the bar file’s shear moduli)'),
  solid_sensitivities: z.boolean({ error: 'must be true or false' }),
  solid_solves: z.number({ error: 'must be a whole number' }).int({ error: 'must be a whole number' }).min(0, { error: 'must be 0 or more' }),
});

const adviceSchema = z.looseObject({
  status: z.enum(['cut', 'done', 'stuck'], { error: 'must be "cut", "done" or "stuck"' }),
  bar_after: barFileSchema,
  predicted_hz: hzList,
  calibrated_material: barMaterialSchema.optional(),
  reason: z.string().optional(),
  checkpoints: checkpointsSchema.optional(),
  lot_record: lotRecordSchema.optional(),
  theory: z.enum(['line', 'solid'], { error: 'must be "line" or "solid"' }).optional(),
  solid: solidReportSchema.nullable().optional(),
  from_steps: z.number().int({ error: 'must be a whole number' }).min(0, { error: 'must be 0 or more' }),
  advised_at: isoTime,
});

/** The project's lots, checked by the lot file's parser (the CLI's `*.lots.json`), so they export as a lot file. */
const lotsSchema = z.unknown().transform((value, context) => {
  try {
    return parseLotFile({ format: 'barwright.lots', version: 1, lots: value }, 'lots').lots;
  } catch (error) {
    if (!isInputError(error)) throw error;
    context.addIssue({ code: 'custom', path: fieldToPath(error.field).filter((key) => key !== 'lots'), message: error.rule, input: value });
    return z.NEVER;
  }
});

/** The project's chime set, checked by the chime-set file's parser (the CLI's `*.chimes.json`), so it exports as a chime-set file. */
const chimeSetSchema = z.unknown().transform((value, context) => {
  try {
    return parseChimeSetFile(value, 'chime_set');
  } catch (error) {
    if (!isInputError(error)) throw error;
    context.addIssue({ code: 'custom', path: fieldToPath(error.field).filter((key) => key !== 'chime set'), message: error.rule, input: value });
    return z.NEVER;
  }
});

/** The project's workshop, checked by the workshop file's parser (the CLI's `--workshop`), so it exports as a workshop file. */
const workshopSchema = z.unknown().transform((value, context) => {
  try {
    return parseWorkshop(value, 'project', 'workshop.');
  } catch (error) {
    if (!isInputError(error)) throw error;
    context.addIssue({ code: 'custom', path: fieldToPath(error.field).slice(1), message: error.rule, input: value });
    return z.NEVER;
  }
});

const barSchema = z.looseObject({
  id: z.string({ error: 'must be text' }).min(1, { error: 'must not be empty' }),
  note: noteName,
  register: z.string({ error: 'must name a register' }),
  state: z.enum(['not-started', 'rough', 'tuning', 'done'], { error: 'must be "not-started", "rough", "tuning" or "done"' }),
  blank: barFileSchema,
  current: barFileSchema,
  design: designSchema.nullable(),
  session: sessionFileSchema,
  advice: adviceSchema.nullable(),
  expected_hz: hzList.optional(),
  cut_finished_at: isoTime.optional(),
  checkpoints: checkpointsSchema.optional(),
  cut_note: z.string({ error: 'must be text' }).max(400, { error: 'must be at most 400 characters' }).optional(),
  notes: z.string({ error: 'must be text' }),
  updated_at: isoTime,
});

/** The project file, current version (2), with its cross-references checked. */
export const projectFileSchema = z
  .looseObject({
    format: z.literal('barwright.project', { error: 'must be "barwright.project"' }),
    version: z.literal(2, { error: 'must be 2' }),
    id: z.string({ error: 'must be text' }).min(1, { error: 'must not be empty' }),
    name: z.string({ error: 'must be text' }).min(1, { error: 'must not be empty' }).max(200, { error: 'must be at most 200 characters' }),
    revision: z.number({ error: 'must be a whole number' }).int({ error: 'must be a whole number' }).min(0, { error: 'must be 0 or more' }),
    saved_at: isoTime.nullable(),
    instrument: z.looseObject({
      name: z.string({ error: 'must be text' }),
      lowest_note: noteName,
      highest_note: noteName,
      a4_hz: z.number({ error: 'must be a number (Hz)' }).refine((v) => v >= 300 && v <= 600, { error: 'must lie within 300–600 Hz' }),
      material: barMaterialSchema,
      registers: z.array(registerSchema).min(1, { error: 'needs at least one register' }),
      air_temperature_c: z.number({ error: 'must be a number (°C)' }).refine((v) => v >= -30 && v <= 60, { error: 'must lie within −30 to 60 °C' }),
      resonator_end: z.enum(['unflanged', 'flanged'], { error: 'must be "unflanged" or "flanged"' }),
      resonator_max_length_mm: z.number({ error: 'must be a number (mm)' }).refine((v) => v >= 50 && v <= 3000, { error: 'must lie within 50–3000 mm' }).optional(),
    }),
    bars: z.array(barSchema, { error: 'must be a list of bars' }),
    keyboard_plan: keyboardPlanRecordSchema.optional(),
    lots: lotsSchema.optional(),
    chime_set: chimeSetSchema.optional(),
    workshop: workshopSchema.optional(),
  })
  .superRefine((project, context) => {
    const registerIds = new Set<string>();
    project.instrument.registers.forEach((register, index) => {
      if (registerIds.has(register.id)) context.addIssue({ code: 'custom', path: ['instrument', 'registers', index, 'id'], message: `register id "${register.id}" is used twice` });
      registerIds.add(register.id);
      if (register.tolerance_cents.length !== register.ratios.length) context.addIssue({ code: 'custom', path: ['instrument', 'registers', index, 'tolerance_cents'], message: `needs one tolerance per ratio (${register.ratios.length})` });
    });
    if (parseNote(project.instrument.highest_note).midi < parseNote(project.instrument.lowest_note).midi) {
      context.addIssue({ code: 'custom', path: ['instrument', 'highest_note'], message: 'must not be below the lowest note' });
    }
    const barIds = new Set<string>();
    project.bars.forEach((bar, index) => {
      if (barIds.has(bar.id)) context.addIssue({ code: 'custom', path: ['bars', index, 'id'], message: `bar id "${bar.id}" is used twice` });
      barIds.add(bar.id);
      if (!registerIds.has(bar.register)) context.addIssue({ code: 'custom', path: ['bars', index, 'register'], message: `names no register of the instrument ("${bar.register}")` });
    });
  });
