// Element-level properties of the beam and torsion elements: symmetry, rigid-body modes,
// positive semi-definiteness, mass totals, exactness of the quadrature, law derivatives.
import { describe, expect, it } from 'vitest';
import {
  beamElement,
  bendingLaw,
  gaussLegendre,
  hermiteCubicElement,
  rectangleTorsionConstant,
  rectangleTorsionConstantDerivative,
  timoshenkoLagrangeElement,
  torsionElement,
  lagrangeTorsionElement,
  torsionElementType,
  torsionLaw,
  type BeamElementType,
  type Material,
  type Section,
} from '../../src/index.ts';

const wood: Material = { youngModulus: 18e9, shearModulus: 1.3e9, density: 1000, poisson: 0.37 };
const rect: Section = { shape: 'rect', width: 0.05, thickness: 0.022 };
const law = bendingLaw(rect, wood, 'vertical');

function quadratic(matrix: Float64Array, n: number, u: ArrayLike<number>): number {
  let sum = 0;
  for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) sum += u[a]! * matrix[a * n + b]! * u[b]!;
  return sum;
}

/** Nodal vector of a field w(x), θ(x) sampled at the element's dof positions. */
function nodalVector(type: BeamElementType, h: number, w: (x: number) => number, theta: (x: number) => number): Float64Array {
  return Float64Array.from({ length: type.localDofs }, (_, a) => (type.dofKind[a] === 0 ? w(type.dofPosition[a]! * h) : theta(type.dofPosition[a]! * h)));
}

const types: [string, BeamElementType][] = [
  ['Hermite cubic (Euler–Bernoulli)', hermiteCubicElement],
  ['Timoshenko p = 2', timoshenkoLagrangeElement(2)],
  ['Timoshenko p = 3', timoshenkoLagrangeElement(3)],
  ['Timoshenko p = 4 (the default element)', timoshenkoLagrangeElement(4)],
];

describe('Gauss–Legendre rule', () => {
  it('matches Abramowitz & Stegun table 25.4 (4 points on [−1, 1]) to 1e-15', () => {
    // A&S table 25.4, n = 4: ±0.339981043584856, ±0.861136311594053; weights 0.652145154862546, 0.347854845137454.
    const { points, weights } = gaussLegendre(4);
    const mapped = Array.from(points, (p) => 2 * p - 1);
    expect(mapped[2]).toBeCloseTo(0.339981043584856, 14);
    expect(mapped[3]).toBeCloseTo(0.861136311594053, 14);
    expect(2 * weights[2]!).toBeCloseTo(0.652145154862546, 14);
    expect(2 * weights[3]!).toBeCloseTo(0.347854845137454, 14);
  });
  it('integrates x^k exactly for k ≤ 2n − 1 and not for k = 2n (closed form 1/(k+1))', () => {
    for (const n of [3, 4, 5, 6]) {
      const { points, weights } = gaussLegendre(n);
      for (let k = 0; k <= 2 * n; k++) {
        const approximation = points.reduce((sum, x, i) => sum + weights[i]! * x ** k, 0);
        if (k <= 2 * n - 1) expect(Math.abs(approximation - 1 / (k + 1))).toBeLessThan(1e-14);
        else expect(Math.abs(approximation - 1 / (k + 1))).toBeGreaterThan(1e-12);
      }
    }
  });
});

describe.each(types)('%s element', (_name, type) => {
  const n = type.localDofs;
  const h = 0.012;
  const k = new Float64Array(n * n);
  const m = new Float64Array(n * n);
  beamElement(type, h, 0.02, 0.014, law, k, m);

  it('has symmetric stiffness and mass', () => {
    for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) {
      expect(k[a * n + b]).toBe(k[b * n + a]);
      expect(m[a * n + b]).toBe(m[b * n + a]);
    }
  });

  it('stores no energy in rigid translation and rotation (relative to ‖K‖, 1e-12: round-off)', () => {
    const scale = Math.max(...Array.from(k, Math.abs));
    const translation = nodalVector(type, h, () => 1, () => 0);
    const rotation = nodalVector(type, h, (x) => x, () => 1);
    for (const u of [translation, rotation]) {
      const ku = Array.from({ length: n }, (_, a) => Array.from({ length: n }, (_, b) => k[a * n + b]! * u[b]!).reduce((s, v) => s + v, 0));
      for (const value of ku) expect(Math.abs(value)).toBeLessThan(1e-12 * scale * h);
    }
  });

  it('has a positive mass for any non-zero motion and K ≥ 0 (random vectors)', () => {
    let seed = 7;
    for (let trial = 0; trial < 50; trial++) {
      const u = Float64Array.from({ length: n }, () => ((seed = (seed * 16807) % 2147483647) / 2147483647) - 0.5);
      expect(quadratic(m, n, u)).toBeGreaterThan(0);
      expect(quadratic(k, n, u)).toBeGreaterThanOrEqual(-1e-9 * Math.max(...Array.from(k, Math.abs)));
    }
  });

  it('carries the element mass ρ·∫A dx in translation (closed form for a linear taper)', () => {
    const translation = nodalVector(type, h, () => 1, () => 0);
    const expected = wood.density * rect.width * ((0.02 + 0.014) / 2) * h;
    expect(quadratic(m, n, translation) / expected).toBeCloseTo(1, 12);
  });

  it('gives the exact bending energy of a constant-curvature field on a uniform element', () => {
    // w = x²/2, θ = x (EB: θ = w′; Timoshenko: zero shear strain): uᵀKu = ∫ EI·1² dx = EI·h.
    const ku = new Float64Array(n * n);
    const mu = new Float64Array(n * n);
    beamElement(type, h, 0.02, 0.02, law, ku, mu);
    const u = nodalVector(type, h, (x) => (x * x) / 2, (x) => x);
    const EI = (wood.youngModulus * rect.width * 0.02 ** 3) / 12;
    expect(quadratic(ku, n, u) / (EI * h)).toBeCloseTo(1, 10);
  });
});

describe('Timoshenko element has no shear locking', () => {
  for (const p of [3, 4]) {
    it(`gives a cantilever-like bending energy independent of κGA once shear is stiff (p = ${p})`, () => {
      // As G → ∞ the element's Rayleigh quotient for a pure-bending field must approach the EB one.
      const type = timoshenkoLagrangeElement(p);
      const n = type.localDofs;
      const stiff = bendingLaw(rect, { ...wood, shearModulus: 1e6 * wood.youngModulus }, 'vertical');
      const k = new Float64Array(n * n);
      const m = new Float64Array(n * n);
      beamElement(type, 0.02, 0.02, 0.02, stiff, k, m);
      const u = nodalVector(type, 0.02, (x) => x ** 3, (x) => 3 * x * x);
      // ∫ EI (6x)² dx over [0, h] = 12·EI·h³ (w′ = θ exactly, so no shear energy). Tolerance 5e-9:
      // the shear terms are ~1e6 times the bending ones and cancel, leaving ~1e6·ε·n² of rounding.
      const EI = (wood.youngModulus * rect.width * 0.02 ** 3) / 12;
      expect(quadratic(k, n, u) / (12 * EI * 0.02 ** 3)).toBeCloseTo(1, 8);
    });
  }
});

describe('torsion element', () => {
  const tlaw = torsionLaw(rect, wood);
  for (const type of [lagrangeTorsionElement(2), torsionElementType]) {
    const n = type.localDofs;
    const k = new Float64Array(n * n);
    const m = new Float64Array(n * n);
    torsionElement(0.01, 0.02, 0.015, tlaw, k, m, type);
    it(`degree ${type.degree}: symmetric, with a zero-energy rigid twist and positive mass`, () => {
      for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) expect(k[a * n + b]).toBe(k[b * n + a]);
      for (let a = 0; a < n; a++) {
        let sum = 0;
        for (let b = 0; b < n; b++) sum += k[a * n + b]!;
        expect(Math.abs(sum)).toBeLessThan(1e-12 * Math.abs(k[0]!));
      }
      for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) expect(m[a * n + b]).toBe(m[b * n + a]);
    });
    it(`degree ${type.degree}: a rigid twist carries ρ∫I_p dx (closed form for a linear taper)`, () => {
      // I_p = b·t·(b² + t²)/12 for a rectangle; with t linear from t0 to t1 over h:
      // ∫ I_p dx = (b/12)·[b²·h·(t0 + t1)/2 + h·(t0⁴ − t1⁴)/(4(t0 − t1))]. The quadrature (degree + 2
      // Gauss points) integrates this cubic exactly, so only rounding is left (1e-12).
      const [h, t0, t1, b] = [0.01, 0.02, 0.015, rect.shape === 'rect' ? rect.width : 0];
      const expected = wood.density * (b / 12) * (b * b * h * ((t0 + t1) / 2) + (h * (t0 ** 4 - t1 ** 4)) / (4 * (t0 - t1)));
      expect(quadratic(m, n, new Float64Array(n).fill(1)) / expected).toBeCloseTo(1, 12);
    });
    it(`degree ${type.degree}: a uniform twist rate stores G·J·h (St-Venant, closed form)`, () => {
      const uniformK = new Float64Array(n * n);
      const uniformM = new Float64Array(n * n);
      torsionElement(0.01, 0.02, 0.02, tlaw, uniformK, uniformM, type);
      // Twist ψ = x: the nodal values are the dof positions ξ·h (Lagrange interpolation of a linear
      // field is exact, so ψ' = 1 throughout).
      const u = Float64Array.from({ length: n }, (_, a) => type.points[a]! * 0.01);
      const J = rectangleTorsionConstant(rect.shape === 'rect' ? rect.width : 0, 0.02);
      expect(quadratic(uniformK, n, u) / (wood.shearModulus * J * 0.01)).toBeCloseTo(1, 10);
    });
  }
});

describe('section law derivatives match central finite differences (step 1e-7 m; error O(step²) ≈ 1e-9 relative)', () => {
  const out = new Float64Array(4);
  const slope = new Float64Array(4);
  const plus = new Float64Array(4);
  const minus = new Float64Array(4);
  for (const [name, sectionLaw] of [
    ['vertical', bendingLaw(rect, wood, 'vertical')],
    ['lateral', bendingLaw(rect, wood, 'lateral')],
    ['torsion', torsionLaw(rect, wood)],
  ] as const) {
    it(name, () => {
      for (const t of [0.006, 0.012, 0.022, 0.06]) {
        sectionLaw.evaluate(t, out, slope);
        sectionLaw.evaluate(t + 1e-7, plus);
        sectionLaw.evaluate(t - 1e-7, minus);
        for (let i = 0; i < sectionLaw.count; i++) {
          const fd = (plus[i]! - minus[i]!) / 2e-7;
          expect(Math.abs(slope[i]! - fd)).toBeLessThan(1e-6 * Math.abs(fd) + 1e-30);
        }
      }
    });
  }
  it('torsion constant derivative, either side longer', () => {
    for (const [b, t] of [
      [0.05, 0.02],
      [0.05, 0.05],
      [0.02, 0.05],
    ]) {
      const fd = (rectangleTorsionConstant(b!, t! + 1e-8) - rectangleTorsionConstant(b!, t! - 1e-8)) / 2e-8;
      expect(rectangleTorsionConstantDerivative(b!, t!) / fd).toBeCloseTo(1, 6);
    }
  });
});
