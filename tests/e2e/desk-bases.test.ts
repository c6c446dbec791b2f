import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { e2eDatabase, makeMechanicAndAirframe } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { deskContext } from '../setup/kiosk-steps';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** Two bases of this test's own, with one airframe at each, so nothing else in the e2e database counts. */
async function twoBasesWithAnAirframeEach() {
  e2eDatabase();
  const { Airframe, Base } = await import('@server/db/models');
  const suffix = Math.random().toString(36).slice(2, 6).toUpperCase();
  const here = await Base.create({ code: `H${suffix}`, name: `Hillside ${suffix}` });
  const there = await Base.create({ code: `T${suffix}`, name: `Tarn ${suffix}` });
  const atHere = (await makeMechanicAndAirframe()).airframe;
  const atThere = (await makeMechanicAndAirframe()).airframe;
  await Airframe.update({ baseId: here.id }, { where: { id: atHere.id } });
  await Airframe.update({ baseId: there.id }, { where: { id: atThere.id } });
  return { here, there, atHere, atThere };
}

describe('choosing bases at the desk', () => {
  it('when engineering makes a board link for one base and places a tablet, then the TV shows that base only and the list says where each stands', async () => {
    const { here, there, atHere, atThere } = await twoBasesWithAnAirframeEach();
    const hereWords = `${here.name} (${here.code})`;
    const thereWords = `${there.name} (${there.code})`;
    const { context, page } = await deskContext(browser, '7401', 'desk-engineering');
    await page.goto('/desk/devices');

    // A TV for one base: its toggle pressed, the form says what the screen will show.
    await page.getByLabel('Screen name (where it hangs)').fill(`Hillside TV ${here.code}`);
    const toggles = page.getByTestId('board-link-bases');
    await toggles.getByRole('button', { name: hereWords }).click();
    expect(await toggles.getByRole('button', { name: hereWords }).getAttribute('aria-pressed')).toBe('true');
    expect(await toggles.textContent()).toContain(`The screen shows ${hereWords} only.`);
    await page.getByRole('button', { name: 'Create board link' }).click();
    const boardUrl = (await page.getByTestId('board-link-url').textContent())!;
    const listed = page.getByRole('listitem').filter({ hasText: `Hillside TV ${here.code}` });
    expect(await listed.getByTestId('board-link-shows').textContent()).toBe(`Shows ${hereWords}`);

    const tv = await browser.newContext({ viewport: { width: 1920, height: 1080 } });
    const board = await tv.newPage();
    await board.goto(boardUrl);
    await board.getByTestId(`board-${atHere.fleetNumber}`).waitFor();
    expect(await board.getByTestId(`board-${atThere.fleetNumber}`).count()).toBe(0);
    await tv.close();

    // A signed-in lead's board of one base, by its address; a base that does not exist is said in words.
    await page.goto(`/board?base=${here.code.toLowerCase()}`);
    await page.getByTestId(`board-${atHere.fleetNumber}`).waitFor();
    expect(await page.getByTestId(`board-${atThere.fleetNumber}`).count()).toBe(0);
    await page.goto('/board?base=NOPE9');
    expect(await page.getByTestId('board-refused').textContent()).toContain('NOPE9');
    expect(await page.getByTestId('board-stale').count()).toBe(0);
    await page.goto('/desk/devices');

    // A tablet enrolled at one base, then moved to the other.
    const tabletName = `Hillside wall ${here.code}`;
    await page.getByLabel('Tablet name (where it hangs)').fill(tabletName);
    await page.getByLabel('Base where it stands').selectOption(here.code);
    await page.getByRole('button', { name: 'Create enrolment link' }).click();
    await page.getByTestId('enrolment-link').waitFor();
    const tablet = page.getByRole('listitem').filter({ hasText: tabletName });
    await expect
      .poll(() => tablet.getByTestId('kiosk-base').textContent())
      .toBe(`Stands at ${hereWords}: its airframe list shows that base first.`);
    await tablet.getByRole('button', { name: 'Change base' }).click();
    await tablet.getByLabel(`Base of "${tabletName}"`).selectOption(there.code);
    await tablet.getByRole('button', { name: 'Save base' }).click();
    await expect
      .poll(() => tablet.getByTestId('kiosk-base').textContent())
      .toBe(`Stands at ${thereWords}: its airframe list shows that base first.`);
    await context.close();
  });
});
