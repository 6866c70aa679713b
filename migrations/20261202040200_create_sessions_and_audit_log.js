// @ts-check

/** @param {import('knex').Knex} knex */
exports.up = async function up(knex) {
  // Columns as connect-session-knex expects them (sid primary key, sess JSON, expired indexed datetime).
  await knex.schema.createTable('sessions', (t) => {
    t.string('sid', 255).primary();
    t.json('sess').notNullable();
    t.datetime('expired').notNullable().index();
  });
  await knex.schema.createTable('audit_log', (t) => {
    t.bigIncrements('id').primary();
    t.integer('team_id').unsigned().nullable().references('teams.id').onDelete('CASCADE');
    t.integer('user_id').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.string('action', 64).notNullable();
    t.string('target_type', 32).nullable();
    t.string('target_id', 64).nullable();
    t.json('details').nullable();
    t.string('ip', 64).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['team_id', 'created_at']);
  });
};

/** @param {import('knex').Knex} knex */
exports.down = async function down(knex) {
  await knex.schema.dropTableIfExists('audit_log');
  await knex.schema.dropTableIfExists('sessions');
};
