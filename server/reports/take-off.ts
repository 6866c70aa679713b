/**
 * The take-off a contractor quotes from: insulation volume by material and layer thickness, jacketing (or
 * coating) area by finish with an overlap allowance, and counts of valves, flanges and fittings by size.
 *
 * Volumes, layer by layer, inside out, on nominal thicknesses:
 * - pipe: V = π/4 · (D₂² − D₁²) · L, D₁ the layer's inner and D₂ its outer diameter (D₁ of the first layer is
 *   the pipe's outside diameter);
 * - vessel: the shell as a pipe of its length, and each head as the integral of the head's area over the
 *   layer's thickness (Simpson's rule on the head area of shared/calc/vessel-heads, exact for hemispheres and
 *   flat heads).
 * Jacketing: the outer surface (π·D·L of lines and shells, head areas at the outer face) plus the allowance.
 */
import { headArea } from '../../shared/calc/vessel-heads';
import type { CsvValue } from '../http/csv';
import type { LineList } from '../revisions/revisions.service';
import { documentFrame, draftNote, methodBlock } from './context';
import { libraryNames, sizeLabel } from './describe';
import type { DisplayUnits } from './display';
import type { Block, ReportDocument } from './pdf';

/** Jacketing allowance for laps and waste when the query gives none [%] (common practice). */
export const DEFAULT_JACKET_OVERLAP_PCT = 10;
export const MAX_JACKET_OVERLAP_PCT = 100;

/** Layer thicknesses are grouped to the tenth of a millimetre (sizing works in series values). */
const thicknessKey = (m: number) => Math.round(m * 1e4) / 1e4;

export type VolumeRow = { materialId: string; thicknessM: number; lines: number; lineLengthM: number; vessels: number; volumeM3: number };
export type JacketRow = { finishId: string; items: number; surfaceM2: number; orderM2: number };
export type CountRow = { size: string; outerDiameterM: number; lines: number; valves: number; flanges: number; elbows: number; tees: number };

export type TakeOff = {
  volumes: VolumeRow[];
  jacketing: JacketRow[];
  counts: CountRow[];
  overlapPct: number;
  /** Items left out of volumes and areas: bare, or (draft) without a result. */
  bare: number;
  withoutResult: number;
};

/** Insulation volume of one pipe layer [m³]: π/4 · (D₂² − D₁²) · L. */
export function pipeLayerVolumeM3(innerDiameterM: number, thicknessM: number, lengthM: number): number {
  const d2 = innerDiameterM + 2 * thicknessM;
  return (Math.PI / 4) * (d2 * d2 - innerDiameterM * innerDiameterM) * lengthM;
}

/** Insulation volume of one layer over one vessel head [m³]: ∫ A(o) do from the layer's inner to its outer offset (Simpson). */
export function headLayerVolumeM3(type: 'flat' | 'ellipsoidal2to1' | 'hemispherical', diameterM: number, innerOffsetM: number, thicknessM: number): number {
  const a = headArea(type, diameterM, innerOffsetM);
  const m = headArea(type, diameterM, innerOffsetM + thicknessM / 2);
  const b = headArea(type, diameterM, innerOffsetM + thicknessM);
  return (thicknessM / 6) * (a + 4 * m + b);
}

const collator = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });

export function takeOff(list: LineList, du: DisplayUnits, overlapPct = DEFAULT_JACKET_OVERLAP_PCT): TakeOff {
  const volumes = new Map<string, VolumeRow>();
  const jackets = new Map<string, JacketRow>();
  const counts = new Map<string, CountRow>();
  let bare = 0;
  let withoutResult = 0;
  for (const x of list.items) {
    const it = x.item;
    if (it.kind === 'line') {
      const size = sizeLabel(it, du);
      const c = counts.get(size) ?? { size, outerDiameterM: it.outerDiameterM, lines: 0, valves: 0, flanges: 0, elbows: 0, tees: 0 };
      c.lines++;
      c.valves += it.fittings.valves;
      c.flanges += it.fittings.flanges;
      c.elbows += it.fittings.elbows;
      c.tees += it.fittings.tees;
      counts.set(size, c);
    }
    const r = x.result;
    if (!r) {
      withoutResult++;
      continue;
    }
    if (r.layers.length === 0) {
      bare++;
      continue;
    }
    const seen = new Set<string>();
    let offset = 0;
    for (const l of r.layers) {
      const key = `${l.materialId}\u0000${thicknessKey(l.thicknessM)}`;
      const v = volumes.get(key) ?? { materialId: l.materialId, thicknessM: thicknessKey(l.thicknessM), lines: 0, lineLengthM: 0, vessels: 0, volumeM3: 0 };
      const inner = it.outerDiameterM + 2 * offset;
      v.volumeM3 += pipeLayerVolumeM3(inner, l.thicknessM, it.lengthM);
      if (it.kind === 'vessel') v.volumeM3 += 2 * headLayerVolumeM3(it.headType ?? 'ellipsoidal2to1', it.outerDiameterM, offset, l.thicknessM);
      if (!seen.has(key)) {
        // An item with two layers of one material and thickness counts once, its length once.
        seen.add(key);
        if (it.kind === 'line') {
          v.lines++;
          v.lineLengthM += it.lengthM;
        } else v.vessels++;
      }
      volumes.set(key, v);
      offset += l.thicknessM;
    }
    const outer = it.outerDiameterM + 2 * offset;
    let surface = Math.PI * outer * it.lengthM;
    if (it.kind === 'vessel') surface += 2 * headArea(it.headType ?? 'ellipsoidal2to1', it.outerDiameterM, offset);
    const j = jackets.get(r.finishId) ?? { finishId: r.finishId, items: 0, surfaceM2: 0, orderM2: 0 };
    j.items++;
    j.surfaceM2 += surface;
    j.orderM2 = j.surfaceM2 * (1 + overlapPct / 100);
    jackets.set(r.finishId, j);
  }
  return {
    volumes: [...volumes.values()].sort((a, b) => collator.compare(a.materialId, b.materialId) || a.thicknessM - b.thicknessM),
    jacketing: [...jackets.values()].sort((a, b) => collator.compare(a.finishId, b.finishId)),
    counts: [...counts.values()].sort((a, b) => a.outerDiameterM - b.outerDiameterM || collator.compare(a.size, b.size)),
    overlapPct,
    bare,
    withoutResult,
  };
}

function notes(t: TakeOff): string[] {
  const out = [
    'Thicknesses are nominal. Pipe insulation is made to ASTM C585, whose nesting sizes give actual inner diameters and thicknesses that differ from the nominal ones; Lagline does not tabulate them, so volumes are worked out on the pipe’s outside diameter with nominal thicknesses. Check sections against the supplier’s C585 sizes before ordering.',
    `Volumes layer by layer: pipes π/4·(D₂² − D₁²)·L over the line length; vessels the shell over its length plus both heads (head area integrated over the layer thickness). Jacketing area: the outer surface plus an overlap allowance of ${t.overlapPct} % for laps and waste (default ${DEFAULT_JACKET_OVERLAP_PCT} %, common practice; set another with ?overlapPct=).`,
    'Valve, flange and fitting covers are not in the volumes or areas; they are counted by line size (line lengths run through them).',
  ];
  if (t.bare) out.push(`${t.bare} bare item${t.bare === 1 ? '' : 's'} (no insulation layers) are counted in the fittings only.`);
  if (t.withoutResult) out.push(`${t.withoutResult} item${t.withoutResult === 1 ? '' : 's'} of the draft carry no sizing result and are left out of volumes and areas.`);
  return out;
}

export function takeOffDocument(list: LineList, du: DisplayUnits, now: Date, overlapPct = DEFAULT_JACKET_OVERLAP_PCT): ReportDocument {
  const t = takeOff(list, du, overlapPct);
  const names = libraryNames(list.snapshot.library);
  const totalVolume = t.volumes.reduce((s, v) => s + v.volumeM3, 0);
  const totalOrder = t.jacketing.reduce((s, j) => s + j.orderM2, 0);
  const sum = (k: 'valves' | 'flanges' | 'elbows' | 'tees' | 'lines') => t.counts.reduce((s, c) => s + c[k], 0);
  const blocks: Block[] = [
    ...draftNote(list),
    { kind: 'heading', text: 'Insulation volume by material and thickness' },
    {
      kind: 'table',
      columns: [
        { header: 'Material', width: 34 },
        { header: 'Layer thickness', width: 9, align: 'right' },
        { header: 'Lines', width: 6, align: 'right' },
        { header: 'Line length', width: 10, align: 'right' },
        { header: 'Vessels', width: 6, align: 'right' },
        { header: 'Volume', width: 10, align: 'right' },
      ],
      rows: [
        ...t.volumes.map((v) => ({
          cells: [names.material(v.materialId), du.thickness(v.thicknessM), String(v.lines), du.length(v.lineLengthM), String(v.vessels), du.volume(v.volumeM3)],
        })),
        { cells: ['Total insulation', '', '', '', '', du.volume(totalVolume)], weight: 'bold' as const, shade: true },
      ],
    },
    { kind: 'heading', text: 'Jacketing and coating area by finish' },
    {
      kind: 'table',
      columns: [
        { header: 'Finish', width: 34 },
        { header: 'Items', width: 6, align: 'right' },
        { header: 'Outer surface', width: 11, align: 'right' },
        { header: 'Overlap allowance', width: 9, align: 'right' },
        { header: 'Area to order', width: 11, align: 'right' },
      ],
      rows: [
        ...t.jacketing.map((j) => ({ cells: [names.finish(j.finishId), String(j.items), du.area(j.surfaceM2), `${t.overlapPct} %`, du.area(j.orderM2)] })),
        { cells: ['Total', '', '', '', du.area(totalOrder)], weight: 'bold' as const, shade: true },
      ],
    },
    { kind: 'heading', text: 'Valves, flanges and fittings by line size' },
    {
      kind: 'table',
      columns: [
        { header: 'Size', width: 16 },
        { header: 'Lines', width: 8, align: 'right' },
        { header: 'Valves', width: 8, align: 'right' },
        { header: 'Flanged joints', width: 8, align: 'right' },
        { header: 'Elbows', width: 8, align: 'right' },
        { header: 'Tees', width: 8, align: 'right' },
      ],
      rows: [
        ...t.counts.map((c) => ({ cells: [c.size, String(c.lines), String(c.valves), String(c.flanges), String(c.elbows), String(c.tees)] })),
        { cells: ['Total', String(sum('lines')), String(sum('valves')), String(sum('flanges')), String(sum('elbows')), String(sum('tees'))], weight: 'bold' as const, shade: true },
      ],
    },
    { kind: 'heading', text: 'How the quantities are worked out' },
    ...notes(t).map((text): Block => ({ kind: 'paragraph', text })),
    ...methodBlock(),
  ];
  return { ...documentFrame(list, 'Take-off', du, now), blocks };
}

export function takeOffCsv(list: LineList, du: DisplayUnits, overlapPct = DEFAULT_JACKET_OVERLAP_PCT): { header: string[]; rows: CsvValue[][] } {
  const t = takeOff(list, du, overlapPct);
  const names = libraryNames(list.snapshot.library);
  const th = du.system === 'SI' ? 'mm' : 'in';
  const header = ['Section', 'Material, finish or size', `Layer thickness [${th}]`, 'Count', 'Quantity', 'Unit', 'Note'];
  const rows: CsvValue[][] = [];
  for (const v of t.volumes) {
    rows.push(['insulation volume', names.material(v.materialId), du.thicknessNumber(v.thicknessM), v.lines + v.vessels, du.volumeNumber(v.volumeM3), du.volumeUnit, `${v.lines} lines (${du.length(v.lineLengthM)}), ${v.vessels} vessels`]);
  }
  for (const j of t.jacketing) {
    rows.push(['jacketing area', names.finish(j.finishId), null, j.items, du.areaNumber(j.orderM2), du.areaUnit, `outer surface ${du.area(j.surfaceM2)} plus ${t.overlapPct} % overlap allowance`]);
  }
  for (const c of t.counts) {
    for (const k of ['valves', 'flanges', 'elbows', 'tees'] as const) {
      if (c[k] > 0) rows.push([k === 'flanges' ? 'flanged joints' : k, c.size, null, c.lines, c[k], 'each', '']);
    }
  }
  return { header, rows };
}
