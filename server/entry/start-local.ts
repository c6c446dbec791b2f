import { resolve } from 'node:path';
import { loadConfig } from '../config';
import { startServer } from '../start';
import { createSequelize } from '../db/connection';
import { initModels, Airframe, Tag } from '../db/models';
import { migrate } from '../db/migrate';
import { demoStaff, seedDemo } from '../db/seeders/demo-seed';
import { createEnrolment } from '../features/kiosks/kiosks.service';
import { buildClientIfStale, localDatabase, onShutdown, sessionSecret } from './local-environment';
import { roleLabels } from '../../shared/schemas/auth';

const dataDir = resolve(process.env.DATA_DIR ?? '.data');
const db = await localDatabase(dataDir);
let stopServer: (() => Promise<void>) | undefined;
onShutdown(async () => {
  await stopServer?.();
  await db.local?.stop();
});

try {
  const config = loadConfig({
    ...process.env,
    DATABASE_URL: db.url,
    SESSION_SECRET: sessionSecret(dataDir),
    DATA_DIR: dataDir,
  });
  const sequelize = createSequelize(db.url);
  initModels(sequelize);
  const applied = await migrate(sequelize);
  if (applied.length) process.stdout.write(`Migrations applied: ${applied.join(', ')}\n`);
  const seed = await seedDemo(sequelize, { bcryptCost: config.BCRYPT_COST });
  process.stdout.write(
    seed.seeded
      ? 'Demo scenario loaded (Tern Island Air Ambulance).\n'
      : 'Existing data kept; demo not loaded again.\n',
  );
  const enrolment = await createEnrolment('Demo tablet (printed at start)', null);
  const tags = await Tag.findAll({ where: { revokedAt: null }, order: [['airframeId', 'ASC']] });
  const airframes = new Map((await Airframe.findAll()).map((a) => [a.id, a.fleetNumber]));
  await sequelize.close();

  buildClientIfStale();
  const running = await startServer(config);
  stopServer = running.stop;
  const lines = [
    '',
    `Gaugewalk is running: ${running.url}`,
    '',
    `Enrol this browser as a kiosk tablet (one use, 24 h): ${running.url}${enrolment.enrolPath}`,
    `Hangar board: ${running.url}/board      Desk sign-in: ${running.url}/desk`,
    '',
    'Demo badges (invented people):',
    ...demoStaff.map(
      (s) =>
        `  ${s.badge}  ${s.name.padEnd(12)} ${s.roles
          .map((r) => roleLabels[r])
          .join(' + ')
          .padEnd(20)} PIN ${s.pin}` + (s.password ? `   desk password ${s.password}` : ''),
    ),
    '',
    'Airframe tags:',
    ...tags.map((t) => `  ${airframes.get(t.airframeId)}  ${running.url}/t/${t.token}`),
    '',
    'Limits in the demo are invented. Real limits come from the approved maintenance data. Ctrl-C stops it.',
    '',
  ];
  process.stdout.write(lines.join('\n'));
} catch (err) {
  process.stderr.write(`\n${(err as Error).stack ?? String(err)}\n`);
  await stopServer?.();
  await db.local?.stop();
  process.exit(1);
}
