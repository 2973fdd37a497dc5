// The workbench palette meets WCAG 2.1 AA contrast: 4.5 : 1 for text, 3 : 1 for the focus ring
// and other non-text marks (WCAG 2.1, success criteria 1.4.3 and 1.4.11; relative luminance and
// contrast ratio as defined there).
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

const css = readFileSync(resolve(import.meta.dirname, '../../web/styles/page.css'), 'utf8');

/** The colour a custom property is set to in page.css (#rrggbb). */
function colour(name: string): [number, number, number] {
  const match = new RegExp(`--${name}:\\s*#([0-9a-f]{6})`, 'i').exec(css);
  if (!match) throw new Error(`--${name} is not set in page.css`);
  const hex = match[1]!;
  return [0, 2, 4].map((offset) => Number.parseInt(hex.slice(offset, offset + 2), 16)) as [number, number, number];
}

/** WCAG 2.1 relative luminance of an sRGB colour. */
function luminance([r, g, b]: [number, number, number]): number {
  const linear = (channel: number) => {
    const value = channel / 255;
    return value <= 0.04045 ? value / 12.92 : ((value + 0.055) / 1.055) ** 2.4;
  };
  return 0.2126 * linear(r) + 0.7152 * linear(g) + 0.0722 * linear(b);
}

/** WCAG 2.1 contrast ratio (L1 + 0.05) / (L2 + 0.05) of two sRGB colours. */
function contrastOf(a: [number, number, number], b: [number, number, number]): number {
  const [light, dark] = [luminance(a), luminance(b)].sort((x, y) => y - x) as [number, number];
  return (light + 0.05) / (dark + 0.05);
}

/** WCAG 2.1 contrast ratio of two palette colours (custom property names). */
function contrast(a: string, b: string): number {
  return contrastOf(colour(a), colour(b));
}

describe('palette contrast', () => {
  it('computes the WCAG ratio of known pairs (the check this file makes of the palette)', () => {
    // Black on white is 21 : 1, the largest ratio (WCAG 2.1, definition of contrast ratio).
    expect(contrastOf([0, 0, 0], [255, 255, 255])).toBeCloseTo(21, 12);
    expect(contrastOf([119, 119, 119], [119, 119, 119])).toBe(1);
    // #767676 on white is the lightest grey with 4.5 : 1 (4.54 : 1) and #777777 just fails
    // (4.48 : 1): the pair usually quoted for WCAG AA text (from memory; both ratios agree with
    // the definition's formula worked by hand to two decimals).
    expect(contrastOf([0x76, 0x76, 0x76], [255, 255, 255])).toBeCloseTo(4.54, 2);
    expect(contrastOf([0x77, 0x77, 0x77], [255, 255, 255])).toBeLessThan(4.5);
  });

  const textPairs: [string, string][] = [
    ['bw-ink', 'bw-paper'],
    ['bw-ink', 'bw-panel'],
    ['bw-ink-muted', 'bw-panel'],
    ['bw-ink-muted', 'bw-paper'],
    ['bw-action', 'bw-panel'],
    ['bw-action-ink', 'bw-action'],
    ['bw-ink', 'bw-action-soft'],
    ['bw-sharp', 'bw-panel'],
    ['bw-flat', 'bw-panel'],
    ['bw-in-tune', 'bw-panel'],
    ['bw-caution-ink', 'bw-caution-ground'],
    ['bw-problem-ink', 'bw-problem-ground'],
    ['bw-ink-muted', 'bw-line-soft'],
  ];
  for (const [ink, ground] of textPairs) {
    it(`${ink} on ${ground} reaches 4.5 : 1`, () => {
      expect(contrast(ink, ground)).toBeGreaterThanOrEqual(4.5);
    });
  }

  it('the focus ring and field borders stand out 3 : 1 from the panel', () => {
    expect(contrast('bw-focus', 'bw-panel')).toBeGreaterThanOrEqual(3);
    expect(contrast('bw-ink-muted', 'bw-panel')).toBeGreaterThanOrEqual(3);
  });
});
