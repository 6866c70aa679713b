import http from 'node:http';
import type { AddressInfo } from 'node:net';

export type RawResult = {
  method: string;
  path: string;
  status: number;
  headers: http.IncomingHttpHeaders;
  text: string;
  /** The body parsed as JSON, or undefined when it is not JSON. */
  json: unknown;
  /** True when the request went over a socket an earlier request had used (keep-alive held). */
  reusedSocket: boolean;
  ms: number;
  /** Set when no complete HTTP answer arrived: a reset socket, a truncated body, a timeout. */
  error?: string;
};

/** Listens on 127.0.0.1:<free port>; close() ends every connection. */
export async function listen(handler: http.RequestListener): Promise<{ url: string; server: http.Server; close: () => Promise<void> }> {
  const server = http.createServer(handler);
  // Loops that pause between requests must find their keep-alive socket still open.
  server.keepAliveTimeout = 60_000;
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  return {
    url,
    server,
    close: async () => {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

/**
 * A browser-like client over plain node:http: one keep-alive socket, a cookie jar, the CSRF token
 * from the last answer that carried one, and a hard timeout per request. It never retries, so a reset
 * socket or a body that stops short shows up as `error`.
 */
export class RawClient {
  readonly agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
  readonly cookies = new Map<string, string>();
  csrf = '';

  constructor(
    readonly baseUrl: string,
    readonly timeoutMs = 15_000,
  ) {}

  cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  request(method: string, path: string, body?: unknown, extraHeaders: Record<string, string> = {}): Promise<RawResult> {
    const url = new URL(path, this.baseUrl);
    const payload = body === undefined ? undefined : JSON.stringify(body);
    const headers: Record<string, string> = { Accept: 'application/json', ...extraHeaders };
    if (payload !== undefined) {
      headers['Content-Type'] = 'application/json';
      headers['Content-Length'] = String(Buffer.byteLength(payload));
    }
    if (this.cookies.size) headers.Cookie = this.cookieHeader();
    if (method !== 'GET' && this.csrf) headers['X-CSRF-Token'] = this.csrf;
    const t0 = performance.now();
    return new Promise((resolve) => {
      let done = false;
      const finish = (r: Omit<RawResult, 'method' | 'path' | 'ms'>) => {
        if (done) return;
        done = true;
        resolve({ method, path, ms: performance.now() - t0, ...r });
      };
      const req = http.request(
        { host: url.hostname, port: url.port, path: url.pathname + url.search, method, headers, agent: this.agent, timeout: this.timeoutMs },
        (res) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('aborted', () => finish({ status: res.statusCode ?? 0, headers: res.headers, text: '', json: undefined, reusedSocket: req.reusedSocket, error: 'body aborted' }));
          res.on('error', (e) => finish({ status: res.statusCode ?? 0, headers: res.headers, text: '', json: undefined, reusedSocket: req.reusedSocket, error: e.message }));
          res.on('end', () => {
            const text = Buffer.concat(chunks).toString('utf8');
            for (const c of ([] as string[]).concat(res.headers['set-cookie'] ?? [])) {
              const [pair] = c.split(';');
              const eq = pair.indexOf('=');
              const name = pair.slice(0, eq).trim();
              const value = pair.slice(eq + 1).trim();
              if (/expires=Thu, 01 Jan 1970/i.test(c) || value === '') this.cookies.delete(name);
              else this.cookies.set(name, value);
            }
            let json: unknown;
            try {
              json = text ? JSON.parse(text) : undefined;
            } catch {
              json = undefined;
            }
            const token = (json as { csrfToken?: unknown } | undefined)?.csrfToken;
            if (typeof token === 'string') this.csrf = token;
            const expected = Number(res.headers['content-length']);
            const short = Number.isFinite(expected) && Buffer.byteLength(text) !== expected;
            finish({ status: res.statusCode ?? 0, headers: res.headers, text, json, reusedSocket: req.reusedSocket, ...(short ? { error: 'body shorter than Content-Length' } : {}) });
          });
        },
      );
      req.on('timeout', () => req.destroy(new Error(`no complete answer within ${this.timeoutMs} ms`)));
      req.on('error', (e) => finish({ status: 0, headers: {}, text: '', json: undefined, reusedSocket: req.reusedSocket, error: e.message }));
      req.end(payload);
    });
  }

  close(): void {
    this.agent.destroy();
  }
}
