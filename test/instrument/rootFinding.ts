/**
 * The test suite's own root finding, independent of the code under test: scan a function for sign
 * changes on a fine grid, then bisect each bracket to machine precision.
 */

/** Bisection of f on [a, b] where f(a)·f(b) < 0, to |b − a| ≤ 1e-13·|b| (or 200 halvings). */
function bisect(f: (x: number) => number, a: number, b: number): number {
  let fa = f(a);
  for (let i = 0; i < 200 && b - a > 1e-13 * Math.abs(b); i++) {
    const m = 0.5 * (a + b);
    const fm = f(m);
    if (fm === 0) return m;
    if (fa * fm < 0) b = m;
    else {
      a = m;
      fa = fm;
    }
  }
  return 0.5 * (a + b);
}

/** The first `count` roots of f in (start, end), found by scanning `steps` equal intervals. */
export function scanRoots(f: (x: number) => number, start: number, end: number, count: number, steps = 20000): number[] {
  const roots: number[] = [];
  let x0 = start;
  let f0 = f(x0);
  for (let i = 1; i <= steps && roots.length < count; i++) {
    const x1 = start + ((end - start) * i) / steps;
    const f1 = f(x1);
    if (Number.isFinite(f0) && Number.isFinite(f1) && f0 * f1 < 0) roots.push(bisect(f, x0, x1));
    x0 = x1;
    f0 = f1;
  }
  return roots;
}
