import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { enrolledKiosk, makeMechanicAndAirframe } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { kioskSignIn } from '../setup/kiosk-steps';

// A German screen writes "321,4 h". The keypad's decimal key and the figures typed on it must say the same, or a
// mechanic reads "321.4" beside "321,4" on one screen and cannot tell which the tablet took.
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const key = (page: Page, name: string) => page.getByRole('button', { name, exact: true });

async function chooseLanguage(page: Page, id: 'language-de' | 'language-en') {
  await page.getByTestId('language-button').click();
  await page.getByTestId(id).click();
  await page.getByRole('dialog').waitFor({ state: 'detached' });
}

const decimalKey = (page: Page, name: string) =>
  page.getByRole('group', { name }).getByRole('button', { name: /^Decimal point$|^Dezimalkomma$/ });

describe('decimal figures on the kiosk keypad', () => {
  it("when a German mechanic types an after-flight's hours, then the decimal key, the figures and the typed hours use the comma, and hours below the last recorded are flagged; in English the point", async () => {
    const { badge, pin, airframe } = await makeMechanicAndAirframe();
    const context = await enrolledKiosk(browser);
    const page = await context.newPage();
    await kioskSignIn(page, badge, pin);
    await page.goto(`/kiosk/airframes/${airframe.id}`);
    await page.getByTestId('start-after_flight').click();
    await key(page, 'Next').waitFor();
    // The after-flight asks for what its card's readings need of the context; answer what it asks.
    for (const name of ['On wheels', 'Relieved'])
      if ((await key(page, name).count()) > 0) await key(page, name).click();
    const temperature = page.getByTestId('ambient-temp');
    if ((await temperature.count()) > 0 && (await temperature.textContent())?.includes('Not set'))
      await page.getByRole('button', { name: '20 degrees C' }).click();
    await key(page, 'Next').click();
    await page.getByRole('button', { name: 'Go to hours, flights and landings' }).click();
    await page.getByRole('heading', { name: 'Hours, flights and landings' }).waitFor();
    await page.getByRole('button', { name: /^Airframe hours/ }).click();
    for (const k of ['1', '2', '3', '6', 'Decimal point', '5']) await key(page, k).click();
    await expect(page.getByTestId('usage-hours').textContent()).resolves.toBe('1236.5');
    await expect(page.locator('[data-testid="usage-below"]:visible').count()).resolves.toBe(0);
    await expect(decimalKey(page, 'Keypad').textContent()).resolves.toBe('.');

    await chooseLanguage(page, 'language-de');
    await page.getByRole('heading', { name: 'Stunden, Flüge und Landungen' }).waitFor();
    await expect(decimalKey(page, 'Tastenfeld').textContent()).resolves.toBe(',');
    await expect(page.getByTestId('usage-hours').textContent()).resolves.toBe('1236,5');
    // The digits typed so far read with the comma too, and the key types a decimal, not a thousands mark.
    await page.getByRole('button', { name: /^Betriebsstunden/ }).click();
    for (const k of ['4', '2']) await key(page, k).click();
    await decimalKey(page, 'Tastenfeld').click();
    await expect(page.locator('output[aria-label="Betriebsstunden"]').textContent()).resolves.toBe('42,');
    await key(page, '7').click();
    await expect(page.getByTestId('usage-hours').textContent()).resolves.toBe('42,7');
    await expect(page.getByTestId('usage-flown').textContent()).resolves.not.toMatch(/\d\.\d/);
    // 42,7 h is below the airframe's last recorded hours: the step says so before the review, in German.
    await expect(page.locator('[data-testid="usage-below"]:visible').textContent()).resolves.toMatch(
      /^Betriebsstunden: weniger als die zuletzt erfassten \d+,\d h\./,
    );

    // On a portrait tablet the keypad is under the figures: the caution goes under the keypad, so a key does not
    // move between two taps when a figure drops below the last one.
    await page.setViewportSize({ width: 800, height: 1280 });
    await page.getByRole('button', { name: /^Betriebsstunden/ }).click();
    for (const k of ['9', '9', '9']) await key(page, k).click();
    await expect(page.locator('[data-testid="usage-below"]:visible').count()).resolves.toBe(0);
    // Where the key sits on the page (a tap scrolls the page first, so the box on the screen may move with it).
    const onPage = () =>
      key(page, '9').evaluate((el) => {
        const box = el.getBoundingClientRect();
        return { x: box.left + window.scrollX, y: box.top + window.scrollY };
      });
    const before = await onPage();
    await key(page, 'Letzte Ziffer löschen').click();
    await key(page, 'Letzte Ziffer löschen').click();
    await page.locator('[data-testid="usage-below"]:visible').waitFor();
    expect(await onPage()).toEqual(before);
    await page.setViewportSize({ width: 1280, height: 800 });
    await page.getByRole('button', { name: /^Betriebsstunden/ }).click();
    for (const k of ['4', '2']) await key(page, k).click();
    await decimalKey(page, 'Tastenfeld').click();
    await key(page, '7').click();
    await chooseLanguage(page, 'language-en');
    await expect(page.getByTestId('usage-hours').textContent()).resolves.toBe('42.7');
    await context.close();
  });
});
