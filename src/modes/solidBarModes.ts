import { assembleSolidBar, solidRigidModes, type SolidMaterial, type SolidSystem } from '../fe/solid/assembleSolid.ts';
import { buildSolidBarMesh, type SolidBarGeometry, type SolidMeshOptions, type SolidPart } from '../fe/solid/solidBarMesh.ts';
import { envelopeEigenproblem } from '../eigen/GeneralizedEigenproblem.ts';
import { invertSix } from '../material/orthotropicStiffness.ts';
import { classifySolidMode, topFaceNodalLines, type SolidModeKind } from './solidModeShape.ts';
import { solveFreeModesOf } from './solveFreeModes.ts';

/** A rectangular bar as an elastic solid: its geometry (SI) and material in the bar's axes. */
export interface SolidBar {
  readonly geometry: SolidBarGeometry;
  readonly material: SolidMaterial;
  /**
   * True when the mid-width plane is a plane of material symmetry (isotropic, or R and T along
   * the width and thickness): the two halves then solve apart. Otherwise the full body is solved.
   */
  readonly mirrorSymmetric: boolean;
}

/**
 * barwright's default solid meshes, one per part: 20-node hexahedra, the elements next to each
 * kink of the underside halved once, graded across the width. Vertical bending (symmetric half)
 * needs the length and thickness resolved and hardly the width; torsion and lateral bending
 * (antisymmetric half) the width and thickness and less the length. The full body takes the finer
 * of each. Chosen from the measured convergence study on the deep-arch bar (DEVELOPERS.md): every
 * family within 0.85 cent of its mesh-converged value (test/solid/solidConvergence.test.ts).
 */
export const defaultSolidMeshes: Readonly<Record<SolidPart, SolidMeshOptions>> = {
  symmetric: { element: 'serendipity-20', lengthElements: 30, halfWidthElements: 2, thicknessElements: 4, widthGrading: true, stationRefinement: 1 },
  antisymmetric: { element: 'serendipity-20', lengthElements: 20, halfWidthElements: 3, thicknessElements: 3, widthGrading: true, stationRefinement: 1 },
  full: { element: 'serendipity-20', lengthElements: 30, halfWidthElements: 3, thicknessElements: 4, widthGrading: true, stationRefinement: 1 },
};

/** The mesh of a part: its default with the given options on top. */
export function solidMeshFor(part: SolidPart, options: Partial<SolidMeshOptions> = {}): SolidMeshOptions {
  return { ...defaultSolidMeshes[part], ...options };
}

/** How many modes of each half to find: the `count` lowest, and every one up to `upToHz`. */
export interface SolidPartRequest {
  readonly count: number;
  readonly upToHz?: number;
}

/** Options of solveSolidBar. */
export interface SolidSolveOptions {
  /** Mesh options on top of each part's default (defaultSolidMeshes). */
  readonly mesh?: Partial<SolidMeshOptions>;
  /** Lanczos relative residual (default 1e-7; analyzeBar uses 1e-5, frequencies to about 1e-10). */
  readonly tolerance?: number;
  /** Solve the full body even when the halves could be solved apart (for checks; its mesh: defaultSolidMeshes.full). */
  readonly fullBody?: boolean;
}

/** The flexible modes of one part (half or full body) with its assembled system. */
export interface SolidPartSolution {
  readonly part: SolidPart;
  readonly system: SolidSystem;
  /** λ = ω² (rad²/s²), ascending. */
  readonly eigenvalues: Float64Array;
  /** M-orthonormal mode vectors in the system's dofs (on a half model: half the bar's mass normalised). */
  readonly vectors: Float64Array[];
  /** Lanczos steps taken. */
  readonly steps: number;
}

/** One mode of the solid bar. */
export interface SolidMode {
  readonly hz: number;
  readonly eigenvalue: number;
  readonly kind: SolidModeKind;
  /** 1-based index within its kind, in ascending frequency. */
  readonly index: number;
  /** Share of the beam-like kinetic energy in its kind (see classifySolidMode). */
  readonly purity: number;
  /** Sign changes of its main beam-like curve (bending n: n + 1; torsion, longitudinal n: n; lateral n: n + 1). */
  readonly signChanges: number;
  /** Where its nodal lines cross the top face's centre line (m from the left end). */
  readonly nodalLines: Float64Array;
  /** Its main beam-like curve (see ModeClassification) at the mesh slices `slices` (m). */
  readonly curve: Float64Array;
  readonly slices: Float64Array;
  /** Which part solution it came from, and its position there. */
  readonly part: number;
  readonly vectorIndex: number;
}

/** The solid bar's modes, all kinds together in ascending frequency, with the parts they came from. */
export interface SolidSolution {
  readonly parts: SolidPartSolution[];
  readonly modes: SolidMode[];
  /** Unknowns over all parts solved. */
  readonly dofs: number;
}

/**
 * Euler–Bernoulli estimate of the lowest vertical bending eigenvalue, (4.730/L)⁴·E_x·I/(ρA) with
 * station-averaged t³ and t (Blevins 1979, table 8-1): only to place the Lanczos shift.
 */
function firstEigenvalueEstimate(bar: SolidBar): number {
  const { geometry, material } = bar;
  const youngAlong = 1 / invertSix(material.stiffness)[0]!;
  const t = geometry.profile.thicknesses;
  let cubes = 0;
  let sum = 0;
  for (let k = 0; k < t.length; k++) {
    cubes += t[k]! ** 3;
    sum += t[k]!;
  }
  return (4.730041 / geometry.length) ** 4 * ((youngAlong * cubes) / (12 * material.density * sum));
}

/**
 * Free–free modes of one part of a solid bar on a given mesh (pipeline: mesh → assembly →
 * envelope LDLᵀ of K − σM → shift-invert Lanczos with the part's rigid motions deflated, through
 * the project's one free-mode tail, solveFreeModesOf; σ from an Euler–Bernoulli estimate).
 */
export function solveSolidPart(bar: SolidBar, part: SolidPart, mesh: SolidMeshOptions, request: SolidPartRequest, tolerance = 1e-7): SolidPartSolution {
  const system = assembleSolidBar(buildSolidBarMesh(bar.geometry, part, mesh), bar.material);
  const free = solveFreeModesOf(envelopeEigenproblem(system.stiffness, system.mass), {
    modes: request.count,
    firstEigenvalueEstimate: firstEigenvalueEstimate(bar),
    rigidModes: solidRigidModes(system),
    tolerance,
    ...(request.upToHz === undefined ? {} : { upToHz: request.upToHz }),
  });
  return { part, system, eigenvalues: free.eigenvalues, vectors: free.vectors, steps: free.steps };
}

/**
 * The flexible modes of a rectangular bar as a 3D elastic solid (quadratic hexahedra on a mapped
 * mesh, consistent mass, 3 × 3 × 3 Gauss points, orthotropic or isotropic material), each
 * classified by kind with its nodal lines on the top face. When the material is mirror-symmetric
 * across the mid-width plane the symmetric half (vertical bending, longitudinal) and the
 * antisymmetric half (torsion, lateral bending) are solved apart, each for its own request;
 * otherwise the full body, for the sum of both counts up to the higher bound. Pure and synchronous.
 */
export function solveSolidBar(bar: SolidBar, request: { symmetric: SolidPartRequest; antisymmetric: SolidPartRequest }, options: SolidSolveOptions = {}): SolidSolution {
  const tolerance = options.tolerance ?? 1e-7;
  const parts: SolidPartSolution[] = [];
  if (bar.mirrorSymmetric && !options.fullBody) {
    parts.push(solveSolidPart(bar, 'symmetric', solidMeshFor('symmetric', options.mesh), request.symmetric, tolerance));
    parts.push(solveSolidPart(bar, 'antisymmetric', solidMeshFor('antisymmetric', options.mesh), request.antisymmetric, tolerance));
  } else {
    const mesh = solidMeshFor('full', options.mesh);
    const bounds = [request.symmetric.upToHz, request.antisymmetric.upToHz].filter((b): b is number => b !== undefined);
    const upToHz = bounds.length ? Math.max(...bounds) : undefined;
    parts.push(solveSolidPart(bar, 'full', mesh, { count: request.symmetric.count + request.antisymmetric.count, ...(upToHz === undefined ? {} : { upToHz }) }, tolerance));
  }
  return { parts, modes: solidModesOf(parts), dofs: parts.reduce((sum, p) => sum + p.system.dofCount, 0) };
}

/**
 * The modes of solved parts, classified (classifySolidMode), with their top-face nodal lines,
 * in ascending frequency, indexed within their kind.
 */
export function solidModesOf(parts: readonly SolidPartSolution[]): SolidMode[] {
  const found: Omit<SolidMode, 'index'>[] = [];
  parts.forEach((solution, partIndex) => {
    solution.vectors.forEach((vector, vectorIndex) => {
      const eigenvalue = solution.eigenvalues[vectorIndex]!;
      const classification = classifySolidMode(solution.system, vector);
      found.push({
        hz: Math.sqrt(Math.max(eigenvalue, 0)) / (2 * Math.PI),
        eigenvalue,
        kind: classification.kind,
        purity: classification.purity,
        signChanges: classification.signChanges,
        nodalLines: topFaceNodalLines(solution.system, vector, classification.kind),
        curve: classification.curve,
        slices: classification.slices,
        part: partIndex,
        vectorIndex,
      });
    });
  });
  found.sort((a, b) => a.hz - b.hz);
  const counters: Record<SolidModeKind, number> = { bending: 0, torsion: 0, lateral: 0, longitudinal: 0 };
  return found.map((mode) => ({ ...mode, index: ++counters[mode.kind] }));
}
