import { describe, expect, it } from 'vitest';
import { analyzeBar } from '../../src/index.ts';
import { assembleBending } from '../../src/fe/assembleBending.ts';
import { assembleTorsion, torsionRigidMode } from '../../src/fe/assembleTorsion.ts';
import { lagrangeTorsionElement } from '../../src/fe/torsionElement.ts';
import { lowestModes } from '../../src/eigen/lowestModes.ts';
import { buildMesh } from '../../src/fe/buildMesh.ts';
import { bandedToDense } from '../../src/eigen/BandedMatrix.ts';
import { barModelFromFile } from '../../src/modes/BarModel.ts';
import { meshDensity } from '../../src/modes/meshDensity.ts';
import { solveBending } from '../../src/modes/solveBending.ts';
import { solveTorsion } from '../../src/modes/solveTorsion.ts';
import { denseGeneralizedEigen } from '../reference/denseGeneralizedEigen.ts';
import { huangFreeFreeFrequencies } from '../reference/huangFreeFree.ts';
import { barFileOf, beamLineOf, practiceBar, uniformBeamOf, workedExampleBar } from './referenceBars.ts';

/**
 * β of J = β b t³ from the Timoshenko & Goodier series (Theory of Elasticity; memory), summed
 * here independently of the solver: β = (1/3)[1 − (192/π⁵)(t/b) Σ_{n odd} tanh(nπb/2t)/n⁵].
 */
function torsionCoefficient(aspect: number): number {
  let sum = 0;
  for (let n = 1; n < 200; n += 2) sum += Math.tanh((n * Math.PI * aspect) / 2) / n ** 5;
  return (1 - ((192 / Math.PI ** 5) * sum) / aspect) / 3;
}

const bar = workedExampleBar;
const model = barModelFromFile(barFileOf(bar));
const thickness = 0.02;
const elements = 64;

describe('uniform bar: torsion and lateral bending', () => {
  it('torsion modes form the harmonic series f_n = (n/2L) √(GJ/ρI_p)', () => {
    // Closed form (uniform free–free St-Venant torsion, reference-values.md), J by the series
    // above (its 5-digit table value β(2.5) = 0.24937 is checked in sectionConstants.test.ts),
    // I_p = b t (b² + t²)/12. Mesh bound: degree-p Lagrange elements overestimate by
    // O((kh)^{2p}) with k = nπ/L; the quartic element at 16 elements is measured at 2.8e-9 for
    // mode 4, so ≤ 5e-9. Ritz values are upper bounds; the floor −5e-11 allows the J series'
    // truncation (tail of Σ n⁻⁵ beyond n = 200: ~2e-11 relative in f).
    const torsion = solveTorsion(model, { modes: 4, elements: 16 }).frequencies;
    const j = torsionCoefficient(bar.width / thickness) * bar.width * thickness ** 3;
    const polar = (bar.width * thickness * (bar.width ** 2 + thickness ** 2)) / 12;
    const first = (1 / (2 * bar.length)) * Math.sqrt((bar.shearModulus * j) / (bar.density * polar));
    expect(torsion).toHaveLength(4);
    torsion.forEach((hz, i) => {
      const n = i + 1;
      const error = hz / (n * first) - 1;
      expect(error).toBeGreaterThan(-5e-11);
      expect(error).toBeLessThan(5e-9);
    });
  });

  it('quadratic torsion elements converge as (kh)⁴/1440 on the same harmonic series', () => {
    // Same closed form; quadratic Lagrange elements overestimate by ≈ (kh)⁴/1440 with k = nπ/L
    // (measured 1.0e-6 for mode 4 at 64 elements); tolerance 1.5× that plus 5e-11.
    const line = beamLineOf(bar, 'torsion');
    const system = assembleTorsion(buildMesh(line.profile, elements), line, lagrangeTorsionElement(2));
    const result = lowestModes(system.stiffness, system.mass, 4, { shift: -1e3, rigidModes: [torsionRigidMode(system.stiffness.size)] });
    const j = torsionCoefficient(bar.width / thickness) * bar.width * thickness ** 3;
    const polar = (bar.width * thickness * (bar.width ** 2 + thickness ** 2)) / 12;
    const first = (1 / (2 * bar.length)) * Math.sqrt((bar.shearModulus * j) / (bar.density * polar));
    result.eigenvalues.forEach((eigenvalue, i) => {
      const n = i + 1;
      const error = Math.sqrt(eigenvalue) / (2 * Math.PI) / (n * first) - 1;
      const bound = (((n * Math.PI) / bar.length) * (bar.length / elements)) ** 4 / 1440;
      expect(error).toBeGreaterThan(-5e-11);
      expect(error).toBeLessThan(1.5 * bound + 5e-11);
    });
  });

  it('lateral over vertical bending frequency is b/t for Euler–Bernoulli', () => {
    // Closed form (reference-values.md): EI_lateral/EI_vertical = (b/t)², same ρA, so every
    // lateral frequency is b/t times the vertical one. Both are discretised identically on the
    // same mesh, so the ratio holds to rounding: tolerance 1e-9.
    const vertical = solveBending(model, { theory: 'euler-bernoulli', elements, modes: 4 }).frequencies;
    const lateral = solveBending(model, { theory: 'euler-bernoulli', elements, modes: 4, plane: 'lateral' }).frequencies;
    vertical.forEach((hz, i) => expect(Math.abs(lateral[i]! / hz / (bar.width / thickness) - 1)).toBeLessThan(1e-9));
  });

  it('lateral Timoshenko modes match the Huang roots for bending across the width', () => {
    // Source: Huang free–free frequency equation (test/reference/huangFreeFree.ts) with
    // I = t b³/12 (depth b = 50 mm, so L/depth = 8: shear matters). Tolerance 1e-7 relative
    // (O(h⁸) element, measured ≤ 8e-12 at 32 elements).
    const lateral = solveBending(model, { elements: 32, modes: 4, plane: 'lateral' }).frequencies;
    const vertical = solveBending(model, { elements: 32, modes: 1 }).frequencies;
    const expected = huangFreeFreeFrequencies(uniformBeamOf(bar, 'lateral'), 4);
    expected.forEach((hz, i) => expect(Math.abs(lateral[i]! / hz - 1)).toBeLessThan(1e-7));
    // The deep lateral direction feels shear more: lateral/vertical < b/t.
    expect(lateral[0]! / vertical[0]!).toBeLessThan(bar.width / thickness);
  });
});

describe('analyzeBar: the other families over the partials\' range', () => {
  for (const [name, subject] of [['uniform bar', workedExampleBar], ['practice bar', practiceBar]] as const) {
    it(`${name}: lists every torsion and lateral mode up to 50 cents above the highest partial`, () => {
      // Reference: every eigenvalue of the same torsion / lateral matrices (same mesh) by the
      // dense route of test/reference, so a mode the Lanczos iteration skipped would show.
      // contract.md: torsion or lateral modes near a tuned partial must be flagged, so none
      // below the reach may be missing. Frequencies compared to 1e-9 relative.
      const analysis = analyzeBar(barFileOf(subject), { modes: 4 });
      const reach = Math.max(analysis.bending[3]!.hz, analysis.bending[2]!.hz) * 2 ** (50 / 1200);
      const nodes = buildMesh(barModelFromFile(barFileOf(subject)).profile, meshDensity(4, 'timoshenko'));
      const lateralSystem = assembleBending(nodes, beamLineOf(subject, 'lateral'), 'timoshenko');
      const torsionSystem = assembleTorsion(nodes, beamLineOf(subject, 'torsion'));
      for (const [listed, system, rigid] of [[analysis.lateral, lateralSystem, 2], [analysis.torsion, torsionSystem, 1]] as const) {
        const all = denseGeneralizedEigen(bandedToDense(system.stiffness), bandedToDense(system.mass)).values.slice(rigid);
        const expected = all.map((lambda) => Math.sqrt(lambda) / (2 * Math.PI)).filter((hz, i) => hz <= reach || i === 0);
        expect(listed.map((m) => m.mode)).toEqual(expected.map((_, i) => i + 1));
        listed.forEach((m, i) => expect(Math.abs(m.hz / expected[i]! - 1)).toBeLessThan(1e-9));
      }
    });
  }
});
