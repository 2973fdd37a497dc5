// Paper that prints right, in real Chromium: a bar's template printed to PDF (page.pdf with the
// page's own CSS page size) on A4 and on US Letter. A short bar takes one portrait sheet; a long
// one is tiled on landscape sheets with alignment marks, as many as the paper plan
// (templatePages) says, the station table after it. Each PDF page is measured: its size, and the
// 100 mm scale bar drawn on it, read back from the PDF's own drawing (test/browser/pdfPages.ts).
// Thickness figures under the bar must not run into each other, and the paper chosen is
// remembered through a reload.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { cutInstructions, parseBarFile, parseProjectFile, templatePages, templatePapers, type BarFile, type TemplatePaper } from '../../src/index.ts';
import { artifactPath, useWorkbench } from './harness.ts';
import { readPdfPages, scaleBarLengthsMm } from './pdfPages.ts';

const workbench = useWorkbench();
const problems = workbench.problems;

/** CSS px per mm at the CSS reference of 96 px per inch. */
const pxPerMm = 96 / 25.4;
/** Tolerance on a printed length: half a millimetre, what a maker can see on a steel rule. */
const ruleToleranceMm = 0.5;

const demo = parseProjectFile(JSON.parse(readFileSync('fixtures/demo.project.json', 'utf8')), 'demo.project.json');
const demoBar = (id: string) => demo.bars.find((bar) => bar.id === id)!;

async function openTemplate(page: Page, barId: string): Promise<void> {
  await page.goto(`${workbench.url}#/template/${barId}`);
  await page.locator('[data-testid="save-status"]').filter({ hasText: '✓' }).waitFor({ timeout: 60_000 });
  await page.locator('bw-bar-template [data-testid="template-tile"]').first().waitFor();
  // The cord holes come from the worker's analysis of the shape printed.
  await expect.poll(() => page.locator('[data-testid="template-tile"]').first().textContent(), { timeout: 60_000 }).toMatch(/Cord hole at \d+\.\d mm/);
}

async function choosePaper(page: Page, paper: TemplatePaper): Promise<void> {
  await page.getByLabel('Paper').selectOption(paper);
  await expect.poll(() => page.locator('bw-bar-template').first().getAttribute('paper')).toBe(paper);
}

async function printPdf(page: Page) {
  await page.emulateMedia({ media: 'print' });
  const pdf = await page.pdf({ preferCSSPageSize: true, printBackground: true });
  return readPdfPages(pdf);
}

/** Overlapping pairs among the thickness figures of each tile (their boxes on screen, in mm), and the smallest type size, mm. */
async function figureReport(page: Page) {
  return page.locator('[data-testid="template-tile"]').evaluateAll((tiles, perMm) => {
    const overlaps: string[] = [];
    let smallest = Infinity;
    for (const tile of tiles) {
      const figures = [...tile.querySelectorAll('[data-testid="thickness-figure"]')].map((figure) => ({ box: figure.getBoundingClientRect(), text: figure.textContent ?? '', size: Number(figure.getAttribute('font-size')) }));
      for (const figure of figures) smallest = Math.min(smallest, figure.size);
      for (let i = 0; i < figures.length; i++)
        for (let j = i + 1; j < figures.length; j++) {
          const a = figures[i]!.box;
          const b = figures[j]!.box;
          if (a.left < b.right && b.left < a.right && a.top < b.bottom && b.top < a.bottom) overlaps.push(`${figures[i]!.text}/${figures[j]!.text} at ${(a.left / perMm).toFixed(1)} mm`);
        }
    }
    return { overlaps, smallest, count: tiles.reduce((sum, tile) => sum + tile.querySelectorAll('[data-testid="thickness-figure"]').length, 0) };
  }, pxPerMm);
}

describe('paper that prints right', () => {
  for (const paper of ['a4', 'letter'] as const) {
    it(`${paper}: a short bar prints on one portrait sheet, its 100 mm scale bar 100 mm long in the PDF`, async () => {
      const { context, page } = await workbench.freshPage();
      const bar = demoBar('bar-C7');
      await openTemplate(page, bar.id);
      await choosePaper(page, paper);
      const layout = templatePages({ length_mm: bar.current.length_mm, depth_mm: 18, paper });
      expect(layout).toMatchObject({ orientation: 'portrait', pages: 1 });
      expect(await page.locator('[data-testid="template-summary"]').innerText()).toMatch(new RegExp(`^1 portrait sheet of ${templatePapers[paper].label} `));
      // On screen under print media: the scale bar's outline is 100 mm plus its 0.3 mm stroke, at 96 px per 25.4 mm.
      const pages = await printPdf(page);
      const outline = (await page.locator('[data-testid="scale-bar"] rect').first().boundingBox())!;
      expect(Math.abs(outline.width / pxPerMm - 100.3)).toBeLessThan(ruleToleranceMm);
      await page.screenshot({ path: artifactPath(`print-short-${paper}.png`), fullPage: true });
      // The PDF: one page, the paper's portrait size, one scale bar measuring 100 mm.
      expect(pages).toHaveLength(1);
      const size = templatePapers[paper];
      expect(Math.abs(pages[0]!.widthMm - size.width_mm)).toBeLessThan(ruleToleranceMm);
      expect(Math.abs(pages[0]!.heightMm - size.height_mm)).toBeLessThan(ruleToleranceMm);
      const bars = scaleBarLengthsMm(pages[0]!);
      expect(bars).toHaveLength(1);
      expect(Math.abs(bars[0]! - 100)).toBeLessThan(ruleToleranceMm);
      console.log(`short bar on ${paper}: ${pages.length} page, ${pages[0]!.widthMm.toFixed(2)} × ${pages[0]!.heightMm.toFixed(2)} mm, scale bar ${bars[0]!.toFixed(3)} mm`);
      await context.close();
    }, 120_000);

    it(`${paper}: a long bar is tiled on landscape sheets with alignment marks and the station table after it, every sheet with a 100 mm scale bar`, async () => {
      const { context, page } = await workbench.freshPage();
      const bar = demoBar('bar-A2');
      await openTemplate(page, bar.id);
      await choosePaper(page, paper);
      // What the paper plan says for this bar: its length, blank thickness, and one table row per station where wood came off the blank.
      const rows = cutInstructions(bar.blank, bar.current).stations.length;
      const layout = templatePages({ length_mm: bar.current.length_mm, depth_mm: 24, paper, table_rows: rows });
      expect(layout.orientation).toBe('landscape');
      expect(layout.tiles.length).toBeGreaterThan(1);
      const tiles = page.locator('[data-testid="template-tile"]');
      expect(await tiles.count()).toBe(layout.tiles.length);
      // Page k of n on each tile; a join line with two ⊕ marks at each side of every join; the overlap stated.
      for (let index = 0; index < layout.tiles.length; index++) expect(await tiles.nth(index).textContent()).toContain(`page ${index + 1} of ${layout.pages}`);
      expect(await page.locator('[data-testid="join-mark"]').count()).toBe(2 * (layout.tiles.length - 1));
      expect(await page.locator('[data-testid="trim-strip"]').count()).toBe(layout.tiles.length - 1);
      expect(await tiles.first().textContent()).toContain(`sheets overlap ${layout.overlap_mm} mm`);
      expect(await page.locator('bw-station-table[printed] tbody tr').count()).toBe(rows);
      // Figures legible at 1:1: type at least 3 mm (about 8.5 pt) and no two figures overlapping.
      const figures = await figureReport(page);
      expect(figures.count).toBeGreaterThan(10);
      expect(figures.smallest).toBeGreaterThanOrEqual(3);
      expect(figures.overlaps).toEqual([]);

      const pages = await printPdf(page);
      await page.screenshot({ path: artifactPath(`print-long-${paper}.png`), fullPage: true });
      expect(pages).toHaveLength(layout.pages);
      const size = templatePapers[paper];
      const lengths: number[] = [];
      for (const [index, printed] of pages.entries()) {
        expect(Math.abs(printed.widthMm - size.height_mm), `page ${index + 1} width`).toBeLessThan(ruleToleranceMm);
        expect(Math.abs(printed.heightMm - size.width_mm), `page ${index + 1} height`).toBeLessThan(ruleToleranceMm);
        const bars = scaleBarLengthsMm(printed);
        expect(bars, `page ${index + 1}`).toHaveLength(1);
        expect(Math.abs(bars[0]! - 100), `page ${index + 1}`).toBeLessThan(ruleToleranceMm);
        lengths.push(bars[0]!);
      }
      console.log(`long bar on ${paper}: ${pages.length} pages (${layout.tiles.length} tiles, table on ${layout.table_rows.length}), ${pages[0]!.widthMm.toFixed(2)} × ${pages[0]!.heightMm.toFixed(2)} mm, scale bars ${lengths.map((length) => length.toFixed(3)).join(', ')} mm`);
      await context.close();
    }, 120_000);
  }

  it('the station table goes under a short bar\'s drawing when it fits (one page), else onto pages of its own, as the paper plan says', async () => {
    const { context, page } = await workbench.freshPage();
    await openTemplate(page, 'bar-C7');
    // The element on its own: the C7 blank (175 × 40 × 19 mm) with an invented arch, 19 mm at the
    // ends and 13 mm in the middle (test data for the layout, not a tuned shape), stations every
    // `step` mm: every 10 mm gives 12 rows where wood comes off (under the drawing), every 2.5 mm 47 (41 + 6 on two pages of their own).
    const blank = parseBarFile(JSON.parse(readFileSync('fixtures/c7-blank.bar.json', 'utf8')), 'c7-blank.bar.json');
    for (const step of [10, 2.5]) {
      const profile: [number, number][] = [];
      const arch = (position: number) => 19 - 6 * Math.max(0, 1 - ((position - 87.5) / 60) ** 2);
      for (let position = 0; position < blank.length_mm - 1e-9; position += step) profile.push([position, arch(position)]);
      profile.push([blank.length_mm, arch(blank.length_mm)]);
      const arched: BarFile = { ...blank, profile_mm: profile };
      const table = cutInstructions(blank, arched);
      const layout = templatePages({ length_mm: blank.length_mm, depth_mm: 19, paper: 'a4', table_rows: table.stations.length });
      expect(layout.table_under_drawing).toBe(step === 10);
      await page.evaluate(
        ({ bar, cut }) => {
          document.querySelector('bw-app')?.remove();
          document.querySelector('bw-bar-template[data-test]')?.remove();
          const element = document.createElement('bw-bar-template');
          element.dataset.test = 'alone';
          Object.assign(element, { bar, table: cut, nodesMm: [39.4, 135.6], heading: 'C7 · test arch', tableHeading: 'C7: stations', paper: 'a4', final: true });
          document.body.append(element);
        },
        { bar: arched, cut: table },
      );
      await expect.poll(() => page.locator('bw-bar-template[data-test] bw-station-table tbody tr').count()).toBe(table.stations.length);
      const pages = await printPdf(page);
      await page.screenshot({ path: artifactPath(`print-table-every-${step}mm.png`), fullPage: true });
      await page.emulateMedia({ media: 'screen' });
      expect(pages, `stations every ${step} mm: ${table.stations.length} rows`).toHaveLength(layout.pages);
      for (const [index, printed] of pages.entries()) expect(scaleBarLengthsMm(printed).map((length) => Math.round(length)), `page ${index + 1}`).toEqual([100]);
      console.log(`stations every ${step} mm: ${table.stations.length} rows, ${pages.length} page(s), table rows per page ${layout.table_rows.join(', ')}${layout.table_under_drawing ? ' (under the drawing)' : ''}`);
    }
    await context.close();
  }, 120_000);

  it('remembers the paper chosen through a reload', async () => {
    const { context, page } = await workbench.freshPage();
    await openTemplate(page, 'bar-C4');
    expect(await page.getByLabel('Paper').inputValue()).toBe('a4');
    await choosePaper(page, 'letter');
    await page.reload();
    await page.locator('bw-bar-template [data-testid="template-tile"]').first().waitFor({ timeout: 60_000 });
    expect(await page.getByLabel('Paper').inputValue()).toBe('letter');
    expect(await page.locator('[data-testid="template-summary"]').innerText()).toMatch(/of US Letter at true scale/);
    await context.close();
  }, 120_000);

  it('showed no page or console errors in any of the above', () => {
    expect(problems).toEqual([]);
  });
});
