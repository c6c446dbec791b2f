import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { enrolledKiosk, makeMechanicAndAirframe } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { deskContext, kioskSignIn, runCheck } from '../setup/kiosk-steps';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const preFlightInLimits = {
  'System 1 reservoir level': { glass: 6.5 },
  'System 2 reservoir level': { glass: 4.0 },
  'Brake accumulator pre-charge': { keypad: '45' },
};

async function deferOnDesk(page: Page, airframeId: number, number: number, password: string) {
  await page.goto(`/desk/defects/${airframeId}`);
  const card = page.getByTestId(`tech-log-defect-${number}`);
  await card.waitFor();
  await card.getByRole('button', { name: 'Defer', exact: true }).click();
  const form = card.getByTestId('defect-defer');
  await form.getByLabel('MEL item or procedure reference').fill('MEL 33-40-01 (demo)');
  await form.getByRole('radio', { name: /^C/ }).click();
  await form
    .getByLabel('Repeat inspection (optional)')
    .fill('Placard the step; check before each first flight.');
  await form.getByLabel('Your password, typed again to sign').fill(password);
  await form.getByRole('button', { name: 'Sign the deferral' }).click();
  return { card, form };
}

describe('the tech-log loop: defect note to deferral to certificate of release to service', () => {
  it("when a mechanic's defect note becomes a defect, then the board shows it within 5 s, a lead authorised for another type is refused the deferral with the reason, an authorised lead defers it with a countdown on the board, and the board shows Released after the certificate", async () => {
    const { badge, pin, airframe } = await makeMechanicAndAirframe();
    const fleet = airframe.fleetNumber;
    const note = `Cabin step light ${fleet} inoperative`;

    const lead = await deskContext(browser, '5201', 'north-pad-lead');
    const tv = await lead.context.newPage();
    await tv.setViewportSize({ width: 1920, height: 1080 });
    await tv.goto('/board');
    const tile = tv.getByTestId(`board-${fleet}`);
    await expect.poll(() => tile.getAttribute('data-state'), { timeout: 10_000 }).toBe('not_checked');

    const kiosk = await enrolledKiosk(browser);
    const mechanic = await kiosk.newPage();
    await kioskSignIn(mechanic, badge, pin);
    expect(
      await runCheck(mechanic, {
        fleetNumber: fleet,
        kind: 'pre_flight',
        pin,
        entries: preFlightInLimits,
        note,
      }),
    ).toBe('in_limits');
    const signedAt = Date.now();

    // A defect note is a defect in the tech log (issue 11): open, so the airframe is unserviceable.
    const line = tile.getByTestId('defect-lines');
    await expect
      .poll(async () => ((await line.count()) > 0 ? line.textContent() : ''), {
        timeout: 5_000,
        interval: 200,
      })
      .toContain(note);
    expect(Date.now() - signedAt).toBeLessThan(5_000);
    expect(await tile.getAttribute('data-state')).toBe('unserviceable');
    expect(await tile.getAttribute('data-causes')).toBe('open_defect');
    const number = Number(
      (await tile
        .locator('[data-testid^="defect-"][data-status="open"]')
        .first()
        .getAttribute('data-testid'))!.replace('defect-', ''),
    );
    expect(number).toBeGreaterThan(0);

    // Ruth Amsel holds B2 for RL-2, ATA 29 only: a deferral on this RX-4 is outside her authorisation
    // (EASA Part-145 145.A.30 and 145.A.35, from memory: certifying staff act only within their written scope).
    const ruth = await deskContext(browser, '5202', 'harbour-lead');
    const refused = await deferOnDesk(ruth.page, airframe.id, number, 'harbour-lead');
    const refusal = refused.form.getByTestId('defect-defer-refused');
    await refusal.waitFor();
    expect(await refusal.textContent()).toMatch(
      /cannot defer this defect: the authorisation covers RL-2, not RX-4/,
    );
    // What she typed is still there to hand over.
    expect(await refused.form.getByLabel('MEL item or procedure reference').inputValue()).toBe(
      'MEL 33-40-01 (demo)',
    );
    expect(await refused.card.getAttribute('data-status')).toBe('open');

    // Jonah Pell holds B1 for RX-4, all chapters: the deferral is accepted. MEL category C: 10 calendar days after
    // the day of discovery (MMEL rectification intervals as commonly published, from memory).
    const done = await deferOnDesk(lead.page, airframe.id, number, 'north-pad-lead');
    await expect.poll(() => done.card.getAttribute('data-status')).toBe('deferred');
    expect(await done.card.textContent()).toMatch(/Category C under MEL 33-40-01 \(demo\)/);

    const deferred = tile.getByTestId(`defect-${number}`);
    await expect.poll(() => deferred.getAttribute('data-status'), { timeout: 5_000 }).toBe('deferred');
    // Discovered today: the limit is the end of the 10th day after, so between 10 and 11 days are left.
    expect(await deferred.getByTestId('deferral-left').textContent()).toMatch(
      /(10|9)\u00a0d \d+\u00a0h left/,
    );
    expect(await tile.getAttribute('data-state')).toBe('checks_in_limits');
    expect(await tile.getByTestId('release-line').textContent()).toMatch(
      /No certificate of release in force/,
    );

    // The certificate of release to service, its wording shown before signing (145.A.50, from memory).
    const panel = lead.page.getByTestId('release-panel');
    await panel.getByRole('button', { name: 'Sign certificate of release to service' }).click();
    expect(await panel.getByTestId('release-statement').textContent()).toMatch(
      /considered ready for release to service/,
    );
    await panel.getByLabel('Your password, typed again to sign').fill('north-pad-lead');
    await panel.getByRole('button', { name: 'Sign the release' }).click();
    await expect
      .poll(() => panel.getByTestId('release-in-force').textContent())
      .toMatch(/In force: signed by Jonah Pell/);

    await expect.poll(() => tile.getAttribute('data-state'), { timeout: 5_000 }).toBe('released');
    expect(await tile.getByTestId('release-line').textContent()).toMatch(
      /Released by Jonah Pell, \d{1,2} [A-Z][a-z]{2} \d{4}, \d\d:\d\d [A-Z]/,
    );
    // The deferred defect stays on the board with its countdown after the release.
    expect(await tile.getByTestId(`defect-${number}`).getAttribute('data-status')).toBe('deferred');

    for (const c of [kiosk, lead.context, ruth.context]) await c.close();
  }, 180_000);
});
