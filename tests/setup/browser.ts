import type { Browser, BrowserContext } from 'playwright-core';
import { inject } from 'vitest';
import { createSequelize } from '@server/db/connection';
import { initModels } from '@server/db/models';
import { createEnrolment } from '@server/features/kiosks/kiosks.service';
import type { Sequelize } from 'sequelize';

let sequelize: Sequelize | undefined;
export function e2eDatabase(): Sequelize {
  if (!sequelize) {
    sequelize = createSequelize(inject('e2eDatabaseUrl'), { pool: 3 });
    initModels(sequelize);
  }
  return sequelize;
}

/**
 * A new browser context that has been enrolled as a kiosk tablet through the enrolment link, as a hangar would;
 * on the test server, or on another server of the same database (a test that serves its own build).
 */
export async function enrolledKiosk(
  browser: Browser,
  viewport = { width: 1280, height: 800 },
  baseURL = inject('baseUrl'),
): Promise<BrowserContext> {
  e2eDatabase();
  const enrolment = await createEnrolment('E2E tablet', null);
  const context = await browser.newContext({ viewport, baseURL });
  const page = await context.newPage();
  await page.goto(enrolment.enrolPath);
  await page.waitForURL(/\/kiosk/, { timeout: 15_000 });
  await page.close();
  return context;
}

/** A mechanic and an RX-4 airframe of this test's own, made directly in the e2e database. */
export async function makeMechanicAndAirframe() {
  e2eDatabase();
  const { AircraftType, Airframe, Base, Staff, Tag } = await import('@server/db/models');
  const { hashSecret, randomToken } = await import('@server/security/hashing');
  const suffix = Math.random().toString(36).slice(2, 6).toUpperCase();
  // Digits only: the kiosk keypad types badge numbers.
  const badge = String(100_000 + Math.floor(Math.random() * 899_999));
  const pin = '3690';
  const staff = await Staff.create({
    badgeNumber: badge,
    name: `Mechanic ${suffix}`,
    licenceNumber: `E2E-${suffix}`,
    roles: 'mechanic',
    pinHash: await hashSecret(pin, 4),
    passwordHash: null,
    lockedUntil: null,
  });
  const type = await AircraftType.findOne({ where: { code: 'RX-4' } });
  const base = await Base.findOne();
  const airframe = await Airframe.create({
    fleetNumber: `E-${suffix}`,
    serial: `E2E-${suffix}`,
    typeId: type!.id,
    baseId: base!.id,
    hours: 321.4,
  });
  const tag = await Tag.create({
    airframeId: airframe.id,
    token: randomToken(12),
    issuedAt: new Date(),
    revokedAt: null,
  });
  return { badge: staff.badgeNumber, pin, staff, airframe, tag };
}
