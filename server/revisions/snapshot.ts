/**
 * What a revision holds and how it is fingerprinted: the site part (name, design bases, sizing settings, the
 * names of the materials and finishes used) and every item with its inputs and the sizing result it was
 * issued with. Pure functions; the repository stores these shapes as they are.
 */
import crypto from 'node:crypto';

import type { StoredSizingSettings } from '../../shared/calc/sizing/settings';
import { canonicalJson } from '../../shared/calc/sizing/hash';
import type { ItemSizing, SizingBases, SizingLibraryData } from '../../shared/calc/sizing/types';
import type { RevisionTotals } from '../../shared/schemas/revisions';
import type { ItemRecord, StoredResult } from '../lines/items.repository';

/** An item's inputs as a revision keeps them (SI; no team, site, version or timestamps). */
export type SnapshotItem = Omit<ItemRecord, 'id' | 'teamId' | 'siteId' | 'version' | 'createdAt' | 'updatedAt'> & { itemId: number };

/** The site as a revision keeps it. */
export type SiteSnapshot = {
  site: { id: number; name: string; description: string };
  designBases: SizingBases;
  sizingSettings: StoredSizingSettings;
  /** Names (and sources of team entries) of every material and finish the items use. */
  library: { materials: { id: string; name: string }[]; finishes: { id: string; name: string }[] };
};

/** Where an item of a line list stands for issue. */
export type ItemStatus = 'current' | 'stale' | 'unsized' | 'error';

/** One item of a line list (draft or revision) with the result it carries. */
export type ListedItem = {
  item: SnapshotItem;
  /** The sizing result; null when unsized or when sizing could not run for it. */
  result: ItemSizing | null;
  status: ItemStatus;
  sizedAt: string | null;
  /** Why sizing could not run (status `error`). */
  error?: string;
};

export function snapshotItemOf(it: ItemRecord): SnapshotItem {
  const { id, teamId: _t, siteId: _s, version: _v, createdAt: _c, updatedAt: _u, ...rest } = it;
  return { itemId: id, ...rest };
}

/** An item of the draft with its stored result and whether that result still matches its inputs. */
export function listedDraftItem(it: ItemRecord, stored: { inputHash: string; result: StoredResult; sizedAt: string } | null): ListedItem {
  const item = snapshotItemOf(it);
  if (!stored) return { item, result: null, status: 'unsized', sizedAt: null };
  if ('error' in stored.result) return { item, result: null, status: 'error', sizedAt: stored.sizedAt, error: stored.result.error.message };
  return { item, result: stored.result, status: stored.inputHash === it.inputHash ? 'current' : 'stale', sizedAt: stored.sizedAt };
}

export type Blocker = { itemId: number; kind: SnapshotItem['kind']; tag: string; reason: Exclude<ItemStatus, 'current'>; message: string };

const KIND_WORD = { line: 'Line', vessel: 'Vessel' } as const;

/** Where one item stands, all that readiness needs of it. */
export type ItemStanding = { itemId: number; kind: SnapshotItem['kind']; tag: string; status: ItemStatus; error?: string; failing: ItemSizing['failing'] };

export const standingOf = (x: ListedItem): ItemStanding => ({ itemId: x.item.itemId, kind: x.item.kind, tag: x.item.tag, status: x.status, error: x.error, failing: x.result?.failing ?? [] });

/** What keeps a line list from being issued: every item not sized on its current inputs, with the reason. */
export function blockersOf(items: readonly ItemStanding[]): Blocker[] {
  const out: Blocker[] = [];
  for (const x of items) {
    if (x.status === 'current') continue;
    const what = `${KIND_WORD[x.kind]} ${x.tag}`;
    const message =
      x.status === 'unsized'
        ? `${what} has not been sized: size the site.`
        : x.status === 'stale'
          ? `${what} changed since it was sized (its inputs, the site's bases or settings, or a material): size the site again.`
          : `${what} could not be sized: ${x.error ?? 'fix its inputs'}.`;
    out.push({ itemId: x.itemId, kind: x.kind, tag: x.tag, reason: x.status, message });
  }
  return out;
}

/** Materials and finishes an item list uses, with their names from the library (ids kept when unknown). */
export function libraryUsed(items: readonly ListedItem[], library: SizingLibraryData, settings: StoredSizingSettings): SiteSnapshot['library'] {
  const materials = new Set<string>();
  const finishes = new Set<string>();
  for (const b of [settings.defaultBuildUps.hot, settings.defaultBuildUps.cold]) {
    b.layers.forEach((l) => materials.add(l.materialId));
    finishes.add(b.finishId);
  }
  for (const x of items) {
    x.item.buildUp?.layers.forEach((l) => materials.add(l.materialId));
    if (x.item.buildUp) finishes.add(x.item.buildUp.finishId);
    x.result?.layers.forEach((l) => materials.add(l.materialId));
    if (x.result) finishes.add(x.result.finishId);
  }
  const nameOf = (list: readonly { id: string; name: string }[], id: string) => list.find((m) => m.id === id)?.name ?? id;
  return {
    materials: [...materials].sort().map((id) => ({ id, name: nameOf(library.materials, id) })),
    finishes: [...finishes].sort().map((id) => ({ id, name: nameOf(library.finishes, id) })),
  };
}

/**
 * SHA-256 over the canonical JSON of the site part and of every item in order: equal hashes, equal
 * revisions. This is what the checker and the approver sign.
 */
export function snapshotHash(site: SiteSnapshot, items: readonly { item: SnapshotItem; result: ItemSizing; sizedAt: string }[]): string {
  const h = crypto.createHash('sha256');
  h.update(canonicalJson(site));
  for (const x of items) {
    h.update('\n');
    h.update(canonicalJson(x));
  }
  return h.digest('hex');
}

export type { RevisionTotals };

export function totalsOf(items: readonly ListedItem[]): RevisionTotals {
  const t: RevisionTotals = { lines: 0, vessels: 0, heatLossW: 0, bareHeatLossW: 0, annualEnergyKWh: 0, bareAnnualEnergyKWh: 0, failing: 0 };
  for (const x of items) {
    if (x.item.kind === 'line') t.lines++;
    else t.vessels++;
    const r = x.result;
    if (!r) continue;
    t.heatLossW += r.heatLossW ?? 0;
    t.bareHeatLossW += r.bareHeatLossW ?? 0;
    t.annualEnergyKWh += r.annualEnergyKWh ?? 0;
    t.bareAnnualEnergyKWh += r.bareAnnualEnergyKWh ?? 0;
    if (r.failing.length > 0) t.failing++;
  }
  return t;
}
