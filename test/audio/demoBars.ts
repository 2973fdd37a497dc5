// Invented struck bars for the tests, the fixtures and the benchmark: partial frequencies,
// strike levels and decay times chosen to be plausible for the demo workshop's keyboard
// (A4 = 442 Hz) and its steel bell bars, including a weak (−18 to −20 dB) fast-decaying partial each.
import type { StrikeScene, SyntheticPartial } from './syntheticStrike.ts';

export interface DemoBar {
  name: string;
  partials: SyntheticPartial[];
  /** Mains frequency in the invented room (kept ≥ 7 Hz away from every partial). */
  humHz: 50 | 60;
}

export const demoBars: DemoBar[] = [
  {
    name: 'bass bar near G#1 (1 : 4 : 10 with a torsion mode)',
    humHz: 60,
    partials: [
      { hz: 52.3, amplitude: 0.3, decayS: 3 },
      { hz: 208.6, amplitude: 0.1, decayS: 1.5 },
      { hz: 377.1, amplitude: 0.035, decayS: 0.6 },
      { hz: 521.4, amplitude: 0.05, decayS: 0.8 },
    ],
  },
  {
    name: 'F4 bar (1 : 4 : 10 with a lateral mode)',
    humHz: 50,
    partials: [
      { hz: 351.23, amplitude: 0.25, decayS: 1.2 },
      { hz: 1404.6, amplitude: 0.08, decayS: 0.6 },
      { hz: 2630.4, amplitude: 0.026, decayS: 0.3 },
      { hz: 3512.9, amplitude: 0.03, decayS: 0.25 },
    ],
  },
  {
    name: 'C7 bar (1 : 3 : 6, third partial above 12 kHz)',
    humHz: 60,
    partials: [
      { hz: 2102.0, amplitude: 0.25, decayS: 0.5 },
      { hz: 6306.5, amplitude: 0.06, decayS: 0.18 },
      { hz: 12617.0, amplitude: 0.03, decayS: 0.07 },
    ],
  },
  {
    name: 'steel bell bar (uniform, third partial near 19.5 kHz)',
    humHz: 50,
    partials: [
      { hz: 3600, amplitude: 0.2, decayS: 2.5 },
      { hz: 9923.4, amplitude: 0.07, decayS: 1.2 },
      { hz: 19454.0, amplitude: 0.025, decayS: 0.6 },
    ],
  },
];

/**
 * A 2 s recording of a demo bar: struck at 0.2 s with a 2 ms noise burst at 0.6 of full scale,
 * mains hum (harmonics 1–3 at −50, −60, −56 dBFS) and white noise at −70 dBFS.
 */
export function demoScene(bar: DemoBar, sampleRate: number, overrides: Partial<StrikeScene> = {}): StrikeScene {
  return {
    sampleRate,
    durationS: 2,
    strikeS: 0.2,
    partials: bar.partials,
    strikeNoise: { amplitude: 0.6, timeConstantS: 0.002 },
    hum: { hz: bar.humHz, amplitudes: [0.003, 0.001, 0.0015] },
    noiseRms: 0.0003,
    seed: 7,
    ...overrides,
  };
}
