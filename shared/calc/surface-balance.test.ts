import * as fc from 'fast-check';
import { recomputeBalance } from '../../tests/reference/energy-balance';
import { airProperties } from './air-properties';
import { analyse } from './analyse';
import { layerOf } from './library';
import { RA_BRANCH_PLATE_UPPER_HOT, rayleighNumberIdealGas } from './natural-convection';
import { runCase } from './run-case';
import type { CalcCase, CalcResult, Geometry, Layer, Rounding, SolveFor } from './types';

const FOUR_INCH = { type: 'pipe', outerDiameterM: 0.1143, orientation: 'horizontal' } as const;

function cryogenicPipe(material: string, processC: number, solveFor?: SolveFor): CalcCase {
  const c: CalcCase = {
    geometry: FOUR_INCH,
    processTemperatureC: processC,
    layers: [layerOf(material, 0.1)],
    surfaceEmissivity: 0.9,
    ambient: { airTemperatureC: 25, relativeHumidityPct: 70 },
  };
  if (solveFor) c.solveFor = solveFor;
  return c;
}

describe('cold service with cubic and quadratic k(T) reaching far down', () => {
  it.each(['polyisocyanurate-c591-type-iv', 'flexible-elastomeric-c534-grade-1-type-i'])(
    'when a 4-inch pipe with 100 mm of %s runs at −183 °C, then the balance closes and it gains more heat than at −162 °C',
    (material) => {
      const cold = cryogenicPipe(material, -183);
      const warmer = cryogenicPipe(material, -162);
      const a = analyse(cold);
      const b = analyse(warmer);
      expect(recomputeBalance(cold, a).worst).toBeLessThanOrEqual(1e-6);
      expect(recomputeBalance(warmer, b).worst).toBeLessThanOrEqual(1e-6);
      // 21 K more across the layer, where k is lowest: a few per cent more heat gain (about 6 % for the foam,
      // 3 % for the elastomer whose k falls steeply there), never the same.
      expect((a.heatLossWPerM as number) / (b.heatLossWPerM as number)).toBeGreaterThan(1.02);
    },
  );

  it('when the condensation thickness is solved at −183 °C, then it is thicker than at −162 °C and the solved layer meets the margin', () => {
    const crit: SolveFor = { criterion: 'condensation', marginK: 1 };
    const a = analyse(cryogenicPipe('polyisocyanurate-c591-type-iv', -183, crit));
    const b = analyse(cryogenicPipe('polyisocyanurate-c591-type-iv', -162, crit));
    expect(a.thicknessM as number).toBeGreaterThan((b.thicknessM as number) + 0.003);
    expect(a.surfaceTemperatureC).toBeCloseTo((a.dewPointC as number) + 1, 3);
  });
});

describe('a surface on the McAdams branch change (hot plate facing up, Ra = 10⁷)', () => {
  const plate = (L: number): CalcCase => ({
    geometry: { type: 'flat', orientation: 'faceUp', characteristicLengthM: L },
    processTemperatureC: 60,
    layers: [{ thicknessM: 0.02, conductivity: [0.04] }],
    surfaceEmissivity: 0.9,
    ambient: { airTemperatureC: 20 },
  });

  it('when the balance falls on the step, then it closes there, h_c lies between the branches, and a warning says so', () => {
    const c = plate(0.241);
    const r = analyse(c);
    expect(recomputeBalance(c, r).worst).toBeLessThanOrEqual(1e-6);
    expect(r.warnings.map((w) => w.code)).toContain('CORRELATION_BRANCH_CHANGE');
    const Ts = r.surfaceTemperatureC;
    const film = (Ts + 20) / 2 + 273.15;
    const air = airProperties(film);
    const Ra = rayleighNumberIdealGas(Ts - 20, 0.241, film, air.nu, air.Pr);
    expect(Math.abs(Ra / RA_BRANCH_PLATE_UPPER_HOT - 1)).toBeLessThan(1e-6);
    const hLow = (0.54 * Ra ** 0.25 * air.k) / 0.241;
    const hHigh = (0.15 * Math.cbrt(Ra) * air.k) / 0.241;
    expect(r.convectionCoefficientWPerM2K).toBeGreaterThan(hLow);
    expect(r.convectionCoefficientWPerM2K).toBeLessThan(hHigh);
  });

  it('when the plate size passes through the step, then the heat flux moves continuously and only the step carries the warning', () => {
    let last: number | undefined;
    for (let L = 0.239; L <= 0.243; L += 0.0001) {
      const r = analyse(plate(L));
      const q = r.heatFluxWPerM2 as number;
      if (last !== undefined) expect(Math.abs(q / last - 1)).toBeLessThan(2e-3);
      last = q;
      const atStep = r.warnings.some((w) => w.code === 'CORRELATION_BRANCH_CHANGE');
      const film = (r.surfaceTemperatureC + 20) / 2 + 273.15;
      const air = airProperties(film);
      const Ra = rayleighNumberIdealGas(r.surfaceTemperatureC - 20, L, film, air.nu, air.Pr);
      expect(atStep).toBe(Math.abs(Ra / RA_BRANCH_PLATE_UPPER_HOT - 1) < 1e-6);
    }
  });
});

// ---- The energy balance over the whole valid domain ----

const geometryArb: fc.Arbitrary<Geometry> = fc.oneof(
  fc.record({ type: fc.constant('pipe' as const), outerDiameterM: fc.double({ min: 0.01, max: 1.5, noNaN: true }), orientation: fc.constant('horizontal' as const) }),
  fc.record({
    type: fc.constant('pipe' as const),
    outerDiameterM: fc.double({ min: 0.01, max: 1.5, noNaN: true }),
    orientation: fc.constant('vertical' as const),
    heightM: fc.double({ min: 0.5, max: 30, noNaN: true }),
  }),
  fc.record({ type: fc.constant('flat' as const), orientation: fc.constant('vertical' as const), heightM: fc.double({ min: 0.1, max: 20, noNaN: true }) }),
  fc.record({
    type: fc.constant('flat' as const),
    orientation: fc.constantFrom('faceUp' as const, 'faceDown' as const),
    characteristicLengthM: fc.double({ min: 0.05, max: 5, noNaN: true }),
  }),
  fc.record({
    type: fc.constant('vessel' as const),
    diameterM: fc.double({ min: 0.3, max: 8, noNaN: true }),
    lengthM: fc.double({ min: 0.3, max: 25, noNaN: true }),
    orientation: fc.constantFrom('horizontal' as const, 'vertical' as const),
    headType: fc.constantFrom('flat' as const, 'ellipsoidal2to1' as const, 'hemispherical' as const),
  }),
);

/**
 * k(T) of degree 1–3 that stays within 0.1·k₀…1.9·k₀ over [lo, hi] by construction: k = k₀·(1 + Σ aᵢ·xⁱ)
 * with x = (T − mid)/half ∈ [−1, 1] and Σ|aᵢ| ≤ 0.9, expanded into powers of T.
 */
function conductivityArb(lo: number, hi: number): fc.Arbitrary<number[]> {
  const mid = (lo + hi) / 2;
  const half = Math.max((hi - lo) / 2, 1);
  return fc
    .tuple(
      fc.double({ min: 0.015, max: 0.2, noNaN: true }),
      fc.integer({ min: 1, max: 3 }),
      fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: 3, maxLength: 3 }),
    )
    .map(([k0, degree, raw]) => {
      const a = raw.slice(0, degree);
      const sum = a.reduce((s, v) => s + Math.abs(v), 0);
      const scale = sum > 0.9 ? 0.9 / sum : 1;
      const binom = [[1], [1, 1], [1, 2, 1], [1, 3, 3, 1]];
      const c = new Array<number>(degree + 1).fill(0);
      c[0] = k0;
      a.forEach((ai, idx) => {
        const i = idx + 1;
        for (let j = 0; j <= i; j++) c[j] += (k0 * ai * scale * binom[i][j] * (-mid) ** (i - j)) / half ** i;
      });
      return c;
    });
}

type Setting = { hot: boolean; processC: number; airC: number; radiantC: number };

const settingArb: fc.Arbitrary<Setting> = fc
  .record({
    hot: fc.boolean(),
    hotC: fc.double({ min: 40, max: 1000, noNaN: true }),
    coldC: fc.double({ min: -200, max: 15, noNaN: true }),
    airC: fc.double({ min: -40, max: 50, noNaN: true }),
    sky: fc.oneof(fc.constant(0), fc.double({ min: -20, max: 10, noNaN: true })),
  })
  .map(({ hot, hotC, coldC, airC, sky }) => ({ hot, processC: hot ? hotC : coldC, airC, radiantC: airC + sky }));

function solveArb(s: Setting, g: Geometry): fc.Arbitrary<Partial<CalcCase>> {
  const series: Rounding = { seriesM: [0.02, 0.025, 0.03, 0.04, 0.05, 0.06, 0.08, 0.1, 0.12, 0.15], maxSingleLayerM: 0.1 };
  const round: fc.Arbitrary<Rounding | undefined> = fc.option(fc.constant(series), { nil: undefined });
  const limit = g.type === 'pipe' ? 'maxWPerM' : g.type === 'flat' ? 'maxWPerM2' : 'maxW';
  const options: fc.Arbitrary<Partial<CalcCase>>[] = [fc.constant({})];
  if (s.hot) {
    options.push(fc.record({ solveFor: fc.double({ min: 40, max: 70, noNaN: true }).map((maxC) => ({ criterion: 'surfaceTemperature' as const, maxC })), round }));
    options.push(
      fc.record({
        solveFor: fc.double({ min: 20, max: g.type === 'vessel' ? 50_000 : 300, noNaN: true }).map((v) => ({ criterion: 'heatLoss' as const, [limit]: v })),
        round,
      }),
    );
  } else {
    options.push(fc.record({ solveFor: fc.double({ min: 0, max: 3, noNaN: true }).map((marginK) => ({ criterion: 'condensation' as const, marginK })), round }));
  }
  if (g.type === 'pipe') {
    options.push(
      fc.record({
        run: fc.record({
          lengthM: fc.double({ min: 10, max: 3000, noNaN: true }),
          massFlowKgPerS: fc.double({ min: 0.05, max: 20, noNaN: true }),
          specificHeatJPerKgK: fc.constant(4190),
        }),
        solveFor: fc.double({ min: 0.5, max: 20, noNaN: true }).map((maxChangeK) => ({ criterion: 'temperatureChange' as const, maxChangeK })),
      }),
    );
    if (!s.hot && s.airC < 0 && s.processC > 0) {
      const inner = (g as { outerDiameterM: number }).outerDiameterM * 0.9;
      options.push(
        fc.record({
          stagnant: fc.constant({ innerDiameterM: inner, pipeMassKgPerM: 10 }),
          solveFor: fc.double({ min: 1, max: 24, noNaN: true }).map((minHours) => ({ criterion: 'freezeTime' as const, minHours })),
        }),
      );
    }
  }
  return fc.oneof(...options);
}

const caseArb: fc.Arbitrary<CalcCase> = fc.tuple(settingArb, geometryArb).chain(([s, geometry]) => {
  const lo = Math.min(s.processC, s.airC, s.radiantC);
  const hi = Math.max(s.processC, s.airC, s.radiantC);
  const layer: fc.Arbitrary<Layer> = fc.record({ thicknessM: fc.double({ min: 0.001, max: 0.25, noNaN: true }), conductivity: conductivityArb(lo, hi) });
  return fc
    .record({
      layers: fc.array(layer, { minLength: 1, maxLength: 3 }),
      surfaceEmissivity: fc.double({ min: 0.02, max: 1, noNaN: true }),
      windSpeedMS: fc.oneof(fc.constant(0), fc.double({ min: 0.2, max: 20, noNaN: true })),
      relativeHumidityPct: fc.double({ min: 20, max: 95, noNaN: true }),
      solve: solveArb(s, geometry),
    })
    .map(({ layers, surfaceEmissivity, windSpeedMS, relativeHumidityPct, solve }) => ({
      geometry,
      processTemperatureC: s.processC,
      layers,
      surfaceEmissivity,
      ambient: { airTemperatureC: s.airC, radiantTemperatureC: s.radiantC, windSpeedMS, relativeHumidityPct },
      ...solve,
    }));
});

/** Error items a valid case may honestly end in; a balance failure or a crash is never one of them. */
const ACCEPTABLE_ERRORS = new Set(['TARGET_NOT_REACHABLE', 'SERIES_TOO_THIN']);

describe('energy balance over the valid domain', () => {
  it('when any case in the domain is analysed, then conduction through every layer equals convection + radiation at the surface within 1e-6, or the case is an error item', () => {
    let results = 0;
    let errors = 0;
    fc.assert(
      fc.property(caseArb, (c) => {
        const out = runCase(c);
        if ('error' in out) {
          errors++;
          expect(ACCEPTABLE_ERRORS.has(out.error.code) ? 'acceptable' : out.error).toBe('acceptable');
          return;
        }
        results++;
        const b = recomputeBalance(c, out as CalcResult);
        expect(b.worst).toBeLessThanOrEqual(1e-6);
      }),
      { numRuns: 600 },
    );
    // The property must rest on real results, not on error items.
    expect(results).toBeGreaterThan(4 * errors);
  });
});
