import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { createApp } from '../../server/app';
import { inlineScriptHashes } from '../../server/http/web-app';
import { testConfig } from '../helpers/test-config';
import { createTestDatabase, type TestDatabase } from '../helpers/test-db';

const HYDRATE = 'globalThis.__EXPO_ROUTER_HYDRATE__=true;';
jest.setTimeout(60_000);

let dist: string;
let database: TestDatabase;
const mailer = { send: async () => undefined, close: () => undefined };

function write(rel: string, content: string) {
  const file = path.join(dist, rel);
  fs.mkdirSync(path.dirname(file), { recursive: true });
  fs.writeFileSync(file, content);
}

beforeAll(async () => {
  dist = fs.mkdtempSync(path.join(os.tmpdir(), 'lagline-dist-'));
  const page = (name: string) => `<!DOCTYPE html><html><head><script>${HYDRATE}</script></head><body>${name}<script src="/_expo/x.js" defer></script></body></html>`;
  write('index.html', page('home'));
  write('sites.html', page('sites list'));
  write('sites/[id].html', page('one site'));
  write('sites/[id]/lines.html', page('site lines'));
  write('team/index.html', page('team'));
  write('(auth)/sign-in.html', page('sign in page'));
  write('+not-found.html', page('not found'));
  write('_expo/x.js', 'console.log(1)');
  database = await createTestDatabase();
});
afterAll(async () => {
  fs.rmSync(dist, { recursive: true, force: true });
  await database.drop();
});

describe('serving the exported web app', () => {
  const app = () => createApp({ db: database.db, mailer, config: testConfig({ distDir: dist }) });

  it('when paths map to exported pages, then static, index, dynamic and not-found pages are served', async () => {
    const a = app();
    try {
      expect((await request(a).get('/').expect(200)).text).toContain('home');
      expect((await request(a).get('/sites').expect(200)).text).toContain('sites list');
      expect((await request(a).get('/sites/42').expect(200)).text).toContain('one site');
      expect((await request(a).get('/sites/42/lines').expect(200)).text).toContain('site lines');
      expect((await request(a).get('/team').expect(200)).text).toContain('team');
      expect((await request(a).get('/sign-in').expect(200)).text).toContain('sign in page');
      expect((await request(a).get('/sites/..%2F..%2Fetc%2Fpasswd')).text).not.toContain('root:');
      const missing = await request(a).get('/no/such/page');
      expect(missing.status).toBe(404);
      expect(missing.text).toContain('not found');
      await request(a).get('/_expo/x.js').expect(200).expect('Content-Type', /javascript/);
    } finally {
      await a.locals.close();
    }
  });

  it('when pages carry an inline script, then the CSP allows exactly its sha256 and keeps the rest strict', async () => {
    const expected = `'sha256-${crypto.createHash('sha256').update(HYDRATE).digest('base64')}'`;
    expect(inlineScriptHashes(dist)).toEqual([expected]);
    const a = app();
    try {
      const csp = (await request(a).get('/')).headers['content-security-policy'];
      expect(csp).toContain(`script-src 'self' ${expected}`);
      expect(csp).toContain("style-src 'self' 'unsafe-inline'");
      expect(csp).toContain("img-src 'self' data: blob:");
      expect(csp).toContain("font-src 'self' data:");
      expect(csp).toContain("connect-src 'self'");
      expect(csp).not.toContain('upgrade-insecure-requests');
      expect((await request(a).get('/')).headers['strict-transport-security']).toBeUndefined();
    } finally {
      await a.locals.close();
    }
  });

  it('when the app is served over TLS, then HSTS and upgrade-insecure-requests are on', async () => {
    const a = createApp({ db: database.db, mailer, config: testConfig({ distDir: dist, appUrl: 'https://lagline.example' }) });
    try {
      const res = await request(a).get('/');
      expect(res.headers['strict-transport-security']).toMatch(/max-age=/);
      expect(res.headers['content-security-policy']).toContain('upgrade-insecure-requests');
    } finally {
      await a.locals.close();
    }
  });

  it('when dist/ is missing, then the API still works and pages get a short text note', async () => {
    const a = createApp({ db: database.db, mailer, config: testConfig({ distDir: path.join(dist, 'absent') }) });
    try {
      const page = await request(a).get('/sites').expect(200);
      expect(page.text).toMatch(/not been built/);
      await request(a).get('/api/v1/health').expect(200);
      await request(a).get('/api/v1/nothing-here').expect(404);
    } finally {
      await a.locals.close();
    }
  });
});
