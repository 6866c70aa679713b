import type { Caller } from '../auth/auth.service';
import type { Db } from '../db/db';
import { errors } from '../errors';
import { toCsv } from '../http/csv';
import { loadLineList, parseWhich, refuseUnknownQuery, unitsFor, type LineList } from '../revisions/revisions.service';
import { displayUnits, type DisplayUnits } from './display';
import { heatLossSummaryCsv, heatLossSummaryDocument } from './heat-loss';
import { renderPdf, type ReportDocument } from './pdf';
import { insulationScheduleCsv, insulationScheduleDocument } from './schedule';
import { DEFAULT_JACKET_OVERLAP_PCT, MAX_JACKET_OVERLAP_PCT, takeOffCsv, takeOffDocument } from './take-off';

export const REPORTS = ['insulation-schedule', 'heat-loss-summary', 'take-off'] as const;
export type ReportName = (typeof REPORTS)[number];
export type ReportFormat = 'pdf' | 'csv';

type Options = { overlapPct: number };

const BUILDERS: Record<
  ReportName,
  {
    document: (list: LineList, du: DisplayUnits, now: Date, o: Options) => ReportDocument;
    csv: (list: LineList, du: DisplayUnits, o: Options) => { header: string[]; rows: Parameters<typeof toCsv>[1] };
  }
> = {
  'insulation-schedule': { document: (l, du, now) => insulationScheduleDocument(l, du, now), csv: (l, du) => insulationScheduleCsv(l, du) },
  'heat-loss-summary': { document: (l, du, now) => heatLossSummaryDocument(l, du, now), csv: (l, du) => heatLossSummaryCsv(l, du) },
  'take-off': { document: (l, du, now, o) => takeOffDocument(l, du, now, o.overlapPct), csv: (l, du, o) => takeOffCsv(l, du, o.overlapPct) },
};

function overlapOf(report: ReportName, query: Record<string, unknown>): number {
  const v = query.overlapPct;
  if (v === undefined) return DEFAULT_JACKET_OVERLAP_PCT;
  if (report !== 'take-off') throw errors.badRequest('VALIDATION_FAILED', 'overlapPct applies to the take-off only.', 'overlapPct');
  if (typeof v !== 'string' || !/^\d{1,3}(\.\d{1,2})?$/.test(v) || Number(v) > MAX_JACKET_OVERLAP_PCT) {
    throw errors.badRequest('VALIDATION_FAILED', `overlapPct must be a number from 0 to ${MAX_JACKET_OVERLAP_PCT}.`, 'overlapPct');
  }
  return Number(v);
}

/** A file name that says what the file is: site, revision (or draft) and report. */
function fileName(list: LineList, report: ReportName, units: string, format: ReportFormat): string {
  const rev = list.revision ? `rev-${list.revision.number}` : 'draft';
  return `${list.snapshot.site.name}_${rev}_${report}_${units}.${format}`;
}

/**
 * A report of the draft or a revision of a site, in SI or US units: PDF bytes or CSV text.
 * Query: `revision` (an id, or `draft`, the default), `units` (`SI` | `US`, default the caller's setting),
 * `overlapPct` (take-off only).
 */
export async function buildReport(deps: { db: Db }, caller: Caller, siteId: number, report: ReportName, format: ReportFormat, query: Record<string, unknown>, now = new Date()) {
  refuseUnknownQuery(query, report === 'take-off' ? ['revision', 'units', 'overlapPct'] : ['revision', 'units']);
  const overlapPct = overlapOf(report, query);
  const which = parseWhich(query.revision, 'revision', 'draft');
  const units = await unitsFor(deps.db, caller, query.units as string | undefined);
  const list = await loadLineList(deps.db, caller, siteId, which);
  const du = displayUnits(units);
  const name = fileName(list, report, units, format);
  if (format === 'csv') {
    const { header, rows } = BUILDERS[report].csv(list, du, { overlapPct });
    return { fileName: name, csv: toCsv(header, rows) };
  }
  return { fileName: name, pdf: await renderPdf(BUILDERS[report].document(list, du, now, { overlapPct })) };
}
