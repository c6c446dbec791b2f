import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomUUID } from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { findFreePort, startLocalMariadb, type LocalDatabase } from '@server/db/local-server';
import { createSequelize } from '@server/db/connection';
import { initModels } from '@server/db/models';
import { migrate } from '@server/db/migrate';
import { KIOSK_COOKIE } from '@server/middleware/kiosk-device';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** A MariaDB of the test's own, which the test may kill: its folder stays until `remove()`. */
export class KillableDatabase {
  private current: LocalDatabase | undefined;
  readonly dir = mkdtempSync(join(tmpdir(), 'gaugewalk-fault-'));
  port = 0;

  async start(): Promise<string> {
    this.port ||= await findFreePort(0);
    this.current = await startLocalMariadb({
      dataDir: this.dir,
      port: this.port,
      database: 'gaugewalk_fault',
      quiet: true,
    });
    return this.current.url;
  }

  get url(): string {
    if (!this.current) throw new Error('the database is not started');
    return this.current.url;
  }

  /** SIGKILL to mariadbd: no shutdown, no flush, as when the power goes. */
  async kill(): Promise<void> {
    const pidFile = join(this.dir, 'run', 'mariadb.pid');
    const pid = Number(readFileSync(pidFile, 'utf8').trim());
    process.kill(pid, 'SIGKILL');
    for (let i = 0; i < 100; i++) {
      try {
        process.kill(pid, 0);
      } catch {
        return;
      }
      await sleep(50);
    }
    throw new Error(`mariadbd ${pid} did not die`);
  }

  async remove(): Promise<void> {
    await this.current?.stop();
    rmSync(this.dir, { recursive: true, force: true });
  }
}

export async function connect(url: string): Promise<Sequelize> {
  const sequelize = createSequelize(url, { pool: 3 });
  initModels(sequelize);
  await migrate(sequelize);
  return sequelize;
}

/** `node --import tsx server/start.ts` as its own process, the way a hangar server runs it. */
export class ServerProcess {
  private child: ChildProcess | undefined;
  port = 0;
  readonly dataDir = mkdtempSync(join(tmpdir(), 'gaugewalk-fault-data-'));

  constructor(private readonly databaseUrl: string) {}

  get url() {
    return `http://127.0.0.1:${this.port}`;
  }

  async start(): Promise<void> {
    this.port ||= await findFreePort(0);
    const child = spawn(process.execPath, ['--import', 'tsx', 'server/start.ts'], {
      env: {
        ...process.env,
        PORT: String(this.port),
        HOST: '127.0.0.1',
        DATABASE_URL: this.databaseUrl,
        DATA_DIR: this.dataDir,
        SESSION_SECRET: 'fault-secret-that-is-long-enough',
        BCRYPT_COST: '4',
        SIGN_IN_RATE_PER_MINUTE: '100000',
        KIOSK_IDLE_SECONDS: '3600',
        LOG_LEVEL: 'fatal',
      },
      stdio: ['ignore', 'pipe', 'inherit'],
    });
    this.child = child;
    await new Promise<void>((ok, fail) => {
      const timer = setTimeout(() => fail(new Error('the server did not start within 30 s')), 30_000);
      child.stdout?.on('data', (chunk: Buffer) => {
        if (chunk.toString().includes('listening')) {
          clearTimeout(timer);
          ok();
        }
      });
      child.once('exit', (code) => {
        clearTimeout(timer);
        fail(new Error(`the server exited with ${code}`));
      });
    });
  }

  /** Whether the process is still alive (a database outage must not take the server down with it). */
  get alive(): boolean {
    return !!this.child && this.child.exitCode === null && this.child.signalCode === null;
  }

  async kill(signal: NodeJS.Signals = 'SIGKILL'): Promise<void> {
    const child = this.child;
    if (!child || !this.alive) return;
    const exited = new Promise((r) => child.once('exit', r));
    child.kill(signal);
    await exited;
  }

  async remove(): Promise<void> {
    await this.kill('SIGTERM');
    if (existsSync(this.dataDir)) rmSync(this.dataDir, { recursive: true, force: true });
  }
}

export interface SendLog {
  attempts: number;
  networkErrors: number;
  serverErrors: number;
  reSignIns: number;
}

/** One tablet: its own cookie jar (device cookie and session), signed in as one mechanic. */
export class SimulatedKiosk {
  private readonly cookies = new Map<string, string>();
  private csrf = '';

  constructor(
    private readonly baseUrl: () => string,
    deviceToken: string,
    private readonly badge: string,
    private readonly pin: string,
  ) {
    this.cookies.set(KIOSK_COOKIE, deviceToken);
  }

  private async request(method: string, path: string, body?: unknown) {
    const res = await fetch(`${this.baseUrl()}${path}`, {
      method,
      headers: {
        cookie: [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; '),
        ...(body === undefined ? {} : { 'content-type': 'application/json', 'x-csrf-token': this.csrf }),
      },
      body: body === undefined ? undefined : JSON.stringify(body),
      signal: AbortSignal.timeout(10_000),
    });
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const at = pair!.indexOf('=');
      this.cookies.set(pair!.slice(0, at), pair!.slice(at + 1));
    }
    const json = (await res.json().catch(() => null)) as Record<string, unknown> | null;
    if (json && typeof json.csrfToken === 'string') this.csrf = json.csrfToken;
    return { status: res.status, json, replay: res.headers.get('idempotent-replay') };
  }

  async signIn(): Promise<void> {
    await this.request('GET', '/api/session');
    const res = await this.request('POST', '/api/auth/kiosk', { badge: this.badge, pin: this.pin });
    if (res.status !== 200) throw new Error(`sign-in answered ${res.status} ${JSON.stringify(res.json)}`);
  }

  /**
   * Sends one signed check until the server answers 201, as the kiosk's outbox does: the same id and the same
   * body every time, exponential backoff, and a fresh sign-in when the session was lost.
   */
  async sendUntilStored(body: { id: string }, log: SendLog, deadline: number): Promise<void> {
    let delay = 50;
    for (;;) {
      if (Date.now() > deadline) throw new Error(`check ${body.id} was not stored before the deadline`);
      log.attempts += 1;
      try {
        const res = await this.request('POST', '/api/checks', body);
        if (res.status === 201) return;
        if (res.status === 401 || res.status === 403) {
          log.reSignIns += 1;
          await this.signIn();
          continue;
        }
        if (res.status < 500) throw new Error(`check ${body.id}: ${res.status} ${JSON.stringify(res.json)}`);
        log.serverErrors += 1;
      } catch (err) {
        if ((err as Error).message.startsWith(`check ${body.id}`)) throw err;
        log.networkErrors += 1;
      }
      await sleep(delay + Math.random() * delay);
      delay = Math.min(delay * 2, 1_000);
    }
  }
}

export const newCheckId = () => randomUUID();
