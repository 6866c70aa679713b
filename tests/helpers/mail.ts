import type { Knex } from 'knex';
import { type CaughtMail, listCaughtMail } from '../../server/mail/caught-mail.repository';
import { startMailCatcher } from '../../server/mail/mail-catcher';

export type TestMail = {
  port: number;
  /** Every caught message, newest first. */
  messages: () => Promise<CaughtMail[]>;
  /** Waits for a message to this address (optionally whose subject matches), newest first. */
  waitFor: (to: string, opts?: { subject?: RegExp; timeoutMs?: number; after?: number }) => Promise<CaughtMail>;
  close: () => Promise<void>;
};

/** A mail catcher on 127.0.0.1, port 0, storing into the given database. */
export async function startTestMail(db: Knex): Promise<TestMail> {
  const catcher = await startMailCatcher(db, { port: 0 });
  return {
    port: catcher.port,
    messages: () => listCaughtMail(db),
    waitFor: async (to, opts = {}) => {
      const deadline = Date.now() + (opts.timeoutMs ?? 10_000);
      for (;;) {
        const found = (await listCaughtMail(db, { to: to.toLowerCase() })).find(
          (m) => (!opts.subject || opts.subject.test(m.subject)) && (opts.after === undefined || m.id > opts.after),
        );
        if (found) return found;
        if (Date.now() > deadline) throw new Error(`No mail to ${to} arrived`);
        await new Promise((r) => setTimeout(r, 50));
      }
    },
    close: () => catcher.close(),
  };
}

/** The first link in a mail's text that carries ?token=…, and the token. */
export function tokenFromMail(mail: CaughtMail): { link: string; token: string } {
  const link = mail.text.match(/https?:\/\/\S+token=[A-Za-z0-9_-]+/)?.[0];
  if (!link) throw new Error(`No token link in mail "${mail.subject}"`);
  return { link, token: new URL(link).searchParams.get('token')! };
}
