// Shared set-up for browser tests: serve the workbench with Vite on a free port and drive
// Debian's Chromium through playwright-core (npm cannot download browsers on this machine;
// test/browser/ensure-chromium.sh installs the Debian package, and .ci/run calls it).
import { existsSync, mkdirSync, mkdtempSync, readFileSync, statSync } from 'node:fs';
import { createServer as createHttpServer } from 'node:http';
import { tmpdir } from 'node:os';
import { extname, join, resolve, sep } from 'node:path';
import { chromium, type Browser, type BrowserContext, type LaunchOptions, type Page } from 'playwright-core';
import { build, createServer, type InlineConfig, type ViteDevServer } from 'vite';
import { afterAll, beforeAll } from 'vitest';

/** Where browser tests save screenshots and other artefacts (git-ignored). */
export const artifactDir = resolve(import.meta.dirname, '../artifacts');

/** The Chromium binary: $CHROMIUM_PATH, else Debian's /usr/bin/chromium. */
export function chromiumPath(): string {
  const candidates = [process.env.CHROMIUM_PATH, '/usr/bin/chromium', '/usr/bin/chromium-browser'].filter(Boolean) as string[];
  const found = candidates.find((p) => existsSync(p));
  if (!found) throw new Error('Chromium not found: `npm test` installs Debian\'s chromium package first (test/browser/ensure-chromium.sh); run `npm run setup:browser` to do only that');
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

/**
 * Builds the workbench as `npm start` serves it (vite build, service worker included) into a new
 * temporary folder and returns its path. `overrides` are merged over vite.config.ts (e.g. a
 * different `define` to make a second, newer version).
 */
export async function buildWorkbench(overrides: InlineConfig = {}): Promise<string> {
  const outDir = mkdtempSync(join(tmpdir(), 'barwright-built-'));
  // vitest runs with NODE_ENV=test, and Vite builds for the NODE_ENV it finds (development
  // libraries, import.meta.env.PROD false: no service worker). Build as `npm start` does.
  const nodeEnv = process.env.NODE_ENV;
  process.env.NODE_ENV = 'production';
  try {
    await build({
      configFile: resolve(import.meta.dirname, '../../vite.config.ts'),
      logLevel: 'error',
      ...overrides,
      build: { outDir, emptyOutDir: true, ...overrides.build },
    });
  } finally {
    if (nodeEnv === undefined) delete process.env.NODE_ENV;
    else process.env.NODE_ENV = nodeEnv;
  }
  return outDir;
}

const contentTypes: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json',
  '.webmanifest': 'application/manifest+json',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
};

/** A static server of a built workbench folder; see serveBuiltWorkbench. */
export interface BuiltWorkbenchServer {
  url: string;
  /** Requests answered so far (path of each). */
  requests: string[];
  /** Serves another folder from now on, at the same address (a new version deployed). */
  serve(folder: string): void;
  /** Stops listening: from then on the address refuses connections, as with no network. */
  close(): Promise<void>;
}

/**
 * Serves a built workbench folder on 127.0.0.1 (a free port) like a plain static host: files as
 * they are, `/` as index.html, `Cache-Control: no-cache` so the browser asks again each time.
 */
export async function serveBuiltWorkbench(folder: string): Promise<BuiltWorkbenchServer> {
  let root = folder;
  const requests: string[] = [];
  const server = createHttpServer((request, response) => {
    const path = decodeURIComponent(new URL(request.url ?? '/', 'http://localhost').pathname);
    requests.push(path);
    const file = resolve(root, `.${path.endsWith('/') ? `${path}index.html` : path}`);
    if (!file.startsWith(root + sep) || !existsSync(file) || !statSync(file).isFile()) {
      response.writeHead(404, { 'Content-Type': 'text/plain' }).end('not found');
      return;
    }
    response.writeHead(200, { 'Content-Type': contentTypes[extname(file)] ?? 'application/octet-stream', 'Cache-Control': 'no-cache' }).end(readFileSync(file));
  });
  await new Promise<void>((done) => server.listen(0, '127.0.0.1', done));
  const address = server.address();
  if (!address || typeof address === 'string') throw new Error('the static server did not report a port');
  let closed = false;
  return {
    url: `http://127.0.0.1:${address.port}/`,
    requests,
    serve: (next) => void (root = next),
    close: () => {
      if (closed) return Promise.resolve();
      closed = true;
      server.closeAllConnections();
      return new Promise<void>((done, fail) => server.close((error) => (error ? fail(error) : done())));
    },
  };
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

/** A test file's workbench: its dev server's address, its pages' console errors, and fresh pages. */
export interface Workbench {
  /** The dev server's address (set before the file's first test). */
  url: string;
  /** Page errors and console errors of every page opened through `freshPage`. */
  readonly problems: string[];
  /** A fresh browser profile (its own IndexedDB, downloads allowed) with a watched page, 1280 × 800 unless given. */
  freshPage(viewport?: { width: number; height: number }): Promise<{ context: BrowserContext; page: Page }>;
}

/**
 * Serves the workbench and starts Chromium for the calling test file (beforeAll) and closes both
 * after its tests (afterAll). Call it at the top level of the file.
 */
export function useWorkbench(): Workbench {
  let server: ViteDevServer | undefined;
  let browser: Browser | undefined;
  const workbench: Workbench = {
    url: '',
    problems: [],
    freshPage(viewport) {
      if (!browser) throw new Error('the workbench starts before the first test (useWorkbench at the top level of the file)');
      return freshPage(browser, workbench.problems, viewport);
    },
  };
  beforeAll(async () => {
    const started = await startWorkbench();
    server = started.server;
    workbench.url = started.url;
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });
  return workbench;
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
