import type { DesignBases } from '../../api/types';

import { basisWarnings, displayValue, fieldName, formFieldOf, formToPatch, siteToForm, BASES } from './design-basis-fields';

const bases: DesignBases = {
  touch: { airTemperatureC: 40, windSpeedMS: 0, surfaceEmissivity: 0.9, contactSeconds: 5 },
  energy: { airTemperatureC: 20, windSpeedMS: 0, operatingHoursPerYear: 8000, energyPricePerKWh: 0.045, currency: 'EUR', heatSourceEfficiency: 0.85 },
  condensation: { airTemperatureC: 28, relativeHumidityPct: 70, marginK: 1 },
  winter: { airTemperatureC: -12, windSpeedMS: 6 },
};
const site = { name: 'Boiler house', description: 'Steam and condensate.', designBases: bases };

describe('site form conversion', () => {
  it('when nothing is changed in US units, then every stored SI value is sent back exactly', () => {
    const initial = siteToForm(site, 'US');
    expect(initial[fieldName('touch', 'airTemperatureC')]).toBe('104');
    const { patch, errors } = formToPatch(initial, initial, bases, 'US', 'all');
    expect(errors).toEqual({});
    expect(patch).toEqual({ name: 'Boiler house', description: 'Steam and condensate.', designBases: bases });
  });

  it('when a temperature is typed in °F, then it is sent in °C', () => {
    const initial = siteToForm(site, 'US');
    const values = { ...initial, [fieldName('touch', 'airTemperatureC')]: '113' };
    expect(formToPatch(values, initial, bases, 'US', 'all').patch?.designBases?.touch?.airTemperatureC).toBe(45);
  });

  it('when a field is not a number or out of range, then the error names the basis and the field', () => {
    const initial = siteToForm(site, 'SI');
    const values = { ...initial, [fieldName('touch', 'windSpeedMS')]: 'calm', [fieldName('condensation', 'relativeHumidityPct')]: '130' };
    const { patch, errors } = formToPatch(values, initial, bases, 'SI', 'all');
    expect(patch).toBeNull();
    expect(errors[fieldName('touch', 'windSpeedMS')]).toBe('Touch safety: wind speed must be a number');
    expect(errors[fieldName('condensation', 'relativeHumidityPct')]).toBe('Condensation: relative humidity must be at most 100 % (the physical range)');
  });

  it('when a value is beyond its credible range, then it is refused with the bound in the user units and why', () => {
    const us = siteToForm(site, 'US');
    const hot = formToPatch({ ...us, [fieldName('touch', 'airTemperatureC')]: '999' }, us, bases, 'US', 'all');
    expect(hot.patch).toBeNull();
    expect(hot.errors[fieldName('touch', 'airTemperatureC')]).toBe('Touch safety: air temperature must be at most 140 °F (the hottest credible air where people work)');
    const si = siteToForm(site, 'SI');
    const gale = formToPatch({ ...si, [fieldName('energy', 'windSpeedMS')]: '59' }, si, bases, 'SI', 'all');
    expect(gale.errors[fieldName('energy', 'windSpeedMS')]).toBe('Energy: wind speed must be at most 30 m/s (beyond storm force)');
    const winter = formToPatch({ ...si, [fieldName('winter', 'airTemperatureC')]: '25' }, si, bases, 'SI', 'all');
    expect(winter.errors[fieldName('winter', 'airTemperatureC')]).toMatch(/^Winter: air temperature must be at most 20 °C/);
  });

  it('when a value is credible but unusual, then it is saved as entered and the form warns in the user units', () => {
    const si = siteToForm(site, 'SI');
    const values = { ...si, [fieldName('touch', 'windSpeedMS')]: '4', [fieldName('winter', 'airTemperatureC')]: '5' };
    const { patch, errors } = formToPatch(values, si, bases, 'SI', 'all');
    expect(errors).toEqual({});
    expect(patch?.designBases?.touch?.windSpeedMS).toBe(4);
    const warnings = basisWarnings(values, 'SI', 'all');
    expect(warnings[fieldName('touch', 'windSpeedMS')]).toMatch(/still air, the worst case/);
    expect(warnings[fieldName('winter', 'airTemperatureC')]).toBe('Winter: frost protection needs design air below 0 °C.');
    expect(basisWarnings({ ...siteToForm(site, 'US'), [fieldName('winter', 'airTemperatureC')]: '41' }, 'US', 'all')[fieldName('winter', 'airTemperatureC')]).toBe(
      'Winter: frost protection needs design air below 32 °F.',
    );
    expect(basisWarnings(si, 'SI', 'all')).toEqual({});
  });

  it('when the winter basis and the cooling assumptions are filled in, then they are sent in SI', () => {
    const us = siteToForm(site, 'US');
    expect(us[fieldName('winter', 'airTemperatureC')]).toBe('10.4');
    const values = {
      ...us,
      [fieldName('winter', 'airTemperatureC')]: '14',
      [fieldName('energy', 'coolingCop')]: '4',
      [fieldName('energy', 'electricityPricePerKWh')]: '58.61',
      [fieldName('energy', 'electricityCo2KgPerKWh')]: '300',
      [fieldName('energy', 'electricityCo2Basis')]: 'Grid average',
    };
    const { patch, errors } = formToPatch(values, us, bases, 'US', 'all');
    expect(errors).toEqual({});
    expect(patch?.designBases?.winter?.airTemperatureC).toBe(-10);
    expect(patch?.designBases?.energy).toMatchObject({ coolingCop: 4, electricityCo2Basis: 'Grid average' });
    expect(patch?.designBases?.energy?.electricityPricePerKWh).toBeCloseTo(0.2, 4); // 58.61 per MMBtu
    expect(patch?.designBases?.energy?.electricityCo2KgPerKWh).toBeCloseTo(0.4643, 3); // 300 lb/MMBtu = 136.1 kg per 293.07 kWh
  });

  it('when a required value is cleared, then it is refused', () => {
    const initial = siteToForm(site, 'SI');
    const values = { ...initial, [fieldName('energy', 'airTemperatureC')]: ' ' };
    expect(formToPatch(values, initial, bases, 'SI', 'all').errors[fieldName('energy', 'airTemperatureC')]).toMatch(/air temperature is required/);
  });

  it('when the scope is the touch basis only, then the patch holds nothing else', () => {
    const initial = siteToForm(site, 'SI');
    const values = { ...initial, name: 'Renamed', [fieldName('touch', 'airTemperatureC')]: '45' };
    const { patch } = formToPatch(values, initial, bases, 'SI', 'touch');
    expect(patch).toEqual({ designBases: { touch: { ...bases.touch, airTemperatureC: 45 } } });
  });

  it('when the server names a basis field, then it lands on the form field of that name', () => {
    expect(formFieldOf('designBases.touch.airTemperatureC')).toBe('touch_airTemperatureC');
    expect(formFieldOf('name')).toBe('name');
  });

  it('when a value is shown, then it carries the unit of the user system', () => {
    const touch = BASES.find((b) => b.key === 'touch')!;
    const air = touch.fields.find((f) => f.key === 'airTemperatureC')!;
    expect(displayValue(air, 40, 'SI')).toBe('40 °C');
    expect(displayValue(air, 40, 'US')).toBe('104 °F');
    expect(displayValue(air, undefined, 'SI')).toBeNull();
    expect(displayValue(air, -12, 'SI')).toBe('−12 °C');
    const price = BASES.find((b) => b.key === 'energy')!.fields.find((f) => f.key === 'energyPricePerKWh')!;
    expect(displayValue(price, 0.045, 'SI', 'EUR')).toBe('0.045 EUR/kWh');
    // A converted price is money per unit: to the cent, with its currency.
    expect(displayValue(price, 0.05, 'US', 'USD')).toBe('14.65 USD/MMBtu');
    expect(displayValue(price, 0.05, 'SI')).toBe('0.05 currency/kWh');
  });
});
