import nodemailer from 'nodemailer';
import { UniqueConstraintError } from 'sequelize';
import type { Logger } from 'pino';
import { MailDelivery } from '../db/models';

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
  send(message: MailMessage): Promise<MailOutcome>;
  close(): void;
}

export interface MailerOptions {
  host: string | undefined;
  port: number;
  from: string;
  to: string[];
  logger: Logger;
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
  return {
    recipients: to,
    close: () => transport.close(),
    async send(message) {
      let delivery: MailDelivery;
      try {
        delivery = await MailDelivery.create({
          topic: message.topic,
          topicKey: message.topicKey ?? null,
          recipients: to.join(', '),
          subject: message.subject,
          text: message.text,
          status: 'pending',
          error: null,
          sentAt: null,
        });
      } catch (err) {
        if (err instanceof UniqueConstraintError)
          return { deliveryId: null, status: 'duplicate', to, error: null };
        options.logger.error({ err, topic: message.topic }, 'could not record an e-mail before sending');
        return { deliveryId: null, status: 'failed', to, error: (err as Error).message };
      }
      try {
        if (!options.host) throw new Error('No mail server is configured: set SMTP_HOST and SMTP_PORT.');
        await transport.sendMail({ from: options.from, to, subject: message.subject, text: message.text });
        await delivery.update({ status: 'sent', sentAt: new Date() });
        return { deliveryId: delivery.id, status: 'sent', to, error: null };
      } catch (err) {
        const error = (err as Error).message;
        options.logger.warn({ err, topic: message.topic, deliveryId: delivery.id }, 'e-mail not sent');
        await delivery.update({ status: 'failed', error }).catch((updateErr: unknown) => {
          options.logger.error({ err: updateErr }, 'could not record a failed e-mail');
        });
        return { deliveryId: delivery.id, status: 'failed', to, error };
      }
    },
  };
}
