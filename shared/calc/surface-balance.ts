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
 * [min, max] always holds the single root.
 *
 * References:
 * 1. R. P. Brent, *Algorithms for Minimization without Derivatives*, Prentice-Hall, 1973, ch. 4 (zero).
 * 2. ASTM C680-19, §7–8 (iterative surface balance for insulated systems).
 */

import { loadAir } from './air-properties';
import { assertConductivityPositive, innerTemperatureFromKirchhoffDrop } from './conduction';
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
import { KELVIN_OFFSET, radiationCoefficient, radiativeHeatFlux } from './radiation';

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

function residual(m: SurfaceModel, surfaceC: number): number {
  const hc = convectionCoefficientOf(m, surfaceC);
  const q =
    hc * (surfaceC - m.airC) + radiativeHeatFlux(m.emissivity, surfaceC + KELVIN_OFFSET, m.radiantC + KELVIN_OFFSET);
  const Q = q * m.area;
  lastHeatFlow = Q;
  lastHc = hc;
  let T = surfaceC;
  const factor = m.factor;
  for (let i = factor.length - 1; i >= 0; i--) {
    const f = factor[i];
    if (f === 0) continue;
    T = innerTemperatureFromKirchhoffDrop(m.coeffs[i], T, Q * f);
    // No temperature with k > 0 carries this flow: the true inner temperature is "beyond" in Q's direction.
    if (T !== T) return Q > 0 ? 1e30 : -1e30;
  }
  T += Q * m.seriesR;
  return T - m.processC;
}

/** Converged when the bracket on Ts is narrower than this [K]. */
const SURFACE_TOLERANCE_K = 1e-7;

/**
 * Solves the surface balance of `m` in place (Brent's method on Ts; see the module header for the bracket
 * and monotonicity argument) and stores Ts, Q, h_c and h_r on the model.
 *
 * @param m - the surface model; `surfaceC`, `heatFlow`, `hc`, `hr` are overwritten
 * @returns nothing
 * @internal
 */
export function solveSurface(m: SurfaceModel): void {
  let a = Math.min(m.processC, m.airC, m.radiantC);
  let b = Math.max(m.processC, m.airC, m.radiantC);
  let fa = residual(m, a);
  if (fa === 0 || b - a < SURFACE_TOLERANCE_K) {
    store(m, a);
    return;
  }
  let fb = residual(m, b);
  if (fb === 0) {
    store(m, b);
    return;
  }
  // Brent's zero finder (inverse quadratic interpolation, secant, bisection), after Brent (1973) ch. 4.
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < 200; iter++) {
    if ((fb > 0 && fc > 0) || (fb < 0 && fc < 0)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2e-15 * Math.abs(b) + 0.5 * SURFACE_TOLERANCE_K;
    const xm = 0.5 * (c - b);
    if (Math.abs(xm) <= tol || fb === 0) break;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * xm * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * xm * qq * (qq - r) - (b - a) * (r - 1));
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
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : xm > 0 ? tol : -tol;
    fb = residual(m, b);
  }
  store(m, b);
}

function store(m: SurfaceModel, surfaceC: number): void {
  residual(m, surfaceC);
  m.surfaceC = surfaceC;
  m.heatFlow = lastHeatFlow;
  m.hc = lastHc;
  m.hr = radiationCoefficient(m.emissivity, surfaceC + KELVIN_OFFSET, m.radiantC + KELVIN_OFFSET);
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
    if (m.factor[i] !== 0) T = innerTemperatureFromKirchhoffDrop(m.coeffs[i], T, m.heatFlow * m.factor[i]);
  }
  return { outerFacesC: out, innerC: T };
}

/**
 * Checks k > 0 over every layer's solved span; throws CalcInputError naming `layers[i].conductivity`.
 * @internal
 */
export function checkConductivitySpans(m: SurfaceModel, layerIndex: (i: number) => number): void {
  const { outerFacesC, innerC } = interfaceTemperatures(m);
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
      assertConductivityPositive(m.coeffs[i], Tin, outerFacesC[i], `layers[${layerIndex(i)}].conductivity`);
    }
    Tin = outerFacesC[i];
  }
}
