import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { enrolledKiosk, makeMechanicAndAirframe } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { kioskSignIn } from '../setup/kiosk-steps';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** WCAG 2.x relative luminance and contrast ratio of two computed rgb() colours. */
function contrast(a: string, b: string) {
  const luminance = (css: string) => {
    const [r, g, bl] = (css.match(/[\d.]+/g) ?? []).slice(0, 3).map((v) => {
      const c = Number(v) / 255;
      return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
    });
    return 0.2126 * r! + 0.7152 * g! + 0.0722 * bl!;
  };
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi! + 0.05) / (lo! + 0.05);
}

/**
 * What every airframe's state badge on the list says and shows: its word, its drawn shape, and the fill of the
 * states drawn on a cockpit colour (red, amber, green, blue fills stay the same in both themes).
 */
const badges = (page: Page) =>
  page.getByTestId('airframe-state').evaluateAll((all) =>
    all.map((badge) => {
      const state = badge.getAttribute('data-state');
      const tile = badge.parentElement?.closest('[data-testid^="airframe-"]')?.getAttribute('data-testid');
      const filled = state !== 'not_checked' && state !== 'checks_in_limits';
      return {
        tile,
        state,
        word: badge.textContent?.trim(),
        shape: badge.querySelector('svg')?.innerHTML,
        fill: filled ? getComputedStyle(badge).backgroundColor : 'the page',
      };
    }),
  );

describe('the kiosk in daylight', () => {
  it('when the header button is tapped, then the kiosk turns to its daylight colours at 7:1 or more, keeps the choice on this tablet, and states keep their word, shape and colour', async () => {
    const { badge, pin, airframe } = await makeMechanicAndAirframe();
    const kiosk = await enrolledKiosk(browser);
    const page = await kiosk.newPage();
    await kioskSignIn(page, badge, pin);
    await page.getByTestId(`airframe-${airframe.fleetNumber}`).waitFor();
    const night = await badges(page);
    // The demo fleet shows states on a cockpit fill (on hold, check due) beside this test's own unchecked airframe.
    expect(night.some((b) => b.fill !== 'the page')).toBe(true);

    const switcher = page.getByTestId('theme-switch');
    expect(await switcher.textContent()).toBe('Daylight');
    const box = (await switcher.boundingBox())!;
    expect(Math.min(box.width, box.height)).toBeGreaterThanOrEqual(76);
    await switcher.click();

    expect(await page.evaluate(() => document.documentElement.dataset.theme)).toBe('daylight');
    expect(await switcher.textContent()).toBe('Night');
    const colours = await page.evaluate(() => {
      const style = (selector: string) => getComputedStyle(document.querySelector(selector)!);
      return {
        page: getComputedStyle(document.documentElement).backgroundColor,
        heading: style('h1').color,
        header: style('header').backgroundColor,
        key: style('[data-testid="theme-switch"]').backgroundColor,
        keyWord: style('[data-testid="theme-switch"]').color,
      };
    });
    // A light page with near-black words: well past 7:1 (WCAG 1.4.6) on the page, the header and a button.
    expect(contrast(colours.page, 'rgb(255, 255, 255)')).toBeLessThan(1.1);
    expect(contrast(colours.heading, colours.header)).toBeGreaterThanOrEqual(7);
    expect(contrast(colours.keyWord, colours.key)).toBeGreaterThanOrEqual(7);

    // Every state reads the same: the same word, the same shape, the same cockpit fill.
    // (Tiles other browser tests add meanwhile are left out.)
    const day = await badges(page);
    expect(day.filter((b) => night.some((n) => n.tile === b.tile))).toEqual(night);

    // The choice belongs to this tablet: it is still daylight after a reload, and the button turns it back.
    await page.reload();
    await page.getByTestId(`airframe-${airframe.fleetNumber}`).waitFor();
    expect(await page.evaluate(() => document.documentElement.dataset.theme)).toBe('daylight');
    await page.getByTestId('theme-switch').click();
    expect(await page.evaluate(() => document.documentElement.dataset.theme)).toBe('night');
    expect(await page.evaluate(() => localStorage.getItem('gw.kiosk.theme'))).toBe('night');
    await kiosk.close();
  });
});
