// What a bar's session needs from the rest of the project: the playing temperature (the
// instrument's), and what the bar's lot has taught; and the project's lot records, kept per lot.
import { InputError } from '../fileFormats/InputError.ts';
import { parseSessionFile } from '../fileFormats/sessionFile.ts';
import type { LotBarRecord } from '../fileFormats/lotFile.ts';
import { lotPrior, sessionTemperature, warmReadings, type LotPrior, type SessionTemperature, type WarmReading } from '../session/index.ts';
import type { ProjectBar, ProjectFile, SessionFile } from './projectFileTypes.ts';

/** The lot a bar was cut from: its blank's `lot` (or its present shape's), trimmed; undefined when none. */
export function barLot(bar: ProjectBar): string | undefined {
  const name = bar.blank.lot ?? bar.current.lot;
  return name && name.trim() !== '' ? name.trim() : undefined;
}

/** A bar's session as advice and predictions use it: its target at the instrument's playing temperature. */
export function barSession(project: ProjectFile, bar: ProjectBar): SessionFile {
  return { ...bar.session, target: { ...bar.session.target, playing_temperature_c: project.instrument.air_temperature_c } };
}

/** What the finished bars of a bar's lot (other than itself) teach it, or null (no lot, or nothing learnt yet). */
export function barLotPrior(project: ProjectFile, bar: ProjectBar): LotPrior | null {
  const name = barLot(bar);
  if (!name) return null;
  const records = (project.lots?.[name]?.bars ?? []).filter((record) => record.bar !== bar.id);
  return lotPrior(name, records);
}

/**
 * How a bar's readings move to the playing temperature (no solves: for displays), with its warm
 * readings; null before the first round.
 */
export function barTemperature(project: ProjectFile, bar: ProjectBar): SessionTemperature | null {
  if (bar.session.steps.length === 0) return null;
  const log = parseSessionFile(barSession(project, bar), 'session');
  const lot = barLotPrior(project, bar);
  return lot?.pitch ? sessionTemperature(log, lot.pitch, warmReadings(log)) : sessionTemperature(log, undefined, warmReadings(log));
}

/** The readings of a bar's session taken while it was warm from a cut (see warmReadings). */
export function barWarmReadings(project: ProjectFile, bar: ProjectBar): WarmReading[] {
  return bar.session.steps.length === 0 ? [] : warmReadings(parseSessionFile(barSession(project, bar), 'session'));
}

/** Keeps what a finished bar taught its lot (replacing what the same bar taught before). */
export function recordLotLearning(project: ProjectFile, lot: string, record: LotBarRecord): ProjectFile {
  if (lot.trim() === '') throw new InputError('lots', 'lot', 'must name the lot');
  const lots = structuredClone(project.lots ?? {});
  const entry = lots[lot] ?? { bars: [] };
  entry.bars = [...entry.bars.filter((existing) => existing.bar !== record.bar), structuredClone(record)];
  lots[lot] = entry;
  return { ...project, lots };
}

/** Sets the lot a bar was cut from, on its blank and its present shape (later rounds carry it); an empty name clears it. */
export function setBarLot(project: ProjectFile, barId: string, lot: string, at: string): ProjectFile {
  const name = lot.trim();
  if (name.length > 200) throw new InputError('blank', 'lot', 'must be a name of at most 200 characters');
  const index = project.bars.findIndex((bar) => bar.id === barId);
  if (index < 0) throw new InputError('project', 'bar', `no bar with id "${barId}"`);
  const bars = project.bars.slice();
  const bar = structuredClone(project.bars[index]!);
  for (const file of [bar.blank, bar.current]) {
    if (name === '') delete file.lot;
    else file.lot = name;
  }
  bars[index] = { ...bar, updated_at: at };
  return { ...project, bars };
}
