import { basisCo2Factor, basisPrice, heatFlowValue, totalEnergy, totalHeatFlow, totalMoney } from './overview-format';

describe('site totals in the user’s units', () => {
  it('when a site loses about a megawatt, then SI reads kilowatts and US units million Btu per hour', () => {
    expect(totalHeatFlow(1_077_977, 'SI').text).toBe('1,080 kW');
    // 1,077,977 W × 3.41214 Btu/h per W = 3.678 million Btu/h
    expect(totalHeatFlow(1_077_977, 'US').text).toBe('3.68 MMBtu/h');
    expect(heatFlowValue(2500, 'SI')).toBe(2.5);
  });

  it('when a year’s energy is shown, then SI reads megawatt hours and US units million Btu', () => {
    expect(totalEnergy(8_623_816, 'SI').text).toBe('8,620 MWh');
    // 8,623,816 kWh ÷ 293.071 kWh per MMBtu = 29,426 MMBtu
    expect(totalEnergy(8_623_816, 'US').text).toBe('29,400 MMBtu');
  });

  it('when the energy basis is described, then its price and CO₂ factor are in the user’s units', () => {
    expect(basisPrice(0.045, 'EUR', 'SI')).toBe('0.045 EUR/kWh');
    // 0.045 EUR/kWh × 293.071 kWh/MMBtu = 13.19 EUR/MMBtu (prices keep four figures, as typed)
    expect(basisPrice(0.045, 'EUR', 'US')).toBe('13.19 EUR/MMBtu');
    expect(basisCo2Factor(0.202, 'SI')).toBe('0.202 kg CO₂/kWh');
    // 0.202 kg/kWh × 293.071 kWh/MMBtu ÷ 0.453592 kg/lb = 130.5 lb/MMBtu
    expect(basisCo2Factor(0.202, 'US')).toBe('131 lb CO₂/MMBtu');
  });

  it('when the API sends money as decimal text, then it reads to the cent in its currency, and nothing without one', () => {
    expect(totalMoney('456554.99', 'EUR')?.text).toBe('€456,554.99');
    expect(totalMoney(null, 'EUR')).toBeNull();
    expect(totalMoney('12.5', null)).toBeNull();
  });
});
