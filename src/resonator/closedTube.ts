import { InputError } from '../fileFormats/InputError.ts';
import { cents } from '../pitch/cents.ts';
import { endCorrection, type OpenEnd } from './endCorrection.ts';
import { speedOfSound, speedOfSoundDryAir, type AirConditions } from './speedOfSound.ts';

/** What sizes a closed-bottom resonator tube. */
export interface TubeSpec {
  /** The frequency the tube is tuned to (the bar's fundamental), Hz. */
  targetHz: number;
  /** Inner diameter, m. */
  innerDiameterM: number;
  /** Air the instrument is played in. */
  air: AirConditions;
  /** Open end (default unflanged). Ignored when `endCorrectionFactor` is given. */
  openEnd?: OpenEnd;
  /** End correction per unit inner radius, e.g. calibrated from a measured tube. */
  endCorrectionFactor?: number;
  /** How many resonances to list (default 3: f, 3f, 5f). */
  harmonics?: number;
}

/** A sized closed-bottom tube. */
export interface ClosedTube {
  /** Physical length from the closed bottom to the open end, m. */
  lengthM: number;
  /** Acoustic length L + δ, m. */
  effectiveLengthM: number;
  /** End correction δ, m. */
  endCorrectionM: number;
  /** Speed of sound used, m/s. */
  speedOfSoundMS: number;
  /** The tube's resonances, odd multiples of the first, Hz. */
  harmonicsHz: number[];
}

/**
 * Sizes a tube closed at the bottom and open at the top for a target frequency: its resonances
 * are f_k = (2k − 1) c / (4 (L + δ)), k = 1, 2, … (pressure antinode at the closed end, node a
 * distance δ beyond the open end), so L = c / (4 f) − δ. Throws InputError when the tube would be
 * shorter than its own radius (too wide for the note).
 */
export function closedTube(spec: TubeSpec, source = 'tube'): ClosedTube {
  const { targetHz, innerDiameterM } = spec;
  if (!Number.isFinite(targetHz) || targetHz <= 0) throw new InputError(source, 'target', `frequency ${String(targetHz)} Hz must be a positive number`);
  if (!Number.isFinite(innerDiameterM) || innerDiameterM <= 0) throw new InputError(source, 'inner diameter', `${String(innerDiameterM)} m must be a positive number`);
  const radius = innerDiameterM / 2;
  const c = speedOfSound(spec.air);
  const endCorrectionM = spec.endCorrectionFactor !== undefined ? spec.endCorrectionFactor * radius : endCorrection(radius, spec.openEnd ?? 'unflanged');
  const effectiveLengthM = c / (4 * targetHz);
  const lengthM = effectiveLengthM - endCorrectionM;
  if (lengthM < radius) {
    throw new InputError(source, 'inner diameter', `a ${(innerDiameterM * 1000).toFixed(1)} mm bore is too wide for ${targetHz.toFixed(1)} Hz (the tube would be ${(lengthM * 1000).toFixed(1)} mm long)`);
  }
  return { lengthM, effectiveLengthM, endCorrectionM, speedOfSoundMS: c, harmonicsHz: oddHarmonics(targetHz, spec.harmonics ?? 3) };
}

/** The first `count` resonances of a closed tube whose lowest is `fundamentalHz`: (2k − 1) f, Hz. */
export function oddHarmonics(fundamentalHz: number, count: number): number[] {
  return Array.from({ length: count }, (_, k) => (2 * k + 1) * fundamentalHz);
}

/** Lowest resonance (Hz) of a closed tube of physical length L (m) and end correction δ (m): c / (4 (L + δ)). */
export function closedTubeHz(lengthM: number, endCorrectionM: number, air: AirConditions): number {
  return speedOfSound(air) / (4 * (lengthM + endCorrectionM));
}

/**
 * How fast a tube's pitch drifts with air temperature, cents per °C, at `temperatureC`:
 * f ∝ c ∝ √(273.15 + T), so d(cents)/dT = (1200 / ln 2) / (2 (273.15 + T)) (closed form of the
 * dry-air formula; about +2.95 cents per °C at 20 °C — colder air, flatter tube).
 */
export function detuneCentsPerDegree(temperatureC: number): number {
  return 1200 / Math.LN2 / (2 * (273.15 + temperatureC));
}

/** Cents by which a tube tuned at `tunedAtC` is off when played at `playedAtC` (dry air, exact). */
export function detuneCents(tunedAtC: number, playedAtC: number): number {
  return cents(speedOfSoundDryAir(playedAtC), speedOfSoundDryAir(tunedAtC));
}

/** Which bar partial a tube resonance reinforces. */
export interface Reinforcement {
  /** Tube resonance number k (resonance at (2k − 1) f). */
  resonance: number;
  /** Bar partial number (1 = fundamental). */
  partial: number;
  /** Partial minus tube resonance, cents. */
  cents: number;
}

/**
 * Pairs the tube's resonances with the bar partials (Hz) that lie within `toleranceCents` of one
 * (default 50): a closed tube tuned to the fundamental also sounds at 3 f, where a 1 : 3 bar has
 * its second partial, and has nothing at 4 f or 10 f.
 */
export function reinforcedPartials(harmonicsHz: readonly number[], partialsHz: readonly number[], toleranceCents = 50): Reinforcement[] {
  const found: Reinforcement[] = [];
  harmonicsHz.forEach((tubeHz, index) => {
    partialsHz.forEach((partialHz, partialIndex) => {
      const offset = cents(partialHz, tubeHz);
      if (Math.abs(offset) <= toleranceCents) found.push({ resonance: index + 1, partial: partialIndex + 1, cents: offset });
    });
  });
  return found;
}
