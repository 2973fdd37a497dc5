import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { smoothLengths, type LengthWindow } from '../../src/instrument/smoothLengths.ts';

const windowAround = (preferred: number, spread = 0.08): LengthWindow => ({ preferred_mm: preferred, min_mm: preferred * (1 - spread), max_mm: preferred * (1 + spread) });

describe('blank length progression', () => {
  it('keeps a geometric run as it is (no second differences in ln L), rounded to the step', () => {
    const preferred = Array.from({ length: 30 }, (_, i) => 560 * 2 ** (-i / 24));
    const smoothed = smoothLengths(preferred.map((p) => windowAround(p)), { step_mm: 1 });
    smoothed.forEach((s, i) => {
      expect(Math.abs(s.length_mm - preferred[i]!)).toBeLessThanOrEqual(0.5 + 1e-9);
      expect(s.inside).toBe(true);
    });
  });

  it('smooths a noisy run, stays in every window, cuts to a 5 mm step and never rises up the keyboard', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -0.03, max: 0.03, noNaN: true }), { minLength: 12, maxLength: 52 }), (noise) => {
        const windows = noise.map((e, i) => windowAround(600 * 2 ** (-i / 20) * (1 + e), 0.1));
        const smoothed = smoothLengths(windows, { step_mm: 5 });
        smoothed.forEach((s, i) => {
          expect(s.length_mm % 5).toBe(0);
          expect(s.inside).toBe(true);
          expect(s.length_mm).toBeGreaterThanOrEqual(windows[i]!.min_mm);
          expect(s.length_mm).toBeLessThanOrEqual(windows[i]!.max_mm);
          if (i > 0) expect(s.length_mm).toBeLessThanOrEqual(smoothed[i - 1]!.length_mm);
        });
      }),
      { numRuns: 60 },
    );
  });

  it('bridges a note with no window and flags it; keeps fixed lengths exactly', () => {
    const windows: (LengthWindow | undefined)[] = Array.from({ length: 10 }, (_, i) => windowAround(400 * 2 ** (-i / 12)));
    windows[4] = undefined;
    const smoothed = smoothLengths(windows, { fixed: new Map([[0, 410]]) });
    expect(smoothed[4]!.inside).toBe(false);
    expect(smoothed[4]!.length_mm).toBeLessThan(smoothed[3]!.length_mm);
    expect(smoothed[4]!.length_mm).toBeGreaterThan(smoothed[5]!.length_mm);
    expect(smoothed[0]!.length_mm).toBe(410);
  });

  it('pins a note whose window is narrow and off the trend to the nearest edge of its window', () => {
    const windows = Array.from({ length: 12 }, (_, i) => windowAround(500 * 2 ** (-i / 12), 0.1));
    windows[6] = { preferred_mm: 330, min_mm: 328, max_mm: 334 }; // trend says about 354 mm
    const smoothed = smoothLengths(windows, { step_mm: 1 });
    expect(smoothed[6]!.inside).toBe(true);
    expect(smoothed[6]!.length_mm).toBeGreaterThanOrEqual(328);
    expect(smoothed[6]!.length_mm).toBeLessThanOrEqual(334);
  });
});
