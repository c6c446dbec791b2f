import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { e2eDatabase, enrolledKiosk, makeMechanicAndAirframe } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { cuttableLink, type CuttableLink } from '../setup/cuttable-link';
import { fillPreFlight, kioskSignIn } from '../setup/kiosk-steps';
import { Check } from '@server/db/models';

let browser: Browser;
let link: CuttableLink;
beforeAll(async () => {
  browser = await launchBrowser();
  link = await cuttableLink(inject('baseUrl'));
});
afterAll(async () => {
  await browser?.close();
  await link?.close();
});

describe('a tablet that loses the network', () => {
  it('when the kiosk is reloaded with no network, then it opens from its own copy, shows the check waiting to send, and stores it once when the network returns', async () => {
    const { badge, pin, airframe } = await makeMechanicAndAirframe();
    const context = await enrolledKiosk(browser, undefined, link.url);
    const page = await context.newPage();
    await kioskSignIn(page, badge, pin);
    // The service worker has copied the app's screens once it is active.
    await page.waitForFunction(
      async () => (await navigator.serviceWorker.ready).active?.state === 'activated',
      undefined,
      { timeout: 30_000 },
    );
    await fillPreFlight(page, airframe.fleetNumber, pin, 6.5);

    // The link to the server is cut (nothing more reaches it), and the browser is told it is offline.
    link.cut();
    await context.setOffline(true);
    await page.getByRole('button', { name: 'Sign', exact: true }).click();
    await page.getByTestId('queue-item').waitFor({ timeout: 15_000 });

    // Reloaded with no network: the app itself opens, says the server cannot be reached, and keeps the queue.
    await page.reload();
    await page.getByText('The server cannot be reached').first().waitFor({ timeout: 15_000 });
    expect(await page.getByTestId('send-queue').textContent()).toContain('Waiting to send (1)');
    expect(await page.getByTestId('queue-item').textContent()).toContain(airframe.fleetNumber);
    expect(await Check.count({ where: { airframeId: airframe.id } })).toBe(0);

    // The network returns: the same session goes on. The tablet kept no PIN across the reload, so the mechanic
    // signs again from the queue, and the check is stored exactly once.
    link.restore();
    await context.setOffline(false);
    await page.getByRole('button', { name: 'Try again' }).click();
    await page.goto('/kiosk/queue');
    await page.getByRole('button', { name: 'Enter PIN' }).click();
    const dialog = page.getByRole('dialog');
    for (const d of pin) await dialog.getByRole('button', { name: d, exact: true }).click();
    await dialog.getByRole('button', { name: 'Sign and send' }).click();
    await expect.poll(() => Check.count({ where: { airframeId: airframe.id } }), { timeout: 60_000 }).toBe(1);
    await expect.poll(() => page.getByTestId('queue-item').count(), { timeout: 30_000 }).toBe(0);
    expect(await Check.count({ where: { airframeId: airframe.id } })).toBe(1);
    await context.close();
  });
});

describe('a hangar TV that loses the server', () => {
  it('when the board is reloaded while the server cannot be reached, then it still shows its last tiles, marked stale with their time', async () => {
    const { airframe } = await makeMechanicAndAirframe();
    const { createBoardLink } = await import('@server/features/board-links/board-links.service');
    const link = await createBoardLink(e2eDatabase(), 'Offline TV', 1);
    const tv = await browser.newContext({
      viewport: { width: 1920, height: 1080 },
      baseURL: inject('baseUrl'),
    });
    const board = await tv.newPage();
    await board.goto(link.path);
    await board.getByTestId(`board-${airframe.fleetNumber}`).waitFor();
    await board.waitForFunction(
      async () => (await navigator.serviceWorker.ready).active?.state === 'activated',
      undefined,
      { timeout: 30_000 },
    );

    await tv.route('**/api/**', (route) => route.abort('internetdisconnected'));
    await tv.setOffline(true);
    await board.reload();
    await board.getByTestId('board-stale').waitFor({ timeout: 15_000 });
    expect(await board.getByTestId('board-stale').textContent()).toMatch(
      /Shown as of \d{1,2} [A-Z][a-z]{2} \d{4}, \d{2}:\d{2} /,
    );
    expect(await board.getByTestId(`board-${airframe.fleetNumber}`).isVisible()).toBe(true);
    await tv.close();
  });
});
