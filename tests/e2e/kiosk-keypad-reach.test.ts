import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { enrolledKiosk, makeMechanicAndAirframe } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { preFlightAnswer, tapGlass } from '../setup/kiosk-steps';

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** Everything a gloved finger can aim at on a kiosk screen. */
const targets = 'button, a[href], input:not([type=hidden]), textarea, [role=slider], [role=button]';

/**
 * Keys and toggles that change a value on the screen and leave the screen where it is: these are tapped. Anything
 * else (Next, Back, Pause, Sign, a tile that opens another screen, a progress item) is hit-tested the same way but
 * left alone; the walk taps the one it needs to move on.
 */
const tappedHere =
  /^(\d|Decimal point|Delete last digit|Clear value|Clear count|Unit .+|Fluid in .+|Less .+|More .+|On wheels|On jacks, gear retracted|Pressure on|Relieved|Degrees [CF]|-?\d+ degrees [CF]|Static leak|Dynamic leak|Airframe hours.*|Flights.*|Landings.*)$/;

interface Miss {
  screen: string;
  target: string;
  hit: string;
}

/**
 * Scrolls each visible target into view as a finger would (only as far as needed: the nearest edge), then asks the
 * page what lies at the centre of its box: it must be the target or something inside it, not a bar over it. Keys
 * and toggles are then tapped there with the mouse, so the tap lands where the check looked. With a dialog open,
 * only its targets count: the screen behind it is not reachable on purpose.
 */
async function reachEvery(page: Page, screen: string, misses: Miss[], reached: string[]) {
  await page.waitForTimeout(150);
  const count = await page.evaluate((selector) => {
    let n = 0;
    const dialogs = [...document.querySelectorAll('[aria-modal="true"]')];
    const scope = dialogs[dialogs.length - 1] ?? document;
    for (const element of document.querySelectorAll('[data-reach]')) element.removeAttribute('data-reach');
    for (const element of scope.querySelectorAll<HTMLElement | SVGElement>(selector)) {
      const box = element.getBoundingClientRect();
      const style = getComputedStyle(element);
      if (box.width === 0 || box.height === 0 || style.visibility === 'hidden' || style.display === 'none')
        continue;
      element.setAttribute('data-reach', String(n++));
    }
    return n;
  }, targets);
  expect(count, `${screen}: nothing to tap`).toBeGreaterThan(0);
  for (let at = 0; at < count; at++) {
    const found = await page.evaluate((id) => {
      const element = document.querySelector(`[data-reach="${id}"]`);
      if (!element || !element.isConnected) return null;
      element.scrollIntoView({ block: 'nearest', inline: 'nearest', behavior: 'instant' });
      const box = element.getBoundingClientRect();
      if (box.width === 0 || box.height === 0) return null;
      const x = box.left + box.width / 2;
      const y = box.top + box.height / 2;
      const hit = document.elementFromPoint(x, y);
      const describe = (e: Element | null) =>
        e
          ? `${e.tagName.toLowerCase()} "${(e.getAttribute('aria-label') ?? e.textContent ?? '').trim().slice(0, 40)}"`
          : 'nothing';
      return {
        x,
        y,
        name: (element.getAttribute('aria-label') ?? element.textContent ?? '').trim(),
        ok: hit !== null && (hit === element || element.contains(hit)),
        hit: describe(hit?.closest('button, a, [role], input, textarea, [data-testid]') ?? hit),
        disabled: element instanceof HTMLButtonElement && element.disabled,
      };
    }, at);
    if (!found) continue;
    reached.push(`${screen}: ${found.name}`);
    if (!found.ok) misses.push({ screen, target: found.name, hit: found.hit });
    else if (!found.disabled && tappedHere.test(found.name)) await page.mouse.click(found.x, found.y);
  }
}

const key = (page: Page, name: string) => page.getByRole('button', { name, exact: true });

async function clearPad(page: Page, times: number) {
  for (let i = 0; i < times; i++) await key(page, 'Delete last digit').click();
}

async function typeOnPad(page: Page, text: string) {
  for (const ch of text) await key(page, ch === '.' ? 'Decimal point' : ch).click();
}

/** Context step: every toggle tapped, then on wheels, the pressure as the card wants it, 20 degrees C. */
async function context(
  page: Page,
  look: (screen: string) => Promise<void>,
  pressure: 'Relieved' | 'Pressure on',
) {
  await key(page, 'Next').waitFor();
  await look('context');
  await key(page, 'On wheels').click();
  if ((await key(page, pressure).count()) > 0) await key(page, pressure).click();
  if ((await key(page, 'Degrees C').count()) > 0) await key(page, 'Degrees C').click();
  if ((await page.getByRole('button', { name: '20 degrees C' }).count()) > 0)
    await page.getByRole('button', { name: '20 degrees C' }).click();
  await key(page, 'Next').click();
}

describe('kiosk keys clear of the bottom bar', () => {
  for (const viewport of [
    { width: 1280, height: 800 },
    { width: 800, height: 1280 },
    { width: 1024, height: 768 },
  ]) {
    const size = `${viewport.width}x${viewport.height}`;
    it(`when a check is walked at ${size}, then every key and button, scrolled into view, is what a tap at its centre hits`, async () => {
      const { badge, pin, airframe } = await makeMechanicAndAirframe();
      const kiosk = await enrolledKiosk(browser, viewport);
      const page = await kiosk.newPage();
      const misses: Miss[] = [];
      const reached: string[] = [];
      const look = (screen: string) => reachEvery(page, screen, misses, reached);
      const counter = page.getByText(/^Checkpoint \d+ of \d+/);

      // Badge and PIN pads: every key tapped, the typing deleted, then the real badge and PIN.
      await page.goto('/kiosk');
      await key(page, 'Next: PIN').waitFor();
      await look('badge pad');
      await clearPad(page, 12);
      await typeOnPad(page, badge);
      await key(page, 'Next: PIN').click();
      await key(page, 'Sign in').waitFor();
      await look('PIN pad');
      await clearPad(page, 12);
      await typeOnPad(page, pin);
      await key(page, 'Sign in').click();

      await page.getByTestId(`airframe-${airframe.fleetNumber}`).waitFor();
      await look('airframe list');
      await page.getByRole('button', { name: 'Type fleet number' }).click();
      await key(page, 'Back to list').waitFor();
      await look('fleet number pad');
      await key(page, 'Back to list').click();
      await page.getByTestId(`airframe-${airframe.fleetNumber}`).click();
      await page.getByTestId('start-pre_flight').waitFor();
      await look('check kinds');

      // Pre-flight: levels (one topped up), the pre-charge keypad, yes/no, a leak counted, review and signing.
      await page.getByTestId('start-pre_flight').click();
      await context(page, look, 'Relieved');
      await tapGlass(page, 5.0);
      await page.getByTestId('add-fluid').waitFor();
      await look('level needing fluid');
      await page.getByTestId('add-fluid').click();
      await key(page, 'Next: fluid').waitFor();
      await look('fluid added: amount');
      await clearPad(page, 6);
      await typeOnPad(page, '2');
      await key(page, 'Next: fluid').click();
      await key(page, 'Next: batch').waitFor();
      await look('fluid added: which fluid');
      await page.getByRole('button', { name: /^MIL-PRF-83282/ }).click();
      await key(page, 'Next: batch').click();
      await page.getByTestId('batch-number').waitFor();
      await look('fluid added: batch');
      for (const k of ['L', 'O', 'T', 'Dash', '4', '2']) await key(page, k).click();
      await key(page, 'Next: can opened').click();
      await key(page, 'Today').click();
      await look('fluid added: can opened');
      await key(page, 'Save, then re-read the level').click();
      await page.getByTestId('servicing-summary').waitFor();
      await tapGlass(page, 7.0);
      await look('level re-read');
      await key(page, 'Next').click();
      await page.getByText('Checkpoint 2 of 8').waitFor();
      await tapGlass(page, 4.0);
      await look('level');
      await key(page, 'Next').click();
      await page.getByTestId('reading-value').waitFor();
      await look('pre-charge');
      await key(page, 'Clear value').click();
      await typeOnPad(page, '45');
      await key(page, 'Unit bar').click();
      await key(page, 'Next').click();
      for (let at = 4; at <= 8; at++) {
        await page.getByText(`Checkpoint ${at} of 8`).waitFor();
        await key(page, preFlightAnswer(at)).waitFor();
        await page.waitForTimeout(300);
        if (at === 4) await look('yes or no');
        if (at === 6) {
          await look('leak check');
          await key(page, 'Dynamic leak').click();
          await page.getByRole('group', { name: 'Keypad' }).waitFor();
          await look('leak rate');
        }
        await key(page, preFlightAnswer(at)).click();
      }
      await page.getByRole('button', { name: 'Sign with PIN' }).waitFor();
      await look('review');
      await page.getByRole('button', { name: 'Sign with PIN' }).click();
      await key(page, 'Sign').waitFor();
      await look('signing PIN pad');
      await clearPad(page, 12);
      await typeOnPad(page, pin);
      await key(page, 'Sign').click();
      await page.getByTestId('check-result').waitFor();
      await look('result');

      // Ground run: the system pressures on the keypad.
      await page.goto(`/kiosk/airframes/${airframe.id}`);
      await page.getByTestId('start-ground_run').click();
      await context(page, look, 'Pressure on');
      await page.getByTestId('reading-value').waitFor();
      await look('pressure');
      await key(page, 'Pause').click();

      // After-flight: its hours, flights and landings.
      await page.getByTestId('start-after_flight').click();
      await context(page, look, 'Relieved');
      await counter.waitFor();
      await page.getByRole('button', { name: 'Go to hours, flights and landings' }).click();
      await page.getByRole('heading', { name: 'Hours, flights and landings' }).waitFor();
      await look('hours, flights and landings');
      await key(page, 'Pause').click();

      await kiosk.close();
      expect(misses).toEqual([]);
      // Every kind of screen was walked, and the pads' keys were among what was hit-tested.
      for (const screen of [
        'badge pad',
        'PIN pad',
        'fleet number pad',
        'pre-charge',
        'leak rate',
        'pressure',
      ])
        expect(reached, screen).toContain(`${screen}: 0`);
      expect(reached).toContain('fluid added: amount: Decimal point');
      expect(reached).toContain('hours, flights and landings: Delete last digit');
    }, 120_000);
  }
});
