// Parsing one step of a session file (see sessionFile.ts): the bar as shaped, the partials
// measured, and barwright's optional additions.
import { InputError, isInputError } from './InputError.ts';
import { parseBarFile } from './barFile.ts';
import type { SessionLogStep } from './sessionFileTypes.ts';
import { isJsonObject } from './jsonFields.ts';

/** Longest free-text note kept in a step (characters). */
const noteLimit = 4000;
/** Slack (mm) when checking a measured station lies on the bar. */
const positionSlackMm = 1e-6;

function number(source: string, field: string, value: unknown, unit: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new InputError(source, field, `must be a number (${unit})`);
  return value;
}

function hzList(source: string, field: string, value: unknown, minimum: number): number[] {
  if (!Array.isArray(value)) throw new InputError(source, field, 'must be a list of frequencies in Hz');
  if (value.length < minimum) throw new InputError(source, field, `needs at least ${minimum} measured partial${minimum === 1 ? '' : 's'}`);
  return value.map((item, index) => {
    const hz = number(source, `${field}[${index}]`, item, 'Hz');
    if (hz <= 0) throw new InputError(source, `${field}[${index}]`, `must be greater than 0 Hz (got ${hz})`);
    if (hz > 100_000) throw new InputError(source, `${field}[${index}]`, `${hz} Hz is above 100 kHz: not a bar partial`);
    return hz;
  });
}

function parseMeasuredThicknesses(source: string, field: string, value: unknown, bar: SessionLogStep['bar']): [number, number][] {
  if (bar.section.shape !== 'rect') throw new InputError(source, field, `only a rect bar has thicknesses to measure (this bar is a ${bar.section.shape})`);
  const blank = bar.section.thickness_mm;
  if (!Array.isArray(value) || value.length === 0) throw new InputError(source, field, 'must be a non-empty list of [position_mm, thickness_mm] pairs');
  const pairs: [number, number][] = [];
  value.forEach((pair: unknown, index) => {
    const at = `${field}[${index}]`;
    if (!Array.isArray(pair) || pair.length !== 2) throw new InputError(source, at, 'must be a [position_mm, thickness_mm] pair');
    const position = number(source, at, pair[0], 'position, mm');
    const thickness = number(source, at, pair[1], 'thickness, mm');
    if (position < -positionSlackMm || position > bar.length_mm + positionSlackMm) throw new InputError(source, at, `position ${position} mm is off the ${bar.length_mm} mm bar`);
    if (thickness <= 0) throw new InputError(source, at, `thickness ${thickness} mm must be greater than 0`);
    if (thickness > blank + 0.5) throw new InputError(source, at, `thickness ${thickness} mm exceeds the blank's ${blank} mm`);
    if (index > 0 && position <= pairs[index - 1]![0]) throw new InputError(source, at, `position ${position} mm must be greater than the previous measurement's ${pairs[index - 1]![0]} mm`);
    pairs.push([position, thickness]);
  });
  return pairs;
}

/** Coldest and warmest temperature accepted, °C: a workshop or a stage, never a kiln. */
export const temperatureRangeC: readonly [number, number] = [-30, 60];

/** A temperature in °C within temperatureRangeC, or an InputError naming the field. */
export function parseTemperature(source: string, field: string, value: unknown): number {
  const temperature = number(source, field, value, '°C');
  if (temperature < temperatureRangeC[0] || temperature > temperatureRangeC[1]) throw new InputError(source, field, `${temperature} °C is outside −30 to 60 °C`);
  return temperature;
}

function parseTime(source: string, field: string, value: unknown): string {
  if (typeof value !== 'string' || Number.isNaN(Date.parse(value))) throw new InputError(source, field, 'must be a date and time (ISO 8601)');
  return value;
}

/** Highest torsion or sideways mode a step may record, Hz (exclusive): the top of hearing. */
export const otherModeCeilingHz = 20_000;

/**
 * A torsion or sideways mode as read, Hz: above the fundamental `partials[0]` (on a bar, both lie
 * above it) and below otherModeCeilingHz, or an InputError naming the field. The session parser's
 * rule, also applied where the workbench records a round.
 */
export function otherModeHz(source: string, field: string, value: unknown, partials: readonly number[]): number {
  const hz = number(source, field, value, 'Hz');
  if (hz <= partials[0]! || hz >= otherModeCeilingHz) throw new InputError(source, field, `${hz} Hz must lie above the fundamental (${partials[0]} Hz) and below 20 000 Hz`);
  return hz;
}

/** Validates one step; `field` is its place in the file (`steps[3]`), used in every message. */
export function parseSessionLogStep(source: string, field: string, value: unknown): SessionLogStep {
  if (!isJsonObject(value)) throw new InputError(source, field, 'must be an object with "bar" and "measured_hz"');
  let bar: SessionLogStep['bar'];
  try {
    bar = parseBarFile(value.bar, source);
  } catch (error) {
    if (!isInputError(error)) throw error;
    throw new InputError(source, error.field === 'bar' ? `${field}.bar` : `${field}.bar.${error.field}`, error.rule);
  }
  const step: SessionLogStep = { bar, measured_hz: hzList(source, `${field}.measured_hz`, value.measured_hz, 1) };
  if (value.measured_thickness_mm !== undefined && value.thickness_measured_mm !== undefined)
    throw new InputError(source, `${field}.thickness_measured_mm`, 'give the caliper readings once, as measured_thickness_mm (thickness_measured_mm is the older name of the same field)');
  if (value.measured_thickness_mm !== undefined) step.measured_thickness_mm = parseMeasuredThicknesses(source, `${field}.measured_thickness_mm`, value.measured_thickness_mm, bar);
  else if (value.thickness_measured_mm !== undefined) step.measured_thickness_mm = parseMeasuredThicknesses(source, `${field}.thickness_measured_mm`, value.thickness_measured_mm, bar);
  if (value.measured_torsion_hz !== undefined) step.measured_torsion_hz = otherModeHz(source, `${field}.measured_torsion_hz`, value.measured_torsion_hz, step.measured_hz);
  if (value.measured_lateral_hz !== undefined) step.measured_lateral_hz = otherModeHz(source, `${field}.measured_lateral_hz`, value.measured_lateral_hz, step.measured_hz);
  if (value.air_temperature_c !== undefined) step.air_temperature_c = parseTemperature(source, `${field}.air_temperature_c`, value.air_temperature_c);
  if (value.note !== undefined) {
    if (typeof value.note !== 'string') throw new InputError(source, `${field}.note`, 'must be text');
    if (value.note.length > noteLimit) throw new InputError(source, `${field}.note`, `must be at most ${noteLimit} characters`);
    step.note = value.note;
  }
  if (value.cut !== undefined) {
    const cut = value.cut;
    if (!isJsonObject(cut)) throw new InputError(source, `${field}.cut`, 'must be an object such as { "made": "as-planned" }');
    if (cut.made !== 'as-planned' && cut.made !== 'as-done')
      throw new InputError(source, `${field}.cut.made`, `must be "as-planned" (the bar recorded is the plan) or "as-done" (the shape was measured after cutting), got ${JSON.stringify(cut.made)}`);
    if (cut.note !== undefined && typeof cut.note !== 'string') throw new InputError(source, `${field}.cut.note`, 'must be text');
    step.cut = typeof cut.note === 'string' ? { made: cut.made, note: cut.note } : { made: cut.made };
    if (cut.shortened_mm !== undefined) {
      if (typeof cut.shortened_mm !== 'number' || !Number.isFinite(cut.shortened_mm) || cut.shortened_mm <= 0 || cut.shortened_mm > 1000)
        throw new InputError(source, `${field}.cut.shortened_mm`, `must be a length greater than 0 and at most 1000 mm (got ${JSON.stringify(cut.shortened_mm)})`);
      step.cut.shortened_mm = cut.shortened_mm;
    }
    if (cut.shortened_at !== undefined) {
      if (cut.shortened_at !== 'free-end' && cut.shortened_at !== 'both-ends') throw new InputError(source, `${field}.cut.shortened_at`, `must be "free-end" or "both-ends" (got ${JSON.stringify(cut.shortened_at)})`);
      step.cut.shortened_at = cut.shortened_at;
    }
  }
  if (value.recorded_at !== undefined) step.recorded_at = parseTime(source, `${field}.recorded_at`, value.recorded_at);
  if (value.cut_finished_at !== undefined) {
    step.cut_finished_at = parseTime(source, `${field}.cut_finished_at`, value.cut_finished_at);
    if (step.recorded_at !== undefined && Date.parse(step.cut_finished_at) > Date.parse(step.recorded_at))
      throw new InputError(source, `${field}.cut_finished_at`, `${step.cut_finished_at} is after the reading (recorded_at ${step.recorded_at}): the cut is finished before the bar is struck`);
  }
  if (value.predicted_hz !== undefined) step.predicted_hz = hzList(source, `${field}.predicted_hz`, value.predicted_hz, 0);
  if (value.source !== undefined) {
    if (value.source !== 'typed' && value.source !== 'microphone' && value.source !== 'file') throw new InputError(source, `${field}.source`, 'must be "typed", "microphone" or "file"');
    step.source = value.source;
  }
  return step;
}
