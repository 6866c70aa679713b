/**
 * Dry air at 1 atm from Incropera & DeWitt, Table A.4, linearly interpolated in temperature.
 *
 * @remarks
 * The table runs 100–1500 K; film temperatures outside it are clamped to the nearest end (callers warn).
 * Linear interpolation between the 50 K / 100 K table steps matches the table's own 3–4 significant
 * figures. Ideal-gas expansion coefficient β = 1/T.
 *
 * References:
 * 1. F. P. Incropera, D. P. DeWitt, T. L. Bergman, A. S. Lavine, *Fundamentals of Heat and Mass Transfer*,
 *    6th ed., Wiley, 2007, Table A.4 "Thermophysical properties of gases at atmospheric pressure — Air".
 */

/** Table temperatures [K]. Step 50 K up to 1000 K, then 100 K. */
const TABLE_T_K = [
  100, 150, 200, 250, 300, 350, 400, 450, 500, 550, 600, 650, 700, 750, 800, 850, 900, 950, 1000, 1100, 1200,
  1300, 1400, 1500,
];
/** Thermal conductivity k·10³ [W/(m·K)]. */
const TABLE_K_E3 = [
  9.34, 13.8, 18.1, 22.3, 26.3, 30.0, 33.8, 37.3, 40.7, 43.9, 46.9, 49.7, 52.4, 54.9, 57.3, 59.6, 62.0, 64.3, 66.7,
  71.5, 76.3, 82, 91, 100,
];
/** Kinematic viscosity ν·10⁶ [m²/s]. */
const TABLE_NU_E6 = [
  2.0, 4.426, 7.59, 11.44, 15.89, 20.92, 26.41, 32.39, 38.79, 45.57, 52.69, 60.21, 68.1, 76.37, 84.93, 93.8, 102.9,
  112.2, 121.9, 141.8, 162.9, 185.1, 213, 240,
];
/** Prandtl number [-]. */
const TABLE_PR = [
  0.786, 0.758, 0.737, 0.72, 0.707, 0.7, 0.69, 0.686, 0.684, 0.683, 0.685, 0.69, 0.695, 0.702, 0.709, 0.716, 0.72,
  0.723, 0.726, 0.728, 0.728, 0.719, 0.703, 0.685,
];

/** Lowest film temperature in the air table [K]. */
export const AIR_TABLE_MIN_K = 100;
/** Highest film temperature in the air table [K]. */
export const AIR_TABLE_MAX_K = 1500;

/** Name of the property source, for the method panel. */
export const AIR_PROPERTIES_SOURCE = 'Air properties at film temperature: Incropera & DeWitt Table A.4 (1 atm), interpolated';

/** Air properties at one temperature. */
export type AirProperties = {
  /** Thermal conductivity [W/(m·K)]. */
  k: number;
  /** Kinematic viscosity [m²/s]. */
  nu: number;
  /** Prandtl number [-]. */
  Pr: number;
  /** Volumetric expansion coefficient 1/T [1/K]. */
  beta: number;
  /** False when the temperature was outside the table and clamped. */
  inRange: boolean;
};

/**
 * Writes interpolated air properties at `TK` into `out` as [k, ν, Pr].
 *
 * @param TK - film temperature [K]
 * @param out - caller-owned scratch array, reused so the surface solver allocates nothing per iteration
 * @internal
 */
export function loadAir(TK: number, out: Float64Array): void {
  let T = TK;
  if (!(T > AIR_TABLE_MIN_K)) T = AIR_TABLE_MIN_K;
  else if (T > AIR_TABLE_MAX_K) T = AIR_TABLE_MAX_K;
  let i: number;
  if (T < 1000) i = Math.floor((T - 100) / 50);
  else i = 18 + Math.floor((T - 1000) / 100);
  if (i > TABLE_T_K.length - 2) i = TABLE_T_K.length - 2;
  const t0 = TABLE_T_K[i];
  const f = (T - t0) / (TABLE_T_K[i + 1] - t0);
  out[0] = (TABLE_K_E3[i] + f * (TABLE_K_E3[i + 1] - TABLE_K_E3[i])) * 1e-3;
  out[1] = (TABLE_NU_E6[i] + f * (TABLE_NU_E6[i + 1] - TABLE_NU_E6[i])) * 1e-6;
  out[2] = TABLE_PR[i] + f * (TABLE_PR[i + 1] - TABLE_PR[i]);
}

/**
 * Properties of dry air at 1 atm, linearly interpolated in Incropera & DeWitt Table A.4; β = 1/T.
 *
 * @param temperatureK - air (film) temperature [K]
 * @returns k [W/(m·K)], ν [m²/s], Pr [-], β [1/K] and whether the temperature lay inside the table
 * @remarks Valid 100–1500 K (−173 to 1227 °C); clamped outside, with `inRange` false.
 * @example
 * // Table A.4 at 350 K lists k = 30.0e-3 W/(m·K), ν = 20.92e-6 m²/s, Pr = 0.700.
 * airProperties(350); // → { k: 0.0300, nu: 2.092e-5, Pr: 0.700, beta: 0.002857, inRange: true }
 *
 * References:
 * 1. F. P. Incropera, D. P. DeWitt et al., *Fundamentals of Heat and Mass Transfer*, 6th ed., Table A.4.
 */
export function airProperties(temperatureK: number): AirProperties {
  const out = new Float64Array(3);
  loadAir(temperatureK, out);
  return {
    k: out[0],
    nu: out[1],
    Pr: out[2],
    beta: 1 / temperatureK,
    inRange: temperatureK >= AIR_TABLE_MIN_K && temperatureK <= AIR_TABLE_MAX_K,
  };
}
