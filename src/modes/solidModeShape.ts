import type { SolidSystem } from '../fe/solid/assembleSolid.ts';

/** The four mode families of a bar, as the solid model tells them apart. */
export type SolidModeKind = 'bending' | 'torsion' | 'lateral' | 'longitudinal';

/** Every kind, in the order results list them. */
export const solidModeKinds: readonly SolidModeKind[] = ['bending', 'torsion', 'lateral', 'longitudinal'];

/**
 * A solid mode seen as a beam: at every lattice slice x_I of the mesh, the cross-section's mean
 * axial displacement ū, lateral v̄ and vertical w̄ displacements, and its twist ψ (least-squares
 * rotation about the section's centre: ψ = Σ[(u_z − w̄)·y − (u_y − v̄)·(z − z̄)] / Σ[y² + (z − z̄)²]).
 * Nodes of a slice count equally (nodes on the mirror plane of a half model half, so a half and
 * the full body give the same curves).
 */
export interface SectionMotion {
  /** Slice positions (m). */
  readonly x: Float64Array;
  readonly axial: Float64Array;
  readonly lateral: Float64Array;
  readonly vertical: Float64Array;
  readonly twist: Float64Array;
  /** Mean of y² + (z − z̄)² over each slice (m²): the twist's inertia per unit area. */
  readonly radiusSquared: Float64Array;
  /** Slice thickness (m). */
  readonly thickness: Float64Array;
}

/** The displacement component c of node `node` in a global vector (0 where the mirror plane fixes it). */
function nodeDisplacement(system: SolidSystem, vector: ArrayLike<number>, node: number, c: number): number {
  const dof = system.nodeDofs[3 * node + c]!;
  return dof < 0 ? 0 : vector[dof]!;
}

/** The section motion (see SectionMotion) of a mode vector of a solid system. */
export function sectionMotion(system: SolidSystem, vector: ArrayLike<number>): SectionMotion {
  const { mesh } = system;
  const [nI, nJ, nK] = mesh.latticeShape;
  const half = mesh.part !== 'full';
  const x = new Float64Array(nI);
  const axial = new Float64Array(nI);
  const lateral = new Float64Array(nI);
  const vertical = new Float64Array(nI);
  const twist = new Float64Array(nI);
  const radiusSquared = new Float64Array(nI);
  const thickness = new Float64Array(nI);
  for (let I = 0; I < nI; I++) {
    let weightSum = 0;
    let zSum = 0;
    let ux = 0;
    let uy = 0;
    let uz = 0;
    let zMin = Infinity;
    let zMax = -Infinity;
    const forEachNode = (visit: (node: number, weight: number) => void) => {
      for (let J = 0; J < nJ; J++) {
        const weight = half && J === 0 ? 0.5 : 1;
        for (let K = 0; K < nK; K++) {
          const node = mesh.nodeOfLattice[(I * nJ + J) * nK + K]!;
          if (node >= 0) visit(node, weight);
        }
      }
    };
    forEachNode((node, weight) => {
      const z = mesh.coordinates[3 * node + 2]!;
      x[I] = mesh.coordinates[3 * node]!;
      weightSum += weight;
      zSum += weight * z;
      zMin = Math.min(zMin, z);
      zMax = Math.max(zMax, z);
      ux += weight * nodeDisplacement(system, vector, node, 0);
      uy += weight * nodeDisplacement(system, vector, node, 1);
      uz += weight * nodeDisplacement(system, vector, node, 2);
    });
    const zMean = zSum / weightSum;
    // On a half model the antisymmetric means vanish over the whole section by symmetry.
    axial[I] = mesh.part === 'antisymmetric' ? 0 : ux / weightSum;
    vertical[I] = mesh.part === 'antisymmetric' ? 0 : uz / weightSum;
    lateral[I] = mesh.part === 'symmetric' ? 0 : uy / weightSum;
    let numerator = 0;
    let denominator = 0;
    forEachNode((node, weight) => {
      const y = mesh.coordinates[3 * node + 1]!;
      const z = mesh.coordinates[3 * node + 2]! - zMean;
      const vy = nodeDisplacement(system, vector, node, 1) - lateral[I]!;
      const vz = nodeDisplacement(system, vector, node, 2) - vertical[I]!;
      numerator += weight * (vz * y - vy * z);
      denominator += weight * (y * y + z * z);
    });
    twist[I] = mesh.part === 'symmetric' ? 0 : numerator / denominator;
    radiusSquared[I] = denominator / weightSum;
    thickness[I] = zMax - zMin;
  }
  return { x, axial, lateral, vertical, twist, radiusSquared, thickness };
}

/** Which family a mode belongs to, how clearly, and its beam-like displacement curve. */
export interface ModeClassification {
  readonly kind: SolidModeKind;
  /** Share of the beam-like kinetic energy in the winning family (0–1; near 1 for a clean mode). */
  readonly purity: number;
  /** Sign changes of the winning family's curve along the bar (bending n: n + 1, torsion and longitudinal n: n). */
  readonly signChanges: number;
  /** The winning family's curve at the slices (w̄, ψ, v̄ or ū), for plots. */
  readonly curve: Float64Array;
  /** The slices' positions along the bar (m). */
  readonly slices: Float64Array;
}

/**
 * Classifies a solid mode by the kinetic energy of its section motion per family, integrated
 * along the bar with Simpson's weights on the quadratic slices (proportional to ρ):
 * vertical ∫A·w̄², lateral ∫A·v̄², longitudinal ∫A·ū², torsion ∫A·r̄²·ψ² (A ∝ the slice thickness).
 * The family with the largest share wins.
 */
export function classifySolidMode(system: SolidSystem, vector: ArrayLike<number>): ModeClassification {
  const motion = sectionMotion(system, vector);
  const energies = { bending: 0, torsion: 0, lateral: 0, longitudinal: 0 };
  const n = motion.x.length;
  for (let I = 0; I < n; I++) {
    // Simpson's rule on each element's three slices: weights h/6 · (1, 4, 1).
    let weight = 0;
    if (I % 2 === 1) weight = (4 * (motion.x[I + 1]! - motion.x[I - 1]!)) / 6;
    else {
      if (I > 0) weight += (motion.x[I]! - motion.x[I - 2]!) / 6;
      if (I + 2 < n) weight += (motion.x[I + 2]! - motion.x[I]!) / 6;
    }
    const area = weight * motion.thickness[I]!;
    energies.bending += area * motion.vertical[I]! ** 2;
    energies.lateral += area * motion.lateral[I]! ** 2;
    energies.longitudinal += area * motion.axial[I]! ** 2;
    energies.torsion += area * motion.radiusSquared[I]! * motion.twist[I]! ** 2;
  }
  let kind: SolidModeKind = 'bending';
  let total = 0;
  for (const k of Object.keys(energies) as SolidModeKind[]) {
    total += energies[k];
    if (energies[k] > energies[kind]) kind = k;
  }
  const curve = kind === 'bending' ? motion.vertical : kind === 'torsion' ? motion.twist : kind === 'lateral' ? motion.lateral : motion.axial;
  return { kind, purity: total > 0 ? energies[kind] / total : 0, signChanges: signChanges(curve), curve, slices: motion.x };
}

/** Sign changes along a sequence, ignoring values under 1e-6 of its largest magnitude. */
export function signChanges(values: ArrayLike<number>): number {
  let largest = 0;
  for (let i = 0; i < values.length; i++) largest = Math.max(largest, Math.abs(values[i]!));
  let count = 0;
  let previous = 0;
  for (let i = 0; i < values.length; i++) {
    const value = values[i]!;
    if (Math.abs(value) <= 1e-6 * largest) continue;
    const sign = Math.sign(value);
    if (previous !== 0 && sign !== previous) count++;
    previous = sign;
  }
  return count;
}

/**
 * Where a mode's nodal lines cross the top face's centre line (m from the left end): the zeros
 * of its main motion along the top of the bar, from the quadratic interpolant of each element's
 * three nodes there. The motion read is u_z on the centre line for bending, u_x there for
 * longitudinal modes, u_y there for lateral modes, and u_z along the top's side edge for torsion
 * (the centre line itself is nodal in torsion; its crossing lines are where the twist changes
 * sign).
 */
export function topFaceNodalLines(system: SolidSystem, vector: ArrayLike<number>, kind: SolidModeKind): Float64Array {
  const { mesh } = system;
  const [nI, nJ, nK] = mesh.latticeShape;
  const centre = mesh.part === 'full' ? (nJ - 1) / 2 : 0;
  const J = kind === 'torsion' ? nJ - 1 : centre;
  const component = kind === 'bending' || kind === 'torsion' ? 2 : kind === 'lateral' ? 1 : 0;
  const values = new Float64Array(nI);
  const x = new Float64Array(nI);
  let largest = 0;
  for (let I = 0; I < nI; I++) {
    const node = mesh.nodeOfLattice[(I * nJ + J) * nK + nK - 1]!;
    x[I] = mesh.coordinates[3 * node]!;
    values[I] = nodeDisplacement(system, vector, node, component);
    largest = Math.max(largest, Math.abs(values[I]!));
  }
  const crossings: number[] = [];
  const floor = 1e-9 * largest;
  for (let e = 0; 2 * e + 2 < nI; e++) {
    const f0 = values[2 * e]!;
    const f1 = values[2 * e + 1]!;
    const f2 = values[2 * e + 2]!;
    // f(s) = a s² + b s + c on s ∈ [−1, 1] through (−1, f0), (0, f1), (1, f2).
    const a = 0.5 * (f0 + f2) - f1;
    const b = 0.5 * (f2 - f0);
    const c = f1;
    const roots: number[] = [];
    if (Math.abs(a) <= 1e-14 * (Math.abs(b) + Math.abs(c))) {
      if (b !== 0) roots.push(-c / b);
    } else {
      const discriminant = b * b - 4 * a * c;
      if (discriminant >= 0) {
        const q = -0.5 * (b + Math.sign(b || 1) * Math.sqrt(discriminant));
        roots.push(q / a);
        if (q !== 0) roots.push(c / q);
      }
    }
    const x0 = x[2 * e]!;
    const x2 = x[2 * e + 2]!;
    for (const s of roots.sort((p, q) => p - q)) {
      // A root on the element's right end belongs to the next element (half-open [−1, 1)).
      if (!(s >= -1 && s < 1)) continue;
      // Only genuine sign changes, not touching zeros or numerical dust.
      const left = a * (s - 1e-6) ** 2 + b * (s - 1e-6) + c;
      const right = a * (s + 1e-6) ** 2 + b * (s + 1e-6) + c;
      if (Math.sign(left) === Math.sign(right) || Math.max(Math.abs(f0), Math.abs(f1), Math.abs(f2)) <= floor) continue;
      crossings.push(x0 + ((s + 1) / 2) * (x2 - x0));
    }
  }
  return Float64Array.from(crossings);
}
