// Shared set-up for browser tests: serve the workbench with Vite on a free port and drive
// Debian's Chromium through playwright-core (npm cannot download browsers on this machine;
// test/browser/ensure-chromium.sh installs the Debian package, and .ci/run calls it).
import { existsSync, mkdirSync } from 'node:fs';
import { resolve } from 'node:path';
import { chromium, type Browser, type BrowserContext, type LaunchOptions, type Page } from 'playwright-core';
import { createServer, type ViteDevServer } from 'vite';

/** Where browser tests save screenshots and other artefacts (git-ignored). */
export const artifactDir = resolve(import.meta.dirname, '../artifacts');

/** The Chromium binary: $CHROMIUM_PATH, else Debian's /usr/bin/chromium. */
export function chromiumPath(): string {
  const candidates = [process.env.CHROMIUM_PATH, '/usr/bin/chromium', '/usr/bin/chromium-browser'].filter(Boolean) as string[];
  const found = candidates.find((p) => existsSync(p));
  if (!found) throw new Error('Chromium not found: run `npm run setup:browser` (installs Debian\'s chromium package)');
  return found;
}

/** Flags for headless Chromium on this closed-network machine (see DEVELOPERS.md). */
export const chromiumArgs = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** Launches headless Chromium; `extraArgs` e.g. fake audio capture flags. */
export async function launchBrowser(extraArgs: string[] = [], options: LaunchOptions = {}): Promise<Browser> {
  return chromium.launch({ executablePath: chromiumPath(), args: [...chromiumArgs, ...extraArgs], headless: true, ...options });
}

/** Starts the Vite dev server for the workbench on a free port; returns it and its base URL. */
export async function startWorkbench(): Promise<{ server: ViteDevServer; url: string }> {
  const server = await createServer({
    configFile: resolve(import.meta.dirname, '../../vite.config.ts'),
    server: { port: 0, strictPort: false, host: '127.0.0.1' },
    logLevel: 'error',
  });
  await server.listen();
  const address = server.httpServer?.address();
  if (!address || typeof address === 'string') throw new Error('vite did not report a port');
  return { server, url: `http://127.0.0.1:${address.port}/` };
}

/** Makes sure the artefact folder exists and returns a path inside it. */
export function artifactPath(name: string): string {
  mkdirSync(artifactDir, { recursive: true });
  return resolve(artifactDir, name);
}

/** Records a page's uncaught errors and console errors into `problems` (a test asserts it stays empty). */
export function watchPage(page: Page, problems: string[]): void {
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  page.on('console', (message) => {
    if (message.type() === 'error') problems.push(`console error: ${message.text()}`);
  });
}

/** A fresh browser profile (its own IndexedDB, downloads allowed) with a watched page. */
export async function freshPage(browser: Browser, problems: string[], viewport = { width: 1280, height: 800 }): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport, acceptDownloads: true });
  const page = await context.newPage();
  watchPage(page, problems);
  return { context, page };
}
