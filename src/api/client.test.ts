import { createApiClient, problemMessage, shouldRetry, ApiProblemError, unwrap } from './client';

type Call = { url: string; init: RequestInit };

function jsonResponse(status: number, body: unknown, headers: Record<string, string> = {}): Response {
  const text = body === undefined ? '' : JSON.stringify(body);
  return {
    ok: status >= 200 && status < 300,
    status,
    headers: new Headers(headers),
    text: async () => text,
  } as unknown as Response;
}

function fakeFetch(...responses: (Response | Error)[]) {
  const calls: Call[] = [];
  const queue = [...responses];
  const fn = (async (url: string, init: RequestInit) => {
    calls.push({ url, init });
    const next = queue.shift();
    if (!next) throw new Error('no more fake responses');
    if (next instanceof Error) throw next;
    return next;
  }) as unknown as typeof fetch;
  return { fn, calls };
}

const errors = (code: string, message: string, field?: string) => ({ errors: [{ code, message, ...(field ? { field } : {}) }] });

describe('api client', () => {
  it('when the server answers 2xx, then the result is ok with the parsed body', async () => {
    const { fn, calls } = fakeFetch(jsonResponse(200, { sites: [{ id: 1, name: 'Boiler house' }] }));
    const client = createApiClient({ fetch: fn });

    const result = await client.get('/sites');

    expect(result).toEqual({ kind: 'ok', status: 200, data: { sites: [{ id: 1, name: 'Boiler house' }] } });
    expect(calls[0].url).toBe('/api/v1/sites');
    expect(calls[0].init.credentials).toBe('same-origin');
  });

  it('when a session payload arrives, then later state-changing requests carry its CSRF token', async () => {
    const { fn, calls } = fakeFetch(
      jsonResponse(200, { user: null, team: null, role: null, settings: null, csrfToken: 'tok-1' }),
      jsonResponse(204, undefined),
      jsonResponse(200, { sites: [] }),
    );
    const client = createApiClient({ fetch: fn });

    await client.get('/auth/session');
    await client.post('/auth/signout');
    await client.get('/sites');

    const sent = (i: number) => (calls[i].init.headers as Record<string, string>)['X-CSRF-Token'];
    expect(sent(1)).toBe('tok-1');
    expect(sent(2)).toBeUndefined();
    expect(client.getCsrfToken()).toBe('tok-1');
  });

  it('when the server answers 401, then the problem kind is unauthenticated with its message', async () => {
    const { fn } = fakeFetch(jsonResponse(401, errors('INVALID_CREDENTIALS', 'E-mail or password is wrong.')));
    const result = await createApiClient({ fetch: fn }).post('/auth/signin', { email: 'a@b.c', password: 'x' });
    expect(result).toMatchObject({ kind: 'unauthenticated', code: 'INVALID_CREDENTIALS', message: 'E-mail or password is wrong.' });
  });

  it('when the server answers 403, then the problem kind is forbidden', async () => {
    const { fn } = fakeFetch(jsonResponse(403, errors('FORBIDDEN', 'Owners only.')));
    const result = await createApiClient({ fetch: fn }).post('/team/invitations', {});
    expect(result).toMatchObject({ kind: 'forbidden', code: 'FORBIDDEN' });
  });

  it('when the server answers 404, then the problem kind is not-found', async () => {
    const { fn } = fakeFetch(jsonResponse(404, errors('NOT_FOUND', 'No such invitation.')));
    const result = await createApiClient({ fetch: fn }).get('/invitations/nope');
    expect(result).toMatchObject({ kind: 'not-found', message: 'No such invitation.' });
  });

  it('when the server answers 400 with field errors, then the problem is validation with each field message', async () => {
    const { fn } = fakeFetch(
      jsonResponse(400, {
        errors: [
          { code: 'VALIDATION_FAILED', message: 'Use at least 12 characters.', field: 'password' },
          { code: 'VALIDATION_FAILED', message: 'Enter an e-mail address.', field: 'email' },
        ],
      }),
    );
    const result = await createApiClient({ fetch: fn }).post('/auth/signup', {});
    expect(result.kind).toBe('validation');
    if (result.kind !== 'validation') throw new Error('unreachable');
    expect(result.fieldErrors).toEqual({ password: 'Use at least 12 characters.', email: 'Enter an e-mail address.' });
  });

  it('when the server answers 409 without a field, then the problem is validation with a general message', async () => {
    const { fn } = fakeFetch(jsonResponse(409, errors('CONFLICT', 'That address already has an account.')));
    const result = await createApiClient({ fetch: fn }).post('/auth/signup', {});
    expect(result).toMatchObject({ kind: 'validation', code: 'CONFLICT', message: 'That address already has an account.', fieldErrors: {} });
  });

  it('when the server answers 429, then the problem is rate-limited with the Retry-After seconds', async () => {
    const { fn } = fakeFetch(jsonResponse(429, errors('RATE_LIMITED', 'Slow down.'), { 'Retry-After': '42' }));
    const result = await createApiClient({ fetch: fn }).post('/auth/signin', {});
    expect(result).toMatchObject({ kind: 'rate-limited', retryAfterSeconds: 42 });
  });

  it('when the server answers 500, then the problem is server and hides the internals', async () => {
    const { fn } = fakeFetch(jsonResponse(500, errors('INTERNAL', 'stack trace at db.js:12')));
    const result = await createApiClient({ fetch: fn }).get('/team');
    expect(result).toMatchObject({ kind: 'server', status: 500 });
    if (result.kind !== 'server') throw new Error('unreachable');
    expect(result.message).not.toContain('db.js');
  });

  it('when fetch itself fails, then the problem is network', async () => {
    const { fn } = fakeFetch(new TypeError('Failed to fetch'));
    const result = await createApiClient({ fetch: fn }).get('/team');
    expect(result.kind).toBe('network');
    expect(problemMessage(result as never)).toMatch(/connection/);
  });

  it('when a write is refused for CSRF twice, then the problem is csrf after one refresh and retry', async () => {
    const { fn, calls } = fakeFetch(
      jsonResponse(403, errors('CSRF_FAILED', 'Missing or wrong CSRF token.')),
      jsonResponse(200, { user: null, team: null, role: null, settings: null, csrfToken: 'fresh' }),
      jsonResponse(403, errors('CSRF_FAILED', 'Missing or wrong CSRF token.')),
    );
    const result = await createApiClient({ fetch: fn }).post('/sites', { name: 'Tank farm' });
    expect(result.kind).toBe('csrf');
    expect(calls.map((c) => c.init.method)).toEqual(['POST', 'GET', 'POST']);
    expect((calls[2].init.headers as Record<string, string>)['X-CSRF-Token']).toBe('fresh');
  });

  it('when a write is refused for CSRF once, then the retry with a fresh token succeeds', async () => {
    const { fn } = fakeFetch(
      jsonResponse(403, errors('CSRF_FAILED', 'Missing or wrong CSRF token.')),
      jsonResponse(200, { user: null, team: null, role: null, settings: null, csrfToken: 'fresh' }),
      jsonResponse(201, { id: 7, name: 'Tank farm' }),
    );
    const result = await createApiClient({ fetch: fn }).post('/sites', { name: 'Tank farm' });
    expect(result).toMatchObject({ kind: 'ok', status: 201, data: { id: 7 } });
  });

  it('when a query fails with a 4xx problem, then unwrap throws it and no retry is attempted', () => {
    const problem = { kind: 'forbidden', code: 'FORBIDDEN', message: 'no' } as const;
    let thrown: unknown;
    try {
      unwrap(problem);
    } catch (e) {
      thrown = e;
    }
    expect(thrown).toBeInstanceOf(ApiProblemError);
    expect(shouldRetry(0, thrown)).toBe(false);
    expect(shouldRetry(0, new ApiProblemError({ kind: 'network', code: 'NETWORK', message: '' }))).toBe(true);
  });
});
