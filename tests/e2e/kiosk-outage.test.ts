import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { spawn, type ChildProcess } from 'node:child_process';
import type { Browser, Page } from 'playwright-core';
import { e2eDatabase, launchBrowser, makeMechanicAndAirframe } from '../setup/browser';
import { tapGlass } from '../setup/kiosk-steps';
import { findFreePort } from '../../server/db/local-server';
import { createEnrolment } from '../../server/features/kiosks/kiosks.service';
import { Check } from '../../server/db/models';

let browser: Browser;
let server: ChildProcess | null = null;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await stopServer('SIGTERM');
  await browser?.close();
});

/** A server of this test's own on the e2e database, so killing it leaves the other browser tests alone. */
async function startServer(port: number): Promise<void> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/start.ts'], {
    env: {
      ...process.env,
      PORT: String(port),
      HOST: '127.0.0.1',
      DATABASE_URL: inject('e2eDatabaseUrl'),
      SESSION_SECRET: 'e2e-outage-secret-that-is-long-enough',
      BCRYPT_COST: '4',
      SIGN_IN_RATE_PER_MINUTE: '10000',
      LOG_LEVEL: 'warn',
    },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  await new Promise<void>((ok, fail) => {
    const timer = setTimeout(() => fail(new Error('the outage server did not start within 30 s')), 30_000);
    child.stdout?.on('data', (chunk: Buffer) => {
      if (chunk.toString().includes('listening')) {
        clearTimeout(timer);
        ok();
      }
    });
    child.once('exit', (code) => fail(new Error(`the outage server exited with ${code}`)));
  });
  server = child;
}

async function stopServer(signal: NodeJS.Signals): Promise<void> {
  const child = server;
  server = null;
  if (!child || child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise((resolve) => child.once('exit', resolve));
  child.kill(signal);
  await exited;
}

const key = (page: Page, name: string) => page.getByRole('button', { name, exact: true });

describe('a server outage in the middle of signing', () => {
  it('when the server is killed as the mechanic signs and then comes back, then the check waits in the queue and is stored exactly once', async () => {
    const port = await findFreePort(0);
    await startServer(port);
    const { badge, pin, airframe } = await makeMechanicAndAirframe();
    e2eDatabase();
    const enrolment = await createEnrolment('Outage tablet', null);
    const context = await browser.newContext({
      viewport: { width: 1280, height: 800 },
      baseURL: `http://127.0.0.1:${port}`,
    });
    const page = await context.newPage();
    await page.goto(enrolment.enrolPath);
    await page.waitForURL(/\/kiosk/, { timeout: 15_000 });

    await page.goto('/kiosk');
    for (const d of badge) await key(page, d).click();
    await key(page, 'Next: PIN').click();
    for (const d of pin) await key(page, d).click();
    await key(page, 'Sign in').click();
    await page.getByTestId(`airframe-${airframe.fleetNumber}`).click();
    await page.getByTestId('start-pre_flight').click();
    await key(page, 'On wheels').click();
    await key(page, 'Relieved').click();
    if ((await page.getByTestId('ambient-temp').textContent())?.includes('Not set')) {
      await page.getByRole('button', { name: '20 degrees C' }).click();
    }
    await key(page, 'Next').click();
    await tapGlass(page, 6.5);
    await key(page, 'Next').click();
    await tapGlass(page, 4.0);
    await key(page, 'Next').click();
    await page.getByTestId('reading-value').waitFor();
    await key(page, '4').click();
    await key(page, '5').click();
    await key(page, 'Next').click();
    for (let i = 0; i < 5; i++) {
      await page.getByText(`Checkpoint ${4 + i} of 8`).waitFor();
      await key(page, 'No').click();
    }
    await page.getByRole('button', { name: 'Sign with PIN' }).click();
    for (const d of pin) await key(page, d).click();

    await stopServer('SIGKILL');
    await key(page, 'Sign').click();
    const item = page.getByTestId('queue-item');
    await item.waitFor({ timeout: 15_000 });
    expect(await item.textContent()).toContain(airframe.fleetNumber);
    expect(await page.getByTestId('send-queue').textContent()).toContain('Waiting to send (1)');
    expect(await Check.count({ where: { airframeId: airframe.id } })).toBe(0);

    await startServer(port);
    await page.getByTestId('queue-sent').waitFor({ timeout: 90_000 });
    await expect.poll(() => page.getByTestId('queue-item').count()).toBe(0);

    // A second press of "send" (or a lost answer) must not make a second record.
    const stored = await Check.findAll({ where: { airframeId: airframe.id } });
    expect(stored).toHaveLength(1);
    await page.getByRole('button', { name: 'See the result' }).click();
    await page.getByTestId('check-result').waitFor();
    expect(await page.getByTestId('check-result').getAttribute('data-verdict')).toBe('in_limits');
    expect(await page.getByTestId('waiting-to-send').count()).toBe(0);
    await context.close();
  });
});
