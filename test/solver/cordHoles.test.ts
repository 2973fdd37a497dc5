// Cord holes in the bar model: a hole of no diameter changes nothing; a small hole's shift of
// each partial agrees with first-order (Rayleigh) perturbation theory computed here from the
// undrilled bar's modes and the closed-form section of a centred hole; the drilled model
// converges with the mesh like the undrilled one.
import { describe, expect, it } from 'vitest';
import {
  analyzeBar,
  barModelFromFile,
  bendingFieldsAt,
  bendingSensitivities,
  bendingLine,
  buildMesh,
  gaussLegendre,
  parseBarFile,
  solveBending,
  solveBendingLine,
  solveTorsionLine,
  torsionLine,
  type BarModel,
  type BendingSolution,
} from '../../src/index.ts';

const material = { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1000 };
const uniform = parseBarFile({ length_mm: 300, section: { shape: 'rect', width_mm: 40, thickness_mm: 20 }, material });
const cents = (a: number, b: number): number => 1200 * Math.log2(a / b);

function withHoles(model: BarModel, holes: { x: number; d: number; depth?: number }[]): BarModel {
  const t = model.section.shape === 'rect' ? model.section.thickness : 0;
  return { ...model, holes: holes.map((h) => ({ position: h.x, radius: h.d / 2, depthBelowTop: h.depth ?? t / 2 })) };
}

describe('a cord hole of no diameter', () => {
  const model = barModelFromFile(uniform);
  it('changes nothing: the same frequencies, bit for bit', () => {
    const plain = solveBending(model, { modes: 4 }).frequencies;
    const drilled = solveBending(withHoles(model, [{ x: 0.0672, d: 0 }, { x: 0.2328, d: 0 }]), { modes: 4 }).frequencies;
    expect(Array.from(drilled)).toEqual(Array.from(plain));
  });
  it('a vanishing diameter (0.1 µm) moves no mode by more than 1e-4 cent on the same mesh: bending, lateral and torsion', () => {
    // The hole's own effect goes as d² (≈ 1e-12 cent here); what remains is rounding from the
    // 50 nm elements the hole's edges add (the stiffness scales as 1/h: measured ≈ 1e-5 cent).
    const drilledModel = withHoles(model, [{ x: 0.0672, d: 1e-7 }, { x: 0.2328, d: 1e-7 }]);
    const nodes = buildMesh(model.profile, 12, drilledModel.holes);
    for (const plane of ['vertical', 'lateral'] as const) {
      const plain = solveBendingLine(bendingLine(model, plane), nodes, 'timoshenko', 4).frequencies;
      const drilled = solveBendingLine(bendingLine(drilledModel, plane), nodes, 'timoshenko', 4).frequencies;
      plain.forEach((f, k) => expect(Math.abs(cents(drilled[k]!, f))).toBeLessThan(1e-4));
    }
    const plainTwist = solveTorsionLine(torsionLine(model), nodes, 4).frequencies;
    const drilledTwist = solveTorsionLine(torsionLine(drilledModel), nodes, 4).frequencies;
    plainTwist.forEach((f, k) => expect(Math.abs(cents(drilledTwist[k]!, f))).toBeLessThan(1e-4));
  });
  it('…and through a bar file and analyzeBar only by the default mesh’s own discretisation (≤ 0.001 cent)', () => {
    const plain = analyzeBar(uniform);
    const drilled = analyzeBar({ ...uniform, holes: [{ x_mm: 67.2, diameter_mm: 1e-6 }, { x_mm: 232.8, diameter_mm: 1e-6 }] });
    for (const family of ['bending', 'torsion', 'lateral'] as const) {
      drilled[family].forEach((mode, i) => expect(Math.abs(cents(mode.hz, plain[family][i]!.hz))).toBeLessThan(1e-3));
    }
  });
});

/**
 * First-order change of λ from a centred hole (Fox & Kapoor 1968; Rayleigh's quotient with the
 * undrilled mode): Δλ = ∫ ΔEI·κ² + κ·G·ΔA·γ² − λ(ρ·ΔA·w² + ρ·ΔI·θ²) dx over the hole, with the
 * centred hole's closed-form losses ΔA = −b·c, ΔI = −b·c³/12 (c the chord 2√(r² − s²)), and
 * the M-normalised fields of the undrilled bar. Integrated by 4000 four-point Gauss panels in x
 * (the chord's edge singularity limits this to about 1e-6 relative: ample for a 5 % check).
 */
function firstOrderShift(solution: BendingSolution, mode: number, centre: number, radius: number, width: number, E: number, G: number, rho: number, kappa: number): number {
  const rule = gaussLegendre(4);
  const panels = 4000;
  const lambda = solution.eigenvalues[mode]!;
  let change = 0;
  for (let p = 0; p < panels; p++) {
    const a = centre - radius + (2 * radius * p) / panels;
    const h = (2 * radius) / panels;
    rule.points.forEach((xi, g) => {
      const x = a + xi * h;
      const chord = 2 * Math.sqrt(Math.max(0, radius * radius - (x - centre) ** 2));
      const dArea = -width * chord;
      const dSecond = (-width * chord ** 3) / 12;
      const f = bendingFieldsAt(solution, mode, x);
      change += rule.weights[g]! * h * (E * dSecond * f.curvature ** 2 + kappa * G * dArea * f.shear ** 2 - lambda * (rho * dArea * f.deflection ** 2 + rho * dSecond * f.rotation ** 2));
    });
  }
  return change;
}

describe('a small cord hole against first-order (Rayleigh) perturbation', () => {
  const model = barModelFromFile(uniform);
  const E = 18e9;
  const G = 1.3e9;
  const shifts = (position: number, diameter: number): { exact: number; first: number }[] => {
    const drilledModel = withHoles(model, [{ x: position, d: diameter }]);
    const nodes = buildMesh(model.profile, 40, drilledModel.holes);
    const plain = solveBendingLine(bendingLine(model), nodes, 'timoshenko', 3);
    const drilled = solveBendingLine(bendingLine(drilledModel), nodes, 'timoshenko', 3);
    return [0, 1, 2].map((mode) => ({
      exact: cents(drilled.frequencies[mode]!, plain.frequencies[mode]!),
      first: (1200 / Math.LN2) * (firstOrderShift(plain, mode, position, diameter / 2, 0.04, E, G, 1000, 5 / 6) / (2 * plain.eigenvalues[mode]!)),
    }));
  };
  // Holes 0.6 mm across (3 % of the 20 mm thickness): at the centre (antinode of partials 1 and
  // 3), at the uniform bar's mode-1 node (0.2242 L, Blevins 1979, table 8-1), and in between.
  for (const position of [0.15, 0.0672, 0.1]) {
    it(`hole at ${position * 1000} mm: every shift of partials 1–3 within 5 % of the first-order value`, () => {
      for (const { exact, first } of shifts(position, 0.0006)) expect(Math.abs(exact - first)).toBeLessThan(0.05 * Math.abs(exact));
    });
  }
  it('the remainder falls in proportion to the diameter (slope 1 ± 0.15 on a log-log scale, 2.4 → 0.6 mm)', () => {
    // Over the hole the shear force is carried by less wood, so the shear strain there rises by
    // the fraction of the section removed (≈ chord/thickness): a remainder of first order in d/t,
    // largest where the partial's shear is largest (partial 2 at the centre).
    const remainders = [0.0024, 0.0012, 0.0006].map((d) => {
      const { exact, first } = shifts(0.15, d)[1]!;
      return Math.abs(exact - first) / Math.abs(exact);
    });
    for (let k = 0; k + 1 < remainders.length; k++) expect(Math.log2(remainders[k]! / remainders[k + 1]!)).toBeCloseTo(1, 0.7);
    expect(Math.abs(Math.log2(remainders[0]! / remainders[1]!) - 1)).toBeLessThan(0.15);
    expect(Math.abs(Math.log2(remainders[1]! / remainders[2]!) - 1)).toBeLessThan(0.15);
  });
});

describe('drilled bars on refined meshes', () => {
  it('the default mesh is within 0.001 cent of a 400-element mesh (holes at the nodes, 6 mm, and an off-centre one)', () => {
    const bar = parseBarFile({
      ...uniform,
      profile_mm: [
        [0, 20],
        [80, 20],
        [150, 9],
        [220, 20],
        [300, 20],
      ],
      holes: [
        { x_mm: 64, diameter_mm: 6 },
        { x_mm: 236, diameter_mm: 6, z_mm: 13 },
      ],
    });
    const model = barModelFromFile(bar);
    const coarse = solveBending(model, { modes: 4 }).frequencies;
    const fine = solveBendingLine(bendingLine(model), buildMesh(model.profile, 400, model.holes), 'timoshenko', 4).frequencies;
    coarse.forEach((f, k) => expect(Math.abs(cents(f, fine[k]!))).toBeLessThan(1e-3));
  });
});

describe('station sensitivities of a drilled bar', () => {
  it('agree with central differences at stations in, at and beside a hole (1e-6 relative)', () => {
    // Stations at the hole's centre and inside its span, so the hat functions of those stations
    // run through the angle rule.
    const bar = parseBarFile({
      ...uniform,
      profile_mm: [
        [0, 20],
        [62, 20],
        [64, 19.5],
        [66, 19],
        [150, 12],
        [300, 20],
      ],
      holes: [{ x_mm: 64, diameter_mm: 6, z_mm: 9 }],
    });
    const model = barModelFromFile(bar);
    const solve = (thicknesses: Float64Array) => solveBending({ ...model, profile: { positions: model.profile.positions, thicknesses } }, { modes: 3, tolerance: 1e-10 });
    const base = solve(model.profile.thicknesses);
    const exact = bendingSensitivities(base);
    for (const station of [1, 2, 3, 4]) {
      // Step 1e-6 m (5e-5 of the thickness): truncation O(h²) ≈ 1e-9 relative; the eigensolver at
      // residual 1e-10 adds far less.
      const h = 1e-6;
      const plus = Float64Array.from(model.profile.thicknesses);
      const minus = Float64Array.from(model.profile.thicknesses);
      plus[station]! += h;
      minus[station]! -= h;
      const up = solve(plus).eigenvalues;
      const down = solve(minus).eigenvalues;
      for (let k = 0; k < 3; k++) {
        const difference = (up[k]! - down[k]!) / (2 * h);
        expect(Math.abs(exact[k]![station]! - difference)).toBeLessThan(1e-6 * Math.abs(difference) + 1e-9 * base.eigenvalues[k]!);
      }
    }
  });
});
