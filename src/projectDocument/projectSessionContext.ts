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
 * What every prediction of a bar's partials is calibrated with once it has been struck: its
 * session at the playing temperature and what its lot taught; null before the first round (the
 * starting-guess material then stands).
 */
export function barCalibrationInputs(project: ProjectFile, bar: ProjectBar): { session: SessionFile; lot: LotPrior | null } | null {
  return bar.session.steps.length === 0 ? null : { session: barSession(project, bar), lot: barLotPrior(project, bar) };
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

/** What one lot has taught, for the workbench's lot panel. */
export interface ProjectLot {
  name: string;
  /** The finished bars it learnt from (the project's bar id, its note, and the record). */
  learntFrom: { barId: string; note: string; record: LotBarRecord }[];
  /** Bars cut from the lot that have not taught it yet (by note). */
  waiting: string[];
  /**
   * What the next bar starts from (null before a bar finished): stiffness and shear stiffness at
   * the lot's mean density (GPa) with their one-sigma spread (percent), the model's correction per
   * partial (fraction per unit arch depth, with one-sigma), and the pitch's temperature coefficient
   * when a bar learnt its own (cents per °C).
   */
  next: {
    E_GPa: number;
    E_spread_percent: number;
    G_GPa: number;
    G_spread_percent: number;
    corrections: { mean: number; sigma: number }[];
    pitch: { cents_per_c: number; sigma: number } | null;
  } | null;
}

/**
 * Every lot of the project, by name: the lots records were kept for and those bars name, each with
 * the finished bars it learnt from, the bars still waiting, and the prior the next bar starts
 * from (lotPrior over all its records; its moduli shown at the records' mean density).
 */
export function projectLots(project: ProjectFile): ProjectLot[] {
  const names = new Set<string>(Object.keys(project.lots ?? {}));
  for (const bar of project.bars) {
    const name = barLot(bar);
    if (name) names.add(name);
  }
  return [...names].sort().map((name) => {
    const records = project.lots?.[name]?.bars ?? [];
    const noteOf = (id: string): string => project.bars.find((bar) => bar.id === id)?.note ?? records.find((record) => record.bar === id)?.note ?? id;
    const learntFrom = records.map((record) => ({ barId: record.bar, note: noteOf(record.bar), record }));
    const waiting = project.bars.filter((bar) => barLot(bar) === name && !records.some((record) => record.bar === bar.id)).map((bar) => bar.note);
    const prior = lotPrior(name, records);
    let next: ProjectLot['next'] = null;
    if (prior) {
      const density = records.reduce((sum, record) => sum + record.density_kg_m3, 0) / records.length;
      next = {
        E_GPa: (Math.exp(prior.lnSpecificYoung.mean) * density) / 1e9,
        E_spread_percent: 100 * prior.lnSpecificYoung.sigma,
        G_GPa: (Math.exp(prior.lnSpecificShear.mean) * density) / 1e9,
        G_spread_percent: 100 * prior.lnSpecificShear.sigma,
        corrections: prior.corrections.map((belief) => ({ mean: belief.mean, sigma: belief.sigma })),
        pitch: prior.pitch ? { cents_per_c: prior.pitch.centsPerC, sigma: prior.pitch.sigma } : null,
      };
    }
    return { name, learntFrom, waiting, next };
  });
}

/** A bar's last reading projected to the playing temperature (Hz; each partial moved by the round's shift), or null before the first round. */
export function lastReadingAtPlayingHz(project: ProjectFile, bar: ProjectBar): number[] | null {
  const temperature = barTemperature(project, bar);
  const last = bar.session.steps[bar.session.steps.length - 1];
  if (!temperature || !last) return null;
  const shift = temperature.shiftCents[bar.session.steps.length - 1] ?? 0;
  return last.measured_hz.map((hz) => hz * 2 ** (shift / 1200));
}
