import knex, { type Knex } from 'knex';
import type { Config } from '../config';

/** The database handle services receive; a transaction is one too. */
export type Db = Knex;

export function createDb(config: Pick<Config, 'db'>, overrides: Partial<Knex.Config> = {}): Db {
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
      connectTimeout: 5000,
    },
    pool: { min: 0, max: 10 },
    acquireConnectionTimeout: 5000,
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
