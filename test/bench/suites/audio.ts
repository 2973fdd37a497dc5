import { analyzeRecording, encodeWav, findPartials } from '../../../src/index.ts';
import { demoBars, demoScene } from '../../audio/demoBars.ts';
import { synthesizeStrike } from '../../audio/syntheticStrike.ts';
import { measure, type BenchRow, type BenchSuite } from '../measure.ts';

/**
 * Analysis time of a 2 s recording of a struck bar (the demo F4 bar: four partials, strike
 * noise, hum, noise), at 48 kHz (the target: under 50 ms) and the other common rates; plus the
 * whole `tap` path from WAV bytes (decode + find).
 */
export const audioSuite: BenchSuite = {
  name: 'audio',
  async run() {
    const rows: BenchRow[] = [];
    const bar = demoBars[1]!;
    for (const sampleRate of [48000, 44100, 96000]) {
      const samples = synthesizeStrike(demoScene(bar, sampleRate));
      let found = 0;
      const timing = await measure(() => {
        found = findPartials(samples, sampleRate).partials.length;
      });
      rows.push({ suite: 'audio', case: `findPartials 2 s @ ${sampleRate / 1000} kHz`, ...timing, detail: { partials: found, target_ms: sampleRate === 48000 ? 50 : 'none' } });
    }
    const wav = encodeWav([synthesizeStrike(demoScene(bar, 48000))], 48000, { kind: 'integer', bits: 24 });
    const whole = await measure(() => analyzeRecording(wav));
    rows.push({ suite: 'audio', case: 'decode 24-bit WAV + find, 2 s @ 48 kHz', ...whole, detail: { bytes: wav.length } });
    return rows;
  },
};
