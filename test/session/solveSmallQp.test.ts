// The interior-point QP behind the cut planner, against closed forms and the KKT conditions
// (Nocedal & Wright, Numerical Optimization, 2nd ed., theorem 16.4: for a convex QP they are
// necessary and sufficient for the minimum).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { solveSmallQp } from '../../src/session/solveSmallQp.ts';

/** Tolerance on KKT residuals: the method stops at relative residuals of 1e-10. */
const kktTolerance = 1e-6;

describe('solveSmallQp', () => {
  it('projects onto the positive orthant: min ½|x − c|² subject to x ≥ 0 gives max(c, 0) (closed form)', () => {
    const c = [1.5, -2, 0.25, -0.1];
    const result = solveSmallQp({ hessian: c.map((_, i) => c.map((_, j) => (i === j ? 1 : 0))), linear: c, rows: c.map((_, i) => c.map((_, j) => (i === j ? 1 : 0))), bounds: c.map(() => 0) });
    expect(result.converged).toBe(true);
    result.x.forEach((x, i) => expect(x).toBeCloseTo(Math.max(c[i]!, 0), 8));
    expect(result.active.sort()).toEqual([1, 3]);
  });

  it('is unmoved by duplicated constraints (which defeat active-set solvers)', () => {
    const base = { hessian: [[2, 0.5], [0.5, 1]], linear: [3, 2] };
    const rows = [[1, 0], [0, 1], [-1, -1]];
    const bounds = [0, 0, -1];
    const once = solveSmallQp({ ...base, rows, bounds });
    const many = solveSmallQp({ ...base, rows: [...rows, ...rows, ...rows, [-2, -2]], bounds: [...bounds, ...bounds, ...bounds, -2] });
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
        const { x, multipliers, converged } = solveSmallQp({ hessian, linear, rows, bounds });
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
