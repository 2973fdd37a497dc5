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

/**
 * Inputs without a label and controls smaller than 44 × 44 px (ui-notes.md: touch targets) anywhere
 * on the page, shadow roots included. Buttons, selects and inputs are sized; `alsoSized` adds tags.
 */
export async function auditControls(page: Page, alsoSized: readonly string[] = []): Promise<{ unlabelled: string[]; small: string[] }> {
  return page.evaluate((extra) => {
    const sized = new Set(['button', 'select', ...extra]);
    const unlabelled: string[] = [];
    const small: string[] = [];
    const visit = (root: Document | ShadowRoot) => {
      for (const element of root.querySelectorAll('*')) {
        if (element.shadowRoot) visit(element.shadowRoot);
        const tag = element.tagName.toLowerCase();
        if (['input', 'select', 'textarea'].includes(tag)) {
          const control = element as HTMLInputElement;
          if (control.type === 'file') continue;
          const named = (control.labels && control.labels.length > 0) || control.getAttribute('aria-label') || control.getAttribute('aria-labelledby');
          if (!named) unlabelled.push(`${tag}#${control.id}`);
        }
        if (sized.has(tag) || (tag === 'input' && (element as HTMLInputElement).type !== 'file')) {
          const box = element.getBoundingClientRect();
          if (box.width > 0 && box.height > 0 && (box.width < 44 || box.height < 44)) small.push(`${tag} "${(element.textContent ?? '').trim().slice(0, 30)}" ${box.width.toFixed(0)}×${box.height.toFixed(0)}`);
        }
      }
    };
    visit(document);
    return { unlabelled, small };
  }, [...alsoSized]);
}

/** RFC 4180 CSV (quoted fields, doubled quotes, CRLF) into rows of cells. */
export function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (c === '"') quoted = false;
      else cell += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') {
      row.push(cell);
      cell = '';
    } else if (c === '\r' && text[i + 1] === '\n') {
      row.push(cell);
      rows.push(row);
      row = [];
      cell = '';
      i++;
    } else cell += c;
  }
  if (cell !== '' || row.length > 0) rows.push([...row, cell]);
  return rows;
}
