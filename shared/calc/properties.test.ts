import * as fc from 'fast-check';
import { analyse } from './analyse';
import { ImpossibleTargetError } from './errors';
import type { CalcCase, CalcResult, Geometry } from './types';

const geometryArb: fc.Arbitrary<Geometry> = fc.oneof(
  fc.record({
    type: fc.constant('pipe' as const),
    outerDiameterM: fc.double({ min: 0.006, max: 1.5, noNaN: true }),
    orientation: fc.constant('horizontal' as const),
  }),
  fc.record({
    type: fc.constant('pipe' as const),
    outerDiameterM: fc.double({ min: 0.006, max: 1.5, noNaN: true }),
    orientation: fc.constant('vertical' as const),
    heightM: fc.double({ min: 0.5, max: 30, noNaN: true }),
  }),
  fc.record({
    type: fc.constant('flat' as const),
    orientation: fc.constant('vertical' as const),
    heightM: fc.double({ min: 0.1, max: 20, noNaN: true }),
  }),
  fc.record({
    type: fc.constant('flat' as const),
    orientation: fc.constantFrom('faceUp' as const, 'faceDown' as const),
    characteristicLengthM: fc.double({ min: 0.05, max: 10, noNaN: true }),
  }),
  fc.record({
    type: fc.constant('vessel' as const),
    diameterM: fc.double({ min: 0.3, max: 10, noNaN: true }),
    lengthM: fc.double({ min: 0.3, max: 30, noNaN: true }),
    orientation: fc.constantFrom('horizontal' as const, 'vertical' as const),
    headType: fc.constantFrom('flat' as const, 'ellipsoidal2to1' as const, 'hemispherical' as const),
  }),
);

const layersArb = fc.array(
  fc.record({
    thicknessM: fc.double({ min: 0, max: 0.3, noNaN: true }),
    // Typical mineral wool / foam / calcium silicate shapes, positive over −273…1000 °C.
    conductivity: fc.oneof(
      fc.tuple(fc.double({ min: 0.02, max: 0.15, noNaN: true })).map((t) => [...t]),
      fc
        .tuple(fc.double({ min: 0.02, max: 0.1, noNaN: true }), fc.double({ min: 0, max: 1.5e-4, noNaN: true }))
        .map(([a, b]) => [a + 300 * b, b]),
      fc
        .tuple(fc.double({ min: 0.03, max: 0.06, noNaN: true }), fc.double({ min: 0, max: 1e-7, noNaN: true }))
        .map(([a, c2]) => [a, 5e-5, c2]),
    ),
  }),
  { maxLength: 3 },
);

const ambientArb = fc.record({
  airTemperatureC: fc.double({ min: -40, max: 50, noNaN: true }),
  windSpeedMS: fc.double({ min: 0, max: 20, noNaN: true }),
  relativeHumidityPct: fc.double({ min: 5, max: 100, noNaN: true }),
});

const caseArb: fc.Arbitrary<CalcCase> = fc.record({
  geometry: geometryArb,
  processTemperatureC: fc.double({ min: -200, max: 1000, noNaN: true }),
  layers: layersArb,
  surfaceEmissivity: fc.double({ min: 0.02, max: 1, noNaN: true }),
  ambient: ambientArb,
});

function allFinite(r: CalcResult): boolean {
  const nums: number[] = [
    r.surfaceTemperatureC,
    r.convectionCoefficientWPerM2K,
    r.radiationCoefficientWPerM2K,
    r.totalThicknessM,
    ...r.interfaceTemperaturesC,
  ];
  for (const v of [r.heatLossWPerM, r.heatFluxWPerM2, r.heatLossW, r.dewPointC]) if (v !== undefined) nums.push(v);
  for (const p of r.parts ?? []) nums.push(p.areaM2, p.heatLossW, p.surfaceTemperatureC);
  return nums.every(Number.isFinite);
}

describe('properties over the valid domain', () => {
  it('when any case in the domain is analysed, then no field is NaN or infinite and the surface lies between process and surroundings', () => {
    fc.assert(
      fc.property(caseArb, (c) => {
        const r = analyse(c);
        expect(allFinite(r)).toBe(true);
        const a = c.ambient.airTemperatureC;
        const lo = Math.min(c.processTemperatureC, a) - 1e-6;
        const hi = Math.max(c.processTemperatureC, a) + 1e-6;
        expect(r.surfaceTemperatureC).toBeGreaterThanOrEqual(lo);
        expect(r.surfaceTemperatureC).toBeLessThanOrEqual(hi);
        const q = r.heatLossWPerM ?? r.heatFluxWPerM2 ?? (r.heatLossW as number);
        // Heat flows from hot to cold: its sign follows process − air (surroundings at air temperature).
        if (c.processTemperatureC > a + 1e-3) expect(q).toBeGreaterThan(0);
        if (c.processTemperatureC < a - 1e-3) expect(q).toBeLessThan(0);
      }),
      { numRuns: 300 },
    );
  });

  it('when a hot pipe above the critical radius gets more insulation, then surface temperature and heat loss fall', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.05, max: 1, noNaN: true }),
        fc.double({ min: 60, max: 1000, noNaN: true }),
        fc.double({ min: 0.02, max: 0.3, noNaN: true }),
        fc.double({ min: 0.001, max: 0.2, noNaN: true }),
        ambientArb,
        fc.double({ min: 0.02, max: 1, noNaN: true }),
        (D, Tp, t1, dt, ambient, eps) => {
          fc.pre(Tp > ambient.airTemperatureC + 20);
          const at = (t: number) =>
            analyse({
              geometry: { type: 'pipe', outerDiameterM: D, orientation: 'horizontal' },
              processTemperatureC: Tp,
              layers: [{ thicknessM: t, conductivity: [0.03, 1e-4] }],
              surfaceEmissivity: eps,
              ambient,
            });
          const a = at(t1);
          const b = at(t1 + dt);
          expect(b.surfaceTemperatureC).toBeLessThanOrEqual(a.surfaceTemperatureC + 1e-6);
          expect(b.heatLossWPerM as number).toBeLessThanOrEqual((a.heatLossWPerM as number) * (1 + 1e-9));
        },
      ),
      { numRuns: 150 },
    );
  });

  it('when a hot wall gets more insulation from zero, then surface temperature and heat flux fall', () => {
    fc.assert(
      fc.property(geometryArb.filter((g) => g.type === 'flat'), fc.double({ min: 40, max: 1000, noNaN: true }), fc.double({ min: 0, max: 0.3, noNaN: true }), fc.double({ min: 0.001, max: 0.2, noNaN: true }), ambientArb, (g, Tp, t1, dt, ambient) => {
        fc.pre(Tp > ambient.airTemperatureC + 10);
        const at = (t: number) =>
          analyse({ geometry: g, processTemperatureC: Tp, layers: [{ thicknessM: t, conductivity: [0.04] }], surfaceEmissivity: 0.5, ambient });
        const a = at(t1);
        const b = at(t1 + dt);
        expect(b.surfaceTemperatureC).toBeLessThanOrEqual(a.surfaceTemperatureC + 1e-6);
        expect(b.heatFluxWPerM2 as number).toBeLessThanOrEqual((a.heatFluxWPerM2 as number) * (1 + 1e-9));
      }),
      { numRuns: 100 },
    );
  });

  it('when a surface-temperature or heat-loss target is solved, then analysing the solved build-up meets it', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 0.8, noNaN: true }),
        fc.double({ min: 80, max: 900, noNaN: true }),
        ambientArb,
        fc.double({ min: 0.02, max: 1, noNaN: true }),
        fc.double({ min: 0.05, max: 0.95, noNaN: true }),
        fc.boolean(),
        (D, Tp, ambient, eps, frac, byLoss) => {
          const base: CalcCase = {
            geometry: { type: 'pipe', outerDiameterM: D, orientation: 'horizontal' },
            processTemperatureC: Tp,
            layers: [{ thicknessM: 0, conductivity: [0.035, 1.5e-4] }],
            surfaceEmissivity: eps,
            ambient,
          };
          const bare = analyse(base);
          const solveFor: CalcCase['solveFor'] = byLoss
            ? { criterion: 'heatLoss', maxWPerM: (bare.heatLossWPerM as number) * frac }
            : { criterion: 'surfaceTemperature', maxC: ambient.airTemperatureC + (Tp - ambient.airTemperatureC) * frac };
          let r: CalcResult;
          try {
            r = analyse({ ...base, solveFor, round: { seriesM: [0.02, 0.025, 0.03, 0.04, 0.05, 0.06, 0.08, 0.1], maxSingleLayerM: 0.1 } });
          } catch (e) {
            if (e instanceof ImpossibleTargetError) return;
            throw e;
          }
          const back = analyse({ ...base, layers: [{ thicknessM: r.thicknessM as number, conductivity: [0.035, 1.5e-4] }] });
          if (solveFor.criterion === 'heatLoss') {
            expect(back.heatLossWPerM as number).toBeLessThanOrEqual((solveFor.maxWPerM as number) * (1 + 1e-4));
            expect(r.heatLossWPerM as number).toBeLessThanOrEqual((solveFor.maxWPerM as number) * (1 + 1e-6));
          } else {
            expect(back.surfaceTemperatureC).toBeLessThanOrEqual(solveFor.maxC + 1e-3);
            expect(r.surfaceTemperatureC).toBeLessThanOrEqual(solveFor.maxC + 1e-6);
          }
        },
      ),
      { numRuns: 80 },
    );
  });
});
