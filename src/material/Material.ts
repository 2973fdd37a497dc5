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
}
