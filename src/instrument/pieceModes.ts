import { assembleBending, bendingRigidModes } from '../fe/assembleBending.ts';
import type { BeamTheory } from '../fe/beamElementType.ts';
import { buildMesh } from '../fe/buildMesh.ts';
import type { BarModel } from '../modes/BarModel.ts';
import { meshDensity } from '../modes/meshDensity.ts';
import { bendingFieldsAt, zeroCrossings } from '../modes/modeShape.ts';
import { bendingLine, firstBendingEigenvalueEstimate, type BendingSolution } from '../modes/solveBending.ts';
import { solveFreeModes } from '../modes/solveFreeModes.ts';
import { addEndLoad, type EndLoad } from './endLoad.ts';

/** One vertical bending mode of a piece: frequency, ratio to mode 1, node positions (m from x = 0). */
export interface PieceMode {
  readonly mode: number;
  readonly hz: number;
  readonly ratio: number;
  readonly nodes: readonly number[];
}

/** Options of pieceModes. */
export interface PieceModeOptions {
  readonly modes?: number;
  readonly theory?: BeamTheory;
  /** Rigid masses at the ends (plugs, caps). */
  readonly endLoads?: readonly EndLoad[];
  /** Target element count (default: the solver's automatic density for the modes asked). */
  readonly elements?: number;
}

/**
 * The lowest free–free vertical bending modes of a bar, tube or rod, with optional rigid end
 * loads, through the solver's own pipeline (mesh → Timoshenko or Euler–Bernoulli elements →
 * banded assembly → shift-invert Lanczos with the rigid modes deflated). Node positions are the
 * zero crossings of each mode's deflection. Pure; SI in and out.
 */
export function pieceModes(model: BarModel, options: PieceModeOptions = {}): PieceMode[] {
  const modes = Math.max(1, Math.floor(options.modes ?? 4));
  const theory = options.theory ?? 'timoshenko';
  const line = bendingLine(model, 'vertical');
  const nodes = buildMesh(model.profile, options.elements ?? meshDensity(modes, theory), model.holes);
  const system = assembleBending(nodes, line, theory);
  for (const load of options.endLoads ?? []) addEndLoad(system.mass, load.at === 'start' ? 0 : system.mass.size - 2, load);
  const free = solveFreeModes(system.stiffness, system.mass, { modes, firstEigenvalueEstimate: firstBendingEigenvalueEstimate(line), rigidModes: bendingRigidModes(system) });
  const frequencies = free.frequencies;
  const solution: BendingSolution = { line, system, ...free };
  return Array.from(frequencies, (hz, i) => ({
    mode: i + 1,
    hz,
    ratio: hz / frequencies[0]!,
    nodes: zeroCrossings(nodes, (x) => bendingFieldsAt(solution, i, x).deflection),
  }));
}
