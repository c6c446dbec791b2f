import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { e2eDatabase, enrolledKiosk } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { deskContext, kioskSignIn } from '../setup/kiosk-steps';

// People read words, never codes, and every instant in one style: "2 Dec 2026, 14:05 UTC" (or the base's zone).
// This walks every kiosk, board and desk screen of the seeded demo and reads the text a person sees.

const instant =
  /\b\d{1,2} (Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec) \d{4}, \d{2}:\d{2} (UTC|[A-Z]{2,5}|GMT[+-]\d{1,2}(:\d{2})?)\b/g;

/** What on a screen reads as a program's word or a second date style, each with why. */
export function codeLike(text: string): string[] {
  const found: string[] = [];
  const look = (pattern: RegExp, why: string, source = text) => {
    for (const match of source.matchAll(pattern)) found.push(`${why}: "${match[0]}"`);
  };
  look(/\b[a-z][a-z0-9]*_[a-z0-9_]+\b/g, 'snake_case word');
  look(/\b[a-z]+[A-Z][A-Za-z]*\b/g, 'camelCase key');
  look(/\bsys\d+\b|\b[a-z]+\d*\.[a-z_]+\d*\b(?!\.[a-z])/g, 'internal id');
  look(/\d{4}-\d{2}-\d{2}(T\d{2}:\d{2})?/g, 'raw ISO date');
  look(/\b\d{1,2}\/\d{1,2}\/\d{2,4}\b/g, 'numeric date');
  look(/\b\d{1,2}:\d{2}(:\d{2})?\s?(AM|PM|am|pm)\b/g, '12-hour clock');
  look(/\b(Mon|Tue|Wed|Thu|Fri|Sat|Sun)\b/g, 'weekday date');
  // Once every instant in the one style is taken out, no bare clock time may be left.
  look(/\b\d{1,2}:\d{2}(:\d{2})?\b/g, 'time without its date and zone', text.replace(instant, ''));
  return found;
}

describe('what on screen reads as a code or a second date style', () => {
  it('when text has program words or other date styles, then each is named; plain words and the one style pass', () => {
    expect(
      codeLike('Level at or above 4 L · 2 Dec 2026, 14:05 UTC · 3 Dec 2026, 08:30 GMT+9 · due in 3 h 05 min'),
    ).toEqual([]);
    expect(codeLike('in_limits_wheels')).toEqual(['snake_case word: "in_limits_wheels"']);
    expect(codeLike('sys1 level')).toEqual(['internal id: "sys1"']);
    expect(codeLike('sys1.level')).toHaveLength(1);
    expect(codeLike('ambientTempC: 20')).toEqual(['camelCase key: "ambientTempC"']);
    expect(codeLike('at 2026-12-02T14:05:00.000Z')).toContain('raw ISO date: "2026-12-02T14:05"');
    expect(codeLike('12/2/2026, 1:23:46 PM')).toEqual(
      expect.arrayContaining(['numeric date: "12/2/2026"', '12-hour clock: "1:23:46 PM"']),
    );
    expect(codeLike('Wed 12:42')).toEqual(['weekday date: "Wed"', 'time without its date and zone: "12:42"']);
  });
});

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** Opens a path, waits for the page to settle, and returns what reads as code on it. */
async function readScreen(page: Page, path: string): Promise<string[]> {
  await page.goto(path);
  await page.waitForLoadState('networkidle');
  await page.waitForTimeout(300);
  // A tag's printed code and a link under a QR code are for typing when the camera fails, not words to read.
  const printed = await page.locator('[data-printed-code]').allInnerTexts();
  let text = (await page.locator('body').innerText()).replace(/\S*\/(t|board|enrol)\/?\?*\S*/g, '');
  for (const code of printed) text = text.replaceAll(code.trim(), '');
  expect(text.length, `${path} shows something`).toBeGreaterThan(20);
  expect(text, `${path} is not the error page`).not.toMatch(/Something went wrong|Page not found/);
  return codeLike(text).map((problem) => `${path}: ${problem}`);
}

async function demoIds() {
  const { Airframe, AircraftType, Check, Hold, Tag } = await import('@server/db/models');
  e2eDatabase();
  const airframes = await Airframe.findAll({ where: { active: true }, order: [['id', 'ASC']] });
  const checks = await Check.findAll({ order: [['signedAt', 'DESC']], limit: 40 });
  const holds = await Hold.findAll({ order: [['id', 'ASC']] });
  const types = await AircraftType.findAll();
  const tags = await Tag.findAll({ where: { revokedAt: null } });
  return { airframes, checks, holds, types, tags };
}

describe('every screen speaks words', () => {
  it('when the kiosk, the board and the desk are walked over the demo, then no code and no second date style shows', async () => {
    const ids = await demoIds();
    const problems: string[] = [];
    const checkPaths = ids.checks.slice(0, 12).map((c) => c.id);
    const heldCheck = ids.holds[0]?.checkId;

    // The mechanic's kiosk: picker, airframe screens, check cards, results and the send queue.
    const kiosk = await enrolledKiosk(browser);
    const mechanic = await kiosk.newPage();
    await kioskSignIn(mechanic, '4101', '2468');
    await mechanic.waitForURL(/\/kiosk\/airframes/);
    problems.push(...(await readScreen(mechanic, '/kiosk/airframes')));
    for (const airframe of ids.airframes) {
      problems.push(...(await readScreen(mechanic, `/kiosk/airframes/${airframe.id}`)));
    }
    for (const kind of ['pre_flight', 'servicing', 'after_flight', 'ground_run']) {
      problems.push(
        ...(await readScreen(mechanic, `/kiosk/airframes/${ids.airframes[0]!.id}/check/${kind}`)),
      );
    }
    for (const id of [...checkPaths.slice(0, 4), ...(heldCheck ? [heldCheck] : [])]) {
      problems.push(...(await readScreen(mechanic, `/kiosk/checks/${id}`)));
    }
    problems.push(...(await readScreen(mechanic, '/kiosk/queue')));
    await kiosk.close();

    // The lead's kiosk screens: holds and the tech log.
    const leadKiosk = await enrolledKiosk(browser);
    const lead = await leadKiosk.newPage();
    await kioskSignIn(lead, '5201', '9753');
    await lead.waitForURL(/\/kiosk\//);
    problems.push(...(await readScreen(lead, '/kiosk/holds')));
    for (const hold of ids.holds) problems.push(...(await readScreen(lead, `/kiosk/holds/${hold.id}`)));
    problems.push(...(await readScreen(lead, '/kiosk/defects')));
    for (const airframe of ids.airframes) {
      problems.push(...(await readScreen(lead, `/kiosk/defects/${airframe.id}`)));
    }
    await leadKiosk.close();

    // The pilot's view.
    const pilotKiosk = await enrolledKiosk(browser);
    const pilot = await pilotKiosk.newPage();
    await kioskSignIn(pilot, '6301', '2718');
    await pilot.waitForURL(/\/pilot/);
    problems.push(...(await readScreen(pilot, '/pilot')));
    for (const airframe of ids.airframes) {
      problems.push(...(await readScreen(pilot, `/pilot/airframes/${airframe.id}`)));
    }
    await pilotKiosk.close();

    // The hangar board, through a board link as the TV opens it, and a tag opened by a phone.
    const { createBoardLink } = await import('@server/features/board-links/board-links.service');
    const link = await createBoardLink(e2eDatabase(), 'Plain words TV', 1);
    const tv = await browser.newContext({
      viewport: { width: 1920, height: 1080 },
      baseURL: inject('baseUrl'),
    });
    const board = await tv.newPage();
    problems.push(...(await readScreen(board, link.path)));
    await tv.close();

    // The desk: the lead's pages, then engineering's.
    const leadDesk = await deskContext(browser, '5201', 'north-pad-lead');
    for (const path of ['/desk/home', '/desk/holds', '/desk/defects', '/desk/handover', '/desk/mail']) {
      problems.push(...(await readScreen(leadDesk.page, path)));
    }
    for (const hold of ids.holds)
      problems.push(...(await readScreen(leadDesk.page, `/desk/holds/${hold.id}`)));
    for (const airframe of ids.airframes) {
      problems.push(...(await readScreen(leadDesk.page, `/desk/defects/${airframe.id}`)));
    }
    await leadDesk.context.close();

    const desk = await deskContext(browser, '7401', 'desk-engineering');
    for (const path of [
      '/desk/home',
      '/desk/devices',
      '/desk/types',
      '/desk/fleet',
      '/desk/tools',
      '/desk/tools/print',
      '/desk/staff',
      '/desk/records',
      '/desk/trends',
      '/desk/audit',
      '/desk/tags/print',
      '/desk/badges/print',
    ]) {
      problems.push(...(await readScreen(desk.page, path)));
    }
    for (const type of ids.types) problems.push(...(await readScreen(desk.page, `/desk/types/${type.id}`)));
    for (const id of checkPaths) problems.push(...(await readScreen(desk.page, `/desk/records/${id}`)));
    await desk.context.close();

    expect([...new Set(problems)]).toEqual([]);
  }, 480_000); // About 50 screens: 140 s alone on 2 cores, over 240 s when the machine is busy with other work.
});
