import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';
import type { Sequelize } from 'sequelize';
import { storeCaughtMail } from '../db/mail-deliveries';

export interface FakeSmtp {
  port: number;
  stop(): Promise<void>;
}

const addresses = (field: AddressObject | AddressObject[] | undefined) =>
  (Array.isArray(field) ? field : field ? [field] : [])
    .flatMap((a) => a.value.map((v) => v.address ?? ''))
    .filter(Boolean);

/**
 * A local SMTP server for the demo and the tests: it accepts every message on loopback and keeps it in the
 * caught_mail table, where the engineering page lists it. It delivers nothing anywhere.
 */
export async function startFakeSmtp(options: {
  port: number;
  sequelize: Sequelize;
  host?: string;
}): Promise<FakeSmtp> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    logger: false,
    size: 2 * 1024 * 1024,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (mail) => {
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
          const to = envelopeTo.length ? envelopeTo : addresses(mail.to);
          await storeCaughtMail(options.sequelize, {
            recipients: to.join(', '),
            sender: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
            subject: (mail.subject ?? '(no subject)').slice(0, 255),
            text: mail.text ?? '',
          });
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  const host = options.host ?? '127.0.0.1';
  await new Promise<void>((ok, fail) => {
    server.once('error', fail);
    server.listen(options.port, host, () => ok());
  });
  const address = server.server.address();
  const port = typeof address === 'object' && address ? address.port : options.port;
  return { port, stop: () => new Promise<void>((ok) => server.close(() => ok())) };
}
