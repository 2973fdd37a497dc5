// Worker that finds partials off the main thread with the library's own code (src/audio via
// src/index.ts): a dropped WAV file is decoded and analysed, a microphone capture analysed.
import { analyzeRecording, findPartials, isInputError, tapReport } from '../../src/index.ts';
import type { PartialRequest, PartialResponse } from './partialProtocol.ts';

function post(message: PartialResponse): void {
  (self as unknown as Worker).postMessage(message);
}

self.addEventListener('message', (event: MessageEvent<{ id: number; request: PartialRequest }>) => {
  const { id, request } = event.data;
  const started = performance.now();
  try {
    const options = { maxPartials: request.maxPartials, expected: request.expected };
    const report =
      request.kind === 'wav'
        ? analyzeRecording(new Uint8Array(request.bytes), options, request.name)
        : tapReport(findPartials(Float64Array.from(request.samples), request.sampleRate, options, 'microphone'), 1, request.expected);
    post({ id, ok: true, report, elapsedMs: performance.now() - started });
  } catch (error) {
    post({ id, ok: false, inputError: isInputError(error), message: error instanceof Error ? error.message : String(error) });
  }
});
