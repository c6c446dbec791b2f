import type { Sequelize, Transaction } from 'sequelize';
import QRCode from 'qrcode';
import {
  tagShortCode,
  type AirframeInput,
  type FleetAirframe,
  type TagSheetEntry,
} from '@shared/schemas/fleet';
import { isDuplicateKey } from '@server/db/unique-violation';
import { updateRow } from '@server/db/rows';
import {
  basesByCode,
  fleetRows,
  insertAirframe,
  insertTag,
  liveTags,
  lockAirframe,
  typeAndBase,
  activeAirframeWithRegistration,
  type Airframe,
} from './fleet.repository';
import { appendAuditEvent, updateAudited } from '@server/audit/audit-trail';
import { randomToken } from '@server/security/hashing';
import { badRequest, conflict, notFound, refusal } from '@server/errors/app-error';
import { inTransaction } from '@server/db/retry';

export const tagUrl = (origin: string, token: string) => `${origin}/t/${token}`;

export async function listBases() {
  const bases = await basesByCode();
  return bases.map((b) => ({ id: b.id, code: b.code, name: b.name }));
}

export async function listFleet(): Promise<FleetAirframe[]> {
  const [airframes, types, bases, tags] = await fleetRows();
  const typeById = new Map(types.map((t) => [t.id, t]));
  const baseById = new Map(bases.map((b) => [b.id, b]));
  return airframes.map((a) => {
    const own = tags.filter((t) => t.airframeId === a.id);
    const live = own.find((t) => t.revokedAt === null);
    const base = baseById.get(a.baseId);
    return {
      id: a.id,
      fleetNumber: a.fleetNumber,
      serial: a.serial,
      type: { id: a.typeId, code: typeById.get(a.typeId)?.code ?? '?' },
      base: { id: a.baseId, code: base?.code ?? '?', name: base?.name ?? '?' },
      hours: Number(a.hours),
      flights: Number(a.flights ?? 0),
      registration: a.registration ?? null,
      active: a.active,
      tag: live
        ? {
            id: live.id,
            token: live.token,
            shortCode: tagShortCode(live.token),
            issuedAt: live.issuedAt.toISOString(),
          }
        : null,
      revokedTags: own.length - (live ? 1 : 0),
    };
  });
}

async function assertRefs(input: AirframeInput) {
  const [type, base] = await typeAndBase(input.typeId, input.baseId);
  if (!type)
    throw badRequest('unknown_type', refusal('types.typeGone'), {
      path: 'typeId',
    });
  if (!base)
    throw badRequest('unknown_base', refusal('bases.baseGone'), {
      path: 'baseId',
    });
}

const fleetNumberTaken = (fleetNumber: string) =>
  conflict('fleet_number_taken', refusal('fleet.fleetNumberTaken', { fleetNumber }), {
    path: 'fleetNumber',
  });

/** The holder's fleet number, when it is known. */
const registrationTaken = (registration: string, holder?: string) =>
  conflict(
    'registration_taken',
    holder === undefined
      ? refusal('fleet.registrationTakenElsewhere', { registration })
      : refusal('fleet.registrationTaken', { registration, holder }),
    { path: 'registration' },
  );

/** Refuses a mark another airframe in service carries, naming it; the unique index settles a race. */
async function assertRegistrationFree(registration: string | null | undefined, exceptId?: number) {
  if (!registration) return;
  const holder = await activeAirframeWithRegistration(registration);
  if (holder && holder.id !== exceptId) throw registrationTaken(registration, holder.fleetNumber);
}

/** Which unique key refused the write: the registration's index names itself in the driver's message. */
function duplicateOf(err: unknown, input: AirframeInput) {
  const text = err instanceof Error ? `${err.message} ${String((err as { parent?: unknown }).parent)}` : '';
  return /active_registration/.test(text) && input.registration
    ? registrationTaken(input.registration)
    : fleetNumberTaken(input.fleetNumber);
}

async function issueTag(
  sequelize: Sequelize,
  transaction: Transaction,
  airframe: Airframe,
  actorId: number,
  now: Date,
) {
  const tag = await insertTag(
    { airframeId: airframe.id, token: randomToken(12), issuedAt: now, revokedAt: null },
    transaction,
  );
  await appendAuditEvent(sequelize, transaction, {
    actorId,
    action: 'tag.issued',
    entity: 'tag',
    entityId: String(tag.id),
    payload: { airframe: airframe.fleetNumber, shortCode: tagShortCode(tag.token) },
    at: now,
  });
  return tag;
}

export async function createAirframe(sequelize: Sequelize, input: AirframeInput, actorId: number) {
  await assertRefs(input);
  await assertRegistrationFree(input.registration);
  const now = new Date();
  try {
    return await inTransaction(sequelize, async (transaction) => {
      const airframe = await insertAirframe({ ...input }, transaction);
      await appendAuditEvent(sequelize, transaction, {
        actorId,
        action: 'airframe.created',
        entity: 'airframe',
        entityId: String(airframe.id),
        payload: { ...input },
        at: now,
      });
      await issueTag(sequelize, transaction, airframe, actorId, now);
      return { id: airframe.id };
    });
  } catch (err) {
    if (isDuplicateKey(err)) throw duplicateOf(err, input);
    throw err;
  }
}

export async function updateAirframe(
  sequelize: Sequelize,
  id: number,
  input: AirframeInput,
  actorId: number,
) {
  await assertRefs(input);
  await assertRegistrationFree(input.registration, id);
  try {
    return await inTransaction(sequelize, async (transaction) => {
      const airframe = await lockAirframe(id, transaction);
      if (!airframe) throw notFound(refusal('airframes.airframeGone'));
      const before = {
        fleetNumber: airframe.fleetNumber,
        serial: airframe.serial,
        typeId: airframe.typeId,
        baseId: airframe.baseId,
        hours: Number(airframe.hours),
        flights: Number(airframe.flights ?? 0),
        registration: airframe.registration ?? null,
      };
      const after = {
        ...input,
        flights: input.flights ?? before.flights,
        registration: input.registration === undefined ? before.registration : input.registration,
      };
      if (after.flights < before.flights) {
        throw badRequest(
          'flights_backwards',
          refusal('fleet.flightsBackwards', {
            fleetNumber: airframe.fleetNumber,
            flown: { decimal: before.flights, places: 0 },
            entered: { decimal: after.flights, places: 0 },
          }),
          { path: 'flights', last: before.flights },
        );
      }
      const changed = await updateAudited(
        sequelize,
        transaction,
        airframe,
        { before, after },
        {
          actorId,
          action: 'airframe.changed',
          entity: 'airframe',
          entityId: String(id),
        },
      );
      return { id, changed };
    });
  } catch (err) {
    if (isDuplicateKey(err)) throw duplicateOf(err, input);
    throw err;
  }
}

/** A dirty or lost tag is replaced: the old one is refused (410) from this instant. */
export async function reissueTag(sequelize: Sequelize, airframeId: number, actorId: number) {
  const now = new Date();
  return inTransaction(sequelize, async (transaction) => {
    const airframe = await lockAirframe(airframeId, transaction);
    if (!airframe) throw notFound(refusal('airframes.airframeGone'));
    const live = await liveTags(airframeId, transaction);
    for (const old of live) {
      await updateRow(old, { revokedAt: now }, transaction);
      await appendAuditEvent(sequelize, transaction, {
        actorId,
        action: 'tag.revoked',
        entity: 'tag',
        entityId: String(old.id),
        payload: { airframe: airframe.fleetNumber, shortCode: tagShortCode(old.token), reason: 'reissued' },
        at: now,
      });
    }
    const tag = await issueTag(sequelize, transaction, airframe, actorId, now);
    return {
      airframeId,
      tag: { id: tag.id, token: tag.token, shortCode: tagShortCode(tag.token) },
      revoked: live.length,
    };
  });
}

export async function tagSheet(origin: string, ids?: number[]): Promise<TagSheetEntry[]> {
  const fleet = (await listFleet()).filter((a) => a.active && a.tag && (!ids || ids.includes(a.id)));
  return Promise.all(
    fleet.map(async (a) => {
      const url = tagUrl(origin, a.tag!.token);
      return {
        airframeId: a.id,
        fleetNumber: a.fleetNumber,
        registration: a.registration,
        typeCode: a.type.code,
        url,
        shortCode: a.tag!.shortCode,
        qrSvg: await QRCode.toString(url, { type: 'svg', errorCorrectionLevel: 'M', margin: 2 }),
      };
    }),
  );
}
