import { bandedCombine, bandedMultiply, type BandedMatrix } from './BandedMatrix.ts';
import { bandedLdlt, bandedLdltSolve } from './bandedLdlt.ts';
import { tridiagonalEigen } from './tridiagonalEigen.ts';

/** Options for lowestModes. */
export interface LowestModesOptions {
  /**
   * Shift σ for the shift-invert operator (K − σM)⁻¹M, in eigenvalue units (rad²/s² for
   * vibration). Must lie below the lowest eigenvalue kept; for free–free problems a negative
   * value near −½ of the expected lowest flexible eigenvalue converges fastest.
   */
  shift: number;
  /**
   * Known null-space (rigid-body) vectors of K, deflated exactly so only flexible modes come
   * back. They need not be normalised or M-orthogonal.
   */
  rigidModes?: readonly Float64Array[];
  /**
   * Also return every eigenpair with λ ≤ upTo, plus the first one above it (so the caller knows
   * the range is covered): the count grows as needed, in one Lanczos run.
   */
  upTo?: number;
  /**
   * Relative residual at which a Ritz pair counts as converged (default 1e-9: eigenvalue error
   * ≈ residual²/gap, far below 1e-12 relative; vectors to about 1e-9).
   */
  tolerance?: number;
}

/** The lowest eigenpairs of K·x = λ·M·x, ascending, vectors M-orthonormal (xᵀMx = 1). */
export interface Eigenpairs {
  eigenvalues: Float64Array;
  vectors: Float64Array[];
  /** Lanczos steps taken (a cost figure for benchmarks). */
  steps: number;
}

/** Deterministic start vector (a fixed linear congruential sequence) so results are repeatable. */
function startVector(n: number, seed: number): Float64Array {
  const v = new Float64Array(n);
  let state = (seed * 2654435761) >>> 0 || 1;
  for (let i = 0; i < n; i++) {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    v[i] = state / 4294967296 - 0.5;
  }
  return v;
}

/** aᵀb with four partial sums (breaks the floating-point add latency chain). */
function dot(a: Float64Array, b: Float64Array): number {
  const n = a.length;
  let s0 = 0;
  let s1 = 0;
  let s2 = 0;
  let s3 = 0;
  let i = 0;
  for (; i + 3 < n; i += 4) {
    s0 += a[i]! * b[i]!;
    s1 += a[i + 1]! * b[i + 1]!;
    s2 += a[i + 2]! * b[i + 2]!;
    s3 += a[i + 3]! * b[i + 3]!;
  }
  for (; i < n; i++) s0 += a[i]! * b[i]!;
  return s0 + s1 + (s2 + s3);
}

/** w ← w − Σ q (M q)ᵀ w over the given M-orthonormal basis (one classical Gram–Schmidt pass). */
function orthogonalise(w: Float64Array, basis: readonly Float64Array[], massBasis: readonly Float64Array[]): void {
  for (let k = 0; k < basis.length; k++) {
    const coefficient = dot(massBasis[k]!, w);
    const q = basis[k]!;
    for (let i = 0; i < w.length; i++) w[i]! -= coefficient * q[i]!;
  }
}

/**
 * The `count` lowest eigenpairs of the symmetric generalized problem K·x = λ·M·x (K positive
 * semi-definite, M positive definite, both banded), by shift-invert Lanczos with full
 * M-orthogonal re-orthogonalisation (Ericsson & Ruhe, Math. Comp. 35 (1980) 1251; Parlett,
 * The Symmetric Eigenvalue Problem, ch. 13) on a banded LDLᵀ of K − σM. Rigid-body vectors are
 * deflated at every step, so free–free problems return only flexible modes. Cost per step: one
 * banded solve and multiply, O(n·b), plus re-orthogonalisation O(n·steps).
 */
export function lowestModes(stiffness: BandedMatrix, mass: BandedMatrix, count: number, options: LowestModesOptions): Eigenpairs {
  const n = stiffness.size;
  const tolerance = options.tolerance ?? 1e-9;
  const sigma = options.shift;
  // M-orthonormal rigid-body basis (modified Gram–Schmidt in the M inner product).
  const rigid: Float64Array[] = [];
  const massRigid: Float64Array[] = [];
  for (const mode of options.rigidModes ?? []) {
    const v = mode.slice();
    for (let pass = 0; pass < 2; pass++) orthogonalise(v, rigid, massRigid);
    const mv = bandedMultiply(mass, v);
    const norm = Math.sqrt(dot(v, mv));
    if (!(norm > 0)) continue;
    for (let i = 0; i < n; i++) {
      v[i]! /= norm;
      mv[i]! /= norm;
    }
    rigid.push(v);
    massRigid.push(mv);
  }
  const available = n - rigid.length;
  const minimum = Math.min(count, available);
  let wanted = minimum;
  if (wanted <= 0) return { eigenvalues: new Float64Array(0), vectors: [], steps: 0 };

  const factor = bandedLdlt(sigma === 0 ? stiffness : bandedCombine(stiffness, -sigma, mass));
  const basis: Float64Array[] = [];
  const massBasis: Float64Array[] = [];
  const alpha: number[] = [];
  const beta: number[] = [];
  const maxSteps = available;

  const newDirection = (seed: number): boolean => {
    for (let attempt = 0; attempt < 5; attempt++) {
      const v = startVector(n, seed + attempt * 7919);
      for (let pass = 0; pass < 2; pass++) {
        orthogonalise(v, rigid, massRigid);
        orthogonalise(v, basis, massBasis);
      }
      const mv = bandedMultiply(mass, v);
      const norm = Math.sqrt(dot(v, mv));
      if (norm > 1e-8) {
        for (let i = 0; i < n; i++) {
          v[i]! /= norm;
          mv[i]! /= norm;
        }
        basis.push(v);
        massBasis.push(mv);
        return true;
      }
    }
    return false;
  };

  if (!newDirection(1)) throw new Error('internal: Lanczos could not find a start vector');
  let ritz: { values: Float64Array; vectors: Float64Array } | null = null;
  let order: number[] = [];
  const firstCheck = Math.min(maxSteps, wanted + 2);
  for (let j = 0; j < maxSteps; j++) {
    const q = basis[j]!;
    const w = bandedLdltSolve(factor, massBasis[j]!.slice());
    orthogonalise(w, rigid, massRigid);
    const a = dot(massBasis[j]!, w);
    alpha.push(a);
    for (let i = 0; i < n; i++) w[i]! -= a * q[i]!;
    if (j > 0) {
      const previous = basis[j - 1]!;
      const b = beta[j - 1]!;
      for (let i = 0; i < n; i++) w[i]! -= b * previous[i]!;
    }
    // Full re-orthogonalisation, a second pass only when the first cancelled most of w
    // (Daniel, Gragg, Kaufman & Stewart, Math. Comp. 30 (1976) 772: "twice is enough").
    const before = Math.sqrt(dot(w, w));
    orthogonalise(w, basis, massBasis);
    if (Math.sqrt(dot(w, w)) < 0.7071 * before) {
      orthogonalise(w, rigid, massRigid);
      orthogonalise(w, basis, massBasis);
    }
    const mw = bandedMultiply(mass, w);
    const b = Math.sqrt(Math.max(dot(w, mw), 0));
    const steps = j + 1;
    const exhausted = steps >= maxSteps;
    if ((steps >= firstCheck && (steps - firstCheck) % 2 === 0) || exhausted) {
      ritz = tridiagonalEigen(alpha, beta, true);
      order = Array.from(ritz.values.keys()).sort((x, y) => ritz!.values[y]! - ritz!.values[x]!);
      if (options.upTo !== undefined) {
        // Ritz values ν = 1/(λ − σ), largest first: count those with λ ≤ upTo, plus one.
        const bound = 1 / (options.upTo - sigma);
        let below = 0;
        while (below < order.length && ritz.values[order[below]!]! >= bound) below++;
        wanted = Math.max(minimum, Math.min(below + 1, available));
      }
      if (exhausted) wanted = Math.min(wanted, steps);
      // Ritz pairs are trusted only once the Krylov space is larger than the set wanted.
      let converged = wanted < steps || exhausted;
      for (let k = 0; converged && k < wanted; k++) {
        const index = order[k]!;
        const lastComponent = ritz.vectors[index]!;
        if (Math.abs(b * lastComponent) > tolerance * Math.abs(ritz.values[index]!)) {
          converged = false;
          break;
        }
      }
      if (converged || exhausted) break;
    }
    if (b <= 1e-12 * Math.abs(a)) {
      // Invariant subspace found: continue from a fresh direction orthogonal to everything so far.
      beta.push(0);
      if (!newDirection(j + 2)) break;
      continue;
    }
    beta.push(b);
    for (let i = 0; i < n; i++) {
      w[i]! /= b;
      mw[i]! /= b;
    }
    basis.push(w);
    massBasis.push(mw);
  }
  if (!ritz) throw new Error('internal: Lanczos produced no Ritz values');
  const steps = alpha.length;
  ritz = tridiagonalEigen(alpha, beta.slice(0, steps - 1));
  order = Array.from(ritz.values.keys()).sort((x, y) => ritz!.values[y]! - ritz!.values[x]!);
  const eigenvalues = new Float64Array(wanted);
  const vectors: Float64Array[] = [];
  for (let k = 0; k < wanted; k++) {
    const index = order[k]!;
    eigenvalues[k] = sigma + 1 / ritz.values[index]!;
    const x = new Float64Array(n);
    for (let s = 0; s < steps; s++) {
      const coefficient = ritz.vectors[s * steps + index]!;
      const q = basis[s]!;
      for (let i = 0; i < n; i++) x[i]! += coefficient * q[i]!;
    }
    vectors.push(x);
  }
  return { eigenvalues, vectors, steps };
}
