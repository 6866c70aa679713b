import type { StoredSizingSettings } from '../../shared/calc/sizing/settings';
import type { ItemSizing, SizingBases } from '../../shared/calc/sizing/types';
import type { RevisionPurpose, RevisionScheme, RevisionStatus } from '../../shared/schemas/revisions';
import { type Db, parseJson } from '../db/db';
import { toItem, type StoredResult } from '../lines/items.repository';
import { listedDraftItem, type ItemStanding, type ListedItem, type RevisionTotals, type SiteSnapshot, type SnapshotItem } from './snapshot';

type Row = Record<string, unknown>;

const iso = (d: unknown) => (d == null ? null : new Date(d as Date).toISOString());

export type Signature = { userId: number | null; name: string; at: string; hash: string | null };

/** A revision as stored, without its items. */
export type RevisionRecord = {
  id: number;
  teamId: number;
  siteId: number;
  series: string;
  sequence: number;
  number: string;
  purpose: RevisionPurpose;
  description: string;
  status: RevisionStatus;
  snapshot: SiteSnapshot;
  snapshotHash: string;
  itemCount: number;
  totals: RevisionTotals;
  prepared: Signature;
  checked: Signature | null;
  approved: Signature | null;
  createdAt: string;
  updatedAt: string;
};

function signature(r: Row, who: 'prepared' | 'checked' | 'approved'): Signature | null {
  const at = r[`${who}_at`];
  if (at == null) return null;
  return {
    userId: (r[`${who}_by`] as number | null) ?? null,
    name: r[`${who}_by_name`] as string,
    at: iso(at) as string,
    hash: who === 'prepared' ? (r.snapshot_hash as string) : ((r[`${who}_hash`] as string | null) ?? null),
  };
}

function toRevision(r: Row, withSnapshot = true): RevisionRecord {
  return {
    id: r.id as number,
    teamId: r.team_id as number,
    siteId: r.site_id as number,
    series: r.series as string,
    sequence: r.sequence as number,
    number: r.number as string,
    purpose: r.purpose as RevisionPurpose,
    description: r.description as string,
    status: r.status as RevisionStatus,
    snapshot: withSnapshot ? parseJson<SiteSnapshot>(r.snapshot, {} as SiteSnapshot) : ({} as SiteSnapshot),
    snapshotHash: r.snapshot_hash as string,
    itemCount: r.item_count as number,
    totals: parseJson<RevisionTotals>(r.totals, {} as RevisionTotals),
    prepared: signature(r, 'prepared') as Signature,
    checked: signature(r, 'checked'),
    approved: signature(r, 'approved'),
    createdAt: iso(r.created_at) as string,
    updatedAt: iso(r.updated_at) as string,
  };
}

const LIST_COLUMNS = [
  'id',
  'team_id',
  'site_id',
  'series',
  'sequence',
  'number',
  'purpose',
  'description',
  'status',
  'snapshot_hash',
  'item_count',
  'totals',
  'prepared_by',
  'prepared_by_name',
  'prepared_at',
  'checked_by',
  'checked_by_name',
  'checked_at',
  'checked_hash',
  'approved_by',
  'approved_by_name',
  'approved_at',
  'approved_hash',
  'created_at',
  'updated_at',
];

/** What a revision needs of its site, read under a row lock so two revisions of one site never race. */
export type SiteForRevision = {
  id: number;
  name: string;
  description: string;
  designBases: SizingBases;
  sizingSettings: Partial<StoredSizingSettings> | null;
  revisionScheme: RevisionScheme | null;
};

export async function readSiteForRevision(db: Db, teamId: number, siteId: number, opts: { lock?: boolean } = {}): Promise<SiteForRevision | undefined> {
  const q = db('sites').where({ team_id: teamId, id: siteId }).first('id', 'name', 'description', 'design_bases', 'sizing_settings', 'revision_scheme');
  if (opts.lock) q.forUpdate();
  const r = await q;
  if (!r) return undefined;
  return {
    id: r.id,
    name: r.name,
    description: r.description,
    designBases: parseJson<SizingBases>(r.design_bases, {}),
    sizingSettings: parseJson<Partial<StoredSizingSettings> | null>(r.sizing_settings, null),
    revisionScheme: parseJson<RevisionScheme | null>(r.revision_scheme, null),
  };
}

export async function writeRevisionScheme(db: Db, teamId: number, siteId: number, scheme: RevisionScheme): Promise<void> {
  await db('sites').where({ team_id: teamId, id: siteId }).update({ revision_scheme: JSON.stringify(scheme), updated_at: db.fn.now(3) });
}

/** Every item of a site with its stored result, in id order. */
export async function listDraftItems(db: Db, siteId: number): Promise<ListedItem[]> {
  const rows: Row[] = await db('items as i')
    .leftJoin('item_results as r', 'r.item_id', 'i.id')
    .where('i.site_id', siteId)
    .orderBy('i.id')
    .select('i.*', 'r.input_hash as r_input_hash', 'r.result as r_result', 'r.sized_at as r_sized_at');
  return rows.map((r) =>
    listedDraftItem(
      toItem(r),
      r.r_input_hash == null
        ? null
        : {
            inputHash: r.r_input_hash as string,
            result: parseJson<StoredResult>(r.r_result, { error: { code: 'UNREADABLE', field: '', message: 'the stored result could not be read' } }),
            sizedAt: iso(r.r_sized_at) as string,
          },
    ),
  );
}

/** Where each item of a site stands (sized on its current inputs, stale, unsized, unsizable), without reading whole results. */
export async function listItemStandings(db: Db, siteId: number): Promise<ItemStanding[]> {
  const rows: Row[] = await db('items as i')
    .leftJoin('item_results as r', 'r.item_id', 'i.id')
    .where('i.site_id', siteId)
    .orderBy('i.id')
    .select(
      'i.id',
      'i.kind',
      'i.tag',
      'i.input_hash',
      'r.input_hash as r_input_hash',
      'r.failing_purposes as r_failing_purposes',
      db.raw("JSON_UNQUOTE(JSON_EXTRACT(r.result, '$.error.message')) as r_error"),
    );
  return rows.map((r) => {
    const error = (r.r_error as string | null) ?? undefined;
    const status: ItemStanding['status'] = r.r_input_hash == null ? 'unsized' : error ? 'error' : r.r_input_hash === r.input_hash ? 'current' : 'stale';
    return {
      itemId: r.id as number,
      kind: r.kind as ItemStanding['kind'],
      tag: r.tag as string,
      status,
      ...(error ? { error } : {}),
      failing: status === 'unsized' || error ? [] : parseJson<ItemStanding['failing']>(r.r_failing_purposes, []),
    };
  });
}

export async function findActiveRevision(db: Db, siteId: number): Promise<RevisionRecord | undefined> {
  const r = await db('revisions').where({ site_id: siteId }).whereIn('status', ['prepared', 'checked']).first(LIST_COLUMNS);
  return r ? toRevision(r, false) : undefined;
}

export async function maxSequence(db: Db, siteId: number, series: string): Promise<number> {
  const r = await db('revisions').where({ site_id: siteId, series }).max<{ m: number | null }[]>({ m: 'sequence' });
  return Number(r[0]?.m ?? 0);
}

export async function numberTaken(db: Db, siteId: number, number: string): Promise<boolean> {
  return !!(await db('revisions').where({ site_id: siteId, number }).first('id'));
}

export type RevisionInsert = {
  teamId: number;
  siteId: number;
  series: string;
  sequence: number;
  number: string;
  purpose: RevisionPurpose;
  description: string;
  snapshot: SiteSnapshot;
  snapshotHash: string;
  itemCount: number;
  totals: RevisionTotals;
  preparedBy: number;
  preparedByName: string;
  preparedAt: Date;
};

export async function insertRevision(db: Db, r: RevisionInsert): Promise<number> {
  const [id] = await db('revisions').insert({
    team_id: r.teamId,
    site_id: r.siteId,
    series: r.series,
    sequence: r.sequence,
    number: r.number,
    purpose: r.purpose,
    description: r.description,
    status: 'prepared',
    snapshot: JSON.stringify(r.snapshot),
    snapshot_hash: r.snapshotHash,
    item_count: r.itemCount,
    totals: JSON.stringify(r.totals),
    prepared_by: r.preparedBy,
    prepared_by_name: r.preparedByName,
    prepared_at: r.preparedAt,
  });
  return id;
}

/** Stores a revision's items, 500 per statement, in the order given. */
export async function insertRevisionItems(db: Db, revisionId: number, items: readonly { item: SnapshotItem; result: ItemSizing; sizedAt: string }[]): Promise<void> {
  for (let i = 0; i < items.length; i += 500) {
    await db('revision_items').insert(
      items.slice(i, i + 500).map((x, k) => ({
        revision_id: revisionId,
        position: i + k,
        item_id: x.item.itemId,
        kind: x.item.kind,
        tag: x.item.tag,
        item: JSON.stringify(x.item),
        result: JSON.stringify(x.result),
        sized_at: new Date(x.sizedAt),
      })),
    );
  }
}

/** A revision of the team (with its site part), or undefined. */
export async function findRevision(db: Db, teamId: number, id: number, opts: { lock?: boolean } = {}): Promise<RevisionRecord | undefined> {
  const q = db('revisions').where({ team_id: teamId, id }).first([...LIST_COLUMNS, 'snapshot']);
  if (opts.lock) q.forUpdate();
  const r = await q;
  return r ? toRevision(r) : undefined;
}

/** A site's revisions, newest first (without their site part). */
export async function listRevisions(db: Db, siteId: number): Promise<RevisionRecord[]> {
  const rows: Row[] = await db('revisions').where({ site_id: siteId }).orderBy('id', 'desc').select(LIST_COLUMNS);
  return rows.map((r) => toRevision(r, false));
}

/** The items of a revision in their stored order. */
export async function listRevisionItems(db: Db, revisionId: number): Promise<ListedItem[]> {
  const rows: Row[] = await db('revision_items').where({ revision_id: revisionId }).orderBy('position').select('item', 'result', 'sized_at');
  return rows.map((r) => ({
    item: parseJson<SnapshotItem>(r.item, {} as SnapshotItem),
    result: parseJson<ItemSizing | null>(r.result, null),
    status: 'current' as const,
    sizedAt: iso(r.sized_at),
  }));
}

/** Records a signature when the revision is still in the expected state; returns whether it was. */
export async function recordSignature(
  db: Db,
  id: number,
  who: 'checked' | 'approved',
  s: { userId: number; name: string; at: Date; hash: string },
  from: RevisionStatus,
): Promise<boolean> {
  const n = await db('revisions')
    .where({ id, status: from })
    .update({
      status: who === 'checked' ? 'checked' : 'issued',
      [`${who}_by`]: s.userId,
      [`${who}_by_name`]: s.name,
      [`${who}_at`]: s.at,
      [`${who}_hash`]: s.hash,
      updated_at: db.fn.now(3),
    });
  return n === 1;
}

export async function updateRevisionDescription(db: Db, id: number, description: string): Promise<boolean> {
  const n = await db('revisions').where({ id, status: 'prepared' }).update({ description, updated_at: db.fn.now(3) });
  return n === 1;
}

/** Withdraws a revision that was never issued (its items go with it). */
export async function deleteUnissuedRevision(db: Db, id: number): Promise<boolean> {
  const n = await db('revisions').where({ id }).whereNot({ status: 'issued' }).delete();
  return n === 1;
}
