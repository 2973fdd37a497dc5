import type { HexahedronTable } from './hexahedronBasis.ts';
import { hexahedronGradients } from './solidElement.ts';

const voigtPairs = [
  [0, 0],
  [1, 1],
  [2, 2],
  [1, 2],
  [0, 2],
  [0, 1],
];

/**
 * Derivatives of one element's energies uᵀK_e u and uᵀM_e u (u fixed) when its nodes move with a
 * velocity field V (a design change), exact for the discrete element: with G = ∇V (interpolated
 * like the geometry) and H = ∇u at each Gauss point, d(det J) = det J·tr G and dH = −H·G, so
 *   d(uᵀK_e u) = Σ_q w_q det J [2 σ·dε + (σ·ε) tr G],  d(uᵀM_e u) = Σ_q w_q det J ρ|u|² tr G,
 * with σ = C ε, dε = sym(dH) in Voigt form (the material derivative of the energy; Haug, Choi &
 * Komkov, Design Sensitivity Analysis of Structural Systems (1986), ch. 3). `velocities` holds one
 * field per design variable (3n entries each, node by node); results go to stiffnessOut[k] and
 * massOut[k].
 */
export function elementEnergyDerivatives(
  table: HexahedronTable,
  coordinates: ArrayLike<number>,
  displacement: ArrayLike<number>,
  velocities: readonly ArrayLike<number>[],
  stiffness: ArrayLike<number>,
  density: number,
  stiffnessOut: Float64Array,
  massOut: Float64Array,
): void {
  const n = table.type.nodeCount;
  const gradients = new Float64Array(3 * n);
  const H = new Float64Array(9);
  const strain = new Float64Array(6);
  const stress = new Float64Array(6);
  const G = new Float64Array(9);
  const dH = new Float64Array(9);
  stiffnessOut.fill(0);
  massOut.fill(0);
  for (let q = 0; q < table.pointCount; q++) {
    const det = hexahedronGradients(table, q, coordinates, gradients);
    const weight = table.weights[q]! * det;
    H.fill(0);
    let u0 = 0;
    let u1 = 0;
    let u2 = 0;
    for (let a = 0; a < n; a++) {
      const shape = table.values[q * n + a]!;
      u0 += shape * displacement[3 * a]!;
      u1 += shape * displacement[3 * a + 1]!;
      u2 += shape * displacement[3 * a + 2]!;
      for (let i = 0; i < 3; i++) {
        const ui = displacement[3 * a + i]!;
        for (let j = 0; j < 3; j++) H[i * 3 + j]! += ui * gradients[3 * a + j]!;
      }
    }
    for (let k = 0; k < 6; k++) {
      const [i, j] = voigtPairs[k]!;
      strain[k] = i === j ? H[i! * 3 + i!]! : H[i! * 3 + j!]! + H[j! * 3 + i!]!;
    }
    let energy = 0;
    for (let r = 0; r < 6; r++) {
      let s = 0;
      for (let c = 0; c < 6; c++) s += stiffness[r * 6 + c]! * strain[c]!;
      stress[r] = s;
      energy += s * strain[r]!;
    }
    const kinetic = density * (u0 * u0 + u1 * u1 + u2 * u2);
    velocities.forEach((velocity, field) => {
      G.fill(0);
      for (let a = 0; a < n; a++) {
        for (let i = 0; i < 3; i++) {
          const vi = velocity[3 * a + i]!;
          if (vi === 0) continue;
          for (let j = 0; j < 3; j++) G[i * 3 + j]! += vi * gradients[3 * a + j]!;
        }
      }
      const trace = G[0]! + G[4]! + G[8]!;
      // dH = −H·G
      for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) dH[i * 3 + j] = -(H[i * 3]! * G[j]! + H[i * 3 + 1]! * G[3 + j]! + H[i * 3 + 2]! * G[6 + j]!);
      let work = 0;
      for (let k = 0; k < 6; k++) {
        const [i, j] = voigtPairs[k]!;
        const d = i === j ? dH[i! * 3 + i!]! : dH[i! * 3 + j!]! + dH[j! * 3 + i!]!;
        work += stress[k]! * d;
      }
      stiffnessOut[field]! += weight * (2 * work + energy * trace);
      massOut[field]! += weight * kinetic * trace;
    });
  }
}
