import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ConfigError, loadConfig } from './config';

describe('loadConfig', () => {
  it('when nothing is set, then the documented defaults apply', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'lagline-secret-'));
    const c = loadConfig({ SECRET_DIR: dir });
    expect(c).toMatchObject({ port: 8080, host: '127.0.0.1', db: { host: '127.0.0.1', port: 3307, name: 'lagline' }, mailCatcher: true, bcryptCost: 12 });
    expect(c.appUrl).toBe('http://127.0.0.1:8080');
    fs.rmSync(dir, { recursive: true, force: true });
  });

  it('when no SESSION_SECRET is set in development, then a secret is generated once and reused after a restart', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'lagline-secret-'));
    const first = loadConfig({ SECRET_DIR: dir }).sessionSecret;
    const second = loadConfig({ SECRET_DIR: dir }).sessionSecret;
    expect(first).toHaveLength(64);
    expect(second).toBe(first);
    expect(fs.statSync(path.join(dir, 'session-secret')).mode & 0o077).toBe(0);
    fs.rmSync(dir, { recursive: true, force: true });
  });

  it('when values are invalid, then one error lists every problem', () => {
    expect(() => loadConfig({ PORT: 'eighty', DB_PORT: '70000', APP_URL: 'nope', SESSION_SECRET: 'short' })).toThrow(ConfigError);
    try {
      loadConfig({ PORT: 'eighty', DB_PORT: '70000', APP_URL: 'nope', SESSION_SECRET: 'short' });
    } catch (e) {
      const msg = (e as Error).message;
      for (const name of ['PORT', 'DB_PORT', 'APP_URL', 'SESSION_SECRET']) expect(msg).toContain(name);
    }
  });

  it('when running in production without SESSION_SECRET, then start-up refuses', () => {
    expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(/SESSION_SECRET is required/);
    const c = loadConfig({ NODE_ENV: 'production', SESSION_SECRET: 's'.repeat(40) });
    expect(c.mailCatcher).toBe(false);
  });
});
