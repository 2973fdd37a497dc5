// The whole instrument in the workbench, in real Chromium: a small keyboard range planned on the
// worker pool through the UI with progress, cancelled mid-way and resumed without redoing the
// bars already planned, kept through reloads, its cut list downloaded and parsed; the print view
// with one page per planned bar at true scale; the chime set page checked against the library's
// chimeForNote run here in Node for the same stock and note.
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import type { ViteDevServer } from 'vite';
import { chimeForNote, keyboardCutListColumns, noteToHz } from '../../src/index.ts';
import { artifactPath, auditControls as auditPageControls, freshPage as openFreshPage, launchBrowser, parseCsv, startWorkbench } from './harness.ts';

let server: ViteDevServer;
let baseUrl: string;
let browser: Browser;
const problems: string[] = [];

/** CSS px per mm at the CSS reference of 96 px per inch. */
const pxPerMm = 96 / 25.4;
/** PDF points per mm (72 per inch). */
const ptPerMm = 72 / 25.4;

beforeAll(async () => {
  ({ server, url: baseUrl } = await startWorkbench());
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

const freshPage = (viewport = { width: 1280, height: 900 }) => openFreshPage(browser, problems, viewport);

async function openView(page: Page, hash: string): Promise<void> {
  await page.goto(`${baseUrl}#/${hash}`);
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

    // The print view: one sheet per planned bar, each SVG at true scale in mm.
    await page.getByRole('button', { name: 'Templates of the plan (1:1)…' }).click();
    const sheets = page.locator('[data-testid="print-sheet"]');
    await expect.poll(() => sheets.count()).toBe(12);
    for (let i = 0; i < 12; i++) {
      const sheet = sheets.nth(i);
      const blank = Number(await sheet.getAttribute('data-blank-length-mm'));
      expect(blank).toBeCloseTo(Number(body[i]![column('blank_length_mm')]), 1);
      const svgInfo = await sheet.locator('svg').evaluate((svg) => {
        const box = svg.getAttribute('viewBox')!.split(/\s+/).map(Number);
        const outline = svg.querySelector('rect[stroke-dasharray]');
        return { width: svg.getAttribute('width'), viewBoxWidth: box[2]!, outlineWidth: Number(outline?.getAttribute('width')), px: svg.getBoundingClientRect().width };
      });
      const widthMm = Number(/^([\d.]+)mm$/.exec(svgInfo.width!)![1]);
      // One user unit is one mm, the blank's outline is the blank's length, and the page draws it at 96 px per 25.4 mm.
      expect(widthMm).toBeCloseTo(svgInfo.viewBoxWidth, 3);
      expect(svgInfo.outlineWidth).toBeCloseTo(blank, 3);
      expect(widthMm).toBeGreaterThan(blank);
      expect(widthMm).toBeLessThan(blank + 60);
      expect(svgInfo.px).toBeCloseTo(widthMm * pxPerMm, 0);
      expect(await sheet.innerText()).toContain(planNotes[i]!);
    }
    expect(await auditControls(page)).toEqual({ unlabelled: [], small: [] });
    await page.screenshot({ path: artifactPath('plan-print-screen.png'), fullPage: false });
    // Printed: exactly one page per bar, each page as wide as its template plus the margins.
    const pdf = (await page.pdf({ preferCSSPageSize: true, printBackground: true })).toString('latin1');
    const pages = [...pdf.matchAll(/\/Type\s*\/Page[^s]/g)].length;
    expect(pages).toBe(12);
    const widthsPt = [...pdf.matchAll(/\/MediaBox\s*\[\s*0\s+0\s+([\d.]+)\s+([\d.]+)\s*\]/g)].map((m) => Number(m[1]));
    expect(widthsPt).toHaveLength(12);
    // The widest page holds the widest template (not always the lowest note's: a plan may lengthen a blank it chose).
    const svgWidthsMm = await sheets.locator('svg').evaluateAll((svgs) => svgs.map((svg) => Number(/^([\d.]+)mm$/.exec(svg.getAttribute('width') ?? '')?.[1])));
    expect(Math.max(...widthsPt) / ptPerMm).toBeCloseTo(Math.max(...svgWidthsMm) + 16, 0);
    await page.emulateMedia({ media: 'print' });
    await page.screenshot({ path: artifactPath('plan-print-media.png'), fullPage: true });
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
