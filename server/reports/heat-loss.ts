/**
 * The heat-loss summary: heat loss (or gain) per service and for the site, the energy, cost and CO₂ of a
 * year at the site's energy basis, and the saving against the same items bare.
 */
import { annualCo2, energyCost, fuelEnergyKWh } from '../../shared/calc/energy';
import type { DesignBases } from '../../shared/schemas/sites';
import type { CsvValue } from '../http/csv';
import type { LineList } from '../revisions/revisions.service';
import { basesBlock, documentFrame, draftNote, methodBlock } from './context';
import type { DisplayUnits } from './display';
import type { Block, ReportDocument, TableRow } from './pdf';

type Sums = { items: number; heatLossW: number; bareHeatLossW: number; annualKWh: number; bareAnnualKWh: number };

export type SummaryRow = Sums & {
  scope: 'service' | 'subtotal' | 'site';
  serviceKind: 'hot' | 'cold' | null;
  service: string;
  /** Purchased energy, cost and CO₂ per year, insulated and bare (null where the basis lacks what they need). */
  purchasedKWh: number | null;
  barePurchasedKWh: number | null;
  cost: number | null;
  bareCost: number | null;
  co2Tonnes: number | null;
  bareCo2Tonnes: number | null;
};

export type HeatLossSummary = {
  rows: SummaryRow[];
  currency: string | null;
  /** Items left out because they carry no result (draft only). */
  withoutResult: number;
  hoursSet: boolean;
  priceSet: boolean;
  co2Set: boolean;
};

const zero = (): Sums => ({ items: 0, heatLossW: 0, bareHeatLossW: 0, annualKWh: 0, bareAnnualKWh: 0 });
const add = (a: Sums, b: Sums) => {
  a.items += b.items;
  a.heatLossW += b.heatLossW;
  a.bareHeatLossW += b.bareHeatLossW;
  a.annualKWh += b.annualKWh;
  a.bareAnnualKWh += b.bareAnnualKWh;
};

const collator = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });

/** Totals per service (hot services first), subtotals for hot and cold service, and the site. */
export function heatLossSummary(list: LineList): HeatLossSummary {
  const energy = (list.snapshot.designBases as { energy?: DesignBases['energy'] }).energy;
  const groups = new Map<string, Sums & { serviceKind: 'hot' | 'cold'; service: string }>();
  let withoutResult = 0;
  for (const x of list.items) {
    const r = x.result;
    if (!r) {
      withoutResult++;
      continue;
    }
    const service = x.item.service || '(no service)';
    const key = `${r.service}\u0000${service}`;
    const g = groups.get(key) ?? { ...zero(), serviceKind: r.service, service };
    add(g, { items: 1, heatLossW: r.heatLossW ?? 0, bareHeatLossW: r.bareHeatLossW ?? 0, annualKWh: r.annualEnergyKWh ?? 0, bareAnnualKWh: r.bareAnnualEnergyKWh ?? 0 });
    groups.set(key, g);
  }
  const price = energy?.energyPricePerKWh;
  const eff = energy?.heatSourceEfficiency ?? 1;
  const hoursSet = energy?.operatingHoursPerYear !== undefined;
  const money = (kWh: number) => (price === undefined ? null : energyCost(fuelEnergyKWh(kWh, eff), { amount: String(price), per: 'kWh' }).amount.toNumber());
  const co2 = (kWh: number) =>
    energy?.co2KgPerKWh === undefined ? null : annualCo2(fuelEnergyKWh(kWh, eff), { kgCo2PerKWh: energy.co2KgPerKWh, basis: energy.co2Basis ?? '' }).tonnes;
  const row = (scope: SummaryRow['scope'], serviceKind: SummaryRow['serviceKind'], service: string, s: Sums): SummaryRow => ({
    scope,
    serviceKind,
    service,
    ...s,
    purchasedKWh: hoursSet ? fuelEnergyKWh(s.annualKWh, eff) : null,
    barePurchasedKWh: hoursSet ? fuelEnergyKWh(s.bareAnnualKWh, eff) : null,
    cost: hoursSet ? money(s.annualKWh) : null,
    bareCost: hoursSet ? money(s.bareAnnualKWh) : null,
    co2Tonnes: hoursSet ? co2(s.annualKWh) : null,
    bareCo2Tonnes: hoursSet ? co2(s.bareAnnualKWh) : null,
  });
  const rows: SummaryRow[] = [];
  const site = zero();
  for (const kind of ['hot', 'cold'] as const) {
    const mine = [...groups.values()].filter((g) => g.serviceKind === kind).sort((a, b) => collator.compare(a.service, b.service));
    if (mine.length === 0) continue;
    const sub = zero();
    for (const g of mine) {
      rows.push(row('service', kind, g.service, g));
      add(sub, g);
    }
    rows.push(row('subtotal', kind, kind === 'hot' ? 'Hot service' : 'Cold service', sub));
    add(site, sub);
  }
  rows.push(row('site', null, 'Site', site));
  return { rows, currency: energy?.currency ?? null, withoutResult, hoursSet, priceSet: price !== undefined, co2Set: energy?.co2KgPerKWh !== undefined };
}

const dash = '—';

export function heatLossSummaryDocument(list: LineList, du: DisplayUnits, now: Date): ReportDocument {
  const s = heatLossSummary(list);
  const cur = s.currency ?? '';
  const opt = (v: number | null, f: (x: number) => string) => (v === null ? dash : f(v));
  const money = (v: number | null) => opt(v, (x) => du.money(x, cur || 'EUR'));
  const saving = (a: number | null, b: number | null) => (a === null || b === null ? null : b - a);
  const tableRows: TableRow[] = s.rows.map((r) => ({
    cells: [
      r.scope === 'service' ? r.service : r.scope === 'subtotal' ? `${r.service}, total` : 'Site total',
      String(r.items),
      du.bigHeatFlow(r.heatLossW),
      du.bigHeatFlow(r.bareHeatLossW),
      s.hoursSet ? du.bigEnergy(r.annualKWh) : dash,
      opt(r.purchasedKWh, du.bigEnergy),
      money(r.cost),
      opt(r.co2Tonnes, du.co2),
      opt(saving(r.purchasedKWh, r.barePurchasedKWh), du.bigEnergy),
      money(saving(r.cost, r.bareCost)),
      opt(saving(r.co2Tonnes, r.bareCo2Tonnes), du.co2),
    ],
    weight: r.scope === 'service' ? undefined : 'bold',
    shade: r.scope !== 'service',
  }));
  const notes: string[] = [];
  if (!s.hoursSet) notes.push("The site's energy basis has no operating hours: annual figures are not worked out.");
  if (!s.priceSet) notes.push("The site's energy basis has no energy price: costs are not worked out.");
  if (!s.co2Set) notes.push("The site's energy basis has no CO₂ factor: emissions are not worked out.");
  if (s.withoutResult) notes.push(`${s.withoutResult} item${s.withoutResult === 1 ? '' : 's'} of the draft carry no sizing result and are left out.`);
  const blocks: Block[] = [
    ...draftNote(list),
    { kind: 'heading', text: 'Heat loss, energy, cost and CO₂ per year' },
    {
      kind: 'table',
      columns: [
        { header: 'Service', width: 16 },
        { header: 'Items', width: 5, align: 'right' },
        { header: 'Heat loss', width: 8, align: 'right' },
        { header: 'Bare', width: 8, align: 'right' },
        { header: 'Heat per year', width: 8, align: 'right' },
        { header: 'Bought per year', width: 8, align: 'right' },
        { header: `Cost per year${cur ? ` (${cur})` : ''}`, width: 9, align: 'right' },
        { header: 'CO₂ per year', width: 8, align: 'right' },
        { header: 'Saving vs bare: energy', width: 9, align: 'right' },
        { header: 'Saving vs bare: cost', width: 9, align: 'right' },
        { header: 'Saving vs bare: CO₂', width: 8, align: 'right' },
      ],
      rows: tableRows,
    },
    ...notes.map((text): Block => ({ kind: 'paragraph', text, tone: 'heat' })),
    { kind: 'heading', text: 'Bases of the totals' },
    {
      kind: 'definitions',
      rows: [
        ['Heat loss', 'Whole items at the energy basis, valves and flanges by equivalent length; cold service is a heat gain (counted by its magnitude).'],
        ['Heat per year', '|heat flow| × operating hours a year.'],
        ['Bought per year', 'Heat per year ÷ heat-source efficiency (the energy bought to supply or remove it).'],
        ['Cost and CO₂', 'Energy bought × the price and the CO₂ factor of the energy basis; money rounded to the cent.'],
        ['Saving vs bare', 'The same items with no insulation (oxidised carbon-steel surface, ε 0.8) minus the insulated figures.'],
      ],
    },
    ...basesBlock(list, du),
    ...methodBlock(),
  ];
  return { ...documentFrame(list, 'Heat-loss summary', du, now), blocks };
}

export function heatLossSummaryCsv(list: LineList, du: DisplayUnits): { header: string[]; rows: CsvValue[][] } {
  const s = heatLossSummary(list);
  const cur = s.currency ?? '';
  const header = [
    'Scope',
    'Service kind',
    'Service',
    'Items',
    `Heat loss [${du.bigHeatFlowUnit}]`,
    `Bare heat loss [${du.bigHeatFlowUnit}]`,
    `Heat per year [${du.bigEnergyUnit}]`,
    `Bare heat per year [${du.bigEnergyUnit}]`,
    `Energy bought per year [${du.bigEnergyUnit}]`,
    `Cost per year [${cur}]`,
    `CO₂ per year [${du.unit('co2Mass')}]`,
    `Saving vs bare: energy bought [${du.bigEnergyUnit}]`,
    `Saving vs bare: cost [${cur}]`,
    `Saving vs bare: CO₂ [${du.unit('co2Mass')}]`,
  ];
  const n = (v: number | null, f: (x: number) => number) => (v === null ? null : f(v));
  const diff = (a: number | null, b: number | null) => (a === null || b === null ? null : b - a);
  const rows = s.rows.map((r): CsvValue[] => [
    r.scope,
    r.serviceKind ?? '',
    r.service,
    r.items,
    du.bigHeatFlowNumber(r.heatLossW),
    du.bigHeatFlowNumber(r.bareHeatLossW),
    s.hoursSet ? du.bigEnergyNumber(r.annualKWh) : null,
    s.hoursSet ? du.bigEnergyNumber(r.bareAnnualKWh) : null,
    n(r.purchasedKWh, du.bigEnergyNumber),
    r.cost,
    n(r.co2Tonnes, du.co2Number),
    n(diff(r.purchasedKWh, r.barePurchasedKWh), du.bigEnergyNumber),
    diff(r.cost, r.bareCost) === null ? null : Math.round((diff(r.cost, r.bareCost) as number) * 100) / 100,
    n(diff(r.co2Tonnes, r.bareCo2Tonnes), du.co2Number),
  ]);
  return { header, rows };
}
