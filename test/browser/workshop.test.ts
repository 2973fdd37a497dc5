// The workshop view in Chromium: the default shop's limits each named with the tool that sets
// them; a tool's size refused at the field when absurd, taken when sensible and kept in the
// project through a reload and an export; the project's workshop downloaded as a workshop file
// the CLI's parser reads; the last finishing tool cannot be removed; the plan says which
// workshop it plans for; nothing scrolls sideways at laptop or tablet size.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { parseProjectFile, parseWorkshopFile } from '../../src/index.ts';
import { artifactPath, auditControls, useWorkbench } from './harness.ts';

const workbench = useWorkbench();
const problems = workbench.problems;

async function saved(page: Page): Promise<void> {
  await page.locator('[data-testid="save-status"]').filter({ hasText: '✓' }).waitFor({ timeout: 30_000 });
}

/** The smallest concave radius as the limits panel shows it. */
function radiusLimit(page: Page) {
  return page.locator('[data-testid="workshop-limits"] dd[data-limit="tool_radius_mm"]');
}

describe('the workshop view', () => {
  it('sets the project’s tools, refuses absurd sizes at the field, keeps them through reload and export, and shows at both sizes', async () => {
    const { context, page } = await workbench.freshPage();
    await page.goto(`${workbench.url}#/workshop`);
    await saved(page);
    await page.locator('bw-workshop-view').waitFor({ timeout: 60_000 });

    // The default shop: a band saw, a 12.5 mm spindle sleeve and a 25 mm drum; the smallest concave
    // radius is the sleeve's (barwright's default workshop, src/fileFormats/workshopFile.ts).
    await expect.poll(() => page.locator('[data-testid="workshop-origin"]').innerText()).toMatch(/default/);
    expect(await page.locator('[data-testid="workshop-tool"]').count()).toBe(3);
    expect(await radiusLimit(page).innerText()).toMatch(/12\.5 mm[\s\S]*spindle/);

    // An absurd radius is refused at the field with the range; the project keeps its default shop.
    const radius = page.locator('bw-number-field[name="radius-1"] input');
    await radius.fill('0');
    await radius.press('Enter');
    await expect.poll(() => page.locator('bw-number-field[name="radius-1"] [role="alert"]').innerText()).toMatch(/greater than 0 and at most 500 mm/);
    expect(await page.locator('[data-testid="workshop-origin"]').innerText()).toMatch(/default/);

    // A 5 mm sleeve: the smallest concave radius follows it and the workshop becomes the project's own.
    await radius.fill('5');
    await radius.press('Enter');
    await expect.poll(() => radiusLimit(page).innerText()).toMatch(/^5 mm/);
    await expect.poll(() => page.locator('[data-testid="workshop-origin"]').innerText()).toMatch(/own/);
    await saved(page);

    // Kept through a reload.
    await page.reload();
    await page.locator('bw-workshop-view').waitFor({ timeout: 60_000 });
    await expect.poll(() => radiusLimit(page).innerText(), { timeout: 30_000 }).toMatch(/^5 mm/);

    // In the exported project file, checked by the project file's own parser.
    await page.locator('[data-testid="project-menu"]').click();
    const [projectDownload] = await Promise.all([page.waitForEvent('download'), page.locator('[data-testid="export"]').click()]);
    const projectPath = artifactPath('workshop-export.project.json');
    await projectDownload.saveAs(projectPath);
    const exported = parseProjectFile(JSON.parse(readFileSync(projectPath, 'utf8')), 'exported');
    expect(exported.workshop?.tools[1]).toMatchObject({ kind: 'spindle', radius_mm: 5 });

    await page.locator('[data-testid="project-menu"]').click();
    // As a workshop file of its own, read by the CLI's parser (what `plan --workshop` reads).
    const [workshopDownload] = await Promise.all([page.waitForEvent('download'), page.locator('[data-testid="workshop-download"]').click()]);
    const workshopPath = artifactPath('workshop-export.workshop.json');
    await workshopDownload.saveAs(workshopPath);
    expect(parseWorkshopFile(JSON.parse(readFileSync(workshopPath, 'utf8')), 'downloaded').tools[1]).toMatchObject({ kind: 'spindle', radius_mm: 5 });

    // The last tool that finishes the underside cannot go: remove the drum, then try the sleeve.
    await page.getByRole('button', { name: 'Remove tool 3' }).click();
    await expect.poll(() => page.locator('[data-testid="workshop-tool"]').count()).toBe(2);
    await page.getByRole('button', { name: 'Remove tool 2' }).click();
    await expect.poll(() => page.locator('[data-testid="tool-error"]').innerText()).toMatch(/finishes the underside/);
    expect(await page.locator('[data-testid="workshop-tool"]').count()).toBe(2);

    // The keyboard's plan names the workshop it plans for.
    await page.goto(`${workbench.url}#/keyboard`);
    await expect.poll(() => page.locator('[data-testid="plan-workshop"]').innerText(), { timeout: 30_000 }).toMatch(/small shop/);

    // Back to the default shop.
    await page.goto(`${workbench.url}#/workshop`);
    await page.locator('[data-testid="workshop-reset"]').click();
    await expect.poll(() => page.locator('[data-testid="workshop-origin"]').innerText()).toMatch(/default/);
    await expect.poll(() => radiusLimit(page).innerText()).toMatch(/12\.5 mm/);

    const controls = await auditControls(page);
    expect(controls.unlabelled).toEqual([]);
    await context.close();

    for (const viewport of [
      { width: 1280, height: 800 },
      { width: 768, height: 1024 },
    ]) {
      const sized = await workbench.freshPage(viewport);
      await sized.page.goto(`${workbench.url}#/workshop`);
      await sized.page.locator('[data-testid="workshop-limits"]').waitFor({ timeout: 60_000 });
      const sideways = await sized.page.evaluate(() => document.scrollingElement!.scrollWidth - document.scrollingElement!.clientWidth);
      expect(sideways).toBeLessThanOrEqual(0);
      await sized.page.screenshot({ path: artifactPath(`workshop-${viewport.width}x${viewport.height}.png`), fullPage: true });
      await sized.context.close();
    }
    expect(problems).toEqual([]);
  }, 300_000);
});
