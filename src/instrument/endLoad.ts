import { bandedAddElement, type BandedMatrix } from '../eigen/BandedMatrix.ts';

/**
 * A rigid mass fixed at one end of a chime or bar: a plug pressed into a tube's bore, a cap over
 * its end, a striker block. SI: mass (kg), its centre's distance from that end (m) and its rotary
 * inertia about a transverse axis through its centre (kg·m²).
 */
export interface EndLoad {
  /** Which end: 'start' is x = 0 (a chime's top, where it hangs), 'end' is x = L. */
  readonly at: 'start' | 'end';
  readonly mass: number;
  /** Distance of the mass centre from the end face, inwards, m. */
  readonly centreOffset: number;
  /** Rotary inertia about a transverse axis through the mass centre, kg·m². */
  readonly rotaryInertia: number;
}

/**
 * An end load for a solid cylindrical plug of the given length and diameter (m) and mass (kg),
 * flush with the end: centre at half its length, rotary inertia m(3r² + ℓ²)/12 (solid cylinder
 * about a diameter through its centre, a closed form of rigid-body mechanics).
 */
export function cylindricalPlug(at: EndLoad['at'], mass: number, length: number, diameter: number): EndLoad {
  const radius = diameter / 2;
  return { at, mass, centreOffset: length / 2, rotaryInertia: (mass * (3 * radius * radius + length * length)) / 12 };
}

/**
 * Adds a rigid end load to an assembled bending mass matrix whose end node carries the dofs
 * [w, θ] at `deflectionDof` and `deflectionDof + 1`. The load moves as w + c·θ (c the signed
 * offset of its centre along x) and turns with θ, so its kinetic energy adds
 * [[m, m c], [m c, m c² + J]] to those two dofs. Rigid-body motions of the bar stay exact
 * (translation and rotation move the load rigidly with it). Mutates `mass`.
 */
export function addEndLoad(mass: BandedMatrix, deflectionDof: number, load: EndLoad): void {
  const c = load.at === 'start' ? load.centreOffset : -load.centreOffset;
  const m = load.mass;
  bandedAddElement(mass, [deflectionDof, deflectionDof + 1], [m, m * c, m * c, m * c * c + load.rotaryInertia]);
}
