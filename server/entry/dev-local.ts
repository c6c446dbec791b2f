import { spawn, type ChildProcess } from 'node:child_process';
import { resolve, join } from 'node:path';
import { openDatabase } from '../db/connection';
import { migrate } from '../db/migrate';
import { seedDemo } from '../demo/demo-seed';
import { createEnrolment } from '../features/kiosks/kiosks.service';
import { localDatabase, localPhotoStore, onShutdown, sessionSecret } from './local-environment';

// `npm run dev`: the same private database as `npm start`, the API restarting on change, Vite with hot reload.
const dataDir = resolve(process.env.DATA_DIR ?? '.data');
const db = await localDatabase(dataDir);
const photoStore = await localPhotoStore(dataDir);
const children: ChildProcess[] = [];
onShutdown(async () => {
  for (const child of children) child.kill('SIGTERM');
  await photoStore?.stop();
  await db.local?.stop();
});

const sequelize = openDatabase(db.url);
await migrate(sequelize);
await seedDemo(sequelize, { bcryptCost: 10 });
const enrolment = await createEnrolment('Dev tablet', null);
await sequelize.close();

const apiPort = process.env.PORT ?? '8080';
const env = {
  ...process.env,
  DATABASE_URL: db.url,
  SESSION_SECRET: sessionSecret(dataDir),
  PORT: apiPort,
  NODE_ENV: 'development',
  ...photoStore?.env,
};
children.push(
  spawn(
    process.execPath,
    ['--watch-path=server', '--watch-path=shared', '--import', 'tsx', 'server/start.ts'],
    { env, stdio: 'inherit' },
  ),
  spawn(process.execPath, [join('node_modules', 'vite', 'bin', 'vite.js')], { env, stdio: 'inherit' }),
);
process.stdout.write(
  `\nDev client: http://localhost:5173  (API on :${apiPort})\nEnrol: http://localhost:5173${enrolment.enrolPath}\n\n`,
);
