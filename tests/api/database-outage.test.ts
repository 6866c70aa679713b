/**
 * MariaDB stopped, restarted and frozen while signed-in users read and write. Every request gets a
 * complete HTTP answer (its result, or a 503 in the error shape) on its keep-alive socket, nobody is
 * signed out once the database is back, and nothing is half written. The test runs a MariaDB of its
 * own (scripts/db.sh on its own port and data folder), never the shared test instance.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import type { Knex } from 'knex';
import { createApp, type LaglineApp } from '../../server/app';
import { createDb } from '../../server/db/db';
import { STRONG_PASSWORD, uniqueEmail } from '../helpers/api';
import { startOwnMariaDb, type OwnMariaDb } from '../helpers/own-mariadb';
import { listen, RawClient, type RawResult } from '../helpers/raw-http';
import { testConfig } from '../helpers/test-config';
import { createTestDatabase, testDbSettings, type TestDatabase } from '../helpers/test-db';

jest.setTimeout(180_000);

/** Short, so an outage is felt in seconds; the product's default is 5 s. */
const DB_TIMEOUT_MS = 1000;
const quiet = { warn: () => undefined, error: () => undefined, debug: () => undefined, deprecate: () => undefined };

type Phase = 'before' | 'stopped' | 'restarted' | 'frozen' | 'thawed';
type Outcome = RawResult & { who: string; phase: Phase };
type User = { tag: string; client: RawClient; userId: number; siteId: number; created: number[] };

let own: OwnMariaDb;
let database: TestDatabase;
let appDb: Knex;
let app: LaglineApp;
let server: Awaited<ReturnType<typeof listen>>;
const clients: RawClient[] = [];

beforeAll(async () => {
  own = await startOwnMariaDb();
  database = await createTestDatabase({ port: own.port, quiet: true });
  const s = testDbSettings(own.port);
  const config = testConfig({ dbTimeoutMs: DB_TIMEOUT_MS, db: { host: s.host, port: own.port, name: database.name, user: s.user, password: s.password } });
  appDb = createDb(config, { log: quiet });
  app = createApp({ db: appDb, mailer: { send: async () => undefined, close: () => undefined }, config });
  server = await listen(app);
}, 120_000);

afterAll(async () => {
  for (const c of clients) c.close();
  await server?.close();
  await app?.locals.close();
  await appDb?.destroy();
  own?.resume();
  await database?.drop().catch(() => undefined);
  await own?.destroy();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function until(what: string, condition: () => boolean, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!condition()) {
    if (Date.now() > deadline) throw new Error(`Gave up waiting: ${what}`);
    await sleep(25);
  }
}

async function signedInUser(tag: string): Promise<User> {
  const client = new RawClient(server.url, 15_000);
  clients.push(client);
  await client.request('GET', '/api/v1/auth/session');
  const signup = await client.request('POST', '/api/v1/auth/signup', { name: `Outage ${tag}`, email: uniqueEmail(tag), password: STRONG_PASSWORD, teamName: `Team ${tag}` });
  expect(signup.status).toBe(201);
  const site = await client.request('POST', '/api/v1/sites', { name: `Home of ${tag}` });
  expect(site.status).toBe(201);
  return {
    tag,
    client,
    userId: (signup.json as { user: { id: number } }).user.id,
    siteId: (site.json as { site: { id: number } }).site.id,
    created: [],
  };
}

describe('a database outage under load', () => {
  it('when MariaDB stops, restarts and freezes while users read and write, then every request is answered, nobody is signed out and nothing is half written', async () => {
    const users = await Promise.all(['ash', 'birch', 'cedar'].map(signedInUser));
    const sidsBefore = await database.db('sessions').select('sid').orderBy('sid');
    const visitor = new RawClient(server.url, 15_000);
    clients.push(visitor);
    await visitor.request('GET', '/api/v1/health');

    const outcomes: Outcome[] = [];
    const signedUp: string[] = [];
    let phase: Phase = 'before';
    let running = true;

    const readAndWrite = async (u: User) => {
      for (let i = 0; running; i++) {
        const at = phase;
        let r: RawResult;
        switch (i % 5) {
          case 0:
            r = await u.client.request('GET', '/api/v1/sites');
            break;
          case 1:
            r = await u.client.request('POST', '/api/v1/sites', { name: `Site ${u.tag} ${i}` });
            if (r.status === 201) u.created.push((r.json as { site: { id: number } }).site.id);
            break;
          case 2:
            r = await u.client.request('PATCH', '/api/v1/me/settings', { unitSystem: i % 2 ? 'US' : 'SI' });
            break;
          case 3:
            r = await u.client.request('PATCH', `/api/v1/sites/${u.siteId}`, { description: `Revision ${i}` });
            break;
          default:
            r = await u.client.request('GET', '/api/v1/auth/session');
        }
        outcomes.push({ ...r, who: u.tag, phase: at });
        await sleep(10);
      }
    };
    // Sign-ups write a user, a team, a membership, settings and an audit row together.
    const signUps = async () => {
      for (let i = 0; running; i++) {
        const at = phase;
        visitor.cookies.clear();
        const visit = await visitor.request('GET', '/api/v1/auth/session');
        outcomes.push({ ...visit, who: 'visitor', phase: at });
        const email = uniqueEmail('joiner');
        const r = await visitor.request('POST', '/api/v1/auth/signup', { name: 'Joiner', email, password: STRONG_PASSWORD, teamName: `Joiners ${i}` });
        outcomes.push({ ...r, who: 'visitor', phase: at });
        if (r.status === 201) signedUp.push(email);
        await sleep(30);
      }
    };

    const ok = (p: Phase, who?: string) => outcomes.filter((o) => o.phase === p && o.status >= 200 && o.status < 300 && (!who || o.who === who)).length;
    const unavailable = (p: Phase) => outcomes.filter((o) => o.phase === p && o.status === 503).length;
    const everyoneServed = (p: Phase) => users.every((u) => ok(p, u.tag) >= 3) && ok(p, 'visitor') >= 2;

    const load = Promise.all([...users.map(readAndWrite), signUps()]);
    try {
      await until('requests served before the outage', () => everyoneServed('before'), 30_000);

      phase = 'stopped';
      await own.stop();
      await until('503s while MariaDB is down', () => unavailable('stopped') >= 4, 20_000);

      phase = 'restarted';
      await own.start();
      await until('requests served after the restart', () => everyoneServed('restarted'), 30_000);

      phase = 'frozen';
      own.pause();
      await until('503s while MariaDB is frozen', () => unavailable('frozen') >= 3, 30_000);

      phase = 'thawed';
      own.resume();
      await until('requests served after the freeze', () => everyoneServed('thawed'), 30_000);
    } finally {
      own.resume();
      running = false;
      await load;
    }

    const summary: Record<string, Record<number, number>> = {};
    for (const o of outcomes) ((summary[o.phase] ??= {})[o.status] = (summary[o.phase][o.status] ?? 0) + 1);
    // Evidence beside the assertions: answers per phase and status, and the slowest answer.
    mkdirSync('test-output', { recursive: true });
    writeFileSync('test-output/database-outage.json', JSON.stringify({ answersByPhase: summary, slowestMs: Math.round(Math.max(...outcomes.map((o) => o.ms))) }, null, 2));
    // Every request got a complete HTTP answer on the socket it started on.
    expect(outcomes.filter((o) => o.error).map((o) => `${o.phase} ${o.method} ${o.path}: ${o.error}`)).toEqual([]);
    expect(outcomes.filter((o) => !o.reusedSocket).map((o) => `${o.phase} ${o.method} ${o.path}`)).toEqual([]);
    // Each answer is its result or a clean 503; never a 500, a 401 or a refused token.
    const odd = outcomes.filter((o) => ![200, 201, 204, 503].includes(o.status));
    expect(odd.map((o) => `${o.phase} ${o.method} ${o.path} → ${o.status} ${o.text.slice(0, 120)}`)).toEqual([]);
    for (const o of outcomes.filter((x) => x.status === 503)) {
      expect(o.json).toEqual({ errors: [{ code: 'SERVICE_UNAVAILABLE', message: expect.any(String) }] });
    }
    expect(unavailable('stopped') + unavailable('frozen')).toBeGreaterThanOrEqual(7);

    // Nobody was signed out: the same sessions, each still its user's.
    expect(await database.db('sessions').whereIn('sid', sidsBefore.map((r) => r.sid)).select('sid').orderBy('sid')).toEqual(sidsBefore);
    for (const u of users) {
      const me = await u.client.request('GET', '/api/v1/auth/session');
      expect((me.json as { user: { id: number } | null }).user?.id).toBe(u.userId);
      expect((await u.client.request('GET', '/api/v1/sites')).status).toBe(200);
    }

    // Nothing half written.
    const db = database.db;
    const sitesWithoutOneAudit = await db('sites as s')
      .leftJoin('audit_log as a', function joinAudit() {
        this.on('a.target_id', '=', db.raw('CAST(s.id AS CHAR)')).andOn('a.action', '=', db.raw('?', ['site.created']));
      })
      .groupBy('s.id')
      .havingRaw('COUNT(a.id) <> 1')
      .select('s.id');
    expect(sitesWithoutOneAudit).toEqual([]);
    const siteIds = new Set((await db('sites').select('id')).map((r) => r.id as number));
    expect(users.flatMap((u) => u.created).filter((id) => !siteIds.has(id))).toEqual([]);
    const usersWithoutSettings = await db('users as u').leftJoin('user_settings as s', 's.user_id', 'u.id').whereNull('s.user_id').select('u.email');
    expect(usersWithoutSettings).toEqual([]);
    const usersWithoutTeam = await db('users as u').leftJoin('memberships as m', 'm.user_id', 'u.id').whereNull('m.user_id').select('u.email');
    expect(usersWithoutTeam).toEqual([]);
    const teamsWithoutOwner = await db('teams as t')
      .leftJoin('memberships as m', function joinOwner() {
        this.on('m.team_id', '=', 't.id').andOn('m.role', '=', db.raw('?', ['owner']));
      })
      .whereNull('m.id')
      .select('t.name');
    expect(teamsWithoutOwner).toEqual([]);
    const joined = await db('users').whereIn('email', signedUp).count({ n: '*' });
    expect(Number(joined[0].n)).toBe(signedUp.length);
  });
});
