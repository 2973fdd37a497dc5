// Worker that finds partials off the main thread with the library's own code (src/audio via
// src/index.ts), in the workbench's job protocol: a dropped WAV file is decoded and analysed, a
// microphone capture analysed.
import { analyzeRecording, findPartials, tapReport } from '../../src/index.ts';
import { serveJobs } from '../worker/serveJobs.ts';
import type { PartialJobs } from './partialProtocol.ts';

serveJobs<PartialJobs>({
  partials(request) {
    const options = { maxPartials: request.maxPartials, expected: request.expected };
    return request.kind === 'wav'
      ? analyzeRecording(new Uint8Array(request.bytes), options, request.name)
      : tapReport(findPartials(Float64Array.from(request.samples), request.sampleRate, options, 'microphone'), 1, request.expected);
  },
});
