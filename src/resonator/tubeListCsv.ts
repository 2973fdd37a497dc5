import { closedTube, detuneCentsPerDegree, reinforcedPartials, type TubeSpec } from './closedTube.ts';
import { endCorrectionFactors } from './endCorrection.ts';
import { tubePracticality, type TubeWarning } from './tubePracticality.ts';

/** One tube of a set to size. */
export interface TubeRequest {
  /** What the maker calls it, e.g. the note name "F#3". */
  label: string;
  /** The bar's fundamental, Hz. */
  targetHz: number;
  /** Inner diameter, m. */
  innerDiameterM: number;
}

/** One sized tube of a set. */
export interface TubeRow {
  label: string;
  targetHz: number;
  innerDiameterMm: number;
  lengthMm: number;
  endCorrectionMm: number;
  speedOfSoundMS: number;
  harmonicsHz: number[];
  /** Bar partial numbers the tube's resonances reinforce (with the bar's partial ratios). */
  reinforcedPartials: number[];
  detuneCentsPerDegree: number;
  /** Why the tube is impractical (shorter than its bore, longer than the frame), with remedies; empty when it is fine. */
  warnings: TubeWarning[];
}

/** What the frame allows (optional): the longest tube it takes, m. */
export interface TubeFrame {
  maxLengthM?: number;
}

/**
 * Sizes every tube of a set (closedTube) under the same air and end treatment; with the bar's
 * partial ratios (e.g. [1, 4, 10] or [1, 3]), also lists which partials each tube reinforces
 * (within 50 cents), and warns of a tube shorter than its bore or longer than `frame.maxLengthM`
 * (tubePracticality).
 */
export function tubeSet(requests: readonly TubeRequest[], common: Omit<TubeSpec, 'targetHz' | 'innerDiameterM'>, partialRatios: readonly number[] = [1], source = 'tube set', frame: TubeFrame = {}): TubeRow[] {
  return requests.map((request) => {
    const tube = closedTube({ ...common, targetHz: request.targetHz, innerDiameterM: request.innerDiameterM }, request.label ? `${source}: ${request.label}` : source);
    const partialsHz = partialRatios.map((ratio) => ratio * request.targetHz);
    const openEnd = common.openEnd ?? 'unflanged';
    const endCorrectionFactor = common.endCorrectionFactor ?? endCorrectionFactors[openEnd];
    return {
      label: request.label,
      targetHz: request.targetHz,
      innerDiameterMm: request.innerDiameterM * 1000,
      lengthMm: tube.lengthM * 1000,
      endCorrectionMm: tube.endCorrectionM * 1000,
      speedOfSoundMS: tube.speedOfSoundMS,
      harmonicsHz: tube.harmonicsHz,
      reinforcedPartials: [...new Set(reinforcedPartials(tube.harmonicsHz, partialsHz).map((r) => r.partial))],
      detuneCentsPerDegree: detuneCentsPerDegree(common.air.temperatureC),
      warnings: tubePracticality({ lengthM: tube.lengthM, innerDiameterM: request.innerDiameterM, quarterWaveM: tube.effectiveLengthM, endCorrectionFactor, openEnd }, frame),
    };
  });
}

/** Quotes a CSV field when it holds a comma, quote or line break (RFC 4180). */
function csvField(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

/**
 * A tube set as CSV (RFC 4180, CRLF line ends, header row): label, target Hz, inner diameter,
 * length and end correction in mm (0.1 mm), speed of sound, the first three resonances, the
 * reinforced partials ("1 2"), detuning in cents per °C, and the warnings ("; " between them).
 */
export function tubeListCsv(rows: readonly TubeRow[], temperatureC: number): string {
  const header = ['note', 'target_hz', 'inner_diameter_mm', 'length_mm', 'end_correction_mm', 'speed_of_sound_m_s', 'temp_c', 'resonance_1_hz', 'resonance_3_hz', 'resonance_5_hz', 'reinforces_partials', 'cents_per_c', 'warnings'];
  const lines = [header.join(',')];
  for (const row of rows) {
    lines.push(
      [
        csvField(row.label),
        row.targetHz.toFixed(2),
        row.innerDiameterMm.toFixed(1),
        row.lengthMm.toFixed(1),
        row.endCorrectionMm.toFixed(1),
        row.speedOfSoundMS.toFixed(2),
        temperatureC.toFixed(1),
        ...[0, 1, 2].map((k) => (row.harmonicsHz[k] ?? 0).toFixed(2)),
        row.reinforcedPartials.join(' '),
        row.detuneCentsPerDegree.toFixed(2),
        csvField(row.warnings.map((warning) => warning.message).join('; ')),
      ].join(','),
    );
  }
  return `${lines.join('\r\n')}\r\n`;
}
