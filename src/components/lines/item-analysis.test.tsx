import { DEFAULT_SIZING_SETTINGS } from '../../../shared/calc/sizing/settings';
import { sizeItem } from '../../../shared/calc/sizing/size-item';
import type { DesignBases, LibraryPayload, Line, Vessel } from '../../api/types';

import { analyseItem, contextOf, taskOfItem } from './item-analysis';
import { purposeNote, purposeTargets } from './purpose-target';
import { testLine } from './test-line';

const bases: DesignBases = {
  touch: { airTemperatureC: 40, windSpeedMS: 0, surfaceEmissivity: 0.9, contactSeconds: 5 },
  energy: { airTemperatureC: 20, windSpeedMS: 3, operatingHoursPerYear: 8000, energyPricePerKWh: 0.045, currency: 'EUR', heatSourceEfficiency: 0.85, co2KgPerKWh: 0.202 },
  condensation: { airTemperatureC: 28, relativeHumidityPct: 70, marginK: 1 },
};
const library: LibraryPayload = { materials: [], finishes: [], teamMaterials: [], teamFinishes: [] };
const ctx = contextOf(bases, DEFAULT_SIZING_SETTINGS, library);

const line = (patch: Partial<Line>) => testLine(patch);

/** The thickness each chart marks must be the thickness the sizing job stores for that purpose. */
function expectChartsMatchSizing(item: Line | Vessel, kind: 'line' | 'vessel') {
  const task = taskOfItem(item, kind);
  const stored = sizeItem(task, ctx);
  const a = analyseItem(task, ctx);
  if (a.kind !== 'ok') throw new Error(a.message);
  expect(a.views.length).toBeGreaterThan(0);
  for (const v of a.views) {
    const outcome = stored.purposes.find((p) => p.purpose === v.purpose)!;
    if (v.output.kind !== 'ok') throw new Error(`${v.purpose}: ${v.output.message}`);
    expect(v.output.result.totalThicknessM).toBeCloseTo(outcome.totalThicknessM as number, 12);
    expect(v.output.sweep.length).toBeGreaterThan(10);
  }
  return { stored, a };
}

describe('item page charts from the sizing plan', () => {
  it('when a hot line carries personnel protection and heat conservation by the site rule, then each chart marks the stored thickness', () => {
    const { stored, a } = expectChartsMatchSizing(line({}), 'line');
    expect(stored.purposes.map((p) => p.status)).toEqual(['sized', 'sized']);
    const conservation = a.kind === 'ok' ? a.views.find((v) => v.purpose === 'heatConservation') : undefined;
    // The site rule (10 % of bare) is drawn as the chart's limit, not the plan's placeholder.
    expect(conservation?.draft.maxHeatLossWPerM).toBeGreaterThan(1);
    expect(conservation?.draft.purpose).toBe('conservation');
  });

  it('when a cold line carries condensation control, then its chart marks the stored thickness', () => {
    expectChartsMatchSizing(line({ operatingTemperatureC: 6, purposes: ['condensationControl'] }), 'line');
  });

  it('when a vessel has its own heat-loss limit, then its chart marks the stored thickness', () => {
    const vessel = { ...line({}), diameterM: 2.2, lengthM: 6, headType: 'ellipsoidal2to1', purposes: ['heatConservation'], purposeParameters: { heatConservation: { maxHeatLossW: 4000 } } } as unknown as Vessel;
    expectChartsMatchSizing(vessel, 'vessel');
  });

  it('when a build-up is taken as built, then the charts check it and carry the limit of the purpose', () => {
    const fixed = line({ buildUp: { layers: [{ materialId: 'mineral-fibre-pipe-c547-type-ii', thicknessM: 0.025 }], finishId: 'aluminium-oxidised', fixed: true }, purposes: ['personnelProtection'] });
    const a = analyseItem(taskOfItem(fixed, 'line'), ctx);
    if (a.kind !== 'ok') throw new Error(a.message);
    expect(a.views[0].draft.mode).toBe('check');
    expect(a.views[0].draft.maxSurfaceC).toBeGreaterThan(40);
    expect(a.views[0].output.kind === 'ok' && a.views[0].output.result.totalThicknessM).toBeCloseTo(0.025, 12);
  });

  it('when the build-up names a material the library lacks, then the error names the field', () => {
    const bad = line({ buildUp: { layers: [{ materialId: 'team-material-99' }], finishId: 'aluminium-oxidised' } });
    expect(analyseItem(taskOfItem(bad, 'line'), ctx)).toEqual({ kind: 'error', field: 'buildUp.layers[0].materialId', message: 'There is no material "team-material-99" in the library.' });
  });

  it('when the targets are worded, then their numbers are in the user’s units', () => {
    const hot = analyseItem(taskOfItem(line({ purposeParameters: { heatConservation: { maxHeatLossWPerM: 50 } } }), 'line'), ctx);
    const cold = analyseItem(taskOfItem(line({ operatingTemperatureC: 6, purposes: ['condensationControl', 'heatConservation'] }), 'line'), ctx);
    if (hot.kind !== 'ok' || cold.kind !== 'ok') throw new Error('expected plans');
    const si = purposeTargets(hot.plan, ctx.bases, 'SI');
    expect(si.personnelProtection).toMatch(/^surface at most \d+\.\d °C$/);
    expect(si.heatConservation).toBe('heat flow at most 50.0 W/m');
    const us = purposeTargets(hot.plan, ctx.bases, 'US');
    // 50 W/m = 52.0 Btu/(h·ft)
    expect(us.heatConservation).toBe('heat flow at most 52.0 Btu/(h·ft)');
    expect(us.personnelProtection).toMatch(/^surface at most \d+\.\d °F$/);
    const coldUs = purposeTargets(cold.plan, ctx.bases, 'US');
    // Margin 1 K = 1.8 °F; dew point of 28 °C air at 70 % (Magnus, Alduchov & Eskridge) = 22.0 °C = 71.6 °F
    expect(coldUs.condensationControl).toBe('surface at least 1.8 °F above the dew point (71.6 °F)');
    expect(coldUs.heatConservation).toBe('heat flow at most 10 % of the bare item’s');
  });

  it('when a fixed build-up falls short, then the note says so without SI figures', () => {
    expect(purposeNote({ purpose: 'personnelProtection', basis: 'touch', target: 'surface at most 58 °C', status: 'notMet', message: 'The build-up as given misses: surface at most 58 °C.' })).toBe('The build-up as built misses this target.');
  });
});
