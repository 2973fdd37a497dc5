import { bandedAddElement, createBandedMatrix } from '../eigen/BandedMatrix.ts';
import { bandedLdlt, bandedLdltSolve } from '../eigen/bandedLdlt.ts';

/** One note's admissible blank lengths (mm) as the blank advisor gives them; absent when none works. */
export interface LengthWindow {
  /** Preferred (comfortable) length, mm. */
  preferred_mm: number;
  /** Shortest and longest length that still works, mm (preferred inside). */
  min_mm: number;
  max_mm: number;
}

/** One note's place in a smoothed progression. */
export interface SmoothedLength {
  /** The length chosen, mm, rounded to the stock step. */
  length_mm: number;
  /** Whether it lies inside the note's window (false also when the note has no window). */
  inside: boolean;
}

/** Options of smoothLengths. */
export interface SmoothingOptions {
  /** Round to this step, mm (default 1). */
  step_mm?: number;
  /** Lengths fixed by the maker, by index: kept exactly. */
  fixed?: ReadonlyMap<number, number>;
  /**
   * Weight of smoothness against following each note's preferred length (Whittaker smoother λ,
   * on the logarithm of length; default 4: a preferred length a few % off the curve costs as
   * much as a kink of the same size).
   */
  smoothness?: number;
  /**
   * Lengths (mm) to lean on, lightly (weight 0.05), where a note has no window: e.g. a typical
   * fraction of the length at which its uncut blank sounds the note. Without one such a note is
   * bridged by the curve alone.
   */
  fallback_mm?: readonly (number | undefined)[];
}

/**
 * A smooth, non-increasing progression of blank lengths along a keyboard (lowest note first),
 * cut to a stock step, staying inside each note's window where one exists. Method: a Whittaker
 * smoother (Whittaker 1923; Eilers, Anal. Chem. 75 (2003) 3631) on ln L — minimise
 * Σ wᵢ(yᵢ − ln Pᵢ)² + λ Σ (Δ²y)² with weight 1 on notes with a window, 0.05 on a fallback
 * length for those without (else 0: bridged by the curve), 10⁶ on fixed ones — solved as a pentadiagonal system by the
 * banded LDLᵀ, then notes pushed outside their window are pinned to the nearest bound and the
 * system solved again (a few passes), then rounded to the step inwards, and made non-increasing.
 * A geometric run (ln L linear in note number) has zero second differences, so smoothing never
 * fights the natural shape of a keyboard.
 */
export function smoothLengths(windows: readonly (LengthWindow | undefined)[], options: SmoothingOptions = {}): SmoothedLength[] {
  const n = windows.length;
  const step = options.step_mm ?? 1;
  const lambda = options.smoothness ?? 4;
  const fixed = options.fixed ?? new Map<number, number>();
  const weight = new Float64Array(n);
  const aim = new Float64Array(n);
  const known = windows.map((w, i) => fixed.get(i) ?? w?.preferred_mm);
  // A note with neither a window nor a fixed length leans lightly on its fallback, else on the
  // trend of its neighbours alone (weight 0).
  for (let i = 0; i < n; i++) {
    const value = known[i];
    const fallback = options.fallback_mm?.[i];
    if (value !== undefined) {
      aim[i] = Math.log(value);
      weight[i] = fixed.has(i) ? 1e6 : 1;
    } else if (fallback !== undefined && fallback > 0) {
      aim[i] = Math.log(fallback);
      weight[i] = 0.05;
    }
  }
  if (weight.every((w) => w === 0)) throw new Error('internal: no note has a blank length to start from');
  const pinned = new Map<number, number>();
  let y = solveWhittaker(weight, aim, lambda, pinned);
  for (let pass = 0; pass < 2 * n + 2; pass++) {
    let moved = false;
    for (let i = 0; i < n; i++) {
      const window = windows[i];
      if (!window || fixed.has(i)) continue;
      const low = Math.log(window.min_mm);
      const high = Math.log(window.max_mm);
      if (y[i]! < low - 1e-12 && pinned.get(i) !== low) {
        pinned.set(i, low);
        moved = true;
      } else if (y[i]! > high + 1e-12 && pinned.get(i) !== high) {
        pinned.set(i, high);
        moved = true;
      }
    }
    if (!moved) break;
    y = solveWhittaker(weight, aim, lambda, pinned);
  }
  const lengths = Array.from(y, (value, i) => {
    const fixedLength = fixed.get(i);
    if (fixedLength !== undefined) return fixedLength;
    const window = windows[i];
    let length = Math.round(Math.exp(value) / step) * step;
    if (window) {
      if (length < window.min_mm) length = Math.ceil(window.min_mm / step - 1e-9) * step;
      if (length > window.max_mm) length = Math.floor(window.max_mm / step + 1e-9) * step;
    }
    return length;
  });
  // Non-increasing up the keyboard: a longer bar above a shorter one is lowered to match, if its window allows.
  for (let i = 1; i < n; i++) {
    if (lengths[i]! > lengths[i - 1]! && !fixed.has(i)) {
      const window = windows[i];
      if (!window || lengths[i - 1]! >= window.min_mm) lengths[i] = lengths[i - 1]!;
    }
  }
  return lengths.map((length, i) => {
    const window = windows[i];
    const inside = fixed.has(i) ? true : window !== undefined && length >= window.min_mm - 1e-9 && length <= window.max_mm + 1e-9;
    return { length_mm: length, inside };
  });
}

/** Solves (W + λDᵀD) y = W·aim with some entries pinned (heavy weight), D the second difference. */
function solveWhittaker(weight: Float64Array, aim: Float64Array, lambda: number, pinned: ReadonlyMap<number, number>): Float64Array {
  const n = weight.length;
  if (n === 1) return Float64Array.of(pinned.get(0) ?? aim[0]!);
  const matrix = createBandedMatrix(n, 2);
  const rhs = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const pin = pinned.get(i);
    const w = pin === undefined ? weight[i]! : 1e8;
    const target = pin === undefined ? aim[i]! : pin;
    // A tiny ridge keeps the system positive definite where weights are 0 (λDᵀD has a 2-D null space).
    bandedAddElement(matrix, [i], [w + 1e-10]);
    rhs[i] = w * target;
  }
  const element = [1, -2, 1];
  const block = new Float64Array(9);
  for (let a = 0; a < 3; a++) for (let b = 0; b < 3; b++) block[3 * a + b] = lambda * element[a]! * element[b]!;
  for (let i = 0; i + 2 < n; i++) bandedAddElement(matrix, [i, i + 1, i + 2], block);
  return bandedLdltSolve(bandedLdlt(matrix), rhs);
}
