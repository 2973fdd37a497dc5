import { assembleTorsion, torsionRigidMode, type TorsionSystem } from '../fe/assembleTorsion.ts';
import type { BeamLine } from '../fe/BeamLine.ts';
import { buildMesh } from '../fe/buildMesh.ts';
import { longitudinalLaw, torsionLaw } from '../fe/sectionLaw.ts';
import type { BarModel } from './BarModel.ts';
import { meshDensity } from './meshDensity.ts';
import { solveFreeModes } from './solveFreeModes.ts';

/** Flexible St-Venant torsion modes of a free–free bar. */
export interface TorsionSolution {
  readonly line: BeamLine;
  readonly system: TorsionSystem;
  readonly eigenvalues: Float64Array;
  readonly frequencies: Float64Array;
  /** M-normalised twist vectors (dof layout of the system, see TorsionSystem), ψ(0) > 0. */
  readonly vectors: Float64Array[];
}

/**
 * The longitudinal (rod) line of a bar: solveTorsionLine solves it too (same operator; its
 * "twist" is then the axial displacement).
 */
export function longitudinalLine(model: BarModel): BeamLine {
  return { length: model.length, profile: model.profile, law: longitudinalLaw(model.section, model.material) };
}

/** The torsion beam line of a bar. */
export function torsionLine(model: BarModel): BeamLine {
  const line: BeamLine = { length: model.length, profile: model.profile, law: torsionLaw(model.section, model.material) };
  return model.holes && model.holes.length > 0 ? { ...line, holes: model.holes } : line;
}

/**
 * Free–free torsion modes of a beam line on a given mesh (with `upToHz`, all up to it);
 * `tolerance` is the eigensolver's relative residual (default lowestModes' 1e-7).
 */
export function solveTorsionLine(line: BeamLine, nodes: Float64Array, modes: number, upToHz?: number, tolerance?: number): TorsionSolution {
  const system = assembleTorsion(nodes, line);
  // Uniform estimate of the first torsion eigenvalue, (π/L)²·GJ/ρI_p, from averaged properties.
  const properties = new Float64Array(2);
  let stiffness = 0;
  let inertia = 0;
  for (const t of line.profile.thicknesses) {
    line.law.evaluate(t, properties);
    stiffness += properties[0]!;
    inertia += properties[1]!;
  }
  const free = solveFreeModes(system.stiffness, system.mass, {
    modes,
    firstEigenvalueEstimate: (Math.PI / line.length) ** 2 * (stiffness / inertia),
    rigidModes: [torsionRigidMode(system.stiffness.size)],
    ...(upToHz === undefined ? {} : { upToHz }),
    ...(tolerance === undefined ? {} : { tolerance }),
  });
  return { line, system, ...free };
}

/** The lowest flexible torsion modes of a free–free bar (1D St-Venant theory). */
export function solveTorsion(model: BarModel, options: { modes?: number; elements?: number } = {}): TorsionSolution {
  const modes = options.modes ?? 4;
  return solveTorsionLine(torsionLine(model), buildMesh(model.profile, options.elements ?? meshDensity(modes), model.holes), modes);
}
