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
  /** True when the shape is known outright (the first step, a tube or rod, or a cut recorded as done). */
  readonly anchored: boolean;
  /**
   * Caliper readings of an unanchored step (`measured_thickness_mm`, in m on this step's frame):
   * the calibration fits the cut depths to them as well as to the partials. Absent otherwise.
   */
  readonly readings?: { x: number; thickness: number }[];
}

/** How deep a rect shape is cut below its blank at a position (m): the arch caliper readings scale on a shape known outright. */
function archDepthOf(model: BarModel): (x: number) => number {
  const blank = model.section.shape === 'rect' ? model.section.thickness : 0;
  return (x) => Math.max(0, blank - thicknessAt(model.profile, x));
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
 * cut recorded `as-done`, with any caliper readings correcting its arch — see
 * shapeWithMeasuredThicknesses). Caliper readings after a cut recorded as planned stay with the
 * step (`readings`): the calibration fits the cut depths to them beside the partials.
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
    const measured = (step.measured_thickness_mm?.length ?? 0) > 0;
    if (k === 0 || !rect || step.cut?.made === 'as-done') {
      // Known outright: the first step, a tube or rod, or a cut recorded as done (the file is the shape),
      // corrected by caliper readings taken with it.
      const model = shapeWithMeasuredThicknesses(file, step.measured_thickness_mm, rect ? archDepthOf(file) : undefined);
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
    const carried: BarModel = { ...file, profile: { positions: grid, thicknesses } };
    const removals: SessionShape['removals'] = [];
    for (let j = anchor + 1; j <= k; j++) {
      const before = recorded[j - 1]!.profile;
      const after = recorded[j]!.profile;
      const values = Float64Array.from(grid, (x) => Math.max(0, thicknessAt(before, x + shift(j - 1)) - thicknessAt(after, x + shift(j))));
      if (values.some((v) => v > 1e-7)) removals.push({ cut: j + 1, values });
    }
    // Caliper readings after a cut recorded as planned tell how deep the cuts really went where they
    // were taken: the calibration fits the cut depths to them (a hand is not a scaled plan, so the
    // readings are weighed, not imposed between them).
    const readings = measured ? step.measured_thickness_mm!.map(([x, t]) => ({ x: Math.min(file.length, Math.max(0, x * 1e-3)), thickness: t * 1e-3 })) : undefined;
    shapes.push({ model: carried, removals, anchored: false, ...(readings ? { readings } : {}) });
  });
  return shapes;
}
