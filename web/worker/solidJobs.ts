// The 3D model's jobs (solidWorker.ts): a bar on the solid model, with the calibrated material once
// the bar has measured rounds, and the next cut of a session on the solid model. Their own worker
// module, so the quick solver worker never loads the solid model.
import type { JobHandlers } from './serveJobs.ts';
import type { SolidJobs } from './solverProtocol.ts';
import { summaryOf } from './calibrationCache.ts';
import { nextCutPercent, withLotRecord } from './adviceLearning.ts';
import { analyzeBar, calibratedMaterial, correctedBar, nextCutSolid } from '../../src/index.ts';

/** The solid worker's handlers. */
export const solidHandlers: JobHandlers<SolidJobs> = {
  /** One bar on the solid model (about a second; a worker per job, so a cancel stops only it). */
  solidModes(payload, job) {
    job.progress(0, 1);
    const calibration = payload.session && payload.session.steps.length > 0 ? summaryOf(payload.session, payload.lot) : null;
    const bar = calibration ? { ...correctedBar(payload.bar, calibration), material: calibratedMaterial(payload.bar.material, calibration) } : payload.bar;
    return { analysis: analyzeBar(bar, { theory: 'solid', modes: payload.modes, shapes: true }), calibration };
  },

  /** The next cut on the solid model (nextCutSolid, about 20 s on the demo bars, more with an off-axis grain; a worker per job, so a cancel stops only it). When done (and `learn` given), with what the bar teaches its lot. */
  nextCutSolid(payload, job) {
    const result = nextCutSolid(payload.session, { source: 'session', lot: payload.lot ?? null, onProgress: (stage, fraction) => job.progress(nextCutPercent(stage, fraction), 100) });
    return { ...withLotRecord(result, payload), theory: 'solid' as const };
  },
};
