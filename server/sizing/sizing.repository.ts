import type { StoredSizingSettings } from '../../shared/calc/sizing/settings';
import type { SizingBases } from '../../shared/calc/sizing/types';
import { type Db, parseJson } from '../db/db';

/** What sizing reads of a site. */
export type SiteSizingRow = { id: number; teamId: number; designBases: SizingBases; sizingSettings: Partial<StoredSizingSettings> | null };

export async function readSiteSizing(db: Db, teamId: number, siteId: number): Promise<SiteSizingRow | undefined> {
  const r = await db('sites').where({ team_id: teamId, id: siteId }).first('id', 'team_id', 'design_bases', 'sizing_settings');
  if (!r) return undefined;
  return {
    id: r.id,
    teamId: r.team_id,
    designBases: parseJson<SizingBases>(r.design_bases, {}),
    sizingSettings: parseJson<Partial<StoredSizingSettings> | null>(r.sizing_settings, null),
  };
}

export async function writeSiteSizingSettings(db: Db, teamId: number, siteId: number, settings: StoredSizingSettings): Promise<void> {
  await db('sites').where({ team_id: teamId, id: siteId }).update({ sizing_settings: JSON.stringify(settings), updated_at: db.fn.now(3) });
}

export async function siteIdsOfTeam(db: Db, teamId: number): Promise<number[]> {
  return (await db('sites').where({ team_id: teamId }).select('id')).map((r: { id: number }) => r.id);
}
