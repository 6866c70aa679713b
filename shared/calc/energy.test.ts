import fc from 'fast-check';

import {
  annualEnergyAssessment,
  chillerElectricityKWh,
  componentsEquivalentLengthM,
  energyCost,
  EXAMPLE_NATURAL_GAS_EMISSION_FACTOR,
  lineHeatFlowW,
  savingVersusBare,
  type CoolingBasis,
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

const cooling: CoolingBasis = {
  coefficientOfPerformance: 4,
  electricityPrice: { amount: '0.2', per: 'kWh' },
  electricityEmissionFactor: { kgCo2PerKWh: 0.3, basis: 'example grid factor' },
};

describe('a heat gain on cold service', () => {
  it('when a gain is costed with a cooling basis, then a chiller removes it: electricity at COP, electricity price and factor', () => {
    // 1 kW gain for 8760 h = 8760 kWh of heat; ÷ COP 4 = 2190 kWh of electricity; × 0.2 = 438.00; × 0.3 = 657 kg.
    const a = annualEnergyAssessment(-1000, { ...basis, cooling });
    expect(a.service).toBe('cooling');
    expect(a.heat.kWh).toBeCloseTo(8760, 9);
    expect(a.purchasedKWh).toBeCloseTo(2190, 9);
    expect(a.cost.text).toBe('438.00');
    expect(a.co2.kg).toBeCloseTo(657, 9);
    expect(a.co2.basis).toBe('example grid factor');
  });

  it('when a loss is costed on a basis that also has cooling, then the heat source pays for it as before', () => {
    const a = annualEnergyAssessment(1000, { ...basis, cooling });
    expect(a).toEqual(annualEnergyAssessment(1000, basis));
    expect(a.service).toBe('heating');
  });

  it('when a gain has no cooling basis, then it is charged to the heat source as before', () => {
    expect(annualEnergyAssessment(-1000, basis).purchasedKWh).toBeCloseTo(8760 / 0.9, 9);
    expect(annualEnergyAssessment(-1000, basis).service).toBe('heating');
  });

  it('when insulation halves a gain, then the saving is half the chiller electricity and cost', () => {
    const s = savingVersusBare(-1000, -500, { ...basis, cooling });
    expect(s.purchasedKWhSaved).toBeCloseTo(1095, 9);
    expect(s.costSaved.text).toBe('219.00');
    expect(s.co2KgSaved).toBeCloseTo(328.5, 9);
  });

  it('when the COP grows, then the electricity never rises', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1e7, noNaN: true }), fc.double({ min: 0.3, max: 15, noNaN: true }), fc.double({ min: 1, max: 3, noNaN: true }), (e, cop, f) => {
        expect(chillerElectricityKWh(e, cop * f)).toBeLessThanOrEqual(chillerElectricityKWh(e, cop) + 1e-9);
      }),
    );
  });

  it('when the COP is not positive, then it throws naming the field', () => {
    expect(() => annualEnergyAssessment(-1, { ...basis, cooling: { ...cooling, coefficientOfPerformance: 0 } })).toThrow(/cooling.coefficientOfPerformance/);
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
