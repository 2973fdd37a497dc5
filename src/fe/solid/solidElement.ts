import type { HexahedronTable } from './hexahedronBasis.ts';

/** Scratch space for solidElementMatrices, sized for one hexahedron type (reuse it across elements). */
export interface SolidElementScratch {
  readonly gradients: Float64Array;
  readonly stressOfNode: Float64Array;
}

/** Scratch space for hexahedra of `nodeCount` nodes. */
export function solidElementScratch(nodeCount: number): SolidElementScratch {
  return { gradients: new Float64Array(3 * nodeCount), stressOfNode: new Float64Array(18 * nodeCount) };
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
      jacobian[i * 3] += x * dxi;
      jacobian[i * 3 + 1] += x * deta;
      jacobian[i * 3 + 2] += x * dzeta;
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
 * σ_xy; engineering shear), any anisotropy. Units: SI in, SI out.
 */
export function solidElementMatrices(
  table: HexahedronTable,
  coordinates: ArrayLike<number>,
  stiffness: ArrayLike<number>,
  density: number,
  stiffnessOut: Float64Array,
  massOut: Float64Array | null,
  scratch: SolidElementScratch = solidElementScratch(table.type.nodeCount),
): void {
  const n = table.type.nodeCount;
  const size = 3 * n;
  const { gradients, stressOfNode } = scratch;
  stiffnessOut.fill(0);
  massOut?.fill(0);
  const c = stiffness;
  for (let q = 0; q < table.pointCount; q++) {
    const det = hexahedronGradients(table, q, coordinates, gradients);
    const weight = table.weights[q]! * det;
    // (C·B_b) for every node b: 6 × 3 at stressOfNode[18b + 3r + column], scaled by the weight.
    for (let b = 0; b < n; b++) {
      const gx = gradients[3 * b]! * weight;
      const gy = gradients[3 * b + 1]! * weight;
      const gz = gradients[3 * b + 2]! * weight;
      const base = 18 * b;
      for (let r = 0; r < 6; r++) {
        const row = r * 6;
        // B_b columns: u_x → (gx, 0, 0, 0, gz, gy); u_y → (0, gy, 0, gz, 0, gx); u_z → (0, 0, gz, gy, gx, 0).
        stressOfNode[base + 3 * r] = c[row]! * gx + c[row + 4]! * gz + c[row + 5]! * gy;
        stressOfNode[base + 3 * r + 1] = c[row + 1]! * gy + c[row + 3]! * gz + c[row + 5]! * gx;
        stressOfNode[base + 3 * r + 2] = c[row + 2]! * gz + c[row + 3]! * gy + c[row + 4]! * gx;
      }
    }
    // K_ab += B_aᵀ (C B_b), lower block triangle (b ≤ a).
    for (let a = 0; a < n; a++) {
      const gx = gradients[3 * a]!;
      const gy = gradients[3 * a + 1]!;
      const gz = gradients[3 * a + 2]!;
      const rowX = 3 * a * size;
      const rowY = rowX + size;
      const rowZ = rowY + size;
      for (let b = 0; b <= a; b++) {
        const s = 18 * b;
        const column = 3 * b;
        for (let k = 0; k < 3; k++) {
          const s0 = stressOfNode[s + k]!;
          const s1 = stressOfNode[s + 3 + k]!;
          const s2 = stressOfNode[s + 6 + k]!;
          const s3 = stressOfNode[s + 9 + k]!;
          const s4 = stressOfNode[s + 12 + k]!;
          const s5 = stressOfNode[s + 15 + k]!;
          stiffnessOut[rowX + column + k]! += gx * s0 + gz * s4 + gy * s5;
          stiffnessOut[rowY + column + k]! += gy * s1 + gz * s3 + gx * s5;
          stiffnessOut[rowZ + column + k]! += gz * s2 + gy * s3 + gx * s4;
        }
      }
    }
    if (massOut) {
      const values = table.values;
      const scale = density * weight;
      for (let a = 0; a < n; a++) {
        const na = values[q * n + a]! * scale;
        for (let b = 0; b <= a; b++) {
          const m = na * values[q * n + b]!;
          for (let k = 0; k < 3; k++) massOut[(3 * a + k) * size + 3 * b + k]! += m;
        }
      }
    }
  }
  // Mirror the lower block triangle (diagonal blocks are full 3 × 3 and symmetric by construction).
  for (let a = 0; a < n; a++) {
    for (let b = 0; b < a; b++) {
      for (let i = 0; i < 3; i++) {
        for (let k = 0; k < 3; k++) {
          stiffnessOut[(3 * b + k) * size + 3 * a + i] = stiffnessOut[(3 * a + i) * size + 3 * b + k]!;
          if (massOut) massOut[(3 * b + k) * size + 3 * a + i] = massOut[(3 * a + i) * size + 3 * b + k]!;
        }
      }
    }
  }
}
