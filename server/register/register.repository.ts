import type { MeasurementMethod } from '../../shared/calc/register';
import type { ContactMaterial } from '../../shared/calc/types';
import type { RegisterStatus } from '../../shared/schemas/register';
import type { Role } from '../../shared/schemas/common';
import type { DesignBases } from '../../shared/schemas/sites';
import { type Db, parseJson } from '../db/db';

type Row = Record<string, unknown>;

const iso = (d: unknown) => new Date(d as Date).toISOString();
const isoOrNull = (d: unknown) => (d ? iso(d) : null);
const numOrNull = (v: unknown) => (v === null || v === undefined ? null : Number(v));

/** A register entry as stored, with the names the views show. */
export type EntryRecord = {
  id: number;
  teamId: number;
  siteId: number;
  siteName: string;
  itemId: number | null;
  itemKind: 'line' | 'vessel' | null;
  itemTag: string | null;
  itemInputHash: string | null;
  location: string;
  description: string;
  measuredTemperatureC: number;
  method: MeasurementMethod;
  emissivitySetting: number | null;
  surfaceMaterial: ContactMaterial;
  surfaceFinishId: string | null;
  withinReach: boolean;
  contactSeconds: number | null;
  measuredAt: string;
  status: RegisterStatus;
  action: string;
  ownerUserId: number | null;
  ownerName: string | null;
  dueDate: string | null;
  assignedBy: number | null;
  statusNote: string;
  closedBy: number | null;
  closedByName: string | null;
  closedAt: string | null;
  verificationTemperatureC: number | null;
  version: number;
  createdBy: number | null;
  createdByName: string | null;
  createdAt: string;
  updatedAt: string;
  photoCount: number;
};

/** The stored fields an insert or update writes (SI); times as Dates. */
export type EntryWrite = Omit<
  EntryRecord,
  'id' | 'teamId' | 'siteName' | 'itemKind' | 'itemTag' | 'ownerName' | 'closedByName' | 'version' | 'createdBy' | 'createdByName' | 'createdAt' | 'updatedAt' | 'photoCount' | 'measuredAt' | 'closedAt'
> & { measuredAt: Date; closedAt: Date | null };

const COLUMNS: Record<keyof EntryWrite, string> = {
  siteId: 'site_id',
  itemId: 'item_id',
  itemInputHash: 'item_input_hash',
  location: 'location',
  description: 'description',
  measuredTemperatureC: 'measured_temperature_c',
  method: 'method',
  emissivitySetting: 'emissivity_setting',
  surfaceMaterial: 'surface_material',
  surfaceFinishId: 'surface_finish_id',
  withinReach: 'within_reach',
  contactSeconds: 'contact_seconds',
  measuredAt: 'measured_at',
  status: 'status',
  action: 'action',
  ownerUserId: 'owner_user_id',
  dueDate: 'due_date',
  assignedBy: 'assigned_by',
  statusNote: 'status_note',
  closedBy: 'closed_by',
  closedAt: 'closed_at',
  verificationTemperatureC: 'verification_temperature_c',
};

function rowOf(w: Partial<EntryWrite>): Row {
  const row: Row = {};
  for (const [k, col] of Object.entries(COLUMNS) as [keyof EntryWrite, string][]) {
    if (w[k] !== undefined) row[col] = w[k];
  }
  return row;
}

function toEntry(r: Row): EntryRecord {
  return {
    id: r.id as number,
    teamId: r.team_id as number,
    siteId: r.site_id as number,
    siteName: r.site_name as string,
    itemId: (r.item_id as number | null) ?? null,
    itemKind: (r.item_kind as 'line' | 'vessel' | null) ?? null,
    itemTag: (r.item_tag as string | null) ?? null,
    itemInputHash: (r.item_input_hash as string | null) ?? null,
    location: r.location as string,
    description: r.description as string,
    measuredTemperatureC: Number(r.measured_temperature_c),
    method: r.method as MeasurementMethod,
    emissivitySetting: numOrNull(r.emissivity_setting),
    surfaceMaterial: r.surface_material as ContactMaterial,
    surfaceFinishId: (r.surface_finish_id as string | null) ?? null,
    withinReach: !!r.within_reach,
    contactSeconds: numOrNull(r.contact_seconds),
    measuredAt: iso(r.measured_at),
    status: r.status as RegisterStatus,
    action: r.action as string,
    ownerUserId: (r.owner_user_id as number | null) ?? null,
    ownerName: (r.owner_name as string | null) ?? null,
    dueDate: (r.due_date_text as string | null) ?? null,
    assignedBy: (r.assigned_by as number | null) ?? null,
    statusNote: r.status_note as string,
    closedBy: (r.closed_by as number | null) ?? null,
    closedByName: (r.closed_by_name as string | null) ?? null,
    closedAt: isoOrNull(r.closed_at),
    verificationTemperatureC: numOrNull(r.verification_temperature_c),
    version: r.version as number,
    createdBy: (r.created_by as number | null) ?? null,
    createdByName: (r.created_by_name as string | null) ?? null,
    createdAt: iso(r.created_at),
    updatedAt: iso(r.updated_at),
    photoCount: Number(r.photo_count ?? 0),
  };
}

/** Entries of a team with the names the views show; contractors only those of sites they were invited to. */
function entries(db: Db, teamId: number, onlyForUserId?: number) {
  const q = db('register_entries as e')
    .join('sites as s', 's.id', 'e.site_id')
    .leftJoin('items as i', 'i.id', 'e.item_id')
    .leftJoin('users as o', 'o.id', 'e.owner_user_id')
    .leftJoin('users as c', 'c.id', 'e.created_by')
    .leftJoin('users as x', 'x.id', 'e.closed_by')
    .where('e.team_id', teamId)
    .select(
      'e.*',
      db.raw("DATE_FORMAT(e.due_date, '%Y-%m-%d') as due_date_text"),
      's.name as site_name',
      'i.kind as item_kind',
      'i.tag as item_tag',
      'o.name as owner_name',
      'c.name as created_by_name',
      'x.name as closed_by_name',
      db('register_photos as p').count('*').whereRaw('p.entry_id = e.id').as('photo_count'),
    );
  if (onlyForUserId !== undefined) q.whereIn('e.site_id', db('site_members').select('site_id').where({ user_id: onlyForUserId }));
  return q;
}

export async function findEntry(db: Db, teamId: number, id: number, onlyForUserId?: number): Promise<EntryRecord | undefined> {
  const r = await entries(db, teamId, onlyForUserId).where('e.id', id).first();
  return r ? toEntry(r) : undefined;
}

/** Locks the entry's row for the rest of the transaction (two people taking one step at once). */
export async function lockEntry(db: Db, teamId: number, id: number): Promise<boolean> {
  const r = await db('register_entries').where({ team_id: teamId, id }).forUpdate().first('id');
  return !!r;
}

export type EntryFilter = {
  siteId?: number;
  statuses?: RegisterStatus[];
  ownerUserId?: number;
  q?: string;
  onlyForUserId?: number;
};

const likeEscape = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

/** Every entry matching the filter (the register of a team stays in the thousands at most). */
export async function listEntries(db: Db, teamId: number, f: EntryFilter, max: number): Promise<EntryRecord[]> {
  const q = entries(db, teamId, f.onlyForUserId).orderBy('e.id', 'desc').limit(max);
  if (f.siteId !== undefined) q.where('e.site_id', f.siteId);
  if (f.statuses?.length) q.whereIn('e.status', f.statuses);
  if (f.ownerUserId !== undefined) q.where('e.owner_user_id', f.ownerUserId);
  if (f.q) {
    const needle = `%${likeEscape(f.q)}%`;
    q.where((w) => w.where('e.location', 'like', needle).orWhere('e.description', 'like', needle).orWhere('i.tag', 'like', needle));
  }
  return (await q).map(toEntry);
}

export async function insertEntry(db: Db, teamId: number, userId: number, w: EntryWrite): Promise<number> {
  const [id] = await db('register_entries').insert({ ...rowOf(w), team_id: teamId, created_by: userId, updated_by: userId });
  return id;
}

export async function updateEntry(db: Db, teamId: number, id: number, userId: number, w: Partial<EntryWrite>): Promise<void> {
  await db('register_entries')
    .where({ team_id: teamId, id })
    .update({ ...rowOf(w), updated_by: userId, updated_at: db.fn.now(3), version: db.raw('version + 1') });
}

// ---------------------------------------------------------------------------------------------------------
// History and comments

export type HistoryChange = { from: unknown; to: unknown };

export type HistoryRecord = {
  id: number;
  action: string;
  fromStatus: RegisterStatus | null;
  toStatus: RegisterStatus | null;
  changes: Record<string, HistoryChange>;
  note: string;
  userId: number | null;
  userName: string | null;
  at: string;
};

export async function insertHistory(
  db: Db,
  h: { entryId: number; teamId: number; userId: number | null; action: string; fromStatus?: RegisterStatus | null; toStatus?: RegisterStatus | null; changes?: Record<string, HistoryChange>; note?: string; at: Date },
): Promise<number> {
  const [id] = await db('register_history').insert({
    entry_id: h.entryId,
    team_id: h.teamId,
    user_id: h.userId,
    action: h.action,
    from_status: h.fromStatus ?? null,
    to_status: h.toStatus ?? null,
    changes: JSON.stringify(h.changes ?? {}),
    note: h.note ?? '',
    created_at: h.at,
  });
  return Number(id);
}

export async function listHistory(db: Db, entryId: number): Promise<HistoryRecord[]> {
  const rows = await db('register_history as h').leftJoin('users as u', 'u.id', 'h.user_id').where('h.entry_id', entryId).orderBy('h.id').select('h.*', 'u.name as user_name');
  return rows.map((r: Row) => ({
    id: Number(r.id),
    action: r.action as string,
    fromStatus: (r.from_status as RegisterStatus | null) ?? null,
    toStatus: (r.to_status as RegisterStatus | null) ?? null,
    changes: parseJson<Record<string, HistoryChange>>(r.changes, {}),
    note: r.note as string,
    userId: (r.user_id as number | null) ?? null,
    userName: (r.user_name as string | null) ?? null,
    at: iso(r.created_at),
  }));
}

export type CommentRecord = { id: number; body: string; userId: number | null; userName: string | null; at: string };

export async function insertComment(db: Db, c: { entryId: number; teamId: number; userId: number; body: string; at: Date }): Promise<number> {
  const [id] = await db('register_comments').insert({ entry_id: c.entryId, team_id: c.teamId, user_id: c.userId, body: c.body, created_at: c.at });
  return id;
}

export async function listComments(db: Db, entryId: number): Promise<CommentRecord[]> {
  const rows = await db('register_comments as c').leftJoin('users as u', 'u.id', 'c.user_id').where('c.entry_id', entryId).orderBy('c.id').select('c.*', 'u.name as user_name');
  return rows.map((r: Row) => ({ id: r.id as number, body: r.body as string, userId: (r.user_id as number | null) ?? null, userName: (r.user_name as string | null) ?? null, at: iso(r.created_at) }));
}

// ---------------------------------------------------------------------------------------------------------
// Photos

export type PhotoRecord = {
  id: number;
  entryId: number;
  teamId: number;
  siteId: number;
  fileName: string;
  thumbnailName: string;
  contentType: string;
  width: number;
  height: number;
  bytes: number;
  originalType: string;
  originalWidth: number;
  originalHeight: number;
  takenAt: string | null;
  latitude: number | null;
  longitude: number | null;
  uploadedBy: number | null;
  uploadedByName: string | null;
  createdAt: string;
};

export type PhotoWrite = Omit<PhotoRecord, 'id' | 'siteId' | 'uploadedByName' | 'createdAt' | 'takenAt'> & { takenAt: Date | null; createdAt: Date };

function toPhoto(r: Row): PhotoRecord {
  return {
    id: r.id as number,
    entryId: r.entry_id as number,
    teamId: r.team_id as number,
    siteId: r.site_id as number,
    fileName: r.file_name as string,
    thumbnailName: r.thumbnail_name as string,
    contentType: r.content_type as string,
    width: r.width as number,
    height: r.height as number,
    bytes: r.bytes as number,
    originalType: r.original_type as string,
    originalWidth: r.original_width as number,
    originalHeight: r.original_height as number,
    takenAt: isoOrNull(r.taken_at),
    latitude: numOrNull(r.latitude),
    longitude: numOrNull(r.longitude),
    uploadedBy: (r.uploaded_by as number | null) ?? null,
    uploadedByName: (r.uploaded_by_name as string | null) ?? null,
    createdAt: iso(r.created_at),
  };
}

function photos(db: Db, teamId: number, onlyForUserId?: number) {
  const q = db('register_photos as p')
    .join('register_entries as e', 'e.id', 'p.entry_id')
    .leftJoin('users as u', 'u.id', 'p.uploaded_by')
    .where('p.team_id', teamId)
    .select('p.*', 'e.site_id', 'u.name as uploaded_by_name');
  if (onlyForUserId !== undefined) q.whereIn('e.site_id', db('site_members').select('site_id').where({ user_id: onlyForUserId }));
  return q;
}

export async function insertPhoto(db: Db, p: PhotoWrite): Promise<number> {
  const [id] = await db('register_photos').insert({
    entry_id: p.entryId,
    team_id: p.teamId,
    file_name: p.fileName,
    thumbnail_name: p.thumbnailName,
    content_type: p.contentType,
    width: p.width,
    height: p.height,
    bytes: p.bytes,
    original_type: p.originalType,
    original_width: p.originalWidth,
    original_height: p.originalHeight,
    taken_at: p.takenAt,
    latitude: p.latitude,
    longitude: p.longitude,
    uploaded_by: p.uploadedBy,
    created_at: p.createdAt,
  });
  return id;
}

export async function listPhotos(db: Db, teamId: number, entryId: number): Promise<PhotoRecord[]> {
  return (await photos(db, teamId).where('p.entry_id', entryId).orderBy('p.id')).map(toPhoto);
}

export async function findPhoto(db: Db, teamId: number, id: number, onlyForUserId?: number): Promise<PhotoRecord | undefined> {
  const r = await photos(db, teamId, onlyForUserId).where('p.id', id).first();
  return r ? toPhoto(r) : undefined;
}

export async function countPhotos(db: Db, entryId: number): Promise<number> {
  const r = await db('register_photos').where({ entry_id: entryId }).count<{ n: number }[]>({ n: '*' });
  return Number(r[0]?.n ?? 0);
}

export async function deletePhoto(db: Db, teamId: number, id: number): Promise<number> {
  return db('register_photos').where({ team_id: teamId, id }).delete();
}

// ---------------------------------------------------------------------------------------------------------
// Lines and vessels, sites and people the register refers to

/** A line or vessel as the register links it, with its current sizing outcome for touch safety. */
export type LinkedItem = {
  id: number;
  siteId: number;
  kind: 'line' | 'vessel';
  tag: string;
  service: string;
  inputHash: string;
  /** Sized with the current inputs. */
  current: boolean;
  surfaceTemperatureC: number | null;
  burnVerdict: string | null;
  burnLimitC: number | null;
  burnSource: string | null;
  contactMaterial: ContactMaterial | null;
  sizedAt: string | null;
};

const ITEM_RESULT_COLUMNS = (db: Db) => [
  'i.id',
  'i.site_id',
  'i.kind',
  'i.tag',
  'i.service',
  'i.input_hash',
  'r.input_hash as r_input_hash',
  'r.surface_temperature_c',
  'r.burn_verdict',
  'r.sized_at',
  db.raw("JSON_VALUE(r.result, '$.burn.limitC') as burn_limit_c"),
  db.raw("JSON_VALUE(r.result, '$.burn.source') as burn_source"),
  db.raw("JSON_VALUE(r.result, '$.finishId') as finish_id"),
];

function toLinkedItem(r: Row, contactMaterialOf: (finishId: string | null) => ContactMaterial | null): LinkedItem {
  return {
    id: r.id as number,
    siteId: r.site_id as number,
    kind: r.kind as 'line' | 'vessel',
    tag: r.tag as string,
    service: r.service as string,
    inputHash: r.input_hash as string,
    current: r.r_input_hash != null && r.r_input_hash === r.input_hash,
    surfaceTemperatureC: numOrNull(r.surface_temperature_c),
    burnVerdict: (r.burn_verdict as string | null) ?? null,
    burnLimitC: numOrNull(r.burn_limit_c),
    burnSource: (r.burn_source as string | null) ?? null,
    contactMaterial: contactMaterialOf((r.finish_id as string | null) ?? null),
    sizedAt: isoOrNull(r.sized_at),
  };
}

export async function findLinkedItem(db: Db, teamId: number, id: number, contactMaterialOf: (finishId: string | null) => ContactMaterial | null): Promise<LinkedItem | undefined> {
  const r = await db('items as i').leftJoin('item_results as r', 'r.item_id', 'i.id').where({ 'i.team_id': teamId, 'i.id': id }).first(ITEM_RESULT_COLUMNS(db));
  return r ? toLinkedItem(r, contactMaterialOf) : undefined;
}

/**
 * Items whose current sizing finds the surface above the touch limit and that the register does not already
 * cover: no entry linked to them that is still open, and none closed (verified or accepted) for the inputs
 * they have now.
 */
export async function listCalculatedRisks(
  db: Db,
  teamId: number,
  f: { siteId?: number; q?: string; onlyForUserId?: number },
  contactMaterialOf: (finishId: string | null) => ContactMaterial | null,
  max: number,
): Promise<(LinkedItem & { siteName: string })[]> {
  const q = db('items as i')
    .join('item_results as r', 'r.item_id', 'i.id')
    .join('sites as s', 's.id', 'i.site_id')
    .where({ 'i.team_id': teamId, 'r.burn_verdict': 'fail' })
    .whereRaw('r.input_hash = i.input_hash')
    .whereNotExists(
      db('register_entries as e')
        .select(db.raw('1'))
        .whereRaw('e.item_id = i.id')
        .where((w) => w.whereIn('e.status', ['open', 'actionAssigned', 'madeSafe']).orWhereRaw('e.item_input_hash = i.input_hash')),
    )
    .select([...ITEM_RESULT_COLUMNS(db), 's.name as site_name'])
    .orderBy('i.id')
    .limit(max);
  if (f.siteId !== undefined) q.where('i.site_id', f.siteId);
  if (f.onlyForUserId !== undefined) q.whereIn('i.site_id', db('site_members').select('site_id').where({ user_id: f.onlyForUserId }));
  if (f.q) {
    const needle = `%${likeEscape(f.q)}%`;
    q.where((w) => w.where('i.tag', 'like', needle).orWhere('i.service', 'like', needle));
  }
  return (await q).map((r: Row) => ({ ...toLinkedItem(r, contactMaterialOf), siteName: r.site_name as string }));
}

/** Design bases of the team's sites by id. */
export async function siteBases(db: Db, teamId: number, siteIds: number[]): Promise<Map<number, DesignBases>> {
  const out = new Map<number, DesignBases>();
  if (siteIds.length === 0) return out;
  const rows = await db('sites').where({ team_id: teamId }).whereIn('id', [...new Set(siteIds)]).select('id', 'design_bases');
  for (const r of rows) out.set(r.id as number, parseJson<DesignBases>(r.design_bases, {}));
  return out;
}

export async function isSiteMember(db: Db, siteId: number, userId: number): Promise<boolean> {
  return !!(await db('site_members').where({ site_id: siteId, user_id: userId }).first('site_id'));
}

/** Members of the team holding one of the roles (contractors only when invited to the site). */
export async function membersWithRoles(db: Db, teamId: number, roles: Role[]): Promise<{ userId: number; name: string; email: string; role: Role }[]> {
  const rows = await db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.team_id', teamId)
    .whereIn('m.role', roles)
    .orderBy('m.id')
    .select('u.id', 'u.name', 'u.email', 'm.role');
  return rows.map((r: Row) => ({ userId: r.id as number, name: r.name as string, email: r.email as string, role: r.role as Role }));
}

// ---------------------------------------------------------------------------------------------------------
// Settings

export async function findRegisterSettings(db: Db, teamId: number): Promise<{ keepPhotoLocation: boolean }> {
  const r = await db('register_settings').where({ team_id: teamId }).first('keep_photo_location');
  return { keepPhotoLocation: !!r?.keep_photo_location };
}

export async function upsertRegisterSettings(db: Db, teamId: number, userId: number, s: { keepPhotoLocation: boolean }): Promise<void> {
  await db('register_settings')
    .insert({ team_id: teamId, keep_photo_location: s.keepPhotoLocation, updated_by: userId, updated_at: db.fn.now(3) })
    .onConflict('team_id')
    .merge();
}
