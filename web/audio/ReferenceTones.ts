// Reference tones through Web Audio: steady sines at the target partials (and/or the measured
// ones), so the maker can tune by ear by counting beats.

/** Plays a chord of sine tones until stopped. */
export class ReferenceTones {
  private context: AudioContext | null = null;
  private voices: { oscillator: OscillatorNode; gain: GainNode }[] = [];

  constructor(private readonly makeContext: () => AudioContext = () => new AudioContext()) {}

  /** True while tones sound. */
  get playing(): boolean {
    return this.voices.length > 0;
  }

  /**
   * Sounds sines at `frequenciesHz` (each faded in over 30 ms; the sum kept below −12 dBFS so
   * nothing clips), replacing whatever was playing. Frequencies outside 20 Hz–20 kHz are skipped.
   */
  async play(frequenciesHz: readonly number[]): Promise<void> {
    this.stopVoices();
    const audible = frequenciesHz.filter((hz) => Number.isFinite(hz) && hz >= 20 && hz <= 20_000);
    if (audible.length === 0) return;
    this.context ??= this.makeContext();
    const context = this.context;
    if (context.state === 'suspended') await context.resume();
    const level = 0.25 / audible.length;
    const now = context.currentTime;
    for (const hz of audible) {
      const oscillator = context.createOscillator();
      oscillator.type = 'sine';
      oscillator.frequency.value = hz;
      const gain = context.createGain();
      gain.gain.setValueAtTime(0, now);
      gain.gain.linearRampToValueAtTime(level, now + 0.03);
      oscillator.connect(gain).connect(context.destination);
      oscillator.start(now);
      this.voices.push({ oscillator, gain });
    }
  }

  /** Fades the tones out over 30 ms. */
  stop(): void {
    this.stopVoices();
  }

  /** Stops the tones and closes the audio context. */
  async dispose(): Promise<void> {
    this.stopVoices();
    const context = this.context;
    this.context = null;
    await context?.close().catch(() => undefined);
  }

  private stopVoices(): void {
    const context = this.context;
    if (!context) return;
    const now = context.currentTime;
    for (const { oscillator, gain } of this.voices) {
      gain.gain.cancelScheduledValues(now);
      gain.gain.setValueAtTime(gain.gain.value, now);
      gain.gain.linearRampToValueAtTime(0, now + 0.03);
      oscillator.stop(now + 0.05);
    }
    this.voices = [];
  }
}
