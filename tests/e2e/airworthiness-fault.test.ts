import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { enrolledKiosk, makeMechanicAndAirframe } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { kioskSignIn, preFlight, runCheck } from '../setup/kiosk-steps';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

// The rule relied on: an aircraft is released to service only when every finding is cleared and a certificate of
// release to service is signed (EASA Part-145 145.A.50, from memory); a reservoir below its minimum mark is a
// finding whatever kind of check found it. Demo RX-4 system 2: minimum 3.5 L, normal 4.5 L, isolation 1.5 L
// (invented limits, shared/demo/demo-types.ts).
const afterFlightLow = {
  'System 1 reservoir level': { glass: 6.5 },
  'System 2 reservoir level': { glass: 3.2 },
};

describe('a finding from an after-flight check grounds the airframe everywhere', () => {
  it('when an after-flight finds system 2 below its minimum mark, then the kiosk result, the board and the pilot view say unserviceable: service needed, the pilot cannot accept, and after a servicing check in limits the pilot can', async () => {
    const { badge, pin, airframe } = await makeMechanicAndAirframe();
    const fleet = airframe.fleetNumber;
    const kiosk = await enrolledKiosk(browser);
    const mechanic = await kiosk.newPage();
    await kioskSignIn(mechanic, badge, pin);

    // A valid pre-flight first: without the finding the pilot could accept.
    expect(await preFlight(mechanic, fleet, pin, 6.5)).toBe('in_limits');

    expect(
      await runCheck(mechanic, { fleetNumber: fleet, kind: 'after_flight', pin, entries: afterFlightLow }),
    ).toBe('service');
    // The result says what the board says, from the same derivation: never "shows as due".
    const state = mechanic.getByTestId('state-after-check');
    await state.waitFor();
    expect(await state.getAttribute('data-state')).toBe('unserviceable');
    expect(await state.getByTestId('airframe-state').getAttribute('data-causes')).toBe('service_needed');
    const result = (await mechanic.getByTestId('check-result').textContent())!;
    expect(result).toContain('Unserviceable: service needed');
    expect(result).toMatch(/System 2 reservoir level needs service/);
    expect(result).not.toMatch(/shows as due|released/i);

    // The board, from across the hangar.
    const board = await kiosk.newPage();
    await board.setViewportSize({ width: 1920, height: 1080 });
    await board.goto('/board');
    const tile = board.getByTestId(`board-${fleet}`);
    await expect.poll(() => tile.getAttribute('data-state'), { timeout: 10_000 }).toBe('unserviceable');
    expect(await tile.getAttribute('data-causes')).toBe('service_needed');
    expect(await tile.getByTestId('airframe-state').textContent()).toMatch(/Unserviceable:\s*Service needed/);

    // The pilot sees why, and Accept is refused with the reason.
    const pilotKiosk = await enrolledKiosk(browser);
    const pilot = await pilotKiosk.newPage();
    await kioskSignIn(pilot, '6301', '2718');
    await pilot.waitForURL(/\/pilot$/);
    await pilot.getByTestId(`pilot-airframe-${fleet}`).click();
    const view = pilot.getByTestId('pilot-view');
    await view.waitFor();
    expect(await view.getAttribute('data-state')).toBe('unserviceable');
    expect(await pilot.getByRole('button', { name: 'Accept aircraft' }).isDisabled()).toBe(true);
    const refusal = (await pilot.getByTestId('acceptance-refused').textContent())!;
    expect(refusal).toMatch(/unserviceable/i);
    expect(refusal).toMatch(/System 2 reservoir level needs service/);
    // The server refuses too, whatever the screen shows.
    const forced = await pilot.request.post(`/api/airframes/${airframe.id}/accept`, {
      data: { pin: '2718' },
      headers: { 'X-CSRF-Token': (await (await pilot.request.get('/api/session')).json()).csrfToken },
    });
    expect(forced.status()).toBe(409);

    // Servicing: system 2 read at 3.7 L, in limits; the finding clears.
    expect(
      await runCheck(mechanic, {
        fleetNumber: fleet,
        kind: 'servicing',
        pin,
        entries: {
          'System 1 reservoir level': { glass: 6.5 },
          'System 2 reservoir level': { glass: 3.7 },
          'Brake accumulator pre-charge': { keypad: '45' },
        },
      }),
    ).toBe('in_limits');
    await expect
      .poll(() => mechanic.getByTestId('state-after-check').getAttribute('data-state'))
      .toBe('checks_in_limits');
    await expect.poll(() => tile.getAttribute('data-state'), { timeout: 10_000 }).toBe('checks_in_limits');

    await pilot.reload();
    await view.waitFor();
    await expect.poll(() => view.getAttribute('data-state'), { timeout: 20_000 }).toBe('checks_in_limits');
    await pilot.getByRole('button', { name: 'Accept aircraft' }).click();
    for (const d of '2718') await pilot.getByRole('button', { name: d, exact: true }).click();
    await pilot.getByRole('button', { name: 'Sign acceptance' }).click();
    await pilot.getByTestId('acceptance-done').waitFor();

    for (const c of [kiosk, pilotKiosk]) await c.close();
  }, 180_000);
});
