import type { DesignBases } from '../../api/types';

import { displayValue, fieldName, formFieldOf, formToPatch, siteToForm, BASES } from './design-basis-fields';

const bases: DesignBases = {
  touch: { airTemperatureC: 40, windSpeedMS: 0, surfaceEmissivity: 0.9, contactSeconds: 5 },
  energy: { airTemperatureC: 20, windSpeedMS: 0, operatingHoursPerYear: 8000, energyPricePerKWh: 0.045, currency: 'EUR', heatSourceEfficiency: 0.85 },
  condensation: { airTemperatureC: 28, relativeHumidityPct: 70, marginK: 1 },
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
    expect(errors[fieldName('condensation', 'relativeHumidityPct')]).toBe('Relative humidity must be 0–100 %');
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
    const price = BASES.find((b) => b.key === 'energy')!.fields.find((f) => f.key === 'energyPricePerKWh')!;
    expect(displayValue(price, 0.045, 'SI', 'EUR')).toBe('0.045 EUR/kWh');
  });
});
