import { formatInstant } from '@shared/domain/when';
import { join, resolve } from 'node:path';
import { loadConfig } from '../config';
import { startServer } from '../start';
import { createSequelize, openDatabase } from '../db/connection';
import { firstEngineerId, liveTags } from '../db/seeders/start-listing';
import { migrate } from '../db/migrate';
import { demoStaff } from '../db/seeders/demo-rows';
import { seedDemo } from '../demo/demo-seed';
import { findFreePort } from '../db/local-server';
import { startFakeSmtp, type FakeSmtp } from '../mail/fake-smtp';
import type { FakeObjectStore } from '../storage/fake-object-store';
import {
  buildClientIfStale,
  localDatabase,
  localPhotoStore,
  onShutdown,
  printedBoardLink,
  printedEnrolmentLink,
  sessionSecret,
} from './local-environment';
import { roleLabels } from '@shared/schemas/auth';
import { languageNames } from '@shared/i18n/languages';

const dataDir = resolve(process.env.DATA_DIR ?? '.data');
const db = await localDatabase(dataDir);
let stopServer: (() => Promise<void>) | undefined;
let fakeSmtp: FakeSmtp | undefined;
let fakePhotoStore: FakeObjectStore | null | undefined;
onShutdown(async () => {
  await stopServer?.();
  await fakeSmtp?.stop();
  await fakePhotoStore?.stop();
  await db.local?.stop();
});

try {
  // Without a real mail server configured, a local fake catches the e-mail so the demo shows what would be sent.
  const smtpPort = process.env.SMTP_HOST
    ? undefined
    : await findFreePort(Number(process.env.SMTP_PORT ?? 2525));
  fakePhotoStore = await localPhotoStore(dataDir);
  const config = loadConfig({
    ...process.env,
    DATABASE_URL: db.url,
    SESSION_SECRET: sessionSecret(dataDir),
    DATA_DIR: dataDir,
    ...(smtpPort ? { SMTP_HOST: '127.0.0.1', SMTP_PORT: String(smtpPort) } : {}),
    ...fakePhotoStore?.env,
  });
  const sequelize = openDatabase(db.url);
  const applied = await migrate(sequelize);
  if (applied.length) process.stdout.write(`Migrations applied: ${applied.join(', ')}\n`);
  const seed = await seedDemo(sequelize, { bcryptCost: config.BCRYPT_COST });
  process.stdout.write(
    seed.seeded
      ? 'Demo scenario loaded (Tern Island Air Ambulance).\n'
      : 'Existing data kept; demo not loaded again.\n',
  );
  const enrolment = await printedEnrolmentLink(dataDir);
  const tags = await liveTags();
  const engineer = await firstEngineerId();
  const boardLink = engineer ? await printedBoardLink(sequelize, dataDir, engineer) : null;
  await sequelize.close();
  if (smtpPort) {
    const mailDb = createSequelize(db.url, { pool: 2 });
    const smtp = await startFakeSmtp({ port: smtpPort, sequelize: mailDb });
    fakeSmtp = { port: smtp.port, stop: () => smtp.stop().then(() => mailDb.close()) };
  }

  buildClientIfStale();
  const running = await startServer(config);
  stopServer = running.stop;
  const lines = [
    '',
    `Gaugewalk is running: ${running.url}`,
    '',
    `Enrol this browser as a kiosk tablet (one use, until ${formatInstant(enrolment.expiresAt)}): ${running.url}${enrolment.enrolPath}`,
    `Hangar board: ${running.url}/board      Desk sign-in: ${running.url}/desk`,
    ...(boardLink ? [`Board link for a TV (read only, no sign-in): ${running.url}${boardLink.path}`] : []),
    fakeSmtp
      ? `E-mail to ${config.MAINTENANCE_CONTROL_EMAILS.join(', ')} is caught by a local fake SMTP server on port ${fakeSmtp.port}; engineering sees it on the desk.`
      : `E-mail goes to ${config.SMTP_HOST}:${config.SMTP_PORT}.`,
    fakePhotoStore
      ? `Photos are kept by a local fake object store (s3rver) on port ${new URL(fakePhotoStore.endpoint).port}, as files in ${join(dataDir, 'objects')}.`
      : `Photos go to bucket ${config.PHOTO_STORE_BUCKET} at ${config.PHOTO_STORE_ENDPOINT}.`,
    '',
    'Demo badges (invented people):',
    ...demoStaff.map(
      (s) =>
        `  ${s.badge}  ${s.name.padEnd(12)} ${s.roles
          .map((r) => roleLabels[r])
          .join(' + ')
          .padEnd(20)} PIN ${s.pin}` +
        (s.password ? `   desk password ${s.password}` : '') +
        (s.language ? `   kiosk in ${languageNames[s.language]}` : ''),
    ),
    '',
    'Airframe tags:',
    ...tags.map((t) => `  ${t.fleetNumber}  ${running.url}/t/${t.token}`),
    '',
    'Limits in the demo are invented. Real limits come from the approved maintenance data. Ctrl-C stops it.',
    '',
  ];
  process.stdout.write(lines.join('\n'));
} catch (err) {
  process.stderr.write(`\n${(err as Error).stack ?? String(err)}\n`);
  await stopServer?.();
  await fakeSmtp?.stop();
  await fakePhotoStore?.stop();
  await db.local?.stop();
  process.exit(1);
}
