import { brentRoot } from './brentRoot.ts';

/**
 * The first `count` sign changes of `f` on a uniform grid start, start + step, …, each refined
 * by Brent's method to `absoluteTolerance`. Used by the reference solvers to find the lowest
 * roots of a frequency equation. A root pair closer than `step` can be missed: callers choose a
 * step well below the expected root spacing. Throws if `count` roots are not found before `end`.
 */
export function scanForRoots(
  f: (x: number) => number,
  { start, step, end, count, absoluteTolerance = 0 }: {
    start: number;
    step: number;
    end: number;
    count: number;
    absoluteTolerance?: number;
  },
): number[] {
  const roots: number[] = [];
  let left = start;
  let valueLeft = f(left);
  for (let index = 1; roots.length < count; index++) {
    const right = start + index * step;
    if (right > end) throw new Error(`scanForRoots: found ${roots.length} of ${count} roots below ${end}`);
    const valueRight = f(right);
    if (valueLeft === 0) {
      roots.push(left);
    } else if (Math.sign(valueLeft) !== Math.sign(valueRight) && valueRight !== 0) {
      roots.push(brentRoot(f, left, right, { absoluteTolerance, valueAtA: valueLeft, valueAtB: valueRight }));
    }
    left = right;
    valueLeft = valueRight;
  }
  return roots;
}
