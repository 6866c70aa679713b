/**
 * Steady conduction through insulation layers with temperature-dependent conductivity.
 *
 * The Kirchhoff transform K(T) = ∫₀ᵀ k(τ) dτ turns each layer's heat flow into a linear law in K:
 * cylinder q′ = 2π·[K(T₁) − K(T₂)]/ln(r₂/r₁), flat q″ = [K(T₁) − K(T₂)]/t, sphere-like shells
 * Q = [K(T₁) − K(T₂)]·√(A₁A₂)/t. k(T) is a polynomial in °C: k = c₀ + c₁T + c₂T² + …
 *
 * References:
 * 1. ASTM C680-19, *Standard Practice for Estimate of the Heat Gain or Loss and the Surface Temperatures of
 *    Insulated Flat, Cylindrical, and Spherical Systems by Use of Computer Programs*, §7 (integral of k).
 * 2. ISO 12241:2022, *Thermal insulation for building equipment and industrial installations —
 *    Calculation rules*, §4.
 * 3. F. P. Incropera, D. P. DeWitt et al., *Fundamentals of Heat and Mass Transfer*, 6th ed., Table 3.3.
 */

import { CalcInputError } from './errors';
import { PolynomialRange, polynomialRange, polynomialRealRoots } from './polynomial';

/**
 * Thermal conductivity from its polynomial: k(T) = Σ cᵢ·Tⁱ.
 *
 * @param coefficients - [c₀, c₁, …] of k in W/(m·K) with T in °C
 * @param temperatureC - temperature [°C]
 * @returns k [W/(m·K)]
 * @remarks Horner evaluation; the polynomial's validity range is the material data's own.
 * @example
 * conductivityAt([0.035, 0.00015], 100); // = 0.05
 *
 * References: [1].
 */
export function conductivityAt(coefficients: readonly number[], temperatureC: number): number {
  let k = 0;
  for (let i = coefficients.length - 1; i >= 0; i--) k = k * temperatureC + coefficients[i];
  return k;
}

/**
 * Kirchhoff potential K(T) = ∫₀ᵀ k dτ = Σ cᵢ·Tⁱ⁺¹/(i+1).
 *
 * @param coefficients - [c₀, c₁, …] of k in W/(m·K), T in °C
 * @param temperatureC - upper limit [°C]
 * @returns K [W/m]
 * @remarks Differences K(T₁) − K(T₂) equal k_mean·(T₁ − T₂) exactly for linear k (k at the mean temperature).
 * @example
 * conductivityIntegral([0.035, 0.00015], 100); // = 3.5 + 0.75 = 4.25
 *
 * References: [1].
 */
export function conductivityIntegral(coefficients: readonly number[], temperatureC: number): number {
  let s = 0;
  for (let i = coefficients.length - 1; i >= 0; i--) s = s * temperatureC + coefficients[i] / (i + 1);
  return s * temperatureC;
}

/**
 * Heat flow per unit length through a cylindrical layer: q′ = 2π·∫_{T₂}^{T₁} k dT / ln(r₂/r₁).
 *
 * @param coefficients - k(T) polynomial [W/(m·K)], T in °C
 * @param innerC - inner-face temperature [°C]
 * @param outerC - outer-face temperature [°C]
 * @param innerRadiusM - inner radius [m]
 * @param outerRadiusM - outer radius [m]
 * @returns q′ [W/m], positive outward
 * @remarks ASTM C680 cylindrical layer; k must stay positive between the two temperatures.
 * @example
 * // Constant k = 0.04, 100 → 20 °C, r 0.05 → 0.1 m: 2π·0.04·80/ln 2 ≈ 29.0 W/m
 * heatFlowCylindricalLayer([0.04], 100, 20, 0.05, 0.1);
 *
 * References: [1], [3].
 */
export function heatFlowCylindricalLayer(
  coefficients: readonly number[],
  innerC: number,
  outerC: number,
  innerRadiusM: number,
  outerRadiusM: number,
): number {
  const dK = conductivityIntegral(coefficients, innerC) - conductivityIntegral(coefficients, outerC);
  return (2 * Math.PI * dK) / Math.log(outerRadiusM / innerRadiusM);
}

/**
 * Heat flux through a flat layer: q″ = ∫_{T₂}^{T₁} k dT / t.
 *
 * @param coefficients - k(T) polynomial [W/(m·K)], T in °C
 * @param innerC - hot-side (inner) face temperature [°C]
 * @param outerC - outer face temperature [°C]
 * @param thicknessM - layer thickness [m]
 * @returns q″ [W/m²], positive outward
 * @remarks ASTM C680 flat layer.
 * @example
 * heatFluxFlatLayer([0.04], 100, 20, 0.05); // = 64
 *
 * References: [1].
 */
export function heatFluxFlatLayer(coefficients: readonly number[], innerC: number, outerC: number, thicknessM: number): number {
  return (conductivityIntegral(coefficients, innerC) - conductivityIntegral(coefficients, outerC)) / thicknessM;
}

/** Absolute zero [°C] (SI definition): no layer temperature lies below it. */
export const ABSOLUTE_ZERO_C = -273.15;

/**
 * Lowest conductivity accepted over a layer's temperature span [W/(m·K)]: below evacuated panels
 * (centre-of-panel values of about 0.002–0.004 W/(m·K); common practice), so only a unit or sign slip is
 * refused.
 */
export const CONDUCTIVITY_MIN_W_PER_MK = 0.001;

/**
 * Highest conductivity accepted over a layer's temperature span [W/(m·K)]: above pure silver (429) and
 * copper (401 W/(m·K) at 300 K; Incropera & DeWitt, 6th ed., Table A.1), the best conductors a build-up
 * could hold.
 */
export const CONDUCTIVITY_MAX_W_PER_MK = 500;

/**
 * Where k(T) changes sign inside a temperature domain, for bracketing the Kirchhoff inverse.
 * @internal
 */
export type KirchhoffBracket = {
  /** Sorted real roots of k(T) in [loC, hiC] [°C]. */
  roots: readonly number[];
  /** Lower end of the domain [°C]. */
  loC: number;
  /** Upper end of the domain [°C]. */
  hiC: number;
};

/**
 * The real roots of k(T) inside a temperature domain, which bound every bracket of the Kirchhoff inverse.
 *
 * @param coefficients - k(T) polynomial [W/(m·K)], T in °C
 * @param loC - lower end of the domain [°C]
 * @param hiC - upper end of the domain [°C]
 * @returns the roots and the domain
 * @remarks Degree ≤ 2 needs no roots (the inverse is in closed form there). See {@link polynomialRealRoots}.
 * @internal
 */
export function kirchhoffBracket(coefficients: readonly number[], loC: number, hiC: number): KirchhoffBracket {
  return { roots: coefficients.length > 2 ? polynomialRealRoots(coefficients, loC, hiC) : [], loC, hiC };
}

const DEFAULT_BRACKET_HI_C = 1e4;

/**
 * Temperature on the inner face of a layer given its outer face and the Kirchhoff drop:
 * solves K(T_in) = K(T_out) + ΔK on the branch where k > 0.
 *
 * @param coefficients - k(T) polynomial [W/(m·K)], T in °C
 * @param outerC - outer-face temperature [°C]
 * @param dK - required K(T_in) − K(T_out) [W/m]
 * @param bracket - roots of k over the temperature domain (from {@link kirchhoffBracket}); computed over
 *   −273.15…10⁴ °C when absent
 * @returns T_in [°C], or NaN when k(T_out) ≤ 0 or k reaches zero between T_out and the temperature that
 *   would carry the drop
 * @remarks Closed form for constant and linear k. Otherwise the bracket runs from T_out to the nearest root
 * of k in the direction of the drop (so it never leaves the interval where k > 0 and K is strictly
 * increasing, which holds exactly one solution), or to the domain's end; Newton's method safeguarded by
 * bisection solves inside it. Past the domain's end (no root of k in between), K is continued linearly with
 * slope k(end): the answer then lies outside every temperature of the case and only its side matters, and
 * the continuation keeps the surface balance's residual finite, continuous and increasing.
 * @internal
 */
export function innerTemperatureFromKirchhoffDrop(
  coefficients: readonly number[],
  outerC: number,
  dK: number,
  bracket?: KirchhoffBracket,
): number {
  const n = coefficients.length;
  if (dK === 0) return outerC;
  const c0 = coefficients[0];
  if (n === 1) return c0 > 0 ? outerC + dK / c0 : NaN;
  if (n === 2 || (n === 3 && coefficients[2] === 0)) {
    const c1 = coefficients[1];
    if (c1 === 0) return c0 > 0 ? outerC + dK / c0 : NaN;
    const kOut = c0 + c1 * outerC;
    if (!(kOut > 0)) return NaN;
    // K(T) = c0·T + c1·T²/2 about T_out: k(T_in)² = k(T_out)² + 2·c1·ΔK; the root with k(T_in) > 0 is
    // the one on T_out's branch, written without cancellation.
    const D = kOut * kOut + 2 * c1 * dK;
    if (!(D > 0)) return NaN;
    return outerC + (2 * dK) / (kOut + Math.sqrt(D));
  }
  const kOut = conductivityAt(coefficients, outerC);
  if (!(kOut > 0)) return NaN;
  const br = bracket ?? kirchhoffBracket(coefficients, ABSOLUTE_ZERO_C, DEFAULT_BRACKET_HI_C);
  const KOut = conductivityIntegral(coefficients, outerC);
  const target = KOut + dK;
  const up = dK > 0;
  // The end of the k > 0 interval around T_out in the direction of the drop.
  let edge = up ? br.hiC : br.loC;
  let edgeIsRoot = false;
  const roots = br.roots;
  if (up) {
    for (let i = 0; i < roots.length; i++) {
      if (roots[i] > outerC) {
        edge = roots[i];
        edgeIsRoot = true;
        break;
      }
    }
  } else {
    for (let i = roots.length - 1; i >= 0; i--) {
      if (roots[i] < outerC) {
        edge = roots[i];
        edgeIsRoot = true;
        break;
      }
    }
  }
  if (up ? edge <= outerC : edge >= outerC) {
    // T_out sits at or beyond the domain's end: continue from T_out itself.
    return outerC + dK / kOut;
  }
  const gEdge = conductivityIntegral(coefficients, edge) - target;
  if (up ? gEdge < 0 : gEdge > 0) {
    if (edgeIsRoot) return NaN;
    const kEdge = conductivityAt(coefficients, edge);
    return kEdge > 0 ? edge - gEdge / kEdge : NaN;
  }
  if (gEdge === 0) return edge;
  // g(T) = K(T) − target is increasing on the bracket: g(T_out) = −ΔK, g(edge) has the sign of ΔK.
  let a = up ? outerC : edge;
  let b = up ? edge : outerC;
  // Start from K's second-order expansion about T_out (exact for linear k), so Newton needs a step or two.
  let dk = 0;
  for (let i = n - 1; i >= 1; i--) dk = dk * outerC + i * coefficients[i];
  const D = kOut * kOut + 2 * dk * dK;
  let T = outerC + (D > 0 ? (2 * dK) / (kOut + Math.sqrt(D)) : dK / kOut);
  if (!(T > a && T < b)) T = 0.5 * (a + b);
  for (let it = 0; it < 100; it++) {
    const f = conductivityIntegral(coefficients, T) - target;
    if (f === 0) return T;
    if (f < 0) a = T;
    else b = T;
    const k = conductivityAt(coefficients, T);
    let Tn = k > 0 ? T - f / k : 0.5 * (a + b);
    if (!(Tn > a && Tn < b)) Tn = 0.5 * (a + b);
    // Newton converges quadratically, so once a step is this small the new iterate is exact to rounding.
    if (Math.abs(Tn - T) <= 1e-13 * (1 + Math.abs(T)) || Tn === a || Tn === b) return Tn;
    T = Tn;
  }
  return T;
}

/**
 * Throws when k(T) ≤ 0 anywhere between two temperatures.
 *
 * @param coefficients - k(T) polynomial [W/(m·K)], T in °C
 * @param aC - one end of the span [°C]
 * @param bC - other end [°C]
 * @param field - input path reported in the error
 * @returns nothing; throws {@link CalcInputError} with code CONDUCTIVITY_NOT_POSITIVE
 * @remarks Exact for every degree: the least k on the span is found at its ends or at a real root of
 * dk/dT ({@link polynomialRange}), so a narrow negative band between sample points cannot slip through.
 * @example
 * assertConductivityPositive([0.04, -0.0002], 0, 300, 'layers[0].conductivity'); // throws: k(300 °C) = −0.02
 */
export function assertConductivityPositive(coefficients: readonly number[], aC: number, bC: number, field: string): void {
  const lo = Math.min(aC, bC);
  const hi = Math.max(aC, bC);
  const r = polynomialRange(coefficients, lo, hi);
  if (!(r.min > 0)) throw notPositive(lo, hi, r, field);
}

function notPositive(lo: number, hi: number, r: PolynomialRange, field: string): CalcInputError {
  return new CalcInputError(
    field,
    `Conductivity k(T) must stay positive over the layer's temperature span ${lo.toFixed(1)}…${hi.toFixed(1)} °C, ` +
      `but k(${r.argMin.toFixed(1)} °C) = ${r.min.toPrecision(3)} W/(m·K). Check the coefficients and their temperature unit (°C).`,
    'CONDUCTIVITY_NOT_POSITIVE',
  );
}

/**
 * Throws unless k(T) stays within the physical range {@link CONDUCTIVITY_MIN_W_PER_MK}…
 * {@link CONDUCTIVITY_MAX_W_PER_MK} over a layer's temperature span.
 *
 * @param coefficients - k(T) polynomial [W/(m·K)], T in °C
 * @param aC - one end of the span [°C]
 * @param bC - other end [°C]
 * @param field - input path reported in the error
 * @returns nothing; throws {@link CalcInputError}: CONDUCTIVITY_NOT_POSITIVE where k ≤ 0, else
 *   CONDUCTIVITY_OUT_OF_RANGE
 * @remarks Exact extremes as in {@link assertConductivityPositive}. A conductivity outside the range is a
 * slip (a wrong unit, a lost exponent) whose result would be a number without meaning.
 * @example
 * assertConductivityInRange([1e200], 20, 250, 'layers[0].conductivity'); // throws CONDUCTIVITY_OUT_OF_RANGE
 */
export function assertConductivityInRange(coefficients: readonly number[], aC: number, bC: number, field: string): void {
  const lo = Math.min(aC, bC);
  const hi = Math.max(aC, bC);
  const r = polynomialRange(coefficients, lo, hi);
  if (!(r.min > 0)) throw notPositive(lo, hi, r, field);
  if (!(r.min >= CONDUCTIVITY_MIN_W_PER_MK && r.max <= CONDUCTIVITY_MAX_W_PER_MK)) {
    const low = !(r.min >= CONDUCTIVITY_MIN_W_PER_MK);
    throw new CalcInputError(
      field,
      `Conductivity k(T) must lie within ${CONDUCTIVITY_MIN_W_PER_MK}…${CONDUCTIVITY_MAX_W_PER_MK} W/(m·K) over the layer's ` +
        `temperature span ${lo.toFixed(1)}…${hi.toFixed(1)} °C, but k(${(low ? r.argMin : r.argMax).toFixed(1)} °C) = ` +
        `${(low ? r.min : r.max).toPrecision(3)} W/(m·K). Check the coefficients, their unit (W/(m·K)) and their temperature unit (°C).`,
      'CONDUCTIVITY_OUT_OF_RANGE',
    );
  }
}
