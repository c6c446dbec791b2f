import nodemailer from 'nodemailer';
import { sourceLanguage, type Language } from '@shared/i18n/languages';
import { mailLanguage } from './mail-language';
import type { Logger } from 'pino';
import {
  claimRetry,
  failedDeliveriesSince,
  markDelivery,
  recordDelivery,
  type MailDelivery,
} from '../db/mail-deliveries';

export interface MailMessage {
  topic: 'hold' | 'consumption' | 'handover';
  /** Sending the same key twice sends once: a hold is announced once, even if two sweeps race. */
  topicKey?: string;
  subject: string;
  text: string;
}

export interface MailOutcome {
  deliveryId: number | null;
  status: 'sent' | 'failed' | 'duplicate';
  to: string[];
  error: string | null;
}

export interface Mailer {
  readonly recipients: readonly string[];
  /** The language the recipients read: what a message to them is written in (server/mail/mail-language.ts). */
  readonly language: Language;
  send(message: MailMessage): Promise<MailOutcome>;
  /** Tries again the announcements (holds, consumption) that failed in the last day; how many went out now. */
  retryFailed(now?: Date): Promise<number>;
  close(): void;
}

/** Minutes to wait after the nth failed attempt before the next: 1, 2, 4, 8, 16, then every 30. */
const retryAfterMinutes = (attempts: number) => Math.min(2 ** Math.max(0, attempts - 1), 30);
const retryWindowMs = 24 * 3_600_000;

export interface MailerOptions {
  host: string | undefined;
  port: number;
  from: string;
  to: string[];
  logger: Logger;
  /** Maintenance control's language (OPERATOR_LANGUAGE); English when not given. */
  language?: Language;
}

/**
 * Sends to maintenance control over plain SMTP and records every attempt in mail_deliveries. It never throws:
 * an e-mail that cannot go out is logged and recorded as failed, and whatever asked for it carries on.
 */
export function createMailer(options: MailerOptions): Mailer {
  const transport = nodemailer.createTransport({
    host: options.host ?? '127.0.0.1',
    port: options.port,
    secure: false,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 10_000,
  });
  const to = [...options.to];
  /** One attempt at a recorded delivery; never throws. */
  const attempt = async (
    delivery: MailDelivery,
    message: Pick<MailMessage, 'subject' | 'text' | 'topic'>,
  ): Promise<MailOutcome> => {
    // A retry goes to whom the message was recorded for.
    const recipients = delivery.recipients.split(',').map((a) => a.trim());
    try {
      if (!options.host) throw new Error('No mail server is configured: set SMTP_HOST and SMTP_PORT.');
      await transport.sendMail({
        from: options.from,
        to: recipients,
        subject: message.subject,
        text: message.text,
      });
      await markDelivery(delivery, { status: 'sent', sentAt: new Date(), error: null });
      return { deliveryId: delivery.id, status: 'sent', to: recipients, error: null };
    } catch (err) {
      const error = (err as Error).message;
      options.logger.warn({ err, topic: message.topic, deliveryId: delivery.id }, 'e-mail not sent');
      await markDelivery(delivery, { status: 'failed', error }).catch((updateErr: unknown) => {
        options.logger.error({ err: updateErr }, 'could not record a failed e-mail');
      });
      return { deliveryId: delivery.id, status: 'failed', to: recipients, error };
    }
  };
  return {
    recipients: to,
    language: mailLanguage(options.language ?? sourceLanguage),
    close: () => transport.close(),
    async send(message) {
      let delivery: MailDelivery | null;
      try {
        delivery = await recordDelivery({
          topic: message.topic,
          topicKey: message.topicKey ?? null,
          recipients: to.join(', '),
          subject: message.subject,
          text: message.text,
        });
      } catch (err) {
        options.logger.error({ err, topic: message.topic }, 'could not record an e-mail before sending');
        return { deliveryId: null, status: 'failed', to, error: (err as Error).message };
      }
      if (!delivery) return { deliveryId: null, status: 'duplicate', to, error: null };
      return attempt(delivery, message);
    },
    async retryFailed(now = new Date()) {
      const failed = await failedDeliveriesSince(new Date(now.getTime() - retryWindowMs));
      let sent = 0;
      for (const delivery of failed) {
        const due =
          (delivery.lastAttemptAt ?? delivery.createdAt).getTime() +
          retryAfterMinutes(delivery.attempts) * 60_000;
        if (due > now.getTime()) continue;
        const claimed = await claimRetry(delivery, now);
        if (!claimed) continue;
        const retried = {
          subject: claimed.subject,
          text: claimed.text,
          topic: claimed.topic as MailMessage['topic'],
        };
        if ((await attempt(claimed, retried)).status === 'sent') sent += 1;
      }
      return sent;
    },
  };
}
