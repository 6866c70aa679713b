import request from 'supertest';
import { isPastAbsoluteTimeout } from '../../server/auth/auth.service';
import { loadConfig } from '../../server/config';
import { type ApiContext, createApiContext, signUpOwner, STRONG_PASSWORD, uniqueEmail } from '../helpers/api';

jest.setTimeout(60_000);

let ctx: ApiContext;
beforeAll(async () => {
  ctx = await createApiContext();
});
afterAll(async () => {
  await ctx.close();
});

const sidCookie = (res: request.Response): string | undefined =>
  ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('lagline.sid='))?.split(';')[0];

describe('sign-up', () => {
  it('when a visitor signs up, then the team, the owner membership and a signed-in session exist', async () => {
    const { agent, email, teamId, userId } = await signUpOwner(ctx, { teamName: 'Fernside Plant' });
    const me = await agent.get('/api/v1/auth/session').expect(200);
    expect(me.body).toMatchObject({ user: { id: userId, email }, team: { id: teamId, name: 'Fernside Plant' }, role: 'owner', settings: { unitSystem: 'SI' } });
    const membership = await ctx.db('memberships').where({ team_id: teamId, user_id: userId }).first();
    expect(membership.role).toBe('owner');
  });

  it('when the address already has an account, then sign-up answers 409 naming email and creates no team', async () => {
    const { email } = await signUpOwner(ctx);
    const teamsBefore = (await ctx.db('teams').count({ n: '*' }))[0].n;
    const agent = await ctx.agent();
    const res = await agent
      .post('/api/v1/auth/signup')
      .set('X-CSRF-Token', agent.csrf)
      .send({ name: 'Again', email: email.toUpperCase(), password: STRONG_PASSWORD, teamName: 'Other' })
      .expect(409);
    expect(res.body.errors[0]).toMatchObject({ code: 'EMAIL_TAKEN', field: 'email' });
    expect((await ctx.db('teams').count({ n: '*' }))[0].n).toBe(teamsBefore);
  });
});

describe('passwords', () => {
  const attempt = async (password: string, email = uniqueEmail()) => {
    const agent = await ctx.agent();
    return agent.post('/api/v1/auth/signup').set('X-CSRF-Token', agent.csrf).send({ name: 'Pat', email, password, teamName: 'T' });
  };

  it('when the password is shorter than 12 characters, then 400 names the password field', async () => {
    const res = await attempt('Sh0rt-pass!');
    expect(res.status).toBe(400);
    expect(res.body.errors[0].field).toBe('password');
  });

  it('when the password is long enough but common, then 400 WEAK_PASSWORD names the password field', async () => {
    for (const weak of ['password1234', 'qwertyuiop123', 'aaaaaaaaaaaaaaaa']) {
      const res = await attempt(weak);
      expect(res.status).toBe(400);
      expect(res.body.errors[0]).toMatchObject({ code: 'WEAK_PASSWORD', field: 'password' });
    }
  });

  it('when the password contains the e-mail address, then it is refused as guessable', async () => {
    const email = 'quentin.harrowby@example.test';
    const res = await attempt('quentin.harrowby2026', email);
    expect(res.status).toBe(400);
    expect(res.body.errors[0].code).toBe('WEAK_PASSWORD');
  });

  it('when a passphrase is longer than 72 bytes, then every byte counts (a password sharing the first 72 bytes is wrong)', async () => {
    const email = uniqueEmail('long');
    const long = 'ember-slate-quarry-'.repeat(5) + 'end-one';
    expect(Buffer.byteLength(long)).toBeGreaterThan(72);
    expect((await attempt(long, email)).status).toBe(201);
    const a = await ctx.agent();
    await a.post('/api/v1/auth/signin').set('X-CSRF-Token', a.csrf).send({ email, password: long.slice(0, -3) + 'two' }).expect(401);
    const b = await ctx.agent();
    await b.post('/api/v1/auth/signin').set('X-CSRF-Token', b.csrf).send({ email, password: long }).expect(200);
  });

  it('when a password exceeds 256 characters, then 400 names the password field', async () => {
    const res = await attempt('x7!'.repeat(90));
    expect(res.status).toBe(400);
    expect(res.body.errors[0].field).toBe('password');
  });

  it('when the server starts with default settings, then bcrypt cost is 12 and stored hashes are bcrypt', async () => {
    expect(loadConfig({ NODE_ENV: 'test', SESSION_SECRET: 'x'.repeat(40) }).bcryptCost).toBe(12);
    const { email } = await signUpOwner(ctx);
    const row = await ctx.db('users').where({ email }).first();
    expect(row.password_hash).toMatch(/^\$2[aby]\$\d\d\$/);
    expect(row.password_hash).not.toContain(STRONG_PASSWORD);
  });
});

describe('sign-in', () => {
  it('when the password is wrong or the address unknown, then the answers are identical 401s', async () => {
    const { email } = await signUpOwner(ctx);
    const a = await ctx.agent();
    const wrong = await a.post('/api/v1/auth/signin').set('X-CSRF-Token', a.csrf).send({ email, password: 'not-the-password-at-all' });
    const b = await ctx.agent();
    const unknown = await b.post('/api/v1/auth/signin').set('X-CSRF-Token', b.csrf).send({ email: uniqueEmail('nobody'), password: 'not-the-password-at-all' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.errors[0].code).toBe('INVALID_CREDENTIALS');
  });

  it('when the address differs only in case and spaces, then sign-in still succeeds', async () => {
    const { email } = await signUpOwner(ctx);
    const a = await ctx.agent();
    const res = await a.post('/api/v1/auth/signin').set('X-CSRF-Token', a.csrf).send({ email: email.toUpperCase(), password: STRONG_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user.email).toBe(email);
  });

  it('when a visitor signs in, then the session id changes and the pre-sign-in id is not signed in (no fixation)', async () => {
    const { email } = await signUpOwner(ctx);
    const first = await request(ctx.app).get('/api/v1/auth/session').expect(200);
    const before = sidCookie(first)!;
    expect(before).toBeDefined();
    const signin = await request(ctx.app)
      .post('/api/v1/auth/signin')
      .set('Cookie', before)
      .set('X-CSRF-Token', first.body.csrfToken)
      .send({ email, password: STRONG_PASSWORD })
      .expect(200);
    const after = sidCookie(signin)!;
    expect(after).toBeDefined();
    expect(after).not.toBe(before);
    expect(signin.body.csrfToken).not.toBe(first.body.csrfToken);
    const withOld = await request(ctx.app).get('/api/v1/auth/session').set('Cookie', before).expect(200);
    expect(withOld.body.user).toBeNull();
    const withNew = await request(ctx.app).get('/api/v1/auth/session').set('Cookie', after).expect(200);
    expect(withNew.body.user.email).toBe(email);
  });

  it('when the server restarts (a new app on the same database), then the session survives', async () => {
    const { agent, email } = await signUpOwner(ctx);
    const res = await agent.get('/api/v1/auth/session');
    const cookie = (agent as unknown as { jar: { getCookie: (n: string, o: unknown) => { value: string } } }).jar.getCookie('lagline.sid', {
      domain: '127.0.0.1',
      path: '/',
      secure: false,
      script: false,
    });
    expect(res.body.user.email).toBe(email);
    const restarted = ctx.restart();
    const again = await request(restarted).get('/api/v1/auth/session').set('Cookie', `lagline.sid=${cookie.value}`).expect(200);
    expect(again.body.user.email).toBe(email);
  });

  it('when the session cookie is set, then it is httpOnly, SameSite=Lax and named lagline.sid', async () => {
    const res = await request(ctx.app).get('/api/v1/auth/session').expect(200);
    const raw = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('lagline.sid='))!;
    expect(raw).toMatch(/HttpOnly/i);
    expect(raw).toMatch(/SameSite=Lax/i);
    expect(raw).not.toMatch(/Secure/i);
  });

  it('when the request arrives over HTTPS through a trusted proxy, then the cookie is Secure', async () => {
    const app = ctx.restart({ trustProxy: 1 });
    const res = await request(app).get('/api/v1/auth/session').set('X-Forwarded-Proto', 'https').expect(200);
    const raw = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('lagline.sid='))!;
    expect(raw).toMatch(/Secure/i);
  });

  it('when sign-in fails repeatedly from one address, then it answers 429 RATE_LIMITED in the error shape', async () => {
    const app = ctx.restart({ rateLimits: { ...ctx.config.rateLimits, signin: { windowMs: 60_000, limit: 3 } } });
    const agent = await ctx.agent(app);
    const statuses: number[] = [];
    let last: request.Response | undefined;
    for (let i = 0; i < 5; i++) {
      last = await agent.post('/api/v1/auth/signin').set('X-CSRF-Token', agent.csrf).send({ email: 'flood@example.test', password: 'wrong-password-' + i });
      statuses.push(last.status);
    }
    expect(statuses).toEqual([401, 401, 401, 429, 429]);
    expect(last!.body).toEqual({ errors: [{ code: 'RATE_LIMITED', message: expect.any(String) }] });
  });
});

describe('sign-out and timeouts', () => {
  it('when a user signs out, then the session row is gone and the old cookie is anonymous', async () => {
    const { agent } = await signUpOwner(ctx);
    const sessionsBefore = Number((await ctx.db('sessions').count({ n: '*' }))[0].n);
    await agent.post('/api/v1/auth/signout').set('X-CSRF-Token', agent.csrf).expect(204);
    expect(Number((await ctx.db('sessions').count({ n: '*' }))[0].n)).toBe(sessionsBefore - 1);
    const me = await agent.get('/api/v1/auth/session').expect(200);
    expect(me.body.user).toBeNull();
    await agent.get('/api/v1/sites').expect(401);
  });

  it('when a session has been idle past its rolling max age, then it is no longer signed in', async () => {
    const { agent, userId } = await signUpOwner(ctx);
    await agent.get('/api/v1/sites').expect(200);
    await ctx.db('sessions').whereRaw("JSON_VALUE(sess, '$.userId') = ?", [String(userId)]).update({ expired: new Date(Date.now() - 1000) });
    await agent.get('/api/v1/sites').expect(401);
  });

  it('when a session is older than the absolute timeout, then it is ended even though it was active', async () => {
    const { agent, userId } = await signUpOwner(ctx);
    await agent.get('/api/v1/sites').expect(200);
    const old = Date.now() - ctx.config.sessionAbsoluteMs - 60_000;
    await ctx.db('sessions')
      .whereRaw("JSON_VALUE(sess, '$.userId') = ?", [String(userId)])
      .update({ sess: ctx.db.raw("JSON_SET(sess, '$.signedInAt', ?)", [old]) });
    await agent.get('/api/v1/sites').expect(401);
    const rows = await ctx.db('sessions').whereRaw("JSON_VALUE(sess, '$.userId') = ?", [String(userId)]);
    expect(rows).toHaveLength(0);
  });

  it('when checking the absolute timeout, then only sessions within the limit pass', () => {
    const now = 1_000_000_000_000;
    const limit = 7 * 24 * 3600_000;
    expect(isPastAbsoluteTimeout(now - limit + 1000, now, limit)).toBe(false);
    expect(isPastAbsoluteTimeout(now - limit - 1000, now, limit)).toBe(true);
    expect(isPastAbsoluteTimeout(undefined, now, limit)).toBe(true);
    expect(isPastAbsoluteTimeout(now + 3600_000, now, limit)).toBe(true);
  });
});

describe('CSRF', () => {
  it('when a state-changing request has no or a wrong X-CSRF-Token, then 403 CSRF_FAILED and nothing changes', async () => {
    const { agent, teamId } = await signUpOwner(ctx);
    const none = await agent.post('/api/v1/sites').send({ name: 'No token' });
    const wrong = await agent.post('/api/v1/sites').set('X-CSRF-Token', 'x'.repeat(43)).send({ name: 'Wrong token' });
    expect(none.status).toBe(403);
    expect(wrong.status).toBe(403);
    expect(none.body.errors[0].code).toBe('CSRF_FAILED');
    expect(await ctx.db('sites').where({ team_id: teamId })).toHaveLength(0);
    await agent.post('/api/v1/sites').set('X-CSRF-Token', agent.csrf).send({ name: 'With token' }).expect(201);
  });

  it('when the request comes from another origin or is marked cross-site, then it is refused even with the token', async () => {
    const { agent } = await signUpOwner(ctx);
    const evil = await agent.post('/api/v1/sites').set('X-CSRF-Token', agent.csrf).set('Origin', 'https://evil.example').send({ name: 'Evil' });
    expect(evil.status).toBe(403);
    const cross = await agent.post('/api/v1/sites').set('X-CSRF-Token', agent.csrf).set('Sec-Fetch-Site', 'cross-site').send({ name: 'Cross' });
    expect(cross.status).toBe(403);
    const same = await agent
      .post('/api/v1/sites')
      .set('X-CSRF-Token', agent.csrf)
      .set('Origin', ctx.config.appUrl)
      .set('Sec-Fetch-Site', 'same-origin')
      .send({ name: 'Same' });
    expect(same.status).toBe(201);
  });

  it('when signing in without the token, then it is refused (no login CSRF)', async () => {
    const { email } = await signUpOwner(ctx);
    const res = await request(ctx.app).post('/api/v1/auth/signin').send({ email, password: STRONG_PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body.errors[0].code).toBe('CSRF_FAILED');
  });
});

describe('settings', () => {
  it('when a user switches to US units, then the session payload and GET /me/settings say US', async () => {
    const { agent } = await signUpOwner(ctx);
    const patched = await agent.patch('/api/v1/me/settings').set('X-CSRF-Token', agent.csrf).send({ unitSystem: 'US' }).expect(200);
    expect(patched.body).toEqual({ unitSystem: 'US' });
    expect((await agent.get('/api/v1/me/settings').expect(200)).body).toEqual({ unitSystem: 'US' });
    expect((await agent.get('/api/v1/auth/session')).body.settings).toEqual({ unitSystem: 'US' });
    const bad = await agent.patch('/api/v1/me/settings').set('X-CSRF-Token', agent.csrf).send({ unitSystem: 'imperial' }).expect(400);
    expect(bad.body.errors[0].field).toBe('unitSystem');
  });
});
