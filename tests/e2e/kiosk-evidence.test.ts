import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { enrolledKiosk, makeMechanicAndAirframe } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { kioskSignIn, restOfPreFlight, startPreFlight, tapGlass } from '../setup/kiosk-steps';
import { Check, Photo } from '@server/db/models';
import type { StoredCheck } from '@shared/schemas/checks';
import { onePixelPng } from '../setup/images';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const png = onePixelPng;
const markup = '<img src=x onerror=window.__pwned=1>';

const key = (page: Page, name: string) => page.getByRole('button', { name, exact: true });

async function signInAndStart(page: Page, badge: string, pin: string, fleetNumber: string) {
  await kioskSignIn(page, badge, pin);
  await startPreFlight(page, fleetNumber);
}

describe('servicing, photos and notes on the kiosk', () => {
  it('when fluid is added, a photo taken and a note with markup written, then the record holds them and the note shows as text with no script run', async () => {
    const { badge, pin, airframe, staff } = await makeMechanicAndAirframe();
    const context = await enrolledKiosk(browser);
    const page = await context.newPage();
    await signInAndStart(page, badge, pin, airframe.fleetNumber);

    await tapGlass(page, 5.0);
    await page.getByTestId('fluid-to-add').waitFor();
    expect(await page.getByTestId('fluid-to-add').textContent()).toMatch(/2\.0 L/);

    // A file that is not a picture is refused with the server's own words.
    await page
      .getByTestId('photo-input')
      .setInputFiles({ name: 'notes.txt', mimeType: 'image/png', buffer: Buffer.from('not a picture') });
    await page.getByText('That file is not a photo').waitFor();
    await page
      .getByTestId('photo-input')
      .setInputFiles({ name: 'glass.png', mimeType: 'image/png', buffer: png });
    await page.getByTestId('photo-thumb').waitFor();

    await page.getByTestId('add-fluid').click();
    // The figure to the mark is a guide only; the quantity is what was poured, typed as measured.
    expect(await page.getByTestId('servicing-estimate').textContent()).toContain('an estimate');
    expect(await page.getByRole('button', { name: /as shown/ }).count()).toBe(0);
    await key(page, '2').click();
    await key(page, 'Next: fluid').click();
    await key(page, 'Other…').click();
    await key(page, 'MIL-PRF-5606').click();
    expect(await page.getByTestId('fluid-refused').getAttribute('data-reason')).toBe('different_base');
    expect(await page.getByTestId('fluid-refused').textContent()).toContain('DO NOT ADD');
    expect(await key(page, 'Next: batch').isDisabled()).toBe(true);
    await page.getByRole('button', { name: /^MIL-PRF-83282/ }).click();
    await key(page, 'Next: batch').click();
    for (const k of ['B', '7', '7', 'Dash', '1']) await key(page, k).click();
    await key(page, 'Next: can opened').click();
    expect(await key(page, 'Save, then re-read the level').isDisabled()).toBe(true);
    await key(page, 'Yesterday').click();
    await key(page, 'Save, then re-read the level').click();
    await page.getByTestId('servicing-summary').waitFor();
    await tapGlass(page, 7.0);
    await key(page, 'Next').click();
    await restOfPreFlight(page);

    expect(await page.getByTestId('review-fluid-sys1.level').textContent()).toContain('MIL-PRF-83282');
    await page.getByTestId('defect-note').fill(markup);
    await page.getByRole('button', { name: 'Sign with PIN' }).click();
    for (const d of pin) await key(page, d).click();
    await key(page, 'Sign').click();
    await page.getByTestId('check-result').waitFor();

    expect(await page.getByTestId('result-note').textContent()).toBe(markup);
    expect(await page.locator('img[src="x"]').count()).toBe(0);
    expect(await page.evaluate(() => (window as unknown as { __pwned?: number }).__pwned)).toBeUndefined();
    expect(await page.getByTestId('result-fluid-sys1.level').textContent()).toContain('B77-1');

    const [check] = await Check.findAll({ where: { airframeId: airframe.id } });
    expect(check).toBeDefined();
    expect(check!.note).toBe(markup);
    const stored = (await (await context.request.get(`/api/checks/${check!.id}`)).json()) as StoredCheck;
    expect(stored.servicing).toHaveLength(1);
    expect(stored.servicing[0]).toMatchObject({
      code: 'sys1.level',
      fluidSpec: 'MIL-PRF-83282',
      batch: 'B77-1',
      levelBefore: { value: 5, unit: 'L' },
      tool: null,
    });
    expect(stored.servicing[0]!.canOpenedOn).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    expect(stored.servicing[0]!.quantityL).toBeCloseTo(2, 6);
    expect(stored.readings.find((r) => r.code === 'sys1.level')!.value).toBeCloseTo(7, 6);
    expect(stored.readings.find((r) => r.code === 'sys1.level')!.photos).toHaveLength(1);
    expect(await Photo.count({ where: { checkId: check!.id, uploadedBy: staff.id } })).toBe(1);
    await context.close();
  });

  it('when the page is reloaded while a signed check waits to send, then the PIN is not kept: the queue asks for it and then sends the check once', async () => {
    const { badge, pin, airframe } = await makeMechanicAndAirframe();
    const context = await enrolledKiosk(browser);
    const page = await context.newPage();
    await signInAndStart(page, badge, pin, airframe.fleetNumber);
    await tapGlass(page, 6.5);
    await key(page, 'Next').click();
    await restOfPreFlight(page);
    await page.getByRole('button', { name: 'Sign with PIN' }).click();
    for (const d of pin) await key(page, d).click();
    await page.route('**/api/checks', (route) => route.abort('connectionrefused'));
    await key(page, 'Sign').click();
    await page.getByTestId('queue-item').waitFor();
    await page.unroute('**/api/checks');

    await page.reload();
    const item = page.getByTestId('queue-item');
    await expect.poll(() => item.getAttribute('data-state'), { timeout: 10_000 }).toBe('needs_pin');
    expect(await item.textContent()).toContain('does not keep PINs');
    // Nothing goes out without the PIN typed again.
    await page.waitForTimeout(3_000);
    expect(await Check.count({ where: { airframeId: airframe.id } })).toBe(0);

    await key(page, 'Enter PIN').click();
    for (const d of pin) await key(page, d).click();
    await key(page, 'Sign and send').click();
    await page.getByTestId('queue-sent').waitFor({ timeout: 20_000 });
    expect(await Check.count({ where: { airframeId: airframe.id } })).toBe(1);
    await context.close();
  });
});
