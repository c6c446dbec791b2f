import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { enrolledKiosk, makeMechanicAndAirframe } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { kioskSignIn, startPreFlight } from '../setup/kiosk-steps';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe('a level read against the marks, with no scale on the glass', () => {
  for (const viewport of [
    { width: 1280, height: 800 },
    { width: 800, height: 1280 },
  ]) {
    it(`when the mechanic taps where the fluid stands at ${viewport.width}x${viewport.height}, then its verdict is on screen above the Back and Next bar`, async () => {
      const { badge, pin, airframe } = await makeMechanicAndAirframe();
      const context = await enrolledKiosk(browser, viewport);
      const page = await context.newPage();
      await kioskSignIn(page, badge, pin);
      await startPreFlight(page, airframe.fleetNumber);
      await page.getByTestId('sight-glass').waitFor();
      await page.getByRole('button', { name: /No scale/ }).click();
      await page.getByRole('button', { name: 'Between minimum and normal', exact: true }).click();

      const verdict = page.getByTestId('verdict').first();
      expect(await verdict.getAttribute('data-verdict')).toBe('in_limits');
      await page.waitForTimeout(300);
      const box = (await verdict.boundingBox())!;
      const barTop = await page.getByRole('button', { name: 'Next', exact: true }).evaluate((next) => {
        // The bar is the pinned element that holds Next.
        let bar: Element | null = next;
        while (bar && !['fixed', 'sticky'].includes(getComputedStyle(bar).position)) bar = bar.parentElement;
        return (bar ?? next).getBoundingClientRect().top;
      });
      expect(box.y).toBeGreaterThanOrEqual(0);
      expect(box.y + box.height).toBeLessThanOrEqual(barTop);
      await context.close();
    });
  }
});
