import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { enrolledKiosk, makeMechanicAndAirframe } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { kioskSignIn, tapGlass } from '../setup/kiosk-steps';
import { Check, Tool } from '@server/db/models';
import { localDay } from '@shared/domain/local-time';
import type { StoredCheck } from '@shared/schemas/checks';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const key = (page: Page, name: string) => page.getByRole('button', { name, exact: true });
const day = (offsetDays: number) =>
  localDay(new Date(Date.now() + offsetDays * 86_400_000), Intl.DateTimeFormat().resolvedOptions().timeZone);

/** Three tools of this test's own: a gauge in calibration, one overdue since last week, a servicing cart. */
async function registerTools() {
  const suffix = Math.random().toString(36).slice(2, 6).toUpperCase();
  const made = await Tool.bulkCreate([
    {
      number: `PG-${suffix}1`,
      kind: 'pressure_gauge',
      description: 'Test gauge 0-100 bar',
      serial: `E2E-${suffix}-1`,
      calibrationDue: day(60),
    },
    {
      number: `PG-${suffix}2`,
      kind: 'pressure_gauge',
      description: 'Test gauge 0-250 bar',
      serial: `E2E-${suffix}-2`,
      calibrationDue: day(-7),
    },
    {
      number: `SC-${suffix}`,
      kind: 'servicing_cart',
      description: 'Hydraulic servicing cart',
      serial: `E2E-${suffix}-3`,
      calibrationDue: day(90),
    },
  ]);
  const [gauge, overdue, cart] = made.map((t) => t.number) as [string, string, string];
  return { gauge, overdue, cart };
}

describe('a servicing check with tools on the kiosk', () => {
  it('when fluid is added from a cart and the pre-charge is read on a gauge in calibration, then the signed record names both; the overdue gauge cannot be picked', async () => {
    const { badge, pin, airframe } = await makeMechanicAndAirframe();
    const { gauge, overdue, cart } = await registerTools();
    const context = await enrolledKiosk(browser);
    const page = await context.newPage();
    await kioskSignIn(page, badge, pin);

    await page.getByTestId(`airframe-${airframe.fleetNumber}`).click();
    await page.getByTestId('start-servicing').click();
    await key(page, 'On wheels').click();
    await key(page, 'Relieved').click();
    if ((await page.getByTestId('ambient-temp').textContent())?.includes('Not set')) {
      await page.getByRole('button', { name: '20 degrees C' }).click();
    }
    await key(page, 'Next').click();

    // System 1 low: the figure to the mark is offered as an estimate, and what was poured is entered as measured.
    await tapGlass(page, 5.5);
    expect(await page.getByTestId('fluid-to-add').textContent()).toMatch(/About 1\.5 L .*an estimate/);
    await page.getByTestId('add-fluid').click();
    for (const k of ['1', 'Decimal point', '5']) await key(page, k).click();
    await key(page, 'Next: fluid').click();
    await page.getByRole('button', { name: /^MIL-PRF-83282/ }).click();
    await key(page, 'Next: batch').click();
    for (const k of ['C', '9']) await key(page, k).click();
    await key(page, 'Next: can opened').click();
    await key(page, 'Today').click();
    await key(page, 'Pick tool').click();
    await page.getByRole('button', { name: new RegExp(`^${cart}`) }).click();
    expect(await page.getByTestId('tool-chosen').textContent()).toContain(cart);
    await key(page, 'Save, then re-read the level').click();
    await page.getByTestId('servicing-summary').waitFor();
    await tapGlass(page, 7.0);
    await key(page, 'Next').click();

    await tapGlass(page, 4.5);
    await key(page, 'Next').click();

    await page.getByTestId('reading-value').waitFor();
    await key(page, '4').click();
    await key(page, '5').click();
    await key(page, 'Pick tool').click();
    const overdueButton = page.getByRole('button', { name: new RegExp(`^${overdue}`) });
    expect(await overdueButton.isDisabled()).toBe(true);
    expect(await overdueButton.textContent()).toContain('Calibration overdue since');
    await page.getByRole('button', { name: new RegExp(`^${gauge}`) }).click();
    expect(await page.getByTestId('tool-chosen').textContent()).toContain(gauge);
    await key(page, 'Next').click();

    await page.getByRole('button', { name: 'Sign with PIN' }).waitFor();
    expect(await page.getByTestId('review-tool-brake.precharge').textContent()).toContain(gauge);
    expect(await page.getByTestId('review-fluid-sys1.level').textContent()).toContain(`cart ${cart}`);
    await page.getByRole('button', { name: 'Sign with PIN' }).click();
    for (const d of pin) await key(page, d).click();
    await key(page, 'Sign').click();
    await page.getByTestId('check-result').waitFor();

    const [check] = await Check.findAll({ where: { airframeId: airframe.id } });
    const stored = (await (await context.request.get(`/api/checks/${check!.id}`)).json()) as StoredCheck;
    expect(stored.readings.find((r) => r.code === 'brake.precharge')!.tool).toMatchObject({
      number: gauge,
      kind: 'pressure_gauge',
      calibrationDue: day(60),
    });
    expect(stored.servicing).toEqual([
      expect.objectContaining({
        code: 'sys1.level',
        quantityL: 1.5,
        batch: 'C9',
        canOpenedOn: day(0),
        tool: expect.objectContaining({ number: cart, kind: 'servicing_cart' }),
      }),
    ]);
    const signed = JSON.parse(check!.signedContent!) as {
      readings: { code: string; tool?: { number: string } }[];
    };
    expect(signed.readings.find((r) => r.code === 'brake.precharge')!.tool!.number).toBe(gauge);
    await context.close();
  });
});
