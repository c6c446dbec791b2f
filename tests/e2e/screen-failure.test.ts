import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from '../setup/chromium';

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
    const context = await browser.newContext({
      viewport: { width: 1280, height: 800 },
      baseURL: inject('baseUrl'),
      serviceWorkers: 'block',
    });
    const page = await context.newPage();
    await page.goto('/desk');
    await page.getByLabel('Badge number').fill('7401');
    await page.getByLabel('Password').fill('desk-engineering');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/desk\/home/);

    await page.route(/\/assets\/records-pages-[^/]+\.js$/, (route) => route.abort('connectionreset'));
    await page.getByRole('link', { name: 'Records' }).first().click();
    const failed = page.getByRole('alert').filter({ hasText: 'This screen failed' });
    await failed.waitFor();
    expect(await failed.textContent()).toContain('Readings typed so far are kept on this tablet.');
    expect(await failed.getByRole('button', { name: 'Reload' }).isVisible()).toBe(true);

    await page.unroute(/\/assets\/records-pages-[^/]+\.js$/);
    await page.goBack();
    await page.getByRole('heading', { name: /Good to see you/ }).waitFor();
    expect(await page.getByText('This screen failed').count()).toBe(0);
    await context.close();
  });
});
