// Whether a sized resonator tube can be built and works as sized: a tube shorter than its own
// bore, or longer than the frame takes, with the remedies the trade uses, in numbers.
import { endCorrectionFactors, type OpenEnd } from './endCorrection.ts';

/** What makes a tube impractical. */
export type TubeWarningKind = 'shorter-than-bore' | 'longer-than-frame';

/** One reason a tube is impractical, in words, with what would help (numbers in mm). */
export interface TubeWarning {
  kind: TubeWarningKind;
  message: string;
  remedies: string[];
}

/** A sized tube as tubePracticality needs it, SI. */
export interface TubeToCheck {
  /** Physical length, m. */
  lengthM: number;
  /** Inner diameter, m. */
  innerDiameterM: number;
  /** Quarter wavelength of the tuned frequency, c / (4 f), m (the acoustic length L + δ). */
  quarterWaveM: number;
  /** End correction per unit inner radius used in the sizing. */
  endCorrectionFactor: number;
  /** Open end used in the sizing (for the flanged-top remedy). */
  openEnd: OpenEnd;
}

const mm = (metres: number) => (metres * 1000).toFixed(1);

/**
 * Largest inner diameter (m) with which a closed tube of acoustic length `quarterWaveM` is at
 * least as long as its bore: L = λ/4 − k·d/2 ≥ d, so d ≤ (λ/4) / (1 + k/2).
 */
export function largestBoreNotShorterThanIt(quarterWaveM: number, endCorrectionFactor: number): number {
  return quarterWaveM / (1 + endCorrectionFactor / 2);
}

/**
 * Checks a sized tube:
 * - shorter than its bore: the plane-wave sizing (and the end corrections of Levine & Schwinger,
 *   valid for k·a well below 0.5) no longer describes it — at L = d the product k·a at the tuned
 *   frequency is already (π/2)·a/(L + δ) ≈ 0.6; remedies: a narrower bore (the largest that keeps
 *   the tube at least as long as its bore), or a tube stopped short with a plug to keep the row
 *   even (common practice);
 * - longer than `maxLengthM` (the frame): remedies: fold it with a U-bend or a return bend (common
 *   practice), a flanged top (shortens by (0.8216 − 0.6133)·r), a wider bore (δ grows with r: the
 *   bore that brings it within the frame, while it stays at least as long as its bore), or a
 *   deeper frame.
 */
export function tubePracticality(tube: TubeToCheck, limits: { maxLengthM?: number } = {}): TubeWarning[] {
  const warnings: TubeWarning[] = [];
  const bore = tube.innerDiameterM;
  const largestBore = largestBoreNotShorterThanIt(tube.quarterWaveM, tube.endCorrectionFactor);
  if (tube.lengthM < bore) {
    const lengthAtLargest = tube.quarterWaveM - (tube.endCorrectionFactor * largestBore) / 2;
    warnings.push({
      kind: 'shorter-than-bore',
      message: `${tube.lengthM > 0 ? `The tube is ${mm(tube.lengthM)} mm long, shorter than its ${mm(bore)} mm bore` : `A ${mm(bore)} mm bore is too wide for this note (no tube length works)`}: it will not sound where the sizing says.`,
      remedies: [
        `A bore of at most ${mm(Math.floor(largestBore * 1e4) / 1e4)} mm (the tube is then ${mm(lengthAtLargest)} mm long).`,
        'To keep the row of tubes even, use a longer tube stopped with a plug at this depth (common practice).',
      ],
    });
  }
  const maxLength = limits.maxLengthM;
  if (maxLength !== undefined && tube.lengthM > maxLength) {
    const remedies = [`Fold it: a U-bend or a return bend keeps the ${mm(tube.lengthM)} mm of air in less height (common practice).`];
    if (tube.openEnd === 'unflanged') {
      const saving = (endCorrectionFactors.flanged - tube.endCorrectionFactor) * (bore / 2);
      if (saving > 0) remedies.push(`A flanged top (the open end set in a board) shortens it by ${mm(saving)} mm.`);
    }
    const boreToFit = (2 * (tube.quarterWaveM - maxLength)) / tube.endCorrectionFactor;
    if (boreToFit > bore && boreToFit <= largestBore) remedies.push(`A bore of ${mm(Math.ceil(boreToFit * 1e4) / 1e4)} mm brings it to the frame's ${mm(maxLength)} mm.`);
    remedies.push(`Or a frame that takes ${Math.ceil(tube.lengthM * 1e3)} mm.`);
    warnings.push({ kind: 'longer-than-frame', message: `The tube is ${mm(tube.lengthM)} mm long; the frame takes ${mm(maxLength)} mm.`, remedies });
  }
  return warnings;
}
