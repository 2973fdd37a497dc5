import { createEnvelopeMatrix, envelopeAddCombination, envelopeAddElement, envelopeLayout, type EnvelopeMatrix } from '../../eigen/EnvelopeMatrix.ts';
import type { SparseSymmetricMatrix } from '../../eigen/SparseSymmetricMatrix.ts';
import type { SolidMaterial } from '../../material/solidElasticity.ts';
import { hexahedronTable } from './hexahedronBasis.ts';
import type { SolidBarMesh } from './solidBarMesh.ts';
import { isAxisAligned, solidElementMatrices, solidElementScratch, solidElementWidthParts } from './solidElement.ts';

export type { SolidMaterial } from '../../material/solidElasticity.ts';

/**
 * Assembled stiffness (envelope storage) and consistent mass (compressed: it couples only equal
 * displacement components, so its envelope would be mostly zeros) of a solid bar mesh.
 */
export interface SolidSystem {
  readonly mesh: SolidBarMesh;
  readonly material: SolidMaterial;
  /** Global dof of displacement component c (0 x, 1 y, 2 z) of node i at [3i + c], or −1 where the mirror plane fixes it. */
  readonly nodeDofs: Int32Array;
  readonly dofCount: number;
  readonly stiffness: EnvelopeMatrix;
  readonly mass: SparseSymmetricMatrix;
  /** How many element computations were made; the other elements reused one (moved, or another width of the same slice). */
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
 * come from 3 × 3 × 3 Gauss points; an element that is the translate of one already computed
 * (equal elements along uncut parts) reuses its matrices, keyed by the node coordinates relative
 * to its first node to a picometre. For a material orthotropic in the bar's axes the key leaves
 * out y, and every width across a slice comes from one split computation
 * (solidElementWidthParts), since the mesh is affine across the width.
 * K goes into an envelope whose rows reach back to the first dof of the elements that hold
 * them; the consistent mass ρ∫N_aN_b dV is assembled node by node and expanded to the three
 * components (where the mirror plane leaves them free).
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
  const stiffness = createEnvelopeMatrix(envelopeLayout(firstColumn));
  // The scalar mass node by node, in a node-level envelope (entry (A, B) at nodeOffset[A] + B).
  const nodeFirst = Int32Array.from({ length: mesh.nodeCount }, (_, i) => i);
  for (let e = 0; e < mesh.elementCount; e++) {
    let lowest = mesh.nodeCount;
    for (let a = 0; a < n; a++) lowest = Math.min(lowest, mesh.connectivity[e * n + a]!);
    for (let a = 0; a < n; a++) {
      const node = mesh.connectivity[e * n + a]!;
      if (nodeFirst[node]! > lowest) nodeFirst[node] = lowest;
    }
  }
  const nodeLayout = envelopeLayout(nodeFirst);
  const nodeMass = new Float64Array(nodeLayout.entries);
  const nodeOffset = nodeLayout.rowOffset;
  const table = hexahedronTable(mesh.element);
  const scratch = solidElementScratch(n, table.pointCount);
  const coordinates = new Float64Array(size);
  const fullMass = new Float64Array(size * size);
  const elementMass = new Float64Array(n * n);
  // Axis-aligned materials: one computation per element shape in x and z, every width from it.
  const aligned = isAxisAligned(material.stiffness);
  type Cached = { stiffness: Float64Array; mass: Float64Array } | { none: Float64Array; one: Float64Array; two: Float64Array; mass: Float64Array };
  const cache = new Map<string, Cached>();
  for (let e = 0; e < mesh.elementCount; e++) {
    const origin = mesh.connectivity[e * n]!;
    const keyParts: number[] = [];
    let yMin = Infinity;
    let yMax = -Infinity;
    for (let a = 0; a < n; a++) {
      const node = mesh.connectivity[e * n + a]!;
      for (let c = 0; c < 3; c++) {
        const value = mesh.coordinates[3 * node + c]!;
        coordinates[3 * a + c] = value;
        if (a > 0 && !(aligned && c === 1)) keyParts.push(keyPart(value - mesh.coordinates[3 * origin + c]!));
      }
      yMin = Math.min(yMin, coordinates[3 * a + 1]!);
      yMax = Math.max(yMax, coordinates[3 * a + 1]!);
    }
    const key = keyParts.join(',');
    let cached = cache.get(key);
    if (!cached) {
      if (aligned) {
        // The element at width 2 (y = η + 1), where the split is computed.
        for (let a = 0; a < n; a++) coordinates[3 * a + 1] = mesh.element.offsets[3 * a + 1]!;
        cached = { none: new Float64Array(size * size), one: new Float64Array(size * size), two: new Float64Array(size * size), mass: new Float64Array(n * n) };
        solidElementWidthParts(table, coordinates, material.stiffness, material.density, cached, scratch);
      } else {
        cached = { stiffness: new Float64Array(size * size), mass: new Float64Array(n * n) };
        solidElementMatrices(table, coordinates, material.stiffness, material.density, cached.stiffness, fullMass, scratch);
        // The mass is the same for each component: keep its scalar (node by node) block.
        for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) cached.mass[a * n + b] = fullMass[3 * a * size + 3 * b]!;
      }
      cache.set(key, cached);
    }
    let massBlock: Float64Array;
    if ('none' in cached) {
      // K(h) = (h/2)·K₀ + K₁ + (2/h)·K₂, M(h) = (h/2)·M₀ (solidElementWidthParts).
      const width = yMax - yMin;
      envelopeAddCombination(stiffness, elementDofs(e), width / 2, cached.none, 1, cached.one, 2 / width, cached.two);
      for (let k = 0; k < n * n; k++) elementMass[k] = (width / 2) * cached.mass[k]!;
      massBlock = elementMass;
    } else {
      envelopeAddElement(stiffness, elementDofs(e), cached.stiffness);
      massBlock = cached.mass;
    }
    for (let a = 0; a < n; a++) {
      const row = mesh.connectivity[e * n + a]!;
      const offset = nodeOffset[row]!;
      for (let b = 0; b < n; b++) {
        const column = mesh.connectivity[e * n + b]!;
        if (column <= row) nodeMass[offset + column]! += massBlock[a * n + b]!;
      }
    }
  }
  // Expand the node-by-node mass to dofs (rows in dof order: nodes ascending, then components;
  // exact zeros left out).
  let count = 0;
  for (let node = 0; node < mesh.nodeCount; node++) {
    const offset = nodeOffset[node]!;
    for (let other = nodeFirst[node]!; other < node; other++) if (nodeMass[offset + other] !== 0) count++;
  }
  const rowStart = new Int32Array(dofCount + 1);
  const columns = new Int32Array(3 * count);
  const values = new Float64Array(3 * count);
  const diagonal = new Float64Array(dofCount);
  let k = 0;
  for (let node = 0; node < mesh.nodeCount; node++) {
    const offset = nodeOffset[node]!;
    for (let c = 0; c < 3; c++) {
      const dof = nodeDofs[3 * node + c]!;
      if (dof < 0) continue;
      diagonal[dof] = nodeMass[offset + node]!;
      for (let other = nodeFirst[node]!; other < node; other++) {
        const value = nodeMass[offset + other]!;
        const column = nodeDofs[3 * other + c]!;
        if (value === 0 || column < 0) continue;
        columns[k] = column;
        values[k++] = value;
      }
      rowStart[dof + 1] = k;
    }
  }
  const mass: SparseSymmetricMatrix = { size: dofCount, diagonal, rowStart, columns: columns.slice(0, k), values: values.slice(0, k) };
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
