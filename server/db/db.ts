import knex, { type Knex } from 'knex';
import type { Config } from '../config';

/** The database handle services receive; a transaction is one too. */
export type Db = Knex;

/** Used when a caller builds a handle without a configured bound (scripts, tests of old shape). */
export const DEFAULT_DB_TIMEOUT_MS = 5000;

/** A query that got no answer within its bound; its connection has been closed. */
export class DatabaseTimeoutError extends Error {
  readonly code = 'DB_QUERY_TIMEOUT';
  /** mysql2 marks errors that end a connection as fatal; so does this one. */
  readonly fatal = true;
  constructor(readonly timeoutMs: number) {
    super(`The database did not answer within ${timeoutMs} ms`);
    this.name = 'DatabaseTimeoutError';
  }
}

type QueryCallback = (err: unknown, ...rest: unknown[]) => void;
type RawConnection = {
  query: (sql: unknown, values: unknown, cb?: QueryCallback) => unknown;
  destroy: () => void;
  stream?: { destroy?: () => void };
  __knex__disposed?: unknown;
};

/**
 * Gives every query on a raw mysql2 connection a watchdog. A hung server (or a half-open socket)
 * otherwise leaves the query, and the HTTP response waiting on it, pending for ever. On timeout the
 * connection is closed and marked disposed, so the pool never hands it out again, and the query fails
 * with DatabaseTimeoutError. A query may ask for a longer bound with `.options({ timeout })`.
 */
function watchQueries(conn: RawConnection, defaultTimeoutMs: number): void {
  const original = conn.query.bind(conn);
  conn.query = (sql, values, cb) => {
    if (typeof cb !== 'function' || !sql || typeof sql !== 'object' || !('sql' in sql)) return original(sql, values, cb);
    // mysql2's own `timeout` leaves the command on a live connection; the watchdog closes it instead.
    const { timeout, ...options } = sql as { timeout?: unknown };
    const limit = typeof timeout === 'number' && timeout > 0 ? timeout : defaultTimeoutMs;
    let settled = false;
    const timer = setTimeout(() => {
      if (settled) return;
      settled = true;
      const err = new DatabaseTimeoutError(limit);
      conn.__knex__disposed = err;
      try {
        conn.destroy();
        conn.stream?.destroy?.();
      } catch {
        // already closed
      }
      cb(err);
    }, limit);
    return original(options, values, (err, ...rest) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      cb(err, ...rest);
    });
  };
}

export function createDb(config: Pick<Config, 'db'> & Partial<Pick<Config, 'dbTimeoutMs'>>, overrides: Partial<Knex.Config> = {}): Db {
  const timeoutMs = config.dbTimeoutMs ?? DEFAULT_DB_TIMEOUT_MS;
  return knex({
    client: 'mysql2',
    connection: {
      host: config.db.host,
      port: config.db.port,
      database: config.db.name,
      user: config.db.user,
      password: config.db.password,
      timezone: 'Z',
      charset: 'utf8mb4',
      connectTimeout: timeoutMs,
    },
    pool: {
      min: 0,
      max: 10,
      afterCreate: (conn: RawConnection, done: (err: Error | null, conn: RawConnection) => void) => {
        watchQueries(conn, timeoutMs);
        done(null, conn);
      },
    },
    acquireConnectionTimeout: timeoutMs,
    ...overrides,
  });
}

/** Runs fn in a transaction, or inside the caller's transaction when db already is one. */
export async function inTransaction<T>(db: Db, fn: (trx: Db) => Promise<T>): Promise<T> {
  if ((db as Knex.Transaction).isTransaction) return fn(db);
  return db.transaction((trx) => fn(trx));
}

/** MariaDB returns JSON columns as text. */
export function parseJson<T>(value: unknown, fallback: T): T {
  if (value == null) return fallback;
  if (typeof value === 'string') {
    try {
      return JSON.parse(value) as T;
    } catch {
      return fallback;
    }
  }
  return value as T;
}
