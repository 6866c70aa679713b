import {
  BASIS_RANGES,
  BASIS_TITLES,
  designBasisWarnings,
  sitePatchSchema,
  type BasisKey,
  type BasisRange,
  type SitePatchInput,
} from '../../../shared/schemas/sites';
import type { DesignBases, SiteDetail } from '../../api/types';
import { temperaturesInText } from '../../calc/calc-messages';
import { fixed } from '../../calc/format';
import { formatInputNumber, formatInputValue, fromDisplay, parseNumber, toDisplay, unitOf, type Quantity, type UnitSystem } from '../../calc/units';
import { validateWithSchema } from '../forms/validate';

export type { BasisKey };

export interface BasisField {
  key: string;
  label: string;
  /** Numbers carry a quantity (shown in the user's units); fields without one are text. */
  quantity?: Quantity;
  required?: boolean;
}

export interface BasisSpec {
  key: BasisKey;
  title: string;
  /** What the basis is for, in one sentence. */
  purpose: string;
  fields: readonly BasisField[];
}

/** Every basis starts from the air temperature; it is what makes a basis present at all. */
const AIR_TEMPERATURE: BasisField = { key: 'airTemperatureC', label: 'Air temperature', quantity: 'temperature', required: true };
const WIND_SPEED: BasisField = { key: 'windSpeedMS', label: 'Wind speed', quantity: 'speed' };

/** The design bases of a site, in the order a practitioner reads them. */
export const BASES: readonly BasisSpec[] = [
  {
    key: 'touch',
    title: BASIS_TITLES.touch,
    purpose: 'Hottest credible air, still air and the worst emissivity: personnel protection is sized against these.',
    fields: [
      AIR_TEMPERATURE,
      { key: 'radiantTemperatureC', label: 'Radiant temperature', quantity: 'temperature' },
      WIND_SPEED,
      { key: 'surfaceEmissivity', label: 'Surface emissivity', quantity: 'ratio' },
      { key: 'contactSeconds', label: 'Contact time', quantity: 'seconds' },
      { key: 'maxSurfaceC', label: 'Touch limit (highest surface temperature)', quantity: 'temperature' },
    ],
  },
  {
    key: 'energy',
    title: BASIS_TITLES.energy,
    purpose:
      'Annual-average air and wind with the economics that heat conservation and the totals use. A heat loss is made up by the heat source; on cold service a heat gain is removed by a chiller, costed as its electricity.',
    fields: [
      AIR_TEMPERATURE,
      WIND_SPEED,
      { key: 'operatingHoursPerYear', label: 'Operating hours a year', quantity: 'hours' },
      { key: 'energyPricePerKWh', label: 'Energy price', quantity: 'pricePerEnergy' },
      { key: 'currency', label: 'Currency' },
      { key: 'heatSourceEfficiency', label: 'Heat-source efficiency', quantity: 'fraction' },
      { key: 'co2KgPerKWh', label: 'CO₂ factor', quantity: 'co2Factor' },
      { key: 'co2Basis', label: 'Basis of the CO₂ factor' },
      { key: 'coolingCop', label: 'Chiller COP (cold service)', quantity: 'ratio' },
      { key: 'electricityPricePerKWh', label: 'Electricity price (cold service)', quantity: 'pricePerEnergy' },
      { key: 'electricityCo2KgPerKWh', label: 'CO₂ factor of electricity', quantity: 'co2Factor' },
      { key: 'electricityCo2Basis', label: 'Basis of the electricity CO₂ factor' },
    ],
  },
  {
    key: 'condensation',
    title: BASIS_TITLES.condensation,
    purpose: 'Air and humidity around cold lines; their surfaces must stay above the dew point by the margin.',
    fields: [
      AIR_TEMPERATURE,
      { key: 'relativeHumidityPct', label: 'Relative humidity', quantity: 'percent', required: true },
      { key: 'marginK', label: 'Margin above dew point', quantity: 'temperatureDelta' },
    ],
  },
  {
    key: 'winter',
    title: BASIS_TITLES.winter,
    purpose: 'Coldest design conditions, used for frost protection and process temperature holding.',
    fields: [AIR_TEMPERATURE, WIND_SPEED],
  },
];

/** The credible and usual range of a basis value, when it is a number with one. */
export function rangeOf(basis: BasisKey, key: string): BasisRange | undefined {
  return (BASIS_RANGES[basis] as Record<string, BasisRange>)[key];
}

/** Flat form field names: Formik reads dots as nesting, so "touch_airTemperatureC". */
export const fieldName = (basis: BasisKey, key: string) => `${basis}_${key}`;

export type SiteFormValues = Record<string, string>;

/** Which parts of a site a role may change: everything, or the touch-safety basis alone. */
export type EditScope = 'all' | 'touch';

const basisValue = (bases: DesignBases, basis: BasisKey, key: string): unknown =>
  (bases[basis] as Record<string, unknown> | undefined)?.[key];

/**
 * A stored value as the user reads it: number in their units with the unit's suffix, or text. A
 * price carries its basis's currency ("0.045 EUR/kWh").
 */
export function displayValue(field: BasisField, raw: unknown, system: UnitSystem, currency?: unknown): string | null {
  if (raw === undefined || raw === null || raw === '') return null;
  if (!field.quantity || typeof raw !== 'number') return String(raw);
  const unit = unitOf(field.quantity, system);
  const number = unit.inputDecimals !== undefined ? formatInputValue(field.quantity, system, raw) : formatInputNumber(toDisplay(field.quantity, system, raw), 4);
  // A figure to read, not to edit: a true minus sign.
  const text = number.replace(/^-/, '−');
  const suffix = unitSuffix(field, system, currency);
  return suffix ? `${text} ${suffix}` : text;
}

/** The unit shown after a basis value: a price carries its currency ("EUR/kWh"). */
export function unitSuffix(field: BasisField, system: UnitSystem, currency?: unknown): string {
  if (!field.quantity) return '';
  const unit = unitOf(field.quantity, system);
  const code = typeof currency === 'string' && /^[A-Z]{3}$/.test(currency) ? currency : '';
  if (field.quantity === 'pricePerEnergy') return code ? `${code}${unit.suffix}` : `currency${unit.suffix}`;
  return unit.suffix;
}

export function siteToForm(site: Pick<SiteDetail, 'name' | 'description' | 'designBases'>, system: UnitSystem): SiteFormValues {
  const values: SiteFormValues = { name: site.name, description: site.description ?? '' };
  for (const b of BASES) {
    for (const f of b.fields) {
      const raw = basisValue(site.designBases ?? {}, b.key, f.key);
      values[fieldName(b.key, f.key)] =
        raw === undefined || raw === null ? '' : f.quantity && typeof raw === 'number' ? formatInputValue(f.quantity, system, raw) : String(raw);
    }
  }
  return values;
}

/** Server and schema paths (designBases.touch.airTemperatureC) → the form's field names. */
export function formFieldOf(path: string): string {
  const m = /^designBases\.(touch|energy|condensation|winter)\.(\w+)$/.exec(path);
  return m ? fieldName(m[1] as BasisKey, m[2]) : path;
}

// Conversions back from US units leave float noise; 12 significant figures keep every typed digit.
const clean = (x: number) => Number(x.toPrecision(12));

/** A bound in the units shown ("140 °F", "2 EUR/kWh", "50 %"). */
function boundText(f: BasisField, si: number, system: UnitSystem, currency?: unknown): string {
  const q = f.quantity!;
  const v = toDisplay(q, system, si);
  const number = Math.abs(v) >= 100 ? fixed(v, 0) : formatInputNumber(v, 3).replace('-', '−');
  const suffix = unitSuffix(f, system, currency);
  return suffix ? `${number} ${suffix}` : number;
}

/**
 * The refusal for a value outside its credible range, in the form's words and the user's units; null when it
 * is inside. The server applies the same ranges (shared/schemas/sites.ts).
 */
function outOfRange(basis: BasisKey, f: BasisField, si: number, system: UnitSystem, currency?: unknown): string | null {
  const r = rangeOf(basis, f.key);
  if (!r || !f.quantity) return null;
  const name = `${BASIS_TITLES[basis]}: ${f.label.toLowerCase()}`;
  if (r.minExclusive ? !(si > r.min) : si < r.min) {
    return `${name} must be ${r.minExclusive ? 'above' : 'at least'} ${boundText(f, r.min, system, currency)} (${r.why})`;
  }
  if (si > r.max) return `${name} must be at most ${boundText(f, r.max, system, currency)} (${r.why})`;
  return null;
}

/**
 * Warnings for values that are credible but unusual (accepted as they are), keyed by form field name and worded
 * in the user's units.
 */
export function basisWarnings(values: SiteFormValues, system: UnitSystem, scope: EditScope): Record<string, string> {
  const bases: Record<string, Record<string, number>> = {};
  for (const b of BASES) {
    if (scope === 'touch' && b.key !== 'touch') continue;
    for (const f of b.fields) {
      if (!f.quantity) continue;
      const n = parseNumber(values[fieldName(b.key, f.key)] ?? '');
      if (n === null) continue;
      (bases[b.key] ??= {})[f.key] = clean(fromDisplay(f.quantity, system, n));
    }
  }
  const out: Record<string, string> = {};
  for (const w of designBasisWarnings(bases as DesignBases)) out[fieldName(w.basis, w.key)] = temperaturesInText(w.message, system);
  return out;
}

/**
 * Turns the form into the PATCH body, in SI. A value the user left as it was keeps its stored SI
 * number exactly (a unit round trip would otherwise nudge it). Errors are keyed by form field name.
 */
export function formToPatch(
  values: SiteFormValues,
  initial: SiteFormValues,
  stored: DesignBases,
  system: UnitSystem,
  scope: EditScope,
): { patch: SitePatchInput | null; errors: Record<string, string> } {
  const errors: Record<string, string> = {};
  const designBases: Record<string, Record<string, unknown>> = {};
  for (const b of BASES) {
    if (scope === 'touch' && b.key !== 'touch') continue;
    const out: Record<string, unknown> = {};
    const touched = b.fields.some((f) => (values[fieldName(b.key, f.key)] ?? '').trim() !== '');
    if (!touched && basisValue(stored, b.key, 'airTemperatureC') === undefined) continue;
    for (const f of b.fields) {
      const name = fieldName(b.key, f.key);
      const text = (values[name] ?? '').trim();
      if (text === '') {
        if (f.required) errors[name] = `${b.title}: ${f.label.toLowerCase()} is required`;
        continue;
      }
      const storedValue = basisValue(stored, b.key, f.key);
      if (text === (initial[name] ?? '').trim() && storedValue !== undefined) {
        out[f.key] = storedValue;
        continue;
      }
      if (!f.quantity) {
        out[f.key] = text;
        continue;
      }
      const n = parseNumber(text);
      if (n === null) {
        errors[name] = `${b.title}: ${f.label.toLowerCase()} must be a number`;
        continue;
      }
      const si = clean(fromDisplay(f.quantity, system, n));
      const outside = outOfRange(b.key, f, si, system, values[fieldName(b.key, 'currency')] ?? stored.energy?.currency);
      if (outside) errors[name] = outside;
      else out[f.key] = si;
    }
    designBases[b.key] = out;
  }
  const patch: Record<string, unknown> = { designBases };
  if (scope === 'all') {
    patch.name = values.name.trim();
    patch.description = values.description.trim();
  }
  for (const [path, message] of Object.entries(validateWithSchema(sitePatchSchema, patch))) {
    const name = formFieldOf(path);
    if (message !== undefined && !(name in errors)) errors[name] = message;
  }
  return Object.keys(errors).length > 0 ? { patch: null, errors } : { patch: patch as SitePatchInput, errors };
}
