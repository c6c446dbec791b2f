import request from 'supertest';
import { afterAll, inject } from 'vitest';
import { randomUUID } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Sequelize } from 'sequelize';
import { createApp } from '@server/app';
import { createPhotoStore } from '@server/storage/photo-store';
import { loadConfig, type Config } from '@server/config';
import { createSequelize } from '@server/db/connection';
import { Airframe, Base, Staff, Tag, initModels } from '@server/db/models';
import { hashSecret, randomToken } from '@server/security/hashing';
import { createEnrolment, redeemEnrolment } from '@server/features/kiosks/kiosks.service';
import { KIOSK_COOKIE } from '@server/middleware/kiosk-device';
import { demoTypes } from '@shared/demo/demo-types';
import { publishedType } from './type-rows';
import type { AircraftTypeDefinition } from '@shared/schemas/limits';
import type { Role } from '@shared/schemas/auth';

let sequelize: Sequelize | undefined;

export function database(): Sequelize {
  if (!sequelize) {
    sequelize = createSequelize(inject('databaseUrl'), { pool: 5 });
    initModels(sequelize);
  }
  return sequelize;
}

/** Files of this test file go to a folder of its own (photos go to the fake object store). */
export const testDataDir = mkdtempSync(join(tmpdir(), 'gaugewalk-api-data-'));

export function testConfig(overrides: Record<string, string> = {}): Config {
  return loadConfig({
    DATABASE_URL: inject('databaseUrl'),
    SESSION_SECRET: 'test-secret-that-is-long-enough',
    NODE_ENV: 'test',
    LOG_LEVEL: 'silent',
    BCRYPT_COST: '4',
    SIGN_IN_RATE_PER_MINUTE: '100000',
    // Each app counts sign-ins on its own, as a separate instance did before the counts moved to the database;
    // a test that wants two instances to share them passes the same scope to both.
    SIGN_IN_COUNT_SCOPE: `test-${unique()}`,
    DATA_DIR: testDataDir,
    ...inject('photoStoreEnv'),
    ...overrides,
  });
}

/** The photo store the API tests' app uses, to look into the bucket as another client would. */
export const testPhotoStore = () => createPhotoStore(testConfig());

export function buildApp(overrides: Record<string, string> = {}) {
  return createApp({ config: testConfig(overrides), sequelize: database(), clientDir: '/nonexistent' });
}

/** The app of one test file: built once, and closed with the database pool after the file's last test. */
export function appForThisFile(overrides: Record<string, string> = {}) {
  const built = buildApp(overrides);
  afterAll(async () => {
    built.close();
    await database().close();
  });
  return built;
}

const unique = () => randomUUID().replace(/-/g, '').slice(0, 10);

/** A type with the demo RX-4 limits under a code of its own, so tests never share limits. */
export async function makeType(definition: AircraftTypeDefinition = demoTypes[0]!) {
  const code = `TX-${unique()}`;
  return publishedType(definition, code, `${definition.name} (test)`);
}

export async function makeAirframe(options: { definition?: AircraftTypeDefinition } = {}) {
  const { type, limits } = await makeType(options.definition);
  const [base] = await Base.findOrCreate({
    where: { code: 'TB' },
    defaults: { code: 'TB', name: 'Test base' },
  });
  const airframe = await Airframe.create({
    fleetNumber: `F-${unique()}`,
    serial: `S-${unique()}`,
    typeId: type.id,
    baseId: base.id,
    hours: 1234.5,
  });
  const tag = await Tag.create({
    airframeId: airframe.id,
    token: randomToken(12),
    issuedAt: new Date(),
    revokedAt: null,
  });
  return { airframe, type, limits, tag };
}

export async function makeStaff(roles: Role[], options: { pin?: string; password?: string } = {}) {
  const pin = options.pin ?? '2580';
  const staff = await Staff.create({
    badgeNumber: `B${unique()}`,
    name: `Test ${roles.join('/')} ${unique().slice(0, 4)}`,
    licenceNumber: `LIC-${unique().slice(0, 6)}`,
    roles: roles.join(','),
    pinHash: await hashSecret(pin, 4),
    passwordHash: options.password ? await hashSecret(options.password, 4) : null,
    lockedUntil: null,
  });
  return { staff, badge: staff.badgeNumber, pin, password: options.password };
}

export async function makeKioskToken() {
  const enrolment = await createEnrolment(`Test tablet ${unique()}`, null);
  const { token, device } = await redeemEnrolment(enrolment.code);
  return { token, device };
}

type App = ReturnType<typeof buildApp>['app'];

/** A browser-like client: keeps cookies, fetches the CSRF token and sends it on every change. */
export class Client {
  readonly agent: ReturnType<typeof request.agent>;
  csrf = '';

  constructor(app: App) {
    this.agent = request.agent(app);
  }

  static async kiosk(app: App) {
    const client = new Client(app);
    const { token } = await makeKioskToken();
    client.agent.jar.setCookie(`${KIOSK_COOKIE}=${token}; Path=/`, '127.0.0.1', '/');
    await client.refresh();
    return client;
  }

  async refresh() {
    const res = await this.agent.get('/api/session').expect(200);
    this.csrf = res.body.csrfToken;
    return res;
  }

  get(path: string) {
    return this.agent.get(path);
  }

  async post(path: string, body: unknown = {}) {
    if (!this.csrf) await this.refresh();
    const res = await this.agent
      .post(path)
      .set('X-CSRF-Token', this.csrf)
      .send(body as object);
    if (res.body && typeof res.body.csrfToken === 'string') this.csrf = res.body.csrfToken;
    return res;
  }

  /** A write with a body sent as it is (broken JSON, a form), with the CSRF token, as a careless client would. */
  async postRaw(path: string, body: string, contentType: string) {
    if (!this.csrf) await this.refresh();
    return this.agent.post(path).set('X-CSRF-Token', this.csrf).set('Content-Type', contentType).send(body);
  }

  async signInKiosk(badge: string, pin: string) {
    const res = await this.post('/api/auth/kiosk', { badge, pin });
    if (res.status !== 200)
      throw new Error(`kiosk sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
    return res;
  }

  async signInDesk(badge: string, password: string) {
    return this.post('/api/auth/desk', { badge, password });
  }
}
