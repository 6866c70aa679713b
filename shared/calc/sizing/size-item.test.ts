import * as fc from 'fast-check';

import { runCase } from '../run-case';
import { canonicalJson, fingerprint } from './hash';
import { fitTeamConductivity, sizingLibrary } from './library';
import { toSizingSettings } from './settings';
import { planItemSizing, sizeItem, sizingInputHash } from './size-item';
import { PURPOSES, type Purpose, type SizingContext, type SizingItem } from './types';

const ctx: SizingContext = {
  bases: {
    touch: { airTemperatureC: 35, windSpeedMS: 0, contactSeconds: 5 },
    energy: { airTemperatureC: 10, windSpeedMS: 3, operatingHoursPerYear: 8000 },
    condensation: { airTemperatureC: 30, relativeHumidityPct: 80, marginK: 1 },
    winter: { airTemperatureC: -15, windSpeedMS: 5 },
  },
  settings: toSizingSettings({}),
  library: sizingLibrary(),
};

const line = (over: Partial<SizingItem> = {}): SizingItem => ({
  kind: 'line',
  outerDiameterM: 0.1143,
  nps: '4',
  lengthM: 100,
  orientation: 'horizontal',
  location: 'outdoor',
  operatingTemperatureC: 180,
  purposes: ['personnelProtection', 'heatConservation'],
  purposeParameters: {},
  fittings: { valves: 0, flanges: 0, elbows: 0, tees: 0 },
  fittingsInsulated: true,
  ...over,
});

describe('canonical JSON and fingerprints', () => {
  it('when keys come in another order, then the text and fingerprint are the same', () => {
    expect(canonicalJson({ b: 1, a: [2, { d: 3, c: 4 }] })).toBe('{"a":[2,{"c":4,"d":3}],"b":1}');
    expect(fingerprint(canonicalJson({ x: 1, y: 2 }))).toBe(fingerprint(canonicalJson({ y: 2, x: 1 })));
    expect(fingerprint('a')).not.toBe(fingerprint('b'));
    expect(fingerprint('')).toMatch(/^[0-9a-f]{16}$/);
  });
});

describe('sizing an item', () => {
  it('when a hot line is sized, then every purpose meets its target with the governing build-up', () => {
    const s = sizeItem({ item: line(), buildUp: null }, ctx);
    expect(s.service).toBe('hot');
    expect(s.failing).toEqual([]);
    expect(s.governingPurpose).toBe('personnelProtection');
    expect(s.surfaceBasis).toBe('touch');
    expect(s.burnVerdict).toBe('pass');
    expect(s.surfaceTemperatureC!).toBeLessThanOrEqual(s.burn!.limitC + 0.05);
    // The governing thickness comes from the series.
    for (const t of s.layersM) expect(ctx.settings.seriesM.some((x) => Math.abs(x - t) < 1e-12)).toBe(true);
    // The annual energy is the whole line's heat flow over the operating hours.
    expect(s.annualEnergyKWh).toBeCloseTo((s.heatLossW! * 8000) / 1000, 6);
    expect(s.bareHeatLossWPerM!).toBeGreaterThan(s.heatLossWPerM! * 5);
  });

  it('when a cold line carries personnel protection and condensation control, then condensation governs and the burn check does not apply', () => {
    const s = sizeItem({ item: line({ operatingTemperatureC: 5, location: 'indoor', purposes: ['personnelProtection', 'condensationControl'] }), buildUp: null }, ctx);
    expect(s.service).toBe('cold');
    expect(s.governingPurpose).toBe('condensationControl');
    expect(s.purposes.find((p) => p.purpose === 'personnelProtection')?.status).toBe('notApplicable');
    expect(s.burnVerdict).toBe('notApplicable');
    const dew = s.evaluations.find((e) => e.basis === 'condensation')!;
    expect(dew.surfaceTemperatureC).toBeGreaterThanOrEqual(dew.dewPointC! + 1 - 1e-6);
  });

  it('when a bare item is checked, then personnel protection fails and the verdict says so', () => {
    const s = sizeItem({ item: line({ purposes: ['personnelProtection'] }), buildUp: { layers: [], finishId: 'carbon-steel-oxidised', fixed: true } }, ctx);
    expect(s.totalThicknessM).toBe(0);
    expect(s.failing).toEqual(['personnelProtection']);
    expect(s.purposes[0].status).toBe('notMet');
    expect(s.burnVerdict).toBe('fail');
  });

  it('when a basis is missing, then the purpose fails naming the basis, and the others still size', () => {
    const noWinter = { ...ctx, bases: { ...ctx.bases, winter: undefined } };
    const s = sizeItem({ item: line({ purposes: ['personnelProtection', 'frostProtection'], purposeParameters: { frostProtection: { minHours: 8 } } }), buildUp: null }, noWinter);
    const frost = s.purposes.find((p) => p.purpose === 'frostProtection')!;
    expect(frost.status).toBe('error');
    expect(frost.error?.field).toBe('designBases.winter');
    expect(s.failing).toEqual(['frostProtection']);
    expect(s.governingPurpose).toBe('personnelProtection');
  });

  it('when the standing-water data is not given, then the NPS standard wall supplies it', () => {
    const s = sizeItem({ item: line({ operatingTemperatureC: 10, purposes: ['frostProtection'], purposeParameters: { frostProtection: { minHours: 8 } } }), buildUp: null }, ctx);
    const frost = s.purposes[0];
    expect(frost.status).toBe('sized');
    expect(frost.totalThicknessM!).toBeGreaterThan(0);
  });

  it('when a vessel is sized, then its whole heat flow is reported in watts', () => {
    const vessel: SizingItem = { ...line(), kind: 'vessel', nps: null, outerDiameterM: 2.4, lengthM: 6, orientation: 'vertical', headType: 'ellipsoidal2to1' };
    const s = sizeItem({ item: vessel, buildUp: null }, ctx);
    expect(s.heatLossWPerM).toBeUndefined();
    expect(s.heatLossW!).toBeGreaterThan(0);
    expect(s.failing).toEqual([]);
  });
});

describe('properties', () => {
  const purposeSets = fc.subarray(['personnelProtection', 'heatConservation', 'condensationControl', 'frostProtection'] as Purpose[], { minLength: 1 });
  const items = fc.record({
    nps: fc.constantFrom('1', '2', '4', '8'),
    t: fc.double({ min: -30, max: 400, noNaN: true }),
    purposes: purposeSets,
    location: fc.constantFrom<'indoor' | 'outdoor'>('indoor', 'outdoor'),
  });
  const sizes: Record<string, number> = { '1': 0.0334, '2': 0.0603, '4': 0.1143, '8': 0.2191 };
  const toItem = (x: { nps: string; t: number; purposes: Purpose[]; location: 'indoor' | 'outdoor' }) =>
    line({
      nps: x.nps,
      outerDiameterM: sizes[x.nps],
      operatingTemperatureC: x.t,
      location: x.location,
      purposes: PURPOSES.filter((p) => x.purposes.includes(p)),
      purposeParameters: { frostProtection: { minHours: 4, startTemperatureC: 10 } },
    });

  it('when any item is sized, then the governing thickness is the largest of its purposes\' thicknesses', () => {
    fc.assert(
      fc.property(items, (x) => {
        const s = sizeItem({ item: toItem(x), buildUp: null }, ctx);
        const sized = s.purposes.filter((p) => p.status === 'sized').map((p) => p.totalThicknessM ?? 0);
        if (sized.length === 0) return s.governingPurpose === null;
        return Math.abs(s.totalThicknessM - Math.max(...sized)) < 1e-12;
      }),
      { numRuns: 60 },
    );
  });

  it('when each purpose is solved alone with its basis, then the governing build-up meets it (round trip through runCase)', () => {
    fc.assert(
      fc.property(items, (x) => {
        const task = { item: toItem(x), buildUp: null };
        const s = sizeItem(task, ctx);
        const plan = planItemSizing(task, ctx);
        for (const p of plan.purposes) {
          if (!p.case || !p.case.solveFor) continue;
          const outcome = s.purposes.find((o) => o.purpose === p.purpose)!;
          if (outcome.status !== 'sized') continue;
          const check = runCase({ ...p.case, solveFor: undefined, round: undefined, layers: s.layersM.map((t) => ({ ...p.case!.layers[0], thicknessM: t })) });
          if ('error' in check) return false;
          if (p.case.solveFor.criterion === 'surfaceTemperature' && check.surfaceTemperatureC > p.case.solveFor.maxC + 1e-6) return false;
          if (p.case.solveFor.criterion === 'condensation' && check.surfaceTemperatureC < check.dewPointC! + p.case.solveFor.marginK - 1e-6) return false;
        }
        return true;
      }),
      { numRuns: 40 },
    );
  });

  it('when a field that changes no number changes, the fingerprint stays; when one that does changes, it moves', () => {
    fc.assert(
      fc.property(items, fc.double({ min: 1, max: 50, noNaN: true }), (x, dT) => {
        const a = sizingInputHash({ item: toItem(x), buildUp: null }, ctx);
        const b = sizingInputHash({ item: { ...toItem(x) }, buildUp: null }, ctx);
        const c = sizingInputHash({ item: { ...toItem(x), operatingTemperatureC: x.t + dT }, buildUp: null }, ctx);
        return a === b && a !== c;
      }),
      { numRuns: 50 },
    );
  });
});

describe('team material fits', () => {
  it('when datasheet points lie on a line, then a first-degree fit reproduces them', () => {
    const f = fitTeamConductivity(
      [
        { meanTemperatureC: 0, conductivityWPerMK: 0.035 },
        { meanTemperatureC: 100, conductivityWPerMK: 0.05 },
        { meanTemperatureC: 200, conductivityWPerMK: 0.065 },
      ],
      [-20, 250],
    );
    expect(f.degree).toBe(1);
    expect(f.conductivity[0]).toBeCloseTo(0.035, 10);
    expect(f.conductivity[1]).toBeCloseTo(0.00015, 12);
    expect(f.maxErrorPct).toBeLessThan(1e-6);
  });

  it('when the points curve, then a higher degree is used and its error is reported', () => {
    const pts = [0, 100, 200, 300, 400].map((t) => ({ meanTemperatureC: t, conductivityWPerMK: 0.03 + 1e-7 * t * t }));
    const f = fitTeamConductivity(pts, [0, 400]);
    expect(f.degree).toBe(2);
    expect(f.maxErrorPct).toBeLessThan(0.01);
    expect(f.dataRangeC).toEqual([0, 400]);
  });

  it('when points are unusable, then the error names them', () => {
    expect(() => fitTeamConductivity([{ meanTemperatureC: 0, conductivityWPerMK: 0.03 }], [0, 100])).toThrow(/at least two/);
    expect(() => fitTeamConductivity([{ meanTemperatureC: 0, conductivityWPerMK: 0.03 }, { meanTemperatureC: 0, conductivityWPerMK: 0.04 }], [0, 100])).toThrow(/same mean temperature/);
    // A steeply falling line turns negative inside the service range.
    expect(() => fitTeamConductivity([{ meanTemperatureC: 0, conductivityWPerMK: 0.05 }, { meanTemperatureC: 100, conductivityWPerMK: 0.01 }], [0, 300])).toThrow(/k ≤ 0/);
  });
});
