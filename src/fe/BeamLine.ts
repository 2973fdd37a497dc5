import type { ThicknessProfile } from '../section/ThicknessProfile.ts';
import type { SectionLaw } from './sectionLaw.ts';

/**
 * A cord hole as the finite elements see it (m): drilled through the width, centred at
 * `position` along the line, of radius `radius`, its centre `depthBelowTop` below the flat top.
 */
export interface LineHole {
  readonly position: number;
  readonly radius: number;
  readonly depthBelowTop: number;
}

/**
 * A one-dimensional beam as the finite elements see it: its length (m), the thickness profile
 * that drives the section (uniform for round sections), the law turning thickness into
 * properties per unit length, and the cord holes that take material out of the section where
 * they cross it (rect sections; none by default). Knows nothing about supports.
 */
export interface BeamLine {
  readonly length: number;
  readonly profile: ThicknessProfile;
  readonly law: SectionLaw;
  readonly holes?: readonly LineHole[];
}
