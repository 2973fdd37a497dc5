export * from './Material.ts';
export * from './materialPresets.ts';
export * from './orthotropicStiffness.ts';
export * from './solidElasticity.ts';
export * from './materialFamily.ts';
export * from './pitchTemperatureCoefficient.ts';
