import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApp, Client, database, makeAirframe, makeStaff } from '../setup/api-harness';
import { heldAirframe } from '../setup/lead-fixtures';
import { CheckDraft, HoldCorrectiveAction, Photo, Staff } from '@server/db/models';
import { hashSecret } from '@server/security/hashing';

const built = buildApp();
const { app, close } = built;
afterAll(async () => {
  close();
  await database().close();
});

interface RouteLayer {
  route?: { path: string | string[]; methods: Record<string, boolean> };
  handle?: { stack?: RouteLayer[] };
}

/** Every API route the app has, read from Express's own router, so a route added later is covered too. */
function apiRoutes(): { method: string; path: string }[] {
  const found: { method: string; path: string }[] = [];
  const walk = (stack: RouteLayer[]) => {
    for (const layer of stack) {
      if (layer.route) {
        const paths = Array.isArray(layer.route.path) ? layer.route.path : [layer.route.path];
        for (const path of paths) {
          for (const method of Object.keys(layer.route.methods)) {
            if (method !== '_all') found.push({ method: method.toUpperCase(), path });
          }
        }
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack);
      }
    }
  };
  walk((app as unknown as { router: { stack: RouteLayer[] } }).router.stack);
  return found
    .filter((r) => !r.path.startsWith('/{*') && !r.path.startsWith('/manifest') && r.path !== '/health')
    .map((r) => ({ ...r, path: '/api' + r.path }));
}

const sampleValue: Record<string, string> = {
  id: '1',
  checkId: '00000000-0000-4000-8000-000000000000',
  code: 'sys1.level',
  kind: 'pre_flight',
  token: 'AAAAAAAAAAAAAAAAAAAAAAAA',
  versionId: '1',
  otherId: '1',
};
const concrete = (path: string) =>
  path.replace(/:([A-Za-z]+)/g, (_m, name: string) => sampleValue[name] ?? '1');

/** The only things a temporary-PIN session may do. */
const open = new Set([
  'GET /api/session',
  'POST /api/auth/change-pin',
  'POST /api/auth/touch',
  'POST /api/auth/sign-out',
]);

let kiosk: Client;
let badge = '';
let staffId = 0;
const temporaryPin = '735146';

beforeAll(async () => {
  // A mechanic and shift lead with every kiosk role a temporary PIN could open, just after a PIN reset.
  const person = await makeStaff(['mechanic', 'shift_lead', 'pilot', 'engineering']);
  await person.staff.update({ pinHash: await hashSecret(temporaryPin, 4), mustChangePin: true });
  badge = person.badge;
  staffId = person.staff.id;
  kiosk = await Client.kiosk(app);
  const res = await kiosk.signInKiosk(badge, temporaryPin);
  expect(res.body.mustChangePin).toBe(true);
});

describe('a session signed in with a temporary PIN', () => {
  it('when it calls any API route but the PIN change, then it is refused with 403 and a plain message', async () => {
    const routes = apiRoutes().filter((r) => !open.has(`${r.method} ${r.path}`));
    expect(routes.length).toBeGreaterThan(40);
    for (const route of routes) {
      const path = concrete(route.path);
      const res =
        route.method === 'GET'
          ? await kiosk.get(path)
          : await kiosk.agent[route.method.toLowerCase() as 'post'](path)
              .set('X-CSRF-Token', kiosk.csrf)
              .send({});
      expect({ route: `${route.method} ${route.path}`, status: res.status, code: res.body?.code }).toEqual({
        route: `${route.method} ${route.path}`,
        status: 403,
        code: 'pin_change_required',
      });
      expect(res.body.message).toMatch(/temporary PIN/);
    }
  });

  it('when it records a corrective action, uploads a photo or announces a draft with valid bodies, then each is refused and nothing is stored', async () => {
    const held = await heldAirframe(app);
    const { airframe } = await makeAirframe();
    const action = await kiosk.post(`/api/holds/${held.holdId}/corrective-action`, {
      text: 'Written in the mechanic’s name by whoever knows the temporary PIN.',
      pin: temporaryPin,
    });
    const draftId = crypto.randomUUID();
    const draft = await kiosk.post('/api/check-drafts', {
      id: draftId,
      airframeId: airframe.id,
      kind: 'pre_flight',
    });
    const photo = await kiosk.agent
      .post('/api/photos')
      .set('X-CSRF-Token', kiosk.csrf)
      .attach('photo', Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0, 0x10, 0x4a, 0x46, 0x49, 0x46, 0, 1]), 'p.jpg');
    for (const res of [action, draft, photo]) {
      expect(res.status).toBe(403);
      expect(res.body.code).toBe('pin_change_required');
    }
    expect(await HoldCorrectiveAction.count({ where: { holdId: held.holdId } })).toBe(0);
    expect(await CheckDraft.count({ where: { id: draftId } })).toBe(0);
    expect(await Photo.count({ where: { uploadedBy: staffId } })).toBe(0);
  });

  it('when the PIN is changed, then the same session can work', async () => {
    expect((await kiosk.get('/api/session')).body.user.badgeNumber).toBe(badge);
    const changed = await kiosk.post('/api/auth/change-pin', { currentPin: temporaryPin, newPin: '862431' });
    expect(changed.status).toBe(200);
    expect((await Staff.findByPk(staffId))!.mustChangePin).toBe(false);
    expect((await kiosk.get('/api/airframes')).status).toBe(200);
  });
});

describe('a corrective action is signed', () => {
  it('when it comes without the PIN typed again, or with a wrong one, then it is refused and nothing is stored', async () => {
    const held = await heldAirframe(app);
    const client = held.mechanic.client;
    const text = 'Replaced the system 1 return line seal.';
    const none = await client.post(`/api/holds/${held.holdId}/corrective-action`, { text });
    expect(none.status).toBe(400);
    expect(none.body.message).toMatch(/PIN/);
    const wrong = await client.post(`/api/holds/${held.holdId}/corrective-action`, { text, pin: '0000' });
    expect(wrong.status).toBe(401);
    expect(await HoldCorrectiveAction.count({ where: { holdId: held.holdId } })).toBe(0);
    const right = await client.post(`/api/holds/${held.holdId}/corrective-action`, {
      text,
      pin: held.mechanic.pin,
    });
    expect(right.status).toBe(201);
  });
});
