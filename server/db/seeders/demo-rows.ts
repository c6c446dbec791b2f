import { randomToken, hashSecret } from '@server/security/hashing';
import { demoTypes } from '@shared/demo/demo-types';
import type { Role } from '@shared/schemas/auth';
import type { Language } from '@shared/i18n/languages';
import type { CreationAttributes } from 'sequelize';
import { AircraftType, Airframe, Base, LimitsVersion, Staff, Tag, Tool } from '../models';

export const demoStaff: {
  badge: string;
  name: string;
  licence: string;
  roles: Role[];
  pin: string;
  password?: string;
  /** The kiosk switches to it at this badge's sign-in. */
  language?: Language;
}[] = [
  { badge: '4101', name: 'Ines Calder', licence: 'TIA-B1-0417', roles: ['mechanic'], pin: '2468' },
  {
    badge: '4102',
    name: 'Tomas Reyna',
    licence: 'TIA-B1-0522',
    roles: ['mechanic'],
    pin: '1357',
    language: 'de',
  },
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

// Invented marks: no State's nationality mark begins with Q (ICAO Annex 7 and the ITU call-sign series, from
// memory), so "QX-" cannot be a real aircraft.
const fleet = [
  { fleet: 'T-01', registration: 'QX-TNA', serial: 'RX4-31021', type: 'RX-4', base: 'NP', hours: 4211.4 },
  { fleet: 'T-02', registration: 'QX-TNB', serial: 'RX4-31034', type: 'RX-4', base: 'NP', hours: 3890.2 },
  { fleet: 'T-03', registration: 'QX-TNC', serial: 'RX4-31057', type: 'RX-4', base: 'HH', hours: 2675.8 },
  { fleet: 'T-04', registration: 'QX-TND', serial: 'RX4-31102', type: 'RX-4', base: 'HH', hours: 1520.0 },
  { fleet: 'T-05', registration: 'QX-TNE', serial: 'RX4-31118', type: 'RX-4', base: 'NP', hours: 988.6 },
  { fleet: 'T-06', registration: 'QX-TNF', serial: 'RL2-7730', type: 'RL-2', base: 'HH', hours: 5402.3 },
  { fleet: 'T-07', registration: 'QX-TNG', serial: 'RL2-7745', type: 'RL-2', base: 'NP', hours: 3120.9 },
  { fleet: 'T-08', registration: 'QX-TNH', serial: 'RL2-7791', type: 'RL-2', base: 'HH', hours: 610.5 },
];

/**
 * The demo's bases, people, types (limits published) and airframes with their tags, written once into an empty
 * database; null when there is data already.
 */
export async function seedDemoRows(options: {
  bcryptCost: number;
}): Promise<{ limitsByType: Map<string, number>; engineerId: number } | null> {
  if ((await Staff.count()) > 0 || (await Airframe.count()) > 0) return null;
  const bases = await Base.bulkCreate([
    { code: 'NP', name: 'North Pad', timeZone: 'Atlantic/Madeira' },
    { code: 'HH', name: 'Harbour Hangar', timeZone: 'Atlantic/Madeira' },
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
      preferredLanguage: person.language ?? null,
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
      registration: a.registration,
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
  await Tool.bulkCreate(demoTools(new Date()));
  return { limitsByType, engineerId: engineer!.id };
}

/** The demo's tools register, due dates counted from today: PG-014 ran out two days ago, to show the refusal. */
export function demoTools(today: Date) {
  const day = (days: number) => new Date(today.getTime() + days * 86_400_000).toISOString().slice(0, 10);
  return [
    {
      number: 'PG-011',
      kind: 'pressure_gauge',
      description: 'Test gauge 0-160 bar, accumulator pre-charge',
      serial: 'TG-40117',
      calibrationDue: day(170),
    },
    {
      number: 'PG-014',
      kind: 'pressure_gauge',
      description: 'Test gauge 0-250 bar, system pressure',
      serial: 'TG-40562',
      calibrationDue: day(-2),
    },
    {
      number: 'NK-003',
      kind: 'nitrogen_charging_kit',
      description: 'Nitrogen charging kit with 0-100 bar gauge',
      serial: 'NCK-2291',
      calibrationDue: day(95),
    },
    {
      number: 'SC-002',
      kind: 'servicing_cart',
      description: 'Hydraulic servicing cart, hand pump and filter',
      serial: 'HSC-0815',
      calibrationDue: day(240),
    },
  ] as const satisfies readonly Omit<CreationAttributes<Tool>, 'createdAt' | 'retiredAt'>[];
}

export const demoStaffByBadge = (badgeNumber: string) => Staff.findOne({ where: { badgeNumber } });

export const demoAirframe = (fleetNumber: string) => Airframe.findOne({ where: { fleetNumber } });
