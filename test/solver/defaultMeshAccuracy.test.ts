import { describe, expect, it } from 'vitest';
import { analyzeBar } from '../../src/index.ts';
import { eulerBernoulliFreeFreeRoots } from '../reference/eulerBernoulliFreeFree.ts';
import { huangFreeFreeFrequencies } from '../reference/huangFreeFree.ts';
import { barFileOf, centsBetween, eulerBernoulliHz, practiceBar, shootingFrequencies, uniformBeamOf, workedExampleBar } from './referenceBars.ts';

// The automatic mesh (no `elements` option) must put modes 1–4 within 0.05 cent of the
// converged frequencies: a tenth of the tightest tolerance a maker works to (±1–2 cents on the
// fundamental, brief.md §3 "common practice"), so the mesh never eats into the tuning budget.
const limitCents = 0.05;

describe('default mesh accuracy, modes 1–4', () => {
  it('uniform bar, Timoshenko, against the Huang frequency equation', () => {
    // Converged reference: Huang (1961) free–free equation, root-found (test/reference).
    const expected = huangFreeFreeFrequencies(uniformBeamOf(workedExampleBar), 4);
    const analysis = analyzeBar(barFileOf(workedExampleBar));
    analysis.bending.forEach((mode, i) => expect(Math.abs(centsBetween(mode.hz, expected[i]!))).toBeLessThan(limitCents));
  });

  it('uniform bar, Euler–Bernoulli, against cos βL cosh βL = 1', () => {
    // Converged reference: the closed form (Blevins 1979, table 8-1).
    const roots = eulerBernoulliFreeFreeRoots(4);
    const beam = uniformBeamOf(workedExampleBar);
    const analysis = analyzeBar(barFileOf(workedExampleBar), { theory: 'euler-bernoulli' });
    analysis.bending.forEach((mode, i) => expect(Math.abs(centsBetween(mode.hz, eulerBernoulliHz(beam, roots[i]!)))).toBeLessThan(limitCents));
  });

  for (const theory of ['timoshenko', 'euler-bernoulli'] as const) {
    it(`deeply undercut bar (contract F4 practice bar), ${theory}, against the shooting solver`, () => {
      // Converged reference: the independent shooting solver (~4e-12 relative).
      const expected = shootingFrequencies(practiceBar, theory, 4);
      const analysis = analyzeBar(barFileOf(practiceBar), { theory });
      analysis.bending.forEach((mode, i) => expect(Math.abs(centsBetween(mode.hz, expected[i]!))).toBeLessThan(limitCents));
    });
  }
});
