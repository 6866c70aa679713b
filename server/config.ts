import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

export type RateLimitRule = { windowMs: number; limit: number };

export type Config = {
  env: 'development' | 'test' | 'production';
  port: number;
  host: string;
  db: { host: string; port: number; name: string; user: string; password: string };
  /**
   * Bound on one piece of database work [ms]: connecting, waiting for a pooled connection, and each
   * query (sessions included). Past it the request answers 503 instead of hanging.
   */
  dbTimeoutMs: number;
  sessionSecret: string;
  /** Idle timeout: the cookie's rolling max age [ms]. */
  sessionIdleMs: number;
  /** Absolute timeout from sign-in [ms]. */
  sessionAbsoluteMs: number;
  /** How often expired session rows are deleted [ms]; 0 turns the sweep off. */
  sessionCleanupMs: number;
  smtp: { host: string; port: number };
  mailFrom: string;
  appUrl: string;
  mailCatcher: boolean;
  trustProxy: boolean | number | string;
  bcryptCost: number;
  distDir: string;
  /** Where uploaded files (schedules, photos) are kept: outside the web root, under generated names. */
  uploadDir: string;
  rateLimits: {
    signin: RateLimitRule;
    /** Successful sign-ups (new teams) per client IP. */
    signup: RateLimitRule;
    /** Every sign-up attempt per client IP (bcrypt work), separate from sign-in's counter. */
    signupAttempts: RateLimitRule;
    passwordReset: RateLimitRule;
    invite: RateLimitRule;
    calculations: RateLimitRule;
  };
  calc: { maxThreads: number; maxQueue: number; chunkSize: number };
  logLevel: 'silent' | 'error' | 'info';
};

export class ConfigError extends Error {}

const ROOT = path.resolve(__dirname, '..');

function int(env: Env, name: string, fallback: number, problems: string[], min = 0, max = 65535): number {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < min || n > max) {
    problems.push(`${name} must be a whole number from ${min} to ${max} (got "${raw}")`);
    return fallback;
  }
  return n;
}

function bool(env: Env, name: string, fallback: boolean, problems: string[]): boolean {
  const raw = env[name];
  if (raw === undefined || raw === '') return fallback;
  if (/^(1|true|yes|on)$/i.test(raw)) return true;
  if (/^(0|false|no|off)$/i.test(raw)) return false;
  problems.push(`${name} must be true or false (got "${raw}")`);
  return fallback;
}

/**
 * A development secret kept in .db/ so sessions survive restarts without anyone having to set one.
 */
function persistedDevSecret(dir: string): string {
  const file = path.join(dir, 'session-secret');
  try {
    const existing = fs.readFileSync(file, 'utf8').trim();
    if (existing.length >= 32) return existing;
  } catch {
    // not there yet
  }
  const secret = crypto.randomBytes(32).toString('hex');
  fs.mkdirSync(dir, { recursive: true });
  fs.writeFileSync(file, secret + '\n', { mode: 0o600 });
  return secret;
}

export type Env = Record<string, string | undefined>;

/** Reads and validates the environment once; throws ConfigError listing every problem. */
export function loadConfig(env: Env = process.env): Config {
  const problems: string[] = [];
  const nodeEnv = env.NODE_ENV === 'production' ? 'production' : env.NODE_ENV === 'test' ? 'test' : 'development';
  const port = int(env, 'PORT', 8080, problems);
  const host = env.HOST || '127.0.0.1';
  const appUrl = env.APP_URL || `http://${host}:${port}`;
  try {
    const u = new URL(appUrl);
    if (u.protocol !== 'http:' && u.protocol !== 'https:') problems.push('APP_URL must be an http(s) URL');
  } catch {
    problems.push(`APP_URL must be a URL (got "${appUrl}")`);
  }
  let sessionSecret = env.SESSION_SECRET || '';
  if (sessionSecret && sessionSecret.length < 32) problems.push('SESSION_SECRET must be at least 32 characters');
  if (!sessionSecret) {
    if (nodeEnv === 'production') problems.push('SESSION_SECRET is required in production');
    else sessionSecret = persistedDevSecret(env.SECRET_DIR || path.join(ROOT, '.db'));
  }
  const mailCatcher = bool(env, 'MAIL_CATCHER', nodeEnv !== 'production', problems);
  const trustRaw = env.TRUST_PROXY;
  const trustProxy: Config['trustProxy'] =
    trustRaw === undefined || trustRaw === '' ? false : /^\d+$/.test(trustRaw) ? Number(trustRaw) : /^(true|false)$/.test(trustRaw) ? trustRaw === 'true' : trustRaw;
  const logLevel = (env.LOG_LEVEL || (nodeEnv === 'test' ? 'silent' : 'info')) as Config['logLevel'];
  if (!['silent', 'error', 'info'].includes(logLevel)) problems.push('LOG_LEVEL must be silent, error or info');

  const config: Config = {
    env: nodeEnv,
    port,
    host,
    db: {
      host: env.DB_HOST || '127.0.0.1',
      port: int(env, 'DB_PORT', 3307, problems, 1),
      name: env.DB_NAME || 'lagline',
      user: env.DB_USER || 'lagline',
      password: env.DB_PASSWORD ?? 'lagline-dev-password',
    },
    dbTimeoutMs: int(env, 'DB_TIMEOUT_MS', 5000, problems, 100, 600_000),
    sessionSecret,
    sessionIdleMs: int(env, 'SESSION_IDLE_MINUTES', 8 * 60, problems, 1, 525600) * 60_000,
    sessionAbsoluteMs: int(env, 'SESSION_ABSOLUTE_HOURS', 7 * 24, problems, 1, 87600) * 3_600_000,
    sessionCleanupMs: int(env, 'SESSION_CLEANUP_MINUTES', nodeEnv === 'test' ? 0 : 15, problems, 0, 10_080) * 60_000,
    smtp: { host: env.SMTP_HOST || '127.0.0.1', port: int(env, 'SMTP_PORT', 2525, problems) },
    mailFrom: env.MAIL_FROM || 'Lagline <no-reply@lagline.test>',
    appUrl: appUrl.replace(/\/+$/, ''),
    mailCatcher,
    trustProxy,
    bcryptCost: int(env, 'BCRYPT_COST', 12, problems, 4, 15),
    distDir: env.DIST_DIR || path.join(ROOT, 'dist'),
    uploadDir: env.UPLOAD_DIR || path.join(ROOT, '.uploads', nodeEnv),
    rateLimits: {
      signin: { windowMs: 15 * 60_000, limit: int(env, 'RATE_LIMIT_SIGNIN', 10, problems, 1, 1_000_000) },
      signup: { windowMs: 60 * 60_000, limit: int(env, 'RATE_LIMIT_SIGNUP', 5, problems, 1, 1_000_000) },
      signupAttempts: { windowMs: 60 * 60_000, limit: int(env, 'RATE_LIMIT_SIGNUP_ATTEMPTS', 30, problems, 1, 1_000_000) },
      passwordReset: { windowMs: 60 * 60_000, limit: int(env, 'RATE_LIMIT_RESET', 5, problems, 1, 1_000_000) },
      invite: { windowMs: 60 * 60_000, limit: int(env, 'RATE_LIMIT_INVITE', 30, problems, 1, 1_000_000) },
      calculations: { windowMs: 60_000, limit: int(env, 'RATE_LIMIT_CALCULATIONS', 120, problems, 1, 1_000_000) },
    },
    calc: {
      maxThreads: int(env, 'CALC_THREADS', 1, problems, 1, 64),
      maxQueue: int(env, 'CALC_MAX_QUEUE', 400, problems, 1, 1_000_000),
      chunkSize: int(env, 'CALC_CHUNK_SIZE', 250, problems, 1, 10_000),
    },
    logLevel,
  };
  if (problems.length) throw new ConfigError(`Invalid configuration:\n- ${problems.join('\n- ')}`);
  return Object.freeze(config);
}
