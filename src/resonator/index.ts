// Resonators: closed-bottom tubes tuned to a bar's fundamental.
export * from './speedOfSound.ts';
export * from './endCorrection.ts';
export * from './closedTube.ts';
export * from './closedTubeResonator.ts';
export * from './calibrateEndCorrection.ts';
export * from './tubePracticality.ts';
export * from './tubeListCsv.ts';
