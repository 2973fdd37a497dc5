// How the growth rings run through a bar, from a torsion or sideways mode read on it, on the
// solid model: the one mode family that hears the grain.
import type { Material } from '../material/Material.ts';
import { bendingPlaneShearModuli } from '../material/orthotropicStiffness.ts';
import type { BarModel } from '../modes/BarModel.ts';
import { analyzeBarModel } from '../modes/analyzeBar.ts';

/** The other modes read on the bar now, Hz (either or both). */
export interface OtherModeReadings {
  readonly torsionHz?: number;
  readonly lateralHz?: number;
}

/** The grain fitted, and how well the solid model then places the modes read. */
export interface SolidGrainFit {
  /** Ring angle between the radial direction and the thickness, radians (0 quarter-sawn, π/2 flat-sawn). */
  readonly ringAngle: number;
  /** The material with that grain (its shear moduli rescaled to keep the vertical plane's, see materialAt). */
  readonly material: Material;
  /** Reading − solid model at the fitted grain, Hz, for each family read. */
  readonly residualHz: { torsion?: number; lateral?: number };
  /** Solid analyses taken. */
  readonly solves: number;
}

/**
 * The material at a ring angle with every shear modulus scaled so that the vertical bending plane
 * hears the same shear modulus as at the material's own grain: the bending partials the wood was
 * fitted to stay where they are (to first order), and only the other modes move with the grain.
 */
function materialAt(material: Material, ringAngle: number): Material {
  const elasticity = material.elasticity;
  if (elasticity?.kind !== 'orthotropic') throw new Error('internal: the grain is fitted on wood only');
  const c = elasticity.constants;
  const keep = bendingPlaneShearModuli(c, elasticity.grain).vertical / bendingPlaneShearModuli(c, { ringAngle }).vertical;
  const constants = { ...c, shearLongitudinalRadial: c.shearLongitudinalRadial * keep, shearLongitudinalTangential: c.shearLongitudinalTangential * keep, shearRadialTangential: c.shearRadialTangential * keep };
  return { ...material, shearModulus: material.shearModulus * keep, elasticity: { ...elasticity, constants, grain: { ringAngle } } };
}

/** The first torsion and sideways modes of a shape at a ring angle, Hz. */
function otherModesAt(model: BarModel, ringAngle: number): { torsion: number; lateral: number } {
  const analysis = analyzeBarModel({ ...model, material: materialAt(model.material, ringAngle) }, { theory: 'solid', modes: 3 });
  return { torsion: analysis.torsion[0]?.hz ?? NaN, lateral: analysis.lateral[0]?.hz ?? NaN };
}

/**
 * The ring angle α ∈ [0, 90°] that makes the solid model of `model` (SI; its material wood with the
 * constants already fitted to the bending partials at the file's grain, e.g. fitSolidWood's) ring
 * its first torsion and/or sideways mode where they were read. The bending partials hear one shear
 * modulus, the vertical plane's (G_xz, rotated with the grain: bendingPlaneShearModuli), so they
 * cannot tell the grain from the shear's size; at each trial angle every shear modulus is scaled to
 * keep G_xz as fitted, and the other modes — which hear the cross-section's other shear — decide. Method: the two aligned grains first (quarter- and flat-sawn: each solves as two
 * halves, cheaply); between them f² is taken as linear in sin²α (the shear modulus seen across the
 * section rotates as cos²α·G₁ + sin²α·G₂ for a rotation of the section's axes, Lekhnitskii's
 * transformation of the compliances, from memory), which puts α within a few degrees (measured on
 * a 370 × 56 mm bar: 1 % in f² at 30° and 60°); one analysis at that angle, and a second from the
 * secant through the nearer aligned end when it misses by more than 0.5 %. Readings weighed in
 * cents alike. Outside the range the aligned grain nearer is kept. 3–4 solid analyses (the ones
 * off-axis solve the full body, a few seconds each).
 */
export function fitSolidGrain(model: BarModel, readings: OtherModeReadings): SolidGrainFit {
  const families = (['torsion', 'lateral'] as const).filter((family) => (family === 'torsion' ? readings.torsionHz : readings.lateralHz) !== undefined);
  if (families.length === 0) throw new Error('internal: fitSolidGrain needs a torsion or sideways reading');
  const read = (family: 'torsion' | 'lateral'): number => (family === 'torsion' ? readings.torsionHz! : readings.lateralHz!);
  let solves = 0;
  const at = (angle: number): { torsion: number; lateral: number } => {
    solves++;
    return otherModesAt(model, angle);
  };
  const quarter = at(0);
  const flat = at(Math.PI / 2);
  // Least squares in sin²α of Σ (f²_read − f²(α))² / f⁴_read over the families read, f²(α) = f²(0) + u·(f²(90°) − f²(0)).
  let numerator = 0;
  let denominator = 0;
  for (const family of families) {
    const weight = 1 / read(family) ** 4;
    const span = flat[family] ** 2 - quarter[family] ** 2;
    numerator += weight * span * (read(family) ** 2 - quarter[family] ** 2);
    denominator += weight * span * span;
  }
  const share = Math.min(1, Math.max(0, denominator > 0 ? numerator / denominator : 0));
  let angle = Math.asin(Math.sqrt(share));
  const misfit = (modes: { torsion: number; lateral: number }): number => families.reduce((sum, family) => sum + Math.log(read(family) / modes[family]), 0) / families.length;
  let best = share === 0 ? quarter : share === 1 ? flat : at(angle);
  if (share > 0 && share < 1 && Math.abs(misfit(best)) > 0.005) {
    // Secant in α through the nearer aligned end.
    const endAngle = angle < Math.PI / 4 ? 0 : Math.PI / 2;
    const end = endAngle === 0 ? quarter : flat;
    const slope = (misfit(best) - misfit(end)) / (angle - endAngle);
    if (slope !== 0) {
      const next = Math.min(Math.PI / 2, Math.max(0, angle - misfit(best) / slope));
      const tried = at(next);
      if (Math.abs(misfit(tried)) < Math.abs(misfit(best))) {
        angle = next;
        best = tried;
      }
    }
  }
  const material = materialAt(model.material, angle);
  const residualHz: { torsion?: number; lateral?: number } = {};
  for (const family of families) residualHz[family] = read(family) - best[family];
  return { ringAngle: angle, material, residualHz, solves };
}
