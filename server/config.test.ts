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

  it('when the database bound, session sweep and sign-up limits are set, then they apply; without them the defaults do', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'lagline-secret-'));
    const defaults = loadConfig({ SECRET_DIR: dir });
    expect(defaults).toMatchObject({ dbTimeoutMs: 5000, sessionCleanupMs: 15 * 60_000 });
    expect(defaults.rateLimits.signup).toEqual({ windowMs: 3_600_000, limit: 5 });
    expect(defaults.rateLimits.signupAttempts).toEqual({ windowMs: 3_600_000, limit: 30 });
    expect(loadConfig({ SECRET_DIR: dir, NODE_ENV: 'test' }).sessionCleanupMs).toBe(0);
    const set = loadConfig({ SECRET_DIR: dir, DB_TIMEOUT_MS: '1500', SESSION_CLEANUP_MINUTES: '5', RATE_LIMIT_SIGNUP: '2', RATE_LIMIT_SIGNUP_ATTEMPTS: '9' });
    expect(set).toMatchObject({ dbTimeoutMs: 1500, sessionCleanupMs: 5 * 60_000 });
    expect(set.rateLimits.signup.limit).toBe(2);
    expect(set.rateLimits.signupAttempts.limit).toBe(9);
    expect(() => loadConfig({ SECRET_DIR: dir, DB_TIMEOUT_MS: '10' })).toThrow(/DB_TIMEOUT_MS/);
    fs.rmSync(dir, { recursive: true, force: true });
  });

  it('when running in production without SESSION_SECRET, then start-up refuses', () => {
    expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(/SESSION_SECRET is required/);
    const c = loadConfig({ NODE_ENV: 'production', SESSION_SECRET: 's'.repeat(40) });
    expect(c.mailCatcher).toBe(false);
  });
});
