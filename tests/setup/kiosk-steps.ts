import { expect, inject } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';

/** Badge then PIN on the kiosk keypad, as a gloved finger would. */
export async function kioskSignIn(page: Page, badge: string, pin: string) {
  await page.goto('/kiosk');
  await page.getByRole('button', { name: 'Next: PIN' }).waitFor();
  for (const d of badge) await page.getByRole('button', { name: d, exact: true }).click();
  await page.getByRole('button', { name: 'Next: PIN' }).click();
  for (const d of pin) await page.getByRole('button', { name: d, exact: true }).click();
  // Waits for the answer: a caller that goes to another address at once would cancel the sign-in and lose its
  // session cookie (the kiosk list then never showed, about one run in three).
  const answered = page.waitForResponse(
    (res) => res.request().method() === 'POST' && new URL(res.url()).pathname === '/api/auth/kiosk',
  );
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await answered;
}

/** A desk browser signed in with badge and password. */
export async function deskContext(
  browser: Browser,
  badge: string,
  password: string,
  // 'block' keeps the service worker out, so page.route sees every file the screens fetch.
  serviceWorkers: 'allow' | 'block' = 'allow',
): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({
    viewport: { width: 1280, height: 800 },
    baseURL: inject('baseUrl'),
    serviceWorkers,
  });
  const page = await context.newPage();
  await page.goto('/desk');
  await page.getByLabel('Badge number').fill(badge);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/desk\/home/);
  return { context, page };
}

/** Taps the drawn sight glass at the height of a level, reading the scale from the glass's data attributes. */
export async function tapGlass(page: Page, litres: number) {
  const glass = page.getByTestId('sight-glass');
  await glass.waitFor();
  await glass.scrollIntoViewIfNeeded();
  const box = (await glass.boundingBox())!;
  const [min, max, top, bottom] = await Promise.all(
    ['data-range-min', 'data-range-max', 'data-top', 'data-bottom'].map(async (a) =>
      Number(await glass.getAttribute(a)),
    ),
  );
  const fraction = bottom! - ((litres - min!) / (max! - min!)) * (bottom! - top!);
  await glass.click({ position: { x: box.width * 0.3, y: box.height * fraction } });
}

/** From the airframe list: picks the airframe, starts its pre-flight and sets the context (on wheels, relieved, 20 C). */
export async function startPreFlight(page: Page, fleetNumber: string) {
  const key = (name: string) => page.getByRole('button', { name, exact: true });
  await page.getByTestId(`airframe-${fleetNumber}`).click();
  await page.getByTestId('start-pre_flight').click();
  await key('On wheels').click();
  await key('Relieved').click();
  if ((await page.getByTestId('ambient-temp').textContent())?.includes('Not set')) {
    await page.getByRole('button', { name: '20 degrees C' }).click();
  }
  await key('Next').click();
}

/** The answer that moves an RX-4 pre-flight on from checkpoint 4 of 8: two filter bypass questions, then three leaks. */
export const preFlightAnswer = (checkpoint: number) => (checkpoint <= 5 ? 'No' : 'No leak');

/**
 * After system 1's level: system 2 at 4.0 L, the pre-charge at 45 bar, "No" to both filter bypass questions and
 * "No leak" at the three leak checks, up to signing.
 */
export async function restOfPreFlight(page: Page) {
  const key = (name: string) => page.getByRole('button', { name, exact: true });
  await tapGlass(page, 4.0);
  await key('Next').click();
  await page.getByTestId('reading-value').waitFor();
  await key('4').click();
  await key('5').click();
  await key('Next').click();
  for (let at = 4; at <= 8; at++) {
    await page.getByText(`Checkpoint ${at} of 8`).waitFor();
    await key(preFlightAnswer(at)).click();
  }
  await page.getByRole('button', { name: 'Sign with PIN' }).waitFor();
}

/**
 * An RX-4 pre-flight with system 1 at the level given and everything else in limits, up to the PIN typed on the
 * sign screen: the next tap is "Sign".
 */
export async function fillPreFlight(page: Page, fleetNumber: string, pin: string, system1Litres: number) {
  await startPreFlight(page, fleetNumber);
  await tapGlass(page, system1Litres);
  await page.getByRole('button', { name: 'Next', exact: true }).click();
  await restOfPreFlight(page);
  await page.getByRole('button', { name: 'Sign with PIN' }).click();
  for (const d of pin) await page.getByRole('button', { name: d, exact: true }).click();
}

/** An RX-4 pre-flight with system 1 at the level given and everything else in limits; returns the verdict. */
export async function preFlight(page: Page, fleetNumber: string, pin: string, system1Litres: number) {
  await fillPreFlight(page, fleetNumber, pin, system1Litres);
  await page.getByRole('button', { name: 'Sign', exact: true }).click();
  await page.getByTestId('check-result').waitFor();
  return page.getByTestId('check-result').getAttribute('data-verdict');
}

/**
 * What to enter at a checkpoint: litres on the glass, a gauge or quantity value on the keypad, a yes/no, or a leak
 * (static or dynamic, with its drops per minute on the keypad).
 */
export type CardEntry =
  | { glass: number }
  | { keypad: string }
  | { answer: 'Yes' | 'No' }
  | { leak: 'Static leak' | 'Dynamic leak'; dropsPerMinute: string };

/** The figures an after-flight records, as typed on the keypad: "1236.5" taps 1, 2, 3, 6, the point and 5. */
export interface UsageTyped {
  hours: string;
  flights: string;
  landings: string;
}

/** On the after-flight's figures step: types each figure given (the first key replaces it), then Next. */
export async function enterUsage(page: Page, usage: UsageTyped | undefined) {
  const key = (name: string) => page.getByRole('button', { name, exact: true });
  await page.getByRole('heading', { name: 'Hours, flights and landings' }).waitFor();
  const labels = { hours: /^Airframe hours/, flights: /^Flights/, landings: /^Landings/ } as const;
  for (const field of ['hours', 'flights', 'landings'] as const) {
    if (!usage) break;
    await page.getByRole('button', { name: labels[field] }).click();
    for (const ch of usage[field]) await key(ch === '.' ? 'Decimal point' : ch).click();
  }
  await key('Next').click();
}

/**
 * Any check on the kiosk, from the airframe list to the result: picks the airframe and the kind, sets the context
 * (on wheels, pressure relieved, 20 degrees C), enters each checkpoint by its label (yes/no questions not named
 * are answered "No", leak checks not named "No leak"), on an after-flight the figures given (or the last ones
 * kept), writes the defect note if given, and signs with the PIN. Returns the stored verdict.
 */
export async function runCheck(page: Page, options: KioskCheck) {
  await sendCheck(page, options);
  await page.getByTestId('check-result').waitFor();
  return page.getByTestId('check-result').getAttribute('data-verdict');
}

export interface KioskCheck {
  fleetNumber: string;
  kind: 'pre_flight' | 'ground_run' | 'after_flight' | 'servicing';
  pin: string;
  entries: Record<string, CardEntry>;
  note?: string;
  usage?: UsageTyped;
}

/** runCheck up to the tap on Sign, for a test that looks at what the kiosk answers. */
export async function sendCheck(page: Page, options: KioskCheck) {
  const key = (name: string) => page.getByRole('button', { name, exact: true });
  await page.goto('/kiosk/airframes');
  await page.getByTestId(`airframe-${options.fleetNumber}`).click();
  await page.getByTestId(`start-${options.kind}`).click();
  await key('Next').waitFor();
  await page.waitForTimeout(300);
  for (const name of ['On wheels', 'Relieved']) {
    if ((await key(name).count()) > 0) await key(name).click();
  }
  const temp = page.getByTestId('ambient-temp');
  if ((await temp.count()) > 0 && (await temp.textContent())?.includes('Not set')) {
    await page.getByRole('button', { name: '20 degrees C' }).click();
  }
  await key('Next').click();
  const counter = page.getByText(/^Checkpoint \d+ of \d+/);
  const sign = page.getByRole('button', { name: 'Sign with PIN' });
  const figures = page.getByRole('heading', { name: 'Hours, flights and landings' });
  for (let guard = 0; guard < 20; guard++) {
    await counter.or(sign).or(figures).first().waitFor();
    if ((await figures.count()) > 0) {
      await enterUsage(page, options.usage);
      continue;
    }
    if ((await sign.count()) > 0 && (await counter.count()) === 0) break;
    const at = (await counter.textContent())!;
    const label = (await counter.locator('xpath=following-sibling::h2[1]').textContent())!.trim();
    const entry = options.entries[label];
    if (entry === undefined) {
      await key('No').or(key('No leak')).first().waitFor();
      await key((await key('No leak').count()) > 0 ? 'No leak' : 'No').click();
    } else if ('glass' in entry) await tapGlass(page, entry.glass);
    else if ('keypad' in entry) {
      await page.getByTestId('reading-value').waitFor();
      for (const ch of entry.keypad) await key(ch === '.' ? 'Decimal point' : ch).click();
    } else if ('leak' in entry) {
      await key(entry.leak).click();
      for (const ch of entry.dropsPerMinute) await key(ch).click();
    } else await key(entry.answer).click();
    // An answer in limits moves on by itself; anything else waits for Next.
    await page.waitForTimeout(400);
    if ((await counter.count()) > 0 && (await counter.textContent()) === at) await key('Next').click();
    for (let wait = 0; wait < 50; wait++) {
      if ((await counter.count()) === 0 || (await counter.textContent()) !== at) break;
      await page.waitForTimeout(100);
    }
  }
  if (options.note) await page.getByTestId('defect-note').fill(options.note);
  await sign.click();
  for (const d of options.pin) await key(d).click();
  await key('Sign').click();
}

/** A POST to the API from a signed-in desk page, with the session's CSRF token as the client sends it. */
export async function deskPost(page: Page, path: string, data?: unknown) {
  const session = (await (await page.request.get('/api/session')).json()) as { csrfToken: string };
  const res = await page.request.post(path, {
    headers: { 'x-csrf-token': session.csrfToken },
    ...(data === undefined ? {} : { data }),
  });
  expect(res.status(), `${path}: ${await res.text()}`).toBeLessThan(300);
  return res.json() as Promise<Record<string, unknown>>;
}
