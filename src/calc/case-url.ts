/**
 * Shared links: the case travels in the URL as its SI CalcCase (query parameter `case`, compact JSON),
 * with the few form choices a case does not carry in `o`, and the display units it was shown in (`u`,
 * SI or US). The case itself stays SI: the units only choose how the reader first sees it.
 */
import * as yup from 'yup';

import type { CalcCase } from '../../shared/calc/types';
import type { DraftOptions } from './quick-case';
import type { UnitSystem } from './units';

/**
 * Drop undefined members. Numbers are kept exactly (JSON writes the shortest text that reads back to the
 * same double), so a link reproduces the case bit for bit and library materials are recognised again.
 */
function tidy(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(tidy);
  if (value && typeof value === 'object') {
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(value)) if (v !== undefined) out[k] = tidy(v);
    return out;
  }
  return value;
}

/** The case as compact JSON for the `case` parameter. */
export function caseToParam(c: CalcCase): string {
  return JSON.stringify(tidy(c));
}

/** The query string (without "?") for a case, its options and the display units it was shown in. */
export function encodeCaseQuery(c: CalcCase, o?: DraftOptions, units?: UnitSystem): string {
  const parts = [`case=${encodeURIComponent(caseToParam(c))}`];
  if (o && Object.keys(o).length > 0) parts.push(`o=${encodeURIComponent(JSON.stringify(tidy(o)))}`);
  if (units) parts.push(`u=${units}`);
  return parts.join('&');
}

const num = () => yup.number().strict().required();
const optNum = () => yup.number().strict().optional();
const oneOf = <T extends string>(values: readonly T[]) => yup.mixed<T>().oneOf([...values]).required();

const geometrySchema = yup.lazy((g: { type?: unknown }) => {
  if (g?.type === 'pipe') {
    return yup.object({ type: yup.string().required(), outerDiameterM: num(), orientation: oneOf(['horizontal', 'vertical'] as const), heightM: optNum() });
  }
  if (g?.type === 'vessel') {
    return yup.object({
      type: yup.string().required(),
      diameterM: num(),
      lengthM: num(),
      orientation: oneOf(['horizontal', 'vertical'] as const),
      headType: oneOf(['flat', 'ellipsoidal2to1', 'hemispherical'] as const),
    });
  }
  if (g?.type === 'flat') {
    return yup.object({
      type: yup.string().required(),
      orientation: oneOf(['vertical', 'faceUp', 'faceDown'] as const),
      heightM: optNum(),
      characteristicLengthM: optNum(),
      lengthAlongWindM: optNum(),
    });
  }
  return yup.object({ type: yup.string().oneOf(['pipe', 'vessel', 'flat'], 'geometry.type must be pipe, vessel or flat').required() });
});

const caseSchema = yup.object({
  geometry: geometrySchema,
  processTemperatureC: num(),
  layers: yup
    .array(
      yup.object({
        thicknessM: num(),
        conductivity: yup.array(num()).min(1).required(),
        maxServiceTemperatureC: optNum(),
        minServiceTemperatureC: optNum(),
        conductivityDataRangeC: yup.array(num()).length(2).default(undefined).optional(),
      }),
    )
    .required(),
  surfaceEmissivity: num(),
  ambient: yup
    .object({ airTemperatureC: num(), radiantTemperatureC: optNum(), windSpeedMS: optNum(), relativeHumidityPct: optNum() })
    .required(),
  solveFor: yup
    .object({
      criterion: oneOf(['surfaceTemperature', 'heatLoss', 'condensation', 'temperatureChange', 'freezeTime'] as const),
      maxC: optNum(),
      maxWPerM: optNum(),
      maxWPerM2: optNum(),
      maxW: optNum(),
      marginK: optNum(),
      maxChangeK: optNum(),
      minHours: optNum(),
      maxThicknessM: optNum(),
    })
    .default(undefined)
    .optional(),
  round: yup.object({ seriesM: yup.array(num()).min(1).required(), maxSingleLayerM: optNum() }).default(undefined).optional(),
  run: yup.object({ lengthM: num(), massFlowKgPerS: num(), specificHeatJPerKgK: num() }).default(undefined).optional(),
  stagnant: yup.object({ innerDiameterM: num(), pipeMassKgPerM: num(), pipeSpecificHeatJPerKgK: optNum() }).default(undefined).optional(),
  contact: yup
    .object({ material: oneOf(['uncoatedMetal', 'coatedMetal', 'ceramicGlassStone', 'plastic', 'wood'] as const), seconds: num() })
    .default(undefined)
    .optional(),
});

export type DecodedLink =
  | { kind: 'none' }
  | { kind: 'ok'; case: CalcCase; options: DraftOptions; /** Display units of the link, when it names them. */ units?: UnitSystem }
  | { kind: 'invalid'; message: string };

/**
 * Read a shared link's parameters. Missing `case` → none; unreadable → invalid with the field named.
 */
export function decodeCaseParams(caseParam: string | undefined | null, optionsParam?: string | null): DecodedLink {
  if (caseParam === undefined || caseParam === null || caseParam === '') return { kind: 'none' };
  let raw: unknown;
  try {
    raw = JSON.parse(caseParam);
  } catch {
    return { kind: 'invalid', message: 'The link’s case is not valid JSON.' };
  }
  try {
    caseSchema.validateSync(raw, { abortEarly: true });
  } catch (e) {
    const err = e as yup.ValidationError;
    return { kind: 'invalid', message: `The link’s case could not be read: ${err.path ? `${err.path} — ` : ''}${err.message}` };
  }
  let options: DraftOptions = {};
  if (optionsParam) {
    try {
      const o = JSON.parse(optionsParam);
      if (o && typeof o === 'object' && !Array.isArray(o)) options = o as DraftOptions;
    } catch {
      options = {};
    }
  }
  return { kind: 'ok', case: raw as CalcCase, options };
}

/** Read a query string such as window.location.search. */
export function decodeCaseQuery(search: string): DecodedLink {
  const params = new URLSearchParams(search.startsWith('?') ? search.slice(1) : search);
  const decoded = decodeCaseParams(params.get('case'), params.get('o'));
  const u = params.get('u');
  if (decoded.kind === 'ok' && (u === 'SI' || u === 'US')) return { ...decoded, units: u };
  return decoded;
}
