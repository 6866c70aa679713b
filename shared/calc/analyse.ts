/**
 * Assembly of a full analysis: builds the surfaces of a pipe, wall or vessel, solves their balances,
 * sizes the outer layer for a purpose, rounds to a thickness series and reports the result.
 *
 * References:
 * 1. ASTM C680-19, *Standard Practice for Estimate of the Heat Gain or Loss and the Surface Temperatures of
 *    Insulated Flat, Cylindrical, and Spherical Systems by Use of Computer Programs*.
 * 2. ISO 12241:2022, *Thermal insulation for building equipment and industrial installations —
 *    Calculation rules* (temperature drop along a pipe; freezing of stagnant water).
 * 3. F. P. Incropera, D. P. DeWitt et al., *Fundamentals of Heat and Mass Transfer*, 6th ed., §3.3.2
 *    (critical insulation radius), §5.3 (lumped capacitance), §8.3.1 (exponential decay along a duct).
 */

import { burnCheck } from './burn';
import { AIR_PROPERTIES_SOURCE, AIR_TABLE_MAX_K, AIR_TABLE_MIN_K, airProperties } from './air-properties';
import { DEW_POINT_VALID_RANGE_C, dewPointC } from './dew-point';
import { CONDUCTIVITY_MAX_W_PER_MK, CONDUCTIVITY_MIN_W_PER_MK, KirchhoffBracket, kirchhoffBracket } from './conduction';
import { CalcInputError, EnergyBalanceError, ImpossibleTargetError } from './errors';
import { RE_CRITICAL_FLAT_PLATE, RE_MAX_FLAT_PLATE, REPR_MIN_CYLINDER_CROSSFLOW } from './forced-convection';
import {
  RA_BRANCH_PLATE_UPPER_HOT,
  RA_RANGE_HORIZONTAL_CYLINDER,
  RA_RANGE_PLATE_LOWER_HOT,
  RA_RANGE_PLATE_UPPER_HOT,
  RA_RANGE_VERTICAL_PLATE,
  rayleighNumberIdealGas,
} from './natural-convection';
import { polynomialRange } from './polynomial';
import { KELVIN_OFFSET } from './radiation';
import {
  FORCED_CYLINDER,
  FORCED_PLATE,
  NATURAL_FACE_DOWN,
  NATURAL_FACE_UP,
  NATURAL_HORIZONTAL_CYLINDER,
  NATURAL_VERTICAL_PLATE,
  SurfaceModel,
  checkConductivitySpans,
  energyBalanceMismatch,
  interfaceTemperatures,
  solveSurface,
} from './surface-balance';
import type { CalcCase, CalcResult, Criterion, VesselPart, Warning } from './types';
import { headArea } from './vessel-heads';
import { validateCase } from './validate';

/** Largest thickness of the solved layer considered when `solveFor.maxThicknessM` is absent [m]. */
export const DEFAULT_MAX_THICKNESS_M = 0.5;
/** Density of liquid water [kg/m³] (from memory; ≈ 999.8 at 0 °C). */
export const WATER_DENSITY_KG_PER_M3 = 1000;
/** Specific heat of liquid water [J/(kg·K)] (from memory; 4.19–4.22 kJ/(kg·K) from 0 to 20 °C). */
export const WATER_SPECIFIC_HEAT_J_PER_KGK = 4190;
/** Specific heat of carbon steel [J/(kg·K)] (from memory; ≈ 434–490 near room temperature). */
export const STEEL_SPECIFIC_HEAT_J_PER_KGK = 460;
/** Number of segments the run is marched in. */
const RUN_SEGMENTS = 20;
/** Simpson intervals over the water temperature for the freezing time (even). */
const FREEZE_INTERVALS = 20;
/** Points of the downward thickness scan (quadratic spacing: dense near zero where r_crit matters). */
const SCAN_POINTS = 40;
/** Bisection stops when the pass/fail bracket on thickness is narrower than this [m]. */
const THICKNESS_TOLERANCE_M = 1e-6;

type Prepared = {
  c: CalcCase;
  airC: number;
  radiantC: number;
  windMS: number;
  dewC: number | undefined;
  /** Every temperature of the case lies in [min, max] of the process, air and radiant temperatures [°C]. */
  domainLoC: number;
  domainHiC: number;
  /** Roots of each k(T) over the domain, computed once per polynomial. */
  brackets: Map<readonly number[], KirchhoffBracket>;
  /**
   * Surface models by part (pipe, wall or shell; head 1; head 2), kept so that the thickness search and the
   * run march re-solve the same objects (no allocation) and each solve starts from the last answer.
   */
  models: (SurfaceModel | undefined)[];
};

/** The surfaces of a build-up before they are solved; `names` only for a vessel's parts. */
type Surfaces = { models: SurfaceModel[]; names: VesselPart['name'][] };

type Evaluation = Surfaces & {
  /** W/m (pipe), W/m² (flat) or W (vessel). */
  heatFlow: number;
  /** Index of the hottest part, whose coefficients and faces the result reports. */
  governing: number;
  maxSurfaceC: number;
  minSurfaceC: number;
  /** Every part's balance closed. */
  balanced: boolean;
};

function bracketOf(p: Prepared, k: readonly number[]): KirchhoffBracket {
  let b = p.brackets.get(k);
  if (!b) {
    b = kirchhoffBracket(k, p.domainLoC, p.domainHiC);
    p.brackets.set(k, b);
  }
  return b;
}

/**
 * The model of part `slot` for this build-up: the previous one re-initialised when it has the same layer
 * polynomials (the thickness search), so it keeps its warm start; else a new one that inherits it.
 */
function newModel(p: Prepared, processC: number, coeffs: number[][], layerCount: number, slot: number): SurfaceModel {
  const old = p.models[slot];
  if (old && old.coeffs === coeffs && old.factor.length === layerCount) {
    old.seriesR = 0;
    old.area = 1;
    old.naturalKind = NATURAL_VERTICAL_PLATE;
    old.naturalLengthM = 1;
    old.forcedKind = FORCED_PLATE;
    old.forcedLengthM = 1;
    old.processC = processC;
    old.outerDiameterM = 0;
    return old;
  }
  const m: SurfaceModel = {
    coeffs,
    brackets: coeffs.map((k) => bracketOf(p, k)),
    factor: new Float64Array(layerCount),
    seriesR: 0,
    area: 1,
    naturalKind: NATURAL_VERTICAL_PLATE,
    naturalLengthM: 1,
    forcedKind: FORCED_PLATE,
    forcedLengthM: 1,
    windMS: p.windMS,
    emissivity: p.c.surfaceEmissivity,
    airC: p.airC,
    radiantC: p.radiantC,
    processC,
    outerDiameterM: 0,
    surfaceC: processC,
    heatFlow: 0,
    hc: 0,
    hr: 0,
    balanced: false,
    atBranchChange: false,
    guessC: old ? old.guessC : NaN,
    slope: old ? old.slope : 0,
  };
  p.models[slot] = m;
  return m;
}

/** Cylindrical build-up from radius r0; Q basis per `lengthM` metres (1 for pipes). */
function cylinderModel(
  p: Prepared,
  processC: number,
  r0: number,
  lengthM: number,
  thicknesses: readonly number[],
  coeffs: number[][],
): SurfaceModel {
  const n = thicknesses.length;
  const m = newModel(p, processC, coeffs, n, 0);
  let r = r0;
  for (let i = 0; i < n; i++) {
    const r2 = r + thicknesses[i];
    m.factor[i] = thicknesses[i] > 0 ? Math.log(r2 / r) / (2 * Math.PI * lengthM) : 0;
    r = r2;
  }
  m.area = 2 * Math.PI * r * lengthM;
  m.outerDiameterM = 2 * r;
  m.forcedKind = FORCED_CYLINDER;
  m.forcedLengthM = 2 * r;
  return m;
}

function buildSurfaces(p: Prepared, thicknesses: readonly number[], coeffs: number[][], processC: number): Surfaces {
  const c = p.c;
  const g = c.geometry;
  const film = c.insideFilmWPerM2K;
  if (g.type === 'pipe') {
    const m = cylinderModel(p, processC, g.outerDiameterM / 2, 1, thicknesses, coeffs);
    let innerD = g.outerDiameterM;
    if (c.pipeWall) {
      innerD = c.pipeWall.innerDiameterM;
      m.seriesR += Math.log(g.outerDiameterM / innerD) / (2 * Math.PI * c.pipeWall.conductivityWPerMK);
    }
    if (film) m.seriesR += 1 / (film * Math.PI * innerD);
    if (g.orientation === 'horizontal') {
      m.naturalKind = NATURAL_HORIZONTAL_CYLINDER;
      m.naturalLengthM = m.outerDiameterM;
    } else {
      m.naturalKind = NATURAL_VERTICAL_PLATE;
      m.naturalLengthM = g.heightM as number;
    }
    return { models: [m], names: [] };
  }
  if (g.type === 'flat') {
    const n = thicknesses.length;
    const m = newModel(p, processC, coeffs, n, 0);
    for (let i = 0; i < n; i++) m.factor[i] = thicknesses[i];
    if (film) m.seriesR = 1 / film;
    m.area = 1;
    if (g.orientation === 'vertical') {
      m.naturalKind = NATURAL_VERTICAL_PLATE;
      m.naturalLengthM = g.heightM as number;
    } else {
      m.naturalKind = g.orientation === 'faceUp' ? NATURAL_FACE_UP : NATURAL_FACE_DOWN;
      m.naturalLengthM = g.characteristicLengthM as number;
    }
    m.forcedKind = FORCED_PLATE;
    m.forcedLengthM = g.lengthAlongWindM ?? g.heightM ?? (g.characteristicLengthM as number);
    return { models: [m], names: [] };
  }
  // Vessel: shell plus two heads, each solved as its own surface of its own area.
  const D = g.diameterM;
  const shell = cylinderModel(p, processC, D / 2, g.lengthM, thicknesses, coeffs);
  if (film) shell.seriesR = 1 / (film * Math.PI * D * g.lengthM);
  if (g.orientation === 'horizontal') {
    shell.naturalKind = NATURAL_HORIZONTAL_CYLINDER;
    shell.naturalLengthM = shell.outerDiameterM;
  } else {
    shell.naturalKind = NATURAL_VERTICAL_PLATE;
    shell.naturalLengthM = g.lengthM;
  }
  const heads: SurfaceModel[] = [];
  for (let h = 0; h < 2; h++) {
    const n = thicknesses.length;
    const m = newModel(p, processC, coeffs, n, 1 + h);
    let offset = 0;
    let A1 = headArea(g.headType, D, 0);
    const A0 = A1;
    for (let i = 0; i < n; i++) {
      offset += thicknesses[i];
      const A2 = headArea(g.headType, D, offset);
      // Exact for spherical shells (√(A₁A₂)/t = 4πr₁r₂/(r₂ − r₁)); slab for flat heads.
      m.factor[i] = thicknesses[i] > 0 ? thicknesses[i] / Math.sqrt(A1 * A2) : 0;
      A1 = A2;
    }
    m.area = A1;
    if (film) m.seriesR = 1 / (film * A0);
    const Dout = D + 2 * offset;
    if (g.orientation === 'horizontal') {
      m.naturalKind = NATURAL_VERTICAL_PLATE;
      m.naturalLengthM = Dout;
    } else {
      m.naturalKind = h === 0 ? NATURAL_FACE_UP : NATURAL_FACE_DOWN;
      m.naturalLengthM = Dout / 4;
    }
    m.forcedKind = FORCED_PLATE;
    m.forcedLengthM = Dout;
    heads.push(m);
  }
  return { models: [shell, ...heads], names: ['shell', 'head1', 'head2'] };
}

function evaluate(p: Prepared, thicknesses: readonly number[], coeffs: number[][], processC: number): Evaluation {
  const { models: ms, names } = buildSurfaces(p, thicknesses, coeffs, processC);
  const g = p.c.geometry;
  const horizontalVessel = g.type === 'vessel' && g.orientation === 'horizontal';
  let total = 0;
  let gov = 0;
  let maxT = -Infinity;
  let minT = Infinity;
  let balanced = true;
  for (let i = 0; i < ms.length; i++) {
    if (i === 2 && horizontalVessel) {
      // Both heads of a horizontal vessel are the same vertical surface.
      const h1 = ms[1];
      const h2 = ms[2];
      h2.surfaceC = h1.surfaceC;
      h2.heatFlow = h1.heatFlow;
      h2.hc = h1.hc;
      h2.hr = h1.hr;
      h2.balanced = h1.balanced;
      h2.atBranchChange = h1.atBranchChange;
    } else {
      solveSurface(ms[i]);
    }
    const m = ms[i];
    if (!m.balanced) balanced = false;
    total += m.heatFlow;
    if (m.surfaceC > maxT) {
      maxT = m.surfaceC;
      gov = i;
    }
    if (m.surfaceC < minT) minT = m.surfaceC;
  }
  return { models: ms, names, heatFlow: total, governing: gov, maxSurfaceC: maxT, minSurfaceC: minT, balanced };
}

/** Marches the fluid along the run; the single pipe model is re-solved at each local temperature. */
function marchRun(p: Prepared, ev: Evaluation, inletC: number): { outletC: number; heatW: number; balanced: boolean } {
  const run = p.c.run!;
  const m = ev.models[0];
  const seg = run.lengthM / RUN_SEGMENTS;
  const mc = run.massFlowKgPerS * run.specificHeatJPerKgK;
  const air = p.airC;
  const step = (T: number, q: number, Tref: number): number => {
    const d = Tref - air;
    const U = q / d;
    // Local exponential decay towards the air with the segment's own U′ = q′/(T − T_air).
    if (Math.abs(d) > 1e-9 && U > 0 && Number.isFinite(U)) return air + (T - air) * Math.exp((-U * seg) / mc);
    return T - (q * seg) / mc;
  };
  let T = inletC;
  let balanced = true;
  for (let s = 0; s < RUN_SEGMENTS; s++) {
    m.processC = T;
    solveSurface(m);
    balanced &&= m.balanced;
    const Tpred = step(T, m.heatFlow, T);
    const Tmid = 0.5 * (T + Tpred);
    m.processC = Tmid;
    solveSurface(m);
    balanced &&= m.balanced;
    T = step(T, m.heatFlow, Tmid);
  }
  m.processC = inletC;
  solveSurface(m);
  return { outletC: T, heatW: mc * (inletC - T), balanced };
}

/**
 * Hours for standing water to cool from `startC` to 0 °C, or null when it never gets there; NaN when a
 * surface balance along the way did not close.
 */
function freezeHours(p: Prepared, ev: Evaluation, startC: number): number | null {
  if (startC <= 0) return 0;
  if (p.airC >= 0) return null;
  const st = p.c.stagnant!;
  const C =
    WATER_DENSITY_KG_PER_M3 * Math.PI * 0.25 * st.innerDiameterM * st.innerDiameterM * WATER_SPECIFIC_HEAT_J_PER_KGK +
    st.pipeMassKgPerM * (st.pipeSpecificHeatJPerKgK ?? STEEL_SPECIFIC_HEAT_J_PER_KGK);
  const m = ev.models[0];
  const h = startC / FREEZE_INTERVALS;
  let sum = 0;
  // t = ∫₀^{T₀} C/q′(T) dT (quasi-steady), Simpson's rule in the water temperature.
  for (let j = 0; j <= FREEZE_INTERVALS; j++) {
    m.processC = j * h;
    solveSurface(m);
    if (!m.balanced) {
      m.processC = startC;
      solveSurface(m);
      return NaN;
    }
    const q = m.heatFlow;
    if (!(q > 0)) {
      m.processC = startC;
      solveSurface(m);
      return null;
    }
    const w = j === 0 || j === FREEZE_INTERVALS ? 1 : j % 2 === 1 ? 4 : 2;
    sum += w / q;
  }
  m.processC = startC;
  solveSurface(m);
  return (C * (h / 3) * sum) / 3600;
}

function heatLossLimit(p: Prepared, crit: Extract<Criterion, { criterion: 'heatLoss' }>): number {
  const t = p.c.geometry.type;
  return (t === 'pipe' ? crit.maxWPerM : t === 'flat' ? crit.maxWPerM2 : crit.maxW) as number;
}

/**
 * How far an evaluated build-up is inside the criterion (≥ 0 passes), in the criterion's own unit;
 * −∞ when a surface balance of the run or the cooling water did not close.
 */
function criterionMargin(p: Prepared, crit: Criterion, ev: Evaluation): number {
  switch (crit.criterion) {
    case 'surfaceTemperature':
      return crit.maxC - ev.maxSurfaceC;
    case 'heatLoss':
      return heatLossLimit(p, crit) - Math.abs(ev.heatFlow);
    case 'condensation':
      return ev.minSurfaceC - ((p.dewC as number) + crit.marginK);
    case 'temperatureChange': {
      const r = marchRun(p, ev, p.c.processTemperatureC);
      return r.balanced ? crit.maxChangeK - Math.abs(p.c.processTemperatureC - r.outletC) : -Infinity;
    }
    case 'freezeTime': {
      const hrs = freezeHours(p, ev, p.c.processTemperatureC);
      return hrs === null ? Infinity : hrs !== hrs ? -Infinity : hrs - crit.minHours;
    }
  }
}

function describeCriterion(p: Prepared, crit: Criterion): string {
  switch (crit.criterion) {
    case 'surfaceTemperature':
      return `surface temperature at most ${crit.maxC} °C`;
    case 'heatLoss': {
      const t = p.c.geometry.type;
      return `heat flow at most ${heatLossLimit(p, crit)} ${t === 'pipe' ? 'W/m' : t === 'flat' ? 'W/m²' : 'W'}`;
    }
    case 'condensation':
      return `surface at least ${crit.marginK} K above the dew point (${(p.dewC as number).toFixed(1)} °C)`;
    case 'temperatureChange':
      return `temperature change along the run at most ${crit.maxChangeK} K`;
    case 'freezeTime':
      return `at least ${crit.minHours} h before the standing water reaches 0 °C`;
  }
}

function impossibleAdvice(crit: Criterion): string {
  switch (crit.criterion) {
    case 'surfaceTemperature':
      return 'A higher surface emissivity (e.g. a painted or non-metallic finish instead of bright metal), a lower-conductivity material, or a guard/cage instead of insulation may help; a limit at or below the air temperature cannot be met by insulation.';
    case 'heatLoss':
      return 'A lower-conductivity material, a larger maximum thickness, or a less strict limit may help.';
    case 'condensation':
      return 'A lower-conductivity material, a lower surface emissivity, a larger maximum thickness, or a vapour-tight design for a less strict margin may help.';
    case 'temperatureChange':
      return 'A higher flow, heat tracing, a lower-conductivity material or a larger maximum thickness may help.';
    case 'freezeTime':
      return 'Heat tracing, draining, keeping the water flowing, or a larger maximum thickness may help.';
  }
}

/** t* = smallest thickness such that every thickness from t* to maxT meets the criterion. */
function solveThickness(p: Prepared, crit: Criterion, maxT: number, baseThick: number[], coeffs: number[][]): number {
  const last = baseThick.length - 1;
  const thick = baseThick.slice();
  let ev: Evaluation | undefined;
  const g = (t: number): number => {
    thick[last] = t;
    ev = evaluate(p, thick, coeffs, p.c.processTemperatureC);
    // A build-up whose balance does not close is no valid answer.
    return ev.balanced ? criterionMargin(p, crit, ev) : -Infinity;
  };
  const gMax = g(maxT);
  if (!(gMax >= 0)) {
    // A layer that cannot carry the flow, or a balance that does not close, explains more than the target.
    const evMax = ev as Evaluation;
    const index = baseThick.map((_, i) => i);
    for (const m of evMax.models) checkConductivitySpans(m, (i) => index[i]);
    if (gMax === -Infinity) throw balanceError();
    throw new ImpossibleTargetError(
      `No thickness of the outer layer up to ${(maxT * 1000).toFixed(0)} mm gives ${describeCriterion(p, crit)}: ` +
        `at ${(maxT * 1000).toFixed(0)} mm it still misses by ${Math.abs(gMax).toPrecision(3)}. ${impossibleAdvice(crit)}`,
    );
  }
  if (p.c.geometry.type === 'flat') {
    // A slab has no critical thickness: adding to the last layer's resistance moves the balance
    // monotonically (|Q| falls, Ts moves towards the surroundings), so every criterion's margin is
    // monotonic in t and the one crossing below a passing maximum is t*; no scan is needed.
    const g0 = g(0);
    return g0 >= 0 ? 0 : marginCrossing(g, 0, g0, maxT, gMax);
  }
  // Scan downward: below the critical radius a thin layer can be worse than none, so the answer is the
  // top of the highest failing interval, not the first pass met from below. A build-up whose balance does
  // not close counts as failing, so t* never rests on one.
  let pass = maxT;
  let gPass = gMax;
  for (let i = SCAN_POINTS - 1; i >= 0; i--) {
    const t = (maxT * i * i) / (SCAN_POINTS * SCAN_POINTS);
    const gt = g(t);
    if (gt < 0) return marginCrossing(g, t, gt, pass, gPass);
    pass = t;
    gPass = gt;
  }
  return 0;
}

/**
 * The thickness where the margin crosses zero between a failing `fail` (g < 0, possibly −∞) and a passing
 * `pass` (g ≥ 0), to {@link THICKNESS_TOLERANCE_M}; returns the passing end. Regula falsi with the Illinois
 * modification (superlinear), bisecting where g is −∞, each step kept half a tolerance inside the bracket so
 * the bracket itself shrinks to the tolerance.
 */
function marginCrossing(g: (t: number) => number, fail: number, gFail: number, pass: number, gPass: number): number {
  const inset = 0.5 * THICKNESS_TOLERANCE_M;
  let side = 0;
  while (pass - fail > THICKNESS_TOLERANCE_M) {
    let t = gFail > -Infinity ? pass - (gPass * (pass - fail)) / (gPass - gFail) : 0.5 * (pass + fail);
    if (!(t > fail + inset)) t = fail + inset;
    if (!(t < pass - inset)) t = pass - inset;
    const gt = g(t);
    if (gt >= 0) {
      pass = t;
      gPass = gt;
      if (side === 1) gFail *= 0.5;
      side = 1;
    } else {
      fail = t;
      gFail = gt;
      if (side === -1) gPass *= 0.5;
      side = -1;
    }
  }
  return pass;
}

/**
 * Rounds a solved thickness up to a series: one layer (the smallest series value ≥ t*) when it fits within
 * `maxSingle`, otherwise two series layers each ≤ `maxSingle` with the smallest sum ≥ t*, the most nearly
 * equal pair breaking ties; thicker layer inside.
 *
 * @param thicknessM - continuous thickness t* [m]
 * @param seriesM - standard thicknesses [m]
 * @param maxSingleLayerM - largest single layer [m]; Infinity when unlimited
 * @returns layer thicknesses [m], inside out ([] for t* = 0)
 * @remarks Throws ImpossibleTargetError (SERIES_TOO_THIN) when even two of the thickest layers are thinner
 * than t*. Rounding only ever adds thickness, which keeps the build-up inside the range where every
 * thickness meets the criterion.
 * @example
 * roundThicknessToSeries(0.052, [0.025, 0.04, 0.05, 0.06]); // → [0.06]
 * roundThicknessToSeries(0.13, [0.04, 0.05, 0.06, 0.08, 0.1], 0.1); // → [0.08, 0.05]
 */
export function roundThicknessToSeries(thicknessM: number, seriesM: readonly number[], maxSingleLayerM = Infinity): number[] {
  if (thicknessM <= 0) return [];
  const eps = 1e-9;
  const s = seriesM.filter((v) => v <= maxSingleLayerM + eps).sort((a, b) => a - b);
  if (thicknessM <= maxSingleLayerM + eps) {
    for (const v of s) if (v >= thicknessM - eps) return [v];
  }
  let best: [number, number] | null = null;
  for (let i = 0; i < s.length; i++) {
    for (let j = i; j < s.length; j++) {
      const sum = s[i] + s[j];
      if (sum < thicknessM - eps) continue;
      if (
        best === null ||
        sum < best[0] + best[1] - eps ||
        (Math.abs(sum - best[0] - best[1]) <= eps && s[j] - s[i] < best[0] - best[1])
      ) {
        best = [s[j], s[i]];
      }
    }
  }
  if (best === null) {
    throw new ImpossibleTargetError(
      `The solved thickness ${(thicknessM * 1000).toFixed(1)} mm exceeds two of the thickest series layers ` +
        `(${((s[s.length - 1] ?? 0) * 2000).toFixed(0)} mm). Add thicker values to the series or raise maxSingleLayerM.`,
      'round.seriesM',
      'SERIES_TOO_THIN',
    );
  }
  return best;
}

const METHOD_NATURAL = [
  'Natural convection: Churchill & Chu (1975), horizontal cylinder',
  'Natural convection: Churchill & Chu (1975), vertical plate',
  'Natural convection: horizontal plate facing up, L = area/perimeter (McAdams; Lloyd & Moran)',
  'Natural convection: horizontal plate facing down, L = area/perimeter (McAdams; Lloyd & Moran)',
];
const METHOD_FORCED = [
  'Forced convection: Churchill & Bernstein (1977), cylinder in cross-flow',
  'Forced convection: flat plate, average Nusselt number of a mixed laminar–turbulent boundary layer (Re_c = 5·10⁵)',
];

function fmt(x: number): string {
  return x.toExponential(2);
}

/** Range checks at the solved state; warnings never come from inside the solver loops. */
function diagnose(m: SurfaceModel, label: string, verticalCylinder: boolean, warnings: Warning[], method: Set<string>): void {
  const dT = m.surfaceC - m.airC;
  const filmK = 0.5 * (m.surfaceC + m.airC) + KELVIN_OFFSET;
  const air = airProperties(filmK);
  method.add(METHOD_NATURAL[m.naturalKind]);
  if (!air.inRange) {
    warnings.push({
      code: 'AIR_PROPERTIES_OUT_OF_RANGE',
      message: `${label}: film temperature ${(filmK - KELVIN_OFFSET).toFixed(0)} °C is outside the air table (${(AIR_TABLE_MIN_K - KELVIN_OFFSET).toFixed(0)}…${(AIR_TABLE_MAX_K - KELVIN_OFFSET).toFixed(0)} °C); properties were held at the table's end.`,
    });
  }
  if (Math.abs(dT) > 1e-3) {
    const Ra = rayleighNumberIdealGas(dT, m.naturalLengthM, filmK, air.nu, air.Pr);
    let range: readonly [number, number];
    let name: string;
    if (m.naturalKind === NATURAL_HORIZONTAL_CYLINDER) {
      range = RA_RANGE_HORIZONTAL_CYLINDER;
      name = 'Churchill–Chu horizontal cylinder, Ra_D';
    } else if (m.naturalKind === NATURAL_VERTICAL_PLATE) {
      range = RA_RANGE_VERTICAL_PLATE;
      name = 'Churchill–Chu vertical plate, Ra_L';
    } else {
      const plumeAway = (m.naturalKind === NATURAL_FACE_UP) === dT >= 0;
      range = plumeAway ? RA_RANGE_PLATE_UPPER_HOT : RA_RANGE_PLATE_LOWER_HOT;
      name = plumeAway
        ? 'Horizontal plate, hot face up / cold face down (0.54·Ra^¼, 0.15·Ra^⅓), Ra_L'
        : 'Horizontal plate, hot face down / cold face up (0.27·Ra^¼), Ra_L';
    }
    if (Ra < range[0] || Ra > range[1]) {
      warnings.push({
        code: 'CORRELATION_OUT_OF_RANGE',
        message: `${label}: ${name} = ${fmt(Ra)} is outside the published range ${fmt(range[0])}…${fmt(range[1])}; the natural-convection coefficient is extrapolated.`,
      });
    }
    if (verticalCylinder) {
      const Gr = Ra / air.Pr;
      const need = (35 * m.naturalLengthM) / Math.pow(Gr, 0.25);
      if (m.outerDiameterM < need) {
        warnings.push({
          code: 'VERTICAL_CYLINDER_THIN',
          message: `${label}: outer diameter ${(m.outerDiameterM * 1000).toFixed(0)} mm is below 35·H/Gr_H^¼ = ${(need * 1000).toFixed(0)} mm, so the vertical-plate correlation underestimates convection from this slender vertical cylinder.`,
        });
      }
    }
  }
  if (m.atBranchChange) warnings.push(branchChangeWarning(m, label, filmK, air.nu, air.Pr, dT));
  if (m.windMS > 0) {
    method.add(METHOD_FORCED[m.forcedKind]);
    method.add('Combined convection: h = (h_forced³ + h_natural³)^⅓');
    const Re = (m.windMS * m.forcedLengthM) / air.nu;
    if (m.forcedKind === FORCED_CYLINDER && Re * air.Pr < REPR_MIN_CYLINDER_CROSSFLOW) {
      warnings.push({
        code: 'CORRELATION_OUT_OF_RANGE',
        message: `${label}: Churchill–Bernstein Re_D·Pr = ${fmt(Re * air.Pr)} is below its published range (≥ ${REPR_MIN_CYLINDER_CROSSFLOW}).`,
      });
    }
    if (m.forcedKind === FORCED_PLATE && Re > RE_MAX_FLAT_PLATE) {
      warnings.push({
        code: 'CORRELATION_OUT_OF_RANGE',
        message: `${label}: flat-plate Re_L = ${fmt(Re)} is above its published range (≤ ${RE_MAX_FLAT_PLATE.toExponential(0).replace('+', '')}).`,
      });
    }
  }
}

/** Where the surface sits on a step between two published branches of a correlation. */
function branchChangeWarning(m: SurfaceModel, label: string, filmK: number, nu: number, Pr: number, dT: number): Warning {
  const near = (x: number, at: number) => Math.abs(x / at - 1) < 1e-3;
  const Ra = rayleighNumberIdealGas(dT, m.naturalLengthM, filmK, nu, Pr);
  const plumeAway =
    (m.naturalKind === NATURAL_FACE_UP && dT >= 0) || (m.naturalKind === NATURAL_FACE_DOWN && dT < 0);
  let where: string;
  if (plumeAway && near(Ra, RA_BRANCH_PLATE_UPPER_HOT)) {
    where = `Ra_L = ${fmt(Ra)}, where the McAdams branches 0.54·Ra^¼ and 0.15·Ra^⅓ of a horizontal plate meet with a step`;
  } else if (m.windMS > 0 && m.forcedKind === FORCED_PLATE && near((m.windMS * m.forcedLengthM) / nu, RE_CRITICAL_FLAT_PLATE)) {
    where = `Re_L = ${fmt((m.windMS * m.forcedLengthM) / nu)}, where the flat plate's laminar and mixed boundary-layer branches meet with a step`;
  } else {
    where = 'a point where a convection correlation steps between branches';
  }
  return {
    code: 'CORRELATION_BRANCH_CHANGE',
    message: `${label}: the surface sits at ${where}; h_c is taken between the two branches, at the value that closes the energy balance, so it is uncertain by the size of the step.`,
  };
}

/** Lowest emissivity of a real surface that the tested domain covers (polished silver and gold, about 0.02). */
const EMISSIVITY_LOWEST_REAL = 0.02;

function prepare(c: CalcCase): Prepared {
  const a = c.ambient;
  const airC = a.airTemperatureC;
  const radiantC = a.radiantTemperatureC ?? a.airTemperatureC;
  return {
    c,
    airC,
    radiantC,
    windMS: a.windSpeedMS ?? 0,
    dewC: a.relativeHumidityPct === undefined ? undefined : dewPointC(a.airTemperatureC, a.relativeHumidityPct),
    domainLoC: Math.min(c.processTemperatureC, airC, radiantC),
    domainHiC: Math.max(c.processTemperatureC, airC, radiantC),
    brackets: new Map(),
    models: [undefined, undefined, undefined],
  };
}

function balanceError(): EnergyBalanceError {
  return new EnergyBalanceError(
    'The heat conducted through the layers and the heat leaving the surface by convection and radiation do not agree ' +
      'within 1e-6 for this case, so no result is given; please report it with the input.',
  );
}

/**
 * Refuses a layer whose k(T) lies outside the physical range at every temperature of the case (a wrong unit
 * or a lost exponent): no span could make it valid, and the solve would only produce a meaningless number.
 * The exact check over each layer's own span follows the solve.
 */
function checkConductivityPlausible(p: Prepared): void {
  const layers = p.c.layers;
  for (let i = 0; i < layers.length; i++) {
    const solved = p.c.solveFor !== undefined && i === layers.length - 1;
    if (!solved && !(layers[i].thicknessM > 0)) continue;
    const r = polynomialRange(layers[i].conductivity, p.domainLoC, p.domainHiC);
    if (!(r.max >= CONDUCTIVITY_MIN_W_PER_MK && r.min <= CONDUCTIVITY_MAX_W_PER_MK)) {
      const high = !(r.min <= CONDUCTIVITY_MAX_W_PER_MK);
      throw new CalcInputError(
        `layers[${i}].conductivity`,
        `Conductivity k(T) must lie within ${CONDUCTIVITY_MIN_W_PER_MK}…${CONDUCTIVITY_MAX_W_PER_MK} W/(m·K) over the layer's ` +
          `temperature span, but over the case's temperatures ${p.domainLoC.toFixed(1)}…${p.domainHiC.toFixed(1)} °C it ` +
          `is ${high ? `at least ${r.min.toPrecision(3)}` : `at most ${r.max.toPrecision(3)}`} W/(m·K). ` +
          'Check the coefficients, their unit (W/(m·K)) and their temperature unit (°C).',
        'CONDUCTIVITY_OUT_OF_RANGE',
      );
    }
  }
}

/**
 * Analyses one case: heat flow and surface temperature of the build-up, and when `solveFor` is given the
 * thinnest outer-layer thickness t* such that every thickness from t* to `maxThicknessM` meets the
 * criterion, optionally rounded up to a series (every result field then refers to the rounded build-up).
 *
 * @param input - the case (SI, °C); validated here
 * @returns the result with `method` and `warnings`
 * @remarks
 * Validity: process −200…1000 °C, air −40…50 °C, wind 0…20 m/s, emissivity 0.02…1 are the tested domain;
 * outside a correlation's published range a warning is added. Vessel heads are each treated as one surface
 * of their own outer area: on a horizontal vessel a vertical plate of height D_out, on a vertical vessel a
 * horizontal plate (top facing up, bottom facing down) with L = D_out/4; conduction through a head layer
 * uses the geometric mean of its inner and outer areas (exact for hemispheres). The vessel's reported
 * surface temperature, coefficients and interface temperatures are those of its hottest part; criteria
 * check every part. Throws {@link CalcInputError} (with the field path) for bad input and
 * {@link ImpossibleTargetError} when no thickness up to the maximum meets the criterion.
 * @example
 * // The calculation contract's example, whose figures come from an independent model: 114.3 mm pipe at
 * // 250 °C, k = 0.035 + 0.00015·T, ε = 0.1, 30 °C still air, surface ≤ 60 °C, series up to 0.1 m
 * // → t* ≈ 0.052 m, rounded 0.06 m, 98.2 W/m, Ts 56.5 °C, h_c 4.31, h_r 0.72 W/(m²·K).
 *
 * References:
 * 1. ASTM C680-19. 2. ISO 12241:2022. 3. Incropera & DeWitt, 6th ed., §3.3.2, §5.3, §8.3.1.
 */
export function analyse(input: CalcCase): CalcResult {
  const c = validateCase(input);
  const p = prepare(c);
  checkConductivityPlausible(p);
  const g = c.geometry;
  const warnings: Warning[] = [];
  const method = new Set<string>();
  let thick = c.layers.map((l) => l.thicknessM ?? 0);
  let coeffs = c.layers.map((l) => l.conductivity);
  let layerIndex = c.layers.map((_, i) => i);
  let thicknessM: number | undefined;
  let roundedLayersM: number[] | undefined;

  if (c.solveFor) {
    const crit = c.solveFor as Criterion;
    const maxT = c.solveFor.maxThicknessM ?? DEFAULT_MAX_THICKNESS_M;
    thicknessM = solveThickness(p, crit, maxT, thick, coeffs);
    const nFixed = c.layers.length - 1;
    const solvedCoeffs = coeffs[nFixed];
    let solved: number[];
    if (c.round) {
      solved = roundThicknessToSeries(thicknessM, c.round.seriesM, c.round.maxSingleLayerM ?? Infinity);
      roundedLayersM = solved;
    } else {
      solved = thicknessM > 0 ? [thicknessM] : [];
    }
    thick = [...thick.slice(0, nFixed), ...solved];
    coeffs = [...coeffs.slice(0, nFixed), ...solved.map(() => solvedCoeffs)];
    layerIndex = [...layerIndex.slice(0, nFixed), ...solved.map(() => nFixed)];
    method.add(
      c.geometry.type === 'flat'
        ? 'Thickness: smallest t* such that every thickness from t* to the maximum meets the criterion (monotonic for a flat surface: one crossing, found by regula falsi)'
        : 'Thickness: smallest t* such that every thickness from t* to the maximum meets the criterion (downward scan, then regula falsi in the highest failing interval)',
    );
  }
  // Layers of zero thickness carry no resistance and have no faces to report.
  const keep = thick.map((t) => t > 0);
  thick = thick.filter((_, i) => keep[i]);
  coeffs = coeffs.filter((_, i) => keep[i]);
  layerIndex = layerIndex.filter((_, i) => keep[i]);

  const ev = evaluate(p, thick, coeffs, c.processTemperatureC);
  const partFaces = ev.models.map(interfaceTemperatures);
  for (let i = 0; i < ev.models.length; i++) checkConductivitySpans(ev.models[i], (j) => layerIndex[j], partFaces[i]);
  // Every result checks its own energy balance before any number leaves.
  for (let i = 0; i < ev.models.length; i++) {
    if (!(energyBalanceMismatch(ev.models[i], partFaces[i].outerFacesC) <= 1)) throw balanceError();
  }

  method.add('Radiation: Stefan–Boltzmann law, full T⁴ exchange with enclosing surroundings (σ CODATA 2018)');
  method.add(AIR_PROPERTIES_SOURCE);
  if (thick.length > 0) method.add('Conduction: Kirchhoff integral of k(T) over each layer (ASTM C680, ISO 12241)');
  method.add("Surface balance: Brent's method on the surface temperature");

  const isVessel = g.type === 'vessel';
  for (let i = 0; i < ev.models.length; i++) {
    const vertCyl = (g.type === 'pipe' && g.orientation === 'vertical') || (isVessel && i === 0 && g.orientation === 'vertical');
    diagnose(ev.models[i], isVessel ? ev.names[i] : 'Surface', vertCyl, warnings, method);
  }

  const gov = ev.models[ev.governing];
  const faces = partFaces[ev.governing];
  // Service temperatures: the hottest and coldest face of each layer over all parts; the data range of k(T)
  // against the layer's mean temperature, as material tables give k at mean temperature.
  for (let li = 0; li < thick.length; li++) {
    const layer = c.layers[layerIndex[li]];
    const n = layerIndex[li] + 1;
    let hot = -Infinity;
    let cold = Infinity;
    let meanLo = Infinity;
    let meanHi = -Infinity;
    for (const f of partFaces) {
      const inner = li === 0 ? f.innerC : f.outerFacesC[li - 1];
      const outer = f.outerFacesC[li];
      const mean = (inner + outer) / 2;
      hot = Math.max(hot, inner, outer);
      cold = Math.min(cold, inner, outer);
      meanLo = Math.min(meanLo, mean);
      meanHi = Math.max(meanHi, mean);
    }
    if (layer.maxServiceTemperatureC !== undefined && hot > layer.maxServiceTemperatureC) {
      warnings.push({
        code: 'MAX_SERVICE_TEMPERATURE_EXCEEDED',
        message: `Layer ${n} reaches ${hot.toFixed(1)} °C, above its maximum service temperature of ${layer.maxServiceTemperatureC} °C.`,
      });
    }
    if (layer.minServiceTemperatureC !== undefined && cold < layer.minServiceTemperatureC) {
      warnings.push({
        code: 'MIN_SERVICE_TEMPERATURE_EXCEEDED',
        message: `Layer ${n} reaches ${cold.toFixed(1)} °C, below its minimum service temperature of ${layer.minServiceTemperatureC} °C.`,
      });
    }
    const range = layer.conductivityDataRangeC;
    const slack = 0.5; // K: tables state whole degrees
    const outside = !range ? undefined : meanLo < range[0] - slack ? meanLo : meanHi > range[1] + slack ? meanHi : undefined;
    if (range && outside !== undefined) {
      warnings.push({
        code: 'CONDUCTIVITY_EXTRAPOLATED',
        message: `Layer ${n} has a mean temperature of ${outside.toFixed(1)} °C, outside ${range[0].toFixed(1)}…${range[1].toFixed(1)} °C where its conductivity rests on data; k(T) is extrapolated there, so check the result against the product's data.`,
      });
    }
  }

  if (c.surfaceEmissivity < EMISSIVITY_LOWEST_REAL) {
    warnings.push({
      code: 'EMISSIVITY_BELOW_REAL_SURFACES',
      message:
        c.surfaceEmissivity === 0
          ? 'Surface emissivity 0 leaves radiation out (a convection-only check). Every real surface radiates — polished metal about 0.02–0.1, painted or non-metallic finishes 0.8–0.95 — so a real hot surface loses more heat and runs cooler than this result.'
          : `Surface emissivity ${c.surfaceEmissivity} is below that of any real finish (polished silver or gold, about 0.02); radiation is all but left out, so a real hot surface loses more heat and runs cooler than this result.`,
    });
  }
  const amb = c.ambient;
  if (p.dewC !== undefined) {
    method.add('Dew point: Magnus formula, Alduchov & Eskridge (1996) constants');
    if (amb.airTemperatureC < DEW_POINT_VALID_RANGE_C[0] || amb.airTemperatureC > DEW_POINT_VALID_RANGE_C[1]) {
      warnings.push({
        code: 'DEW_POINT_OUT_OF_RANGE',
        message: `Air at ${amb.airTemperatureC} °C is outside the Magnus (Alduchov & Eskridge) range −40…50 °C; the dew point is extrapolated.`,
      });
    }
    if (ev.minSurfaceC < p.dewC) {
      warnings.push({
        code: 'SURFACE_BELOW_DEW_POINT',
        message: `The surface (${ev.minSurfaceC.toFixed(1)} °C) is below the dew point (${p.dewC.toFixed(1)} °C): moisture will condense on it.`,
      });
    }
  }
  if (ev.minSurfaceC < p.airC - 1e-6 && amb.radiantTemperatureC === undefined && p.windMS > 0) {
    warnings.push({
      code: 'COLD_SURFACE_SKY_RADIATION',
      message:
        'This cold surface exchanges radiation with surroundings taken at the air temperature. Outdoors a clear night sky can be 10–20 K colder than the air, which cools the surface further (more condensation risk); set ambient.radiantTemperatureC to check.',
    });
  }

  const totalThicknessM = thick.reduce((s, t) => s + t, 0);
  let run: { outletC: number; heatW: number } | undefined;
  if (c.run) {
    method.add('Temperature change: segment marching with local exponential decay (20 segments)');
    const r = marchRun(p, ev, c.processTemperatureC);
    if (!r.balanced) throw balanceError();
    run = r;
  }
  let hoursToZeroC: number | null | undefined;
  if (c.stagnant) {
    method.add('Freezing time: quasi-steady lumped cooling of water and pipe, latent heat ignored');
    hoursToZeroC = freezeHours(p, ev, c.processTemperatureC);
    if (hoursToZeroC !== null && hoursToZeroC !== hoursToZeroC) throw balanceError();
    if (hoursToZeroC === null) {
      warnings.push({
        code: 'NO_FREEZING',
        message:
          p.airC >= 0
            ? `The air (${p.airC} °C) is not below 0 °C, so standing water does not freeze.`
            : 'The surroundings keep the standing water above 0 °C, so it does not freeze.',
      });
    }
  }
  const burn = c.contact ? burnCheck(ev.maxSurfaceC, c.contact) : undefined;
  if (burn) method.add(`Contact burn: ${burn.source}`);
  if (c.solveFor && roundedLayersM !== undefined) {
    const margin = criterionMargin(p, c.solveFor as Criterion, ev);
    if (margin < -1e-6) {
      warnings.push({
        code: 'ROUNDED_BUILD_UP_FAILS',
        message: `The rounded build-up (${(totalThicknessM * 1000).toFixed(0)} mm) lies beyond the maximum thickness searched and misses the target by ${Math.abs(margin).toPrecision(3)}.`,
      });
    }
  }

  // Keys in the contract's order (readable JSON for people and diffs), absent ones left out.
  const result = {} as CalcResult;
  if (g.type === 'pipe') result.heatLossWPerM = ev.heatFlow;
  else if (g.type === 'flat') result.heatFluxWPerM2 = ev.heatFlow;
  else result.heatLossW = ev.heatFlow;
  result.surfaceTemperatureC = ev.maxSurfaceC;
  result.interfaceTemperaturesC = faces.outerFacesC;
  result.convectionCoefficientWPerM2K = gov.hc;
  result.radiationCoefficientWPerM2K = gov.hr;
  if (thicknessM !== undefined) result.thicknessM = thicknessM;
  if (roundedLayersM !== undefined) result.roundedLayersM = roundedLayersM;
  result.totalThicknessM = totalThicknessM;
  if (p.dewC !== undefined) result.dewPointC = p.dewC;
  if (run) {
    result.outletTemperatureC = run.outletC;
    result.runHeatLossW = run.heatW;
  }
  if (hoursToZeroC !== undefined) result.hoursToZeroC = hoursToZeroC;
  if (burn) result.burn = burn;
  if (isVessel) {
    result.parts = ev.models.map((m, i) => ({
      name: ev.names[i],
      areaM2: m.area,
      heatLossW: m.heatFlow,
      surfaceTemperatureC: m.surfaceC,
    }));
  }
  result.method = [...method];
  result.warnings = warnings;
  return result;
}

