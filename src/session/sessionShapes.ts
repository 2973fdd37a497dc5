import { mergeStations } from '../design/cutLimits.ts';
import { barModelFromFile, type BarModel } from '../modes/BarModel.ts';
import type { SessionLog } from '../fileFormats/sessionFile.ts';
import { thicknessAt, type ThicknessProfile } from '../section/ThicknessProfile.ts';
import { shapeWithMeasuredThicknesses } from './measuredShape.ts';

/** How each step's real shape is known to the calibration. */
export interface SessionShape {
  /** The step's shape on a station grid: the recorded bar plus what earlier measurements correct. */
  readonly model: BarModel;
  /**
   * Cuts since the last anchored step whose real depth is fitted: the shape loses
   * `scale · values` (m per unit scale) per cut, `cut` the step number (1-based) of that cut.
   */
  readonly removals: { cut: number; values: Float64Array }[];
  /** True when the shape is known outright (the first step, a cut recorded as done, or thicknesses measured). */
  readonly anchored: boolean;
}

/** Stations closer than this (m) are merged. */
const stationGap = 1e-5;

function profileOf(model: BarModel): ThicknessProfile {
  return model.profile;
}

/**
 * The shapes of a session's steps as the calibration sees them. Each step's bar file is the shape
 * the maker recorded; a step whose cut is recorded as planned (the default) may in truth have
 * removed more or less, so its cut — the difference between the previous bar file and this one —
 * gets a fitted depth scale, and the error carries on into later steps until one is anchored (a
 * cut recorded `as-done`, or thicknesses measured at stations, which correct the shape directly).
 * Positions in each step's own frame (shortening trims both ends equally). All models carry the
 * first step's material (the maker's guess).
 */
export function sessionShapes(log: SessionLog): SessionShape[] {
  const material = barModelFromFile(log.steps[0]!.bar).material;
  const recorded = log.steps.map((step) => ({ ...barModelFromFile(step.bar), material }));
  const shapes: SessionShape[] = [];
  let anchor = 0;
  let anchorShape: BarModel = recorded[0]!;
  log.steps.forEach((step, k) => {
    const file = recorded[k]!;
    const rect = file.section.shape === 'rect';
    const anchored = k === 0 || !rect || step.cut?.made === 'as-done' || (step.thickness_measured_mm?.length ?? 0) > 0;
    if (anchored) {
      const model = shapeWithMeasuredThicknesses(file, step.thickness_measured_mm);
      anchor = k;
      anchorShape = model;
      shapes.push({ model, removals: [], anchored: true });
      return;
    }
    // x in this frame is x + shift(j) in step j's frame.
    const shift = (j: number): number => 0.5 * (recorded[j]!.length - file.length);
    const lists: ArrayLike<number>[] = [file.profile.positions, Array.from(anchorShape.profile.positions, (x) => x - shift(anchor))];
    for (let j = anchor + 1; j <= k; j++) lists.push(Array.from(recorded[j - 1]!.profile.positions, (x) => x - shift(j - 1)));
    const positions = mergeStations(lists, stationGap).filter((x) => x >= -1e-12 && x <= file.length + 1e-12);
    positions[0] = 0;
    positions[positions.length - 1] = file.length;
    const grid = Float64Array.from(positions);
    const anchorRecorded = profileOf(recorded[anchor]!);
    const thicknesses = Float64Array.from(grid, (x) => {
      const correction = thicknessAt(anchorShape.profile, x + shift(anchor)) - thicknessAt(anchorRecorded, x + shift(anchor));
      return Math.max(1e-5, thicknessAt(file.profile, x) + correction);
    });
    const removals: SessionShape['removals'] = [];
    for (let j = anchor + 1; j <= k; j++) {
      const before = recorded[j - 1]!.profile;
      const after = recorded[j]!.profile;
      const values = Float64Array.from(grid, (x) => Math.max(0, thicknessAt(before, x + shift(j - 1)) - thicknessAt(after, x + shift(j))));
      if (values.some((v) => v > 1e-7)) removals.push({ cut: j + 1, values });
    }
    shapes.push({ model: { ...file, profile: { positions: grid, thicknesses } }, removals, anchored: false });
  });
  return shapes;
}
