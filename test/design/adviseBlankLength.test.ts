import { describe, expect, it } from 'vitest';
import { analyzeBar } from '../../src/modes/analyzeBar.ts';
import type { BarFile } from '../../src/fileFormats/barFile.ts';
import { adviseBlankLength, type BlankSpec } from '../../src/design/adviseBlankLength.ts';
import { designBar } from '../../src/design/designBar.ts';

const spec: BlankSpec = { section: { shape: 'rect', width_mm: 55, thickness_mm: 22 }, material: { preset: 'demo-tropical-hardwood' } };
const bar = (length_mm: number): BarFile => ({ length_mm, section: spec.section, material: spec.material });
const target = { note: 'C4', a4: 442, ratios: '1:4:10' } as const;

describe('adviseBlankLength', () => {
  const advice = adviseBlankLength(spec, { target });
  it('finds a range of lengths under the length at which the uncut blank sounds the note', () => {
    expect(advice.feasible).toBe(true);
    expect(advice.shortest_mm!).toBeLessThan(advice.recommended_mm!);
    expect(advice.recommended_mm!).toBeLessThan(advice.longest_mm!);
    expect(advice.longest_mm!).toBeLessThan(advice.uncut_length_mm);
    // The uncut blank at uncut_length_mm sounds the target fundamental (0.1 mm rounding ≈ 0.8 cent).
    const uncut = analyzeBar(bar(advice.uncut_length_mm), { modes: 1 }).bending[0]!.hz;
    expect(Math.abs(1200 * Math.log2(uncut / advice.target_hz[0]!))).toBeLessThan(1);
  });
  it('is right: the designer meets the targets at the recommended and end lengths, and not well outside', () => {
    for (const length of [advice.shortest_mm!, advice.recommended_mm!, advice.longest_mm!]) expect(designBar(bar(length), { target }).feasible).toBe(true);
    // The comfortable range sits inside what the plain limits allow (the margins raise the minimum
    // thickness by a twelfth of the blank), so "well outside" means 10 % longer or 25 % shorter.
    expect(designBar(bar(Math.round(advice.longest_mm! * 1.1)), { target, remedies: false }).feasible).toBe(false);
    expect(designBar(bar(Math.round(advice.shortest_mm! * 0.75)), { target, remedies: false }).feasible).toBe(false);
  });
  it('lists the lengths it tried', () => {
    expect(advice.samples.length).toBeGreaterThan(4);
    expect(advice.samples.some((s) => s.comfortable)).toBe(true);
    expect(advice.samples.some((s) => !s.comfortable)).toBe(true);
  });
  it('says when no length works, and why', () => {
    const none = adviseBlankLength({ section: { shape: 'rect', width_mm: 40, thickness_mm: 19 }, material: { preset: 'demo-tropical-hardwood' } }, { target: { note: 'C7', a4: 442, ratios: '1:4:10' } });
    expect(none.feasible).toBe(false);
    expect(none.shortest_mm).toBeUndefined();
    expect(none.reason).toMatch(/no length from [\d.]+ to [\d.]+ mm reaches the targets/);
  });
  it('rejects sections that cannot be undercut and bad margins', () => {
    expect(() => adviseBlankLength({ section: { shape: 'round', diameter_mm: 20 }, material: spec.material }, { target })).toThrow('blank: section.shape: only rect bars are undercut');
    expect(() => adviseBlankLength(spec, { target, comfort: { slope_factor: 2 } })).toThrow('blank: comfort:');
  });
});
