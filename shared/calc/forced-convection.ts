/**
 * Forced convection by wind, and its combination with natural convection.
 *
 * References:
 * 1. S. W. Churchill, M. Bernstein, "A correlating equation for forced convection from gases and liquids
 *    to a circular cylinder in crossflow", J. Heat Transfer 99 (1977) 300–306. doi:10.1115/1.3450685
 * 2. F. P. Incropera, D. P. DeWitt et al., *Fundamentals of Heat and Mass Transfer*, 6th ed., Wiley,
 *    Eq. 7.54 (Churchill–Bernstein), Eqs. 7.30 and 7.38 with Re_x,c = 5·10⁵ (flat plate, mixed boundary
 *    layer, A = 871), §9.9 (mixed convection, n = 3).
 * 3. S. W. Churchill, "A comprehensive correlating equation for laminar, assisting, forced and free
 *    convection", AIChE J. 23 (1977) 10–16 (power-sum combination with n = 3).
 */

/** Churchill–Bernstein holds for Re_D·Pr ≥ 0.2 [1]. */
export const REPR_MIN_CYLINDER_CROSSFLOW = 0.2;
/** Flat-plate average correlation: 0.6 ≤ Pr ≤ 60, Re_L ≤ 10⁸ [2]. */
export const RE_MAX_FLAT_PLATE = 1e8;
/** Critical Reynolds number for transition on a flat plate [-] [2]. */
export const RE_CRITICAL_FLAT_PLATE = 5e5;

/**
 * Average Nusselt number of a cylinder in cross-flow, Churchill & Bernstein (1977):
 * Nu_D = 0.3 + 0.62·Re^(1/2)·Pr^(1/3) / [1 + (0.4/Pr)^(2/3)]^(1/4) · [1 + (Re/282 000)^(5/8)]^(4/5).
 *
 * @param Re - Reynolds number on the outside diameter [-]
 * @param Pr - Prandtl number [-]
 * @returns Nu_D [-]
 * @remarks Valid for Re_D·Pr ≥ 0.2; properties at the film temperature.
 * @example
 * // Incropera 6th ed. Example 7.4 (Re_D = 6071, Pr = 0.70): Nu_D = 40.6
 * nusseltCylinderCrossFlowChurchillBernstein(6071, 0.7); // ≈ 40.64
 *
 * References: [1], [2] Eq. 7.54.
 */
export function nusseltCylinderCrossFlowChurchillBernstein(Re: number, Pr: number): number {
  // Powers by roots and exp/log: the same values to rounding, cheaper than Math.pow in the solver's loop.
  const c = Math.cbrt(0.4 / Pr);
  const a = (0.62 * Math.sqrt(Re) * Math.cbrt(Pr)) / Math.sqrt(Math.sqrt(1 + c * c));
  const x = Re / 282000;
  const x58 = Math.sqrt(Math.sqrt(Math.sqrt(x * x * x * x * x)));
  return 0.3 + a * Math.exp(0.8 * Math.log(1 + x58));
}

/**
 * Average Nusselt number of a flat plate in parallel flow with a mixed laminar–turbulent boundary layer:
 * Nu_L = 0.664·Re^(1/2)·Pr^(1/3) for Re_L ≤ 5·10⁵; Nu_L = (0.037·Re^(4/5) − 871)·Pr^(1/3) above.
 *
 * @param Re - Reynolds number on the length along the flow [-]
 * @param Pr - Prandtl number [-]
 * @returns Nu_L [-]
 * @remarks Valid 0.6 ≤ Pr ≤ 60, Re_L ≤ 10⁸, transition at Re_x,c = 5·10⁵ (A = 871).
 * @example
 * // Re 1e6, Pr 0.7 → (0.037·1e6^0.8 − 871)·0.7^(1/3) ≈ 1299
 * nusseltFlatPlateMixedBoundaryLayer(1e6, 0.7);
 *
 * References: [2] Eqs. 7.30, 7.38.
 */
export function nusseltFlatPlateMixedBoundaryLayer(Re: number, Pr: number): number {
  if (Re <= RE_CRITICAL_FLAT_PLATE) return 0.664 * Math.sqrt(Re) * Math.cbrt(Pr);
  return (0.037 * Math.exp(0.8 * Math.log(Re)) - 871) * Math.cbrt(Pr);
}

/**
 * Combined forced and natural convection: h = (h_forced³ + h_natural³)^(1/3).
 *
 * @param hForced - forced-convection coefficient [W/(m²·K)]
 * @param hNatural - natural-convection coefficient [W/(m²·K)]
 * @returns combined coefficient [W/(m²·K)]
 * @remarks Assisting/transverse flow assumed (the usual choice for wind across pipes and walls).
 * @example
 * combinedConvectionCoefficient(3, 4); // = 91^(1/3) ≈ 4.498
 *
 * References: [2] Eq. 9.63; [3].
 */
export function combinedConvectionCoefficient(hForced: number, hNatural: number): number {
  return Math.cbrt(hForced * hForced * hForced + hNatural * hNatural * hNatural);
}
