import type { ThicknessProfile } from '../section/ThicknessProfile.ts';
import type { SectionLaw } from './sectionLaw.ts';

/**
 * A one-dimensional beam as the finite elements see it: its length (m), the thickness profile
 * that drives the section (uniform for round sections), and the law turning thickness into
 * properties per unit length. Knows nothing about supports.
 */
export interface BeamLine {
  readonly length: number;
  readonly profile: ThicknessProfile;
  readonly law: SectionLaw;
}
