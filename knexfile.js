// @ts-check
/**
 * Knex configuration for the CLI (`npx knex migrate:latest`, `npx knex seed:run`).
 * Reads the same environment variables as server/config.ts.
 * @type {import('knex').Knex.Config}
 */
const config = {
  client: 'mysql2',
  connection: {
    host: process.env.DB_HOST || '127.0.0.1',
    port: Number(process.env.DB_PORT || 3307),
    database: process.env.DB_NAME || 'lagline',
    user: process.env.DB_USER || 'lagline',
    password: process.env.DB_PASSWORD || 'lagline-dev-password',
    timezone: 'Z',
    charset: 'utf8mb4',
  },
  pool: { min: 0, max: 10 },
  migrations: { directory: './migrations', loadExtensions: ['.js'] },
  seeds: { directory: './seeds', loadExtensions: ['.js'] },
};

module.exports = config;
