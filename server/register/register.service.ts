import { registerVerdict, type RegisterTouchBasis, type RegisterVerdictValue } from '../../shared/calc/register';
import { sizingLibrary } from '../../shared/calc/sizing/library';
import type { ContactMaterial } from '../../shared/calc/types';
import { can } from '../../shared/schemas/permissions';
import {
  ACTIVE_STATUSES,
  REGISTER_LIMITS,
  REGISTER_STATUSES,
  REGISTER_TRANSITIONS,
  REGISTER_VERDICTS,
  type AssignInput,
  type CommentInput,
  type EntryCreateInput,
  type EntryPatchInput,
  type MadeSafeInput,
  type ReasonInput,
  type RegisterSettingsInput,
  type RegisterStatus,
  type RegisterTransition,
  type VerifyInput,
  type RegisterRow,
} from '../../shared/schemas/register';
import type { DesignBases } from '../../shared/schemas/sites';
import { insertAudit } from '../audit/audit.repository';
import type { Caller } from '../auth/auth.service';
import type { Config } from '../config';
import { type Db, inTransaction } from '../db/db';
import { errors } from '../errors';
import { visibleTo } from '../lines/items.service';
import { findSite } from '../sites/sites.repository';
import { teamLibrary } from '../sizing/sizing-context';
import { findMember } from '../team/teams.repository';
import { processPhoto, removePhotoFiles, writePhotoFiles, type ProcessedPhoto } from './photos';
import * as repo from './register.repository';
import type { EntryRecord, EntryWrite, HistoryChange, LinkedItem } from './register.repository';
import { STATUS_WORDS, addDays, dayOf } from './register-words';
import { DUE_SOON_DAYS } from './reminders';
import { queueReminders } from './reminders.repository';

export type RegisterDeps = { db: Db; config: Pick<Config, 'uploadDir'>; now: () => number; poke?: () => void };

/** An uploaded file as multer hands it over (memory storage). */
export type UploadedPhoto = { originalname: string; buffer: Buffer; fieldname: string };

/** How many register rows one request reads at most (a team's register stays in the thousands). */
export const REGISTER_READ_MAX = 5000;
export const LIST_LIMIT_MAX = 500;

// ---------------------------------------------------------------------------------------------------------
// Views

/** The part of a site's touch basis the verdict reads (`maxSurfaceC` is the site's touch limit when it has one). */
export function touchBasisOf(bases: DesignBases | undefined): RegisterTouchBasis {
  const t = (bases?.touch ?? {}) as { contactSeconds?: number; maxSurfaceC?: number };
  return { contactSeconds: t.contactSeconds ?? null, maxSurfaceC: t.maxSurfaceC ?? null };
}

const person = (userId: number | null, name: string | null) => (userId === null ? null : { userId, name: name ?? 'a former member' });

export const isOverdue = (e: Pick<EntryRecord, 'dueDate' | 'status'>, today: string) =>
  e.dueDate !== null && (e.status === 'open' || e.status === 'actionAssigned') && e.dueDate < today;

function readingOf(e: EntryRecord) {
  return {
    temperatureC: e.measuredTemperatureC,
    method: e.method,
    emissivitySetting: e.emissivitySetting,
    surfaceMaterial: e.surfaceMaterial,
    surfaceFinishId: e.surfaceFinishId,
    withinReach: e.withinReach,
    contactSeconds: e.contactSeconds,
  };
}

export function entryView(e: EntryRecord, basis: RegisterTouchBasis, today: string): RegisterRow {
  return {
    source: 'measured',
    key: `entry-${e.id}`,
    id: e.id,
    siteId: e.siteId,
    siteName: e.siteName,
    item: e.itemId !== null && e.itemKind ? { id: e.itemId, kind: e.itemKind, tag: e.itemTag ?? '' } : null,
    location: e.location,
    description: e.description,
    measuredTemperatureC: e.measuredTemperatureC,
    method: e.method,
    emissivitySetting: e.emissivitySetting,
    surfaceMaterial: e.surfaceMaterial,
    surfaceFinishId: e.surfaceFinishId,
    withinReach: e.withinReach,
    contactSeconds: e.contactSeconds,
    measuredAt: e.measuredAt,
    status: e.status,
    action: e.action,
    owner: person(e.ownerUserId, e.ownerName),
    dueDate: e.dueDate,
    overdue: isOverdue(e, today),
    statusNote: e.statusNote,
    closedBy: person(e.closedBy, e.closedByName),
    closedAt: e.closedAt,
    verificationTemperatureC: e.verificationTemperatureC,
    verdict: registerVerdict(readingOf(e), basis),
    photoCount: e.photoCount,
    version: e.version,
    createdBy: person(e.createdBy, e.createdByName),
    createdAt: e.createdAt,
    updatedAt: e.updatedAt,
    sizedAt: null,
  };
}

/** A line or vessel whose current sizing leaves its surface above the touch limit, as a register row. */
export function calculatedView(it: LinkedItem & { siteName: string }): RegisterRow {
  return {
    source: 'calculated',
    key: `item-${it.id}`,
    id: null,
    siteId: it.siteId,
    siteName: it.siteName,
    item: { id: it.id, kind: it.kind, tag: it.tag },
    location: it.tag,
    description: it.service,
    measuredTemperatureC: it.surfaceTemperatureC,
    method: 'calculated',
    emissivitySetting: null,
    surfaceMaterial: it.contactMaterial,
    surfaceFinishId: null,
    withinReach: true,
    contactSeconds: null,
    measuredAt: it.sizedAt,
    status: null,
    action: '',
    owner: null,
    dueDate: null,
    overdue: false,
    statusNote: '',
    closedBy: null,
    closedAt: null,
    verificationTemperatureC: null,
    verdict: {
      verdict: 'fail',
      basis: 'hot',
      limitC: it.burnLimitC,
      governs: null,
      contactSeconds: null,
      marginK: it.surfaceTemperatureC !== null && it.burnLimitC !== null ? it.surfaceTemperatureC - it.burnLimitC : null,
      source: it.burnSource ?? 'Whole-site sizing: the surface temperature at the touch basis exceeds the touch limit.',
      cautions: [],
    },
    photoCount: 0,
    version: null,
    createdBy: null,
    createdAt: null,
    updatedAt: null,
    sizedAt: it.sizedAt,
  };
}

// ---------------------------------------------------------------------------------------------------------
// Listing

const QUERY_KEYS = new Set(['siteId', 'status', 'ownerId', 'overdue', 'verdict', 'source', 'q', 'limit', 'cursor']);

export type RegisterQuery = {
  siteId?: number;
  statuses?: RegisterStatus[];
  ownerUserId?: number;
  overdue?: boolean;
  verdict?: RegisterVerdictValue;
  source?: 'measured' | 'calculated';
  q?: string;
  limit: number;
  cursor?: string;
};

const bad = (field: string, message: string) => errors.badRequest('VALIDATION_FAILED', message, field);

function one(query: Record<string, unknown>, key: string): string | undefined {
  const v = query[key];
  if (v === undefined) return undefined;
  if (typeof v !== 'string') throw bad(key, `${key} must be given once, as text.`);
  return v;
}

/** Parses the register's query string (unknown parameters refused). */
export function parseRegisterQuery(query: Record<string, unknown>, opts: { paged: boolean }): RegisterQuery {
  for (const k of Object.keys(query)) {
    if (!QUERY_KEYS.has(k) || (!opts.paged && (k === 'limit' || k === 'cursor'))) throw bad(k, `Unknown query parameter "${k}".`);
  }
  const out: RegisterQuery = { limit: 100 };
  const id = (key: string, what: string) => {
    const v = one(query, key);
    if (v !== undefined && !/^[1-9]\d{0,9}$/.test(v)) throw bad(key, `${key} must be ${what}.`);
    return v === undefined ? undefined : Number(v);
  };
  out.siteId = id('siteId', 'a site id');
  out.ownerUserId = id('ownerId', 'a user id');
  const status = one(query, 'status');
  if (status !== undefined) {
    const parts = status.split(',').filter(Boolean);
    const statuses = new Set<RegisterStatus>();
    for (const p of parts) {
      if (p === 'active') ACTIVE_STATUSES.forEach((s) => statuses.add(s));
      else if (p === 'closed') ['verified', 'accepted'].forEach((s) => statuses.add(s as RegisterStatus));
      else if ((REGISTER_STATUSES as readonly string[]).includes(p)) statuses.add(p as RegisterStatus);
      else throw bad('status', `status must be one or more of ${REGISTER_STATUSES.join(', ')}, active or closed (comma-separated).`);
    }
    if (statuses.size) out.statuses = [...statuses];
  }
  const overdue = one(query, 'overdue');
  if (overdue !== undefined) {
    if (overdue !== 'true' && overdue !== 'false') throw bad('overdue', 'overdue must be true or false.');
    out.overdue = overdue === 'true';
  }
  const verdict = one(query, 'verdict');
  if (verdict !== undefined) {
    if (!(REGISTER_VERDICTS as readonly string[]).includes(verdict)) throw bad('verdict', `verdict must be one of ${REGISTER_VERDICTS.join(', ')}.`);
    out.verdict = verdict as RegisterVerdictValue;
  }
  const source = one(query, 'source');
  if (source !== undefined) {
    if (source !== 'measured' && source !== 'calculated') throw bad('source', 'source must be measured or calculated.');
    out.source = source;
  }
  const q = one(query, 'q');
  if (q !== undefined) {
    if (q.length > 200) throw bad('q', 'q must be at most 200 characters.');
    if (q.trim()) out.q = q.trim();
  }
  const limit = one(query, 'limit');
  if (limit !== undefined) {
    if (!/^\d{1,4}$/.test(limit) || Number(limit) < 1 || Number(limit) > LIST_LIMIT_MAX) throw bad('limit', `limit must be a whole number from 1 to ${LIST_LIMIT_MAX}.`);
    out.limit = Number(limit);
  }
  const cursor = one(query, 'cursor');
  if (cursor !== undefined) {
    if (cursor.length > 200 || !/^[A-Za-z0-9_-]+$/.test(cursor)) throw errors.badRequest('INVALID_CURSOR', 'The cursor is not one this list gave out; start from the first page.', 'cursor');
    out.cursor = cursor;
  }
  return out;
}

/** Order of the register: work first (open, computed, assigned, made safe), then closed entries. */
const GROUP: Record<string, number> = { open: 0, calculated: 1, actionAssigned: 2, madeSafe: 3, verified: 4, accepted: 5 };
const VERDICT_RANK: Record<RegisterVerdictValue, number> = { fail: 0, caution: 1, pass: 2 };

/** A sort key that orders rows as strings: group, verdict, due date (none last), newest first. */
export function sortKey(r: RegisterRow): string {
  const group = GROUP[r.source === 'calculated' ? 'calculated' : (r.status as string)];
  const due = r.dueDate ?? '9999-12-31';
  const kind = r.source === 'calculated' ? 1 : 0;
  const id = r.source === 'calculated' ? (r.item?.id ?? 0) : (r.id as number);
  return `${group}|${VERDICT_RANK[r.verdict.verdict]}|${due}|${kind}|${String(9_999_999_999 - id).padStart(10, '0')}`;
}

const encodeCursor = (key: string) => Buffer.from(key).toString('base64url');
function decodeCursor(text: string): string {
  const key = Buffer.from(text, 'base64url').toString('utf8');
  if (!/^\d\|\d\|\d{4}-\d{2}-\d{2}\|\d\|\d{10}$/.test(key)) {
    throw errors.badRequest('INVALID_CURSOR', 'The cursor is not one this list gave out; start from the first page.', 'cursor');
  }
  return key;
}

/** Rows of the register the caller may see, filtered and in order, with counts for the filter chips. */
export async function registerRows(deps: RegisterDeps, caller: Caller, q: RegisterQuery) {
  const onlyForUserId = visibleTo(caller);
  if (q.siteId !== undefined && !(await findSite(deps.db, caller.teamId, q.siteId, onlyForUserId))) throw errors.notFound('The site');
  const today = dayOf(deps.now());
  const materialOf = await contactMaterialResolver(deps.db, caller.teamId);
  const [records, risks] = await Promise.all([
    repo.listEntries(deps.db, caller.teamId, { siteId: q.siteId, q: q.q, onlyForUserId }, REGISTER_READ_MAX),
    repo.listCalculatedRisks(deps.db, caller.teamId, { siteId: q.siteId, q: q.q, onlyForUserId }, materialOf, REGISTER_READ_MAX),
  ]);
  const bases = await repo.siteBases(deps.db, caller.teamId, records.map((e) => e.siteId));
  const measured = records.map((e) => entryView(e, touchBasisOf(bases.get(e.siteId)), today));
  const calculated = risks.map(calculatedView);
  const counts = {
    open: 0,
    actionAssigned: 0,
    madeSafe: 0,
    verified: 0,
    accepted: 0,
    overdue: measured.filter((r) => r.overdue).length,
    calculated: calculated.length,
    fail: measured.filter((r) => r.verdict.verdict === 'fail' && ACTIVE_STATUSES.includes(r.status as RegisterStatus)).length + calculated.length,
  };
  for (const r of measured) counts[r.status as RegisterStatus]++;

  const keepMeasured = (r: RegisterRow) =>
    (!q.statuses || q.statuses.includes(r.status as RegisterStatus)) &&
    (q.ownerUserId === undefined || r.owner?.userId === q.ownerUserId) &&
    (q.overdue === undefined || r.overdue === q.overdue) &&
    (!q.verdict || r.verdict.verdict === q.verdict);
  // A computed risk is unassigned open work with a fail verdict.
  const calculatedFits =
    (!q.statuses || q.statuses.includes('open')) && q.ownerUserId === undefined && q.overdue !== true && (!q.verdict || q.verdict === 'fail');
  const rows = [
    ...(q.source === 'calculated' ? [] : measured.filter(keepMeasured)),
    ...(q.source === 'measured' || !calculatedFits ? [] : calculated),
  ];
  const keyed = rows.map((r) => ({ r, key: sortKey(r) })).sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
  return { keyed, counts, today };
}

export async function listRegister(deps: RegisterDeps, caller: Caller, query: Record<string, unknown>) {
  const q = parseRegisterQuery(query, { paged: true });
  const after = q.cursor ? decodeCursor(q.cursor) : undefined;
  const { keyed, counts } = await registerRows(deps, caller, q);
  const from = after === undefined ? keyed : keyed.filter((k) => k.key > after);
  const page = from.slice(0, q.limit);
  const more = from.length > q.limit;
  return { entries: page.map((k) => k.r), nextCursor: more ? encodeCursor(page[page.length - 1].key) : null, counts };
}

// ---------------------------------------------------------------------------------------------------------
// One entry

function allowedActions(caller: Caller, e: EntryRecord): string[] {
  const out: string[] = [];
  const active = ACTIVE_STATUSES.includes(e.status);
  if (active && can(caller.role, 'surfaces.create')) out.push('edit', 'addPhoto');
  if (can(caller.role, 'surfaces.create')) out.push('comment');
  if (active && can(caller.role, 'surfaces.assign')) out.push('removePhoto');
  for (const [name, t] of Object.entries(REGISTER_TRANSITIONS)) {
    if ((t.from as readonly string[]).includes(e.status) && can(caller.role, t.permission)) out.push(name);
  }
  return out;
}

async function entryOrNotFound(db: Db, caller: Caller, id: number): Promise<EntryRecord> {
  const e = await repo.findEntry(db, caller.teamId, id, visibleTo(caller));
  if (!e) throw errors.notFound('The register entry');
  return e;
}

function photoView(p: repo.PhotoRecord) {
  return {
    id: p.id,
    url: `/api/v1/register/photos/${p.id}/image`,
    thumbnailUrl: `/api/v1/register/photos/${p.id}/thumbnail`,
    width: p.width,
    height: p.height,
    bytes: p.bytes,
    takenAt: p.takenAt,
    location: p.latitude !== null && p.longitude !== null ? { latitude: p.latitude, longitude: p.longitude } : null,
    uploadedBy: person(p.uploadedBy, p.uploadedByName),
    createdAt: p.createdAt,
  };
}

export async function getEntry(deps: RegisterDeps, caller: Caller, id: number) {
  const e = await entryOrNotFound(deps.db, caller, id);
  const [bases, photos, comments, history] = await Promise.all([
    repo.siteBases(deps.db, caller.teamId, [e.siteId]),
    repo.listPhotos(deps.db, caller.teamId, id),
    repo.listComments(deps.db, id),
    repo.listHistory(deps.db, id),
  ]);
  const basis = touchBasisOf(bases.get(e.siteId));
  const view = entryView(e, basis, dayOf(deps.now()));
  const verification =
    e.verificationTemperatureC === null ? null : registerVerdict({ ...readingOf(e), temperatureC: e.verificationTemperatureC, method: e.method === 'calculated' ? 'contact' : e.method }, basis);
  return {
    ...view,
    verification,
    photos: photos.map(photoView),
    comments: comments.map((c) => ({ id: c.id, body: c.body, author: person(c.userId, c.userName), createdAt: c.at })),
    history: history.map((h) => ({ id: h.id, action: h.action, fromStatus: h.fromStatus, toStatus: h.toStatus, changes: h.changes, note: h.note, by: person(h.userId, h.userName), at: h.at })),
    allowed: allowedActions(caller, e),
  };
}

// ---------------------------------------------------------------------------------------------------------
// Create and edit

/** The ISO 13732-1 group of an item's finish (built-in or the team's own). */
async function contactMaterialResolver(db: Db, teamId: number): Promise<(finishId: string | null) => ContactMaterial | null> {
  const finishes = sizingLibrary(await teamLibrary(db, teamId)).finishes;
  return (finishId) => finishes.find((f) => f.id === finishId)?.contactMaterial ?? null;
}

async function linkedItemOrRefuse(db: Db, teamId: number, siteId: number, itemId: number): Promise<LinkedItem> {
  const item = await repo.findLinkedItem(db, teamId, itemId, await contactMaterialResolver(db, teamId));
  if (!item || item.siteId !== siteId) throw bad('itemId', `There is no line or vessel ${itemId} in this site.`);
  return item;
}

function measuredAtOf(input: string | undefined, now: number): Date {
  if (input === undefined) return new Date(now);
  const d = new Date(input);
  if (d.getTime() > now + 5 * 60_000) throw bad('measuredAt', 'Measured at is in the future.');
  return d;
}

/** Processes every photo before anything is stored, so a bad one refuses the whole request. */
async function processAll(files: UploadedPhoto[], keepLocation: boolean): Promise<ProcessedPhoto[]> {
  const out: ProcessedPhoto[] = [];
  for (const [i, f] of files.entries()) out.push(await processPhoto(f.buffer, { name: f.originalname, field: `photos[${i}]`, keepLocation }));
  return out;
}

/**
 * Writes the files, then runs `save` (which inserts the rows) in the transaction; if anything fails the
 * files go again, so a request stores all of its photos and rows or nothing.
 */
async function withStoredPhotos<T>(
  deps: RegisterDeps,
  processed: ProcessedPhoto[],
  save: (trx: Db, stored: { processed: ProcessedPhoto; fileName: string; thumbnailName: string }[]) => Promise<T>,
): Promise<T> {
  const stored: { processed: ProcessedPhoto; fileName: string; thumbnailName: string }[] = [];
  try {
    for (const p of processed) stored.push({ processed: p, ...(await writePhotoFiles(deps.config.uploadDir, p)) });
    return await inTransaction(deps.db, (trx) => save(trx, stored));
  } catch (e) {
    await removePhotoFiles(deps.config.uploadDir, stored.flatMap((s) => [s.fileName, s.thumbnailName]));
    throw e;
  }
}

async function insertPhotos(trx: Db, caller: Caller, entryId: number, stored: { processed: ProcessedPhoto; fileName: string; thumbnailName: string }[], at: Date) {
  const ids: number[] = [];
  for (const s of stored) {
    ids.push(
      await repo.insertPhoto(trx, {
        entryId,
        teamId: caller.teamId,
        fileName: s.fileName,
        thumbnailName: s.thumbnailName,
        contentType: 'image/jpeg',
        width: s.processed.width,
        height: s.processed.height,
        bytes: s.processed.image.length,
        originalType: s.processed.originalType,
        originalWidth: s.processed.originalWidth,
        originalHeight: s.processed.originalHeight,
        takenAt: s.processed.takenAt,
        latitude: s.processed.latitude,
        longitude: s.processed.longitude,
        uploadedBy: caller.userId,
        createdAt: at,
      }),
    );
  }
  return ids;
}

export async function createEntry(deps: RegisterDeps, caller: Caller, siteId: number, input: EntryCreateInput, files: UploadedPhoto[], ip?: string) {
  const now = deps.now();
  if (!(await findSite(deps.db, caller.teamId, siteId, visibleTo(caller)))) throw errors.notFound('The site');
  const item = input.itemId ? await linkedItemOrRefuse(deps.db, caller.teamId, siteId, input.itemId) : undefined;
  let temperatureC = input.measuredTemperatureC as number;
  if (input.method === 'calculated') {
    if (!item || !item.current || item.surfaceTemperatureC === null) {
      throw errors.badRequest('NOT_SIZED', 'This line or vessel has no current sizing to take the surface temperature from; size the site first, or record a measurement.', 'itemId');
    }
    temperatureC = item.surfaceTemperatureC;
  }
  const settings = await repo.findRegisterSettings(deps.db, caller.teamId);
  const processed = await processAll(files, settings.keepPhotoLocation);
  const w: EntryWrite = {
    siteId,
    itemId: item?.id ?? null,
    itemInputHash: item?.inputHash ?? null,
    location: input.location,
    description: input.description ?? '',
    measuredTemperatureC: temperatureC,
    method: input.method,
    emissivitySetting: input.method === 'infrared' ? (input.emissivitySetting ?? null) : null,
    surfaceMaterial: input.surfaceMaterial,
    surfaceFinishId: input.surfaceFinishId ?? null,
    withinReach: input.withinReach,
    contactSeconds: input.contactSeconds ?? null,
    measuredAt: measuredAtOf(input.measuredAt, now),
    status: 'open',
    action: '',
    ownerUserId: null,
    dueDate: null,
    assignedBy: null,
    statusNote: '',
    closedBy: null,
    closedAt: null,
    verificationTemperatureC: null,
  };
  const id = await withStoredPhotos(deps, processed, async (trx, stored) => {
    const at = new Date(now);
    const entryId = await repo.insertEntry(trx, caller.teamId, caller.userId, w);
    await repo.insertHistory(trx, { entryId, teamId: caller.teamId, userId: caller.userId, action: 'created', toStatus: 'open', at });
    if (stored.length) {
      await insertPhotos(trx, caller, entryId, stored, at);
      await repo.insertHistory(trx, { entryId, teamId: caller.teamId, userId: caller.userId, action: 'photoAdded', note: `${stored.length} photo${stored.length > 1 ? 's' : ''}`, at });
    }
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'register.created', targetType: 'register_entry', targetId: entryId, details: { siteId, photos: stored.length }, ip });
    return entryId;
  });
  return getEntry(deps, caller, id);
}

const EDITABLE: (keyof EntryPatchInput & keyof EntryWrite)[] = [
  'location',
  'description',
  'itemId',
  'measuredTemperatureC',
  'method',
  'emissivitySetting',
  'surfaceMaterial',
  'surfaceFinishId',
  'withinReach',
  'contactSeconds',
];

function assertActive(e: EntryRecord): void {
  if (!ACTIVE_STATUSES.includes(e.status)) {
    throw errors.conflict('ENTRY_CLOSED', `This entry is ${STATUS_WORDS[e.status].toLowerCase()}; reopen it before changing it.`);
  }
}

/** Locks and reads the entry for a change; 404 when the caller may not see it. */
async function lockForChange(trx: Db, caller: Caller, id: number): Promise<EntryRecord> {
  await repo.lockEntry(trx, caller.teamId, id);
  return entryOrNotFound(trx, caller, id);
}

export async function updateEntry(deps: RegisterDeps, caller: Caller, id: number, patch: EntryPatchInput, ip?: string) {
  await inTransaction(deps.db, async (trx) => {
    const e = await lockForChange(trx, caller, id);
    assertActive(e);
    if (patch.version !== undefined && patch.version !== e.version) {
      throw errors.conflict('VERSION_CONFLICT', `Someone changed this entry since you opened it (version ${e.version} now); reload and edit again.`, 'version');
    }
    if (patch.method === 'calculated' && e.method !== 'calculated') {
      throw bad('method', 'An entry takes its temperature from sizing only when it is recorded from a calculated risk.');
    }
    if (e.method === 'calculated' && patch.measuredTemperatureC !== undefined && (patch.method === undefined || patch.method === 'calculated')) {
      throw bad('method', 'Say how the new reading was taken (contact probe or infrared).');
    }
    const w: Partial<EntryWrite> = {};
    for (const k of EDITABLE) if (patch[k] !== undefined) (w as Record<string, unknown>)[k] = patch[k];
    if (patch.measuredAt !== undefined) w.measuredAt = measuredAtOf(patch.measuredAt, deps.now());
    const method = w.method ?? e.method;
    if (method !== 'infrared') w.emissivitySetting = null;
    else if ((w.emissivitySetting ?? e.emissivitySetting) === null) throw bad('emissivitySetting', 'Give the emissivity the infrared thermometer was set to');
    if (w.itemId !== undefined && w.itemId !== e.itemId) {
      const item = w.itemId === null ? undefined : await linkedItemOrRefuse(trx, caller.teamId, e.siteId, w.itemId);
      w.itemInputHash = item?.inputHash ?? null;
    }
    const changes: Record<string, HistoryChange> = {};
    const current = e as unknown as Record<string, unknown>;
    for (const [k, v] of Object.entries(w)) {
      if (k === 'itemInputHash') continue;
      const before = current[k] ?? null;
      const after = v instanceof Date ? v.toISOString() : v;
      if (JSON.stringify(before) === JSON.stringify(after)) delete (w as Record<string, unknown>)[k];
      else changes[k] = { from: before, to: after };
    }
    if (Object.keys(changes).length === 0) return;
    await repo.updateEntry(trx, caller.teamId, id, caller.userId, w);
    await repo.insertHistory(trx, { entryId: id, teamId: caller.teamId, userId: caller.userId, action: 'updated', changes, at: new Date(deps.now()) });
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'register.updated', targetType: 'register_entry', targetId: id, details: { fields: Object.keys(changes) }, ip });
  });
  return getEntry(deps, caller, id);
}

// ---------------------------------------------------------------------------------------------------------
// Workflow

const VERBS: Record<RegisterTransition, string> = {
  assign: 'assigned',
  madeSafe: 'recorded as made safe',
  verify: 'verified',
  sendBack: 'sent back',
  accept: 'accepted',
  reopen: 'reopened',
};

async function assigneeOrRefuse(db: Db, caller: Caller, siteId: number, userId: number) {
  const m = await findMember(db, caller.teamId, userId);
  if (!m) throw bad('ownerUserId', 'This person is not a member of the team.');
  if (m.role === 'viewer') throw bad('ownerUserId', 'A viewer cannot record the fix; choose someone with another role.');
  if (m.role === 'contractor' && !(await repo.isSiteMember(db, siteId, userId))) {
    throw bad('ownerUserId', 'This contractor is not invited to the site; invite them to it first.');
  }
  return m;
}

/** Takes one workflow step, all or nothing, with its history and any mail it queues. */
export async function transition(deps: RegisterDeps, caller: Caller, id: number, name: RegisterTransition, input: unknown, ip?: string) {
  const spec = REGISTER_TRANSITIONS[name];
  const now = deps.now();
  const at = new Date(now);
  let queued = false;
  await inTransaction(deps.db, async (trx) => {
    const e = await lockForChange(trx, caller, id);
    if (!(spec.from as readonly RegisterStatus[]).includes(e.status)) {
      throw errors.conflict('INVALID_TRANSITION', `An entry that is ${STATUS_WORDS[e.status].toLowerCase()} cannot be ${VERBS[name]}.`);
    }
    const w: Partial<EntryWrite> = {};
    let note = '';
    let ownerName: string | null = null;
    const closeFields = async () => {
      w.closedBy = caller.userId;
      w.closedAt = at;
      // The closing judges the item's inputs as they are now: a later change to the line brings its risk back.
      if (e.itemId !== null) w.itemInputHash = (await repo.findLinkedItem(trx, caller.teamId, e.itemId, () => null))?.inputHash ?? e.itemInputHash;
    };
    switch (name) {
      case 'assign': {
        const a = input as AssignInput;
        ownerName = (await assigneeOrRefuse(trx, caller, e.siteId, a.ownerUserId)).name;
        if (a.dueDate < dayOf(now)) throw bad('dueDate', 'The due date is in the past.');
        Object.assign(w, { status: spec.to, ownerUserId: a.ownerUserId, dueDate: a.dueDate, action: a.action, assignedBy: caller.userId, statusNote: '' });
        note = a.action;
        break;
      }
      case 'madeSafe':
        note = (input as MadeSafeInput).note;
        Object.assign(w, { status: spec.to, statusNote: note });
        break;
      case 'verify': {
        const v = input as VerifyInput;
        if (v.measuredTemperatureC !== undefined) {
          const bases = await repo.siteBases(trx, caller.teamId, [e.siteId]);
          const after = registerVerdict(
            { ...readingOf(e), temperatureC: v.measuredTemperatureC, method: v.method ?? 'contact', emissivitySetting: v.method === 'infrared' ? (v.emissivitySetting ?? null) : null },
            touchBasisOf(bases.get(e.siteId)),
          );
          if (after.verdict === 'fail') {
            throw errors.conflict(
              'STILL_ABOVE_LIMIT',
              `The new reading, ${v.measuredTemperatureC} °C, is still above the ${Math.round((after.limitC as number) * 10) / 10} °C limit for a surface within reach; send the entry back instead.`,
              'measuredTemperatureC',
            );
          }
          w.verificationTemperatureC = v.measuredTemperatureC;
        }
        note = v.note ?? '';
        Object.assign(w, { status: spec.to, statusNote: note });
        await closeFields();
        break;
      }
      case 'sendBack':
        note = (input as ReasonInput).reason;
        Object.assign(w, { status: e.ownerUserId !== null ? 'actionAssigned' : 'open', statusNote: note });
        break;
      case 'accept':
        note = (input as ReasonInput).reason;
        Object.assign(w, { status: spec.to, statusNote: note });
        await closeFields();
        break;
      case 'reopen':
        note = (input as ReasonInput).reason;
        Object.assign(w, { status: spec.to, statusNote: note, closedBy: null, closedAt: null, verificationTemperatureC: null });
        break;
    }
    const current = e as unknown as Record<string, unknown>;
    const changes: Record<string, HistoryChange> = {};
    for (const [k, v] of Object.entries(w)) {
      if (k === 'itemInputHash' || k === 'closedAt' || k === 'closedBy' || k === 'statusNote') continue;
      const before = current[k] ?? null;
      if (JSON.stringify(before) !== JSON.stringify(v)) changes[k] = { from: before, to: v };
    }
    // Names as they were, so the history reads the same after someone leaves the team.
    if (changes.ownerUserId) changes.owner = { from: e.ownerName, to: ownerName };
    await repo.updateEntry(trx, caller.teamId, id, caller.userId, w);
    const historyId = await repo.insertHistory(trx, {
      entryId: id,
      teamId: caller.teamId,
      userId: caller.userId,
      action: name,
      fromStatus: e.status,
      toStatus: (w.status ?? e.status) as RegisterStatus,
      changes,
      note,
      at,
    });
    if (name === 'assign') {
      const rows: Parameters<typeof queueReminders>[1] = [{ teamId: caller.teamId, entryId: id, kind: 'assigned', key: `h${historyId}`, recipientUserId: w.ownerUserId as number }];
      // The assignment mail already says when it is due: no separate due-soon mail when it is due that soon.
      if ((w.dueDate as string) <= addDays(dayOf(now), DUE_SOON_DAYS)) {
        rows.push({ teamId: caller.teamId, entryId: id, kind: 'dueSoon', key: w.dueDate as string, recipientUserId: w.ownerUserId as number, status: 'skipped' });
      }
      await queueReminders(trx, rows, at);
      queued = true;
    }
    if (name === 'madeSafe') {
      // The safety officers verify; a team without one asks its owners.
      let verifiers = (await repo.membersWithRoles(trx, caller.teamId, ['safety'])).filter((m) => m.userId !== caller.userId);
      if (verifiers.length === 0) verifiers = (await repo.membersWithRoles(trx, caller.teamId, ['owner'])).filter((m) => m.userId !== caller.userId);
      await queueReminders(
        trx,
        verifiers.map((m) => ({ teamId: caller.teamId, entryId: id, kind: 'verifyRequest' as const, key: `h${historyId}`, recipientUserId: m.userId })),
        at,
      );
      queued = verifiers.length > 0;
    }
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: `register.${name}`, targetType: 'register_entry', targetId: id, details: { from: e.status, to: w.status ?? e.status }, ip });
  });
  if (queued) deps.poke?.();
  return getEntry(deps, caller, id);
}

// ---------------------------------------------------------------------------------------------------------
// Comments and photos

export async function addComment(deps: RegisterDeps, caller: Caller, id: number, input: CommentInput, ip?: string) {
  await inTransaction(deps.db, async (trx) => {
    await entryOrNotFound(trx, caller, id);
    await repo.insertComment(trx, { entryId: id, teamId: caller.teamId, userId: caller.userId, body: input.body, at: new Date(deps.now()) });
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'register.commented', targetType: 'register_entry', targetId: id, ip });
  });
  return getEntry(deps, caller, id);
}

export async function addPhotos(deps: RegisterDeps, caller: Caller, id: number, files: UploadedPhoto[], ip?: string) {
  if (files.length === 0) throw errors.badRequest('NO_PHOTO', 'Choose a photo to upload (multipart field "photos").', 'photos');
  const e = await entryOrNotFound(deps.db, caller, id);
  assertActive(e);
  const settings = await repo.findRegisterSettings(deps.db, caller.teamId);
  const processed = await processAll(files, settings.keepPhotoLocation);
  await withStoredPhotos(deps, processed, async (trx, stored) => {
    const locked = await lockForChange(trx, caller, id);
    assertActive(locked);
    if ((await repo.countPhotos(trx, id)) + stored.length > REGISTER_LIMITS.photosPerEntry) {
      throw errors.conflict('TOO_MANY_PHOTOS', `An entry keeps at most ${REGISTER_LIMITS.photosPerEntry} photos; remove one first.`, 'photos');
    }
    const at = new Date(deps.now());
    await insertPhotos(trx, caller, id, stored, at);
    await repo.insertHistory(trx, { entryId: id, teamId: caller.teamId, userId: caller.userId, action: 'photoAdded', note: `${stored.length} photo${stored.length > 1 ? 's' : ''}`, at });
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'register.photo_added', targetType: 'register_entry', targetId: id, details: { photos: stored.length }, ip });
  });
  return getEntry(deps, caller, id);
}

export async function deletePhoto(deps: RegisterDeps, caller: Caller, photoId: number, ip?: string): Promise<void> {
  const files = await inTransaction(deps.db, async (trx) => {
    const p = await repo.findPhoto(trx, caller.teamId, photoId, visibleTo(caller));
    if (!p) throw errors.notFound('The photo');
    const e = await lockForChange(trx, caller, p.entryId);
    assertActive(e);
    await repo.deletePhoto(trx, caller.teamId, photoId);
    await repo.insertHistory(trx, { entryId: p.entryId, teamId: caller.teamId, userId: caller.userId, action: 'photoRemoved', note: `photo ${photoId}`, at: new Date(deps.now()) });
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'register.photo_removed', targetType: 'register_entry', targetId: p.entryId, details: { photoId }, ip });
    return [p.fileName, p.thumbnailName];
  });
  await removePhotoFiles(deps.config.uploadDir, files);
}

export const photoMissing = () => errors.notFound('The photo file');

/** The stored file of a photo the caller may see. */
export async function photoFile(deps: RegisterDeps, caller: Caller, photoId: number, which: 'image' | 'thumbnail') {
  const p = await repo.findPhoto(deps.db, caller.teamId, photoId, visibleTo(caller));
  if (!p) throw errors.notFound('The photo');
  return { name: which === 'image' ? p.fileName : p.thumbnailName, contentType: p.contentType, entryId: p.entryId };
}

// ---------------------------------------------------------------------------------------------------------
// Settings

export const getRegisterSettings = (deps: RegisterDeps, caller: Caller) => repo.findRegisterSettings(deps.db, caller.teamId);

export async function updateRegisterSettings(deps: RegisterDeps, caller: Caller, input: RegisterSettingsInput, ip?: string) {
  await inTransaction(deps.db, async (trx) => {
    await repo.upsertRegisterSettings(trx, caller.teamId, caller.userId, input);
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'register.settings_updated', targetType: 'team', targetId: caller.teamId, details: { ...input }, ip });
  });
  return repo.findRegisterSettings(deps.db, caller.teamId);
}

