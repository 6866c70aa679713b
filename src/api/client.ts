/**
 * The one HTTP client of the app. Every call answers a result union instead of throwing, so screens
 * handle each problem on purpose: `{ kind: 'ok', data }` or one of the `ApiProblem` kinds below.
 */

export type FieldErrors = Record<string, string>;

export type ApiProblem =
  | { kind: 'unauthenticated'; code: string; message: string }
  | { kind: 'forbidden'; code: string; message: string }
  | { kind: 'not-found'; code: string; message: string }
  | { kind: 'validation'; code: string; message: string; fieldErrors: FieldErrors }
  | { kind: 'rate-limited'; code: string; message: string; retryAfterSeconds: number | null }
  | { kind: 'server'; code: string; message: string; status: number }
  | { kind: 'network'; code: 'NETWORK'; message: string }
  | { kind: 'csrf'; code: string; message: string };

export type ApiResult<T> = { kind: 'ok'; data: T; status: number } | ApiProblem;

export type ApiProblemKind = ApiProblem['kind'];

type ErrorItem = { code?: string; message?: string; field?: string };

export type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export interface ApiClientOptions {
  /** Prefix for every path; same origin by default. */
  baseUrl?: string;
  /** Injected for tests; defaults to the global fetch at call time (never at import time). */
  fetch?: typeof fetch;
}

const MUTATING: ReadonlySet<HttpMethod> = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** Wording shown when the server sent nothing useful. Ours, short, and says what to do. */
const fallbackMessages: Record<ApiProblemKind, string> = {
  unauthenticated: 'Please sign in to continue.',
  forbidden: 'Your role does not allow this. Ask a team owner if you need it.',
  'not-found': 'We could not find that. It may have been removed.',
  validation: 'Some fields need attention.',
  'rate-limited': 'Too many attempts. Wait a minute, then try again.',
  server: 'Something went wrong on our side. Try again in a moment.',
  network: 'We could not reach Lagline. Check your connection and try again.',
  csrf: 'Your session changed in another tab. Reload the page and try again.',
};

export function problemMessage(problem: ApiProblem): string {
  return problem.message || fallbackMessages[problem.kind];
}

async function readJson(response: Response): Promise<unknown> {
  if (response.status === 204) return null;
  const text = await response.text();
  if (!text) return null;
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

function errorItems(body: unknown): ErrorItem[] {
  if (body && typeof body === 'object' && Array.isArray((body as { errors?: unknown }).errors)) {
    return (body as { errors: ErrorItem[] }).errors.filter((e) => e && typeof e === 'object');
  }
  return [];
}

/** Turns a non-2xx answer into a problem; exported so tests can check the mapping directly. */
export function toProblem(status: number, body: unknown, headers?: Headers): ApiProblem {
  const items = errorItems(body);
  const first = items[0] ?? {};
  const code = first.code ?? `HTTP_${status}`;
  const message = first.message ?? '';
  if (code === 'CSRF_FAILED') return { kind: 'csrf', code, message: message || fallbackMessages.csrf };
  if (status === 401) return { kind: 'unauthenticated', code, message: message || fallbackMessages.unauthenticated };
  if (status === 403) return { kind: 'forbidden', code, message: message || fallbackMessages.forbidden };
  if (status === 404) return { kind: 'not-found', code, message: message || fallbackMessages['not-found'] };
  if (status === 429) {
    const retry = Number(headers?.get('retry-after'));
    return {
      kind: 'rate-limited',
      code,
      message: message || fallbackMessages['rate-limited'],
      retryAfterSeconds: Number.isFinite(retry) && retry > 0 ? retry : null,
    };
  }
  if (status >= 400 && status < 500) {
    const fieldErrors: FieldErrors = {};
    for (const item of items) {
      if (item.field && !(item.field in fieldErrors)) fieldErrors[item.field] = item.message ?? 'Check this field.';
    }
    const general = items.find((i) => !i.field)?.message;
    return { kind: 'validation', code, message: general ?? message ?? fallbackMessages.validation, fieldErrors };
  }
  return { kind: 'server', code, message: fallbackMessages.server, status };
}

export interface ApiClient {
  request<T>(method: HttpMethod, path: string, body?: unknown): Promise<ApiResult<T>>;
  get<T>(path: string): Promise<ApiResult<T>>;
  post<T>(path: string, body?: unknown): Promise<ApiResult<T>>;
  patch<T>(path: string, body?: unknown): Promise<ApiResult<T>>;
  del<T>(path: string): Promise<ApiResult<T>>;
  /** The CSRF token sent with state-changing requests; set from every session payload. */
  setCsrfToken(token: string | null): void;
  getCsrfToken(): string | null;
}

export function createApiClient(options: ApiClientOptions = {}): ApiClient {
  const baseUrl = options.baseUrl ?? '/api/v1';
  let csrfToken: string | null = null;

  async function send<T>(method: HttpMethod, path: string, body: unknown): Promise<ApiResult<T>> {
    const doFetch = options.fetch ?? globalThis.fetch;
    const headers: Record<string, string> = { Accept: 'application/json' };
    if (body !== undefined) headers['Content-Type'] = 'application/json';
    if (MUTATING.has(method) && csrfToken) headers['X-CSRF-Token'] = csrfToken;
    let response: Response;
    try {
      response = await doFetch(`${baseUrl}${path}`, {
        method,
        headers,
        credentials: 'same-origin',
        body: body === undefined ? undefined : JSON.stringify(body),
      });
    } catch {
      return { kind: 'network', code: 'NETWORK', message: fallbackMessages.network };
    }
    let data: unknown;
    try {
      data = await readJson(response);
    } catch {
      return { kind: 'network', code: 'NETWORK', message: fallbackMessages.network };
    }
    if (response.ok) {
      const token = (data as { csrfToken?: unknown } | null)?.csrfToken;
      if (typeof token === 'string') csrfToken = token;
      return { kind: 'ok', data: data as T, status: response.status };
    }
    return toProblem(response.status, data, response.headers);
  }

  async function request<T>(method: HttpMethod, path: string, body?: unknown): Promise<ApiResult<T>> {
    const first = await send<T>(method, path, body);
    if (first.kind !== 'csrf' || !MUTATING.has(method)) return first;
    // The token is bound to the session, which may have rotated (sign-in elsewhere, expiry):
    // fetch a fresh one once, then retry; a second refusal is reported as it is.
    const session = await send<{ csrfToken?: string }>('GET', '/auth/session', undefined);
    if (session.kind !== 'ok') return first;
    return send<T>(method, path, body);
  }

  return {
    request,
    get: (path) => request('GET', path),
    post: (path, body) => request('POST', path, body ?? {}),
    patch: (path, body) => request('PATCH', path, body ?? {}),
    del: (path) => request('DELETE', path),
    setCsrfToken: (token) => {
      csrfToken = token;
    },
    getCsrfToken: () => csrfToken,
  };
}

/** The app's shared client (same origin, `/api/v1`). */
export const api = createApiClient();

/** Thrown by query functions so TanStack Query sees a failure; screens read `.problem`. */
export class ApiProblemError extends Error {
  readonly problem: ApiProblem;
  constructor(problem: ApiProblem) {
    super(problemMessage(problem));
    this.name = 'ApiProblemError';
    this.problem = problem;
  }
}

export function unwrap<T>(result: ApiResult<T>): T {
  if (result.kind === 'ok') return result.data;
  throw new ApiProblemError(result);
}

/** Retry transient failures only; a 4xx answer will not change by asking again. */
export function shouldRetry(failureCount: number, error: unknown): boolean {
  if (error instanceof ApiProblemError) {
    const kind = error.problem.kind;
    if (kind !== 'network' && kind !== 'server') return false;
  }
  return failureCount < 2;
}
