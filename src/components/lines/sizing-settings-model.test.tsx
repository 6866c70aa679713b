import { DEFAULT_SIZING_SETTINGS } from '../../../shared/calc/sizing/settings';

import { SERIES_PRESETS, seriesUnitOf, settingsFormToInput, settingsToForm } from './sizing-settings-model';

const stored = DEFAULT_SIZING_SETTINGS;

describe('sizing settings form', () => {
  it('when the settings are saved untouched, in either unit system, then the stored values go back exactly', () => {
    for (const system of ['SI', 'US'] as const) {
      const form = settingsToForm(stored, system);
      const { input, errors } = settingsFormToInput(form, system, stored);
      expect(errors).toEqual({});
      expect(input).toEqual({
        seriesMm: stored.seriesMm,
        maxSingleLayerMm: 100,
        maxThicknessMm: 500,
        heatConservationMaxPercentOfBare: 10,
        defaultBuildUps: stored.defaultBuildUps,
      });
    }
  });

  it('when the half-inch series is chosen, then it is stored in millimetres and read back in inches', () => {
    const form = { ...settingsToForm(stored, 'US'), seriesUnit: 'in' as const, series: SERIES_PRESETS.in, maxSingleLayer: '4' };
    const { input, errors } = settingsFormToInput(form, 'US', stored);
    expect(errors).toEqual({});
    expect(input!.seriesMm).toEqual([25.4, 38.1, 50.8, 63.5, 76.2, 88.9, 101.6, 114.3, 127, 139.7, 152.4]);
    expect(input!.maxSingleLayerMm).toBe(101.6);
    expect(seriesUnitOf(input!.seriesMm as number[])).toBe('in');
    expect(seriesUnitOf(stored.seriesMm)).toBe('mm');
  });

  it('when the series is typed out of order with a repeat, then it is stored sorted once each', () => {
    const form = { ...settingsToForm(stored, 'SI'), series: '50; 25, 40 25' };
    expect(settingsFormToInput(form, 'SI', stored).input!.seriesMm).toEqual([25, 40, 50]);
  });

  it('when a field is wrong, then its error says what and where', () => {
    const form = { ...settingsToForm(stored, 'SI'), series: '25, thick', maxSingleLayer: '600', heatRule: '0' };
    const { input, errors } = settingsFormToInput(form, 'SI', stored);
    expect(input).toBeNull();
    expect(errors.series).toBe('“thick” is not a number; separate thicknesses with commas');
    expect(errors.maxSingleLayer).toBe('The largest single layer must not exceed the largest thickness');
    expect(errors.heatRule).toBe('The share of the bare heat loss must be above 0 %');
  });

  it('when a default build-up has an inner layer without thickness, then the error belongs to that build-up', () => {
    const form = settingsToForm(stored, 'SI');
    const hot = { ...form.hot, layers: [{ materialId: 'calcium-silicate-c533-type-i', thickness: '' }, ...form.hot.layers] };
    const { errors } = settingsFormToInput({ ...form, hot }, 'SI', stored);
    expect(errors['hot:buildUp.layers[0].thicknessM']).toMatch(/^Layer 1: give its thickness/);
  });
});
