/**
 * Seeded benchmark cases that span the calculation domain: pipes, walls and vessels; hot and cold
 * service from −200 to 1000 °C; air −40 to 50 °C; wind 0–20 m/s; emissivity 0.02–1; bare and up to
 * two insulation layers. Same seed → same cases, so runs compare.
 */
import type { CalcCase, Geometry, Layer, SolveFor } from '../shared/calc/types';

/** Mulberry32: a small, well-known 32-bit PRNG; good enough to spread benchmark inputs. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const PIPE_OD_M = [0.0213, 0.0334, 0.0483, 0.0603, 0.0889, 0.1143, 0.1683, 0.2191, 0.3239, 0.508, 0.762];
// Representative k(T) curves [W/(m·K)], T in °C; generic shapes of fibrous, cellular and foam insulation.
const HOT_K: number[][] = [
  [0.0325, 0.000105, 3.2e-7],
  [0.052, 0.0001, 1.1e-7],
  [0.041, 0.00012, 0],
];
const COLD_K: number[][] = [
  [0.034, 0.00012, 0],
  [0.022, 0.00008, 0],
  [0.044, 0.00016, 0],
];

function pick<T>(rand: () => number, items: readonly T[]): T {
  return items[Math.floor(rand() * items.length)];
}

function between(rand: () => number, lo: number, hi: number): number {
  return lo + (hi - lo) * rand();
}

function geometry(rand: () => number): Geometry {
  const r = rand();
  if (r < 0.6) {
    const vertical = rand() < 0.2;
    return vertical
      ? { type: 'pipe', outerDiameterM: pick(rand, PIPE_OD_M), orientation: 'vertical', heightM: between(rand, 1, 10) }
      : { type: 'pipe', outerDiameterM: pick(rand, PIPE_OD_M), orientation: 'horizontal' };
  }
  if (r < 0.8) {
    const o = pick(rand, ['vertical', 'faceUp', 'faceDown'] as const);
    return o === 'vertical'
      ? { type: 'flat', orientation: o, heightM: between(rand, 0.5, 6) }
      : { type: 'flat', orientation: o, characteristicLengthM: between(rand, 0.2, 2) };
  }
  return {
    type: 'vessel',
    diameterM: between(rand, 0.5, 4),
    lengthM: between(rand, 1, 12),
    orientation: pick(rand, ['horizontal', 'vertical'] as const),
    headType: pick(rand, ['flat', 'ellipsoidal2to1', 'hemispherical'] as const),
  };
}

/** One analysis case (no solving) anywhere in the domain. */
export function analysisCase(rand: () => number): CalcCase {
  const hot = rand() < 0.75;
  const processTemperatureC = hot ? between(rand, 60, 1000) : between(rand, -200, 10);
  const nLayers = Math.floor(rand() * 3);
  const layers: Layer[] = [];
  for (let i = 0; i < nLayers; i++) {
    layers.push({ thicknessM: between(rand, 0.01, 0.12), conductivity: pick(rand, hot ? HOT_K : COLD_K) });
  }
  const air = between(rand, -40, 50);
  return {
    geometry: geometry(rand),
    processTemperatureC,
    layers,
    surfaceEmissivity: between(rand, 0.02, 1),
    ambient: {
      airTemperatureC: air,
      radiantTemperatureC: air + between(rand, -10, 5),
      windSpeedMS: rand() < 0.4 ? 0 : between(rand, 0.5, 20),
      relativeHumidityPct: between(rand, 20, 95),
    },
  };
}

/** One thickness-solving case with a target that is usually reachable, rounded to a metric series. */
export function solveCase(rand: () => number): CalcCase {
  const base = analysisCase(rand);
  const hot = base.processTemperatureC > 50;
  if (base.layers.length === 0) base.layers.push({ thicknessM: 0.05, conductivity: pick(rand, hot ? HOT_K : COLD_K) });
  let solveFor: SolveFor;
  if (!hot) {
    solveFor = { criterion: 'condensation', marginK: between(rand, 0, 2) };
    base.ambient.relativeHumidityPct = between(rand, 40, 85);
    base.ambient.airTemperatureC = between(rand, 15, 35);
    base.ambient.radiantTemperatureC = base.ambient.airTemperatureC;
  } else if (rand() < 0.5) {
    solveFor = { criterion: 'surfaceTemperature', maxC: between(rand, 50, 65) };
    base.ambient.airTemperatureC = between(rand, -10, 35);
    base.ambient.radiantTemperatureC = base.ambient.airTemperatureC;
  } else {
    const g = base.geometry;
    const bound = g.type === 'pipe' ? { maxWPerM: between(rand, 60, 400) } : g.type === 'flat' ? { maxWPerM2: between(rand, 40, 400) } : { maxW: between(rand, 2000, 60000) };
    solveFor = { criterion: 'heatLoss', ...bound };
  }
  return {
    ...base,
    solveFor,
    round: { seriesM: [0.02, 0.025, 0.03, 0.04, 0.05, 0.06, 0.08, 0.1, 0.12, 0.15], maxSingleLayerM: 0.15 },
  };
}

export function makeCases(kind: 'analyse' | 'solve', count: number, seed = 20261202): CalcCase[] {
  const rand = seededRandom(seed);
  const make = kind === 'analyse' ? analysisCase : solveCase;
  return Array.from({ length: count }, () => make(rand));
}

if (require.main === module) {
  const [kind = 'analyse', count = '100'] = process.argv.slice(2);
  process.stdout.write(JSON.stringify(makeCases(kind === 'solve' ? 'solve' : 'analyse', Number(count))));
}
