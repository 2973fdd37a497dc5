import type { BarModel } from '../modes/BarModel.ts';

/**
 * How deep the arch of a bar is, as a fraction: 1 − (thinnest station)/(blank thickness), 0 for
 * an uncut blank or a round or tube section. The calibration's per-partial correction scales with
 * it: the 1D model agrees with a 2D one within 0.25 % on a uniform bar and misses by 2–3 % on a
 * bar cut to about a third of its thickness (brief.md, "The real bar is not the model").
 */
export function archDepth(model: BarModel): number {
  if (model.section.shape !== 'rect') return 0;
  let thinnest = Infinity;
  for (const t of model.profile.thicknesses) thinnest = Math.min(thinnest, t);
  return Math.max(0, 1 - thinnest / model.section.thickness);
}
