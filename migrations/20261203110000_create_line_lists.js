// @ts-check
/**
 * Line lists: a team's own materials and finishes, the items (lines and vessels) of each site with their
 * sizing results, a site's sizing settings, and background jobs.
 */

/** @param {import('knex').Knex} knex */
exports.up = async function up(knex) {
  await knex.schema.createTable('team_materials', (t) => {
    t.increments('id').primary();
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE');
    t.string('name', 120).notNullable();
    // The datasheet (name, edition, page) the points were read from.
    t.string('source', 500).notNullable();
    // [{ meanTemperatureC, conductivityWPerMK }] as entered.
    t.json('table_points').notNullable();
    // Fitted k(T) polynomial [W/(m·K)], T in °C, and the fit's largest relative error [%].
    t.json('conductivity').notNullable();
    t.double('fit_max_error_pct').notNullable();
    t.double('max_service_temperature_c').notNullable();
    t.double('min_service_temperature_c').notNullable();
    t.double('density_kg_per_m3').nullable();
    t.string('notes', 2000).notNullable().defaultTo('');
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['team_id', 'name']);
  });
  await knex.schema.createTable('team_finishes', (t) => {
    t.increments('id').primary();
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE');
    t.string('name', 120).notNullable();
    t.string('source', 500).notNullable();
    t.double('emissivity').notNullable();
    t.double('emissivity_low').notNullable();
    t.double('emissivity_high').notNullable();
    t.enum('contact_material', ['uncoatedMetal', 'coatedMetal', 'ceramicGlassStone', 'plastic', 'wood']).notNullable();
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['team_id', 'name']);
  });
  await knex.schema.alterTable('sites', (t) => {
    // Thickness series, multi-layer rule, heat-conservation rule and default build-ups (shared/calc/sizing).
    t.json('sizing_settings').nullable();
  });
  await knex.schema.createTable('items', (t) => {
    t.increments('id').primary();
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE');
    t.integer('site_id').unsigned().notNullable().references('sites.id').onDelete('CASCADE');
    t.enum('kind', ['line', 'vessel']).notNullable();
    t.string('tag', 100).notNullable();
    t.string('service', 200).notNullable().defaultTo('');
    // How a line's size was given: NPS, DN or an explicit outside diameter.
    t.enum('size_kind', ['nps', 'dn', 'od']).nullable();
    t.string('nps', 16).nullable();
    t.integer('dn').unsigned().nullable();
    // Line: bare pipe outside diameter; vessel: shell outside diameter.
    t.double('outer_diameter_m').notNullable();
    t.double('length_m').notNullable();
    t.enum('orientation', ['horizontal', 'vertical']).notNullable();
    t.double('height_m').nullable();
    t.enum('head_type', ['flat', 'ellipsoidal2to1', 'hemispherical']).nullable();
    t.enum('location', ['indoor', 'outdoor']).notNullable();
    t.double('operating_temperature_c').notNullable();
    t.json('purposes').notNullable();
    t.json('purpose_parameters').notNullable();
    t.json('fittings').notNullable();
    t.boolean('fittings_insulated').notNullable().defaultTo(true);
    // null: the site's default build-up for the item's service.
    t.json('build_up').nullable();
    t.text('notes').notNullable();
    // Fingerprint of the sizing inputs as they are now; a result whose own fingerprint differs is stale.
    t.string('input_hash', 16).notNullable();
    t.integer('version').unsigned().notNullable().defaultTo(1);
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.integer('updated_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.datetime('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.unique(['site_id', 'kind', 'tag']);
    t.index(['site_id', 'kind', 'id']);
    t.index(['team_id']);
  });
  await knex.schema.createTable('item_results', (t) => {
    t.integer('item_id').unsigned().primary().references('items.id').onDelete('CASCADE');
    t.integer('site_id').unsigned().notNullable().references('sites.id').onDelete('CASCADE');
    t.string('input_hash', 16).notNullable();
    t.string('governing_purpose', 32).nullable();
    t.double('total_thickness_m').nullable();
    t.json('layers_m').notNullable();
    // Lines: W/m; vessels: W (energy basis).
    t.double('heat_loss').nullable();
    t.double('heat_loss_w').nullable();
    t.double('bare_heat_loss_w').nullable();
    t.enum('service_kind', ['hot', 'cold']).nullable();
    t.double('surface_temperature_c').nullable();
    t.string('burn_verdict', 16).nullable();
    t.double('annual_energy_kwh').nullable();
    t.double('bare_annual_energy_kwh').nullable();
    t.boolean('failing').notNullable().defaultTo(false);
    t.json('failing_purposes').notNullable();
    // The whole ItemSizing (shared/calc/sizing), or { error } when the item could not be sized.
    t.json('result').notNullable();
    t.datetime('sized_at', { precision: 3 }).notNullable();
    t.index(['site_id']);
  });
  await knex.schema.createTable('jobs', (t) => {
    t.increments('id').primary();
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE');
    t.integer('site_id').unsigned().nullable().references('sites.id').onDelete('CASCADE');
    t.string('kind', 32).notNullable();
    t.enum('status', ['queued', 'running', 'done', 'failed']).notNullable().defaultTo('queued');
    t.json('params').notNullable();
    t.integer('done').unsigned().notNullable().defaultTo(0);
    t.integer('total').unsigned().notNullable().defaultTo(0);
    // Progress mark: the last item id finished, so an interrupted job resumes after it.
    t.integer('cursor_id').unsigned().notNullable().defaultTo(0);
    t.string('error', 2000).nullable();
    t.string('lease_owner', 64).nullable();
    t.datetime('lease_expires_at', { precision: 3 }).nullable();
    t.integer('attempts').unsigned().notNullable().defaultTo(0);
    t.integer('created_by').unsigned().nullable().references('users.id').onDelete('SET NULL');
    t.datetime('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3));
    t.datetime('started_at', { precision: 3 }).nullable();
    t.datetime('finished_at', { precision: 3 }).nullable();
    t.index(['status', 'lease_expires_at']);
    t.index(['site_id', 'status']);
  });
};

/** @param {import('knex').Knex} knex */
exports.down = async function down(knex) {
  await knex.schema.dropTableIfExists('jobs');
  await knex.schema.dropTableIfExists('item_results');
  await knex.schema.dropTableIfExists('items');
  await knex.schema.alterTable('sites', (t) => {
    t.dropColumn('sizing_settings');
  });
  await knex.schema.dropTableIfExists('team_finishes');
  await knex.schema.dropTableIfExists('team_materials');
};
