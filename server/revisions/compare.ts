/**
 * Line-by-line comparison of two line lists (two revisions, or a revision and the draft): items added,
 * removed and changed, each change field by field, thickness changes flagged. Items are matched by the item
 * they were (so a renamed tag reads as a change of tag), then by kind and tag.
 *
 * Inputs compare exactly; results compare at the precision they are printed, so re-sizing an unchanged item
 * never shows a difference in the last binary digit.
 */
import { canonicalJson } from '../../shared/calc/sizing/hash';
import type { ComparisonCounts, FieldChange, ItemChange } from '../../shared/schemas/revisions';
import type { DisplayUnits } from '../reports/display';
import { buildUpText, layersText, purposesLong, sizeLabel, type LibraryNames } from '../reports/describe';
import { PURPOSE_NAMES } from '../reports/display';
import type { ListedItem } from './snapshot';

type FieldDef = {
  field: string;
  label: string;
  /** Inputs compare their raw value; results the printed text. */
  by: 'value' | 'text';
  value: (x: ListedItem) => unknown;
  text: (x: ListedItem, du: DisplayUnits, names: LibraryNames) => string;
  thickness?: boolean;
};

const STATUS_WORDS = { current: 'sized', stale: 'stale (inputs changed since sizing)', unsized: 'not sized', error: 'could not be sized' } as const;
const orNone = (s: string) => (s === '' ? '—' : s);
const num = (v: number | null | undefined, f: (x: number) => string) => (v === null || v === undefined ? '—' : f(v));

function parametersText(x: ListedItem, du: DisplayUnits): string {
  const p = x.item.purposeParameters;
  const parts: string[] = [];
  if (p.heatConservation?.maxHeatLossWPerM !== undefined) parts.push(`heat loss ≤ ${du.heatLossPerLength(p.heatConservation.maxHeatLossWPerM)}`);
  if (p.heatConservation?.maxHeatLossW !== undefined) parts.push(`heat loss ≤ ${du.heatFlow(p.heatConservation.maxHeatLossW)}`);
  if (p.temperatureHolding) {
    const t = p.temperatureHolding;
    parts.push(`holding: ${t.massFlowKgPerS} kg/s, c ${t.specificHeatJPerKgK} J/(kg·K), drop ≤ ${du.temperatureDelta(t.maxChangeK)}`);
  }
  if (p.frostProtection) parts.push(`frost: ≥ ${p.frostProtection.minHours} h`);
  return parts.join('; ');
}

const FIELDS: FieldDef[] = [
  { field: 'tag', label: 'Tag', by: 'value', value: (x) => x.item.tag, text: (x) => x.item.tag },
  { field: 'service', label: 'Service', by: 'value', value: (x) => x.item.service, text: (x) => orNone(x.item.service) },
  {
    field: 'size',
    label: 'Size',
    by: 'value',
    value: (x) => [x.item.sizeKind, x.item.nps, x.item.dn, x.item.outerDiameterM],
    text: (x, du) => sizeLabel(x.item, du),
  },
  { field: 'lengthM', label: 'Length', by: 'value', value: (x) => x.item.lengthM, text: (x, du) => du.length(x.item.lengthM) },
  { field: 'orientation', label: 'Orientation', by: 'value', value: (x) => x.item.orientation, text: (x) => x.item.orientation },
  { field: 'heightM', label: 'Vertical run', by: 'value', value: (x) => x.item.heightM, text: (x, du) => num(x.item.heightM, du.length) },
  { field: 'headType', label: 'Head type', by: 'value', value: (x) => x.item.headType, text: (x) => x.item.headType ?? '—' },
  { field: 'location', label: 'Location', by: 'value', value: (x) => x.item.location, text: (x) => x.item.location },
  {
    field: 'operatingTemperatureC',
    label: 'Operating temperature',
    by: 'value',
    value: (x) => x.item.operatingTemperatureC,
    text: (x, du) => du.temperature(x.item.operatingTemperatureC),
  },
  { field: 'purposes', label: 'Purposes', by: 'value', value: (x) => x.item.purposes, text: (x) => purposesLong(x.item.purposes) },
  { field: 'purposeParameters', label: 'Purpose parameters', by: 'value', value: (x) => x.item.purposeParameters, text: (x, du) => orNone(parametersText(x, du)) },
  {
    field: 'fittings',
    label: 'Valves, flanges, elbows, tees',
    by: 'value',
    value: (x) => (x.item.kind === 'line' ? x.item.fittings : null),
    text: (x) => (x.item.kind === 'line' ? `${x.item.fittings.valves}, ${x.item.fittings.flanges}, ${x.item.fittings.elbows}, ${x.item.fittings.tees}` : '—'),
  },
  {
    field: 'fittingsInsulated',
    label: 'Valve and flange covers',
    by: 'value',
    value: (x) => (x.item.kind === 'line' ? x.item.fittingsInsulated : null),
    text: (x) => (x.item.kind === 'line' ? (x.item.fittingsInsulated ? 'insulated' : 'bare') : '—'),
  },
  { field: 'buildUp', label: 'Build-up as entered', by: 'value', value: (x) => x.item.buildUp, text: (x, du, n) => buildUpText(x.item.buildUp, du, n) },
  { field: 'notes', label: 'Notes', by: 'value', value: (x) => x.item.notes, text: (x) => orNone(x.item.notes) },
  { field: 'sizingStatus', label: 'Sizing', by: 'text', value: (x) => x.status, text: (x) => STATUS_WORDS[x.status] },
  {
    field: 'governingPurpose',
    label: 'Governing purpose',
    by: 'text',
    value: (x) => x.result?.governingPurpose ?? null,
    text: (x) => (x.result?.governingPurpose ? PURPOSE_NAMES[x.result.governingPurpose] : '—'),
  },
  {
    field: 'layers',
    label: 'Insulation layers',
    by: 'text',
    thickness: true,
    value: (x) => x.result?.layers ?? null,
    text: (x, du, n) => orNone(layersText(x.result, du, n.material)),
  },
  {
    field: 'totalThicknessM',
    label: 'Total thickness',
    by: 'text',
    thickness: true,
    value: (x) => x.result?.totalThicknessM ?? null,
    text: (x, du) => num(x.result?.totalThicknessM, du.thickness),
  },
  { field: 'finish', label: 'Finish', by: 'text', value: (x) => x.result?.finishId ?? null, text: (x, _du, n) => (x.result ? n.finish(x.result.finishId) : '—') },
  {
    field: 'surfaceTemperatureC',
    label: 'Surface temperature',
    by: 'text',
    value: (x) => x.result?.surfaceTemperatureC ?? null,
    text: (x, du) => num(x.result?.surfaceTemperatureC, du.temperature),
  },
  {
    field: 'heatLossWPerM',
    label: 'Heat loss per length',
    by: 'text',
    value: (x) => x.result?.heatLossWPerM ?? null,
    text: (x, du) => num(x.result?.heatLossWPerM, du.heatLossPerLength),
  },
  { field: 'heatLossW', label: 'Heat loss', by: 'text', value: (x) => x.result?.heatLossW ?? null, text: (x, du) => num(x.result?.heatLossW, du.heatFlow) },
  {
    field: 'annualEnergyKWh',
    label: 'Annual energy',
    by: 'text',
    value: (x) => x.result?.annualEnergyKWh ?? null,
    text: (x, du) => num(x.result?.annualEnergyKWh, du.bigEnergy),
  },
  { field: 'burnVerdict', label: 'Burn check', by: 'text', value: (x) => x.result?.burnVerdict ?? null, text: (x) => x.result?.burnVerdict ?? '—' },
  {
    field: 'failing',
    label: 'Purposes not met',
    by: 'text',
    value: (x) => x.result?.failing ?? null,
    text: (x) => (x.result ? orNone(purposesLong(x.result.failing)) : '—'),
  },
];

const keyOf = (x: ListedItem) => `${x.item.kind}:${x.item.tag}`;

function summaryOf(x: ListedItem, du: DisplayUnits, names: LibraryNames): string {
  const parts = [sizeLabel(x.item, du), du.temperatureList(x.item.operatingTemperatureC)];
  if (x.result) parts.push(orNone(layersText(x.result, du, names.material)));
  else parts.push(STATUS_WORDS[x.status]);
  return parts.join(' · ');
}

const collator = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });

/**
 * Compares two line lists.
 *
 * @param from - the earlier list
 * @param to - the later list
 * @param du - units of the texts
 * @param names - material and finish names of both lists
 * @returns the changes sorted by kind and tag, and the counts
 */
export function compareLists(from: readonly ListedItem[], to: readonly ListedItem[], du: DisplayUnits, names: LibraryNames): { counts: ComparisonCounts; changes: ItemChange[] } {
  const toById = new Map(to.map((x) => [x.item.itemId, x]));
  const toByKey = new Map(to.map((x) => [keyOf(x), x]));
  const matched = new Set<ListedItem>();
  const pairs: [ListedItem | null, ListedItem | null][] = [];
  const unmatchedFrom: ListedItem[] = [];
  for (const a of from) {
    const b = toById.get(a.item.itemId);
    if (b && b.item.kind === a.item.kind && !matched.has(b)) {
      matched.add(b);
      pairs.push([a, b]);
    } else unmatchedFrom.push(a);
  }
  for (const a of unmatchedFrom) {
    const b = toByKey.get(keyOf(a));
    if (b && !matched.has(b)) {
      matched.add(b);
      pairs.push([a, b]);
    } else pairs.push([a, null]);
  }
  for (const b of to) if (!matched.has(b)) pairs.push([null, b]);

  const thickness = (x: ListedItem | null) => x?.result?.totalThicknessM ?? null;
  const thicknessText = (x: ListedItem | null) => (x?.result ? du.thickness(x.result.totalThicknessM) : '—');
  const counts: ComparisonCounts = { added: 0, removed: 0, changed: 0, unchanged: 0, thicknessChanged: 0 };
  const changes: ItemChange[] = [];
  for (const [a, b] of pairs) {
    const side = (b ?? a) as ListedItem;
    const base = {
      key: keyOf(side),
      kind: side.item.kind,
      tag: side.item.tag,
      itemId: side.item.itemId,
      totalThicknessM: { from: thickness(a), to: thickness(b), fromText: a ? thicknessText(a) : '—', toText: b ? thicknessText(b) : '—' },
      summary: summaryOf(side, du, names),
    };
    if (!a || !b) {
      const change = a ? 'removed' : 'added';
      counts[change]++;
      changes.push({ ...base, change, thicknessChanged: false, fields: [] });
      continue;
    }
    const fields: FieldChange[] = [];
    for (const f of FIELDS) {
      const fromText = f.text(a, du, names);
      const toText = f.text(b, du, names);
      const differs = f.by === 'value' ? canonicalJson(f.value(a) ?? null) !== canonicalJson(f.value(b) ?? null) : fromText !== toText;
      if (differs) fields.push({ field: f.field, label: f.label, from: f.value(a) ?? null, to: f.value(b) ?? null, fromText, toText, thickness: !!f.thickness });
    }
    if (fields.length === 0) {
      counts.unchanged++;
      continue;
    }
    const thicknessChanged = fields.some((f) => f.thickness);
    counts.changed++;
    if (thicknessChanged) counts.thicknessChanged++;
    changes.push({ ...base, key: `${keyOf(b)}`, change: 'changed', thicknessChanged, fields });
  }
  changes.sort((x, y) => (x.kind === y.kind ? collator.compare(x.tag, y.tag) : x.kind === 'line' ? -1 : 1));
  return { counts, changes };
}

export const COMPARISON_CSV_HEADER = ['Change', 'Kind', 'Tag', 'Field', 'From', 'To', 'Thickness changed'] as const;

/** One CSV row per field that changed; one row for each item added or removed. */
export function comparisonCsvRows(changes: readonly ItemChange[]): (string | boolean)[][] {
  const rows: (string | boolean)[][] = [];
  for (const c of changes) {
    if (c.change !== 'changed') {
      rows.push([c.change, c.kind, c.tag, '', c.change === 'removed' ? c.summary : '', c.change === 'added' ? c.summary : '', false]);
      continue;
    }
    for (const f of c.fields) rows.push([c.change, c.kind, c.tag, f.label, f.fromText, f.toText, f.thickness]);
  }
  return rows;
}
