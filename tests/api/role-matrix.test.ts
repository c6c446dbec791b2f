import { beforeAll, describe, expect, it } from 'vitest';
import { appForThisFile, Client } from '../setup/api-harness';
import { heldAirframe } from '../setup/lead-fixtures';
import { type SignedIn, signedIn } from '../setup/sign-in';
import type { Role } from '@shared/schemas/auth';
import { Defect } from '@server/db/models';
import { randomUUID } from 'node:crypto';

const { app } = appForThisFile();

const roles: Role[] = ['mechanic', 'shift_lead', 'pilot', 'engineering'];
// Mechanics and pilots have no desk password: they work on a kiosk. Leads and engineering sign in at the desk.
const channelOf: Record<Role, 'kiosk' | 'desk'> = {
  mechanic: 'kiosk',
  pilot: 'kiosk',
  shift_lead: 'desk',
  engineering: 'desk',
};

let people: Record<Role, SignedIn>;
let anonymous: Client;
let holdId = 0;
let airframeId = 0;
let defectId = 0;
const draftId = randomUUID();
const staffId = () => people.shift_lead.staff.id;
const everyone: Role[] = ['mechanic', 'shift_lead', 'pilot', 'engineering'];
const maintenance: Role[] = ['mechanic', 'shift_lead'];

beforeAll(async () => {
  const entries = await Promise.all(
    roles.map(async (r) => [r, await signedIn(app, [r], channelOf[r])] as const),
  );
  people = Object.fromEntries(entries) as Record<Role, SignedIn>;
  anonymous = new Client(app);
  const held = await heldAirframe(app);
  holdId = held.holdId;
  airframeId = held.airframe.id;
  defectId = (await Defect.findOne({ where: { holdId } }))!.id;
});

/**
 * Every route of the lead desk, board and acceptance work, and who may use it. Allowed callers send a body that
 * fails validation where the route changes something, so the matrix proves the guard without side effects.
 */
const routes: {
  method: 'GET' | 'POST';
  path: () => string;
  allowed: Role[];
  what: string;
  /** What an allowed caller gets: 200 for a read, 400 for the invalid body, 404 for a link that does not exist. */
  allowedStatus: number;
}[] = [
  {
    method: 'GET',
    path: () => '/api/holds',
    allowed: ['shift_lead', 'engineering'],
    what: 'read the holds queue',
    allowedStatus: 200,
  },
  {
    method: 'GET',
    path: () => `/api/holds/${holdId}`,
    allowed: ['shift_lead', 'engineering', 'mechanic'],
    what: 'read a hold',
    allowedStatus: 200,
  },
  {
    method: 'POST',
    path: () => `/api/holds/${holdId}/corrective-action`,
    allowed: ['shift_lead', 'mechanic'],
    what: 'record a corrective action',
    allowedStatus: 400,
  },
  {
    method: 'POST',
    path: () => `/api/holds/${holdId}/countersign`,
    allowed: ['shift_lead'],
    what: 'countersign, release or keep a hold',
    allowedStatus: 400,
  },
  {
    method: 'GET',
    path: () => `/api/airframes/${airframeId}/acceptance-view`,
    allowed: ['pilot', 'shift_lead', 'engineering'],
    what: 'read the pilot view',
    allowedStatus: 200,
  },
  {
    method: 'POST',
    path: () => `/api/airframes/${airframeId}/accept`,
    allowed: ['pilot'],
    what: 'accept an aircraft',
    allowedStatus: 400,
  },
  {
    method: 'POST',
    path: () => `/api/airframes/${airframeId}/flight-close`,
    allowed: ['pilot'],
    what: "close a flight with the airframe's hours, flights and landings",
    allowedStatus: 400,
  },
  {
    method: 'GET',
    path: () => '/api/board-links',
    allowed: ['engineering'],
    what: 'list board links',
    allowedStatus: 200,
  },
  {
    method: 'POST',
    path: () => '/api/board-links',
    allowed: ['engineering'],
    what: 'create a board link',
    allowedStatus: 400,
  },
  {
    method: 'POST',
    path: () => '/api/board-links/999999999/revoke',
    allowed: ['engineering'],
    what: 'revoke a board link',
    allowedStatus: 404,
  },
  {
    method: 'GET',
    path: () => '/api/handover',
    allowed: ['shift_lead', 'engineering'],
    what: 'read the handover',
    allowedStatus: 200,
  },
  {
    method: 'POST',
    path: () => '/api/handover/send',
    allowed: ['shift_lead'],
    what: 'send the handover',
    allowedStatus: 400,
  },
  {
    method: 'GET',
    path: () => '/api/mail/outbox',
    allowed: ['engineering'],
    what: 'read the caught e-mail',
    allowedStatus: 200,
  },
  // The tech log, releases and abandoned checks (issue 11). Every signed act is refused as input (400) here.
  ...(
    [
      ['GET', () => `/api/airframes/${airframeId}/defects`, everyone, 'read the defects of an airframe', 200],
      ['GET', () => `/api/defects/${defectId}`, everyone, 'read a defect', 200],
      [
        'POST',
        () => `/api/airframes/${airframeId}/defects`,
        ['mechanic', 'shift_lead', 'pilot'],
        'raise a defect',
        400,
      ],
      ['POST', () => `/api/defects/${defectId}/work`, maintenance, 'record work on a defect', 400],
      [
        'POST',
        () => `/api/defects/${defectId}/inspection`,
        maintenance,
        'sign an independent inspection',
        400,
      ],
      ['POST', () => `/api/defects/${defectId}/certify`, maintenance, 'certify a rectification', 400],
      ['POST', () => `/api/defects/${defectId}/defer`, maintenance, 'defer a defect', 400],
      ['POST', () => `/api/holds/${holdId}/inspection`, maintenance, 'sign the inspection of a hold', 400],
      [
        'POST',
        () => `/api/airframes/${airframeId}/release`,
        maintenance,
        'sign a certificate of release',
        400,
      ],
      [
        'GET',
        () => `/api/airframes/${airframeId}/releases`,
        everyone,
        'read the certificates of release',
        200,
      ],
      ['GET', () => '/api/check-drafts', ['shift_lead', 'engineering'], 'list checks in progress', 200],
      ['POST', () => `/api/check-drafts/${draftId}/close`, ['shift_lead'], 'close an abandoned check', 400],
      [
        'GET',
        () => `/api/staff/${staffId()}/authorisations`,
        ['shift_lead', 'engineering'],
        'read authorisations',
        200,
      ],
      [
        'POST',
        () => `/api/staff/${staffId()}/authorisations`,
        ['engineering'],
        'grant an authorisation',
        400,
      ],
      [
        'POST',
        () => `/api/staff/${staffId()}/authorisations/999999999/revoke`,
        ['engineering'],
        'withdraw an authorisation',
        404,
      ],
    ] as const
  ).map(([method, path, allowed, what, allowedStatus]) => ({
    method,
    path,
    allowed: [...allowed],
    what,
    allowedStatus,
  })),
  {
    method: 'GET',
    path: () => '/api/mail/deliveries',
    allowed: ['engineering'],
    what: 'read the e-mail delivery log',
    allowedStatus: 200,
  },
];

// Bodies that every allowed caller gets refused on as input, so nothing is changed by the matrix itself.
const invalidBody: Record<string, unknown> = {
  '/api/handover/send': { from: 'not a time' },
};

const call = (client: Client, method: 'GET' | 'POST', path: string) =>
  method === 'GET' ? client.get(path) : client.post(path, invalidBody[path] ?? { unexpected: true });

describe('role matrix for holds, acceptance, board links, handover and mail', () => {
  describe.each(routes)('$method $what', (route) => {
    it('when nobody is signed in, then it is 401', async () => {
      const res = await call(anonymous, route.method, route.path());
      expect(res.status).toBe(401);
      expect(res.body.code).toBe('not_signed_in');
    });

    it.each(route.allowed)(
      'when a %s calls it, then it gets past the guard to the exact answer',
      async (role) => {
        const res = await call(people[role].client, route.method, route.path());
        expect(res.status).toBe(route.allowedStatus);
      },
    );

    it.each(roles.filter((r) => !route.allowed.includes(r)))(
      'when a %s calls it, then it is 403 for the role',
      async (role) => {
        const res = await call(people[role].client, route.method, route.path());
        expect(res.status).toBe(403);
        expect(res.body.code).toBe('forbidden');
        expect(res.body.message).toMatch(/needs the .* role/);
      },
    );
  });

  it('when a mechanic who is not a lead tries to release a hold with a valid body, then it is still 403', async () => {
    const res = await people.mechanic.client.post(`/api/holds/${holdId}/countersign`, {
      decision: 'release',
      pin: people.mechanic.pin,
    });
    expect(res.status).toBe(403);
  });

  it('when a shift lead tries to accept an aircraft with a valid PIN, then it is 403: only pilots accept', async () => {
    const lead = await signedIn(app, ['shift_lead'], 'kiosk');
    const res = await lead.client.post(`/api/airframes/${airframeId}/accept`, { pin: lead.pin });
    expect(res.status).toBe(403);
  });
});
