import { afterAll, describe, expect, it, vi } from 'vitest';
import { randomUUID } from 'node:crypto';
import { buildApp, database, makeAirframe } from '../setup/api-harness';
import { preFlightBody } from '../setup/check-builder';
import { signedIn } from '../setup/sign-in';
import { BoardSnapshots } from '@server/features/airframes/board-snapshot';
import * as service from '@server/features/airframes/airframes.service';
import type { AirframeSummary } from '@shared/schemas/airframes';

// Two app instances on one database, as behind a load balancer: each keeps its own board snapshot.
const one = buildApp();
const two = buildApp();
afterAll(async () => {
  one.close();
  two.close();
  await database().close();
});

const mechanicOn = (app: ReturnType<typeof buildApp>['app']) => signedIn(app, ['mechanic'], 'kiosk');

const find = (board: AirframeSummary[], id: number) => board.find((a) => a.id === id)!;

/** The board a snapshot sends at this instant, read back as the tablets read it. */
const boardAt = async (snapshots: BoardSnapshots, now: Date) =>
  JSON.parse((await snapshots.encoded(now)).body.toString('utf8')) as AirframeSummary[];

describe('the board snapshot', () => {
  it('when a check is signed through one instance, then the board read through the other shows it at once', async () => {
    const signer = await mechanicOn(one.app);
    const reader = await mechanicOn(two.app);
    const { airframe, limits } = await makeAirframe();
    const before = await reader.client.get('/api/airframes');
    expect(find(before.body, airframe.id).state).toBe('not_checked');
    const body = preFlightBody(airframe.id, limits.id, signer.pin);
    expect((await signer.client.post('/api/checks', body)).status).toBe(201);
    const after = find((await reader.client.get('/api/airframes')).body, airframe.id);
    expect(after.state).toBe('checks_in_limits');
    expect(after.lastCheck?.id).toBe(body.id);
  });

  it('when an airframe is added behind the application, then the next board read shows it, not one 30 s later', async () => {
    const { client } = await mechanicOn(one.app);
    await makeAirframe();
    const before = (await client.get('/api/airframes')).body as AirframeSummary[];
    // Rows written straight to the database, as a restore or a script would: no audit event moves the head.
    const { airframe } = await makeAirframe();
    const after = (await client.get('/api/airframes')).body as AirframeSummary[];
    expect(before.some((a) => a.id === airframe.id)).toBe(false);
    expect(after.some((a) => a.id === airframe.id)).toBe(true);
  });

  it('when a check is started on a tablet, then the board shows the airframe in progress at once', async () => {
    const { client } = await mechanicOn(one.app);
    const { airframe } = await makeAirframe();
    expect(find((await client.get('/api/airframes')).body, airframe.id).state).toBe('not_checked');
    const draft = await client.post('/api/check-drafts', {
      id: randomUUID(),
      airframeId: airframe.id,
      kind: 'pre_flight',
    });
    expect(draft.status).toBe(200);
    expect(find((await client.get('/api/airframes')).body, airframe.id).state).toBe('in_progress');
  });

  it('when the pre-flight runs out, then the board turns due with no change to the records', async () => {
    const { client, pin } = await mechanicOn(one.app);
    const { airframe, limits } = await makeAirframe();
    expect((await client.post('/api/checks', preFlightBody(airframe.id, limits.id, pin))).status).toBe(201);
    const snapshots = new BoardSnapshots(database());
    const now = new Date();
    const fresh = find(await boardAt(snapshots, now), airframe.id);
    expect(fresh.state).toBe('checks_in_limits');
    // Valid for 14 hours at most (the demo type's window); a day later it has run out.
    const later = new Date(now.getTime() + 24 * 3_600_000);
    expect(find(await boardAt(snapshots, later), airframe.id).state).toBe('due');
  });

  it("when the clock runs out one airframe's pre-flight, then only that airframe is judged again; one with nothing waiting on the clock keeps its judgement", async () => {
    const { client, pin } = await mechanicOn(one.app);
    const checked = await makeAirframe();
    const idle = await makeAirframe();
    const signed = await client.post(
      '/api/checks',
      preFlightBody(checked.airframe.id, checked.limits.id, pin),
    );
    expect(signed.status).toBe(201);
    const records = await service.loadFleetRecords(database(), new Date());
    const now = new Date();
    const first = service.judgeFleet(records, now);
    const checkedFirst = first.byAirframe.get(checked.airframe.id)!;
    expect(checkedFirst.detail.summary.state).toBe('checks_in_limits');
    // Nothing of the never-checked airframe waits on the clock; the pre-flight runs out within the demo's 14 hours.
    expect(first.byAirframe.get(idle.airframe.id)!.changesAt).toBe(Infinity);
    expect(checkedFirst.changesAt).toBeLessThanOrEqual(now.getTime() + 14 * 3_600_000);
    const later = new Date(checkedFirst.changesAt);
    const second = service.judgeFleet(records, later, first);
    expect(second.byAirframe.get(checked.airframe.id)!.detail.summary.state).toBe('due');
    expect(second.byAirframe.get(idle.airframe.id)!.detail).toBe(
      first.byAirframe.get(idle.airframe.id)!.detail,
    );
    // The same as judging everything again from nothing.
    const fresh = service.judgeFleet(records, later);
    expect(second.details.map((d) => d.summary)).toEqual(fresh.details.map((d) => d.summary));
    expect(second.nextClockChange).toEqual(fresh.nextClockChange);
  });

  it('when only the clock moves, then the board is judged again from the records it already read, and reads them again once they are too old', async () => {
    const { client, pin } = await mechanicOn(one.app);
    const { airframe, limits } = await makeAirframe();
    expect((await client.post('/api/checks', preFlightBody(airframe.id, limits.id, pin))).status).toBe(201);
    const dayMs = 24 * 3_600_000;
    const snapshots = new BoardSnapshots(database(), 2 * dayMs);
    const read = vi.spyOn(service, 'loadFleetRecords');
    try {
      const now = new Date();
      expect(find(await boardAt(snapshots, now), airframe.id).state).toBe('checks_in_limits');
      // A day later the pre-flight has run out: due, judged from the same records, not read again.
      expect(find(await boardAt(snapshots, new Date(now.getTime() + dayMs)), airframe.id).state).toBe('due');
      expect(read).toHaveBeenCalledTimes(1);
      // Past the snapshot's age the records are read again, behind the reader: it is answered from the records
      // it has (unchanged, as the fingerprint says), and the read after it gets the ones read again.
      const first = read.mock.results[0]!.value as Promise<unknown>;
      await snapshots.encoded(new Date(now.getTime() + 3 * dayMs));
      expect(read).toHaveBeenCalledTimes(2);
      const again = read.mock.results[1]!.value as Promise<unknown>;
      expect(again).not.toBe(first);
      await again;
      await snapshots.encoded(new Date(now.getTime() + 3 * dayMs + 1));
      expect(read).toHaveBeenCalledTimes(2);
    } finally {
      read.mockRestore();
    }
  });

  it('when nothing changed, then readers get the same snapshot without another build, and concurrent readers share one', async () => {
    const snapshots = new BoardSnapshots(database());
    const build = vi.spyOn(service, 'loadFleetRecords');
    try {
      const now = new Date();
      const [a, b, c] = await Promise.all([
        snapshots.encoded(now),
        snapshots.encoded(now),
        snapshots.encoded(now),
      ]);
      expect(b).toBe(a);
      expect(c).toBe(a);
      expect(await snapshots.encoded(new Date(now.getTime() + 10))).toBe(a);
      expect(build).toHaveBeenCalledTimes(1);
    } finally {
      build.mockRestore();
    }
  });

  it('when tablets read an unchanged board, then each gets the bytes made once, compressed as it accepts, or "not modified"', async () => {
    const { client } = await mechanicOn(one.app);
    await makeAirframe();
    // The body as bytes (the test's HTTP client undoes the compression; Content-Length is what was sent).
    const raw = (accepts: string, etag?: string) => {
      const req = client
        .get('/api/airframes')
        .set('Accept-Encoding', accepts)
        .buffer(true)
        .parse((res, done) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () => done(null, Buffer.concat(chunks)));
        });
      return etag ? req.set('If-None-Match', etag) : req;
    };
    const plain = await raw('identity');
    expect(plain.status).toBe(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    const text = (plain.body as Buffer).toString('utf8');
    expect(JSON.parse(text).length).toBeGreaterThan(0);
    const br = await raw('gzip, deflate, br');
    expect(br.headers['content-encoding']).toBe('br');
    expect((br.body as Buffer).toString('utf8')).toBe(text);
    expect(Number(br.headers['content-length'])).toBeLessThan(Buffer.byteLength(text) / 2);
    const gz = await raw('gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect((gz.body as Buffer).toString('utf8')).toBe(text);
    expect(Number(gz.headers['content-length'])).toBeLessThan(Buffer.byteLength(text) / 2);
    for (const res of [plain, br, gz]) {
      expect(res.headers.vary).toContain('Accept-Encoding');
      expect(res.headers['cache-control']).toBe('no-store');
      expect(res.headers.etag).toBe(plain.headers.etag);
    }
    const again = await raw('br', plain.headers.etag);
    expect(again.status).toBe(304);
    // A change makes new bytes with a new tag.
    await makeAirframe();
    const changed = await raw('identity', plain.headers.etag);
    expect(changed.status).toBe(200);
    expect(changed.headers.etag).not.toBe(plain.headers.etag);
  });
});
