// The built workbench (as `npm start` serves it) in real Chromium, offline and as an installable
// app: after one visit it loads and works with the network cut and the server gone (the demo
// project opened from the stored app, an undercut planned on a worker, a reading entered, all
// there after another reload); Chromium finds nothing missing to install it; a new version waits
// until the maker reloads, and a change made just before that reload is kept.
import { mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, sep } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { chromium, type Browser, type Page } from 'playwright-core';
import { artifactPath, buildWorkbench, chromiumArgs, chromiumPath, freshPage as openFreshPage, launchBrowser, serveBuiltWorkbench, watchPage, type BuiltWorkbenchServer } from './harness.ts';

const { version } = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string };

let browser: Browser;
let built: string;
const servers: BuiltWorkbenchServer[] = [];
const folders: string[] = [];
const problems: string[] = [];

beforeAll(async () => {
  built = await buildWorkbench();
  folders.push(built);
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  for (const server of servers) await server.close();
  for (const folder of folders) rmSync(folder, { recursive: true, force: true });
});

async function serve(folder: string): Promise<BuiltWorkbenchServer> {
  const server = await serveBuiltWorkbench(folder);
  servers.push(server);
  return server;
}

/** Waits for the app to have a project open and saved. */
async function saved(page: Page): Promise<void> {
  await page.locator('[data-testid="save-status"]').filter({ hasText: '✓' }).waitFor({ timeout: 30_000 });
}

/** Waits until the service worker has stored the app and controls the page. */
async function controlled(page: Page): Promise<void> {
  await page.evaluate(async () => void (await navigator.serviceWorker.ready));
  await expect.poll(() => page.evaluate(() => navigator.serviceWorker.controller !== null), { timeout: 30_000 }).toBe(true);
}

/** Every file of a built folder, relative, with forward slashes. */
function builtFiles(folder: string): string[] {
  return (readdirSync(folder, { recursive: true, withFileTypes: true }) as { isFile(): boolean; parentPath: string; name: string }[])
    .filter((entry) => entry.isFile())
    .map((entry) => join(entry.parentPath, entry.name).slice(folder.length + 1).split(sep).join('/'))
    .sort();
}

/** Types a round of three partials into the tuning view (Enter moves on, the last records it). */
async function enterReading(page: Page, hz: readonly [string, string, string]): Promise<void> {
  await page.getByLabel('Fundamental heard (Hz)').fill(hz[0]);
  await page.getByLabel('Fundamental heard (Hz)').press('Enter');
  await page.keyboard.type(hz[1]);
  await page.keyboard.press('Enter');
  await page.keyboard.type(hz[2]);
  await page.keyboard.press('Enter');
}

describe('the built workbench, offline and installable (Chromium)', () => {
  it('stores every file of the build for offline use, and nothing else', () => {
    const files = builtFiles(built);
    const sw = readFileSync(join(built, 'sw.js'), 'utf8');
    const list = JSON.parse(/\[("[^"]*",?)+\]/.exec(sw)![0]) as string[];
    expect([...list].sort()).toEqual(files.filter((file) => file !== 'sw.js'));
    expect(list).toContain('index.html');
    expect(list).toContain('manifest.webmanifest');
    expect(list.some((file) => /^assets\/solverWorker-.*\.js$/.test(file))).toBe(true);
    // numeric is a test-only reference: no bundle may carry it (its source announces itself).
    for (const file of files.filter((name) => name.endsWith('.js'))) expect(readFileSync(join(built, file), 'utf8')).not.toMatch(/numeric\.version\s*=|numeric\.(solveQP|dopri)\s*=/);
  });

  it('loads and works with the network cut after one visit: demo project, a design, a reading, a reload', async () => {
    const server = await serve(built);
    // A browser profile on disk, as a maker's browser has (Chromium does not install apps from
    // an incognito-like profile, which is what a plain new context is).
    const profile = mkdtempSync(join(tmpdir(), 'barwright-profile-'));
    folders.push(profile);
    const context = await chromium.launchPersistentContext(profile, { executablePath: chromiumPath(), args: chromiumArgs, headless: true, viewport: { width: 1280, height: 800 } });
    const page = context.pages()[0] ?? (await context.newPage());
    watchPage(page, problems);
    await page.goto(server.url);
    await saved(page);
    await controlled(page);
    expect(await page.evaluate(() => document.documentElement.dataset.version)).toBe(version);

    // Installable: the manifest parses and Chromium reports nothing missing (icons, worker, scope).
    const cdp = await context.newCDPSession(page);
    const manifest = (await cdp.send('Page.getAppManifest')) as { errors: unknown[]; url: string };
    expect(manifest.errors).toEqual([]);
    expect(manifest.url).toBe(`${server.url}manifest.webmanifest`);
    const { installabilityErrors } = (await cdp.send('Page.getInstallabilityErrors')) as { installabilityErrors: { errorId: string }[] };
    expect(installabilityErrors.map((error) => error.errorId)).toEqual([]);

    // No network at all from here on: the browser is offline and the server is gone.
    await context.setOffline(true);
    await server.close();
    const requestsBefore = server.requests.length;
    await page.reload();
    await saved(page);
    expect(await page.locator('bw-app').count()).toBe(1);

    // Open a new copy of the demo project (its data come from the stored app).
    await page.locator('[data-testid="project-menu"]').click();
    await page.getByRole('button', { name: 'New copy of the demo' }).click();
    await expect.poll(() => page.locator('bw-project-menu select#project option').count()).toBe(2);
    await saved(page);

    // Plan an undercut: the solver worker runs from the stored files.
    await page.evaluate(() => (location.hash = '#/shape/bar-A4'));
    const plan = page.getByRole('button', { name: 'Plan the undercut' });
    await plan.click();
    await page.getByText(/A plan reaches the targets\.|No plan reaches all targets;/).waitFor({ timeout: 120_000 });
    await saved(page);

    // Enter a reading in the tuning view.
    await page.evaluate(() => (location.hash = '#/tuning/bar-A4'));
    await enterReading(page, ['771.4', '1963.0', '3481.5']);
    await expect.poll(() => page.locator('[data-testid="rounds"] tbody tr').count()).toBe(1);
    await saved(page);

    // Reload again, still offline: the project, the design and the reading are all there.
    await page.reload();
    await saved(page);
    await expect.poll(() => page.locator('[data-testid="rounds"] tbody tr').count()).toBe(1);
    expect(await page.locator('[data-testid="rounds"]').innerText()).toMatch(/771\.4[\s\S]*1963\.0[\s\S]*3481\.5/);
    expect(await page.locator('bw-project-menu select#project option').count()).toBe(2);
    await page.evaluate(() => (location.hash = '#/shape/bar-A4'));
    await page.getByText(/A plan reaches the targets\.|No plan reaches all targets;/).waitFor({ timeout: 30_000 });
    await page.screenshot({ path: artifactPath('offline-shape.png') });
    expect(server.requests.length).toBe(requestsBefore);
    expect(problems).toEqual([]);
    await context.close();
  });

  it('offers a new version as "reload to update" and keeps a change made just before the reload', async () => {
    const next = await buildWorkbench({ define: { __BARWRIGHT_VERSION__: JSON.stringify(`${version}+next`) } });
    folders.push(next);
    const server = await serve(built);
    const { context, page } = await openFreshPage(browser, problems);
    await page.goto(`${server.url}#/tuning/bar-A4`);
    await saved(page);
    await controlled(page);
    const notice = page.locator('[data-testid="update-notice"]');
    expect(await notice.count()).toBe(0);

    // The new version is deployed; the page finds it and keeps running the old one meanwhile.
    server.serve(next);
    await page.evaluate(async () => (await navigator.serviceWorker.getRegistration())?.update());
    await notice.waitFor({ timeout: 30_000 });
    expect(await notice.innerText()).toMatch(/new version of the workbench is ready/);
    expect(await page.evaluate(() => document.documentElement.dataset.version)).toBe(version);

    // A reading typed, and "Reload to update" pressed in the same moment as the Enter that
    // records it: the change is still waiting for the autosave (150 ms) when the reload is asked.
    await page.getByLabel('Fundamental heard (Hz)').fill('771.4');
    await page.getByLabel('Fundamental heard (Hz)').press('Enter');
    await page.keyboard.type('1963.0');
    await page.keyboard.press('Enter');
    await page.keyboard.type('3481.5');
    const statusAtReload = await page.evaluate(async () => {
      const find = (root: Document | ShadowRoot, selector: string): HTMLElement | null => {
        const hit = root.querySelector<HTMLElement>(selector);
        if (hit) return hit;
        for (const element of root.querySelectorAll('*')) {
          const inner = element.shadowRoot ? find(element.shadowRoot, selector) : null;
          if (inner) return inner;
        }
        return null;
      };
      const deepActive = (root: Document | ShadowRoot): Element | null => (root.activeElement?.shadowRoot ? deepActive(root.activeElement.shadowRoot) : root.activeElement);
      deepActive(document)!.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', bubbles: true, composed: true }));
      await new Promise((resolve) => requestAnimationFrame(resolve));
      const status = find(document, '[data-testid="save-status"]')!.innerText;
      find(document, '[data-testid="update-reload"]')!.click();
      return status;
    });
    expect(statusAtReload).toBe('saving…');
    await expect.poll(() => page.evaluate(() => document.documentElement.dataset.version), { timeout: 30_000 }).toBe(`${version}+next`);
    await saved(page);
    await expect.poll(() => page.locator('[data-testid="rounds"] tbody tr').count()).toBe(1);
    expect(await page.locator('[data-testid="rounds"]').innerText()).toMatch(/771\.4[\s\S]*1963\.0[\s\S]*3481\.5/);
    expect(await page.locator('[data-testid="update-notice"]').count()).toBe(0);
    expect(problems).toEqual([]);
    await context.close();
  });
});
