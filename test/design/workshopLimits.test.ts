// The workshop description: its file format, and the limits its tools set, each saying which
// tool or rule sets it; explicit limits override.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { defaultWorkshop, parseWorkshop, parseWorkshopFile, type Workshop } from '../../src/fileFormats/workshopFile.ts';
import { kindSteepestWall, resolveDesignLimits, workshopRules } from '../../src/design/workshopLimits.ts';

const demo = JSON.parse(readFileSync('fixtures/demo.workshop.json', 'utf8'));
const blank = { length: 0.3, thickness: 0.02 };

describe('workshop file', () => {
  it('reads the demo workshop and barwright’s default (which its own parser accepts)', () => {
    const file = parseWorkshopFile(demo, 'demo.workshop.json');
    expect(file.name).toBe('Demo workshop');
    expect(file.tools.map((t) => t.kind)).toEqual(['band-saw', 'spindle', 'drum', 'router-template']);
    expect(parseWorkshop(JSON.parse(JSON.stringify(defaultWorkshop)))).toEqual(defaultWorkshop);
  });
  it.each([
    [{ ...demo, format: 'other' }, 'w.json: format: must be "barwright.workshop" (got "other")'],
    [{ ...demo, tools: [] }, 'w.json: tools: must list the tools'],
    [{ ...demo, tools: [{ kind: 'laser' }] }, 'w.json: tools[0].kind: must be one of band-saw, drum, spindle, router-template, grinding-wheel (got "laser")'],
    [{ ...demo, tools: [{ kind: 'drum' }] }, 'w.json: tools[0].radius_mm: must be a number'],
    [{ ...demo, tools: [{ kind: 'drum', radius_mm: -4 }] }, 'w.json: tools[0].radius_mm: must be more than 0 and at most 500 mm (got -4)'],
    [{ ...demo, tools: [{ kind: 'band-saw', blade_width_mm: 6 }] }, 'w.json: tools: needs a tool that finishes the underside'],
    [{ ...demo, tools: [{ kind: 'spindle', radius_mm: 10, blade_width_mm: 6 }] }, 'w.json: tools[0].blade_width_mm: is not a spindle field'],
    [{ ...demo, cord_holes: { diameter_mm: 30, clearance_mm: 3 } }, 'w.json: cord_holes.diameter_mm: must be from 0 to 20 mm (got 30)'],
    [{ ...demo, saw: true }, 'w.json: saw: is not a workshop field'],
  ])('refuses %j with one line naming the field and the rule', (value, message) => {
    expect(() => parseWorkshopFile(value, 'w.json')).toThrow(message);
  });
  it('names the section when it is part of another file', () => {
    expect(() => parseWorkshop({ tools: [{ kind: 'drum', radius_mm: 0 }], cord_holes: { diameter_mm: 6, clearance_mm: 3 } }, 'k.json', 'workshop.')).toThrow('k.json: workshop.tools[0].radius_mm: must be more than 0');
  });
});

describe('limits from the tools', () => {
  const shop: Workshop = {
    name: 'test shop',
    tools: [
      { kind: 'band-saw', blade_width_mm: 3 },
      { kind: 'drum', radius_mm: 25, label: 'big drum' },
      { kind: 'spindle', radius_mm: 9.5, label: 'small sleeve' },
      { kind: 'grinding-wheel', radius_mm: 75 },
    ],
    cord_holes: { diameter_mm: 6, clearance_mm: 3 },
  };
  it('the smallest finishing tool sets the concave radius (the band saw only roughs out)', () => {
    const rules = workshopRules(shop);
    expect(rules.minToolRadius).toBeCloseTo(0.0095, 12);
    expect(rules.minToolRadiusSource).toBe('the small sleeve (9.5 mm radius)');
  });
  it('the tool that finishes the steepest wall sets the slope: each kind’s own figure unless the file gives one', () => {
    expect(workshopRules(shop).maxSlope).toBe(kindSteepestWall.spindle);
    expect(workshopRules(shop).maxSlopeSource).toBe(`the small sleeve (walls up to ${kindSteepestWall.spindle})`);
    const withRouter = workshopRules({ ...shop, tools: [...shop.tools, { kind: 'router-template', radius_mm: 12, steepest_wall: 2.5, label: 'template router' }] });
    expect(withRouter.maxSlope).toBe(2.5);
    expect(withRouter.maxSlopeSource).toBe('the template router (walls up to 2.5)');
  });
  it('the thinnest point is a quarter of the blank unless the shop says otherwise (common practice)', () => {
    expect(workshopRules(shop).minThicknessFraction).toBe(0.25);
    expect(workshopRules({ ...shop, min_thickness_fraction: 0.3 }).minThicknessSource).toBe("the workshop's rule: 0.3 of the blank");
  });
  it('uncut ends: as far as the cord holes need, or the shop’s fraction, or 0.18 of the length without holes', () => {
    const rules = workshopRules(shop);
    const fromHoles = resolveDesignLimits(rules, undefined, blank, { left: 0.07, right: 0.069 });
    expect(fromHoles.limits.uncutLeft).toBeCloseTo(0.07, 12);
    expect(fromHoles.limits.uncutRight).toBeCloseTo(0.069, 12);
    expect(fromHoles.sources.uncut_end_mm).toBe('the 6 mm cord holes at the nodes, kept 3 mm clear of the arch');
    const byRule = resolveDesignLimits(workshopRules({ ...shop, uncut_end_fraction: 0.3 }), undefined, blank, { left: 0.07, right: 0.07 });
    expect(byRule.limits.uncutLeft).toBeCloseTo(0.09, 12);
    expect(byRule.sources.uncut_end_mm).toBe("the workshop's rule: 0.3 of the length");
    expect(resolveDesignLimits(rules, undefined, blank, undefined).limits.uncutLeft).toBeCloseTo(0.054, 12);
  });
  it('explicit limits override and say so; an explicit uncut end still keeps the arch clear of the holes', () => {
    const given = resolveDesignLimits(workshopRules(shop), { max_slope: 0.7, min_tool_radius_mm: 20, uncut_end_mm: 40 }, blank, { left: 0.066, right: 0.066 }, 'limits', 'given on the command line');
    expect(given.limits.maxSlope).toBe(0.7);
    expect(given.limits.minToolRadius).toBeCloseTo(0.02, 12);
    expect(given.limits.uncutLeft).toBeCloseTo(0.066, 12);
    expect(given.sources).toMatchObject({ max_slope: 'given on the command line', tool_radius_mm: 'given on the command line', uncut_end_mm: 'given on the command line, and clear of the cord holes' });
    expect(given.sources.min_thickness_mm).toMatch(/0\.25 of the blank/);
  });
  it('bad explicit limits fail as they always did', () => {
    expect(() => resolveDesignLimits(workshopRules(shop), { max_slope: -1 }, blank, undefined, 'design')).toThrow('design: max_slope: must be greater than 0 and at most 10');
  });
});
