import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { enrolledKiosk, makeMechanicAndAirframe } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';

// Kiosk targets are at least 20 mm, taken as 76 CSS px (../shared/TESTING.md).
const minTarget = 76;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const key = (page: Page, name: string) => page.getByRole('button', { name, exact: true });

async function boxOf(page: Page, testId: string) {
  const box = await page.getByTestId(testId).boundingBox();
  if (!box) throw new Error(`${testId} is not on the screen`);
  return box;
}

/** Keys the screens asked for that the catalogue lacks (src/i18n/i18n.ts keeps them on window). */
const missingKeys = (page: Page) => page.evaluate(() => window.__gaugewalkMissingKeys ?? []);

async function choose(page: Page, languageName: string) {
  await page.getByTestId('language-button').click();
  const dialog = page.getByRole('dialog');
  await dialog.waitFor();
  // Every shipped language is offered, each named in itself, each glove-sized.
  await expect(dialog.getByRole('button', { name: 'English', exact: true }).count()).resolves.toBe(1);
  await expect(dialog.getByRole('button', { name: 'Deutsch', exact: true }).count()).resolves.toBe(1);
  for (const id of ['language-en', 'language-de']) {
    const box = await boxOf(page, id);
    expect(box.width).toBeGreaterThanOrEqual(minTarget);
    expect(box.height).toBeGreaterThanOrEqual(minTarget);
  }
  await dialog.getByRole('button', { name: languageName, exact: true }).click();
  await dialog.waitFor({ state: 'detached' });
}

describe("the kiosk's language button", () => {
  it('when a mechanic picks Deutsch on the sign-in screen, then sign-in and the airframe list read German, the tablet keeps it after a reload, and English comes back the same way', async () => {
    const { badge, pin, airframe } = await makeMechanicAndAirframe();
    const context = await enrolledKiosk(browser, { width: 800, height: 1280 });
    const page = await context.newPage();

    await page.goto('/kiosk');
    await key(page, 'Next: PIN').waitFor();
    const button = await boxOf(page, 'language-button');
    expect(button.width).toBeGreaterThanOrEqual(minTarget);
    expect(button.height).toBeGreaterThanOrEqual(minTarget);
    await expect(page.getByTestId('language-button').textContent()).resolves.toBe('English');

    await choose(page, 'Deutsch');
    await key(page, 'Weiter: PIN').waitFor();
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe('Anmelden');
    await expect(page.evaluate(() => document.documentElement.lang)).resolves.toBe('de');

    // Kept per tablet: a reload (or the next badge) finds the tablet in German.
    await page.reload();
    await key(page, 'Weiter: PIN').waitFor();
    await expect(page.evaluate(() => localStorage.getItem('gaugewalk.language'))).resolves.toBe('de');

    for (const d of badge) await key(page, d).click();
    await key(page, 'Weiter: PIN').click();
    for (const d of pin) await key(page, d).click();
    await key(page, 'Anmelden').click();
    await page.getByTestId(`airframe-${airframe.fleetNumber}`).waitFor();
    await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe('Luftfahrzeuge');
    await expect(page.getByRole('button', { name: 'Flottennummer eintippen' }).count()).resolves.toBe(1);
    await page.getByTestId(`airframe-${airframe.fleetNumber}`).click();
    await expect(page.getByTestId('start-pre_flight').textContent()).resolves.toBe('Vorflugprüfung beginnen');
    // The header's button is there after sign-in too, beside Sign out.
    await expect(page.getByRole('button', { name: 'Abmelden' }).count()).resolves.toBe(1);
    await expect(missingKeys(page)).resolves.toEqual([]);

    await choose(page, 'English');
    await expect(page.getByTestId('start-pre_flight').textContent()).resolves.toBe('Start Pre-flight check');
    await expect(page.getByRole('button', { name: 'Type fleet number' }).count()).resolves.toBe(1);
    await expect(page.evaluate(() => localStorage.getItem('gaugewalk.language'))).resolves.toBe('en');
    await context.close();
  });

  it("when a badge and PIN that do not match are typed on a German tablet, then the refusal itself reads German, not the server's English", async () => {
    const context = await enrolledKiosk(browser);
    const page = await context.newPage();
    // An upright tablet: the refusal must not push the keypad below the screen.
    await page.setViewportSize({ width: 800, height: 1280 });
    await page.goto('/kiosk');
    await key(page, 'Next: PIN').waitFor();
    await choose(page, 'Deutsch');
    // A badge nobody holds: the answer is the same as for a wrong PIN, so badges cannot be probed.
    for (const d of '4199') await key(page, d).click();
    await key(page, 'Weiter: PIN').click();
    for (const d of '0000') await key(page, d).click();
    const answered = page.waitForResponse((res) => new URL(res.url()).pathname === '/api/auth/kiosk');
    await key(page, 'Anmelden').click();
    expect((await answered).status()).toBe(401);
    const notice = page.getByRole('alert').filter({ hasText: 'Ausweis und PIN passen nicht zusammen' });
    await expect.poll(() => notice.innerText()).toContain('oder der Ausweis kann sich nicht anmelden');
    expect(await notice.innerText()).not.toMatch(/do not match|shift lead/);
    // The PIN is cleared, so the refusal stands where Sign in was until the next digit: every key stays on screen.
    for (const d of '0123456789') {
      const box = await key(page, d).boundingBox();
      expect(box!.y + box!.height, `key ${d}`).toBeLessThanOrEqual(1280);
    }
    await key(page, '1').click();
    await expect.poll(() => notice.count()).toBe(0);
    await expect(key(page, 'Anmelden').isVisible()).resolves.toBe(true);
    await context.close();
  });
});
