/** How the open end of a tube meets the air. */
export type OpenEnd = 'unflanged' | 'flanged';

/** End correction per unit inner radius for each open end (low-frequency limits). */
export const endCorrectionFactors: Readonly<Record<OpenEnd, number>> = {
  /** Levine & Schwinger, Phys. Rev. 73 (1948) 383: thin-walled unflanged pipe. */
  unflanged: 0.6133,
  /** Norris & Sheng, J. Sound Vib. 135 (1989) 85 (from memory): pipe ending in an infinite flange. */
  flanged: 0.8216,
};

/**
 * End correction of an open tube end, m: δ = factor · r with r the inner radius (m) — by default
 * Levine & Schwinger's 0.6133 r for an unflanged end, 0.8216 r flanged. Valid while k r ≪ 1
 * (at k r = 0.3 the unflanged value is about 2 % lower: Davies et al. 1980).
 */
export function endCorrection(innerRadiusM: number, openEnd: OpenEnd = 'unflanged'): number {
  return endCorrectionFactors[openEnd] * innerRadiusM;
}
