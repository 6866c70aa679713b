/**
 * Full validation of an untrusted case (parsed JSON) into a {@link CalcCase}: types, ranges, required
 * fields per geometry and criterion, and refusal of unknown fields. Errors name the field path, e.g.
 * `layers[0].conductivity`.
 */

import { CONTACT_MATERIALS } from './burn';
import { CalcInputError } from './errors';
import type { CalcCase, Criterion, Geometry, Layer } from './types';

type Obj = Record<string, unknown>;

function isObj(v: unknown): v is Obj {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function join(path: string, key: string): string {
  return path === '' ? key : `${path}.${key}`;
}

function object(v: unknown, path: string, allowed: readonly string[]): Obj {
  if (!isObj(v)) throw new CalcInputError(path || '(case)', `${path || 'The case'} must be an object.`);
  for (const k of Object.keys(v)) {
    if (!allowed.includes(k)) throw new CalcInputError(join(path, k), `Unknown field "${k}".`, 'UNKNOWN_FIELD');
  }
  return v;
}

type NumOpts = { min?: number; max?: number; gt?: number; lt?: number };

function num(o: Obj, key: string, path: string, opts: NumOpts, required: true): number;
function num(o: Obj, key: string, path: string, opts: NumOpts, required: boolean): number | undefined;
function num(o: Obj, key: string, path: string, opts: NumOpts, required: boolean): number | undefined {
  const f = join(path, key);
  const v = o[key];
  if (v === undefined) {
    if (required) throw new CalcInputError(f, `${f} is required.`, 'REQUIRED');
    return undefined;
  }
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new CalcInputError(f, `${f} must be a finite number.`);
  if (opts.min !== undefined && v < opts.min) throw new CalcInputError(f, `${f} must be at least ${opts.min}.`, 'OUT_OF_RANGE');
  if (opts.max !== undefined && v > opts.max) throw new CalcInputError(f, `${f} must be at most ${opts.max}.`, 'OUT_OF_RANGE');
  if (opts.gt !== undefined && !(v > opts.gt)) throw new CalcInputError(f, `${f} must be greater than ${opts.gt}.`, 'OUT_OF_RANGE');
  if (opts.lt !== undefined && !(v < opts.lt)) throw new CalcInputError(f, `${f} must be less than ${opts.lt}.`, 'OUT_OF_RANGE');
  return v;
}

function oneOf<T extends string>(o: Obj, key: string, path: string, values: readonly T[]): T {
  const f = join(path, key);
  const v = o[key];
  if (v === undefined) throw new CalcInputError(f, `${f} is required (one of ${values.join(', ')}).`, 'REQUIRED');
  if (typeof v !== 'string' || !(values as readonly string[]).includes(v)) {
    throw new CalcInputError(f, `${f} must be one of ${values.join(', ')}.`);
  }
  return v as T;
}

/** Geometric limits: well beyond any plant item, tight enough to stop unit mistakes (mm given as m). */
const MAX_DIMENSION_M = 100;
const MAX_LAYER_M = 5;

function geometry(v: unknown): Geometry {
  if (!isObj(v)) throw new CalcInputError('geometry', 'geometry must be an object.', v === undefined ? 'REQUIRED' : 'INVALID_INPUT');
  const type = oneOf(v, 'type', 'geometry', ['pipe', 'flat', 'vessel'] as const);
  const P = 'geometry';
  if (type === 'pipe') {
    const o = object(v, P, ['type', 'outerDiameterM', 'orientation', 'heightM']);
    const outerDiameterM = num(o, 'outerDiameterM', P, { gt: 0, max: 20 }, true);
    const orientation = oneOf(o, 'orientation', P, ['horizontal', 'vertical'] as const);
    const heightM = num(o, 'heightM', P, { gt: 0, max: 1000 }, orientation === 'vertical');
    return heightM === undefined ? { type, outerDiameterM, orientation } : { type, outerDiameterM, orientation, heightM };
  }
  if (type === 'flat') {
    const o = object(v, P, ['type', 'orientation', 'heightM', 'characteristicLengthM', 'lengthAlongWindM']);
    const orientation = oneOf(o, 'orientation', P, ['vertical', 'faceUp', 'faceDown'] as const);
    const heightM = num(o, 'heightM', P, { gt: 0, max: MAX_DIMENSION_M }, orientation === 'vertical');
    const characteristicLengthM = num(o, 'characteristicLengthM', P, { gt: 0, max: MAX_DIMENSION_M }, orientation !== 'vertical');
    const lengthAlongWindM = num(o, 'lengthAlongWindM', P, { gt: 0, max: 1000 }, false);
    const g: Geometry = { type, orientation };
    if (heightM !== undefined) g.heightM = heightM;
    if (characteristicLengthM !== undefined) g.characteristicLengthM = characteristicLengthM;
    if (lengthAlongWindM !== undefined) g.lengthAlongWindM = lengthAlongWindM;
    return g;
  }
  const o = object(v, P, ['type', 'diameterM', 'lengthM', 'orientation', 'headType']);
  return {
    type,
    diameterM: num(o, 'diameterM', P, { gt: 0, max: MAX_DIMENSION_M }, true),
    lengthM: num(o, 'lengthM', P, { gt: 0, max: 1000 }, true),
    orientation: oneOf(o, 'orientation', P, ['horizontal', 'vertical'] as const),
    headType: oneOf(o, 'headType', P, ['flat', 'ellipsoidal2to1', 'hemispherical'] as const),
  };
}

/** Bounds of a material's service limits and data range [°C]. */
const MATERIAL_TEMPERATURE_C = { min: -273.15, max: 3000 } as const;

function layers(v: unknown, solving: boolean): Layer[] {
  if (!Array.isArray(v)) throw new CalcInputError('layers', 'layers must be an array (use [] for a bare surface).', v === undefined ? 'REQUIRED' : 'INVALID_INPUT');
  if (v.length > 20) throw new CalcInputError('layers', 'At most 20 layers.', 'OUT_OF_RANGE');
  if (solving && v.length === 0) {
    throw new CalcInputError('layers', 'solveFor needs at least one layer: the outermost layer is the one sized.', 'REQUIRED');
  }
  return v.map((raw, i) => {
    const P = `layers[${i}]`;
    const o = object(raw, P, ['thicknessM', 'conductivity', 'maxServiceTemperatureC', 'minServiceTemperatureC', 'conductivityDataRangeC']);
    const isSolved = solving && i === v.length - 1;
    // The solved layer's own thickness is ignored, so it may be left out.
    const thicknessM = num(o, 'thicknessM', P, { min: 0, max: MAX_LAYER_M }, !isSolved) ?? 0;
    const kf = `${P}.conductivity`;
    const k = o.conductivity;
    if (k === undefined) throw new CalcInputError(kf, `${kf} is required.`, 'REQUIRED');
    if (!Array.isArray(k) || k.length === 0 || k.length > 8) {
      throw new CalcInputError(kf, `${kf} must be an array of 1 to 8 polynomial coefficients [W/(m·K)], T in °C.`);
    }
    k.forEach((c, j) => {
      if (typeof c !== 'number' || !Number.isFinite(c)) throw new CalcInputError(`${kf}[${j}]`, `${kf}[${j}] must be a finite number.`);
    });
    if (k.length === 1 && !(k[0] > 0)) throw new CalcInputError(kf, `${kf}: a constant conductivity must be positive.`, 'CONDUCTIVITY_NOT_POSITIVE');
    const layer: Layer = { thicknessM, conductivity: k.slice() as number[] };
    const ms = num(o, 'maxServiceTemperatureC', P, MATERIAL_TEMPERATURE_C, false);
    if (ms !== undefined) layer.maxServiceTemperatureC = ms;
    const mins = num(o, 'minServiceTemperatureC', P, MATERIAL_TEMPERATURE_C, false);
    if (mins !== undefined) {
      if (ms !== undefined && mins >= ms) {
        throw new CalcInputError(`${P}.minServiceTemperatureC`, `${P}.minServiceTemperatureC must be below maxServiceTemperatureC.`, 'OUT_OF_RANGE');
      }
      layer.minServiceTemperatureC = mins;
    }
    const rf = `${P}.conductivityDataRangeC`;
    const range = o.conductivityDataRangeC;
    if (range !== undefined) {
      const ok =
        Array.isArray(range) &&
        range.length === 2 &&
        range.every((t) => typeof t === 'number' && t >= MATERIAL_TEMPERATURE_C.min && t <= MATERIAL_TEMPERATURE_C.max) &&
        (range[0] as number) <= (range[1] as number);
      if (!ok) throw new CalcInputError(rf, `${rf} must be [lowest, highest] mean temperatures in °C, lowest first.`);
      layer.conductivityDataRangeC = [range[0] as number, range[1] as number];
    }
    return layer;
  });
}

function criterion(v: unknown, c: CalcCase): CalcCase['solveFor'] {
  const P = 'solveFor';
  if (!isObj(v)) throw new CalcInputError(P, 'solveFor must be an object.');
  const kind = oneOf(v, 'criterion', P, ['surfaceTemperature', 'heatLoss', 'condensation', 'temperatureChange', 'freezeTime'] as const);
  const common = ['criterion', 'maxThicknessM'];
  let crit: Criterion;
  switch (kind) {
    case 'surfaceTemperature': {
      const o = object(v, P, [...common, 'maxC']);
      crit = { criterion: kind, maxC: num(o, 'maxC', P, { gt: -273.15, max: 2000 }, true) };
      break;
    }
    case 'heatLoss': {
      const key = c.geometry.type === 'pipe' ? 'maxWPerM' : c.geometry.type === 'flat' ? 'maxWPerM2' : 'maxW';
      const o = object(v, P, [...common, key]);
      crit = { criterion: kind, [key]: num(o, key, P, { gt: 0 }, true) };
      break;
    }
    case 'condensation': {
      const o = object(v, P, [...common, 'marginK']);
      if (c.ambient.relativeHumidityPct === undefined) {
        throw new CalcInputError('ambient.relativeHumidityPct', 'The condensation criterion needs ambient.relativeHumidityPct.', 'REQUIRED');
      }
      crit = { criterion: kind, marginK: num(o, 'marginK', P, { min: 0, max: 50 }, true) };
      break;
    }
    case 'temperatureChange': {
      const o = object(v, P, [...common, 'maxChangeK']);
      if (!c.run) throw new CalcInputError('run', 'The temperatureChange criterion needs run (pipes only).', 'REQUIRED');
      crit = { criterion: kind, maxChangeK: num(o, 'maxChangeK', P, { gt: 0 }, true) };
      break;
    }
    case 'freezeTime': {
      const o = object(v, P, [...common, 'minHours']);
      if (!c.stagnant) throw new CalcInputError('stagnant', 'The freezeTime criterion needs stagnant (pipes only).', 'REQUIRED');
      crit = { criterion: kind, minHours: num(o, 'minHours', P, { gt: 0, max: 1e4 }, true) };
      break;
    }
  }
  const maxThicknessM = num(v, 'maxThicknessM', P, { gt: 0, max: MAX_LAYER_M }, false);
  return maxThicknessM === undefined ? crit : { ...crit, maxThicknessM };
}

const CASE_KEYS = [
  'geometry',
  'processTemperatureC',
  'layers',
  'surfaceEmissivity',
  'ambient',
  'solveFor',
  'round',
  'insideFilmWPerM2K',
  'pipeWall',
  'run',
  'stagnant',
  'contact',
] as const;

/**
 * Validates an untrusted case and returns a clean copy.
 *
 * @param input - parsed JSON (or a typed case)
 * @returns the validated case, with defaults left absent
 * @remarks Throws {@link CalcInputError} naming the first offending field path. Ranges: process
 * −273…1500 °C, air −100…100 °C, radiant −273…1500 °C, wind 0…100 m/s, emissivity 0…1, RH 0 < RH ≤ 100 %.
 * @example
 * validateCase({}); // throws CalcInputError, field 'geometry', code 'REQUIRED'
 */
export function validateCase(input: unknown): CalcCase {
  const o = object(input, '', CASE_KEYS);
  const geo = geometry(o.geometry);
  const processTemperatureC = num(o, 'processTemperatureC', '', { gt: -273.15, max: 1500 }, true);
  const surfaceEmissivity = num(o, 'surfaceEmissivity', '', { min: 0, max: 1 }, true);
  if (o.ambient === undefined) throw new CalcInputError('ambient', 'ambient is required.', 'REQUIRED');
  const a = object(o.ambient, 'ambient', ['airTemperatureC', 'radiantTemperatureC', 'windSpeedMS', 'relativeHumidityPct']);
  const ambient: CalcCase['ambient'] = { airTemperatureC: num(a, 'airTemperatureC', 'ambient', { min: -100, max: 100 }, true) };
  const rad = num(a, 'radiantTemperatureC', 'ambient', { gt: -273.15, max: 1500 }, false);
  if (rad !== undefined) ambient.radiantTemperatureC = rad;
  const wind = num(a, 'windSpeedMS', 'ambient', { min: 0, max: 100 }, false);
  if (wind !== undefined) ambient.windSpeedMS = wind;
  const rh = num(a, 'relativeHumidityPct', 'ambient', { gt: 0, max: 100 }, false);
  if (rh !== undefined) ambient.relativeHumidityPct = rh;

  const c: CalcCase = {
    geometry: geo,
    processTemperatureC,
    layers: layers(o.layers, o.solveFor !== undefined),
    surfaceEmissivity,
    ambient,
  };
  const isPipe = geo.type === 'pipe';

  const film = num(o, 'insideFilmWPerM2K', '', { gt: 0 }, false);
  if (film !== undefined) c.insideFilmWPerM2K = film;
  if (o.pipeWall !== undefined) {
    if (!isPipe) throw new CalcInputError('pipeWall', 'pipeWall applies to pipes only.');
    const w = object(o.pipeWall, 'pipeWall', ['innerDiameterM', 'conductivityWPerMK']);
    const od = (geo as { outerDiameterM: number }).outerDiameterM;
    c.pipeWall = {
      innerDiameterM: num(w, 'innerDiameterM', 'pipeWall', { gt: 0, lt: od }, true),
      conductivityWPerMK: num(w, 'conductivityWPerMK', 'pipeWall', { gt: 0, max: 1000 }, true),
    };
  }
  if (o.run !== undefined) {
    if (!isPipe) throw new CalcInputError('run', 'run applies to pipes only.');
    const r = object(o.run, 'run', ['lengthM', 'massFlowKgPerS', 'specificHeatJPerKgK']);
    c.run = {
      lengthM: num(r, 'lengthM', 'run', { gt: 0, max: 1e6 }, true),
      massFlowKgPerS: num(r, 'massFlowKgPerS', 'run', { gt: 0 }, true),
      specificHeatJPerKgK: num(r, 'specificHeatJPerKgK', 'run', { gt: 0, max: 1e5 }, true),
    };
  }
  if (o.stagnant !== undefined) {
    if (!isPipe) throw new CalcInputError('stagnant', 'stagnant applies to pipes only.');
    const s = object(o.stagnant, 'stagnant', ['innerDiameterM', 'pipeMassKgPerM', 'pipeSpecificHeatJPerKgK']);
    const od = (geo as { outerDiameterM: number }).outerDiameterM;
    c.stagnant = {
      innerDiameterM: num(s, 'innerDiameterM', 'stagnant', { gt: 0, lt: od }, true),
      pipeMassKgPerM: num(s, 'pipeMassKgPerM', 'stagnant', { min: 0, max: 1e4 }, true),
    };
    const cp = num(s, 'pipeSpecificHeatJPerKgK', 'stagnant', { gt: 0, max: 1e5 }, false);
    if (cp !== undefined) c.stagnant.pipeSpecificHeatJPerKgK = cp;
  }
  if (o.contact !== undefined) {
    const k = object(o.contact, 'contact', ['material', 'seconds']);
    c.contact = {
      material: oneOf(k, 'material', 'contact', CONTACT_MATERIALS),
      seconds: num(k, 'seconds', 'contact', { gt: 0, max: 1e6 }, true),
    };
  }
  if (o.solveFor !== undefined) c.solveFor = criterion(o.solveFor, c);
  if (o.round !== undefined) {
    if (o.solveFor === undefined) throw new CalcInputError('round', 'round applies to a solved layer: give solveFor as well.');
    const r = object(o.round, 'round', ['seriesM', 'maxSingleLayerM']);
    const s = r.seriesM;
    if (!Array.isArray(s) || s.length === 0 || s.length > 200) {
      throw new CalcInputError('round.seriesM', 'round.seriesM must be a non-empty array of thicknesses [m].', s === undefined ? 'REQUIRED' : 'INVALID_INPUT');
    }
    s.forEach((t, j) => {
      if (typeof t !== 'number' || !Number.isFinite(t) || !(t > 0) || t > MAX_LAYER_M) {
        throw new CalcInputError(`round.seriesM[${j}]`, `round.seriesM[${j}] must be a thickness in metres, 0 < t ≤ ${MAX_LAYER_M}.`);
      }
    });
    c.round = { seriesM: (s as number[]).slice().sort((x, y) => x - y) };
    const ms = num(r, 'maxSingleLayerM', 'round', { gt: 0, max: MAX_LAYER_M }, false);
    if (ms !== undefined) c.round.maxSingleLayerM = ms;
  }
  return c;
}
