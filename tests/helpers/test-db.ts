import crypto from 'node:crypto';
import path from 'node:path';
import knex, { type Knex } from 'knex';

const ROOT = path.resolve(__dirname, '../..');

/** Connection settings of the test MariaDB (scripts/db.sh with DB_PORT=3317 by default), or of another instance's port. */
export function testDbSettings(port?: number) {
  return {
    host: process.env.DB_HOST || '127.0.0.1',
    port: port ?? Number(process.env.DB_PORT || 3317),
    user: process.env.DB_USER || 'lagline',
    password: process.env.DB_PASSWORD ?? 'lagline-dev-password',
  };
}

export type TestDatabase = { db: Knex; name: string; drop: () => Promise<void> };

const silent = { warn: () => undefined, error: () => undefined, debug: () => undefined, deprecate: () => undefined };

const connect = (database?: string, port?: number, quiet = false) =>
  knex({
    client: 'mysql2',
    connection: { ...testDbSettings(port), database, timezone: 'Z', charset: 'utf8mb4' },
    pool: { min: 0, max: 10 },
    ...(quiet ? { log: silent } : {}),
  });

/**
 * A fresh database lagline_t_<random>, migrated (and seeded with the demo data when asked);
 * drop() removes it. `port` picks another MariaDB than the test instance; `quiet` keeps Knex from
 * logging connection errors (for tests that stop the database on purpose).
 */
export async function createTestDatabase(opts: { seed?: boolean; port?: number; quiet?: boolean } = {}): Promise<TestDatabase> {
  const name = `lagline_t_${crypto.randomBytes(5).toString('hex')}`;
  const admin = connect(undefined, opts.port);
  try {
    await admin.raw(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  } catch (e) {
    await admin.destroy();
    const s = testDbSettings(opts.port);
    throw new Error(
      `Cannot create a test database on ${s.host}:${s.port} (${(e as Error).message}). ` +
        `Start the test instance: DB_DIR=$PWD/.db-test DB_PORT=${s.port} bash scripts/db.sh start`,
    );
  }
  await admin.destroy();
  const db = connect(name, opts.port, opts.quiet);
  await db.migrate.latest({ directory: path.join(ROOT, 'migrations'), loadExtensions: ['.js'] });
  if (opts.seed) await db.seed.run({ directory: path.join(ROOT, 'seeds'), loadExtensions: ['.js'] });
  return {
    db,
    name,
    drop: async () => {
      await db.destroy();
      const a = connect(undefined, opts.port);
      try {
        await a.raw(`DROP DATABASE IF EXISTS \`${name}\``);
      } finally {
        await a.destroy();
      }
    },
  };
}
