import express, { type Express, type Request, type RequestHandler, type Router } from 'express';
import { registerAuthRoutes } from './auth/auth.routes';
import { createCalcPool, type CalcPool } from './calculations/calc-pool';
import { registerCalculationRoutes } from './calculations/calculations.routes';
import type { Config } from './config';
import type { Db } from './db/db';
import type { Deps } from './deps';
import { registerDevMailRoutes } from './dev/dev-mail.routes';
import { errorHandler, errors } from './errors';
import { registerHealthRoutes } from './health/health.routes';
import { csrfProtection } from './http/csrf';
import { boundJsonDepth } from './http/json-depth';
import { createLimiters } from './http/rate-limits';
import { requestId } from './http/request-id';
import { securityHeaders } from './http/security';
import { loadSessionCaller, sessionMiddleware } from './http/session';
import { inlineScriptHashes, mountWebApp } from './http/web-app';
import { registerInvitationRoutes } from './invitations/invitations.routes';
import { createJobRunner, type JobRunner } from './jobs/job-runner';
import { registerLibraryRoutes } from './library/library.routes';
import { registerLineRoutes } from './lines/lines.routes';
import { SITE_SIZING, siteSizingHandler } from './sizing/sizing.service';
import { registerSizingRoutes } from './sizing/sizing.routes';
import { createLogger, type Logger } from './logger';
import type { Mailer } from './mail/mailer';
import { registerMeRoutes } from './me/me.routes';
import { registerRegisterRoutes } from './register/register.routes';
import { createReminderScheduler, type ReminderScheduler } from './register/reminders';
import { registerReportRoutes } from './reports/reports.routes';
import { registerRevisionRoutes } from './revisions/revisions.routes';
import { registerSiteRoutes } from './sites/sites.routes';
import { registerTeamRoutes } from './team/team.routes';

export type AppOptions = {
  db: Db;
  mailer: Mailer;
  config: Config;
  logger?: Logger;
  calc?: CalcPool;
  /** The clock [ms since epoch]; tests pass their own. */
  now?: () => number;
};

export type LaglineApp = Express & {
  locals: {
    apiRouter: Router;
    calc: CalcPool;
    jobs: JobRunner;
    reminders: ReminderScheduler;
    /** Stops what the app runs in the background (worker threads, the session expiry sweep). */
    close: () => Promise<void>;
  };
};

const CALCULATIONS = '/v1/calculations';

/** Builds the whole HTTP application. Never listens (server/index.ts and tests do). */
export function createApp({ db, mailer, config, logger = createLogger(config.logLevel), calc, now = Date.now }: AppOptions): LaglineApp {
  const app = express() as LaglineApp;
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy);
  app.set('query parser', 'simple');

  // APP_URL is what browsers see: https there means every cookie is Secure, whatever the hop to us.
  const tls = config.appUrl.startsWith('https:');
  const pool = calc ?? createCalcPool(config);
  const jobs = createJobRunner({ db, logger, handlers: { [SITE_SIZING]: siteSizingHandler({ db, calc: pool }) } });
  const deps: Deps = {
    db,
    mailer,
    config,
    logger,
    limiters: createLimiters(config),
    calc: pool,
    jobs,
    secureCookies: tls,
    now,
  };
  // Register reminders: started by server/index.ts (tests drive tick() themselves).
  const reminders = createReminderScheduler({ db, mailer, config, logger, now });

  app.use(requestId);
  app.use(securityHeaders({ scriptHashes: inlineScriptHashes(config.distDir), tls }));
  // API answers are per caller (sessions, team data): no shared or browser cache keeps them.
  app.use('/api', (_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });

  const isCalculation = (req: Request) => req.path === CALCULATIONS;
  // Batches of cases may be large; everything else stays small.
  const bigJson = express.json({ limit: '12mb' });
  const smallJson = express.json({ limit: '100kb' });
  app.use('/api', (req, res, next) => (isCalculation(req) ? bigJson : smallJson)(req, res, next));
  app.use('/api', boundJsonDepth());

  // Calculations are stateless: no session, no CSRF token.
  const exceptCalculations =
    (handler: RequestHandler): RequestHandler =>
    (req, res, next) =>
      isCalculation(req) ? next() : handler(req, res, next);
  const sessions = sessionMiddleware(deps, { secureCookies: tls });
  app.use('/api', exceptCalculations(sessions.middleware));
  app.use('/api', exceptCalculations(loadSessionCaller(deps)));
  app.use('/api', csrfProtection({ appOrigin: new URL(config.appUrl).origin, secret: config.sessionSecret, secureCookies: tls, exempt: isCalculation }));

  const api = express.Router();
  registerHealthRoutes(api, deps);
  registerAuthRoutes(api, deps);
  registerInvitationRoutes(api, deps);
  registerTeamRoutes(api, deps);
  registerMeRoutes(api, deps);
  registerSiteRoutes(api, deps);
  registerLibraryRoutes(api, deps);
  registerLineRoutes(api, deps);
  registerSizingRoutes(api, deps);
  registerRegisterRoutes(api, deps, reminders.poke);
  registerRevisionRoutes(api, deps);
  registerReportRoutes(api, deps);
  registerDevMailRoutes(api, deps);
  registerCalculationRoutes(api, deps);
  app.use(api);
  app.use('/api', (_req, _res, next) => next(errors.notFound('The API route')));
  app.locals.apiRouter = api;
  app.locals.calc = deps.calc;
  app.locals.jobs = jobs;
  app.locals.reminders = reminders;
  app.locals.close = async () => {
    await jobs.stop();
    await reminders.stop();
    sessions.close();
    await deps.calc.close();
  };

  mountWebApp(app, config.distDir);
  app.use(errorHandler(logger));
  return app;
}
