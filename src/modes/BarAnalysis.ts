import type { BeamTheory } from '../fe/beamElementType.ts';
import type { SolidMeshOptions } from '../fe/solid/solidBarMesh.ts';
import type { SolidModeKind } from './solidModeShape.ts';

/** Options of analyzeBar. */
export interface AnalyzeOptions {
  /** How many vertical bending modes (default 4). */
  modes?: number;
  /** Beam theories (line model) or the 3D elastic solid (rectangular bars). */
  theory?: BeamTheory | 'solid';
  /** Target element count (default automatic). */
  elements?: number;
  /** Include sampled mode shapes (61 points, scaled to ±1) for plotting (default false). */
  shapes?: boolean;
  /** Solid theory: the mesh (default defaultSolidMesh). */
  solidMesh?: Partial<SolidMeshOptions>;
}

/** A mode shape sampled along the bar, positions in mm, values scaled so max |value| = 1. */
export interface SampledShape {
  x_mm: number[];
  displacement: number[];
}

/** One mode in analyzeBar's result. */
export interface ModeResult {
  mode: number;
  hz: number;
  /** hz / the fundamental's (bending mode 1) hz. */
  ratio: number;
  /** Node positions (zero crossings of the deflection) from the left end, mm: bending only. */
  nodes_mm?: number[];
  shape?: SampledShape;
  /** Solid theory: the family the mode was classified into (the key it is listed under). */
  kind?: SolidModeKind;
  /** Solid theory: share of the mode's beam-like kinetic energy in its kind (near 1 for a clean mode). */
  purity?: number;
  /**
   * Solid theory: cents of the line model's matching mode (same kind and index) relative to
   * this one, 1200·log₂(f_line / f_solid): positive when the line model is sharp. Null when the
   * line model has no such mode.
   */
  line_model_cents?: number | null;
  /** Solid theory: where the mode's nodal lines cross the top face's centre line, mm from the left end. */
  nodal_lines_mm?: number[];
}

/** analyzeBar's result: exactly what `barwright modes --json` prints (contract). */
export interface BarAnalysis {
  theory: BeamTheory | 'solid';
  bending: ModeResult[];
  torsion: ModeResult[];
  lateral: ModeResult[];
  /** Solid theory: longitudinal (stretching) modes in the range. */
  longitudinal?: ModeResult[];
  warnings: string[];
  /** Elements along the bar (line theories); hexahedra and more for the solid. */
  mesh: { elements: number } & Partial<SolidMeshSummary>;
  /** Solid theory: the elastic law used and the constants that were assumed. */
  material?: SolidMaterialSummary;
  /** Remarks on how the bar was modelled (e.g. a tube asked for the solid theory). */
  notes?: string[];
}

/** The solid mesh in analyzeBar's result. */
export interface SolidMeshSummary {
  element: string;
  /** Each part solved: elements along the bar, across its width (half or full) and through the thickness, and its unknowns. */
  parts: { part: string; along: number; across: number; through_thickness: number; unknowns: number }[];
  nodes: number;
  unknowns: number;
  /** "halves" (symmetric and antisymmetric across the width, apart) or "full body". */
  solved_as: 'halves' | 'full body';
}

/** The solid model's material in analyzeBar's result. */
export interface SolidMaterialSummary {
  model: 'orthotropic' | 'isotropic';
  /** "radial" (R through the thickness), "tangential", or "ring angle N°". */
  grain?: string;
  /** Constants used, in the bar file's units. */
  constants: Record<string, number>;
  /** Bar-file fields not given, and where their values came from. */
  assumed: string[];
  assumed_source?: string;
}


