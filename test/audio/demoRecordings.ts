// The demo recordings in fixtures/wav/: invented strikes of two demo bars, rendered by the
// synthetic-strike generator so they are small, deterministic and their true partials known.
// Regenerate with: npx tsx test/audio/demoRecordings.ts  (a test checks the files match).
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { encodeWav, type WavEncoding } from '../../src/audio/encodeWav.ts';
import { synthesizeStrike, type StrikeScene } from './syntheticStrike.ts';

export interface DemoRecording {
  /** Path from the repository root. */
  path: string;
  /** What the file is, for the README. */
  description: string;
  scene: StrikeScene;
  encoding: WavEncoding;
  /** Extra channels are the same strike at 0.6 of the level with other noise. */
  channels: 1 | 2;
}

export const demoRecordings: DemoRecording[] = [
  {
    path: 'fixtures/wav/f4-practice-strike.wav',
    description: 'fixtures/f4-practice.bar.json struck once: a blank about 3 % stiffer than modelled, with a weak torsion and lateral mode, 50 Hz hum',
    encoding: { kind: 'integer', bits: 16 },
    channels: 1,
    scene: {
      sampleRate: 44100,
      durationS: 1.2,
      strikeS: 0.15,
      partials: [
        { hz: 252.5, amplitude: 0.3, decayS: 1.1 },
        { hz: 395.0, amplitude: 0.024, decayS: 0.4 },
        { hz: 1009.8, amplitude: 0.09, decayS: 0.55 },
        { hz: 1196.0, amplitude: 0.015, decayS: 0.3 },
        { hz: 2262.0, amplitude: 0.035, decayS: 0.3 },
      ],
      strikeNoise: { amplitude: 0.5, timeConstantS: 0.0015 },
      hum: { hz: 50, amplitudes: [0.002, 0.0006, 0.001] },
      noiseRms: 0.0004,
      seed: 11,
    },
  },
  {
    path: 'fixtures/wav/c7-blank-strike.wav',
    description: 'fixtures/c7-blank.bar.json struck once: the top bar of the demo keyboard, third partial near 8.8 kHz; 24-bit stereo, 48 kHz',
    encoding: { kind: 'integer', bits: 24 },
    channels: 2,
    scene: {
      sampleRate: 48000,
      durationS: 0.5,
      strikeS: 0.05,
      partials: [
        { hz: 2398.1, amplitude: 0.28, decayS: 0.35 },
        { hz: 5455.0, amplitude: 0.07, decayS: 0.12 },
        { hz: 8790.2, amplitude: 0.04, decayS: 0.06 },
      ],
      strikeNoise: { amplitude: 0.6, timeConstantS: 0.001 },
      hum: { hz: 60, amplitudes: [0.001] },
      noiseRms: 0.0003,
      seed: 12,
    },
  },
];

/** The bytes of a demo recording's WAV file. */
export function renderDemoRecording(recording: DemoRecording): Uint8Array {
  const first = synthesizeStrike(recording.scene);
  const channels = [first];
  if (recording.channels === 2) channels.push(synthesizeStrike({ ...recording.scene, seed: (recording.scene.seed ?? 1) + 100 }).map((v) => 0.6 * v));
  return encodeWav(channels, recording.scene.sampleRate, recording.encoding);
}

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  for (const recording of demoRecordings) {
    const target = resolve(root, recording.path);
    mkdirSync(dirname(target), { recursive: true });
    writeFileSync(target, renderDemoRecording(recording));
    console.log(`wrote ${recording.path}`);
  }
}
