import AxeBuilder from '@axe-core/playwright';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { english } from '@shared/i18n/english';
import { namespaces, type Namespace } from '@shared/i18n/setup';
import { e2eDatabase, enrolledKiosk } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { deskContext, kioskSignIn } from '../setup/kiosk-steps';
import german from '../setup/german-catalogue';

// The demo's screens walked in German: no key missing from the German catalogue, none of the English sentences
// the catalogue translates left on screen, dates in the German style, and axe still finds nothing serious. A
// screen's words become German as its feature's catalogue is translated, so the English-sentence check reads
// every namespace that has German text: it grows with the catalogue and needs no change here.

/** English texts of the catalogue that German translates, long enough to be a sentence and free of values. */
function englishSentences(): { namespace: Namespace; text: string }[] {
  const found: { namespace: Namespace; text: string }[] = [];
  const walk = (namespace: Namespace, en: unknown, de: unknown) => {
    if (typeof en === 'string') {
      const fixed = en.split(/\{\{[^}]+\}\}/).map((part) => part.trim());
      for (const part of fixed) {
        if (part.split(' ').length >= 3 && part !== de) found.push({ namespace, text: part });
      }
      return;
    }
    if (!en || typeof en !== 'object') return;
    for (const [key, value] of Object.entries(en)) {
      const other = de && typeof de === 'object' ? (de as Record<string, unknown>)[key] : undefined;
      if (other !== undefined) walk(namespace, value, other);
    }
  };
  for (const namespace of namespaces) walk(namespace, english[namespace], german[namespace]);
  return found;
}

const sentences = englishSentences();
// German instants: "2. Dez. 2026, 14:05 UTC", "15. Juli 2026, 23:59 WESZ".
const germanInstant =
  /\b\d{1,2}\. [A-ZÄÖÜ][a-zäöü]{2,4}\.? \d{4}, \d{2}:\d{2} (UTC|[A-Z]{2,5}|GMT[+-]\d{1,2}(:\d{2})?)\b/g;
// An English day, with or without its time ("3 Dec 2027", "2 Dec 2026, 14:05").
const englishInstant = /\b\d{1,2} (Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec) \d{4}(, \d{2}:\d{2})?\b/g;
/** A figure with its unit written with a decimal point ("3.50 L", "44.1 bar"): German writes "3,50 l". */
const englishFigure = /\b\d+\.\d+\s?(?:L|l|bar|psi|kPa|MPa|US qt|US gal|UK gal|°C|°F|K|h)(?![\w-])/g;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** Opens a path in German and returns what is not German on it: missing keys, English sentences, axe findings. */
async function readGerman(page: Page, path: string): Promise<string[]> {
  await page.goto(`${path}${path.includes('?') ? '&' : '?'}lang=de`);
  await page.waitForLoadState('networkidle');
  await page.waitForTimeout(300);
  const problems: string[] = [];
  expect(await page.evaluate(() => document.documentElement.lang), `${path} says it is German`).toBe('de');
  const missing = await page.evaluate(() => window.__gaugewalkMissingKeys ?? []);
  for (const key of missing) problems.push(`${path}: missing key ${key}`);
  // Sentences the server composes for the airframe summaries (its state's reasons, a finding's words, a defect's
  // standing) are still written in English by shared/domain/status.ts and are marked data-server-words; they are
  // the one known gap (README, "Languages") and are left out here so the test says what the catalogues cover.
  let text = await page.locator('body').innerText();
  // Recorded text (a defect's description, a band's message written by engineering) reads as it was written.
  for (const serverWords of await page
    .locator('[data-server-words], [data-recorded-words]')
    .allInnerTexts()) {
    text = text.replaceAll(serverWords.trim(), '');
  }
  for (const { namespace, text: sentence } of sentences) {
    if (text.includes(sentence)) problems.push(`${path}: English left (${namespace}) "${sentence}"`);
  }
  for (const match of text.matchAll(englishInstant)) problems.push(`${path}: English date "${match[0]}"`);
  for (const match of text.matchAll(englishFigure)) problems.push(`${path}: English figure "${match[0]}"`);
  const axe = await new AxeBuilder({ page }).analyze();
  for (const v of axe.violations.filter((x) => x.impact === 'serious' || x.impact === 'critical')) {
    problems.push(`${path}: axe ${v.id} (${v.impact}) ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
  }
  return problems;
}

async function demoIds() {
  const { Airframe, Hold } = await import('@server/db/models');
  e2eDatabase();
  const airframes = await Airframe.findAll({ where: { active: true }, order: [['id', 'ASC']] });
  const holds = await Hold.findAll({ order: [['id', 'ASC']] });
  return { airframes, holds };
}

describe('the German catalogue against the screens', () => {
  it('when the English catalogue is walked, then the sentences German translates are found for the screens to be read against', () => {
    expect(sentences.length).toBeGreaterThan(50);
    expect(sentences).toContainEqual({ namespace: 'board', text: 'Loading the board…' });
  });
});

describe('the demo in German', () => {
  it('when the hangar board opens from a board link with lang=de, then it reads German with German dates and keeps German on the way to the sign-in', async () => {
    const { createBoardLink } = await import('@server/features/board-links/board-links.service');
    const link = await createBoardLink(e2eDatabase(), 'German TV', 1);
    const tv = await browser.newContext({
      viewport: { width: 1920, height: 1080 },
      baseURL: inject('baseUrl'),
    });
    const board = await tv.newPage();
    expect(await readGerman(board, link.path)).toEqual([]);
    await expect.poll(() => board.getByRole('heading', { name: 'Hallentafel' }).count()).toBe(1);
    const text = await board.locator('body').innerText();
    expect(text).toMatch(germanInstant);
    expect(text).toMatch(/Luftfahrzeuge|Luftfahrzeug/);
    // The TV keeps its language for the next start even without the query (i18next's localStorage cache).
    await board.goto(link.path);
    await board.waitForLoadState('networkidle');
    expect(await board.evaluate(() => document.documentElement.lang)).toBe('de');
    await tv.close();
  }, 120_000);

  it("when engineering reads an airframe's fluid trends in German, then the chart names its time axis in German, not in uPlot's English", async () => {
    const desk = await deskContext(browser, '7401', 'desk-engineering');
    const { airframes } = await demoIds();
    const t01 = airframes.find((airframe) => airframe.fleetNumber === 'T-01')!;
    expect(await readGerman(desk.page, `/desk/trends?airframeId=${t01.id}`)).toEqual([]);
    const legend = desk.page.locator('.u-legend').first();
    await legend.waitFor();
    // uPlot's own legend named it "Time", in English, and wrote its ticks "9/7" on the desk computer's clock.
    expect(await legend.innerText()).toContain('Zeit (UTC)');
    expect(await legend.innerText()).not.toContain('Time');
    await desk.context.close();
  }, 120_000);

  it('when a lead walks the holds, the tech log and the handover in German, at the kiosk and at the desk, then nothing is left in English or missing', async () => {
    const ids = await demoIds();
    const problems: string[] = [];
    const leadKiosk = await enrolledKiosk(browser);
    const lead = await leadKiosk.newPage();
    await kioskSignIn(lead, '5201', '9753');
    await lead.waitForURL(/\/kiosk\//);
    problems.push(...(await readGerman(lead, '/kiosk/holds')));
    for (const hold of ids.holds) problems.push(...(await readGerman(lead, `/kiosk/holds/${hold.id}`)));
    problems.push(...(await readGerman(lead, '/kiosk/defects')));
    for (const airframe of ids.airframes.slice(0, 3)) {
      problems.push(...(await readGerman(lead, `/kiosk/defects/${airframe.id}`)));
    }
    await leadKiosk.close();

    const desk = await deskContext(browser, '5201', 'north-pad-lead');
    for (const path of ['/desk/holds', '/desk/defects', '/desk/handover']) {
      problems.push(...(await readGerman(desk.page, path)));
    }
    for (const hold of ids.holds) problems.push(...(await readGerman(desk.page, `/desk/holds/${hold.id}`)));
    await desk.context.close();
    expect([...new Set(problems)]).toEqual([]);
  }, 240_000);
});
