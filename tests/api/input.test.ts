import request from 'supertest';
import { type Agent, type ApiContext, createApiContext, signUpOwner } from '../helpers/api';

jest.setTimeout(60_000);

let ctx: ApiContext;
let owner: Agent;
let siteId: number;
beforeAll(async () => {
  ctx = await createApiContext();
  owner = (await signUpOwner(ctx)).agent;
  siteId = (await owner.post('/api/v1/sites').set('X-CSRF-Token', owner.csrf).send({ name: 'Input site' }).expect(201)).body.site.id;
});
afterAll(async () => {
  await ctx.close();
});

const post = (path: string, body: unknown) => owner.post(path).set('X-CSRF-Token', owner.csrf).send(body as object);

describe('bad input', () => {
  it('when the body is malformed JSON, then 400 INVALID_JSON in the error shape', async () => {
    const res = await owner.post('/api/v1/sites').set('X-CSRF-Token', owner.csrf).set('Content-Type', 'application/json').send('{"name": "x",');
    expect(res.status).toBe(400);
    expect(res.body).toEqual({ errors: [{ code: 'INVALID_JSON', message: expect.any(String) }] });
  });

  it('when an ordinary route gets more than 100 kB, then 413 PAYLOAD_TOO_LARGE', async () => {
    const res = await post('/api/v1/sites', { name: 'Big', description: 'x'.repeat(200_000) });
    expect(res.status).toBe(413);
    expect(res.body.errors[0].code).toBe('PAYLOAD_TOO_LARGE');
  });

  it('when a field has the wrong type, then 400 names the field', async () => {
    const res = await post('/api/v1/sites', { name: 42 });
    expect(res.status).toBe(400);
    expect(res.body.errors).toEqual([{ code: 'VALIDATION_FAILED', field: 'name', message: 'name must be text.' }]);
    const nested = await owner
      .patch(`/api/v1/sites/${siteId}`)
      .set('X-CSRF-Token', owner.csrf)
      .send({ designBases: { touch: { airTemperatureC: 'hot' } } });
    expect(nested.status).toBe(400);
    expect(nested.body.errors[0].field).toBe('designBases.touch.airTemperatureC');
  });

  it('when numbers are sent as strings, then they are refused rather than coerced', async () => {
    const res = await owner
      .patch(`/api/v1/sites/${siteId}`)
      .set('X-CSRF-Token', owner.csrf)
      .send({ designBases: { condensation: { airTemperatureC: '30', relativeHumidityPct: 80 } } });
    expect(res.status).toBe(400);
    expect(res.body.errors[0].field).toBe('designBases.condensation.airTemperatureC');
  });

  it('when unknown fields are sent, then 400 names each of them', async () => {
    const res = await post('/api/v1/sites', { name: 'Extra', colour: 'red', designBases: { touch: { airTemperatureC: 30, sparkle: 1 } } });
    expect(res.status).toBe(400);
    const fields = res.body.errors.map((e: { field: string }) => e.field);
    expect(fields).toEqual(expect.arrayContaining(['colour', 'designBases.touch.sparkle']));
  });

  it('when a string is very long, then 400 names the field with its limit', async () => {
    const res = await post('/api/v1/sites', { name: 'n'.repeat(5000) });
    expect(res.status).toBe(400);
    expect(res.body.errors[0]).toMatchObject({ field: 'name', message: expect.stringMatching(/at most 120/) });
    const mail = await post('/api/v1/team/invitations', { email: `${'a'.repeat(300)}@example.test`, role: 'viewer' });
    expect(mail.status).toBe(400);
    expect(mail.body.errors[0].field).toBe('email');
  });

  it('when a value is out of range or not in its list, then 400 names the field', async () => {
    const role = await post('/api/v1/team/invitations', { email: 'someone@example.test', role: 'admin' });
    expect(role.body.errors[0].field).toBe('role');
    const rh = await owner
      .patch(`/api/v1/sites/${siteId}`)
      .set('X-CSRF-Token', owner.csrf)
      .send({ designBases: { condensation: { airTemperatureC: 30, relativeHumidityPct: 140 } } });
    expect(rh.status).toBe(400);
    expect(rh.body.errors[0].field).toBe('designBases.condensation.relativeHumidityPct');
  });

  it('when a JSON body is not an object, then 400 VALIDATION_FAILED', async () => {
    for (const body of [[1, 2], 'text', 7, null]) {
      const res = await owner.post('/api/v1/sites').set('X-CSRF-Token', owner.csrf).set('Content-Type', 'application/json').send(JSON.stringify(body));
      expect(res.status).toBe(400);
    }
  });

  it('when any writing route gets hostile bodies, then it never answers 500', async () => {
    const hostile: unknown[] = [
      null,
      [],
      'x',
      0,
      { name: null },
      { name: ['a'] },
      { name: { $gt: '' } },
      { email: 'a@b.c', password: { toString: 1 } },
      { role: 'owner', email: 'x'.repeat(100_000 / 2) },
      { __proto__: { admin: true }, name: 'proto' },
      { constructor: { prototype: { x: 1 } } },
      { name: '\u0000\uFFFF\uD800', description: '💥'.repeat(500) },
      { designBases: [] },
      { designBases: { touch: null } },
      { unitSystem: ['SI'] },
      { token: 'x'.repeat(500), password: 'y' },
      { userId: -1 },
      { userId: 1.5 },
      { userId: '1' },
      JSON.parse('{"a":' + '['.repeat(500) + ']'.repeat(500) + '}'),
    ];
    const targets: [string, string][] = [
      ['post', '/api/v1/auth/signup'],
      ['post', '/api/v1/auth/signin'],
      ['post', '/api/v1/auth/password-reset'],
      ['post', '/api/v1/auth/password-reset/confirm'],
      ['post', '/api/v1/invitations/abcdefghijklmnopqrstuvwxyz012345/accept'],
      ['post', '/api/v1/team/invitations'],
      ['patch', '/api/v1/team/members/1'],
      ['patch', '/api/v1/me/settings'],
      ['post', '/api/v1/sites'],
      ['patch', `/api/v1/sites/${siteId}`],
      ['post', `/api/v1/sites/${siteId}/members`],
      ['post', '/api/v1/calculations'],
    ];
    const failures: string[] = [];
    for (const [method, path] of targets) {
      for (const body of hostile) {
        const res = await (owner as unknown as Record<string, (p: string) => request.Test>)[method](path)
          .set('X-CSRF-Token', owner.csrf)
          .set('Content-Type', 'application/json')
          .send(JSON.stringify(body));
        if (res.status >= 500) failures.push(`${method} ${path} ${JSON.stringify(body).slice(0, 60)} → ${res.status}`);
        if (res.status >= 400) expect(Array.isArray(res.body.errors)).toBe(true);
      }
    }
    expect(failures).toEqual([]);
  }, 60_000);
});

describe('request ids and unexpected errors', () => {
  it('when a request carries X-Request-Id, then the answer echoes it; otherwise one is made', async () => {
    const given = await request(ctx.app).get('/api/v1/health').set('X-Request-Id', 'trace-123');
    expect(given.headers['x-request-id']).toBe('trace-123');
    const made = await request(ctx.app).get('/api/v1/health');
    expect(made.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
  });

  it('when the database connection is lost or too slow mid-request, then 503 SERVICE_UNAVAILABLE, never 500', async () => {
    const { errorHandler } = await import('../../server/errors');
    const { DatabaseTimeoutError } = await import('../../server/db/db');
    const express = (await import('express')).default;
    const lost: unknown[] = [
      Object.assign(new Error('write EPIPE'), { code: 'EPIPE' }),
      Object.assign(new Error('read ECONNRESET'), { code: 'ECONNRESET' }),
      Object.assign(new Error('Connection lost: The server closed the connection.'), { code: 'PROTOCOL_CONNECTION_LOST', fatal: true }),
      // mysql2, for a query on a connection that has been closed (no code, only `fatal`).
      Object.assign(new Error("Can't add new command when connection is in closed state"), { fatal: true }),
      Object.assign(new Error('Server shutdown in progress'), { code: 'ER_SERVER_SHUTDOWN', errno: 1053 }),
      Object.assign(new Error('Connection was killed'), { code: 'ER_CONNECTION_KILLED', errno: 1927 }),
      new DatabaseTimeoutError(5000),
    ];
    const app = express();
    app.get('/fail/:i', (req) => {
      throw lost[Number(req.params.i)];
    });
    app.use(errorHandler({ info: () => undefined, error: () => undefined }));
    for (let i = 0; i < lost.length; i++) {
      const res = await request(app).get(`/fail/${i}`);
      expect(`${i}: ${res.status}`).toBe(`${i}: 503`);
      expect(res.body).toEqual({ errors: [{ code: 'SERVICE_UNAVAILABLE', message: expect.any(String) }] });
    }
  });

  it('when a handler throws something unexpected, then the client gets only the generic message and the request id is logged', async () => {
    const { errorHandler } = await import('../../server/errors');
    const express = (await import('express')).default;
    const logged: unknown[][] = [];
    const app = express();
    app.use((req, _res, next) => {
      req.id = 'rid-42';
      next();
    });
    app.get('/boom', () => {
      throw new Error('secret internals');
    });
    app.use(errorHandler({ info: () => undefined, error: (...a) => logged.push(a) }));
    const res = await request(app).get('/boom');
    expect(res.status).toBe(500);
    expect(res.body).toEqual({ errors: [{ code: 'INTERNAL', message: 'An unexpected error occurred.' }] });
    expect(JSON.stringify(res.body)).not.toContain('secret');
    expect(String(logged[0][0])).toContain('rid-42');
  });
});
