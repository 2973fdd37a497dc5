import type { BeamTheory } from '../fe/beamElementType.ts';

/**
 * Automatic mesh density: the target number of elements along the bar so that bending modes up
 * to `highestMode` are converged, measured on uniform and deeply undercut wooden bars (see
 * test/solver): Timoshenko elements (θ quartic, w quintic, error O(h⁸)) need 2·(n+1) elements
 * for under 0.001 cent on mode 4; Euler–Bernoulli Hermite cubics (error O(h⁴)) need 8·(n+2) for
 * under 0.01 cent. Profile stations add nodes on top of this (buildMesh).
 */
export function meshDensity(highestMode: number, theory: BeamTheory = 'timoshenko'): number {
  return theory === 'timoshenko' ? Math.max(8, Math.ceil(2 * (highestMode + 1))) : Math.max(24, Math.ceil(8 * (highestMode + 2)));
}
