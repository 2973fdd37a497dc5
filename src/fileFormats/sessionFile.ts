// The tune-and-trim session file (`*.session.json`, format "barwright.session", version 1):
// types and the validating parser. The contract's fields come first, then its turn-2 additions
// (the playing temperature; per step the air temperature, when the cut was finished and the
// caliper readings `measured_thickness_mm`), then barwright's compatible additions (cut limits
// beyond the minimum thickness, measurement uncertainty, a note and how the cut was made). All
// are optional, so every contract session file parses and every file written here is one.
import { InputError } from './InputError.ts';
import type { CutLimitsInput } from './cutLimitsInput.ts';
import type { SessionLog, SessionLogTarget } from './sessionFileTypes.ts';
import { parseNote } from './noteName.ts';
import { checkA4, midiToHz, standardA4Hz } from './concertPitch.ts';
import { isJsonObject } from './jsonFields.ts';
import { parseSessionLogStep, parseTemperature } from './sessionFileSteps.ts';

export type * from './sessionFileTypes.ts';

/**
 * Default one-sigma uncertainty of a measured partial, cents: a good electronic tuner or a tap
 * analysis of one second of sound reads to about half a cent (common practice; brief §2 "Hearing
 * the bar": sub-cent accuracy from one second of sound).
 */
export const defaultMeasurementUncertaintyCents = 0.5;

/** How far (cents) a target's `hz` and `note` may disagree when both are given. */
const targetAgreementCents = 1;

function finiteNumber(source: string, field: string, value: unknown, unit: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new InputError(source, field, `must be a number${unit ? ` (${unit})` : ''}`);
  return value;
}

function positiveList(source: string, field: string, value: unknown, unit: string, minimum: number): number[] {
  if (!Array.isArray(value)) throw new InputError(source, field, `must be a list of numbers (${unit})`);
  if (value.length < minimum) throw new InputError(source, field, `needs at least ${minimum} value${minimum === 1 ? '' : 's'}`);
  return value.map((item, index) => {
    const n = finiteNumber(source, `${field}[${index}]`, item, unit);
    if (n <= 0) throw new InputError(source, `${field}[${index}]`, `must be greater than 0 ${unit} (got ${n})`);
    return n;
  });
}

function parseTarget(source: string, value: unknown): SessionLogTarget {
  if (!isJsonObject(value)) throw new InputError(source, 'target', 'must be an object with hz (or note and a4), ratios and tolerance_cents');
  const ratios = positiveList(source, 'target.ratios', value.ratios, 'ratio', 1);
  if (Math.abs(ratios[0]! - 1) > 1e-9) throw new InputError(source, 'target.ratios[0]', `the first ratio is the fundamental and must be 1 (got ${ratios[0]})`);
  ratios.forEach((ratio, index) => {
    if (index > 0 && ratio <= ratios[index - 1]!) throw new InputError(source, `target.ratios[${index}]`, `ratios must increase (${ratio} is not above ${ratios[index - 1]})`);
  });
  const tolerance = positiveList(source, 'target.tolerance_cents', value.tolerance_cents, 'cents', 1);
  if (tolerance.length !== ratios.length) throw new InputError(source, 'target.tolerance_cents', `needs one tolerance per ratio (${ratios.length}), got ${tolerance.length}`);
  tolerance.forEach((t, index) => {
    if (t > 100) throw new InputError(source, `target.tolerance_cents[${index}]`, `${t} cents is more than a semitone; give at most 100`);
  });
  const target: SessionLogTarget = { ratios, tolerance_cents: tolerance };
  if (value.hz !== undefined) {
    const hz = finiteNumber(source, 'target.hz', value.hz, 'Hz');
    if (hz <= 0) throw new InputError(source, 'target.hz', `must be greater than 0 Hz (got ${hz})`);
    target.hz = hz;
  }
  if (value.a4 !== undefined) target.a4 = checkA4(finiteNumber(source, 'target.a4', value.a4, 'Hz'), source, 'target.a4');
  if (value.note !== undefined) {
    if (typeof value.note !== 'string') throw new InputError(source, 'target.note', 'must be a note name such as F3 or Bb4');
    parseNote(value.note, source, 'target.note');
    target.note = value.note;
  }
  if (value.playing_temperature_c !== undefined) target.playing_temperature_c = parseTemperature(source, 'target.playing_temperature_c', value.playing_temperature_c);
  if (target.hz === undefined && target.note === undefined) throw new InputError(source, 'target', 'give the fundamental as "hz", or as "note" (with an optional "a4", default 440)');
  if (target.hz !== undefined && target.note !== undefined) {
    const fromNote = midiToHz(parseNote(target.note).midi, target.a4 ?? standardA4Hz);
    const apart = 1200 * Math.log2(target.hz / fromNote);
    if (Math.abs(apart) > targetAgreementCents)
      throw new InputError(source, 'target.hz', `${target.hz} Hz is ${apart.toFixed(1)} cents from ${target.note} at A4 = ${target.a4 ?? standardA4Hz} Hz (${fromNote.toFixed(2)} Hz); give one or make them agree`);
  }
  return target;
}

const limitKeys = ['min_thickness_mm', 'uncut_end_mm', 'uncut_left_mm', 'uncut_right_mm', 'max_slope', 'min_tool_radius_mm', 'allow_shortening', 'max_shortening_mm', 'shorten_at'] as const;

/** Copies the known limit fields (types are checked later against the blank by resolveCutLimits). */
function parseLimits(source: string, value: unknown): CutLimitsInput {
  if (value === undefined) return {};
  if (!isJsonObject(value)) throw new InputError(source, 'limits', 'must be an object such as { "min_thickness_mm": 6 }');
  const limits: Record<string, unknown> = {};
  for (const key of limitKeys) {
    const item = value[key];
    if (item === undefined) continue;
    if (key === 'allow_shortening') {
      if (typeof item !== 'boolean') throw new InputError(source, 'limits.allow_shortening', 'must be true or false');
    } else if (key === 'shorten_at') {
      if (item !== 'free-end' && item !== 'both-ends') throw new InputError(source, 'limits.shorten_at', `must be "free-end" (a hung chime) or "both-ends" (a bar on cords), got ${JSON.stringify(item)}`);
    } else finiteNumber(source, `limits.${key}`, item, key === 'max_slope' ? 'rise over run' : 'mm');
    limits[key] = item;
  }
  return limits as CutLimitsInput;
}

/** The fundamental's target (Hz) of a validated session: `hz`, or the note at `a4` (default 440). */
export function sessionFundamentalHz(target: SessionLogTarget): number {
  if (target.hz !== undefined) return target.hz;
  return midiToHz(parseNote(target.note ?? '').midi, target.a4 ?? standardA4Hz);
}

/** Playing temperature assumed when a session gives none, °C (contract, turn 2: default 20). */
export const defaultPlayingTemperatureC = 20;

/** The temperature (°C) a session's readings are projected to: `target.playing_temperature_c`, or 20. */
export function sessionPlayingTemperatureC(target: SessionLogTarget): number {
  return target.playing_temperature_c ?? defaultPlayingTemperatureC;
}

/** Target frequency (Hz) of each tuned partial: the fundamental times each ratio. */
export function sessionTargetHz(target: SessionLogTarget): number[] {
  const fundamental = sessionFundamentalHz(target);
  return target.ratios.map((ratio) => fundamental * ratio);
}

/**
 * Validates a parsed JSON value as a session file and returns it typed. Throws
 * InputError(source, field, rule), e.g. `f3.session.json: steps[2].measured_hz[1]: must be greater
 * than 0 Hz (got -3)`; bar-file problems inside a step name the step (`steps[0].bar.profile_mm[3]`).
 * Rules beyond each field's own: every step's bar is the same kind of section, of the same width and
 * blank thickness as the first; `recorded_at` times never go backwards (the log is in the order the
 * bar was measured); a step's `cut_finished_at` lies between the previous step's reading and its
 * own. Caliper readings under the older name `thickness_measured_mm` come back as
 * `measured_thickness_mm`. Unknown fields are left out of the result (the file itself is never changed).
 */
export function parseSessionFile(value: unknown, source = 'session'): SessionLog {
  if (!isJsonObject(value)) throw new InputError(source, 'session', 'must be a JSON object');
  if (value.format !== 'barwright.session') throw new InputError(source, 'format', `must be "barwright.session" (got ${JSON.stringify(value.format)})`);
  if (value.version !== 1) throw new InputError(source, 'version', `must be 1 (got ${JSON.stringify(value.version)})`);
  if (value.label !== undefined && typeof value.label !== 'string') throw new InputError(source, 'label', 'must be text');
  const target = parseTarget(source, value.target);
  const limits = parseLimits(source, value.limits);
  let uncertainty: number | undefined;
  if (value.measurement_uncertainty_cents !== undefined) {
    uncertainty = finiteNumber(source, 'measurement_uncertainty_cents', value.measurement_uncertainty_cents, 'cents');
    if (uncertainty <= 0 || uncertainty > 50) throw new InputError(source, 'measurement_uncertainty_cents', `must be greater than 0 and at most 50 cents (got ${uncertainty})`);
  }
  if (!Array.isArray(value.steps)) throw new InputError(source, 'steps', 'must be a list of measured steps');
  const steps = value.steps.map((step: unknown, index) => parseSessionLogStep(source, `steps[${index}]`, step));
  steps.forEach((step, index) => {
    if (index === 0) return;
    const first = steps[0]!.bar.section;
    const section = step.bar.section;
    const field = `steps[${index}].bar.section`;
    if (section.shape !== first.shape) throw new InputError(source, `${field}.shape`, `is ${section.shape} but step 1's bar is ${first.shape}: a session follows one bar`);
    if (section.shape === 'rect' && first.shape === 'rect') {
      if (Math.abs(section.width_mm - first.width_mm) > 0.5) throw new InputError(source, `${field}.width_mm`, `${section.width_mm} mm differs from step 1's ${first.width_mm} mm: a session follows one bar (width is never cut)`);
      if (Math.abs(section.thickness_mm - first.thickness_mm) > 1e-6) throw new InputError(source, `${field}.thickness_mm`, `${section.thickness_mm} mm differs from step 1's blank thickness ${first.thickness_mm} mm (the blank thickness stays; the cut goes in profile_mm)`);
    }
    const previous = steps[index - 1]!.recorded_at;
    const now = step.recorded_at;
    if (previous !== undefined && now !== undefined && Date.parse(now) < Date.parse(previous))
      throw new InputError(source, `steps[${index}].recorded_at`, `${now} is earlier than step ${index}'s ${previous}: the log must be in the order the bar was measured`);
    const finished = step.cut_finished_at;
    if (previous !== undefined && finished !== undefined && Date.parse(finished) < Date.parse(previous))
      throw new InputError(source, `steps[${index}].cut_finished_at`, `${finished} is earlier than step ${index}'s reading (${previous}): the cut is made after the bar was last struck`);
  });
  const log: SessionLog = { format: 'barwright.session', version: 1, target, limits, steps };
  if (typeof value.label === 'string') log.label = value.label;
  if (uncertainty !== undefined) log.measurement_uncertainty_cents = uncertainty;
  return log;
}
