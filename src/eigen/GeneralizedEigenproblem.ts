import { bandedCombine, bandedMultiply, type BandedMatrix } from './BandedMatrix.ts';
import { bandedLdlt, bandedLdltInPlace, bandedLdltSolve } from './bandedLdlt.ts';
import type { EnvelopeMatrix } from './EnvelopeMatrix.ts';
import { envelopeLdltInPlace, envelopeLdltSolve } from './envelopeLdlt.ts';
import { envelopeAddSparse, sparseSymmetricMultiply, type SparseSymmetricMatrix } from './SparseSymmetricMatrix.ts';

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
 * The problem of an envelope K and a sparse symmetric M inside K's envelope (as a mesh's
 * consistent mass is): K − σM is formed in a copy of K and factored there (envelope LDLᵀ).
 */
export function envelopeEigenproblem(stiffness: EnvelopeMatrix, mass: SparseSymmetricMatrix): GeneralizedEigenproblem {
  return {
    size: stiffness.size,
    multiplyMass: (x, out) => sparseSymmetricMultiply(mass, x, out),
    factorShifted(shift) {
      const shifted = envelopeAddSparse({ ...stiffness, data: stiffness.data.slice() }, -shift, mass);
      const factor = envelopeLdltInPlace(shifted);
      return (x) => void envelopeLdltSolve(factor, x);
    },
  };
}
