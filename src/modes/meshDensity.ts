/**
 * Automatic mesh density: the target number of elements along the bar for the highest mode
 * wanted. Chosen from the measured convergence of the elements (see test/solver and DEVELOPERS.md):
 * with this density modes 1–4 of uniform and deeply undercut bars are within 0.01 cent of the
 * converged values; each extra mode adds elements in proportion to its wavenumber.
 */
export function meshDensity(highestMode: number): number {
  return Math.max(24, Math.ceil(6 * (highestMode + 1.5)));
}
