import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import type { Browser } from 'playwright-core';
import { enrolledKiosk } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { kioskSignIn, tapGlass } from '../setup/kiosk-steps';
import { demoStaff } from '@server/db/seeders/demo-rows';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const catalogue = (language: string, namespace: string) =>
  JSON.parse(readFileSync(`shared/i18n/locales/${language}/${namespace}.json`, 'utf8')) as unknown;

const texts = (value: unknown): string[] =>
  typeof value === 'string'
    ? [value]
    : value && typeof value === 'object'
      ? Object.values(value).flatMap(texts)
      : [];

/** German texts of the screens after sign-in that read differently from their English, placeholders left out. */
function germanOnly(namespaces: string[]): string[] {
  const english = new Set(namespaces.flatMap((ns) => texts(catalogue('en', ns))));
  return namespaces
    .flatMap((ns) => texts(catalogue('de', ns)))
    .filter((text) => !english.has(text) && !text.includes('{{') && text.length >= 4);
}

describe('preferred language at the kiosk', () => {
  it('when the demo mechanic who prefers German signs in on an English tablet, then the next screen is in German', async () => {
    const tomas = demoStaff.find((s) => s.language === 'de')!;
    const context = await enrolledKiosk(browser);
    await context.addInitScript(() => window.localStorage.setItem('gaugewalk.language', 'en'));
    const page = await context.newPage();
    await kioskSignIn(page, tomas.badge, tomas.pin);
    await page.waitForURL(/\/kiosk\/airframes/);
    await expect.poll(() => page.evaluate(() => document.documentElement.lang)).toBe('de');
    const german = germanOnly(['app', 'kiosks', 'airframes']);
    expect(german.length, 'the screens after sign-in have German words').toBeGreaterThan(0);
    await expect
      .poll(async () => {
        const shown = await page.locator('body').innerText();
        return german.filter((text) => shown.includes(text));
      })
      .not.toEqual([]);
    await context.close();
  });

  it('when that mechanic enters a pre-charge too low, then the kiosk tells him in German what is wrong and what to do as he types', async () => {
    const tomas = demoStaff.find((s) => s.language === 'de')!;
    const context = await enrolledKiosk(browser);
    const page = await context.newPage();
    const key = (name: string) => page.getByRole('button', { name, exact: true });
    await kioskSignIn(page, tomas.badge, tomas.pin);
    await page.waitForURL(/\/kiosk\/airframes/);
    await page.getByTestId('airframe-T-01').click();
    await page.getByTestId('start-pre_flight').click();
    await key('Auf Rädern').click();
    await key('Drucklos').click();
    if ((await page.getByTestId('ambient-temp').textContent())?.includes('Nicht gesetzt'))
      await page.getByRole('button', { name: '20 Grad C' }).click();
    await key('Weiter').click();
    await tapGlass(page, 6.5);
    await key('Weiter').click();
    await tapGlass(page, 4.0);
    await key('Weiter').click();
    await page.getByTestId('reading-value').waitFor();
    await key('1').click();
    await key('0').click();
    // The pre-charge's bands are worked out for the temperature, so their words were composed in English.
    const verdict = page
      .getByRole('region', { name: /.+/ })
      .filter({ has: page.getByTestId('expected-precharge') });
    await expect
      .poll(() => verdict.innerText())
      .toMatch(/Vorfülldruck zu niedrig: bei dieser Temperatur werden \d+,\d bar erwartet\./);
    expect(await verdict.innerText()).toMatch(/Stickstoff auf \d+,\d bar nachfüllen/);
    expect(await verdict.innerText()).not.toMatch(/Pre-charge|nitrogen/);
    await context.close();
  });
});
