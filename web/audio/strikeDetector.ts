// Decides, block by block, when a strike starts and when its sound has died away, and hands
// back the whole strike with the quiet just before it. Pure logic (no Web Audio), so the
// microphone path and the tests share it.

/** Settings of the strike detector (all have defaults). */
export interface StrikeDetectorOptions {
  /** Samples per second of the blocks pushed, Hz. */
  sampleRate: number;
  /** Quiet kept from before the onset, s (default 0.25: lets the analysis tell hum from the bar). */
  preRollS?: number;
  /** Background learnt before arming, s (default 0.2). */
  warmUpS?: number;
  /** A strike starts when a block's peak rises this far above the background RMS, dB (default 24). */
  triggerDb?: number;
  /** …and above this absolute peak, full scale = 1 (default 0.01, −40 dBFS). */
  minimumPeak?: number;
  /** The strike ends when the RMS over 50 ms is back within this of the background, dB (default 4). */
  endDb?: number;
  /** Shortest and longest capture after the onset, s (defaults 0.4 and 4). */
  minimumS?: number;
  maximumS?: number;
}

/** What the detector is doing. */
export type StrikeDetectorState = 'warming-up' | 'waiting' | 'capturing';

/** A captured strike: samples from `preRollS` before the onset to the end of its sound. */
export interface CapturedStrike {
  samples: Float32Array;
  sampleRate: number;
  /** Index of the onset within `samples`. */
  onsetIndex: number;
}

/**
 * Onset trigger and end-of-decay detector over a stream of sample blocks. Tracks the background
 * RMS (a slow exponential average while waiting), triggers when a block's peak stands `triggerDb`
 * above it, records until the 50 ms RMS sinks to within `endDb` of the background (or
 * `maximumS`), and returns the strike with its pre-roll.
 */
export class StrikeDetector {
  private readonly sampleRate: number;
  private readonly preRoll: Float32Array;
  private preRollFilled = 0;
  private preRollWrite = 0;
  private readonly warmUpSamples: number;
  private readonly triggerRatio: number;
  private readonly minimumPeak: number;
  private readonly endRatio: number;
  private readonly minimumSamples: number;
  private readonly maximumSamples: number;
  private readonly windowSamples: number;
  private seen = 0;
  private backgroundPower = 0;
  private capture: Float32Array[] = [];
  private captured = 0;
  private onsetIndex = 0;
  private recentPower: number[] = [];
  private recentSamples: number[] = [];
  state: StrikeDetectorState = 'warming-up';

  constructor(options: StrikeDetectorOptions) {
    this.sampleRate = options.sampleRate;
    this.preRoll = new Float32Array(Math.round((options.preRollS ?? 0.25) * options.sampleRate));
    this.warmUpSamples = Math.round((options.warmUpS ?? 0.2) * options.sampleRate);
    this.triggerRatio = 10 ** ((options.triggerDb ?? 24) / 20);
    this.minimumPeak = options.minimumPeak ?? 0.01;
    this.endRatio = 10 ** ((options.endDb ?? 4) / 10);
    this.minimumSamples = Math.round((options.minimumS ?? 0.4) * options.sampleRate);
    this.maximumSamples = Math.round((options.maximumS ?? 4) * options.sampleRate);
    this.windowSamples = Math.round(0.05 * options.sampleRate);
  }

  /** Background RMS learnt so far (full scale = 1). */
  get backgroundRms(): number {
    return Math.sqrt(this.backgroundPower);
  }

  /** Feeds one block; returns the strike when its sound has just ended, else null. */
  push(block: Float32Array): CapturedStrike | null {
    let peak = 0;
    let power = 0;
    for (let i = 0; i < block.length; i++) {
      const v = block[i]!;
      peak = Math.max(peak, Math.abs(v));
      power += v * v;
    }
    power /= block.length || 1;

    if (this.state === 'capturing') return this.continueCapture(block, power);

    const triggered = this.state === 'waiting' && peak >= this.minimumPeak && peak >= this.triggerRatio * Math.SQRT2 * Math.sqrt(this.backgroundPower);
    if (triggered) {
      this.startCapture(block);
      return null;
    }
    // Learn the background: a running mean during warm-up, then a slow average (≈ 1 s).
    this.seen += block.length;
    const weight = this.state === 'warming-up' ? block.length / this.seen : Math.min(1, block.length / this.sampleRate);
    this.backgroundPower += weight * (power - this.backgroundPower);
    if (this.state === 'warming-up' && this.seen >= this.warmUpSamples) this.state = 'waiting';
    this.keepPreRoll(block);
    return null;
  }

  /** Forgets any capture in progress and waits for the next strike (keeps the background). */
  reset(): void {
    this.state = this.seen >= this.warmUpSamples ? 'waiting' : 'warming-up';
    this.capture = [];
    this.captured = 0;
    this.recentPower = [];
    this.recentSamples = [];
  }

  private keepPreRoll(block: Float32Array): void {
    const size = this.preRoll.length;
    if (size === 0) return;
    for (let i = 0; i < block.length; i++) {
      this.preRoll[this.preRollWrite] = block[i]!;
      this.preRollWrite = (this.preRollWrite + 1) % size;
    }
    this.preRollFilled = Math.min(size, this.preRollFilled + block.length);
  }

  private startCapture(block: Float32Array): void {
    const size = this.preRoll.length;
    const pre = new Float32Array(this.preRollFilled);
    for (let i = 0; i < this.preRollFilled; i++) pre[i] = this.preRoll[(this.preRollWrite - this.preRollFilled + i + size) % size]!;
    this.capture = [pre, Float32Array.from(block)];
    this.onsetIndex = pre.length;
    this.captured = block.length;
    this.recentPower = [];
    this.recentSamples = [];
    this.preRollFilled = 0;
    this.state = 'capturing';
  }

  private continueCapture(block: Float32Array, power: number): CapturedStrike | null {
    this.capture.push(Float32Array.from(block));
    this.captured += block.length;
    this.recentPower.push(power * block.length);
    this.recentSamples.push(block.length);
    let windowSamples = this.recentSamples.reduce((a, b) => a + b, 0);
    while (windowSamples - this.recentSamples[0]! >= this.windowSamples) {
      windowSamples -= this.recentSamples.shift()!;
      this.recentPower.shift();
    }
    const windowPower = this.recentPower.reduce((a, b) => a + b, 0) / windowSamples;
    const quiet = windowSamples >= this.windowSamples && windowPower <= this.endRatio * this.backgroundPower;
    if ((this.captured >= this.minimumSamples && quiet) || this.captured >= this.maximumSamples) return this.finish();
    return null;
  }

  private finish(): CapturedStrike {
    const total = this.capture.reduce((sum, part) => sum + part.length, 0);
    const samples = new Float32Array(total);
    let offset = 0;
    for (const part of this.capture) {
      samples.set(part, offset);
      offset += part.length;
    }
    const strike = { samples, sampleRate: this.sampleRate, onsetIndex: this.onsetIndex };
    this.reset();
    return strike;
  }
}
