import type { Knex } from 'knex';
import request from 'supertest';
import { createApp, type LaglineApp } from '../../server/app';
import type { Config } from '../../server/config';
import { createMailer, type Mailer } from '../../server/mail/mailer';
import type { Role } from '../../shared/schemas/common';
import { createTestDatabase } from './test-db';
import { startTestMail, tokenFromMail, type TestMail } from './mail';
import { testConfig } from './test-config';

export type Agent = ReturnType<typeof request.agent> & { csrf: string };

export type ApiContext = {
  db: Knex;
  /** The test database's name (to open more handles on it). */
  dbName: string;
  config: Config;
  app: LaglineApp;
  mail: TestMail;
  mailer: Mailer;
  /** A new app on the same database and secret (a server restart, or a second process), optionally on another handle to it and with its own clock. */
  restart: (overrides?: Partial<Config>, opts?: { db?: Knex; now?: () => number }) => LaglineApp;
  /** A cookie-keeping client that has fetched its CSRF token. */
  agent: (app?: LaglineApp) => Promise<Agent>;
  close: () => Promise<void>;
};

/** supertest against createApp on a fresh database, with a mail catcher. */
export async function createApiContext(
  opts: { seed?: boolean; config?: Partial<Config>; env?: Record<string, string | undefined>; now?: () => number } = {},
): Promise<ApiContext> {
  const database = await createTestDatabase({ seed: opts.seed });
  const mail = await startTestMail(database.db);
  const config = testConfig(opts.config, opts.env);
  const mailer = createMailer({ mailFrom: config.mailFrom, smtp: { host: '127.0.0.1', port: mail.port } });
  const apps: LaglineApp[] = [];
  const make = (overrides: Partial<Config> = {}, appOpts: { db?: Knex; now?: () => number } = {}) => {
    const a = createApp({ db: appOpts.db ?? database.db, mailer, config: Object.freeze({ ...config, ...overrides }), now: appOpts.now ?? opts.now });
    apps.push(a);
    return a;
  };
  const app = make();
  const ctx: ApiContext = {
    db: database.db,
    dbName: database.name,
    config,
    app,
    mail,
    mailer,
    restart: make,
    agent: async (target = app) => {
      const agent = request.agent(target) as Agent;
      const res = await agent.get('/api/v1/auth/session').expect(200);
      agent.csrf = res.body.csrfToken;
      return agent;
    },
    close: async () => {
      for (const a of apps) await a.locals.close();
      mailer.close();
      await mail.close();
      await database.drop();
    },
  };
  return ctx;
}

let counter = 0;
/** A unique address for a test. */
export const uniqueEmail = (prefix = 'user') => `${prefix}.${Date.now().toString(36)}${(counter++).toString(36)}@example.test`;

export const STRONG_PASSWORD = 'amber-ledger-quarry-61';

/** Signs up a new owner with a new team; the agent holds the session and its new token. */
export async function signUpOwner(ctx: ApiContext, opts: { teamName?: string; email?: string } = {}) {
  const agent = await ctx.agent();
  const email = opts.email ?? uniqueEmail('owner');
  const res = await agent
    .post('/api/v1/auth/signup')
    .set('X-CSRF-Token', agent.csrf)
    .send({ name: 'Test Owner', email, password: STRONG_PASSWORD, teamName: opts.teamName ?? 'Test Team' })
    .expect(201);
  agent.csrf = res.body.csrfToken;
  return { agent, email, userId: res.body.user.id as number, teamId: res.body.team.id as number };
}

/** Invites someone with the role and accepts as a new user, returning their signed-in agent. */
export async function addMember(ctx: ApiContext, owner: Agent, role: Role) {
  const email = uniqueEmail(role);
  await owner.post('/api/v1/team/invitations').set('X-CSRF-Token', owner.csrf).send({ email, role }).expect(201);
  const mail = await ctx.mail.waitFor(email, { subject: /invited/i });
  const { token } = tokenFromMail(mail);
  const agent = await ctx.agent();
  const res = await agent
    .post(`/api/v1/invitations/${token}/accept`)
    .set('X-CSRF-Token', agent.csrf)
    .send({ name: `Test ${role}`, password: STRONG_PASSWORD })
    .expect(201);
  agent.csrf = res.body.csrfToken;
  return { agent, email, userId: res.body.user.id as number };
}
