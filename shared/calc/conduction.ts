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

/**
 * Temperature on the inner face of a layer given its outer face and the Kirchhoff drop:
 * solves K(T_in) = K(T_out) + ΔK on the branch where k > 0.
 *
 * @param coefficients - k(T) polynomial [W/(m·K)], T in °C
 * @param outerC - outer-face temperature [°C]
 * @param dK - required K(T_in) − K(T_out) [W/m]
 * @returns T_in [°C], or NaN when no temperature with k > 0 along the way satisfies it
 * @remarks Closed form for constant and linear k; otherwise Newton's method safeguarded by bisection on a
 * bracket grown from T_out (K is strictly increasing wherever k > 0, so the bracket holds one root).
 * @internal
 */
export function innerTemperatureFromKirchhoffDrop(coefficients: readonly number[], outerC: number, dK: number): number {
  const n = coefficients.length;
  if (dK === 0) return outerC;
  const c0 = coefficients[0];
  if (n === 1) return c0 > 0 ? outerC + dK / c0 : NaN;
  const kOut = conductivityAt(coefficients, outerC);
  if (!(kOut > 0)) return NaN;
  if (n === 2) {
    const c1 = coefficients[1];
    if (c1 === 0) return outerC + dK / c0;
    const target = conductivityIntegral(coefficients, outerC) + dK;
    // K(T) = c0·T + c1·T²/2; the root with k(T) = +√D is the one on the same rising branch as T_out.
    const D = c0 * c0 + 2 * c1 * target;
    if (!(D > 0)) return NaN;
    const sD = Math.sqrt(D);
    return c0 >= 0 ? (2 * target) / (c0 + sD) : (sD - c0) / c1;
  }
  const target = conductivityIntegral(coefficients, outerC) + dK;
  let lo = outerC;
  let step = dK / kOut;
  let hi = outerC + step;
  let g = conductivityIntegral(coefficients, hi) - target;
  let grow = 0;
  // Grow the bracket away from T_out until K passes the target, refusing to cross a k ≤ 0 point.
  while ((dK > 0 ? g < 0 : g > 0) && grow < 60) {
    if (!(conductivityAt(coefficients, hi) > 0)) return NaN;
    lo = hi;
    step *= 2;
    hi = outerC + step;
    g = conductivityIntegral(coefficients, hi) - target;
    grow++;
  }
  if (grow >= 60) return NaN;
  let a = Math.min(lo, hi);
  let b = Math.max(lo, hi);
  let T = hi - g / Math.max(conductivityAt(coefficients, hi), 1e-12);
  if (!(T > a && T < b)) T = 0.5 * (a + b);
  for (let it = 0; it < 100; it++) {
    const f = conductivityIntegral(coefficients, T) - target;
    if (f === 0) return T;
    if (f < 0) a = T;
    else b = T;
    const k = conductivityAt(coefficients, T);
    let Tn = k > 0 ? T - f / k : 0.5 * (a + b);
    if (!(Tn > a && Tn < b)) Tn = 0.5 * (a + b);
    if (Math.abs(Tn - T) < 1e-10 * (1 + Math.abs(T))) return Tn;
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
 * @remarks Checks the ends, the stationary point of a quadratic and 32 interior points for higher degree.
 * @example
 * assertConductivityPositive([0.04, -0.0002], 0, 300, 'layers[0].conductivity'); // throws: k(300 °C) = −0.02
 */
export function assertConductivityPositive(coefficients: readonly number[], aC: number, bC: number, field: string): void {
  const lo = Math.min(aC, bC);
  const hi = Math.max(aC, bC);
  let kMin = Math.min(conductivityAt(coefficients, lo), conductivityAt(coefficients, hi));
  let at = conductivityAt(coefficients, lo) <= conductivityAt(coefficients, hi) ? lo : hi;
  if (coefficients.length === 3 && coefficients[2] !== 0) {
    const Tv = -coefficients[1] / (2 * coefficients[2]);
    if (Tv > lo && Tv < hi) {
      const kv = conductivityAt(coefficients, Tv);
      if (kv < kMin) {
        kMin = kv;
        at = Tv;
      }
    }
  } else if (coefficients.length > 3) {
    for (let i = 1; i < 32; i++) {
      const T = lo + ((hi - lo) * i) / 32;
      const k = conductivityAt(coefficients, T);
      if (k < kMin) {
        kMin = k;
        at = T;
      }
    }
  }
  if (!(kMin > 0)) {
    throw new CalcInputError(
      field,
      `Conductivity k(T) must stay positive over the layer's temperature span ${lo.toFixed(1)}…${hi.toFixed(1)} °C, ` +
        `but k(${at.toFixed(1)} °C) = ${kMin.toPrecision(3)} W/(m·K). Check the coefficients and their temperature unit (°C).`,
      'CONDUCTIVITY_NOT_POSITIVE',
    );
  }
}
