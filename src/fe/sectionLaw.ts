import type { Material } from '../material/Material.ts';
import type { Section } from '../section/Section.ts';
import { sectionProperties } from '../section/sectionProperties.ts';
import { defaultShearCoefficient } from '../section/shearCoefficient.ts';
import { rectangleTorsionConstant, rectangleTorsionConstantDerivative } from '../section/rectangleTorsionConstant.ts';
import { drilledBendingSection, drilledSection } from '../section/drilledSection.ts';

/**
 * Properties per unit length of a beam as functions of the local thickness t (m): the bridge
 * between a section and the elements, which only ever see these numbers.
 * Bending laws write [EI, κGA, ρA, ρI] (N·m², N, kg/m, kg·m); torsion laws [GJ, ρI_p] (N·m², kg·m).
 */
export interface SectionLaw {
  /** How many properties `evaluate` writes. */
  readonly count: number;
  /** Writes the properties at thickness t into `out`, and their d/dt into `derivative` if given. */
  evaluate(thickness: number, out: Float64Array, derivative?: Float64Array): void;
  /**
   * The same where a cord hole crosses the section (rect sections only): a full-width strip of
   * height `chord` (m) centred `depthBelowTop` (m) below the flat top is missing (see
   * drilledSection); d/dt at a fixed hole. With chord 0 it equals `evaluate`.
   */
  evaluateDrilled?(thickness: number, chord: number, depthBelowTop: number, out: Float64Array, derivative?: Float64Array): void;
}

/** Bending plane: vertical (the tuned family, thickness direction) or lateral (width direction). */
export type BendingPlane = 'vertical' | 'lateral';

/**
 * The drilled section's [EI, κGA, ρA, ρI] and their thickness slopes for bending in `plane`, from
 * drilledBendingSection (the section with a cord hole's chord removed); `shearModulus` is κG.
 */
function drilledEvaluator(width: number, young: number, shearModulus: number, density: number, plane: BendingPlane): NonNullable<SectionLaw['evaluateDrilled']> {
  return (t, chord, depthBelowTop, out, derivative) => {
    const s = drilledBendingSection(width, t, chord, depthBelowTop);
    const moment = plane === 'vertical' ? s.secondMomentVertical : s.secondMomentLateral;
    const momentSlope = plane === 'vertical' ? s.secondMomentVerticalSlope : s.secondMomentLateralSlope;
    out[0] = young * moment;
    out[1] = shearModulus * s.area;
    out[2] = density * s.area;
    out[3] = density * moment;
    if (derivative) {
      derivative[0] = young * momentSlope;
      derivative[1] = shearModulus * s.areaSlope;
      derivative[2] = density * s.areaSlope;
      derivative[3] = density * momentSlope;
    }
  };
}

/**
 * The bending law of a section and material in one plane. Rect: EI = E·b·t³/12 (vertical) or
 * E·t·b³/12 (lateral), κGA = κ·G·b·t, ρA = ρ·b·t, ρI likewise; round and tube are uniform.
 * Classical beam theory about the section's own centroid (contract); over a cord hole the net
 * section's own properties (drilledSection: κGA and ρA from the net area, EI and ρI about the net
 * centroid).
 */
export function bendingLaw(section: Section, material: Material, plane: BendingPlane): SectionLaw {
  const E = material.youngModulus;
  const G = material.shearModulus;
  const rho = material.density;
  const kappa = material.shearCoefficient ?? defaultShearCoefficient(section, material.poisson);
  if (section.shape === 'rect') {
    const b = section.width;
    if (plane === 'vertical') {
      return {
        count: 4,
        evaluate(t, out, derivative) {
          const t2 = t * t;
          out[0] = (E * b * t2 * t) / 12;
          out[1] = kappa * G * b * t;
          out[2] = rho * b * t;
          out[3] = (rho * b * t2 * t) / 12;
          if (derivative) {
            derivative[0] = (E * b * t2) / 4;
            derivative[1] = kappa * G * b;
            derivative[2] = rho * b;
            derivative[3] = (rho * b * t2) / 4;
          }
        },
        evaluateDrilled: drilledEvaluator(b, E, kappa * G, rho, 'vertical'),
      };
    }
    const b3 = b * b * b;
    return {
      count: 4,
      evaluate(t, out, derivative) {
        out[0] = (E * t * b3) / 12;
        out[1] = kappa * G * b * t;
        out[2] = rho * b * t;
        out[3] = (rho * t * b3) / 12;
        if (derivative) {
          derivative[0] = (E * b3) / 12;
          derivative[1] = kappa * G * b;
          derivative[2] = rho * b;
          derivative[3] = (rho * b3) / 12;
        }
      },
      evaluateDrilled: drilledEvaluator(b, E, kappa * G, rho, 'lateral'),
    };
  }
  const p = sectionProperties(section);
  const values = [E * p.secondMomentVertical, kappa * G * p.area, rho * p.area, rho * p.secondMomentVertical];
  return {
    count: 4,
    evaluate(_t, out, derivative) {
      for (let k = 0; k < 4; k++) out[k] = values[k]!;
      derivative?.fill(0);
    },
  };
}

/**
 * The St-Venant torsion law: GJ (J by the rectangle series, or the polar moment for round
 * sections) and ρI_p with I_p = b·t·(b² + t²)/12 for a rectangle; over a cord hole the two strips
 * above and below it twist apart (drilledSection).
 */
export function torsionLaw(section: Section, material: Material): SectionLaw {
  const G = material.shearModulus;
  const rho = material.density;
  if (section.shape === 'rect') {
    const b = section.width;
    return {
      count: 2,
      evaluate(t, out, derivative) {
        out[0] = G * rectangleTorsionConstant(b, t);
        out[1] = (rho * b * t * (b * b + t * t)) / 12;
        if (derivative) {
          derivative[0] = G * rectangleTorsionConstantDerivative(b, t);
          derivative[1] = (rho * b * (b * b + 3 * t * t)) / 12;
        }
      },
      evaluateDrilled(t, chord, depthBelowTop, out, derivative) {
        // Polar moment of the net section about its centroid: I_vertical + I_lateral.
        const s = drilledSection(b, t, chord, depthBelowTop);
        out[0] = G * s.torsionConstant;
        out[1] = rho * (s.secondMomentVertical + s.secondMomentLateral);
        if (derivative) {
          derivative[0] = G * s.torsionConstantSlope;
          derivative[1] = rho * (s.secondMomentVerticalSlope + s.secondMomentLateralSlope);
        }
      },
    };
  }
  const p = sectionProperties(section);
  return {
    count: 2,
    evaluate(_t, out, derivative) {
      out[0] = G * p.torsionConstant;
      out[1] = rho * p.polarMoment;
      derivative?.fill(0);
    },
  };
}

/**
 * The longitudinal (rod) law [EA, ρA]: axial stretching u along the bar obeys
 * (EA u′)′ = −ω² ρA u, the same second-order operator as St-Venant torsion, so the torsion
 * elements and assembler serve it unchanged. Rect: EA = E·b·t, ρA = ρ·b·t.
 */
export function longitudinalLaw(section: Section, material: Material): SectionLaw {
  const E = material.youngModulus;
  const rho = material.density;
  if (section.shape === 'rect') {
    const b = section.width;
    return {
      count: 2,
      evaluate(t, out, derivative) {
        out[0] = E * b * t;
        out[1] = rho * b * t;
        if (derivative) {
          derivative[0] = E * b;
          derivative[1] = rho * b;
        }
      },
    };
  }
  const area = sectionProperties(section).area;
  return {
    count: 2,
    evaluate(_t, out, derivative) {
      out[0] = E * area;
      out[1] = rho * area;
      derivative?.fill(0);
    },
  };
}
