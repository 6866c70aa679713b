import fc from 'fast-check';

import {
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  formatEighthsOfInch,
  formatSignificantFigures,
  roundToSignificantFigures,
  thicknessToEighthInch,
  thicknessToWholeMillimetres,
  wattsPerMetreToBtuPerHourFoot,
  btuPerHourFootToWattsPerMetre,
} from './units';

describe('display helpers', () => {
  it('when a thickness is shown in millimetres, then it is a whole number, rounded or rounded up', () => {
    expect(thicknessToWholeMillimetres(0.0524)).toBe(52);
    expect(thicknessToWholeMillimetres(0.0525)).toBe(53);
    expect(thicknessToWholeMillimetres(0.0521, 'up')).toBe(53);
    // 0.06 m is exactly 60 mm although 0.06 * 1000 is not exact in binary: rounding up must not give 61.
    expect(thicknessToWholeMillimetres(0.06, 'up')).toBe(60);
    expect(thicknessToWholeMillimetres(0.07, 'up')).toBe(70);
  });

  it('when a thickness is shown in inches, then it is the nearest (or next) eighth', () => {
    expect(thicknessToEighthInch(0.052)).toBe(2); // 2.047 in = 16.38 eighths
    expect(thicknessToEighthInch(0.0524)).toBe(2.125); // 2.063 in = 16.50 eighths
    expect(thicknessToEighthInch(0.0524, 'up')).toBe(2.125);
    expect(thicknessToEighthInch(2.375 * 0.0254, 'up')).toBe(2.375);
    expect(thicknessToEighthInch(0.0254 * 1.06)).toBe(1.0);
  });

  it('when eighths are formatted, then fractions are reduced', () => {
    expect(formatEighthsOfInch(2.375)).toBe('2 3/8');
    expect(formatEighthsOfInch(0.5)).toBe('1/2');
    expect(formatEighthsOfInch(3)).toBe('3');
    expect(formatEighthsOfInch(1.25)).toBe('1 1/4');
  });

  it('when heat loss is formatted to 3 significant figures, then no exponent form appears', () => {
    expect(formatSignificantFigures(98.24)).toBe('98.2');
    expect(formatSignificantFigures(1234.5)).toBe('1230');
    expect(formatSignificantFigures(0.012345)).toBe('0.0123');
    expect(formatSignificantFigures(-4.5)).toBe('-4.50');
    expect(formatSignificantFigures(999.7)).toBe('1000');
    expect(formatSignificantFigures(0.0099996)).toBe('0.0100');
    expect(formatSignificantFigures(123456789)).toBe('123000000');
    expect(formatSignificantFigures(0)).toBe('0');
    expect(roundToSignificantFigures(98.25, 2)).toBe(98);
  });

  it('when the significant figures are invalid, then it throws with the field name', () => {
    expect(() => formatSignificantFigures(1, 0)).toThrow(/significantFigures/);
    expect(() => formatSignificantFigures(Number.NaN)).toThrow(/value/);
  });

  it('when any finite value is formatted, then the text parses back to the rounded value', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e12, max: 1e12, noNaN: true }), fc.integer({ min: 1, max: 6 }), (v, sf) => {
        const text = formatSignificantFigures(v, sf);
        expect(text).not.toMatch(/e/i);
        expect(Number(text)).toBeCloseTo(roundToSignificantFigures(v, sf), 6);
      }),
    );
  });
});

describe('round trips', () => {
  it('when converted SI → US → SI, then the input returns', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), (v) => {
        expect(fahrenheitToCelsius(celsiusToFahrenheit(v))).toBeCloseTo(v, 6);
        expect(btuPerHourFootToWattsPerMetre(wattsPerMetreToBtuPerHourFoot(v))).toBeCloseTo(v, 6);
      }),
    );
  });

  it('when the input is not a finite number, then it throws with the field name', () => {
    expect(() => celsiusToFahrenheit(Number.POSITIVE_INFINITY)).toThrow(/temperatureC/);
  });
});
