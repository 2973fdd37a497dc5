import { scanForRoots } from './scanForRoots.ts';

/** Uniform beam properties in SI: EI (N·m²), κGA (N), ρA (kg/m), ρI (kg·m), length (m). */
export interface UniformBeam {
  length: number;
  bendingStiffness: number;
  shearStiffness: number;
  massPerLength: number;
  rotaryInertiaPerLength: number;
}

/**
 * Left side of the free–free uniform Timoshenko frequency equation (Huang 1961, in the notation
 * of Han, Benaroya & Wei, J. Sound Vib. 225 (1999) 935), divided by cosh(bα) so it stays finite:
 *   2 − 2 cosh(bα) cos(bβ) + [b/√(1 − b²r²s²)] [b²r²(r² − s²)² + (3r² − s²)] sinh(bα) sin(bβ) = 0
 * with b² = ρA L⁴ ω²/(EI), r² = I/(A L²), s² = EI/(κ A G L²),
 * α, β = (1/√2) {∓(r² + s²) + [(r² − s²)² + 4/b²]^½}^½. Valid below the cutoff b r s < 1.
 */
function huangFreeFreeResidual(b: number, r2: number, s2: number): number {
  const root = Math.sqrt((r2 - s2) ** 2 + 4 / (b * b));
  const alpha = Math.SQRT1_2 * Math.sqrt(-(r2 + s2) + root);
  const beta = Math.SQRT1_2 * Math.sqrt(r2 + s2 + root);
  const factor = (b / Math.sqrt(1 - b * b * r2 * s2)) * (b * b * r2 * (r2 - s2) ** 2 + (3 * r2 - s2));
  const coshBa = Math.cosh(b * alpha);
  return 2 / coshBa - 2 * Math.cos(b * beta) + factor * Math.tanh(b * alpha) * Math.sin(b * beta);
}

/**
 * The first `count` roots b of the free–free Timoshenko frequency equation for the dimensionless
 * parameters r², s² (see huangFreeFreeResidual). Scanned in √b (roots are about π apart there,
 * like βL) with step 0.02, refined by Brent to machine precision. Throws if the roots run past
 * the cutoff b = 1/(r s).
 */
export function huangFreeFreeRoots(r2: number, s2: number, count: number): number[] {
  const cutoff = r2 * s2 > 0 ? 1 / Math.sqrt(r2 * s2) : Infinity;
  const end = Math.min(Math.sqrt(cutoff) * (1 - 1e-9), 10 + 4 * count);
  const roots = scanForRoots((q) => huangFreeFreeResidual(q * q, r2, s2), { start: 1, step: 0.02, end, count });
  return roots.map((q) => q * q);
}

/**
 * Frequencies (Hz) of the first `count` flexible free–free modes of a uniform Timoshenko beam,
 * from the Huang roots: ω = b √(EI/(ρA)) / L², with r² = ρI/(ρA L²) and s² = EI/(κGA L²).
 */
export function huangFreeFreeFrequencies(beam: UniformBeam, count: number): number[] {
  const { length, bendingStiffness, shearStiffness, massPerLength, rotaryInertiaPerLength } = beam;
  const r2 = rotaryInertiaPerLength / (massPerLength * length * length);
  const s2 = bendingStiffness / (shearStiffness * length * length);
  const scale = Math.sqrt(bendingStiffness / massPerLength) / (length * length) / (2 * Math.PI);
  return huangFreeFreeRoots(r2, s2, count).map((b) => b * scale);
}
