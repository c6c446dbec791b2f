import type { TestProject } from 'vitest/node';
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { testDatabase } from './test-database';
import { findFreePort } from '@server/db/local-server';
import { seedDemo } from '@server/demo/demo-seed';
import { startFakeSmtp } from '@server/mail/fake-smtp';
import { startFakeObjectStore } from '@server/storage/fake-object-store';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    e2eDatabaseUrl: string;
  }
}

/** The built client served by the real server, as its own process, on a database seeded with the demo. */
export default async function setup(project: TestProject) {
  if (!existsSync(resolve('dist', 'index.html')))
    throw new Error('Browser tests need the built client: run `npx vite build` first.');
  const db = await testDatabase('TEST_DATABASE_URL_E2E', 'gaugewalk_e2e');
  await seedDemo(db.sequelize, { bcryptCost: 4 });
  // The fake SMTP server keeps what it catches in the e2e database, where the engineering page reads it.
  const smtp = await startFakeSmtp({ port: await findFreePort(0), sequelize: db.sequelize });
  // Photos the browser tests take go to a local fake object store, as under `npm start`.
  const objects = mkdtempSync(join(tmpdir(), 'gaugewalk-e2e-objects-'));
  const photoStore = await startFakeObjectStore({ directory: objects, port: await findFreePort(0) });
  const port = await findFreePort(0);
  const server: ChildProcess = spawn(process.execPath, ['--import', 'tsx', 'server/start.ts'], {
    env: {
      ...process.env,
      PORT: String(port),
      HOST: '127.0.0.1',
      DATABASE_URL: db.url,
      SESSION_SECRET: 'e2e-secret-that-is-long-enough',
      BCRYPT_COST: '4',
      SIGN_IN_RATE_PER_MINUTE: '10000',
      LOG_LEVEL: 'warn',
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(smtp.port),
      ...photoStore.env,
    },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  await new Promise<void>((ok, fail) => {
    const timer = setTimeout(() => fail(new Error('the server did not start within 30 s')), 30_000);
    server.stdout?.on('data', (chunk: Buffer) => {
      if (chunk.toString().includes('listening')) {
        clearTimeout(timer);
        ok();
      }
    });
    server.once('exit', (code) => fail(new Error(`the server exited with ${code}`)));
  });
  project.provide('baseUrl', `http://127.0.0.1:${port}`);
  project.provide('e2eDatabaseUrl', db.url);
  return async () => {
    server.kill('SIGTERM');
    await new Promise((r) => server.once('exit', r));
    await smtp.stop();
    await photoStore.stop();
    rmSync(objects, { recursive: true, force: true });
    await db.sequelize.close();
    await db.stop();
  };
}
