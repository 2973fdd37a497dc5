import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyzeBar } from '../../src/modes/analyzeBar.ts';
import { parseBarFile, type BarFile } from '../../src/fileFormats/barFile.ts';
import { profileTemplateSvg } from '../../src/design/profileTemplateSvg.ts';
import { stationTable, stationTableCsv } from '../../src/design/stationTable.ts';
import { whereToCutMap } from '../../src/design/whereToCutMap.ts';

const practice = parseBarFile(JSON.parse(readFileSync('fixtures/f4-practice.bar.json', 'utf8')), 'f4-practice');

describe('station table', () => {
  const rows = stationTable(practice);
  it('has a row every 5 mm out from the centre, and both ends', () => {
    expect(rows[0]).toEqual({ from_left_mm: 0, from_centre_mm: -190, thickness_mm: 22, depth_mm: 0 });
    expect(rows[rows.length - 1]).toEqual({ from_left_mm: 380, from_centre_mm: 190, thickness_mm: 22, depth_mm: 0 });
    const centre = rows.find((r) => r.from_centre_mm === 0)!;
    // The practice bar's profile is 8 mm at 190 mm (its middle station).
    expect(centre).toEqual({ from_left_mm: 190, from_centre_mm: 0, thickness_mm: 8, depth_mm: 14 });
    for (let i = 1; i + 1 < rows.length; i++) expect(rows[i + 1]!.from_left_mm - rows[i]!.from_left_mm).toBeCloseTo(5, 9);
  });
  it('interpolates the profile linearly between stations', () => {
    // Between (140, 11) and (190, 8): at 165 mm, 9.5 mm.
    expect(rows.find((r) => r.from_left_mm === 165)!.thickness_mm).toBe(9.5);
    // Between (80, 22) and (140, 11): at 110 mm, 16.5 mm.
    expect(rows.find((r) => r.from_left_mm === 110)!.thickness_mm).toBe(16.5);
  });
  it('writes CSV with a header', () => {
    const csv = stationTableCsv(rows);
    expect(csv.split('\n')[0]).toBe('from_left_mm,from_centre_mm,thickness_mm,depth_mm');
    expect(csv).toContain('\n190,0,8,14\n');
  });
  it('puts the centre on a row even when the length is not a multiple of 5 mm', () => {
    const odd: BarFile = { ...practice, length_mm: 347, profile_mm: [[0, 22], [347, 22]] };
    const table = stationTable(odd);
    expect(table.some((r) => r.from_left_mm === 173.5 && r.from_centre_mm === 0)).toBe(true);
    expect(table[0]!.from_left_mm).toBe(0);
    expect(table[table.length - 1]!.from_left_mm).toBe(347);
  });
});

describe('1:1 SVG template', () => {
  const svg = profileTemplateSvg({ ...practice, label: 'F4 practice & test' }, { cord_holes_mm: [80.5, 299.5] });
  it('is sized in millimetres with a matching millimetre viewBox', () => {
    const match = /<svg [^>]*width="([\d.]+)mm" height="([\d.]+)mm" viewBox="0 0 ([\d.]+) ([\d.]+)"/.exec(svg)!;
    expect(match).not.toBeNull();
    expect(Number(match[1])).toBe(Number(match[3]));
    expect(Number(match[2])).toBe(Number(match[4]));
    // Bar length plus 10 mm margins.
    expect(Number(match[1])).toBe(400);
  });
  it('draws the profile point for point at 1:1, the scale bar, holes and cautions', () => {
    const path = /<path d="([^"]+)"/.exec(svg)![1]!;
    const points = [...path.matchAll(/[ML] ([\d.]+) ([\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])]);
    // Top edge at y = 28 (10 mm margin + 18 mm title), x offset 10 mm.
    expect(points.slice(0, 2)).toEqual([[10, 28], [390, 28]]);
    const underside = points.slice(2).reverse();
    expect(underside).toEqual(practice.profile_mm!.map(([x, t]) => [10 + x, 28 + t]));
    expect(svg).toContain('100 mm — measure this on the print');
    expect(svg).toContain('cord hole 80.5');
    expect(svg).toContain('F4 practice &amp; test');
    expect(svg).toMatch(/Estimate only: cut less than shown/);
    expect(svg.trim().endsWith('</svg>')).toBe(true);
    expect(svg).not.toMatch(/NaN|Infinity/);
  });
});

describe('where-to-cut map', () => {
  const map = whereToCutMap(practice);
  it('covers the bar every 2.5 mm for the first three partials', () => {
    expect(map.positions_mm[0]).toBe(0);
    expect(map.positions_mm[map.positions_mm.length - 1]).toBe(380);
    expect(map.partials.map((p) => p.partial)).toEqual([1, 2, 3]);
    for (const partial of map.partials) expect(partial.cents).toHaveLength(map.positions_mm.length);
  });
  it('flattens the fundamental where it bends and sharpens it near the ends (brief §2)', () => {
    const at = (x: number, partial: number): number => map.partials[partial]!.cents[map.positions_mm.indexOf(x)]!;
    expect(at(190, 0)).toBeLessThan(0);
    expect(at(5, 0)).toBeGreaterThan(0);
    // The second partial's bending moment vanishes at the centre (antisymmetric mode): a cut there barely moves it.
    expect(Math.abs(at(190, 1))).toBeLessThan(0.1 * Math.abs(at(190, 0)));
  });
  it('agrees with actually removing a little over the strip and re-solving (first order)', () => {
    const base = analyzeBar(practice, { modes: 3, elements: 400 });
    for (const x of [60, 120, 190, 260]) {
      const a = x - 5;
      const b = x + 5;
      const step = 0.001;
      const original = (p: number): number => {
        const pairs = practice.profile_mm!;
        let k = 0;
        while (k + 2 < pairs.length && pairs[k + 1]![0] <= p) k++;
        const [x0, t0] = pairs[k]!;
        const [x1, t1] = pairs[k + 1]!;
        return t0 + ((p - x0) / (x1 - x0)) * (t1 - t0);
      };
      const stations = [...practice.profile_mm!.map(([p]) => p), a - step, a, b, b + step].sort((u, v) => u - v);
      const cut: BarFile = { ...practice, profile_mm: stations.map((p) => [p, original(p) - (p >= a && p <= b ? 0.01 : 0)]) };
      const after = analyzeBar(cut, { modes: 3, elements: 400 });
      for (let k = 0; k < 3; k++) {
        // A 0.01 mm cut re-solved, scaled to the map's 0.1 mm: the second-order part (about 2–3 %
        // at 0.1 mm on the 8 mm middle, measured) shrinks tenfold; the 1 µm ramps at the strip
        // ends and the map's 0.001-cent rounding add less. Tolerance 0.6 % + 0.002 cent.
        const actual = 10 * 1200 * Math.log2(after.bending[k]!.hz / base.bending[k]!.hz);
        const predicted = map.partials[k]!.cents[map.positions_mm.indexOf(x)]!;
        expect(Math.abs(predicted - actual)).toBeLessThan(0.006 * Math.abs(actual) + 0.002);
      }
    }
  });
  it('rejects bad options', () => {
    expect(() => whereToCutMap(practice, { partials: 9 })).toThrow('map: partials: must be a whole number from 1 to 6 (got 9)');
    expect(() => whereToCutMap(practice, { depth_mm: 0 })).toThrow('map: depth_mm:');
  });
});
