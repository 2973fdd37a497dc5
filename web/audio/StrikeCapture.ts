// Microphone capture: getUserMedia → AudioWorklet (captureProcessor.ts) → StrikeDetector; hands
// each complete strike (with its pre-roll) to a callback.
import captureProcessorUrl from './captureProcessor.ts?worker&url';
import { StrikeDetector, type CapturedStrike, type StrikeDetectorState } from './strikeDetector.ts';

const captureProcessorName = 'barwright-strike-capture';

/** Why listening could not start. */
export type CaptureProblem = 'denied' | 'no-microphone' | 'unsupported' | 'failed';

/** Raised by StrikeCapture.start with the reason in words. */
export class CaptureError extends Error {
  constructor(
    readonly problem: CaptureProblem,
    message: string,
  ) {
    super(message);
    this.name = 'CaptureError';
  }
}

/** Callbacks of a capture session. */
export interface CaptureHandlers {
  onStrike: (strike: CapturedStrike) => void;
  onState?: (state: StrikeDetectorState) => void;
  /** Peak level of the latest block, dBFS (for a level meter). */
  onLevel?: (peakDb: number) => void;
}

/** Listens to the microphone and reports strikes until stopped. */
export class StrikeCapture {
  private context: AudioContext | null = null;
  private stream: MediaStream | null = null;
  private node: AudioWorkletNode | null = null;

  /** True while the microphone is open. */
  get active(): boolean {
    return this.context !== null;
  }

  /** Opens the microphone (raw: no echo cancellation, noise suppression or gain control). */
  async start(handlers: CaptureHandlers): Promise<void> {
    if (this.context) return;
    if (!navigator.mediaDevices?.getUserMedia) throw new CaptureError('unsupported', 'this browser offers no microphone access here (it needs a secure page: https or localhost)');
    if (typeof AudioWorkletNode === 'undefined') throw new CaptureError('unsupported', 'this browser cannot process live audio (no AudioWorklet)');
    let stream: MediaStream;
    try {
      stream = await navigator.mediaDevices.getUserMedia({ audio: { echoCancellation: false, noiseSuppression: false, autoGainControl: false, channelCount: 1 } });
    } catch (error) {
      const name = (error as { name?: string }).name;
      if (name === 'NotAllowedError' || name === 'SecurityError') throw new CaptureError('denied', 'the browser did not allow the microphone');
      if (name === 'NotFoundError' || name === 'OverconstrainedError') throw new CaptureError('no-microphone', 'no microphone was found');
      throw new CaptureError('failed', `the microphone could not be opened (${error instanceof Error ? error.message : String(error)})`);
    }
    const context = new AudioContext();
    try {
      await context.audioWorklet.addModule(captureProcessorUrl);
      if (context.state === 'suspended') await context.resume();
      const source = context.createMediaStreamSource(stream);
      const node = new AudioWorkletNode(context, captureProcessorName, { numberOfInputs: 1, numberOfOutputs: 0, channelCount: 1, channelCountMode: 'explicit' });
      const detector = new StrikeDetector({ sampleRate: context.sampleRate });
      let lastState = detector.state;
      handlers.onState?.(lastState);
      node.port.onmessage = (event: MessageEvent<Float32Array>) => {
        const block = event.data;
        if (handlers.onLevel) {
          let peak = 0;
          for (let i = 0; i < block.length; i++) peak = Math.max(peak, Math.abs(block[i]!));
          handlers.onLevel(peak > 0 ? 20 * Math.log10(peak) : -120);
        }
        const strike = detector.push(block);
        if (detector.state !== lastState) {
          lastState = detector.state;
          handlers.onState?.(lastState);
        }
        if (strike) handlers.onStrike(strike);
      };
      source.connect(node);
      this.context = context;
      this.stream = stream;
      this.node = node;
    } catch (error) {
      stream.getTracks().forEach((track) => track.stop());
      await context.close().catch(() => undefined);
      throw new CaptureError('failed', `live audio could not start (${error instanceof Error ? error.message : String(error)})`);
    }
  }

  /** Closes the microphone. */
  async stop(): Promise<void> {
    this.node?.port.close();
    this.node?.disconnect();
    this.stream?.getTracks().forEach((track) => track.stop());
    const context = this.context;
    this.node = null;
    this.stream = null;
    this.context = null;
    await context?.close().catch(() => undefined);
  }
}
