import type { Section } from './Section.ts';

/** Cowper's shear coefficient of a rectangle, 10(1+ν)/(12+11ν) (Cowper 1966, J. Appl. Mech. 33:335). */
export function cowperRectangle(poisson: number): number {
  return (10 * (1 + poisson)) / (12 + 11 * poisson);
}

/** Cowper's shear coefficient of a solid circle, 6(1+ν)/(7+6ν) (Cowper 1966). */
export function cowperSolidCircle(poisson: number): number {
  return (6 * (1 + poisson)) / (7 + 6 * poisson);
}

/**
 * Cowper's shear coefficient of a hollow circle with m = r_inner/r_outer,
 * 6(1+ν)(1+m²)² / [(7+6ν)(1+m²)² + (20+12ν)m²] (Cowper 1966).
 */
export function cowperHollowCircle(poisson: number, radiusRatio: number): number {
  const q = (1 + radiusRatio ** 2) ** 2;
  return (6 * (1 + poisson) * q) / ((7 + 6 * poisson) * q + (20 + 12 * poisson) * radiusRatio ** 2);
}

/**
 * The default shear coefficient κ of a section, as the contract fixes it: rect 5/6 (the usual
 * choice); round and tube Cowper's values at the material's Poisson ratio.
 */
export function defaultShearCoefficient(section: Section, poisson: number): number {
  switch (section.shape) {
    case 'rect':
      return 5 / 6;
    case 'round':
      return cowperSolidCircle(poisson);
    case 'tube': {
      const outer = section.outerDiameter / 2;
      return cowperHollowCircle(poisson, (outer - section.wall) / outer);
    }
  }
}
