// What a finished bar teaches its lot, added to a `done` next-cut answer (line or 3D model), so
// marking the bar done can keep it without another job.
import { calibrateSession, lotRecordFromCalibration, parseSessionFile, type NextCutResult } from '../../src/index.ts';
import type { NextCutAdvice, NextCutPayload } from './solverProtocol.ts';

/** Progress of next-cut advice in percent: calibration is the first 40 %, planning the rest. */
export function nextCutPercent(stage: string, fraction: number): number {
  return Math.round(100 * (stage === 'calibrating' ? fraction * 0.4 : stage === 'planning' ? 0.4 + 0.6 * fraction : 1));
}

/** `result` with, when it is `done` and `payload.learn` names the bar, the lot record of its calibration. */
export function withLotRecord<R extends NextCutResult>(result: R, payload: NextCutPayload): R & Pick<NextCutAdvice, 'lot_record'> {
  if (result.status !== 'done' || !payload.learn) return result;
  const log = parseSessionFile(payload.session, 'session');
  return { ...result, lot_record: lotRecordFromCalibration(calibrateSession(log, { lot: payload.lot ?? null }), payload.learn.bar, new Date().toISOString(), payload.learn.note) };
}
