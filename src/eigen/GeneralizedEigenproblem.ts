import { bandedCombine, bandedMultiply, type BandedMatrix } from './BandedMatrix.ts';
import { bandedLdlt, bandedLdltInPlace, bandedLdltSolve } from './bandedLdlt.ts';
import { envelopeCombine, type EnvelopeMatrix } from './EnvelopeMatrix.ts';
import { envelopeLdltInPlace, envelopeLdltSolve } from './envelopeLdlt.ts';
import { compressEnvelope, sparseSymmetricMultiply } from './SparseSymmetricMatrix.ts';

/**
 * A symmetric generalized eigenproblem K·x = λ·M·x seen through the two operations shift-invert
 * Lanczos needs: multiply by M, and solve with K − σM. The storage behind it (band, envelope, …)
 * is the adapter's business, so one Lanczos serves every matrix format.
 */
export interface GeneralizedEigenproblem {
  readonly size: number;
  /** out ← M·x (every entry of out overwritten); returns out. */
  multiplyMass(x: Float64Array, out: Float64Array<ArrayBuffer>): Float64Array;
  /**
   * Factors K − σM once and returns a solver that overwrites its argument b with (K − σM)⁻¹·b.
   * Throws (internal) when K − σM is not positive definite.
   */
  factorShifted(shift: number): (x: Float64Array) => void;
}

/** The problem of two banded matrices (banded LDLᵀ of K − σM; with σ = 0, of K alone). */
export function bandedEigenproblem(stiffness: BandedMatrix, mass: BandedMatrix): GeneralizedEigenproblem {
  return {
    size: stiffness.size,
    multiplyMass: (x, out) => bandedMultiply(mass, x, out),
    factorShifted(shift) {
      const factor = shift === 0 ? bandedLdlt(stiffness) : bandedLdltInPlace(bandedCombine(stiffness, -shift, mass));
      return (x) => void bandedLdltSolve(factor, x);
    },
  };
}

/**
 * The problem of two envelope matrices of one layout (envelope LDLᵀ of K − σM); M is multiplied
 * through a compressed copy without its structural zeros.
 */
export function envelopeEigenproblem(stiffness: EnvelopeMatrix, mass: EnvelopeMatrix): GeneralizedEigenproblem {
  const compressedMass = compressEnvelope(mass);
  return {
    size: stiffness.size,
    multiplyMass: (x, out) => sparseSymmetricMultiply(compressedMass, x, out),
    factorShifted(shift) {
      const factor = envelopeLdltInPlace(envelopeCombine(stiffness, -shift, mass));
      return (x) => void envelopeLdltSolve(factor, x);
    },
  };
}
