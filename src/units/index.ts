// Units: the SI factors of the edge units (mm, GPa, g). One place for every conversion constant.
export * from './units.ts';
