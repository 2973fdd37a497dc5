import { describe, expect, it } from 'vitest';
import numeric from 'numeric';
import { beamElement } from '../../src/fe/beamElement.ts';
import { hermiteCubicElement, timoshenkoElementType, type BeamElementType } from '../../src/fe/beamElementType.ts';
import { gaussLegendre } from '../../src/fe/gaussLegendre.ts';
import { lagrangeTorsionElement, torsionElement } from '../../src/fe/torsionElement.ts';
import { beamLineOf, practiceBar, workedExampleBar } from './referenceBars.ts';

/** Largest |a − b| over two square matrices (row-major / rows), relative to the largest |b|. */
function relativeMatrixError(actual: ArrayLike<number>, expected: number[][]): number {
  const flat = expected.flat();
  const scale = Math.max(...flat.map(Math.abs));
  return Math.max(...flat.map((value, k) => Math.abs(actual[k]! - value))) / scale;
}

function symmetricFromUpper(upper: number[][]): number[][] {
  return upper.map((row, i) => row.map((_, j) => (j >= i ? upper[i]![j]! : upper[j]![i]!)));
}

function elementMatrices(type: BeamElementType, h: number, t0: number, t1: number, law = beamLineOf(workedExampleBar).law) {
  const n = type.localDofs;
  const stiffness = new Float64Array(n * n);
  const mass = new Float64Array(n * n);
  beamElement(type, h, t0, t1, law, stiffness, mass);
  return { stiffness, mass, n };
}

/** Rows of a row-major n×n array. */
function rows(matrix: Float64Array, n: number): number[][] {
  return Array.from({ length: n }, (_, i) => Array.from(matrix.subarray(i * n, i * n + n)));
}

/** Static condensation onto the end dofs [w₁, θ₁, w₂, θ₂]: K_ee − K_ei K_ii⁻¹ K_ie. */
function condenseToEnds(matrix: Float64Array, n: number): number[][] {
  const all = rows(matrix, n);
  const ends = [0, 1, n - 2, n - 1];
  const internal = Array.from({ length: n - 4 }, (_, k) => 2 + k);
  if (internal.length === 0) return ends.map((i) => ends.map((j) => all[i]![j]!));
  const kii = internal.map((i) => internal.map((j) => all[i]![j]!));
  const kie = internal.map((i) => ends.map((j) => all[i]![j]!));
  const correction = numeric.dot(ends.map((i) => internal.map((j) => all[i]![j]!)), numeric.dot(numeric.inv(kii), kie)) as number[][];
  return ends.map((i, a) => ends.map((j, b) => all[i]![j]! - correction[a]![b]!));
}

const h = 0.03;
const t = 0.02;
const properties = new Float64Array(4);
beamLineOf(workedExampleBar).law.evaluate(t, properties);
const [EI, kGA, rhoA] = [properties[0]!, properties[1]!, properties[2]!];

describe('Euler–Bernoulli element', () => {
  it('is the Hermite-cubic stiffness and consistent mass for a uniform section', () => {
    // Closed form: J. S. Przemieniecki, Theory of Matrix Structural Analysis (1968), §5.3 and
    // §11.5 (memory): K = EI/h³[12, 6h, −12, 6h; 4h², −6h, 2h²; 12, −6h; 4h²],
    // M = ρAh/420[156, 22h, 54, −13h; 4h², 13h, −3h²; 156, −22h; 4h²].
    // Tolerance 1e-13 relative: Gauss quadrature integrates these polynomials exactly.
    const { stiffness, mass } = elementMatrices(hermiteCubicElement, h, t, t);
    const k = EI / h ** 3;
    const expectedK = symmetricFromUpper([[12, 6 * h, -12, 6 * h], [0, 4 * h * h, -6 * h, 2 * h * h], [0, 0, 12, -6 * h], [0, 0, 0, 4 * h * h]]).map((r) => r.map((v) => v * k));
    const m = (rhoA * h) / 420;
    const expectedM = symmetricFromUpper([[156, 22 * h, 54, -13 * h], [0, 4 * h * h, 13 * h, -3 * h * h], [0, 0, 156, -22 * h], [0, 0, 0, 4 * h * h]]).map((r) => r.map((v) => v * m));
    expect(relativeMatrixError(stiffness, expectedK)).toBeLessThan(1e-13);
    expect(relativeMatrixError(mass, expectedM)).toBeLessThan(1e-13);
  });

  it('integrates a tapered section as ∫EI(x) B″ᵀB″ dx by an independent quadrature', () => {
    // Computed: composite Simpson with 2000 panels of E b t(x)³/12 times products of the Hermite
    // second derivatives (degree-5 integrands; Simpson's error ~1e-14 relative here). Tolerance
    // 1e-10. A midpoint-constant section would be off by ~1e-2 for this 2:1 taper.
    const [h, t0, t1] = [0.05, 0.022, 0.011];
    const { stiffness } = elementMatrices(hermiteCubicElement, h, t0, t1, beamLineOf(practiceBar).law);
    const curvature = (xi: number) => [(12 * xi - 6) / h ** 2, (6 * xi - 4) / h, (6 - 12 * xi) / h ** 2, (6 * xi - 2) / h];
    const panels = 2000;
    const expected = Array.from({ length: 4 }, () => new Array<number>(4).fill(0));
    for (let k = 0; k <= panels; k++) {
      const xi = k / panels;
      const weight = (k === 0 || k === panels ? 1 : k % 2 ? 4 : 2) / (3 * panels);
      const thickness = t0 + (t1 - t0) * xi;
      const ei = (practiceBar.youngModulus * practiceBar.width * thickness ** 3) / 12;
      const b = curvature(xi);
      for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) expected[i]![j]! += weight * h * ei * b[i]! * b[j]!;
    }
    expect(relativeMatrixError(stiffness, expected)).toBeLessThan(1e-10);
  });
});

describe('Timoshenko element', () => {
  it('condenses to the exact shear-flexible stiffness of a uniform beam', () => {
    // Closed form: Przemieniecki (1968) §5.3 (memory), φ = 12EI/(κGA h²):
    // K = EI/((1+φ)h³)[12, 6h, −12, 6h; (4+φ)h², −6h, (2−φ)h²; 12, −6h; (4+φ)h²].
    // The exact static solution (w cubic, θ quadratic) lies in the element's space, so after
    // condensing the internal dofs the element must reproduce it. Tolerance 1e-9 relative (the
    // condensation inverts an internal block with condition number ~1e4 for this φ).
    const { stiffness, n } = elementMatrices(timoshenkoElementType, h, t, t);
    const phi = (12 * EI) / (kGA * h * h);
    const k = EI / ((1 + phi) * h ** 3);
    const expected = symmetricFromUpper([
      [12, 6 * h, -12, 6 * h], [0, (4 + phi) * h * h, -6 * h, (2 - phi) * h * h], [0, 0, 12, -6 * h], [0, 0, 0, (4 + phi) * h * h],
    ]).map((r) => r.map((v) => v * k));
    expect(relativeMatrixError(condenseToEnds(stiffness, n).flat(), expected)).toBeLessThan(1e-9);
  });

  it('gives a one-element cantilever the exact tip deflection PL³/3EI + PL/κGA', () => {
    // Closed form (Timoshenko beam statics, uniform cantilever under a tip load). Tolerance 1e-9
    // relative, as for the condensation above.
    const { stiffness, n } = elementMatrices(timoshenkoElementType, h, t, t);
    const condensed = condenseToEnds(stiffness, n);
    const [k22, k23, k33] = [condensed[2]![2]!, condensed[2]![3]!, condensed[3]![3]!];
    const tip = k33 / (k22 * k33 - k23 * k23);
    expect(Math.abs(tip / (h ** 3 / (3 * EI) + h / kGA) - 1)).toBeLessThan(1e-9);
  });
});

describe('both element types on a tapered section', () => {
  const [h, t0, t1] = [0.05, 0.022, 0.011];
  const law = beamLineOf(practiceBar).law;
  for (const type of [hermiteCubicElement, timoshenkoElementType]) {
    it(`${type.theory}: rigid-body motions cost no strain energy and carry the exact mass`, () => {
      // Closed forms: K·u = 0 for the translation (w = 1, θ = 0) and the rotation (w = x, θ = 1),
      // both exactly in the element's space; uᵀMu = ∫ρA dx = ρ b h (t0 + t1)/2 for the
      // translation, and ∫ρA x² (+ ρI for Timoshenko) dx for the rotation about the left end,
      // integrated exactly for the linear taper. Tolerances 1e-12 relative (rounding).
      const { stiffness, mass, n } = elementMatrices(type, h, t0, t1, law);
      const translation = Array.from(type.dofKind, (kind) => (kind === 0 ? 1 : 0));
      const rotation = Array.from(type.dofKind, (kind, a) => (kind === 0 ? type.dofPosition[a]! * h : 1));
      const kRows = rows(stiffness, n);
      const mRows = rows(mass, n);
      const stiffnessScale = Math.max(...kRows.map((row, a) => Math.abs(row[a]!) * (type.dofKind[a] === 0 ? 1 : 1 / h)));
      for (const u of [translation, rotation]) {
        for (let a = 0; a < n; a++) {
          const force = kRows[a]!.reduce((sum, value, b) => sum + value * u[b]!, 0);
          const scale = type.dofKind[a] === 0 ? stiffnessScale : stiffnessScale * h;
          expect(Math.abs(force)).toBeLessThan(1e-12 * scale);
        }
      }
      const quadratic = (u: number[]) => u.reduce((sum, ui, a) => sum + ui * mRows[a]!.reduce((s, value, b) => s + value * u[b]!, 0), 0);
      const { width, density } = practiceBar;
      expect(Math.abs(quadratic(translation) / ((density * width * h * (t0 + t1)) / 2) - 1)).toBeLessThan(1e-12);
      const slope = (t1 - t0) / h;
      const translationalInertia = density * width * ((t0 * h ** 3) / 3 + (slope * h ** 4) / 4);
      const rotaryInertia = (density * width * (t1 ** 4 - t0 ** 4)) / (48 * slope);
      const expected = translationalInertia + (type.theory === 'timoshenko' ? rotaryInertia : 0);
      expect(Math.abs(quadratic(rotation) / expected - 1)).toBeLessThan(1e-12);
    });

    it(`${type.theory}: matrices are symmetric, K positive semi-definite, M positive definite`, () => {
      // Definition of stiffness and consistent mass matrices; eigenvalues by numeric.eig (a
      // general-purpose reference library, tiny matrix). K has exactly the two rigid-body zero
      // eigenvalues (|λ| < 1e-14·max λ: rounding) and the third is a real stiffness (> 1e-10·max λ;
      // measured 9e-9 for the quartic/quintic element, whose interior modes are very stiff);
      // M's smallest eigenvalue is positive.
      const { stiffness, mass, n } = elementMatrices(type, h, t0, t1, law);
      const kRows = rows(stiffness, n);
      const mRows = rows(mass, n);
      for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) {
        expect(kRows[a]![b]).toBe(kRows[b]![a]);
        expect(mRows[a]![b]).toBe(mRows[b]![a]);
      }
      // Scale rotations by h so both matrices are dimensionally uniform before the eigenvalues.
      const scale = Array.from(type.dofKind, (kind) => (kind === 0 ? 1 : h));
      const scaled = (m: number[][]) => m.map((row, a) => row.map((value, b) => value * scale[a]! * scale[b]!));
      const kValues = (numeric.eig(scaled(kRows)).lambda.x as number[]).sort((x, y) => x - y);
      const mValues = (numeric.eig(scaled(mRows)).lambda.x as number[]).sort((x, y) => x - y);
      const largest = kValues[n - 1]!;
      expect(Math.abs(kValues[0]!)).toBeLessThan(1e-14 * largest);
      expect(Math.abs(kValues[1]!)).toBeLessThan(1e-14 * largest);
      expect(kValues[2]!).toBeGreaterThan(1e-10 * largest);
      expect(mValues[0]!).toBeGreaterThan(0);
    });
  }
});

describe('Gauss rule and torsion element', () => {
  it('has the 4-point nodes and weights of Abramowitz & Stegun table 25.4', () => {
    // Source: Abramowitz & Stegun, Handbook of Mathematical Functions, table 25.4 (published):
    // on [−1, 1], ±0.339981043584856, ±0.861136311594053; weights 0.652145154862546,
    // 0.347854845137454. Tolerance 1e-15 (the table's 15 digits).
    const { points, weights } = gaussLegendre(4);
    const expectedPoints = [-0.861136311594053, -0.339981043584856, 0.339981043584856, 0.861136311594053].map((x) => (x + 1) / 2);
    const expectedWeights = [0.347854845137454, 0.652145154862546, 0.652145154862546, 0.347854845137454].map((w) => w / 2);
    points.forEach((x, i) => expect(Math.abs(x - expectedPoints[i]!)).toBeLessThan(1e-15));
    weights.forEach((w, i) => expect(Math.abs(w - expectedWeights[i]!)).toBeLessThan(1e-15));
  });

  it('integrates polynomials up to degree 2n − 1 exactly on [0, 1], and not degree 2n', () => {
    // Closed form ∫₀¹ xᵏ dx = 1/(k+1). Tolerance 1e-14 (rounding).
    for (const n of [2, 3, 4, 5, 6]) {
      const { points, weights } = gaussLegendre(n);
      for (let k = 0; k <= 2 * n - 1; k++) {
        const sum = points.reduce((s, x, g) => s + weights[g]! * x ** k, 0);
        expect(Math.abs(sum - 1 / (k + 1))).toBeLessThan(1e-14);
      }
      const beyond = points.reduce((s, x, g) => s + weights[g]! * x ** (2 * n), 0);
      expect(Math.abs(beyond - 1 / (2 * n + 1))).toBeGreaterThan(1e-8);
    }
  });

  it('uniform torsion element is the quadratic Lagrange stiffness and mass', () => {
    // Closed form (quadratic bar element, any FE text, e.g. Przemieniecki 1968; memory):
    // K = GJ/(3h)[7, −8, 1; −8, 16, −8; 1, −8, 7], M = ρI_p h/30[4, 2, −1; 2, 16, 2; −1, 2, 4].
    // Tolerance 1e-13 relative (exact quadrature).
    const torsion = beamLineOf(workedExampleBar, 'torsion').law;
    const values = new Float64Array(2);
    torsion.evaluate(t, values);
    const stiffness = new Float64Array(9);
    const mass = new Float64Array(9);
    torsionElement(h, t, t, torsion, stiffness, mass, lagrangeTorsionElement(2));
    const k = values[0]! / (3 * h);
    const m = (values[1]! * h) / 30;
    expect(relativeMatrixError(stiffness, [[7, -8, 1], [-8, 16, -8], [1, -8, 7]].map((r) => r.map((v) => v * k)))).toBeLessThan(1e-13);
    expect(relativeMatrixError(mass, [[4, 2, -1], [2, 16, 2], [-1, 2, 4]].map((r) => r.map((v) => v * m)))).toBeLessThan(1e-13);
  });
});
