/**
 * Everything the quick-sizing screen shows for one draft, computed in the browser with shared/calc:
 * the result, the bare-surface comparison, the thickness sweeps for the charts, the temperature profile
 * and the annual energy figures. Pure: no React, no clock.
 */
import { analyse, runCase } from './run-case';
import { conductivityIntegral } from '../../shared/calc/conduction';
import type { CalcCase, CalcResult, Layer } from '../../shared/calc/types';

import { calcErrorInFormWords } from './calc-messages';
import { annualEnergy, type EnergyFigures } from './energy';
import { DraftIncomplete, draftToCase, roundingOf, type Draft, type EnergyAssumptions } from './quick-case';
import { validateDraft, type FieldErrors } from './validation';
import type { UnitSystem } from './units';

/** Largest thickness of the solved layer the calculation searches when none is given [m] (DESIGN §6). */
export const SEARCHED_THICKNESS_M = 0.5;

/**
 * A target no thickness reaches. The output then describes the best build-up within reach — the thickest
 * searched, or two of the thickest series layers — so the screen can show how close it gets, with the charts.
 */
export type Shortfall = {
  code: 'TARGET_NOT_REACHABLE' | 'SERIES_TOO_THIN';
  /** Thickness of the outer layer(s) in the best build-up within reach [m]. */
  bestThicknessM: number;
  /** The thickness the target needs, when it exists but the series cannot make it [m]. */
  neededThicknessM: number | null;
  /** What would help, in plain words. */
  advice: string[];
};

/** One layer of the build-up the result describes, with its face temperatures. */
export type EvaluatedLayer = {
  layer: Layer;
  /** Index of the form's layer it comes from (a solved layer split in two maps both halves to it). */
  draftIndex: number;
  /** Inner and outer face temperatures [°C]. */
  innerC: number;
  outerC: number;
};

export type SweepPoint = { thicknessM: number; surfaceTemperatureC: number; heatFlow: number };
export type ProfilePoint = { positionM: number; temperatureC: number };
export type ProfileBoundary = { positionM: number; temperatureC: number; label: string };

export type LiveOutput =
  | { kind: 'invalid'; errors: FieldErrors }
  | {
      kind: 'error';
      case: CalcCase;
      code: string;
      /** The calc's field path. */
      field: string;
      /** The draft field to mark, when the form has one. */
      formField: string | null;
      /** In the form's words and units. */
      message: string;
      advice: string[];
    }
  | {
      kind: 'ok';
      /** The case of the draft (what the link carries). */
      case: CalcCase;
      /** The result shown: the draft's, or with a shortfall the best build-up within reach. */
      result: CalcResult;
      /** Set when no thickness meets the purpose; `result` is then the best build-up within reach. */
      shortfall: Shortfall | null;
      bare: CalcResult | null;
      /** The heat flow that matters for this geometry (W/m, W/m² or W). */
      heatFlow: number;
      bareHeatFlow: number | null;
      sweep: SweepPoint[];
      /** Thickness of the solved (outer) layer in the evaluated build-up [m]. */
      chosenThicknessM: number | null;
      profile: ProfilePoint[];
      boundaries: ProfileBoundary[];
      /** The evaluated build-up, inside out, with face temperatures (the governing part of a vessel). */
      buildUp: EvaluatedLayer[];
      energy: EnergyFigures | null;
    };

/** The heat flow of a result in the unit that suits its geometry. */
function heatFlowOf(c: CalcCase, r: CalcResult): number {
  if (c.geometry.type === 'pipe') return r.heatLossWPerM ?? NaN;
  if (c.geometry.type === 'flat') return r.heatFluxWPerM2 ?? NaN;
  return r.heatLossW ?? NaN;
}

/** The same case with the outer layer at a given thickness, evaluated as it stands (no solving, no rounding). */
function withOuterThickness(c: CalcCase, thicknessM: number): CalcCase {
  const layers = c.layers.map((l, i) => (i === c.layers.length - 1 ? { ...l, thicknessM } : l));
  const { solveFor: _s, round: _r, ...rest } = c;
  return { ...rest, layers };
}

/** The thicknesses swept for the charts: the series range, in even steps, with every series value. */
export function sweepThicknesses(seriesM: readonly number[], steps = 24): number[] {
  const lo = seriesM[0];
  const hi = seriesM[seriesM.length - 1];
  const set = new Set<number>(seriesM.map((t) => Number(t.toPrecision(10))));
  for (let i = 0; i <= steps; i++) set.add(Number((lo + ((hi - lo) * i) / steps).toPrecision(10)));
  return [...set].sort((a, b) => a - b);
}

function sweep(c: CalcCase, seriesM: readonly number[]): SweepPoint[] {
  if (c.layers.length === 0) return [];
  const out: SweepPoint[] = [];
  for (const t of sweepThicknesses(seriesM)) {
    try {
      const r = analyse(withOuterThickness(c, t));
      out.push({ thicknessM: t, surfaceTemperatureC: r.surfaceTemperatureC, heatFlow: heatFlowOf(c, r) });
    } catch {
      // A point the physics refuses (k not positive over the span, say) is left out of the curve.
    }
  }
  return out;
}

/**
 * The layers of the build-up the result describes: inner layers as entered and, when sized, the solved
 * layer's rounded thicknesses (possibly split in two), all with the outer layer's material.
 */
function evaluatedLayers(c: CalcCase, r: CalcResult): Layer[] {
  const n = r.interfaceTemperaturesC.length;
  if (!c.solveFor || c.layers.length === 0) return c.layers;
  const outer = c.layers[c.layers.length - 1];
  const inner = c.layers.slice(0, -1);
  const rounded = r.roundedLayersM;
  if (rounded && rounded.length === n) return rounded.map((t, i) => ({ ...(i < inner.length ? inner[i] : outer), thicknessM: t }));
  if (rounded && inner.length + rounded.length === n) return [...inner, ...rounded.map((t) => ({ ...outer, thicknessM: t }))];
  if (r.thicknessM !== undefined) return [...inner, { ...outer, thicknessM: r.thicknessM }];
  return c.layers;
}

/** Temperature at a fraction f of a layer's Kirchhoff drop, found by bisection (K(T) is monotonic where k > 0). */
function temperatureAtFraction(k: readonly number[], tIn: number, tOut: number, f: number): number {
  const kIn = conductivityIntegral(k, tIn);
  const target = kIn - f * (kIn - conductivityIntegral(k, tOut));
  let lo = Math.min(tIn, tOut);
  let hi = Math.max(tIn, tOut);
  const rising = conductivityIntegral(k, hi) >= conductivityIntegral(k, lo);
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    const v = conductivityIntegral(k, mid);
    if (v < target === rising) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/**
 * The temperature through the build-up, from the bare surface (at the process temperature) outward.
 * Cylinders follow ln r, flat layers are linear in position, both in the Kirchhoff variable so a k(T)
 * layer curves as it should.
 */
function temperatureProfile(c: CalcCase, r: CalcResult): { points: ProfilePoint[]; boundaries: ProfileBoundary[] } {
  const layers = evaluatedLayers(c, r);
  const temps = r.interfaceTemperaturesC;
  const cylindrical = c.geometry.type !== 'flat';
  const r0 = c.geometry.type === 'pipe' ? c.geometry.outerDiameterM / 2 : c.geometry.type === 'vessel' ? c.geometry.diameterM / 2 : 0;
  const points: ProfilePoint[] = [{ positionM: 0, temperatureC: c.processTemperatureC }];
  const boundaries: ProfileBoundary[] = [{ positionM: 0, temperatureC: c.processTemperatureC, label: 'Bare surface' }];
  let x = 0;
  let tIn = c.processTemperatureC;
  layers.forEach((layer, i) => {
    const tOut = temps[i];
    if (tOut === undefined) return;
    const steps = 12;
    for (let s = 1; s <= steps; s++) {
      const xi = (layer.thicknessM * s) / steps;
      const f = cylindrical ? Math.log((r0 + x + xi) / (r0 + x)) / Math.log((r0 + x + layer.thicknessM) / (r0 + x)) : s / steps;
      const t = s === steps ? tOut : temperatureAtFraction(layer.conductivity, tIn, tOut, f);
      points.push({ positionM: x + xi, temperatureC: t });
    }
    x += layer.thicknessM;
    tIn = tOut;
    boundaries.push({ positionM: x, temperatureC: tOut, label: i === layers.length - 1 ? 'Surface' : `Layer ${i + 1} outer face` });
  });
  return { points, boundaries };
}

/** What would help when a target cannot be reached, in plain words. */
function adviceFor(d: Draft, code: Shortfall['code']): string[] {
  if (code === 'SERIES_TOO_THIN') {
    return [
      'Choose a material with lower conductivity, or add an inner layer of one.',
      'Choose the other thickness series if it offers thicker layers.',
      ...adviceFor(d, 'TARGET_NOT_REACHABLE').slice(1),
    ];
  }
  switch (d.purpose) {
    case 'personnel':
      return [
        'Choose a material with lower conductivity, or add an inner layer of one.',
        'Choose a finish with a higher emissivity (a painted or plastic jacket sheds more heat by radiation).',
        'Raise the surface limit if the plant’s specification allows, or guard the surface instead.',
      ];
    case 'conservation':
      return ['Choose a material with lower conductivity.', 'Allow a higher heat loss.', 'Allow a thicker build-up (extend the thickness series).'];
    case 'condensation':
      return [
        'Choose a material with lower conductivity (closed-cell materials suit cold service).',
        'Choose a finish with a lower emissivity, or reduce the margin if the specification allows.',
        'Check the humidity: at very high humidity no practical thickness keeps the surface dry.',
      ];
    case 'holding':
      return ['Choose a material with lower conductivity.', 'Allow a larger temperature drop, or raise the flow.', 'Consider heat tracing for long runs at low flow.'];
    case 'frost':
      return ['Choose a material with lower conductivity.', 'Shorten the hours to hold, or drain the line when it stands.', 'Consider heat tracing: insulation only delays freezing.'];
  }
}

/** The best build-up within reach when the target cannot be met, evaluated as it stands; null if even that fails. */
function bestWithinReach(c: CalcCase, code: Shortfall['code']): { evaluated: CalcCase; result: CalcResult; bestThicknessM: number; neededThicknessM: number | null } | null {
  if (!c.solveFor || c.layers.length === 0) return null;
  try {
    if (code === 'TARGET_NOT_REACHABLE') {
      const t = c.solveFor.maxThicknessM ?? SEARCHED_THICKNESS_M;
      const evaluated = withOuterThickness(c, t);
      return { evaluated, result: analyse(evaluated), bestThicknessM: t, neededThicknessM: null };
    }
    const round = c.round;
    if (!round) return null;
    const single = round.maxSingleLayerM ?? Infinity;
    const thickest = Math.max(...round.seriesM.filter((t) => t <= single + 1e-9));
    const { round: _r, ...unrounded } = c;
    const needed = analyse(unrounded).thicknessM ?? null;
    const { solveFor: _s, round: _r2, ...rest } = c;
    const outer = c.layers[c.layers.length - 1];
    const evaluated: CalcCase = { ...rest, layers: [...c.layers.slice(0, -1), { ...outer, thicknessM: thickest }, { ...outer, thicknessM: thickest }] };
    return { evaluated, result: analyse(evaluated), bestThicknessM: 2 * thickest, neededThicknessM: needed };
  } catch {
    return null;
  }
}

/** The full output for one draft in one unit system (errors are worded in those units). */
export function evaluateDraft(d: Draft, system: UnitSystem): LiveOutput {
  const errors = validateDraft(d, system);
  if (Object.keys(errors).length > 0) return { kind: 'invalid', errors };
  let c: CalcCase;
  try {
    c = draftToCase(d);
  } catch (e) {
    if (e instanceof DraftIncomplete) return { kind: 'invalid', errors: { [e.field]: 'Enter a number.' } };
    throw e;
  }
  return evaluateCase(c, roundingOf(d).seriesM, d.energy, {
    advice: (code) => adviceFor(d, code),
    words: (error) => calcErrorInFormWords(error, d, system),
  });
}

/**
 * The full output for one case: its result (or, when the target is out of reach, the best build-up within reach
 * and the shortfall), the bare-surface comparison, the thickness sweeps over the series range, the temperature
 * profile and the annual figures (none without `energy`). Used for a quick-sizing draft and for the cases of a
 * line-list item alike.
 */
export function evaluateCase(
  c: CalcCase,
  seriesM: readonly number[],
  energy: EnergyAssumptions | null,
  opts: {
    advice?: (code: Shortfall['code']) => string[];
    words?: (error: { code: string; field: string; message: string }) => { field: string | null; message: string };
  } = {},
): Exclude<LiveOutput, { kind: 'invalid' }> {
  const outcome = runCase(c);
  let result: CalcResult;
  let evaluated = c;
  let shortfall: Shortfall | null = null;
  if ('error' in outcome) {
    const code = outcome.error.code;
    const best = code === 'TARGET_NOT_REACHABLE' || code === 'SERIES_TOO_THIN' ? bestWithinReach(c, code) : null;
    if (!best) {
      const words = opts.words?.(outcome.error) ?? { field: outcome.error.field, message: outcome.error.message };
      return { kind: 'error', case: c, code, field: outcome.error.field, formField: words.field, message: words.message, advice: [] };
    }
    const sc = code as Shortfall['code'];
    result = best.result;
    evaluated = best.evaluated;
    shortfall = { code: sc, bestThicknessM: best.bestThicknessM, neededThicknessM: best.neededThicknessM, advice: opts.advice?.(sc) ?? [] };
  } else {
    result = outcome;
  }
  let bare: CalcResult | null = null;
  try {
    const { solveFor: _s, round: _r, ...rest } = c;
    bare = analyse({ ...rest, layers: [] });
  } catch {
    bare = null;
  }
  const heatFlow = heatFlowOf(c, result);
  const bareHeatFlow = bare ? heatFlowOf(c, bare) : null;
  const swept = sweep(c, seriesM);
  const layers = evaluatedLayers(evaluated, result);
  const innerM = c.layers.slice(0, -1).reduce((s, l) => s + l.thicknessM, 0);
  const chosenThicknessM = c.solveFor
    ? result.totalThicknessM - innerM
    : layers.length > 0
      ? layers[layers.length - 1].thicknessM
      : null;
  const { points, boundaries } = temperatureProfile(evaluated, result);
  const figures = energy ? annualEnergy(heatFlow, bareHeatFlow, energy) : null;
  const lastDraft = c.layers.length - 1;
  const buildUp: EvaluatedLayer[] = layers.flatMap((layer, i) => {
    const outerC = result.interfaceTemperaturesC[i];
    if (outerC === undefined) return [];
    return [{ layer, draftIndex: Math.min(i, lastDraft), innerC: i === 0 ? c.processTemperatureC : result.interfaceTemperaturesC[i - 1], outerC }];
  });
  return { kind: 'ok', case: c, result, shortfall, bare, heatFlow, bareHeatFlow, sweep: swept, chosenThicknessM, profile: points, boundaries, buildUp, energy: figures };
}
