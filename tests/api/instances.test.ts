import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { randomUUID } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { buildApp, Client, database, makeAirframe, makeStaff } from '../setup/api-harness';
import { preFlightBody } from '../setup/check-builder';
import { signedIn } from '../setup/sign-in';

// Two app instances on one database, as behind a load balancer (README, "Running it for a whole operator"): what
// one stores or counts, the other sees. Each `buildApp` is an instance of its own: its own board streams, its own
// memory; only the database is shared.
const scope = `shared-${randomUUID().slice(0, 8)}`;
const shared = { SIGN_IN_COUNT_SCOPE: scope, SIGN_IN_RATE_PER_MINUTE: '1000' };
const a = buildApp(shared);
const b = buildApp(shared);
const closers = [a.close, b.close];
let serverB: Server;
let urlB = '';

beforeAll(async () => {
  serverB = b.app.listen(0, '127.0.0.1');
  await new Promise((ok) => serverB.once('listening', ok));
  urlB = `http://127.0.0.1:${(serverB.address() as AddressInfo).port}`;
});
afterAll(async () => {
  serverB.closeAllConnections();
  await new Promise((ok) => serverB.close(ok));
  for (const close of closers) close();
  await database().close();
});

/** The cookies a client holds, as a Cookie header another instance can be sent. */
const cookiesOf = (client: Client) =>
  client.agent.jar
    .getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false })
    .map((c) => c.toValueString())
    .join('; ');

/** Opens instance B's board stream and resolves with the time of the first `change` event. */
async function firstChange(cookie: string, timeoutMs: number) {
  const controller = new AbortController();
  const res = await fetch(`${urlB}/api/board/events`, { headers: { cookie }, signal: controller.signal });
  expect(res.status).toBe(200);
  const reader = res.body!.getReader();
  const decoder = new TextDecoder();
  const changed = (async () => {
    let text = '';
    for (;;) {
      const { value, done } = await reader.read();
      if (done) return null;
      text += decoder.decode(value, { stream: true });
      if (text.includes('event: change')) return performance.now();
    }
  })();
  const timer = setTimeout(() => controller.abort(), timeoutMs);
  return {
    changed: changed
      .catch(() => null)
      .finally(() => {
        clearTimeout(timer);
        controller.abort();
      }),
  };
}

describe('two instances on one database', () => {
  it('when a person signs in through one instance, then the session is good on the other (sessions live in the database)', async () => {
    const { client, staff } = await signedIn(a.app, ['mechanic'], 'kiosk');
    const onB = await request(b.app).get('/api/session').set('Cookie', cookiesOf(client));
    expect(onB.status).toBe(200);
    expect(onB.body.user).toMatchObject({ id: staff.id });
    const stranger = await request(b.app).get('/api/session');
    expect(stranger.body.user).toBeNull();
  });

  it('when a check is stored through instance A, then a board stream open on instance B is told within 5 s', async () => {
    const { client, pin } = await signedIn(a.app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    const stream = await firstChange(cookiesOf(client), 8_000);
    // Let B's watcher read the board as it was before the check.
    await new Promise((ok) => setTimeout(ok, 1_200));
    const res = await client.post('/api/checks', preFlightBody(airframe.id, limits.id, pin));
    const storedAt = performance.now();
    expect(res.status).toBe(201);
    const toldAt = await stream.changed;
    expect(toldAt).not.toBeNull();
    expect(toldAt! - storedAt).toBeLessThan(5_000);
  });

  it('when sign-ins come through both instances, then the per-address limit counts them together', async () => {
    const limited = { SIGN_IN_COUNT_SCOPE: `rate-${randomUUID().slice(0, 8)}`, SIGN_IN_RATE_PER_MINUTE: '4' };
    const limitA = buildApp(limited);
    const limitB = buildApp(limited);
    closers.push(limitA.close, limitB.close);
    const codes: string[] = [];
    for (const target of [limitA, limitB, limitA, limitB, limitB, limitA]) {
      const res = await new Client(target.app).signInDesk(`U${randomUUID().slice(0, 8)}`, 'not-a-real-one');
      codes.push(res.status === 429 ? String(res.body.code) : String(res.status));
    }
    expect(codes).toEqual(['401', '401', '401', '401', 'too_many_attempts', 'too_many_attempts']);
  });

  it('when wrong passwords for a badge come through both instances from many addresses, then both see it locked', async () => {
    const proxyScope = `lock-${randomUUID().slice(0, 8)}`;
    const settings = { PIN_MAX_ATTEMPTS: '3', LOCK_MIN_ADDRESSES: '3', TRUST_PROXY: 'loopback' };
    const lockA = buildApp({ ...settings, SIGN_IN_COUNT_SCOPE: proxyScope });
    const lockB = buildApp({ ...settings, SIGN_IN_COUNT_SCOPE: proxyScope });
    closers.push(lockA.close, lockB.close);
    const badge = `U${randomUUID().slice(0, 8)}`;
    const lead = await makeStaff(['shift_lead'], { password: 'lead-pass-654' });
    const statuses: Record<string, number[]> = { unknown: [], real: [] };
    for (const [who, target] of [
      ['unknown', badge],
      ['real', lead.badge],
    ] as const) {
      const turns = [
        [lockA, '198.51.100.11'],
        [lockB, '198.51.100.12'],
        [lockA, '198.51.100.13'],
        [lockB, '198.51.100.14'],
      ] as const;
      for (const [instance, address] of turns) {
        const client = new Client(instance.app);
        await client.refresh();
        const res = await client.agent
          .post('/api/auth/desk')
          .set('X-CSRF-Token', client.csrf)
          .set('X-Forwarded-For', address)
          .send({ badge: target, password: 'wrong-one' });
        statuses[who]!.push(res.status);
      }
    }
    // Each instance alone saw at most two addresses: only the shared count reaches three and locks.
    expect(statuses.real).toEqual([401, 401, 423, 423]);
    expect(statuses.unknown).toEqual(statuses.real);
  });
});
