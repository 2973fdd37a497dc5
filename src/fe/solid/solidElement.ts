import type { HexahedronTable } from './hexahedronBasis.ts';

/** Scratch space for solidElementMatrices, sized for one hexahedron type and rule (reuse it across elements). */
export interface SolidElementScratch {
  /** ∂N_a/∂x_d at point q: [(q·n + a)·3 + d]. */
  readonly gradients: Float64Array;
  /** The same times the point's weight·det J. */
  readonly weighted: Float64Array;
  /** (C·B_b)·weight·det J at point q: [(q·n + b)·18 + 3r + column] (general materials). */
  readonly stressOfNode: Float64Array;
  /** weight·det J of each point. */
  readonly volume: Float64Array;
}

/** Scratch space for hexahedra of `nodeCount` nodes at up to `pointCount` Gauss points. */
export function solidElementScratch(nodeCount: number, pointCount = 27): SolidElementScratch {
  return {
    gradients: new Float64Array(3 * nodeCount * pointCount),
    weighted: new Float64Array(3 * nodeCount * pointCount),
    stressOfNode: new Float64Array(18 * nodeCount * pointCount),
    volume: new Float64Array(pointCount),
  };
}

/**
 * True when a Voigt stiffness is orthotropic in the bar's own axes (only the normal block and
 * the three shear diagonals non-zero): grain radial or tangential, or an isotropic material.
 */
export function isAxisAligned(stiffness: ArrayLike<number>): boolean {
  for (let r = 0; r < 6; r++) for (let c = 0; c < 6; c++) if ((r < 3 ? c >= 3 : r !== c) && stiffness[r * 6 + c] !== 0) return false;
  return true;
}

/**
 * Jacobian J = ∂x/∂ξ (row-major: J[i·3 + j] = ∂x_i/∂ξ_j) of an isoparametric hexahedron at one
 * table point q, and its determinant. `coordinates` holds x, y, z of each node.
 */
export function hexahedronJacobian(table: HexahedronTable, q: number, coordinates: ArrayLike<number>, jacobian: Float64Array): number {
  const n = table.type.nodeCount;
  const derivatives = table.derivatives;
  jacobian.fill(0);
  for (let a = 0; a < n; a++) {
    const base = (q * n + a) * 3;
    const dxi = derivatives[base]!;
    const deta = derivatives[base + 1]!;
    const dzeta = derivatives[base + 2]!;
    for (let i = 0; i < 3; i++) {
      const x = coordinates[3 * a + i]!;
      jacobian[i * 3]! += x * dxi;
      jacobian[i * 3 + 1]! += x * deta;
      jacobian[i * 3 + 2]! += x * dzeta;
    }
  }
  const j00 = jacobian[0]!;
  const j01 = jacobian[1]!;
  const j02 = jacobian[2]!;
  const j10 = jacobian[3]!;
  const j11 = jacobian[4]!;
  const j12 = jacobian[5]!;
  const j20 = jacobian[6]!;
  const j21 = jacobian[7]!;
  const j22 = jacobian[8]!;
  return j00 * (j11 * j22 - j12 * j21) - j01 * (j10 * j22 - j12 * j20) + j02 * (j10 * j21 - j11 * j20);
}

const jacobianScratch = new Float64Array(9);

/**
 * Physical gradients ∂N_a/∂x, ∂N_a/∂y, ∂N_a/∂z at table point q into gradients[3a …], from
 * ∇_x N = J⁻ᵀ ∇_ξ N. Returns det J (throws, internal, when the element is inverted).
 */
export function hexahedronGradients(table: HexahedronTable, q: number, coordinates: ArrayLike<number>, gradients: Float64Array): number {
  const jacobian = jacobianScratch;
  const det = hexahedronJacobian(table, q, coordinates, jacobian);
  if (!(det > 0)) throw new Error(`internal: hexahedron Jacobian ${det} at point ${q} (element inverted or degenerate)`);
  const a = jacobian[0]!;
  const b = jacobian[1]!;
  const c = jacobian[2]!;
  const d = jacobian[3]!;
  const e = jacobian[4]!;
  const f = jacobian[5]!;
  const g = jacobian[6]!;
  const h = jacobian[7]!;
  const k = jacobian[8]!;
  // Inverse of J, row-major: inv[j][i] = ∂ξ_j/∂x_i.
  const i00 = (e * k - f * h) / det;
  const i01 = (c * h - b * k) / det;
  const i02 = (b * f - c * e) / det;
  const i10 = (f * g - d * k) / det;
  const i11 = (a * k - c * g) / det;
  const i12 = (c * d - a * f) / det;
  const i20 = (d * h - e * g) / det;
  const i21 = (b * g - a * h) / det;
  const i22 = (a * e - b * d) / det;
  const n = table.type.nodeCount;
  const derivatives = table.derivatives;
  for (let node = 0; node < n; node++) {
    const base = (q * n + node) * 3;
    const dxi = derivatives[base]!;
    const deta = derivatives[base + 1]!;
    const dzeta = derivatives[base + 2]!;
    // ∂N/∂x_i = Σ_j ∂N/∂ξ_j · ∂ξ_j/∂x_i
    gradients[3 * node] = dxi * i00 + deta * i10 + dzeta * i20;
    gradients[3 * node + 1] = dxi * i01 + deta * i11 + dzeta * i21;
    gradients[3 * node + 2] = dxi * i02 + deta * i12 + dzeta * i22;
  }
  return det;
}

/**
 * Stiffness and consistent mass of an isoparametric hexahedron of linear elasticity:
 * K = ∫ Bᵀ C B dV and M = ρ ∫ Nᵀ N dV by the table's Gauss rule (Zienkiewicz, Taylor & Zhu,
 * The Finite Element Method: Its Basis and Fundamentals, 7th ed. (2013), ch. 6). Local dofs node
 * by node (u_x, u_y, u_z of node a at 3a … 3a + 2); `stiffnessOut` and `massOut` are row-major
 * (3n)², fully written (both triangles). C is a Voigt stiffness (σ_xx, σ_yy, σ_zz, σ_yz, σ_xz,
 * σ_xy; engineering shear), any anisotropy. Units: SI in, SI out. The gradients at every point
 * are found first; then each node pair's 3 × 3 block is summed over the points in registers,
 * by the closed form of Bᵀ C B when C is orthotropic in the bar's axes (isAxisAligned), by the
 * general product otherwise.
 */
export function solidElementMatrices(
  table: HexahedronTable,
  coordinates: ArrayLike<number>,
  stiffness: ArrayLike<number>,
  density: number,
  stiffnessOut: Float64Array,
  massOut: Float64Array | null,
  scratch: SolidElementScratch = solidElementScratch(table.type.nodeCount, table.pointCount),
): void {
  const n = table.type.nodeCount;
  const points = table.pointCount;
  const size = 3 * n;
  const { gradients, weighted, stressOfNode, volume } = scratch;
  const c = stiffness;
  const aligned = isAxisAligned(c);
  const single = new Float64Array(3 * n);
  for (let q = 0; q < points; q++) {
    const det = hexahedronGradients(table, q, coordinates, single);
    const weight = table.weights[q]! * det;
    volume[q] = weight;
    const base = q * 3 * n;
    for (let k = 0; k < 3 * n; k++) {
      gradients[base + k] = single[k]!;
      weighted[base + k] = single[k]! * weight;
    }
    if (aligned) continue;
    for (let b = 0; b < n; b++) {
      const gx = weighted[base + 3 * b]!;
      const gy = weighted[base + 3 * b + 1]!;
      const gz = weighted[base + 3 * b + 2]!;
      const o = (q * n + b) * 18;
      for (let r = 0; r < 6; r++) {
        const row = r * 6;
        // B_b columns: u_x → (gx, 0, 0, 0, gz, gy); u_y → (0, gy, 0, gz, 0, gx); u_z → (0, 0, gz, gy, gx, 0).
        stressOfNode[o + 3 * r] = c[row]! * gx + c[row + 4]! * gz + c[row + 5]! * gy;
        stressOfNode[o + 3 * r + 1] = c[row + 1]! * gy + c[row + 3]! * gz + c[row + 5]! * gx;
        stressOfNode[o + 3 * r + 2] = c[row + 2]! * gz + c[row + 3]! * gy + c[row + 4]! * gx;
      }
    }
  }
  const c11 = c[0]!;
  const c12 = c[1]!;
  const c13 = c[2]!;
  const c22 = c[7]!;
  const c23 = c[8]!;
  const c33 = c[14]!;
  const c44 = c[21]!;
  const c55 = c[28]!;
  const c66 = c[35]!;
  const stride = 3 * n;
  for (let a = 0; a < n; a++) {
    for (let b = 0; b <= a; b++) {
      let kxx = 0;
      let kxy = 0;
      let kxz = 0;
      let kyx = 0;
      let kyy = 0;
      let kyz = 0;
      let kzx = 0;
      let kzy = 0;
      let kzz = 0;
      if (aligned) {
        for (let q = 0, oa = 3 * a, ob = 3 * b; q < points; q++, oa += stride, ob += stride) {
          const ax = weighted[oa]!;
          const ay = weighted[oa + 1]!;
          const az = weighted[oa + 2]!;
          const bx = gradients[ob]!;
          const by = gradients[ob + 1]!;
          const bz = gradients[ob + 2]!;
          const xx = ax * bx;
          const yy = ay * by;
          const zz = az * bz;
          kxx += c11 * xx + c66 * yy + c55 * zz;
          kyy += c22 * yy + c66 * xx + c44 * zz;
          kzz += c33 * zz + c55 * xx + c44 * yy;
          kxy += c12 * ax * by + c66 * ay * bx;
          kyx += c12 * ay * bx + c66 * ax * by;
          kxz += c13 * ax * bz + c55 * az * bx;
          kzx += c13 * az * bx + c55 * ax * bz;
          kyz += c23 * ay * bz + c44 * az * by;
          kzy += c23 * az * by + c44 * ay * bz;
        }
      } else {
        for (let q = 0, oa = 3 * a; q < points; q++, oa += stride) {
          const gx = gradients[oa]!;
          const gy = gradients[oa + 1]!;
          const gz = gradients[oa + 2]!;
          const o = (q * n + b) * 18;
          // K_ab[p][k] = Σ_r B_a[r][p]·(C B_b)[r][k].
          kxx += gx * stressOfNode[o]! + gz * stressOfNode[o + 12]! + gy * stressOfNode[o + 15]!;
          kxy += gx * stressOfNode[o + 1]! + gz * stressOfNode[o + 13]! + gy * stressOfNode[o + 16]!;
          kxz += gx * stressOfNode[o + 2]! + gz * stressOfNode[o + 14]! + gy * stressOfNode[o + 17]!;
          kyx += gy * stressOfNode[o + 3]! + gz * stressOfNode[o + 9]! + gx * stressOfNode[o + 15]!;
          kyy += gy * stressOfNode[o + 4]! + gz * stressOfNode[o + 10]! + gx * stressOfNode[o + 16]!;
          kyz += gy * stressOfNode[o + 5]! + gz * stressOfNode[o + 11]! + gx * stressOfNode[o + 17]!;
          kzx += gz * stressOfNode[o + 6]! + gy * stressOfNode[o + 9]! + gx * stressOfNode[o + 12]!;
          kzy += gz * stressOfNode[o + 7]! + gy * stressOfNode[o + 10]! + gx * stressOfNode[o + 13]!;
          kzz += gz * stressOfNode[o + 8]! + gy * stressOfNode[o + 11]! + gx * stressOfNode[o + 14]!;
        }
      }
      const rx = 3 * a * size + 3 * b;
      const ry = rx + size;
      const rz = ry + size;
      stiffnessOut[rx] = kxx;
      stiffnessOut[rx + 1] = kxy;
      stiffnessOut[rx + 2] = kxz;
      stiffnessOut[ry] = kyx;
      stiffnessOut[ry + 1] = kyy;
      stiffnessOut[ry + 2] = kyz;
      stiffnessOut[rz] = kzx;
      stiffnessOut[rz + 1] = kzy;
      stiffnessOut[rz + 2] = kzz;
      // The mirror block K_ba = K_abᵀ.
      const tx = 3 * b * size + 3 * a;
      stiffnessOut[tx] = kxx;
      stiffnessOut[tx + size] = kxy;
      stiffnessOut[tx + 2 * size] = kxz;
      stiffnessOut[tx + 1] = kyx;
      stiffnessOut[tx + 1 + size] = kyy;
      stiffnessOut[tx + 1 + 2 * size] = kyz;
      stiffnessOut[tx + 2] = kzx;
      stiffnessOut[tx + 2 + size] = kzy;
      stiffnessOut[tx + 2 + 2 * size] = kzz;
    }
  }
  if (massOut) {
    massOut.fill(0);
    const values = table.values;
    for (let a = 0; a < n; a++) {
      for (let b = 0; b <= a; b++) {
        let m = 0;
        for (let q = 0; q < points; q++) m += volume[q]! * values[q * n + a]! * values[q * n + b]!;
        m *= density;
        for (let k = 0; k < 3; k++) {
          massOut[(3 * a + k) * size + 3 * b + k] = m;
          massOut[(3 * b + k) * size + 3 * a + k] = m;
        }
      }
    }
  }
}

/**
 * For an element whose y is affine in η alone (y = y₀ + h(η + 1)/2, x and z independent of η, as
 * in a bar's mapped mesh) and a material orthotropic in the bar's axes, K and M split by the
 * number of y-derivatives in each term: K(h) = (h/2)·K₀ + K₁ + (2/h)·K₂ and M(h) = (h/2)·M₀, with
 * the parts computed once at h = 2 (`coordinates` given with that width). Every element across
 * the width of one slice then costs a linear combination (widthScaledMatrices).
 */
export function solidElementWidthParts(
  table: HexahedronTable,
  coordinates: ArrayLike<number>,
  stiffness: ArrayLike<number>,
  density: number,
  parts: { readonly none: Float64Array; readonly one: Float64Array; readonly two: Float64Array; readonly mass: Float64Array },
  scratch: SolidElementScratch = solidElementScratch(table.type.nodeCount, table.pointCount),
): void {
  if (!isAxisAligned(stiffness)) throw new Error('internal: the width split needs a material orthotropic in the bar axes');
  const n = table.type.nodeCount;
  const points = table.pointCount;
  const size = 3 * n;
  const { gradients, weighted, volume } = scratch;
  const single = new Float64Array(3 * n);
  for (let q = 0; q < points; q++) {
    const det = hexahedronGradients(table, q, coordinates, single);
    const weight = table.weights[q]! * det;
    volume[q] = weight;
    const base = q * 3 * n;
    for (let k = 0; k < 3 * n; k++) {
      gradients[base + k] = single[k]!;
      weighted[base + k] = single[k]! * weight;
    }
  }
  const c = stiffness;
  const c11 = c[0]!;
  const c12 = c[1]!;
  const c13 = c[2]!;
  const c22 = c[7]!;
  const c23 = c[8]!;
  const c33 = c[14]!;
  const c44 = c[21]!;
  const c55 = c[28]!;
  const c66 = c[35]!;
  const stride = 3 * n;
  const write = (matrix: Float64Array, a: number, b: number, block: readonly number[]) => {
    const r = 3 * a * size + 3 * b;
    const t = 3 * b * size + 3 * a;
    for (let i = 0; i < 3; i++) {
      for (let k = 0; k < 3; k++) {
        matrix[r + i * size + k] = block[3 * i + k]!;
        matrix[t + k * size + i] = block[3 * i + k]!;
      }
    }
  };
  for (let a = 0; a < n; a++) {
    for (let b = 0; b <= a; b++) {
      // No y-derivative: xx, zz, xz, zx terms; one: xy, yx, yz, zy; two: the yy terms.
      let n0 = 0; // c11 xx + c55 zz (K_xx)
      let n1 = 0; // c66 xx + c44 zz (K_yy)
      let n2 = 0; // c33 zz + c55 xx (K_zz)
      let n3 = 0; // K_xz
      let n4 = 0; // K_zx
      let o0 = 0; // K_xy
      let o1 = 0; // K_yx
      let o2 = 0; // K_yz
      let o3 = 0; // K_zy
      let t0 = 0; // yy
      for (let q = 0, oa = 3 * a, ob = 3 * b; q < points; q++, oa += stride, ob += stride) {
        const ax = weighted[oa]!;
        const ay = weighted[oa + 1]!;
        const az = weighted[oa + 2]!;
        const bx = gradients[ob]!;
        const by = gradients[ob + 1]!;
        const bz = gradients[ob + 2]!;
        const xx = ax * bx;
        const zz = az * bz;
        n0 += c11 * xx + c55 * zz;
        n1 += c66 * xx + c44 * zz;
        n2 += c33 * zz + c55 * xx;
        n3 += c13 * ax * bz + c55 * az * bx;
        n4 += c13 * az * bx + c55 * ax * bz;
        o0 += c12 * ax * by + c66 * ay * bx;
        o1 += c12 * ay * bx + c66 * ax * by;
        o2 += c23 * ay * bz + c44 * az * by;
        o3 += c23 * az * by + c44 * ay * bz;
        t0 += ay * by;
      }
      write(parts.none, a, b, [n0, 0, n3, 0, n1, 0, n4, 0, n2]);
      write(parts.one, a, b, [0, o0, 0, o1, 0, o2, 0, o3, 0]);
      write(parts.two, a, b, [c66 * t0, 0, 0, 0, c22 * t0, 0, 0, 0, c44 * t0]);
      let m = 0;
      for (let q = 0; q < points; q++) m += volume[q]! * table.values[q * n + a]! * table.values[q * n + b]!;
      parts.mass[a * n + b] = parts.mass[b * n + a] = density * m;
    }
  }
}

/** K(h) = (h/2)·K₀ + K₁ + (2/h)·K₂ into `out` (see solidElementWidthParts). */
export function widthScaledStiffness(parts: { readonly none: Float64Array; readonly one: Float64Array; readonly two: Float64Array }, width: number, out: Float64Array): Float64Array {
  const half = width / 2;
  const inverse = 2 / width;
  const { none, one, two } = parts;
  for (let k = 0; k < out.length; k++) out[k] = half * none[k]! + one[k]! + inverse * two[k]!;
  return out;
}
