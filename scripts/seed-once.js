// @ts-check
// Seeds the demo only into an empty database, so restarting the product never wipes a team's work.
const knexFactory = require('knex');
const config = require('../knexfile.js');

async function main() {
  const env = process.env.NODE_ENV === 'test' ? 'test' : 'development';
  const db = knexFactory(config[env] || config);
  try {
    const row = await db('teams').count({ n: '*' }).first();
    if (Number(row?.n ?? 0) === 0) {
      await db.seed.run();
      console.log('Demo data seeded.');
    } else {
      console.log('Database already holds data; demo seed skipped.');
    }
  } finally {
    await db.destroy();
  }
}

main().catch((e) => {
  console.error(`Seeding failed: ${e.message}`);
  process.exit(1);
});
