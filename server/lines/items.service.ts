import { pipeSizeByDn, pipeSizeByNps } from '../../shared/calc/pipe-sizes';
import { SizingInputError, planFingerprint, planItemSizing } from '../../shared/calc/sizing/size-item';
import { PURPOSES, type Fittings, type Purpose, type PurposeParameters, type SizingContext } from '../../shared/calc/sizing/types';
import type { BulkEditInput, LineCreateInput, LinePatchInput, VesselCreateInput, VesselPatchInput } from '../../shared/schemas/lines';
import { insertAudit } from '../audit/audit.repository';
import type { Caller } from '../auth/auth.service';
import { type Db, inTransaction } from '../db/db';
import { errors } from '../errors';
import { findSite } from '../sites/sites.repository';
import { loadSizingContext, taskOf } from '../sizing/sizing-context';
import * as repo from './items.repository';
import type { ItemKind, ItemRecord, ItemWithResult, ItemWrite, ListQuery, SortKey } from './items.repository';

/** Contractors see only the sites they were invited to. */
export const visibleTo = (caller: Caller) => (caller.role === 'contractor' ? caller.userId : undefined);

const KIND_WORD: Record<ItemKind, string> = { line: 'The line', vessel: 'The vessel' };

/** The sizing part of a line or vessel as the API shows it (DESIGN §11). */
export function sizingView(it: ItemWithResult) {
  const r = it.result;
  if (!r) return null;
  const failing = r.failing && r.failingPurposes.length === 0 ? it.purposes : r.failingPurposes;
  return {
    governingPurpose: r.governingPurpose,
    layersM: r.layersM,
    totalThicknessM: r.totalThicknessM,
    ...(it.kind === 'line' ? { heatLossWPerM: r.heatLoss } : {}),
    heatLossW: r.heatLossW,
    surfaceTemperatureC: r.surfaceTemperatureC,
    burnVerdict: r.burnVerdict,
    annualEnergyKWh: r.annualEnergyKWh,
    failing,
    stale: r.inputHash !== it.inputHash,
    sizedAt: r.sizedAt,
  };
}

export function lineView(it: ItemWithResult) {
  return {
    id: it.id,
    siteId: it.siteId,
    tag: it.tag,
    service: it.service,
    sizeGivenAs: it.sizeKind,
    nps: it.sizeKind === 'od' ? null : it.nps,
    dn: it.sizeKind === 'od' ? null : it.dn,
    outerDiameterM: it.outerDiameterM,
    orientation: it.orientation,
    heightM: it.heightM,
    lengthM: it.lengthM,
    operatingTemperatureC: it.operatingTemperatureC,
    location: it.location,
    purposes: it.purposes,
    purposeParameters: it.purposeParameters,
    fittings: it.fittings,
    fittingsInsulated: it.fittingsInsulated,
    buildUp: it.buildUp,
    notes: it.notes,
    version: it.version,
    createdAt: it.createdAt,
    updatedAt: it.updatedAt,
    sizing: sizingView(it),
  };
}

export function vesselView(it: ItemWithResult) {
  return {
    id: it.id,
    siteId: it.siteId,
    tag: it.tag,
    service: it.service,
    diameterM: it.outerDiameterM,
    lengthM: it.lengthM,
    orientation: it.orientation,
    headType: it.headType,
    location: it.location,
    operatingTemperatureC: it.operatingTemperatureC,
    purposes: it.purposes,
    purposeParameters: it.purposeParameters,
    buildUp: it.buildUp,
    notes: it.notes,
    version: it.version,
    createdAt: it.createdAt,
    updatedAt: it.updatedAt,
    sizing: sizingView(it),
  };
}

export const viewOf = (it: ItemWithResult) => (it.kind === 'line' ? lineView(it) : vesselView(it));

/** Millimetres of the pipe table as the metres a person would write (0.0483, not 0.048299999999999996). */
const metresOf = (mm: number) => Number((mm / 1000).toPrecision(12));

/** Size fields of a line from how it was given. */
export function lineSize(input: { nps?: string; dn?: number; outerDiameterM?: number }): Pick<ItemWrite, 'sizeKind' | 'nps' | 'dn' | 'outerDiameterM'> | undefined {
  if (input.nps !== undefined) {
    const s = pipeSizeByNps(input.nps);
    return { sizeKind: 'nps', nps: s.nps, dn: s.dn, outerDiameterM: metresOf(s.outerDiameterMm) };
  }
  if (input.dn !== undefined) {
    const s = pipeSizeByDn(input.dn);
    return { sizeKind: 'dn', nps: s.nps, dn: s.dn, outerDiameterM: metresOf(s.outerDiameterMm) };
  }
  if (input.outerDiameterM !== undefined) return { sizeKind: 'od', nps: null, dn: null, outerDiameterM: input.outerDiameterM };
  return undefined;
}

const NO_FITTINGS: Fittings = { valves: 0, flanges: 0, elbows: 0, tees: 0 };

/** Checks the build-up against the library and fingerprints the inputs; bad references are a 400 naming the field. */
export function hashOrRefuse(item: ItemRecord, ctx: SizingContext, fieldPrefix = ''): string {
  const task = taskOf(item);
  if (task.buildUp) {
    task.buildUp.layers.forEach((l, i) => {
      if (!ctx.library.materials.some((m) => m.id === l.materialId)) {
        throw errors.badRequest('UNKNOWN_MATERIAL', `There is no material "${l.materialId}" in the library.`, `${fieldPrefix}buildUp.layers[${i}].materialId`);
      }
    });
    if (!ctx.library.finishes.some((f) => f.id === task.buildUp?.finishId)) {
      throw errors.badRequest('UNKNOWN_FINISH', `There is no finish "${task.buildUp.finishId}" in the library.`, `${fieldPrefix}buildUp.finishId`);
    }
  }
  try {
    return planFingerprint(planItemSizing(task, ctx));
  } catch (e) {
    if (e instanceof SizingInputError) throw errors.badRequest(e.code, e.message, `${fieldPrefix}${e.field}`);
    throw e;
  }
}

async function siteOrNotFound(db: Db, caller: Caller, siteId: number) {
  const site = await findSite(db, caller.teamId, siteId, visibleTo(caller));
  if (!site) throw errors.notFound('The site');
  return site;
}

async function assertTagFree(db: Db, siteId: number, kind: ItemKind, tag: string, exceptId?: number) {
  if (await repo.tagTaken(db, siteId, kind, tag, exceptId)) {
    throw errors.conflict('TAG_TAKEN', `The site already has a ${kind} tagged "${tag}".`, 'tag');
  }
}

/** A draft record for fingerprinting before the row exists. */
const draft = (w: ItemWrite, kind: ItemKind, siteId: number, teamId: number): ItemRecord => ({
  ...w,
  id: 0,
  teamId,
  siteId,
  kind,
  version: 1,
  createdAt: '',
  updatedAt: '',
});

/** Normalises a create body of either kind into the stored fields (SI), hash not yet set. */
export function writeOfCreate(kind: ItemKind, input: LineCreateInput | VesselCreateInput): ItemWrite {
  if (kind === 'line') {
    const l = input as LineCreateInput;
    const size = lineSize(l) as NonNullable<ReturnType<typeof lineSize>>;
    return {
      tag: l.tag,
      service: l.service ?? '',
      ...size,
      lengthM: l.lengthM,
      orientation: l.orientation ?? 'horizontal',
      heightM: l.orientation === 'vertical' ? (l.heightM ?? null) : null,
      headType: null,
      location: l.location ?? 'outdoor',
      operatingTemperatureC: l.operatingTemperatureC,
      purposes: orderPurposes(l.purposes as Purpose[]),
      purposeParameters: (l.purposeParameters ?? {}) as PurposeParameters,
      fittings: { ...NO_FITTINGS, ...(l.fittings ?? {}) },
      fittingsInsulated: l.fittingsInsulated ?? true,
      buildUp: l.buildUp ?? null,
      notes: l.notes ?? '',
      inputHash: '',
    };
  }
  const v = input as VesselCreateInput;
  return {
    tag: v.tag,
    service: v.service ?? '',
    sizeKind: null,
    nps: null,
    dn: null,
    outerDiameterM: v.diameterM,
    lengthM: v.lengthM,
    orientation: v.orientation ?? 'vertical',
    heightM: null,
    headType: v.headType ?? 'ellipsoidal2to1',
    location: v.location ?? 'outdoor',
    operatingTemperatureC: v.operatingTemperatureC,
    purposes: orderPurposes(v.purposes as Purpose[]),
    purposeParameters: (v.purposeParameters ?? {}) as PurposeParameters,
    fittings: { ...NO_FITTINGS },
    fittingsInsulated: true,
    buildUp: v.buildUp ?? null,
    notes: v.notes ?? '',
    inputHash: '',
  };
}

/** Purposes in the one canonical order, so the same set always reads (and hashes) the same. */
export const orderPurposes = (ps: readonly Purpose[]): Purpose[] => PURPOSES.filter((p) => ps.includes(p));

export async function createItem(deps: { db: Db }, caller: Caller, siteId: number, kind: ItemKind, input: LineCreateInput | VesselCreateInput, ip?: string) {
  return inTransaction(deps.db, async (trx) => {
    await siteOrNotFound(trx, caller, siteId);
    const w = writeOfCreate(kind, input);
    await assertTagFree(trx, siteId, kind, w.tag);
    const ctx = await loadSizingContext(trx, caller.teamId, siteId);
    w.inputHash = hashOrRefuse(draft(w, kind, siteId, caller.teamId), ctx);
    const id = await repo.insertItem(trx, caller.teamId, siteId, kind, caller.userId, w);
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: `${kind}.created`, targetType: kind, targetId: id, details: { siteId, tag: w.tag }, ip });
    return viewOf((await repo.findItem(trx, caller.teamId, id)) as ItemWithResult);
  });
}

export async function getItem(deps: { db: Db }, caller: Caller, id: number, kind: ItemKind, opts: { withResult?: boolean } = {}) {
  const it = await repo.findItem(deps.db, caller.teamId, id, visibleTo(caller));
  if (!it || it.kind !== kind) throw errors.notFound(KIND_WORD[kind]);
  const view = viewOf(it);
  if (!opts.withResult || !view.sizing) return view;
  const result = await repo.findStoredResult(deps.db, id);
  return { ...view, sizing: { ...view.sizing, result } };
}

function same(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

/** The stored fields a patch changes, against the item as it is. */
function writeOfPatch(it: ItemRecord, patch: LinePatchInput | VesselPatchInput): Partial<ItemWrite> {
  const w: Partial<ItemWrite> = {};
  const p = patch as LinePatchInput & VesselPatchInput;
  if (p.tag !== undefined) w.tag = p.tag;
  if (p.service !== undefined) w.service = p.service;
  if (it.kind === 'line') {
    const size = lineSize(p);
    if (size) Object.assign(w, size);
    if (p.fittings !== undefined) w.fittings = { ...it.fittings, ...p.fittings };
    if (p.fittingsInsulated !== undefined) w.fittingsInsulated = p.fittingsInsulated;
    if (p.heightM !== undefined) w.heightM = p.heightM;
  } else {
    if (p.diameterM !== undefined) w.outerDiameterM = p.diameterM;
    if (p.headType !== undefined) w.headType = p.headType;
  }
  if (p.lengthM !== undefined) w.lengthM = p.lengthM;
  if (p.orientation !== undefined) w.orientation = p.orientation;
  if ((w.orientation ?? it.orientation) === 'horizontal' && it.kind === 'line') w.heightM = null;
  if (p.location !== undefined) w.location = p.location;
  if (p.operatingTemperatureC !== undefined) w.operatingTemperatureC = p.operatingTemperatureC;
  if (p.purposes !== undefined) w.purposes = orderPurposes(p.purposes as Purpose[]);
  if (p.purposeParameters !== undefined) w.purposeParameters = p.purposeParameters as PurposeParameters;
  if (p.buildUp !== undefined) w.buildUp = p.buildUp;
  if (p.notes !== undefined) w.notes = p.notes;
  // Only real changes count.
  for (const k of Object.keys(w) as (keyof ItemWrite)[]) if (same(w[k], it[k])) delete w[k];
  return w;
}

export async function updateItem(deps: { db: Db }, caller: Caller, id: number, kind: ItemKind, patch: LinePatchInput | VesselPatchInput, ip?: string) {
  return inTransaction(deps.db, async (trx) => {
    const it = await repo.findItem(trx, caller.teamId, id, visibleTo(caller));
    if (!it || it.kind !== kind) throw errors.notFound(KIND_WORD[kind]);
    if (patch.version !== undefined && patch.version !== it.version) {
      throw errors.conflict('VERSION_CONFLICT', `Someone changed this ${kind} since you opened it (version ${it.version} now); reload and edit again.`, 'version');
    }
    const w = writeOfPatch(it, patch);
    const fields = Object.keys(w);
    if (fields.length === 0) return viewOf(it);
    if (w.tag !== undefined) await assertTagFree(trx, it.siteId, kind, w.tag, id);
    const ctx = await loadSizingContext(trx, caller.teamId, it.siteId);
    const next: ItemRecord = { ...it, ...w };
    const hash = hashOrRefuse(next, ctx);
    if (hash !== it.inputHash) w.inputHash = hash;
    await repo.updateItem(trx, caller.teamId, id, caller.userId, w);
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: `${kind}.updated`, targetType: kind, targetId: id, details: { fields }, ip });
    return viewOf((await repo.findItem(trx, caller.teamId, id)) as ItemWithResult);
  });
}

export async function deleteItem(deps: { db: Db }, caller: Caller, id: number, kind: ItemKind, ip?: string): Promise<void> {
  await inTransaction(deps.db, async (trx) => {
    const it = await repo.findItem(trx, caller.teamId, id, visibleTo(caller));
    if (!it || it.kind !== kind) throw errors.notFound(KIND_WORD[kind]);
    await repo.deleteItem(trx, caller.teamId, id);
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: `${kind}.deleted`, targetType: kind, targetId: id, details: { siteId: it.siteId, tag: it.tag }, ip });
  });
}

/** Applies the same purposes and/or build-up to a selection of one site's items, all or nothing. */
export async function bulkEdit(deps: { db: Db }, caller: Caller, siteId: number, kind: ItemKind, input: BulkEditInput, ip?: string) {
  return inTransaction(deps.db, async (trx) => {
    await siteOrNotFound(trx, caller, siteId);
    const ids = [...new Set(input.ids)];
    const items = await repo.listSiteItems(trx, siteId, { ids });
    const found = new Set(items.filter((i) => i.kind === kind).map((i) => i.id));
    const missing = ids.findIndex((i) => !found.has(i));
    if (missing >= 0) throw errors.badRequest('NOT_FOUND', `There is no ${kind} ${ids[missing]} in this site.`, `ids[${missing}]`);
    const ctx = await loadSizingContext(trx, caller.teamId, siteId);
    if (kind === 'vessel' && input.purposes?.some((p) => p === 'temperatureHolding' || p === 'frostProtection')) {
      throw errors.badRequest('VALIDATION_FAILED', 'Process temperature holding and frost protection apply to lines only.', 'purposes');
    }
    let changed = 0;
    for (const it of items) {
      const w: Partial<ItemWrite> = {};
      if (input.purposes !== undefined) w.purposes = orderPurposes(input.purposes as Purpose[]);
      if (input.buildUp !== undefined) w.buildUp = input.buildUp;
      for (const k of Object.keys(w) as (keyof ItemWrite)[]) if (same(w[k], it[k])) delete w[k];
      if (Object.keys(w).length === 0) continue;
      const next = { ...it, ...w };
      w.inputHash = hashOrRefuse(next, ctx);
      await repo.updateItem(trx, caller.teamId, it.id, caller.userId, w);
      changed++;
    }
    if (changed) {
      await insertAudit(trx, {
        teamId: caller.teamId,
        userId: caller.userId,
        action: `${kind}.bulk_updated`,
        targetType: 'site',
        targetId: siteId,
        details: { count: changed, fields: Object.keys(input).filter((k) => k !== 'ids') },
        ip,
      });
    }
    return { updated: changed, unchanged: items.length - changed };
  });
}

// ---------------------------------------------------------------------------------------------------------
// Listing

export const LIST_MAX = 1000;

function queryText(v: unknown, field: string): string | undefined {
  if (v === undefined) return undefined;
  if (typeof v !== 'string') throw errors.badRequest('VALIDATION_FAILED', `${field} must be given once, as text.`, field);
  return v;
}

/** Cursor: base64url JSON of [the sort value is null, the value, the id]. */
export const encodeCursor = (c: [boolean, string | number | null, number]) => Buffer.from(JSON.stringify(c)).toString('base64url');

function decodeCursor(text: string): [boolean, string | number | null, number] {
  const bad = () => errors.badRequest('INVALID_CURSOR', 'The cursor is not one this list gave out; start from the first page.', 'cursor');
  if (text.length > 500) throw bad();
  let v: unknown;
  try {
    v = JSON.parse(Buffer.from(text, 'base64url').toString('utf8'));
  } catch {
    throw bad();
  }
  if (
    !Array.isArray(v) ||
    v.length !== 3 ||
    typeof v[0] !== 'boolean' ||
    !(v[1] === null || typeof v[1] === 'string' || typeof v[1] === 'number') ||
    !Number.isInteger(v[2]) ||
    (v[0] && v[1] !== null)
  ) {
    throw bad();
  }
  return v as [boolean, string | number | null, number];
}

const STATUSES = ['failing', 'stale', 'unsized', 'sized', 'current'] as const;
const KNOWN_QUERY = new Set(['limit', 'cursor', 'q', 'purpose', 'location', 'status', 'sort']);

/** Parses and checks the list's query string (unknown parameters refused). */
export function parseListQuery(query: Record<string, unknown>): Omit<ListQuery, 'teamId' | 'siteId' | 'kind'> {
  for (const k of Object.keys(query)) {
    if (!KNOWN_QUERY.has(k)) throw errors.badRequest('VALIDATION_FAILED', `Unknown query parameter "${k}".`, k);
  }
  const limitText = queryText(query.limit, 'limit');
  let limit = 100;
  if (limitText !== undefined) {
    if (!/^\d{1,6}$/.test(limitText) || Number(limitText) < 1 || Number(limitText) > LIST_MAX) {
      throw errors.badRequest('VALIDATION_FAILED', `limit must be a whole number from 1 to ${LIST_MAX}.`, 'limit');
    }
    limit = Number(limitText);
  }
  const q = queryText(query.q, 'q');
  if (q !== undefined && q.length > 200) throw errors.badRequest('VALIDATION_FAILED', 'q must be at most 200 characters.', 'q');
  const purpose = queryText(query.purpose, 'purpose');
  if (purpose !== undefined && !(PURPOSES as readonly string[]).includes(purpose)) {
    throw errors.badRequest('VALIDATION_FAILED', `purpose must be one of ${PURPOSES.join(', ')}.`, 'purpose');
  }
  const location = queryText(query.location, 'location');
  if (location !== undefined && location !== 'indoor' && location !== 'outdoor') {
    throw errors.badRequest('VALIDATION_FAILED', 'location must be indoor or outdoor.', 'location');
  }
  const status = queryText(query.status, 'status');
  if (status !== undefined && !(STATUSES as readonly string[]).includes(status)) {
    throw errors.badRequest('VALIDATION_FAILED', `status must be one of ${STATUSES.join(', ')}.`, 'status');
  }
  const sortText = queryText(query.sort, 'sort') ?? 'tag';
  const descending = sortText.startsWith('-');
  const sort = (descending ? sortText.slice(1) : sortText) as SortKey;
  if (!(sort in repo.SORTS)) {
    throw errors.badRequest('VALIDATION_FAILED', `sort must be one of ${Object.keys(repo.SORTS).join(', ')} (prefix - for descending).`, 'sort');
  }
  const cursor = queryText(query.cursor, 'cursor');
  return {
    limit,
    q: q || undefined,
    purpose: purpose as Purpose | undefined,
    location: location as 'indoor' | 'outdoor' | undefined,
    status: status as ListQuery['status'],
    sort,
    descending,
    after: cursor ? decodeCursor(cursor) : undefined,
  };
}

export async function listItems(deps: { db: Db }, caller: Caller, siteId: number, kind: ItemKind, query: Record<string, unknown>) {
  const parsed = parseListQuery(query);
  await siteOrNotFound(deps.db, caller, siteId);
  const { items, last } = await repo.listItems(deps.db, { ...parsed, teamId: caller.teamId, siteId, kind });
  return { items: items.map(viewOf), nextCursor: last ? encodeCursor(last) : null };
}

