import { spawnSync } from 'node:child_process';
import path from 'node:path';

import { MAX_CASES, layerOf, runCases } from '../../shared/calc';
import type { CalcCase, CalcOutcome, CalcResult } from '../../shared/calc/types';
import { CONTRACT_EXAMPLE_CASE as CASE } from '../helpers/contract-case';
import { recomputeBalance } from '../reference/energy-balance';

const root = path.join(__dirname, '..', '..');
const calc = (input: string) => spawnSync('npm', ['run', '--silent', 'calc'], { cwd: root, input, encoding: 'utf8', maxBuffer: 1 << 26 });

describe('npm run --silent calc', () => {
  it('when a JSON array of cases arrives on stdin, then the same results as the package come out in order, an error item in place of a bad case, exit 0', () => {
    const cases: unknown[] = [CASE, { ...CASE, surfaceEmissivity: 'shiny' }, { ...CASE, processTemperatureC: 400, solveFor: undefined }];
    const r = calc(JSON.stringify(cases));
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as unknown[];
    expect(out).toEqual(JSON.parse(JSON.stringify(runCases(cases))));
    expect(out[1]).toEqual({ error: expect.objectContaining({ field: '[1].surfaceEmissivity' }) });
    expect((out[0] as { roundedLayersM: number[] }).roundedLayersM).toEqual([0.06]);
  }, 60_000);

  it('when stdin is not JSON, then it says so on stderr and exits 2 with nothing on stdout', () => {
    const r = calc('not json');
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/not JSON/);
  }, 60_000);

  it('when a batch is larger than the cap shared with the API, then one line on stderr, nothing on stdout, exit 2', () => {
    expect(MAX_CASES).toBe(10_000);
    const r = calc(JSON.stringify(Array.from({ length: MAX_CASES + 1 }, () => 0)));
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/at most 10,000 cases per run \(got 10,001\)/);
  }, 60_000);

  it('when five million items arrive, then it refuses them in one line with exit 2 instead of crashing or writing hundreds of MB', () => {
    const r = calc(`[${'0,'.repeat(4_999_999)}0]`);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).not.toMatch(/RangeError|\n\s+at /);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  }, 60_000);

  it('when stdin is larger than the input cap, then one line on stderr, nothing on stdout, exit 2', () => {
    const r = calc(`[${' '.repeat(65 * 1024 * 1024)}]`);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/larger than 64 MB/);
  }, 60_000);

  it('when cases reach the calculation faults found by an outside check, then each comes back balanced, warned or as an error item naming the field', () => {
    const cryo = (processTemperatureC: number, solveFor?: CalcCase['solveFor']): CalcCase => ({
      geometry: { type: 'pipe', outerDiameterM: 0.1143, orientation: 'horizontal' },
      processTemperatureC,
      layers: [layerOf('polyisocyanurate-c591-type-iv', 0.1)],
      surfaceEmissivity: 0.9,
      ambient: { airTemperatureC: 25, relativeHumidityPct: 70 },
      ...(solveFor ? { solveFor } : {}),
    });
    // k = −5e-5 + 2e-5·x² + 1e-12·x⁴ + 1e-14·x⁵, x = T − 102.3 °C: negative only within ±1.6 K of 102.3 °C.
    const narrowBand = [0.20925328098721993, -0.004090806281928795, 0.000019955731823300003, 6.37329e-10, -4.115e-12, 1e-14];
    const wall = (over: Partial<CalcCase>): CalcCase => ({
      geometry: { type: 'flat', orientation: 'vertical', heightM: 2 },
      processTemperatureC: 150,
      layers: [{ thicknessM: 0.05, conductivity: [0.04] }],
      surfaceEmissivity: 0.9,
      ambient: { airTemperatureC: 20 },
      ...over,
    });
    const cases: CalcCase[] = [
      cryo(-183),
      cryo(-162),
      cryo(-183, { criterion: 'condensation', marginK: 1 }),
      cryo(-162, { criterion: 'condensation', marginK: 1 }),
      // A hot plate facing up whose surface sits where McAdams' 0.54·Ra^¼ and 0.15·Ra^⅓ meet (Ra = 10⁷).
      wall({ geometry: { type: 'flat', orientation: 'faceUp', characteristicLengthM: 0.241 }, processTemperatureC: 60, layers: [{ thicknessM: 0.02, conductivity: [0.04] }] }),
      wall({ layers: [{ thicknessM: 0.05, conductivity: narrowBand }] }),
      wall({ layers: [{ thicknessM: 0.05, conductivity: [0.04] }, { thicknessM: 0.05, conductivity: [1e200, 1e180] }] }),
      wall({ surfaceEmissivity: 0 }),
    ];
    const r = calc(JSON.stringify(cases));
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as CalcOutcome[];
    const result = (i: number) => {
      expect(out[i]).not.toHaveProperty('error');
      return out[i] as CalcResult;
    };
    for (const i of [0, 1, 2, 3, 4, 7]) expect(recomputeBalance(cases[i], result(i)).worst).toBeLessThanOrEqual(1e-6);
    // Colder by 21 K gains several per cent more heat, and needs more insulation against condensation.
    expect((result(0).heatLossWPerM as number) / (result(1).heatLossWPerM as number)).toBeGreaterThan(1.04);
    expect(result(2).thicknessM as number).toBeGreaterThan((result(3).thicknessM as number) + 0.003);
    expect(result(4).warnings.map((w) => w.code)).toContain('CORRELATION_BRANCH_CHANGE');
    expect(out[5]).toEqual({ error: expect.objectContaining({ code: 'CONDUCTIVITY_NOT_POSITIVE', field: '[5].layers[0].conductivity' }) });
    expect(out[6]).toEqual({ error: expect.objectContaining({ code: 'CONDUCTIVITY_OUT_OF_RANGE', field: '[6].layers[1].conductivity' }) });
    expect(result(7).warnings.map((w) => w.code)).toContain('EMISSIVITY_BELOW_REAL_SURFACES');
  }, 60_000);
});

