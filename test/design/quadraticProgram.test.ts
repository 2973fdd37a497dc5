import numeric from 'numeric';
import { describe, expect, it } from 'vitest';
import { solveQuadraticProgram, type QuadraticProgram } from '../../src/design/quadraticProgram.ts';

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

describe('solveQuadraticProgram (primal active set)', () => {
  it('projects onto a half-plane (closed form)', () => {
    // min ½‖x − (1, 2)‖² s.t. x + y ≤ 1: the projection (0, 1) (closed form: move along the normal).
    const x = solveQuadraticProgram({ size: 2, hessian: Float64Array.of(1, 0, 0, 1), gradient: Float64Array.of(-1, -2), constraintCount: 1, constraints: Float64Array.of(-1, -1), lowerBounds: Float64Array.of(-1) })!;
    expect(x[0]).toBeCloseTo(0, 12);
    expect(x[1]).toBeCloseTo(1, 12);
  });
  it('returns the unconstrained minimiser when no constraint binds', () => {
    const x = solveQuadraticProgram({ size: 2, hessian: Float64Array.of(2, 0, 0, 4), gradient: Float64Array.of(-2, -4), constraintCount: 1, constraints: Float64Array.of(1, 0), lowerBounds: Float64Array.of(-10) })!;
    expect(x[0]).toBeCloseTo(1, 14);
    expect(x[1]).toBeCloseTo(1, 14);
  });
  it('refuses a Hessian that is not positive definite', () => {
    expect(solveQuadraticProgram({ size: 1, hessian: Float64Array.of(-1), gradient: Float64Array.of(0), constraintCount: 0, constraints: new Float64Array(0), lowerBounds: new Float64Array(0) })).toBeNull();
  });
  it('meets the KKT conditions and never does worse than numeric.solveQP (reference library) on random programs', () => {
    const random = generator(12345);
    let compared = 0;
    for (let trial = 0; trial < 150; trial++) {
      const n = 2 + (trial % 7);
      const m = 3 + (trial % 13);
      const program = randomProgram(random, n, m);
      const x = solveQuadraticProgram(program)!;
      expect(worstViolation(program, x)).toBeLessThan(1e-10);
      // Stationarity with non-negative multipliers on the active constraints (coordinate descent
      // on ‖Hx + g − A_actᵀλ‖², λ ≥ 0), tolerance 1e-6 for that inner iteration.
      const c = Array.from({ length: n }, (_, i) => {
        let s = program.gradient[i]!;
        for (let j = 0; j < n; j++) s += program.hessian[i * n + j]! * x[j]!;
        return s;
      });
      const active: number[] = [];
      for (let k = 0; k < m; k++) {
        let s = 0;
        for (let i = 0; i < n; i++) s += program.constraints[k * n + i]! * x[i]!;
        if (Math.abs(s - program.lowerBounds[k]!) < 1e-9) active.push(k);
      }
      const lambda = new Float64Array(active.length);
      for (let sweep = 0; sweep < 5000; sweep++) {
        for (let r = 0; r < active.length; r++) {
          let numerator = 0;
          let denominator = 0;
          for (let i = 0; i < n; i++) {
            let residual = c[i]!;
            for (let q = 0; q < active.length; q++) residual -= program.constraints[active[q]! * n + i]! * lambda[q]!;
            const a = program.constraints[active[r]! * n + i]!;
            numerator += a * (residual + a * lambda[r]!);
            denominator += a * a;
          }
          lambda[r] = Math.max(0, numerator / denominator);
        }
      }
      for (let i = 0; i < n; i++) {
        let residual = c[i]!;
        for (let q = 0; q < active.length; q++) residual -= program.constraints[active[q]! * n + i]! * lambda[q]!;
        expect(Math.abs(residual)).toBeLessThan(1e-6);
      }
      // numeric 1.2.6's solveQP (Goldfarb–Idnani) as the reference where it reports success.
      const D = Array.from({ length: n }, (_, i) => Array.from(program.hessian.subarray(i * n, i * n + n)));
      const A = Array.from({ length: n }, (_, i) => Array.from({ length: m }, (_, k) => program.constraints[k * n + i]!));
      const reference = numeric.solveQP(D, Array.from(program.gradient, (v) => -v), A, Array.from(program.lowerBounds), 0);
      if (reference.message === '' && worstViolation(program, reference.solution as number[]) < 1e-9) {
        compared++;
        expect(objective(program, x)).toBeLessThanOrEqual(objective(program, reference.solution as number[]) + 1e-9);
      }
    }
    expect(compared).toBeGreaterThan(100);
  });
});
