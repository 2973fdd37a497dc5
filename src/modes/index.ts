export * from './BarModel.ts';
export * from './meshDensity.ts';
export * from './solveBending.ts';
export * from './solveTorsion.ts';
export * from './modeShape.ts';
export * from './bendingSensitivities.ts';
export * from './collisionWarnings.ts';
export * from './analyzeBar.ts';
