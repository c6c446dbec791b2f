import type { Sequelize } from 'sequelize';
import { randomUUID } from 'node:crypto';
import type { CheckContext, CheckKind, ReadingEntry } from '@shared/schemas/limits';
import { demoAirframe, demoStaff, demoStaffByBadge, seedDemoRows } from '@server/db/seeders/demo-rows';
import { submitCheck } from '@server/features/checks/checks.service';
import { toSessionUser } from '@server/features/auth/auth.service';
import { grantAuthorisation } from '@server/features/staff/authorisations.service';
import { deferDefect, raiseDefect } from '@server/features/defects/defects.service';
import { releaseAirframe } from '@server/features/releases/releases.service';
import { airframeStatuses } from '@server/features/airframes/airframes.service';

export interface SeedResult {
  seeded: boolean;
}

/**
 * Loads the invented demo scenario once, into an empty database only: the rows first, then authorisations,
 * checks, a defect and a release through the same services the kiosk and the desk use.
 */
export async function seedDemo(
  sequelize: Sequelize,
  options: { bcryptCost: number; withHistory?: boolean },
): Promise<SeedResult> {
  const rows = await seedDemoRows(options);
  if (!rows) return { seeded: false };
  await seedAuthorisations(sequelize, rows.engineerId);
  if (options.withHistory !== false) await seedHistory(sequelize, rows.limitsByType);
  return { seeded: true };
}

const onWheels: CheckContext = { attitude: 'on_wheels', systemPressure: 'relieved', ambientTempC: 14 };
const goodRx4PreFlight: Record<string, ReadingEntry> = {
  'sys1.level': { value: 7.0, unit: 'L' },
  'sys2.level': { value: 4.5, unit: 'L' },
  'brake.precharge': { value: 44, unit: 'bar' },
  'sys1.filter_bypass': { answer: false },
  'sys2.filter_bypass': { answer: false },
  'sys1.leaks': { dropsPerMinute: 0 },
  'sys2.leaks': { dropsPerMinute: 0 },
  'brakes.leaks': { dropsPerMinute: 0 },
};

/** In a year's time, as YYYY-MM-DD: the demo's authorisations stay valid whenever it is run. */
const aYearOn = () => new Date(Date.now() + 365 * 24 * 3_600_000).toISOString().slice(0, 10);

/**
 * Invented certifying authorisations: Jonah Pell may certify and defer on both types, all chapters; Ruth Amsel
 * only on the RL-2 (so the demo shows a refusal for an RX-4).
 */
async function seedAuthorisations(sequelize: Sequelize, engineerId: number) {
  const grants = [
    {
      badge: '5201',
      category: 'B1' as const,
      typeCodes: ['RX-4', 'RL-2'],
      scope: ['all'],
      reference: 'TIA-CA-017',
    },
    { badge: '5202', category: 'B2' as const, typeCodes: ['RL-2'], scope: ['29'], reference: 'TIA-CA-023' },
  ];
  for (const grant of grants) {
    const person = await demoStaffByBadge(grant.badge);
    if (!person) continue;
    const { badge: _badge, ...input } = grant;
    await grantAuthorisation(sequelize, person.id, { ...input, expiresOn: aYearOn() }, engineerId);
  }
}

/** A morning's worth of signed checks through the same path the kiosk uses, so the board has something to show. */
async function seedHistory(sequelize: Sequelize, limitsByType: Map<string, number>) {
  const mechanic = await demoStaffByBadge('4101');
  const pin = demoStaff.find((s) => s.badge === '4101')!.pin;
  if (!mechanic) return;
  const signer = toSessionUser(mechanic);
  const sign = async (
    fleetNumber: string,
    kind: CheckKind,
    readings: Record<string, ReadingEntry>,
    minutesAgo: number,
  ) => {
    const airframe = await demoAirframe(fleetNumber);
    if (!airframe) return;
    await submitCheck(
      sequelize,
      {
        id: randomUUID(),
        airframeId: airframe.id,
        kind,
        limitsVersionId: limitsByType.get('RX-4')!,
        context: onWheels,
        readings: Object.entries(readings).map(([code, entry]) => ({ code, entry })),
        pin,
      },
      {
        signer,
        kioskId: null,
        lockout: { maxAttempts: 5, lockMinutes: 15 },
        now: new Date(Date.now() - minutesAgo * 60_000),
      },
    );
  };
  await sign('T-01', 'pre_flight', goodRx4PreFlight, 95);
  await sign('T-03', 'pre_flight', { ...goodRx4PreFlight, 'sys2.level': { value: 1.2, unit: 'L' } }, 40);
  // A weep counted at a servo, within the demo's allowed dynamic rate: the records show a leak in drops/min.
  const weep: ReadingEntry = { dropsPerMinute: 2, leakState: 'dynamic' };
  await sign('T-02', 'pre_flight', { ...goodRx4PreFlight, 'sys1.leaks': weep }, 20 * 60);
  await deferredDefectOnT01(sequelize);
}

/** T-01 carries a deferred defect and a certificate of release to service, so the demo shows both. */
async function deferredDefectOnT01(sequelize: Sequelize) {
  const lead = await demoStaffByBadge('5201');
  const airframe = await demoAirframe('T-01');
  if (!lead || !airframe) return;
  const pin = demoStaff.find((p) => p.badge === '5201')!.pin;
  const ctx = {
    signer: toSessionUser(lead),
    channel: 'kiosk' as const,
    lockout: { maxAttempts: 5, lockMinutes: 15 },
  };
  const at = (minutesAgo: number) => new Date(Date.now() - minutesAgo * 60_000);
  const defect = await raiseDefect(
    sequelize,
    airframe.id,
    { description: 'Cabin step light inoperative.', chapter: null, pin },
    ctx,
    at(80),
  );
  await deferDefect(
    sequelize,
    defect.id,
    {
      reference: 'MEL 33-40-01 (demo)',
      category: 'C',
      pin,
      repeatInspection: 'Placard the step; check daily.',
    },
    ctx,
    at(75),
  );
  await releaseAirframe(
    sequelize,
    async (id, now) => (await airframeStatuses(sequelize, now, id))[0],
    airframe.id,
    { pin },
    ctx,
    at(70),
  );
}
