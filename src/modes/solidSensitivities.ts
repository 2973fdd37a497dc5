import { hexahedronTable } from '../fe/solid/hexahedronBasis.ts';
import { elementEnergyDerivatives } from '../fe/solid/solidShapeDerivative.ts';
import { profileInterval } from '../section/ThicknessProfile.ts';
import type { SolidPartSolution } from './solidBarModes.ts';

/**
 * The exact derivatives dλ/dt_j of a solid mode's eigenvalue λ = ω² (rad²/s² per metre) with
 * respect to the thickness t_j at every profile station j, the top staying flat: moving t_j moves
 * the mesh's nodes by z′ = −h_j(x)·(1 − s) (h_j the station's hat function, s the node's height
 * fraction above the underside), and dλ = φᵀ(∂K − λ∂M)φ is summed element by element from
 * elementEnergyDerivatives (φ M-normalised on its part). The derivative of the discrete
 * eigenvalue on this mesh, as the line model's bendingSensitivities; df/dt = dλ/dt / (8π²f).
 * Cost: one pass over the elements per mode, far below a solve.
 */
export function solidThicknessSensitivities(solution: SolidPartSolution, vectorIndex: number): Float64Array {
  const { system } = solution;
  const { mesh } = system;
  const profile = mesh.geometry.profile;
  const stations = profile.positions;
  const result = new Float64Array(stations.length);
  const eigenvalue = solution.eigenvalues[vectorIndex]!;
  const vector = solution.vectors[vectorIndex]!;
  const n = mesh.element.nodeCount;
  const table = hexahedronTable(mesh.element);
  const nK = mesh.latticeShape[2];
  const coordinates = new Float64Array(3 * n);
  const displacement = new Float64Array(3 * n);
  const velocities = [new Float64Array(3 * n), new Float64Array(3 * n)];
  const stiffnessRate = new Float64Array(2);
  const massRate = new Float64Array(2);
  const { density, stiffness } = system.material;
  for (let e = 0; e < mesh.elementCount; e++) {
    let xMin = Infinity;
    let xMax = -Infinity;
    for (let a = 0; a < n; a++) {
      const node = mesh.connectivity[e * n + a]!;
      for (let c = 0; c < 3; c++) {
        coordinates[3 * a + c] = mesh.coordinates[3 * node + c]!;
        const dof = system.nodeDofs[3 * node + c]!;
        displacement[3 * a + c] = dof < 0 ? 0 : vector[dof]!;
      }
      xMin = Math.min(xMin, coordinates[3 * a]!);
      xMax = Math.max(xMax, coordinates[3 * a]!);
    }
    // The element lies in one station interval [p_k, p_k+1]: only t_k and t_k+1 move its nodes.
    const k = profileInterval(profile, 0.5 * (xMin + xMax));
    const left = stations[k]!;
    const span = stations[k + 1]! - left;
    for (let a = 0; a < n; a++) {
      const node = mesh.connectivity[e * n + a]!;
      const s = mesh.lattice[3 * node + 2]! / (nK - 1);
      const right = (coordinates[3 * a]! - left) / span;
      velocities[0]![3 * a + 2] = -(1 - right) * (1 - s);
      velocities[1]![3 * a + 2] = -right * (1 - s);
    }
    elementEnergyDerivatives(table, coordinates, displacement, velocities, stiffness, density, stiffnessRate, massRate);
    result[k]! += stiffnessRate[0]! - eigenvalue * massRate[0]!;
    result[k + 1]! += stiffnessRate[1]! - eigenvalue * massRate[1]!;
  }
  return result;
}
