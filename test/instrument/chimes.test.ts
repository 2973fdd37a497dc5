import { describe, expect, it } from 'vitest';
import { analyzeChime } from '../../src/instrument/analyzeChime.ts';
import { chimeForNote } from '../../src/instrument/chimeForNote.ts';
import type { ChimeStock } from '../../src/instrument/chimeStock.ts';
import { chimeModel } from '../../src/instrument/chimeStock.ts';
import { pieceModes } from '../../src/instrument/pieceModes.ts';
import { strikeNote } from '../../src/instrument/strikeNote.ts';
import { scanRoots } from './rootFinding.ts';

// Aluminium 6061-T6 as the producers' data sheets give it (reference-values.md, published).
const aluminium = { E_GPa: 68.9, density_kg_m3: 2700, poisson: 0.33 };
const E = 68.9e9;
const rho = 2700;
const nu = 0.33;

const thinTube: ChimeStock = { section: { shape: 'tube', outer_diameter_mm: 25.4, wall_mm: 1.6 }, material: aluminium };
const thickTube: ChimeStock = { section: { shape: 'tube', outer_diameter_mm: 32, wall_mm: 8 }, material: aluminium };
const rod: ChimeStock = { section: { shape: 'round', diameter_mm: 16 }, material: aluminium };

/** Area and second moment of a tube (closed forms: π(D² − d²)/4, π(D⁴ − d⁴)/64), m², m⁴. */
function tubeSection(outerMm: number, wallMm: number): { area: number; inertia: number; m: number } {
  const D = outerMm / 1000;
  const d = (outerMm - 2 * wallMm) / 1000;
  return { area: (Math.PI * (D * D - d * d)) / 4, inertia: (Math.PI * (D ** 4 - d ** 4)) / 64, m: d / D };
}

/** Cowper's hollow-circle κ, 6(1+ν)(1+m²)² / [(7+6ν)(1+m²)² + (20+12ν)m²] (Cowper 1966, J. Appl. Mech. 33:335; reference-values.md). */
function cowperHollow(m: number): number {
  const q = (1 + m * m) ** 2;
  return (6 * (1 + nu) * q) / ((7 + 6 * nu) * q + (20 + 12 * nu) * m * m);
}

/**
 * Free–free Timoshenko frequencies (Hz) from Huang's frequency equation (Huang 1961, in the
 * notation of Han, Benaroya & Wei, J. Sound Vib. 225 (1999) 935; reference-values.md):
 * b² = ρAL⁴ω²/EI, r² = I/(AL²), s² = EI/(κAGL²),
 * α, β = (1/√2){∓(r² + s²) + [(r² − s²)² + 4/b²]^½}^½,
 * 2 − 2 cosh(bα) cos(bβ) + b/√(1 − b²r²s²) · [b²r²(r² − s²)² + (3r² − s²)] · sinh(bα) sin(bβ) = 0,
 * divided through by cosh(bα) (same roots, no overflow), roots by this suite's own scan + bisection.
 */
function huangFrequencies(length: number, area: number, inertia: number, kappa: number, count: number): number[] {
  const G = E / (2 * (1 + nu));
  const r2 = inertia / (area * length * length);
  const s2 = (E * inertia) / (kappa * area * G * length * length);
  const equation = (b: number): number => {
    const root = Math.sqrt((r2 - s2) ** 2 + 4 / (b * b));
    const alpha = Math.sqrt(0.5 * (-(r2 + s2) + root));
    const beta = Math.sqrt(0.5 * (r2 + s2 + root));
    const cutoff = 1 - b * b * r2 * s2;
    if (cutoff <= 0) return Number.NaN;
    const factor = (b / Math.sqrt(cutoff)) * (b * b * r2 * (r2 - s2) ** 2 + (3 * r2 - s2));
    return 2 / Math.cosh(b * alpha) - 2 * Math.cos(b * beta) + factor * Math.tanh(b * alpha) * Math.sin(b * beta);
  };
  // Euler–Bernoulli roots b = (βL)² with βL ≈ (n + ½)π bound the Timoshenko ones from above.
  const roots = scanRoots(equation, 1, 1.2 * ((count + 1) * Math.PI) ** 2, count, 200000);
  return roots.map((b) => (b / (length * length)) * Math.sqrt((E * inertia) / (rho * area)) / (2 * Math.PI));
}

const cents = (a: number, b: number): number => 1200 * Math.log2(a / b);

describe('chime length for a note', () => {
  it('matches the thin-tube Euler–Bernoulli closed form under Euler–Bernoulli theory', () => {
    // Blevins 1979, table 8-1: f₁ = (β₁L)²/(2πL²)·√(EI/ρA), β₁L = 4.73004074486 (reference-values.md),
    // so L = β₁L·(√(EI/ρA)/(2πf))^½ with I/A = (D² + d²)/16 for a tube.
    for (const hz of [262, 525.6, 1051]) {
      const chime = chimeForNote(thinTube, hz, { theory: 'euler-bernoulli' });
      const { area, inertia } = tubeSection(25.4, 1.6);
      const closed = 4.73004074486 * Math.sqrt(Math.sqrt((E * inertia) / (rho * area)) / (2 * Math.PI * hz)) * 1000;
      // The length is the finite-element answer (the search stops when the solver's mode 1 is within
      // 1e-4 cent), so this compares the solver with the closed form, wherever the search started.
      // Tolerance 3e-6 of the length = 0.01 cent of frequency: the Hermite mesh's mode-1 error (meshDensity).
      expect(Math.abs(chime.length_mm / closed - 1)).toBeLessThan(3e-6);
      const closedHz = ((4.73004074486 / (chime.length_mm / 1000)) ** 2 / (2 * Math.PI)) * Math.sqrt((E * inertia) / (rho * area));
      expect(Math.abs(cents(closedHz, hz))).toBeLessThan(0.01);
      expect(Math.abs(chime.cents_error)).toBeLessThan(1e-3);
    }
  });

  it('lands every partial on the Timoshenko free–free frequency equation, thin and thick walls and a rod', () => {
    const cases: [string, ChimeStock, number, number][] = [
      ['thin tube 25.4 × 1.6', thinTube, 525.6, 0.5321],
      ['thick tube 32 × 8', thickTube, 1400, 0],
      ['solid rod 16', rod, 1200, 0],
    ];
    for (const [name, stock, hz] of cases) {
      const chime = chimeForNote(stock, hz);
      const length = chime.length_mm / 1000;
      let area: number;
      let inertia: number;
      let kappa: number;
      if (stock.section.shape === 'tube') {
        const t = tubeSection(stock.section.outer_diameter_mm, stock.section.wall_mm);
        ({ area, inertia } = t);
        kappa = cowperHollow(t.m);
      } else {
        const d = stock.section.diameter_mm / 1000;
        area = (Math.PI * d * d) / 4;
        inertia = (Math.PI * d ** 4) / 64;
        kappa = (6 * (1 + nu)) / (7 + 6 * nu); // Cowper's solid circle (Cowper 1966)
      }
      const reference = huangFrequencies(length, area, inertia, kappa, 6);
      expect(reference.length, name).toBe(6);
      // The fundamental is the tuned quantity: within 0.001 cent of the target on Huang's equation
      // (search 1e-4 cent; mesh error measured 3e-5 cent).
      expect(Math.abs(cents(reference[0]!, hz)), name).toBeLessThan(0.001);
      // Partials 1–6 on the automatic mesh: within 0.005 cent (O(h⁸) elements; measured ≤ 5.0e-4 cent on mode 6).
      chime.partials.forEach((p, i) => expect(Math.abs(cents(p.hz, reference[i]!)), `${name} partial ${p.mode}`).toBeLessThan(0.005));
    }
  });

  it('shows the Timoshenko correction growing with the wall (thick tubes need a longer or shorter cut than Euler–Bernoulli says)', () => {
    // Shear and rotary inertia only lower frequencies (Han, Benaroya & Wei 1999), so for the same
    // note the Timoshenko chime is shorter than the Euler–Bernoulli one, more so when stubby.
    const thin = chimeForNote(thinTube, 525.6).length_mm / chimeForNote(thinTube, 525.6, { theory: 'euler-bernoulli' }).length_mm;
    const thick = chimeForNote(thickTube, 1400).length_mm / chimeForNote(thickTube, 1400, { theory: 'euler-bernoulli' }).length_mm;
    expect(thin).toBeLessThan(1);
    expect(thick).toBeLessThan(thin);
  });
});

describe('hanging point', () => {
  it('sits at the mode-1 node, 0.2242 L from the top of a slender tube', () => {
    // Node of mode 1 at x/L = 0.224158 (Blevins 1979, table 8-1; more digits computed, reference-values.md).
    const eb = analyzeChime(thinTube, 1500, { theory: 'euler-bernoulli' });
    // Euler–Bernoulli on the solver's mesh: node to 5e-6 L (the table's 6 digits; zero crossing refined
    // to 1e-9 L; measured 5e-7 L).
    expect(Math.abs(eb.hanging_point_fraction - 0.224158)).toBeLessThan(5e-6);
    expect(Math.abs(eb.lower_node_mm / 1500 - 0.775842)).toBeLessThan(5e-6);
    // Timoshenko on the same slender tube (L/D ≈ 59): shear moves the node by order (r/L)² — under 1e-4 L here.
    const timoshenko = analyzeChime(thinTube, 1500);
    expect(Math.abs(timoshenko.hanging_point_fraction - 0.224158)).toBeLessThan(1e-4);
  });

  it('moves a point mass’s end node as the Euler–Bernoulli tip-mass frequency equation says', () => {
    // A free–free Euler–Bernoulli beam with a point mass m at x = L (closed form, derived here):
    // w = a(ch + c) + b(sh + s) (free at 0), w''(L) = 0 and EI w'''(L) = −mω² w(L) give
    // det [[ch − c, sh − s], [sh + s + μλ(ch + c), ch − c + μλ(sh + s)]] = 0, λ = βL, μ = m/(ρAL).
    const length = 0.6;
    const { area, inertia } = tubeSection(25.4, 1.6);
    const tubeMass = rho * area * length;
    for (const mu of [0, 0.05, 0.2]) {
      const frequencyEquation = (l: number): number => {
        const [ch, sh, c, s] = [Math.cosh(l), Math.sinh(l), Math.cos(l), Math.sin(l)];
        return ((ch - c) * (ch - c + mu * l * (sh + s)) - (sh - s) * (sh + s + mu * l * (ch + c))) / (ch * ch);
      };
      const lambda = scanRoots(frequencyEquation, 0.5, 8, 1)[0]!;
      const hz = ((lambda * lambda) / (2 * Math.PI * length * length)) * Math.sqrt((E * inertia) / (rho * area));
      const shape = (x: number): number => {
        const l = (lambda * x) / length;
        const ratio = -(Math.cosh(lambda) - Math.cos(lambda)) / (Math.sinh(lambda) - Math.sin(lambda));
        return Math.cosh(l) + Math.cos(l) + ratio * (Math.sinh(l) + Math.sin(l));
      };
      const nodes = scanRoots(shape, 0, length, 2, 4000);
      const model = chimeModel(thinTube, length);
      const loads = mu === 0 ? [] : [{ at: 'end' as const, mass: mu * tubeMass, centreOffset: 0, rotaryInertia: 0 }];
      const [mode1] = pieceModes(model, { modes: 1, theory: 'euler-bernoulli', endLoads: loads });
      // 0.01 cent: the Hermite mesh's mode-1 error (meshDensity); nodes to 1e-5 L.
      expect(Math.abs(cents(mode1!.hz, hz)), `μ = ${mu}`).toBeLessThan(0.01);
      mode1!.nodes.forEach((x, i) => expect(Math.abs(x - nodes[i]!) / length, `μ = ${mu} node ${i}`).toBeLessThan(1e-5));
    }
  });

  it('reports how far a plug at the top moves the hanging point (towards the plug) and shortens the chime', () => {
    const plain = chimeForNote(thinTube, 525.6);
    const plugged = chimeForNote({ ...thinTube, end_masses: [{ end: 'top', mass_g: 5.3, length_mm: 12 }] }, 525.6);
    expect(plugged.hanging_point_shift_mm).toBeLessThan(0);
    // The mass lowers the pitch at a given length, so the same note needs a shorter tube.
    expect(plugged.length_mm).toBeLessThan(plain.length_mm);
    // The reported shift is the difference to the same tube without the plug.
    const unplugged = analyzeChime(thinTube, plugged.length_mm);
    expect(plugged.hanging_point_mm - unplugged.hanging_point_mm).toBeCloseTo(plugged.hanging_point_shift_mm!, 9);
  });
});

describe('strike note', () => {
  it('is the virtual pitch of modes 4–6 taken as harmonics 2 : 3 : 4, near an octave below mode 4', () => {
    // Uniform Euler–Bernoulli ratios 8.932950 : 13.344287 : 18.637888 (Blevins 1979, table 8-1; reference-values.md).
    // A true harmonic series 2f : 3f : 4f has its virtual pitch at f exactly (the definition of
    // the missing fundamental), and it scales with the frequencies.
    expect(strikeNote(2 * 440, 3 * 440, 4 * 440).hz).toBeCloseTo(440, 9);
    expect(strikeNote(2 * 440, 3 * 440, 4 * 440).harmonicDeviationCents.every((d) => Math.abs(d) < 1e-9)).toBe(true);
    expect(strikeNote(2 * 880, 3 * 880, 4 * 880).hz / strikeNote(2 * 440, 3 * 440, 4 * 440).hz).toBeCloseTo(2, 12);
    const strike = strikeNote(8.93295, 13.344287, 18.637888);
    // "About an octave below mode 4": within 50 cents of f₄/2 (common statement of the chime's strike note).
    expect(Math.abs(cents(strike.hz, strike.octaveBelowMode4Hz))).toBeLessThan(50);
    // Modes 4–6 are near 2 : 3 : 4: each within 70 cents of its harmonic.
    for (const d of strike.harmonicDeviationCents) expect(Math.abs(d)).toBeLessThan(70);
  });

  it('on a slender tube under Euler–Bernoulli theory equals the strike note of the closed-form ratios', () => {
    const chime = analyzeChime(thinTube, 1500, { theory: 'euler-bernoulli' });
    const f1 = chime.partials[0]!.hz;
    const expected = f1 * Math.cbrt((8.93295 / 2) * (13.344287 / 3) * (18.637888 / 4));
    // 0.05 cent: mesh error on modes 4–6 with the Hermite elements (meshDensity: 0.01 cent at mode 4).
    expect(Math.abs(cents(chime.strike.hz, expected))).toBeLessThan(0.05);
  });

  it('can be the tuned pitch: a tubular bell cut for its strike note sounds it', () => {
    const bell = chimeForNote(thinTube, 392, { tune: 'strike' });
    expect(Math.abs(cents(bell.strike.hz, 392))).toBeLessThan(1e-3);
    expect(bell.partials[0]!.hz).toBeLessThan(392 / 4);
  });
});
