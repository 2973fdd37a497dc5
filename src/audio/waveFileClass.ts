import * as wavefileModule from 'wavefile';

/** The wavefile library's WaveFile class. */
export type WaveFileClass = typeof wavefileModule.WaveFile;

/**
 * wavefile ships CommonJS for Node (whose named export Node's ESM loader cannot see, so it sits
 * on the default export) and an ES module for bundlers (named export only): take the class from
 * whichever shape the loader handed over.
 */
export const WaveFile: WaveFileClass =
  (wavefileModule as { WaveFile?: WaveFileClass }).WaveFile ?? (Reflect.get(wavefileModule, 'default') as { WaveFile: WaveFileClass }).WaveFile;
