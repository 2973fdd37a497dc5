import { assembleBending, bendingRigidModes, type BendingSystem } from '../fe/assembleBending.ts';
import type { BeamTheory } from '../fe/beamElementType.ts';
import type { BeamLine } from '../fe/BeamLine.ts';
import { buildMesh } from '../fe/buildMesh.ts';
import { bendingLaw, type BendingPlane } from '../fe/sectionLaw.ts';
import type { BarModel } from './BarModel.ts';
import { meshDensity } from './meshDensity.ts';
import { solveFreeModes } from './solveFreeModes.ts';

/** Options for solveBending. */
export interface BendingOptions {
  theory?: BeamTheory;
  /** How many flexible modes (default 4). */
  modes?: number;
  /** Target element count (default: automatic, see meshDensity). */
  elements?: number;
  /** Bending plane (default vertical, the tuned family). */
  plane?: BendingPlane;
  /** Eigensolver relative residual (default lowestModes' 1e-7: sensitivities to about 1e-6). */
  tolerance?: number;
}

/** Flexible bending modes of a free–free bar on its finite-element mesh. */
export interface BendingSolution {
  readonly line: BeamLine;
  readonly system: BendingSystem;
  /** Eigenvalues λ = ω² (rad²/s²), ascending. */
  readonly eigenvalues: Float64Array;
  /** Frequencies (Hz), ascending. */
  readonly frequencies: Float64Array;
  /** M-normalised mode vectors (dof layout of the system), sign fixed so w(0) > 0. */
  readonly vectors: Float64Array[];
}

/** The beam line (length, profile, law, cord holes) of a bar in one bending plane. */
export function bendingLine(model: BarModel, plane: BendingPlane = 'vertical'): BeamLine {
  const line: BeamLine = { length: model.length, profile: model.profile, law: bendingLaw(model.section, model.material, plane) };
  return model.holes && model.holes.length > 0 ? { ...line, holes: model.holes } : line;
}

/**
 * Euler–Bernoulli estimate of the lowest free–free eigenvalue ω₁² from length-averaged
 * properties, (4.730/L)⁴·EI/ρA (Blevins 1979, table 8-1), rad²/s²: used only to place the shift.
 */
export function firstBendingEigenvalueEstimate(line: BeamLine): number {
  const properties = new Float64Array(4);
  const t = line.profile.thicknesses;
  let bending = 0;
  let mass = 0;
  for (let k = 0; k < t.length; k++) {
    line.law.evaluate(t[k]!, properties);
    bending += properties[0]!;
    mass += properties[2]!;
  }
  return (4.730041 / line.length) ** 4 * (bending / mass);
}

/**
 * Free–free bending modes of a beam line on a given mesh (pipeline: assemble → solve): the
 * `modes` lowest, and with `upToHz` also every mode up to that frequency. `tolerance` is the
 * eigensolver's relative residual (default lowestModes' 1e-7).
 */
export function solveBendingLine(line: BeamLine, nodes: Float64Array, theory: BeamTheory, modes: number, upToHz?: number, tolerance?: number): BendingSolution {
  const system = assembleBending(nodes, line, theory);
  const free = solveFreeModes(system.stiffness, system.mass, {
    modes,
    firstEigenvalueEstimate: firstBendingEigenvalueEstimate(line),
    rigidModes: bendingRigidModes(system),
    ...(upToHz === undefined ? {} : { upToHz }),
    ...(tolerance === undefined ? {} : { tolerance }),
  });
  return { line, system, ...free };
}

/**
 * The lowest flexible bending modes of a free–free bar (Timoshenko by default), in the vertical
 * or lateral plane. Mesh: a node at every profile station, automatic density unless `elements`.
 */
export function solveBending(model: BarModel, options: BendingOptions = {}): BendingSolution {
  const modes = options.modes ?? 4;
  const line = bendingLine(model, options.plane ?? 'vertical');
  const nodes = buildMesh(model.profile, options.elements ?? meshDensity(modes, options.theory ?? 'timoshenko'), line.holes);
  return solveBendingLine(line, nodes, options.theory ?? 'timoshenko', modes, undefined, options.tolerance);
}
