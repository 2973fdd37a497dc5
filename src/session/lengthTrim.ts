// Tuning a piece that is not undercut (a chime tube or rod, a plain bell bar) by its length alone:
// how much to trim, and from which end, to bring a measured fundamental to its target.
import type { BarFile } from '../fileFormats/barFile.ts';
import { InputError } from '../fileFormats/InputError.ts';
import { analyzeLineBar } from '../modes/index.ts';

/** Where a shortening is taken: the free end of a hung chime, or equally from both ends (a bar on cords). */
export type ShortenAt = 'free-end' | 'both-ends';

/** The usual place to shorten a piece of this section: a tube or rod hangs from one end (free end), a bar lies on cords (both ends). */
export function defaultShortenAt(bar: BarFile): ShortenAt {
  return bar.section.shape === 'rect' ? 'both-ends' : 'free-end';
}

/** What lengthTrim needs: the piece now, its fundamental as heard, the target and the tolerance. */
export interface LengthTrimInput {
  /** The piece as it is now (its length is the one struck). */
  readonly bar: BarFile;
  /** The fundamental heard at this length (Hz; projected to the playing temperature by the caller). */
  readonly measuredHz: number;
  /** The fundamental aimed at (Hz). */
  readonly targetHz: number;
  /** ± cents within which the fundamental counts as in tune. */
  readonly toleranceCents: number;
  /** Where the shortening is taken (default: defaultShortenAt). */
  readonly shortenAt?: ShortenAt;
}

/** lengthTrim's answer (mm, Hz, cents). */
export interface LengthTrim {
  /** `in-tune`: within tolerance; `trim`: flat, shorten by `trim_mm`; `sharp`: sharp beyond tolerance, which shortening cannot cure. */
  status: 'in-tune' | 'trim' | 'sharp';
  /** Fundamental now minus target, cents. */
  cents: number;
  /** How the calibrated model's fundamental rises per mm shortened at this length, cents (from its length sensitivity). */
  cents_per_mm: number;
  /** The same rate from the closed form f ∝ 1/L² (uniform free–free beam): (1200 / ln 2) · 2 / L per mm, cents. */
  closed_form_cents_per_mm: number;
  /** Length to trim now (mm, one decimal, rounded down): lands half the tolerance flat of the target, so a cut a little long still ends in tune. 0 unless `trim`. */
  trim_mm: number;
  /** Length that would reach the target exactly (mm, two decimals). Negative when the piece is sharp (it would need to be longer). */
  exact_mm: number;
  shorten_at: ShortenAt;
  /** Length after the advised trim (mm). */
  length_after_mm: number;
  /** What the calibrated model expects after the advised trim (Hz). */
  predicted_hz: number;
  /** The advice in the workshop's words. */
  advice: string;
}

/** Fundamental (Hz) of the piece at `lengthMm`, by the line model (Timoshenko). */
function fundamentalAt(bar: BarFile, lengthMm: number): number {
  const hz = analyzeLineBar({ ...bar, length_mm: lengthMm }, { modes: 1 }).bending[0]?.hz;
  if (hz === undefined || !Number.isFinite(hz)) throw new InputError('piece', 'length_mm', `no fundamental found at ${lengthMm} mm`);
  return hz;
}

const centsOf = (ratio: number): number => 1200 * Math.log2(ratio);

/**
 * The length trim that brings a piece tuned by its length alone (tube, rod, plain bar) from its
 * measured fundamental to the target. Method: the line model (Timoshenko, Cowper's κ) gives the
 * fundamental as a function of length; scaled by measured / modelled at the present length (a
 * one-number calibration), the length reaching a pitch is found by secant steps on log f against
 * log L. Check: for a slender uniform free–free beam f ∝ 1/L² (Euler–Bernoulli closed form,
 * Blevins 1979, table 8-1), so Δf/f ≈ −2 ΔL/L and the rate is (1200/ln 2)·2/L cents per unit length.
 * Trimming only raises the pitch: a sharp piece cannot be cured by it, only by a longer piece.
 * The advised trim aims half the tolerance flat of the target (tune from below, creep up).
 */
export function lengthTrim(input: LengthTrimInput): LengthTrim {
  const { bar, measuredHz, targetHz, toleranceCents } = input;
  if (!(Number.isFinite(measuredHz) && measuredHz > 0)) throw new InputError('round', 'measured_hz[0]', 'must be a frequency greater than 0 Hz');
  if (!(Number.isFinite(targetHz) && targetHz > 0)) throw new InputError('target', 'hz', 'must be a frequency greater than 0 Hz');
  if (!(Number.isFinite(toleranceCents) && toleranceCents > 0)) throw new InputError('target', 'tolerance_cents[0]', 'must be greater than 0 cents');
  if (bar.profile_mm && bar.section.shape === 'rect') throw new InputError('piece', 'profile_mm', 'an undercut bar is tuned by the next-cut advice, not by its length alone');
  const shortenAt = input.shortenAt ?? defaultShortenAt(bar);
  const length = bar.length_mm;
  const modelNow = fundamentalAt(bar, length);
  const scale = measuredHz / modelNow;
  const calibrated = (lengthMm: number): number => scale * fundamentalAt(bar, lengthMm);
  // Length sensitivity by a central difference of ±0.5 mm (the model is smooth in L).
  const step = Math.min(0.5, length / 200);
  const centsPerMm = centsOf(fundamentalAt(bar, length - step) / fundamentalAt(bar, length + step)) / (2 * step);
  const closedForm = (1200 / Math.LN2) * (2 / length);
  const lengthFor = (hz: number): number => {
    // Secant on ln f(ln L), started from the closed form's exponent −2.
    let l0 = length;
    let f0 = measuredHz;
    let l1 = length * Math.sqrt(f0 / hz);
    for (let iteration = 0; iteration < 8; iteration++) {
      const f1 = calibrated(l1);
      if (Math.abs(centsOf(f1 / hz)) < 0.01) break;
      const slope = Math.log(f1 / f0) / Math.log(l1 / l0);
      if (!Number.isFinite(slope) || slope >= 0) break;
      const next = l1 * Math.exp(Math.log(hz / f1) / slope);
      l0 = l1;
      f0 = f1;
      l1 = next;
    }
    return l1;
  };
  const cents = centsOf(measuredHz / targetHz);
  const exact = length - lengthFor(targetHz);
  const round2 = (value: number): number => Math.round(value * 100) / 100;
  const where = shortenAt === 'free-end' ? 'off the free end' : 'in all, half from each end';
  const base = { cents, cents_per_mm: centsPerMm, closed_form_cents_per_mm: closedForm, exact_mm: round2(exact), shorten_at: shortenAt };
  if (Math.abs(cents) <= toleranceCents) {
    return { ...base, status: 'in-tune', trim_mm: 0, length_after_mm: length, predicted_hz: measuredHz, advice: `In tune: the fundamental is ${signed(cents)} cents, within ±${toleranceCents}. No trim needed.` };
  }
  if (cents > 0) {
    return {
      ...base,
      status: 'sharp',
      trim_mm: 0,
      length_after_mm: length,
      predicted_hz: measuredHz,
      advice: `This piece is sharp by ${Math.abs(cents).toFixed(1)} cents. Shortening only raises the pitch: lowering it needs a new, longer piece (about ${(-exact).toFixed(1)} mm longer), or a plug or cap at the free end.`,
    };
  }
  const aimHz = targetHz * 2 ** (-toleranceCents / 2 / 1200);
  const trim = Math.max(0, Math.floor((length - lengthFor(aimHz)) * 10 + 1e-9) / 10);
  const trimNow = trim > 0 ? trim : Math.max(0.1, Math.floor(exact * 10) / 10);
  const after = length - trimNow;
  const perEnd = shortenAt === 'both-ends' ? ` (${(trimNow / 2).toFixed(2)} mm each end)` : '';
  return {
    ...base,
    status: 'trim',
    trim_mm: trimNow,
    length_after_mm: Math.round(after * 100) / 100,
    predicted_hz: calibrated(after),
    advice: `This piece is flat by ${Math.abs(cents).toFixed(1)} cents: it can only be raised by shortening. Trim ${trimNow.toFixed(1)} mm ${where}${perEnd}; about ${exact.toFixed(1)} mm would reach the target exactly. Cut a little less, strike again: a piece cannot be lengthened.`,
  };
}

function signed(value: number): string {
  return `${value >= 0 ? '+' : '−'}${Math.abs(value).toFixed(1)}`;
}
