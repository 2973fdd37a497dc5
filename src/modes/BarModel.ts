import type { LineHole } from '../fe/BeamLine.ts';
import type { Material, MaterialElasticity } from '../material/Material.ts';
import type { GrainOrientation } from '../material/orthotropicStiffness.ts';
import { orthotropicFromGPa } from '../material/solidElasticity.ts';
import { InputError } from '../fileFormats/InputError.ts';
import { ringAngleDegrees, type BarFileGrain } from '../fileFormats/barFileMaterial.ts';
import { isWoodMaterial, resolveWoodConstants, verticalShearOf } from '../fileFormats/woodConstants.ts';
import { findMaterialPreset } from '../material/materialPresets.ts';
import type { BarFile, BarFileMaterial, BarFileSection } from '../fileFormats/barFile.ts';
import { sectionDepth, type Section } from '../section/Section.ts';
import { thicknessAt, uniformProfile, type ThicknessProfile } from '../section/ThicknessProfile.ts';
import { millimetre as mm, gigapascal as GPa } from '../units/units.ts';

/** A bar in SI units, ready for the solver: length (m), section, thickness profile, material. */
export interface BarModel {
  readonly length: number;
  readonly section: Section;
  /** Thickness profile (m); uniform for round sections (where the thickness is the diameter). */
  readonly profile: ThicknessProfile;
  readonly material: Material;
  /** Cord holes drilled across the width (rect only; m, see LineHole); absent means none. */
  readonly holes?: readonly LineHole[];
}

/** The section of a bar file in SI. */
export function sectionFromFile(section: BarFileSection): Section {
  switch (section.shape) {
    case 'rect':
      return { shape: 'rect', width: section.width_mm * mm, thickness: section.thickness_mm * mm };
    case 'round':
      return { shape: 'round', diameter: section.diameter_mm * mm };
    case 'tube':
      return { shape: 'tube', outerDiameter: section.outer_diameter_mm * mm, wall: section.wall_mm * mm };
  }
}

/**
 * The material of a bar file in SI: a preset by name, or explicit E, ρ and G (or ν, giving the
 * isotropic G = E/(2(1+ν))); ν defaults to 0.3 (contract). With it, the 3D elastic law for the
 * solid model (`elasticity`): metals and materials with E/G ≤ 3 isotropic; woods orthotropic
 * with their grain (default radial), constants not given filled by the bar file's rules
 * (resolveWoodConstants). For wood the beam's G is the vertical plane's shear modulus: G_GPa, or
 * from G_LR and G_LT for the grain when the file gives those instead.
 */
export function materialFromFile(material: BarFileMaterial, grain?: BarFileGrain): Material {
  let E: number;
  let density: number;
  let G: number | undefined;
  let poisson: number;
  let elasticity: MaterialElasticity;
  if ('preset' in material) {
    const preset = findMaterialPreset(material.preset);
    if (!preset) throw new Error(`internal: unknown preset ${material.preset} (parseBarFile should have caught it)`);
    E = preset.E_GPa * GPa;
    density = preset.density_kg_m3;
    poisson = preset.poisson;
    G = preset.G_GPa === undefined ? undefined : preset.G_GPa * GPa;
    if (preset.orthotropic) {
      const set = preset.orthotropic;
      G = verticalShearOf(set, grain) * GPa;
      elasticity = { kind: 'orthotropic', constants: orthotropicFromGPa(set), grain: grainOrientation(grain), assumed: [] };
    } else {
      elasticity = { kind: 'isotropic', youngModulus: E, poisson, assumed: [] };
    }
  } else {
    E = material.E_GPa * GPa;
    density = material.density_kg_m3;
    poisson = material.poisson ?? 0.3;
    G = material.G_GPa === undefined ? undefined : material.G_GPa * GPa;
    if (isWoodMaterial(material, grain)) {
      const resolved = resolveWoodConstants(material, grain);
      if ('rule' in resolved) throw new InputError('bar', resolved.field, resolved.rule);
      const set = resolved.constants;
      G ??= verticalShearOf(set, grain) * GPa;
      elasticity = { kind: 'orthotropic', constants: orthotropicFromGPa(set), grain: grainOrientation(grain), assumed: resolved.assumed };
    } else {
      const isotropicPoisson = material.poisson ?? (G === undefined ? 0.3 : E / (2 * G) - 1);
      elasticity = { kind: 'isotropic', youngModulus: E, poisson: isotropicPoisson, assumed: material.poisson === undefined && G === undefined ? ['poisson'] : [] };
    }
  }
  const shearModulus = G ?? E / (2 * (1 + poisson));
  return material.shear_coefficient === undefined
    ? { youngModulus: E, shearModulus, density, poisson, elasticity }
    : { youngModulus: E, shearModulus, density, poisson, shearCoefficient: material.shear_coefficient, elasticity };
}

/** The grain of a bar file as a ring angle in radians. */
export function grainOrientation(grain: BarFileGrain | undefined): GrainOrientation {
  return { ringAngle: (ringAngleDegrees(grain) * Math.PI) / 180 };
}

/** Converts a validated bar file (mm, GPa) to a BarModel (SI). */
export function barModelFromFile(bar: BarFile): BarModel {
  const length = bar.length_mm * mm;
  const section = sectionFromFile(bar.section);
  let profile: ThicknessProfile;
  if (section.shape === 'rect' && bar.profile_mm && bar.profile_mm.length >= 2) {
    profile = {
      positions: Float64Array.from(bar.profile_mm, ([x]) => x * mm),
      thicknesses: Float64Array.from(bar.profile_mm, ([, t]) => t * mm),
    };
  } else {
    profile = uniformProfile(length, sectionDepth(section));
  }
  const model: BarModel = { length, section, profile, material: materialFromFile(bar.material, bar.grain) };
  return bar.holes && bar.holes.length > 0 && section.shape === 'rect' ? { ...model, holes: bar.holes.map((hole) => lineHoleFromFile(hole, profile)) } : model;
}

/**
 * A bar file's cord hole in SI for the solver: centre and radius, and the depth of its centre
 * below the flat top — the thickness there less its height above the underside (`z_mm`, default
 * half the thickness at the hole's centre: drilled through the middle).
 */
export function lineHoleFromFile(hole: { x_mm: number; diameter_mm: number; z_mm?: number }, profile: ThicknessProfile): LineHole {
  const position = hole.x_mm * mm;
  const thickness = thicknessAt(profile, position);
  const height = hole.z_mm === undefined ? thickness / 2 : hole.z_mm * mm;
  return { position, radius: (hole.diameter_mm * mm) / 2, depthBelowTop: thickness - height };
}
