import { describe, expect, it } from 'vitest';
import { analyzeBar } from '../../src/index.ts';
import { barFileOf, parabolicArchBar, practiceBar, shootingFrequencies } from './referenceBars.ts';

// Undercut bars against the independent shooting solver (test/reference/timoshenkoShooting.ts:
// Dormand–Prince on the first-order system of brief.md §2, restarted at every profile station;
// ~4e-12 relative, checked by tightening its tolerance 100×). The two methods share nothing but
// the bar's definition.
const bars = [
  { name: 'contract F4 practice bar (22 → 8 mm)', bar: practiceBar },
  { name: 'parabolic arch, 10 mm stations (24 → 6 mm)', bar: parabolicArchBar },
];

describe('variable-section bars against the shooting solver', () => {
  for (const { name, bar } of bars) {
    it(`${name}, Timoshenko, modes 1–4`, () => {
      // Tolerance 1e-8 relative: O(h⁸) element, measured ≤ 5.0e-10 on 128 elements (the floor is
      // analyzeBar's eigensolver residual, 1e-5, whose square bounds the eigenvalue error).
      const expected = shootingFrequencies(bar, 'timoshenko', 4);
      const analysis = analyzeBar(barFileOf(bar), { elements: 128, modes: 4 });
      analysis.bending.forEach((mode, i) => expect(Math.abs(mode.hz / expected[i]! - 1)).toBeLessThan(1e-8));
    });

    it(`${name}, Euler–Bernoulli, modes 1–4`, () => {
      // Tolerance 1e-6 relative: O(h⁴) element, measured ≤ 3.1e-7 (mode 4) on ~130–150 elements.
      const expected = shootingFrequencies(bar, 'euler-bernoulli', 4);
      const analysis = analyzeBar(barFileOf(bar), { elements: 128, modes: 4, theory: 'euler-bernoulli' });
      analysis.bending.forEach((mode, i) => expect(Math.abs(mode.hz / expected[i]! - 1)).toBeLessThan(1e-6));
    });
  }
});
