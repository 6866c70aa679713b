/**
 * A few rows of Incropera & DeWitt, *Fundamentals of Heat and Mass Transfer*, 6th ed., Table A.4 (air at
 * 1 atm), kept here so reference tests recompute correlations without the package's own property code.
 * Columns: T [K], k [W/(m·K)], ν [m²/s], Pr [-].
 */
const ROWS: [number, number, number, number][] = [
  [250, 0.0223, 11.44e-6, 0.72],
  [300, 0.0263, 15.89e-6, 0.707],
  [350, 0.03, 20.92e-6, 0.7],
  [400, 0.0338, 26.41e-6, 0.69],
  [450, 0.0373, 32.39e-6, 0.686],
];

/** Linear interpolation in the rows above (250–450 K). */
export function airA4(TK: number): { k: number; nu: number; Pr: number } {
  for (let i = 0; i < ROWS.length - 1; i++) {
    const [t0, k0, n0, p0] = ROWS[i];
    const [t1, k1, n1, p1] = ROWS[i + 1];
    if (TK >= t0 && TK <= t1) {
      const f = (TK - t0) / (t1 - t0);
      return { k: k0 + f * (k1 - k0), nu: n0 + f * (n1 - n0), Pr: p0 + f * (p1 - p0) };
    }
  }
  throw new Error(`airA4: ${TK} K outside the copied rows`);
}

/** Standard gravity [m/s²]. */
export const G = 9.80665;
/** Stefan–Boltzmann constant [W/(m²·K⁴)], CODATA 2018. */
export const SIGMA = 5.670374419e-8;
