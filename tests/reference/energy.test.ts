/**
 * Reference checks of annual energy, cost and CO₂.
 *
 * Source: definitions (exact): 1 kWh = 3.6 MJ (SI Brochure, 9th ed.); 1 Btu_IT = 1055.05585262 J (NIST SP 811,
 * 2008, App. B.8); a year of continuous operation is 8760 h. The cases are hand calculations from these
 * definitions, worked in the comments; money is checked to the cent, exactly, since the method states half-up
 * rounding once at the end.
 */
import {
  annualCo2,
  annualEnergyAssessment,
  annualHeatEnergy,
  energyCost,
  fuelEnergyKWh,
  savingVersusBare,
  type EnergyBasis,
} from '../../shared/calc/energy';

const basis: EnergyBasis = {
  operatingHoursPerYear: 8000,
  heatSourceEfficiency: 0.8,
  price: { amount: '0.05', per: 'kWh' },
  emissionFactor: { kgCo2PerKWh: 0.2, basis: 'test factor' },
};

describe('annual energy', () => {
  it('when 1 kW runs all year, then it is 8760 kWh = 31.536 GJ', () => {
    // 1000 W × 8760 h = 8 760 000 Wh = 8760 kWh; × 3.6 MJ/kWh = 31 536 MJ.
    const e = annualHeatEnergy(1000, 8760);
    expect(e.kWh).toBeCloseTo(8760, 9);
    expect(e.GJ).toBeCloseTo(31.536, 9);
  });

  it('when the heat flow is a gain (negative), then its magnitude counts', () => {
    expect(annualHeatEnergy(-250, 4000).kWh).toBeCloseTo(1000, 9);
  });

  it('when a boiler is 80 % efficient, then 8000 kWh of heat takes 10 000 kWh of fuel', () => {
    expect(fuelEnergyKWh(8000, 0.8)).toBeCloseTo(10000, 9);
    expect(() => fuelEnergyKWh(8000, 0)).toThrow(/heatSourceEfficiency/);
  });
});

describe('cost with decimal arithmetic', () => {
  it('when 10 000 kWh costs 0.05 per kWh, then it is 500.00', () => {
    expect(energyCost(10000, { amount: '0.05', per: 'kWh' }).text).toBe('500.00');
  });

  it('when the price is per GJ, then 1000 kWh (3.6 GJ) at 12.50 per GJ is 45.00', () => {
    expect(energyCost(1000, { amount: '12.50', per: 'GJ' }).text).toBe('45.00');
  });

  it('when the price is per MMBtu, then 293.07107017 kWh (1 MMBtu) at 3.00 is 3.00', () => {
    // 1 MMBtu = 1e6 × 1055.05585262 J / 3.6e6 J/kWh = 293.0710701722… kWh.
    expect(energyCost(293.0710701722, { amount: '3', per: 'MMBtu' }).text).toBe('3.00');
  });

  it('when the price is per therm, then 29.3071070172 kWh (1 therm) at 1.20 is 1.20', () => {
    expect(energyCost(29.3071070172, { amount: '1.20', per: 'therm' }).text).toBe('1.20');
  });

  it('when a cost ends in half a cent, then it rounds half up, once', () => {
    // 0.1 kWh × 0.05 = 0.005 → 0.01; binary floats would give 0.005000000000000001 or 0.00499…
    expect(energyCost(0.1, { amount: '0.05', per: 'kWh' }).text).toBe('0.01');
    // 3 × 0.335 = 1.005 exactly in decimal → 1.01 (in binary floats 1.005 rounds to 1.00).
    expect(energyCost(3, { amount: '0.335', per: 'kWh' }).text).toBe('1.01');
  });

  it('when the currency has no minor unit, then the cost is whole', () => {
    expect(energyCost(1234, { amount: '27', per: 'kWh', currencyDecimals: 0 }).text).toBe('33318');
  });

  it('when the price is not a number, then it throws with the field', () => {
    expect(() => energyCost(1, { amount: 'abc', per: 'kWh' })).toThrow(/price.amount/);
  });
});

describe('CO₂ and the whole assessment', () => {
  it('when 10 000 kWh of gas burns at 0.2 kg/kWh, then it emits 2000 kg with the basis stated', () => {
    const co2 = annualCo2(10000, { kgCo2PerKWh: 0.2, basis: 'test factor' });
    expect(co2.kg).toBeCloseTo(2000, 9);
    expect(co2.tonnes).toBeCloseTo(2, 12);
    expect(co2.basis).toBe('test factor');
    expect(() => annualCo2(1, { kgCo2PerKWh: 0.2, basis: '' })).toThrow(/basis/);
  });

  it('when 1 kW runs 8000 h at 80 % and 0.05 per kWh, then it costs 500.00 and emits 2000 kg', () => {
    // 1000 W × 8000 h = 8000 kWh heat; / 0.8 = 10 000 kWh fuel; × 0.05 = 500.00; × 0.2 = 2000 kg.
    const a = annualEnergyAssessment(1000, basis);
    expect(a.purchasedKWh).toBeCloseTo(10000, 9);
    expect(a.cost.text).toBe('500.00');
    expect(a.co2.kg).toBeCloseTo(2000, 9);
  });

  it('when insulation cuts 1000 W to 100 W, then 90 % is saved: 450.00 and 1800 kg a year', () => {
    const s = savingVersusBare(1000, 100, basis);
    expect(s.fraction).toBeCloseTo(0.9, 12);
    expect(s.heatSaved.kWh).toBeCloseTo(7200, 9);
    expect(s.costSaved.text).toBe('450.00');
    expect(s.co2KgSaved).toBeCloseTo(1800, 9);
  });

  it('when a thin layer increases the heat flow, then the saving is negative, not hidden', () => {
    // 10 W more × 8000 h = 80 kWh heat; / 0.8 = 100 kWh fuel; × 0.05 = 5.00 lost.
    expect(savingVersusBare(100, 110, basis).costSaved.text).toBe('-5.00');
  });
});
