import type { AddressInfo } from 'node:net';
import type { Knex } from 'knex';
import { createApp, type LaglineApp } from '../../server/app';
import type { Config } from '../../server/config';
import { createMailer } from '../../server/mail/mailer';
import { testConfig } from './test-config';
import { createTestDatabase } from './test-db';
import { startTestMail, type TestMail } from './mail';

export type TestServer = {
  url: string;
  db: Knex;
  dbName: string;
  config: Config;
  app: LaglineApp;
  mail: Pick<TestMail, 'messages' | 'waitFor'>;
  close: () => Promise<void>;
};

/**
 * A complete Lagline on 127.0.0.1:<free port>: fresh database (migrated, optionally seeded with the
 * demo team), a mail catcher on a free port, the exported web app from dist/.
 */
export async function startTestServer(opts: { seed?: boolean; config?: Partial<Config>; env?: Record<string, string | undefined> } = {}): Promise<TestServer> {
  const database = await createTestDatabase({ seed: opts.seed });
  const mail = await startTestMail(database.db);
  const config0 = testConfig(opts.config, opts.env);
  const mailer = createMailer({ mailFrom: config0.mailFrom, smtp: { host: '127.0.0.1', port: mail.port } });
  // The app's links must point at this server, so the port is known before the config is final.
  const { createServer } = await import('node:http');
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const config = Object.freeze({ ...config0, appUrl: opts.config?.appUrl ?? url, port: (server.address() as AddressInfo).port });
  const app = createApp({ db: database.db, mailer, config });
  server.on('request', app);
  return {
    url,
    db: database.db,
    dbName: database.name,
    config,
    app,
    mail,
    close: async () => {
      server.closeAllConnections?.();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await app.locals.jobs.stop();
      await app.locals.reminders.stop();
      await app.locals.calc.close();
      mailer.close();
      await mail.close();
      await database.drop();
    },
  };
}
