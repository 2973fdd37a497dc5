export * from './BandedMatrix.ts';
export * from './bandedLdlt.ts';
export * from './tridiagonalEigen.ts';
export * from './lowestModes.ts';
export * from './denseCholesky.ts';
