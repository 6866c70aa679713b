import { api } from './client';
import { exportUrl, filterQuery, postForm } from './register';

function response(status: number, body: unknown): Response {
  const text = body === undefined ? '' : JSON.stringify(body);
  return {
    ok: status >= 200 && status < 300,
    status,
    headers: new Headers(),
    text: async () => text,
    clone() {
      return { json: async () => (text ? JSON.parse(text) : null) } as Response;
    },
  } as unknown as Response;
}

describe('register client', () => {
  afterEach(() => {
    jest.restoreAllMocks();
    api.setCsrfToken(null);
  });

  it('when filters are turned into a query, then empty ones are left out and the export keeps them', () => {
    expect(filterQuery({ siteId: '4', status: 'active', q: '' })).toBe('?siteId=4&status=active');
    expect(filterQuery({})).toBe('');
    expect(exportUrl('pdf', { verdict: 'fail', overdue: 'true' })).toBe('/api/v1/register/export.pdf?verdict=fail&overdue=true');
  });

  it('when a photo upload succeeds, then it was sent as multipart with the session token and answers ok', async () => {
    api.setCsrfToken('tok-1');
    const calls: RequestInit[] = [];
    const fetchFn = (async (_url: string, init: RequestInit) => {
      calls.push(init);
      return response(201, { entry: { id: 7 } });
    }) as unknown as typeof fetch;
    const form = new FormData();
    form.append('photos', new Blob(['x'], { type: 'image/jpeg' }), 'a.jpg');
    const result = await postForm<{ entry: { id: number } }>('/register/entries/7/photos', form, fetchFn);
    expect(result).toEqual({ kind: 'ok', data: { entry: { id: 7 } }, status: 201 });
    expect(calls[0].method).toBe('POST');
    expect((calls[0].headers as Record<string, string>)['X-CSRF-Token']).toBe('tok-1');
    // The browser sets the multipart boundary itself: no content type of ours.
    expect((calls[0].headers as Record<string, string>)['Content-Type']).toBeUndefined();
    expect(calls[0].body).toBe(form);
  });

  it('when the server refuses a photo, then the problem names its field', async () => {
    const fetchFn = (async () =>
      response(415, { errors: [{ code: 'UNSUPPORTED_PHOTO_TYPE', message: '"a.jpg" is not a JPEG, PNG or WebP image.', field: 'photos[0]' }] })) as unknown as typeof fetch;
    const result = await postForm('/sites/1/register', new FormData(), fetchFn);
    expect(result).toMatchObject({ kind: 'validation', code: 'UNSUPPORTED_PHOTO_TYPE', fieldErrors: { 'photos[0]': '"a.jpg" is not a JPEG, PNG or WebP image.' } });
  });

  it('when the session token has rotated, then a fresh one is fetched and the upload is sent once more', async () => {
    api.setCsrfToken('old');
    jest.spyOn(api, 'get').mockImplementation(async () => {
      api.setCsrfToken('new');
      return { kind: 'ok', data: { csrfToken: 'new' }, status: 200 };
    });
    const tokens: string[] = [];
    const answers = [response(403, { errors: [{ code: 'CSRF_FAILED', message: 'x' }] }), response(201, { entry: { id: 1 } })];
    const fetchFn = (async (_url: string, init: RequestInit) => {
      tokens.push((init.headers as Record<string, string>)['X-CSRF-Token']);
      return answers.shift()!;
    }) as unknown as typeof fetch;
    const result = await postForm('/sites/1/register', new FormData(), fetchFn);
    expect(result.kind).toBe('ok');
    expect(tokens).toEqual(['old', 'new']);
  });

  it('when the network fails, then the problem says so', async () => {
    const fetchFn = (async () => {
      throw new TypeError('Failed to fetch');
    }) as unknown as typeof fetch;
    await expect(postForm('/sites/1/register', new FormData(), fetchFn)).resolves.toMatchObject({ kind: 'network' });
  });
});
