// Renders the workbench's icons (web/public/icons/*.svg, drawn for barwright) to the PNG sizes a
// web app manifest needs, with Debian's Chromium through playwright-core. Run after changing an
// SVG: `npx tsx scripts/renderIcons.ts`; the PNGs are committed (the build copies them as they are).
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { launchBrowser } from '../test/browser/harness.ts';

const folder = fileURLToPath(new URL('../web/public/icons/', import.meta.url));
const renders = [
  { svg: 'icon.svg', png: 'icon-192.png', size: 192 },
  { svg: 'icon.svg', png: 'icon-512.png', size: 512 },
  { svg: 'icon.svg', png: 'apple-touch-icon-180.png', size: 180 },
  { svg: 'maskable.svg', png: 'maskable-192.png', size: 192 },
  { svg: 'maskable.svg', png: 'maskable-512.png', size: 512 },
];

const browser = await launchBrowser();
try {
  for (const { svg, png, size } of renders) {
    const page = await browser.newPage({ viewport: { width: size, height: size }, deviceScaleFactor: 1 });
    const markup = readFileSync(folder + svg, 'utf8').replace('<svg ', `<svg width="${size}" height="${size}" `);
    await page.setContent(`<!doctype html><html><body style="margin:0;background:transparent">${markup}</body></html>`);
    await page.locator('svg').screenshot({ path: folder + png, omitBackground: true });
    await page.close();
    process.stdout.write(`${png} (${size} × ${size})\n`);
  }
} finally {
  await browser.close();
}
