import { describe, expect, it } from 'vitest';
import { assembleBending, bendingDofLayout } from '../../src/fe/assembleBending.ts';
import { buildMesh } from '../../src/fe/buildMesh.ts';
import { constrainDofs } from '../../src/fe/constrainDofs.ts';
import { lowestModes } from '../../src/eigen/lowestModes.ts';
import { simplySupportedTimoshenkoFrequency } from '../reference/simplySupportedTimoshenko.ts';
import { beamLineOf, uniformBar, uniformBeamOf } from './referenceBars.ts';

/** Simply supported frequencies (Hz): w = 0 at both ends, by assembleBending + constrainDofs + lowestModes. */
function simplySupportedFrequencies(bar: ReturnType<typeof uniformBar>, elements: number, count: number): number[] {
  const line = beamLineOf(bar);
  const nodes = buildMesh(line.profile, elements);
  const system = assembleBending(nodes, line, 'timoshenko');
  const { kind, position } = bendingDofLayout(system);
  const supported: number[] = [];
  kind.forEach((k, i) => {
    if (k === 0 && (position[i] === 0 || position[i] === bar.length)) supported.push(i);
  });
  expect(supported).toHaveLength(2);
  const stiffness = constrainDofs(system.stiffness, supported).matrix;
  const mass = constrainDofs(system.mass, supported).matrix;
  const beam = uniformBeamOf(bar);
  const estimate = (Math.PI / bar.length) ** 4 * (beam.bendingStiffness / beam.massPerLength);
  const { eigenvalues } = lowestModes(stiffness, mass, count, { shift: -0.5 * estimate });
  return Array.from(eigenvalues, (lambda) => Math.sqrt(lambda) / (2 * Math.PI));
}

describe('Timoshenko element, simply supported uniform beam', () => {
  // Thick to slender, metal-like to very shear-soft wood (E/G = 2.6, 12, 25).
  const cases = [
    { slenderness: 8, modulusRatio: 12 },
    { slenderness: 15, modulusRatio: 2.6 },
    { slenderness: 15, modulusRatio: 25 },
    { slenderness: 30, modulusRatio: 12 },
  ];
  for (const { slenderness, modulusRatio } of cases) {
    it(`matches the closed form for L/h = ${slenderness}, E/G = ${modulusRatio}, modes 1–4`, () => {
      // Source: the simply supported closed form (κGA k² − ω²ρA)(EI k² + κGA − ω²ρI) − (κGA k)² = 0,
      // lower root (reference-values.md; test/reference/simplySupportedTimoshenko.ts).
      // Tolerance 1e-7 relative: the O(h⁸) element is measured at ≤ 2.3e-11 on the 32 elements
      // used here (see meshConvergence.test.ts for the rate); 1e-7 is far
      // below the shear effect tested (0.7 % to 50 % of the frequency, see the last assertion).
      const thickness = 0.02;
      const bar = uniformBar(slenderness * thickness, 0.05, thickness, 15e9, 15e9 / modulusRatio, 900);
      const computed = simplySupportedFrequencies(bar, 32, 4);
      const beam = uniformBeamOf(bar);
      computed.forEach((hz, i) => {
        const expected = simplySupportedTimoshenkoFrequency(beam, i + 1);
        expect(Math.abs(hz / expected - 1)).toBeLessThan(1e-7);
        // Same closed form without shear and rotary inertia (Euler–Bernoulli): a wrong shear
        // treatment could not hide inside the tolerance.
        const eulerBernoulli = Math.sqrt((beam.bendingStiffness * ((i + 1) * Math.PI / bar.length) ** 4) / beam.massPerLength) / (2 * Math.PI);
        expect(1 - hz / eulerBernoulli).toBeGreaterThan(1e-3);
      });
    });
  }
});
