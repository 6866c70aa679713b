import { analyse } from '../../shared/calc';

// Source: RoyMech engineering reference (roymech.org, "Thermos — insulation tables"), table "Heat loss from
// bare black steel pipes": horizontal pipes, ambient air 20 °C, emissivity 0.9, still air, W/m by pipe
// outside diameter [mm] and pipe temperature [°C]. The table is printed to whole watts (2–4 significant
// figures) but its convection method is not named; handbook bare-pipe tables are built on simplified
// natural-convection formulas whose spread against Churchill–Chu is several percent, and Churchill–Chu's own
// scatter against measurements is about ±10 %. Tolerance: 10 %.
const TABLE: Record<string, Record<number, number>> = {
  '21.3': { 50: 27, 100: 93, 150: 180, 200: 290 },
  '60.3': { 50: 68, 100: 230, 150: 448, 200: 728 },
  '114.3': { 50: 119, 100: 405, 150: 791, 200: 1292 },
  '168.3': { 100: 571, 200: 1833 },
  '273.0': { 100: 880, 200: 2848 },
};

const rows: Array<[string, number, number]> = [];
for (const [od, byT] of Object.entries(TABLE)) for (const [T, q] of Object.entries(byT)) rows.push([od, Number(T), q]);

describe('bare horizontal steel pipe in still air, against a handbook table', () => {
  it.each(rows)('when OD %s mm is at %p °C, then q′ ≈ %p W/m', (od, T, published) => {
    const r = analyse({
      geometry: { type: 'pipe', outerDiameterM: Number(od) / 1000, orientation: 'horizontal' },
      processTemperatureC: T,
      layers: [],
      surfaceEmissivity: 0.9,
      ambient: { airTemperatureC: 20 },
    });
    expect(Math.abs((r.heatLossWPerM as number) / published - 1)).toBeLessThan(0.1);
  });
});
