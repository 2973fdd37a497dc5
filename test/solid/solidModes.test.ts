// The solid bar model against closed forms, an independent dense solver and itself (halves
// against the full body), layered: rigid motions, algebra, uniform bars, then wood.
import { describe, expect, it } from 'vitest';
import {
  analyzeBar,
  assembleSolidBar,
  buildSolidBarMesh,
  envelopeEigenproblem,
  envelopeToDense,
  isotropicStiffness,
  lowestModesOf,
  orthotropicStiffness,
  parseBarFile,
  rectangleTorsionConstant,
  solidRigidModes,
  solveSolidBar,
  sparseSymmetricToDense,
  uniformProfile,
  type OrthotropicElasticity,
  type SolidBar,
  type SolidMeshOptions,
  type SolidModeKind,
} from '../../src/index.ts';
import { denseGeneralizedEigen } from '../reference/denseGeneralizedEigen.ts';
import { eulerBernoulliFreeFreeNodes } from '../reference/eulerBernoulliFreeFree.ts';
import { huangFreeFreeFrequencies } from '../reference/huangFreeFree.ts';

const GPa = 1e9;
/** Plain carbon steel (E, ν, ρ from memory; the values only need to be isotropic and plausible). */
const steel = { E: 205 * GPa, nu: 0.29, rho: 7850 };
const shearModulus = steel.E / (2 * (1 + steel.nu));
/** Cowper (1966, J. Appl. Mech. 33:335): κ of a rectangle, 10(1+ν)/(12+11ν). */
const cowper = (10 * (1 + steel.nu)) / (12 + 11 * steel.nu);

function steelBar(length: number, width: number, thickness: number): SolidBar {
  return { geometry: { length, width, blankThickness: thickness, profile: uniformProfile(length, thickness) }, material: { stiffness: isotropicStiffness(steel.E, steel.nu), density: steel.rho }, mirrorSymmetric: true };
}

/** The wood (E_L 12, E_R 1.2, E_T 0.6, G_LR 0.95, G_LT 0.75, G_RT 0.25 GPa; Poisson's ratios the hardwood means). */
const wood: OrthotropicElasticity = {
  youngLongitudinal: 12 * GPa,
  youngRadial: 1.2 * GPa,
  youngTangential: 0.6 * GPa,
  shearLongitudinalRadial: 0.95 * GPa,
  shearLongitudinalTangential: 0.75 * GPa,
  shearRadialTangential: 0.25 * GPa,
  poissonLongitudinalRadial: 0.38,
  poissonLongitudinalTangential: 0.47,
  poissonRadialTangential: 0.71,
};

const frequenciesOf = (modes: { kind: SolidModeKind; hz: number }[], kind: SolidModeKind) => modes.filter((m) => m.kind === kind).map((m) => m.hz);
const relative = (a: number, b: number) => Math.abs(a / b - 1);

describe('rigid motions and the algebra (small meshes, dense reference of test/reference)', () => {
  const bar = steelBar(0.12, 0.03, 0.02);
  const mesh: SolidMeshOptions = { element: 'serendipity-20', lengthElements: 4, halfWidthElements: 1, thicknessElements: 1, stationRefinement: 0 };
  const dense = (part: 'symmetric' | 'antisymmetric' | 'full') => {
    const system = assembleSolidBar(buildSolidBarMesh(bar.geometry, part, mesh), bar.material);
    return { system, result: denseGeneralizedEigen(envelopeToDense(system.stiffness), sparseSymmetricToDense(system.mass)) };
  };
  const full = dense('full');
  const symmetric = dense('symmetric');
  const antisymmetric = dense('antisymmetric');

  it('the full body has six zero eigenvalues (rigid motions) and the halves three each; the rest are positive (1e-9 of the first flexible one)', () => {
    for (const [{ result }, rigid] of [
      [full, 6],
      [symmetric, 3],
      [antisymmetric, 3],
    ] as const) {
      const values = result.values;
      const firstFlexible = values[rigid]!;
      expect(firstFlexible).toBeGreaterThan(0);
      for (let k = 0; k < rigid; k++) expect(Math.abs(values[k]!)).toBeLessThan(1e-9 * firstFlexible);
    }
  });
  it('the rigid vectors the solver deflates span exactly that null space: K·r = 0 (1e-9 of ‖K‖·‖r‖)', () => {
    for (const { system } of [full, symmetric, antisymmetric]) {
      const k = envelopeToDense(system.stiffness);
      const scale = Math.max(...k.map((row) => Math.max(...row.map(Math.abs))));
      for (const r of solidRigidModes(system)) {
        const norm = Math.sqrt(r.reduce((s, v) => s + v * v, 0));
        for (const row of k) expect(Math.abs(row.reduce((s, v, j) => s + v * r[j]!, 0))).toBeLessThan(1e-9 * scale * norm);
      }
    }
  });
  it('shift-invert Lanczos on the envelope LDLᵀ gives the dense solver’s lowest flexible eigenvalues (relative 1e-9)', () => {
    for (const [{ system, result }, rigid] of [
      [full, 6],
      [symmetric, 3],
      [antisymmetric, 3],
    ] as const) {
      const lanczos = lowestModesOf(envelopeEigenproblem(system.stiffness, system.mass), 6, { shift: -0.1 * result.values[rigid]!, rigidModes: solidRigidModes(system), tolerance: 1e-10 });
      lanczos.eigenvalues.forEach((value, k) => expect(relative(value, result.values[rigid + k]!)).toBeLessThan(1e-9));
    }
  });
  it('the two halves together give the full body’s spectrum (relative 1e-6): every mode is symmetric or antisymmetric across the width', () => {
    const parts = [...symmetric.result.values.slice(3), ...antisymmetric.result.values.slice(3)].sort((a, b) => a - b);
    const whole = full.result.values.slice(6);
    for (let k = 0; k < 30; k++) expect(relative(parts[k]!, whole[k]!)).toBeLessThan(1e-6);
  });
});

describe('uniform isotropic steel bar against beam theory (closed forms)', () => {
  const length = 0.4;
  const width = 0.03;
  const thickness = 0.02;
  const solution = solveSolidBar(steelBar(length, width, thickness), { symmetric: { count: 4 }, antisymmetric: { count: 5 } }, { mesh: { lengthElements: 30, halfWidthElements: 2, thicknessElements: 2 }, tolerance: 1e-9 });
  const area = width * thickness;

  it('vertical and lateral bending within 0.3 % of Timoshenko theory with Cowper’s κ (Huang 1961 frequency equation; Cowper 1966)', () => {
    for (const [kind, depth, span] of [
      ['bending', thickness, width],
      ['lateral', width, thickness],
    ] as const) {
      const reference = huangFreeFreeFrequencies(
        { length, bendingStiffness: (steel.E * span * depth ** 3) / 12, shearStiffness: cowper * shearModulus * area, massPerLength: steel.rho * area, rotaryInertiaPerLength: (steel.rho * span * depth ** 3) / 12 },
        3,
      );
      const found = frequenciesOf(solution.modes, kind);
      // Measured 0.02 / 0.08 / 0.16 %: the solid's Poisson coupling and mesh error, inside the 0.3 %.
      reference.forEach((hz, i) => expect(relative(found[i]!, hz)).toBeLessThan(0.003));
    }
  });
  it('the first two torsion modes within 1 % of Saint-Venant torsion with the rectangle’s J (Timoshenko & Goodier series): f_n = (n/2L)·√(GJ/ρI_p)', () => {
    const J = rectangleTorsionConstant(width, thickness);
    const polar = (width * thickness * (width ** 2 + thickness ** 2)) / 12;
    const found = frequenciesOf(solution.modes, 'torsion');
    // Measured +0.30 % and +0.33 % on this mesh (0.07 / 0.10 % on 40 × 3 × 3): warping inertia and mesh error.
    [1, 2].forEach((n, i) => expect(relative(found[i]!, (n / (2 * length)) * Math.sqrt((shearModulus * J) / (steel.rho * polar)))).toBeLessThan(0.01));
  });
  it('classifies every mode with its expected sign changes (bending n: n + 1, torsion n: n) and high purity', () => {
    for (const mode of solution.modes) {
      expect(mode.purity).toBeGreaterThan(0.9);
      expect(mode.signChanges).toBe(mode.kind === 'bending' || mode.kind === 'lateral' ? mode.index + 1 : mode.index);
    }
  });
});

describe('slender bar against Euler–Bernoulli', () => {
  it('a bar 60 thicknesses long: mode 1 within 0.5 % of (4.730041)²/(2πL²)·√(EI/ρA) and its nodal lines within 0.5 mm of 0.2242 L (Blevins 1979, table 8-1)', () => {
    const length = 0.6;
    const thickness = 0.01;
    const solution = solveSolidBar(steelBar(length, 0.012, thickness), { symmetric: { count: 1 }, antisymmetric: { count: 1 } }, { mesh: { lengthElements: 30, halfWidthElements: 1, thicknessElements: 2 } });
    const first = solution.modes.find((m) => m.kind === 'bending' && m.index === 1)!;
    const eulerBernoulli = (4.730041 ** 2 / (2 * Math.PI * length ** 2)) * Math.sqrt((steel.E * thickness ** 2) / 12 / steel.rho);
    expect(relative(first.hz, eulerBernoulli)).toBeLessThan(0.005);
    const nodes = eulerBernoulliFreeFreeNodes(1).map((s) => s * length);
    expect(first.nodalLines).toHaveLength(2);
    first.nodalLines.forEach((x, i) => expect(Math.abs(x - nodes[i]!)).toBeLessThan(0.0005));
  });
});

describe('grain orientation', () => {
  const length = 0.3;
  const profile = uniformProfile(length, 0.02);
  const geometry = { length, width: 0.04, blankThickness: 0.02, profile };
  const mesh = { lengthElements: 16, halfWidthElements: 2, thicknessElements: 2, stationRefinement: 0 };
  const request = { symmetric: { count: 3 }, antisymmetric: { count: 3 } };

  it('an isotropic material gives the same frequencies for every ring angle (1e-7; the full body for oblique rings, the halves otherwise)', () => {
    const E = 70 * GPa;
    const nu = 0.33;
    const G = E / (2 * (1 + nu));
    const same: OrthotropicElasticity = { youngLongitudinal: E, youngRadial: E, youngTangential: E, shearLongitudinalRadial: G, shearLongitudinalTangential: G, shearRadialTangential: G, poissonLongitudinalRadial: nu, poissonLongitudinalTangential: nu, poissonRadialTangential: nu };
    const spectra = [0, 25, 90].map((degrees) => {
      const ringAngle = (degrees * Math.PI) / 180;
      const aligned = degrees % 90 === 0;
      const bar = { geometry, material: { stiffness: orthotropicStiffness(same, { ringAngle }), density: 2700 }, mirrorSymmetric: aligned };
      return solveSolidBar(bar, request, { mesh, tolerance: 1e-9 }).modes.map((m) => m.hz);
    });
    for (const spectrum of spectra.slice(1)) spectrum.slice(0, 6).forEach((hz, k) => expect(relative(hz, spectra[0]![k]!)).toBeLessThan(1e-7));
  });
  it('an oblique ring angle (45°) is solved on the full body, says so, and puts each tuned partial between its radial and tangential values (the vertical plane’s shear modulus lies between G_LT and G_LR)', () => {
    const file = (grain: object) =>
      parseBarFile({ length_mm: 300, section: { shape: 'rect', width_mm: 40, thickness_mm: 20 }, profile_mm: [[0, 20], [90, 20], [150, 10], [210, 20], [300, 20]], material: { E_GPa: 12, E_R_GPa: 1.2, E_T_GPa: 0.6, G_LR_GPa: 0.95, G_LT_GPa: 0.75, G_RT_GPa: 0.25, density_kg_m3: 750 }, grain });
    const coarse = { lengthElements: 12, halfWidthElements: 1, thicknessElements: 2 };
    const solve = (grain: object) => analyzeBar(file(grain), { theory: 'solid', modes: 3, solidMesh: coarse });
    const oblique = solve({ ring_angle_deg: 45 });
    expect(oblique.mesh.solved_as).toBe('full body');
    expect(oblique.notes?.[0]).toMatch(/full body/);
    const radial = solve({ through_thickness: 'radial' });
    const tangential = solve({ through_thickness: 'tangential' });
    oblique.bending.forEach((mode, i) => {
      expect(mode.hz).toBeLessThan(radial.bending[i]!.hz);
      expect(mode.hz).toBeGreaterThan(tangential.bending[i]!.hz);
    });
  });
  it('radial against tangential moves each family the way the shear moduli say: vertical bending follows G_xz (G_LR radial > G_LT tangential), lateral and torsion of this wide bar follow G_xy (the other way)', () => {
    const solve = (degrees: number) => {
      const bar = { geometry, material: { stiffness: orthotropicStiffness(wood, { ringAngle: (degrees * Math.PI) / 180 }), density: 750 }, mirrorSymmetric: true };
      return solveSolidBar(bar, request, { mesh }).modes;
    };
    const radial = solve(0);
    const tangential = solve(90);
    for (const [kind, radialHigher] of [
      ['bending', true],
      ['lateral', false],
      ['torsion', false],
    ] as const) {
      const r = frequenciesOf(radial, kind)[0]!;
      const t = frequenciesOf(tangential, kind)[0]!;
      expect(r > t).toBe(radialHigher);
    }
  });
});

describe('line model against solid model on slender uniform bars (the output line_model_cents)', () => {
  // 0.3 % = 5.19 cents.
  const limit = 1200 * Math.log2(1.003);
  it('steel 600 × 20 × 10 mm: every listed bending, torsion and lateral mode within 0.3 % (measured ≤ 0.15 %)', () => {
    const analysis = analyzeBar(parseBarFile({ length_mm: 600, section: { shape: 'rect', width_mm: 20, thickness_mm: 10 }, material: { preset: 'steel-carbon' } }), { theory: 'solid', modes: 3 });
    for (const family of ['bending', 'torsion', 'lateral'] as const) {
      expect(analysis[family].length).toBeGreaterThan(0);
      for (const mode of analysis[family]) expect(Math.abs(mode.line_model_cents!)).toBeLessThan(limit);
    }
  });
  it('wood 500 × 40 × 12 mm, radial grain: the tuned partials 1–3 within 0.3 % (the line model’s G is the vertical plane’s; measured ≤ 0.11 %)', () => {
    const analysis = analyzeBar(parseBarFile({ length_mm: 500, section: { shape: 'rect', width_mm: 40, thickness_mm: 12 }, material: { E_GPa: 12, E_R_GPa: 1.2, E_T_GPa: 0.6, G_LR_GPa: 0.95, G_LT_GPa: 0.75, G_RT_GPa: 0.25, density_kg_m3: 750 } }), { theory: 'solid', modes: 3 });
    for (const mode of analysis.bending) expect(Math.abs(mode.line_model_cents!)).toBeLessThan(limit);
  });
});
