import { beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { randomUUID } from 'node:crypto';
import { existsSync, readdirSync } from 'node:fs';
import { dirname } from 'node:path';
import {
  appForThisFile,
  buildApp,
  Client,
  makeAirframe,
  makeKioskToken,
  makeStaff,
  testDataDir,
  testPhotoStore,
} from '../setup/api-harness';
import { preFlightBody } from '../setup/check-builder';
import { KIOSK_COOKIE } from '@server/middleware/kiosk-device';
import { Photo } from '@server/db/models';
import { photoKey } from '@server/storage/photo-store';
import { onePixelPng } from '../setup/images';

const { app } = appForThisFile();

type App = typeof app;
interface ApiRoute {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
}

/** Every route mounted under /api, read from the app itself so routes added later are attacked too. */
function apiRoutes(target: App): ApiRoute[] {
  interface Layer {
    rawPath?: string;
    handle?: { stack?: Layer[] };
    route?: { path: string | string[]; methods: Record<string, boolean> };
  }
  const root = (target as unknown as { router: { stack: Layer[] } }).router.stack;
  const found: ApiRoute[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const paths = Array.isArray(layer.route.path) ? layer.route.path : [layer.route.path];
        const methods = Object.keys(layer.route.methods).flatMap((m) =>
          m === '_all' ? ['get', 'post', 'put', 'patch', 'delete'] : [m],
        );
        for (const path of paths)
          for (const method of methods)
            found.push({ method: method as ApiRoute['method'], path: prefix + path });
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack, prefix + (layer.rawPath && layer.rawPath !== '/' ? layer.rawPath : ''));
      }
    }
  };
  walk(root, '');
  // The board's event stream never ends by design; its only input is the session, covered by every other route.
  return found.filter((r) => r.path.startsWith('/api/') && r.path !== '/api/board/events');
}

const injections = [
  "' OR '1'='1",
  '1; DROP TABLE checks; --',
  '" UNION SELECT pin_hash FROM staff --',
  '<script>alert(1)</script>',
  '<img src=x onerror=alert(1)>',
  '${7*7}{{7*7}}',
  '../../../../etc/passwd',
  '..%2F..%2Fetc%2Fpasswd',
  '\u0000',
  'null',
  'undefined',
  '__proto__',
  '\uD800',
  'Ω≈ç√∫ 𝔘𝔫𝔦𝔠𝔬𝔡𝔢 🛩',
  '-1',
  '0',
  '1e309',
  '99999999999999999999999',
  'true',
  '[]',
  '{}',
];

const hostileString = fc.oneof(
  fc.constantFrom(...injections),
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'binary', maxLength: 20 }),
  fc.nat({ max: 5 }).map((n) => 'A'.repeat(10 ** n)),
);

const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  hostileString,
  fc.integer(),
  fc.constantFrom(-1, 0, 2 ** 31, 2 ** 53 + 1, 1e308, -1e308, Number.MIN_VALUE, 0.1 + 0.2),
  fc.boolean(),
  fc.constant(null),
  fc.array(hostileString, { maxLength: 5 }),
  fc.dictionary(hostileString, hostileString, { maxKeys: 4 }),
  fc.jsonValue({ maxDepth: 3 }),
  fc.nat({ max: 3 }).map((n) => {
    let deep: unknown = 'bottom';
    for (let i = 0; i < 10 ** n; i++) deep = { a: deep };
    return deep;
  }),
);

/** Percent-encoding, with a lone surrogate sent as the invalid UTF-8 bytes a hostile client would send. */
const encodeSegment = (text: string) =>
  text
    .split(/([\uD800-\uDFFF])/)
    .map((part) => (/^[\uD800-\uDFFF]$/.test(part) ? '%ED%A0%80' : encodeURIComponent(part)))
    .join('');

/**
 * A path into a body and a change there: replace, delete, or add a key no schema expects. At the root, delete sends
 * no body and extra adds a key to it.
 */
function mutate(template: unknown, path: string[], value: unknown, how: 'set' | 'delete' | 'extra'): unknown {
  const copy = structuredClone(template) as Record<string, unknown>;
  if (path.length === 0 || typeof copy !== 'object' || copy === null) {
    if (how === 'set') return value;
    if (how === 'delete') return undefined;
    return { ...copy, unexpected_extra: value };
  }
  let node: Record<string, unknown> = copy;
  for (const key of path.slice(0, -1)) {
    const next = node[key];
    if (typeof next !== 'object' || next === null) break;
    node = next as Record<string, unknown>;
  }
  const last = path[path.length - 1]!;
  if (how === 'delete') delete node[last];
  else if (how === 'extra') node[`${last}_extra`] = value;
  else node[last] = value;
  return copy;
}

function pathsOf(value: unknown, prefix: string[] = []): string[][] {
  if (typeof value !== 'object' || value === null) return [prefix];
  return [prefix, ...Object.entries(value).flatMap(([k, v]) => pathsOf(v, [...prefix, k]))];
}

interface Mutation {
  path: string[];
  how: 'set' | 'delete' | 'extra' | 'whole' | 'raw';
  value: unknown;
}

const takesNoBody = () => true;
const isFiniteNumber = (v: unknown) => typeof v === 'number' && Number.isFinite(v);

/**
 * The only routes that may answer 2xx to a mutated body, the mutations that may leave a valid request, and why.
 * Every other mutated body must be refused with a 4xx.
 */
const mayAcceptMutatedBody: Record<string, { why: string; when: (m: Mutation) => boolean }> = {
  'POST /api/auth/touch': { why: 'takes no body: it only keeps the session alive', when: takesNoBody },
  'POST /api/auth/sign-out': { why: 'takes no body: signing out needs only the session', when: takesNoBody },
  'POST /api/kiosks/:id/revoke': { why: 'takes no body: the tablet is named in the path', when: takesNoBody },
  'POST /api/board-links/:id/revoke': {
    why: 'takes no body: the link is named in the path',
    when: takesNoBody,
  },
  'POST /api/handover/send': {
    why: 'both fields are optional: no body means the last 12 hours',
    when: (m) => m.how === 'delete' && m.path.length === 0,
  },
  'POST /api/kiosks': {
    why: "a tablet's name is free text, stored as text and escaped wherever it is shown",
    when: (m) => m.how === 'set' && m.path.join('.') === 'name' && typeof m.value === 'string',
  },
  'POST /api/checks': {
    why: 'a reading value or ambient temperature that is a number is judged, not refused',
    when: (m) =>
      (m.how === 'set' &&
        isFiniteNumber(m.value) &&
        /^readings\.\d+\.entry\.value$/.test(m.path.join('.'))) ||
      (m.how === 'set' && isFiniteNumber(m.value) && m.path.join('.') === 'context.ambientTempC'),
  },
};

/** Every refusal the API gives, by status: a bad request must be refused with the right one of these. */
const refusals: Record<number, string[]> = {
  400: [
    'invalid_input',
    'request_refused',
    'entity_parse_failed',
    'bad_request',
    'photo_missing',
    'photo_upload_malformed',
  ],
  401: ['not_signed_in', 'wrong_pin', 'wrong_password'],
  403: ['csrf_invalid', 'forbidden', 'kiosk_not_enrolled', 'badge_inactive', 'pin_change_required'],
  404: ['not_found', 'enrolment_invalid', 'tag_unknown', 'airframe_unknown'],
  409: ['signed_check_immutable'],
  413: ['entity_too_large'],
  415: ['unsupported_media_type'],
  423: ['badge_locked'],
  429: ['too_many_attempts', 'sign_in_slowed'],
};

interface Identity {
  name: 'anonymous' | 'kiosk' | 'mechanic' | 'engineer';
  client: Client;
}

describe('hostile input on every /api route', () => {
  const routes = apiRoutes(app);
  const valid: Record<string, string> = {};
  const templates: Record<string, unknown> = {};
  const identities = new Map<Identity['name'], Identity>();

  async function makeIdentity(name: Identity['name']): Promise<Identity> {
    if (name === 'anonymous') {
      const client = new Client(app);
      await client.refresh();
      return { name, client };
    }
    if (name === 'kiosk') return { name, client: await Client.kiosk(app) };
    if (name === 'mechanic') {
      const { badge, pin } = await makeStaff(['mechanic']);
      const client = await Client.kiosk(app);
      await client.signInKiosk(badge, pin);
      return { name, client };
    }
    const { badge, password } = await makeStaff(['engineering', 'shift_lead'], { password: 'engineer-pass' });
    const client = new Client(app);
    const res = await client.signInDesk(badge, password!);
    if (res.status !== 200) throw new Error(`desk sign-in failed: ${res.status}`);
    return { name, client };
  }

  beforeAll(async () => {
    const { airframe, limits, tag } = await makeAirframe();
    const mechanic = await makeIdentity('mechanic');
    const { pin } = await makeStaff(['mechanic']);
    const signer = await makeStaff(['mechanic']);
    const signerClient = await Client.kiosk(app);
    await signerClient.signInKiosk(signer.badge, signer.pin);
    const signed = await signerClient.post('/api/checks', preFlightBody(airframe.id, limits.id, signer.pin));
    void mechanic;
    const spare = await makeKioskToken();
    // A real id for each kind of path parameter, so routes are reached past their id checks too.
    Object.assign(valid, {
      '/api/airframes': String(airframe.id),
      '/api/checks': String(signed.body.id),
      '/api/kiosks': String(spare.device.id),
      kind: 'pre_flight',
      token: tag.token,
      code: 'sys1.level',
    });
    const victim = await makeStaff(['mechanic'], { password: 'victim-pass' });
    Object.assign(templates, {
      '/api/checks': preFlightBody(airframe.id, limits.id, pin),
      '/api/check-drafts': { id: randomUUID(), airframeId: airframe.id, kind: 'pre_flight' },
      '/api/auth/kiosk': { badge: victim.badge, pin: '0000' },
      '/api/auth/desk': { badge: victim.badge, password: 'wrong-pass' },
      '/api/kiosks': { name: 'Hangar 2 tablet' },
      '/api/kiosks/enrol': { code: 'a'.repeat(24) },
    });
    for (const name of ['anonymous', 'kiosk', 'mechanic', 'engineer'] as const)
      identities.set(name, await makeIdentity(name));
  });

  it('when thousands of malformed, oversized, wrongly typed and injection-laden requests arrive, then none is a 5xx, only the listed routes accept a mutated body, and every refusal is a 4xx JSON with a code this API gives', async () => {
    const requestArb = fc.record({
      route: fc.constantFrom(...routes),
      identity: fc.constantFrom<Identity['name']>('anonymous', 'kiosk', 'mechanic', 'mechanic', 'engineer'),
      params: fc.array(fc.oneof(fc.constant<string | null>(null), hostileString), {
        minLength: 3,
        maxLength: 3,
      }),
      query: fc.oneof(
        fc.constant(''),
        fc
          .dictionary(
            fc.oneof(
              fc.string({ maxLength: 8 }),
              fc.constantFrom('limit', 'a[b][c]', '__proto__[x]', 'id[]'),
            ),
            hostileString,
            { maxKeys: 4 },
          )
          .map((q) =>
            Object.entries(q)
              .map(([k, v]) => `${encodeSegment(k)}=${encodeSegment(v)}`)
              .join('&'),
          ),
      ),
      csrf: fc.constantFrom('valid', 'valid', 'valid', 'valid', 'valid', 'valid', 'missing', 'wrong'),
      body: fc.oneof(
        { weight: 8, arbitrary: fc.tuple(fc.nat(), hostileValue, fc.constantFrom('set', 'delete', 'extra')) },
        { weight: 1, arbitrary: hostileValue.map((v) => ({ whole: v })) },
        {
          weight: 1,
          arbitrary: fc
            .constantFrom(
              '{"badge":',
              '{"id": NaN}',
              '[1,2',
              "{'a':1}",
              '\u0000',
              '{"a":1}}',
              'x'.repeat(210_000),
            )
            .map((raw) => ({ raw })),
        },
      ),
      contentType: fc.oneof(
        { weight: 8, arbitrary: fc.constant('application/json') },
        fc.constantFrom(
          'application/json; charset=utf-16',
          'text/plain',
          'application/x-www-form-urlencoded',
          'application/xml',
          'multipart/form-data; boundary=x',
        ),
      ),
      header: fc.record({
        name: fc.constantFrom(
          'x-forwarded-for',
          'accept',
          'accept-language',
          'idempotency-key',
          'x-csrf-token',
        ),
        value: fc.stringMatching(/^[\x20-\x7e]{0,200}$/),
      }),
      cookie: fc.oneof(
        { weight: 8, arbitrary: fc.constant('') },
        fc.stringMatching(/^[A-Za-z0-9_%.-]{0,120}$/).map((v) => `gw_session=${v}`),
        fc.stringMatching(/^[A-Za-z0-9_-]{0,120}$/).map((v) => `${KIOSK_COOKIE}=${v}`),
      ),
    });

    // A fixed seed, so a run can be repeated; FUZZ_SEED tries another one (printed, with its replay command).
    const seed = Number(process.env.FUZZ_SEED ?? 20261217);
    const runs = Number(process.env.FUZZ_RUNS ?? 5_000);
    console.log(
      `hostile input: seed ${seed}, ${runs} requests. Replay: FUZZ_SEED=${seed} FUZZ_RUNS=${runs} ` +
        'npx vitest run --project api tests/api/hostile-input.test.ts',
    );
    const samples = fc.sample(requestArb, { numRuns: runs, seed });
    const findings: string[] = [];
    const tally = new Map<string, number>();
    let sent = 0;
    for (const sample of samples) {
      let identity = identities.get(sample.identity)!;
      let n = 0;
      const path = sample.route.path.replace(/:(\w+)/g, (_, name: string) => {
        const hostile = sample.params[n++];
        const prefix = sample.route.path.split('/').slice(0, 3).join('/');
        const good = name === 'id' ? valid[prefix] : valid[name];
        return encodeSegment(hostile ?? good ?? 'x');
      });
      const url = sample.query ? `${path}?${sample.query}` : path;
      // Each near-valid body gets a new check id, so it reaches validation and signing, not the replay check.
      const stored = templates[sample.route.path] ?? {};
      const template = 'id' in (stored as object) ? { ...(stored as object), id: randomUUID() } : stored;
      let payload: string | undefined;
      let mutation: Mutation = { path: [], how: 'raw', value: undefined };
      if ('raw' in sample.body) payload = sample.body.raw;
      else if ('whole' in sample.body) {
        payload = JSON.stringify(sample.body.whole ?? null);
        mutation = { path: [], how: 'whole', value: sample.body.whole };
      } else {
        const [pick, value, how] = sample.body;
        const paths = pathsOf(template);
        const path = paths[pick % paths.length]!;
        const mutated = mutate(template, path, value, how);
        payload = mutated === undefined ? undefined : JSON.stringify(mutated);
        mutation = { path, how, value };
      }
      const mutatedBody = sample.route.method !== 'get' && payload !== JSON.stringify(template);
      let req = identity.client.agent[sample.route.method](url)
        .set(sample.header.name, sample.header.value)
        .set('Content-Type', sample.contentType);
      if (sample.csrf === 'valid' && sample.header.name !== 'x-csrf-token')
        req = req.set('X-CSRF-Token', identity.client.csrf);
      if (sample.csrf === 'wrong') req = req.set('X-CSRF-Token', 'f'.repeat(43));
      if (sample.cookie) req = req.set('Cookie', sample.cookie);
      const res =
        sample.route.method === 'get' || payload === undefined ? await req : await req.send(payload);
      sent += 1;
      if (process.env.HOSTILE_TALLY) {
        const key = `${sample.route.method} ${sample.route.path} ${res.status} ${res.body?.code ?? ''}`;
        tally.set(key, (tally.get(key) ?? 0) + 1);
      }
      const label = `${sample.route.method.toUpperCase()} ${url.slice(0, 120)} as ${identity.name} (${sample.contentType}): ${res.status}`;
      // Node's HTTP parser answers an over-long URL with a bare 431 before any app code runs.
      if (res.status === 431) continue;
      const routeKey = `${sample.route.method.toUpperCase()} ${sample.route.path}`;
      if (res.status >= 500) findings.push(`${label} ${JSON.stringify(res.body).slice(0, 200)}`);
      else if (res.status < 300 && mutatedBody && !mayAcceptMutatedBody[routeKey]?.when(mutation))
        findings.push(`${label}: accepted a mutated body ${String(payload).slice(0, 200)}`);
      else if (res.status >= 400 && !refusals[res.status]?.includes(res.body?.code))
        findings.push(`${label}: ${res.body?.code} is not a refusal this API gives with ${res.status}`);
      else if (res.status >= 400) {
        const body = res.body as { code?: unknown; message?: unknown };
        if (!res.headers['content-type']?.includes('application/json'))
          findings.push(`${label}: refusal is not JSON`);
        else if (
          typeof body.code !== 'string' ||
          !body.code ||
          typeof body.message !== 'string' ||
          !body.message
        )
          findings.push(`${label}: refusal lacks code or message ${JSON.stringify(body).slice(0, 200)}`);
      }
      // A sign-out, a revoked tablet or an idle lock ends the session: later requests get a fresh one.
      if (
        identity.name !== 'anonymous' &&
        (res.status === 401 || sample.route.path === '/api/auth/sign-out')
      ) {
        identity = await makeIdentity(identity.name);
        identities.set(identity.name, identity);
      }
    }
    if (tally.size)
      console.log(
        [...tally]
          .sort()
          .map(([k, n]) => `${n}\t${k}`)
          .join('\n'),
      );
    expect(sent).toBe(samples.length);
    expect(sent).toBeGreaterThanOrEqual(2_000);
    expect(findings, `seed ${seed}; first findings:\n${findings.slice(0, 10).join('\n')}`).toEqual([]);
  }, 600_000);
});

describe('a body the server does not read', () => {
  it('when a shift lead sends the handover window as a form, then it is 415, not a handover of the default 12 hours', async () => {
    const { badge, password } = await makeStaff(['shift_lead'], { password: 'lead-pass-415' });
    const client = new Client(app);
    expect((await client.signInDesk(badge, password!)).status).toBe(200);
    const res = await client.postRaw(
      '/api/handover/send',
      'from=2026-01-15T06:00:00Z',
      'application/x-www-form-urlencoded',
    );
    expect(res.status).toBe(415);
    expect(res.body.code).toBe('unsupported_media_type');
  });
});

describe('CSRF, session fixation and PIN guessing', () => {
  it('when a signed-in mechanic posts a check with no token, a token of another session, or the token in the body, then each is refused with 403 and nothing is stored', async () => {
    const { badge, pin } = await makeStaff(['mechanic']);
    const { airframe, limits } = await makeAirframe();
    const client = await Client.kiosk(app);
    await client.signInKiosk(badge, pin);
    const other = new Client(app);
    await other.refresh();
    const attempts = [
      client.agent.post('/api/checks').send(preFlightBody(airframe.id, limits.id, pin)),
      client.agent
        .post('/api/checks')
        .set('X-CSRF-Token', other.csrf)
        .send(preFlightBody(airframe.id, limits.id, pin)),
      client.agent
        .post('/api/checks')
        .send({ ...preFlightBody(airframe.id, limits.id, pin), _csrf: client.csrf, csrfToken: client.csrf }),
      client.agent
        .post(`/api/checks?_csrf=${encodeURIComponent(client.csrf)}`)
        .send(preFlightBody(airframe.id, limits.id, pin)),
    ];
    for (const res of await Promise.all(attempts)) {
      expect(res.status).toBe(403);
      expect(res.body.code).toBe('csrf_invalid');
    }
    const board = await client.get(`/api/airframes/${airframe.id}`);
    expect(board.body.lastCheck).toBeNull();
  });

  // Session fixation: anonymous visits get no session id any more (issue 13), so a planted id can only be a
  // signed-in one; tests/api/sign-in-policy.test.ts shows that one replaced at sign-in.

  it('when one address guesses PINs across many badges, then it is slowed to the sign-in rate with 429 and a badge guessed five times locks', async () => {
    const limited = buildApp({ SIGN_IN_RATE_PER_MINUTE: '12' });
    try {
      const badges = await Promise.all(Array.from({ length: 8 }, () => makeStaff(['mechanic'])));
      const client = await Client.kiosk(limited.app);
      const statuses: number[] = [];
      const codes: string[] = [];
      // Five guesses on the first badge, then one each on the others: 12 in the window, then more.
      const targets = [...Array(5).fill(badges[0]!), ...badges.slice(1), ...badges.slice(1)];
      for (const target of targets) {
        const res = await client.post('/api/auth/kiosk', { badge: target.badge, pin: '0000' });
        statuses.push(res.status);
        codes.push(res.body.code);
      }
      expect(statuses.slice(0, 4)).toEqual([401, 401, 401, 401]);
      expect(codes[4]).toBe('badge_locked');
      expect(statuses.slice(5, 12).every((s) => s === 401)).toBe(true);
      expect(statuses.slice(12).every((s) => s === 429)).toBe(true);
      expect(codes.slice(12).every((c) => c === 'too_many_attempts')).toBe(true);
      // Even the right PIN is not tried once the address is over the rate.
      const right = await client.post('/api/auth/kiosk', { badge: badges[1]!.badge, pin: badges[1]!.pin });
      expect(right.status).toBe(429);
      expect(right.headers['ratelimit-policy'] ?? right.headers['ratelimit']).toBeTruthy();
    } finally {
      limited.close();
    }
  });
});

describe('uploads with a path in their name', () => {
  const png = onePixelPng;
  const names = [
    '/etc/gaugewalk-owned.png',
    '..\\..\\..\\windows\\system32\\owned.png',
    '....//....//owned.png',
    '%2e%2e%2f%2e%2e%2fowned.png',
    'photos/../../owned.png',
    'owned.png\u0000.txt',
    `${'../'.repeat(40)}owned.png`,
    `${'a'.repeat(300)}.png`,
    '.',
    '..',
  ];

  it('when photos are uploaded under absolute, backslashed, encoded, null-byte and over-long names, then each lands in the photo store under a key of our own and nothing is written to the data folder or beside it', async () => {
    const { badge, pin } = await makeStaff(['mechanic']);
    const client = await Client.kiosk(app);
    await client.signInKiosk(badge, pin);
    const store = testPhotoStore();
    const parent = dirname(testDataDir);
    const beside = new Set(readdirSync(parent));
    const insideData = new Set(readdirSync(testDataDir));
    const results: { filename: string; status: number; code?: string }[] = [];
    for (const filename of names) {
      const res = await client.agent
        .post('/api/photos')
        .set('X-CSRF-Token', client.csrf)
        .attach('photo', png, { filename, contentType: 'image/png' });
      // A name the multipart parser cannot read (a null byte in the part header) is refused as bad input.
      results.push({ filename, status: res.status, code: res.body.code });
      if (res.status !== 201) continue;
      const photo = await Photo.findByPk(res.body.id);
      expect(photo!.storedName).toBe(`${res.body.id}.png`);
      expect(await store.head(photoKey(photo!.storedName))).toMatchObject({ bytes: png.length });
    }
    expect(results).toEqual(
      names.map((filename) =>
        filename.includes('\u0000')
          ? { filename, status: 400, code: 'photo_upload_malformed' }
          : // The multipart parser reads a name of only dots as no file at all.
            filename === '.' || filename === '..'
            ? { filename, status: 400, code: 'photo_missing' }
            : { filename, status: 201, code: undefined },
      ),
    );
    expect(existsSync('/etc/gaugewalk-owned.png')).toBe(false);
    expect([...readdirSync(testDataDir)].filter((n) => !insideData.has(n))).toEqual([]);
    expect(readdirSync(parent).filter((n) => !beside.has(n) && n.includes('owned'))).toEqual([]);
    const keys = [];
    for await (const key of store.keys('')) keys.push(key);
    expect(keys.every((key) => /^photos\/[0-9a-f-]{36}\.(jpg|png|webp)$/.test(key))).toBe(true);
    store.close();
  });
});
