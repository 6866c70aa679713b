import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { Db } from '../db/db';
import { insertCaughtMail } from './caught-mail.repository';

export type MailCatcher = { port: number; close: () => Promise<void> };

const addresses = (a: AddressObject | AddressObject[] | undefined): string =>
  (Array.isArray(a) ? a : a ? [a] : [])
    .flatMap((o) => o.value.map((v) => v.address ?? ''))
    .filter(Boolean)
    .join(', ');

/**
 * A local SMTP server on loopback that stores every message it receives in caught_mail,
 * so the app (GET /dev/mail) and tests can read it. Development and tests only.
 */
export async function startMailCatcher(db: Db, opts: { port?: number; host?: string; onError?: (e: unknown) => void } = {}): Promise<MailCatcher> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    logger: false,
    size: 5 * 1024 * 1024,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          await insertCaughtMail(db, {
            messageId: parsed.messageId,
            from: addresses(parsed.from),
            to: addresses(parsed.to).toLowerCase(),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : undefined,
          });
          callback();
        })
        .catch((e: Error) => {
          opts.onError?.(e);
          callback(e);
        });
    },
  });
  server.on('error', (e) => opts.onError?.(e));
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port ?? 0, opts.host ?? '127.0.0.1', () => resolve());
  });
  const port = (server.server.address() as AddressInfo).port;
  return { port, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}
