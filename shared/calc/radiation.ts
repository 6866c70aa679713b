/**
 * Thermal radiation between a grey surface and large surroundings that enclose it.
 *
 * References:
 * 1. E. Tiesinga, P. J. Mohr, D. B. Newell, B. N. Taylor, "CODATA recommended values of the fundamental
 *    physical constants: 2018", Rev. Mod. Phys. 93, 025010 (2021). doi:10.1103/RevModPhys.93.025010
 * 2. F. P. Incropera, D. P. DeWitt et al., *Fundamentals of Heat and Mass Transfer*, 6th ed., Eq. 1.7
 *    and Eq. 1.9 (radiation coefficient h_r).
 */

/** Stefan–Boltzmann constant [W/(m²·K⁴)], CODATA 2018 (exact, derived from h, c, k). */
export const STEFAN_BOLTZMANN = 5.670374419e-8;

/** Offset from degrees Celsius to kelvin [K] (SI definition). */
export const KELVIN_OFFSET = 273.15;

/**
 * Net radiative heat flux from a small grey surface to enclosing surroundings: q = ε·σ·(Ts⁴ − Tsur⁴).
 *
 * @param emissivity - total hemispherical emissivity of the surface [-], 0–1
 * @param surfaceK - surface temperature [K]
 * @param surroundingsK - radiant temperature of the surroundings [K]
 * @returns net flux leaving the surface [W/m²] (negative when the surface gains heat)
 * @remarks The surroundings are large and black relative to the surface (enclosure view factor 1).
 * @example
 * // Incropera & DeWitt 6th ed. Example 1.2: ε = 0.8, Ts = 473 K, Tsur = 298 K → 421 W/m over
 * // π·0.07 m² per metre, i.e. about 1915 W/m².
 * radiativeHeatFlux(0.8, 473, 298); // ≈ 1915
 *
 * References: see module header [1], [2].
 */
export function radiativeHeatFlux(emissivity: number, surfaceK: number, surroundingsK: number): number {
  const s2 = surfaceK * surfaceK;
  const r2 = surroundingsK * surroundingsK;
  return emissivity * STEFAN_BOLTZMANN * (s2 * s2 - r2 * r2);
}

/**
 * Radiation heat-transfer coefficient from the full T⁴ exchange:
 * h_r = q/(Ts − Tsur) = ε·σ·(Ts + Tsur)·(Ts² + Tsur²).
 *
 * @param emissivity - surface emissivity [-]
 * @param surfaceK - surface temperature [K]
 * @param surroundingsK - radiant temperature of the surroundings [K]
 * @returns h_r [W/(m²·K)], relative to (Ts − Tsur)
 * @remarks The factored form is exact and has no 0/0 at Ts = Tsur, where it tends to the derivative
 * limit 4·ε·σ·T³.
 * @example
 * radiationCoefficient(1, 300, 300); // = 4·σ·300³ ≈ 6.12
 *
 * References: see module header [2], Eq. 1.9.
 */
export function radiationCoefficient(emissivity: number, surfaceK: number, surroundingsK: number): number {
  return (
    emissivity *
    STEFAN_BOLTZMANN *
    (surfaceK + surroundingsK) *
    (surfaceK * surfaceK + surroundingsK * surroundingsK)
  );
}
