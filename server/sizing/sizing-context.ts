import { sizingLibrary } from '../../shared/calc/sizing/library';
import { DEFAULT_SIZING_SETTINGS, toSizingSettings, type StoredSizingSettings } from '../../shared/calc/sizing/settings';
import { sizingInputHash } from '../../shared/calc/sizing/size-item';
import type { SizingContext, SizingLibraryData, SizingTask } from '../../shared/calc/sizing/types';
import type { Db } from '../db/db';
import { errors } from '../errors';
import { listTeamFinishes, listTeamMaterials } from '../library/library.repository';
import { listSiteItems, setInputHashes, type ItemRecord } from '../lines/items.repository';
import { readSiteSizing, siteIdsOfTeam } from './sizing.repository';

/** A team's own materials and finishes in the shape sizing uses. */
export async function teamLibrary(db: Db, teamId: number): Promise<Partial<SizingLibraryData>> {
  const [materials, finishes] = await Promise.all([listTeamMaterials(db, teamId), listTeamFinishes(db, teamId)]);
  return {
    materials: materials.map((m) => ({
      id: m.materialId,
      name: m.name,
      conductivity: m.conductivity,
      maxServiceTemperatureC: m.maxServiceTemperatureC,
      minServiceTemperatureC: m.minServiceTemperatureC,
      conductivityDataRangeC: [Math.min(...m.tablePoints.map((p) => p.meanTemperatureC)), Math.max(...m.tablePoints.map((p) => p.meanTemperatureC))],
    })),
    finishes: finishes.map((f) => ({ id: f.finishId, name: f.name, emissivity: f.emissivity, emissivityRange: f.emissivityRange, contactMaterial: f.contactMaterial })),
  };
}

/** A site's stored settings with the defaults filled in. */
export function storedSettingsOf(stored: Partial<StoredSizingSettings> | null): StoredSizingSettings {
  return { ...DEFAULT_SIZING_SETTINGS, ...(stored ?? {}), defaultBuildUps: { ...DEFAULT_SIZING_SETTINGS.defaultBuildUps, ...(stored?.defaultBuildUps ?? {}) } };
}

/** Everything sizing needs of a site: its bases, settings and the team's library. */
export async function loadSizingContext(db: Db, teamId: number, siteId: number, library?: Partial<SizingLibraryData>): Promise<SizingContext> {
  const site = await readSiteSizing(db, teamId, siteId);
  if (!site) throw errors.notFound('The site');
  return {
    bases: site.designBases,
    settings: toSizingSettings(storedSettingsOf(site.sizingSettings)),
    library: sizingLibrary(library ?? (await teamLibrary(db, teamId))),
  };
}

/** The physical item and build-up sizing sees (tag, service and notes left out: they change no number). */
export function taskOf(item: ItemRecord): SizingTask {
  return {
    item: {
      kind: item.kind,
      outerDiameterM: item.outerDiameterM,
      nps: item.nps,
      lengthM: item.lengthM,
      orientation: item.orientation,
      heightM: item.heightM,
      headType: item.headType,
      location: item.location,
      operatingTemperatureC: item.operatingTemperatureC,
      purposes: item.purposes,
      purposeParameters: item.purposeParameters,
      fittings: item.fittings,
      fittingsInsulated: item.fittingsInsulated,
    },
    buildUp: item.buildUp,
  };
}

/**
 * Recomputes the input fingerprint of every item of a site (after its bases, settings or the team's library
 * changed), so exactly the items whose numbers would change read as stale.
 */
export async function refreshSiteInputHashes(db: Db, teamId: number, siteId: number, library?: Partial<SizingLibraryData>): Promise<number> {
  const ctx = await loadSizingContext(db, teamId, siteId, library);
  let changed = 0;
  let afterId = 0;
  for (;;) {
    const items = await listSiteItems(db, siteId, { afterId, limit: 2000 });
    if (items.length === 0) break;
    const updates = items.map((it) => ({ id: it.id, hash: sizingInputHash(taskOf(it), ctx) })).filter((u, k) => u.hash !== items[k].inputHash);
    await setInputHashes(db, updates);
    changed += updates.length;
    afterId = items[items.length - 1].id;
  }
  return changed;
}

/** The same for every site of a team (after a team material or finish changed). */
export async function refreshTeamInputHashes(db: Db, teamId: number): Promise<number> {
  const library = await teamLibrary(db, teamId);
  let changed = 0;
  for (const siteId of await siteIdsOfTeam(db, teamId)) changed += await refreshSiteInputHashes(db, teamId, siteId, library);
  return changed;
}
