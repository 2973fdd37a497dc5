import { materialFromFile, sectionFromFile, type BarModel } from '../modes/BarModel.ts';
import type { BarFile, BarFileMaterial } from '../fileFormats/barFile.ts';
import { uniformProfile } from '../section/ThicknessProfile.ts';
import { cylindricalPlug, type EndLoad } from './endLoad.ts';
import { gram, millimetre as mm } from '../units/units.ts';

/** The section of chime stock, mm: a tube or a solid rod (bar-file shapes). */
export type ChimeSection = { shape: 'tube'; outer_diameter_mm: number; wall_mm: number } | { shape: 'round'; diameter_mm: number };

/**
 * A plug or cap fixed at one end of a chime, mm and grams: modelled as a rigid solid cylinder of
 * that length and diameter, flush with the end face.
 */
export interface ChimeEndMass {
  /** 'top' is the end the chime hangs from (x = 0); 'bottom' the other. */
  end: 'top' | 'bottom';
  mass_g: number;
  length_mm: number;
  /** Diameter of the plug (default: the tube's bore, or the rod's diameter for a cap). */
  diameter_mm?: number;
}

/** Chime stock: one section and one material, with optional end plugs or caps. */
export interface ChimeStock {
  section: ChimeSection;
  material: BarFileMaterial;
  end_masses?: ChimeEndMass[];
}

/** The bar file of a chime of this stock and length (mm): what `barwright modes` would read. */
export function chimeBarFile(stock: ChimeStock, lengthMm: number, label?: string): BarFile {
  return { format: 'barwright.bar', version: 1, ...(label ? { label } : {}), length_mm: lengthMm, section: { ...stock.section }, material: { ...stock.material } };
}

/** A chime of this stock as the solver's model (SI), length in metres. */
export function chimeModel(stock: ChimeStock, length: number): BarModel {
  const section = sectionFromFile(stock.section);
  const diameter = section.shape === 'tube' ? section.outerDiameter : section.shape === 'round' ? section.diameter : section.thickness;
  return { length, section, profile: uniformProfile(length, diameter), material: materialFromFile(stock.material) };
}

/** The solver's end loads (SI) for the stock's plugs and caps. */
export function chimeEndLoads(stock: ChimeStock): EndLoad[] {
  const bore = stock.section.shape === 'tube' ? stock.section.outer_diameter_mm - 2 * stock.section.wall_mm : stock.section.diameter_mm;
  return (stock.end_masses ?? []).map((load) =>
    cylindricalPlug(load.end === 'top' ? 'start' : 'end', load.mass_g * gram, load.length_mm * mm, (load.diameter_mm ?? bore) * mm),
  );
}
