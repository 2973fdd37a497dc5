// Audio: WAV decoding, partial finding from a recording of a struck bar, labelling.
export * from './decodeWav.ts';
export * from './encodeWav.ts';
export * from './windows.ts';
export * from './powerSpectrum.ts';
export * from './noiseFloor.ts';
export * from './pickPeaks.ts';
export * from './findStrike.ts';
export * from './trackDecay.ts';
export * from './findPartials.ts';
export * from './labelPartials.ts';
export * from './matchTargets.ts';
export * from './analyzeRecording.ts';
