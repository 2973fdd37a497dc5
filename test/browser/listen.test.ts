// <bw-listen> in real Chromium: a WAV dropped on the page, and the microphone path with
// Chromium's fake audio capture playing a generated strike, must both yield the right partials;
// a denied microphone must show the fallback text.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import type { ViteDevServer } from 'vite';
import { encodeWav } from '../../src/audio/encodeWav.ts';
import { cents } from '../../src/pitch/cents.ts';
import { demoBars, demoScene } from '../audio/demoBars.ts';
import { synthesizeStrike } from '../audio/syntheticStrike.ts';
import { artifactPath, launchBrowser, startWorkbench } from './harness.ts';

const bar = demoBars[1]!; // F4 bar: 351.23, 1404.6, 2630.4, 3512.9 Hz
const targets = [351.2, 1404.9, 3512.3];
let server: ViteDevServer;
let baseUrl: string;
let folder: string;
let strikeWav: string;
const browsers: Browser[] = [];

beforeAll(async () => {
  ({ server, url: baseUrl } = await startWorkbench());
  folder = mkdtempSync(join(tmpdir(), 'barwright-listen-'));
  // 0.6 s of room (hum and noise) before the strike, 2.4 s of ring: Chromium loops the file.
  strikeWav = join(folder, 'strike.wav');
  writeFileSync(strikeWav, encodeWav([synthesizeStrike(demoScene(bar, 48000, { durationS: 3, strikeS: 0.6 }))], 48000, { kind: 'integer', bits: 16 }));
});

afterAll(async () => {
  for (const browser of browsers) await browser.close();
  await server?.close();
  if (folder) rmSync(folder, { recursive: true, force: true });
});

async function openPage(extraArgs: string[] = []): Promise<Page> {
  const browser = await launchBrowser(['--autoplay-policy=no-user-gesture-required', ...extraArgs]);
  browsers.push(browser);
  const page = await browser.newPage();
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(error.message));
  page.on('console', (message) => {
    if (message.type() === 'error') problems.push(message.text());
  });
  await page.goto(`${baseUrl}dev/listen.html?targets=${targets.join(',')}`);
  await page.locator('bw-listen button[data-action="listen"]').waitFor();
  (page as unknown as { problems: string[] }).problems = problems;
  return page;
}

type Measured = { partials: { hz: number; level_db: number; decay_s: number }[]; source: string };

async function waitForEvent(page: Page, count = 1): Promise<Measured> {
  await page.waitForFunction((n) => ((window as unknown as { listenEvents: unknown[] }).listenEvents ?? []).length >= n, count, { timeout: 30_000 });
  return page.evaluate((n) => (window as unknown as { listenEvents: Measured[] }).listenEvents[n - 1]!, count);
}

/** Every synthetic partial found within `toleranceCents`. */
function expectPartials(measured: Measured, toleranceCents: number): void {
  for (const partial of bar.partials) {
    const nearest = measured.partials.reduce((a, b) => (Math.abs(cents(b.hz, partial.hz)) < Math.abs(cents(a.hz, partial.hz)) ? b : a));
    expect(Math.abs(cents(nearest.hz, partial.hz)), `${partial.hz} Hz`).toBeLessThanOrEqual(toleranceCents);
  }
}

describe('<bw-listen> in Chromium', () => {
  it('finds the partials of a WAV file dropped on it, and shows cents and sharp/flat in words', async () => {
    const page = await openPage();
    const base64 = Buffer.from(encodeWav([synthesizeStrike(demoScene(bar, 44100))], 44100, { kind: 'integer', bits: 24 })).toString('base64');
    const dataTransfer = await page.evaluateHandle((data) => {
      const bytes = Uint8Array.from(atob(data), (c) => c.charCodeAt(0));
      const transfer = new DataTransfer();
      transfer.items.add(new File([bytes], 'f4-strike.wav', { type: 'audio/wav' }));
      return transfer;
    }, base64);
    await page.locator('bw-listen [data-part="drop-zone"]').dispatchEvent('drop', { dataTransfer });
    const measured = await waitForEvent(page);
    expect(measured.source).toBe('file');
    expect(measured.partials).toHaveLength(bar.partials.length);
    // The same 0.2-cent bound as the unit tests: the page runs the same code.
    expectPartials(measured, 0.2);

    const cards = page.locator('bw-listen [data-part="partial"]');
    await expect.poll(() => cards.count()).toBe(4);
    // 351.23 Hz against 351.2: +0.15 cent, within ±2 → "in tune"; 1404.6 against 1404.9: −0.37
    // within ±5 → "in tune"; 3512.9 against 3512.3: +0.30 → "in tune".
    const first = cards.first();
    await expect.poll(() => first.locator('[data-part="verdict"]').innerText()).toMatch(/in tune/i);
    await expect.poll(() => first.locator('.name').innerText()).toBe('Fundamental');
    await expect.poll(() => page.locator('bw-listen [data-part="beats"]').innerText()).toContain('Fundamental 0.0 per second');
    await page.screenshot({ path: artifactPath('listen-dropped.png'), fullPage: true });
    expect((page as unknown as { problems: string[] }).problems).toEqual([]);
  });

  it('says sharp and flat in words when the bar is off its targets', async () => {
    const page = await openPage();
    await page.evaluate(() => {
      document.querySelector('bw-listen')!.targetHz = [349.0, 1410.0];
    });
    const base64 = Buffer.from(encodeWav([synthesizeStrike(demoScene(bar, 48000))], 48000, { kind: 'integer', bits: 16 })).toString('base64');
    await page.evaluate((data) => {
      const bytes = Uint8Array.from(atob(data), (c) => c.charCodeAt(0));
      const input = document.querySelector('bw-listen')!.shadowRoot!.querySelector('input[type=file]') as HTMLInputElement;
      const transfer = new DataTransfer();
      transfer.items.add(new File([bytes], 'f4-strike.wav', { type: 'audio/wav' }));
      input.files = transfer.files;
      input.dispatchEvent(new Event('change'));
    }, base64);
    await waitForEvent(page);
    const cards = page.locator('bw-listen [data-part="partial"]');
    // 351.23 vs 349.0: +11.0 cents → sharp; 1404.6 vs 1410.0: −6.6 cents → flat.
    await expect.poll(() => cards.nth(0).innerText()).toMatch(/\+11\s*cents[\s\S]*sharp/i);
    await expect.poll(() => cards.nth(1).innerText()).toMatch(/−6\.6\s*cents[\s\S]*flat/i);
  });

  it('hears a strike through the microphone (Chromium fake audio capture of a generated WAV)', async () => {
    const page = await openPage(['--use-fake-device-for-media-stream', '--use-fake-ui-for-media-stream', `--use-file-for-fake-audio-capture=${strikeWav}`]);
    await page.locator('bw-listen button[data-action="listen"]').click();
    const measured = await waitForEvent(page);
    expect(measured.source).toBe('microphone');
    // Through Chromium's capture path (resampling to the device rate, float conversion) the
    // partials must still be within the 0.2 cent.
    expectPartials(measured, 0.2);
    await page.screenshot({ path: artifactPath('listen-microphone.png'), fullPage: true });
    await page.locator('bw-listen button[data-action="listen"]').click();
    await expect.poll(() => page.locator('bw-listen button[data-action="listen"]').innerText()).toBe('Listen');
  });

  it('shows the fallback text when the microphone is denied', async () => {
    const browser = await launchBrowser();
    browsers.push(browser);
    const context = await browser.newContext();
    // The browser's answer when the maker (or a policy) refuses the microphone.
    await context.addInitScript(() => {
      navigator.mediaDevices.getUserMedia = () => Promise.reject(new DOMException('Permission denied', 'NotAllowedError'));
    });
    const page = await context.newPage();
    await page.goto(`${baseUrl}dev/listen.html`);
    await page.locator('bw-listen button[data-action="listen"]').click();
    const fallback = page.locator('bw-listen [data-part="microphone-fallback"]');
    await fallback.waitFor();
    expect(await fallback.innerText()).toMatch(/did not allow the microphone[\s\S]*drop the WAV file/);
    expect(await page.locator('bw-listen [data-part="drop-zone"]').isVisible()).toBe(true);
  });
});
