/**
 * Natural (free) convection correlations for isothermal surfaces in air.
 *
 * All functions take the Rayleigh number Ra = g·β·|ΔT|·L³/(ν·α) = g·β·|ΔT|·L³·Pr/ν² on the stated length.
 *
 * References:
 * 1. S. W. Churchill, H. H. S. Chu, "Correlating equations for laminar and turbulent free convection from
 *    a horizontal cylinder", Int. J. Heat Mass Transfer 18 (1975) 1049–1053. doi:10.1016/0017-9310(75)90222-7
 * 2. S. W. Churchill, H. H. S. Chu, "Correlating equations for laminar and turbulent free convection from
 *    a vertical plate", Int. J. Heat Mass Transfer 18 (1975) 1323–1329. doi:10.1016/0017-9310(75)90243-4
 * 3. W. H. McAdams, *Heat Transmission*, 3rd ed., McGraw-Hill, 1954, ch. 7 (horizontal plates).
 * 4. J. R. Lloyd, W. R. Moran, "Natural convection adjacent to horizontal surfaces of various planforms",
 *    J. Heat Transfer 96 (1974) 443–447. doi:10.1115/1.3450224
 * 5. F. P. Incropera, D. P. DeWitt et al., *Fundamentals of Heat and Mass Transfer*, 6th ed., Wiley,
 *    §9.6, Eqs. 9.26, 9.30–9.32, 9.34 and the validity ranges quoted there.
 */

/** Standard acceleration of gravity [m/s²] (3rd CGPM, 1901). */
export const STANDARD_GRAVITY = 9.80665;

/** Published validity of Churchill–Chu horizontal cylinder: Ra_D ≲ 10¹² [5]; lower bound 10⁻⁵ [1]. */
export const RA_RANGE_HORIZONTAL_CYLINDER: readonly [number, number] = [1e-5, 1e12];
/** Churchill–Chu vertical plate is fitted for 10⁻¹ ≤ Ra_L ≤ 10¹² [2]. */
export const RA_RANGE_VERTICAL_PLATE: readonly [number, number] = [1e-1, 1e12];
/** Upper face of a hot plate (≡ lower face of a cold plate): 10⁴ ≤ Ra_L ≤ 10¹¹ [4, 5]. */
export const RA_RANGE_PLATE_UPPER_HOT: readonly [number, number] = [1e4, 1e11];
/** Lower face of a hot plate (≡ upper face of a cold plate): 10⁵ ≤ Ra_L ≤ 10¹⁰ [3, 5]. */
export const RA_RANGE_PLATE_LOWER_HOT: readonly [number, number] = [1e5, 1e10];

/** Ra_L where the two McAdams branches of a hot upper face meet, with a step of about 6 % [3, 5]. */
export const RA_BRANCH_PLATE_UPPER_HOT = 1e7;

/**
 * Rayleigh number of an ideal gas: Ra = g·(1/T_film)·|ΔT|·L³·Pr/ν².
 *
 * @param deltaTK - surface − fluid temperature difference [K] (sign ignored)
 * @param lengthM - characteristic length [m]
 * @param filmK - film temperature, for β = 1/T [K]
 * @param nu - kinematic viscosity [m²/s]
 * @param Pr - Prandtl number [-]
 * @returns Ra [-]
 * @remarks β = 1/T holds for an ideal gas such as air at 1 atm.
 *
 * References: [5] Eq. 9.25.
 */
export function rayleighNumberIdealGas(deltaTK: number, lengthM: number, filmK: number, nu: number, Pr: number): number {
  return (STANDARD_GRAVITY * Math.abs(deltaTK) * lengthM * lengthM * lengthM * Pr) / (filmK * nu * nu);
}

/**
 * Average Nusselt number of an isothermal horizontal cylinder, Churchill & Chu (1975):
 * Nu_D = {0.60 + 0.387·Ra_D^(1/6) / [1 + (0.559/Pr)^(9/16)]^(8/27)}².
 *
 * @param Ra - Rayleigh number on the outside diameter [-]
 * @param Pr - Prandtl number [-]
 * @returns Nu_D [-]
 * @remarks Valid 10⁻⁵ ≤ Ra_D ≤ 10¹², all Pr; properties at the film temperature.
 * @example
 * // Bell, ht (conv_free_immersed), doctest from Incropera 6th ed.: Pr 0.69, Gr 2.63e9 → 139.13
 * nusseltHorizontalCylinderChurchillChu(0.69 * 2.63e9, 0.69); // ≈ 139.13
 *
 * References: [1], [5] Eq. 9.34.
 */
export function nusseltHorizontalCylinderChurchillChu(Ra: number, Pr: number): number {
  const a = 0.6 + (0.387 * sixthRoot(Ra)) / prandtlFactor(0.559 / Pr);
  return a * a;
}

/** x^(1/6) as √∛x: the same value to rounding, a fraction of the cost of Math.pow in the solver's loop. */
function sixthRoot(x: number): number {
  return Math.sqrt(Math.cbrt(x));
}

/** [1 + x^(9/16)]^(8/27) of Churchill & Chu, with x^(9/16) = (x^(1/16))⁹ by square roots. */
function prandtlFactor(x: number): number {
  const r = Math.sqrt(Math.sqrt(Math.sqrt(Math.sqrt(x))));
  const r2 = r * r;
  const r4 = r2 * r2;
  return Math.exp((8 / 27) * Math.log(1 + r4 * r4 * r));
}

/**
 * Average Nusselt number of an isothermal vertical plate, Churchill & Chu (1975), all regimes:
 * Nu_L = {0.825 + 0.387·Ra_L^(1/6) / [1 + (0.492/Pr)^(9/16)]^(8/27)}².
 *
 * @param Ra - Rayleigh number on the plate height [-]
 * @param Pr - Prandtl number [-]
 * @returns Nu_L [-]
 * @remarks Valid 10⁻¹ ≤ Ra_L ≤ 10¹². Also applies to a vertical cylinder of height H when
 * D ≥ 35·H/Gr_H^(1/4) ([5] Eq. 9.33); thinner cylinders gain more than the plate predicts.
 * @example
 * // Incropera 6th ed. Example 9.2 (glass fire screen, Ra_L = 1.813e9, Pr = 0.690): Nu_L = 147
 * nusseltVerticalPlateChurchillChu(1.813e9, 0.69); // ≈ 147.2
 *
 * References: [2], [5] Eq. 9.26.
 */
export function nusseltVerticalPlateChurchillChu(Ra: number, Pr: number): number {
  const a = 0.825 + (0.387 * sixthRoot(Ra)) / prandtlFactor(0.492 / Pr);
  return a * a;
}

/**
 * Upper face of a hot horizontal plate (or lower face of a cold one), L = area/perimeter:
 * Nu_L = 0.54·Ra_L^(1/4) for Ra_L ≤ 10⁷; Nu_L = 0.15·Ra_L^(1/3) above (McAdams; Lloyd & Moran).
 *
 * @param Ra - Rayleigh number on L = A/P [-]
 * @returns Nu_L [-]
 * @remarks Valid 10⁴ ≤ Ra_L ≤ 10¹¹, Pr ≳ 0.7. The two branches meet with a step at 10⁷ (0.54·10^(7/4) = 30.4
 * against 0.15·10^(7/3) = 32.3), as published; the surface balance handles a surface that sits on it.
 * @example
 * // Bell, ht Nu_horizontal_plate_McAdams(5.54, 3.21e8, buoyancy=True) = 181.73
 * nusseltHorizontalPlateUpperHotMcAdams(5.54 * 3.21e8); // ≈ 181.73
 *
 * References: [3], [4], [5] Eqs. 9.30–9.31.
 */
export function nusseltHorizontalPlateUpperHotMcAdams(Ra: number): number {
  return Ra <= RA_BRANCH_PLATE_UPPER_HOT ? 0.54 * Math.sqrt(Math.sqrt(Ra)) : 0.15 * Math.cbrt(Ra);
}

/**
 * Lower face of a hot horizontal plate (or upper face of a cold one), L = area/perimeter:
 * Nu_L = 0.27·Ra_L^(1/4) (McAdams).
 *
 * @param Ra - Rayleigh number on L = A/P [-]
 * @returns Nu_L [-]
 * @remarks Valid 10⁵ ≤ Ra_L ≤ 10¹⁰ (Incropera 6th ed. Eq. 9.32); the fluid must flow round the edge.
 * @example
 * // Bell, ht Nu_horizontal_plate_McAdams(5.54, 3.21e8, buoyancy=False) = 55.45
 * nusseltHorizontalPlateLowerHotMcAdams(5.54 * 3.21e8); // ≈ 55.45
 *
 * References: [3], [5] Eq. 9.32.
 */
export function nusseltHorizontalPlateLowerHotMcAdams(Ra: number): number {
  return 0.27 * Math.sqrt(Math.sqrt(Ra));
}
