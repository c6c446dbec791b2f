import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes, type Sequelize } from 'sequelize';
import { makeAirframe, makeKioskToken, makeStaff } from '../setup/api-harness';
import { preFlightBody } from '../setup/check-builder';
import { verifyAuditTrail } from '@server/audit/audit-trail';
import { KillableDatabase, ServerProcess, SimulatedKiosk, connect, type SendLog } from './fault-harness';

const KIOSKS = 20;
const CHECKS = 500;
const RX4_PRE_FLIGHT_READINGS = 8;

const db = new KillableDatabase();
let server: ServerProcess;

beforeAll(async () => {
  await db.start();
  const sequelize = await connect(db.url);
  await sequelize.close();
  server = new ServerProcess(db.url);
  await server.start();
});

afterAll(async () => {
  await server?.remove();
  await db.remove();
});

/** 20 tablets, each an enrolled device with a signed-in mechanic, and 500 checks spread over them. */
async function hangarAtDawn() {
  const sequelize = await connect(db.url);
  const airframes = await Promise.all([1, 2, 3, 4, 5].map(() => makeAirframe()));
  const kiosks = await Promise.all(
    Array.from({ length: KIOSKS }, async () => {
      const mechanic = await makeStaff(['mechanic']);
      const { token } = await makeKioskToken();
      return { kiosk: new SimulatedKiosk(() => server.url, token, mechanic.badge, mechanic.pin), mechanic };
    }),
  );
  await sequelize.close();
  for (const { kiosk } of kiosks) await kiosk.signIn();
  const work = kiosks.map(({ kiosk, mechanic }, k) => ({
    kiosk,
    bodies: Array.from({ length: CHECKS / KIOSKS }, (_, i) => {
      const { airframe, limits } = airframes[(k + i) % airframes.length]!;
      return preFlightBody(airframe.id, limits.id, mechanic.pin);
    }),
  }));
  return { airframeIds: airframes.map((a) => a.airframe.id), work };
}

/** Every tablet sends its checks one after another, retrying each until stored; `fault` runs alongside. */
async function sendAll(
  work: Awaited<ReturnType<typeof hangarAtDawn>>['work'],
  fault: (stored: () => number) => Promise<void>,
) {
  const log: SendLog = { attempts: 0, networkErrors: 0, serverErrors: 0, reSignIns: 0 };
  let stored = 0;
  const deadline = Date.now() + 80_000;
  const sending = Promise.all(
    work.map(async ({ kiosk, bodies }) => {
      for (const body of bodies) {
        await kiosk.sendUntilStored(body, log, deadline);
        stored += 1;
      }
    }),
  );
  await Promise.all([sending, fault(() => stored)]);
  return { log, ids: work.flatMap((w) => w.bodies.map((b) => b.id)) };
}

async function waitUntil(condition: () => boolean) {
  while (!condition()) await new Promise((r) => setTimeout(r, 20));
}

async function storedExactlyOnce(ids: string[], airframeIds: number[]) {
  const sequelize: Sequelize = await connect(db.url);
  try {
    const count = async (sql: string) =>
      Number(
        (
          await sequelize.query<{ n: number }>(sql, {
            replacements: { ids, airframeIds },
            type: QueryTypes.SELECT,
          })
        )[0]!.n,
      );
    const perCheck = await sequelize.query<{ n: number }>(
      'SELECT COUNT(*) AS n FROM readings WHERE check_id IN (:ids) GROUP BY check_id',
      { replacements: { ids }, type: QueryTypes.SELECT },
    );
    return {
      // A resend stored under a new id is the duplicate to look for: a count by id could never exceed one each.
      checksUnderOtherIds: await count(
        'SELECT COUNT(*) AS n FROM checks WHERE airframe_id IN (:airframeIds) AND id NOT IN (:ids)',
      ),
      checksOnTheseAirframes: await count(
        'SELECT COUNT(*) AS n FROM checks WHERE airframe_id IN (:airframeIds)',
      ),
      readings: await count('SELECT COUNT(*) AS n FROM readings WHERE check_id IN (:ids)'),
      checksWithReadings: perCheck.length,
      checksWithOtherThanOneSetOfReadings: perCheck.filter((r) => Number(r.n) !== RX4_PRE_FLIGHT_READINGS)
        .length,
      signedEvents: await count(
        "SELECT COUNT(*) AS n FROM audit_events WHERE action = 'check.signed' AND entity_id IN (:ids)",
      ),
      trail: await verifyAuditTrail(sequelize),
    };
  } finally {
    await sequelize.close();
  }
}

function expectExactlyOnce(result: Awaited<ReturnType<typeof storedExactlyOnce>>) {
  expect(result.checksUnderOtherIds).toBe(0);
  expect(result.checksOnTheseAirframes).toBe(CHECKS);
  expect(result.readings).toBe(CHECKS * RX4_PRE_FLIGHT_READINGS);
  expect(result.checksWithReadings).toBe(CHECKS);
  expect(result.checksWithOtherThanOneSetOfReadings).toBe(0);
  expect(result.signedEvents).toBe(CHECKS);
  expect(result.trail.firstBroken).toBeNull();
  expect(result.trail.ok).toBe(true);
}

describe('faults while 20 tablets send their checks', () => {
  it('when mariadbd is killed with SIGKILL mid-run and restarted, then exactly 500 checks are stored once each and the trail verifies', async () => {
    const { work, airframeIds } = await hangarAtDawn();
    const { log, ids } = await sendAll(work, async (stored) => {
      await waitUntil(() => stored() >= CHECKS / 5);
      await db.kill();
      await new Promise((r) => setTimeout(r, 1_000));
      await db.start();
    });
    expect(log.serverErrors + log.networkErrors).toBeGreaterThan(0);
    expect(server.alive).toBe(true);
    expectExactlyOnce(await storedExactlyOnce(ids, airframeIds));
  });

  it('when the Express server process is killed mid-run and started again, then exactly 500 checks are stored once each and the trail verifies', async () => {
    const { work, airframeIds } = await hangarAtDawn();
    const { log, ids } = await sendAll(work, async (stored) => {
      await waitUntil(() => stored() >= CHECKS / 5);
      await server.kill('SIGKILL');
      await new Promise((r) => setTimeout(r, 500));
      await server.start();
    });
    expect(log.networkErrors).toBeGreaterThan(0);
    expectExactlyOnce(await storedExactlyOnce(ids, airframeIds));
  });
});
