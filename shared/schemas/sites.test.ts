import { ValidationError } from 'yup';

import { BASIS_RANGES, designBasesSchema, designBasisWarnings, sitePatchSchema } from './sites';

function refusal(value: unknown): ValidationError | null {
  try {
    sitePatchSchema.validateSync(value, { abortEarly: false });
    return null;
  } catch (e) {
    if (e instanceof ValidationError) return e;
    throw e;
  }
}

describe('design-basis ranges', () => {
  it('when a touch basis has 999 °C air or an energy basis 59 m/s wind, then each is refused naming its field, bound and why', () => {
    const e = refusal({ designBases: { touch: { airTemperatureC: 999 }, energy: { airTemperatureC: 10, windSpeedMS: 59 } } });
    expect(e).not.toBeNull();
    const byPath = Object.fromEntries(e!.inner.map((i) => [i.path, i.message]));
    expect(byPath['designBases.touch.airTemperatureC']).toBe('Touch safety: air temperature must be at most 60 °C (the hottest credible air where people work)');
    expect(byPath['designBases.energy.windSpeedMS']).toBe('Energy: wind speed must be at most 30 m/s (beyond storm force)');
  });

  it('when every bound is tried just inside and just outside, then inside passes and outside is refused', () => {
    for (const [basis, fields] of Object.entries(BASIS_RANGES)) {
      for (const [key, r] of Object.entries(fields)) {
        const required = basis === 'condensation' ? { airTemperatureC: 20, relativeHumidityPct: 50 } : { airTemperatureC: basis === 'winter' ? -10 : 20 };
        const at = (v: number) => ({ [basis]: { ...required, [key]: v } });
        const inside = r.minExclusive ? r.min + 1e-6 : r.min;
        expect(() => designBasesSchema.validateSync(at(inside))).not.toThrow();
        expect(() => designBasesSchema.validateSync(at(r.max))).not.toThrow();
        expect(() => designBasesSchema.validateSync(at(r.max + 1e-6))).toThrow(/must be at most/);
        expect(() => designBasesSchema.validateSync(at(r.minExclusive ? r.min : r.min - 1e-6))).toThrow(/must be (at least|above)/);
      }
    }
  });

  it('when a winter basis and the chiller figures are given, then they are accepted; unknown fields are not', () => {
    const ok = { winter: { airTemperatureC: -25, windSpeedMS: 8 }, energy: { airTemperatureC: 10, coolingCop: 4, electricityPricePerKWh: 0.2, electricityCo2KgPerKWh: 0.3, electricityCo2Basis: 'grid' } };
    expect(designBasesSchema.validateSync(ok)).toEqual(ok);
    expect(() => designBasesSchema.validateSync({ winter: { airTemperatureC: -5, snow: 1 } })).toThrow();
    expect(() => designBasesSchema.validateSync({ winter: { windSpeedMS: 3 } })).toThrow(/Winter: air temperature is required/);
  });

  it('when values are credible but unusual, then they are warned about (and usual ones are not)', () => {
    const w = designBasisWarnings({ touch: { airTemperatureC: 35, windSpeedMS: 4 }, winter: { airTemperatureC: 5 }, energy: { airTemperatureC: 10, coolingCop: 4 } });
    expect(w.map((x) => x.field)).toEqual(['designBases.touch.windSpeedMS', 'designBases.winter.airTemperatureC']);
    expect(w[1].message).toBe('Winter: frost protection needs design air below 0 °C.');
    // Refused values are the schema's business, not a warning.
    expect(designBasisWarnings({ touch: { airTemperatureC: 999 } })).toEqual([]);
  });
});
