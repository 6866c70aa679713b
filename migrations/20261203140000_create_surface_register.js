// @ts-check
/**
 * The hot-surface register: entries (a measured or computed surface temperature, its surface and
 * accessibility, the workflow status, owner and due date), their history (who changed what, when), comments,
 * photos (files under the upload folder, metadata here), reminders (the mail outbox, one row per entry, kind,
 * key and recipient, so no reminder is sent twice by two processes or after a restart) and a team setting.
 */

const MATERIALS = ['uncoatedMetal', 'coatedMetal', 'ceramicGlassStone', 'plastic', 'wood'];
const STATUSES = ['open', 'actionAssigned', 'madeSafe', 'verified', 'accepted'];

/** @param {import('knex').Knex} knex */
exports.up = async function up(knex) {
  await knex.schema.createTable('register_entries', (t) => {
    t.increments('id').primary();
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE');
    t.integer('site_id').unsigned().notNullable().references('sites.id').onDelete('CASCADE');
    // The line or vessel this surface belongs to, when there is one.
    t.integer('item_id').unsigned().nullable().references('items.id').onDelete('SET NULL');
    // The item's sizing fingerprint when the entry was linked: a closed entry resolves the item's calculated
    // risk only while the item's inputs stay as they were.
    t.string('item_input_hash', 16).nullable();
    t.string('location', 200).notNullable();
    t.text('description').notNullable();
    t.double('measured_temperature_c').notNullable();
    t.enum('method', ['contact', 'infrared', 'calculated']).notNullable();
    t.double('emissivity_setting').nullable();
    t.enum('surface_material', MATERIALS).notNullable();
    // A built-in finish id (shared/calc/library/finishes), when known.
    t.string('surface_finish_id', 64).nullable();
    t.boolean('within_reach').notNullable();
    t.double('contact_seconds').nullable();
    t.datetime('measured_at', { precision: 3 }).notNullable();
    t.enum('status', STATUSES).notNullable().defaultTo('open');
    t.text('action').notNullable();
    t.integer('owner_user_id').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.date('due_date').nullable();
    t.integer('assigned_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.text('status_note').notNullable();
    t.integer('closed_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.datetime('closed_at', { precision: 3 }).nullable();
    // The reading taken when the fix was verified.
    t.double('verification_temperature_c').nullable();
    t.integer('version').unsigned().notNullable().defaultTo(1);
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.integer('updated_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.index(['team_id', 'site_id', 'status']);
    t.index(['item_id']);
    t.index(['status', 'due_date']);
  });
  await knex.schema.createTable('register_history', (t) => {
    t.bigIncrements('id').primary();
    t.integer('entry_id').unsigned().notNullable().references('register_entries.id').onDelete('CASCADE');
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE');
    t.integer('user_id').unsigned().nullable().references('users.id').onDelete('SET NULL');
    // created, updated, assign, madeSafe, verify, sendBack, accept, reopen, commented, photoAdded, photoRemoved
    t.string('action', 32).notNullable();
    t.enum('from_status', STATUSES).nullable();
    t.enum('to_status', STATUSES).nullable();
    // { field: { from, to } } for the fields that changed.
    t.json('changes').notNullable();
    t.text('note').notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.index(['entry_id', 'id']);
  });
  await knex.schema.createTable('register_comments', (t) => {
    t.increments('id').primary();
    t.integer('entry_id').unsigned().notNullable().references('register_entries.id').onDelete('CASCADE');
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE');
    t.integer('user_id').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.text('body').notNullable();
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.index(['entry_id', 'id']);
  });
  await knex.schema.createTable('register_photos', (t) => {
    t.increments('id').primary();
    t.integer('entry_id').unsigned().notNullable().references('register_entries.id').onDelete('CASCADE');
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE');
    // Generated names of the served image and its thumbnail under <uploadDir>/register-photos/.
    t.string('file_name', 80).notNullable().unique();
    t.string('thumbnail_name', 80).notNullable().unique();
    t.string('content_type', 40).notNullable();
    t.integer('width').unsigned().notNullable();
    t.integer('height').unsigned().notNullable();
    t.integer('bytes').unsigned().notNullable();
    // What was uploaded (type found from the content, pixels before downscaling).
    t.string('original_type', 40).notNullable();
    t.integer('original_width').unsigned().notNullable();
    t.integer('original_height').unsigned().notNullable();
    t.datetime('taken_at', { precision: 3 }).nullable();
    // Kept only when the team keeps photo locations; never in the served file.
    t.double('latitude').nullable();
    t.double('longitude').nullable();
    t.integer('uploaded_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.index(['entry_id', 'id']);
  });
  await knex.schema.createTable('register_reminders', (t) => {
    t.bigIncrements('id').primary();
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE');
    t.integer('entry_id').unsigned().notNullable().references('register_entries.id').onDelete('CASCADE');
    // assigned, dueSoon, overdue, verifyRequest
    t.string('kind', 16).notNullable();
    // The due date (YYYY-MM-DD) a due-soon or overdue reminder is for; the history row of an assignment or
    // a request to verify.
    t.string('reminder_key', 32).notNullable();
    t.integer('recipient_user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    t.enum('status', ['pending', 'sending', 'sent', 'skipped', 'failed']).notNullable().defaultTo('pending');
    t.integer('attempts').unsigned().notNullable().defaultTo(0);
    t.string('claimed_by', 64).nullable();
    t.datetime('lease_until', { precision: 3 }).nullable();
    t.datetime('not_before', { precision: 3 }).notNullable();
    t.datetime('sent_at', { precision: 3 }).nullable();
    t.string('last_error', 500).nullable();
    t.datetime('created_at', { precision: 3 }).notNullable();
    t.unique(['entry_id', 'kind', 'reminder_key', 'recipient_user_id'], { indexName: 'register_reminders_once' });
    t.index(['status', 'not_before']);
  });
  await knex.schema.createTable('register_settings', (t) => {
    t.integer('team_id').unsigned().primary().references('teams.id').onDelete('CASCADE');
    t.boolean('keep_photo_location').notNullable().defaultTo(false);
    t.integer('updated_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
  });
};

/** @param {import('knex').Knex} knex */
exports.down = async function down(knex) {
  await knex.schema.dropTableIfExists('register_settings');
  await knex.schema.dropTableIfExists('register_reminders');
  await knex.schema.dropTableIfExists('register_photos');
  await knex.schema.dropTableIfExists('register_comments');
  await knex.schema.dropTableIfExists('register_history');
  await knex.schema.dropTableIfExists('register_entries');
};
