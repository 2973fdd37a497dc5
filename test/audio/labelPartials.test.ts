import { describe, expect, it } from 'vitest';
import { expectedModesOf, labelPartials } from '../../src/audio/index.ts';

// Predictions shaped like analyzeBar's for a 1 : 4 : 10 bar (invented numbers).
const expected = {
  bending: [250, 1000, 2500, 4100],
  other: [
    { family: 'torsion', mode: 1, hz: 390 },
    { family: 'lateral', mode: 1, hz: 1190 },
  ],
};

describe('labelPartials', () => {
  it('labels bending partials 1–3 and other modes on a bar that sounds higher than predicted', () => {
    // The real blank is 3 % stiffer: all modes about +51 cents; the labels must follow.
    const scale = 1.03;
    const measured = [250 * scale, 392 * scale, 995 * scale, 1185 * scale, 2520 * scale, 3333];
    const labels = labelPartials(measured, expected);
    expect(labels.map((l) => l.mode)).toEqual([1, null, 2, null, 3, null]);
    expect(labels.map((l) => l.otherMode)).toEqual([null, 'torsion 1', null, 'lateral 1', null, null]);
    expect(labels[2]!.predictedHz).toBe(1000);
    expect(labels[5]).toEqual({ mode: null, otherMode: null, predictedHz: null });
  });

  it('gives each mode to one partial only, the closest', () => {
    // 985 Hz is −26 cents from the predicted 1000, 1004 Hz is +7: mode 2 goes to 1004 Hz.
    const labels = labelPartials([250, 985, 1004], expected);
    expect(labels.map((l) => l.mode)).toEqual([1, null, 2]);
  });

  it('without a measured fundamental, matches overtones unscaled within the wide tolerance', () => {
    const labels = labelPartials([1050, 2400], expected);
    expect(labels.map((l) => l.mode)).toEqual([2, 3]);
  });

  it('leaves everything unlabelled when nothing is near a prediction', () => {
    expect(labelPartials([60, 7000], expected).every((l) => l.mode === null && l.otherMode === null)).toBe(true);
    expect(labelPartials([250], { bending: [] })).toEqual([{ mode: null, otherMode: null, predictedHz: null }]);
  });

  it('reads predictions from an analyzeBar-shaped result', () => {
    const modes = expectedModesOf({
      bending: [{ hz: 250 }, { hz: 1000 }],
      torsion: [{ mode: 1, hz: 390 }],
      lateral: [{ mode: 1, hz: 1190 }],
    });
    expect(modes).toEqual({ bending: [250, 1000], other: [{ family: 'torsion', mode: 1, hz: 390 }, { family: 'lateral', mode: 1, hz: 1190 }] });
  });
});
