// Keeping the other modes clear of the tuned partials: the check in Hz and the search over the
// uncut ends, on constructed numbers (closed forms: distances are differences of frequencies).
import { describe, expect, it } from 'vitest';
import { otherModeClearances, type OtherMode } from '../../src/modes/index.ts';
import { keepOtherModesClear, type ClearanceTrial } from '../../src/design/index.ts';

describe('otherModeClearances (the beating rule: 6 Hz below 1 kHz, 15 Hz below 2 kHz, 30 Hz above; common practice, from memory)', () => {
  it('measures each mode against its tightest partial by the rule, in Hz, tightest first', () => {
    const tuned = [110, 440, 1100];
    const others: OtherMode[] = [
      { family: 'torsion', mode: 1, hz: 230 }, // 120 Hz above 110 (rule 6): margin 114
      { family: 'torsion', mode: 2, hz: 1106 }, // 6 Hz above 1100 (rule 15): margin −9
      { family: 'lateral', mode: 1, hz: 452 }, // 12 Hz above 440 (rule 6): margin 6
    ];
    const found = otherModeClearances(tuned, others);
    expect(found.map((c) => [c.family, c.mode, c.partial, c.apart_hz, c.allowed_hz, c.margin_hz, c.clear])).toEqual([
      ['torsion', 2, 3, 6, 15, -9, false],
      ['lateral', 1, 2, 12, 6, 6, true],
      ['torsion', 1, 1, 120, 6, 114, true],
    ]);
  });

  it('picks the partial by the rule, not by the nearer frequency', () => {
    // 1020 Hz is 30 Hz above 990 (rule 6: margin 24) and 20 Hz below 1040 (rule 15: margin 5).
    const [c] = otherModeClearances([990, 1040], [{ family: 'longitudinal', mode: 1, hz: 1020 }]);
    expect([c!.partial, c!.apart_hz, c!.allowed_hz, c!.margin_hz]).toEqual([2, -20, 15, 5]);
  });

  it('a mode exactly at the distance can beat (not clear), one past it is clear; 30 Hz above 2 kHz', () => {
    expect(otherModeClearances([440], [{ family: 'torsion', mode: 1, hz: 446 }])[0]!.clear).toBe(false);
    expect(otherModeClearances([440], [{ family: 'torsion', mode: 1, hz: 446.5 }])[0]!.clear).toBe(true);
    expect(otherModeClearances([2400], [{ family: 'lateral', mode: 2, hz: 2372 }])[0]).toMatchObject({ apart_hz: -28, allowed_hz: 30, margin_hz: -2, clear: false });
  });

  it('no tuned partials or no other modes: nothing to report', () => {
    expect(otherModeClearances([], [{ family: 'torsion', mode: 1, hz: 100 }])).toEqual([]);
    expect(otherModeClearances([100], [])).toEqual([]);
  });
});

// A constructed design law: the tuned partials fixed, torsion mode 2 moving linearly with the
// uncut ends u (mm) at `rate` Hz per mm from `start` Hz above partial 3 at u = 100 mm; the
// targets are met up to `reach` mm.
function lawOf(start: number, rate: number, reach = Infinity) {
  const tuned = [110, 440, 1100];
  const made: number[] = [];
  const at = (u: number): ClearanceTrial => ({
    solidHz: tuned,
    meetsTargets: u <= reach,
    others: [{ family: 'torsion', mode: 2, hz: 1100 + start + rate * (u - 100) }],
    uncutEndMm: u,
    solidSolves: 1,
  });
  return { first: at(100), designAt: (u: number) => (made.push(u), at(u)), made };
}

describe('keepOtherModesClear (the search over the uncut ends, on a linear law)', () => {
  it('steps 1.5 % of the length, then the secant aims 1.5 × the rule beyond the partial: clear on the second design', () => {
    const law = lawOf(-4, 1.6);
    const { chosen, report } = keepOtherModesClear(law.first, law.designAt, { lengthMm: 560, keep: true });
    // First step 0.015 · 560 = 8.4 mm → 108.5 (half millimetres): −4 + 1.6 · 8.5 = 9.6 Hz, inside 15.
    // Secant: aim +22.5 Hz, step (22.5 − 9.6)/1.6 = 8.06 mm → 116.5: 22.4 Hz above, clear.
    expect(law.made).toEqual([108.5, 116.5]);
    expect(report.holds).toBe(true);
    expect(report.uncut_end_mm).toEqual({ from: 100, to: 116.5 });
    expect(report.before[0]).toMatchObject({ apart_hz: -4, clear: false });
    expect(report.after[0]!.apart_hz).toBeCloseTo(22.4, 10);
    expect(report.solid_solves).toBe(2);
    expect(chosen.uncutEndMm).toBe(116.5);
  });

  it('follows a mode that moves down as the arch narrows', () => {
    const law = lawOf(3, -2);
    const { report } = keepOtherModesClear(law.first, law.designAt, { lengthMm: 560, keep: true });
    expect(report.holds).toBe(true);
    expect(report.after[0]!.apart_hz).toBeLessThan(-15);
  });

  it('stops when a narrower arch no longer meets the targets, keeps the first design and says it does not hold', () => {
    const law = lawOf(-4, 1.6, 105);
    const { chosen, report } = keepOtherModesClear(law.first, law.designAt, { lengthMm: 560, keep: true });
    expect(law.made).toEqual([108.5]);
    expect(chosen).toBe(law.first);
    expect(report).toMatchObject({ holds: false, uncut_end_mm: null, uncut_ends_tried_mm: [108.5], solid_solves: 1 });
  });

  it('a mode the lever hardly moves: at most four designs, the arch kept at least a fifth of the length', () => {
    const law = lawOf(2, 0.01);
    const { report } = keepOtherModesClear(law.first, law.designAt, { lengthMm: 560, keep: true });
    expect(report.holds).toBe(false);
    expect(law.made.length).toBeLessThanOrEqual(4);
    for (const u of law.made) expect(u).toBeLessThanOrEqual(0.4 * 560);
  });

  it('asked only to report, or clear already: no design is made', () => {
    const clash = lawOf(-4, 1.6);
    expect(keepOtherModesClear(clash.first, clash.designAt, { lengthMm: 560, keep: false }).report).toMatchObject({ kept_clear: false, holds: false });
    const clear = lawOf(40, 1.6);
    expect(keepOtherModesClear(clear.first, clear.designAt, { lengthMm: 560, keep: true }).report).toMatchObject({ holds: true, uncut_end_mm: null });
    expect([...clash.made, ...clear.made]).toEqual([]);
  });
});
