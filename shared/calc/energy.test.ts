import fc from 'fast-check';

import {
  annualEnergyAssessment,
  componentsEquivalentLengthM,
  energyCost,
  EXAMPLE_NATURAL_GAS_EMISSION_FACTOR,
  lineHeatFlowW,
  type EnergyBasis,
} from './energy';

const basis: EnergyBasis = {
  operatingHoursPerYear: 8760,
  heatSourceEfficiency: 0.9,
  price: { amount: '0.0731', per: 'kWh' },
  emissionFactor: { kgCo2PerKWh: 0.202, basis: 'example' },
};

describe('energy assessment', () => {
  it('when any heat flow is assessed, then every number is finite and the cost has two decimals', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e7, max: 1e7, noNaN: true }), (q) => {
        const a = annualEnergyAssessment(q, basis);
        expect(Number.isFinite(a.heat.kWh)).toBe(true);
        expect(Number.isFinite(a.co2.kg)).toBe(true);
        expect(a.cost.text).toMatch(/^\d+\.\d{2}$/);
      }),
    );
  });

  it('when the heat flow grows, then cost never falls', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1e6, noNaN: true }), fc.double({ min: 0, max: 1e6, noNaN: true }), (a, b) => {
        const [lo, hi] = a < b ? [a, b] : [b, a];
        expect(energyCost(hi, basis.price).amount.gte(energyCost(lo, basis.price).amount)).toBe(true);
      }),
    );
  });

  it('when the hours exceed a leap year, then it throws with the field', () => {
    expect(() => annualEnergyAssessment(1, { ...basis, operatingHoursPerYear: 9000 })).toThrow(/operatingHoursPerYear/);
  });
});

// The default equivalent lengths (valve 1.0 m, flange pair 0.5 m) are common practice, recalled rather than
// taken from a published table; these checks pin them and the arithmetic around them.
describe('valves and flanges by equivalent length (common practice)', () => {
  it('when the example emission factor is read, then its basis says it is from memory', () => {
    expect(EXAMPLE_NATURAL_GAS_EMISSION_FACTOR.basis).toMatch(/from memory/);
  });

  it('when a line has 2 valves and 4 flange pairs, then 4 m of pipe is added', () => {
    expect(componentsEquivalentLengthM({ valves: 2, flangePairs: 4, fittings: 6 })).toBe(4);
  });

  it('when the valves are bare, then they are charged at the bare heat loss', () => {
    // 100 m × 50 W/m + 2 valves × 1.0 m × 500 W/m = 5000 + 1000 = 6000 W.
    const q = lineHeatFlowW({ heatLossWPerM: 50, bareHeatLossWPerM: 500, lengthM: 100, counts: { valves: 2 }, componentsInsulated: false });
    expect(q.totalW).toBeCloseTo(6000, 9);
    expect(q.method).toMatch(/common practice/);
  });

  it('when the valves are insulated, then they are charged at the insulated heat loss', () => {
    const q = lineHeatFlowW({ heatLossWPerM: 50, lengthM: 100, counts: { valves: 2, flangePairs: 2 }, componentsInsulated: true });
    expect(q.totalW).toBeCloseTo(5150, 9);
  });

  it('when bare components lack a bare heat loss or counts are not whole, then it throws with the field', () => {
    expect(() => lineHeatFlowW({ heatLossWPerM: 50, lengthM: 1, counts: { valves: 1 }, componentsInsulated: false })).toThrow(/bareHeatLossWPerM/);
    expect(() => componentsEquivalentLengthM({ valves: 1.5 })).toThrow(/valves/);
  });
});
