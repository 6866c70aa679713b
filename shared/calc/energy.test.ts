import fc from 'fast-check';

import { annualEnergyAssessment, energyCost, type EnergyBasis } from './energy';

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
