import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import type { ViteDevServer } from 'vite';
import { freshPage as openFreshPage, launchBrowser, startWorkbench } from './harness.ts';

let server: ViteDevServer;
let baseUrl: string;
let browser: Browser;
const problems: string[] = [];

beforeAll(async () => {
  ({ server, url: baseUrl } = await startWorkbench());
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

async function saved(page: Page): Promise<void> {
  await page.locator('[data-testid="save-status"]').filter({ hasText: '✓' }).waitFor({ timeout: 30_000 });
}
async function recordRound(page: Page, hz: readonly number[]): Promise<void> {
  for (const [index, value] of hz.entries()) await page.locator(`#partial-${index}`).fill(String(value));
  await page.locator('[data-testid="record-round"]').click();
}

describe('repro', () => {
  it('remove and re-enter', async () => {
    const { context, page } = await openFreshPage(browser, problems);
    await page.goto(`${baseUrl}#/tuning/bar-A2`);
    await saved(page);
    const done = page.locator('[data-testid="mark-cut-done"]');
    await done.waitFor({ timeout: 60_000 });
    await done.click();
    await page.locator('[data-testid="strike-now"]').waitFor();
    const details = await page.locator('bw-tuning-view .after bw-cents-readout .detail').allInnerTexts();
    const hz = details.filter((text) => /^[\d.]+ Hz/.test(text.trim())).map((text) => Number(/^([\d.]+) Hz/.exec(text.trim())![1]));
    console.log('EXPECTED', hz);
    await recordRound(page, hz);
    await page.waitForTimeout(20000);
    console.log('AFTER ROUND', await page.locator('bw-tuning-view').evaluate((el) => el.shadowRoot!.textContent!.replace(/\s+/g, ' ').slice(0, 3000)));
    const remove = page.getByRole('button', { name: /Remove the last round/ });
    await remove.click();
    await page.waitForTimeout(1000);
    console.log('AFTER REMOVE', await page.locator('bw-tuning-view').evaluate((el) => el.shadowRoot!.textContent!.replace(/\s+/g, ' ').slice(0, 3000)));
    await recordRound(page, hz);
    await page.waitForTimeout(20000);
    console.log('AFTER RE-ENTER', await page.locator('bw-tuning-view').evaluate((el) => el.shadowRoot!.textContent!.replace(/\s+/g, ' ').slice(0, 3000)));
    console.log('BAR', await page.locator('bw-tuning-view').evaluate((el) => JSON.stringify((el as unknown as { project: { bars: { id: string; session: { steps: unknown[] } }[] } }).project.bars.find((b) => b.id === 'bar-A2')!.session.steps.slice(2).map((s) => ({ ...(s as object), bar: undefined })))));
    console.log(problems);
    await context.close();
  }, 180_000);
});
