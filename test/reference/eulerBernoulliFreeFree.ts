import { brentRoot } from './brentRoot.ts';
import { scanForRoots } from './scanForRoots.ts';

/**
 * The first `count` roots βL of the free–free Euler–Bernoulli frequency equation
 * cos βL · cosh βL = 1 (excluding the double root at 0 of the rigid-body modes), found by a
 * scan and Brent refinement of the scaled form cos x − 1/cosh x (same roots, no overflow).
 * Closed-form frequency equation: R. D. Blevins, *Formulas for Natural Frequency and Mode
 * Shape* (1979), table 8-1.
 */
export function eulerBernoulliFreeFreeRoots(count: number): number[] {
  return scanForRoots((x) => Math.cos(x) - 1 / Math.cosh(x), {
    start: 1,
    step: 0.25,
    end: 10 + 4 * count,
    count,
  });
}

/**
 * Free–free Euler–Bernoulli mode shape n (1-based) of a uniform bar at position ξ = x/L:
 * φ(ξ) = cosh βξ + cos βξ − σ (sinh βξ + sin βξ), σ = (cosh β − cos β)/(sinh β − sin β),
 * with β = β_n L (Blevins 1979, table 8-1). Direct evaluation: fine for the first modes (the
 * cancellation of cosh and σ sinh costs about e^{βξ}·ε, ~1e-12 at β = 11).
 */
function eulerBernoulliFreeFreeShape(rootBetaL: number, position: number): number {
  const beta = rootBetaL;
  const sigma = (Math.cosh(beta) - Math.cos(beta)) / (Math.sinh(beta) - Math.sin(beta));
  const z = beta * position;
  return Math.cosh(z) + Math.cos(z) - sigma * (Math.sinh(z) + Math.sin(z));
}

/**
 * Node positions x/L (zeros of the mode shape inside (0, 1)) of free–free Euler–Bernoulli mode
 * n, a mode with n + 1 nodes. Scan on a fine grid, Brent refinement to 1e-13.
 */
export function eulerBernoulliFreeFreeNodes(mode: number): number[] {
  const beta = eulerBernoulliFreeFreeRoots(mode)[mode - 1]!;
  const shape = (position: number): number => eulerBernoulliFreeFreeShape(beta, position);
  const nodes: number[] = [];
  const steps = 400 * (mode + 1);
  let left = 0;
  let valueLeft = shape(left);
  for (let index = 1; index <= steps; index++) {
    const right = index / steps;
    const valueRight = shape(right);
    if (Math.sign(valueLeft) !== Math.sign(valueRight)) {
      nodes.push(brentRoot(shape, left, right, { absoluteTolerance: 1e-13, valueAtA: valueLeft, valueAtB: valueRight }));
    }
    left = right;
    valueLeft = valueRight;
  }
  return nodes;
}
