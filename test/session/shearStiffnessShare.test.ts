// The exact moduli derivatives the calibration uses, against finite differences of the solver
// (a consistency check: the share is claimed to be the exact derivative of the discrete model).
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { barModelFromFile } from '../../src/modes/BarModel.ts';
import { solveBending } from '../../src/modes/solveBending.ts';
import { parseBarFile } from '../../src/fileFormats/barFile.ts';
import { evaluatePartials, withModuli } from '../../src/session/partialModel.ts';
import { shearStiffnessShare } from '../../src/session/shearStiffnessShare.ts';

const rough = barModelFromFile(parseBarFile(JSON.parse(readFileSync(new URL('../../fixtures/f3-rough.bar.json', import.meta.url), 'utf8'))));

describe('shearStiffnessShare and evaluatePartials', () => {
  it('∂cents/∂ln G matches a central difference on the undercut F3 bar within 1e-5 relative', () => {
    const E = rough.material.youngModulus;
    const G = rough.material.shearModulus;
    const exact = evaluatePartials(rough, E, G, 3);
    const h = 1e-4;
    const up = evaluatePartials(rough, E, G * Math.exp(h), 3, false);
    const down = evaluatePartials(rough, E, G * Math.exp(-h), 3, false);
    for (let n = 0; n < 3; n++) {
      const difference = (up.cents[n]! - down.cents[n]!) / (2 * h);
      // Central difference: truncation O(h²) ≈ 1e-8 relative, round-off ≈ 1e-12·10⁴ cents / 2h ≈
      // 1e-7 cent; 1e-5 leaves room for the eigen-solver's own convergence noise.
      expect(Math.abs(exact.perLnShear[n]! / difference - 1)).toBeLessThan(1e-5);
    }
  });

  it('obeys the scaling law: E and G scaled together move every partial by exactly ½ ln of the scale', () => {
    const E = rough.material.youngModulus;
    const G = rough.material.shearModulus;
    const a = evaluatePartials(rough, E, G, 3);
    const b = evaluatePartials(rough, E * 1.21, G * 1.21, 3);
    for (let n = 0; n < 3; n++) {
      expect(b.cents[n]! - a.cents[n]!).toBeCloseTo(1200 * Math.log2(1.1), 6);
      expect(a.perLnYoung[n]! + a.perLnShear[n]!).toBeCloseTo(600 / Math.LN2, 9);
    }
  });

  it('is zero for Euler–Bernoulli and grows with the mode on a Timoshenko bar', () => {
    const model = withModuli(rough, rough.material.youngModulus, rough.material.shearModulus);
    expect(Array.from(shearStiffnessShare(solveBending(model, { modes: 3, theory: 'euler-bernoulli' })))).toEqual([0, 0, 0]);
    const share = shearStiffnessShare(solveBending(model, { modes: 3 }));
    expect(share[0]!).toBeGreaterThan(0);
    expect(share[1]!).toBeGreaterThan(share[0]!);
    expect(share[2]!).toBeGreaterThan(share[1]!);
    expect(share[2]!).toBeLessThan(1);
  });
});
