import type { DesignBases, SiteCreateInput, SitePatchInput } from '../../shared/schemas/sites';
import { can } from '../../shared/schemas/permissions';
import { insertAudit } from '../audit/audit.repository';
import type { Caller } from '../auth/auth.service';
import { type Db, inTransaction } from '../db/db';
import { errors } from '../errors';
import { findMember } from '../team/teams.repository';
import * as repo from './sites.repository';

/**
 * Defaults a new site starts from (SI, °C); every value is editable. They are examples, not any site's data:
 * the winter basis in particular (−10 °C, 5 m/s) is a placeholder to replace with the site's own coldest
 * design conditions (local climate records or the plant's specification).
 */
export const DEFAULT_DESIGN_BASES: DesignBases = {
  touch: { airTemperatureC: 35, windSpeedMS: 0, surfaceEmissivity: 0.9, contactSeconds: 5 },
  energy: { airTemperatureC: 10, windSpeedMS: 3, operatingHoursPerYear: 8000, heatSourceEfficiency: 0.85 },
  condensation: { airTemperatureC: 30, relativeHumidityPct: 80, marginK: 1 },
  winter: { airTemperatureC: -10, windSpeedMS: 5 },
};

/** Contractors see only the sites they were invited to. */
const visibleTo = (caller: Caller) => (caller.role === 'contractor' ? caller.userId : undefined);

async function assertNameFree(trx: Db, teamId: number, name: string, exceptId?: number): Promise<void> {
  if (await repo.siteNameTaken(trx, teamId, name, exceptId)) throw errors.conflict('NAME_TAKEN', 'The team already has a site with this name.', 'name');
}

export const listSites = (deps: { db: Db }, caller: Caller) => repo.listSites(deps.db, caller.teamId, visibleTo(caller));

export async function getSite(deps: { db: Db }, caller: Caller, id: number) {
  const site = await repo.findSite(deps.db, caller.teamId, id, visibleTo(caller));
  if (!site) throw errors.notFound('The site');
  const members = can(caller.role, 'site.members') ? await repo.listSiteMembers(deps.db, id) : undefined;
  return { ...site, ...(members ? { members } : {}) };
}

export async function createSite(deps: { db: Db }, caller: Caller, input: SiteCreateInput, ip?: string) {
  return inTransaction(deps.db, async (trx) => {
    await assertNameFree(trx, caller.teamId, input.name);
    const id = await repo.insertSite(trx, {
      teamId: caller.teamId,
      name: input.name,
      description: input.description ?? '',
      designBases: { ...DEFAULT_DESIGN_BASES, ...(input.designBases ?? {}) },
      createdBy: caller.userId,
    });
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'site.created', targetType: 'site', targetId: id, ip });
    return (await repo.findSite(trx, caller.teamId, id))!;
  });
}

/**
 * Edits a site. A role with only 'site.editTouchBasis' (safety officers) may change the touch-safety
 * basis and nothing else.
 */
export async function updateSite(deps: { db: Db }, caller: Caller, id: number, patch: SitePatchInput, ip?: string) {
  if (!can(caller.role, 'site.edit')) {
    const onlyTouch =
      patch.name === undefined &&
      patch.description === undefined &&
      patch.designBases !== undefined &&
      Object.keys(patch.designBases).every((k) => k === 'touch');
    if (!onlyTouch) throw errors.forbidden('Your role may change the touch-safety basis only.');
  }
  return inTransaction(deps.db, async (trx) => {
    const site = await repo.findSite(trx, caller.teamId, id, visibleTo(caller));
    if (!site) throw errors.notFound('The site');
    if (patch.name !== undefined) await assertNameFree(trx, caller.teamId, patch.name, id);
    await repo.updateSite(trx, caller.teamId, id, {
      name: patch.name,
      description: patch.description,
      designBases: patch.designBases ? { ...site.designBases, ...patch.designBases } : undefined,
    });
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'site.updated', targetType: 'site', targetId: id, details: { fields: Object.keys(patch) }, ip });
    return (await repo.findSite(trx, caller.teamId, id))!;
  });
}

export async function deleteSite(deps: { db: Db }, caller: Caller, id: number, ip?: string): Promise<void> {
  await inTransaction(deps.db, async (trx) => {
    const n = await repo.deleteSite(trx, caller.teamId, id);
    if (!n) throw errors.notFound('The site');
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'site.deleted', targetType: 'site', targetId: id, ip });
  });
}

export async function addSiteMember(deps: { db: Db }, caller: Caller, siteId: number, userId: number, ip?: string) {
  return inTransaction(deps.db, async (trx) => {
    if (!(await repo.findSite(trx, caller.teamId, siteId))) throw errors.notFound('The site');
    if (!(await findMember(trx, caller.teamId, userId))) throw errors.badRequest('VALIDATION_FAILED', 'This person is not a member of the team.', 'userId');
    await repo.addSiteMember(trx, siteId, userId, caller.userId);
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'site.member_added', targetType: 'site', targetId: siteId, details: { userId }, ip });
    return repo.listSiteMembers(trx, siteId);
  });
}

export async function removeSiteMember(deps: { db: Db }, caller: Caller, siteId: number, userId: number, ip?: string): Promise<void> {
  await inTransaction(deps.db, async (trx) => {
    if (!(await repo.findSite(trx, caller.teamId, siteId))) throw errors.notFound('The site');
    if (!(await repo.removeSiteMember(trx, siteId, userId))) throw errors.notFound('The site member');
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'site.member_removed', targetType: 'site', targetId: siteId, details: { userId }, ip });
  });
}
