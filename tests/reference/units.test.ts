/**
 * Reference checks of the unit conversions against an independent implementation.
 *
 * Source: js-quantities 1.8.0 (npm, J. Sanchez et al., MIT licence), its unit definitions table; an
 * independent library, so a wrong factor or a swapped direction in our code fails here.
 * Tolerance: js-quantities defines 1 BTU = 1055.056 J (the IT Btu rounded to 7 significant figures; exact value
 * 1055.05585262 J, NIST SP 811 App. B.8), a relative difference of 1.4e-7; every Btu-based check therefore
 * allows a relative 1e-6, every other check (exact definitional factors in both) 1e-12 for float noise.
 */
// @ts-expect-error -- js-quantities ships without type declarations (TS7016)
import QtyUntyped from 'js-quantities';

import {
  btuInchPerHourSquareFootFahrenheitToWattsPerMetreKelvin,
  btuPerHourFootToWattsPerMetre,
  btuPerHourSquareFootFahrenheitToWattsPerSquareMetreKelvin,
  btuPerHourSquareFootToWattsPerSquareMetre,
  btuPerHourToWatts,
  btuPerPoundFahrenheitToJoulesPerKilogramKelvin,
  celsiusToFahrenheit,
  celsiusToKelvin,
  deltaCelsiusToFahrenheit,
  deltaFahrenheitToCelsius,
  fahrenheitToCelsius,
  feetPerMinuteToMetresPerSecond,
  feetToMetres,
  gigajoulesToKilowattHours,
  inchesToMetres,
  joulesPerKilogramKelvinToBtuPerPoundFahrenheit,
  kelvinToCelsius,
  kilogramsPerMetreToPoundsPerFoot,
  kilogramsPerSecondToPoundsPerHour,
  kilowattHoursToGigajoules,
  kilowattHoursToMillionBtu,
  kilowattHoursToTherms,
  metresPerSecondToFeetPerMinute,
  metresPerSecondToMilesPerHour,
  metresToFeet,
  metresToInches,
  metresToMillimetres,
  millimetresToMetres,
  millionBtuToKilowattHours,
  milesPerHourToMetresPerSecond,
  poundsPerFootToKilogramsPerMetre,
  poundsPerHourToKilogramsPerSecond,
  thermsToKilowattHours,
  wattsPerMetreKelvinToBtuInchPerHourSquareFootFahrenheit,
  wattsPerMetreToBtuPerHourFoot,
  wattsPerSquareMetreKelvinToBtuPerHourSquareFootFahrenheit,
  wattsPerSquareMetreToBtuPerHourSquareFoot,
  wattsToBtuPerHour,
} from '../../shared/calc/units';

type Quantity = { to(unit: string): { scalar: number } };
const Qty = QtyUntyped as unknown as (text: string) => Quantity;

/** Value of `value from` expressed in `to`, by js-quantities. */
function library(value: number, from: string, to: string): number {
  return Qty(`${value} ${from}`).to(to).scalar;
}

function expectRelative(actual: number, expected: number, tolerance: number): void {
  if (expected === 0) {
    expect(Math.abs(actual)).toBeLessThan(1e-12);
    return;
  }
  expect(Math.abs(actual / expected - 1)).toBeLessThan(tolerance);
}

const EXACT = 1e-12;
const BTU = 1e-6;

describe('temperature (js-quantities: tempC/tempF/tempK are temperatures, degC/degF differences)', () => {
  it.each([-40, 0, 20, 100, 250, 650])('when %p °C is converted to °F and back, then it matches the library', (c) => {
    expectRelative(celsiusToFahrenheit(c), library(c, 'tempC', 'tempF'), EXACT);
    const f = library(c, 'tempC', 'tempF');
    expect(fahrenheitToCelsius(f)).toBeCloseTo(c, 9);
  });

  it.each([-273.15, -40, 0, 25, 600])('when %p °C is converted to K, then it matches the library', (c) => {
    expect(celsiusToKelvin(c)).toBeCloseTo(library(c, 'tempC', 'tempK'), 9);
    expect(kelvinToCelsius(library(c, 'tempC', 'tempK'))).toBeCloseTo(c, 9);
  });

  it.each([1, 10, 37.5, -20])('when a difference of %p K is converted to °F, then it matches the library', (d) => {
    expectRelative(deltaCelsiusToFahrenheit(d), library(d, 'degC', 'degF'), EXACT);
    expectRelative(deltaFahrenheitToCelsius(d), library(d, 'degF', 'degC'), EXACT);
  });

  it('when a temperature is converted as a difference by mistake, then the test would see it (140 °F is 60 °C, not 77.8)', () => {
    // Source: definition of the Fahrenheit scale, NIST SP 811 (2008) App. B.9: 140 °F = 60 °C exactly.
    expect(fahrenheitToCelsius(140)).toBeCloseTo(60, 12);
    expect(deltaFahrenheitToCelsius(140)).not.toBeCloseTo(60, 1);
  });

  it('when below absolute zero, then it throws', () => {
    expect(() => celsiusToKelvin(-300)).toThrow(/absolute zero/);
  });
});

describe('length', () => {
  it.each([0.0213, 0.1143, 1, 30.48])('when %p m is converted, then mm/in/ft match the library', (m) => {
    expectRelative(metresToMillimetres(m), library(m, 'm', 'mm'), EXACT);
    expectRelative(millimetresToMetres(m), library(m, 'mm', 'm'), EXACT);
    expectRelative(metresToInches(m), library(m, 'm', 'in'), EXACT);
    expectRelative(inchesToMetres(m), library(m, 'in', 'm'), EXACT);
    expectRelative(metresToFeet(m), library(m, 'm', 'ft'), EXACT);
    expectRelative(feetToMetres(m), library(m, 'ft', 'm'), EXACT);
  });
});

describe('heat flow, flux, coefficient, conductivity (IT Btu)', () => {
  it.each([1, 98.2, 1234])('when %p in SI is converted, then every Btu unit matches the library within 1e-6', (v) => {
    expectRelative(wattsPerMetreToBtuPerHourFoot(v), library(v, 'W/m', 'BTU/h*ft'), BTU);
    expectRelative(btuPerHourFootToWattsPerMetre(v), library(v, 'BTU/h*ft', 'W/m'), BTU);
    expectRelative(wattsPerSquareMetreToBtuPerHourSquareFoot(v), library(v, 'W/m^2', 'BTU/h*ft^2'), BTU);
    expectRelative(btuPerHourSquareFootToWattsPerSquareMetre(v), library(v, 'BTU/h*ft^2', 'W/m^2'), BTU);
    expectRelative(
      wattsPerSquareMetreKelvinToBtuPerHourSquareFootFahrenheit(v),
      library(v, 'W/m^2*degK', 'BTU/h*ft^2*degF'),
      BTU,
    );
    expectRelative(
      btuPerHourSquareFootFahrenheitToWattsPerSquareMetreKelvin(v),
      library(v, 'BTU/h*ft^2*degF', 'W/m^2*degK'),
      BTU,
    );
    expectRelative(
      wattsPerMetreKelvinToBtuInchPerHourSquareFootFahrenheit(v),
      library(v, 'W/m*degK', 'BTU*in/h*ft^2*degF'),
      BTU,
    );
    expectRelative(
      btuInchPerHourSquareFootFahrenheitToWattsPerMetreKelvin(v),
      library(v, 'BTU*in/h*ft^2*degF', 'W/m*degK'),
      BTU,
    );
    expectRelative(wattsToBtuPerHour(v), library(v, 'W', 'BTU/h'), BTU);
    expectRelative(btuPerHourToWatts(v), library(v, 'BTU/h', 'W'), BTU);
  });

  it('when 1 Btu·in/(h·ft²·°F) is converted, then it is 0.1442279 W/(m·K)', () => {
    // Source: NIST SP 811 (2008), Appendix B.8, "thermal conductivity": 1.442279 E-01 (7 s.f.).
    expect(btuInchPerHourSquareFootFahrenheitToWattsPerMetreKelvin(1)).toBeCloseTo(0.1442279, 7);
  });

  it('when 1 Btu/(h·ft²·°F) is converted, then it is 5.678263 W/(m²·K)', () => {
    // Source: NIST SP 811 (2008), Appendix B.8, "coefficient of heat transfer": 5.678263 E+00 (7 s.f.).
    expect(btuPerHourSquareFootFahrenheitToWattsPerSquareMetreKelvin(1)).toBeCloseTo(5.678263, 6);
  });
});

describe('speed, mass flow, specific heat, energy, mass per length', () => {
  it.each([0.5, 1, 6.7056, 20])('when %p is converted, then the library agrees', (v) => {
    expectRelative(metresPerSecondToMilesPerHour(v), library(v, 'm/s', 'mph'), EXACT);
    expectRelative(milesPerHourToMetresPerSecond(v), library(v, 'mph', 'm/s'), EXACT);
    expectRelative(metresPerSecondToFeetPerMinute(v), library(v, 'm/s', 'ft/min'), EXACT);
    expectRelative(feetPerMinuteToMetresPerSecond(v), library(v, 'ft/min', 'm/s'), EXACT);
    expectRelative(kilogramsPerSecondToPoundsPerHour(v), library(v, 'kg/s', 'lb/h'), EXACT);
    expectRelative(poundsPerHourToKilogramsPerSecond(v), library(v, 'lb/h', 'kg/s'), EXACT);
    expectRelative(kilogramsPerMetreToPoundsPerFoot(v), library(v, 'kg/m', 'lb/ft'), EXACT);
    expectRelative(poundsPerFootToKilogramsPerMetre(v), library(v, 'lb/ft', 'kg/m'), EXACT);
    expectRelative(kilowattHoursToGigajoules(v), library(v, 'kWh', 'GJ'), EXACT);
    expectRelative(gigajoulesToKilowattHours(v), library(v, 'GJ', 'kWh'), EXACT);
  });

  it.each([460, 4186.8, 4190])('when %p J/(kg·K) is converted, then the library agrees within 1e-6', (v) => {
    // The library derives Btu/(lb·°F) from its rounded BTU, hence the Btu tolerance.
    expectRelative(joulesPerKilogramKelvinToBtuPerPoundFahrenheit(v), library(v, 'J/kg*degK', 'BTU/lb*degF'), BTU);
    expectRelative(btuPerPoundFahrenheitToJoulesPerKilogramKelvin(v / 4186.8), v, EXACT);
  });

  it.each([1, 293.07107, 10000])('when %p kWh is converted to MMBtu, then the library agrees within 1e-6', (v) => {
    expectRelative(kilowattHoursToMillionBtu(v), library(v, 'kWh', 'BTU') / 1e6, BTU);
    expectRelative(millionBtuToKilowattHours(v), library(v * 1e6, 'BTU', 'kWh'), BTU);
  });

  it('when a therm is converted, then it equals 100 000 Btu (the library\'s "therm" is the 59 °F US therm)', () => {
    // Source: js-quantities; its "therm-US" is 105 480 400 J (100 000 Btu at 59 °F), 0.024 % below the
    // IT-Btu therm this package uses, so the check goes through 100 000 BTU instead.
    expectRelative(kilowattHoursToTherms(29.3071), library(29.3071, 'kWh', 'BTU') / 1e5, BTU);
    expectRelative(thermsToKilowattHours(1), library(1e5, 'BTU', 'kWh'), BTU);
    expectRelative(thermsToKilowattHours(1), library(1, 'therm', 'kWh'), 3e-4);
  });
});
