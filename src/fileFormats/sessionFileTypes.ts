// Types of the tune-and-trim session file (`*.session.json`): the contract's fields and
// barwright's optional additions. The parser is sessionFile.ts; steps are parsed in sessionFileSteps.ts.
import type { BarFile } from './barFile.ts';
import type { CutLimitsInput } from './cutLimitsInput.ts';

/** What a session aims at: the fundamental (Hz, or a note at an A4), ratios and tolerances. */
export interface SessionLogTarget {
  hz?: number;
  note?: string;
  a4?: number;
  /** Partial ratios to the fundamental, the first being 1, increasing (e.g. [1, 4, 10]). */
  ratios: number[];
  /** Tolerance of each partial, cents (e.g. [2, 5, 15]). */
  tolerance_cents: number[];
  /** The temperature the instrument is tuned for, °C (default 20): every reading is projected to it. */
  playing_temperature_c?: number;
}

/** How a step's cut was made: `as-planned` (the shape recorded is the plan) or `as-done` (measured after cutting). */
export type SessionCutRecord = 'as-planned' | 'as-done';

/** The cut made since the previous step. */
export interface SessionLogCut {
  made: SessionCutRecord;
  note?: string;
  /** Length taken off since the previous step, mm (barwright's addition: a piece tuned by trimming). */
  shortened_mm?: number;
  /** Where that length was taken: the free end of a hung chime, or half from each end. */
  shortened_at?: 'free-end' | 'both-ends';
}

/** One measured round of a session. */
export interface SessionLogStep {
  /** The bar as shaped when the partials were measured. */
  bar: BarFile;
  /** Measured partials, Hz, in partial order (1 = fundamental). */
  measured_hz: number[];
  /**
   * Caliper readings of the bar as it really is at this step, `[position_mm, thickness_mm]`
   * (ascending positions from the left end). Files written before the contract named it carry
   * barwright's older name `thickness_measured_mm`: it is read into this field.
   */
  measured_thickness_mm?: [number, number][];
  /** The first torsion (twisting) mode as read, Hz: with the solid model it tells how the growth rings run. */
  measured_torsion_hz?: number;
  /** The first sideways (lateral) bending mode as read, Hz: likewise. */
  measured_lateral_hz?: number;
  /** Air temperature when the bar was struck, °C: the reading is projected from it to the playing temperature. */
  air_temperature_c?: number;
  /** When the cut before this step was finished (ISO 8601): a reading within 10 minutes of it is from a warm bar. */
  cut_finished_at?: string;
  /** Free text for the maker. */
  note?: string;
  /** The cut made since the previous step (the first step has none). */
  cut?: SessionLogCut;
  /** When the round was recorded (ISO 8601). */
  recorded_at?: string;
  /** What the model predicted for this shape before it was struck (Hz), when known. */
  predicted_hz?: number[];
  /** How the partials were taken. */
  source?: 'typed' | 'microphone' | 'file';
}

/** A tune-and-trim session file, validated (contract format plus barwright's optional additions). */
export interface SessionLog {
  format: 'barwright.session';
  version: 1;
  label?: string;
  target: SessionLogTarget;
  /** Workshop limits in mm (the contract's `min_thickness_mm` plus the design module's other limits). */
  limits: CutLimitsInput;
  /** One-sigma uncertainty of a measured partial, cents (default 0.5). */
  measurement_uncertainty_cents?: number;
  steps: SessionLogStep[];
}
