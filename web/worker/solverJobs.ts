// The computations behind each solver job: thin calls into the library's public surface. Bad
// input raises the library's InputError, which serveJobs forwards with its field and rule. Long
// jobs take the job's signal: a design stops at its next solver call, a many-bar analysis
// between bars.
import type { JobHandlers } from './serveJobs.ts';
import type { SolverJobs } from './solverProtocol.ts';
import { summaryOf } from './calibrationCache.ts';
import { nextCutPercent, withLotRecord } from './adviceLearning.ts';
import {
  analyzeLineBar,
  calibratedAnalysis,
  calibratedDesign,
  calibratedMaterial,
  chimeCutListCsv,
  closedTubeResonator,
  correctedBar,
  designBar,
  lengthTrim,
  nextCut,
  parseChimeSetFile,
  planChimeSet,
  whereToCutMap,
  type CutEffectMap,
} from '../../src/index.ts';

/** The solver worker's handlers. */
export const solverHandlers: JobHandlers<SolverJobs> = {
  /** One bar's modes (and where-to-cut map when asked and available). */
  analyze(payload) {
    const calibration = payload.session && payload.session.steps.length > 0 ? summaryOf(payload.session, payload.lot) : null;
    const options = { modes: payload.modes, shapes: payload.withShapes };
    const analysis = calibration ? calibratedAnalysis(payload.bar, calibration, options) : analyzeLineBar(payload.bar, options);
    let sensitivities: CutEffectMap | null = null;
    if (payload.withSensitivities && payload.bar.section.shape === 'rect') {
      const bar = calibration ? { ...correctedBar(payload.bar, calibration), material: calibratedMaterial(payload.bar.material, calibration) } : payload.bar;
      sensitivities = whereToCutMap(bar, { partials: Math.min(3, payload.modes) });
    }
    return { analysis, sensitivities, calibration };
  },

  /** Many bars, one at a time, yielding between bars so a cancel can arrive. */
  async analyzeMany(payload, job) {
    const results: SolverJobs['analyzeMany']['result'] = [];
    for (const [index, entry] of payload.bars.entries()) {
      await job.checkpoint();
      job.progress(index, payload.bars.length);
      try {
        results.push({ id: entry.id, analysis: analyzeLineBar(entry.bar, { modes: payload.modes }), error: null });
      } catch (error) {
        results.push({ id: entry.id, analysis: null, error: error instanceof Error ? error.message : String(error) });
      }
    }
    await job.checkpoint();
    job.progress(payload.bars.length, payload.bars.length);
    return results;
  },

  /** An undercut plan; progress counts solver calls. */
  design(payload, job) {
    const request = { target: payload.target, limits: payload.limits, ...(payload.workshop ? { workshop: payload.workshop } : {}) };
    const run = { signal: job.signal, onProgress: (step: { solves: number; maxSolves: number }) => job.progress(step.solves, step.maxSolves) };
    // A bar that has been struck is planned with its calibrated model (one truth with the tuning view).
    if (payload.session && payload.session.steps.length > 0) return calibratedDesign(payload.bar, request, summaryOf(payload.session, payload.lot), run, 'plan');
    return designBar(payload.bar, request, run, 'plan');
  },

  /** The next cut of a session; progress in percent. When done (and `learn` given), with what the bar teaches its lot. */
  nextCut(payload, job) {
    return withLotRecord(nextCut(payload.session, { source: 'session', lot: payload.lot ?? null, onProgress: (stage, fraction) => job.progress(nextCutPercent(stage, fraction), 100) }), payload);
  },

  /** Resonator tubes for a set of fundamentals. */
  resonators(payload) {
    return payload.rows.map((row) => ({ id: row.id, ...closedTubeResonator({ hz: row.hz, innerDiameterMm: row.innerDiameterMm, temperatureC: payload.temperatureC, end: payload.end }) }));
  },

  /** A chime set: validated as a chime-set file (InputError names the field), planned, and its cut list. */
  chimeSet(payload) {
    const plan = planChimeSet(parseChimeSetFile(payload.file, 'chime set'));
    return { plan, csv: chimeCutListCsv(plan) };
  },

  /** How much to trim a piece tuned by its length (a few line-model solves). */
  lengthTrim(payload) {
    return lengthTrim(payload);
  },
};
