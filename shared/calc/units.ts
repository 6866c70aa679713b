/**
 * Unit conversions between SI and US customary units, and display helpers for results.
 *
 * @remarks
 * The package computes in SI (°C at its public edge); these functions exist so the app and reports can show
 * US customary values without each screen carrying its own factors. Every factor below is derived from the
 * exact definitional constants, never from a rounded handbook factor, so a round trip SI → US → SI returns
 * the input to floating-point precision.
 *
 * References:
 * 1. Thompson, A. and Taylor, B. N., *Guide for the Use of the International System of Units (SI)*,
 *    NIST Special Publication 811, 2008 edition, Appendix B (conversion factors).
 * 2. International Yard and Pound Agreement (1959): 1 yard = 0.9144 m, 1 pound = 0.45359237 kg, exactly.
 * 3. Fifth International Conference on the Properties of Steam, London (1956): the International Table
 *    calorie, 1 cal_IT = 4.1868 J exactly, from which 1 Btu_IT = 1055.05585262 J exactly.
 */

import { requireFinite } from './checks';
import { CalcInputError } from './errors';

/** Metres per international inch, exactly (International Yard and Pound Agreement, 1959). */
export const METRES_PER_INCH = 0.0254;
/** Metres per international foot, exactly (12 in). */
export const METRES_PER_FOOT = 0.3048;
/** Kilograms per avoirdupois pound, exactly (International Yard and Pound Agreement, 1959). */
export const KILOGRAMS_PER_POUND = 0.45359237;
/** Joules per International Table British thermal unit, exactly (NIST SP 811, 2008, App. B.8). */
export const JOULES_PER_BTU_IT = 1055.05585262;
/** Joules per kilogram-kelvin in one Btu_IT/(lb·°F), exactly: 4.1868 kJ/(kg·K) by definition of cal_IT. */
export const J_PER_KG_K_PER_BTU_PER_LB_F = 4186.8;
/** Seconds per hour. */
export const SECONDS_PER_HOUR = 3600;
/** Kelvin per degree Fahrenheit (or Rankine) of temperature difference, exactly. */
export const KELVIN_PER_FAHRENHEIT_DEGREE = 5 / 9;
/** Metres per second in one mile per hour, exactly (1609.344 m / 3600 s). */
export const METRES_PER_SECOND_PER_MPH = 0.44704;
/** Offset between the Celsius and Kelvin scales, exactly (SI Brochure, 9th edition, 2019). */
export const KELVIN_AT_ZERO_CELSIUS = 273.15;
/** Joules per kilowatt-hour, exactly. */
export const JOULES_PER_KWH = 3.6e6;
/** British thermal units (IT) per therm, by definition (100 000 Btu). */
export const BTU_PER_THERM = 1e5;

// Watts in one Btu_IT per hour.
const W_PER_BTU_PER_H = JOULES_PER_BTU_IT / SECONDS_PER_HOUR;

// ---------------------------------------------------------------------------------------------------------
// Temperature

/**
 * Converts a temperature from degrees Celsius to degrees Fahrenheit: °F = °C · 9/5 + 32.
 *
 * @param temperatureC - temperature [°C]
 * @returns temperature [°F]
 * @remarks For a temperature *difference* use {@link deltaCelsiusToFahrenheit}.
 * @example celsiusToFahrenheit(100) // 212 (boiling point of water at 1 atm, NIST SP 811 App. B.9)
 * References: 1. NIST SP 811 (2008), Appendix B.9.
 */
export function celsiusToFahrenheit(temperatureC: number): number {
  requireFinite(temperatureC, 'temperatureC');
  return (temperatureC * 9) / 5 + 32;
}

/**
 * Converts a temperature from degrees Fahrenheit to degrees Celsius: °C = (°F − 32) · 5/9.
 *
 * @param temperatureF - temperature [°F]
 * @returns temperature [°C]
 * @example fahrenheitToCelsius(140) // 60
 * References: 1. NIST SP 811 (2008), Appendix B.9.
 */
export function fahrenheitToCelsius(temperatureF: number): number {
  requireFinite(temperatureF, 'temperatureF');
  return ((temperatureF - 32) * 5) / 9;
}

/**
 * Converts a temperature from degrees Celsius to kelvin: K = °C + 273.15.
 *
 * @param temperatureC - temperature [°C]
 * @returns thermodynamic temperature [K]
 * @remarks Throws when the result would be below absolute zero.
 * @example celsiusToKelvin(0) // 273.15
 * References: 1. BIPM, The International System of Units (SI Brochure), 9th edition, 2019.
 */
export function celsiusToKelvin(temperatureC: number): number {
  requireFinite(temperatureC, 'temperatureC');
  const kelvin = temperatureC + KELVIN_AT_ZERO_CELSIUS;
  if (kelvin < 0) throw new CalcInputError('temperatureC', 'temperatureC is below absolute zero');
  return kelvin;
}

/**
 * Converts a thermodynamic temperature from kelvin to degrees Celsius: °C = K − 273.15.
 *
 * @param temperatureK - thermodynamic temperature [K], ≥ 0
 * @returns temperature [°C]
 * @example kelvinToCelsius(373.15) // 100
 * References: 1. BIPM, SI Brochure, 9th edition, 2019.
 */
export function kelvinToCelsius(temperatureK: number): number {
  requireFinite(temperatureK, 'temperatureK');
  if (temperatureK < 0) throw new CalcInputError('temperatureK', 'temperatureK must not be negative');
  return temperatureK - KELVIN_AT_ZERO_CELSIUS;
}

/**
 * Converts a temperature difference from kelvin (or °C) to degrees Fahrenheit (or Rankine): ΔF = ΔK · 9/5.
 *
 * @param differenceK - temperature difference [K] (equal to a difference in °C)
 * @returns temperature difference [°F]
 * @example deltaCelsiusToFahrenheit(10) // 18
 * References: 1. NIST SP 811 (2008), Appendix B.9.
 */
export function deltaCelsiusToFahrenheit(differenceK: number): number {
  requireFinite(differenceK, 'differenceK');
  return differenceK / KELVIN_PER_FAHRENHEIT_DEGREE;
}

/**
 * Converts a temperature difference from degrees Fahrenheit to kelvin (or °C): ΔK = ΔF · 5/9.
 *
 * @param differenceF - temperature difference [°F]
 * @returns temperature difference [K]
 * @example deltaFahrenheitToCelsius(18) // 10
 * References: 1. NIST SP 811 (2008), Appendix B.9.
 */
export function deltaFahrenheitToCelsius(differenceF: number): number {
  requireFinite(differenceF, 'differenceF');
  return differenceF * KELVIN_PER_FAHRENHEIT_DEGREE;
}

// ---------------------------------------------------------------------------------------------------------
// Length

/**
 * Converts metres to millimetres: mm = m · 1000.
 * @param lengthM - length [m]
 * @returns length [mm]
 * @example metresToMillimetres(0.05) // 50
 */
export function metresToMillimetres(lengthM: number): number {
  requireFinite(lengthM, 'lengthM');
  return lengthM * 1000;
}

/**
 * Converts millimetres to metres: m = mm / 1000.
 * @param lengthMm - length [mm]
 * @returns length [m]
 * @example millimetresToMetres(114.3) // 0.1143
 */
export function millimetresToMetres(lengthMm: number): number {
  requireFinite(lengthMm, 'lengthMm');
  return lengthMm / 1000;
}

/**
 * Converts metres to inches: in = m / 0.0254.
 * @param lengthM - length [m]
 * @returns length [in]
 * @example metresToInches(0.1143) // 4.5 (NPS 4 pipe OD, ASME B36.10M)
 * References: 1. International Yard and Pound Agreement (1959).
 */
export function metresToInches(lengthM: number): number {
  requireFinite(lengthM, 'lengthM');
  return lengthM / METRES_PER_INCH;
}

/**
 * Converts inches to metres: m = in · 0.0254.
 * @param lengthIn - length [in]
 * @returns length [m]
 * @example inchesToMetres(1) // 0.0254
 * References: 1. International Yard and Pound Agreement (1959).
 */
export function inchesToMetres(lengthIn: number): number {
  requireFinite(lengthIn, 'lengthIn');
  return lengthIn * METRES_PER_INCH;
}

/**
 * Converts metres to feet: ft = m / 0.3048.
 * @param lengthM - length [m]
 * @returns length [ft]
 * @example metresToFeet(0.3048) // 1
 */
export function metresToFeet(lengthM: number): number {
  requireFinite(lengthM, 'lengthM');
  return lengthM / METRES_PER_FOOT;
}

/**
 * Converts feet to metres: m = ft · 0.3048.
 * @param lengthFt - length [ft]
 * @returns length [m]
 * @example feetToMetres(100) // 30.48
 */
export function feetToMetres(lengthFt: number): number {
  requireFinite(lengthFt, 'lengthFt');
  return lengthFt * METRES_PER_FOOT;
}

// ---------------------------------------------------------------------------------------------------------
// Heat flow, flux, coefficients and conductivity

/**
 * Converts a linear heat flow from W/m to Btu/(h·ft): 1 Btu/(h·ft) = (1055.05585262 / 3600) / 0.3048 W/m.
 * @param heatFlowWPerM - heat flow per length of pipe [W/m]
 * @returns heat flow per length [Btu/(h·ft)]
 * @example wattsPerMetreToBtuPerHourFoot(100) // ≈ 104.002
 * References: 1. NIST SP 811 (2008), Appendix B.
 */
export function wattsPerMetreToBtuPerHourFoot(heatFlowWPerM: number): number {
  requireFinite(heatFlowWPerM, 'heatFlowWPerM');
  return (heatFlowWPerM * METRES_PER_FOOT) / W_PER_BTU_PER_H;
}

/**
 * Converts a linear heat flow from Btu/(h·ft) to W/m.
 * @param heatFlowBtuPerHFt - heat flow per length [Btu/(h·ft)]
 * @returns heat flow per length [W/m]
 * @example btuPerHourFootToWattsPerMetre(1) // ≈ 0.961504
 */
export function btuPerHourFootToWattsPerMetre(heatFlowBtuPerHFt: number): number {
  requireFinite(heatFlowBtuPerHFt, 'heatFlowBtuPerHFt');
  return (heatFlowBtuPerHFt * W_PER_BTU_PER_H) / METRES_PER_FOOT;
}

/**
 * Converts a heat flux from W/m² to Btu/(h·ft²).
 * @param heatFluxWPerM2 - heat flux [W/m²]
 * @returns heat flux [Btu/(h·ft²)]
 * @example wattsPerSquareMetreToBtuPerHourSquareFoot(3.15459) // ≈ 1
 */
export function wattsPerSquareMetreToBtuPerHourSquareFoot(heatFluxWPerM2: number): number {
  requireFinite(heatFluxWPerM2, 'heatFluxWPerM2');
  return (heatFluxWPerM2 * METRES_PER_FOOT ** 2) / W_PER_BTU_PER_H;
}

/**
 * Converts a heat flux from Btu/(h·ft²) to W/m².
 * @param heatFluxBtuPerHFt2 - heat flux [Btu/(h·ft²)]
 * @returns heat flux [W/m²]
 * @example btuPerHourSquareFootToWattsPerSquareMetre(1) // ≈ 3.154591
 */
export function btuPerHourSquareFootToWattsPerSquareMetre(heatFluxBtuPerHFt2: number): number {
  requireFinite(heatFluxBtuPerHFt2, 'heatFluxBtuPerHFt2');
  return (heatFluxBtuPerHFt2 * W_PER_BTU_PER_H) / METRES_PER_FOOT ** 2;
}

/**
 * Converts a heat-transfer coefficient from W/(m²·K) to Btu/(h·ft²·°F).
 * @param coefficientWPerM2K - heat-transfer coefficient [W/(m²·K)]
 * @returns heat-transfer coefficient [Btu/(h·ft²·°F)]
 * @example wattsPerSquareMetreKelvinToBtuPerHourSquareFootFahrenheit(5.678263) // ≈ 1
 */
export function wattsPerSquareMetreKelvinToBtuPerHourSquareFootFahrenheit(coefficientWPerM2K: number): number {
  requireFinite(coefficientWPerM2K, 'coefficientWPerM2K');
  return (coefficientWPerM2K * METRES_PER_FOOT ** 2 * KELVIN_PER_FAHRENHEIT_DEGREE) / W_PER_BTU_PER_H;
}

/**
 * Converts a heat-transfer coefficient from Btu/(h·ft²·°F) to W/(m²·K).
 * @param coefficientBtuPerHFt2F - heat-transfer coefficient [Btu/(h·ft²·°F)]
 * @returns heat-transfer coefficient [W/(m²·K)]
 * @example btuPerHourSquareFootFahrenheitToWattsPerSquareMetreKelvin(1) // ≈ 5.678263
 */
export function btuPerHourSquareFootFahrenheitToWattsPerSquareMetreKelvin(coefficientBtuPerHFt2F: number): number {
  requireFinite(coefficientBtuPerHFt2F, 'coefficientBtuPerHFt2F');
  return (coefficientBtuPerHFt2F * W_PER_BTU_PER_H) / (METRES_PER_FOOT ** 2 * KELVIN_PER_FAHRENHEIT_DEGREE);
}

/**
 * Converts a thermal conductivity from W/(m·K) to Btu·in/(h·ft²·°F), the unit of US insulation tables.
 * @param conductivityWPerMK - thermal conductivity [W/(m·K)]
 * @returns thermal conductivity [Btu·in/(h·ft²·°F)]
 * @example wattsPerMetreKelvinToBtuInchPerHourSquareFootFahrenheit(0.1442279) // ≈ 1
 * References: 1. NIST SP 811 (2008), Appendix B.8 ("thermal conductivity").
 */
export function wattsPerMetreKelvinToBtuInchPerHourSquareFootFahrenheit(conductivityWPerMK: number): number {
  requireFinite(conductivityWPerMK, 'conductivityWPerMK');
  return (
    (conductivityWPerMK * METRES_PER_FOOT ** 2 * KELVIN_PER_FAHRENHEIT_DEGREE) / (W_PER_BTU_PER_H * METRES_PER_INCH)
  );
}

/**
 * Converts a thermal conductivity from Btu·in/(h·ft²·°F) to W/(m·K).
 * @param conductivityBtuInPerHFt2F - thermal conductivity [Btu·in/(h·ft²·°F)]
 * @returns thermal conductivity [W/(m·K)]
 * @example btuInchPerHourSquareFootFahrenheitToWattsPerMetreKelvin(0.25) // ≈ 0.036057
 * References: 1. NIST SP 811 (2008), Appendix B.8: 1 Btu_IT·in/(h·ft²·°F) = 0.1442279 W/(m·K).
 */
export function btuInchPerHourSquareFootFahrenheitToWattsPerMetreKelvin(conductivityBtuInPerHFt2F: number): number {
  requireFinite(conductivityBtuInPerHFt2F, 'conductivityBtuInPerHFt2F');
  return (
    (conductivityBtuInPerHFt2F * W_PER_BTU_PER_H * METRES_PER_INCH) / (METRES_PER_FOOT ** 2 * KELVIN_PER_FAHRENHEIT_DEGREE)
  );
}

/**
 * Converts a heat flow from watts to Btu per hour.
 * @param heatFlowW - heat flow [W]
 * @returns heat flow [Btu/h]
 * @example wattsToBtuPerHour(1000) // ≈ 3412.14
 */
export function wattsToBtuPerHour(heatFlowW: number): number {
  requireFinite(heatFlowW, 'heatFlowW');
  return heatFlowW / W_PER_BTU_PER_H;
}

/**
 * Converts a heat flow from Btu per hour to watts.
 * @param heatFlowBtuPerH - heat flow [Btu/h]
 * @returns heat flow [W]
 * @example btuPerHourToWatts(1) // ≈ 0.293071
 */
export function btuPerHourToWatts(heatFlowBtuPerH: number): number {
  requireFinite(heatFlowBtuPerH, 'heatFlowBtuPerH');
  return heatFlowBtuPerH * W_PER_BTU_PER_H;
}

// ---------------------------------------------------------------------------------------------------------
// Speed, mass flow, specific heat, energy, mass per length

/**
 * Converts a speed from m/s to miles per hour.
 * @param speedMS - speed [m/s]
 * @returns speed [mph]
 * @example metresPerSecondToMilesPerHour(0.44704) // 1
 */
export function metresPerSecondToMilesPerHour(speedMS: number): number {
  requireFinite(speedMS, 'speedMS');
  return speedMS / METRES_PER_SECOND_PER_MPH;
}

/**
 * Converts a speed from miles per hour to m/s.
 * @param speedMph - speed [mph]
 * @returns speed [m/s]
 * @example milesPerHourToMetresPerSecond(15) // 6.7056
 */
export function milesPerHourToMetresPerSecond(speedMph: number): number {
  requireFinite(speedMph, 'speedMph');
  return speedMph * METRES_PER_SECOND_PER_MPH;
}

/**
 * Converts a speed from m/s to feet per minute.
 * @param speedMS - speed [m/s]
 * @returns speed [ft/min]
 * @example metresPerSecondToFeetPerMinute(0.508) // 100
 */
export function metresPerSecondToFeetPerMinute(speedMS: number): number {
  requireFinite(speedMS, 'speedMS');
  return (speedMS * 60) / METRES_PER_FOOT;
}

/**
 * Converts a speed from feet per minute to m/s.
 * @param speedFtPerMin - speed [ft/min]
 * @returns speed [m/s]
 * @example feetPerMinuteToMetresPerSecond(100) // 0.508
 */
export function feetPerMinuteToMetresPerSecond(speedFtPerMin: number): number {
  requireFinite(speedFtPerMin, 'speedFtPerMin');
  return (speedFtPerMin * METRES_PER_FOOT) / 60;
}

/**
 * Converts a mass flow from kg/s to lb/h.
 * @param massFlowKgPerS - mass flow [kg/s]
 * @returns mass flow [lb/h]
 * @example kilogramsPerSecondToPoundsPerHour(1) // ≈ 7936.64
 */
export function kilogramsPerSecondToPoundsPerHour(massFlowKgPerS: number): number {
  requireFinite(massFlowKgPerS, 'massFlowKgPerS');
  return (massFlowKgPerS * SECONDS_PER_HOUR) / KILOGRAMS_PER_POUND;
}

/**
 * Converts a mass flow from lb/h to kg/s.
 * @param massFlowLbPerH - mass flow [lb/h]
 * @returns mass flow [kg/s]
 * @example poundsPerHourToKilogramsPerSecond(7936.641438655593) // ≈ 1
 */
export function poundsPerHourToKilogramsPerSecond(massFlowLbPerH: number): number {
  requireFinite(massFlowLbPerH, 'massFlowLbPerH');
  return (massFlowLbPerH * KILOGRAMS_PER_POUND) / SECONDS_PER_HOUR;
}

/**
 * Converts a specific heat from J/(kg·K) to Btu/(lb·°F): 1 Btu_IT/(lb·°F) = 4186.8 J/(kg·K) exactly.
 * @param specificHeatJPerKgK - specific heat [J/(kg·K)]
 * @returns specific heat [Btu/(lb·°F)]
 * @example joulesPerKilogramKelvinToBtuPerPoundFahrenheit(4186.8) // 1
 * References: 1. NIST SP 811 (2008), Appendix B.8.
 */
export function joulesPerKilogramKelvinToBtuPerPoundFahrenheit(specificHeatJPerKgK: number): number {
  requireFinite(specificHeatJPerKgK, 'specificHeatJPerKgK');
  return specificHeatJPerKgK / J_PER_KG_K_PER_BTU_PER_LB_F;
}

/**
 * Converts a specific heat from Btu/(lb·°F) to J/(kg·K).
 * @param specificHeatBtuPerLbF - specific heat [Btu/(lb·°F)]
 * @returns specific heat [J/(kg·K)]
 * @example btuPerPoundFahrenheitToJoulesPerKilogramKelvin(0.11) // ≈ 460.5 (carbon steel)
 */
export function btuPerPoundFahrenheitToJoulesPerKilogramKelvin(specificHeatBtuPerLbF: number): number {
  requireFinite(specificHeatBtuPerLbF, 'specificHeatBtuPerLbF');
  return specificHeatBtuPerLbF * J_PER_KG_K_PER_BTU_PER_LB_F;
}

/**
 * Converts energy from kilowatt-hours to million Btu (MMBtu, IT Btu).
 * @param energyKWh - energy [kWh]
 * @returns energy [MMBtu]
 * @example kilowattHoursToMillionBtu(293.07107) // ≈ 1
 */
export function kilowattHoursToMillionBtu(energyKWh: number): number {
  requireFinite(energyKWh, 'energyKWh');
  return (energyKWh * JOULES_PER_KWH) / (JOULES_PER_BTU_IT * 1e6);
}

/**
 * Converts energy from million Btu (MMBtu, IT Btu) to kilowatt-hours.
 * @param energyMMBtu - energy [MMBtu]
 * @returns energy [kWh]
 * @example millionBtuToKilowattHours(1) // ≈ 293.07107
 */
export function millionBtuToKilowattHours(energyMMBtu: number): number {
  requireFinite(energyMMBtu, 'energyMMBtu');
  return (energyMMBtu * JOULES_PER_BTU_IT * 1e6) / JOULES_PER_KWH;
}

/**
 * Converts energy from kilowatt-hours to therms (1 therm = 100 000 Btu_IT = 105.505585262 MJ).
 * @param energyKWh - energy [kWh]
 * @returns energy [therm]
 * @remarks The US "therm" of some statutes is 100 000 Btu at 59 °F (105.4804 MJ), 0.024 % smaller; this
 *   package uses the IT-Btu therm throughout.
 * @example kilowattHoursToTherms(29.3071) // ≈ 1
 */
export function kilowattHoursToTherms(energyKWh: number): number {
  requireFinite(energyKWh, 'energyKWh');
  return (energyKWh * JOULES_PER_KWH) / (JOULES_PER_BTU_IT * BTU_PER_THERM);
}

/**
 * Converts energy from therms (IT Btu) to kilowatt-hours.
 * @param energyTherm - energy [therm]
 * @returns energy [kWh]
 * @example thermsToKilowattHours(1) // ≈ 29.3071
 */
export function thermsToKilowattHours(energyTherm: number): number {
  requireFinite(energyTherm, 'energyTherm');
  return (energyTherm * JOULES_PER_BTU_IT * BTU_PER_THERM) / JOULES_PER_KWH;
}

/**
 * Converts energy from kilowatt-hours to gigajoules: GJ = kWh · 0.0036.
 * @param energyKWh - energy [kWh]
 * @returns energy [GJ]
 * @example kilowattHoursToGigajoules(1000) // 3.6
 */
export function kilowattHoursToGigajoules(energyKWh: number): number {
  requireFinite(energyKWh, 'energyKWh');
  return (energyKWh * JOULES_PER_KWH) / 1e9;
}

/**
 * Converts energy from gigajoules to kilowatt-hours: kWh = GJ / 0.0036.
 * @param energyGJ - energy [GJ]
 * @returns energy [kWh]
 * @example gigajoulesToKilowattHours(3.6) // 1000
 */
export function gigajoulesToKilowattHours(energyGJ: number): number {
  requireFinite(energyGJ, 'energyGJ');
  return (energyGJ * 1e9) / JOULES_PER_KWH;
}

/**
 * Converts a mass per length from kg/m to lb/ft.
 * @param massKgPerM - mass per length [kg/m]
 * @returns mass per length [lb/ft]
 * @example kilogramsPerMetreToPoundsPerFoot(5.44) // ≈ 3.66 (NPS 2 Sch 40, ASME B36.10M)
 */
export function kilogramsPerMetreToPoundsPerFoot(massKgPerM: number): number {
  requireFinite(massKgPerM, 'massKgPerM');
  return (massKgPerM * METRES_PER_FOOT) / KILOGRAMS_PER_POUND;
}

/**
 * Converts a mass per length from lb/ft to kg/m.
 * @param massLbPerFt - mass per length [lb/ft]
 * @returns mass per length [kg/m]
 * @example poundsPerFootToKilogramsPerMetre(1) // ≈ 1.488164
 */
export function poundsPerFootToKilogramsPerMetre(massLbPerFt: number): number {
  requireFinite(massLbPerFt, 'massLbPerFt');
  return (massLbPerFt * KILOGRAMS_PER_POUND) / METRES_PER_FOOT;
}

// ---------------------------------------------------------------------------------------------------------
// Display helpers

/** How a display rounding treats a value between two steps. */
export type RoundingDirection = 'nearest' | 'up';

// Binary floating point turns exact steps such as 2.375 in → 19 eighths into 18.999999…; anything this close
// to a step counts as on it, so rounding up never jumps a whole step because of representation noise.
const STEP_TOLERANCE = 1e-9;

function roundToStep(value: number, steps: number, direction: RoundingDirection): number {
  const nearest = Math.round(steps);
  if (Math.abs(steps - nearest) < STEP_TOLERANCE) return nearest;
  return direction === 'up' ? Math.ceil(steps) : Math.round(steps);
}

/**
 * Thickness in whole millimetres for display: round(t · 1000) (or the ceiling with `direction: 'up'`).
 *
 * @param thicknessM - thickness [m], ≥ 0
 * @param direction - `'nearest'` (default, half away from zero) or `'up'`
 * @returns thickness [mm], an integer
 * @remarks Display rounding only; sizing rounds up to the site's thickness series elsewhere.
 * @example thicknessToWholeMillimetres(0.0524) // 52
 * References: common practice (results in whole millimetres).
 */
export function thicknessToWholeMillimetres(thicknessM: number, direction: RoundingDirection = 'nearest'): number {
  requireFinite(thicknessM, 'thicknessM');
  if (thicknessM < 0) throw new CalcInputError('thicknessM', 'thicknessM must not be negative');
  return roundToStep(thicknessM, thicknessM * 1000, direction);
}

/**
 * Thickness to the nearest ⅛ inch for display: round(t / 0.0254 · 8) / 8 (or rounded up).
 *
 * @param thicknessM - thickness [m], ≥ 0
 * @param direction - `'nearest'` (default) or `'up'`
 * @returns thickness [in], a multiple of 0.125
 * @example thicknessToEighthInch(0.052) // 2 (2.047 in)
 * References: common practice (US insulation thicknesses quoted in eighths of an inch or coarser).
 */
export function thicknessToEighthInch(thicknessM: number, direction: RoundingDirection = 'nearest'): number {
  requireFinite(thicknessM, 'thicknessM');
  if (thicknessM < 0) throw new CalcInputError('thicknessM', 'thicknessM must not be negative');
  return roundToStep(thicknessM, (thicknessM / METRES_PER_INCH) * 8, direction) / 8;
}

/**
 * Formats inches that are a multiple of ⅛ as a whole number and a reduced fraction, e.g. `2 3/8`.
 *
 * @param inches - length [in]; rounded to the nearest ⅛ first
 * @returns text such as `"1/2"`, `"2"`, `"2 3/8"` (ASCII fraction, no unit)
 * @example formatEighthsOfInch(2.375) // "2 3/8"
 * References: common practice.
 */
export function formatEighthsOfInch(inches: number): string {
  requireFinite(inches, 'inches');
  const sign = inches < 0 ? '-' : '';
  const eighths = Math.round(Math.abs(inches) * 8);
  const whole = Math.floor(eighths / 8);
  let numerator = eighths % 8;
  let denominator = 8;
  while (numerator > 0 && numerator % 2 === 0) {
    numerator /= 2;
    denominator /= 2;
  }
  if (numerator === 0) return `${sign}${whole}`;
  return whole === 0 ? `${sign}${numerator}/${denominator}` : `${sign}${whole} ${numerator}/${denominator}`;
}

/**
 * Rounds a number to a number of significant figures: round(x / 10^(e−s+1)) · 10^(e−s+1), e = ⌊log10|x|⌋.
 *
 * @param value - any finite number
 * @param significantFigures - integer ≥ 1 (default 3, as heat loss is shown)
 * @returns the rounded number
 * @example roundToSignificantFigures(98.24, 3) // 98.2
 */
export function roundToSignificantFigures(value: number, significantFigures = 3): number {
  requireFinite(value, 'value');
  if (!Number.isInteger(significantFigures) || significantFigures < 1 || significantFigures > 21) {
    throw new CalcInputError('significantFigures', 'significantFigures must be an integer from 1 to 21');
  }
  if (value === 0) return 0;
  return Number(value.toPrecision(significantFigures));
}

/**
 * Formats a number to significant figures in plain positional notation (never exponent form).
 *
 * @param value - any finite number
 * @param significantFigures - integer ≥ 1 (default 3)
 * @returns text such as `"98.2"`, `"1230"`, `"0.0123"`, `"-4.50"`
 * @remarks Trailing zeros that are significant are kept ("4.50"); zeros left of the decimal point that
 *   only place the value ("1230") are not marked as significant or not.
 * @example formatSignificantFigures(1234.5, 3) // "1230"
 * References: common practice (heat loss shown to 3 significant figures).
 */
export function formatSignificantFigures(value: number, significantFigures = 3): string {
  const rounded = roundToSignificantFigures(value, significantFigures);
  if (rounded === 0) return '0';
  const exponent = Math.floor(Math.log10(Math.abs(rounded)) + 1e-12);
  const decimals = Math.max(0, significantFigures - 1 - exponent);
  return rounded.toFixed(Math.min(decimals, 100));
}
