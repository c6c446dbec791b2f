import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from '../setup/chromium';
import { deskContext } from '../setup/kiosk-steps';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe('a screen whose code cannot be fetched', () => {
  it('when the records screen fails to load, then the page says so in words and keeps its reload button, and going back to the screen before works again without a reload', async () => {
    // No service worker: it would fetch the chunks itself, out of reach of page.route.
    const { context, page } = await deskContext(browser, '7401', 'desk-engineering', 'block');

    await page.route(/\/assets\/records-pages-[^/]+\.js$/, (route) => route.abort('connectionreset'));
    await page.getByRole('link', { name: 'Records' }).first().click();
    const failed = page.getByRole('alert').filter({ hasText: 'This screen failed' });
    await failed.waitFor();
    // Words only: the browser's own message names the file's address.
    expect(await failed.textContent()).toContain(
      'Something went wrong. Readings typed so far are kept on this tablet.',
    );
    expect(await failed.textContent()).not.toMatch(/assets|https?:|import/i);
    expect(await failed.getByRole('button', { name: 'Reload' }).isVisible()).toBe(true);

    await page.unroute(/\/assets\/records-pages-[^/]+\.js$/);
    await page.goBack();
    await page.getByRole('heading', { name: /Good to see you/ }).waitFor();
    expect(await page.getByText('This screen failed').count()).toBe(0);
    await context.close();
  });
});
