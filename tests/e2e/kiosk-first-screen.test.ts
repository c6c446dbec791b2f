import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { gzipSync } from 'node:zlib';
import type { Browser } from 'playwright-core';
import { enrolledKiosk } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("the kiosk's first screen", () => {
  it('when the sign-in screen opens, then it loads at most 150 KB of gzip JS, and the screens after sign-in come with the first tap', async () => {
    const context = await enrolledKiosk(browser);
    const page = await context.newPage();
    const scripts = new Map<string, number>();
    page.on('response', async (res) => {
      if (!new URL(res.url()).pathname.endsWith('.js') || !res.ok()) return;
      const body = await res.body().catch(() => Buffer.alloc(0));
      scripts.set(new URL(res.url()).pathname, gzipSync(body, { level: 9 }).length);
    });
    await page.goto('/kiosk', { waitUntil: 'networkidle' });
    await page.getByRole('button', { name: 'Next: PIN' }).waitFor();
    const firstScreen = [...scripts.values()].reduce((a, b) => a + b, 0) / 1024;
    // Issue 7's target for the kiosk's first screen.
    expect(firstScreen, [...scripts.keys()].join(', ')).toBeLessThanOrEqual(150);
    expect([...scripts.keys()].some((p) => p.includes('kiosk-work-routes'))).toBe(false);

    await page.getByRole('button', { name: '4', exact: true }).click();
    await expect
      .poll(() => [...scripts.keys()].some((p) => p.includes('kiosk-work-routes')), { timeout: 10_000 })
      .toBe(true);
    await context.close();
  });
});

describe('bytes on the wire', () => {
  it('when a tablet asks for a built asset, then it gets the brotli or gzip copy it accepts, cached for a year', async () => {
    const base = inject('baseUrl');
    const html = await (await fetch(`${base}/kiosk`)).text();
    const script = /src="(\/assets\/index-[^"]+\.js)"/.exec(html)?.[1];
    expect(script, 'the page names its script').toBeDefined();
    const plain = await fetch(`${base}${script}`, { headers: { 'Accept-Encoding': 'identity' } });
    const plainBytes = (await plain.arrayBuffer()).byteLength;
    for (const [accept, encoding] of [
      ['br, gzip', 'br'],
      ['gzip', 'gzip'],
    ] as const) {
      // Node's fetch decodes what it receives, so the raw bytes are counted from Content-Length.
      const res = await fetch(`${base}${script}`, { headers: { 'Accept-Encoding': accept } });
      expect(res.headers.get('content-encoding')).toBe(encoding);
      expect(Number(res.headers.get('content-length'))).toBeLessThan(plainBytes / 3);
      expect(res.headers.get('cache-control')).toBe('public, max-age=31536000, immutable');
      expect(res.headers.get('vary')?.toLowerCase()).toContain('accept-encoding');
    }
    // The page itself must never be cached for long: it names the current build's assets.
    expect((await fetch(`${base}/kiosk`)).headers.get('cache-control')).toBe('no-cache');
  });
});
