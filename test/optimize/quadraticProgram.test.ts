import numeric from 'numeric';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { solveQuadraticProgram, type QuadraticProgram } from '../../src/optimize/index.ts';

function objective(p: QuadraticProgram, x: ArrayLike<number>): number {
  const n = p.size;
  let value = 0;
  for (let i = 0; i < n; i++) {
    value += p.gradient[i]! * x[i]!;
    for (let j = 0; j < n; j++) value += 0.5 * x[i]! * p.hessian[i * n + j]! * x[j]!;
  }
  return value;
}
function worstViolation(p: QuadraticProgram, x: ArrayLike<number>): number {
  let worst = 0;
  for (let c = 0; c < p.constraintCount; c++) {
    let value = 0;
    for (let i = 0; i < p.size; i++) value += p.constraints[c * p.size + i]! * x[i]!;
    worst = Math.max(worst, p.lowerBounds[c]! - value);
  }
  return worst;
}

/** Park–Miller minimal standard generator: repeatable random programs. */
function generator(seed: number): () => number {
  let state = seed;
  return () => {
    state = (state * 16807) % 2147483647;
    return state / 2147483647 - 0.5;
  };
}

function randomProgram(random: () => number, n: number, m: number): QuadraticProgram {
  const factor = Array.from({ length: n * n }, random);
  const hessian = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    let s = i === j ? 0.3 : 0;
    for (let k = 0; k < n; k++) s += factor[i * n + k]! * factor[j * n + k]!;
    hessian[i * n + j] = s;
  }
  return {
    size: n,
    hessian,
    gradient: Float64Array.from({ length: n }, () => 3 * random()),
    constraintCount: m,
    constraints: Float64Array.from({ length: m * n }, random),
    // x = 0 feasible, as every program the designer builds.
    lowerBounds: Float64Array.from({ length: m }, () => -Math.abs(random())),
  };
}

/** The solution's x, requiring convergence. */
function solved(program: QuadraticProgram): Float64Array {
  const solution = solveQuadraticProgram(program);
  expect(solution.converged).toBe(true);
  return solution.x;
}

/** A program in nested-array form (objective ½xᵀHx − dᵀx, rows·x ≥ bounds), flattened. */
function program(hessian: number[][], linear: number[], rows: number[][], bounds: number[]): QuadraticProgram {
  return {
    size: linear.length,
    hessian: Float64Array.from(hessian.flat()),
    gradient: Float64Array.from(linear, (v) => -v),
    constraintCount: rows.length,
    constraints: Float64Array.from(rows.flat()),
    lowerBounds: Float64Array.from(bounds),
  };
}

/** Tolerance on KKT residuals: the working-set solves are exact to rounding; 1e-6 leaves room for H's conditioning. */
const kktTolerance = 1e-6;

describe('solveQuadraticProgram (primal active set)', () => {
  it('projects onto a half-plane (closed form)', () => {
    // min ½‖x − (1, 2)‖² s.t. x + y ≤ 1: the projection (0, 1) (closed form: move along the normal).
    const x = solved({ size: 2, hessian: Float64Array.of(1, 0, 0, 1), gradient: Float64Array.of(-1, -2), constraintCount: 1, constraints: Float64Array.of(-1, -1), lowerBounds: Float64Array.of(-1) });
    // The working-set solution is exact to rounding.
    expect(x[0]).toBeCloseTo(0, 8);
    expect(x[1]).toBeCloseTo(1, 8);
  });
  it('returns the unconstrained minimiser when no constraint binds', () => {
    const x = solved({ size: 2, hessian: Float64Array.of(2, 0, 0, 4), gradient: Float64Array.of(-2, -4), constraintCount: 1, constraints: Float64Array.of(1, 0), lowerBounds: Float64Array.of(-10) });
    expect(x[0]).toBeCloseTo(1, 8);
    expect(x[1]).toBeCloseTo(1, 8);
  });
  it('refuses a Hessian that is not positive definite', () => {
    expect(solveQuadraticProgram({ size: 1, hessian: Float64Array.of(-1), gradient: Float64Array.of(0), constraintCount: 0, constraints: new Float64Array(0), lowerBounds: new Float64Array(0) }).converged).toBe(false);
  });
  it('meets the KKT conditions and never does worse than numeric.solveQP (reference library) on random programs', () => {
    const random = generator(12345);
    let compared = 0;
    for (let trial = 0; trial < 150; trial++) {
      const n = 2 + (trial % 7);
      const m = 3 + (trial % 13);
      const program = randomProgram(random, n, m);
      const x = solved(program);
      expect(worstViolation(program, x)).toBeLessThan(1e-9);
      // KKT certificate (Nocedal & Wright theorem 16.4) with the returned multipliers:
      // stationarity Hx + g − Aᵀλ = 0, λ ≥ 0, complementarity λ·slack = 0; tolerance from the
      // method's stopping rule (1e-10 relative) with room for the conditioning of H.
      const { multipliers } = solveQuadraticProgram(program);
      for (let i = 0; i < n; i++) {
        let residual = program.gradient[i]!;
        for (let j = 0; j < n; j++) residual += program.hessian[i * n + j]! * x[j]!;
        for (let k = 0; k < m; k++) residual -= program.constraints[k * n + i]! * multipliers[k]!;
        expect(Math.abs(residual)).toBeLessThan(kktTolerance);
      }
      for (let k = 0; k < m; k++) {
        let slack = -program.lowerBounds[k]!;
        for (let i = 0; i < n; i++) slack += program.constraints[k * n + i]! * x[i]!;
        expect(multipliers[k]!).toBeGreaterThanOrEqual(0);
        expect(Math.abs(multipliers[k]! * slack)).toBeLessThan(kktTolerance);
      }
      // numeric 1.2.6's solveQP (Goldfarb–Idnani) as the reference where it reports success.
      const D = Array.from({ length: n }, (_, i) => Array.from(program.hessian.subarray(i * n, i * n + n)));
      const A = Array.from({ length: n }, (_, i) => Array.from({ length: m }, (_, k) => program.constraints[k * n + i]!));
      const reference = numeric.solveQP(D, Array.from(program.gradient, (v) => -v), A, Array.from(program.lowerBounds), 0);
      if (reference.message === '' && worstViolation(program, reference.solution as number[]) < 1e-9) {
        compared++;
        expect(objective(program, x)).toBeLessThanOrEqual(objective(program, reference.solution as number[]) + 1e-8);
      }
    }
    expect(compared).toBeGreaterThan(100);
  });
});

// Closed forms and the KKT conditions (Nocedal & Wright, Numerical Optimization, 2nd ed., theorem
// 16.4: for a convex QP they are necessary and sufficient for the minimum).
describe('solveQuadraticProgram: the cut planner\'s cases', () => {
  it('projects onto the positive orthant: min ½|x − c|² subject to x ≥ 0 gives max(c, 0) (closed form)', () => {
    const c = [1.5, -2, 0.25, -0.1];
    const result = solveQuadraticProgram(program(c.map((_, i) => c.map((_, j) => (i === j ? 1 : 0))), c, c.map((_, i) => c.map((_, j) => (i === j ? 1 : 0))), c.map(() => 0)));
    expect(result.converged).toBe(true);
    result.x.forEach((x, i) => expect(x).toBeCloseTo(Math.max(c[i]!, 0), 8));
    expect(result.active.sort()).toEqual([1, 3]);
  });

  it('is unmoved by duplicated constraints (the newest dependent working row is dropped)', () => {
    const base = { hessian: [[2, 0.5], [0.5, 1]], linear: [3, 2] };
    const rows = [[1, 0], [0, 1], [-1, -1]];
    const bounds = [0, 0, -1];
    const once = solveQuadraticProgram(program(base.hessian, base.linear, rows, bounds));
    const many = solveQuadraticProgram(program(base.hessian, base.linear, [...rows, ...rows, ...rows, [-2, -2]], [...bounds, ...bounds, ...bounds, -2]));
    expect(many.converged).toBe(true);
    many.x.forEach((x, i) => expect(x).toBeCloseTo(once.x[i]!, 7));
    expect(once.x[0]! + once.x[1]!).toBeCloseTo(1, 8);
  });

  it('meets the KKT conditions on random convex problems (property)', () => {
    const dimension = 3;
    const matrix = fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: dimension * dimension, maxLength: dimension * dimension });
    const row = fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: dimension, maxLength: dimension });
    fc.assert(
      fc.property(matrix, fc.array(fc.double({ min: -5, max: 5, noNaN: true }), { minLength: dimension, maxLength: dimension }), fc.array(row, { minLength: 1, maxLength: 6 }), (entries, linear, extra) => {
        // H = BᵀB + I (positive definite); constraints x ≥ 0 plus random rows with x = 0 feasible.
        const hessian = Array.from({ length: dimension }, (_, i) => Array.from({ length: dimension }, (_, j) => entries.reduce((sum, _, k) => (k % dimension === 0 ? sum + entries[k + i]! * entries[k + j]! : sum), 0) + (i === j ? 1 : 0)));
        const rows = [...Array.from({ length: dimension }, (_, i) => Array.from({ length: dimension }, (_, j) => (i === j ? 1 : 0))), ...extra];
        const bounds = rows.map((_, i) => (i < dimension ? 0 : -1));
        const { x, multipliers, converged } = solveQuadraticProgram(program(hessian, linear, rows, bounds));
        expect(converged).toBe(true);
        rows.forEach((r, i) => {
          const slack = r.reduce((s, a, j) => s + a * x[j]!, 0) - bounds[i]!;
          expect(slack).toBeGreaterThan(-kktTolerance);
          expect(multipliers[i]!).toBeGreaterThanOrEqual(0);
          expect(Math.abs(multipliers[i]! * slack)).toBeLessThan(kktTolerance);
        });
        for (let j = 0; j < dimension; j++) {
          const stationarity = hessian[j]!.reduce((s, h, k) => s + h * x[k]!, 0) - linear[j]! - rows.reduce((s, r, i) => s + r[j]! * multipliers[i]!, 0);
          expect(Math.abs(stationarity)).toBeLessThan(kktTolerance);
        }
      }),
      { numRuns: 200 },
    );
  });
});

describe('solveQuadraticProgram: starts', () => {
  it('solves from an infeasible start (the interior-point fallback): the projection of (1, 2) onto x + y ≤ 1 is (0, 1) (closed form)', () => {
    const result = solveQuadraticProgram({ size: 2, hessian: Float64Array.of(1, 0, 0, 1), gradient: Float64Array.of(-1, -2), constraintCount: 1, constraints: Float64Array.of(-1, -1), lowerBounds: Float64Array.of(-1), start: Float64Array.of(5, 5) });
    expect(result.converged).toBe(true);
    // Interior-point stopping rule: complementarity 1e-10 relative, so about 5 digits in x.
    expect(result.x[0]).toBeCloseTo(0, 4);
    expect(result.x[1]).toBeCloseTo(1, 4);
  });
  it('takes a feasible start and reaches the same optimum', () => {
    const result = solveQuadraticProgram({ size: 2, hessian: Float64Array.of(1, 0, 0, 1), gradient: Float64Array.of(-1, -2), constraintCount: 1, constraints: Float64Array.of(-1, -1), lowerBounds: Float64Array.of(-1), start: Float64Array.of(-3, 0.5) });
    expect(result.status).toBe('optimal');
    expect(result.x[0]).toBeCloseTo(0, 10);
    expect(result.x[1]).toBeCloseTo(1, 10);
  });
});
