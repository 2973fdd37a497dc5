export * from './Material.ts';
export * from './materialPresets.ts';
