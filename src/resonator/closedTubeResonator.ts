import { closedTube } from './closedTube.ts';
import type { OpenEnd } from './endCorrection.ts';

/** One resonator in the contract's units and field names (as `barwright tubes --json`). */
export interface ResonatorResult {
  length_mm: number;
  speed_of_sound_m_s: number;
  end_correction_mm: number;
  harmonics_hz: number[];
}

/**
 * closedTube at the edges' units: the fundamental in Hz, the bore in mm, air in °C (and % RH),
 * the open end; returns lengths in mm, unrounded. Throws InputError(source, …) like closedTube.
 */
export function closedTubeResonator(
  options: { hz: number; innerDiameterMm: number; temperatureC: number; end?: OpenEnd; relativeHumidityPercent?: number; endCorrectionFactor?: number },
  source = 'resonator',
): ResonatorResult {
  const tube = closedTube(
    {
      targetHz: options.hz,
      innerDiameterM: options.innerDiameterMm / 1000,
      air: { temperatureC: options.temperatureC, relativeHumidityPercent: options.relativeHumidityPercent ?? 0 },
      openEnd: options.end ?? 'unflanged',
      endCorrectionFactor: options.endCorrectionFactor,
    },
    source,
  );
  return { length_mm: tube.lengthM * 1000, speed_of_sound_m_s: tube.speedOfSoundMS, end_correction_mm: tube.endCorrectionM * 1000, harmonics_hz: tube.harmonicsHz };
}
