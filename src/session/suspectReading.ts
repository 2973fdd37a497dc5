// Is the last reading one that no plausible bar explains? Decided from the session's calibration:
// moduli fitted outside what the material can be, a reading the rest of the session sets aside, or
// a residual far beyond what a reading can be off by. Then the round is headed as a suspect
// reading, with what to check, instead of advice worked out from it.
import type { MeasurementFlag } from './calibrateSession.ts';

/**
 * Young's modulus a bar can plausibly show, GPa, by family. Timber along the grain 8–25 GPa
 * (USDA Forest Products Laboratory species sheets; the dynamic modulus a bar shows reads about
 * 10 % above the static one, from memory), widened to 5–35 GPa for species beyond the sheets and
 * the model's corrections. Metals: aluminium 69, brass and bronze about 100–120, steel about 200
 * (handbook values, from memory), widened to 40–250 GPa.
 */
export const plausibleYoungGPa = { timber: [5, 35], metal: [40, 250] } as const;

/** A residual beyond this (cents) is far beyond reading noise: a tuner reads to 1–3 cents and the model's form error is about 10 (common practice). */
export const suspectResidualCents = 35;

/**
 * A per-partial correction of the 1D model beyond this (fraction of frequency per unit arch depth)
 * is no form error of a plausible bar: three times the calibration's prior width (±5 % per unit
 * depth, defaultCalibrationPriors, from the 1D model's 3–5 % per unit depth on a deep arch; a
 * simulated real bar needs about 0.06, test/session/workshopAdvice.test.ts).
 */
export const suspectCorrectionPerDepth = 0.15;

/** What the rule looks at: the calibration of the session up to and including the reading in question. */
export interface SuspectReadingInput {
  family: 'timber' | 'metal';
  /** The fitted Young's modulus, GPa. */
  E_GPa: number;
  /** The step in question, 1-based (usually the last). */
  step: number;
  /** Measured − calibrated model at that step, cents per partial (null where set aside). */
  residualCents: readonly (number | null)[];
  /** Readings the calibration set aside (any step; those of `step` count). */
  flags: readonly MeasurementFlag[];
  /** The model's correction per partial at the present arch depth, percent of frequency, and that depth (0–1). */
  correctionPercent: readonly number[];
  archDepth: number;
  /** The step's readings as entered, Hz. */
  readingsHz: readonly number[];
  /** The target ratios of the partials (1, 4, 10…). */
  ratios: readonly number[];
}

/** The verdict: suspect or not, why, the partials concerned (1-based) and what to check, most likely first. */
export interface SuspectReading {
  suspect: boolean;
  why: string[];
  partials: number[];
  check: string[];
}

/** How far (cents) a reading lies from an octave error: ±1200 cents off what the calibration expects. */
function nearOctave(residual: number): boolean {
  return Math.abs(Math.abs(residual) - 1200) < 200;
}

/**
 * Judges the reading of `input.step` (see SuspectReadingInput): suspect when the fitted Young's
 * modulus lies outside plausibleYoungGPa for the family, when the calibration set aside one of its
 * partials (it disagrees with the rest of the session beyond the model's error), when the model's
 * correction for a partial exceeds suspectCorrectionPerDepth per unit arch depth (past an arch
 * depth of 0.05, where corrections are still pinned by their prior), or when a partial's residual
 * exceeds suspectResidualCents. What to check is ordered by the evidence: an
 * octave error when a residual or a partial's ratio to the fundamental is near a factor of two; a
 * typo; the wrong partial picked; a strike at a node.
 */
export function suspectReading(input: SuspectReadingInput): SuspectReading {
  const why: string[] = [];
  const partials = new Set<number>();
  const [low, high] = plausibleYoungGPa[input.family];
  if (!(input.E_GPa >= low && input.E_GPa <= high))
    why.push(`to explain it the ${input.family === 'metal' ? 'metal' : 'wood'} would need a stiffness of ${input.E_GPa.toPrecision(3)} GPa, outside the ${low}–${high} GPa any ${input.family === 'metal' ? 'bar metal' : 'timber'} has`);
  for (const flag of input.flags.filter((entry) => entry.step === input.step)) {
    partials.add(flag.partial);
    why.push(flag.residual_cents === null ? flag.reason : `partial ${flag.partial} (${flag.hz} Hz) is ${flag.residual_cents >= 0 ? '+' : ''}${flag.residual_cents.toFixed(0)} cents from what the other rounds explain`);
  }
  // A correction the arch depth cannot account for: the calibration bent the model to fit a reading.
  if (input.archDepth > 0.05)
    input.correctionPercent.forEach((percent, index) => {
      const perDepth = Math.log1p(percent / 100) / input.archDepth;
      if (Math.abs(perDepth) <= suspectCorrectionPerDepth || partials.has(index + 1)) return;
      partials.add(index + 1);
      why.push(`to fit partial ${index + 1} (${input.readingsHz[index]} Hz) the model had to be bent ${percent >= 0 ? '+' : ''}${percent.toFixed(1)} %, far more than the model's error on any bar`);
    });
  input.residualCents.forEach((residual, index) => {
    if (residual === null || Math.abs(residual) <= suspectResidualCents || partials.has(index + 1)) return;
    partials.add(index + 1);
    why.push(`partial ${index + 1} (${input.readingsHz[index]} Hz) is ${residual >= 0 ? '+' : ''}${residual.toFixed(0)} cents from the calibrated bar, far beyond what a reading is off by (${suspectResidualCents} cents)`);
  });
  if (why.length === 0) return { suspect: false, why, partials: [], check: [] };
  // Each overtone's ratio to the fundamental against its target ratio: a factor near 2 or ½ is an octave slip.
  const octaveRatio = input.readingsHz.some((hz, index) => {
    if (index === 0 || input.ratios[index] === undefined) return false;
    const factor = hz / input.readingsHz[0]! / input.ratios[index]!;
    return Math.abs(Math.log2(factor)) > 0.8 && Math.abs(Math.log2(factor)) < 1.2;
  });
  const octave = octaveRatio || input.residualCents.some((residual) => residual !== null && nearOctave(residual)) || input.flags.some((flag) => flag.step === input.step && flag.residual_cents !== null && nearOctave(flag.residual_cents));
  const check = [
    'a typo: a digit missing, doubled or swapped (compare with the tuner)',
    'the wrong partial picked: a twisting or side-to-side mode heard in place of the bending one',
    'a strike at a node: strike the middle for the fundamental and near an end for the overtones, so each sounds clearly',
  ];
  const octaveCheck = 'an octave error: the tuner caught the partial an octave off (half or twice the frequency)';
  if (octave) check.unshift(octaveCheck);
  else check.push(octaveCheck);
  return { suspect: true, why, partials: [...partials].sort((a, b) => a - b), check };
}
