// @ts-check

/** @param {import('knex').Knex} knex */
exports.up = async function up(knex) {
  await knex.schema.createTable('teams', (t) => {
    t.increments('id').primary();
    t.string('name', 100).notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
  await knex.schema.createTable('users', (t) => {
    t.increments('id').primary();
    t.string('email', 254).notNullable().unique();
    t.string('name', 100).notNullable();
    t.string('password_hash', 100).notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
  await knex.schema.createTable('memberships', (t) => {
    t.increments('id').primary();
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE');
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    t.enum('role', ['owner', 'engineer', 'safety', 'contractor', 'viewer']).notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['team_id', 'user_id']);
  });
  await knex.schema.createTable('user_settings', (t) => {
    t.integer('user_id').unsigned().primary().references('users.id').onDelete('CASCADE');
    t.enum('unit_system', ['SI', 'US']).notNullable().defaultTo('SI');
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
};

/** @param {import('knex').Knex} knex */
exports.down = async function down(knex) {
  await knex.schema.dropTableIfExists('user_settings');
  await knex.schema.dropTableIfExists('memberships');
  await knex.schema.dropTableIfExists('users');
  await knex.schema.dropTableIfExists('teams');
};
