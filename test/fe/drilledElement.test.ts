// Cord holes at the element level: the drilled section against closed forms, the angle rule
// against closed-form integrals over a circle, and the drilled elements' own properties
// (symmetry, rigid-body modes, convergence of the rule).
import { describe, expect, it } from 'vitest';
import {
  beamElement,
  bendingLaw,
  drilledElementRule,
  drilledSection,
  holeChord,
  holeQuadraturePoints,
  rectangleTorsionConstant,
  timoshenkoElementType,
  torsionElement,
  torsionLaw,
  type LineHole,
  type Material,
  type Section,
} from '../../src/index.ts';

const wood: Material = { youngModulus: 18e9, shearModulus: 1.3e9, density: 1000, poisson: 0.37 };
const rect: Section = { shape: 'rect', width: 0.04, thickness: 0.02 };

/** Second moment about the common centroid of full-width strips [top, bottom] (y down from the top): parallel axes, written out here. */
function stripsSecondMoment(width: number, strips: [number, number][]): { area: number; second: number } {
  const area = strips.reduce((sum, [a, b]) => sum + width * (b - a), 0);
  const centroid = strips.reduce((sum, [a, b]) => sum + width * (b - a) * ((a + b) / 2), 0) / area;
  const second = strips.reduce((sum, [a, b]) => sum + (width * (b - a) ** 3) / 12 + width * (b - a) * ((a + b) / 2 - centroid) ** 2, 0);
  return { area, second };
}

describe('drilled section', () => {
  const b = 0.04;
  const t = 0.02;
  it('with no chord is the solid rectangle (A = bt, I = bt³/12, tb³/12, J by the series)', () => {
    const s = drilledSection(b, t, 0, 0.01);
    expect(s.area).toBeCloseTo(b * t, 15);
    expect(s.secondMomentVertical / ((b * t ** 3) / 12)).toBeCloseTo(1, 13);
    expect(s.secondMomentLateral / ((t * b ** 3) / 12)).toBeCloseTo(1, 13);
    expect(s.torsionConstant).toBe(rectangleTorsionConstant(b, t));
  });
  it('a centred void leaves I = b(t³ − c³)/12 (two equal strips, closed form)', () => {
    const c = 0.006;
    const s = drilledSection(b, t, c, t / 2);
    expect(s.area).toBeCloseTo(b * (t - c), 15);
    expect(s.secondMomentVertical / ((b * (t ** 3 - c ** 3)) / 12)).toBeCloseTo(1, 12);
  });
  it('an off-centre void: area and second moment about the net centroid equal those of the two strips (parallel axes)', () => {
    for (const [c, h] of [
      [0.004, 0.006],
      [0.006, 0.013],
      [0.002, 0.0025],
    ] as const) {
      const s = drilledSection(b, t, c, h);
      const strips = stripsSecondMoment(b, [
        [0, h - c / 2],
        [h + c / 2, t],
      ]);
      expect(s.area / strips.area).toBeCloseTo(1, 12);
      expect(s.secondMomentVertical / strips.second).toBeCloseTo(1, 11);
    }
  });
  it('torsion of a wide strip (b = 20t): J falls as the thin strip’s ∫4z²·b dz over the wood left (closed form b(t³ − c³)/3 when centred)', () => {
    const wide = 20 * t;
    const c = 0.006;
    const centred = drilledSection(wide, t, c, t / 2);
    expect(centred.torsionConstant / rectangleTorsionConstant(wide, t)).toBeCloseTo((t ** 3 - c ** 3) / t ** 3, 12);
    // Off-centre by z₀: the void takes ∫ 4z²·b dz over [z₀ − c/2, z₀ + c/2] = b(4c·z₀² + c³/3).
    const z0 = 0.004;
    const off = drilledSection(wide, t, c, t / 2 + z0);
    const removed = ((z0 + c / 2) ** 3 - (z0 - c / 2) ** 3) * (4 / 3);
    expect(off.torsionConstant / rectangleTorsionConstant(wide, t)).toBeCloseTo(1 - removed / (t ** 3 / 3), 12);
  });
  it('derivatives in t (hole fixed below the top) match central differences to 1e-7 relative', () => {
    const c = 0.005;
    const h = 0.008;
    const step = 1e-7;
    const plus = drilledSection(b, t + step, c, h);
    const minus = drilledSection(b, t - step, c, h);
    const s = drilledSection(b, t, c, h);
    // Central difference, truncation O(step²·t‴) ≈ 1e-14 relative here; rounding ≈ 1e-16/1e-7.
    expect(s.secondMomentVerticalSlope / ((plus.secondMomentVertical - minus.secondMomentVertical) / (2 * step))).toBeCloseTo(1, 7);
    expect(s.areaSlope / ((plus.area - minus.area) / (2 * step))).toBeCloseTo(1, 7);
    expect(s.secondMomentLateralSlope / ((plus.secondMomentLateral - minus.secondMomentLateral) / (2 * step))).toBeCloseTo(1, 7);
    expect(s.torsionConstantSlope / ((plus.torsionConstant - minus.torsionConstant) / (2 * step))).toBeCloseTo(1, 7);
  });
  it('the chord of a round hole is its diameter at the centre and 0 at and beyond its edges', () => {
    expect(holeChord(0.003, 0.1, 0.1)).toBeCloseTo(0.006, 15);
    expect(holeChord(0.003, 0.1, 0.103)).toBeLessThan(1e-9); // 0.103 − 0.1 is not exactly 0.003 in binary
    expect(holeChord(0.003, 0.1, 0.09)).toBe(0);
    expect(holeChord(0.003, 0.1, 0.1018)).toBeCloseTo(2 * Math.sqrt(0.003 ** 2 - 0.0018 ** 2), 15);
  });
});

describe('angle rule over a hole', () => {
  const hole: LineHole = { position: 0.1, radius: 0.003, depthBelowTop: 0.01 };
  const halves = [drilledElementRule(0.097, 0.1, hole), drilledElementRule(0.1, 0.103, hole)];
  const integrate = (f: (x: number, chord: number) => number): number =>
    halves.reduce((sum, rule, half) => sum + rule.xi.reduce((inner, xi, g) => inner + rule.weight[g]! * f((half === 0 ? 0.097 : 0.1) + xi * 0.003, rule.chord[g]!), 0), 0);
  const r = hole.radius;
  it('∫ chord dx is the circle’s area πr², ∫ chord³ dx = 3πr⁴, ∫ s²·chord dx = πr⁴/4 (closed forms)', () => {
    expect(integrate((_, c) => c) / (Math.PI * r * r)).toBeCloseTo(1, 14);
    expect(integrate((_, c) => c ** 3) / (3 * Math.PI * r ** 4)).toBeCloseTo(1, 14);
    expect(integrate((x, c) => (x - 0.1) ** 2 * c) / ((Math.PI * r ** 4) / 4)).toBeCloseTo(1, 13);
  });
  it('a sub-span between a hole edge and a station inside it: ∫ chord dx is the circular segment’s area', () => {
    // Segment of a circle cut by the chord at distance d from the centre: r²·acos(d/r) − d·√(r² − d²).
    const d = 0.0011;
    const rule = drilledElementRule(0.1 + d, 0.103, hole);
    const segment = r * r * Math.acos(d / r) - d * Math.sqrt(r * r - d * d);
    expect(rule.xi.reduce((sum, _, g) => sum + rule.weight[g]! * rule.chord[g]!, 0) / (segment / 2) / 2).toBeCloseTo(1, 13);
  });
});

describe('drilled elements', () => {
  const hole: LineHole = { position: 0.1, radius: 0.003, depthBelowTop: 0.008 };
  const law = bendingLaw(rect, wood, 'vertical');
  const n = timoshenkoElementType.localDofs;
  const matrices = (points: number): { k: Float64Array; m: Float64Array } => {
    const k = new Float64Array(n * n);
    const m = new Float64Array(n * n);
    beamElement(timoshenkoElementType, 0.003, 0.02, 0.019, law, k, m, undefined, drilledElementRule(0.1, 0.103, hole, points));
    return { k, m };
  };
  const norm = (a: Float64Array): number => Math.sqrt(a.reduce((sum, v) => sum + v * v, 0));
  it(`${holeQuadraturePoints} angle points agree with 80 to rounding (1e-13 relative, Frobenius: sums of ~100 terms of mixed sign)`, () => {
    const coarse = matrices(holeQuadraturePoints);
    const fine = matrices(80);
    expect(norm(coarse.k.map((v, i) => v - fine.k[i]!)) / norm(fine.k)).toBeLessThan(1e-13);
    expect(norm(coarse.m.map((v, i) => v - fine.m[i]!)) / norm(fine.m)).toBeLessThan(1e-13);
    // …while 6 points (a polynomial-like budget) are visibly off: the rule is needed.
    const few = matrices(6);
    expect(norm(few.m.map((v, i) => v - fine.m[i]!)) / norm(fine.m)).toBeGreaterThan(1e-12);
  });
  it('stays symmetric and keeps the rigid-body modes (translation, rotation) in the stiffness null space', () => {
    const { k } = matrices(holeQuadraturePoints);
    for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) expect(k[a * n + b]).toBe(k[b * n + a]);
    const h = 0.003;
    const modes = [
      Float64Array.from({ length: n }, (_, a) => (timoshenkoElementType.dofKind[a] === 0 ? 1 : 0)),
      Float64Array.from({ length: n }, (_, a) => (timoshenkoElementType.dofKind[a] === 0 ? timoshenkoElementType.dofPosition[a]! * h : 1)),
    ];
    const scale = Math.max(...Array.from(k, Math.abs));
    for (const u of modes) {
      for (let a = 0; a < n; a++) {
        let row = 0;
        for (let b = 0; b < n; b++) row += k[a * n + b]! * u[b]!;
        expect(Math.abs(row)).toBeLessThan(1e-12 * scale);
      }
    }
  });
  it('removes exactly the hole’s mass: Σ M over deflection dofs is ρ·(b·∫t dx − b·∫chord dx)', () => {
    const { m } = matrices(holeQuadraturePoints);
    const w = Float64Array.from({ length: n }, (_, a) => (timoshenkoElementType.dofKind[a] === 0 ? 1 : 0));
    let total = 0;
    for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) total += w[a]! * m[a * n + b]! * w[b]!;
    // Half the hole (πr²/2) out of a linearly tapering strip 3 mm long, 20 → 19 mm thick.
    const expected = wood.density * rect.width * (0.003 * 0.0195 - (Math.PI * 0.003 ** 2) / 2);
    expect(total / expected).toBeCloseTo(1, 13);
  });
  it('torsion: symmetric, twist-free for a rigid rotation, and the net polar inertia', () => {
    const tLaw = torsionLaw(rect, wood);
    const k = new Float64Array(25);
    const m = new Float64Array(25);
    torsionElement(0.003, 0.02, 0.02, tLaw, k, m, undefined, drilledElementRule(0.097, 0.1, hole));
    for (let a = 0; a < 5; a++) {
      let row = 0;
      for (let b = 0; b < 5; b++) {
        expect(k[a * 5 + b]).toBe(k[b * 5 + a]);
        row += k[a * 5 + b]!;
      }
      expect(Math.abs(row)).toBeLessThan(1e-12 * k[0]!);
    }
    expect(m.reduce((sum, v) => sum + v, 0)).toBeGreaterThan(0);
  });
});
