import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { randomUUID } from 'node:crypto';
import { appForThisFile, Client, database, makeAirframe } from '../setup/api-harness';
import { signedIn } from '../setup/sign-in';
import { Airframe, Base } from '@server/db/models';
import type { AirframeSummary } from '@shared/schemas/airframes';
import type { BoardLinkCreated } from '@shared/schemas/board-links';
import { explainLatestChecksByKind } from '@server/features/airframes/airframes.repository';
import { runSql } from '@server/db/sql';
import { bufferPoolMb } from '@server/db/local-server';

const { app } = appForThisFile();

const code = () => `B${randomUUID().replace(/-/g, '').slice(0, 6).toUpperCase()}`;

/** Two bases of this test's own, with airframes at each, so other tests' airframes never count. */
async function twoBases(atFirst: number, atSecond: number) {
  const [first, second] = await Promise.all(
    [code(), code()].map((c) => Base.create({ code: c, name: `Base ${c}` })),
  );
  const place = async (base: Base, count: number) => {
    const ids: number[] = [];
    for (let i = 0; i < count; i += 1) {
      const { airframe } = await makeAirframe();
      await Airframe.update({ baseId: base.id }, { where: { id: airframe.id } });
      ids.push(airframe.id);
    }
    return ids;
  };
  return {
    first: first!,
    second: second!,
    firstIds: await place(first!, atFirst),
    secondIds: await place(second!, atSecond),
  };
}

const ids = (body: unknown) => (body as AirframeSummary[]).map((a) => a.id);

describe('a board per base', () => {
  it('when a board asks for one base or a list of bases, then it shows the airframes at those bases only', async () => {
    const { first, second, firstIds, secondIds } = await twoBases(2, 1);
    const desk = await signedIn(app, ['shift_lead'], 'desk');
    const one = await desk.client.get(`/api/airframes?base=${first.code}`);
    expect(one.status).toBe(200);
    expect(ids(one.body).sort()).toEqual([...firstIds].sort());
    expect((one.body as AirframeSummary[]).every((a) => a.base.code === first.code)).toBe(true);
    const both = await desk.client.get(`/api/airframes?base=${first.code},${second.code.toLowerCase()}`);
    expect(ids(both.body).sort()).toEqual([...firstIds, ...secondIds].sort());
    const everything = await desk.client.get('/api/airframes');
    expect(ids(everything.body)).toEqual(expect.arrayContaining([...firstIds, ...secondIds]));
  });

  it('when a board names a base that does not exist, then it gets a 400 that names the code, not every base', async () => {
    const desk = await signedIn(app, ['shift_lead'], 'desk');
    const res = await desk.client.get('/api/airframes?base=NOPE1');
    expect(res.status).toBe(400);
    expect(res.body.message).toContain('NOPE1');
    expect((await desk.client.get('/api/airframes?base=%3Cscript%3E')).status).toBe(400);
  });

  it('when the board is read a page at a time, then the pages add up to the board, in its order, with a link to the next page', async () => {
    const { first } = await twoBases(5, 0);
    const desk = await signedIn(app, ['shift_lead'], 'desk');
    const whole = ids((await desk.client.get(`/api/airframes?base=${first.code}`)).body);
    const page1 = await desk.client.get(`/api/airframes?base=${first.code}&limit=2`);
    expect(page1.headers['x-total-count']).toBe('5');
    expect(page1.headers.link).toBe(`</api/airframes?base=${first.code}&limit=2&offset=2>; rel="next"`);
    const page2 = await desk.client.get(`/api/airframes?base=${first.code}&limit=2&offset=2`);
    const page3 = await desk.client.get(`/api/airframes?base=${first.code}&limit=2&offset=4`);
    expect(page3.headers.link).toBeUndefined();
    expect([...ids(page1.body), ...ids(page2.body), ...ids(page3.body)]).toEqual(whole);
    expect((await desk.client.get('/api/airframes?limit=0')).status).toBe(400);
    expect((await desk.client.get('/api/airframes?limit=501')).status).toBe(400);
  });

  it('when a board link is bound to a base, then the TV sees that base only and cannot widen it with ?base=', async () => {
    const { first, second, firstIds } = await twoBases(1, 1);
    const engineer = await signedIn(app, ['engineering'], 'desk');
    const made = await engineer.client.post('/api/board-links', {
      name: 'North TV',
      bases: [first.code.toLowerCase()],
    });
    expect(made.status).toBe(201);
    const link = made.body as BoardLinkCreated;
    expect(link.bases).toEqual([{ code: first.code, name: first.name }]);
    const listed = await engineer.client.get('/api/board-links');
    expect(listed.body.find((l: { id: number }) => l.id === link.id).bases).toEqual(link.bases);

    const tv = await request(app).get('/api/airframes').set('X-Board-Token', link.token);
    expect(ids(tv.body)).toEqual(firstIds);
    const widened = await request(app)
      .get(`/api/airframes?base=${second.code}`)
      .set('X-Board-Token', link.token);
    expect(widened.status).toBe(403);
    expect(widened.body.message).toMatch(/does not show that base/);

    const unknown = await engineer.client.post('/api/board-links', { name: 'Typo TV', bases: ['ZZZZ9'] });
    expect(unknown.status).toBe(400);
    expect(unknown.body.message).toContain('ZZZZ9');
  });

  it('when a tablet stands at a base, then its airframe list shows that base first, each part in board order', async () => {
    const { first, second, firstIds, secondIds } = await twoBases(1, 2);
    const engineer = await signedIn(app, ['engineering'], 'desk');
    const made = await engineer.client.post('/api/kiosks', {
      name: `Tablet ${second.code}`,
      base: second.code,
    });
    expect(made.status).toBe(201);
    const tablet = new Client(app);
    const enrolled = await tablet.post('/api/kiosks/enrol', { code: made.body.code });
    expect(enrolled.status).toBe(200);
    const mine = ids((await tablet.get(`/api/airframes?base=${first.code},${second.code}`)).body);
    expect(mine.slice(0, 2).sort()).toEqual([...secondIds].sort());
    expect(mine.slice(2)).toEqual(firstIds);

    // Moved to the other base, the same tablet lists that base first; the move is on the audit trail.
    const kioskId = made.body.id as number;
    const moved = await engineer.client.post(`/api/kiosks/${kioskId}/base`, { base: first.code });
    expect(moved.status).toBe(200);
    expect(moved.body.base).toEqual({ code: first.code, name: first.name });
    expect(ids((await tablet.get(`/api/airframes?base=${first.code},${second.code}`)).body)[0]).toBe(
      firstIds[0],
    );
    const listed = await engineer.client.get('/api/kiosks');
    expect(listed.body.find((k: { id: number }) => k.id === kioskId).base).toEqual({
      code: first.code,
      name: first.name,
    });
    expect((await engineer.client.post(`/api/kiosks/${kioskId}/base`, { base: 'QQQQ7' })).status).toBe(400);
  });

  it('when a board covers more than 1,000 airframes, then the newest-check query still reads the index, not a table made of its id list', async () => {
    // MariaDB turns an IN list of 1,000 values or more into a join against a derived table unless told not to;
    // with 1,100 airframes that query then examined 170,551 checks instead of 5,500.
    const ids = Array.from({ length: 1_200 }, (_, i) => i + 1);
    const plan = await explainLatestChecksByKind(database(), ids);
    // Converted, the plan gains a second derived table made of the list itself ("No tables used").
    expect(plan.filter((row) => String(row.table).startsWith('<derived'))).toHaveLength(1);
    expect(plan.some((row) => row.Extra === 'No tables used')).toBe(false);
  });

  it('when the private database runs, then its buffer pool is the size the machine affords, not the 128 MB default', async () => {
    const [row] = await runSql<{ size: number | bigint }[]>(
      database(),
      'SELECT @@innodb_buffer_pool_size AS size',
    );
    expect(Number(row!.size)).toBe(bufferPoolMb() * 1024 * 1024);
  });
});
