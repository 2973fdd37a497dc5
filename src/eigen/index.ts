export * from './BandedMatrix.ts';
export * from './bandedLdlt.ts';
export * from './tridiagonalEigen.ts';
export * from './lowestModes.ts';
export * from './EnvelopeMatrix.ts';
export * from './envelopeLdlt.ts';
export * from './GeneralizedEigenproblem.ts';
export * from './SparseSymmetricMatrix.ts';
