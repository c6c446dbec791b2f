import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { spawn, type ChildProcess } from 'node:child_process';
import type { Browser, Page } from 'playwright-core';
import { e2eDatabase, enrolledKiosk, makeMechanicAndAirframe } from '../setup/browser';
import { launchBrowser } from '../setup/chromium';
import { fillPreFlight, kioskSignIn } from '../setup/kiosk-steps';
import { findFreePort } from '@server/db/local-server';
import { createEnrolment } from '@server/features/kiosks/kiosks.service';
import { AuditEvent, Check, Reading } from '@server/db/models';

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

    await kioskSignIn(page, badge, pin);
    await fillPreFlight(page, airframe.fleetNumber, pin, 6.5);

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

/** What the database holds for an airframe's checks: the exactly-once count the kiosk must leave behind. */
async function storedFor(airframeId: number) {
  const checks = await Check.findAll({ where: { airframeId }, attributes: ['id'] });
  const ids = checks.map((c) => c.id);
  return {
    checks: ids.length,
    readings: await Reading.count({ where: { checkId: ids } }),
    signedEvents: await AuditEvent.count({ where: { action: 'check.signed', entityId: ids } }),
  };
}

describe('an answer lost after the server stored the check', () => {
  it.each([
    ['taps Sign once', 1],
    ['double-taps Sign', 2],
  ] as const)(
    'when the mechanic %s and the first answer is dropped after the check was stored, then the resend gets the stored record back and there is one check, eight readings and one signed event',
    async (_, taps) => {
      const { badge, pin, airframe } = await makeMechanicAndAirframe();
      const context = await enrolledKiosk(browser);
      const page = await context.newPage();
      await kioskSignIn(page, badge, pin);
      await fillPreFlight(page, airframe.fleetNumber, pin, 6.5);

      // The first request reaches the server and is stored; the browser never sees the answer.
      const dropped: { status: number; id: string }[] = [];
      const sent: { id: string; status: number; replay: string | null }[] = [];
      page.on('response', async (res) => {
        if (res.request().method() !== 'POST' || !res.url().endsWith('/api/checks')) return;
        sent.push({
          id: (res.request().postDataJSON() as { id: string }).id,
          status: res.status(),
          replay: (await res.allHeaders())['idempotent-replay'] ?? null,
        });
      });
      await page.route('**/api/checks', async (route) => {
        if (route.request().method() !== 'POST' || dropped.length > 0) return route.continue();
        const answer = await route.fetch();
        dropped.push({ status: answer.status(), id: (route.request().postDataJSON() as { id: string }).id });
        await route.abort('connectionreset');
      });
      const sign = page.getByRole('button', { name: 'Sign', exact: true });
      await (taps === 2 ? sign.dblclick() : sign.click());

      await page.getByTestId('queue-sent').waitFor({ timeout: 30_000 });
      expect(dropped).toHaveLength(1);
      expect(dropped[0]!.status).toBe(201);
      expect(sent.length).toBeGreaterThanOrEqual(1);
      expect(sent.map((s) => [s.id, s.status, s.replay])).toContainEqual([dropped[0]!.id, 201, 'true']);
      expect(new Set(sent.map((s) => s.id))).toEqual(new Set([dropped[0]!.id]));
      expect(await storedFor(airframe.id)).toEqual({ checks: 1, readings: 8, signedEvents: 1 });
      await context.close();
    },
  );
});
