import { mergeStations } from '../design/cutLimits.ts';
import type { BarModel } from '../modes/BarModel.ts';
import { thicknessAt } from '../section/ThicknessProfile.ts';

/**
 * Station spacing (m) of the profiles a session hands back: 5 mm, half the contract's "a
 * station at least every 10 mm over the arch", so a maker can mark them with a rule.
 */
export const cuttingStationSpacing = 0.005;

/**
 * The same bar on a cutting grid: its existing stations (kept exactly) and stations every
 * `spacing` metres (or a little closer) over the cuttable span [start, end], whose ends become
 * stations too. The profile is sampled from the current one, so the shape is unchanged; only
 * where a cut may be placed gains resolution. Non-rect sections are returned as they are.
 */
export function cuttingGrid(model: BarModel, start: number, end: number, spacing = cuttingStationSpacing): BarModel {
  if (model.section.shape !== 'rect') return model;
  const from = Math.max(0, start);
  const to = Math.min(model.length, end);
  const count = Math.max(1, Math.ceil((to - from) / spacing - 1e-9));
  const uniform = to > from ? Array.from({ length: count + 1 }, (_, i) => from + ((to - from) * i) / count) : [];
  const positions = mergeStations([model.profile.positions, uniform], 1e-4);
  positions[0] = 0;
  positions[positions.length - 1] = model.length;
  const thicknesses = Float64Array.from(positions, (x) => thicknessAt(model.profile, x));
  return { ...model, profile: { positions, thicknesses } };
}
