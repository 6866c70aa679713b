// @ts-check
/**
 * Demo revisions: the boiler house's line list issued for review as revision A — prepared by the engineer,
 * checked by the second engineer, approved by the owner — through the same code the API runs. Earlier seeds
 * reset the sites, so the revision tables are reset here too (truncation bypasses the triggers that keep
 * issued revisions read-only; nothing else may).
 */
/**
 * TypeScript modules of the product: through tsx when the knex command runs the seed, through the test
 * runner's own transform when a test does.
 * @param {string} file
 */
function load(file) {
  if (process.env.JEST_WORKER_ID) return require(file);
  return require('tsx/cjs/api').require(file, __filename);
}

/** @type {typeof import('../server/revisions/revisions.service')} */
const revisions = load('../server/revisions/revisions.service.ts');
const demo = require('./demo-credentials.json');

/** @param {import('knex').Knex} knex */
exports.seed = async function seed(knex) {
  await knex.raw('SET FOREIGN_KEY_CHECKS = 0');
  try {
    for (const table of ['revision_items', 'revisions']) await knex(table).truncate();
  } finally {
    await knex.raw('SET FOREIGN_KEY_CHECKS = 1');
  }
  const team = await knex('teams').where({ name: demo.teamName }).first('id');
  const site = team && (await knex('sites').where({ team_id: team.id, name: 'Boiler house' }).first('id'));
  if (!site) return;
  /** @param {string} email */
  const caller = async (email) => {
    const u = await knex('users as u').join('memberships as m', 'm.user_id', 'u.id').where({ 'u.email': email, 'm.team_id': team.id }).first('u.id', 'u.name', 'm.role');
    return { userId: u.id, teamId: team.id, role: u.role, email, name: u.name };
  };
  const deps = { db: knex };
  const rev = await revisions.prepareRevision(deps, await caller('engineer@lagline.test'), site.id, {
    purpose: 'review',
    description: 'Steam and condensate insulation schedule for comment before the tender.',
  });
  await revisions.checkRevision(deps, await caller('checker@lagline.test'), rev.id, { snapshotHash: rev.snapshotHash });
  await revisions.approveRevision(deps, await caller('owner@lagline.test'), rev.id, { snapshotHash: rev.snapshotHash });
};
