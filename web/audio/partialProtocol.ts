// Messages between the page and the partial-finding worker.
import type { ExpectedModes, TapReport } from '../../src/index.ts';

/** What the worker is asked to analyse. */
export type PartialRequest =
  | { kind: 'wav'; bytes: ArrayBuffer; name: string; maxPartials?: number; expected?: ExpectedModes }
  | { kind: 'samples'; samples: Float32Array; sampleRate: number; maxPartials?: number; expected?: ExpectedModes };

/** The worker's answer to request `id`. */
export type PartialResponse =
  | { id: number; ok: true; report: TapReport; elapsedMs: number }
  | { id: number; ok: false; inputError: boolean; message: string };
