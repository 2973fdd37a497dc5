// Mesh convergence of the solid model: the observed order on a smooth problem against the
// element's theory, and the default mesh's accuracy on the deep-arch bar.
import { describe, expect, it } from 'vitest';
import { analyzeBar, isotropicStiffness, solveSolidPart, uniformProfile } from '../../src/index.ts';
import { deepArchBar, deepArchConverged, extrapolate } from './deepArchBar.ts';

describe('mesh convergence', () => {
  it('uniform steel bar, every direction refined together (k = 2, 3, 4): the observed order of the eigenvalue error is 4 ± 0.5 (quadratic elements: O(h^2p), p = 2; Strang & Fix, An Analysis of the Finite Element Method (1973), §6.3)', () => {
    const bar = { geometry: { length: 0.2, width: 0.02, blankThickness: 0.02, profile: uniformProfile(0.2, 0.02) }, material: { stiffness: isotropicStiffness(205e9, 0.29), density: 7850 }, mirrorSymmetric: true };
    for (const part of ['symmetric', 'antisymmetric'] as const) {
      const levels = [2, 3, 4].map((k) =>
        solveSolidPart(bar, part, { element: 'serendipity-20', lengthElements: 4 * k, halfWidthElements: k, thicknessElements: k, widthGrading: false, stationRefinement: 0 }, { count: 2 }, 1e-10).eigenvalues,
      );
      for (let mode = 0; mode < 2; mode++) {
        // The order from the ratio of successive differences needs no converged value (measured 3.86–3.89).
        const { order } = extrapolate(levels.map((values) => values[mode]!), [1 / 2, 1 / 3, 1 / 4]);
        expect(order).toBeGreaterThan(3.5);
        expect(order).toBeLessThan(4.5);
      }
    }
  });
  it('the default mesh puts every family of the deep-arch bar within 1 cent of its mesh-converged value (pinned regression from three refinements, test/solid/deepArchBar.ts)', () => {
    const analysis = analyzeBar(deepArchBar, { theory: 'solid', modes: 3 });
    for (const family of ['bending', 'torsion', 'lateral'] as const) {
      const converged = deepArchConverged[family];
      expect(analysis[family].length).toBeGreaterThanOrEqual(converged.length);
      converged.forEach((hz, i) => {
        const cents = 1200 * Math.log2(analysis[family][i]!.hz / hz);
        // Measured +0.50 / +0.45 / +0.61 (bending), +0.81 / +0.83 (torsion), +0.43 (lateral): quadratic
        // elements converge from above.
        expect(cents).toBeGreaterThan(0);
        expect(cents).toBeLessThan(1);
      });
    }
  });
});
