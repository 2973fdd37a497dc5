// Pure edits of a project: each takes a project and returns a new one (the input is never
// mutated), validating what the maker changed and keeping session targets in step with the
// instrument. Times are passed in (ISO 8601) so the edits stay pure and testable.
import { parseBarFile, type BarFile } from '../fileFormats/barFile.ts';
import { InputError } from '../fileFormats/InputError.ts';
import { otherModeHz } from '../fileFormats/sessionFileSteps.ts';
import { defaultShortenAt } from '../session/index.ts';
import { checkBlankRanges } from './blankRanges.ts';
import type { BarState, CutAdvice, DesignRecord, Instrument, ProjectBar, ProjectFile, Register, SessionStep } from './projectFileTypes.ts';
import { replaceBar } from './replaceBar.ts';

/** Slack (mm) when checking that a shape never adds material to the one before it. */
const materialSlackMm = 1e-6;


/** The session target of a bar from the instrument: note at A4, register ratios and tolerances. */
function targetFor(instrument: Instrument, bar: ProjectBar): ProjectBar['session']['target'] {
  const register = instrument.registers.find((candidate) => candidate.id === bar.register);
  const ratios = register ? [...register.ratios] : [...bar.session.target.ratios];
  const tolerance = register ? [...register.tolerance_cents] : [...bar.session.target.tolerance_cents];
  return { note: bar.note, a4: instrument.a4_hz, ratios, tolerance_cents: tolerance, playing_temperature_c: instrument.air_temperature_c };
}

/** Rewrites every bar's session target from the instrument (after A4 or a register changed). */
export function syncSessionTargets(project: ProjectFile): ProjectFile {
  return {
    ...project,
    bars: project.bars.map((bar) => ({ ...bar, session: { ...bar.session, target: targetFor(project.instrument, bar) } })),
  };
}

/** Changes instrument settings (A4, temperature, name, range…) and re-targets the sessions. */
export function updateInstrument(project: ProjectFile, change: Partial<Omit<Instrument, 'registers'>>): ProjectFile {
  return syncSessionTargets({ ...project, instrument: { ...project.instrument, ...structuredClone(change) } });
}

/** Changes one register (ratios, tolerances, resonator diameter) and re-targets its bars. */
export function updateRegister(project: ProjectFile, registerId: string, change: Partial<Omit<Register, 'id'>>): ProjectFile {
  const registers = project.instrument.registers.map((register) => (register.id === registerId ? { ...register, ...structuredClone(change) } : register));
  if (!registers.some((register) => register.id === registerId)) throw new InputError('project', 'register', `no register with id "${registerId}"`);
  if (change.ratios && change.tolerance_cents === undefined) {
    const register = registers.find((candidate) => candidate.id === registerId)!;
    const last = register.tolerance_cents[register.tolerance_cents.length - 1] ?? 5;
    register.tolerance_cents = change.ratios.map((_, index) => register.tolerance_cents[index] ?? last);
  }
  return syncSessionTargets({ ...project, instrument: { ...project.instrument, registers } });
}

/** Thickness (mm) of a bar at a position (mm): its profile interpolated, or the blank's thickness. */
export function thicknessAtMm(bar: BarFile, positionMm: number): number {
  if (bar.section.shape !== 'rect') throw new InputError('shape', 'section', 'only a rectangular bar has a thickness profile');
  const profile = bar.profile_mm;
  if (!profile || profile.length < 2) return bar.section.thickness_mm;
  if (positionMm <= profile[0]![0]) return profile[0]![1];
  for (let index = 1; index < profile.length; index += 1) {
    const [x1, t1] = profile[index]!;
    if (positionMm <= x1) {
      const [x0, t0] = profile[index - 1]!;
      return t0 + ((positionMm - x0) / (x1 - x0)) * (t1 - t0);
    }
  }
  return profile[profile.length - 1]![1];
}

/**
 * Throws when `after` has material that `before` lacks: longer, or thicker anywhere (checked at
 * both bars' stations, where piecewise-linear profiles take their extremes).
 */
export function assertNoMaterialAdded(before: BarFile, after: BarFile, source = 'shape'): void {
  if (after.length_mm > before.length_mm + materialSlackMm) throw new InputError(source, 'length_mm', `${after.length_mm} mm is longer than the bar now (${before.length_mm} mm); wood cannot be put back`);
  if (before.section.shape !== 'rect' || after.section.shape !== 'rect') return;
  const offset = (before.length_mm - after.length_mm) / 2;
  const positions = new Set<number>([0, after.length_mm]);
  for (const [x] of after.profile_mm ?? []) positions.add(x);
  for (const [x] of before.profile_mm ?? []) if (x - offset >= 0 && x - offset <= after.length_mm) positions.add(x - offset);
  for (const position of positions) {
    const now = thicknessAtMm(before, position + offset);
    const then = thicknessAtMm(after, position);
    if (then > now + materialSlackMm) throw new InputError(source, 'profile_mm', `at ${position.toFixed(1)} mm the new shape is ${then.toFixed(2)} mm thick, more than the ${now.toFixed(2)} mm there now; wood cannot be put back`);
  }
}

/** A bar with `[position, thickness]` stations every `spacingMm` (or closer), all at full thickness. */
export function withStations(bar: BarFile, spacingMm: number): BarFile {
  if (bar.section.shape !== 'rect') throw new InputError('shape', 'section', 'only a rectangular bar can be undercut');
  if (!(spacingMm > 0)) throw new InputError('shape', 'spacing', 'must be greater than 0 mm');
  const count = Math.max(2, Math.ceil(bar.length_mm / spacingMm));
  const profile: [number, number][] = [];
  for (let index = 0; index <= count; index += 1) {
    const position = (bar.length_mm * index) / count;
    profile.push([Math.round(position * 1000) / 1000, thicknessAtMm(bar, position)]);
  }
  profile[profile.length - 1]![0] = bar.length_mm;
  return { ...structuredClone(bar), profile_mm: profile };
}

/**
 * The bar with one station set to a new thickness (mm), clamped to [minimum, blank thickness].
 * Used by the profile drawing while dragging; returns a new, valid bar file.
 */
export function withStationThickness(bar: BarFile, stationIndex: number, thicknessMm: number, minimumMm: number): BarFile {
  if (bar.section.shape !== 'rect' || !bar.profile_mm) throw new InputError('shape', 'profile_mm', 'this bar has no stations to edit');
  if (stationIndex < 0 || stationIndex >= bar.profile_mm.length) throw new InputError('shape', `profile_mm[${stationIndex}]`, 'no such station');
  if (!Number.isFinite(thicknessMm)) throw new InputError('shape', `profile_mm[${stationIndex}]`, 'thickness must be a number (mm)');
  const blankThickness = bar.section.thickness_mm;
  const floor = Math.min(Math.max(minimumMm, 0.1), blankThickness);
  const clamped = Math.min(blankThickness, Math.max(floor, thicknessMm));
  const profile = bar.profile_mm.map((pair) => [pair[0], pair[1]] as [number, number]);
  profile[stationIndex]![1] = Math.round(clamped * 100) / 100;
  return { ...structuredClone(bar), profile_mm: profile };
}

/** A shape entered by hand replaces any cut marked from the advice: its expectation, checkpoints and part note go. */
function forgetMarkedCut(bar: ProjectBar): void {
  delete bar.expected_hz;
  delete bar.checkpoints;
  delete bar.cut_note;
}

function touched(bar: ProjectBar, at: string): ProjectBar {
  return { ...bar, updated_at: at };
}

/**
 * Sets a bar's blank (validated). A bar not yet measured follows its blank: its present shape
 * takes the blank's length, section and material, its stations scaled to the new length and
 * clamped to the new thickness. Once rounds are recorded only the stated blank changes.
 */
export function setBarBlank(project: ProjectFile, barId: string, blank: BarFile, at: string): ProjectFile {
  const checked = parseBarFile(blank, 'blank');
  checkBlankRanges(checked, 'blank');
  return replaceBar(project, barId, (bar) => {
    const blankOnly = structuredClone(checked);
    delete blankOnly.profile_mm;
    const next = touched({ ...bar, blank: blankOnly }, at);
    if (bar.session.steps.length > 0) return next;
    const current: BarFile = { ...structuredClone(checked) };
    delete current.profile_mm;
    if (checked.section.shape === 'rect' && bar.current.profile_mm && bar.current.section.shape === 'rect') {
      const scale = checked.length_mm / bar.current.length_mm;
      const top = checked.section.thickness_mm;
      current.profile_mm = bar.current.profile_mm.map(([x, t]) => [Math.round(x * scale * 1000) / 1000, Math.min(t, top)] as [number, number]);
      current.profile_mm[current.profile_mm.length - 1]![0] = checked.length_mm;
    }
    next.current = parseBarFile(current, 'shape');
    if (next.current.label === undefined && bar.current.label !== undefined) next.current.label = bar.current.label;
    return next;
  });
}

/** True when `shape` has less wood than `blank`: shorter, or thinner at some station. */
function isCut(blank: BarFile, shape: BarFile): boolean {
  if (shape.length_mm < blank.length_mm - materialSlackMm) return true;
  if (blank.section.shape !== 'rect' || shape.section.shape !== 'rect') return false;
  const full = blank.section.thickness_mm;
  return (shape.profile_mm ?? []).some(([, thickness]) => thickness < full - materialSlackMm);
}

/** Sets a bar's present shape (validated: thickness within the blank). A first cut makes a bar "rough". */
export function setBarShape(project: ProjectFile, barId: string, shape: BarFile, at: string): ProjectFile {
  const checked = parseBarFile(shape, 'shape');
  return replaceBar(project, barId, (bar) => {
    const cut = isCut(bar.blank, checked);
    const next = touched({ ...bar, current: checked, state: bar.state === 'not-started' && cut ? 'rough' : bar.state }, at);
    forgetMarkedCut(next);
    return next;
  });
}

/** Options of a recorded round. */
export interface RecordStepOptions {
  at: string;
  source?: SessionStep['source'];
  /** What the model predicted for this shape before striking it (Hz). */
  predictedHz?: readonly number[];
  /** Air temperature at the reading, °C (the reading is projected from it to the playing temperature). */
  airTemperatureC?: number;
  /** Caliper readings `[x_mm, thickness_mm]` taken with this round (usually at the advised checkpoints). */
  measuredThicknessMm?: readonly (readonly [number, number])[];
  /** The first twisting (torsion) and sideways (lateral) modes heard with this round, Hz (above the fundamental, below 20 kHz). */
  torsionHz?: number;
  lateralHz?: number;
}

/** Records a measured round against the bar as it is now; the bar becomes "tuning". */
export function recordStep(project: ProjectFile, barId: string, measuredHz: readonly number[], options: RecordStepOptions): ProjectFile {
  if (measuredHz.length === 0) throw new InputError('round', 'measured_hz', 'enter at least the fundamental');
  measuredHz.forEach((hz, index) => {
    if (!Number.isFinite(hz) || hz <= 0) throw new InputError('round', `partial ${index + 1}`, 'must be a frequency greater than 0 Hz');
    if (index > 0 && hz <= measuredHz[index - 1]!) throw new InputError('round', `partial ${index + 1}`, `must be higher than partial ${index} (${measuredHz[index - 1]} Hz)`);
  });
  if (options.airTemperatureC !== undefined && !(Number.isFinite(options.airTemperatureC) && options.airTemperatureC >= -30 && options.airTemperatureC <= 60))
    throw new InputError('round', 'air_temperature_c', `${options.airTemperatureC} °C is outside −30 to 60 °C`);
  const torsionHz = options.torsionHz === undefined ? undefined : otherModeHz('round', 'measured_torsion_hz', options.torsionHz, measuredHz);
  const lateralHz = options.lateralHz === undefined ? undefined : otherModeHz('round', 'measured_lateral_hz', options.lateralHz, measuredHz);
  return replaceBar(project, barId, (bar) => {
    const step: SessionStep = { bar: structuredClone(bar.current), measured_hz: [...measuredHz], recorded_at: options.at };
    if (options.source) step.source = options.source;
    const previous = bar.session.steps[bar.session.steps.length - 1];
    const cutSince = previous !== undefined && JSON.stringify(previous.bar) !== JSON.stringify(bar.current);
    // A cut marked in the tuning view (all or part of the advice) is recorded as planned, with the part done in its note.
    if (cutSince) step.cut = { made: bar.expected_hz || bar.cut_note ? 'as-planned' : 'as-done', ...(bar.cut_note ? { note: bar.cut_note } : {}) };
    // A shortening since the last round is kept with the round: how much, and at which end.
    if (step.cut && previous && previous.bar.length_mm - bar.current.length_mm > 1e-6) {
      step.cut.shortened_mm = Math.round((previous.bar.length_mm - bar.current.length_mm) * 100) / 100;
      step.cut.shortened_at = bar.session.limits.shorten_at ?? defaultShortenAt(bar.current);
    }
    // The first round after a cut records when the cut was finished (a re-strike inherits it in the log).
    if (cutSince && bar.cut_finished_at !== undefined && Date.parse(bar.cut_finished_at) <= Date.parse(options.at) && (!previous?.recorded_at || Date.parse(bar.cut_finished_at) >= Date.parse(previous.recorded_at)))
      step.cut_finished_at = bar.cut_finished_at;
    if (options.airTemperatureC !== undefined) step.air_temperature_c = options.airTemperatureC;
    if (torsionHz !== undefined) step.measured_torsion_hz = torsionHz;
    if (lateralHz !== undefined) step.measured_lateral_hz = lateralHz;
    if (options.measuredThicknessMm && options.measuredThicknessMm.length > 0) step.measured_thickness_mm = options.measuredThicknessMm.map(([x, t]) => [x, t]);
    const predicted = bar.expected_hz ?? options.predictedHz;
    if (predicted && predicted.length > 0 && predicted.every((hz) => Number.isFinite(hz) && hz > 0)) step.predicted_hz = [...predicted];
    const next = touched({ ...bar, session: { ...bar.session, steps: [...bar.session.steps, step] }, state: bar.state === 'done' ? 'done' : 'tuning', advice: null }, options.at);
    delete next.expected_hz;
    delete next.cut_note;
    // The checkpoints stay with the bar (shown only while it is cut since its last round), so removing this round brings them back.
    return next;
  });
}

/**
 * Removes the last recorded round (a mistaken entry), undoing what recording it did: the bar's
 * shape is left as it is, and a round that followed a cut marked in the tuning view gives back
 * what the model expected of that cut (`expected_hz`, from the round's prediction) and the part
 * of the cut made (`cut_note`), so entering the round again records it as it was.
 */
export function removeLastStep(project: ProjectFile, barId: string, at: string): ProjectFile {
  return replaceBar(project, barId, (bar) => {
    const last = bar.session.steps[bar.session.steps.length - 1];
    if (!last) throw new InputError('round', 'steps', 'there is no round to remove');
    const next = touched({ ...bar, session: { ...bar.session, steps: bar.session.steps.slice(0, -1) }, advice: null }, at);
    if (last.cut?.made === 'as-planned') {
      if (last.cut.note) next.cut_note = last.cut.note;
      else if (last.predicted_hz) next.expected_hz = [...last.predicted_hz];
    }
    return next;
  });
}

/** Keeps the latest cut advice with the bar (validated: it never adds material). */
export function setAdvice(project: ProjectFile, barId: string, advice: Omit<CutAdvice, 'from_steps' | 'advised_at'>, at: string): ProjectFile {
  return replaceBar(project, barId, (bar) => {
    const barAfter = parseBarFile(advice.bar_after, 'advice');
    assertNoMaterialAdded(bar.current, barAfter, 'advice');
    return touched({ ...bar, advice: { ...structuredClone(advice), bar_after: barAfter, from_steps: bar.session.steps.length, advised_at: at } }, at);
  });
}

/** Sets a bar's state by hand (e.g. "done" when the maker is satisfied). */
export function setBarState(project: ProjectFile, barId: string, state: BarState, at: string): ProjectFile {
  return replaceBar(project, barId, (bar) => touched({ ...bar, state }, at));
}

/** Sets a bar's free-text notes. */
export function setBarNotes(project: ProjectFile, barId: string, notes: string, at: string): ProjectFile {
  return replaceBar(project, barId, (bar) => touched({ ...bar, notes: notes.slice(0, 4000) }, at));
}

/** Sets a bar's minimum thickness limit for cut advice (mm, greater than 0 and not above the blank). */
export function setMinimumThickness(project: ProjectFile, barId: string, minimumMm: number, at: string): ProjectFile {
  return replaceBar(project, barId, (bar) => {
    if (!Number.isFinite(minimumMm) || minimumMm <= 0) throw new InputError('limits', 'min_thickness_mm', 'must be greater than 0 mm');
    if (bar.blank.section.shape === 'rect' && minimumMm > bar.blank.section.thickness_mm) throw new InputError('limits', 'min_thickness_mm', `must not exceed the blank's ${bar.blank.section.thickness_mm} mm`);
    return touched({ ...bar, session: { ...bar.session, limits: { ...bar.session.limits, min_thickness_mm: minimumMm } } }, at);
  });
}

/** Keeps a planned undercut with the bar. */
export function setDesign(project: ProjectFile, barId: string, design: Omit<DesignRecord, 'planned_at'>, at: string): ProjectFile {
  const bar = parseBarFile(design.bar, 'plan');
  return replaceBar(project, barId, (entry) => touched({ ...entry, design: { ...structuredClone(design), bar, planned_at: at } }, at));
}

/** Makes the planned shape the bar's present shape (only removing material). */
export function adoptDesign(project: ProjectFile, barId: string, at: string): ProjectFile {
  return replaceBar(project, barId, (bar) => {
    if (!bar.design) throw new InputError('plan', 'design', 'this bar has no plan yet');
    assertNoMaterialAdded(bar.current, bar.design.bar, 'plan');
    const next = touched({ ...bar, current: structuredClone(bar.design.bar), state: bar.state === 'not-started' ? 'rough' : bar.state }, at);
    forgetMarkedCut(next);
    return next;
  });
}

/**
 * The bar with one station moved to a new thickness (mm) and its neighbours within `spreadMm`
 * following by a raised-cosine weight 0.5·(1 + cos(π·d/spread)), so a drag shapes a smooth arch
 * rather than a spike. Computed from `start` (the shape when the drag began), each thickness
 * clamped to [minimum, blank thickness]. `spreadMm` = 0 moves the one station only.
 */
export function withSmoothDepthChange(start: BarFile, stationIndex: number, thicknessMm: number, minimumMm: number, spreadMm: number): BarFile {
  const moved = withStationThickness(start, stationIndex, thicknessMm, minimumMm);
  if (!(spreadMm > 0)) return moved;
  const profile = start.profile_mm!;
  const [centre, before] = profile[stationIndex]!;
  const delta = moved.profile_mm![stationIndex]![1] - before;
  const blankThickness = start.section.shape === 'rect' ? start.section.thickness_mm : before;
  const floor = Math.min(Math.max(minimumMm, 0.1), blankThickness);
  const next = profile.map(([x, t], index) => {
    const distance = Math.abs(x - centre);
    if (index === stationIndex || distance >= spreadMm) return [x, index === stationIndex ? moved.profile_mm![index]![1] : t] as [number, number];
    const weight = 0.5 * (1 + Math.cos((Math.PI * distance) / spreadMm));
    return [x, Math.round(Math.min(blankThickness, Math.max(floor, t + weight * delta)) * 100) / 100] as [number, number];
  });
  return { ...moved, profile_mm: next };
}

/** Reads target ratios written the trade's way ("1:4:10", "1 : 3", "1, 4, 10"); the first must be 1. */
export function parseRatioText(text: string, field = 'ratios'): number[] {
  const parts = text.split(/[:,;\s]+/).filter((part) => part !== '');
  if (parts.length === 0) throw new InputError('register', field, 'enter ratios such as 1:4:10');
  const ratios = parts.map((part) => Number(part.replace(',', '.')));
  ratios.forEach((ratio, index) => {
    if (!Number.isFinite(ratio) || ratio <= 0) throw new InputError('register', field, `“${parts[index]}” is not a positive number`);
    if (index > 0 && ratio <= ratios[index - 1]!) throw new InputError('register', field, 'ratios must increase (e.g. 1:4:10)');
  });
  if (Math.abs(ratios[0]! - 1) > 1e-9) throw new InputError('register', field, 'the first ratio is the fundamental and must be 1');
  if (ratios.length > 5) throw new InputError('register', field, 'at most 5 partials can be tuned');
  return ratios;
}

/** Reads tolerances in cents ("2, 5, 15"), one per ratio. */
export function parseToleranceText(text: string, count: number, field = 'tolerance_cents'): number[] {
  const parts = text.split(/[:,;\s]+/).filter((part) => part !== '');
  const values = parts.map((part) => Number(part));
  if (values.length !== count) throw new InputError('register', field, `give one tolerance per ratio (${count})`);
  values.forEach((value, index) => {
    if (!Number.isFinite(value) || value <= 0) throw new InputError('register', field, `“${parts[index]}” must be a number of cents greater than 0`);
  });
  return values;
}
