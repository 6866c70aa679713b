import type { AddressInfo } from 'node:net';
import { createApp } from './app';
import { ConfigError, loadConfig } from './config';
import { createDb } from './db/db';
import { findDemoOwner } from './dev/demo.service';
import { pingDatabase } from './health/health.repository';
import { createLogger } from './logger';
import { type MailCatcher, startMailCatcher } from './mail/mail-catcher';
import { createMailer } from './mail/mailer';

async function main(): Promise<void> {
  let config;
  try {
    config = loadConfig();
  } catch (e) {
    if (e instanceof ConfigError) {
      console.error(e.message);
      process.exit(1);
    }
    throw e;
  }
  const logger = createLogger(config.logLevel);
  const db = createDb(config);
  if (!(await pingDatabase(db, 5000))) {
    console.error(`Cannot reach MariaDB at ${config.db.host}:${config.db.port}/${config.db.name}. Is it running? (bash scripts/db.sh start)`);
    process.exit(1);
  }

  let catcher: MailCatcher | undefined;
  if (config.mailCatcher) {
    catcher = await startMailCatcher(db, { port: config.smtp.port, host: config.smtp.host, onError: (e) => logger.error('mail catcher:', e) }).catch(
      (e: Error) => {
        throw new Error(`the mail catcher cannot listen on ${config.smtp.host}:${config.smtp.port} (${e.message}); set SMTP_PORT`);
      },
    );
    logger.info(`Mail catcher on smtp://${config.smtp.host}:${catcher.port} (caught mail: GET /api/v1/dev/mail)`);
  }
  const mailer = createMailer({ ...config, smtp: { host: config.smtp.host, port: catcher?.port ?? config.smtp.port } });
  const app = createApp({ db, mailer, config, logger });
  // Jobs interrupted by a stop (or left by another process that stopped) continue here.
  app.locals.jobs.start();
  // Register reminders (assignment, due soon, overdue, requests to verify); their state is in MariaDB.
  app.locals.reminders.start();

  const server = app.listen(config.port, config.host, () => {
    const { port } = server.address() as AddressInfo;
    console.log(`Lagline on http://${config.host}:${port}`);
  });
  server.on('error', (e) => {
    console.error(`Cannot listen on ${config.host}:${config.port}: ${e.message}`);
    process.exit(1);
  });

  if (config.env !== 'production') {
    findDemoOwner({ db })
      .then((demo) => {
        if (demo) console.log(demo);
      })
      .catch(() => undefined);
  }

  let stopping = false;
  const shutdown = (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info(`${signal}: shutting down`);
    (setTimeout(() => process.exit(1), 10_000) as unknown as NodeJS.Timeout).unref();
    server.close(async () => {
      await app.locals.close().catch(() => undefined);
      await catcher?.close().catch(() => undefined);
      mailer.close();
      await db.destroy().catch(() => undefined);
      process.exit(0);
    });
    server.closeIdleConnections?.();
  };
  process.on('SIGTERM', () => shutdown('SIGTERM'));
  process.on('SIGINT', () => shutdown('SIGINT'));
}

// Belt and braces: a stray rejection is logged, not allowed to stop the server.
process.on('unhandledRejection', (reason) => console.error('Unhandled rejection:', reason));

main().catch((e: Error) => {
  console.error(`Lagline could not start: ${e.message}`);
  process.exit(1);
});
