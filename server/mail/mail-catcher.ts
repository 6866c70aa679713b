import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { Db } from '../db/db';
import { insertCaughtMail } from './caught-mail.repository';
import { MAIL_KIND_HEADER, MAIL_TEAM_HEADER } from './mailer';

export type MailCatcher = { port: number; close: () => Promise<void> };

const addresses = (a: AddressObject | AddressObject[] | undefined): string =>
  (Array.isArray(a) ? a : a ? [a] : [])
    .flatMap((o) => o.value.map((v) => v.address ?? ''))
    .filter(Boolean)
    .join(', ');

const header = (headers: Map<string, unknown>, name: string): string | undefined => {
  const v = headers.get(name.toLowerCase());
  return typeof v === 'string' ? v.trim() : undefined;
};

/** The team a message was sent for, from the mailer's header; null when absent or not an id. */
function teamOf(headers: Map<string, unknown>): number | null {
  const raw = header(headers, MAIL_TEAM_HEADER);
  return raw && /^[1-9][0-9]{0,9}$/.test(raw) && Number(raw) <= 2_147_483_647 ? Number(raw) : null;
}

/**
 * A local SMTP server on loopback that stores every message it receives in caught_mail, filed under
 * the team and kind the mailer put in its headers, so the app (GET /dev/mail: a team's own mail only)
 * and tests can read it. Development and tests only.
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
            teamId: teamOf(parsed.headers),
            kind: header(parsed.headers, MAIL_KIND_HEADER) ?? null,
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
