import type { BeamTheory } from '../fe/beamElementType.ts';
import type { BarModel } from '../modes/BarModel.ts';
import { meshDensity } from '../modes/meshDensity.ts';
import { designGrid } from './designGrid.ts';
import type { CutLimits } from './cutLimits.ts';
import type { DesignTarget } from './designTarget.ts';
import { designLine, type DesignProblem } from './evaluateShape.ts';

/**
 * The fixed part of a design for a rect bar model (SI): grid of stations over the largest
 * symmetric arch the limits allow, the deepest cut (blank thickness − minimum thickness), and the
 * solver settings (theory, mesh density for the tuned partials).
 */
export function createDesignProblem(model: BarModel, target: DesignTarget, limits: CutLimits, theory: BeamTheory = 'timoshenko', spacing?: number): DesignProblem {
  const section = model.section;
  if (section.shape !== 'rect') throw new RangeError('createDesignProblem: only rect bars are undercut');
  const grid = designGrid(model.profile, limits, spacing);
  return {
    model,
    space: { grid, blankThickness: section.thickness, maxDepth: Math.max(0, section.thickness - limits.minThickness) },
    target,
    limits,
    theory,
    elements: meshDensity(Math.max(3, target.hz.length), theory),
    width: section.width,
    line: designLine(model),
  };
}
