import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { enrolledKiosk, makeMechanicAndAirframe } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { kioskSignIn, preFlight, preFlightAnswer, startPreFlight, tapGlass } from '../setup/kiosk-steps';
import { Check, Reading } from '@server/db/models';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe('a pre-flight check on the kiosk', () => {
  it('when a mechanic records an RX-4 pre-flight in limits, then it takes at most 25 taps, every verdict shows, and the board shows checks in limits, not released', async () => {
    const { badge, pin, airframe, staff } = await makeMechanicAndAirframe();
    const context = await enrolledKiosk(browser);
    const page = await context.newPage();
    await kioskSignIn(page, badge, pin);

    let taps = 0;
    const tap = async (target: ReturnType<Page['getByRole']>) => {
      await target.click();
      taps += 1;
    };
    await tap(page.getByTestId(`airframe-${airframe.fleetNumber}`));
    await tap(page.getByTestId('start-pre_flight'));
    await tap(page.getByRole('button', { name: 'On wheels', exact: true }));
    await tap(page.getByRole('button', { name: 'Relieved', exact: true }));
    if ((await page.getByTestId('ambient-temp').textContent())?.includes('Not set')) {
      await tap(page.getByRole('button', { name: '20 degrees C' }));
    }
    await tap(page.getByRole('button', { name: 'Next', exact: true }));
    await tapGlass(page, 6.5);
    taps += 1;
    await expect
      .poll(() => page.getByTestId('verdict').first().getAttribute('data-verdict'))
      .toBe('in_limits');
    await tap(page.getByRole('button', { name: 'Next', exact: true }));
    await tapGlass(page, 4.0);
    taps += 1;
    await tap(page.getByRole('button', { name: 'Next', exact: true }));
    await page.getByTestId('reading-value').waitFor();
    await tap(page.getByRole('button', { name: '4', exact: true }));
    await tap(page.getByRole('button', { name: '5', exact: true }));
    await expect.poll(() => page.getByTestId('expected-precharge').textContent()).toMatch(/4\d/);
    await tap(page.getByRole('button', { name: 'Next', exact: true }));
    // "No" to both filter bypass questions, then "No leak" at each leak check: one tap each.
    for (let at = 4; at <= 8; at++) {
      await page.getByText(`Checkpoint ${at} of 8`).waitFor();
      await tap(page.getByRole('button', { name: preFlightAnswer(at), exact: true }));
    }
    await tap(page.getByRole('button', { name: 'Sign with PIN' }));
    for (const d of pin) await tap(page.getByRole('button', { name: d, exact: true }));
    await tap(page.getByRole('button', { name: 'Sign', exact: true }));

    const result = page.getByTestId('check-result');
    await result.waitFor();
    expect(await result.getAttribute('data-verdict')).toBe('in_limits');
    expect(await page.locator('[data-testid^="result-"]').count()).toBe(8);
    expect(taps).toBeLessThanOrEqual(25);

    const stored = await Check.findAll({ where: { airframeId: airframe.id } });
    expect(stored).toHaveLength(1);
    expect(stored[0]!.signedBy).toBe(staff.id);
    const sys1 = await Reading.findOne({ where: { checkId: stored[0]!.id, checkpointCode: 'sys1.level' } });
    expect(sys1!.value).toBeCloseTo(6.5, 1);

    // "Released" needs a certificate of release to service signed by certifying staff (EASA Part-145 145.A.50,
    // from memory); a mechanic's pre-flight in limits is not one.
    expect(await page.getByTestId('state-after-check').getAttribute('data-state')).toBe('checks_in_limits');
    const board = await context.newPage();
    await board.setViewportSize({ width: 1920, height: 1080 });
    await board.goto('/board');
    const tile = board.getByTestId(`board-${airframe.fleetNumber}`);
    await expect.poll(() => tile.getAttribute('data-state'), { timeout: 10_000 }).toBe('checks_in_limits');
    expect(await tile.getByTestId('airframe-state').textContent()).toMatch(/Checks in limits/i);
    expect(await tile.getByTestId('release-line').textContent()).toBe('No certificate of release in force');
    await context.close();
  });

  it('when the page is reloaded in the middle of a check, then it resumes with every value kept', async () => {
    const { badge, pin, airframe } = await makeMechanicAndAirframe();
    const context = await enrolledKiosk(browser);
    const page = await context.newPage();
    await kioskSignIn(page, badge, pin);
    await startPreFlight(page, airframe.fleetNumber);
    await tapGlass(page, 6.5);
    const before = await page.getByTestId('level-value').textContent();
    await page.reload();
    await page.getByTestId('level-value').waitFor();
    expect(await page.getByTestId('level-value').textContent()).toBe(before);
    expect(before).toMatch(/6\.\d L/);
    await context.close();
  });

  it('when a level is below the isolation mark, then the result says the airframe is unserviceable and on hold, and the board shows the hold', async () => {
    const { badge, pin, airframe } = await makeMechanicAndAirframe();
    const context = await enrolledKiosk(browser);
    const page = await context.newPage();
    await kioskSignIn(page, badge, pin);
    expect(await preFlight(page, airframe.fleetNumber, pin, 2.0)).toBe('out_of_limits');
    await expect
      .poll(() => page.getByTestId('state-after-check').getAttribute('data-state'))
      .toBe('unserviceable');
    expect(await page.getByTestId('check-result').textContent()).toContain('Unserviceable: on hold');

    await page.goto('/board');
    const tile = page.getByTestId(`board-${airframe.fleetNumber}`);
    await expect.poll(() => tile.getAttribute('data-state'), { timeout: 10_000 }).toBe('unserviceable');
    expect(await tile.getAttribute('data-causes')).toBe('on_hold');
    expect(await tile.textContent()).toMatch(/Hold: .*System 1/);
    await context.close();
  });
});
