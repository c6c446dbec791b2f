import { Op, type Sequelize } from 'sequelize';
import { MailDelivery } from './models';
import { runSql } from './sql';
import { isDuplicateKey } from './unique-violation';

export type { MailDelivery };

export interface NewDelivery {
  topic: string;
  topicKey: string | null;
  recipients: string;
  subject: string;
  text: string;
}

/** Records a pending delivery; `null` when one with the same topic key exists (the unique key refused it). */
export async function recordDelivery(delivery: NewDelivery): Promise<MailDelivery | null> {
  try {
    return await MailDelivery.create({
      ...delivery,
      status: 'pending',
      error: null,
      sentAt: null,
      lastAttemptAt: new Date(),
    });
  } catch (err) {
    if (isDuplicateKey(err)) return null;
    throw err;
  }
}

export async function markDelivery(
  delivery: MailDelivery,
  outcome: { status: 'sent'; sentAt: Date; error: null } | { status: 'failed'; error: string },
) {
  await delivery.update(outcome);
}

/** Failed announcements (they carry a topic key) created after `since`, oldest first. */
export const failedDeliveriesSince = (since: Date) =>
  MailDelivery.findAll({
    where: { status: 'failed', topicKey: { [Op.ne]: null }, createdAt: { [Op.gt]: since } },
    order: [['id', 'ASC']],
  });

/**
 * Claims a failed delivery for one more attempt by a conditional update, so two app instances never send the same
 * retry twice; the claimed row read back, or `null` when another instance was first.
 */
export async function claimRetry(delivery: MailDelivery, now: Date): Promise<MailDelivery | null> {
  const [claimed] = await MailDelivery.update(
    { status: 'pending', attempts: delivery.attempts + 1, lastAttemptAt: now },
    { where: { id: delivery.id, status: 'failed', attempts: delivery.attempts } },
  );
  if (claimed !== 1) return null;
  return delivery.reload();
}

/** What the local fake SMTP server caught, for the demo's outbox; it runs beside the app, models or not. */
export async function storeCaughtMail(
  sequelize: Sequelize,
  mail: { recipients: string; sender: string | null; subject: string; text: string },
) {
  await runSql(
    sequelize,
    'INSERT INTO caught_mail (recipients, sender, subject, text, received_at) VALUES (?, ?, ?, ?, ?)',
    [mail.recipients, mail.sender, mail.subject, mail.text, new Date()],
  );
}
