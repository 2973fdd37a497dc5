import type { BeamLine } from '../../src/fe/BeamLine.ts';
import { bendingLaw, torsionLaw, type BendingPlane } from '../../src/fe/sectionLaw.ts';
import type { UniformBeam } from '../reference/huangFreeFree.ts';
import { profileStations, rectangularBarSection, type RectangularBar } from '../reference/rectangularBarSection.ts';
import { timoshenkoShootingFrequencies } from '../reference/timoshenkoShooting.ts';

/**
 * Test bars shared by the solver tests (invented dimensions, plausible for the trade), in SI, and
 * the bridges from them to the solver's BeamLine and to the contract's bar file (mm, GPa).
 */

/** brief.md §2 worked example: uniform 400 × 50 × 20 mm, E 20 GPa, G = E/12, ρ 1000, κ 5/6. */
export const workedExampleBar: RectangularBar = {
  length: 0.4, width: 0.05, youngModulus: 20e9, shearModulus: 20e9 / 12, density: 1000, shearCoefficient: 5 / 6,
  profile: [[0, 0.02], [0.4, 0.02]],
};

/** contract.md's F4 practice bar: 380 × 55 × 22 mm blank, undercut to 8 mm, E 12, G 0.95 GPa, ρ 750. */
export const practiceBar: RectangularBar = {
  length: 0.38, width: 0.055, youngModulus: 12e9, shearModulus: 0.95e9, density: 750, shearCoefficient: 5 / 6,
  profile: [[0, 0.022], [0.08, 0.022], [0.14, 0.011], [0.19, 0.008], [0.24, 0.011], [0.3, 0.022], [0.38, 0.022]],
};

/**
 * A parabolic arch sampled every 10 mm (a station spacing a plan would cut from): 420 × 60 ×
 * 24 mm blank, thickness 24 − 18·(1 − ((x − 210)/130)²) mm over the central 260 mm (6 mm at the
 * thinnest, a quarter of the blank), hardwood-like E 16 GPa, G 1.2 GPa, ρ 950.
 */
export const parabolicArchBar: RectangularBar = (() => {
  const profile: [number, number][] = [[0, 0.024]];
  for (let x = 80; x <= 340; x += 10) {
    const u = (x - 210) / 130;
    profile.push([x / 1000, (24 - 18 * (1 - u * u)) / 1000]);
  }
  profile.push([0.42, 0.024]);
  return { length: 0.42, width: 0.06, youngModulus: 16e9, shearModulus: 1.2e9, density: 950, shearCoefficient: 5 / 6, profile };
})();

/** The solver's material record for a test bar (ν only matters for round sections). */
function materialOf(bar: RectangularBar) {
  return { youngModulus: bar.youngModulus, shearModulus: bar.shearModulus, density: bar.density, poisson: 0.3, shearCoefficient: bar.shearCoefficient };
}

/** The blank thickness of a test bar: its thickest station. */
function blankThickness(bar: RectangularBar): number {
  return Math.max(...bar.profile.map(([, t]) => t));
}

/** The solver's beam line for a test bar, in the given bending plane or for torsion. */
export function beamLineOf(bar: RectangularBar, family: BendingPlane | 'torsion' = 'vertical'): BeamLine {
  const section = { shape: 'rect' as const, width: bar.width, thickness: blankThickness(bar) };
  const material = materialOf(bar);
  return {
    length: bar.length,
    profile: { positions: Float64Array.from(bar.profile, ([x]) => x), thicknesses: Float64Array.from(bar.profile, ([, t]) => t) },
    law: family === 'torsion' ? torsionLaw(section, material) : bendingLaw(section, material, family),
  };
}

/** The contract's bar file (mm, GPa) for a test bar. */
export function barFileOf(bar: RectangularBar, label = 'test bar') {
  const uniform = bar.profile.every(([, t]) => t === bar.profile[0]![1]);
  return {
    format: 'barwright.bar' as const,
    version: 1 as const,
    label,
    length_mm: bar.length * 1000,
    section: { shape: 'rect' as const, width_mm: bar.width * 1000, thickness_mm: blankThickness(bar) * 1000 },
    ...(uniform ? {} : { profile_mm: bar.profile.map(([x, t]) => [x * 1000, t * 1000] as [number, number]) }),
    material: { E_GPa: bar.youngModulus / 1e9, G_GPa: bar.shearModulus / 1e9, density_kg_m3: bar.density, shear_coefficient: bar.shearCoefficient },
  };
}

/** Pitch difference in cents, 1200·log2(value/reference). */
export function centsBetween(value: number, reference: number): number {
  return 1200 * Math.log2(value / reference);
}

/**
 * Converged free–free bending frequencies (Hz) of a test bar from the independent shooting
 * reference (test/reference/timoshenkoShooting.ts; ≤ 1e-10 relative, measured 4e-12 on the
 * undercut bars by tightening its tolerance 100×), restarting at its stations.
 */
export function shootingFrequencies(bar: RectangularBar, theory: 'timoshenko' | 'euler-bernoulli', count: number): number[] {
  return timoshenkoShootingFrequencies(rectangularBarSection(bar), bar.length, count, { stations: profileStations(bar), theory });
}

/** The uniform-beam properties (SI) of a uniform test bar, in one bending plane. */
export function uniformBeamOf(bar: RectangularBar, plane: 'vertical' | 'lateral' = 'vertical'): UniformBeam {
  const thickness = blankThickness(bar);
  const area = bar.width * thickness;
  const second = plane === 'vertical' ? (bar.width * thickness ** 3) / 12 : (thickness * bar.width ** 3) / 12;
  return {
    length: bar.length,
    bendingStiffness: bar.youngModulus * second,
    shearStiffness: bar.shearCoefficient * bar.shearModulus * area,
    massPerLength: bar.density * area,
    rotaryInertiaPerLength: bar.density * second,
  };
}

/** Euler–Bernoulli free–free frequency (Hz) of a uniform beam for the root βL. */
export function eulerBernoulliHz(beam: UniformBeam, betaL: number): number {
  return ((betaL * betaL) / (2 * Math.PI * beam.length ** 2)) * Math.sqrt(beam.bendingStiffness / beam.massPerLength);
}

/** A uniform test bar of the given size and moduli (κ 5/6). */
export function uniformBar(length: number, width: number, thickness: number, youngModulus: number, shearModulus: number, density: number): RectangularBar {
  return { length, width, youngModulus, shearModulus, density, shearCoefficient: 5 / 6, profile: [[0, thickness], [length, thickness]] };
}
