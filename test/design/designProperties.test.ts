import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyzeBar } from '../../src/modes/analyzeBar.ts';
import { barModelFromFile } from '../../src/modes/BarModel.ts';
import type { BarFile } from '../../src/fileFormats/barFile.ts';
import { checkProfile, resolveCutLimits, type CutLimitsInput } from '../../src/design/cutLimits.ts';
import { designBar } from '../../src/design/designBar.ts';

const blankArbitrary = fc.record({
  length: fc.double({ min: 180, max: 600, noNaN: true }),
  width: fc.double({ min: 35, max: 65, noNaN: true }),
  slenderness: fc.double({ min: 9, max: 26, noNaN: true }),
  E: fc.double({ min: 10, max: 22, noNaN: true }),
  shearRatio: fc.double({ min: 9, max: 20, noNaN: true }),
  density: fc.double({ min: 700, max: 1100, noNaN: true }),
  rough: fc.option(fc.record({ depth: fc.double({ min: 0.05, max: 0.35, noNaN: true }), shift: fc.double({ min: -0.08, max: 0.08, noNaN: true }) }), { nil: undefined }),
});
const requestArbitrary = fc.record({
  drop: fc.double({ min: 1.05, max: 3.6, noNaN: true }),
  ratios: fc.constantFrom('1:4:10', '1:4', '1:3', '1:3:6', 'fundamental'),
  minFraction: fc.double({ min: 0.2, max: 0.45, noNaN: true }),
  uncutFraction: fc.double({ min: 0.08, max: 0.3, noNaN: true }),
  maxSlope: fc.double({ min: 0.2, max: 1.5, noNaN: true }),
  radius: fc.double({ min: 0, max: 40, noNaN: true }),
  shortening: fc.boolean(),
});

describe('designBar on random blanks (property)', () => {
  it('every returned profile respects every limit; feasible means within tolerance; otherwise a reason', () => {
    fc.assert(
      fc.property(blankArbitrary, requestArbitrary, (b, r) => {
        const thickness = Math.round((b.length / b.slenderness) * 10) / 10;
        const bar: BarFile = {
          length_mm: Math.round(b.length),
          section: { shape: 'rect', width_mm: Math.round(b.width), thickness_mm: thickness },
          material: { E_GPa: b.E, G_GPa: b.E / b.shearRatio, density_kg_m3: b.density },
        };
        if (b.rough) {
          const c = bar.length_mm / 2 + b.rough.shift * bar.length_mm;
          const t = thickness;
          bar.profile_mm = [
            [0, t],
            [c - 0.25 * bar.length_mm, t],
            [c - 0.1 * bar.length_mm, t * (1 - 0.6 * b.rough.depth)],
            [c, t * (1 - b.rough.depth)],
            [c + 0.12 * bar.length_mm, t * (1 - 0.5 * b.rough.depth)],
            [c + 0.27 * bar.length_mm, t],
            [bar.length_mm, t],
          ];
        }
        const uncutHz = analyzeBar(bar, { modes: 1 }).bending[0]!.hz;
        const limits: CutLimitsInput = {
          min_thickness_mm: r.minFraction * thickness,
          uncut_end_mm: r.uncutFraction * bar.length_mm,
          max_slope: r.maxSlope,
          min_tool_radius_mm: r.radius,
          ...(r.shortening ? { allow_shortening: true, max_shortening_mm: 0.1 * bar.length_mm } : {}),
        };
        const result = designBar(bar, { target: { hz: uncutHz / r.drop, ratios: r.ratios }, limits, max_solves: 120, remedies: false });
        const original = barModelFromFile(bar);
        // The limits given hold (the uncut ends at least as given: they grow to clear the cord holes).
        expect(result.limits.max_slope).toBe(limits.max_slope);
        // Limits come back in mm to 1e-6 (cutLimitsToInput).
        expect(result.limits.min_tool_radius_mm).toBeCloseTo(limits.min_tool_radius_mm!, 6);
        expect(result.limits.min_thickness_mm).toBeCloseTo(limits.min_thickness_mm!, 6);
        expect(Math.min(result.limits.uncut_left_mm, result.limits.uncut_right_mm)).toBeGreaterThanOrEqual(limits.uncut_end_mm! - 1e-6);
        const resolved = resolveCutLimits(result.limits, { length: original.length, thickness: thickness * 1e-3 });
        const designed = barModelFromFile({ ...result.bar, holes: undefined });
        expect(checkProfile(designed.profile, original.profile, resolved, { trimLeft: (result.shortened_mm * 1e-3) / 2 })).toEqual([]);
        expect(JSON.stringify(result)).not.toMatch(/NaN|Infinity|null/);
        if (result.feasible) result.cents_error.forEach((c, k) => expect(Math.abs(c)).toBeLessThanOrEqual(result.tolerance_cents[k]!));
        else expect(result.reason).toMatch(/^closest shape: .+$/);
      }),
      { numRuns: 14, seed: 4242 },
    );
  });
});
