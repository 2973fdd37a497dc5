import { describe, expect, it } from 'vitest';
import { assembleBending, bendingRigidModes } from '../../src/fe/assembleBending.ts';
import { assembleTorsion, torsionRigidMode } from '../../src/fe/assembleTorsion.ts';
import { buildMesh } from '../../src/fe/buildMesh.ts';
import { bandedMultiply, bandedToDense, type BandedMatrix } from '../../src/eigen/BandedMatrix.ts';
import { lowestModes } from '../../src/eigen/lowestModes.ts';
import { denseGeneralizedEigen } from '../reference/denseGeneralizedEigen.ts';
import { beamLineOf, practiceBar, workedExampleBar } from './referenceBars.ts';

function dot(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let sum = 0;
  for (let i = 0; i < a.length; i++) sum += a[i]! * b[i]!;
  return sum;
}

/**
 * The banded shift-invert Lanczos solver against the dense textbook route (Cholesky, Householder,
 * implicit QL: test/reference/denseGeneralizedEigen.ts) on the same K and M (bandedToDense).
 * The dense route returns every eigenpair, the rigid-body ones (λ ≈ 0) first.
 */
function compare(stiffness: BandedMatrix, mass: BandedMatrix, rigidModes: Float64Array[], count: number) {
  const dense = denseGeneralizedEigen(bandedToDense(stiffness), bandedToDense(mass));
  const rigid = rigidModes.length;
  const firstFlexible = dense.values[rigid]!;
  const banded = lowestModes(stiffness, mass, count, { shift: -0.5 * firstFlexible, rigidModes });
  return { dense, banded, rigid, firstFlexible };
}

const cases = [
  { name: 'uniform bar, Timoshenko, 4 elements', stiffnessAndMass: () => bending(workedExampleBar, 4, 'timoshenko') },
  { name: 'uniform bar, Euler–Bernoulli, 6 elements', stiffnessAndMass: () => bending(workedExampleBar, 6, 'euler-bernoulli') },
  { name: 'practice bar, Timoshenko, 6 elements', stiffnessAndMass: () => bending(practiceBar, 6, 'timoshenko') },
  { name: 'practice bar, Euler–Bernoulli, 12 elements', stiffnessAndMass: () => bending(practiceBar, 12, 'euler-bernoulli') },
  { name: 'practice bar, torsion, 12 elements', stiffnessAndMass: () => torsion(practiceBar, 12) },
];

function bending(bar: typeof practiceBar, elements: number, theory: 'timoshenko' | 'euler-bernoulli') {
  const line = beamLineOf(bar);
  const system = assembleBending(buildMesh(line.profile, elements), line, theory);
  return { stiffness: system.stiffness, mass: system.mass, rigidModes: bendingRigidModes(system) };
}

function torsion(bar: typeof practiceBar, elements: number) {
  const line = beamLineOf(bar, 'torsion');
  const system = assembleTorsion(buildMesh(line.profile, elements), line);
  return { stiffness: system.stiffness, mass: system.mass, rigidModes: [torsionRigidMode(system.stiffness.size)] };
}

describe('banded Lanczos eigensolver against the dense reference', () => {
  for (const { name, stiffnessAndMass } of cases) {
    it(`${name}: same eigenvalues and eigenvectors, rigid-body modes excluded`, () => {
      const { stiffness, mass, rigidModes } = stiffnessAndMass();
      const count = 6;
      const { dense, banded, rigid, firstFlexible } = compare(stiffness, mass, rigidModes, count);
      // The dense route sees the rigid-body modes as (numerically) zero eigenvalues: relative to
      // the first flexible one below 1e-8 (rounding of K's large entries; measured ≤ 1.2e-10).
      for (let k = 0; k < rigid; k++) expect(Math.abs(dense.values[k]!)).toBeLessThan(1e-8 * firstFlexible);
      expect(banded.eigenvalues).toHaveLength(count);
      for (let k = 0; k < count; k++) {
        // Eigenvalues: tolerance 1e-9 relative (Lanczos stops at a 1e-10 relative residual; the
        // eigenvalue error is of the order of the residual squared over the gap, the dense route
        // is backward stable to ~1e-13 here).
        const expected = dense.values[rigid + k]!;
        expect(Math.abs(banded.eigenvalues[k]! / expected - 1)).toBeLessThan(1e-9);
        // Eigenvectors: both M-normalised, so |x_bandedᵀ M x_dense| = 1 for the same mode (sign
        // free). Tolerance 1e-6: the angle between the two is residual/gap ≈ 1e-10/(relative gap
        // ≥ 0.1) for these well-separated modes, with margin for the dense route.
        const x = banded.vectors[k]!;
        const mx = bandedMultiply(mass, x);
        expect(Math.abs(Math.abs(dot(dense.vectors[rigid + k]!, mx)) - 1)).toBeLessThan(1e-6);
        // M-orthonormal among themselves (tolerance 1e-10: full re-orthogonalisation) and
        // M-orthogonal to the rigid-body modes (normalised; tolerance 1e-10).
        for (let l = 0; l <= k; l++) expect(Math.abs(dot(banded.vectors[l]!, mx) - (l === k ? 1 : 0))).toBeLessThan(1e-10);
        for (const mode of rigidModes) {
          const norm = Math.sqrt(dot(mode, bandedMultiply(mass, mode)));
          expect(Math.abs(dot(mode, mx)) / norm).toBeLessThan(1e-10);
        }
        // (No check of ‖Kx − λMx‖ itself: the solver stops on the residual of the shift-inverted
        // operator, which maps to an original residual up to λ_max/λ larger while the eigenpair
        // is as accurate as the two checks above show.)
      }
    });
  }

  it('returns every flexible mode of a tiny mesh when asked for more than exist', () => {
    // A 1-element Euler–Bernoulli bar has 4 dofs, 2 rigid-body modes, so 2 flexible modes; the
    // dense route gives them exactly (tolerance 1e-9 relative).
    const { stiffness, mass, rigidModes } = bending(workedExampleBar, 1, 'euler-bernoulli');
    const { dense, banded } = compare(stiffness, mass, rigidModes, 5);
    expect(banded.eigenvalues).toHaveLength(2);
    banded.eigenvalues.forEach((value, k) => expect(Math.abs(value / dense.values[2 + k]! - 1)).toBeLessThan(1e-9));
  });
});
