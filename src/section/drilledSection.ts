import { rectangleTorsionConstant, rectangleTorsionConstantDerivative } from './rectangleTorsionConstant.ts';

/**
 * Properties of a rectangular section (width b, thickness t, m) crossed by a cord hole drilled
 * through the width: where the hole is, the section loses a full-width strip of height `chord`
 * (the hole's chord at that position along the bar, m) whose centre lies `depthBelowTop` (m)
 * below the flat top. The top is the reference because an undercut thins the bar from below:
 * a hole drilled once keeps its distance from the top when the thickness there changes.
 * Everything is per unit length; derivatives are with respect to t at a fixed hole.
 */
export interface DrilledSection {
  /** Net area A = b(t − c), m². */
  area: number;
  /** dA/dt, m. */
  areaSlope: number;
  /** Second moment about the net section's own horizontal centroidal axis (vertical bending), m⁴. */
  secondMomentVertical: number;
  /** d/dt of secondMomentVertical, m³. */
  secondMomentVerticalSlope: number;
  /** Second moment about the vertical centroidal axis (lateral bending), (t − c)·b³/12, m⁴. */
  secondMomentLateral: number;
  /** d/dt of secondMomentLateral, m³. */
  secondMomentLateralSlope: number;
  /** St-Venant torsion constant of the drilled section, m⁴ (see drilledSection). */
  torsionConstant: number;
  /** d/dt of torsionConstant, m³. */
  torsionConstantSlope: number;
}

/**
 * The drilled section's properties. With y measured down from the top: A = b(t − c), first
 * moment Q = b(t²/2 − c·h) (h = depthBelowTop), second moment about the top
 * I_top = b(t³/3 − c³/12 − c·h²), and about the net centroid I = I_top − Q²/A (parallel axes).
 * Classical beam theory about the section's own centroid, as for the undrilled bar. Torsion: a
 * cord hole is short (its length along the bar is its diameter, less than the section's width),
 * so the solid wood on either side keeps the section twisting as one and the hole only removes
 * the shear it would have carried. In a strip the St-Venant shear runs across the width and grows
 * linearly from the mid-plane, τ = 2Gθz, so J = b·t³/3 = ∫4z²·b dz and a void of height c
 * whose centre is z₀ from the mid-plane removes b(4c·z₀² + c³/3) (thin-strip theory, Timoshenko
 * & Goodier, Theory of Elasticity, §109; first order in the void). That fraction,
 * (12c·z₀² + c³)/t³, is taken off the rectangle's own J (the series). With c = 0 every property is
 * the solid rectangle's: A = bt, I = bt³/12, J by the series.
 */
export function drilledSection(width: number, thickness: number, chord: number, depthBelowTop: number): DrilledSection {
  const bending = drilledBendingSection(width, thickness, chord, depthBelowTop);
  const b = width;
  const t = thickness;
  const c = chord;
  const h = depthBelowTop;
  // Fraction of J lost, q = (12c·z₀² + c³)/t³ with z₀ = h − t/2 (so dz₀/dt = −½).
  const offset = h - t / 2;
  const t3 = t * t * t;
  const lost = (12 * c * offset * offset + c * c * c) / t3;
  const lostSlope = (-12 * c * offset) / t3 - (3 * lost) / t;
  const solidTorsion = rectangleTorsionConstant(b, t);
  return {
    ...bending,
    torsionConstant: solidTorsion * (1 - lost),
    torsionConstantSlope: rectangleTorsionConstantDerivative(b, t) * (1 - lost) - solidTorsion * lostSlope,
  };
}

/** drilledSection without the torsion constant (the bending laws' hot path: the series is dear). */
export function drilledBendingSection(width: number, thickness: number, chord: number, depthBelowTop: number): Omit<DrilledSection, 'torsionConstant' | 'torsionConstantSlope'> {
  const b = width;
  const t = thickness;
  const c = chord;
  const h = depthBelowTop;
  const area = b * (t - c);
  const firstMoment = b * ((t * t) / 2 - c * h);
  const topMoment = b * ((t * t * t) / 3 - (c * c * c) / 12 - c * h * h);
  const centroid = firstMoment / area;
  const secondMomentVertical = topMoment - firstMoment * centroid;
  // d/dt: dA = b, dQ = b·t, dI_top = b·t²; dI = dI_top − (2Q·dQ·A − Q²·dA)/A².
  const secondMomentVerticalSlope = b * t * t - 2 * centroid * b * t + centroid * centroid * b;
  return {
    area,
    areaSlope: b,
    secondMomentVertical,
    secondMomentVerticalSlope,
    secondMomentLateral: ((t - c) * b * b * b) / 12,
    secondMomentLateralSlope: (b * b * b) / 12,
  };
}

/**
 * The chord (m) of a round hole of radius `radius` (m) whose centre is at `centre` (m along the
 * bar), at position x: 2√(r² − (x − centre)²) inside the hole's span, 0 outside.
 */
export function holeChord(radius: number, centre: number, x: number): number {
  const offset = x - centre;
  const inside = radius * radius - offset * offset;
  return inside > 0 ? 2 * Math.sqrt(inside) : 0;
}
