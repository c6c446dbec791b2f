import { launchBrowser } from '@tests/setup/chromium';
import { existsSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { gzipSync } from 'node:zlib';

const gzipKB = (bytes: Buffer) => Math.round((gzipSync(bytes, { level: 9 }).length / 1024) * 10) / 10;

/** The JS and CSS that dist/index.html itself references (entry, module preloads, style sheets), gzipped. */
export function entryBundleSizes(distDir = resolve('dist')) {
  const html = readFileSync(join(distDir, 'index.html'), 'utf8');
  const refs = [...html.matchAll(/(?:src|href)="(\/[^"]+\.(?:js|css))"/g)].map((m) => m[1]!);
  const files = [...new Set(refs)].filter((r) => existsSync(join(distDir, r)));
  const sum = (ext: string) =>
    Math.round(
      files.filter((f) => f.endsWith(ext)).reduce((kb, f) => kb + gzipKB(readFileSync(join(distDir, f))), 0) *
        10,
    ) / 10;
  return { jsGzipKB: sum('.js'), cssGzipKB: sum('.css'), files };
}

/**
 * The kiosk start screen in Debian Chromium with the CPU slowed 4x through the DevTools protocol: its Largest
 * Contentful Paint, and every JS and CSS file it actually loaded (lazy chunks included), gzipped.
 */
export async function kioskStartScreen(baseUrl: string, enrolPath: string) {
  const browser = await launchBrowser();
  try {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const enrol = await context.newPage();
    await enrol.goto(`${baseUrl}${enrolPath}`);
    await enrol.waitForURL(/\/kiosk/, { timeout: 20_000 });
    await enrol.close();
    const page = await context.newPage();
    const loaded = new Map<string, Buffer>();
    page.on('response', async (res) => {
      const url = res.url();
      if (/\.(js|css)(\?|$)/.test(url) && res.ok())
        loaded.set(url, await res.body().catch(() => Buffer.alloc(0)));
    });
    const cdp = await context.newCDPSession(page);
    await cdp.send('Network.clearBrowserCache');
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
    await page.goto(`${baseUrl}/kiosk`, { waitUntil: 'networkidle' });
    const lcpMs = await page.evaluate(
      () =>
        new Promise<number>((done) => {
          let last = 0;
          new PerformanceObserver((list) => {
            for (const entry of list.getEntries()) last = entry.startTime;
          }).observe({ type: 'largest-contentful-paint', buffered: true });
          setTimeout(() => done(last), 1_500);
        }),
    );
    const sum = (ext: string) =>
      Math.round(
        [...loaded]
          .filter(([url]) => new URL(url).pathname.endsWith(ext))
          .reduce((kb, [, body]) => kb + gzipKB(body), 0) * 10,
      ) / 10;
    return {
      lcpMs: Math.round(lcpMs),
      jsGzipKB: sum('.js'),
      cssGzipKB: sum('.css'),
      files: [...loaded.keys()],
    };
  } finally {
    await browser.close();
  }
}
