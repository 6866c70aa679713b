import type { DesignBases } from '../../shared/schemas/sites';
import { type Db, parseJson } from '../db/db';

export type Site = {
  id: number;
  name: string;
  description: string;
  designBases: DesignBases;
  createdAt: string;
  updatedAt: string;
};

type SiteRow = { id: number; team_id: number; name: string; description: string; design_bases: unknown; created_at: Date; updated_at: Date };

function toSite(r: SiteRow): Site {
  return {
    id: r.id,
    name: r.name,
    description: r.description,
    designBases: parseJson<DesignBases>(r.design_bases, {}),
    createdAt: new Date(r.created_at).toISOString(),
    updatedAt: new Date(r.updated_at).toISOString(),
  };
}

/** The team's sites; when onlyForUserId is given, only the sites that user was invited to. */
function visibleSites(db: Db, teamId: number, onlyForUserId?: number) {
  const q = db<SiteRow>('sites').where({ team_id: teamId });
  if (onlyForUserId !== undefined) q.whereIn('id', db('site_members').select('site_id').where({ user_id: onlyForUserId }));
  return q;
}

export async function listSites(db: Db, teamId: number, onlyForUserId?: number): Promise<Site[]> {
  return (await visibleSites(db, teamId, onlyForUserId).orderBy('name')).map(toSite);
}

export async function findSite(db: Db, teamId: number, id: number, onlyForUserId?: number, opts: { lock?: boolean } = {}): Promise<Site | undefined> {
  const q = visibleSites(db, teamId, onlyForUserId).where({ id }).first();
  // Locked inside an edit, so two concurrent edits diff against what the other wrote.
  const row = await (opts.lock ? q.forUpdate() : q);
  return row ? toSite(row) : undefined;
}

export async function siteNameTaken(db: Db, teamId: number, name: string, exceptId?: number): Promise<boolean> {
  const q = db('sites').where({ team_id: teamId, name }).first('id');
  if (exceptId !== undefined) q.whereNot({ id: exceptId });
  return !!(await q);
}

export async function insertSite(
  db: Db,
  s: { teamId: number; name: string; description: string; designBases: DesignBases; createdBy: number | null },
): Promise<number> {
  const [id] = await db('sites').insert({
    team_id: s.teamId,
    name: s.name,
    description: s.description,
    design_bases: JSON.stringify(s.designBases),
    created_by: s.createdBy,
  });
  return id;
}

export async function updateSite(
  db: Db,
  teamId: number,
  id: number,
  patch: { name?: string; description?: string; designBases?: DesignBases },
): Promise<void> {
  const row: Record<string, unknown> = { updated_at: db.fn.now(3) };
  if (patch.name !== undefined) row.name = patch.name;
  if (patch.description !== undefined) row.description = patch.description;
  if (patch.designBases !== undefined) row.design_bases = JSON.stringify(patch.designBases);
  await db('sites').where({ team_id: teamId, id }).update(row);
}

export async function deleteSite(db: Db, teamId: number, id: number): Promise<number> {
  return db('sites').where({ team_id: teamId, id }).delete();
}

export async function listSiteMembers(db: Db, siteId: number): Promise<{ userId: number; name: string; email: string }[]> {
  const rows = await db('site_members as sm')
    .join('users as u', 'u.id', 'sm.user_id')
    .select('u.id', 'u.name', 'u.email')
    .where({ 'sm.site_id': siteId })
    .orderBy('u.name');
  return rows.map((r: { id: number; name: string; email: string }) => ({ userId: r.id, name: r.name, email: r.email }));
}

export async function addSiteMember(db: Db, siteId: number, userId: number, addedBy: number): Promise<void> {
  await db('site_members').insert({ site_id: siteId, user_id: userId, added_by: addedBy }).onConflict(['site_id', 'user_id']).ignore();
}

export async function removeSiteMember(db: Db, siteId: number, userId: number): Promise<number> {
  return db('site_members').where({ site_id: siteId, user_id: userId }).delete();
}
