/**
 * Addresses of the reports the server renders (PDF and CSV), for download links. The browser fetches them
 * itself with the session cookie; nothing here needs the JSON client.
 */
import type { UnitSystem } from './types';

export const REPORTS = [
  { key: 'insulation-schedule', label: 'Insulation schedule', description: 'Per item: size, purposes, layers, finish, surface temperature, heat loss.' },
  { key: 'heat-loss-summary', label: 'Heat-loss summary', description: 'Totals per service and site: energy, cost and CO₂ a year, saving against bare.' },
  { key: 'take-off', label: 'Take-off', description: 'Insulation volume by material and thickness, jacketing area, fittings by size.' },
] as const;

export type ReportKey = (typeof REPORTS)[number]['key'];
export type ReportFormat = 'pdf' | 'csv';

const API_BASE = '/api/v1';

/**
 * The address of a report of a site's draft (`revision` null) or of one of its revisions.
 *
 * @example reportUrl(3, 'take-off', 'csv', { revision: 7, units: 'US' }) // '/api/v1/sites/3/reports/take-off.csv?revision=7&units=US'
 */
export function reportUrl(siteId: number | string, report: ReportKey, format: ReportFormat, opts: { revision?: number | null; units?: UnitSystem } = {}): string {
  const q = new URLSearchParams();
  if (opts.revision) q.set('revision', String(opts.revision));
  if (opts.units) q.set('units', opts.units);
  const query = q.toString();
  return `${API_BASE}/sites/${encodeURIComponent(String(siteId))}/reports/${report}.${format}${query ? `?${query}` : ''}`;
}

/** The comparison of two line lists as CSV (query as in src/api/revisions `comparisonQuery`). */
export function comparisonCsvUrl(siteId: number | string, query: string): string {
  return `${API_BASE}/sites/${encodeURIComponent(String(siteId))}/revisions/compare.csv?${query}`;
}
