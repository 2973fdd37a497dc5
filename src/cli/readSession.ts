import { emptyLotFile, InputError, parseLotFile, parseSessionFile, type LotFile, type SessionLog } from '../fileFormats/index.ts';
import { calibrateSession, calibrationSummary, lotPrior, type CalibrationSummary, type LotPrior, type SessionCalibration } from '../session/index.ts';
import { readJsonFile, type CommandIo } from './command.ts';

/** Reads and validates a session file; errors name the file, the field and the rule (exit 2). */
export async function readSessionFile(path: string, io: CommandIo): Promise<SessionLog> {
  return parseSessionFile(await readJsonFile(path, io), path);
}

/** Reads a lot file; with `missingIsEmpty`, a file that does not exist yet is an empty one. */
export async function readLotFile(path: string, io: CommandIo, missingIsEmpty = false): Promise<LotFile> {
  try {
    await io.readText(path);
  } catch {
    if (missingIsEmpty) return emptyLotFile();
  }
  return parseLotFile(await readJsonFile(path, io), path);
}

/** The lot a session's bar names (`lot` in its last step's bar, else its first's), if any. */
export function sessionLotName(log: SessionLog): string | undefined {
  return log.steps[log.steps.length - 1]?.bar.lot ?? log.steps[0]?.bar.lot;
}

/** The prior for a session's bar from a lot file (null when the bar names no lot or the lot has no finished bars yet), with a line saying which. */
export function priorForSession(log: SessionLog, lots: LotFile | undefined): { prior: LotPrior | null; note: string | null } {
  if (!lots) return { prior: null, note: null };
  const name = sessionLotName(log);
  if (name === undefined) return { prior: null, note: 'the bar names no lot ("lot" in its bar file): the calibration starts from the bar file’s material' };
  const records = lots.lots[name]?.bars ?? [];
  const prior = lotPrior(name, records);
  return { prior, note: prior ? null : `lot ${name} has no finished bars yet: the calibration starts from the bar file’s material` };
}

/** A session's calibration summary for `modes --session` and `design --session`, from the files given. */
export async function sessionSummary(sessionPath: string, lotsPath: string | undefined, io: CommandIo): Promise<{ summary: CalibrationSummary; calibration: SessionCalibration; log: SessionLog }> {
  const log = await readSessionFile(sessionPath, io);
  if (log.steps.length === 0) throw new InputError(sessionPath, 'steps', 'needs at least one measured step to calibrate from');
  const lots = lotsPath === undefined ? undefined : await readLotFile(lotsPath, io);
  const { prior } = priorForSession(log, lots);
  const calibration = calibrateSession(log, { lot: prior });
  return { summary: calibrationSummary(calibration, log), calibration, log };
}
