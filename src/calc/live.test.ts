import { typicalConditions } from './examples';
import { evaluateDraft, sweepThicknesses } from './live';
import { present } from './present';
import { defaultDraft, type Draft } from './quick-case';
import { validateDraft } from './validation';

const KINDS = ['pipe', 'vessel', 'wall'] as const;
const PURPOSES = ['personnel', 'conservation', 'condensation', 'holding', 'frost'] as const;

describe('live evaluation of the quick-sizing draft', () => {
  it('when every geometry meets every purpose with its typical conditions, then there are finite numbers, a sweep and a profile', () => {
    for (const kind of KINDS) {
      for (const purpose of PURPOSES) {
        const d: Draft = { ...defaultDraft(), kind, purpose, ...typicalConditions(purpose) };
        const o = evaluateDraft(d, 'SI');
        if (o.kind !== 'ok') throw new Error(`${kind}/${purpose}: ${JSON.stringify(o).slice(0, 200)}`);
        expect(Number.isFinite(o.heatFlow)).toBe(true);
        expect(o.sweep.length).toBeGreaterThan(10);
        expect(o.profile[0].temperatureC).toBe(d.processTemperatureC);
        expect(o.profile[o.profile.length - 1].temperatureC).toBeCloseTo(o.result.surfaceTemperatureC, 9);
        const p = present(d, o, 'SI');
        expect(p.headline.length).toBeGreaterThanOrEqual(2);
      }
    }
  });

  it('when a hot pipe is swept through the series, then the surface cools and the loss falls as insulation is added', () => {
    const o = evaluateDraft(defaultDraft(), 'SI');
    if (o.kind !== 'ok') throw new Error('expected a result');
    for (let i = 1; i < o.sweep.length; i++) {
      expect(o.sweep[i].surfaceTemperatureC).toBeLessThan(o.sweep[i - 1].surfaceTemperatureC);
      expect(o.sweep[i].heatFlow).toBeLessThan(o.sweep[i - 1].heatFlow);
    }
  });

  it('when sized, then the chosen thickness is in the series and meets the limit', () => {
    const d = defaultDraft();
    const o = evaluateDraft(d, 'SI');
    if (o.kind !== 'ok') throw new Error('expected a result');
    expect([20, 25, 30, 40, 50, 60, 70, 80, 90, 100].map((mm) => mm / 1000)).toContainEqual(o.chosenThicknessM);
    expect(o.result.surfaceTemperatureC).toBeLessThanOrEqual(d.maxSurfaceC!);
    expect(present(d, o, 'SI').verdict.state).toBe('pass');
  });

  it('when no thickness can reach the limit, then the best build-up within reach is shown with the charts and what would help', () => {
    const d = { ...defaultDraft(), maxSurfaceC: 20 };
    const o = evaluateDraft(d, 'SI');
    if (o.kind !== 'ok') throw new Error('expected the best build-up within reach');
    expect(o.shortfall?.code).toBe('TARGET_NOT_REACHABLE');
    expect(o.shortfall?.bestThicknessM).toBe(0.5);
    expect(o.chosenThicknessM).toBeCloseTo(0.5, 12);
    expect(o.sweep.length).toBeGreaterThan(10);
    expect(o.shortfall?.advice.join(' ')).toMatch(/lower conductivity/);
    expect(o.shortfall?.advice.join(' ')).toMatch(/emissivity/);
    const p = present(d, o, 'SI');
    expect(p.verdict.state).toBe('fail');
    // The shortfall carries its unit: kelvin for a temperature difference, and the figure reached.
    expect(p.verdict.text).toMatch(/lowest surface temperature within reach is \d+\.\d °C with 500 mm, the thickest searched — \d+\.\d K above the 20\.0 °C/);
    expect(present(d, o, 'US').verdict.text).toMatch(/with 19⅝ in, the thickest searched — \d+\.\d °F above the 68\.0 °F/);
    expect(p.headline[0].testID).toBe('qs-result-best');
  });

  it('when the series cannot make the thickness needed, then it says what it needs and what two of the thickest layers give, without internal names', () => {
    // A 600 °C process held to a 40 °C surface needs more than two metric layers of 100 mm each.
    const d: Draft = { ...defaultDraft(), processTemperatureC: 600, maxSurfaceC: 40, airTemperatureC: 25, radiantTemperatureC: 25 };
    const o = evaluateDraft(d, 'SI');
    if (o.kind !== 'ok') throw new Error(`expected a shortfall: ${JSON.stringify(o).slice(0, 300)}`);
    expect(o.shortfall?.code).toBe('SERIES_TOO_THIN');
    expect(o.shortfall?.bestThicknessM).toBeCloseTo(0.2, 12);
    const text = present(d, o, 'SI').verdict.text;
    expect(text).toMatch(/with two of the series’ thickest single layers \(200 mm in all\); it needs \d+ mm/);
    expect(text).not.toMatch(/maxSingleLayerM|seriesM|round\./);
  });

  it('when the sweep range is built, then it holds every series value in order', () => {
    const t = sweepThicknesses([0.02, 0.05, 0.1], 4);
    expect(t).toEqual([0.02, 0.04, 0.05, 0.06, 0.08, 0.1]);
  });
});

describe('validation of the draft', () => {
  it('when fields are empty or out of range, then each message names its field and bound in the units shown', () => {
    const d: Draft = { ...defaultDraft(), processTemperatureC: null, relativeHumidityPct: 120, pipeOuterDiameterM: 0 };
    const si = validateDraft(d, 'SI');
    expect(si.processTemperatureC).toBe('Enter the process temperature as a number.');
    expect(si.relativeHumidityPct).toBe('The relative humidity must be at most 100 %.');
    expect(si.pipeOuterDiameterM).toBe('The pipe outside diameter must be at least 5 mm.');
    const us = validateDraft(d, 'US');
    expect(us.pipeOuterDiameterM).toBe('The pipe outside diameter must be at least 0.197 in.');
  });

  it('when a custom layer has no first coefficient, then the message names the layer', () => {
    const d = defaultDraft();
    d.layers = [{ materialId: 'custom', conductivity: [null, 0, 0], maxServiceTemperatureC: null, thicknessM: 0.05 }];
    d.mode = 'check';
    expect(validateDraft(d, 'SI')['layers[0].conductivity[0]']).toBe('Enter the conductivity at 0 °C of layer 1 as a number.');
    // Spelt out, never a capital K that reads as kelvin.
    expect(validateDraft({ ...d, layers: [{ ...d.layers[0], conductivity: [0.0001, 0, 0] }] }, 'US')['layers[0].conductivity[0]']).toMatch(/^The conductivity at 32 °F of layer 1 must be at least 0\.00693 Btu·in\/\(h·ft²·°F\)\.$/);
  });

  it('when the draft is complete, then there are no errors', () => {
    expect(validateDraft(defaultDraft(), 'SI')).toEqual({});
  });
});
