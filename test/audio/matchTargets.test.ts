import { describe, expect, it } from 'vitest';
import { matchTargets } from '../../src/audio/index.ts';
import { cents } from '../../src/pitch/index.ts';

describe('matchTargets', () => {
  it('pairs each target with the nearest measured partial and gives cents and beats', () => {
    const matches = matchTargets([120, 352, 1398, 3600], [349.23, 1396.91, 3492.3]);
    expect(matches.map((m) => m.partial)).toEqual([1, 2, 3]);
    expect(matches[0]!.cents).toBeCloseTo(cents(352, 349.23), 12);
    // Beats: |f − f_target| (closed form).
    expect(matches[1]!.beatsPerSecond).toBeCloseTo(1.09, 10);
  });

  it('leaves a target unmatched when nothing lies within the tolerance, and uses each partial once', () => {
    const matches = matchTargets([352], [349.23, 350], { toleranceCents: 100 });
    expect(matches.map((m) => m.partial)).toEqual([null, 0]);
    expect(matches[0]).toEqual({ target: 0, partial: null, cents: null, beatsPerSecond: null });
    expect(matchTargets([600], [349.23])[0]!.partial).toBeNull();
  });

  it('follows bending-mode labels when given', () => {
    const matches = matchTargets([250, 390, 1010], [249, 996], { modes: [1, null, 2] });
    expect(matches.map((m) => m.partial)).toEqual([0, 2]);
  });
});
