import type { BeamTheory } from '../fe/beamElementType.ts';
import { buildMesh } from '../fe/buildMesh.ts';
import { isAxisymmetric } from '../section/Section.ts';
import { barModelFromFile, type BarModel } from './BarModel.ts';
import type { BarFile } from '../fileFormats/barFile.ts';
import type { AnalyzeOptions, BarAnalysis, ModeResult } from './BarAnalysis.ts';
import { collisionWarnings, collisionWindowCents, type OtherMode } from './collisionWarnings.ts';
import { meshDensity } from './meshDensity.ts';
import { bendingFieldsAt, bendingNodePositions, sampleShape, torsionFieldsAt } from './modeShape.ts';
import { bendingLine, solveBendingLine, type BendingSolution } from './solveBending.ts';
import { solveTorsionLine, torsionLine, type TorsionSolution } from './solveTorsion.ts';

const shapePoints = 61;
/**
 * Eigensolver residual for analyzeBar: frequencies come out to ≈ residual² ≈ 1e-10 relative
 * (1e-7 cent) and node positions to about a micrometre, with 1–2 fewer Lanczos steps per family
 * than the library default 1e-7 (measured on the bench bar: 12/10/14 → 10/8/13 steps for
 * vertical/lateral/torsion; the default stays tighter for the designer's sensitivities).
 */
const analysisTolerance = 1e-5;
/** 50 cents above the highest of the first three partials: how far up other families are needed. */
const collisionReach = 2 ** (collisionWindowCents / 1200);

function modeResults(
  frequencies: Float64Array,
  fundamental: number,
  length: number,
  valueAt: (mode: number, x: number) => number,
  shapes: boolean,
  nodesOf?: (mode: number) => number[],
): ModeResult[] {
  return Array.from(frequencies, (hz, i) => {
    const result: ModeResult = { mode: i + 1, hz, ratio: hz / fundamental };
    if (nodesOf) result.nodes_mm = nodesOf(i).map((x) => x * 1000);
    if (shapes) {
      const shape = sampleShape(length, shapePoints, (x) => valueAt(i, x));
      result.shape = { x_mm: Array.from(shape.x, (x) => x * 1000), displacement: Array.from(shape.value) };
    }
    return result;
  });
}

/** The frequencies up to `reach` (Hz), and always at least the first. */
function withinReach(frequencies: Float64Array, reach: number): Float64Array {
  let count = 1;
  while (count < frequencies.length && frequencies[count]! <= reach) count++;
  return frequencies.subarray(0, count);
}

/**
 * The line model's analysis (analyzeBar for the beam theories). Vibration modes of a free–free bar: the N lowest vertical bending modes (the tuned partials)
 * with ratios, node positions and optional shapes; the lateral bending and torsion modes in the
 * same range (up to 50 cents above the highest of partial N and partial 3; at least the first of
 * each); warnings for any within beating distance of bending partials 1–3 (collisionDistanceHz). Timoshenko (default) or
 * Euler–Bernoulli finite elements on a mesh with a node at every profile station; banded
 * shift-invert Lanczos. Pure and synchronous.
 */
export function analyzeLineBarModel(model: BarModel, options: AnalyzeOptions & { theory?: BeamTheory } = {}): BarAnalysis {
  const modes = Math.max(1, Math.floor(options.modes ?? 4));
  const theory = options.theory ?? 'timoshenko';
  const shapes = options.shapes ?? false;
  const nodes = buildMesh(model.profile, options.elements ?? meshDensity(Math.max(modes, 4), theory), model.holes);
  const vertical: BendingSolution = solveBendingLine(bendingLine(model, 'vertical'), nodes, theory, Math.max(modes, 3), undefined, analysisTolerance);
  const fundamental = vertical.frequencies[0]!;
  // Other families are wanted over the bending partials' range, and 50 cents beyond partial 3.
  const highest = Math.max(vertical.frequencies[modes - 1] ?? 0, vertical.frequencies[Math.min(2, vertical.frequencies.length - 1)]!);
  const reach = highest * collisionReach;
  const bendingValue = (solution: BendingSolution) => (mode: number, x: number) => bendingFieldsAt(solution, mode, x).deflection;
  const bending = modeResults(vertical.frequencies.subarray(0, modes), fundamental, model.length, bendingValue(vertical), shapes, (mode) => bendingNodePositions(vertical, mode));

  const lateralLine = bendingLine(model, 'lateral');
  const lateralSolution = isAxisymmetric(model.section) ? vertical : solveBendingLine(lateralLine, nodes, theory, 1, reach, analysisTolerance);
  const lateral = modeResults(withinReach(lateralSolution.frequencies, isAxisymmetric(model.section) ? highest : reach), fundamental, model.length, bendingValue(lateralSolution), shapes);

  const twistLine = torsionLine(model);
  const torsionSolution: TorsionSolution = solveTorsionLine(twistLine, nodes, 1, reach, analysisTolerance);
  const torsion = modeResults(withinReach(torsionSolution.frequencies, reach), fundamental, model.length, (mode, x) => torsionFieldsAt(torsionSolution, mode, x).twist, shapes);

  const others: OtherMode[] = torsion.map((m) => ({ family: 'torsion' as const, mode: m.mode, hz: m.hz }));
  // A rod or tube's lateral modes are its vertical ones: the same partials, not a collision.
  if (!isAxisymmetric(model.section)) others.push(...lateral.map((m) => ({ family: 'lateral' as const, mode: m.mode, hz: m.hz })));
  const warnings = collisionWarnings(Array.from(vertical.frequencies.subarray(0, 3)), others);
  return { theory, bending, torsion, lateral, warnings, mesh: { elements: nodes.length - 1 } };
}

/**
 * analyzeBar for the line theories only (Timoshenko by default, or Euler–Bernoulli), from a bar
 * file: the same result without loading the solid model, for callers that never ask for it
 * (the workbench's quick solver worker, sessions, the keyboard check).
 */
export function analyzeLineBar(bar: BarFile, options: AnalyzeOptions & { theory?: BeamTheory } = {}): BarAnalysis {
  return analyzeLineBarModel(barModelFromFile(bar), options);
}
