// Common chime stock the chime page offers as a starting point (sizes in mm; invented shop list,
// plausible round-number and inch-based sizes). Choosing one fills the section fields.

/** One stock size: a tube (outer diameter × wall) or a solid rod (diameter). */
export interface ChimeStockChoice {
  id: string;
  label: string;
  section: { shape: 'tube'; outer_diameter_mm: number; wall_mm: number } | { shape: 'round'; diameter_mm: number };
}

/** The stock sizes listed on the chime page. */
export const chimeStockChoices: readonly ChimeStockChoice[] = [
  { id: 'tube-16x1', label: 'Tube 16 × 1.0 mm', section: { shape: 'tube', outer_diameter_mm: 16, wall_mm: 1 } },
  { id: 'tube-22x1.5', label: 'Tube 22 × 1.5 mm', section: { shape: 'tube', outer_diameter_mm: 22, wall_mm: 1.5 } },
  { id: 'tube-25.4x1.6', label: 'Tube 25.4 × 1.6 mm (1 in)', section: { shape: 'tube', outer_diameter_mm: 25.4, wall_mm: 1.6 } },
  { id: 'tube-31.75x1.65', label: 'Tube 31.75 × 1.65 mm (1¼ in)', section: { shape: 'tube', outer_diameter_mm: 31.75, wall_mm: 1.65 } },
  { id: 'tube-38.1x1.65', label: 'Tube 38.1 × 1.65 mm (1½ in)', section: { shape: 'tube', outer_diameter_mm: 38.1, wall_mm: 1.65 } },
  { id: 'rod-10', label: 'Rod ⌀ 10 mm', section: { shape: 'round', diameter_mm: 10 } },
  { id: 'rod-12', label: 'Rod ⌀ 12 mm', section: { shape: 'round', diameter_mm: 12 } },
  { id: 'rod-16', label: 'Rod ⌀ 16 mm', section: { shape: 'round', diameter_mm: 16 } },
  { id: 'rod-20', label: 'Rod ⌀ 20 mm', section: { shape: 'round', diameter_mm: 20 } },
];
