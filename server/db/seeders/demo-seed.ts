import type { Sequelize } from 'sequelize';
import { randomUUID } from 'node:crypto';
import { demoTypes } from '@shared/demo/demo-types';
import type { CheckContext, CheckKind, ReadingEntry } from '@shared/schemas/limits';
import type { Role } from '@shared/schemas/auth';
import { AircraftType, Airframe, Base, LimitsVersion, Staff, Tag } from '../models';
import { hashSecret, randomToken } from '@server/security/hashing';
import { submitCheck } from '@server/features/checks/checks.service';
import { toSessionUser } from '@server/features/auth/auth.service';
import { grantAuthorisation } from '@server/features/staff/authorisations.service';
import { deferDefect, raiseDefect } from '@server/features/defects/defects.service';
import { releaseAirframe } from '@server/features/releases/releases.service';
import { airframeStatuses } from '@server/features/airframes/airframes.service';

/** Invented people of the demo operator, Tern Island Air Ambulance. PINs and passwords are printed by `npm start`. */
export const demoStaff: {
  badge: string;
  name: string;
  licence: string;
  roles: Role[];
  pin: string;
  password?: string;
}[] = [
  { badge: '4101', name: 'Ines Calder', licence: 'TIA-B1-0417', roles: ['mechanic'], pin: '2468' },
  { badge: '4102', name: 'Tomas Reyna', licence: 'TIA-B1-0522', roles: ['mechanic'], pin: '1357' },
  {
    badge: '5201',
    name: 'Jonah Pell',
    licence: 'TIA-B1-0301',
    roles: ['shift_lead', 'mechanic'],
    pin: '9753',
    password: 'north-pad-lead',
  },
  {
    badge: '5202',
    name: 'Ruth Amsel',
    licence: 'TIA-B2-0288',
    roles: ['shift_lead'],
    pin: '3141',
    password: 'harbour-lead',
  },
  { badge: '6301', name: 'Lena Ferro', licence: 'TIA-CPL-1190', roles: ['pilot'], pin: '2718' },
  { badge: '6302', name: 'Owen Tarr', licence: 'TIA-CPL-1244', roles: ['pilot'], pin: '1618' },
  {
    badge: '7401',
    name: 'Priya Nand',
    licence: 'TIA-ENG-0077',
    roles: ['engineering'],
    pin: '4242',
    password: 'desk-engineering',
  },
];

const fleet = [
  { fleet: 'T-01', serial: 'RX4-31021', type: 'RX-4', base: 'NP', hours: 4211.4 },
  { fleet: 'T-02', serial: 'RX4-31034', type: 'RX-4', base: 'NP', hours: 3890.2 },
  { fleet: 'T-03', serial: 'RX4-31057', type: 'RX-4', base: 'HH', hours: 2675.8 },
  { fleet: 'T-04', serial: 'RX4-31102', type: 'RX-4', base: 'HH', hours: 1520.0 },
  { fleet: 'T-05', serial: 'RX4-31118', type: 'RX-4', base: 'NP', hours: 988.6 },
  { fleet: 'T-06', serial: 'RL2-7730', type: 'RL-2', base: 'HH', hours: 5402.3 },
  { fleet: 'T-07', serial: 'RL2-7745', type: 'RL-2', base: 'NP', hours: 3120.9 },
  { fleet: 'T-08', serial: 'RL2-7791', type: 'RL-2', base: 'HH', hours: 610.5 },
];

export interface SeedResult {
  seeded: boolean;
}

/** Loads the invented demo scenario once, into an empty database only. */
export async function seedDemo(
  sequelize: Sequelize,
  options: { bcryptCost: number; withHistory?: boolean },
): Promise<SeedResult> {
  if ((await Staff.count()) > 0 || (await Airframe.count()) > 0) return { seeded: false };

  const bases = await Base.bulkCreate([
    { code: 'NP', name: 'North Pad' },
    { code: 'HH', name: 'Harbour Hangar' },
  ]);
  const baseId = new Map(bases.map((b) => [b.code, b.id]));
  for (const person of demoStaff) {
    await Staff.create({
      badgeNumber: person.badge,
      name: person.name,
      licenceNumber: person.licence,
      roles: person.roles.join(','),
      pinHash: await hashSecret(person.pin, options.bcryptCost),
      passwordHash: person.password ? await hashSecret(person.password, options.bcryptCost) : null,
      lockedUntil: null,
    });
  }
  const engineer = await Staff.findOne({ where: { badgeNumber: '7401' } });
  const limitsByType = new Map<string, number>();
  const typeIds = new Map<string, number>();
  for (const definition of demoTypes) {
    const type = await AircraftType.create({ code: definition.code, name: definition.name });
    typeIds.set(definition.code, type.id);
    const version = await LimitsVersion.create({
      typeId: type.id,
      version: 1,
      status: 'published',
      definition: JSON.stringify(definition),
      publishedAt: new Date(),
      publishedBy: engineer?.id ?? null,
    });
    limitsByType.set(definition.code, version.id);
  }
  for (const a of fleet) {
    const airframe = await Airframe.create({
      fleetNumber: a.fleet,
      serial: a.serial,
      typeId: typeIds.get(a.type)!,
      baseId: baseId.get(a.base)!,
      hours: a.hours,
    });
    await Tag.create({
      airframeId: airframe.id,
      token: randomToken(12),
      issuedAt: new Date(),
      revokedAt: null,
    });
  }
  await seedAuthorisations(sequelize, engineer!.id);
  if (options.withHistory !== false) await seedHistory(sequelize, limitsByType);
  return { seeded: true };
}

const onWheels: CheckContext = { attitude: 'on_wheels', systemPressure: 'relieved', ambientTempC: 14 };
const goodRx4PreFlight: Record<string, ReadingEntry> = {
  'sys1.level': { value: 7.0, unit: 'L' },
  'sys2.level': { value: 4.5, unit: 'L' },
  'brake.precharge': { value: 44, unit: 'bar' },
  'sys1.filter_bypass': { answer: false },
  'sys2.filter_bypass': { answer: false },
  'sys1.leaks': { answer: false },
  'sys2.leaks': { answer: false },
  'brakes.leaks': { answer: false },
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
    const person = await Staff.findOne({ where: { badgeNumber: grant.badge } });
    if (!person) continue;
    const { badge: _badge, ...input } = grant;
    await grantAuthorisation(sequelize, person.id, { ...input, expiresOn: aYearOn() }, engineerId);
  }
}

/** A morning's worth of signed checks through the same path the kiosk uses, so the board has something to show. */
async function seedHistory(sequelize: Sequelize, limitsByType: Map<string, number>) {
  const mechanic = await Staff.findOne({ where: { badgeNumber: '4101' } });
  const pin = demoStaff.find((s) => s.badge === '4101')!.pin;
  if (!mechanic) return;
  const signer = toSessionUser(mechanic);
  const sign = async (
    fleetNumber: string,
    kind: CheckKind,
    readings: Record<string, ReadingEntry>,
    minutesAgo: number,
  ) => {
    const airframe = await Airframe.findOne({ where: { fleetNumber } });
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
  await sign('T-02', 'pre_flight', goodRx4PreFlight, 20 * 60);
  await deferredDefectOnT01(sequelize);
}

/** T-01 carries a deferred defect and a certificate of release to service, so the demo shows both. */
async function deferredDefectOnT01(sequelize: Sequelize) {
  const lead = await Staff.findOne({ where: { badgeNumber: '5201' } });
  const airframe = await Airframe.findOne({ where: { fleetNumber: 'T-01' } });
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
