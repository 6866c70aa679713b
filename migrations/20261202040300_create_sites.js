// @ts-check

/** @param {import('knex').Knex} knex */
exports.up = async function up(knex) {
  await knex.schema.createTable('sites', (t) => {
    t.increments('id').primary();
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE');
    t.string('name', 120).notNullable();
    t.string('description', 2000).notNullable().defaultTo('');
    // Touch-safety, energy and condensation bases (SI, °C), shaped by shared/schemas/sites.
    t.json('design_bases').notNullable();
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['team_id', 'name']);
  });
  await knex.schema.createTable('site_members', (t) => {
    t.integer('site_id').unsigned().notNullable().references('sites.id').onDelete('CASCADE');
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    t.integer('added_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.primary(['site_id', 'user_id']);
  });
};

/** @param {import('knex').Knex} knex */
exports.down = async function down(knex) {
  await knex.schema.dropTableIfExists('site_members');
  await knex.schema.dropTableIfExists('sites');
};
