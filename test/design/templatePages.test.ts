// The paper plan of a 1:1 template: sheet sizes, orientation, tiles that cover the bar with the
// stated overlap and no more pages than needed, and the station table's pages.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { templatePages, templatePapers, templateSheet, templateTileHeight, type TemplatePaper } from '../../src/design/index.ts';
import { InputError } from '../../src/fileFormats/InputError.ts';

const papers: TemplatePaper[] = ['a4', 'letter'];

describe('template pages: sheets', () => {
  it('uses the standard sheet sizes', () => {
    // ISO 216: A4 is 210 × 297 mm. ANSI/ASME Y14.1: US Letter is 8.5 × 11 in = 215.9 × 279.4 mm.
    expect(templatePapers.a4).toMatchObject({ width_mm: 210, height_mm: 297 });
    expect(templatePapers.letter.width_mm).toBeCloseTo(8.5 * 25.4, 9);
    expect(templatePapers.letter.height_mm).toBeCloseTo(11 * 25.4, 9);
  });

  it('prints a short bar on one portrait sheet and a bar longer than the portrait width across a landscape one', () => {
    // A4 portrait leaves 210 − 2·10 (margins) − 2·6 (edges) = 178 mm of bar; landscape 297 − 32 = 265 mm.
    const short = templatePages({ length_mm: 170, depth_mm: 18, paper: 'a4' });
    expect(short).toMatchObject({ orientation: 'portrait', sheet_width_mm: 210, sheet_height_mm: 297, span_mm: 178, pages: 1, overlap_mm: 0 });
    expect(short.tiles).toEqual([{ page: 1, from_mm: 0, to_mm: 170 }]);
    const longer = templatePages({ length_mm: 262, depth_mm: 19, paper: 'a4' });
    expect(longer).toMatchObject({ orientation: 'landscape', sheet_width_mm: 297, sheet_height_mm: 210, span_mm: 265, pages: 1 });
    // Exactly at the portrait span it still fits portrait; a tenth over goes landscape.
    expect(templatePages({ length_mm: 178, depth_mm: 20, paper: 'a4' }).orientation).toBe('portrait');
    expect(templatePages({ length_mm: 178.1, depth_mm: 20, paper: 'a4' }).orientation).toBe('landscape');
    // Letter is wider and shorter: 215.9 − 32 = 183.9 mm across portrait, 279.4 − 32 = 247.4 mm across landscape.
    expect(templatePages({ length_mm: 180, depth_mm: 20, paper: 'letter' }).orientation).toBe('portrait');
    expect(templatePages({ length_mm: 250, depth_mm: 20, paper: 'letter' }).tiles).toHaveLength(2);
  });

  it('tiles a long bar: the 554.1 mm A2 bar needs three A4 landscape tiles, 245 mm apart', () => {
    // span 265, overlap 20: starts at 0, 245, 490; n = ⌈(554.1 − 20) / 245⌉ = ⌈2.18⌉ = 3.
    const layout = templatePages({ length_mm: 554.1, depth_mm: 24, paper: 'a4' });
    expect(layout.orientation).toBe('landscape');
    expect(layout.overlap_mm).toBe(20);
    expect(layout.tiles.map((tile) => [tile.from_mm, tile.to_mm])).toEqual([
      [0, 265],
      [245, 510],
      [490, 554.1],
    ]);
    expect(layout.pages).toBe(3);
    // On Letter: span 247.4, step 227.4: ⌈534.1 / 227.4⌉ = ⌈2.35⌉ = 3.
    expect(templatePages({ length_mm: 554.1, depth_mm: 24, paper: 'letter' }).tiles).toHaveLength(3);
  });

  it('for any length: tiles cover the bar end to end, each within the span, neighbours sharing exactly the overlap, and one tile fewer would not do', () => {
    fc.assert(
      fc.property(fc.double({ min: 20, max: 3000, noNaN: true }), fc.constantFrom(...papers), (length, paper) => {
        const layout = templatePages({ length_mm: length, depth_mm: 20, paper });
        const { tiles, span_mm: span } = layout;
        expect(tiles[0]!.from_mm).toBe(0);
        expect(tiles.at(-1)!.to_mm).toBe(length);
        for (const tile of tiles) {
          expect(tile.to_mm - tile.from_mm).toBeLessThanOrEqual(span + 1e-9);
          expect(tile.to_mm).toBeGreaterThan(tile.from_mm);
        }
        for (let index = 1; index < tiles.length; index++) expect(tiles[index - 1]!.to_mm - tiles[index]!.from_mm).toBeCloseTo(templateSheet.overlap_mm, 9);
        // Minimal: n − 1 tiles stepping span − overlap reach only (n − 2)·step + span < length.
        if (tiles.length > 1) expect((tiles.length - 2) * (span - templateSheet.overlap_mm) + span).toBeLessThan(length);
        // The sheet is the paper, turned or not; printable area inside the margins.
        const size = templatePapers[paper];
        expect([layout.sheet_width_mm, layout.sheet_height_mm].sort((a, b) => a - b)).toEqual([size.width_mm, size.height_mm].sort((a, b) => a - b));
        expect(layout.printable_width_mm).toBeCloseTo(layout.sheet_width_mm - 2 * templateSheet.margin_mm, 9);
        expect(layout.pages).toBe(tiles.length);
      }),
    );
  });
});

describe('template pages: the station table', () => {
  it('sits under the drawing when every row fits there, else starts a page of its own', () => {
    // A4 portrait: printable 277 mm; a 20 mm piece's tile is 26 + 20 + 44 = 90 mm; under it
    // 277 − 90 − 6 (gap) − 16 (heading) = 165 mm, 27 rows of 6 mm (162 mm) fit, 28 (168 mm) do not.
    expect(templateTileHeight(20)).toBe(90);
    const fits = templatePages({ length_mm: 170, depth_mm: 20, paper: 'a4', table_rows: 27 });
    expect(fits).toMatchObject({ table_under_drawing: true, table_rows: [27], pages: 1 });
    const over = templatePages({ length_mm: 170, depth_mm: 20, paper: 'a4', table_rows: 28 });
    expect(over).toMatchObject({ table_under_drawing: false, table_rows: [28], pages: 2 });
    // A full portrait page holds ⌊(277 − 12 (scale bar) − 16) / 6⌋ = 41 rows: 100 rows take 41 + 41 + 18.
    expect(templatePages({ length_mm: 170, depth_mm: 20, paper: 'a4', table_rows: 100 }).table_rows).toEqual([41, 41, 18]);
  });

  it('for any row count: every row on exactly one page, no page over its room', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 400 }), fc.double({ min: 50, max: 1500, noNaN: true }), fc.constantFrom(...papers), (rows, length, paper) => {
        const layout = templatePages({ length_mm: length, depth_mm: 22, paper, table_rows: rows });
        expect(layout.table_rows.reduce((sum, count) => sum + count, 0)).toBe(rows);
        const full = Math.floor((layout.printable_height_mm - templateSheet.table_scale_mm - templateSheet.table_heading_mm) / templateSheet.table_row_mm);
        for (const count of layout.table_rows) expect(count).toBeGreaterThan(0);
        for (const count of layout.table_rows) expect(count).toBeLessThanOrEqual(full);
        if (layout.table_under_drawing) expect(layout.tile_height_mm + templateSheet.gap_mm + templateSheet.table_heading_mm + rows * templateSheet.table_row_mm).toBeLessThanOrEqual(layout.printable_height_mm + 1e-9);
        expect(layout.pages).toBe(layout.tiles.length + layout.table_rows.length - (layout.table_under_drawing ? 1 : 0));
      }),
    );
  });

  it('refuses what cannot be printed, naming the field', () => {
    expect(() => templatePages({ length_mm: 0, depth_mm: 20, paper: 'a4' })).toThrow(InputError);
    expect(() => templatePages({ length_mm: Number.NaN, depth_mm: 20, paper: 'a4' })).toThrow(/length_mm/);
    expect(() => templatePages({ length_mm: 300, depth_mm: -1, paper: 'a4' })).toThrow(/depth_mm/);
    expect(() => templatePages({ length_mm: 300, depth_mm: 20, paper: 'a3' as TemplatePaper })).toThrow(/paper: must be one of a4, letter/);
    expect(() => templatePages({ length_mm: 300, depth_mm: 20, paper: 'a4', table_rows: 2.5 })).toThrow(/table_rows/);
    // Landscape A4 holds 190 mm: a piece deeper than 190 − 70 = 120 mm does not fit at 1:1.
    expect(() => templatePages({ length_mm: 300, depth_mm: 121, paper: 'a4' })).toThrow(/at most 120 mm/);
  });
});
