// How the calibration reads each step's shape: measured thicknesses, cuts recorded as planned,
// and the log's own warnings.
import { describe, expect, it } from 'vitest';
import { barModelFromFile } from '../../src/modes/BarModel.ts';
import { parseBarFile } from '../../src/fileFormats/barFile.ts';
import { parseSessionFile } from '../../src/fileFormats/sessionFile.ts';
import { thicknessAt } from '../../src/section/ThicknessProfile.ts';
import { shapeWithMeasuredThicknesses } from '../../src/session/measuredShape.ts';
import { sessionLogWarnings } from '../../src/session/sessionLogWarnings.ts';
import { sessionShapes } from '../../src/session/sessionShapes.ts';

const material = { E_GPa: 18, G_GPa: 1.3, density_kg_m3: 1000 };
const blank = { length_mm: 400, section: { shape: 'rect', width_mm: 50, thickness_mm: 22 }, material };
const arch = (depth: number) => ({ ...blank, profile_mm: [[0, 22], [100, 22], [200, 22 - depth], [300, 22], [400, 22]] });

function session(steps: Record<string, unknown>[]) {
  return parseSessionFile({ format: 'barwright.session', version: 1, target: { hz: 200, ratios: [1, 4, 10], tolerance_cents: [2, 5, 15] }, limits: { min_thickness_mm: 6 }, steps });
}

describe('shapeWithMeasuredThicknesses', () => {
  it('takes the measured thickness at each measured station and interpolates the difference between them', () => {
    const model = barModelFromFile(parseBarFile(arch(10)));
    const corrected = shapeWithMeasuredThicknesses(model, [[150, 16.5], [200, 11.5], [250, 16.5]]);
    expect(thicknessAt(corrected.profile, 0.2) * 1e3).toBeCloseTo(11.5, 9);
    expect(thicknessAt(corrected.profile, 0.15) * 1e3).toBeCloseTo(16.5, 9);
    // Between 150 and 200 mm the record says 17 → 12; the measurements 16.5 → 11.5: 0.5 mm thinner throughout.
    expect(thicknessAt(corrected.profile, 0.175) * 1e3).toBeCloseTo(14.5 - 0.5, 9);
    // The ends, uncut and unmeasured, stay as recorded.
    expect(thicknessAt(corrected.profile, 0) * 1e3).toBeCloseTo(22, 9);
    expect(thicknessAt(corrected.profile, 0.4) * 1e3).toBeCloseTo(22, 9);
  });
});

describe('sessionShapes', () => {
  it('gives a cut recorded as planned a depth to fit, carried into later steps until one is anchored', () => {
    const shapes = sessionShapes(
      session([
        { bar: blank, measured_hz: [600, 1500, 2700] },
        { bar: arch(8), measured_hz: [400, 1300, 2500], cut: { made: 'as-planned' } },
        { bar: arch(10), measured_hz: [350, 1250, 2450] },
        { bar: arch(11), measured_hz: [330, 1230, 2430], cut: { made: 'as-done' } },
        { bar: arch(12), measured_hz: [310, 1210, 2410], measured_thickness_mm: [[200, 9.9]] },
        { bar: arch(12.5), measured_hz: [300, 1200, 2400] },
      ]),
    );
    expect(shapes.map((s) => s.anchored)).toEqual([true, false, false, true, false, false]);
    expect(shapes.map((s) => s.removals.map((r) => r.cut))).toEqual([[], [2], [2, 3], [], [5], [5, 6]]);
    // The caliper reading stays with step 5, for the calibration to fit its cut depth to.
    expect(shapes[4]!.readings).toEqual([{ x: 0.2, thickness: 0.0099 }]);
    // The planned removal of cut 3 at the centre: 10 − 8 = 2 mm.
    const centre = shapes[2]!.model.profile.positions.findIndex((x) => Math.abs(x - 0.2) < 1e-9);
    expect(shapes[2]!.removals[1]!.values[centre]! * 1e3).toBeCloseTo(2, 9);
    // Step 6 carries step 4's record (as done) with cuts 5 and 6 to fit: 22 − 12.5 = 9.5 recorded.
    const sixth = shapes[5]!.model;
    expect(thicknessAt(sixth.profile, 0.2) * 1e3).toBeCloseTo(9.5, 9);
  });
});

describe('sessionLogWarnings', () => {
  it('warns of wood added between steps, steps without an air temperature beside others with one, and unmeasured partials', () => {
    const warnings = sessionLogWarnings(
      session([
        { bar: arch(8), measured_hz: [400, 1300, 2500], air_temperature_c: 15 },
        { bar: arch(6), measured_hz: [420, 1320] },
      ]),
    );
    expect(warnings.join('\n')).toMatch(/step 2's bar is 2\.00 mm thicker than step 1's at 200 mm: wood cannot be put back/);
    // Readings are projected to the playing temperature now; a step without a temperature is taken as read at it.
    expect(warnings.join('\n')).toMatch(/1 of 2 steps give no air_temperature_c: they are taken as read at the playing temperature/);
    expect(warnings.join('\n')).toMatch(/the last step measured 2 partials but the target tunes 3/);
  });
});
