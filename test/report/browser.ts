/**
 * A real browser for the report tests: Debian's chromium driven by playwright-core, with a fresh profile
 * folder per launch, and what a page logged and requested while it loaded.
 */
import { existsSync, mkdtempSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

export const CHROMIUM = '/usr/bin/chromium';
export const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

export interface LoadedPage {
  context: BrowserContext;
  page: Page;
  /** Console errors and uncaught exceptions. */
  errors: string[];
  /** Console warnings, without the GPU driver's performance notes (they come from chromium, not the page). */
  warnings: string[];
  /** Requests that failed, and any request for something other than the file itself and data: or blob: URLs. */
  network: string[];
}

/** Open a local HTML file via file:// and wait until `ready` (a browser expression) is true. */
export async function openFile(file: string, tmp: string, ready: string): Promise<LoadedPage> {
  if (!existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing: install Debian's chromium (apt-get install -y chromium)`);
  const context = await chromium.launchPersistentContext(mkdtempSync(join(tmp, 'profile-')), {
    executablePath: CHROMIUM, args: CHROMIUM_ARGS, viewport: { width: 1280, height: 900 },
  });
  const page = await context.newPage();
  const out: LoadedPage = { context, page, errors: [], warnings: [], network: [] };
  const url = pathToFileURL(file).href;
  page.on('console', (m) => {
    if (m.type() === 'error') out.errors.push(m.text());
    else if (m.type() === 'warning' && !/GL Driver Message|GPU stall/.test(m.text())) out.warnings.push(m.text());
  });
  page.on('pageerror', (e) => out.errors.push(`uncaught: ${e.message}`));
  page.on('requestfailed', (r) => out.network.push(`failed: ${r.url().slice(0, 120)}`));
  page.on('request', (r) => { if (r.url() !== url && !/^(data|blob):/.test(r.url())) out.network.push(`requested: ${r.url().slice(0, 120)}`); });
  await page.goto(url, { waitUntil: 'load' });
  await page.waitForFunction(ready, undefined, { timeout: 60_000 });
  return out;
}

/** Luminance variance and number of distinct colours of a PNG, decoded by the browser in a blank page. */
export async function pngStatistics(context: BrowserContext, png: Buffer): Promise<{ width: number; height: number; variance: number; colours: number }> {
  const blank = await context.newPage();
  try {
    return await blank.evaluate(`(async () => {
      const img = new Image();
      img.src = 'data:image/png;base64,${png.toString('base64')}';
      await img.decode();
      const c = document.createElement('canvas');
      c.width = img.width; c.height = img.height;
      const g = c.getContext('2d');
      g.drawImage(img, 0, 0);
      const d = g.getImageData(0, 0, c.width, c.height).data;
      let n = 0, s = 0, s2 = 0;
      const colours = new Set();
      for (let i = 0; i < d.length; i += 4) {
        const y = 0.299 * d[i] + 0.587 * d[i + 1] + 0.114 * d[i + 2];
        s += y; s2 += y * y; n++;
        colours.add((d[i] << 16) | (d[i + 1] << 8) | d[i + 2]);
      }
      return { width: c.width, height: c.height, variance: s2 / n - (s / n) ** 2, colours: colours.size };
    })()`);
  } finally {
    await blank.close();
  }
}
