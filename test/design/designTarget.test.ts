import { describe, expect, it } from 'vitest';
import { defaultToleranceCents, parseRatios, parseToleranceList, ratioPresets, resolveDesignTarget } from '../../src/design/designTarget.ts';

describe('design targets', () => {
  it('reads a note at any A4 (MIDI 1.0: f = f_A4·2^((m − 69)/12))', () => {
    const target = resolveDesignTarget({ note: 'F3', a4: 442, ratios: '1:4:10' });
    // F3 is MIDI 53: 442·2^(−16/12) Hz (closed form).
    expect(target.fundamentalHz).toBeCloseTo(442 * 2 ** (-16 / 12), 10);
    expect(target.hz).toEqual([1, 4, 10].map((r) => r * target.fundamentalHz));
    expect(target.note).toBe('F3');
    expect(resolveDesignTarget({ note: 'A4' }).fundamentalHz).toBe(440);
  });
  it('takes a frequency instead of a note', () => {
    expect(resolveDesignTarget({ hz: 349.23, ratios: '1:3' }).hz).toEqual([349.23, 3 * 349.23]);
  });
  it('knows the presets and custom ratios', () => {
    expect(Object.keys(ratioPresets)).toEqual(['1:4:10', '1:4', '1:3', '1:3:6', 'fundamental']);
    expect(parseRatios('fundamental')).toEqual([1]);
    expect(parseRatios('1:3:6')).toEqual([1, 3, 6]);
    expect(parseRatios('1:3.95:9.8')).toEqual([1, 3.95, 9.8]);
    expect(parseRatios([1, 4])).toEqual([1, 4]);
  });
  it('defaults the tolerances to ±2, ±5, ±15 cents (common practice, brief §3) and keeps given ones', () => {
    expect([0, 1, 2, 3].map(defaultToleranceCents)).toEqual([2, 5, 15, 20]);
    expect(resolveDesignTarget({ hz: 200, ratios: '1:4:10', tolerance_cents: [1] }).toleranceCents).toEqual([1, 5, 15]);
    expect(parseToleranceList('1,4,12')).toEqual([1, 4, 12]);
  });
  it.each([
    [{}, 'target: note: give the note (e.g. F3) or the fundamental in Hz'],
    [{ note: 'F3', hz: 175 }, 'target: note: give a note or hz, not both'],
    [{ note: 'H3' }, 'target: note: "H3" is not a note name'],
    [{ hz: 5 }, 'target: hz: must be a frequency from 20 to 20000 Hz (got 5)'],
    [{ hz: 200, a4: 1000 }, 'target: a4: A4 reference 1000 Hz is outside 300–600 Hz'],
    [{ hz: 200, ratios: '2:4' }, 'target: ratios: the first ratio is the fundamental and must be 1 (got 2)'],
    [{ hz: 200, ratios: '1:4:3' }, 'target: ratios: ratios must increase by more than 5 % each (4 then 3)'],
    [{ hz: 200, ratios: 'one:four' }, 'target: ratios: "one:four" is neither a preset'],
    [{ hz: 200, ratios: '1:4', tolerance_cents: [2, 5, 9] }, 'target: tolerance_cents: 3 tolerances for 2 partials'],
    [{ hz: 200, tolerance_cents: [0] }, 'target: tolerance_cents[0]: must be from 0.1 to 100 cents (got 0)'],
  ])('rejects %j', (input, message) => {
    expect(() => resolveDesignTarget(input as never)).toThrow(message);
  });
});
