import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyzeBar } from '../../src/index.ts';
import { barModelFromFile } from '../../src/modes/BarModel.ts';
import { bendingSensitivities } from '../../src/modes/bendingSensitivities.ts';
import { solveBending } from '../../src/modes/solveBending.ts';
import type { BarFile } from '../../src/fileFormats/barFile.ts';

// Property-based checks on random bars (fast-check; invented, trade-plausible ranges). numRuns are
// kept modest so the suite stays quick; each property is exact physics or exact algebra of the
// discretisation, so the tolerances only cover rounding and the eigensolver's 1e-10 stop.

/** A random rect bar file: 250–500 mm long, 35–65 mm wide, 14–26 mm blank, 0–5 interior stations. */
const barFiles: fc.Arbitrary<BarFile> = fc
  .record({
    length: fc.double({ min: 250, max: 500, noNaN: true }),
    width: fc.double({ min: 35, max: 65, noNaN: true }),
    blank: fc.double({ min: 14, max: 26, noNaN: true }),
    youngModulus: fc.double({ min: 8, max: 25, noNaN: true }),
    modulusRatio: fc.double({ min: 2.6, max: 20, noNaN: true }),
    density: fc.double({ min: 600, max: 1100, noNaN: true }),
    stations: fc.uniqueArray(fc.integer({ min: 1, max: 19 }), { maxLength: 5 }),
    depths: fc.array(fc.double({ min: 0.3, max: 1, noNaN: true }), { minLength: 5, maxLength: 5 }),
  })
  .map(({ length, width, blank, youngModulus, modulusRatio, density, stations, depths }) => {
    const interior = [...stations].sort((a, b) => a - b).map((s, k) => [(s / 20) * length, blank * depths[k]!] as [number, number]);
    return {
      format: 'barwright.bar',
      version: 1,
      label: 'random bar',
      length_mm: length,
      section: { shape: 'rect', width_mm: width, thickness_mm: blank },
      profile_mm: [[0, blank], ...interior, [length, blank]],
      material: { E_GPa: youngModulus, G_GPa: youngModulus / modulusRatio, density_kg_m3: density, shear_coefficient: 5 / 6 },
    } satisfies BarFile;
  });

/** A random bar that once drew a plain central difference past tolerance: a 4.2 mm station beside a 14 mm blank. */
const thinStationBar: BarFile = {
  format: 'barwright.bar',
  version: 1,
  label: 'random bar',
  length_mm: 250,
  section: { shape: 'rect', width_mm: 35, thickness_mm: 14 },
  profile_mm: [[0, 14], [12.5, 4.2], [25, 4.2], [37.5, 4.2], [50, 12.812604358257614], [250, 14]],
  material: { E_GPa: 8, G_GPa: 8 / 2.6, density_kg_m3: 600, shear_coefficient: 5 / 6 },
};

const theories = fc.constantFrom('timoshenko' as const, 'euler-bernoulli' as const);

function bendingHz(bar: BarFile, theory: 'timoshenko' | 'euler-bernoulli', elements = 24): Float64Array {
  return solveBending(barModelFromFile(bar), { theory, elements, modes: 4 }).frequencies;
}

function withMaterial(bar: BarFile, scale: { modulus: number; density: number }): BarFile {
  const material = bar.material as { E_GPa: number; G_GPa: number; density_kg_m3: number; shear_coefficient: number };
  return {
    ...bar,
    material: { ...material, E_GPa: material.E_GPa * scale.modulus, G_GPa: material.G_GPa * scale.modulus, density_kg_m3: material.density_kg_m3 * scale.density },
  };
}

describe('solver properties on random bars', () => {
  it('f ∝ √(E/ρ) (moduli scaled together, so E/G is kept)', () => {
    // Dimensional analysis: K scales with E, M with ρ, so λ with E/ρ exactly, for either theory
    // and any mesh. Tolerance 1e-9 relative (rounding and the eigensolver's stop).
    fc.assert(
      fc.property(barFiles, theories, fc.double({ min: 0.3, max: 3, noNaN: true }), fc.double({ min: 0.3, max: 3, noNaN: true }), (bar, theory, modulus, density) => {
        const base = bendingHz(bar, theory);
        const scaled = bendingHz(withMaterial(bar, { modulus, density }), theory);
        base.forEach((hz, i) => expect(Math.abs(scaled[i]! / (hz * Math.sqrt(modulus / density)) - 1)).toBeLessThan(1e-9));
      }),
      { numRuns: 20 },
    );
  });

  it('uniform Euler–Bernoulli bar: f ∝ t/L²', () => {
    // Closed-form scaling of f_n = (β_n L)²/(2π L²)·√(EI/ρA) with I/A = t²/12, which the FE
    // discretisation on a proportionally scaled mesh shares exactly. Tolerance 1e-9 relative.
    fc.assert(
      fc.property(barFiles, fc.double({ min: 0.5, max: 2, noNaN: true }), fc.double({ min: 0.5, max: 2, noNaN: true }), (bar, thicknessScale, lengthScale) => {
        const uniform: BarFile = { ...bar, profile_mm: undefined };
        const section = uniform.section as { shape: 'rect'; width_mm: number; thickness_mm: number };
        const scaled: BarFile = { ...uniform, length_mm: bar.length_mm * lengthScale, section: { ...section, thickness_mm: section.thickness_mm * thicknessScale } };
        const base = bendingHz(uniform, 'euler-bernoulli');
        const changed = bendingHz(scaled, 'euler-bernoulli');
        base.forEach((hz, i) => expect(Math.abs(changed[i]! / (hz * (thicknessScale / lengthScale ** 2)) - 1)).toBeLessThan(1e-9));
      }),
      { numRuns: 20 },
    );
  });

  it('a profile and its mirror image have the same frequencies and mirrored nodes', () => {
    // Symmetry of the free–free problem under x → L − x. The mirrored mesh is the mirror of the
    // mesh (nodes at the mirrored stations), so frequencies match to 1e-9 relative (eigenvalue
    // error ≈ residual², analyzeBar's residual 1e-5) and nodes to 1e-3 mm: the mode vectors are
    // good to about the residual, 1e-5, which moves a node by ≲ 1e-5·L/2π ≈ 0.7 µm on a 0.4 m bar.
    fc.assert(
      fc.property(barFiles, theories, (bar, theory) => {
        const mirrored: BarFile = { ...bar, profile_mm: [...bar.profile_mm!].reverse().map(([x, t]) => [bar.length_mm - x, t]) };
        mirrored.profile_mm![0]![0] = 0;
        const a = analyzeBar(bar, { theory, elements: 24 });
        const b = analyzeBar(mirrored, { theory, elements: 24 });
        a.bending.forEach((mode, i) => {
          const other = b.bending[i]!;
          expect(Math.abs(other.hz / mode.hz - 1)).toBeLessThan(1e-9);
          const nodes = mode.nodes_mm ?? [];
          expect(nodes).toHaveLength(i + 2);
          const reflected = (other.nodes_mm ?? []).map((x) => bar.length_mm - x).reverse();
          expect(reflected).toHaveLength(nodes.length);
          nodes.forEach((x, j) => expect(Math.abs(x - reflected[j]!)).toBeLessThan(1e-3));
        });
      }),
      { numRuns: 15 },
    );
  });

  it('Timoshenko frequencies lie below Euler–Bernoulli ones, mode by mode', () => {
    // Shear flexibility and rotary inertia only lower the frequencies (Rayleigh quotient:
    // Timoshenko adds kinetic energy and relaxes a constraint). The discretisation errors on this
    // mesh (< 1e-5) are far below the gap for these proportions (L/t ≤ 36, E/G ≥ 2.6: > 1e-4).
    fc.assert(
      fc.property(barFiles, (bar) => {
        const timoshenko = bendingHz(bar, 'timoshenko', 32);
        const eulerBernoulli = bendingHz(bar, 'euler-bernoulli', 32);
        timoshenko.forEach((hz, i) => expect(hz).toBeLessThan(eulerBernoulli[i]!));
      }),
      { numRuns: 20 },
    );
  });

  it('a deeper central cut lowers the fundamental', () => {
    // Common practice (brief.md §2): removing material where mode 1 bends most (the middle)
    // lowers it. Bar with the cut spread over the middle 20–60 % of the length, centre thinned
    // from depth d to d·(0.5–0.95).
    const cuts = fc.record({
      bar: barFiles,
      span: fc.double({ min: 0.2, max: 0.6, noNaN: true }),
      depth: fc.double({ min: 0.4, max: 0.9, noNaN: true }),
      deeper: fc.double({ min: 0.5, max: 0.95, noNaN: true }),
      theory: theories,
    });
    fc.assert(
      fc.property(cuts, ({ bar, span, depth, deeper, theory }) => {
        const length = bar.length_mm;
        const blank = (bar.section as { thickness_mm: number }).thickness_mm;
        const arch = (centre: number): BarFile => ({
          ...bar,
          profile_mm: [[0, blank], [(length * (1 - span)) / 2, blank], [length / 2, centre], [(length * (1 + span)) / 2, blank], [length, blank]],
        });
        const shallow = bendingHz(arch(blank * depth), theory)[0]!;
        const deep = bendingHz(arch(blank * depth * deeper), theory)[0]!;
        expect(deep).toBeLessThan(shallow);
      }),
      { numRuns: 20 },
    );
  });

  it('station sensitivities dλ/dt match central finite differences of the station thickness', () => {
    // Source: eigenvalue derivative dλ = φᵀ(dK − λ dM)φ (Fox & Kapoor, AIAA J. 6 (1968) 2426)
    // against computed central differences of the re-solved eigenvalue (same mesh: it depends only
    // on the station positions), Richardson-extrapolated from steps δ and 2δ, δ = 1e-3·t, so the
    // truncation is O(δ⁴). A plain central difference is not enough: where a thin station (4.2 mm
    // beside a 14 mm blank) carries EI ∝ t³, its O(δ²) truncation alone is 1.0–1.3e-6 of the
    // largest station sensitivity at δ = 1e-3·t (measured), right at the tolerance. With the
    // extrapolation the worst of 300 random bars (and that bar, kept below as an example) measured
    // 1.1e-7 (rounding of the re-solved eigenvalues over the step); tolerance 1e-6 of the mode's
    // largest station sensitivity. Solved to a residual of 1e-10, so the check is of the formula,
    // not of the solver's stop.
    fc.assert(
      fc.property(barFiles, theories, (bar, theory) => {
        const solve = (profile: [number, number][]) =>
          solveBending(barModelFromFile({ ...bar, profile_mm: profile }), { theory, elements: 20, modes: 3, tolerance: 1e-10 });
        const base = solve(bar.profile_mm!);
        const sensitivities = bendingSensitivities(base);
        const profile = bar.profile_mm!;
        sensitivities.forEach((perStation) => expect(perStation).toHaveLength(profile.length));
        for (let station = 0; station < profile.length; station++) {
          const step = 1e-3 * profile[station]![1];
          const moved = (offset: number) => profile.map(([x, t], k) => [x, k === station ? t + offset : t] as [number, number]);
          // Finite differences are in mm of thickness; the solver's sensitivities per metre.
          const central = (h: number) => {
            const up = solve(moved(h)).eigenvalues;
            const down = solve(moved(-h)).eigenvalues;
            return sensitivities.map((_, mode) => (up[mode]! - down[mode]!) / (2 * h * 1e-3));
          };
          const fine = central(step);
          const coarse = central(2 * step);
          sensitivities.forEach((perStation, mode) => {
            const difference = (4 * fine[mode]! - coarse[mode]!) / 3;
            const scale = Math.max(...perStation.map(Math.abs));
            expect(Math.abs(perStation[station]! - difference)).toBeLessThan(1e-6 * scale);
          });
        }
      }),
      { numRuns: 8, examples: [[thinStationBar, 'timoshenko']] },
    );
  });
});
