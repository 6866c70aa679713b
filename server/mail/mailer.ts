import nodemailer from 'nodemailer';
import type { Config } from '../config';

export type OutgoingMail = { to: string; subject: string; text: string };
export type Mailer = { send: (mail: OutgoingMail) => Promise<void>; close: () => void };

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
      await transport.sendMail({ from: config.mailFrom, to: mail.to, subject: mail.subject, text: mail.text });
    },
    close: () => transport.close(),
  };
}
