/**
 * A site's sizing settings as their form holds them: the thickness series typed in millimetres or inches,
 * the limits in the user's thickness unit, the heat-conservation rule and the default build-ups.
 */
import { METRIC_THICKNESSES_MM, US_THICKNESSES_IN } from '../../../shared/calc/library/series';
import { sizingSettingsSchema } from '../../../shared/schemas/lines';
import type { SizingSettingsPayload } from '../../api/types';
import { formatInputNumber, fromDisplay, parseNumber, toDisplay, type UnitSystem } from '../../calc/units';
import { validateWithSchema } from '../forms/validate';

import { buildUpToDraft, draftToBuildUp, type BuildUpDraft } from './build-up';

export const MM_PER_INCH = 25.4;

export type SeriesUnit = 'mm' | 'in';

export interface SettingsFormValues {
  seriesUnit: SeriesUnit;
  series: string;
  maxSingleLayer: string;
  maxThickness: string;
  heatRule: string;
  hot: BuildUpDraft;
  cold: BuildUpDraft;
}

/** The common series, as a person types them. */
export const SERIES_PRESETS: Record<SeriesUnit, string> = {
  mm: METRIC_THICKNESSES_MM.join(', '),
  in: US_THICKNESSES_IN.join(', '),
};

const round = (x: number) => Number(x.toFixed(6));

/** A series in inches when every step is a whole eighth of an inch and not a whole 5 mm (½-inch product). */
export function seriesUnitOf(seriesMm: readonly number[]): SeriesUnit {
  const eighths = seriesMm.every((mm) => Math.abs((mm / MM_PER_INCH) * 8 - Math.round((mm / MM_PER_INCH) * 8)) < 1e-6);
  const fives = seriesMm.every((mm) => Math.abs(mm / 5 - Math.round(mm / 5)) < 1e-6);
  return eighths && !fives ? 'in' : 'mm';
}

export function seriesText(seriesMm: readonly number[], unit: SeriesUnit): string {
  return seriesMm.map((mm) => formatInputNumber(unit === 'mm' ? mm : round(mm / MM_PER_INCH))).join(', ');
}

const showMm = (mm: number, system: UnitSystem) => formatInputNumber(toDisplay('thickness', system, mm / 1000));

export function settingsToForm(s: SizingSettingsPayload, system: UnitSystem): SettingsFormValues {
  const unit = seriesUnitOf(s.seriesMm);
  return {
    seriesUnit: unit,
    series: seriesText(s.seriesMm, unit),
    maxSingleLayer: showMm(s.maxSingleLayerMm, system),
    maxThickness: showMm(s.maxThicknessMm, system),
    heatRule: formatInputNumber(s.heatConservationMaxPercentOfBare),
    hot: { ...buildUpToDraft(s.defaultBuildUps.hot, system), mode: 'own' },
    cold: { ...buildUpToDraft(s.defaultBuildUps.cold, system), mode: 'own' },
  };
}

export type SettingsErrors = Record<string, string>;

/** Where a schema or server path lands: build-up paths keep their `buildUp.` form under `hot:`/`cold:`. */
export function settingsFieldOf(path: string): string {
  if (/^seriesMm(\[\d+\])?$/.test(path)) return 'series';
  if (path === 'maxSingleLayerMm') return 'maxSingleLayer';
  if (path === 'maxThicknessMm') return 'maxThickness';
  if (path === 'heatConservationMaxPercentOfBare') return 'heatRule';
  const m = /^defaultBuildUps\.(hot|cold)\.(.*)$/.exec(path);
  if (m) return `${m[1]}:buildUp.${m[2]}`;
  return path;
}

/** The form → the PATCH body (stored units: millimetres, percent) and the errors at their fields. */
export function settingsFormToInput(v: SettingsFormValues, system: UnitSystem, start: SizingSettingsPayload): { input: Record<string, unknown> | null; errors: SettingsErrors } {
  const errors: SettingsErrors = {};
  const initial = settingsToForm(start, system);
  const parts = v.series.split(/[;,\s]+/).map((x) => x.trim()).filter(Boolean);
  const seriesMm: number[] = [];
  for (const p of parts) {
    const n = parseNumber(p);
    if (n === null) {
      errors.series = `“${p}” is not a number; separate thicknesses with commas`;
      break;
    }
    seriesMm.push(v.seriesUnit === 'mm' ? n : round(n * MM_PER_INCH));
  }
  if (!errors.series && parts.length === 0) errors.series = 'Give at least one thickness';
  const mm = (field: 'maxSingleLayer' | 'maxThickness', label: string, stored: number): number | undefined => {
    const text = v[field].trim();
    if (text === '') {
      errors[field] = `${label} is required`;
      return undefined;
    }
    if (text === initial[field]) return stored;
    const n = parseNumber(text);
    if (n === null) {
      errors[field] = `${label} must be a number`;
      return undefined;
    }
    return round(fromDisplay('thickness', system, n) * 1000);
  };
  const body: Record<string, unknown> = {};
  if (!errors.series) body.seriesMm = v.series === initial.series && v.seriesUnit === initial.seriesUnit ? start.seriesMm : [...new Set(seriesMm)].sort((a, b) => a - b);
  const single = mm('maxSingleLayer', 'Largest single layer', start.maxSingleLayerMm);
  const largest = mm('maxThickness', 'Largest thickness', start.maxThicknessMm);
  if (single !== undefined) body.maxSingleLayerMm = single;
  if (largest !== undefined) body.maxThicknessMm = largest;
  const rule = parseNumber(v.heatRule);
  if (v.heatRule.trim() === '') errors.heatRule = 'The share of the bare heat loss is required';
  else if (rule === null) errors.heatRule = 'The share of the bare heat loss must be a number';
  else body.heatConservationMaxPercentOfBare = rule;
  const defaults: Record<string, unknown> = {};
  for (const kind of ['hot', 'cold'] as const) {
    const b = draftToBuildUp({ ...v[kind], mode: 'own' }, system, start.defaultBuildUps[kind]);
    for (const [k, m] of Object.entries(b.errors)) errors[`${kind}:${k}`] = m;
    if (b.buildUp) defaults[kind] = b.buildUp;
  }
  body.defaultBuildUps = defaults;
  if (single !== undefined && largest !== undefined && single > largest) errors.maxSingleLayer = 'The largest single layer must not exceed the largest thickness';
  for (const [path, message] of Object.entries(validateWithSchema(sizingSettingsSchema, body))) {
    const f = settingsFieldOf(path);
    if (!errors[f] && message) errors[f] = message;
  }
  return { input: Object.keys(errors).length === 0 ? body : null, errors };
}

/** Errors of one default build-up, keyed as the build-up fields read them. */
export function buildUpErrorsOf(errors: SettingsErrors, kind: 'hot' | 'cold'): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, m] of Object.entries(errors)) if (k.startsWith(`${kind}:`)) out[k.slice(kind.length + 1)] = m;
  return out;
}
