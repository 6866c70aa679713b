/**
 * The insulation schedule: per item its tag, service, size, temperature, purposes and the governing one, the
 * layers (material and thickness), finish, surface temperature and heat loss. What a contractor builds from.
 */
import type { CsvValue } from '../http/csv';
import type { LineList } from '../revisions/revisions.service';
import type { ListedItem } from '../revisions/snapshot';
import { basesBlock, documentFrame, draftNote, methodBlock } from './context';
import { layersText, libraryNames, purposesLong, purposesShort, sizeLabel } from './describe';
import { PURPOSE_NAMES, PURPOSE_SHORT, type DisplayUnits } from './display';
import type { Block, ReportDocument, TableRow } from './pdf';

const collator = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });

/** Lines first, then vessels, each by tag as people sort them (HS-2 before HS-10). */
export function scheduleOrder(items: readonly ListedItem[]): ListedItem[] {
  return [...items].sort((a, b) => (a.item.kind === b.item.kind ? collator.compare(a.item.tag, b.item.tag) : a.item.kind === 'line' ? -1 : 1));
}

const STATUS_WORD = { current: '', stale: 'stale', unsized: 'not sized', error: 'could not be sized' } as const;

/** Short codes of the materials and finishes a list's results use (M1, M2 … and F1, F2 …) for narrow columns. */
export function legendCodes(items: readonly ListedItem[]) {
  const materials: string[] = [];
  const finishes: string[] = [];
  for (const x of items) {
    for (const l of x.result?.layers ?? []) if (!materials.includes(l.materialId)) materials.push(l.materialId);
    if (x.result && !finishes.includes(x.result.finishId)) finishes.push(x.result.finishId);
  }
  return {
    materials,
    finishes,
    material: (id: string) => `M${materials.indexOf(id) + 1}`,
    finish: (id: string) => `F${finishes.indexOf(id) + 1}`,
  };
}

/** Remarks of an item: what does not hold, and where a draft's result is missing or old. */
function remarks(x: ListedItem): string {
  const out: string[] = [];
  if (x.status !== 'current') out.push(STATUS_WORD[x.status]);
  if (x.result?.failing.length) out.push(`fails ${purposesShort(x.result.failing)}`);
  if (x.result?.burnVerdict === 'fail') out.push('burn risk');
  return out.join('; ');
}

export function insulationScheduleDocument(list: LineList, du: DisplayUnits, now: Date): ReportDocument {
  const items = scheduleOrder(list.items);
  const names = libraryNames(list.snapshot.library);
  const codes = legendCodes(items);
  const blocks: Block[] = [...draftNote(list)];
  const legend: [string, string][] = [
    ...codes.materials.map((id): [string, string] => [codes.material(id), names.material(id)]),
    ...codes.finishes.map((id): [string, string] => [codes.finish(id), names.finish(id)]),
  ];
  if (legend.length) blocks.push({ kind: 'heading', text: 'Materials and finishes' }, { kind: 'definitions', rows: legend });

  for (const kind of ['line', 'vessel'] as const) {
    const rows = items.filter((x) => x.item.kind === kind);
    if (rows.length === 0) continue;
    const total = rows.reduce((s, x) => s + (x.result?.heatLossW ?? 0), 0);
    const tableRows: TableRow[] = rows.map((x) => {
      const r = x.result;
      return {
        cells: [
          x.item.tag,
          x.item.service,
          sizeLabel(x.item, du),
          du.temperatureList(x.item.operatingTemperatureC),
          purposesShort(x.item.purposes),
          r?.governingPurpose ? PURPOSE_SHORT[r.governingPurpose] : '',
          layersText(r, du, codes.material),
          r ? codes.finish(r.finishId) : '',
          r?.surfaceTemperatureC != null ? du.temperature(r.surfaceTemperatureC) : '',
          ...(kind === 'line' ? [r?.heatLossWPerM != null ? du.heatLossPerLength(r.heatLossWPerM) : ''] : []),
          r?.heatLossW != null ? du.heatFlow(r.heatLossW) : '',
          remarks(x),
        ],
        tone: x.status !== 'current' || r?.failing.length ? 'heat' : undefined,
      };
    });
    tableRows.push({
      cells: [`Total: ${rows.length} ${kind}${rows.length === 1 ? '' : 's'}`, '', '', '', '', '', '', '', '', ...(kind === 'line' ? [''] : []), du.bigHeatFlow(total), ''],
      weight: 'bold',
      shade: true,
    });
    blocks.push({ kind: 'heading', text: kind === 'line' ? 'Lines' : 'Vessels' });
    blocks.push({
      kind: 'table',
      columns: [
        { header: 'Tag', width: 11 },
        { header: 'Service', width: 13 },
        { header: 'Size', width: kind === 'line' ? 7 : 12 },
        { header: 'Temp.', width: 5, align: 'right' },
        { header: 'Purposes', width: 7 },
        { header: 'Gov.', width: 4 },
        { header: 'Layers', width: 11 },
        { header: 'Finish', width: 4 },
        { header: 'Surface', width: 6, align: 'right' },
        ...(kind === 'line' ? [{ header: 'Heat loss per length', width: 8, align: 'right' as const }] : []),
        { header: 'Heat loss', width: 7, align: 'right' },
        { header: 'Remarks', width: 10 },
      ],
      rows: tableRows,
    });
  }
  const all = items.reduce((s, x) => s + (x.result?.heatLossW ?? 0), 0);
  blocks.push({ kind: 'paragraph', text: `Site total: ${items.length} items, heat loss ${du.bigHeatFlow(all)} at the energy basis.` });
  blocks.push(...basesBlock(list, du));
  blocks.push(
    ...methodBlock([
      'Temp.: operating temperature. Gov.: the governing purpose. Layers inside out, thicknesses nominal. Surface: surface temperature at the touch-safety basis (hot service) or the condensation basis (cold). Heat loss: per length of line, and of the whole item with valves and flanges, at the energy basis (negative: a heat gain).',
    ]),
  );
  return { ...documentFrame(list, 'Insulation schedule', du, now), blocks };
}

export function insulationScheduleCsv(list: LineList, du: DisplayUnits): { header: string[]; rows: CsvValue[][] } {
  const names = libraryNames(list.snapshot.library);
  const t = du.system === 'SI' ? 'mm' : 'in';
  const header = [
    'Kind',
    'Tag',
    'Service',
    'Size',
    `Outer diameter [${du.system === 'SI' ? 'mm' : 'in'}]`,
    `Length [${du.unit('length')}]`,
    `Operating temperature [${du.unit('temperature')}]`,
    'Location',
    'Purposes',
    'Governing purpose',
    'Layers inside out (material, thickness)',
    `Total thickness [${t}]`,
    'Finish',
    `Surface temperature [${du.unit('temperature')}]`,
    `Heat loss per length [${du.unit('heatLossPerLength')}]`,
    `Heat loss [${du.unit('heatFlow')}]`,
    `Annual energy [${du.bigEnergyUnit}]`,
    'Burn check',
    'Purposes not met',
    'Sizing status',
  ];
  const rows = scheduleOrder(list.items).map((x): CsvValue[] => {
    const r = x.result;
    return [
      x.item.kind,
      x.item.tag,
      x.item.service,
      sizeLabel(x.item, du),
      du.diameterNumber(x.item.outerDiameterM),
      du.lengthNumber(x.item.lengthM),
      du.temperatureListNumber(x.item.operatingTemperatureC),
      x.item.location,
      purposesLong(x.item.purposes),
      r?.governingPurpose ? PURPOSE_NAMES[r.governingPurpose] : '',
      layersText(r, du, names.material),
      r ? du.thicknessNumber(r.totalThicknessM) : null,
      r ? names.finish(r.finishId) : '',
      r?.surfaceTemperatureC != null ? du.temperatureNumber(r.surfaceTemperatureC) : null,
      r?.heatLossWPerM != null ? du.heatLossPerLengthNumber(r.heatLossWPerM) : null,
      r?.heatLossW != null ? du.heatFlowNumber(r.heatLossW) : null,
      r?.annualEnergyKWh != null ? du.bigEnergyNumber(r.annualEnergyKWh) : null,
      r?.burnVerdict ?? '',
      r ? purposesLong(r.failing) : '',
      x.status === 'current' ? 'sized' : STATUS_WORD[x.status],
    ];
  });
  return { header, rows };
}
