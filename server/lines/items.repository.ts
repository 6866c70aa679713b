import type { BuildUp, Fittings, ItemSizing, Purpose, PurposeParameters } from '../../shared/calc/sizing/types';
import { type Db, parseJson } from '../db/db';

export type ItemKind = 'line' | 'vessel';

/** An item as stored, SI. */
export type ItemRecord = {
  id: number;
  teamId: number;
  siteId: number;
  kind: ItemKind;
  tag: string;
  service: string;
  sizeKind: 'nps' | 'dn' | 'od' | null;
  nps: string | null;
  dn: number | null;
  outerDiameterM: number;
  lengthM: number;
  orientation: 'horizontal' | 'vertical';
  heightM: number | null;
  headType: 'flat' | 'ellipsoidal2to1' | 'hemispherical' | null;
  location: 'indoor' | 'outdoor';
  operatingTemperatureC: number;
  purposes: Purpose[];
  purposeParameters: PurposeParameters;
  fittings: Fittings;
  fittingsInsulated: boolean;
  buildUp: BuildUp | null;
  notes: string;
  inputHash: string;
  version: number;
  createdAt: string;
  updatedAt: string;
};

/** The stored summary of an item's last sizing. */
export type ResultSummary = {
  inputHash: string;
  governingPurpose: Purpose | null;
  layersM: number[];
  totalThicknessM: number | null;
  heatLoss: number | null;
  heatLossW: number | null;
  surfaceTemperatureC: number | null;
  burnVerdict: string | null;
  annualEnergyKWh: number | null;
  failing: boolean;
  failingPurposes: Purpose[];
  sizedAt: string;
};

export type ItemWithResult = ItemRecord & { result: ResultSummary | null };

export type StoredResult = ItemSizing | { error: { code: string; field: string; message: string } };

type Row = Record<string, unknown>;

const ITEM_COLUMNS = [
  'i.id',
  'i.team_id',
  'i.site_id',
  'i.kind',
  'i.tag',
  'i.service',
  'i.size_kind',
  'i.nps',
  'i.dn',
  'i.outer_diameter_m',
  'i.length_m',
  'i.orientation',
  'i.height_m',
  'i.head_type',
  'i.location',
  'i.operating_temperature_c',
  'i.purposes',
  'i.purpose_parameters',
  'i.fittings',
  'i.fittings_insulated',
  'i.build_up',
  'i.notes',
  'i.input_hash',
  'i.version',
  'i.created_at',
  'i.updated_at',
];

const RESULT_COLUMNS = [
  'r.input_hash as r_input_hash',
  'r.governing_purpose as r_governing_purpose',
  'r.layers_m as r_layers_m',
  'r.total_thickness_m as r_total_thickness_m',
  'r.heat_loss as r_heat_loss',
  'r.heat_loss_w as r_heat_loss_w',
  'r.surface_temperature_c as r_surface_temperature_c',
  'r.burn_verdict as r_burn_verdict',
  'r.annual_energy_kwh as r_annual_energy_kwh',
  'r.failing as r_failing',
  'r.failing_purposes as r_failing_purposes',
  'r.sized_at as r_sized_at',
];

const iso = (d: unknown) => new Date(d as Date).toISOString();

export function toItem(r: Row): ItemRecord {
  return {
    id: r.id as number,
    teamId: r.team_id as number,
    siteId: r.site_id as number,
    kind: r.kind as ItemKind,
    tag: r.tag as string,
    service: r.service as string,
    sizeKind: (r.size_kind as ItemRecord['sizeKind']) ?? null,
    nps: (r.nps as string | null) ?? null,
    dn: (r.dn as number | null) ?? null,
    outerDiameterM: r.outer_diameter_m as number,
    lengthM: r.length_m as number,
    orientation: r.orientation as ItemRecord['orientation'],
    heightM: (r.height_m as number | null) ?? null,
    headType: (r.head_type as ItemRecord['headType']) ?? null,
    location: r.location as ItemRecord['location'],
    operatingTemperatureC: r.operating_temperature_c as number,
    purposes: parseJson<Purpose[]>(r.purposes, []),
    purposeParameters: parseJson<PurposeParameters>(r.purpose_parameters, {}),
    fittings: parseJson<Fittings>(r.fittings, { valves: 0, flanges: 0, elbows: 0, tees: 0 }),
    fittingsInsulated: !!r.fittings_insulated,
    buildUp: parseJson<BuildUp | null>(r.build_up, null),
    notes: r.notes as string,
    inputHash: r.input_hash as string,
    version: r.version as number,
    createdAt: iso(r.created_at),
    updatedAt: iso(r.updated_at),
  };
}

function toResult(r: Row): ResultSummary | null {
  if (r.r_input_hash == null) return null;
  return {
    inputHash: r.r_input_hash as string,
    governingPurpose: (r.r_governing_purpose as Purpose | null) ?? null,
    layersM: parseJson<number[]>(r.r_layers_m, []),
    totalThicknessM: (r.r_total_thickness_m as number | null) ?? null,
    heatLoss: (r.r_heat_loss as number | null) ?? null,
    heatLossW: (r.r_heat_loss_w as number | null) ?? null,
    surfaceTemperatureC: (r.r_surface_temperature_c as number | null) ?? null,
    burnVerdict: (r.r_burn_verdict as string | null) ?? null,
    annualEnergyKWh: (r.r_annual_energy_kwh as number | null) ?? null,
    failing: !!r.r_failing,
    failingPurposes: parseJson<Purpose[]>(r.r_failing_purposes, []),
    sizedAt: iso(r.r_sized_at),
  };
}

/** The fields an insert or update writes (SI). */
export type ItemWrite = Omit<ItemRecord, 'id' | 'teamId' | 'siteId' | 'kind' | 'version' | 'createdAt' | 'updatedAt'>;

function rowOf(w: Partial<ItemWrite>): Row {
  const row: Row = {};
  const set = (col: string, v: unknown) => {
    if (v !== undefined) row[col] = v;
  };
  set('tag', w.tag);
  set('service', w.service);
  set('size_kind', w.sizeKind);
  set('nps', w.nps);
  set('dn', w.dn);
  set('outer_diameter_m', w.outerDiameterM);
  set('length_m', w.lengthM);
  set('orientation', w.orientation);
  set('height_m', w.heightM);
  set('head_type', w.headType);
  set('location', w.location);
  set('operating_temperature_c', w.operatingTemperatureC);
  if (w.purposes !== undefined) row.purposes = JSON.stringify(w.purposes);
  if (w.purposeParameters !== undefined) row.purpose_parameters = JSON.stringify(w.purposeParameters);
  if (w.fittings !== undefined) row.fittings = JSON.stringify(w.fittings);
  set('fittings_insulated', w.fittingsInsulated);
  if (w.buildUp !== undefined) row.build_up = w.buildUp === null ? null : JSON.stringify(w.buildUp);
  set('notes', w.notes);
  set('input_hash', w.inputHash);
  return row;
}

/** Visible items of a team: contractors only those of sites they were invited to. */
function visible(db: Db, teamId: number, onlyForUserId?: number) {
  const q = db('items as i').where('i.team_id', teamId);
  if (onlyForUserId !== undefined) q.whereIn('i.site_id', db('site_members').select('site_id').where({ user_id: onlyForUserId }));
  return q;
}

export async function findItem(db: Db, teamId: number, id: number, onlyForUserId?: number): Promise<ItemWithResult | undefined> {
  const r = await visible(db, teamId, onlyForUserId)
    .leftJoin('item_results as r', 'r.item_id', 'i.id')
    .where('i.id', id)
    .first([...ITEM_COLUMNS, ...RESULT_COLUMNS]);
  return r ? { ...toItem(r), result: toResult(r) } : undefined;
}

/** The full stored result of an item, or undefined when it was never sized. */
export async function findStoredResult(db: Db, itemId: number): Promise<StoredResult | undefined> {
  const r = await db('item_results').where({ item_id: itemId }).first('result');
  return r ? parseJson<StoredResult>(r.result, { error: { code: 'UNREADABLE', field: '', message: 'The stored result could not be read.' } }) : undefined;
}

export async function insertItem(db: Db, teamId: number, siteId: number, kind: ItemKind, userId: number | null, w: ItemWrite): Promise<number> {
  const [id] = await db('items').insert({ ...rowOf(w), team_id: teamId, site_id: siteId, kind, created_by: userId, updated_by: userId });
  return id;
}

/** Rows for a bulk insert (the import and the demo): same columns as insertItem. */
export function itemInsertRow(teamId: number, siteId: number, kind: ItemKind, userId: number | null, w: ItemWrite): Row {
  return { ...rowOf(w), team_id: teamId, site_id: siteId, kind, created_by: userId, updated_by: userId };
}

export async function updateItem(db: Db, teamId: number, id: number, userId: number, w: Partial<ItemWrite>): Promise<void> {
  await db('items')
    .where({ team_id: teamId, id })
    .update({ ...rowOf(w), updated_by: userId, updated_at: db.fn.now(3), version: db.raw('version + 1') });
}

export async function deleteItem(db: Db, teamId: number, id: number): Promise<number> {
  return db('items').where({ team_id: teamId, id }).delete();
}

export async function tagTaken(db: Db, siteId: number, kind: ItemKind, tag: string, exceptId?: number): Promise<boolean> {
  const q = db('items').where({ site_id: siteId, kind, tag }).first('id');
  if (exceptId !== undefined) q.whereNot({ id: exceptId });
  return !!(await q);
}

/** Every item of a site in id order (for hashing and sizing), optionally after an id. */
export async function listSiteItems(db: Db, siteId: number, opts: { afterId?: number; limit?: number; ids?: number[] } = {}): Promise<ItemRecord[]> {
  const q = db('items as i').where('i.site_id', siteId).orderBy('i.id').select(ITEM_COLUMNS);
  if (opts.afterId !== undefined) q.where('i.id', '>', opts.afterId);
  if (opts.ids) q.whereIn('i.id', opts.ids);
  if (opts.limit !== undefined) q.limit(opts.limit);
  return (await q).map(toItem);
}

export async function countSiteItems(db: Db, siteId: number): Promise<number> {
  const r = await db('items').where({ site_id: siteId }).count<{ n: number }[]>({ n: '*' });
  return Number(r[0]?.n ?? 0);
}

/** Sets new input fingerprints, 500 items per statement. */
export async function setInputHashes(db: Db, hashes: { id: number; hash: string }[]): Promise<void> {
  for (let i = 0; i < hashes.length; i += 500) {
    const part = hashes.slice(i, i + 500);
    const cases = part.map(() => 'WHEN ? THEN ?').join(' ');
    await db.raw(`UPDATE items SET input_hash = CASE id ${cases} ELSE input_hash END WHERE id IN (${part.map(() => '?').join(',')})`, [
      ...part.flatMap((h) => [h.id, h.hash]),
      ...part.map((h) => h.id),
    ]);
  }
}

/** Stores sizing results (insert or replace), 500 per statement. */
export async function upsertResults(
  db: Db,
  rows: { itemId: number; siteId: number; inputHash: string; result: StoredResult; sizedAt: Date }[],
): Promise<void> {
  for (let i = 0; i < rows.length; i += 500) {
    const part = rows.slice(i, i + 500).map((x) => {
      const ok = 'error' in x.result ? undefined : x.result;
      const failing = ok ? ok.failing : [];
      return {
        item_id: x.itemId,
        site_id: x.siteId,
        input_hash: x.inputHash,
        governing_purpose: ok?.governingPurpose ?? null,
        layers_m: JSON.stringify(ok?.layersM ?? []),
        total_thickness_m: ok?.totalThicknessM ?? null,
        heat_loss: ok ? (ok.heatLossWPerM ?? ok.heatLossW ?? null) : null,
        heat_loss_w: ok?.heatLossW ?? null,
        bare_heat_loss_w: ok?.bareHeatLossW ?? null,
        service_kind: ok?.service ?? null,
        bare_annual_energy_kwh: ok?.bareAnnualEnergyKWh ?? null,
        surface_temperature_c: ok?.surfaceTemperatureC ?? null,
        burn_verdict: ok?.burnVerdict ?? null,
        annual_energy_kwh: ok?.annualEnergyKWh ?? null,
        failing: !ok || failing.length > 0,
        failing_purposes: JSON.stringify(failing),
        result: JSON.stringify(x.result),
        sized_at: x.sizedAt,
      };
    });
    await db('item_results').insert(part).onConflict('item_id').merge();
  }
}

// ---------------------------------------------------------------------------------------------------------
// Listing with filters, sorting and a keyset cursor

/** Columns a list can be sorted by, with their SQL. */
export const SORTS = {
  tag: { sql: 'i.tag', text: true },
  service: { sql: 'i.service', text: true },
  outerDiameterM: { sql: 'i.outer_diameter_m', text: false },
  lengthM: { sql: 'i.length_m', text: false },
  operatingTemperatureC: { sql: 'i.operating_temperature_c', text: false },
  location: { sql: 'i.location', text: true },
  governingPurpose: { sql: 'r.governing_purpose', text: true },
  totalThicknessM: { sql: 'r.total_thickness_m', text: false },
  heatLoss: { sql: 'r.heat_loss', text: false },
  surfaceTemperatureC: { sql: 'r.surface_temperature_c', text: false },
  annualEnergyKWh: { sql: 'r.annual_energy_kwh', text: false },
  sizedAt: { sql: 'r.sized_at', text: true },
} as const;
export type SortKey = keyof typeof SORTS;

export type ListQuery = {
  teamId: number;
  siteId: number;
  kind: ItemKind;
  limit: number;
  q?: string;
  purpose?: Purpose;
  location?: 'indoor' | 'outdoor';
  status?: 'failing' | 'stale' | 'unsized' | 'sized' | 'current';
  sort: SortKey;
  descending: boolean;
  /** Decoded cursor: [is the sort value null, the value, the id]. */
  after?: [boolean, string | number | null, number];
};

const likeEscape = (s: string) => s.replace(/[\\%_]/g, (c) => `\\${c}`);

/** Keyset page: sorted by (value is null, value, id) with nulls last in either direction. */
export async function listItems(db: Db, q: ListQuery): Promise<{ items: ItemWithResult[]; last?: [boolean, string | number | null, number] }> {
  const s = SORTS[q.sort];
  const query = db('items as i')
    .leftJoin('item_results as r', 'r.item_id', 'i.id')
    .where({ 'i.team_id': q.teamId, 'i.site_id': q.siteId, 'i.kind': q.kind })
    .select([...ITEM_COLUMNS, ...RESULT_COLUMNS]);
  if (q.q) {
    const needle = `%${likeEscape(q.q)}%`;
    query.where((w) => w.where('i.tag', 'like', needle).orWhere('i.service', 'like', needle));
  }
  if (q.purpose) query.whereRaw('JSON_CONTAINS(i.purposes, ?)', [JSON.stringify(q.purpose)]);
  if (q.location) query.where('i.location', q.location);
  switch (q.status) {
    case 'failing':
      query.where('r.failing', 1);
      break;
    case 'stale':
      query.whereNotNull('r.item_id').whereRaw('r.input_hash <> i.input_hash');
      break;
    case 'unsized':
      query.whereNull('r.item_id');
      break;
    case 'sized':
      query.whereNotNull('r.item_id');
      break;
    case 'current':
      query.whereRaw('r.input_hash = i.input_hash');
      break;
  }
  if (q.after) {
    const [wasNull, value, id] = q.after;
    const cmp = q.descending ? '<' : '>';
    if (wasNull) {
      query.whereRaw(`(${s.sql} IS NULL AND i.id ${cmp} ?)`, [id]);
    } else {
      query.whereRaw(`(${s.sql} IS NULL OR ${s.sql} ${cmp} ? OR (${s.sql} = ? AND i.id ${cmp} ?))`, [value, value, id]);
    }
  }
  const dir = q.descending ? 'desc' : 'asc';
  query.orderByRaw(`${s.sql} IS NULL, ${s.sql} ${dir}, i.id ${dir}`).limit(q.limit + 1);
  const rows = await query;
  const more = rows.length > q.limit;
  const page = (more ? rows.slice(0, q.limit) : rows) as Row[];
  const items = page.map((r) => ({ ...toItem(r), result: toResult(r) }));
  if (!more || page.length === 0) return { items };
  const lastRow = page[page.length - 1];
  const col = s.sql.replace(/^[ir]\./, '');
  const raw = s.sql.startsWith('r.') ? lastRow[`r_${col}`] : lastRow[col];
  const value = raw == null ? null : raw instanceof Date ? raw.toISOString().slice(0, 23).replace('T', ' ') : (raw as string | number);
  return { items, last: [value === null, value, lastRow.id as number] };
}

/** Counts for the site overview: items, sized, stale, unsized, failing, per kind. */
export async function siteCounts(db: Db, siteId: number) {
  const rows = await db('items as i')
    .leftJoin('item_results as r', 'r.item_id', 'i.id')
    .where('i.site_id', siteId)
    .groupBy('i.kind')
    .select(
      'i.kind',
      db.raw('COUNT(*) as n'),
      db.raw('SUM(r.item_id IS NULL) as unsized'),
      db.raw('SUM(r.item_id IS NOT NULL AND r.input_hash <> i.input_hash) as stale'),
      db.raw('SUM(COALESCE(r.failing, 0)) as failing'),
    );
  return rows.map((r: Row) => ({ kind: r.kind as ItemKind, items: Number(r.n), unsized: Number(r.unsized ?? 0), stale: Number(r.stale ?? 0), failing: Number(r.failing ?? 0) }));
}

/** Totals of a site's sized items per service name and hot/cold (for the overview and the heat-loss summary). */
export async function siteTotalsByService(db: Db, siteId: number) {
  const rows = await db('items as i')
    .join('item_results as r', 'r.item_id', 'i.id')
    .where('i.site_id', siteId)
    .groupBy('i.service', 'r.service_kind')
    .select(
      'i.service',
      'r.service_kind',
      db.raw('COUNT(*) as n'),
      db.raw('SUM(r.heat_loss_w) as heat_loss_w'),
      db.raw('SUM(r.bare_heat_loss_w) as bare_heat_loss_w'),
      db.raw('SUM(r.annual_energy_kwh) as annual_energy_kwh'),
      db.raw('SUM(r.bare_annual_energy_kwh) as bare_annual_energy_kwh'),
    );
  return rows.map((r: Row) => ({
    service: r.service as string,
    serviceKind: (r.service_kind as 'hot' | 'cold' | null) ?? null,
    items: Number(r.n),
    heatLossW: Number(r.heat_loss_w ?? 0),
    bareHeatLossW: Number(r.bare_heat_loss_w ?? 0),
    annualEnergyKWh: Number(r.annual_energy_kwh ?? 0),
    bareAnnualEnergyKWh: Number(r.bare_annual_energy_kwh ?? 0),
  }));
}
