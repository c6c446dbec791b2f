import { chromium, type Browser, type BrowserContext } from 'playwright-core';
import { inject } from 'vitest';
import { createSequelize } from '../../server/db/connection';
import { initModels } from '../../server/db/models';
import { createEnrolment } from '../../server/features/kiosks/kiosks.service';
import type { Sequelize } from 'sequelize';

export const chromiumFlags = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export const launchBrowser = (): Promise<Browser> =>
  chromium.launch({ executablePath: '/usr/bin/chromium', args: chromiumFlags });

let sequelize: Sequelize | undefined;
export function e2eDatabase(): Sequelize {
  if (!sequelize) {
    sequelize = createSequelize(inject('e2eDatabaseUrl'), { pool: 3 });
    initModels(sequelize);
  }
  return sequelize;
}

/** A new browser context that has been enrolled as a kiosk tablet through the enrolment link, as a hangar would. */
export async function enrolledKiosk(
  browser: Browser,
  viewport = { width: 1280, height: 800 },
): Promise<BrowserContext> {
  e2eDatabase();
  const enrolment = await createEnrolment('E2E tablet', null);
  const context = await browser.newContext({ viewport, baseURL: inject('baseUrl') });
  const page = await context.newPage();
  await page.goto(enrolment.enrolPath);
  await page.waitForURL(/\/kiosk/, { timeout: 15_000 });
  await page.close();
  return context;
}
