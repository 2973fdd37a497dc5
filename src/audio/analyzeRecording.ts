import { decodeWav } from './decodeWav.ts';
import { findPartials, type PartialAnalysis, type PartialOptions } from './findPartials.ts';
import { labelPartials, type ExpectedModes, type LabelTolerances } from './labelPartials.ts';
import { roundDecimals as round } from '../fileFormats/roundDecimals.ts';

/** One partial as `barwright tap --json` prints it (contract field names, rounded). */
export interface TapPartial {
  /** Frequency, Hz (to 0.001 Hz). */
  hz: number;
  /** Level at the strike, dB re a full-scale sine (to 0.1 dB). */
  level_db: number;
  /** Time to fall 60 dB, s (to 0.001 s). */
  decay_s: number;
  /** With expected modes: the bending mode it is (1 = fundamental), or null. */
  mode?: number | null;
  /** With expected modes: "torsion 1", "lateral 2"… when it matches another predicted mode. */
  other_mode?: string | null;
  /** With expected modes: the prediction it was matched to, Hz, or null. */
  predicted_hz?: number | null;
}

/** What `barwright tap --json` prints. */
export interface TapReport {
  sample_rate: number;
  duration_s: number;
  /** Channels in the file (the first is analysed). */
  channels: number;
  /** Time of the strike's onset, s. */
  strike_s: number;
  partials: TapPartial[];
}


/**
 * Shapes a partial analysis as the tap report: contract field names, rounded for display
 * (0.001 Hz is 0.03 cent at 50 Hz), and, given expected modes, each partial's label.
 */
export function tapReport(analysis: PartialAnalysis, channels: number, expected?: ExpectedModes, tolerances?: LabelTolerances): TapReport {
  const labels = expected ? labelPartials(analysis.partials.map((p) => p.hz), expected, tolerances) : null;
  return {
    sample_rate: analysis.sampleRate,
    duration_s: round(analysis.durationS, 3),
    channels,
    strike_s: round(analysis.strikeS, 4),
    partials: analysis.partials.map((partial, index) => {
      const row: TapPartial = { hz: round(partial.hz, 3), level_db: round(partial.levelDb, 1), decay_s: round(partial.decayS, 3) };
      const label = labels?.[index];
      if (label) {
        row.mode = label.mode;
        row.other_mode = label.otherMode;
        row.predicted_hz = label.predictedHz === null ? null : round(label.predictedHz, 2);
      }
      return row;
    }),
  };
}

/**
 * Reads a WAV recording of a struck bar and finds its partials (decodeWav, then findPartials on
 * the first channel), labelled against `expected` when given. Throws InputError(source, …) for
 * a file that is not a usable WAV.
 */
export function analyzeRecording(bytes: Uint8Array, options: PartialOptions & { expected?: ExpectedModes; tolerances?: LabelTolerances } = {}, source = 'recording'): TapReport {
  const audio = decodeWav(bytes, source);
  const analysis = findPartials(audio.channels[0]!, audio.sampleRate, options, source);
  return tapReport(analysis, audio.channels.length, options.expected, options.tolerances);
}
