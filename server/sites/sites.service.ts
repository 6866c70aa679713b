import type { DesignBases, SiteCreateInput, SitePatchInput } from '../../shared/schemas/sites';
import { can } from '../../shared/schemas/permissions';
import { insertAudit } from '../audit/audit.repository';
import type { Caller } from '../auth/auth.service';
import { type Db, inTransaction } from '../db/db';
import { errors } from '../errors';
import { findMember } from '../team/teams.repository';
import { refreshSiteInputHashes } from '../sizing/sizing-context';
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

type Change = { from: unknown; to: unknown };

/** Leaf values of a design-bases object, keyed by their path ("designBases.touch.airTemperatureC"). */
function leaves(value: unknown, prefix: string, out: Map<string, unknown> = new Map()): Map<string, unknown> {
  if (value !== null && typeof value === 'object' && !Array.isArray(value)) {
    for (const [k, v] of Object.entries(value)) leaves(v, `${prefix}.${k}`, out);
  } else if (value !== undefined) {
    out.set(prefix, value);
  }
  return out;
}

/** What an edit really changes, field by field (a basis given replaces that basis, so a dropped value is a change). */
function siteChanges(site: repo.Site, next: { name: string; description: string; designBases: DesignBases }): Record<string, Change> {
  const changes: Record<string, Change> = {};
  if (next.name !== site.name) changes.name = { from: site.name, to: next.name };
  if (next.description !== site.description) changes.description = { from: site.description, to: next.description };
  const before = leaves(site.designBases, 'designBases');
  const after = leaves(next.designBases, 'designBases');
  for (const field of new Set([...before.keys(), ...after.keys()])) {
    const from = before.get(field) ?? null;
    const to = after.get(field) ?? null;
    if (JSON.stringify(from) !== JSON.stringify(to)) changes[field] = { from, to };
  }
  return changes;
}

/**
 * Edits a site. A role with only 'site.editTouchBasis' (safety officers) may send the touch-safety
 * basis and nothing else. Only real changes are written and audited (the audit row lists them); an
 * edit that changes nothing answers the site as it is.
 */
export async function updateSite(deps: { db: Db }, caller: Caller, id: number, patch: SitePatchInput, ip?: string) {
  if (!can(caller.role, 'site.edit')) {
    const outsideReach = [
      ...(patch.name !== undefined ? ['name'] : []),
      ...(patch.description !== undefined ? ['description'] : []),
      ...Object.keys(patch.designBases ?? {})
        .filter((k) => k !== 'touch')
        .map((k) => `designBases.${k}`),
    ];
    if (outsideReach.length) throw errors.forbidden(`Your role may change the touch-safety basis only (not ${outsideReach.join(', ')}).`);
  }
  return inTransaction(deps.db, async (trx) => {
    const site = await repo.findSite(trx, caller.teamId, id, visibleTo(caller), { lock: true });
    if (!site) throw errors.notFound('The site');
    const next = {
      name: patch.name ?? site.name,
      description: patch.description ?? site.description,
      designBases: patch.designBases ? { ...site.designBases, ...patch.designBases } : site.designBases,
    };
    const changes = siteChanges(site, next);
    const changed = Object.keys(changes);
    if (!changed.length) return site;
    if (changes.name) await assertNameFree(trx, caller.teamId, next.name, id);
    await repo.updateSite(trx, caller.teamId, id, {
      name: changes.name ? next.name : undefined,
      description: changes.description ? next.description : undefined,
      designBases: changed.some((f) => f.startsWith('designBases.')) ? next.designBases : undefined,
    });
    // Bases feed every item's sizing: the items whose numbers change read as stale now.
    if (changed.some((f) => f.startsWith('designBases.'))) await refreshSiteInputHashes(trx, caller.teamId, id);
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'site.updated', targetType: 'site', targetId: id, details: { changed, changes }, ip });
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
