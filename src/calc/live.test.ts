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

  it('when no thickness can reach the limit, then the error says so and offers what would help', () => {
    const o = evaluateDraft({ ...defaultDraft(), maxSurfaceC: 20 }, 'SI');
    expect(o.kind).toBe('error');
    if (o.kind !== 'error') return;
    expect(o.code).toBe('TARGET_NOT_REACHABLE');
    expect(o.advice.join(' ')).toMatch(/lower conductivity/);
    expect(o.advice.join(' ')).toMatch(/emissivity/);
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
    expect(validateDraft(d, 'SI')['layers[0].conductivity[0]']).toBe('Enter k at 0 °C for layer 1 as a number.');
  });

  it('when the draft is complete, then there are no errors', () => {
    expect(validateDraft(defaultDraft(), 'SI')).toEqual({});
  });
});
