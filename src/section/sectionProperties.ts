import type { Section } from './Section.ts';
import { rectangleTorsionConstant } from './rectangleTorsionConstant.ts';

/** Geometric properties of a cross-section, SI (m², m⁴). */
export interface SectionProperties {
  /** Area A, m². */
  area: number;
  /** Second moment about the horizontal centroidal axis (vertical bending), m⁴. */
  secondMomentVertical: number;
  /** Second moment about the vertical centroidal axis (lateral bending), m⁴. */
  secondMomentLateral: number;
  /** St-Venant torsion constant J, m⁴. */
  torsionConstant: number;
  /** Polar moment of area about the centroid, I_p = I_vertical + I_lateral, m⁴. */
  polarMoment: number;
}

/**
 * Area, second moments, torsion constant and polar moment of a section. For `rect`, `thickness`
 * (m) overrides the blank's thickness (the local thickness under an undercut). Closed forms:
 * rectangle b·t³/12 and t·b³/12, torsion by the series (rectangleTorsionConstant); circle
 * πd⁴/64; tube π(D⁴ − d⁴)/64; J = I_p for round sections.
 */
export function sectionProperties(section: Section, thickness?: number): SectionProperties {
  switch (section.shape) {
    case 'rect': {
      const b = section.width;
      const t = thickness ?? section.thickness;
      const vertical = (b * t ** 3) / 12;
      const lateral = (t * b ** 3) / 12;
      return {
        area: b * t,
        secondMomentVertical: vertical,
        secondMomentLateral: lateral,
        torsionConstant: rectangleTorsionConstant(b, t),
        polarMoment: vertical + lateral,
      };
    }
    case 'round': {
      const d = section.diameter;
      const i = (Math.PI * d ** 4) / 64;
      return { area: (Math.PI * d * d) / 4, secondMomentVertical: i, secondMomentLateral: i, torsionConstant: 2 * i, polarMoment: 2 * i };
    }
    case 'tube': {
      const outer = section.outerDiameter;
      const inner = outer - 2 * section.wall;
      const i = (Math.PI * (outer ** 4 - inner ** 4)) / 64;
      return {
        area: (Math.PI * (outer * outer - inner * inner)) / 4,
        secondMomentVertical: i,
        secondMomentLateral: i,
        torsionConstant: 2 * i,
        polarMoment: 2 * i,
      };
    }
  }
}
