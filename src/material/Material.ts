import type { GrainOrientation, OrthotropicElasticity } from './orthotropicStiffness.ts';

/**
 * The 3D elastic law of a material for the solid model: orthotropic wood (constants in SI, with
 * the grain orientation in the bar) or an isotropic solid; `assumed` names the bar-file fields
 * that were not given and came from the published hardwood ratios (or defaults).
 */
export type MaterialElasticity =
  | { readonly kind: 'orthotropic'; readonly constants: OrthotropicElasticity; readonly grain: GrainOrientation; readonly assumed: readonly string[] }
  | { readonly kind: 'isotropic'; readonly youngModulus: number; readonly poisson: number; readonly assumed: readonly string[] };

/**
 * A bar material in SI units. For wood, `youngModulus` is along the grain and `shearModulus` the
 * shear modulus governing vertical bending (longitudinal–radial/tangential); for metals
 * G = E / (2(1+ν)). `shearCoefficient` overrides the section's default κ when given.
 */
export interface Material {
  /** Young's modulus E along the bar, Pa. */
  readonly youngModulus: number;
  /** Shear modulus G, Pa. */
  readonly shearModulus: number;
  /** Density ρ, kg/m³. */
  readonly density: number;
  /** Poisson's ratio ν (used for Cowper's κ of round sections). */
  readonly poisson: number;
  /** Timoshenko shear coefficient κ; absent means the section's default. */
  readonly shearCoefficient?: number;
  /** The 3D elastic law (solid theory); absent for materials built by hand, see solidElasticity. */
  readonly elasticity?: MaterialElasticity;
}
