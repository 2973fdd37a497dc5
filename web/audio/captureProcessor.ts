// AudioWorklet processor: copies the first input channel to the page in blocks of 2048 samples
// (about 43 ms at 48 kHz). Runs in the AudioWorkletGlobalScope, loaded by StrikeCapture.

interface WorkletProcessor {
  readonly port: MessagePort;
}
interface WorkletScope {
  AudioWorkletProcessor: new () => WorkletProcessor;
  registerProcessor: (name: string, processor: new () => WorkletProcessor) => void;
}
const scope = globalThis as unknown as WorkletScope;

/** Name the processor is registered under. */
export const captureProcessorName = 'barwright-strike-capture';

const blockLength = 2048;

class CaptureProcessor extends scope.AudioWorkletProcessor {
  private buffer = new Float32Array(blockLength);
  private filled = 0;

  process(inputs: Float32Array[][]): boolean {
    const channel = inputs[0]?.[0];
    if (!channel) return true;
    let offset = 0;
    while (offset < channel.length) {
      const count = Math.min(channel.length - offset, blockLength - this.filled);
      this.buffer.set(channel.subarray(offset, offset + count), this.filled);
      this.filled += count;
      offset += count;
      if (this.filled === blockLength) {
        this.port.postMessage(this.buffer, [this.buffer.buffer]);
        this.buffer = new Float32Array(blockLength);
        this.filled = 0;
      }
    }
    return true;
  }
}

scope.registerProcessor(captureProcessorName, CaptureProcessor);
