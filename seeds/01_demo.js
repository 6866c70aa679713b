// @ts-check
/**
 * Demo data: an invented plant, Ashcombe Vale Works, with one user per role and a second engineer (so three
 * people can prepare, check and approve a revision; credentials in demo-credentials.json, printed at
 * start-up) and a few sites with their design bases.
 */
const crypto = require('node:crypto');
const bcrypt = require('bcrypt');
const demo = require('./demo-credentials.json');

/** Same pre-hash as server/auth/passwords.ts (bcrypt reads only 72 bytes). */
const preHash = (/** @type {string} */ pw) => crypto.createHash('sha256').update(pw, 'utf8').digest('base64');

const touch = (/** @type {number} */ airC) => ({ airTemperatureC: airC, windSpeedMS: 0, surfaceEmissivity: 0.9, contactSeconds: 5 });
const energy = (/** @type {number} */ airC, /** @type {number} */ wind) => ({
  airTemperatureC: airC,
  windSpeedMS: wind,
  operatingHoursPerYear: 8000,
  energyPricePerKWh: 0.045,
  currency: 'EUR',
  heatSourceEfficiency: 0.85,
  co2KgPerKWh: 0.202,
  co2Basis: 'Natural gas, combustion only (common practice factor)',
  // Cold service: heat gains are removed by the chillers, driven by grid electricity (invented demo figures).
  coolingCop: 3.5,
  electricityPricePerKWh: 0.19,
  electricityCo2KgPerKWh: 0.35,
  electricityCo2Basis: 'Grid electricity, location-based average (demo figure)',
});
const condensation = (/** @type {number} */ airC, /** @type {number} */ rh) => ({ airTemperatureC: airC, relativeHumidityPct: rh, marginK: 1 });
/** Coldest design conditions (invented): indoor sites in an unheated building during a cold spell. */
const winter = (/** @type {number} */ airC, /** @type {number} */ wind) => ({ airTemperatureC: airC, windSpeedMS: wind });

const SITES = [
  { name: 'Boiler house', description: 'Two fire-tube steam boilers, 12 bar(g) saturated steam headers and condensate return.', indoor: true, winter: winter(-2, 0) },
  { name: 'Thermal-oil loop', description: 'Hot-oil heater and distribution to the reactor jackets, 290 °C supply.', indoor: false, winter: winter(-12, 6) },
  { name: 'Tank farm', description: 'Heated storage tanks for heavy fuel oil and bitumen, with tracing.', indoor: false, winter: winter(-14, 8) },
  { name: 'Process unit 2', description: 'Distillation train and reboilers, mixed hot and cold service.', indoor: false, winter: winter(-12, 5) },
  { name: 'Chilled water', description: 'Chillers and the 6/12 °C chilled-water distribution to the control buildings.', indoor: true, winter: winter(-3, 0) },
];

/** @param {import('knex').Knex} knex */
exports.seed = async function seed(knex) {
  await knex.raw('SET FOREIGN_KEY_CHECKS = 0');
  try {
    for (const table of ['site_members', 'sites', 'audit_log', 'password_resets', 'invitations', 'user_settings', 'memberships', 'users', 'teams', 'sessions']) {
      await knex(table).truncate();
    }
  } finally {
    await knex.raw('SET FOREIGN_KEY_CHECKS = 1');
  }
  const passwordHash = await bcrypt.hash(preHash(demo.password), 12);
  const [teamId] = await knex('teams').insert({ name: demo.teamName });
  /** @type {Record<string, number>} */
  const ids = {};
  for (const u of demo.users) {
    const [id] = await knex('users').insert({ email: u.email, name: u.name, password_hash: passwordHash });
    // The first user of a role stands for it (the second engineer only signs revisions).
    ids[u.role] ??= id;
    await knex('memberships').insert({ team_id: teamId, user_id: id, role: u.role });
    await knex('user_settings').insert({ user_id: id, unit_system: u.role === 'contractor' ? 'US' : 'SI' });
  }
  for (const s of SITES) {
    const [siteId] = await knex('sites').insert({
      team_id: teamId,
      name: s.name,
      description: s.description,
      design_bases: JSON.stringify({
        touch: touch(s.indoor ? 40 : 35),
        energy: energy(s.indoor ? 20 : 9, s.indoor ? 0 : 3.5),
        condensation: condensation(s.indoor ? 28 : 30, s.indoor ? 70 : 85),
        winter: s.winter,
      }),
      created_by: ids.engineer,
    });
    // The contractor quotes the boiler house and the tank farm only.
    if (s.name === 'Boiler house' || s.name === 'Tank farm') {
      await knex('site_members').insert({ site_id: siteId, user_id: ids.contractor, added_by: ids.engineer });
    }
  }
};
