import numeric from 'numeric';
import { scanForRoots } from './scanForRoots.ts';

/** Section properties along a bar, SI, as functions of the position x (m) from the left end. */
export interface BeamSectionFunctions {
  /** EI(x), N·m². */
  bendingStiffness: (x: number) => number;
  /** κGA(x), N (ignored by the Euler–Bernoulli theory). */
  shearStiffness: (x: number) => number;
  /** ρA(x), kg/m. */
  massPerLength: (x: number) => number;
  /** ρI(x), kg·m (ignored by the Euler–Bernoulli theory). */
  rotaryInertiaPerLength: (x: number) => number;
}

/** Options of the shooting solver. */
export interface ShootingOptions {
  /** 'timoshenko' (default) or 'euler-bernoulli' (no shear flexibility, no rotary inertia). */
  theory?: 'timoshenko' | 'euler-bernoulli';
  /** Positions (m) where the section has kinks: integration restarts there. 0 and L are added. */
  stations?: readonly number[];
  /** Absolute error tolerance of each Dormand–Prince step on the scaled, normalised state (default 1e-10). */
  tolerance?: number;
  /** Longest integration piece as a fraction of L (default 1/16; bounds the growth between re-orthonormalisations). */
  maximumPiece?: number;
  /**
   * Scan step in the dimensionless frequency q = (ω² ρA₀ L⁴ / EI₀)^¼ (βL for a uniform bar;
   * default 0.25, about a tenth of the spacing of the lowest roots, ≈ 2.4–3.1).
   */
  scanStep?: number;
  /** End conditions at both ends: 'free' (M = V = 0, default) or 'simply-supported' (w = M = 0). */
  ends?: 'free' | 'simply-supported';
}

/**
 * Bending frequencies (Hz, ascending, rigid-body modes excluded) of a free–free (or, for checks,
 * simply supported) bar of variable section by shooting on the first-order Timoshenko system (state w, θ, M, V):
 *   w' = θ + V/(κGA),  θ' = M/(EI),  M' = −V − ω² ρI θ,  V' = −ω² ρA w,
 * or its Euler–Bernoulli limit (1/κGA = 0, ρI = 0). From x = 0 with M = V = 0 the two
 * independent solutions started at (w, θ) = (1, 0) and (0, 1) are integrated by numeric.dopri
 * (Dormand–Prince 5(4)) piecewise between stations, in variables scaled by the frequency so all
 * four components are of one size, and re-orthonormalised (Gram–Schmidt) after each piece so the
 * exponentially growing solution does not swamp the other. ω is a frequency when the 2×2 matrix
 * of [M(L), V(L)] (simply supported: [w(L), M(L)]) of the two solutions is singular; its determinant (sign-continuous in ω since
 * Gram–Schmidt only divides by positive norms) is scanned in q and the sign changes refined by
 * Brent's method. Independent of the finite-element code. Accuracy ~1e-11 relative with the
 * default tolerance (checked against closed forms and by tightening it); slow, about 0.1 s per
 * frequency, so for tests only.
 */
export function timoshenkoShootingFrequencies(
  section: BeamSectionFunctions,
  length: number,
  count: number,
  options: ShootingOptions = {},
): number[] {
  const { theory = 'timoshenko', stations = [], tolerance = 1e-10, maximumPiece = 1 / 16, scanStep = 0.25, ends = 'free' } = options;
  const breaks = integrationBreaks(stations, length, maximumPiece);
  // Reference values at mid-length scale the problem: x̂ = x/L, ŵ = w/L, M̂ = M L/EI₀, V̂ = V L²/EI₀.
  const bendingReference = section.bendingStiffness(length / 2);
  const massReference = section.massPerLength(length / 2);
  const omegaScale = Math.sqrt(bendingReference / (massReference * length ** 4));
  const timoshenko = theory === 'timoshenko';
  const determinant = (q: number): number =>
    endDeterminant(q, section, length, breaks, bendingReference, massReference, timoshenko, tolerance, ends === 'free');
  const roots = scanForRoots(determinant, { start: 0.5, step: scanStep, end: 20 + 6 * count, count, absoluteTolerance: 1e-12 });
  // q⁴ = ω² ρA₀ L⁴ / EI₀.
  return roots.map((q) => (q * q * omegaScale) / (2 * Math.PI));
}

/** Sorted piece ends in x/L: stations plus subdivisions so no piece exceeds `maximumPiece`. */
function integrationBreaks(stations: readonly number[], length: number, maximumPiece: number): number[] {
  const knots = [...new Set([0, 1, ...stations.map((x) => x / length)])].filter((s) => s >= 0 && s <= 1).sort((a, b) => a - b);
  const breaks = [0];
  for (let i = 1; i < knots.length; i++) {
    const from = knots[i - 1]!;
    const to = knots[i]!;
    const pieces = Math.max(1, Math.ceil((to - from) / maximumPiece - 1e-12));
    for (let k = 1; k <= pieces; k++) breaks.push(k === pieces ? to : from + ((to - from) * k) / pieces);
  }
  return breaks;
}

/**
 * det [[M̂_a, M̂_b], [V̂_a, V̂_b]] (simply supported: [[ŵ_a, ŵ_b], [M̂_a, M̂_b]]) at x = L of the two orthonormalised shooting solutions for the
 * dimensionless frequency q. With u = (ŵ, θ/q, M̂/q², V̂/q³) the system reads
 *   u₁' = q u₂ + q³ σ(x̂) u₄,  u₂' = q ε(x̂) u₃,  u₃' = −q u₄ − q³ ρ(x̂) u₂,  u₄' = −q μ(x̂) u₁
 * with σ = EI₀/(κGA L²), ε = EI₀/EI, ρ = ρI/(ρA₀ L²), μ = ρA/ρA₀ (′ = d/dx̂).
 */
function endDeterminant(
  q: number,
  section: BeamSectionFunctions,
  length: number,
  breaks: readonly number[],
  bendingReference: number,
  massReference: number,
  timoshenko: boolean,
  tolerance: number,
  freeEnds: boolean,
): number {
  const q3 = q * q * q;
  const derivative = (position: number, u: number[]): number[] => {
    const x = position * length;
    const shear = timoshenko ? bendingReference / (section.shearStiffness(x) * length * length) : 0;
    const flexibility = bendingReference / section.bendingStiffness(x);
    const rotary = timoshenko ? section.rotaryInertiaPerLength(x) / (massReference * length * length) : 0;
    const mass = section.massPerLength(x) / massReference;
    const out = new Array<number>(8);
    for (let s = 0; s < 8; s += 4) {
      const u1 = u[s]!;
      const u2 = u[s + 1]!;
      const u3 = u[s + 2]!;
      const u4 = u[s + 3]!;
      out[s] = q * u2 + q3 * shear * u4;
      out[s + 1] = q * flexibility * u3;
      out[s + 2] = -q * u4 - q3 * rotary * u2;
      out[s + 3] = -q * mass * u1;
    }
    return out;
  };
  let state = freeEnds ? [1, 0, 0, 0, 0, 1, 0, 0] : [0, 1, 0, 0, 0, 0, 0, 1];
  for (let i = 1; i < breaks.length; i++) {
    // numeric's typings declare scalar states; dopri integrates vector states as well.
    const solution = numeric.dopri(breaks[i - 1]!, breaks[i]!, state as unknown as number, derivative as never, tolerance, 100_000);
    if (solution.msg) throw new Error(`timoshenkoShooting: ${solution.msg}`);
    const last = solution.y[solution.y.length - 1] as unknown as number[];
    state = orthonormalise(last);
  }
  return freeEnds ? state[2]! * state[7]! - state[6]! * state[3]! : state[0]! * state[6]! - state[4]! * state[2]!;
}

/** Gram–Schmidt on the two 4-vectors packed in an 8-vector (spans the same subspace). */
function orthonormalise(state: readonly number[]): number[] {
  const a = state.slice(0, 4);
  const b = state.slice(4, 8);
  const normA = Math.hypot(...a);
  for (let k = 0; k < 4; k++) a[k] = a[k]! / normA;
  const projection = a.reduce((sum, value, k) => sum + value * b[k]!, 0);
  for (let k = 0; k < 4; k++) b[k] = b[k]! - projection * a[k]!;
  const normB = Math.hypot(...b);
  for (let k = 0; k < 4; k++) b[k] = b[k]! / normB;
  return [...a, ...b];
}
