import nodemailer from 'nodemailer';
import type { Config } from '../config';

/** What a message is about; the in-app view of caught mail never shows a password reset. */
export type MailKind = 'invitation' | 'password-reset' | 'register-reminder';

export type OutgoingMail = {
  to: string;
  subject: string;
  text: string;
  kind: MailKind;
  /** The team whose action sent it (an owner inviting someone); null when no team acted (a reset). */
  teamId: number | null;
};
export type Mailer = { send: (mail: OutgoingMail) => Promise<void>; close: () => void };

/** Headers that carry kind and team to the local catcher, which files the message under them. */
export const MAIL_KIND_HEADER = 'X-Lagline-Mail-Kind';
export const MAIL_TEAM_HEADER = 'X-Lagline-Team';

/** SMTP mailer; in development and tests it talks to the local catcher. */
export function createMailer(config: Pick<Config, 'smtp' | 'mailFrom'>): Mailer {
  const transport = nodemailer.createTransport({
    host: config.smtp.host,
    port: config.smtp.port,
    secure: false,
    ignoreTLS: config.smtp.host === '127.0.0.1' || config.smtp.host === 'localhost',
    connectionTimeout: 5000,
  });
  return {
    send: async (mail) => {
      const headers: Record<string, string> = { [MAIL_KIND_HEADER]: mail.kind };
      if (mail.teamId !== null) headers[MAIL_TEAM_HEADER] = String(mail.teamId);
      await transport.sendMail({ from: config.mailFrom, to: mail.to, subject: mail.subject, text: mail.text, headers });
    },
    close: () => transport.close(),
  };
}
