import crypto from 'node:crypto';
import path from 'node:path';
import knex, { type Knex } from 'knex';

const ROOT = path.resolve(__dirname, '../..');

/** Connection settings of the test MariaDB (scripts/db.sh with DB_PORT=3317 by default). */
export function testDbSettings() {
  return {
    host: process.env.DB_HOST || '127.0.0.1',
    port: Number(process.env.DB_PORT || 3317),
    user: process.env.DB_USER || 'lagline',
    password: process.env.DB_PASSWORD ?? 'lagline-dev-password',
  };
}

export type TestDatabase = { db: Knex; name: string; drop: () => Promise<void> };

const connect = (database?: string) =>
  knex({
    client: 'mysql2',
    connection: { ...testDbSettings(), database, timezone: 'Z', charset: 'utf8mb4' },
    pool: { min: 0, max: 10 },
  });

/**
 * A fresh database lagline_t_<random>, migrated (and seeded with the demo data when asked);
 * drop() removes it.
 */
export async function createTestDatabase(opts: { seed?: boolean } = {}): Promise<TestDatabase> {
  const name = `lagline_t_${crypto.randomBytes(5).toString('hex')}`;
  const admin = connect();
  try {
    await admin.raw(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  } catch (e) {
    await admin.destroy();
    const s = testDbSettings();
    throw new Error(
      `Cannot create a test database on ${s.host}:${s.port} (${(e as Error).message}). ` +
        `Start the test instance: DB_DIR=$PWD/.db-test DB_PORT=${s.port} bash scripts/db.sh start`,
    );
  }
  await admin.destroy();
  const db = connect(name);
  await db.migrate.latest({ directory: path.join(ROOT, 'migrations'), loadExtensions: ['.js'] });
  if (opts.seed) await db.seed.run({ directory: path.join(ROOT, 'seeds'), loadExtensions: ['.js'] });
  return {
    db,
    name,
    drop: async () => {
      await db.destroy();
      const a = connect();
      try {
        await a.raw(`DROP DATABASE IF EXISTS \`${name}\``);
      } finally {
        await a.destroy();
      }
    },
  };
}
