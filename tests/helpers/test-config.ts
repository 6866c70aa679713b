import path from 'node:path';
import { type Config, type Env, loadConfig } from '../../server/config';

/** Test configuration: cheap bcrypt, fixed secret, generous limits unless a test overrides them. */
export function testConfig(overrides: Partial<Config> = {}, env: Env = {}): Config {
  const base = loadConfig({
    NODE_ENV: 'test',
    SESSION_SECRET: 'test-secret-0123456789-abcdefghijklmnopqrstuvwxyz',
    BCRYPT_COST: '4',
    RATE_LIMIT_SIGNIN: '1000',
    RATE_LIMIT_SIGNUP: '1000',
    RATE_LIMIT_SIGNUP_ATTEMPTS: '1000',
    RATE_LIMIT_RESET: '1000',
    RATE_LIMIT_INVITE: '1000',
    RATE_LIMIT_CALCULATIONS: '1000',
    APP_URL: 'http://127.0.0.1:8080',
    DIST_DIR: path.resolve(__dirname, '../../dist'),
    LOG_LEVEL: process.env.LOG_LEVEL || 'silent',
    ...env,
  });
  return Object.freeze({ ...base, ...overrides });
}
