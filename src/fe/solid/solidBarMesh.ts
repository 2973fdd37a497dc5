import { thicknessAt, type ThicknessProfile } from '../../section/ThicknessProfile.ts';
import { buildMesh } from '../buildMesh.ts';
import { hexahedronType, type HexahedronKind, type HexahedronType } from './hexahedronBasis.ts';

/**
 * Which part of the bar a solid model covers. The mid-width plane y = 0 is a plane of symmetry
 * of a rectangular bar (and of its material when R and T lie along y and z), so every mode is
 * symmetric or antisymmetric across it and the two halves y ≥ 0 solve apart (Zienkiewicz,
 * Taylor & Zhu, 7th ed., §9.12 on symmetry): `symmetric` (u_y = 0 on the plane: vertical
 * bending, longitudinal), `antisymmetric` (u_x = u_z = 0 on it: torsion, lateral bending), or
 * the `full` body.
 */
export type SolidPart = 'symmetric' | 'antisymmetric' | 'full';

/** A rectangular bar in SI units: length, width, blank thickness and the underside profile (flat top). */
export interface SolidBarGeometry {
  readonly length: number;
  readonly width: number;
  /** Blank thickness (m): the flat top is at z = blankThickness, the underside at blankThickness − t(x). */
  readonly blankThickness: number;
  readonly profile: ThicknessProfile;
}

/** Mesh density of a solid bar model. */
export interface SolidMeshOptions {
  /** Target element count along the length (no element longer than length/target); profile stations add element boundaries. */
  readonly lengthElements: number;
  /** Elements across half the width (the full body gets twice as many). */
  readonly halfWidthElements: number;
  /** Elements through the thickness (each a fixed fraction of the local thickness). */
  readonly thicknessElements: number;
  readonly element: HexahedronKind;
  /** Grade the elements across the width toward the side faces (halfWidthBoundaries; default true). */
  readonly widthGrading?: boolean;
  /** Halvings of the elements next to each kink of the underside (lengthSections; default 2). */
  readonly stationRefinement?: number;
}

/**
 * A mapped hexahedral mesh of a bar: element boundaries at x_0 … x_nx (every profile station
 * among them), uniform across the width, and through the thickness at fixed fractions of the
 * local thickness, so the top stays flat and the bottom follows the undercut; the element's
 * mapping is exact because the profile is linear between stations. The nodes are the points of
 * the quadratic lattice (I, J, K) = (0 … 2nx, 0 … 2ny, 0 … 2nz) that the element type uses,
 * numbered slice by slice along the length (I slowest) so the assembled matrices have a narrow
 * envelope.
 */
export interface SolidBarMesh {
  readonly geometry: SolidBarGeometry;
  readonly part: SolidPart;
  readonly element: HexahedronType;
  /** Element boundaries along the length (m). */
  readonly sections: Float64Array;
  readonly elementsAlong: number;
  readonly elementsAcross: number;
  readonly elementsThrough: number;
  /** Lattice points per direction: 2·elements + 1. */
  readonly latticeShape: readonly [number, number, number];
  /** Node number of lattice point (I, J, K) at (I·nJ + J)·nK + K, or −1 where the element type has none. */
  readonly nodeOfLattice: Int32Array;
  readonly nodeCount: number;
  /** x, y, z of node i at [3i … 3i + 2] (m). */
  readonly coordinates: Float64Array;
  /** Lattice indices (I, J, K) of node i at [3i … 3i + 2]. */
  readonly lattice: Int32Array;
  /** Node numbers of element e's local nodes at [e·n … e·n + n − 1] (n = element.nodeCount); elements ordered along, across, through (along slowest). */
  readonly connectivity: Int32Array;
  readonly elementCount: number;
}

/**
 * Element boundaries across the half width y ∈ [0, width/2] (m): uniform, or graded toward the
 * side face by y = (width/2)·sin(πs/2) at s = j/n. Torsion of a wide bar has a shear boundary
 * layer about a thickness wide along each side face (the Prandtl stress function falls from its
 * plateau to zero there; Timoshenko & Goodier, Theory of Elasticity, §109): the grading puts
 * the elements there (measured on the deep-arch bar: see test/solid/solidConvergence.test.ts).
 */
export function halfWidthBoundaries(width: number, elements: number, graded: boolean): Float64Array {
  return Float64Array.from({ length: elements + 1 }, (_, j) => 0.5 * width * (graded ? Math.sin((0.5 * Math.PI * j) / elements) : j / elements));
}

/**
 * Element boundaries along the bar (m): buildMesh's (a boundary at every profile station, none
 * longer than length/target), then each element touching an interior station where the slope
 * of the underside changes is halved `levels` times toward it (boundaries at h/2, h/4, … from
 * the station). The underside's kinks are corners of the solid; where the cut turns in, its
 * stress field is singular (Williams, J. Appl. Mech. 19 (1952) 526) and uniform elements
 * converge slowly there (measured on the deep-arch bar: see test/solid/solidConvergence.test.ts).
 */
export function lengthSections(profile: ThicknessProfile, targetElements: number, levels: number): Float64Array {
  const sections = buildMesh(profile, targetElements);
  if (levels <= 0) return sections;
  const p = profile.positions;
  const t = profile.thicknesses;
  const kinks = new Set<number>();
  for (let k = 1; k + 1 < p.length; k++) {
    const before = (t[k]! - t[k - 1]!) / (p[k]! - p[k - 1]!);
    const after = (t[k + 1]! - t[k]!) / (p[k + 1]! - p[k]!);
    if (Math.abs(after - before) > 1e-9) kinks.add(p[k]!);
  }
  const extra: number[] = [];
  sections.forEach((x, k) => {
    if (!kinks.has(x)) return;
    for (const side of [-1, 1]) {
      const neighbour = sections[k + side];
      if (neighbour === undefined) continue;
      let h = neighbour - x;
      for (let level = 0; level < levels; level++) {
        h /= 2;
        extra.push(x + h);
      }
    }
  });
  // Two kinks one element apart each halve toward the other: their points meet and must not make
  // an element of zero length (boundaries closer than a millionth of the bar's length are one).
  const sorted = [...sections, ...extra].sort((a, b) => a - b);
  const closest = 1e-6 * (sorted[sorted.length - 1]! - sorted[0]!);
  return Float64Array.from(sorted.filter((x, k) => k === 0 || x - sorted[k - 1]! > closest));
}

/** The y of every lattice column (element boundaries and their midpoints). The half models span 0 … width/2; the full body mirrors them to −width/2 … width/2. */
function latticeColumns(geometry: SolidBarGeometry, part: SolidPart, halfElements: number, graded: boolean): Float64Array {
  const half = halfWidthBoundaries(geometry.width, halfElements, graded);
  const boundaries = part === 'full' ? Float64Array.from([...Array.from(half).reverse().map((y) => -y), ...Array.from(half).slice(1)]) : half;
  const columns = new Float64Array(2 * boundaries.length - 1);
  for (let j = 0; j < boundaries.length; j++) {
    columns[2 * j] = boundaries[j]!;
    if (j + 1 < boundaries.length) columns[2 * j + 1] = 0.5 * (boundaries[j]! + boundaries[j + 1]!);
  }
  return columns;
}

/** Builds the mapped mesh of a bar (or of one half of it across the width). */
export function buildSolidBarMesh(geometry: SolidBarGeometry, part: SolidPart, options: SolidMeshOptions): SolidBarMesh {
  const element = hexahedronType(options.element);
  const sections = lengthSections(geometry.profile, options.lengthElements, options.stationRefinement ?? 2);
  const nx = sections.length - 1;
  const ny = (part === 'full' ? 2 : 1) * Math.max(1, Math.floor(options.halfWidthElements));
  const nz = Math.max(1, Math.floor(options.thicknessElements));
  const nI = 2 * nx + 1;
  const nJ = 2 * ny + 1;
  const nK = 2 * nz + 1;
  const keepsFaceNodes = element.nodeCount === 27;
  const columns = latticeColumns(geometry, part, Math.max(1, Math.floor(options.halfWidthElements)), options.widthGrading ?? true);
  const nodeOfLattice = new Int32Array(nI * nJ * nK).fill(-1);
  const coordinatesList: number[] = [];
  const latticeList: number[] = [];
  let nodeCount = 0;
  for (let I = 0; I < nI; I++) {
    const x = I % 2 === 0 ? sections[I / 2]! : 0.5 * (sections[(I - 1) / 2]! + sections[(I + 1) / 2]!);
    const thickness = thicknessAt(geometry.profile, x);
    const bottom = geometry.blankThickness - thickness;
    for (let J = 0; J < nJ; J++) {
      const y = columns[J]!;
      for (let K = 0; K < nK; K++) {
        if (!keepsFaceNodes && (I & 1) + (J & 1) + (K & 1) > 1) continue;
        nodeOfLattice[(I * nJ + J) * nK + K] = nodeCount++;
        coordinatesList.push(x, y, bottom + (thickness * K) / (2 * nz));
        latticeList.push(I, J, K);
      }
    }
  }
  const n = element.nodeCount;
  const elementCount = nx * ny * nz;
  const connectivity = new Int32Array(elementCount * n);
  let e = 0;
  for (let ex = 0; ex < nx; ex++) {
    for (let ey = 0; ey < ny; ey++) {
      for (let ez = 0; ez < nz; ez++, e++) {
        for (let a = 0; a < n; a++) {
          const I = 2 * ex + element.offsets[3 * a]!;
          const J = 2 * ey + element.offsets[3 * a + 1]!;
          const K = 2 * ez + element.offsets[3 * a + 2]!;
          const node = nodeOfLattice[(I * nJ + J) * nK + K]!;
          if (node < 0) throw new Error('internal: solid mesh element refers to a missing lattice node');
          connectivity[e * n + a] = node;
        }
      }
    }
  }
  return {
    geometry,
    part,
    element,
    sections,
    elementsAlong: nx,
    elementsAcross: ny,
    elementsThrough: nz,
    latticeShape: [nI, nJ, nK],
    nodeOfLattice,
    nodeCount,
    coordinates: Float64Array.from(coordinatesList),
    lattice: Int32Array.from(latticeList),
    connectivity,
    elementCount,
  };
}
