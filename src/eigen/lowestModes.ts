import type { BandedMatrix } from './BandedMatrix.ts';
import { bandedEigenproblem, type GeneralizedEigenproblem } from './GeneralizedEigenproblem.ts';
import { VectorStore } from './VectorStore.ts';
import { tridiagonalEigen, tridiagonalEigenvector } from './tridiagonalEigen.ts';

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
   * Also return every eigenpair with λ ≤ upTo: the count grows as needed, in one Lanczos run. The
   * run ends only once the next Ritz value lies beyond upTo by more than its residual bound, so
   * the range is covered; that next pair is not returned (unless needed to make up `count`).
   */
  upTo?: number;
  /**
   * Relative residual at which a Ritz pair counts as converged (default 1e-7: eigenvalue error
   * ≈ residual²·ν/gap, about 1e-14 relative on bar spectra; vectors to about 1e-7, enough for
   * sensitivities in an optimiser).
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
  return lowestModesOf(bandedEigenproblem(stiffness, mass), count, options);
}

/**
 * lowestModes on any storage behind the GeneralizedEigenproblem interface (banded for beam
 * lines, envelope for the solid bar): the one Lanczos of the project. Cost per step: one solve
 * with K − σM and one multiply by M, plus re-orthogonalisation O(n·steps).
 */
export function lowestModesOf(problem: GeneralizedEigenproblem, count: number, options: LowestModesOptions): Eigenpairs {
  const n = problem.size;
  const multiplyMass = (x: Float64Array, out: Float64Array<ArrayBuffer>): Float64Array => problem.multiplyMass(x, out);
  const tolerance = options.tolerance ?? 1e-7;
  const sigma = options.shift;
  // M-orthonormal rigid-body basis (modified Gram–Schmidt in the M inner product).
  const rigidModes = options.rigidModes ?? [];
  const rigidStore = new VectorStore(n, Math.max(1, 2 * rigidModes.length));
  const rigid: Float64Array[] = [];
  const massRigid: Float64Array[] = [];
  for (const mode of rigidModes) {
    const v = rigidStore.take();
    v.set(mode);
    for (let pass = 0; pass < 2; pass++) orthogonalise(v, rigid, massRigid);
    const mv = multiplyMass(v, rigidStore.take());
    const norm = Math.sqrt(dot(v, mv));
    if (!(norm > 0)) continue;
    const inverse = 1 / norm;
    for (let i = 0; i < n; i++) {
      v[i]! *= inverse;
      mv[i]! *= inverse;
    }
    rigid.push(v);
    massRigid.push(mv);
  }
  const available = n - rigid.length;
  const minimum = Math.min(count, available);
  let wanted = minimum;
  if (wanted <= 0) return { eigenvalues: new Float64Array(0), vectors: [], steps: 0 };

  const solveShifted = problem.factorShifted(sigma);
  const store = new VectorStore(n, 32);
  const basis: Float64Array[] = [];
  const massBasis: Float64Array[] = [];
  const alpha: number[] = [];
  const beta: number[] = [];
  const maxSteps = available;

  const newDirection = (seed: number): boolean => {
    for (let attempt = 0; attempt < 5; attempt++) {
      const v = store.take();
      v.set(startVector(n, seed + attempt * 7919));
      for (let pass = 0; pass < 2; pass++) {
        orthogonalise(v, rigid, massRigid);
        orthogonalise(v, basis, massBasis);
      }
      const mv = multiplyMass(v, store.take());
      const norm = Math.sqrt(dot(v, mv));
      if (norm > 1e-8) {
        const inverse = 1 / norm;
        for (let i = 0; i < n; i++) {
          v[i]! *= inverse;
          mv[i]! *= inverse;
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
  let ritzSteps = 0;
  let order: number[] = [];
  // Convergence is tested at `nextCheck` steps: first once the Krylov space is twice the set
  // wanted plus two (shift-invert needs 2.5–3.3 steps per converged pair on bar spectra:
  // measured 10 steps for 4 vertical modes, 13 for 4 torsion modes), then
  // after as many further steps as pairs were still unconverged (at least two), so the small
  // tridiagonal eigenproblem stays cheap beside the Lanczos steps themselves.
  let nextCheck = Math.min(maxSteps, 2 * wanted + 2);
  for (let j = 0; j < maxSteps; j++) {
    // w and Mw join the basis only if the step continues.
    const w = store.take();
    const q = basis[j]!;
    w.set(massBasis[j]!);
    solveShifted(w);
    // α = (Mq_j)ᵀw (rigid components of w do not change it: q_j is M-orthogonal to them), then
    // the three-term recurrence w ← w − α q_j − β q_{j−1}, fused with ‖w‖² for the test below.
    const a = dot(massBasis[j]!, w);
    alpha.push(a);
    let normSquared = 0;
    if (j > 0) {
      const previous = basis[j - 1]!;
      const b = beta[j - 1]!;
      for (let i = 0; i < n; i++) {
        const value = w[i]! - a * q[i]! - b * previous[i]!;
        w[i] = value;
        normSquared += value * value;
      }
    } else {
      for (let i = 0; i < n; i++) {
        const value = w[i]! - a * q[i]!;
        w[i] = value;
        normSquared += value * value;
      }
    }
    // Full re-orthogonalisation against the rigid modes and the basis, a second pass only when
    // the first cancelled most of w (Daniel, Gragg, Kaufman & Stewart, Math. Comp. 30 (1976)
    // 772: "twice is enough").
    orthogonalise(w, rigid, massRigid);
    orthogonalise(w, basis, massBasis);
    if (dot(w, w) < 0.5 * normSquared) {
      orthogonalise(w, rigid, massRigid);
      orthogonalise(w, basis, massBasis);
    }
    const mw = multiplyMass(w, store.take());
    const b = Math.sqrt(Math.max(dot(w, mw), 0));
    const steps = j + 1;
    const exhausted = steps >= maxSteps;
    if (steps >= nextCheck || exhausted) {
      ritz = tridiagonalEigen(alpha, beta, true);
      ritzSteps = steps;
      order = Array.from(ritz.values.keys()).sort((x, y) => ritz!.values[y]! - ritz!.values[x]!);
      // Residual bound of Ritz pair k (largest first): |ν − θ| ≤ |β_j·s_jk| (Parlett, ch. 13).
      const residual = (k: number): number => Math.abs(b * ritz!.vectors[order[k]!]!);
      let covered = true;
      if (options.upTo !== undefined) {
        // Ritz values ν = 1/(λ − σ), largest first: count those with λ ≤ upTo; the next one must
        // stay below the bound in ν even at the far end of its residual interval.
        const bound = 1 / (options.upTo - sigma);
        let below = 0;
        while (below < order.length && ritz.values[order[below]!]! >= bound) below++;
        wanted = Math.max(minimum, Math.min(below, available));
        covered = below >= available || (below < order.length && ritz.values[order[below]!]! + residual(below) < bound);
      }
      if (exhausted) wanted = Math.min(wanted, steps);
      // Ritz pairs are trusted only once the Krylov space is larger than the set wanted.
      let unconverged = covered ? 0 : 1;
      for (let k = 0; k < wanted; k++) if (residual(k) > tolerance * Math.abs(ritz.values[order[k]!]!)) unconverged++;
      const converged = (wanted < steps || exhausted) && unconverged === 0;
      nextCheck = steps + Math.max(2, unconverged);
      if (converged || exhausted) break;
    }
    if (b <= 1e-12 * Math.abs(a)) {
      // Invariant subspace found: continue from a fresh direction orthogonal to everything so far.
      beta.push(0);
      if (!newDirection(j + 2)) break;
      continue;
    }
    beta.push(b);
    const inverse = 1 / b;
    for (let i = 0; i < n; i++) {
      w[i]! *= inverse;
      mw[i]! *= inverse;
    }
    basis.push(w);
    massBasis.push(mw);
  }
  if (!ritz) throw new Error('internal: Lanczos produced no Ritz values');
  const steps = alpha.length;
  const offDiagonal = beta.slice(0, steps - 1);
  // Ritz values ν = 1/(λ − σ), largest first; their vectors in the Krylov basis by inverse
  // iteration (O(steps) each), or from the full QL when two wanted values nearly coincide.
  const values = ritzSteps === steps ? ritz.values : tridiagonalEigen(alpha, offDiagonal, true).values;
  order = Array.from(values.keys()).sort((x, y) => values[y]! - values[x]!);
  let separated = true;
  for (let k = 0; k + 1 < Math.min(wanted + 1, steps); k++) {
    if (values[order[k]!]! - values[order[k + 1]!]! < 1e-8 * Math.abs(values[order[0]!]!)) separated = false;
  }
  const full = separated ? null : tridiagonalEigen(alpha, offDiagonal);
  const eigenvalues = new Float64Array(wanted);
  const vectors: Float64Array[] = [];
  for (let k = 0; k < wanted; k++) {
    const index = order[k]!;
    const value = full ? full.values[index]! : values[index]!;
    eigenvalues[k] = sigma + 1 / value;
    const coefficients = full ? Float64Array.from({ length: steps }, (_, s) => full.vectors[s * steps + index]!) : tridiagonalEigenvector(alpha, offDiagonal, value);
    const x = new Float64Array(n);
    for (let s = 0; s < steps; s++) {
      const coefficient = coefficients[s]!;
      const q = basis[s]!;
      for (let i = 0; i < n; i++) x[i]! += coefficient * q[i]!;
    }
    vectors.push(x);
  }
  return { eigenvalues, vectors, steps };
}
