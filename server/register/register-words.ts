import { KELVIN_PER_FAHRENHEIT_DEGREE } from '../../shared/calc/units';
import type { UnitSystem } from '../../shared/schemas/common';

export { MATERIAL_WORDS, METHOD_WORDS, STATUS_WORDS, VERDICT_WORDS } from '../../shared/schemas/register';

/** A temperature in the reader's units, to the tenth (results) or whole degrees (lists). */
export function temperatureText(celsius: number | null | undefined, system: UnitSystem, decimals = 1): string {
  if (celsius === null || celsius === undefined || !Number.isFinite(celsius)) return '—';
  const value = system === 'US' ? celsius / KELVIN_PER_FAHRENHEIT_DEGREE + 32 : celsius;
  const text = value.toFixed(decimals).replace(/^-0(\.0+)?$/, '0$1').replace('-', '−');
  return `${text} ${system === 'US' ? '°F' : '°C'}`;
}

/** 2 Dec 2026 from YYYY-MM-DD or an ISO time. */
export function dateText(value: string | null | undefined): string {
  if (!value) return '—';
  const d = new Date(value.length === 10 ? `${value}T00:00:00Z` : value);
  if (Number.isNaN(d.getTime())) return '—';
  const months = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
  return `${d.getUTCDate()} ${months[d.getUTCMonth()]} ${d.getUTCFullYear()}`;
}

/** The UTC calendar day of a time [ms since epoch], YYYY-MM-DD. */
export const dayOf = (ms: number) => new Date(ms).toISOString().slice(0, 10);

/** YYYY-MM-DD plus n days. */
export function addDays(day: string, n: number): string {
  return new Date(Date.parse(`${day}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);
}
