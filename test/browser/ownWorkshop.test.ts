// The workbench as a maker's own tool, in real Chromium: a new empty project with three bars added,
// renamed and one removed (undo, reload); the project renamed, copied and deleted (undo, restore
// after a reload); an import that never silently doubles a name; resonators with an impractical
// tube warned, a frame limit, absurd values refused at the field with their range, and the tube
// list as CSV and on paper; labels that name one thing each, no timber notes on metal and no cord
// holes on tubes. The layout test (tablet 768 × 1024 and laptop 1280 × 800: a one-line header at
// tablet size, no sideways scroll on any view, every table fitting or scrolling inside itself)
// saves a screenshot of each view at both sizes into test/artifacts/ (keyboard, its plan panel,
// shape, tuning, listening, resonators, template, chimes, workshop, the plan's templates, project menu).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { closedTubeResonator, noteToHz } from '../../src/index.ts';
import { artifactPath, auditControls, parseCsv, useWorkbench } from './harness.ts';

const workbench = useWorkbench();
const problems = workbench.problems;

const laptop = { width: 1280, height: 800 };
const tablet = { width: 768, height: 1024 };
const freshPage = (viewport = laptop) => workbench.freshPage(viewport);

/** Opens a view and waits for the app to have a project open and saved. */
async function openView(page: Page, hash: string): Promise<void> {
  await page.goto(`${workbench.url}#/${hash}`);
  await saved(page);
}

async function saved(page: Page): Promise<void> {
  await page.locator('[data-testid="save-status"]').filter({ hasText: '✓' }).waitFor({ timeout: 60_000 });
}

/** Opens the project menu (a disclosure in the header). */
async function openMenu(page: Page): Promise<void> {
  const menu = page.locator('bw-project-menu details');
  if (!(await menu.evaluate((element) => (element as HTMLDetailsElement).open))) await page.locator('[data-testid="project-menu"]').click();
}

/**
 * The visible text of an element and everything inside it, nested shadow roots included (innerText
 * stops at a shadow host): text nodes whose parent element is rendered, joined by spaces.
 */
async function visibleText(page: Page, selector: string): Promise<string> {
  return page.locator(selector).first().evaluate((root) => {
    const parts: string[] = [];
    const walk = (node: Node) => {
      if (node.nodeType === Node.TEXT_NODE) {
        const parent = node.parentElement;
        if (parent && parent.checkVisibility() && !['STYLE', 'SCRIPT', 'OPTION'].includes(parent.tagName)) parts.push(node.textContent ?? '');
        return;
      }
      if (node instanceof Element) {
        if (node.tagName === 'SELECT') {
          parts.push((node as HTMLSelectElement).selectedOptions[0]?.textContent ?? '');
          return;
        }
        if (node.shadowRoot) node.shadowRoot.childNodes.forEach(walk);
      }
      node.childNodes.forEach(walk);
    };
    walk(root);
    return parts.join(' ').replace(/\s+/g, ' ');
  });
}

const rows = (page: Page) => page.locator('[data-testid="bar-list"] tbody tr');
const projectOptions = (page: Page) => page.locator('bw-project-menu #project option');

describe('own projects', () => {
  it('a new empty project gets three bars, added, renamed and one removed; kept through a reload', async () => {
    const { context, page } = await freshPage();
    await openView(page, 'keyboard');
    await openMenu(page);
    await page.locator('[data-testid="new-project"]').click();
    await page.getByLabel('Name', { exact: true }).fill('Bench test keyboard');
    await page.getByLabel('Lowest note', { exact: true }).first().fill('C4');
    await page.getByLabel('Highest note', { exact: true }).first().fill('C6');
    await page.locator('[data-testid="create-project"]').click();
    await expect.poll(() => page.locator('bw-keyboard-view h2').first().innerText()).toBe('Bench test keyboard');
    await page.locator('[data-testid="no-bars"]').waitFor();
    await saved(page);

    // Three bars, one note at a time: Enter in the note field adds it.
    await page.locator('[data-testid="toggle-add"]').click();
    for (const note of ['C4', 'E4', 'G4']) {
      await page.getByLabel('Note', { exact: true }).fill(note);
      await expect.poll(() => page.locator('bw-bar-adder .preview').innerText()).toMatch(/^Blank /);
      await page.locator('[data-testid="add-bar"]').click();
      await expect.poll(() => page.locator('[data-testid="list-message"]').innerText()).toBe(`Added bar ${note}.`);
    }
    await expect.poll(() => rows(page).count()).toBe(3);
    // A note no bar can sound, and a note the register has, are refused at the field with the rule.
    await page.getByLabel('Note', { exact: true }).fill('C9');
    await expect.poll(() => page.locator('[data-testid="add-note-problem"]').innerText()).toMatch(/C9 is outside A0–C8/);
    expect(await page.locator('[data-testid="add-bar"]').isDisabled()).toBe(true);
    await page.getByLabel('Note', { exact: true }).fill('E4');
    await page.locator('[data-testid="add-bar"]').click();
    await expect.poll(() => page.locator('bw-bar-adder [role="alert"]').first().innerText()).toMatch(/already has a bar E4/);
    expect(await rows(page).count()).toBe(3);
    // Blanks: the first from the starting rule (330 mm at C4, 50 × 20), the next scaled from the
    // nearest bar by 2^(−n/24) (f ∝ 1/L² for one section): E4 = 330 · 2^(−4/24), G4 = E4 · 2^(−3/24).
    const e4Length = Math.round(330 * 2 ** (-4 / 24));
    const g4Length = Math.round(e4Length * 2 ** (-3 / 24));
    expect(await rows(page).nth(0).innerText()).toMatch(/330 × 50\s*× 20/);
    expect(await rows(page).nth(1).innerText()).toMatch(new RegExp(`${e4Length} × 50\\s*× 20`));
    expect(await rows(page).nth(2).innerText()).toMatch(new RegExp(`${g4Length} × 50\\s*× 20`));

    // Rename: E4 gets a name of its own, G4 becomes F#4 (its target follows).
    await page.locator('[data-testid="toggle-arrange"]').click();
    await page.locator('tr[data-bar="bar-E4"] [data-testid="rename-bar"]').click();
    await page.getByLabel('Name', { exact: true }).last().fill('E4 from the second board');
    await page.getByRole('button', { name: 'Save' }).click();
    await page.locator('tr[data-bar="bar-G4"] [data-testid="rename-bar"]').click();
    await page.locator('tr[data-bar="bar-G4"] input.note-input').fill('F#4');
    await page.locator('tr[data-bar="bar-G4"] input.note-input').press('Enter');
    await expect.poll(() => rows(page).nth(2).innerText()).toMatch(/^F#4/);
    expect(await rows(page).nth(1).innerText()).toMatch(/E4\s+E4 from the second board/);
    // Remove C4, undo, remove it again.
    await page.locator('tr[data-bar="bar-C4"] [data-testid="remove-bar"]').click();
    await expect.poll(() => rows(page).count()).toBe(2);
    await page.locator('[data-testid="undo-remove"]').click();
    await expect.poll(() => rows(page).count()).toBe(3);
    await page.locator('tr[data-bar="bar-C4"] [data-testid="remove-bar"]').click();
    await expect.poll(() => rows(page).count()).toBe(2);
    expect(await page.locator('[data-testid="list-message"]').innerText()).toMatch(/Removed C4/);
    // The range cannot shut out a bar.
    await page.locator('#range-lowest').fill('G4');
    await page.locator('#range-lowest').press('Enter');
    await page.locator('#range-lowest').blur();
    await expect.poll(() => page.locator('[data-testid="range-error"]').innerText()).toMatch(/E4, F#4 would lie outside G4–C6; remove those bars first/);
    await page.evaluate(() => window.scrollTo(0, 0));
    await page.screenshot({ path: artifactPath('own-project-three-bars.png'), fullPage: true });

    await saved(page);
    await page.reload();
    await saved(page);
    await expect.poll(() => rows(page).count()).toBe(2);
    expect(await rows(page).nth(0).innerText()).toMatch(/E4\s+E4 from the second board/);
    expect(await rows(page).nth(1).innerText()).toMatch(/^F#4/);
    // The Tuning view of the renamed bar aims at F#4: 442 · 2^(−3/12) Hz.
    await page.locator('tr[data-bar="bar-G4"]').getByRole('button', { name: 'Tuning of F#4' }).click();
    await expect.poll(() => visibleText(page, 'bw-tuning-view'), { timeout: 30_000 }).toContain(`Target F#4 · ${noteToHz('F#4', 442).toFixed(1)} Hz`);
    await context.close();
  }, 240_000);

  it('renames, copies and deletes a project (undo, and restore after a reload); an import never silently doubles a name', async () => {
    const { context, page } = await freshPage();
    await openView(page, 'keyboard');
    const demoName = await page.locator('bw-project-menu .name').innerText();
    await openMenu(page);
    await page.locator('[data-testid="new-project"]').click();
    await page.getByLabel('Name', { exact: true }).fill(demoName);
    await page.locator('[data-testid="create-project"]').click();
    await expect.poll(() => page.locator('[data-testid="new-project-error"]').innerText()).toMatch(/already the name of another project/);
    await page.getByLabel('Name', { exact: true }).fill('Chimes for the porch');
    await page.getByLabel('What it builds').selectOption('chimes');
    await page.locator('[data-testid="create-project"]').click();
    await expect.poll(() => projectOptions(page).count()).toBe(2);
    await saved(page);

    // Rename: refused when another project has the name, with the rule; else taken.
    await openMenu(page);
    const name = page.getByLabel('Name of this project');
    await name.fill(demoName.toUpperCase());
    await name.press('Enter');
    await expect.poll(() => page.locator('[data-testid="rename-error"]').innerText()).toMatch(/already the name of another project/);
    await name.fill('x'.repeat(201));
    await name.press('Enter');
    // The field holds at most 200 characters; what is typed beyond is not taken.
    expect((await name.inputValue()).length).toBe(200);
    await name.fill('Porch chimes');
    await name.press('Enter');
    await expect.poll(() => page.locator('bw-project-menu .name').innerText()).toBe('Porch chimes');

    // Copy, then delete the copy: undo at once brings it back.
    await page.locator('[data-testid="duplicate-project"]').click();
    await expect.poll(() => page.locator('bw-project-menu .name').innerText()).toBe('Porch chimes (copy)');
    await expect.poll(() => projectOptions(page).count()).toBe(3);
    await openMenu(page);
    await page.locator('[data-testid="delete-project"]').click();
    await expect.poll(() => page.locator('[data-testid="deleted-notice"]').innerText()).toMatch(/Deleted “Porch chimes \(copy\)”/);
    await expect.poll(() => projectOptions(page).count()).toBe(2);
    await page.locator('[data-testid="undo-delete"]').click();
    await expect.poll(() => projectOptions(page).count()).toBe(3);
    // Delete it again; after a reload it is still restorable from the menu.
    await openMenu(page);
    await page.locator('[data-testid="delete-project"]').click();
    await expect.poll(() => projectOptions(page).count()).toBe(2);
    await page.reload();
    await saved(page);
    await openMenu(page);
    await expect.poll(() => page.locator('[data-testid="binned"]').innerText()).toMatch(/Porch chimes \(copy\)/);
    await page.locator('[data-testid="binned"]').getByRole('button', { name: 'Restore' }).click();
    await expect.poll(() => projectOptions(page).count()).toBe(3);
    await saved(page);

    // Export "Porch chimes" and import it again: nothing happens until the maker chooses.
    await openMenu(page);
    await page.locator('#project').selectOption({ label: (await projectOptions(page).allInnerTexts()).find((text) => /^Porch chimes \(\d+ bars/.test(text))! });
    await expect.poll(() => page.locator('bw-project-menu .name').innerText()).toBe('Porch chimes');
    await saved(page);
    await openMenu(page);
    const [download] = await Promise.all([page.waitForEvent('download'), page.locator('[data-testid="export"]').click()]);
    const exported = artifactPath('porch-chimes.project.json');
    await download.saveAs(exported);
    await page.locator('#import-file').setInputFiles(exported);
    await expect.poll(() => page.locator('[data-testid="import-choice"]').innerText()).toMatch(/A project called “Porch chimes” is already stored/);
    expect(await projectOptions(page).count()).toBe(3);
    await page.getByRole('button', { name: 'Keep both: import it as “Porch chimes (2)”' }).click();
    await expect.poll(() => projectOptions(page).count()).toBe(4);
    await expect.poll(() => page.locator('bw-project-menu .name').innerText()).toBe('Porch chimes (2)');
    // Again, replacing the stored one: the count stays, the replaced one is restorable.
    await page.locator('#import-file').setInputFiles(exported);
    await page.getByRole('button', { name: /Replace the stored one/ }).click();
    await expect.poll(() => page.locator('bw-app .banner.notice').innerText()).toMatch(/Imported “Porch chimes”.*Recently deleted/);
    expect(await projectOptions(page).count()).toBe(4);
    await openMenu(page);
    expect(await page.locator('[data-testid="binned"]').innerText()).toMatch(/Porch chimes/);
    const names = (await projectOptions(page).allInnerTexts()).map((text) => text.replace(/ \(\d+ bars.*$/, ''));
    expect(new Set(names).size).toBe(names.length);
    await context.close();
  }, 240_000);
});

describe('resonators', () => {
  it('warns of an impractical tube with remedies, refuses absurd bores and frames with the range, and gives the tube list as CSV and on one printed page', async () => {
    const { context, page } = await freshPage();
    await openView(page, 'resonators');
    // The demo's C7 over a 40 mm bore: 28.7 mm of tube, shorter than its bore.
    const c7 = page.locator('[data-testid="tube-warning"][data-kind="shorter-than-bore"]');
    await expect.poll(() => c7.innerText()).toMatch(/C7: The tube is 28\.7 mm long, shorter than its 40\.0 mm bore/);
    expect(await page.locator('[data-testid="tube-summary"]').innerText()).toBe('1 of 7 tubes impractical: C7');
    expect(await page.locator('tr.warning-row').first().innerText()).toMatch(/A bore of at most 31\.\d mm/);
    // Which partials a tube helps: a closed tube's odd harmonics never meet 4f or 10f.
    expect(await page.locator('tr[data-note="A2"] [data-testid="reinforces"]').innerText()).toBe('fundamental');

    // Absurd values are refused at the field with the range; nothing changes.
    const bass = page.getByLabel(/Inner diameter, Bass/);
    await bass.fill('100000');
    await expect.poll(() => page.locator('bw-number-field[name="diameter-bass"] .message').innerText()).toBe('Inner diameter, Bass (A2–B3) must lie within 10–250 mm');
    await bass.press('Escape');
    const frame = page.getByLabel(/Longest tube the frame takes/);
    await frame.fill('20');
    await expect.poll(() => page.locator('bw-number-field[name="frame"] .message').innerText()).toBe('Longest tube the frame takes must lie within 50–3000 mm');
    // A frame of 700 mm: the A2 tube (752 mm) no longer fits.
    await frame.fill('700');
    await frame.press('Enter');
    const tooLong = page.locator('[data-testid="tube-warning"][data-kind="longer-than-frame"]');
    await expect.poll(() => tooLong.innerText()).toMatch(/A2: The tube is 752\.\d mm long; the frame takes 700\.0 mm/);
    expect(await page.locator('tr.warning-row').filter({ hasText: 'A2:' }).innerText()).toMatch(/U-bend[\s\S]*flanged top[\s\S]*frame that takes 753 mm/);
    await saved(page);

    // The tube list as CSV: every keyboard bar's tube, the warnings in their column.
    const [download] = await Promise.all([page.waitForEvent('download'), page.locator('[data-testid="tube-csv"]').click()]);
    const csvPath = artifactPath('resonator-tubes.csv');
    await download.saveAs(csvPath);
    const csv = parseCsv(readFileSync(csvPath, 'utf8'));
    const header = csv[0]!;
    expect(header).toEqual(['note', 'target_hz', 'inner_diameter_mm', 'length_mm', 'end_correction_mm', 'speed_of_sound_m_s', 'temp_c', 'resonance_1_hz', 'resonance_3_hz', 'resonance_5_hz', 'reinforces_partials', 'cents_per_c', 'warnings']);
    expect(csv.slice(1).map((row) => row[0])).toEqual(['A2', 'E3', 'A3', 'C4', 'A4', 'E5', 'C7']);
    const a2 = csv.find((row) => row[0] === 'A2')!;
    // Closed form, independently: L = c / (4 f) − 0.6133 r, c = 331.3 √(1 + T/273.15) at 22 °C
    // (brief, air columns; Levine & Schwinger 1948); f = A2 at A4 = 442 Hz, r = 44 mm.
    const closedForm = (331.3 * Math.sqrt(1 + 22 / 273.15)) / (4 * noteToHz('A2', 442)) - 0.6133 * 0.044;
    expect(Math.abs(Number(a2[header.indexOf('length_mm')]) - closedForm * 1000)).toBeLessThanOrEqual(0.05 + 1e-9);
    expect(Number(a2[header.indexOf('length_mm')])).toBeCloseTo(closedTubeResonator({ hz: noteToHz('A2', 442), innerDiameterMm: 88, temperatureC: 22 }).length_mm, 1);
    expect(a2[header.indexOf('warnings')]).toMatch(/frame takes 700\.0 mm/);
    expect(csv.find((row) => row[0] === 'C7')![header.indexOf('warnings')]).toMatch(/shorter than its 40\.0 mm bore/);
    expect(a2[header.indexOf('reinforces_partials')]).toBe('1');

    // A 1 : 3 register: its tubes help partial 2 through their 3f.
    await openView(page, 'keyboard');
    const middle = page.getByLabel('Target ratios of Middle (C4–B5)');
    await middle.fill('1 : 3');
    await middle.press('Enter');
    await middle.blur();
    await saved(page);
    await openView(page, 'resonators');
    await expect.poll(() => page.locator('tr[data-note="A4"] [data-testid="reinforces"]').innerText()).toBe("fundamental + partial 2 (tube's 3f)");

    // On paper: the settings stay off, the list and its warnings print on one A4 page.
    await page.emulateMedia({ media: 'print' });
    expect(await page.getByLabel(/Longest tube the frame takes/).isVisible()).toBe(false);
    expect(await page.locator('[data-testid="resonators"]').isVisible()).toBe(true);
    await page.evaluate(() => {
      const style = document.createElement('style');
      style.textContent = '@page { size: A4 portrait; margin: 12mm; }';
      document.head.append(style);
    });
    const pdf = await page.pdf({ preferCSSPageSize: true, printBackground: true });
    const pages = (pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? []).length;
    expect(pages).toBe(1);
    await page.screenshot({ path: artifactPath('resonators-print-media.png'), fullPage: true });
    await context.close();
  }, 180_000);
});

describe('words', () => {
  it('each label names one thing; states are explained; no timber notes on metal, no cord holes on tubes', async () => {
    const { context, page } = await freshPage();
    await openView(page, 'keyboard');
    const tabs = await page.locator('bw-app nav button').allInnerTexts();
    expect(tabs.map((text) => text.replace(/\s+/g, ' ').trim())).toEqual(['Keyboard', 'Shape · A2', 'Tuning · A2', 'Resonators', 'Template · A2', 'Chime set', 'Workshop']);
    // The buttons that open a bar's views carry the views' names; none says "Tune" or just "Print".
    const buttons = (await page.locator('button').allInnerTexts()).map((text) => text.trim());
    expect(buttons).not.toContain('Tune');
    expect(buttons).not.toContain('Print');
    expect(await page.locator('tr[data-bar="bar-A2"]').getByRole('button').allInnerTexts()).toEqual(['Shape', 'Tuning']);
    // The chime register's single target is not a count.
    const strip = await visibleText(page, 'bw-status-strip');
    expect(strip).toMatch(/Chime tubes\s+fundamental only/);
    expect(strip).not.toMatch(/Chime tubes\s+1\b/);
    // Bar states explained in a legend and on hover.
    expect(await page.locator('bw-bar-list .legend').innerText()).toMatch(/rough-cut: undercut roughly/);
    expect(await page.locator('tr[data-bar="bar-E3"] td.state').getAttribute('title')).toMatch(/undercut roughly/);

    // A chime tube: nodes to hang it from, no cord holes; metal words, no timber.
    await openView(page, 'shape/chime-C5');
    await expect.poll(() => visibleText(page, 'bw-shape-view'), { timeout: 60_000 }).toMatch(/Hang or support it at the fundamental's nodes/);
    const chimeText = await visibleText(page, 'bw-shape-view');
    expect(chimeText).not.toMatch(/cord hole/i);
    expect(chimeText).not.toMatch(/timber|grain/i);
    expect(chimeText).toMatch(/What a cut does, along the bar/);
    expect(chimeText).not.toMatch(/Where to cut/);
    await page.locator('bw-shape-view details summary').filter({ hasText: 'Engineering detail' }).click();
    await expect.poll(() => visibleText(page, 'bw-shape-view')).toMatch(/metal is stiff in shear/);
    await openView(page, 'template/chime-C5');
    await expect.poll(() => page.locator('[data-testid="template-tile"]').first().textContent(), { timeout: 60_000 }).toMatch(/Node at \d+\.\d mm: hang or support here/);
    expect(await visibleText(page, 'bw-template-view')).not.toMatch(/cord hole/i);

    // An aluminium bar (E5's blank given the aluminium preset): no timber notes anywhere on it.
    await openView(page, 'shape/bar-E5');
    await page.getByLabel('Start from a preset').selectOption('aluminium-6061-t6');
    await expect.poll(() => visibleText(page, 'bw-blank-form')).toMatch(/Metal .*Stiffness \(E\)/);
    // Stations to shape an undercut: the cut's cautions appear beside the drawing.
    await page.getByRole('button', { name: 'Add stations every 10 mm to shape an undercut' }).click();
    await page.locator('bw-shape-view details summary').filter({ hasText: 'Engineering detail' }).click();
    await expect.poll(() => visibleText(page, 'bw-shape-view'), { timeout: 60_000 }).toMatch(/metal is stiff in shear/);
    const metalText = await visibleText(page, 'bw-shape-view');
    expect(metalText).not.toMatch(/timber|grain|hardwood dust/i);
    expect(await page.locator('bw-shape-view bw-cautions summary').first().innerText()).toMatch(/deburr/);
    await context.close();
  }, 240_000);
});

/**
 * Every view of the workbench, with what to wait for before it is shown as the maker sees it, and
 * for a part of a view (listening, the keyboard plan) what to bring into sight for its screenshot.
 */
const views: { hash: string; name: string; ready: (page: Page) => Promise<unknown>; show?: (page: Page) => Promise<unknown> }[] = [
  { hash: 'keyboard', name: 'keyboard', ready: (page) => expect.poll(() => page.locator('[data-testid="bar-list"]').innerText(), { timeout: 90_000 }).not.toMatch(/predicting/) },
  { hash: 'keyboard', name: 'plan', ready: (page) => page.locator('[data-testid="plan-start"]').waitFor(), show: (page) => page.locator('bw-keyboard-plan').evaluate((element) => element.scrollIntoView({ block: 'center' })) },
  { hash: 'shape/bar-A2', name: 'shape', ready: (page) => expect.poll(() => page.locator('[data-testid="predicted-partials"] bw-cents-readout .detail').first().innerText(), { timeout: 60_000 }).toMatch(/^\d/) },
  { hash: 'tuning/bar-A2', name: 'tuning', ready: (page) => page.locator('[data-testid="mark-cut-done"]').waitFor({ timeout: 120_000 }) },
  { hash: 'tuning/bar-A2', name: 'listen', ready: (page) => page.locator('bw-listen').waitFor({ timeout: 60_000 }), show: (page) => page.locator('bw-listen').evaluate((element) => element.scrollIntoView({ block: 'center' })) },
  { hash: 'resonators', name: 'resonators', ready: (page) => page.locator('[data-testid="resonators"]').waitFor() },
  { hash: 'template/bar-C4', name: 'template', ready: (page) => page.locator('[data-testid="template-tile"]').first().waitFor() },
  { hash: 'chimes', name: 'chimes', ready: (page) => page.locator('[data-testid="chime-table"]').waitFor({ timeout: 60_000 }) },
  { hash: 'workshop', name: 'workshop', ready: (page) => page.locator('[data-testid="workshop-limits"]').waitFor({ timeout: 60_000 }) },
  { hash: 'plan-print', name: 'plan-print', ready: (page) => page.locator('bw-plan-print-view').waitFor() },
  { hash: 'keyboard', name: 'project-menu', ready: (page) => openMenu(page).then(() => page.locator('[data-testid="new-project"]').waitFor()) },
];

/**
 * How the page lays out: its sideways overflow, the header's height, whether the tabs sit on one
 * line and scroll inside themselves, and every table that neither fits the window nor sits in a
 * box that scrolls sideways within it (shadow roots included).
 */
async function layout(page: Page) {
  return page.evaluate(() => {
    const app = document.querySelector('bw-app')!.shadowRoot!;
    const header = app.querySelector('header')!.getBoundingClientRect();
    const nav = app.querySelector('nav')!;
    const tabs = [...nav.querySelectorAll('button')].map((button) => button.getBoundingClientRect());
    const current = nav.querySelector('[aria-current="page"]')?.getBoundingClientRect() ?? null;
    const navBox = nav.getBoundingClientRect();
    const width = document.documentElement.clientWidth;
    const overflowing: string[] = [];
    const parentOf = (element: Element): Element | null => element.parentElement ?? ((element.getRootNode() as ShadowRoot).host || null);
    const visit = (root: Document | ShadowRoot) => {
      for (const element of root.querySelectorAll('*')) {
        if (element.shadowRoot) visit(element.shadowRoot);
        if (element.tagName !== 'TABLE') continue;
        const box = element.getBoundingClientRect();
        if (box.width === 0 || box.right <= width + 0.5) continue;
        let scroller: Element | null = parentOf(element);
        while (scroller && !['auto', 'scroll'].includes(getComputedStyle(scroller).overflowX)) scroller = parentOf(scroller);
        if (!scroller || scroller.getBoundingClientRect().right > width + 0.5) overflowing.push(element.getAttribute('data-testid') ?? element.className ?? 'table');
      }
    };
    visit(document);
    return {
      scrollWidth: document.scrollingElement!.scrollWidth,
      clientWidth: document.scrollingElement!.clientWidth,
      headerHeight: header.height,
      tabRows: new Set(tabs.map((box) => Math.round(box.top))).size,
      navScrolls: nav.scrollWidth > nav.clientWidth + 1,
      currentTabInSight: current ? current.left >= navBox.left - 1 && current.right <= navBox.right + 1 : false,
      overflowing,
    };
  });
}

describe('tablet and laptop', () => {
  for (const [size, viewport] of [
    ['tablet', tablet],
    ['laptop', laptop],
  ] as const) {
    it(`${size} ${viewport.width} × ${viewport.height}: nothing scrolls sideways, tables fit or scroll inside, controls labelled and ≥ 44 px; a screenshot of each view`, async () => {
      const { context, page } = await freshPage(viewport);
      const report: Record<string, unknown> = {};
      for (const view of views) {
        await openView(page, view.hash);
        await view.ready(page);
        await page.waitForTimeout(500);
        const measured = await layout(page);
        report[view.name] = measured;
        expect(measured.scrollWidth, `${view.name} at ${size}`).toBeLessThanOrEqual(measured.clientWidth);
        expect(measured.overflowing, `${view.name} at ${size}`).toEqual([]);
        expect(measured.currentTabInSight || view.name === 'plan-print', `${view.name} at ${size}: its tab in sight`).toBe(true);
        if (size === 'tablet') {
          // One line: the tabs on one row, scrolling inside themselves; the header under 80 px (it was 240).
          expect(measured.tabRows).toBe(1);
          expect(measured.navScrolls).toBe(true);
          expect(measured.headerHeight).toBeLessThan(80);
        }
        const audit = await auditControls(page);
        expect(audit.unlabelled, `${view.name} at ${size}`).toEqual([]);
        expect(audit.small, `${view.name} at ${size}`).toEqual([]);
        await page.evaluate(() => window.scrollTo(0, 0));
        await view.show?.(page);
        await page.screenshot({ path: artifactPath(`view-${view.name}-${size}.png`), fullPage: true });
        await page.screenshot({ path: artifactPath(`view-${view.name}-${size}-screen.png`) });
      }
      console.log(`${size}: ${JSON.stringify(report)}`);
      await context.close();
    }, 600_000);
  }

  it('showed no page or console errors in any of the above', () => {
    expect(problems).toEqual([]);
  });
});
