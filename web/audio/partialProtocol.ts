// The partial-finding worker's one job (partialWorker.ts), in the workbench's job protocol
// (jobProtocol.ts): a WAV file's bytes or captured samples in, the tap report out.
import type { ExpectedModes, TapReport } from '../../src/index.ts';

/** What the worker is asked to analyse (its buffer is transferred to the worker). */
export type PartialRequest =
  | { kind: 'wav'; bytes: ArrayBuffer; name: string; maxPartials?: number; expected?: ExpectedModes }
  | { kind: 'samples'; samples: Float32Array; sampleRate: number; maxPartials?: number; expected?: ExpectedModes };

/** The partial-finding job catalog. */
export type PartialJobs = {
  partials: { payload: PartialRequest; result: TapReport };
};
