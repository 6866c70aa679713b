/**
 * A team material as its form holds it: a datasheet's table of (mean temperature, k) typed in the user's
 * units, fitted live with the same `fitTeamConductivity` the server stores, and the SI body it sends.
 */
import { conductivityAt } from '../../../shared/calc/conduction';
import { CalcInputError } from '../../../shared/calc/errors';
import { fitTeamConductivity, type ConductivityFit } from '../../../shared/calc/sizing/library';
import { teamMaterialCreateSchema, teamMaterialPatchSchema } from '../../../shared/schemas/lines';
import type { TeamMaterial } from '../../api/types';
import { formatInputNumber, fromDisplay, parseNumber, toDisplay, type UnitSystem } from '../../calc/units';
import { validateWithSchema } from '../forms/validate';
import { clean } from '../lines/build-up';

export const MAX_POINTS = 40;

export type PointText = { t: string; k: string };

export interface MaterialFormValues {
  name: string;
  source: string;
  points: PointText[];
  minService: string;
  maxService: string;
  notes: string;
}

export const pointField = (i: number, which: 't' | 'k') => `points[${i}].${which}`;

export function emptyMaterialForm(): MaterialFormValues {
  return { name: '', source: '', points: [{ t: '', k: '' }, { t: '', k: '' }, { t: '', k: '' }], minService: '', maxService: '', notes: '' };
}

const show = (q: 'temperature' | 'conductivity', system: UnitSystem, si: number) => formatInputNumber(toDisplay(q, system, si));

export function materialToForm(m: TeamMaterial, system: UnitSystem): MaterialFormValues {
  return {
    name: m.name,
    source: m.source,
    points: m.tablePoints.map((p) => ({ t: show('temperature', system, p.meanTemperatureC), k: show('conductivity', system, p.conductivityWPerMK) })),
    minService: show('temperature', system, m.minServiceTemperatureC),
    maxService: show('temperature', system, m.maxServiceTemperatureC),
    notes: m.notes ?? '',
  };
}

export type FitPreview =
  | { kind: 'ok'; fit: ConductivityFit; points: { meanTemperatureC: number; conductivityWPerMK: number }[]; serviceRangeC: [number, number] }
  /** Not enough typed yet to fit; says what is missing. */
  | { kind: 'incomplete'; message: string }
  /** The points or range cannot be fitted; names the field. */
  | { kind: 'error'; field: string; message: string };

interface Parsed {
  points: { meanTemperatureC: number; conductivityWPerMK: number }[];
  min: number | null;
  max: number | null;
  errors: Record<string, string>;
}

/**
 * Reads the typed table and range into SI. Rows left wholly empty are skipped; a half-filled row or text
 * that is not a number is an error at its cell. A value shown as it was stored keeps its stored SI value.
 */
function parse(values: MaterialFormValues, system: UnitSystem, start?: { values: MaterialFormValues; material: TeamMaterial }): Parsed {
  const errors: Record<string, string> = {};
  const points: Parsed['points'] = [];
  values.points.forEach((p, i) => {
    const t = p.t.trim();
    const k = p.k.trim();
    if (t === '' && k === '') return;
    const tn = parseNumber(t);
    const kn = parseNumber(k);
    if (t === '') errors[pointField(i, 't')] = `Point ${i + 1}: give its mean temperature`;
    else if (tn === null) errors[pointField(i, 't')] = `Point ${i + 1}: mean temperature must be a number`;
    if (k === '') errors[pointField(i, 'k')] = `Point ${i + 1}: give its conductivity`;
    else if (kn === null) errors[pointField(i, 'k')] = `Point ${i + 1}: conductivity must be a number`;
    if (tn === null || kn === null) return;
    const was = start?.values.points[i];
    const stored = start?.material.tablePoints[i];
    points.push({
      meanTemperatureC: was && stored && was.t === p.t ? stored.meanTemperatureC : clean(fromDisplay('temperature', system, tn)),
      conductivityWPerMK: was && stored && was.k === p.k ? stored.conductivityWPerMK : clean(fromDisplay('conductivity', system, kn)),
    });
  });
  const temp = (field: 'minService' | 'maxService', label: string, stored?: number): number | null => {
    const text = values[field].trim();
    if (text === '') return null;
    if (start && start.values[field] === values[field] && stored !== undefined) return stored;
    const n = parseNumber(text);
    if (n === null) {
      errors[field] = `${label} must be a number`;
      return null;
    }
    return clean(fromDisplay('temperature', system, n));
  };
  return {
    points,
    min: temp('minService', 'Minimum service temperature', start?.material.minServiceTemperatureC),
    max: temp('maxService', 'Maximum service temperature', start?.material.maxServiceTemperatureC),
    errors,
  };
}

/** Index of the form row behind the n-th filled point (rows left empty are skipped). */
function rowOfPoint(values: MaterialFormValues, n: number): number {
  let seen = -1;
  for (let i = 0; i < values.points.length; i++) {
    if (values.points[i].t.trim() === '' && values.points[i].k.trim() === '') continue;
    seen++;
    if (seen === n) return i;
  }
  return n;
}

/** Where a path of the fit or the schema lands in the form. */
export function materialFieldOf(path: string, values: MaterialFormValues): string {
  const m = /^tablePoints\[(\d+)\]\.(meanTemperatureC|conductivityWPerMK)$/.exec(path);
  if (m) return pointField(rowOfPoint(values, Number(m[1])), m[2] === 'meanTemperatureC' ? 't' : 'k');
  if (path.startsWith('tablePoints')) return 'points';
  if (path === 'minServiceTemperatureC') return 'minService';
  if (path === 'maxServiceTemperatureC') return 'maxService';
  return path;
}

/** The live fit of what is typed so far. */
export function fitPreview(values: MaterialFormValues, system: UnitSystem, start?: { values: MaterialFormValues; material: TeamMaterial }): FitPreview {
  const p = parse(values, system, start);
  const firstError = Object.entries(p.errors)[0];
  if (firstError) return { kind: 'error', field: firstError[0], message: firstError[1] };
  if (p.points.length < 2) return { kind: 'incomplete', message: 'Type at least two points of the datasheet’s table to see the fit.' };
  const lo = Math.min(...p.points.map((x) => x.meanTemperatureC));
  const hi = Math.max(...p.points.map((x) => x.meanTemperatureC));
  const range: [number, number] = [p.min ?? lo, p.max ?? hi];
  if (range[0] >= range[1]) return { kind: 'error', field: 'minService', message: 'Minimum service temperature must be below the maximum' };
  try {
    return { kind: 'ok', fit: fitTeamConductivity(p.points, range), points: p.points, serviceRangeC: range };
  } catch (e) {
    if (e instanceof CalcInputError) return { kind: 'error', field: materialFieldOf(e.field, values), message: e.message };
    throw e;
  }
}

/** The curve of a fit over a range, for the chart [°C, W/(m·K)]. */
export function fitCurve(fit: ConductivityFit, rangeC: [number, number], steps = 40): { t: number; k: number }[] {
  const out: { t: number; k: number }[] = [];
  for (let i = 0; i <= steps; i++) {
    const t = rangeC[0] + ((rangeC[1] - rangeC[0]) * i) / steps;
    out.push({ t, k: conductivityAt(fit.conductivity, t) });
  }
  return out;
}

/** The form → the API's SI body (create, or patch with `start`) and the errors at their fields. */
export function materialFormToInput(
  values: MaterialFormValues,
  system: UnitSystem,
  start?: { values: MaterialFormValues; material: TeamMaterial },
): { input: Record<string, unknown> | null; errors: Record<string, string> } {
  const p = parse(values, system, start);
  const errors: Record<string, string> = { ...p.errors };
  const body: Record<string, unknown> = { name: values.name.trim(), source: values.source.trim(), tablePoints: p.points };
  if (p.min !== null) body.minServiceTemperatureC = p.min;
  if (p.max !== null) body.maxServiceTemperatureC = p.max;
  if (values.notes.trim() || start) body.notes = values.notes.trim();
  for (const [path, message] of Object.entries(validateWithSchema(start ? teamMaterialPatchSchema : teamMaterialCreateSchema, body))) {
    const field = materialFieldOf(path, values);
    if (!errors[field] && message) errors[field] = message;
  }
  if (Object.keys(errors).length === 0) {
    const preview = fitPreview(values, system, start);
    if (preview.kind === 'error' && !errors[preview.field]) errors[preview.field] = preview.message;
  }
  return { input: Object.keys(errors).length === 0 ? body : null, errors };
}
