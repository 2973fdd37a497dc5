import type { BarFile } from '../fileFormats/barFile.ts';
import { barModelFromFile, type BarModel } from './BarModel.ts';
import type { AnalyzeOptions, BarAnalysis } from './BarAnalysis.ts';
import { analyzeLineBarModel } from './analyzeLineBar.ts';
import { analyzeSolidBarModel } from './analyzeSolidBar.ts';

export type * from './BarAnalysis.ts';

/**
 * Vibration modes of a free–free bar (contract: what `barwright modes --json` prints): the N
 * lowest vertical bending modes (the tuned partials) with ratios and node positions, the torsion
 * and lateral modes in their range, and collision warnings. Timoshenko (default) or
 * Euler–Bernoulli line models (analyzeLineBarModel), or the 3D elastic solid
 * (analyzeSolidBarModel; rectangular bars). Pure and synchronous.
 */
export function analyzeBar(bar: BarFile, options: AnalyzeOptions = {}): BarAnalysis {
  return analyzeBarModel(barModelFromFile(bar), options);
}

/** analyzeBar on a model already in SI units (see BarModel). */
export function analyzeBarModel(model: BarModel, options: AnalyzeOptions = {}): BarAnalysis {
  const theory = options.theory ?? 'timoshenko';
  return theory === 'solid' ? analyzeSolidBarModel(model, options) : analyzeLineBarModel(model, { ...options, theory });
}
