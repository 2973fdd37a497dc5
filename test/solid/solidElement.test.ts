// The quadratic hexahedra of the solid bar model: element properties first (partition of unity,
// nodal interpolation, symmetry, rigid motions, rank), then Irons' patch test on a distorted patch.
import numeric from 'numeric';
import { describe, expect, it } from 'vitest';
import { hexahedronTable, lagrangeHexahedron, serendipityHexahedron, type HexahedronType } from '../../src/fe/solid/hexahedronBasis.ts';
import { hexahedronGradients as solidGradients, isAxisAligned, solidElementMatrices, solidElementWidthParts, widthScaledStiffness } from '../../src/fe/solid/solidElement.ts';
import { isotropicStiffness, orthotropicStiffness, type OrthotropicElasticity } from '../../src/material/orthotropicStiffness.ts';
import { symmetricEigen } from '../reference/denseGeneralizedEigen.ts';

const types: HexahedronType[] = [serendipityHexahedron, lagrangeHexahedron];
const GPa = 1e9;
/** A wood-like set of constants (the deep-arch bar; Poisson's ratios typical of hardwoods, from memory). */
const wood: OrthotropicElasticity = {
  youngLongitudinal: 12 * GPa,
  youngRadial: 1.2 * GPa,
  youngTangential: 0.6 * GPa,
  shearLongitudinalRadial: 0.95 * GPa,
  shearLongitudinalTangential: 0.75 * GPa,
  shearRadialTangential: 0.25 * GPa,
  poissonLongitudinalRadial: 0.37,
  poissonLongitudinalTangential: 0.45,
  poissonRadialTangential: 0.6,
};

/** Reference-cube coordinates (−1, 0, 1) of each node. */
function referenceNodes(type: HexahedronType): number[][] {
  return Array.from({ length: type.nodeCount }, (_, a) => [0, 1, 2].map((d) => type.offsets[3 * a + d]! - 1));
}

/** Node coordinates of a distorted element: the reference cube scaled, sheared and with every node nudged (deterministically). */
function distortedElement(type: HexahedronType, nudge: number): Float64Array {
  const coordinates = new Float64Array(3 * type.nodeCount);
  referenceNodes(type).forEach(([a, b, c], node) => {
    const wobble = (k: number) => nudge * Math.sin(3.1 * node + 1.7 * k);
    coordinates[3 * node] = 0.02 * a! + 0.003 * b! + wobble(0) * 0.01;
    coordinates[3 * node + 1] = 0.012 * b! - 0.002 * c! + wobble(1) * 0.006;
    coordinates[3 * node + 2] = 0.008 * c! + 0.001 * a! + wobble(2) * 0.004;
  });
  return coordinates;
}

describe('quadratic hexahedron bases', () => {
  for (const type of types) {
    it(`${type.kind}: partition of unity, zero-sum derivatives and N_a(node b) = δ_ab (closed-form properties of a Lagrange-type basis)`, () => {
      const values = new Float64Array(type.nodeCount);
      const derivatives = new Float64Array(3 * type.nodeCount);
      for (const [xi, eta, zeta] of [
        [0.1, -0.7, 0.4],
        [-0.93, 0.2, 0.77],
        [0, 0, 0],
      ]) {
        type.evaluate(xi!, eta!, zeta!, values, derivatives);
        expect(Math.abs(values.reduce((s, v) => s + v, 0) - 1)).toBeLessThan(1e-14);
        for (let d = 0; d < 3; d++) expect(Math.abs(derivatives.filter((_, k) => k % 3 === d).reduce((s, v) => s + v, 0))).toBeLessThan(1e-13);
      }
      referenceNodes(type).forEach(([xi, eta, zeta], b) => {
        type.evaluate(xi!, eta!, zeta!, values, derivatives);
        values.forEach((v, a) => expect(Math.abs(v - (a === b ? 1 : 0))).toBeLessThan(1e-15));
      });
    });
    it(`${type.kind}: derivatives agree with central differences of the values (1e-8)`, () => {
      const h = 1e-6;
      const plus = new Float64Array(type.nodeCount);
      const minus = new Float64Array(type.nodeCount);
      const scratch = new Float64Array(3 * type.nodeCount);
      const derivatives = new Float64Array(3 * type.nodeCount);
      const point = [0.31, -0.44, 0.63];
      type.evaluate(point[0]!, point[1]!, point[2]!, plus, derivatives);
      for (let d = 0; d < 3; d++) {
        const p = [...point];
        const m = [...point];
        p[d]! += h;
        m[d]! -= h;
        type.evaluate(p[0]!, p[1]!, p[2]!, plus, scratch);
        type.evaluate(m[0]!, m[1]!, m[2]!, minus, scratch);
        for (let a = 0; a < type.nodeCount; a++) expect(Math.abs((plus[a]! - minus[a]!) / (2 * h) - derivatives[3 * a + d]!)).toBeLessThan(1e-8);
      }
    });
    it(`${type.kind}: the element reproduces every quadratic polynomial (completeness; the serendipity space holds all of degree 2)`, () => {
      const values = new Float64Array(type.nodeCount);
      const derivatives = new Float64Array(3 * type.nodeCount);
      const nodes = referenceNodes(type);
      const polynomial = (x: number, y: number, z: number) => 1 - 2 * x + 0.5 * y + 3 * z + x * x - 0.7 * y * y + 0.2 * z * z + 1.1 * x * y - 0.4 * y * z + 0.9 * x * z;
      type.evaluate(0.37, -0.21, 0.58, values, derivatives);
      const interpolated = nodes.reduce((s, [a, b, c], k) => s + values[k]! * polynomial(a!, b!, c!), 0);
      expect(Math.abs(interpolated - polynomial(0.37, -0.21, 0.58))).toBeLessThan(1e-13);
    });
  }
});

describe('solid element matrices', () => {
  for (const type of types) {
    const table = hexahedronTable(type);
    const n = type.nodeCount;
    const size = 3 * n;
    const coordinates = distortedElement(type, 0.15);
    const stiffness = new Float64Array(size * size);
    const mass = new Float64Array(size * size);
    solidElementMatrices(table, coordinates, orthotropicStiffness(wood, { ringAngle: 0.4 }), 750, stiffness, mass);

    it(`${type.kind}: K and M are symmetric (1e-12 relative) on a distorted element with a rotated orthotropic material`, () => {
      const scaleK = Math.max(...stiffness.map(Math.abs));
      const scaleM = Math.max(...mass.map(Math.abs));
      for (let i = 0; i < size; i++) {
        for (let j = 0; j < i; j++) {
          expect(Math.abs(stiffness[i * size + j]! - stiffness[j * size + i]!)).toBeLessThan(1e-12 * scaleK);
          expect(Math.abs(mass[i * size + j]! - mass[j * size + i]!)).toBeLessThan(1e-12 * scaleM);
        }
      }
    });
    it(`${type.kind}: rigid motions store no energy (K·r = 0 to 1e-11 of ‖K‖) and K has exactly six zero eigenvalues (the rigid motions; full 3 × 3 × 3 integration leaves no spurious ones)`, () => {
      const scaleK = Math.max(...stiffness.map(Math.abs));
      const motions: ((x: number, y: number, z: number) => number[])[] = [
        () => [1, 0, 0],
        () => [0, 1, 0],
        () => [0, 0, 1],
        (_x, y, z) => [0, -z, y],
        (x, _y, z) => [z, 0, -x],
        (x, y) => [-y, x, 0],
      ];
      for (const motion of motions) {
        const r = new Float64Array(size);
        for (let a = 0; a < n; a++) r.set(motion(coordinates[3 * a]!, coordinates[3 * a + 1]!, coordinates[3 * a + 2]!), 3 * a);
        const norm = Math.sqrt(r.reduce((s, v) => s + v * v, 0));
        for (let i = 0; i < size; i++) {
          let sum = 0;
          for (let j = 0; j < size; j++) sum += stiffness[i * size + j]! * r[j]!;
          expect(Math.abs(sum)).toBeLessThan(1e-11 * scaleK * norm);
        }
      }
      const rows = Array.from({ length: size }, (_, i) => Array.from(stiffness.subarray(i * size, (i + 1) * size)));
      const { values } = symmetricEigen(rows);
      const largest = values[values.length - 1]!;
      values.slice(0, 6).forEach((v) => expect(Math.abs(v)).toBeLessThan(1e-10 * largest));
      expect(values[6]!).toBeGreaterThan(1e-6 * largest);
    });
    it(`${type.kind}: the mass matrix carries the element's mass (translation rᵀMr = ρV, V from the divergence theorem) and is positive definite`, () => {
      // Volume by an independent route: V = ∫ det J over the cube with a 6-point Gauss rule (exact for the polynomial det J).
      const fine = hexahedronTable(type, 6);
      let volume = 0;
      const jacobian = new Float64Array(9);
      for (let q = 0; q < fine.pointCount; q++) {
        jacobian.fill(0);
        for (let a = 0; a < n; a++) for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) jacobian[i * 3 + j]! += coordinates[3 * a + i]! * fine.derivatives[(q * n + a) * 3 + j]!;
        const det = numeric.det([Array.from(jacobian.subarray(0, 3)), Array.from(jacobian.subarray(3, 6)), Array.from(jacobian.subarray(6, 9))]);
        volume += fine.weights[q]! * det;
      }
      for (let c = 0; c < 3; c++) {
        let total = 0;
        for (let i = c; i < size; i += 3) for (let j = c; j < size; j += 3) total += mass[i * size + j]!;
        expect(Math.abs(total - 750 * volume)).toBeLessThan(1e-9 * 750 * volume);
      }
      const rows = Array.from({ length: size }, (_, i) => Array.from(mass.subarray(i * size, (i + 1) * size)));
      expect(symmetricEigen(rows).values[0]!).toBeGreaterThan(0);
    });
  }
});

describe("patch test (Irons & Razzaque 1972; Zienkiewicz, Taylor & Zhu, 7th ed., ch. 9)", () => {
  for (const type of types) {
    it(`${type.kind}: a 2 × 2 × 2 patch of distorted elements with a linear displacement on its boundary reproduces it inside and the constant strain at every Gauss point (1e-9)`, () => {
      // Build the patch on the 5 × 5 × 5 lattice; nudge every interior lattice point so elements are distorted.
      const lattice = 5;
      const index = (i: number, j: number, k: number) => (i * lattice + j) * lattice + k;
      const keep = (i: number, j: number, k: number) => type.nodeCount === 27 || (i & 1) + (j & 1) + (k & 1) <= 1;
      const nodeOf = new Int32Array(lattice ** 3).fill(-1);
      const points: number[][] = [];
      const boundary: boolean[] = [];
      for (let i = 0; i < lattice; i++)
        for (let j = 0; j < lattice; j++)
          for (let k = 0; k < lattice; k++) {
            if (!keep(i, j, k)) continue;
            const inside = i > 0 && i < 4 && j > 0 && j < 4 && k > 0 && k < 4;
            const nudge = inside ? 0.18 : 0;
            nodeOf[index(i, j, k)] = points.length;
            points.push([0.01 * i + nudge * 0.01 * Math.sin(i + 2 * j + 3 * k), 0.008 * j + nudge * 0.008 * Math.cos(2 * i + j), 0.006 * k + nudge * 0.006 * Math.sin(i * j + k)]);
            boundary.push(!inside);
          }
      const nodeCount = points.length;
      const dofs = 3 * nodeCount;
      const global = Array.from({ length: dofs }, () => new Float64Array(dofs));
      const c = orthotropicStiffness(wood, { ringAngle: 0.4 });
      const table = hexahedronTable(type);
      const n = type.nodeCount;
      const ke = new Float64Array(9 * n * n);
      const elements: number[][] = [];
      for (let ex = 0; ex < 2; ex++)
        for (let ey = 0; ey < 2; ey++)
          for (let ez = 0; ez < 2; ez++) {
            const nodes = Array.from({ length: n }, (_, a) => nodeOf[index(2 * ex + type.offsets[3 * a]!, 2 * ey + type.offsets[3 * a + 1]!, 2 * ez + type.offsets[3 * a + 2]!)]!);
            elements.push(nodes);
            const coordinates = Float64Array.from(nodes.flatMap((node) => points[node]!));
            solidElementMatrices(table, coordinates, c, 1, ke, null);
            for (let a = 0; a < 3 * n; a++) for (let b = 0; b < 3 * n; b++) global[3 * nodes[Math.floor(a / 3)]! + (a % 3)]![3 * nodes[Math.floor(b / 3)]! + (b % 3)]! += ke[a * 3 * n + b]!;
          }
      // Linear field u = A·x + u0 (A not symmetric: includes a rotation), prescribed on the boundary nodes.
      const A = [
        [1e-3, 2e-4, -3e-4],
        [-1e-4, 5e-4, 4e-4],
        [2e-4, -6e-4, -7e-4],
      ];
      const exact = (p: number[]) => A.map((row, i) => row[0]! * p[0]! + row[1]! * p[1]! + row[2]! * p[2]! + 1e-5 * (i + 1));
      const free: number[] = [];
      const known = new Float64Array(dofs);
      for (let node = 0; node < nodeCount; node++) {
        const u = exact(points[node]!);
        for (let d = 0; d < 3; d++) {
          if (boundary[node]) known[3 * node + d] = u[d]!;
          else free.push(3 * node + d);
        }
      }
      const matrix = free.map((i) => free.map((j) => global[i]![j]!));
      const rhs = free.map((i) => -global[i]!.reduce((s, v, j) => s + v * known[j]!, 0));
      const solution = numeric.solve(matrix, rhs) as number[];
      free.forEach((dof, k) => {
        const node = Math.floor(dof / 3);
        expect(Math.abs(solution[k]! - exact(points[node]!)[dof % 3]!)).toBeLessThan(1e-9 * 1e-3 * 0.04);
        known[dof] = solution[k]!;
      });
      // Constant strain at every Gauss point of every element: ε = sym(A).
      const gradients = new Float64Array(3 * n);
      const epsilon = [A[0]![0]!, A[1]![1]!, A[2]![2]!, A[1]![2]! + A[2]![1]!, A[0]![2]! + A[2]![0]!, A[0]![1]! + A[1]![0]!];
      for (const nodes of elements) {
        const coordinates = Float64Array.from(nodes.flatMap((node) => points[node]!));
        for (let q = 0; q < table.pointCount; q++) {
          // Displacement gradient H_ij = Σ_a u_a,i ∂N_a/∂x_j (gradients from the element's own routine).
          solidGradients(table, q, coordinates, gradients);
          const H = [0, 1, 2].map((i) => [0, 1, 2].map((j) => nodes.reduce((s, node, a) => s + known[3 * node + i]! * gradients[3 * a + j]!, 0)));
          const strain = [H[0]![0]!, H[1]![1]!, H[2]![2]!, H[1]![2]! + H[2]![1]!, H[0]![2]! + H[2]![0]!, H[0]![1]! + H[1]![0]!];
          strain.forEach((value, k) => expect(Math.abs(value - epsilon[k]!)).toBeLessThan(1e-9 * 1e-3));
        }
      }
    });
  }
});


describe('isotropic limit', () => {
  it('orthotropic constants with equal moduli and G = E/(2(1+ν)) give the isotropic stiffness whatever the ring angle (1e-12)', () => {
    const E = 70 * GPa;
    const nu = 0.33;
    const G = E / (2 * (1 + nu));
    const isotropic = isotropicStiffness(E, nu);
    const same: OrthotropicElasticity = {
      youngLongitudinal: E,
      youngRadial: E,
      youngTangential: E,
      shearLongitudinalRadial: G,
      shearLongitudinalTangential: G,
      shearRadialTangential: G,
      poissonLongitudinalRadial: nu,
      poissonLongitudinalTangential: nu,
      poissonRadialTangential: nu,
    };
    for (const ringAngle of [0, 0.3, Math.PI / 2, 2]) {
      const c = orthotropicStiffness(same, { ringAngle });
      c.forEach((value, k) => expect(Math.abs(value - isotropic[k]!)).toBeLessThan(1e-12 * E));
    }
  });
});

describe('axis-aligned fast path', () => {
  it('radial and tangential grain give a stiffness exactly orthotropic in the bar axes, and the closed-form Bᵀ C B equals the general product (1e-13)', () => {
    for (const ringAngle of [0, Math.PI / 2]) {
      const c = orthotropicStiffness(wood, { ringAngle });
      expect(isAxisAligned(c)).toBe(true);
      const table = hexahedronTable(serendipityHexahedron);
      const size = 60;
      const coordinates = distortedElement(serendipityHexahedron, 0.15);
      const fast = new Float64Array(size * size);
      const general = new Float64Array(size * size);
      solidElementMatrices(table, coordinates, c, 750, fast, null);
      // A shear coupling of 1e-300 Pa forces the general product without changing any sum.
      const nudged = Float64Array.from(c);
      nudged[3 * 6 + 4] = nudged[4 * 6 + 3] = 1e-300;
      expect(isAxisAligned(nudged)).toBe(false);
      solidElementMatrices(table, coordinates, nudged, 750, general, null);
      const scale = Math.max(...general.map(Math.abs));
      fast.forEach((value, k) => expect(Math.abs(value - general[k]!)).toBeLessThan(1e-13 * scale));
    }
  });
});

describe('width split of an element affine across the width', () => {
  it('(h/2)·K₀ + K₁ + (2/h)·K₂ and (h/2)·M₀ equal the direct matrices of the element of width h (1e-12), for both element types', () => {
    for (const type of types) {
      const n = type.nodeCount;
      const size = 3 * n;
      const table = hexahedronTable(type);
      const c = orthotropicStiffness(wood, { ringAngle: Math.PI / 2 });
      // A trapezoid in x–z (sloped underside), straight across the width: y = y0 + h(η + 1)/2.
      const place = (y0: number, h: number) => {
        const coordinates = new Float64Array(size);
        referenceNodes(type).forEach(([xi, eta, zeta], a) => {
          const x = 0.01 * (1 + xi!);
          const bottom = 0.002 * (1 + xi!);
          coordinates.set([x, y0 + (h * (eta! + 1)) / 2, bottom + (0.02 - bottom) * (0.5 * (zeta! + 1))], 3 * a);
        });
        return coordinates;
      };
      const parts = { none: new Float64Array(size * size), one: new Float64Array(size * size), two: new Float64Array(size * size), mass: new Float64Array(n * n) };
      solidElementWidthParts(table, place(0, 2), c, 750, parts);
      for (const h of [0.004, 0.0137]) {
        const direct = new Float64Array(size * size);
        const mass = new Float64Array(size * size);
        solidElementMatrices(table, place(0.003, h), c, 750, direct, mass);
        const split = widthScaledStiffness(parts, h, new Float64Array(size * size));
        const scale = Math.max(...direct.map(Math.abs));
        split.forEach((value, k) => expect(Math.abs(value - direct[k]!)).toBeLessThan(1e-12 * scale));
        const massScale = Math.max(...mass.map(Math.abs));
        for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) expect(Math.abs((h / 2) * parts.mass[a * n + b]! - mass[3 * a * size + 3 * b]!)).toBeLessThan(1e-12 * massScale);
      }
    }
  });
});
