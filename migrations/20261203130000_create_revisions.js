// @ts-check
/**
 * Revisions: a numbered, signed snapshot of a site's line list (every item with its inputs, build-up and
 * sizing result, the site's design bases and sizing settings), prepared, checked and approved by three
 * different members. Once approved (issued) a revision is read-only; the database refuses changes too, so
 * no code path can alter an issued revision.
 */

/** Triggers that keep issued revisions as they were issued (foreign-key cascades do not fire triggers). */
const TRIGGERS = [
  `CREATE TRIGGER revisions_issued_read_only BEFORE UPDATE ON revisions FOR EACH ROW
   BEGIN
     IF OLD.status = 'issued' THEN
       SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'REVISION_ISSUED: an issued revision is read-only';
     END IF;
   END`,
  `CREATE TRIGGER revisions_issued_kept BEFORE DELETE ON revisions FOR EACH ROW
   BEGIN
     IF OLD.status = 'issued' THEN
       SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'REVISION_ISSUED: an issued revision cannot be deleted';
     END IF;
   END`,
  `CREATE TRIGGER revision_items_read_only BEFORE UPDATE ON revision_items FOR EACH ROW
   BEGIN
     SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'REVISION_ITEM_FROZEN: the items of a revision are read-only';
   END`,
  `CREATE TRIGGER revision_items_kept BEFORE DELETE ON revision_items FOR EACH ROW
   BEGIN
     IF (SELECT status FROM revisions WHERE id = OLD.revision_id) = 'issued' THEN
       SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'REVISION_ISSUED: the items of an issued revision cannot be deleted';
     END IF;
   END`,
];

const TRIGGER_NAMES = ['revisions_issued_read_only', 'revisions_issued_kept', 'revision_items_read_only', 'revision_items_kept'];

/** @param {import('knex').Knex} knex */
exports.up = async function up(knex) {
  await knex.schema.alterTable('sites', (t) => {
    // How revisions are numbered: the trade's letters and numbers, or a prefix and a counter (shared/schemas/revisions).
    t.json('revision_scheme').nullable();
  });
  await knex.schema.createTable('revisions', (t) => {
    t.increments('id').primary();
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE');
    t.integer('site_id').unsigned().notNullable().references('sites.id').onDelete('CASCADE');
    // Numbering series ('review', 'construction' or 'counter:<prefix>') and the place in it.
    t.string('series', 40).notNullable();
    t.integer('sequence').unsigned().notNullable();
    // The revision mark as printed (A, B, 0, 1, P-03 …).
    t.string('number', 40).notNullable();
    t.enum('purpose', ['review', 'construction']).notNullable();
    t.string('description', 500).notNullable().defaultTo('');
    t.enum('status', ['prepared', 'checked', 'issued']).notNullable().defaultTo('prepared');
    // The site as it was: name, description, design bases, sizing settings, names of the materials and finishes used.
    t.json('snapshot').notNullable();
    // SHA-256 of the canonical snapshot (site part and every item): what the checker and the approver sign.
    t.string('snapshot_hash', 64).notNullable();
    t.integer('item_count').unsigned().notNullable();
    // Totals for the history list (heat loss, energy, counts).
    t.json('totals').notNullable();
    t.integer('prepared_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.string('prepared_by_name', 200).notNullable();
    t.datetime('prepared_at', { precision: 3 }).notNullable();
    t.integer('checked_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.string('checked_by_name', 200).nullable();
    t.datetime('checked_at', { precision: 3 }).nullable();
    t.string('checked_hash', 64).nullable();
    t.integer('approved_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.string('approved_by_name', 200).nullable();
    t.datetime('approved_at', { precision: 3 }).nullable();
    t.string('approved_hash', 64).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['site_id', 'number']);
    t.index(['site_id', 'status']);
    t.index(['team_id']);
  });
  await knex.schema.createTable('revision_items', (t) => {
    t.integer('revision_id').unsigned().notNullable().references('revisions.id').onDelete('CASCADE');
    t.integer('position').unsigned().notNullable();
    // The line or vessel it was (no foreign key: the item may be deleted from the draft later).
    t.integer('item_id').unsigned().notNullable();
    t.enum('kind', ['line', 'vessel']).notNullable();
    t.string('tag', 100).notNullable();
    // Inputs as they were (SI): size, length, temperature, purposes, parameters, fittings, build-up, notes.
    t.json('item').notNullable();
    // The stored sizing result (ItemSizing of shared/calc/sizing) it was issued with.
    t.json('result').notNullable();
    t.datetime('sized_at', { precision: 3 }).notNullable();
    t.primary(['revision_id', 'position']);
    t.index(['revision_id', 'kind', 'tag']);
  });
  for (const sql of TRIGGERS) await knex.raw(sql);
};

/** @param {import('knex').Knex} knex */
exports.down = async function down(knex) {
  for (const name of TRIGGER_NAMES) await knex.raw(`DROP TRIGGER IF EXISTS ${name}`);
  await knex.schema.dropTableIfExists('revision_items');
  await knex.schema.dropTableIfExists('revisions');
  await knex.schema.alterTable('sites', (t) => {
    t.dropColumn('revision_scheme');
  });
};
