export * from './Material.ts';
export * from './materialPresets.ts';
export * from './pitchTemperatureCoefficient.ts';
