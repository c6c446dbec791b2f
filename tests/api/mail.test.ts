import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApp, database, makeAirframe } from '../setup/api-harness';
import { eventually, heldAirframe } from '../setup/lead-fixtures';
import {
  checkBody,
  isolatedLevel,
  servicingReadings,
  servicingTopUps,
  signCheck,
} from '../setup/check-builder';
import { signedIn } from '../setup/sign-in';
import { findFreePort } from '@server/db/local-server';
import { startFakeSmtp, type FakeSmtp } from '@server/mail/fake-smtp';
import { createMailer } from '@server/mail/mailer';
import pino from 'pino';
import { Check, Hold, MailDelivery } from '@server/db/models';
import type { CaughtMailItem } from '@shared/schemas/mail';
import type { HandoverSummary } from '@shared/schemas/handover';

let smtp: FakeSmtp;
let built: ReturnType<typeof buildApp>;
// A port nothing listens on: the mail server of this app is "down".
let down: ReturnType<typeof buildApp>;
let downPort = 0;

beforeAll(async () => {
  smtp = await startFakeSmtp({ port: await findFreePort(0), sequelize: database() });
  built = buildApp({
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(smtp.port),
    MAINTENANCE_CONTROL_EMAILS: 'control@test.example, duty@test.example',
  });
  downPort = await findFreePort(0);
  down = buildApp({ SMTP_HOST: '127.0.0.1', SMTP_PORT: String(downPort) });
});
afterAll(async () => {
  built.close();
  down.close();
  await smtp.stop();
  await database().close();
});

async function outbox(app: ReturnType<typeof buildApp>['app']) {
  const engineer = await signedIn(app, ['engineering'], 'desk');
  return async (match: (m: CaughtMailItem) => boolean) => {
    const res = await engineer.client.get('/api/mail/outbox');
    expect(res.status).toBe(200);
    return (res.body as CaughtMailItem[]).find(match);
  };
}

describe('e-mail to maintenance control', () => {
  it('when a check opens a hold, then the fake SMTP server catches an e-mail with the airframe, the reading and its limit', async () => {
    const held = await heldAirframe(built.app);
    const find = await outbox(built.app);
    const mail = await eventually(() => find((m) => m.subject.includes(held.airframe.fleetNumber)));
    expect(mail.subject).toBe(`HOLD ${held.airframe.fleetNumber}: System 1 reservoir level`);
    expect(mail.to).toBe('control@test.example, duty@test.example');
    expect(mail.text).toContain(`Airframe ${held.airframe.fleetNumber}`);
    expect(mail.text).toContain('System 1 reservoir level: 2.90 L');
    expect(mail.text).toContain('(limit: at or above 0 L and below 3 L)');
    expect(mail.text).toContain(
      'Level at or below the low-level switch mark: at this level the switch isolates part of System 1.',
    );
    expect(mail.text).toContain(held.mechanic.staff.name);
    expect(mail.text).toMatch(/approved maintenance data/);
    const hold = await Hold.findOne({ where: { checkId: held.check.id } });
    // The server catches the message before the sender records the delivery: wait until it is no longer pending.
    const delivery = await eventually(async () => {
      const row = await MailDelivery.findOne({ where: { topicKey: `hold:${hold!.id}` } });
      return row && row.status !== 'pending' ? row : undefined;
    });
    expect(delivery.status).toBe('sent');
  });

  it('when the mail server is down, then the check is still stored and the failed e-mail is recorded', async () => {
    const mechanic = await signedIn(down.app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    const check = await signCheck(mechanic, airframe.id, limits.id, {}, [isolatedLevel]);
    expect(check.holdOpened).toBe(true);
    expect(await Check.count({ where: { id: check.id } })).toBe(1);
    const hold = await Hold.findOne({ where: { checkId: check.id } });
    const delivery = await eventually(async () => {
      const row = await MailDelivery.findOne({ where: { topicKey: `hold:${hold!.id}` } });
      return row && row.status !== 'pending' ? row : undefined;
    });
    expect(delivery.status).toBe('failed');
    expect(delivery.error).toBe(`connect ECONNREFUSED 127.0.0.1:${downPort}`);
  });

  it('when the mail server comes back, then a failed hold e-mail is sent on a later try, backing off between tries', async () => {
    const mechanic = await signedIn(down.app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    const check = await signCheck(mechanic, airframe.id, limits.id, {}, [isolatedLevel]);
    const hold = await Hold.findOne({ where: { checkId: check.id } });
    const key = `hold:${hold!.id}`;
    const failed = await eventually(async () => {
      const row = await MailDelivery.findOne({ where: { topicKey: key } });
      return row?.status === 'failed' ? row : undefined;
    });
    const firstTry = failed.lastAttemptAt!.getTime();
    const logger = pino({ level: 'silent' });
    const stillDown = createMailer({
      host: '127.0.0.1',
      port: await findFreePort(0),
      from: 'gw@test.example',
      to: [],
      logger,
    });
    const backUp = createMailer({
      host: '127.0.0.1',
      port: smtp.port,
      from: 'gw@test.example',
      to: [],
      logger,
    });
    try {
      // Not yet: the first retry waits a minute after the first try.
      await backUp.retryFailed(new Date(firstTry + 30_000));
      expect((await MailDelivery.findByPk(failed.id))!.status).toBe('failed');
      // A minute on, the server is still down: a second failed try; the next waits two minutes.
      await stillDown.retryFailed(new Date(firstTry + 61_000));
      const second = (await MailDelivery.findByPk(failed.id))!;
      expect(second.status).toBe('failed');
      expect(second.attempts).toBe(2);
      await backUp.retryFailed(new Date(firstTry + 61_000 + 60_000));
      expect((await MailDelivery.findByPk(failed.id))!.status).toBe('failed');
      // Two minutes after the second try the server is back: sent, to whom it was recorded for.
      await backUp.retryFailed(new Date(firstTry + 61_000 + 121_000));
      const sent = (await MailDelivery.findByPk(failed.id))!;
      expect(sent.status).toBe('sent');
      expect(sent.attempts).toBe(3);
      const find = await outbox(built.app);
      const mail = await eventually(() => find((m) => m.subject === sent.subject));
      expect(mail.to).toBe(sent.recipients);
      expect(mail.text).toContain(`Airframe ${airframe.fleetNumber}`);
    } finally {
      stillDown.close();
      backUp.close();
    }
  });

  it('when the lead sends the handover, then it is caught with the checks and holds of the shift', async () => {
    const held = await heldAirframe(built.app);
    const lead = await signedIn(built.app, ['shift_lead'], 'desk');
    const from = new Date(Date.now() - 60_000).toISOString();
    const summary = (await lead.client.get(`/api/handover?from=${encodeURIComponent(from)}`))
      .body as HandoverSummary;
    expect(summary.checks.total).toBeGreaterThanOrEqual(1);
    expect(summary.holdsOpened.some((h) => h.id === held.holdId)).toBe(true);
    const sent = await lead.client.post('/api/handover/send', { from });
    expect(sent.status).toBe(200);
    expect(sent.body).toMatchObject({ status: 'sent', to: ['control@test.example', 'duty@test.example'] });
    const find = await outbox(built.app);
    const mail = await eventually(() => find((m) => m.subject === sent.body.subject));
    expect(mail.text).toContain(`${held.airframe.fleetNumber} (hold ${held.holdId}`);
    expect(mail.text).toMatch(/Pre-flight: \d+/);
  });

  it('when fluid was added and flight hours are unknown, then the handover shows the litres and says no per-hour alert is possible', async () => {
    const mechanic = await signedIn(built.app, ['mechanic'], 'kiosk');
    const { airframe, limits } = await makeAirframe();
    const res = await mechanic.client.post(
      '/api/checks',
      checkBody('servicing', airframe.id, limits.id, mechanic.pin, servicingReadings(), {
        servicing: servicingTopUps(0.6, 0.2),
      }),
    );
    expect(res.status).toBe(201);
    const lead = await signedIn(built.app, ['shift_lead'], 'desk');
    const summary = (await lead.client.get('/api/handover')).body as HandoverSummary;
    expect(summary.fluidUsed.byAirframe.filter((f) => f.airframe.id === airframe.id)).toEqual([
      { airframe: { id: airframe.id, fleetNumber: airframe.fleetNumber }, system: 'sys1', litres: 0.6 },
      { airframe: { id: airframe.id, fleetNumber: airframe.fleetNumber }, system: 'sys2', litres: 0.2 },
    ]);
    const ours = summary.consumption.filter((c) => c.airframe.id === airframe.id);
    expect(ours.map((c) => [c.system, c.flightHours, c.alert])).toEqual([
      ['sys1', null, null],
      ['sys2', null, null],
    ]);
    expect(summary.notes.join(' ')).toContain(`not known for`);
    expect(summary.notes.join(' ')).toContain(airframe.fleetNumber);
    expect(
      (await lead.client.get('/api/handover?from=2026-01-02T00:00:00Z&to=2026-01-01T00:00:00Z')).status,
    ).toBe(400);
    expect((await lead.client.get('/api/handover?from=yesterday')).status).toBe(400);
  });
});
