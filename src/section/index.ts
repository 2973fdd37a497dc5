export * from './Section.ts';
export * from './ThicknessProfile.ts';
export * from './rectangleTorsionConstant.ts';
export * from './shearCoefficient.ts';
export * from './sectionProperties.ts';
export * from './drilledSection.ts';
