/**
 * Dew point over liquid water by the Magnus formula with the Alduchov & Eskridge (1996) constants:
 * γ = ln(RH/100) + b·T/(c + T), T_d = c·γ/(b − γ), b = 17.625, c = 243.04 °C.
 *
 * References:
 * 1. O. A. Alduchov, R. E. Eskridge, "Improved Magnus form approximation of saturation vapor pressure",
 *    J. Appl. Meteorol. 35 (1996) 601–609. doi:10.1175/1520-0450(1996)035<0601:IMFAOS>2.0.CO;2
 */

/** Magnus coefficient b [-], Alduchov & Eskridge (1996). */
export const MAGNUS_B = 17.625;
/** Magnus coefficient c [°C], Alduchov & Eskridge (1996). */
export const MAGNUS_C = 243.04;
/** Air temperatures over which the constants were fitted [°C]. */
export const DEW_POINT_VALID_RANGE_C: readonly [number, number] = [-40, 50];

/**
 * Dew point of moist air.
 *
 * @param airTemperatureC - dry-bulb temperature [°C]
 * @param relativeHumidityPct - relative humidity over water [%], 0 < RH ≤ 100
 * @returns dew point [°C]
 * @remarks Valid −40 to 50 °C (error below 0.35 % in saturation pressure); over water, also below 0 °C.
 * @example
 * // 30 °C, 60 % → 21.39 °C (psychrolib GetTDewPointFromRelHum gives 21.388 °C)
 * dewPointC(30, 60);
 *
 * References: [1].
 */
export function dewPointC(airTemperatureC: number, relativeHumidityPct: number): number {
  const g = Math.log(relativeHumidityPct / 100) + (MAGNUS_B * airTemperatureC) / (MAGNUS_C + airTemperatureC);
  return (MAGNUS_C * g) / (MAGNUS_B - g);
}
