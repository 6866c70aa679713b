// @ts-check

/** @param {import('knex').Knex} knex */
exports.up = async function up(knex) {
  await knex.schema.createTable('invitations', (t) => {
    t.increments('id').primary();
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE');
    t.string('email', 254).notNullable();
    t.enum('role', ['owner', 'engineer', 'safety', 'contractor', 'viewer']).notNullable();
    // SHA-256 of the token in hex; the token itself only ever travels in the e-mail.
    t.string('token_hash', 64).notNullable().unique();
    t.integer('invited_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.datetime('expires_at', { precision: 3 }).notNullable();
    t.datetime('accepted_at', { precision: 3 }).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['team_id', 'email']);
  });
  await knex.schema.createTable('password_resets', (t) => {
    t.increments('id').primary();
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    t.string('token_hash', 64).notNullable().unique();
    t.datetime('expires_at', { precision: 3 }).notNullable();
    t.datetime('used_at', { precision: 3 }).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
};

/** @param {import('knex').Knex} knex */
exports.down = async function down(knex) {
  await knex.schema.dropTableIfExists('password_resets');
  await knex.schema.dropTableIfExists('invitations');
};
