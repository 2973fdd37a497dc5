// When a target cannot be met: the JSON lists remedies (contract: kind, value, cents_gained),
// cheapest to the maker first, and each one, applied to the bar and request exactly as its kind
// says and designed again, meets the target.
import { describe, expect, it } from 'vitest';
import type { BarFile } from '../../src/fileFormats/barFile.ts';
import { applyRemedy, shortfallCents } from '../../src/design/designRemedies.ts';
import { designBar, type DesignRequest } from '../../src/design/designBar.ts';

/** An invented xylophone-type G4 blank in the demo hardwood, in a shop whose only finishing tool is a large drum held to shallow walls. */
const bar: BarFile = { length_mm: 300, section: { shape: 'rect', width_mm: 40, thickness_mm: 20 }, material: { preset: 'demo-tropical-hardwood' } };
const request: DesignRequest = {
  target: { note: 'G4', a4: 442, ratios: '1:3' },
  workshop: { name: 'drum only', tools: [{ kind: 'drum', radius_mm: 40, steepest_wall: 0.4, label: '80 mm drum' }], cord_holes: { diameter_mm: 6, clearance_mm: 3 } },
};

describe('remedies of an infeasible design', () => {
  it('lists remedies, cheapest first, each of which meets the target when designed again', () => {
    const result = designBar(bar, request);
    expect(result.feasible).toBe(false);
    const remedies = result.remedies!;
    expect(remedies.length).toBeGreaterThanOrEqual(3);
    // The contract's fields, JSON-clean.
    const json = JSON.parse(JSON.stringify(result));
    for (const remedy of json.remedies) {
      expect(['tool_radius_mm', 'max_slope', 'uncut_end_mm', 'blank_length_mm', 'blank_thickness_mm', 'ratios']).toContain(remedy.kind);
      expect(remedy.cents_gained).toBeCloseTo(shortfallCents(result), 1);
    }
    // Cheapest first: limits before the blank, the blank before the ratios.
    const order = ['tool_radius_mm', 'max_slope', 'uncut_end_mm', 'blank_length_mm', 'blank_thickness_mm', 'ratios'];
    const ranks = remedies.map((r) => (r.kind === 'blank_length_mm' || r.kind === 'blank_thickness_mm' ? 3.5 : order.indexOf(r.kind)));
    expect(ranks).toEqual([...ranks].sort((a, b) => a - b));
    expect(remedies[remedies.length - 1]!.kind).toBe('ratios');
    // The story names the closest shape once, the binding limits with the tool that sets them, then the remedies.
    expect(result.reason).toMatch(/^closest shape: the 2nd partial \+[\d.]+ cents \(±5\)/);
    expect(result.reason).toMatch(/set by the 80 mm drum/);
    expect(result.reason).toMatch(/Remedies, cheapest first: walls as steep as [\d.]+/);
    for (const remedy of remedies) {
      const changed = applyRemedy(bar, request, remedy);
      const again = designBar(changed.bar, { ...changed.request, remedies: false });
      expect(again.feasible, `${remedy.kind} = ${JSON.stringify(remedy.value)}`).toBe(true);
      again.cents_error.forEach((c, k) => expect(Math.abs(c)).toBeLessThanOrEqual(again.tolerance_cents[k]!));
    }
    // What relaxing each buys: cents per unit, from designs actually made.
    for (const relaxation of result.relaxations!) expect(relaxation.cents_per_unit).toBeCloseTo(relaxation.cents_gained / Math.abs(relaxation.to - relaxation.from), 2);
  }, 900_000);
});
