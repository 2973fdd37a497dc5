import { createEnvelopeMatrix, envelopeAddElement, envelopeLayout, type EnvelopeMatrix } from '../../eigen/EnvelopeMatrix.ts';
import type { VoigtStiffness } from '../../material/orthotropicStiffness.ts';
import { hexahedronTable } from './hexahedronBasis.ts';
import type { SolidBarMesh } from './solidBarMesh.ts';
import { solidElementMatrices, solidElementScratch } from './solidElement.ts';

/** The elastic solid's material: Voigt stiffness in the bar's axes (Pa) and density (kg/m³). */
export interface SolidMaterial {
  readonly stiffness: VoigtStiffness;
  readonly density: number;
}

/** Assembled stiffness and consistent mass of a solid bar mesh (envelope storage, one layout). */
export interface SolidSystem {
  readonly mesh: SolidBarMesh;
  readonly material: SolidMaterial;
  /** Global dof of displacement component c (0 x, 1 y, 2 z) of node i at [3i + c], or −1 where the mirror plane fixes it. */
  readonly nodeDofs: Int32Array;
  readonly dofCount: number;
  readonly stiffness: EnvelopeMatrix;
  readonly mass: EnvelopeMatrix;
  /** How many element matrices were computed; the others were the same shape moved (reused). */
  readonly distinctElements: number;
}

/**
 * Global dofs of a mesh's nodes, in node order: all three components, except on the mid-width
 * plane (lattice column J = 0) of a half model, where the symmetric part fixes u_y and the
 * antisymmetric part fixes u_x and u_z.
 */
export function solidNodeDofs(mesh: SolidBarMesh): { nodeDofs: Int32Array; dofCount: number } {
  const nodeDofs = new Int32Array(3 * mesh.nodeCount).fill(-1);
  let dofCount = 0;
  for (let node = 0; node < mesh.nodeCount; node++) {
    const onPlane = mesh.part !== 'full' && mesh.lattice[3 * node + 1] === 0;
    for (let c = 0; c < 3; c++) {
      const fixed = onPlane && (mesh.part === 'symmetric' ? c === 1 : c !== 1);
      if (!fixed) nodeDofs[3 * node + c] = dofCount++;
    }
  }
  return { nodeDofs, dofCount };
}

/** Rounds a coordinate difference to a picometre for the element-shape key (changes below that are not geometry). */
function keyPart(value: number): number {
  return Math.round(value * 1e12);
}

/**
 * Assembles K and M of a solid bar mesh (pipeline: mesh → element → assembly). Element matrices
 * come from solidElementMatrices at 3 × 3 × 3 Gauss points; an element that is the translate of
 * one already computed (every element across the width, and equal elements along uncut parts)
 * reuses its matrices, keyed by the node coordinates relative to its first node to a picometre.
 * The envelope of each row reaches back to the first dof of the elements that hold it.
 */
export function assembleSolidBar(mesh: SolidBarMesh, material: SolidMaterial): SolidSystem {
  const { nodeDofs, dofCount } = solidNodeDofs(mesh);
  const n = mesh.element.nodeCount;
  const size = 3 * n;
  const dofs = new Int32Array(size);
  const elementDofs = (e: number): Int32Array => {
    for (let a = 0; a < n; a++) {
      const node = mesh.connectivity[e * n + a]!;
      for (let c = 0; c < 3; c++) dofs[3 * a + c] = nodeDofs[3 * node + c]!;
    }
    return dofs;
  };
  const firstColumn = Int32Array.from({ length: dofCount }, (_, i) => i);
  for (let e = 0; e < mesh.elementCount; e++) {
    const d = elementDofs(e);
    let lowest = dofCount;
    for (let k = 0; k < size; k++) if (d[k]! >= 0 && d[k]! < lowest) lowest = d[k]!;
    for (let k = 0; k < size; k++) if (d[k]! >= 0 && firstColumn[d[k]!]! > lowest) firstColumn[d[k]!] = lowest;
  }
  const layout = envelopeLayout(firstColumn);
  const stiffness = createEnvelopeMatrix(layout);
  const mass = createEnvelopeMatrix(layout);
  const table = hexahedronTable(mesh.element);
  const scratch = solidElementScratch(n);
  const coordinates = new Float64Array(size);
  const cache = new Map<string, { stiffness: Float64Array; mass: Float64Array }>();
  for (let e = 0; e < mesh.elementCount; e++) {
    const origin = mesh.connectivity[e * n]!;
    const keyParts: number[] = [];
    for (let a = 0; a < n; a++) {
      const node = mesh.connectivity[e * n + a]!;
      for (let c = 0; c < 3; c++) {
        const value = mesh.coordinates[3 * node + c]!;
        coordinates[3 * a + c] = value;
        if (a > 0) keyParts.push(keyPart(value - mesh.coordinates[3 * origin + c]!));
      }
    }
    const key = keyParts.join(',');
    let matrices = cache.get(key);
    if (!matrices) {
      matrices = { stiffness: new Float64Array(size * size), mass: new Float64Array(size * size) };
      solidElementMatrices(table, coordinates, material.stiffness, material.density, matrices.stiffness, matrices.mass, scratch);
      cache.set(key, matrices);
    }
    const d = elementDofs(e);
    envelopeAddElement(stiffness, d, matrices.stiffness);
    envelopeAddElement(mass, d, matrices.mass);
  }
  return { mesh, material, nodeDofs, dofCount, stiffness, mass, distinctElements: cache.size };
}

/**
 * The rigid-body motions a part admits, as global dof vectors: on the full body the three
 * translations and three rotations; on the symmetric half translations along x and z and the
 * rotation about y; on the antisymmetric half the translation along y and the rotations about x
 * and z (the others break the mirror condition). Rotations are about the bar's mid-length at
 * mid-height of the blank (any centre spans the same space).
 */
export function solidRigidModes(system: SolidSystem): Float64Array[] {
  const { mesh, nodeDofs, dofCount } = system;
  const xc = 0.5 * mesh.geometry.length;
  const zc = 0.5 * mesh.geometry.blankThickness;
  type Motion = (x: number, y: number, z: number) => [number, number, number];
  const translateX: Motion = () => [1, 0, 0];
  const translateY: Motion = () => [0, 1, 0];
  const translateZ: Motion = () => [0, 0, 1];
  const aboutX: Motion = (_x, y, z) => [0, -(z - zc), y];
  const aboutY: Motion = (x, _y, z) => [z - zc, 0, -(x - xc)];
  const aboutZ: Motion = (x, y) => [-y, x - xc, 0];
  const motions =
    mesh.part === 'symmetric' ? [translateX, translateZ, aboutY] : mesh.part === 'antisymmetric' ? [translateY, aboutX, aboutZ] : [translateX, translateY, translateZ, aboutX, aboutY, aboutZ];
  return motions.map((motion) => {
    const vector = new Float64Array(dofCount);
    for (let node = 0; node < mesh.nodeCount; node++) {
      const u = motion(mesh.coordinates[3 * node]!, mesh.coordinates[3 * node + 1]!, mesh.coordinates[3 * node + 2]!);
      for (let c = 0; c < 3; c++) {
        const dof = nodeDofs[3 * node + c]!;
        if (dof >= 0) vector[dof] = u[c]!;
      }
    }
    return vector;
  });
}
