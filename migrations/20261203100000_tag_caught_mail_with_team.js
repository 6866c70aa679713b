// @ts-check

/**
 * Caught mail is filed under the team whose action sent it (null when no team acted, as for a
 * password reset) and its kind, so the in-app view shows a team only its own mail and never a reset.
 * No foreign key: the demo seed truncates teams, and the view checks the team's creation time instead.
 * @param {import('knex').Knex} knex
 */
exports.up = async function up(knex) {
  await knex.schema.alterTable('caught_mail', (t) => {
    t.integer('team_id').unsigned().nullable();
    t.string('kind', 32).nullable();
    t.index(['team_id', 'id']);
  });
};

/** @param {import('knex').Knex} knex */
exports.down = async function down(knex) {
  await knex.schema.alterTable('caught_mail', (t) => {
    t.dropIndex(['team_id', 'id']);
    t.dropColumn('kind');
    t.dropColumn('team_id');
  });
};
