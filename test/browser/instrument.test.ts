// The whole instrument in the workbench, in real Chromium: a small keyboard range planned on the
// worker pool through the UI with progress, cancelled mid-way and resumed without redoing the
// bars already planned, kept through reloads, its cut list downloaded and parsed; the print view
// in the single bar's template style on A4, tiled where a bar is longer than a sheet, its PDF
// pages and scale bars measured; the chime set page checked against the library's
// chimeForNote run here in Node for the same stock and note.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { chimeForNote, keyboardCutListColumns, noteToHz, templatePages } from '../../src/index.ts';
import { artifactPath, auditControls as auditPageControls, parseCsv, useWorkbench } from './harness.ts';
import { readPdfPages, scaleBarLengthsMm } from './pdfPages.ts';

const workbench = useWorkbench();
const problems = workbench.problems;

/** CSS px per mm at the CSS reference of 96 px per inch. */
const pxPerMm = 96 / 25.4;

const freshPage = (viewport = { width: 1280, height: 900 }) => workbench.freshPage(viewport);

async function openView(page: Page, hash: string): Promise<void> {
  await page.goto(`${workbench.url}#/${hash}`);
  await page.locator('[data-testid="save-status"]').filter({ hasText: '✓' }).waitFor({ timeout: 30_000 });
}

/** The touch-target audit here also covers disclosure summaries (the plan's engineering detail). */
const auditControls = (page: Page) => auditPageControls(page, ['summary']);

/** The range planned in the test: 12 bars over two of the demo project's blank sections (C4 52 × 21, A4 46 × 20). */
const planNotes = ['C4', 'C#4', 'D4', 'D#4', 'E4', 'F4', 'F#4', 'G4', 'G#4', 'A4', 'A#4', 'B4'];

describe('the whole instrument in the workbench', () => {
  it('plans a keyboard range on workers with progress, cancels, resumes, keeps it through a reload, and gives the cut list and the print view', async () => {
    const { context, page } = await freshPage();
    await openView(page, 'keyboard');
    const from = page.getByLabel('From note');
    const to = page.getByLabel('To note');
    // A note outside the instrument is refused beside its field, with the rule, and nothing runs.
    await from.fill('C9');
    await to.fill('B4');
    await page.locator('[data-testid="plan-start"]').click();
    await expect.poll(() => page.locator('bw-keyboard-plan .field-error').innerText()).toMatch(/From: C9 lies outside the instrument's range A2–C7/);
    expect(await page.locator('[data-testid="plan-progress"]').count()).toBe(0);

    await from.fill('C4');
    await page.locator('[data-testid="plan-start"]').click();
    const line = page.locator('[data-testid="plan-progress"] .progress-line');
    await line.filter({ hasText: /Step 1 of 2: choosing blank lengths — \d+ of \d+ done, last [A-G]/ }).waitFor({ timeout: 60_000 });
    await page.screenshot({ path: artifactPath('plan-progress-laptop.png'), fullPage: false });
    // Cancel as soon as the first bars are designed (step 2 under way). A bar takes a fraction of a
    // second, so the page itself watches the progress line and presses Cancel (a click from here
    // could come after the last bar).
    const seenAtCancel = await page.evaluate(
      () =>
        new Promise<string>((resolve, reject) => {
          const started = performance.now();
          const find = (root: Document | ShadowRoot, selector: string): Element | null => {
            const direct = root.querySelector(selector);
            if (direct) return direct;
            for (const element of root.querySelectorAll('*')) {
              const inner = element.shadowRoot ? find(element.shadowRoot, selector) : null;
              if (inner) return inner;
            }
            return null;
          };
          const tick = () => {
            const text = find(document, '[data-testid="plan-progress"] .progress-line')?.textContent ?? '';
            if (/Step 2 of 2: planning each undercut — [1-9]\d* of 12 done/.test(text)) {
              const button = [...(find(document, '[data-testid="plan-progress"]')?.querySelectorAll('button') ?? [])].find((b) => b.textContent?.trim() === 'Cancel');
              button?.click();
              resolve(text);
            } else if (performance.now() - started > 90_000) reject(new Error(`no design progress seen (last: ${text})`));
            else setTimeout(tick, 5);
          };
          tick();
        }),
    );
    expect(seenAtCancel).toMatch(/of 12 done/);
    const message = page.locator('[data-testid="plan-message"]');
    await message.filter({ hasText: /Stopped: \d+ of 12 bars planned/ }).waitFor({ timeout: 60_000 });
    const stoppedAt = Number(/Stopped: (\d+) of 12/.exec(await message.innerText())![1]);
    expect(stoppedAt).toBeGreaterThanOrEqual(1);
    expect(stoppedAt).toBeLessThan(12);
    await expect.poll(() => page.locator('[data-testid="plan-table"] tbody tr').count()).toBe(12);
    expect(await page.locator('[data-testid="plan-table"] [data-status]').count()).toBe(stoppedAt);
    expect(await page.getByRole('button', { name: 'Resume plan' }).count()).toBe(1);

    // Reload: the partial plan was stored in the project and is still there.
    await page.locator('[data-testid="save-status"]').filter({ hasText: '✓' }).waitFor();
    await page.reload();
    await page.locator('[data-testid="save-status"]').filter({ hasText: '✓' }).waitFor();
    await expect.poll(() => page.locator('[data-testid="plan-summary"]').innerText()).toMatch(new RegExp(`C4–B4[\\s\\S]*${stoppedAt} of 12 bars planned`));

    // Resume: the bars planned before are kept (the design step starts at their count), the rest is done.
    await page.getByRole('button', { name: 'Resume plan' }).click();
    await expect.poll(() => page.locator('[data-testid="plan-kept"]').innerText(), { timeout: 60_000 }).toMatch(new RegExp(`^${stoppedAt} bars? kept from the plan stored before`));
    await message.filter({ hasText: /Planned 12 bars/ }).waitFor({ timeout: 90_000 });
    await page.locator('[data-testid="save-status"]').filter({ hasText: '✓' }).waitFor();
    await page.reload();
    await page.locator('[data-testid="save-status"]').filter({ hasText: '✓' }).waitFor();
    await expect.poll(() => page.locator('[data-testid="plan-summary"]').innerText()).toMatch(/C4–B4[\s\S]*12 of 12 bars planned/);
    const statuses = await page.locator('[data-testid="plan-table"] [data-status]').evaluateAll((nodes) => nodes.map((n) => n.getAttribute('data-status')));
    expect(statuses).toHaveLength(12);
    for (const status of statuses) expect(['in-tolerance', 'out-of-tolerance', 'infeasible']).toContain(status);
    // The project's own bars in the range show their planned status in the bar list.
    await expect.poll(() => page.locator('[data-testid="bar-list"] tr[data-bar="bar-C4"] [data-plan-status]').getAttribute('data-plan-status')).toBe(statuses[0]);
    expect(await auditControls(page)).toEqual({ unlabelled: [], small: [] });
    const bodyText = await page.locator('bw-keyboard-view').innerText();
    expect(bodyText).not.toMatch(/NaN|Infinity/);
    // Let the bar list's own predictions finish, so the screenshot shows the page as the maker sees it.
    await expect.poll(() => page.locator('bw-keyboard-view').innerText(), { timeout: 60_000 }).not.toMatch(/Predicting \d+ of/);
    await page.screenshot({ path: artifactPath('plan-done-laptop.png'), fullPage: true });
    await page.setViewportSize({ width: 820, height: 1180 });
    await page.screenshot({ path: artifactPath('plan-done-tablet.png'), fullPage: true });
    await page.setViewportSize({ width: 1280, height: 900 });

    // The cut list: RFC 4180 CSV, one row per planned bar, agreeing with the table on screen.
    const [download] = await Promise.all([page.waitForEvent('download'), page.locator('[data-testid="cut-list-download"]').click()]);
    const csvPath = artifactPath('plan-cut-list.csv');
    await download.saveAs(csvPath);
    expect(download.suggestedFilename()).toMatch(/cut-list\.csv$/);
    const rows = parseCsv(readFileSync(csvPath, 'utf8'));
    expect(rows[0]).toEqual([...keyboardCutListColumns]);
    const body = rows.slice(1);
    expect(body.map((r) => r[0])).toEqual(planNotes);
    const column = (name: (typeof keyboardCutListColumns)[number]) => keyboardCutListColumns.indexOf(name);
    expect(body.map((r) => r[column('status')])).toEqual(statuses);
    // C4 and A4 are bars of the demo project whose blanks are already cut (328.3 and 300 mm): kept.
    expect(Number(body[0]![column('blank_length_mm')])).toBeCloseTo(328.3, 1);
    expect(Number(body[9]![column('blank_length_mm')])).toBeCloseTo(300, 1);
    // Sections from the project's bars: C4–G#4 take C4's 52 × 21 mm, A4–B4 take A4's 46 × 20 mm.
    expect(body.map((r) => `${r[column('blank_width_mm')]}x${r[column('blank_thickness_mm')]}`)).toEqual([...Array(9).fill('52.0x21.0'), ...Array(3).fill('46.0x20.0')]);
    for (const row of body) {
      const length = Number(row[column('blank_length_mm')]);
      const holes = [Number(row[column('cord_hole_1_mm')]), Number(row[column('cord_hole_2_mm')])];
      // Cord holes at mode 1's nodes: inside the bar, near 22 % and 78 % of it (Blevins 1979, table 8-1, moved by the arch).
      expect(holes[0]! / length).toBeGreaterThan(0.15);
      expect(holes[0]! / length).toBeLessThan(0.3);
      expect(holes[1]! / length).toBeGreaterThan(0.7);
      expect(holes[1]! / length).toBeLessThan(0.85);
      expect(row.join(',')).not.toMatch(/NaN|Infinity/);
    }
    // On screen, the first row shows the same blank as the CSV.
    expect(await page.locator('[data-testid="plan-table"] tr[data-note="C4"]').innerText()).toMatch(/328 × 52 × 21/);

    // The print view: every planned bar in the single bar's template style (bw-bar-template), on A4
    // as chosen by default, each bar starting a new sheet, tiled where the paper plan says.
    await page.getByRole('button', { name: 'Templates of the plan (1:1)…' }).click();
    const sheets = page.locator('[data-testid="print-sheet"]');
    await expect.poll(() => sheets.count()).toBe(12);
    const layouts = [];
    for (let i = 0; i < 12; i++) {
      const sheet = sheets.nth(i);
      expect(await sheet.evaluate((element) => element.tagName.toLowerCase())).toBe('bw-bar-template');
      expect(await sheet.getAttribute('data-note')).toBe(planNotes[i]);
      const blank = Number(await sheet.getAttribute('data-blank-length-mm'));
      expect(blank).toBeCloseTo(Number(body[i]![column('blank_length_mm')]), 1);
      const drawn = await sheet.evaluate((element) => {
        const template = element as HTMLElement & { bar: { length_mm: number; section: { thickness_mm: number } } };
        return { length: template.bar.length_mm, depth: template.bar.section.thickness_mm };
      });
      const layout = templatePages({ length_mm: drawn.length, depth_mm: drawn.depth, paper: 'a4' });
      layouts.push(layout);
      const tiles = sheet.locator('[data-testid="template-tile"]');
      expect(await tiles.count()).toBe(layout.tiles.length);
      const tile = await tiles.first().evaluate((svg) => ({ width: svg.getAttribute('width'), viewBoxWidth: Number(svg.getAttribute('viewBox')!.split(/\s+/)[2]), px: svg.getBoundingClientRect().width, outline: Number(svg.querySelector('rect[stroke-dasharray]')?.getAttribute('width')) }));
      // One user unit is one mm: the tile is the printable width, drawn at 96 px per 25.4 mm; the blank's outline is the planned bar's length.
      expect(tile.width).toBe(`${layout.printable_width_mm}mm`);
      expect(tile.viewBoxWidth).toBeCloseTo(layout.printable_width_mm, 6);
      expect(tile.px).toBeCloseTo(layout.printable_width_mm * pxPerMm, 0);
      expect(tile.outline).toBeCloseTo(drawn.length, 3);
      // The same figures as a single bar's template: thickness at the stations, cord holes at the planned nodes.
      expect(await sheet.locator('[data-testid="thickness-figure"]').count()).toBeGreaterThan(5);
      expect(await tiles.allTextContents()).toEqual(expect.arrayContaining([expect.stringMatching(/Cord hole at \d+\.\d mm/)]));
    }
    expect(await auditControls(page)).toEqual({ unlabelled: [], small: [] });
    await page.screenshot({ path: artifactPath('plan-print-screen.png'), fullPage: false });
    // Printed: the pages the paper plan counts, each an A4 sheet turned as its bar needs, each with a 100 mm scale bar.
    const printed = readPdfPages(await page.pdf({ preferCSSPageSize: true, printBackground: true }));
    const expected = layouts.flatMap((layout) => layout.tiles.map(() => layout.orientation));
    expect(printed).toHaveLength(expected.length);
    for (const [index, sheetPrinted] of printed.entries()) {
      const [across, down] = expected[index] === 'portrait' ? [210, 297] : [297, 210];
      expect(Math.abs(sheetPrinted.widthMm - across), `page ${index + 1}`).toBeLessThan(0.5);
      expect(Math.abs(sheetPrinted.heightMm - down), `page ${index + 1}`).toBeLessThan(0.5);
      const scaleBars = scaleBarLengthsMm(sheetPrinted);
      expect(scaleBars, `page ${index + 1}`).toHaveLength(1);
      expect(Math.abs(scaleBars[0]! - 100), `page ${index + 1}`).toBeLessThan(0.5);
    }
    await page.emulateMedia({ media: 'print' });
    await page.screenshot({ path: artifactPath('plan-print-media.png'), fullPage: true });
    await page.emulateMedia({ media: 'screen' });
    // The print view at tablet and laptop size: nothing scrolls sideways (the sheets scroll inside themselves).
    for (const [size, viewport] of [
      ['tablet', { width: 768, height: 1024 }],
      ['laptop', { width: 1280, height: 800 }],
    ] as const) {
      await page.setViewportSize(viewport);
      await page.waitForTimeout(300);
      const widths = await page.evaluate(() => ({ scroll: document.scrollingElement!.scrollWidth, client: document.scrollingElement!.clientWidth }));
      expect(widths.scroll, `plan print at ${size}`).toBeLessThanOrEqual(widths.client);
      await page.screenshot({ path: artifactPath(`view-plan-print-planned-${size}.png`), fullPage: false });
    }
    await page.emulateMedia({ media: 'screen' });
    await context.close();
  }, 240_000);

  it('computes a chime set that agrees with chimeForNote, refuses bad notes by name, and gives its cut list', async () => {
    const { context, page } = await freshPage();
    await openView(page, 'chimes');
    const notes = page.getByLabel(/^Notes/);
    await notes.fill('C5 E5 G5');
    await notes.press('Enter');
    const rows = page.locator('[data-testid="chime-table"] tbody tr');
    await expect.poll(() => rows.count(), { timeout: 30_000 }).toBe(3);
    const shownE5 = Number(await page.locator('[data-testid="chime-table"] tr[data-note="E5"] [data-testid="chime-length"]').innerText());
    // Source of truth: the library's chimeForNote (Timoshenko, Cowper's κ), run here in Node for the
    // same stock (25.4 × 1.6 mm aluminium 6061-T6 tube, open top) and note (E5 at A4 = 442 Hz).
    const stock = { section: { shape: 'tube' as const, outer_diameter_mm: 25.4, wall_mm: 1.6 }, material: { preset: 'aluminium-6061-t6' }, end_masses: [] };
    const expected = chimeForNote(stock, noteToHz('E5', 442), { tune: 'fundamental' }).length_mm;
    // Shown to 0.1 mm: within half a display step.
    expect(Math.abs(shownE5 - expected)).toBeLessThanOrEqual(0.05 + 1e-9);
    expect(await page.locator('[data-testid="chime-table"]').innerText()).not.toMatch(/NaN|Infinity/);

    // Strike-note tuning makes a tube of the same note far longer (the strike note lies near half mode 4).
    await page.getByLabel('Tuned on').selectOption('strike');
    await expect.poll(async () => Number(await page.locator('[data-testid="chime-table"] tr[data-note="E5"] [data-testid="chime-length"]').innerText()), { timeout: 30_000 }).toBeGreaterThan(shownE5 * 1.5);
    const strikeExpected = chimeForNote(stock, noteToHz('E5', 442), { tune: 'strike' }).length_mm;
    expect(Math.abs(Number(await page.locator('[data-testid="chime-table"] tr[data-note="E5"] [data-testid="chime-length"]').innerText()) - strikeExpected)).toBeLessThanOrEqual(0.05 + 1e-9);
    await page.getByLabel('Tuned on').selectOption('fundamental');
    await expect.poll(async () => Number(await page.locator('[data-testid="chime-table"] tr[data-note="E5"] [data-testid="chime-length"]').innerText()), { timeout: 30_000 }).toBeCloseTo(shownE5, 1);

    // A bad note is refused beside the field with the rule; the last good set stays shown.
    await notes.fill('C5 H5 G5');
    await notes.press('Enter');
    await expect.poll(() => page.locator('[data-testid="notes-error"]').innerText(), { timeout: 30_000 }).toMatch(/Notes: .*note name/i);
    await expect.poll(() => page.locator('section[data-stale]').getAttribute('data-stale')).toBe('true');
    await page.screenshot({ path: artifactPath('chimes-bad-note.png'), fullPage: false });
    await notes.fill('C5 D5 E5 G5 A5 C6');
    await notes.press('Enter');
    await expect.poll(() => rows.count(), { timeout: 30_000 }).toBe(6);
    await expect.poll(() => page.locator('[data-testid="notes-error"]').count()).toBe(0);

    // The cut list CSV carries the same lengths.
    const [download] = await Promise.all([page.waitForEvent('download'), page.locator('[data-testid="chime-download"]').click()]);
    const csvPath = artifactPath('chime-cut-list.csv');
    await download.saveAs(csvPath);
    const csv = parseCsv(readFileSync(csvPath, 'utf8'));
    const header = csv[0]!;
    const e5 = csv.find((row) => row[0] === 'E5')!;
    expect(csv).toHaveLength(7);
    expect(Math.abs(Number(e5[header.indexOf('length_mm')]) - expected)).toBeLessThanOrEqual(0.05 + 1e-9);
    expect(await auditControls(page)).toEqual({ unlabelled: [], small: [] });
    await page.screenshot({ path: artifactPath('chimes-laptop.png'), fullPage: true });
    // Printable: the form hides, the cut list and the cautions stay.
    await page.emulateMedia({ media: 'print' });
    expect(await page.getByLabel(/^Notes/).isVisible()).toBe(false);
    expect(await page.locator('[data-testid="chime-table"]').isVisible()).toBe(true);
    expect(await page.getByRole('note', { name: 'Workshop cautions' }).isVisible()).toBe(true);
    await page.screenshot({ path: artifactPath('chimes-print-media.png'), fullPage: true });
    await page.emulateMedia({ media: 'screen' });
    await page.setViewportSize({ width: 820, height: 1180 });
    await page.screenshot({ path: artifactPath('chimes-tablet.png'), fullPage: true });
    await context.close();
  }, 120_000);

  it('plans a bar on the 3D model when asked, in the workers, and says so', async () => {
    const { context, page } = await freshPage();
    await openView(page, 'keyboard');
    // D4 has no bar set up: the plan chooses its blank, then designs it on the 3D model.
    await page.getByLabel('From note').fill('D4');
    await page.getByLabel('To note').fill('D4');
    await page.locator('[data-testid="plan-solid"]').check();
    await page.locator('[data-testid="plan-start"]').click();
    const summary = page.locator('[data-testid="plan-summary"]');
    await expect.poll(async () => ((await summary.count()) ? (await summary.innerText()).replace(/\s+/g, ' ') : ''), { timeout: 240_000, interval: 2_000 }).toMatch(/1 of 1 bars planned — 1 in tolerance, .* Designed and checked on the 3D model/);
    await context.close();
  }, 300_000);

  it('raised no page or console errors', () => {
    expect(problems).toEqual([]);
  });
});
