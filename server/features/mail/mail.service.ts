import type { CaughtMailItem } from '@shared/schemas/mail';
import { newestCaughtMail, newestDeliveries } from './mail.repository';

/** What the local fake SMTP server caught: the demo's view of what would have been sent. */
export async function caughtMail(limit: number): Promise<CaughtMailItem[]> {
  return (await newestCaughtMail(limit)).map((m) => ({
    id: m.id,
    to: m.recipients,
    subject: m.subject,
    text: m.text,
    receivedAt: m.receivedAt.toISOString(),
  }));
}

/** Every send the app attempted, with failures and their error, so a missed e-mail is visible. */
export async function deliveries(limit: number) {
  return (await newestDeliveries(limit)).map((d) => ({
    id: d.id,
    topic: d.topic,
    to: d.recipients,
    subject: d.subject,
    status: d.status,
    error: d.error,
    attempts: d.attempts,
    lastAttemptAt: d.lastAttemptAt?.toISOString() ?? null,
    createdAt: d.createdAt.toISOString(),
    sentAt: d.sentAt?.toISOString() ?? null,
  }));
}
