import type { DesignGrid } from './designGrid.ts';

/** What a shape family needs to know to place an arch (SI). */
export interface ShapeSpace {
  readonly grid: DesignGrid;
  /** The blank's full thickness (m): depths are measured down from it. */
  readonly blankThickness: number;
  /** Deepest cut allowed (m): blank thickness − minimum thickness. */
  readonly maxDepth: number;
}

/**
 * A family of symmetric arches described by a few normalised parameters q ∈ [0, 1]ⁿ. The arch is
 * a cut surface: depth d(x) ≥ 0 below the blank's full thickness, so the surface thickness is
 * T − d(x) and the bar becomes min(current, T − d) (material is only ever removed).
 */
export interface ShapeFamily {
  /** Short machine name: "shoulder-arch", "power-arch", "free-form". */
  readonly name: string;
  /** Number of parameters in this space. */
  parameterCount(space: ShapeSpace): number;
  /** Names of the parameters (for reports), same order. */
  parameterNames(space: ShapeSpace): string[];
  /** Starting points for a multi-start search (each in [0, 1]ⁿ). */
  starts(space: ShapeSpace): Float64Array[];
  /**
   * Writes the depth (m) at every grid station into `depth`, and when given its derivatives
   * ∂d_j/∂q_m into `jacobian` (row-major: station j, parameter m).
   */
  depths(space: ShapeSpace, q: ArrayLike<number>, depth: Float64Array, jacobian?: Float64Array): void;
  /** The parameters in physical units for reports (mm, ratios). */
  describe(space: ShapeSpace, q: ArrayLike<number>): Record<string, number>;
}
