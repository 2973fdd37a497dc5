import { describe, expect, it } from 'vitest';
import { solveBendingLine } from '../../src/modes/solveBending.ts';
import type { BeamTheory } from '../../src/fe/beamElementType.ts';
import { eulerBernoulliFreeFreeRoots } from '../reference/eulerBernoulliFreeFree.ts';
import { huangFreeFreeFrequencies } from '../reference/huangFreeFree.ts';
import type { RectangularBar } from '../reference/rectangularBarSection.ts';
import { beamLineOf, eulerBernoulliHz, practiceBar, shootingFrequencies, uniformBeamOf, workedExampleBar } from './referenceBars.ts';

/** Nodes splitting every profile interval of the bar into `pieces` equal elements (h ∝ 1/pieces). */
function refinedNodes(bar: RectangularBar, pieces: number): Float64Array {
  const nodes = [0];
  for (let k = 1; k < bar.profile.length; k++) {
    const [x0] = bar.profile[k - 1]!;
    const [x1] = bar.profile[k]!;
    for (let p = 1; p <= pieces; p++) nodes.push(x0 + ((x1 - x0) * p) / pieces);
  }
  return Float64Array.from(nodes);
}

/** Least-squares slope of ln(error) against ln(1/h): the observed convergence rate. */
function fittedRate(pieces: readonly number[], errors: readonly number[]): number {
  const x = pieces.map(Math.log);
  const y = errors.map(Math.log);
  const meanX = x.reduce((a, b) => a + b, 0) / x.length;
  const meanY = y.reduce((a, b) => a + b, 0) / y.length;
  let numerator = 0;
  let denominator = 0;
  x.forEach((xi, i) => {
    numerator += (xi - meanX) * (y[i]! - meanY);
    denominator += (xi - meanX) ** 2;
  });
  return -numerator / denominator;
}

/** Relative frequency errors of modes 1–4 on each refinement (all must be positive: upper bounds). */
function errorsByMode(bar: RectangularBar, theory: BeamTheory, pieces: readonly number[], exact: readonly number[]): number[][] {
  const line = beamLineOf(bar);
  const byMesh = pieces.map((p) => Array.from(solveBendingLine(line, refinedNodes(bar, p), theory, 4).frequencies, (hz, i) => hz / exact[i]! - 1));
  return exact.map((_, mode) => byMesh.map((errors) => errors[mode]!));
}

// Expected rates from the element theory (Strang & Fix, An Analysis of the Finite Element
// Method, §6.3: eigenvalue error O(h^{2(k+1−m)}) for degree-k elements and an energy with m-th
// derivatives): Hermite cubics for Euler–Bernoulli (k = 3, m = 2) → 4; the Timoshenko element
// with θ quartic and w quintic (energy in θ′ and w′ − θ, both of degree 3) → 8. The fitted slope
// over four meshes drifts from the asymptotic rate by the next term of the error expansion,
// O(h²) relative: bands ±0.25 for EB and ±0.5 for the uniform Timoshenko bar (its meshes are
// coarser because its errors reach rounding sooner); ±0.75 for the undercut Timoshenko bar, whose
// meshes must be coarser still (one to five elements per profile interval: measured slopes
// 7.4–7.6, still climbing towards 8). Every error stays above `floor`, well clear of the
// reference's own accuracy (Huang roots ~1e-14, shooting ~4e-12 relative).
const cases: { name: string; bar: RectangularBar; theory: BeamTheory; pieces: number[]; rate: number; band: number; floor?: number; exact: () => number[] }[] = [
  {
    name: 'uniform bar, Euler–Bernoulli, vs cos βL cosh βL = 1',
    bar: workedExampleBar, theory: 'euler-bernoulli', pieces: [12, 16, 24, 32], rate: 4, band: 0.25,
    exact: () => eulerBernoulliFreeFreeRoots(4).map((root) => eulerBernoulliHz(uniformBeamOf(workedExampleBar), root)),
  },
  {
    name: 'uniform bar, Timoshenko, vs the Huang equation',
    bar: workedExampleBar, theory: 'timoshenko', pieces: [6, 8, 10, 12], rate: 8, band: 0.5, floor: 5e-12,
    exact: () => huangFreeFreeFrequencies(uniformBeamOf(workedExampleBar), 4),
  },
  {
    name: 'practice bar, Euler–Bernoulli, vs shooting',
    bar: practiceBar, theory: 'euler-bernoulli', pieces: [4, 6, 8, 12], rate: 4, band: 0.25,
    exact: () => shootingFrequencies(practiceBar, 'euler-bernoulli', 4),
  },
  {
    name: 'practice bar, Timoshenko, vs shooting',
    bar: practiceBar, theory: 'timoshenko', pieces: [2, 3, 4, 5], rate: 8, band: 0.75, floor: 5e-11,
    exact: () => shootingFrequencies(practiceBar, 'timoshenko', 4),
  },
];

describe('mesh convergence rate of the bending elements', () => {
  for (const { name, bar, theory, pieces, rate, band, floor = 1e-10, exact } of cases) {
    it(`${name}: modes 1–4 converge at rate ${rate} ± ${band}`, () => {
      const errors = errorsByMode(bar, theory, pieces, exact());
      errors.forEach((series) => {
        for (const error of series) expect(error).toBeGreaterThan(floor);
        expect(Math.abs(fittedRate(pieces, series) - rate)).toBeLessThan(band);
      });
    });
  }
});
