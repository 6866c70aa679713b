import * as fc from 'fast-check';

import {
  composeLinear,
  conductivityCoefficientsFromDisplay,
  conductivityCoefficientsToDisplay,
  formatInputNumber,
  fromDisplay,
  parseNumber,
  toDisplay,
  unitOf,
  type Quantity,
} from './units';

const QUANTITIES: Quantity[] = [
  'temperature', 'temperatureDelta', 'thickness', 'diameter', 'length', 'speed', 'heatLossPerLength', 'heatFlux',
  'heatFlow', 'conductivity', 'filmCoefficient', 'massFlow', 'specificHeat', 'massPerLength', 'energy', 'co2Factor',
  'co2Mass', 'percent', 'fraction', 'pricePerEnergy', 'hours', 'seconds',
];

describe('display units', () => {
  it('when a value goes SI → US → SI for every quantity, then it comes back within 1e-12 relative', () => {
    for (const q of QUANTITIES) {
      fc.assert(
        fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), (si) => {
          const back = fromDisplay(q, 'US', toDisplay(q, 'US', si));
          return Math.abs(back - si) <= 1e-12 * Math.max(1, Math.abs(si));
        }),
      );
    }
  });

  it('when known equivalents are converted, then they match published definitions', () => {
    expect(toDisplay('temperature', 'US', 100)).toBeCloseTo(212, 10);
    expect(toDisplay('temperature', 'US', -40)).toBeCloseTo(-40, 10);
    expect(toDisplay('temperatureDelta', 'US', 10)).toBeCloseTo(18, 10);
    expect(toDisplay('thickness', 'US', 0.0508)).toBeCloseTo(2, 10);
    expect(toDisplay('thickness', 'SI', 0.05)).toBeCloseTo(50, 10);
    // 1 W/m = 3.41214 Btu/h ÷ 3.28084 ft = 1.04002 Btu/(h·ft); 1 W/(m·K) = 6.93347 Btu·in/(h·ft²·°F)
    expect(toDisplay('heatLossPerLength', 'US', 1)).toBeCloseTo(1.04002, 4);
    expect(toDisplay('conductivity', 'US', 1)).toBeCloseTo(6.93347, 4);
    expect(toDisplay('filmCoefficient', 'US', 5.678263)).toBeCloseTo(1, 5);
    expect(toDisplay('speed', 'US', 0.44704)).toBeCloseTo(1, 10);
    expect(toDisplay('energy', 'US', 293.07107)).toBeCloseTo(1, 6);
    expect(toDisplay('specificHeat', 'US', 4186.8)).toBeCloseTo(1, 10);
    expect(toDisplay('fraction', 'SI', 0.85)).toBeCloseTo(85, 10);
  });

  it('when asked for suffixes, then each system names its own unit', () => {
    expect(unitOf('temperature', 'SI').suffix).toBe('°C');
    expect(unitOf('temperature', 'US').suffix).toBe('°F');
    expect(unitOf('thickness', 'SI').spoken).toBe('millimetres');
    expect(unitOf('heatLossPerLength', 'US').suffix).toBe('Btu/(h·ft)');
  });
});

describe('k(T) polynomials across unit systems', () => {
  it('when coefficients are carried to °F, then the polynomial gives the same conductivity at the same temperature', () => {
    const si = [0.034, 0.0001, 2.5e-7];
    const us = conductivityCoefficientsToDisplay('US', si);
    for (const tC of [-50, 0, 100, 350]) {
      const kSI = si[0] + si[1] * tC + si[2] * tC * tC;
      const tF = tC * 1.8 + 32;
      const kUS = us[0] + us[1] * tF + us[2] * tF * tF;
      expect(kUS).toBeCloseTo(toDisplay('conductivity', 'US', kSI), 10);
    }
  });

  it('when coefficients go SI → US → SI, then they come back', () => {
    const si = [0.052, 0.0001, 1e-7];
    const back = conductivityCoefficientsFromDisplay('US', conductivityCoefficientsToDisplay('US', si));
    back.forEach((c, i) => expect(c).toBeCloseTo(si[i], 14));
  });

  it('when a polynomial is composed with a linear map, then it matches direct evaluation', () => {
    const p = [1, 2, 3];
    const q = composeLinear(p, 2, 0.5); // p(2 + 0.5x)
    const x = 3;
    const y = 2 + 0.5 * x;
    expect(q[0] + q[1] * x + q[2] * x * x).toBeCloseTo(p[0] + p[1] * y + p[2] * y * y, 12);
  });
});

describe('typing numbers', () => {
  it('when a person types a number with a decimal comma or spaces, then it parses', () => {
    expect(parseNumber(' 114,3 ')).toBe(114.3);
    expect(parseNumber('-40')).toBe(-40);
    expect(parseNumber('.5')).toBe(0.5);
    expect(parseNumber('1e3')).toBe(1000);
  });

  it('when the text is not one number, then it is refused', () => {
    for (const t of ['', 'abc', '1.2.3', '5 mm', '--1', '1,2,3']) expect(parseNumber(t)).toBeNull();
  });

  it('when a converted value is shown in an input, then float noise is gone and the value survives a re-parse', () => {
    expect(formatInputNumber(0.1 + 0.2)).toBe('0.3');
    expect(formatInputNumber(114.3)).toBe('114.3');
    expect(formatInputNumber(4.5)).toBe('4.5');
    expect(formatInputNumber(-17.7777777777)).toBe('-17.7778');
    expect(formatInputNumber(0)).toBe('0');
  });

  it('when an SI value is shown in US units and the shown text is read back and shown in SI, then the SI text is unchanged', () => {
    // The drift a person would see by toggling units: SI text → US text → SI text.
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 99999 }), fc.constantFrom<Quantity>('diameter', 'temperature', 'length', 'heatLossPerLength'), (n, q) => {
        const siText = formatInputNumber(n / 10);
        const si = fromDisplay(q, 'SI', parseNumber(siText)!);
        const usText = formatInputNumber(toDisplay(q, 'US', si));
        // SI stays the source of truth; the SI text is regenerated from it, not from usText.
        const againSI = formatInputNumber(toDisplay(q, 'SI', si));
        return againSI === siText && usText.length > 0;
      }),
    );
  });
});
