import { airA4, G, SIGMA } from '../../tests/reference/air-table-a4';
import { analyse, roundThicknessToSeries } from './analyse';
import { CalcInputError, ImpossibleTargetError } from './errors';
import { runCase, runCases } from './run-case';
import { energyBalanceMismatch, solveSurface, type SurfaceModel } from './surface-balance';
import { kirchhoffBracket } from './conduction';
import type { CalcCase, CalcResult } from './types';

const pipe = (over: Partial<CalcCase> = {}): CalcCase => ({
  geometry: { type: 'pipe', outerDiameterM: 0.1143, orientation: 'horizontal' },
  processTemperatureC: 250,
  layers: [{ thicknessM: 0.05, conductivity: [0.035, 0.00015] }],
  surfaceEmissivity: 0.1,
  ambient: { airTemperatureC: 30 },
  ...over,
});

/** Re-evaluates the build-up at the solved thickness, without solving. */
function atThickness(c: CalcCase, t: number): CalcResult {
  const { solveFor, round, ...rest } = c;
  void solveFor;
  void round;
  const layers = c.layers.map((l, i) => (i === c.layers.length - 1 ? { ...l, thicknessM: t } : l));
  return analyse({ ...rest, layers });
}

describe('solve → analyse round trips, one per criterion', () => {
  it('when solving for a surface temperature, then the continuous t* gives that temperature', () => {
    const c = pipe({ solveFor: { criterion: 'surfaceTemperature', maxC: 50 } });
    const r = analyse(c);
    expect(atThickness(c, r.thicknessM as number).surfaceTemperatureC).toBeCloseTo(50, 2);
  });

  it('when solving for a heat loss, then t* gives that heat loss', () => {
    const c = pipe({ solveFor: { criterion: 'heatLoss', maxWPerM: 60 } });
    const r = analyse(c);
    expect(atThickness(c, r.thicknessM as number).heatLossWPerM as number).toBeCloseTo(60, 2);
  });

  it('when solving a cold line against condensation, then t* puts the surface at dew point + margin', () => {
    const c = pipe({
      processTemperatureC: 2,
      surfaceEmissivity: 0.9,
      ambient: { airTemperatureC: 28, relativeHumidityPct: 75 },
      solveFor: { criterion: 'condensation', marginK: 1 },
    });
    const r = analyse(c);
    const back = atThickness(c, r.thicknessM as number);
    expect(back.surfaceTemperatureC).toBeCloseTo((back.dewPointC as number) + 1, 2);
    expect(back.heatLossWPerM as number).toBeLessThan(0);
  });

  it('when solving for a temperature change along a run, then t* gives that outlet temperature', () => {
    const c = pipe({
      processTemperatureC: 180,
      run: { lengthM: 800, massFlowKgPerS: 2, specificHeatJPerKgK: 2300 },
      solveFor: { criterion: 'temperatureChange', maxChangeK: 5 },
    });
    const r = analyse(c);
    const back = atThickness(c, r.thicknessM as number);
    expect(180 - (back.outletTemperatureC as number)).toBeCloseTo(5, 2);
    expect(Math.abs((back.runHeatLossW as number) / (2 * 2300 * 5) - 1)).toBeLessThan(1e-3);
  });

  it('when solving for a freezing time, then t* gives that many hours', () => {
    const c = pipe({
      geometry: { type: 'pipe', outerDiameterM: 0.0603, orientation: 'horizontal' },
      processTemperatureC: 10,
      surfaceEmissivity: 0.9,
      layers: [{ thicknessM: 0.03, conductivity: [0.035] }],
      ambient: { airTemperatureC: -15, windSpeedMS: 5 },
      stagnant: { innerDiameterM: 0.0525, pipeMassKgPerM: 5.44 },
      solveFor: { criterion: 'freezeTime', minHours: 8 },
    });
    const r = analyse(c);
    expect(atThickness(c, r.thicknessM as number).hoursToZeroC as number).toBeCloseTo(8, 2);
  });

  it('when the run is long, then a finer independent march agrees with the 20-segment result', () => {
    // Independent check: 200 Heun (RK2) steps of dT/dx = −q′(T)/(ṁc), re-using the package only for q′(T).
    const c = pipe({ processTemperatureC: 150, run: { lengthM: 2000, massFlowKgPerS: 0.05, specificHeatJPerKgK: 4200 } });
    const r = analyse(c);
    const q = (T: number) => analyse(pipe({ processTemperatureC: T })).heatLossWPerM as number;
    const n = 200;
    const dx = 2000 / n;
    const mc = 0.05 * 4200;
    let T = 150;
    for (let i = 0; i < n; i++) {
      const k1 = -q(T) / mc;
      const k2 = -q(T + dx * k1) / mc;
      T += (dx * (k1 + k2)) / 2;
    }
    expect(Math.abs((r.outletTemperatureC as number) - T)).toBeLessThan(0.02);
  });
});

describe('rounding to a series', () => {
  it('when t* fits one layer, then it rounds up to the next series value', () => {
    expect(roundThicknessToSeries(0.052, [0.025, 0.04, 0.05, 0.06])).toEqual([0.06]);
    expect(roundThicknessToSeries(0.05, [0.025, 0.04, 0.05, 0.06])).toEqual([0.05]);
    expect(roundThicknessToSeries(0, [0.025])).toEqual([]);
  });

  it('when t* exceeds the single-layer maximum, then two near-equal series layers are used', () => {
    expect(roundThicknessToSeries(0.13, [0.04, 0.05, 0.06, 0.08, 0.1], 0.1)).toEqual([0.08, 0.05]);
    expect(roundThicknessToSeries(0.19, [0.04, 0.05, 0.06, 0.08, 0.1], 0.1)).toEqual([0.1, 0.1]);
  });

  it('when two thickest layers are too thin, then a distinct error says so', () => {
    expect(() => roundThicknessToSeries(0.3, [0.05, 0.1], 0.1)).toThrow(ImpossibleTargetError);
  });

  it('when a solve rounds to two layers, then the result is evaluated at that build-up', () => {
    const r = analyse(
      pipe({
        processTemperatureC: 600,
        surfaceEmissivity: 0.9,
        solveFor: { criterion: 'surfaceTemperature', maxC: 50 },
        round: { seriesM: [0.025, 0.03, 0.04, 0.05, 0.06, 0.08, 0.1], maxSingleLayerM: 0.1 },
      }),
    );
    expect((r.thicknessM as number) > 0.1).toBe(true);
    expect(r.roundedLayersM).toHaveLength(2);
    expect(r.interfaceTemperaturesC).toHaveLength(2);
    expect(r.totalThicknessM).toBeCloseTo((r.roundedLayersM as number[])[0] + (r.roundedLayersM as number[])[1], 12);
    expect(r.surfaceTemperatureC).toBeLessThanOrEqual(50);
  });
});

describe('vessels', () => {
  const vessel = (headType: 'flat' | 'ellipsoidal2to1' | 'hemispherical'): CalcCase => ({
    geometry: { type: 'vessel', diameterM: 2, lengthM: 6, orientation: 'horizontal', headType },
    processTemperatureC: 80,
    layers: [],
    surfaceEmissivity: 0.8,
    ambient: { airTemperatureC: 20 },
  });

  it('when a bare horizontal vessel is analysed, then heat flow = shell + two heads by hand calculation', () => {
    // Hand calculation: every part sits at 80 °C (bare, no film). Shell: Churchill–Chu horizontal cylinder on
    // D; heads: Churchill–Chu vertical plate of height D over the head area; radiation εσ(Ts⁴ − T⁴).
    const Ts = 80;
    const Ta = 20;
    const D = 2;
    const Tf = (Ts + Ta) / 2 + 273.15;
    const { k, nu, Pr } = airA4(Tf);
    const Ra = (G * (Ts - Ta) * D ** 3 * Pr) / (Tf * nu ** 2);
    const hCyl = (((0.6 + (0.387 * Ra ** (1 / 6)) / (1 + (0.559 / Pr) ** (9 / 16)) ** (8 / 27)) ** 2) * k) / D;
    const hPlate = (((0.825 + (0.387 * Ra ** (1 / 6)) / (1 + (0.492 / Pr) ** (9 / 16)) ** (8 / 27)) ** 2) * k) / D;
    const qRad = 0.8 * SIGMA * ((Ts + 273.15) ** 4 - (Ta + 273.15) ** 4);
    const shellArea = Math.PI * D * 6;
    const headAreaEll = 1.084 * D * D;
    const expected = shellArea * (hCyl * 60 + qRad) + 2 * headAreaEll * (hPlate * 60 + qRad);
    const r = analyse(vessel('ellipsoidal2to1'));
    expect(Math.abs((r.heatLossW as number) / expected - 1)).toBeLessThan(0.003);
    const parts = r.parts!;
    expect(parts.map((p) => p.name)).toEqual(['shell', 'head1', 'head2']);
    expect(parts[0].heatLossW + parts[1].heatLossW + parts[2].heatLossW).toBeCloseTo(r.heatLossW as number, 6);
    expect(Math.abs(parts[1].areaM2 / headAreaEll - 1)).toBeLessThan(0.0005);
  });

  it('when the head type changes, then the heat flow changes with the head area', () => {
    const flat = analyse(vessel('flat')).heatLossW as number;
    const ell = analyse(vessel('ellipsoidal2to1')).heatLossW as number;
    const hemi = analyse(vessel('hemispherical')).heatLossW as number;
    expect(flat).toBeLessThan(ell);
    expect(ell).toBeLessThan(hemi);
  });

  it('when an insulated vertical vessel is sized, then the hottest part governs and every part meets the limit', () => {
    const r = analyse({
      geometry: { type: 'vessel', diameterM: 3, lengthM: 8, orientation: 'vertical', headType: 'hemispherical' },
      processTemperatureC: 200,
      layers: [{ thicknessM: 0.05, conductivity: [0.04, 0.0001] }],
      surfaceEmissivity: 0.2,
      ambient: { airTemperatureC: 25 },
      solveFor: { criterion: 'surfaceTemperature', maxC: 45 },
    });
    const parts = r.parts!;
    expect(r.surfaceTemperatureC).toBe(Math.max(...parts.map((p) => p.surfaceTemperatureC)));
    expect(r.surfaceTemperatureC).toBeCloseTo(45, 2);
    for (const p of parts) expect(p.surfaceTemperatureC).toBeLessThanOrEqual(45 + 1e-6);
  });
});

describe('errors and warnings', () => {
  it('when no thickness can reach the target, then an ImpossibleTargetError explains why', () => {
    const c = pipe({ solveFor: { criterion: 'surfaceTemperature', maxC: 25 } });
    expect(() => analyse(c)).toThrow(ImpossibleTargetError);
    const out = runCase(c);
    expect('error' in out && out.error.code).toBe('TARGET_NOT_REACHABLE');
    expect('error' in out && out.error.message).toMatch(/air temperature/);
  });

  it('when input is bad, then CalcInputError names the field and runCases prefixes the index', () => {
    expect(() => analyse(pipe({ surfaceEmissivity: 1.5 }))).toThrow(CalcInputError);
    const outs = runCases([
      pipe(),
      { ...pipe(), layers: [{ thicknessM: 0.05, conductivity: 'x' }] },
      { ...pipe(), colour: 'red' },
      { ...pipe(), geometry: { type: 'pipe', outerDiameterM: 0.1, orientation: 'vertical' } },
      { ...pipe(), solveFor: { criterion: 'condensation', marginK: 1 } },
      { ...pipe(), solveFor: { criterion: 'heatLoss', maxW: 10 } },
      'nonsense',
      { ...pipe(), layers: [{ thicknessM: 0.05, conductivity: [0.03, -0.0002] }], processTemperatureC: 400 },
    ]);
    expect('error' in outs[0]).toBe(false);
    const fields = outs.slice(1).map((o) => ('error' in o ? o.error.field : 'ok'));
    expect(fields).toEqual([
      '[1].layers[0].conductivity',
      '[2].colour',
      '[3].geometry.heightM',
      '[4].ambient.relativeHumidityPct',
      '[5].solveFor.maxW',
      '[6]',
      '[7].layers[0].conductivity',
    ]);
    expect('error' in outs[7] && outs[7].error.code).toBe('CONDUCTIVITY_NOT_POSITIVE');
  });

  it('when nested objects carry unknown or misplaced fields, then the path names them', () => {
    const field = (c: unknown) => {
      const o = runCase(c);
      return 'error' in o ? o.error.field : 'ok';
    };
    expect(field({ ...pipe(), ambient: { airTemperatureC: 20, foo: 1 } })).toBe('ambient.foo');
    expect(field({ ...pipe(), geometry: { type: 'pipe', outerDiameterM: 0.1, orientation: 'horizontal', headType: 'flat' } })).toBe('geometry.headType');
    expect(field({ ...pipe(), round: { seriesM: [0.05] } })).toBe('round');
    expect(field({ ...pipe(), geometry: { type: 'flat', orientation: 'vertical', heightM: 1 }, run: { lengthM: 1, massFlowKgPerS: 1, specificHeatJPerKgK: 1 } })).toBe('run');
    expect(field({ ...pipe(), layers: [{ thicknessM: 0.05, conductivity: [0.04, Number.NaN] }] })).toBe('layers[0].conductivity[1]');
    expect(field({ ...pipe(), ambient: { airTemperatureC: 20, relativeHumidityPct: 0 } })).toBe('ambient.relativeHumidityPct');
  });

  it('when the input is not a case at all, then runCase answers an error item and never throws', () => {
    for (const bad of [null, 42, [], 'x', { geometry: null }, { ...pipe(), layers: [null] }]) {
      const out = runCase(bad);
      expect('error' in out).toBe(true);
    }
    const out = runCase(null);
    expect('error' in out && out.error.field).toBe('(case)');
  });

  it('when a layer runs above its service temperature, then a warning says so', () => {
    const r = analyse(pipe({ layers: [{ thicknessM: 0.05, conductivity: [0.04], maxServiceTemperatureC: 200 }] }));
    expect(r.warnings.map((w) => w.code)).toContain('MAX_SERVICE_TEMPERATURE_EXCEEDED');
  });

  it('when a layer runs below its minimum service temperature, then a warning names the layer and the limit', () => {
    const layer = { thicknessM: 0.05, conductivity: [0.04], minServiceTemperatureC: -18 };
    const cold = analyse(pipe({ processTemperatureC: -40, layers: [layer] }));
    const w = cold.warnings.find((x) => x.code === 'MIN_SERVICE_TEMPERATURE_EXCEEDED');
    expect(w?.message).toMatch(/Layer 1 reaches -40\.0 °C, below its minimum service temperature of -18 °C/);
    const fine = analyse(pipe({ processTemperatureC: 5, layers: [layer] }));
    expect(fine.warnings.map((x) => x.code)).not.toContain('MIN_SERVICE_TEMPERATURE_EXCEEDED');
  });

  it('when a layer’s mean temperature leaves the range its k(T) was fitted over, then a warning says it is extrapolated', () => {
    const layer = { thicknessM: 0.05, conductivity: [0.035, 0.00015], conductivityDataRangeC: [-73, 24] as [number, number] };
    // 250 °C inside, about 40 °C outside: the mean is far above 24 °C.
    const hot = analyse(pipe({ layers: [layer] }));
    expect(hot.warnings.find((x) => x.code === 'CONDUCTIVITY_EXTRAPOLATED')?.message).toMatch(/Layer 1 .* outside -73\.0…24\.0 °C/);
    // 10 °C inside, 30 °C air: the mean stays within the range.
    const mild = analyse(pipe({ processTemperatureC: 10, layers: [layer] }));
    expect(mild.warnings.map((x) => x.code)).not.toContain('CONDUCTIVITY_EXTRAPOLATED');
  });

  it('when the service limits or data range are contradictory or malformed, then the error names the field', () => {
    const bad = (extra: object) => runCase({ ...pipe(), layers: [{ thicknessM: 0.05, conductivity: [0.04], ...extra }] });
    const a = bad({ minServiceTemperatureC: 300, maxServiceTemperatureC: 200 });
    expect('error' in a && a.error.field).toBe('layers[0].minServiceTemperatureC');
    const b = bad({ conductivityDataRangeC: [50, 10] });
    expect('error' in b && b.error.field).toBe('layers[0].conductivityDataRangeC');
    const c = bad({ conductivityDataRangeC: [10] });
    expect('error' in c && c.error.field).toBe('layers[0].conductivityDataRangeC');
  });

  it('when a cold outdoor surface is below the dew point, then dew and sky warnings appear', () => {
    const r = analyse(
      pipe({
        processTemperatureC: -10,
        layers: [{ thicknessM: 0.005, conductivity: [0.04] }],
        surfaceEmissivity: 0.9,
        ambient: { airTemperatureC: 25, relativeHumidityPct: 80, windSpeedMS: 2 },
      }),
    );
    const codes = r.warnings.map((w) => w.code);
    expect(codes).toContain('SURFACE_BELOW_DEW_POINT');
    expect(codes).toContain('COLD_SURFACE_SKY_RADIATION');
    expect(r.heatLossWPerM as number).toBeLessThan(0);
  });

  it('when a large hot wall pushes Ra past 1e12, then the correlation-range warning is given', () => {
    const r = analyse({
      geometry: { type: 'flat', orientation: 'vertical', heightM: 30 },
      processTemperatureC: 300,
      layers: [],
      surfaceEmissivity: 0.9,
      ambient: { airTemperatureC: 20 },
    });
    expect(r.warnings.map((w) => w.code)).toContain('CORRELATION_OUT_OF_RANGE');
  });

  it('when a hot surface is checked for condensation, then no insulation is needed', () => {
    const r = analyse(
      pipe({ ambient: { airTemperatureC: 30, relativeHumidityPct: 90 }, solveFor: { criterion: 'condensation', marginK: 2 } }),
    );
    expect(r.thicknessM).toBe(0);
    expect(r.totalThicknessM).toBe(0);
  });
});

describe('physical bounds and checks', () => {
  it('when a conductivity is absurdly large or small, then an error names the layer instead of 0 W/m', () => {
    const code = (layers: CalcCase['layers'], over: Partial<CalcCase> = {}) => {
      const o = runCase(pipe({ layers, ...over }));
      return 'error' in o ? `${o.error.code} ${o.error.field}` : 'result';
    };
    expect(code([{ thicknessM: 0.05, conductivity: [1e200, 1e180] }])).toBe('CONDUCTIVITY_OUT_OF_RANGE layers[0].conductivity');
    expect(code([{ thicknessM: 0.05, conductivity: [0.04] }, { thicknessM: 0.05, conductivity: [1e-6] }])).toBe('CONDUCTIVITY_OUT_OF_RANGE layers[1].conductivity');
    expect(code([{ thicknessM: 0.05, conductivity: [1e200] }], { solveFor: { criterion: 'surfaceTemperature', maxC: 60 } })).toBe('CONDUCTIVITY_OUT_OF_RANGE layers[0].conductivity');
    // Steep but physical: k reaches 700 W/(m·K) only far above anything this case sees.
    expect(code([{ thicknessM: 0.05, conductivity: [0.04, 0, 0, 0, 0, 0, 0, 1e-18] }])).toBe('result');
    // Above 500 W/(m·K) inside the span only: found after the solve, over the layer's own span.
    expect(code([{ thicknessM: 0.05, conductivity: [0.04, 0, 0, 0, 0, 0, 0, 1e-14] }])).toBe('CONDUCTIVITY_OUT_OF_RANGE layers[0].conductivity');
  });

  it('when a layer is vanishingly thin or the process sits at the air temperature, then a balanced result still comes back', () => {
    for (const c of [
      pipe({ layers: [{ thicknessM: 5e-324, conductivity: [0.02] }, { thicknessM: 1e-17, conductivity: [0.03, 1e-4] }] }),
      pipe({ geometry: { type: 'flat', orientation: 'faceUp', characteristicLengthM: 0.05 }, processTemperatureC: 2e-14, ambient: { airTemperatureC: 0 } }),
      pipe({ processTemperatureC: 30, ambient: { airTemperatureC: 30 } }),
    ]) {
      const o = runCase(c);
      expect('error' in o ? o.error.code : 'result').toBe('result');
    }
  });

  it('when the emissivity is 0 or below any real finish, then the result warns that radiation is (all but) left out', () => {
    const codes = (eps: number) => analyse(pipe({ surfaceEmissivity: eps })).warnings.map((w) => w.code);
    expect(codes(0)).toContain('EMISSIVITY_BELOW_REAL_SURFACES');
    expect(codes(0.01)).toContain('EMISSIVITY_BELOW_REAL_SURFACES');
    expect(codes(0.02)).not.toContain('EMISSIVITY_BELOW_REAL_SURFACES');
    expect(codes(0.9)).not.toContain('EMISSIVITY_BELOW_REAL_SURFACES');
  });

  it('when a solved surface is recomputed, then its balance closes; when its h_c is disturbed by 1e-5, then the check fails', () => {
    const k = [0.03, 5e-5, 2e-7];
    const m: SurfaceModel = {
      coeffs: [k],
      brackets: [kirchhoffBracket(k, 20, 400)],
      factor: Float64Array.of(Math.log(0.1 / 0.05) / (2 * Math.PI)),
      seriesR: 0,
      area: 2 * Math.PI * 0.1,
      naturalKind: 0,
      naturalLengthM: 0.2,
      forcedKind: 0,
      forcedLengthM: 0.2,
      windMS: 0,
      emissivity: 0.5,
      airC: 20,
      radiantC: 20,
      processC: 400,
      outerDiameterM: 0.2,
      surfaceC: 0,
      heatFlow: 0,
      hc: 0,
      hr: 0,
      balanced: false,
      atBranchChange: false,
      guessC: NaN,
      slope: 0,
    };
    solveSurface(m);
    expect(m.balanced).toBe(true);
    expect(energyBalanceMismatch(m, [m.surfaceC])).toBeLessThanOrEqual(1e-2);
    m.hc *= 1 + 1e-5;
    expect(energyBalanceMismatch(m, [m.surfaceC])).toBeGreaterThan(1);
  });
});

