/**
 * The session store failing for a moment (a lost connection, MariaDB restarting) must cost one 503,
 * never the user's session and never the client's keep-alive socket.
 */
import type { LaglineApp } from '../../server/app';
import { type ApiContext, createApiContext, STRONG_PASSWORD, uniqueEmail } from '../helpers/api';
import { createFaultyDb, type FaultyDb } from '../helpers/faulty-db';
import { listen, RawClient, type RawResult } from '../helpers/raw-http';

jest.setTimeout(60_000);

let ctx: ApiContext;
let faulty: FaultyDb;
let app: LaglineApp;
let server: Awaited<ReturnType<typeof listen>>;
const clients: RawClient[] = [];

beforeAll(async () => {
  ctx = await createApiContext();
  faulty = createFaultyDb(ctx.dbName);
  app = ctx.restart({}, { db: faulty.db });
  server = await listen(app);
});
afterAll(async () => {
  for (const c of clients) c.close();
  await server.close();
  await app.locals.close();
  await faulty.destroy();
  await ctx.close();
});

/** A signed-in user on its own keep-alive socket. */
async function signedInClient(): Promise<{ client: RawClient; userId: number }> {
  const client = new RawClient(server.url, 10_000);
  clients.push(client);
  await client.request('GET', '/api/v1/auth/session');
  const res = await client.request('POST', '/api/v1/auth/signup', { name: 'Store Tester', email: uniqueEmail('store'), password: STRONG_PASSWORD, teamName: 'Store Team' });
  expect(res.status).toBe(201);
  return { client, userId: (res.json as { user: { id: number } }).user.id };
}

const sessionRows = async (userId: number) => ctx.db('sessions').whereRaw("JSON_VALUE(sess, '$.userId') = ?", [String(userId)]);

const expectServiceUnavailable = (res: RawResult) => {
  expect(res.error).toBeUndefined();
  expect(res.status).toBe(503);
  expect(res.json).toEqual({ errors: [{ code: 'SERVICE_UNAVAILABLE', message: expect.any(String) }] });
};

describe('a failing session store', () => {
  it('when the session read fails once, then one 503 in the error shape, the session is kept and the same socket answers next', async () => {
    const { client, userId } = await signedInClient();
    expect((await client.request('GET', '/api/v1/sites')).status).toBe(200);
    const rowsBefore = await sessionRows(userId);
    expect(rowsBefore).toHaveLength(1);

    faulty.failNext(1);
    const failed = await client.request('GET', '/api/v1/sites');
    expectServiceUnavailable(failed);
    expect(failed.reusedSocket).toBe(true);

    const after = await client.request('GET', '/api/v1/sites');
    expect(after.error).toBeUndefined();
    expect(after.status).toBe(200);
    expect(after.reusedSocket).toBe(true);
    expect((await sessionRows(userId)).map((r) => r.sid)).toEqual(rowsBefore.map((r) => r.sid));
  });

  it('when the store stays down for the read and whatever would follow it, then still one clean 503 and nobody is signed out', async () => {
    const { client, userId } = await signedInClient();
    faulty.failNext(3);
    expectServiceUnavailable(await client.request('PATCH', '/api/v1/me/settings', { unitSystem: 'US' }));
    faulty.failNext(0);
    const me = await client.request('GET', '/api/v1/auth/session');
    expect(me.error).toBeUndefined();
    expect(me.reusedSocket).toBe(true);
    expect((me.json as { user: { id: number } | null }).user?.id).toBe(userId);
    expect((me.json as { settings: { unitSystem: string } }).settings.unitSystem).toBe('SI');
    expect(await sessionRows(userId)).toHaveLength(1);
  });

  it('when the connection is lost after the session was read (loading the member), then 503 and the session is kept', async () => {
    const { client, userId } = await signedInClient();
    faulty.failNext(1, { skip: 1 });
    expectServiceUnavailable(await client.request('GET', '/api/v1/team'));
    const again = await client.request('GET', '/api/v1/team');
    expect(again.status).toBe(200);
    expect(again.reusedSocket).toBe(true);
    expect(await sessionRows(userId)).toHaveLength(1);
  });

  it('when signing out while the store fails, then 503 and still signed in; signing out again destroys the session', async () => {
    const { client, userId } = await signedInClient();
    faulty.failNext(1, { skip: 2 });
    const failed = await client.request('POST', '/api/v1/auth/signout');
    expectServiceUnavailable(failed);
    expect(await sessionRows(userId)).toHaveLength(1);
    expect((await client.request('GET', '/api/v1/sites')).status).toBe(200);

    const out = await client.request('POST', '/api/v1/auth/signout');
    expect(out.status).toBe(204);
    expect(await sessionRows(userId)).toHaveLength(0);
    expect((await client.request('GET', '/api/v1/sites')).status).toBe(401);
  });

  it('when the database is unreachable while an app starts, then sessions work once it is back', async () => {
    faulty.failNext(1);
    const late = ctx.restart({}, { db: faulty.db });
    const lateServer = await listen(late);
    try {
      const client = new RawClient(lateServer.url, 10_000);
      clients.push(client);
      await client.request('GET', '/api/v1/auth/session');
      const email = uniqueEmail('late');
      expect((await client.request('POST', '/api/v1/auth/signup', { name: 'Late Starter', email, password: STRONG_PASSWORD, teamName: 'Late Team' })).status).toBe(201);
      const me = await client.request('GET', '/api/v1/auth/session');
      expect((me.json as { user: { email: string } }).user.email).toBe(email);
    } finally {
      await lateServer.close();
      await late.locals.close();
    }
  });
});
