import { describe, expect, it } from 'vitest';
import { analyzeBar } from '../../src/index.ts';
import { eulerBernoulliFreeFreeNodes, eulerBernoulliFreeFreeRoots } from '../reference/eulerBernoulliFreeFree.ts';
import { barFileOf, eulerBernoulliHz, uniformBeamOf, workedExampleBar } from './referenceBars.ts';

// A uniform free–free bar against the Euler–Bernoulli closed form. Source of the roots and node
// positions: reference-values.md (Blevins 1979, table 8-1, memory; more digits computed), with
// the roots re-derived here by test/reference/eulerBernoulliFreeFree.ts.
const bar = workedExampleBar;
const beam = uniformBeamOf(bar);
const elements = 64;
const analysis = analyzeBar(barFileOf(bar), { theory: 'euler-bernoulli', elements, modes: 4 });
const roots = eulerBernoulliFreeFreeRoots(4);

describe('uniform free–free bar, Euler–Bernoulli', () => {
  it('has the frequencies of cos βL cosh βL = 1, modes 1–4, within the mesh error', () => {
    // A-priori bound: the Hermite-cubic element with consistent mass overestimates the
    // frequency by ≈ (βh)⁴/1440 (leading term of its dispersion error; memory, and measured here
    // to within 1 %); tolerance 1.5× that, and the error must be positive (Rayleigh–Ritz gives
    // upper bounds). At 64 elements: 2e-8 (mode 1) to 1.7e-6 (mode 4).
    const h = bar.length / elements;
    analysis.bending.forEach((mode, i) => {
      const error = mode.hz / eulerBernoulliHz(beam, roots[i]!) - 1;
      const bound = ((roots[i]! / bar.length) * h) ** 4 / 1440;
      expect(error).toBeGreaterThan(0);
      expect(error).toBeLessThan(1.5 * bound);
    });
  });

  it('has the βL roots of reference-values.md as its frequency ratios', () => {
    // Source: reference-values.md, ratios 2.756539, 5.403918, 8.932950 (computed, 7 digits).
    // Tolerance 3e-6 relative: the mode-4 mesh error of the test above (1.7e-6) plus rounding.
    [1, 2.756539, 5.403918, 8.93295].forEach((ratio, i) => expect(Math.abs(analysis.bending[i]!.ratio / ratio - 1)).toBeLessThan(3e-6));
  });

  it('places the nodes at the x/L of reference-values.md', () => {
    // Source: reference-values.md node table (computed, 6 digits; see test/reference for the
    // 12-digit values used here). Measured error at 64 elements ≤ 2.5e-7 of L, set by
    // analyzeBar's eigensolver residual (1e-5: mode vectors good to about that); tolerance 1e-6
    // of L (0.4 µm here, far below a drilled cord hole's placing).
    analysis.bending.forEach((mode, i) => {
      const expected = eulerBernoulliFreeFreeNodes(i + 1);
      const nodes = mode.nodes_mm ?? [];
      expect(nodes).toHaveLength(i + 2);
      nodes.forEach((x, j) => expect(Math.abs(x / 1000 / bar.length - expected[j]!)).toBeLessThan(1e-6));
    });
  });

  it('reports flexible modes only, ascending, with ratios to the fundamental', () => {
    // contract.md: `bending` lists the N lowest flexible modes (rigid-body modes excluded) in
    // ascending order, ratio = hz / bending[0].hz. A rigid-body mode leaking through would show
    // as a frequency near 0 (here < 1 % of the fundamental's closed form).
    expect(analysis.theory).toBe('euler-bernoulli');
    expect(analysis.bending.map((m) => m.mode)).toEqual([1, 2, 3, 4]);
    expect(analysis.bending[0]!.hz).toBeGreaterThan(0.99 * eulerBernoulliHz(beam, roots[0]!));
    for (let i = 1; i < 4; i++) expect(analysis.bending[i]!.hz).toBeGreaterThan(analysis.bending[i - 1]!.hz);
    analysis.bending.forEach((m) => expect(m.ratio).toBe(m.hz / analysis.bending[0]!.hz));
    expect(JSON.stringify(analysis)).not.toMatch(/null|NaN|Infinity/);
  });
});
