import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { buildApp, database, makeAirframe } from '../setup/api-harness';
import { signedIn } from '../setup/sign-in';
import { BoardLink } from '@server/db/models';
import { sha256 } from '@server/security/hashing';
import type { AirframeSummary } from '@shared/schemas/airframes';
import type { BoardLinkCreated, BoardLinkInfo } from '@shared/schemas/board-links';

const { app, close } = buildApp();
let server: Server;
let baseUrl = '';
beforeAll(async () => {
  server = app.listen(0, '127.0.0.1');
  await new Promise((ok) => server.once('listening', ok));
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  server.closeAllConnections();
  await new Promise((ok) => server.close(ok));
  close();
  await database().close();
});

async function newLink(name = 'Crew room TV') {
  const engineer = await signedIn(app, ['engineering'], 'desk');
  const res = await engineer.client.post('/api/board-links', { name });
  expect(res.status).toBe(201);
  return { engineer, link: res.body as BoardLinkCreated };
}

/** Opens the event stream and reports the status and content type, then hangs up. */
async function openStream(path: string, headers: Record<string, string> = {}) {
  const controller = new AbortController();
  const res = await fetch(`${baseUrl}${path}`, { headers, signal: controller.signal });
  const result = { status: res.status, type: res.headers.get('content-type') ?? '' };
  controller.abort();
  return result;
}

describe('read-only board links', () => {
  it('when engineering creates a link, then only its hash is stored and the token opens the board with nobody signed in', async () => {
    const { link } = await newLink();
    const { airframe } = await makeAirframe();
    expect(link.path).toBe(`/board?board=${link.token}`);
    const row = await BoardLink.findByPk(link.id);
    expect(row!.tokenHash).toBe(sha256(link.token));
    expect(JSON.stringify(row!.toJSON())).not.toContain(link.token);

    const byQuery = await request(app).get(`/api/airframes?board=${link.token}`);
    expect(byQuery.status).toBe(200);
    expect((byQuery.body as AirframeSummary[]).some((a) => a.id === airframe.id)).toBe(true);
    const byHeader = await request(app).get('/api/airframes').set('X-Board-Token', link.token);
    expect(byHeader.status).toBe(200);
    const stream = await openStream(`/api/board/events?board=${link.token}`);
    expect(stream.status).toBe(200);
    expect(stream.type).toMatch(/^text\/event-stream/);
    expect((await request(app).get('/api/airframes')).status).toBe(401);
  });

  it('when a board link is used anywhere but the board, then it is not a person: 401', async () => {
    const { link } = await newLink();
    const { airframe } = await makeAirframe();
    expect((await request(app).get(`/api/airframes/${airframe.id}?board=${link.token}`)).status).toBe(401);
    expect((await request(app).get(`/api/holds?board=${link.token}`)).status).toBe(401);
    expect((await request(app).get(`/api/handover?board=${link.token}`)).status).toBe(401);
  });

  it('when a link is revoked, then the board gets 401 board_link_revoked and the list shows when', async () => {
    const { engineer, link } = await newLink('Hangar 2 screen');
    const revoked = await engineer.client.post(`/api/board-links/${link.id}/revoke`);
    expect(revoked.status).toBe(200);
    expect(revoked.body.revokedAt).toEqual(expect.any(String));
    const res = await request(app).get(`/api/airframes?board=${link.token}`);
    expect(res.status).toBe(401);
    expect(res.body.code).toBe('board_link_revoked');
    expect(res.body.message).toMatch(/revoked/);
    expect(await openStream('/api/board/events', { 'X-Board-Token': link.token })).toMatchObject({
      status: 401,
    });
    const list = (await engineer.client.get('/api/board-links')).body as BoardLinkInfo[];
    const listed = list.find((l) => l.id === link.id);
    expect(listed).toMatchObject({
      name: 'Hangar 2 screen',
      revokedAt: revoked.body.revokedAt,
      createdBy: engineer.staff.name,
    });
    expect(listed).not.toHaveProperty('token');
    expect((await engineer.client.post(`/api/board-links/${link.id}/revoke`)).status).toBe(409);
  });

  it('when a token is made up, then it is refused as unknown; a nameless link is refused as bad input', async () => {
    const res = await request(app).get('/api/airframes?board=AAAAAAAAAAAAAAAAAAAAAAAAAAAAAAAA');
    expect(res.status).toBe(401);
    expect(res.body.code).toBe('board_link_unknown');
    const engineer = await signedIn(app, ['engineering'], 'desk');
    expect((await engineer.client.post('/api/board-links', { name: ' ' })).status).toBe(400);
  });
});
