import { describe, expect, it } from 'vitest';
import { findPartials } from '../../src/audio/index.ts';
import { cents } from '../../src/pitch/index.ts';
import { StrikeDetector, type CapturedStrike } from '../../web/audio/strikeDetector.ts';
import { demoBars, demoScene } from './demoBars.ts';
import { synthesizeStrike } from './syntheticStrike.ts';

/** Feeds a signal in 128-sample blocks (one Web Audio render quantum) and collects strikes. */
function feed(detector: StrikeDetector, signal: Float64Array): { strikes: CapturedStrike[]; endedAt: number[] } {
  const strikes: CapturedStrike[] = [];
  const endedAt: number[] = [];
  for (let start = 0; start < signal.length; start += 128) {
    const strike = detector.push(Float32Array.from(signal.subarray(start, start + 128)));
    if (strike) {
      strikes.push(strike);
      endedAt.push(start + 128);
    }
  }
  return { strikes, endedAt };
}

describe('StrikeDetector (onset trigger, record until decay)', () => {
  const bar = demoBars[1]!;
  const sampleRate = 48000;

  it('captures one strike with its pre-roll and stops when the ring has died into the room noise', () => {
    const signal = synthesizeStrike(demoScene(bar, sampleRate, { durationS: 4, strikeS: 1 }));
    const detector = new StrikeDetector({ sampleRate });
    const { strikes, endedAt } = feed(detector, signal);
    expect(strikes).toHaveLength(1);
    const strike = strikes[0]!;
    // The onset lies within one block of the true strike; 0.25 s of quiet comes before it.
    const onsetInSignal = endedAt[0]! - strike.samples.length + strike.onsetIndex;
    expect(Math.abs(onsetInSignal - sampleRate)).toBeLessThanOrEqual(128);
    expect(strike.onsetIndex).toBe(Math.round(0.25 * sampleRate));
    // The room's RMS is hum and noise: √((0.003² + 0.001² + 0.0015²)/2 + 0.0003²). The capture
    // ends when the 50 ms RMS is within 4 dB of it, i.e. when the fundamental's RMS
    // (0.25/√2) e^(−t/τ), τ = 1.2 s / ln 1000, has fallen to √(10^0.4 − 1) × the room's
    // (the weaker partials have died by then); allow one 50 ms window of lag, +/- one block.
    const roomRms = Math.sqrt((0.003 ** 2 + 0.001 ** 2 + 0.0015 ** 2) / 2 + 0.0003 ** 2);
    const tau = 1.2 / Math.log(1000);
    const expectedEndS = tau * Math.log(0.25 / Math.SQRT2 / (Math.sqrt(10 ** 0.4 - 1) * roomRms));
    const lengthS = (strike.samples.length - strike.onsetIndex) / sampleRate;
    expect(lengthS).toBeGreaterThan(expectedEndS - 0.01);
    expect(lengthS).toBeLessThan(expectedEndS + 0.07);
    expect(detector.state).toBe('waiting');
  });

  it('hands the partial finder a capture it reads within 0.2 cent', () => {
    const signal = synthesizeStrike(demoScene(bar, sampleRate, { durationS: 4, strikeS: 1 }));
    const strike = feed(new StrikeDetector({ sampleRate }), signal).strikes[0]!;
    const result = findPartials(Float64Array.from(strike.samples), sampleRate);
    for (const partial of bar.partials) {
      const found = result.partials.find((p) => Math.abs(cents(p.hz, partial.hz)) < 5);
      expect(found, `${partial.hz} Hz`).toBeDefined();
      expect(Math.abs(cents(found!.hz, partial.hz))).toBeLessThanOrEqual(0.2);
    }
  });

  it('does not trigger on hum and noise alone, nor during its warm-up', () => {
    const room = synthesizeStrike({ ...demoScene(bar, sampleRate), partials: [], strikeNoise: undefined, durationS: 3 });
    expect(feed(new StrikeDetector({ sampleRate }), room).strikes).toHaveLength(0);
    const early = synthesizeStrike(demoScene(bar, sampleRate, { durationS: 2, strikeS: 0.05 }));
    const detector = new StrikeDetector({ sampleRate, warmUpS: 0.2 });
    expect(feed(detector, early).strikes).toHaveLength(0);
  });

  it('captures two strikes in a row, each separately', () => {
    const first = synthesizeStrike(demoScene(bar, sampleRate, { durationS: 3, strikeS: 0.5 }));
    const second = synthesizeStrike(demoScene(demoBars[2]!, sampleRate, { durationS: 3, strikeS: 0.5, seed: 3 }));
    const both = new Float64Array(first.length + second.length);
    both.set(first);
    both.set(second, first.length);
    const { strikes } = feed(new StrikeDetector({ sampleRate }), both);
    expect(strikes).toHaveLength(2);
  });

  it('stops at the longest capture for a bar that rings on', () => {
    const ringing = synthesizeStrike({ ...demoScene(bar, sampleRate, { durationS: 8, strikeS: 0.5 }), partials: [{ hz: 440, amplitude: 0.3, decayS: 60 }] });
    const strike = feed(new StrikeDetector({ sampleRate, maximumS: 3 }), ringing).strikes[0]!;
    expect(strike.samples.length - strike.onsetIndex).toBeGreaterThanOrEqual(3 * sampleRate);
    expect(strike.samples.length - strike.onsetIndex).toBeLessThan(3 * sampleRate + 128);
  });
});
