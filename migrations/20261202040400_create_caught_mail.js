// @ts-check

/** @param {import('knex').Knex} knex */
exports.up = async function up(knex) {
  // Mail received by the local development/test SMTP catcher.
  await knex.schema.createTable('caught_mail', (t) => {
    t.increments('id').primary();
    t.string('message_id', 255).nullable();
    t.string('from_address', 254).notNullable().defaultTo('');
    t.string('to_address', 1000).notNullable().defaultTo('');
    t.string('subject', 500).notNullable().defaultTo('');
    t.text('text', 'mediumtext').nullable();
    t.text('html', 'mediumtext').nullable();
    t.datetime('received_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['received_at']);
  });
};

/** @param {import('knex').Knex} knex */
exports.down = async function down(knex) {
  await knex.schema.dropTableIfExists('caught_mail');
};
