/**
 * Coupled conduction–convection–radiation balance of one insulated surface (a pipe, a wall, a vessel shell
 * or head), solved for its outer surface temperature.
 *
 * The surface temperature Ts is found with Brent's method on the residual
 *   r(Ts) = T_inner(Ts) − T_process,
 * where the outward heat flow Q(Ts) = A·[h_c(Ts)·(Ts − T_air) + ε·σ·(Ts⁴ − T_rad⁴)] is marched inward through
 * every layer (Kirchhoff drop ΔK = Q·geometry factor), the pipe wall and the inside film.
 *
 * Monotonicity (why the bracket is safe): Q(Ts) rises with Ts because h_c·ΔT grows with ΔT for every
 * natural- and forced-convection correlation used and ε·σ·Ts⁴ rises; T_inner rises with both Ts and Q
 * because each layer's K(T) is increasing wherever k > 0. So r(Ts) is increasing. At
 * Ts = min(T_process, T_air, T_rad) Q ≤ 0 gives r ≤ 0, at the max Q ≥ 0 gives r ≥ 0: the bracket
 * [min, max] always holds the single root. Two things keep r(Ts) a function Brent can trust: the Kirchhoff
 * inverse of each layer is bracketed inside the interval where its k > 0 (ends at the real roots of k(T)),
 * and beyond the case's temperature range K is continued linearly, so r stays finite and increasing; and
 * where a correlation steps between published branches (r jumps), the balance is closed on the step itself.
 * Each solve records whether its closure was reached (`balanced`); results are checked again from their
 * reported faces ({@link energyBalanceMismatch}).
 *
 * References:
 * 1. R. P. Brent, *Algorithms for Minimization without Derivatives*, Prentice-Hall, 1973, ch. 4 (zero).
 * 2. ASTM C680-19, §7–8 (iterative surface balance for insulated systems).
 */

import { loadAir } from './air-properties';
import {
  KirchhoffBracket,
  assertConductivityInRange,
  assertConductivityPositive,
  conductivityAt,
  conductivityIntegral,
  innerTemperatureFromKirchhoffDrop,
} from './conduction';
import {
  combinedConvectionCoefficient,
  nusseltCylinderCrossFlowChurchillBernstein,
  nusseltFlatPlateMixedBoundaryLayer,
} from './forced-convection';
import {
  nusseltHorizontalCylinderChurchillChu,
  nusseltHorizontalPlateLowerHotMcAdams,
  nusseltHorizontalPlateUpperHotMcAdams,
  nusseltVerticalPlateChurchillChu,
  rayleighNumberIdealGas,
} from './natural-convection';
import { KELVIN_OFFSET, STEFAN_BOLTZMANN, radiationCoefficient, radiativeHeatFlux } from './radiation';

/** Natural convection: horizontal cylinder (Churchill–Chu). */
export const NATURAL_HORIZONTAL_CYLINDER = 0;
/** Natural convection: vertical plate / thick vertical cylinder (Churchill–Chu). */
export const NATURAL_VERTICAL_PLATE = 1;
/** Natural convection: horizontal plate whose exposed face looks up. */
export const NATURAL_FACE_UP = 2;
/** Natural convection: horizontal plate whose exposed face looks down. */
export const NATURAL_FACE_DOWN = 3;
/** Wind across a cylinder (Churchill–Bernstein). */
export const FORCED_CYLINDER = 0;
/** Wind along a flat surface (mixed boundary layer). */
export const FORCED_PLATE = 1;

/**
 * One surface and its build-up, with the results of the last solve. Mutable on purpose: the thickness
 * search and the run march re-solve the same model thousands of times.
 * @internal
 */
export type SurfaceModel = {
  /** Layer polynomials, inside out. */
  coeffs: number[][];
  /** Per layer: the roots of k(T) over the case's temperature domain, which bound the Kirchhoff inverse. */
  brackets: KirchhoffBracket[];
  /** Per layer: K(T_in) − K(T_out) = Q·factor [m⁻¹ basis of Q]. */
  factor: Float64Array;
  /** Film and pipe-wall resistance in series inside the first layer: ΔT = Q·seriesR [K per unit Q]. */
  seriesR: number;
  /** Outer surface area per unit of Q's basis [m² per m, per m², or m²]. */
  area: number;
  naturalKind: number;
  /** Characteristic length of the natural-convection correlation [m]. */
  naturalLengthM: number;
  forcedKind: number;
  /** Characteristic length of the forced-convection correlation [m]. */
  forcedLengthM: number;
  windMS: number;
  emissivity: number;
  airC: number;
  radiantC: number;
  processC: number;
  /** Outer diameter for cylinders [m] (0 for plates), for the thin-vertical-cylinder check. */
  outerDiameterM: number;
  // Results of the last `solveSurface`.
  surfaceC: number;
  /** Heat flow [W per basis], positive outward. */
  heatFlow: number;
  hc: number;
  hr: number;
  /**
   * True when the last solve closed its balance: the inward march from the surface ends at the process
   * temperature within the closure tolerance (see `solveSurface`).
   */
  balanced: boolean;
  /**
   * True when the surface sits on a step of a convection correlation (a published branch change): h_c is
   * then the value between the two branches that closes the balance.
   */
  atBranchChange: boolean;
  /** Surface temperature to start the next solve from (the last solve's answer), or NaN [°C]. */
  guessC: number;
  /** dr/dTs near the last answer, for the first step from `guessC` (0 when unknown). */
  slope: number;
};

const AIR = new Float64Array(3);

/**
 * Convection coefficient at surface temperature `surfaceC`, natural and (with wind) forced combined.
 * @internal
 */
export function convectionCoefficientOf(m: SurfaceModel, surfaceC: number): number {
  const dT = surfaceC - m.airC;
  const filmK = 0.5 * (surfaceC + m.airC) + KELVIN_OFFSET;
  loadAir(filmK, AIR);
  const k = AIR[0];
  const nu = AIR[1];
  const Pr = AIR[2];
  const L = m.naturalLengthM;
  const Ra = rayleighNumberIdealGas(dT, L, filmK, nu, Pr);
  let Nu: number;
  switch (m.naturalKind) {
    case NATURAL_HORIZONTAL_CYLINDER:
      Nu = nusseltHorizontalCylinderChurchillChu(Ra, Pr);
      break;
    case NATURAL_VERTICAL_PLATE:
      Nu = nusseltVerticalPlateChurchillChu(Ra, Pr);
      break;
    case NATURAL_FACE_UP:
      // A hot face up and a cold face down both drive a plume away from the plate.
      Nu = dT >= 0 ? nusseltHorizontalPlateUpperHotMcAdams(Ra) : nusseltHorizontalPlateLowerHotMcAdams(Ra);
      break;
    default:
      Nu = dT >= 0 ? nusseltHorizontalPlateLowerHotMcAdams(Ra) : nusseltHorizontalPlateUpperHotMcAdams(Ra);
  }
  let h = (Nu * k) / L;
  if (m.windMS > 0) {
    const Lf = m.forcedLengthM;
    const Re = (m.windMS * Lf) / nu;
    const Nuf =
      m.forcedKind === FORCED_CYLINDER
        ? nusseltCylinderCrossFlowChurchillBernstein(Re, Pr)
        : nusseltFlatPlateMixedBoundaryLayer(Re, Pr);
    h = combinedConvectionCoefficient((Nuf * k) / Lf, h);
  }
  return h;
}

let lastHeatFlow = 0;
let lastHc = 0;
/** Temperature drop across the innermost resistance in the last residual [K], for the closure tolerance. */
let lastInnerDrop = 0;

/** Outward heat flow at surface temperature `surfaceC` [W per basis]; sets `lastHc`. */
function surfaceHeatFlow(m: SurfaceModel, surfaceC: number): number {
  const hc = convectionCoefficientOf(m, surfaceC);
  lastHc = hc;
  const q =
    hc * (surfaceC - m.airC) + radiativeHeatFlux(m.emissivity, surfaceC + KELVIN_OFFSET, m.radiantC + KELVIN_OFFSET);
  return q * m.area;
}

/**
 * Temperature reached at the process side by marching heat flow Q inward from the surface at `surfaceC`,
 * minus the process temperature (K). ±1e30 when a layer cannot carry Q (k reaches zero first): the true
 * inner temperature then lies beyond in Q's direction. Sets `lastInnerDrop`.
 */
function closureOf(m: SurfaceModel, surfaceC: number, Q: number): number {
  let T = surfaceC;
  let drop = NaN;
  const factor = m.factor;
  for (let i = factor.length - 1; i >= 0; i--) {
    const f = factor[i];
    if (f === 0) continue;
    const Tn = innerTemperatureFromKirchhoffDrop(m.coeffs[i], T, Q * f, m.brackets[i]);
    if (Tn !== Tn) return Q > 0 ? 1e30 : -1e30;
    drop = Tn - T;
    T = Tn;
  }
  // The check recomputes the innermost layer with the process temperature, so the closure counts against
  // that layer's drop; without layers, against the film and wall.
  if (m.seriesR > 0) {
    const d = Q * m.seriesR;
    if (drop !== drop) drop = d;
    T += d;
  }
  lastInnerDrop = drop === drop ? drop : 0;
  return T - m.processC;
}

function residual(m: SurfaceModel, surfaceC: number): number {
  const Q = surfaceHeatFlow(m, surfaceC);
  lastHeatFlow = Q;
  return closureOf(m, surfaceC, Q);
}

/**
 * Closure the solve aims for [K]: a small part of the drop across the innermost resistance, whose
 * conduction the energy-balance check recomputes with the process temperature (so the mismatch there is
 * closure/drop, relative), with a floor at the rounding of temperatures.
 */
function closureTolerance(innerDropK: number): number {
  return 1e-9 * Math.abs(innerDropK) + 1e-11;
}

/** Closure accepted as balanced [K]: well inside the energy-balance check's 1e-6 relative. */
function closureAllowed(innerDropK: number): number {
  return 1e-7 * Math.abs(innerDropK) + 1e-10;
}

/**
 * Solves the surface balance of `m` in place and stores Ts, Q, h_c and h_r on the model.
 *
 * Brent's method on Ts inside [min, max] of the process, air and radiant temperatures (see the module
 * header for why r(Ts) is increasing there). The bracket starts from the model's last answer (`guessC`,
 * stepped by its last slope) or from the balance linearised about the mean temperature, growing until r
 * changes sign, and falls back to [min, max]; the root is unique, so the start changes only the work,
 * never the answer beyond the closure tolerance. It stops when the closure — the process-side
 * temperature reached by marching the surface's heat flow inward, minus the process temperature — is a
 * billionth of the drop across the innermost layer, or when the bracket has shrunk to rounding. A bracket
 * that shrinks onto a step of r(Ts) without closing means the surface sits on a step of a convection
 * correlation (the McAdams branch change at Ra = 10⁷, the flat plate's transition at Re = 5·10⁵): the
 * balance is then closed at that surface temperature with the heat flow found by conduction (bracketed
 * between the flows on either side of the step), and `atBranchChange` is set. `balanced` says whether the
 * closure was reached.
 *
 * @param m - the surface model; `surfaceC`, `heatFlow`, `hc`, `hr`, `balanced`, `atBranchChange`, `guessC` and
 *   `slope` are overwritten
 * @returns nothing
 * @internal
 */
export function solveSurface(m: SurfaceModel): void {
  m.atBranchChange = false;
  const lo = Math.min(m.processC, m.airC, m.radiantC);
  const hi = Math.max(m.processC, m.airC, m.radiantC);
  // Brent's three points; each carries its heat flow and h_c, so the answer needs no extra evaluation.
  let a = POINT_A;
  let b = POINT_B;
  let c = POINT_C;
  let g = m.guessC;
  if (!(g >= lo && g <= hi)) g = linearisedGuess(m, lo, hi);
  if (g > lo && g < hi) {
    // Warm start: from the last answer (a neighbouring thickness or process temperature), step by the last
    // slope, then by growing secant steps, until r changes sign; the root is unique, so any bracket holds it.
    if (evaluateAt(m, g, a)) return finishAt(m, a, m.slope);
    let step = -a.f / (m.slope > 0 ? m.slope : 1);
    for (let k = 0; ; k++) {
      let x = a.x + 1.05 * step;
      if (x <= lo || x >= hi || k === 8) x = a.f < 0 ? hi : lo;
      if (evaluateAt(m, x, b)) return finishAt(m, b, slopeOf(a, b, m.slope));
      if (b.f > 0 !== a.f > 0 || x === lo || x === hi) break;
      const secant = (-b.f * (b.x - a.x)) / (b.f - a.f);
      const t = a;
      a = b;
      b = t;
      step = 4 * Math.abs(step) > Math.abs(secant) ? 2 * secant : 4 * step;
    }
  } else {
    // Cold, or from an end (a bare surface starts at the process temperature): the two ends bracket.
    const first = g === hi ? hi : lo;
    if (evaluateAt(m, first, a) || hi - lo <= 0) return finishAt(m, a, m.slope);
    if (evaluateAt(m, first === lo ? hi : lo, b)) return finishAt(m, b, m.slope);
  }
  // Brent's zero finder (inverse quadratic interpolation, secant, bisection), after Brent (1973) ch. 4.
  copyPoint(c, a);
  let d = b.x - a.x;
  let e = d;
  for (let iter = 0; iter < 200; iter++) {
    if ((b.f > 0 && c.f > 0) || (b.f < 0 && c.f < 0)) {
      copyPoint(c, a);
      d = b.x - a.x;
      e = d;
    }
    if (Math.abs(c.f) < Math.abs(b.f)) {
      // a ← b, b ← c, c ← b.
      copyPoint(a, b);
      const t = b;
      b = c;
      c = t;
    }
    if (Math.abs(b.f) <= closureTolerance(b.drop)) break;
    // Rounding of the surface temperature (a closure of 1e-9 of the drop can need Ts to the last digits
    // when the insulation's resistance is many times the surface's).
    const tol = 2 * Number.EPSILON * (Math.abs(b.x) > 1 ? Math.abs(b.x) : 1);
    const xm = 0.5 * (c.x - b.x);
    if (Math.abs(xm) <= tol) {
      // The bracket is at rounding without the closure: a step of the heat flow between b and c means a
      // step of a correlation; otherwise this is as close as rounding allows.
      if (Math.abs(c.q - b.q) > 1e-9 * Math.abs(b.q)) {
        closeAcrossStep(m, b.x, b.q, c.q);
        if (m.atBranchChange) return;
      }
      break;
    }
    if (Math.abs(e) >= tol && Math.abs(a.f) > Math.abs(b.f)) {
      const s = b.f / a.f;
      let p: number;
      let q: number;
      if (a.x === c.x) {
        p = 2 * xm * s;
        q = 1 - s;
      } else {
        const qq = a.f / c.f;
        const r = b.f / c.f;
        p = s * (2 * xm * qq * (qq - r) - (b.x - a.x) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      const min1 = 3 * xm * q - Math.abs(tol * q);
      const min2 = Math.abs(e * q);
      if (2 * p < (min1 < min2 ? min1 : min2)) {
        e = d;
        d = p / q;
      } else {
        d = xm;
        e = d;
      }
    } else {
      d = xm;
      e = d;
    }
    // a ← b, then b moves to its next iterate.
    const t = a;
    a = b;
    b = t;
    evaluateAt(m, a.x + (Math.abs(d) > tol ? d : xm > 0 ? tol : -tol), b);
  }
  finishAt(m, b, slopeOf(a, b, slopeOf(c, b, m.slope)));
}

/** One iterate of the surface solve: Ts, the residual there, and what it produced. */
type Iterate = { x: number; f: number; q: number; h: number; drop: number };

const POINT_A: Iterate = { x: 0, f: 0, q: 0, h: 0, drop: 0 };
const POINT_B: Iterate = { x: 0, f: 0, q: 0, h: 0, drop: 0 };
const POINT_C: Iterate = { x: 0, f: 0, q: 0, h: 0, drop: 0 };

/** Evaluates the residual at `x` into `p`; true when the closure is reached there. */
function evaluateAt(m: SurfaceModel, x: number, p: Iterate): boolean {
  p.x = x;
  p.f = residual(m, x);
  p.q = lastHeatFlow;
  p.h = lastHc;
  p.drop = lastInnerDrop;
  return Math.abs(p.f) <= closureTolerance(p.drop);
}

function copyPoint(to: Iterate, from: Iterate): void {
  to.x = from.x;
  to.f = from.f;
  to.q = from.q;
  to.h = from.h;
  to.drop = from.drop;
}

function finishAt(m: SurfaceModel, p: Iterate, slope: number): void {
  finish(m, p.x, p.q, p.h, p.f, p.drop, slope);
}

/**
 * First surface temperature of a cold solve, from the balance linearised about the mean of the process and
 * air temperatures: conduction with each k there, convection from the correlation there and radiation
 * 4εσT³; sets `m.slope` to that balance's dr/dTs = 1 + R·h·A. NaN when k is not positive there.
 */
function linearisedGuess(m: SurfaceModel, lo: number, hi: number): number {
  const mid = 0.5 * (m.processC + m.airC);
  let R = m.seriesR;
  for (let i = 0; i < m.factor.length; i++) {
    const f = m.factor[i];
    if (f === 0) continue;
    const k = conductivityAt(m.coeffs[i], mid);
    if (!(k > 0)) return NaN;
    R += f / k;
  }
  if (R === 0) return m.processC;
  const hc = convectionCoefficientOf(m, mid);
  const TrK = m.radiantC + KELVIN_OFFSET;
  const hr = 4 * m.emissivity * STEFAN_BOLTZMANN * TrK * TrK * TrK;
  const h = hc + hr;
  const surroundingsC = h > 0 ? (hc * m.airC + hr * m.radiantC) / h : m.airC;
  const RhA = R * h * m.area;
  m.slope = 1 + RhA;
  const Ts = (m.processC + RhA * surroundingsC) / (1 + RhA);
  return Ts > lo && Ts < hi ? Ts : NaN;
}

/** Secant slope of r between two iterates, or `fallback` when it is not a usable positive number. */
function slopeOf(p1: Iterate, p2: Iterate, fallback: number): number {
  const s = (p2.f - p1.f) / (p2.x - p1.x);
  return s > 0 && s < 1e20 ? s : fallback;
}

function finish(
  m: SurfaceModel,
  surfaceC: number,
  Q: number,
  hc: number,
  closure: number,
  innerDropK: number,
  slope: number,
): void {
  m.guessC = surfaceC;
  m.slope = slope;
  m.surfaceC = surfaceC;
  m.heatFlow = Q;
  m.hc = hc;
  m.hr = radiationCoefficient(m.emissivity, surfaceC + KELVIN_OFFSET, m.radiantC + KELVIN_OFFSET);
  m.balanced = Math.abs(closure) <= closureAllowed(innerDropK);
}

/**
 * The balance at a step of h_c(Ts): at Ts the convection law takes any value between its two sides, so the
 * heat flow is the one conduction carries from the process to Ts, found between the flows on either side
 * (closure(Q) at fixed Ts is increasing in Q). Sets `atBranchChange` only when that closes the balance.
 */
function closeAcrossStep(m: SurfaceModel, surfaceC: number, q1: number, q2: number): void {
  let lo = Math.min(q1, q2);
  let hi = Math.max(q1, q2);
  let flo = closureOf(m, surfaceC, lo);
  const fhi = closureOf(m, surfaceC, hi);
  if (!(flo < 0 && fhi > 0)) return;
  let Q = lo;
  let f = flo;
  let tol = closureTolerance(lastInnerDrop);
  // Bisection with secant steps (Illinois would do as well; this runs only on the rare step).
  let fh = fhi;
  for (let it = 0; it < 200; it++) {
    Q = hi - (fh * (hi - lo)) / (fh - flo);
    if (!(Q > lo && Q < hi)) Q = 0.5 * (lo + hi);
    f = closureOf(m, surfaceC, Q);
    tol = closureTolerance(lastInnerDrop);
    if (Math.abs(f) <= tol || hi - lo <= 4 * Number.EPSILON * Math.abs(hi)) break;
    if (f < 0) {
      lo = Q;
      flo = f;
      fh *= 0.5;
    } else {
      hi = Q;
      fh = f;
      flo *= 0.5;
    }
  }
  if (!(Math.abs(f) <= closureAllowed(lastInnerDrop))) return;
  const dT = surfaceC - m.airC;
  if (!(Math.abs(dT) > 0)) return;
  const qRad = radiativeHeatFlux(m.emissivity, surfaceC + KELVIN_OFFSET, m.radiantC + KELVIN_OFFSET);
  m.guessC = surfaceC;
  m.surfaceC = surfaceC;
  m.heatFlow = Q;
  m.hc = (Q / m.area - qRad) / dT;
  m.hr = radiationCoefficient(m.emissivity, surfaceC + KELVIN_OFFSET, m.radiantC + KELVIN_OFFSET);
  m.balanced = true;
  m.atBranchChange = true;
}

/**
 * Outer-face temperatures of each layer after a solve, inside out (the last is the surface), plus the
 * temperature at the inner face of the first layer as `innerC`.
 *
 * @param m - a solved model
 * @returns outer-face temperatures [°C] and the first layer's inner-face temperature [°C]
 * @internal
 */
export function interfaceTemperatures(m: SurfaceModel): { outerFacesC: number[]; innerC: number } {
  const n = m.factor.length;
  const out = new Array<number>(n);
  let T = m.surfaceC;
  for (let i = n - 1; i >= 0; i--) {
    out[i] = T;
    if (m.factor[i] !== 0) T = innerTemperatureFromKirchhoffDrop(m.coeffs[i], T, m.heatFlow * m.factor[i], m.brackets[i]);
  }
  return { outerFacesC: out, innerC: T };
}

/**
 * Checks k over every layer's solved span: positive (CONDUCTIVITY_NOT_POSITIVE) and within the physical
 * range (CONDUCTIVITY_OUT_OF_RANGE); throws CalcInputError naming `layers[i].conductivity`.
 * @internal
 */
export function checkConductivitySpans(
  m: SurfaceModel,
  layerIndex: (i: number) => number,
  faces: { outerFacesC: number[]; innerC: number } = interfaceTemperatures(m),
): void {
  const { outerFacesC, innerC } = faces;
  const closure = innerC + m.heatFlow * m.seriesR - m.processC;
  if (!(Math.abs(closure) < 1e-4 * (1 + Math.abs(m.processC - m.surfaceC)))) {
    // The balance only closed against a layer that cannot carry the flow: some k(T) ≤ 0 between the process
    // and the surface. Report the first such layer over that whole span.
    for (let i = 0; i < outerFacesC.length; i++) {
      if (m.factor[i] !== 0) {
        assertConductivityPositive(m.coeffs[i], m.processC, m.surfaceC, `layers[${layerIndex(i)}].conductivity`);
      }
    }
  }
  let Tin = innerC;
  for (let i = 0; i < outerFacesC.length; i++) {
    if (m.factor[i] !== 0) {
      assertConductivityInRange(m.coeffs[i], Tin, outerFacesC[i], `layers[${layerIndex(i)}].conductivity`);
    }
    Tin = outerFacesC[i];
  }
}

/** Relative tolerance of the energy-balance check. */
export const ENERGY_BALANCE_TOLERANCE = 1e-6;
/** Temperatures are known to about this much [K]; a layer's check allows its conductance times it. */
const BALANCE_TEMPERATURE_FLOOR_K = 1e-9;

/**
 * The energy balance of a solved surface, recomputed from its reported state: the heat flow conducted
 * through each layer, from the Kirchhoff integral between its faces (the first layer's inner face being the
 * process temperature less the drop across the film and pipe wall at the surface's heat flow), against the
 * surface's convection h_c·(Ts − T_air) plus radiation ε·σ·(Ts⁴ − T_rad⁴).
 *
 * @param m - a solved model
 * @param outerFacesC - its reported outer-face temperatures, inside out [°C]
 * @returns the worst mismatch over the layers as a multiple of the allowed one (≤ 1 passes): the allowed
 *   mismatch of a layer is {@link ENERGY_BALANCE_TOLERANCE}·|Q| plus its conductance times 1e-9 K (the
 *   rounding of the temperatures themselves); NaN when any figure is not finite
 * @remarks A bare surface without film or wall has no conduction to check; its surface must then sit at
 * the process temperature.
 * @internal
 */
export function energyBalanceMismatch(m: SurfaceModel, outerFacesC: readonly number[]): number {
  const Ts = m.surfaceC;
  const qRad = radiativeHeatFlux(m.emissivity, Ts + KELVIN_OFFSET, m.radiantC + KELVIN_OFFSET);
  const Q = m.area * (m.hc * (Ts - m.airC) + qRad);
  let worst = 0;
  let Tin = m.processC - Q * m.seriesR;
  let anyLayer = false;
  for (let i = 0; i < m.factor.length; i++) {
    const f = m.factor[i];
    const Tout = outerFacesC[i];
    if (f === 0) continue;
    anyLayer = true;
    const c = m.coeffs[i];
    // |Q_i − Q| ≤ tol·|Q| + (k/f)·floor, multiplied through by f so that a vanishing layer stays finite.
    const dK = conductivityIntegral(c, Tin) - conductivityIntegral(c, Tout);
    const kMax = Math.max(Math.abs(conductivityAt(c, Tin)), Math.abs(conductivityAt(c, Tout)));
    const r = Math.abs(dK - Q * f) / (ENERGY_BALANCE_TOLERANCE * Math.abs(Q) * f + kMax * BALANCE_TEMPERATURE_FLOOR_K);
    if (r !== r) return NaN;
    if (r > worst) worst = r;
    Tin = Tout;
  }
  if (!anyLayer) {
    const dT = Math.abs(m.processC - Ts - Q * m.seriesR);
    const allowed =
      m.seriesR > 0
        ? ENERGY_BALANCE_TOLERANCE * Math.abs(Q) * m.seriesR + BALANCE_TEMPERATURE_FLOOR_K
        : BALANCE_TEMPERATURE_FLOOR_K;
    worst = dT / allowed;
  }
  return worst;
}
