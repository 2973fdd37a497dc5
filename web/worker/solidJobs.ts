// The 3D model's job (solidWorker.ts): a bar on the solid model, with the calibrated material once
// the bar has measured rounds. Its own worker module, so the quick solver worker never loads it.
import type { JobHandlers } from './serveJobs.ts';
import type { SolidJobs } from './solverProtocol.ts';
import { summaryOf } from './calibrationCache.ts';
import { analyzeBar, calibratedMaterial, correctedBar } from '../../src/index.ts';

/** The solid worker's handlers. */
export const solidHandlers: JobHandlers<SolidJobs> = {
  /** One bar on the solid model (about a second; a worker per job, so a cancel stops only it). */
  solidModes(payload, job) {
    job.progress(0, 1);
    const calibration = payload.session && payload.session.steps.length > 0 ? summaryOf(payload.session, payload.lot) : null;
    const bar = calibration ? { ...correctedBar(payload.bar, calibration), material: calibratedMaterial(payload.bar.material, calibration) } : payload.bar;
    return { analysis: analyzeBar(bar, { theory: 'solid', modes: payload.modes, shapes: true }), calibration };
  },
};
