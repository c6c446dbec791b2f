import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { cpSync, existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import type { Browser, Page } from 'playwright-core';
import { createApp } from '@server/app';
import { loadConfig } from '@server/config';
import { e2eDatabase, enrolledKiosk, makeMechanicAndAirframe } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { fillPreFlight, kioskSignIn, startPreFlight, tapGlass } from '../setup/kiosk-steps';
import { Check } from '@server/db/models';

// This file serves its own copy of the build, from a folder it can "deploy" a new version into, through the real
// app on the e2e database: the test server's build is shared with the other browser tests and stays untouched.
let browser: Browser;
let server: Server;
let closeApp: () => void;
let baseURL: string;
let buildDir: string;

beforeAll(async () => {
  browser = await launchBrowser();
  buildDir = mkdtempSync(join(tmpdir(), 'gaugewalk-build-'));
  cpSync(resolve('dist'), buildDir, { recursive: true });
  const config = loadConfig({
    DATABASE_URL: inject('e2eDatabaseUrl'),
    SESSION_SECRET: 'e2e-secret-that-is-long-enough',
    BCRYPT_COST: '4',
    SIGN_IN_RATE_PER_MINUTE: '10000',
    LOG_LEVEL: 'warn',
  });
  const built = createApp({ config, sequelize: e2eDatabase(), clientDir: buildDir });
  closeApp = built.close;
  server = createServer(built.app);
  await new Promise<void>((ok) => server.listen(0, '127.0.0.1', ok));
  const address = server.address();
  baseURL = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`;
});

afterAll(async () => {
  await browser?.close();
  closeApp?.();
  server?.closeAllConnections();
  await new Promise((ok) => server?.close(ok));
  if (buildDir) rmSync(buildDir, { recursive: true, force: true });
});

/**
 * A new build, as a deploy leaves it: the service worker script differs by a byte (here a comment with the build
 * time), and its brotli and gzip copies are written again beside it, since the server sends those first.
 */
function deployNewBuild() {
  const sw = join(buildDir, 'sw.js');
  const script = `${readFileSync(sw, 'utf8')}\n// build ${new Date().toISOString()}\n`;
  writeFileSync(sw, script);
  if (existsSync(`${sw}.br`)) writeFileSync(`${sw}.br`, brotliCompressSync(script));
  if (existsSync(`${sw}.gz`)) writeFileSync(`${sw}.gz`, gzipSync(script));
}

/** What the page does on its own when it looks for a new version: the registration's update check. */
const checkForUpdate = (page: Page) =>
  page.evaluate(async () => {
    const registration = await navigator.serviceWorker.getRegistration();
    await registration?.update();
  });

const waitingWorker = (page: Page) =>
  page.evaluate(async () => (await navigator.serviceWorker.getRegistration())?.waiting?.state ?? null);

describe('a new version while a check is open', () => {
  it('when a new build is deployed during a check, then no update is offered until the check is left, and updating keeps the draft and the send queue', async () => {
    const { badge, pin, airframe } = await makeMechanicAndAirframe();
    const kiosk = await enrolledKiosk(browser, { width: 1280, height: 800 }, baseURL);
    const page = await kiosk.newPage();
    await kioskSignIn(page, badge, pin);
    await page.waitForFunction(
      async () => (await navigator.serviceWorker.ready).active?.state === 'activated',
      undefined,
      { timeout: 30_000 },
    );

    // A signed check waits in the send queue: the server does not take it now.
    await kiosk.route('**/api/checks', (route) => route.abort('connectionrefused'));
    await fillPreFlight(page, airframe.fleetNumber, pin, 6.5);
    await page.getByRole('button', { name: 'Sign', exact: true }).click();
    await page.getByTestId('queue-item').waitFor({ timeout: 15_000 });

    // A second pre-flight is open with two levels read: a draft on the tablet, on the second checkpoint.
    await page.goto('/kiosk/airframes');
    await startPreFlight(page, airframe.fleetNumber);
    await tapGlass(page, 6.8);
    await page.getByRole('button', { name: 'Next', exact: true }).click();
    await page.getByText('Checkpoint 2 of 8').waitFor();
    await tapGlass(page, 4.2);
    await page.getByRole('button', { name: 'Go to review' }).click();
    const level1 = await page.getByTestId('review-sys1.level').textContent();
    const level2 = await page.getByTestId('review-sys2.level').textContent();
    expect(level1).toMatch(/\d/);
    expect(level2).toMatch(/\d/);
    await page.getByRole('button', { name: /^Go to checkpoint 2,/ }).click();
    await page.getByText('Checkpoint 2 of 8').waitFor();

    deployNewBuild();
    await checkForUpdate(page);
    await expect.poll(() => waitingWorker(page), { timeout: 30_000 }).toBe('installed');
    // The new version is there and waiting, and the check card shows no offer: a reload would cut into it.
    await page.waitForTimeout(1_000);
    expect(await page.getByTestId('update-offer').count()).toBe(0);
    expect(await page.getByText('Checkpoint 2 of 8').count()).toBe(1);
    expect(page.url()).toMatch(/\/check\/pre_flight$/);

    // Paused back to the airframe: now the offer shows.
    await page.getByRole('button', { name: 'Pause', exact: true }).click();
    await page.getByTestId('start-pre_flight').waitFor();
    await page.getByTestId('update-offer').waitFor({ timeout: 10_000 });

    await Promise.all([
      page.waitForEvent('load', { timeout: 30_000 }),
      page.getByRole('button', { name: 'Update now' }).click(),
    ]);
    await page.getByTestId('start-pre_flight').waitFor({ timeout: 15_000 });
    // The new worker runs the page and nothing waits any more.
    await expect.poll(() => waitingWorker(page), { timeout: 15_000 }).toBeNull();
    expect(
      await page.evaluate(async () => (await navigator.serviceWorker.getRegistration())?.active?.state),
    ).toBe('activated');
    expect(await page.getByTestId('update-offer').count()).toBe(0);

    // The draft opens where it was left, with both levels as read.
    await page.getByTestId('start-pre_flight').click();
    await page.getByText('Checkpoint 2 of 8').waitFor();
    await page.getByRole('button', { name: 'Go to review' }).click();
    expect(await page.getByTestId('review-sys1.level').textContent()).toBe(level1);
    expect(await page.getByTestId('review-sys2.level').textContent()).toBe(level2);

    // The queued check is still there (its PIN was not kept across the reload), and nothing reached the server.
    await page.goto('/kiosk/queue');
    await expect
      .poll(() => page.getByTestId('queue-item').getAttribute('data-state'), { timeout: 10_000 })
      .toBe('needs_pin');
    expect(await page.getByTestId('queue-item').count()).toBe(1);
    expect(await Check.count({ where: { airframeId: airframe.id } })).toBe(0);
    await kiosk.close();
  }, 120_000);
});
