import { bendingDofLayout, elementOffset } from '../fe/assembleBending.ts';
import { lagrangeBasis } from '../fe/lagrangeBasis.ts';
import type { BendingSolution } from './solveBending.ts';
import type { TorsionSolution } from './solveTorsion.ts';

/** Index of the mesh element holding x (binary search over node positions). */
export function elementAt(nodes: Float64Array, x: number): number {
  let lo = 0;
  let hi = nodes.length - 2;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (nodes[mid]! <= x) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** Reusable per-element-type arrays (four of localDofs) for the field evaluators below. */
const scratchByType = new WeakMap<object, Float64Array[]>();

function scratchFor(element: { readonly localDofs: number }): Float64Array[] {
  let scratch = scratchByType.get(element);
  if (!scratch) {
    scratch = [0, 1, 2, 3].map(() => new Float64Array(element.localDofs));
    scratchByType.set(element, scratch);
  }
  return scratch;
}

/**
 * Deflection w (m per unit modal mass), rotation θ, curvature dθ/dx and shear strain of bending
 * mode `mode` (0-based) at x (m), interpolated with the element's own shape functions.
 */
export function bendingFieldsAt(solution: BendingSolution, mode: number, x: number): { deflection: number; rotation: number; curvature: number; shear: number } {
  const { nodes, element } = solution.system;
  const [nw, nt, bb, bs] = scratchFor(element) as [Float64Array, Float64Array, Float64Array, Float64Array];
  const e = elementAt(nodes, x);
  const h = nodes[e + 1]! - nodes[e]!;
  element.evaluate((x - nodes[e]!) / h, h, nw, nt, bb, bs);
  const u = solution.vectors[mode]!;
  const offset = elementOffset(solution.system, e);
  let deflection = 0;
  let rotation = 0;
  let curvature = 0;
  let shear = 0;
  for (let a = 0; a < element.localDofs; a++) {
    const value = u[offset + a]!;
    deflection += nw[a]! * value;
    rotation += nt[a]! * value;
    curvature += bb[a]! * value;
    shear += bs[a]! * value;
  }
  return { deflection, rotation, curvature, shear };
}

const layoutBySystem = new WeakMap<object, { kind: Uint8Array; position: Float64Array }>();

/** Deflection w alone of bending mode `mode` (0-based) at x (m): bendingFieldsAt's first field, cheaper. */
export function bendingDeflectionAt(solution: BendingSolution, mode: number, x: number): number {
  const { nodes, element } = solution.system;
  const deflectionScratch = scratchFor(element)[0]!;
  const e = elementAt(nodes, x);
  const h = nodes[e + 1]! - nodes[e]!;
  element.evaluateDeflection((x - nodes[e]!) / h, h, deflectionScratch);
  const u = solution.vectors[mode]!;
  const offset = elementOffset(solution.system, e);
  let deflection = 0;
  for (let a = 0; a < element.localDofs; a++) deflection += deflectionScratch[a]! * u[offset + a]!;
  return deflection;
}


/** Twist ψ and its slope dψ/dx of torsion mode `mode` (0-based) at x (m), with the element's own basis. */
export function torsionFieldsAt(solution: TorsionSolution, mode: number, x: number): { twist: number; slope: number } {
  const { nodes, element } = solution.system;
  const [twistValues, twistSlopes] = scratchFor(element) as [Float64Array, Float64Array];
  const e = elementAt(nodes, x);
  const h = nodes[e + 1]! - nodes[e]!;
  lagrangeBasis(element.points, (x - nodes[e]!) / h, twistValues, twistSlopes);
  const u = solution.vectors[mode]!;
  const offset = element.degree * e;
  let twist = 0;
  let slope = 0;
  for (let a = 0; a < element.localDofs; a++) {
    twist += twistValues[a]! * u[offset + a]!;
    slope += (twistSlopes[a]! / h) * u[offset + a]!;
  }
  return { twist, slope };
}

/**
 * A mode's displacement sampled at `count` evenly spaced points (m), scaled so the largest
 * magnitude is 1: for plotting. `valueAt` gives the unscaled field.
 */
export function sampleShape(length: number, count: number, valueAt: (x: number) => number): { x: Float64Array; value: Float64Array } {
  const x = new Float64Array(count);
  const value = new Float64Array(count);
  let largest = 0;
  for (let i = 0; i < count; i++) {
    x[i] = (length * i) / (count - 1);
    value[i] = valueAt(x[i]!);
    largest = Math.max(largest, Math.abs(value[i]!));
  }
  if (largest > 0) for (let i = 0; i < count; i++) value[i]! /= largest;
  return { x, value };
}

/**
 * Zero crossings (m) of a field along the mesh: sampled `perElement` times per mesh element,
 * each sign change refined by the Illinois variant of false position (Dowell & Jarratt, BIT 11
 * (1971) 168) on the interpolated field, to 1e-9 of the bar's length.
 */
export function zeroCrossings(nodes: Float64Array, valueAt: (x: number) => number, perElement = 2): number[] {
  const crossings: number[] = [];
  const tolerance = 1e-9 * nodes[nodes.length - 1]!;
  let previousX = nodes[0]!;
  let previousValue = valueAt(previousX);
  for (let e = 0; e + 1 < nodes.length; e++) {
    for (let s = 1; s <= perElement; s++) {
      const x = nodes[e]! + ((nodes[e + 1]! - nodes[e]!) * s) / perElement;
      const value = valueAt(x);
      if (value === 0) crossings.push(x);
      else if (previousValue * value < 0) crossings.push(refineRoot(valueAt, previousX, previousValue, x, value, tolerance));
      previousX = x;
      previousValue = value;
    }
  }
  return crossings;
}

function refineRoot(f: (x: number) => number, a: number, fa: number, b: number, fb: number, tolerance: number): number {
  for (let iteration = 0; iteration < 100 && Math.abs(b - a) > tolerance; iteration++) {
    const c = b - (fb * (b - a)) / (fb - fa);
    const fc = f(c);
    if (fc === 0) return c;
    if (fc * fb < 0) {
      a = b;
      fa = fb;
    } else {
      fa /= 2;
    }
    b = c;
    fb = fc;
  }
  return b;
}

/**
 * Node positions (m) of bending mode `mode` (0-based): sign changes of the deflection dofs
 * (every element's w values at its interpolation points, in order along the bar), each refined
 * on the element's own interpolant by zeroCrossings' root finder.
 */
export function bendingNodePositions(solution: BendingSolution, mode: number): number[] {
  let layout = layoutBySystem.get(solution.system);
  if (!layout) {
    layout = bendingDofLayout(solution.system);
    layoutBySystem.set(solution.system, layout);
  }
  const { kind, position } = layout;
  const u = solution.vectors[mode]!;
  const length = solution.line.length;
  const valueAt = (x: number) => bendingDeflectionAt(solution, mode, x);
  const crossings: number[] = [];
  let previousX = Number.NaN;
  let previousValue = 0;
  for (let i = 0; i < kind.length; i++) {
    if (kind[i] !== 0) continue;
    const x = position[i]!;
    const value = u[i]!;
    if (!Number.isNaN(previousX)) {
      if (value === 0) crossings.push(x);
      else if (previousValue * value < 0) crossings.push(refineRoot(valueAt, previousX, previousValue, x, value, 1e-9 * length));
    }
    previousX = x;
    previousValue = value;
  }
  return crossings;
}
