import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Browser, Page } from 'playwright-core';
import lighthouse from 'lighthouse';
import { launch as launchChrome } from 'chrome-launcher';
import { chromiumFlags } from '@tests/setup/chromium';

/** One first screen to open: its address, the cookie that makes it what a tablet, a TV or a desk sees, and its sign. */
export interface FirstScreen {
  name: string;
  path: string;
  cookie?: string;
  ready: (page: Page) => Promise<unknown>;
}

export interface Transfer {
  kB: number;
  requests: number;
  files: { path: string; bytes: number }[];
}

const QUIET_MS = 800;
const kB = (bytes: number) => Math.round((bytes / 1024) * 10) / 10;

/** Resolves once no request of the page has been in flight for QUIET_MS (fonts and lazy chunks come late). */
function networkQuiet(inFlight: () => number, timeoutMs = 20_000): Promise<void> {
  const started = Date.now();
  let quietSince = Date.now();
  return new Promise((done, fail) => {
    const timer = setInterval(() => {
      if (inFlight() > 0) quietSince = Date.now();
      else if (Date.now() - quietSince >= QUIET_MS) {
        clearInterval(timer);
        done();
      }
      if (Date.now() - started > timeoutMs) {
        clearInterval(timer);
        fail(new Error(`the network did not settle within ${timeoutMs / 1000} s`));
      }
    }, 50);
  });
}

/**
 * Every byte the page received for its first screen, as Chromium counts it (Network.loadingFinished
 * encodedDataLength: headers and the compressed body), in a fresh context, so with an empty cache and no service
 * worker. The service worker's own precache downloads run in the worker, after the screen, and are not counted.
 */
export async function firstScreenTransfer(browser: Browser, baseUrl: string, screen: FirstScreen) {
  const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
  try {
    if (screen.cookie)
      await context.addCookies(
        screen.cookie.split('; ').map((pair) => {
          const at = pair.indexOf('=');
          return { name: pair.slice(0, at), value: pair.slice(at + 1), url: baseUrl };
        }),
      );
    const page = await context.newPage();
    const cdp = await context.newCDPSession(page);
    const urls = new Map<string, string>();
    const open = new Set<string>();
    const files: Transfer['files'] = [];
    // The board's event stream never finishes: its bytes so far are counted, and it is not waited for.
    const streams = new Map<string, number>();
    const record = (id: string, bytes: number) => {
      const url = new URL(urls.get(id) ?? baseUrl);
      files.push({ path: url.pathname + url.search.replace(/board=[^&]+/, 'board=…'), bytes });
    };
    cdp.on('Network.requestWillBeSent', (e) => {
      urls.set(e.requestId, e.request.url);
      if (e.type === 'EventSource') streams.set(e.requestId, 0);
      else open.add(e.requestId);
    });
    cdp.on('Network.dataReceived', (e) => {
      if (streams.has(e.requestId)) streams.set(e.requestId, streams.get(e.requestId)! + e.encodedDataLength);
    });
    cdp.on('Network.loadingFinished', (e) => {
      open.delete(e.requestId);
      if (!streams.delete(e.requestId)) record(e.requestId, e.encodedDataLength);
    });
    cdp.on('Network.loadingFailed', (e) => open.delete(e.requestId));
    await cdp.send('Network.enable');
    await page.goto(`${baseUrl}${screen.path}`);
    await screen.ready(page);
    await networkQuiet(() => open.size);
    for (const [id, bytes] of streams) record(id, bytes);
    const bytes = files.reduce((sum, f) => sum + f.bytes, 0);
    return { kB: kB(bytes), requests: files.length, files } satisfies Transfer;
  } finally {
    await context.close();
  }
}

export interface AuditedPage {
  name: string;
  url: string;
  cookie?: string;
}

export interface Audit {
  performance: number;
  accessibility: number;
  lcpMs: number;
}

/** One Lighthouse run; a busy machine sometimes loses the trace's start (NO_NAVSTART), so that is tried again. */
async function audit(port: number, page: AuditedPage, tries = 3): Promise<Audit> {
  const result = await lighthouse(page.url, {
    port,
    onlyCategories: ['performance', 'accessibility'],
    extraHeaders: page.cookie ? { Cookie: page.cookie } : undefined,
    logLevel: 'error',
  });
  if (!result) throw new Error(`Lighthouse returned nothing for ${page.name}`);
  const { categories, audits, runtimeError } = result.lhr;
  if (runtimeError && tries > 1) return audit(port, page, tries - 1);
  if (runtimeError) throw new Error(`Lighthouse on ${page.name}: ${runtimeError.message}`);
  // BENCH_LIGHTHOUSE_REPORTS=<folder> keeps each page's whole report, to see what its LCP waited for.
  const reports = process.env.BENCH_LIGHTHOUSE_REPORTS;
  if (reports) {
    mkdirSync(reports, { recursive: true });
    writeFileSync(join(reports, `${page.name}.json`), JSON.stringify(result.lhr));
  }
  return {
    performance: categories.performance?.score ?? 0,
    accessibility: categories.accessibility?.score ?? 0,
    lcpMs: Math.round(audits['largest-contentful-paint']?.numericValue ?? NaN),
  };
}

/**
 * Lighthouse's performance and accessibility scores and LCP for each page, with its default mobile preset
 * (simulated slow 4G and a 4x slower CPU), in one Debian Chromium. A page that needs a session gets its cookie
 * through Lighthouse's extra headers, which it sends with every request of the page.
 */
export async function lighthouseAudits(pages: AuditedPage[]): Promise<Record<string, Audit>> {
  const chrome = await launchChrome({ chromePath: '/usr/bin/chromium', chromeFlags: chromiumFlags });
  const audits: Record<string, Audit> = {};
  try {
    for (const page of pages) audits[page.name] = await audit(chrome.port, page);
  } finally {
    chrome.kill();
  }
  return audits;
}
