// The computations behind each worker request: thin calls into the library's public surface.
// Bad input raises the library's InputError, which the worker forwards with its field and rule.
import type { AnalyzeManyRequest, AnalyzeRequest, ChimeSetRequest, DesignRequest, NextCutRequest, ResonatorRequest, SolverResults } from './protocol.ts';
import { analyzeBar, chimeCutListCsv, closedTubeResonator, designBar, nextCut, parseChimeSetFile, planChimeSet, whereToCutMap, type CutEffectMap, type DesignResult, type NextCutResult } from '../../src/index.ts';

/** Raised inside a batch when the page cancelled it. */
export class Cancelled extends Error {
  constructor() {
    super('cancelled');
    this.name = 'Cancelled';
  }
}


/** One bar's modes (and where-to-cut map when asked and available). */
export function runAnalyze(request: AnalyzeRequest): SolverResults['analyze'] {
  const analysis = analyzeBar(request.bar, { modes: request.modes, shapes: request.withShapes });
  let sensitivities: CutEffectMap | null = null;
  if (request.withSensitivities && request.bar.section.shape === 'rect') sensitivities = whereToCutMap(request.bar, { partials: Math.min(3, request.modes) });
  return { analysis, sensitivities };
}

/** Many bars, one at a time; `checkpoint` yields to the message loop and throws when cancelled. */
export async function runAnalyzeMany(request: AnalyzeManyRequest, checkpoint: (done: number) => Promise<void>): Promise<SolverResults['analyzeMany']> {
  const results: SolverResults['analyzeMany'] = [];
  for (const [index, entry] of request.bars.entries()) {
    await checkpoint(index);
    try {
      results.push({ id: entry.id, analysis: analyzeBar(entry.bar, { modes: request.modes }), error: null });
    } catch (error) {
      results.push({ id: entry.id, analysis: null, error: error instanceof Error ? error.message : String(error) });
    }
  }
  await checkpoint(request.bars.length);
  return results;
}

/** An undercut plan; `progress(done, total)` reports solver calls. */
export function runDesign(request: DesignRequest, progress: (done: number, total: number) => void): DesignResult {
  return designBar(request.bar, { target: request.target, limits: request.limits }, { onProgress: (step) => progress(step.solves, step.maxSolves) }, 'plan');
}

/** The next cut of a session; `progress(done, total)` reports the stage in percent. */
export function runNextCut(request: NextCutRequest, progress: (done: number, total: number) => void): NextCutResult {
  return nextCut(request.session, { source: 'session', onProgress: (stage, fraction) => progress(Math.round(100 * (stage === 'calibrating' ? fraction * 0.4 : stage === 'planning' ? 0.4 + 0.6 * fraction : 1)), 100) });
}

/** Resonator tubes for a set of fundamentals. */
export function runResonators(request: ResonatorRequest): SolverResults['resonators'] {
  return request.rows.map((row) => ({ id: row.id, ...closedTubeResonator({ hz: row.hz, innerDiameterMm: row.innerDiameterMm, temperatureC: request.temperatureC, end: request.end }) }));
}

/** A chime set: validated as a chime-set file (InputError names the field), planned, and its cut list. */
export function runChimeSet(request: ChimeSetRequest): SolverResults['chimeSet'] {
  const plan = planChimeSet(parseChimeSetFile(request.file, 'chime set'));
  return { plan, csv: chimeCutListCsv(plan) };
}
