import { sizingLibrary } from '../../shared/calc/sizing/library';
import type { ItemSizing } from '../../shared/calc/sizing/types';
import type { UnitSystem } from '../../shared/schemas/common';
import {
  DEFAULT_REVISION_SCHEME,
  REVISION_PURPOSE_LABELS,
  revisionNumber,
  revisionSeries,
  type RevisionPatchInput,
  type RevisionPrepareInput,
  type RevisionPurpose,
  type RevisionScheme,
  type RevisionSignInput,
} from '../../shared/schemas/revisions';
import { insertAudit } from '../audit/audit.repository';
import type { Caller } from '../auth/auth.service';
import { type Db, inTransaction } from '../db/db';
import { AppError, errors, type ErrorItem } from '../errors';
import { visibleTo } from '../lines/items.service';
import { findSettings } from '../me/settings.repository';
import { displayUnits } from '../reports/display';
import { libraryNames } from '../reports/describe';
import { findSite } from '../sites/sites.repository';
import { storedSettingsOf, teamLibrary } from '../sizing/sizing-context';
import { COMPARISON_CSV_HEADER, compareLists, comparisonCsvRows } from './compare';
import * as repo from './revisions.repository';
import type { RevisionRecord } from './revisions.repository';
import { blockersOf, libraryUsed, snapshotHash, standingOf, totalsOf, type ListedItem, type SiteSnapshot } from './snapshot';

/** Blockers listed in an answer (all are counted). */
const BLOCKERS_LISTED = 500;

async function siteOrNotFound(db: Db, caller: Caller, siteId: number) {
  const site = await findSite(db, caller.teamId, siteId, visibleTo(caller));
  if (!site) throw errors.notFound('The site');
  return site;
}

/** A revision of a site the caller may see, or 404. */
async function revisionOrNotFound(db: Db, caller: Caller, id: number, opts: { lock?: boolean } = {}): Promise<RevisionRecord> {
  const r = await repo.findRevision(db, caller.teamId, id, opts);
  if (!r || !(await findSite(db, caller.teamId, r.siteId, visibleTo(caller)))) throw errors.notFound('The revision');
  return r;
}

const issued = (r: RevisionRecord) =>
  errors.conflict('REVISION_ISSUED', `Revision ${r.number} was issued on ${r.approved?.at.slice(0, 10)} and is read-only; prepare a new revision to change the schedule.`);

/** The database refuses changes to issued revisions too (triggers); such a refusal reads as the same 409. */
async function guardFrozen<T>(r: RevisionRecord, fn: () => Promise<T>): Promise<T> {
  try {
    return await fn();
  } catch (e) {
    const m = (e as { sqlMessage?: string; message?: string }).sqlMessage ?? '';
    if (/^REVISION_(ISSUED|ITEM_FROZEN)/.test(m)) throw issued(r);
    throw e;
  }
}

const signatureView = (s: repo.Signature | null) => (s ? { userId: s.userId, name: s.name, at: s.at } : null);

/** A revision as the API shows it. */
export function revisionView(r: RevisionRecord) {
  return {
    id: r.id,
    siteId: r.siteId,
    number: r.number,
    purpose: r.purpose,
    purposeLabel: REVISION_PURPOSE_LABELS[r.purpose],
    description: r.description,
    status: r.status,
    snapshotHash: r.snapshotHash,
    itemCount: r.itemCount,
    totals: r.totals,
    prepared: signatureView(r.prepared),
    checked: signatureView(r.checked),
    approved: signatureView(r.approved),
    issuedAt: r.status === 'issued' ? (r.approved?.at ?? null) : null,
    createdAt: r.createdAt,
    updatedAt: r.updatedAt,
  };
}

function detailView(r: RevisionRecord) {
  return {
    ...revisionView(r),
    site: r.snapshot.site,
    designBases: r.snapshot.designBases,
    sizingSettings: r.snapshot.sizingSettings,
    library: r.snapshot.library,
  };
}

export async function listRevisions(deps: { db: Db }, caller: Caller, siteId: number) {
  await siteOrNotFound(deps.db, caller, siteId);
  return (await repo.listRevisions(deps.db, siteId)).map(revisionView);
}

export async function getRevision(deps: { db: Db }, caller: Caller, id: number) {
  return detailView(await revisionOrNotFound(deps.db, caller, id));
}

/** The site part of a snapshot, as the site is now. */
async function siteSnapshotNow(db: Db, teamId: number, site: repo.SiteForRevision, items: readonly ListedItem[]): Promise<SiteSnapshot> {
  const sizingSettings = storedSettingsOf(site.sizingSettings);
  const library = sizingLibrary(await teamLibrary(db, teamId));
  return {
    site: { id: site.id, name: site.name, description: site.description },
    designBases: site.designBases,
    sizingSettings,
    library: libraryUsed(items, library, sizingSettings),
  };
}

/** Whether the draft can be issued now: blockers (stale, unsized, unsizable items), failing items, the revision in progress. */
export async function readiness(deps: { db: Db }, caller: Caller, siteId: number) {
  await siteOrNotFound(deps.db, caller, siteId);
  const items = await repo.listItemStandings(deps.db, siteId);
  const blockers = blockersOf(items);
  const failing = items.filter((x) => x.failing.length > 0).map((x) => ({ itemId: x.itemId, kind: x.kind, tag: x.tag, purposes: x.failing }));
  const active = await repo.findActiveRevision(deps.db, siteId);
  const scheme = schemeOf((await repo.readSiteForRevision(deps.db, caller.teamId, siteId)) as repo.SiteForRevision);
  const next = async (purpose: RevisionPurpose) => revisionNumber(scheme, purpose, (await repo.maxSequence(deps.db, siteId, revisionSeries(scheme, purpose))) + 1);
  return {
    ready: items.length > 0 && blockers.length === 0 && !active,
    itemCount: items.length,
    blockerCount: blockers.length,
    blockers: blockers.slice(0, BLOCKERS_LISTED),
    failing: failing.slice(0, BLOCKERS_LISTED),
    failingCount: failing.length,
    inProgress: active ? revisionView(active) : null,
    scheme,
    nextNumbers: { review: await next('review'), construction: await next('construction') },
  };
}

function schemeOf(site: repo.SiteForRevision): RevisionScheme {
  return site.revisionScheme ?? DEFAULT_REVISION_SCHEME;
}

/**
 * Prepares a revision: numbers it, takes the snapshot of every item (inputs, build-up, sizing result) with
 * the site's bases and settings, and records the preparer. Refused while another revision is in progress,
 * when the line list is empty, or when any item is unsized, stale or could not be sized (the answer lists
 * them, with the reason).
 */
export async function prepareRevision(deps: { db: Db }, caller: Caller, siteId: number, input: RevisionPrepareInput, ip?: string) {
  return inTransaction(deps.db, async (trx) => {
    await siteOrNotFound(trx, caller, siteId);
    const site = (await repo.readSiteForRevision(trx, caller.teamId, siteId, { lock: true })) as repo.SiteForRevision;
    const active = await repo.findActiveRevision(trx, siteId);
    if (active) {
      throw errors.conflict(
        'REVISION_IN_PROGRESS',
        `Revision ${active.number} is ${active.status === 'prepared' ? 'waiting to be checked' : 'waiting to be approved'}; approve or withdraw it before preparing another.`,
      );
    }
    const items = await repo.listDraftItems(trx, siteId);
    if (items.length === 0) throw errors.conflict('EMPTY_LINE_LIST', 'The site has no lines or vessels to issue.');
    const blockers = blockersOf(items.map(standingOf));
    if (blockers.length > 0) {
      const listed: ErrorItem[] = blockers.slice(0, BLOCKERS_LISTED).map((b) => ({
        code: b.reason === 'unsized' ? 'ITEM_UNSIZED' : b.reason === 'stale' ? 'ITEM_STALE' : 'ITEM_SIZING_ERROR',
        message: b.message,
        field: `${b.kind}s[${b.tag}]`,
      }));
      const message = `${blockers.length} item${blockers.length === 1 ? '' : 's'} must be sized on ${blockers.length === 1 ? 'its' : 'their'} current inputs before a revision can be prepared.`;
      throw new AppError(409, 'ITEMS_NOT_READY', message, [{ code: 'ITEMS_NOT_READY', message }, ...listed]);
    }
    const scheme = schemeOf(site);
    const series = revisionSeries(scheme, input.purpose);
    const sequence = (await repo.maxSequence(trx, siteId, series)) + 1;
    const number = revisionNumber(scheme, input.purpose, sequence);
    if (await repo.numberTaken(trx, siteId, number)) {
      throw errors.conflict('NUMBER_TAKEN', `The site already has a revision ${number}; change the numbering scheme's prefix or start.`);
    }
    const snapshot = await siteSnapshotNow(trx, caller.teamId, site, items);
    const frozen = items.map((x) => ({ item: x.item, result: x.result as ItemSizing, sizedAt: x.sizedAt as string }));
    const hash = snapshotHash(snapshot, frozen);
    const id = await repo.insertRevision(trx, {
      teamId: caller.teamId,
      siteId,
      series,
      sequence,
      number,
      purpose: input.purpose,
      description: input.description ?? '',
      snapshot,
      snapshotHash: hash,
      itemCount: items.length,
      totals: totalsOf(items),
      preparedBy: caller.userId,
      preparedByName: caller.name,
      preparedAt: new Date(),
    });
    await repo.insertRevisionItems(trx, id, frozen);
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'revision.prepared', targetType: 'revision', targetId: id, details: { siteId, number, items: items.length, snapshotHash: hash }, ip });
    return detailView((await repo.findRevision(trx, caller.teamId, id)) as RevisionRecord);
  });
}

function assertHash(r: RevisionRecord, input: RevisionSignInput) {
  if (input.snapshotHash !== r.snapshotHash) {
    throw errors.conflict('SNAPSHOT_MISMATCH', `The snapshot you reviewed is not revision ${r.number} as prepared; reload it and review again.`, 'snapshotHash');
  }
}

/** The checker signs the prepared snapshot; the preparer may not check their own work. */
export async function checkRevision(deps: { db: Db }, caller: Caller, id: number, input: RevisionSignInput, ip?: string) {
  return inTransaction(deps.db, async (trx) => {
    const r = await revisionOrNotFound(trx, caller, id, { lock: true });
    if (r.status === 'issued') throw issued(r);
    if (r.status === 'checked') throw errors.conflict('ALREADY_CHECKED', `Revision ${r.number} was checked by ${r.checked?.name}; it now needs an approver.`);
    if (r.prepared.userId === caller.userId) {
      throw errors.conflict('SAME_SIGNATORY', `You prepared revision ${r.number}; another member must check it.`);
    }
    assertHash(r, input);
    const ok = await repo.recordSignature(trx, id, 'checked', { userId: caller.userId, name: caller.name, at: new Date(), hash: r.snapshotHash }, 'prepared');
    if (!ok) throw errors.conflict('ALREADY_CHECKED', `Revision ${r.number} was checked meanwhile; reload it.`);
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'revision.checked', targetType: 'revision', targetId: id, details: { number: r.number, snapshotHash: r.snapshotHash }, ip });
    return detailView((await repo.findRevision(trx, caller.teamId, id)) as RevisionRecord);
  });
}

/** The approver signs the checked snapshot and so issues it; neither the preparer nor the checker may approve. */
export async function approveRevision(deps: { db: Db }, caller: Caller, id: number, input: RevisionSignInput, ip?: string) {
  return inTransaction(deps.db, async (trx) => {
    const r = await revisionOrNotFound(trx, caller, id, { lock: true });
    if (r.status === 'issued') throw issued(r);
    if (r.status !== 'checked') throw errors.conflict('NOT_CHECKED', `Revision ${r.number} must be checked before it is approved.`);
    if (r.prepared.userId === caller.userId) throw errors.conflict('SAME_SIGNATORY', `You prepared revision ${r.number}; another member must approve it.`);
    if (r.checked?.userId === caller.userId) throw errors.conflict('SAME_SIGNATORY', `You checked revision ${r.number}; another member must approve it.`);
    assertHash(r, input);
    const ok = await repo.recordSignature(trx, id, 'approved', { userId: caller.userId, name: caller.name, at: new Date(), hash: r.snapshotHash }, 'checked');
    if (!ok) throw errors.conflict('NOT_CHECKED', `Revision ${r.number} changed meanwhile; reload it.`);
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'revision.issued', targetType: 'revision', targetId: id, details: { number: r.number, snapshotHash: r.snapshotHash }, ip });
    return detailView((await repo.findRevision(trx, caller.teamId, id)) as RevisionRecord);
  });
}

/** Changes the description of a prepared revision (before anyone has signed it but the preparer). */
export async function updateRevision(deps: { db: Db }, caller: Caller, id: number, patch: RevisionPatchInput, ip?: string) {
  return inTransaction(deps.db, async (trx) => {
    const r = await revisionOrNotFound(trx, caller, id, { lock: true });
    if (r.status === 'issued') throw issued(r);
    if (r.status === 'checked') throw errors.conflict('REVISION_SIGNED', `Revision ${r.number} has been checked; withdraw it and prepare it again to change it.`);
    await guardFrozen(r, () => repo.updateRevisionDescription(trx, id, patch.description));
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'revision.updated', targetType: 'revision', targetId: id, details: { fields: ['description'] }, ip });
    return detailView((await repo.findRevision(trx, caller.teamId, id)) as RevisionRecord);
  });
}

/** Withdraws a revision that was not issued; its number is free again. Issued revisions stay forever. */
export async function withdrawRevision(deps: { db: Db }, caller: Caller, id: number, ip?: string) {
  await inTransaction(deps.db, async (trx) => {
    const r = await revisionOrNotFound(trx, caller, id, { lock: true });
    if (r.status === 'issued') throw issued(r);
    await guardFrozen(r, () => repo.deleteUnissuedRevision(trx, id));
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'revision.withdrawn', targetType: 'revision', targetId: id, details: { siteId: r.siteId, number: r.number, status: r.status }, ip });
  });
}

export async function getScheme(deps: { db: Db }, caller: Caller, siteId: number): Promise<RevisionScheme> {
  await siteOrNotFound(deps.db, caller, siteId);
  const site = (await repo.readSiteForRevision(deps.db, caller.teamId, siteId)) as repo.SiteForRevision;
  return schemeOf(site);
}

export async function updateScheme(deps: { db: Db }, caller: Caller, siteId: number, input: { kind: RevisionScheme['kind']; prefix?: string; start?: number; digits?: number }, ip?: string) {
  return inTransaction(deps.db, async (trx) => {
    await siteOrNotFound(trx, caller, siteId);
    const scheme: RevisionScheme =
      input.kind === 'trade' ? { kind: 'trade' } : { kind: 'counter', prefix: input.prefix ?? '', start: input.start ?? 1, digits: input.digits ?? 2 };
    await repo.writeRevisionScheme(trx, caller.teamId, siteId, scheme);
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'site.revision_scheme_updated', targetType: 'site', targetId: siteId, details: scheme, ip });
    return scheme;
  });
}

// ---------------------------------------------------------------------------------------------------------
// A line list as it was (a revision) or as it is (the draft), for comparisons and reports

export type LineList = {
  /** null: the draft. */
  revision: RevisionRecord | null;
  snapshot: SiteSnapshot;
  items: ListedItem[];
};

/** The draft or a revision of a site; a revision of another site is a 404. */
export async function loadLineList(db: Db, caller: Caller, siteId: number, which: number | 'draft'): Promise<LineList> {
  await siteOrNotFound(db, caller, siteId);
  if (which === 'draft') {
    const site = (await repo.readSiteForRevision(db, caller.teamId, siteId)) as repo.SiteForRevision;
    const items = await repo.listDraftItems(db, siteId);
    return { revision: null, snapshot: await siteSnapshotNow(db, caller.teamId, site, items), items };
  }
  const r = await repo.findRevision(db, caller.teamId, which);
  if (!r || r.siteId !== siteId) throw errors.notFound('The revision');
  return { revision: r, snapshot: r.snapshot, items: await repo.listRevisionItems(db, r.id) };
}

/** The caller's unit system unless the query names one. */
export async function unitsFor(db: Db, caller: Caller, given: string | undefined): Promise<UnitSystem> {
  if (given === undefined) return (await findSettings(db, caller.userId)).unitSystem;
  if (given !== 'SI' && given !== 'US') throw errors.badRequest('VALIDATION_FAILED', 'units must be SI or US.', 'units');
  return given;
}

/** Parses a `revision` query value: a revision id, or `draft`. */
export function parseWhich(value: unknown, field: string, fallback: number | 'draft' | null): number | 'draft' {
  if (value === undefined) {
    if (fallback === null) throw errors.badRequest('VALIDATION_FAILED', `${field} is required: a revision id or draft.`, field);
    return fallback;
  }
  if (value === 'draft') return 'draft';
  if (typeof value !== 'string' || !/^[1-9][0-9]{0,9}$/.test(value)) {
    throw errors.badRequest('VALIDATION_FAILED', `${field} must be a revision id or draft.`, field);
  }
  return Number(value);
}

export function refuseUnknownQuery(query: Record<string, unknown>, known: readonly string[]): void {
  for (const k of Object.keys(query)) {
    if (!known.includes(k)) throw errors.badRequest('VALIDATION_FAILED', `Unknown query parameter "${k}".`, k);
  }
  for (const k of known) {
    if (query[k] !== undefined && typeof query[k] !== 'string') throw errors.badRequest('VALIDATION_FAILED', `${k} must be given once.`, k);
  }
}

const sideView = (l: LineList) =>
  l.revision
    ? { kind: 'revision' as const, id: l.revision.id, number: l.revision.number, status: l.revision.status, issuedAt: l.revision.status === 'issued' ? (l.revision.approved?.at ?? null) : null }
    : { kind: 'draft' as const };

/**
 * Compares two line lists of a site. Without `from`, the latest issued revision (else the latest revision);
 * without `to`, the draft.
 */
export async function compare(deps: { db: Db }, caller: Caller, siteId: number, query: Record<string, unknown>) {
  refuseUnknownQuery(query, ['from', 'to', 'units']);
  await siteOrNotFound(deps.db, caller, siteId);
  const units = await unitsFor(deps.db, caller, query.units as string | undefined);
  let fallback: number | null = null;
  if (query.from === undefined) {
    const all = await repo.listRevisions(deps.db, siteId);
    fallback = (all.find((r) => r.status === 'issued') ?? all[0])?.id ?? null;
    if (fallback === null) throw errors.badRequest('NO_REVISION', 'The site has no revision yet to compare with; prepare one first.', 'from');
  }
  const from = await loadLineList(deps.db, caller, siteId, parseWhich(query.from, 'from', fallback));
  const to = await loadLineList(deps.db, caller, siteId, parseWhich(query.to, 'to', 'draft'));
  const names = libraryNames({
    materials: [...from.snapshot.library.materials, ...to.snapshot.library.materials],
    finishes: [...from.snapshot.library.finishes, ...to.snapshot.library.finishes],
  });
  const { counts, changes } = compareLists(from.items, to.items, displayUnits(units), names);
  return { from: sideView(from), to: sideView(to), units, counts, changes, site: to.snapshot.site };
}

/** The comparison as CSV rows, and a file name that says what was compared. */
export async function compareCsv(deps: { db: Db }, caller: Caller, siteId: number, query: Record<string, unknown>) {
  const c = await compare(deps, caller, siteId, query);
  const label = (s: typeof c.from) => (s.kind === 'draft' ? 'draft' : `rev-${s.number}`);
  return {
    fileName: `${c.site.name}_${label(c.from)}_to_${label(c.to)}_comparison.csv`,
    header: [...COMPARISON_CSV_HEADER],
    rows: comparisonCsvRows(c.changes),
  };
}
