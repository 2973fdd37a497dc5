import type { UniformBeam } from './huangFreeFree.ts';

/**
 * Frequency (Hz) of mode n of a simply supported uniform Timoshenko beam, closed form: with
 * w = W sin kx, θ = Θ cos kx, k = nπ/L, the Timoshenko equations give the 2×2 determinant
 *   (κGA k² − ω² ρA)(EI k² + κGA − ω² ρI) − (κGA k)² = 0,
 * a quadratic in ω² whose lower root is the bending branch. Solved in the cancellation-free form
 * ω² = 2c / (−b + √(b² − 4ac)). With ρI = 0 it reduces to the shear-only beam, and with
 * κGA → ∞ to Euler–Bernoulli's ω² = EI k⁴/ρA.
 */
export function simplySupportedTimoshenkoFrequency(beam: UniformBeam, mode: number): number {
  const { length, bendingStiffness: EI, shearStiffness: kGA, massPerLength: rhoA, rotaryInertiaPerLength: rhoI } = beam;
  const k = (mode * Math.PI) / length;
  const a = rhoA * rhoI;
  const b = -(kGA * k * k * rhoI + rhoA * (EI * k * k + kGA));
  const c = kGA * EI * k ** 4;
  const omegaSquared = (2 * c) / (-b + Math.sqrt(b * b - 4 * a * c));
  return Math.sqrt(omegaSquared) / (2 * Math.PI);
}
