// The computations behind each solver job: thin calls into the library's public surface. Bad
// input raises the library's InputError, which serveJobs forwards with its field and rule. Long
// jobs take the job's signal: a design stops at its next solver call, a many-bar analysis
// between bars.
import type { JobHandlers } from './serveJobs.ts';
import type { SolverJobs } from './solverProtocol.ts';
import { analyzeBar, chimeCutListCsv, closedTubeResonator, designBar, nextCut, parseChimeSetFile, planChimeSet, whereToCutMap, type CutEffectMap } from '../../src/index.ts';

/** Progress of next-cut advice in percent: calibration is the first 40 %, planning the rest. */
function nextCutPercent(stage: string, fraction: number): number {
  return Math.round(100 * (stage === 'calibrating' ? fraction * 0.4 : stage === 'planning' ? 0.4 + 0.6 * fraction : 1));
}

/** The solver worker's handlers. */
export const solverHandlers: JobHandlers<SolverJobs> = {
  /** One bar's modes (and where-to-cut map when asked and available). */
  analyze(payload) {
    const analysis = analyzeBar(payload.bar, { modes: payload.modes, shapes: payload.withShapes });
    let sensitivities: CutEffectMap | null = null;
    if (payload.withSensitivities && payload.bar.section.shape === 'rect') sensitivities = whereToCutMap(payload.bar, { partials: Math.min(3, payload.modes) });
    return { analysis, sensitivities };
  },

  /** One bar on the solid model (about a second; its own worker, so a cancel stops only it). */
  solidModes(payload, job) {
    job.progress(0, 1);
    return analyzeBar(payload.bar, { theory: 'solid', modes: payload.modes, shapes: true });
  },

  /** Many bars, one at a time, yielding between bars so a cancel can arrive. */
  async analyzeMany(payload, job) {
    const results: SolverJobs['analyzeMany']['result'] = [];
    for (const [index, entry] of payload.bars.entries()) {
      await job.checkpoint();
      job.progress(index, payload.bars.length);
      try {
        results.push({ id: entry.id, analysis: analyzeBar(entry.bar, { modes: payload.modes }), error: null });
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
    return designBar(payload.bar, { target: payload.target, limits: payload.limits }, { signal: job.signal, onProgress: (step) => job.progress(step.solves, step.maxSolves) }, 'plan');
  },

  /** The next cut of a session; progress in percent. */
  nextCut(payload, job) {
    return nextCut(payload.session, { source: 'session', onProgress: (stage, fraction) => job.progress(nextCutPercent(stage, fraction), 100) });
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
};
