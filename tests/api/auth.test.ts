import request from 'supertest';
import { isPastAbsoluteTimeout } from '../../server/auth/auth.service';
import { loadConfig } from '../../server/config';
import demo from '../../seeds/demo-credentials.json';
import type { LaglineApp } from '../../server/app';
import { type ApiContext, createApiContext, signUpOwner, STRONG_PASSWORD, uniqueEmail } from '../helpers/api';

jest.setTimeout(60_000);

let ctx: ApiContext;
beforeAll(async () => {
  ctx = await createApiContext();
});
afterAll(async () => {
  await ctx.close();
});

const cookieNamed = (res: request.Response, name: string): string | undefined =>
  ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith(`${name}=`));
const sidCookie = (res: request.Response): string | undefined => cookieNamed(res, 'lagline.sid')?.split(';')[0];

type Jar = { jar: { getCookie: (n: string, o: unknown) => { value: string } | undefined } };
/** The session cookie a supertest agent holds, as a Cookie header value. */
const agentSid = (agent: unknown) =>
  `lagline.sid=${(agent as Jar).jar.getCookie('lagline.sid', { domain: '127.0.0.1', path: '/', secure: false, script: false })!.value}`;

/**
 * Visits the sign-in form and signs in with raw cookie headers (a supertest agent keeps no Secure
 * cookie over plain HTTP), returning both Set-Cookie lines as sent.
 */
async function signInByHand(app: Parameters<typeof request>[0], email: string, headers: Record<string, string> = {}) {
  const visit = await request(app).get('/api/v1/auth/session').set(headers).expect(200);
  const visitor = cookieNamed(visit, 'lagline.csrf')!;
  expect(visitor).toBeDefined();
  const signin = await request(app)
    .post('/api/v1/auth/signin')
    .set(headers)
    .set('Cookie', visitor.split(';')[0])
    .set('X-CSRF-Token', visit.body.csrfToken)
    .send({ email, password: STRONG_PASSWORD });
  const session = cookieNamed(signin, 'lagline.sid')!;
  return { visitor, session, signedIn: signin.status === 200 && !!session, csrf: signin.body.csrfToken as string };
}

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

  it('when someone signs in on a planted session id, then the session id changes and the planted id is not signed in (no fixation)', async () => {
    const { email } = await signUpOwner(ctx);
    // An attacker's own signed-in session id, planted in the victim's browser.
    const attacker = await signUpOwner(ctx);
    const planted = agentSid(attacker.agent);
    const first = await request(ctx.app).get('/api/v1/auth/session').set('Cookie', planted).expect(200);
    expect(first.body.user.email).toBe(attacker.email);
    const signin = await request(ctx.app)
      .post('/api/v1/auth/signin')
      .set('Cookie', planted)
      .set('X-CSRF-Token', first.body.csrfToken)
      .send({ email, password: STRONG_PASSWORD })
      .expect(200);
    const after = sidCookie(signin)!;
    expect(after).toBeDefined();
    expect(after).not.toBe(planted);
    expect(signin.body.csrfToken).not.toBe(first.body.csrfToken);
    const withOld = await request(ctx.app).get('/api/v1/auth/session').set('Cookie', planted).expect(200);
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

  it('when the session and visitor cookies are set over plain HTTP, then they are httpOnly, SameSite=Lax and not Secure', async () => {
    const { email } = await signUpOwner(ctx);
    const { visitor, session } = await signInByHand(ctx.app, email);
    for (const raw of [visitor, session]) {
      expect(raw).toMatch(/HttpOnly/i);
      expect(raw).toMatch(/SameSite=Lax/i);
      expect(raw).not.toMatch(/Secure/i);
    }
    expect(session).toMatch(/^lagline\.sid=/);
  });

  it('when the request arrives over HTTPS through a trusted proxy, then the cookies are Secure', async () => {
    const { email } = await signUpOwner(ctx);
    const app = ctx.restart({ trustProxy: 1 });
    const { visitor, session } = await signInByHand(app, email, { 'X-Forwarded-Proto': 'https' });
    expect(visitor).toMatch(/;\s*Secure/i);
    expect(session).toMatch(/;\s*Secure/i);
  });

  it('when APP_URL is https, then the cookies are Secure whether or not a proxy is trusted or says how it was reached', async () => {
    const { email } = await signUpOwner(ctx);
    const variants: [Partial<typeof ctx.config>, Record<string, string>][] = [
      [{ appUrl: 'https://lagline.example', trustProxy: false }, {}],
      [{ appUrl: 'https://lagline.example', trustProxy: 1 }, {}],
      [{ appUrl: 'https://lagline.example', trustProxy: 1 }, { 'X-Forwarded-Proto': 'http' }],
    ];
    for (const [config, headers] of variants) {
      const app = ctx.restart(config);
      const { visitor, session, signedIn, csrf } = await signInByHand(app, email, headers);
      expect(signedIn).toBe(true);
      expect(visitor).toMatch(/;\s*Secure/i);
      expect(session).toMatch(/;\s*Secure/i);
      // Signing out clears the cookie with the same attributes.
      const out = await request(app)
        .post('/api/v1/auth/signout')
        .set(headers)
        .set('Cookie', session.split(';')[0])
        .set('X-CSRF-Token', csrf)
        .expect(204);
      expect(cookieNamed(out, 'lagline.sid')).toMatch(/;\s*Secure/i);
    }
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

describe('sign-up limits', () => {
  const signUp = async (app: LaglineApp, email: string, password = STRONG_PASSWORD) => {
    const visitor = await ctx.agent(app);
    return visitor.post('/api/v1/auth/signup').set('X-CSRF-Token', visitor.csrf).send({ name: 'Flood', email, password, teamName: 'Flood team' });
  };

  it('when one client signs up again and again, then successful sign-ups are limited and answer 429 in the error shape', async () => {
    const app = ctx.restart({ rateLimits: { ...ctx.config.rateLimits, signup: { windowMs: 60_000, limit: 2 } } });
    const statuses = [];
    for (let i = 0; i < 4; i++) statuses.push((await signUp(app, uniqueEmail('flood'))).status);
    expect(statuses).toEqual([201, 201, 429, 429]);
    const last = await signUp(app, uniqueEmail('flood'));
    expect(last.body).toEqual({ errors: [{ code: 'RATE_LIMITED', message: expect.any(String) }] });
  });

  it('when sign-ups are refused many times, then they do not count as successes and sign-in from the same client is not locked', async () => {
    const { email } = await signUpOwner(ctx);
    const app = ctx.restart({
      rateLimits: { ...ctx.config.rateLimits, signin: { windowMs: 60_000, limit: 3 }, signup: { windowMs: 60_000, limit: 2 } },
    });
    for (let i = 0; i < 6; i++) {
      expect((await signUp(app, email)).status).toBe(409);
      expect((await signUp(app, uniqueEmail('weak'), 'password1234')).status).toBe(400);
    }
    const agent = await ctx.agent(app);
    await agent.post('/api/v1/auth/signin').set('X-CSRF-Token', agent.csrf).send({ email, password: STRONG_PASSWORD }).expect(200);
    // The refusals did not use up the successes either.
    expect((await signUp(app, uniqueEmail('fresh'))).status).toBe(201);
  });

  it('when a client keeps trying to sign up with refused details, then its attempts are limited too, apart from sign-in', async () => {
    const { email } = await signUpOwner(ctx);
    const app = ctx.restart({ rateLimits: { ...ctx.config.rateLimits, signupAttempts: { windowMs: 60_000, limit: 3 } } });
    const statuses = [];
    for (let i = 0; i < 5; i++) statuses.push((await signUp(app, email)).status);
    expect(statuses).toEqual([409, 409, 409, 429, 429]);
    const agent = await ctx.agent(app);
    await agent.post('/api/v1/auth/signin').set('X-CSRF-Token', agent.csrf).send({ email, password: STRONG_PASSWORD }).expect(200);
  });
});

describe('visitors', () => {
  const sessionCount = async () => Number((await ctx.db('sessions').count({ n: '*' }))[0].n);

  it('when visitors without a cookie look around, then no session row is stored, yet their token lets them sign in', async () => {
    const { email } = await signUpOwner(ctx);
    const before = await sessionCount();
    for (let i = 0; i < 5; i++) {
      const visit = await request(ctx.app).get('/api/v1/auth/session').expect(200);
      expect(visit.body).toMatchObject({ user: null, csrfToken: expect.any(String) });
      expect(sidCookie(visit)).toBeUndefined();
    }
    await request(ctx.app).get('/api/v1/health').expect(200);
    await request(ctx.app).get('/api/v1/sites').expect(401);
    const visitor = await ctx.agent();
    await visitor.get('/api/v1/auth/session').expect(200);
    await visitor.post('/api/v1/auth/password-reset').set('X-CSRF-Token', visitor.csrf).send({ email: uniqueEmail('nobody') }).expect(202);
    expect(await sessionCount()).toBe(before);

    await visitor.post('/api/v1/auth/signin').set('X-CSRF-Token', visitor.csrf).send({ email, password: STRONG_PASSWORD }).expect(200);
    expect(await sessionCount()).toBe(before + 1);
  });

  it('when the visitor token does not match its signed cookie, then state-changing requests are refused', async () => {
    const { email } = await signUpOwner(ctx);
    const visit = await request(ctx.app).get('/api/v1/auth/session').expect(200);
    const cookie = cookieNamed(visit, 'lagline.csrf')!.split(';')[0];
    const token = visit.body.csrfToken as string;
    const signIn = (cookieHeader: string | undefined, sent: string) => {
      const r = request(ctx.app).post('/api/v1/auth/signin');
      if (cookieHeader) r.set('Cookie', cookieHeader);
      return r.set('X-CSRF-Token', sent).send({ email, password: STRONG_PASSWORD });
    };
    // No cookie, someone else's token, a cookie whose signature was made up.
    expect((await signIn(undefined, token)).body.errors[0].code).toBe('CSRF_FAILED');
    const other = await request(ctx.app).get('/api/v1/auth/session');
    expect((await signIn(cookie, other.body.csrfToken)).status).toBe(403);
    expect((await signIn(`lagline.csrf=${token}.${'A'.repeat(43)}`, token)).status).toBe(403);
    expect((await signIn(cookie, token)).status).toBe(200);
  });

  it('when a visitor signs in, then the visitor token no longer works: the session has its own', async () => {
    const { email } = await signUpOwner(ctx);
    const agent = await ctx.agent();
    const visitorToken = agent.csrf;
    const res = await agent.post('/api/v1/auth/signin').set('X-CSRF-Token', visitorToken).send({ email, password: STRONG_PASSWORD }).expect(200);
    expect(res.body.csrfToken).not.toBe(visitorToken);
    const refused = await agent.post('/api/v1/sites').set('X-CSRF-Token', visitorToken).send({ name: 'With the old token' });
    expect(refused.status).toBe(403);
    expect(refused.body.errors[0].code).toBe('CSRF_FAILED');
    await agent.post('/api/v1/sites').set('X-CSRF-Token', res.body.csrfToken).send({ name: 'With the session token' }).expect(201);
  });

  it('when session rows have expired, then the expiry sweep deletes them and keeps live ones', async () => {
    const { userId } = await signUpOwner(ctx);
    const live = await ctx.db('sessions').whereRaw("JSON_VALUE(sess, '$.userId') = ?", [String(userId)]);
    expect(live).toHaveLength(1);
    const sid = `expired-${Date.now()}`;
    await ctx.db('sessions').insert({ sid, sess: JSON.stringify({ cookie: {}, userId }), expired: new Date(Date.now() - 60_000) });
    const app = ctx.restart({ sessionCleanupMs: 100 });
    try {
      const deadline = Date.now() + 10_000;
      while ((await ctx.db('sessions').where({ sid })).length && Date.now() < deadline) await new Promise((r) => setTimeout(r, 50));
      expect(await ctx.db('sessions').where({ sid })).toHaveLength(0);
      expect(await ctx.db('sessions').where({ sid: live[0].sid })).toHaveLength(1);
    } finally {
      await app.locals.close();
    }
  });
});

describe('strength of passwords', () => {
  const attempt = async (password: string, who: { name?: string; email?: string; teamName?: string } = {}) => {
    const agent = await ctx.agent();
    return agent
      .post('/api/v1/auth/signup')
      .set('X-CSRF-Token', agent.csrf)
      .send({ name: who.name ?? 'Pat Ferris', email: who.email ?? uniqueEmail(), password, teamName: who.teamName ?? 'Fernside Plant' });
  };

  it('when a password is a season and year, the product name with digits, or the user\'s own name plus a word, then 400 WEAK_PASSWORD', async () => {
    const weak = [
      'Summer2024!!',
      'lagline12345',
      'Lagline2024!',
      'Lagline-pipework',
      'PatFerris-kitchen',
      'pat ferris window',
      'ferris-kitchen-1',
      'Fernside-Plant-99',
      'Password1234567890!!',
    ];
    const accepted: string[] = [];
    for (const password of weak) {
      const res = await attempt(password);
      if (res.status !== 400 || res.body.errors[0].code !== 'WEAK_PASSWORD' || res.body.errors[0].field !== 'password') accepted.push(`${password} → ${res.status}`);
    }
    expect(accepted).toEqual([]);
  });

  it('when the same words belong to someone else, then they are an ordinary strong passphrase', async () => {
    // "ferris kitchen" is weak for Pat Ferris, not for a user whose name it is not.
    expect((await attempt('ferris-kitchen-71', { name: 'Quinn Abara', teamName: 'Northgate' })).status).toBe(201);
    expect((await attempt('ferris-kitchen-71', { name: 'Pat Ferris' })).status).toBe(400);
  });

  it('when passwords are the demo password, the tests\' and long passphrases, then they pass', async () => {
    for (const password of [demo.password, STRONG_PASSWORD, 'lantern-gravel-orchid-38', 'copper kettle drifts over seven quiet hills', 'correcthorsebatterystaplemoss']) {
      const res = await attempt(password);
      expect(`${password} → ${res.status}`).toBe(`${password} → 201`);
    }
  });

  it('when a password reset sets a password built on the user\'s team name, then it is refused as well', async () => {
    const { email } = await signUpOwner(ctx, { teamName: 'Quarrymoor Refinery' });
    const visitor = await ctx.agent();
    await visitor.post('/api/v1/auth/password-reset').set('X-CSRF-Token', visitor.csrf).send({ email }).expect(202);
    const mail = await ctx.mail.waitFor(email, { subject: /reset/i });
    const token = new URL(mail.text.match(/https?:\/\/\S+token=[A-Za-z0-9_-]+/)![0]).searchParams.get('token')!;
    const res = await visitor
      .post('/api/v1/auth/password-reset/confirm')
      .set('X-CSRF-Token', visitor.csrf)
      .send({ token, password: 'Quarrymoor-Refinery-2024' });
    expect(res.status).toBe(400);
    expect(res.body.errors[0]).toMatchObject({ code: 'WEAK_PASSWORD', field: 'password' });
  });
});

describe('caching', () => {
  it('when a signed-in user reads or writes, then every JSON answer says Cache-Control: no-store', async () => {
    const { agent, userId } = await signUpOwner(ctx);
    const site = await agent.post('/api/v1/sites').set('X-CSRF-Token', agent.csrf).send({ name: 'Cached?' }).expect(201);
    const answers: [string, request.Response][] = [
      ['GET /auth/session', await agent.get('/api/v1/auth/session')],
      ['GET /sites', await agent.get('/api/v1/sites')],
      ['GET /sites/:id', await agent.get(`/api/v1/sites/${site.body.site.id}`)],
      ['GET /team', await agent.get('/api/v1/team')],
      ['GET /me/settings', await agent.get('/api/v1/me/settings')],
      ['PATCH /me/settings', await agent.patch('/api/v1/me/settings').set('X-CSRF-Token', agent.csrf).send({ unitSystem: 'US' })],
      ['PATCH /team/members/:id', await agent.patch(`/api/v1/team/members/${userId}`).set('X-CSRF-Token', agent.csrf).send({ role: 'owner' })],
      ['POST /sites', site],
    ];
    for (const [name, res] of answers) {
      expect(res.headers['content-type']).toMatch(/application\/json/);
      expect(`${name}: ${res.headers['cache-control']}`).toBe(`${name}: no-store`);
    }
  });
});
