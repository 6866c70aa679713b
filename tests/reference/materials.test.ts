/**
 * Reference checks of the built-in insulation materials against their specification tables.
 *
 * Source: the ASTM material specification named in each material's `source` (C547, C533, C552, C591, C534, C612,
 * C610, C1728), table of maximum apparent thermal conductivity at mean temperature, in Btu·in/(h·ft²·°F) at °F;
 * values as recalled **from memory** (see each material's `confidence`), converted with the exact factors of
 * NIST SP 811 (2008).
 * Tolerance 2 %: the tables give k to 2 significant figures (e.g. 0.25, 0.29), so a value is known to about
 * ±0.005 / 0.25 = ±2 %; a fitted curve within 2 % of every point is as good as the table can tell.
 */
import { conductivityAt } from '../../shared/calc/conduction';
import { INSULATION_MATERIALS, layerOf } from '../../shared/calc/library/materials';
import { btuInchPerHourSquareFootFahrenheitToWattsPerMetreKelvin, fahrenheitToCelsius } from '../../shared/calc/units';

describe('built-in materials', () => {
  it.each(INSULATION_MATERIALS.map((m) => [m.id, m] as const))(
    'when %s k(T) is evaluated at each table point, then it is within 2 % of the table',
    (_id, material) => {
      expect(material.tablePoints.length).toBeGreaterThanOrEqual(3);
      for (const point of material.tablePoints) {
        const k = conductivityAt(material.conductivity, point.meanTemperatureC);
        expect(Math.abs(k / point.conductivityWPerMK - 1)).toBeLessThanOrEqual(0.02);
      }
    },
  );

  it.each(INSULATION_MATERIALS.map((m) => [m.id, m] as const))(
    'when %s k(T) is evaluated over its service range, then it stays positive and finite',
    (_id, material) => {
      const span = material.maxServiceTemperatureC - material.minServiceTemperatureC;
      for (let i = 0; i <= 200; i += 1) {
        const t = material.minServiceTemperatureC + (span * i) / 200;
        const k = conductivityAt(material.conductivity, t);
        expect(Number.isFinite(k)).toBe(true);
        expect(k).toBeGreaterThan(0);
      }
    },
  );

  it.each(INSULATION_MATERIALS.map((m) => [m.id, m] as const))(
    'when %s is listed, then its source names its ASTM specification and says it is recalled',
    (_id, material) => {
      expect(material.source).toMatch(/ASTM C\d+/);
      expect(material.source).toMatch(/from memory/);
      expect(material.maxServiceTemperatureC).toBeGreaterThan(material.minServiceTemperatureC);
    },
  );

  it('when the ASTM C547 Type I table is checked at 100 °F, then the stored SI point is 0.25 Btu·in/(h·ft²·°F) at 37.8 °C', () => {
    // Source: ASTM C547, Type I, 100 °F mean: 0.25 Btu·in/(h·ft²·°F) (from memory) = 0.03606 W/(m·K).
    const m = INSULATION_MATERIALS.find((x) => x.id === 'mineral-fibre-pipe-c547-type-i');
    const p = m?.tablePoints[0];
    expect(p?.meanTemperatureC).toBeCloseTo(fahrenheitToCelsius(100), 9);
    expect(p?.conductivityWPerMK).toBeCloseTo(btuInchPerHourSquareFootFahrenheitToWattsPerMetreKelvin(0.25), 9);
    expect(p?.conductivityWPerMK).toBeCloseTo(0.03606, 5);
  });

  it('when no brand could slip in, then names are generic type names', () => {
    for (const m of INSULATION_MATERIALS) {
      expect(m.name).toMatch(
        /^(Mineral-fibre|Calcium silicate|Cellular glass|Rigid polyisocyanurate|Flexible elastomeric|Expanded perlite|Flexible aerogel)/,
      );
    }
  });

  it('when a layer is made of a material, then it carries the k(T) and service limit', () => {
    const layer = layerOf('calcium-silicate-c533-type-i', 0.05);
    expect(layer.thicknessM).toBe(0.05);
    expect(layer.maxServiceTemperatureC).toBe(650);
    expect(conductivityAt(layer.conductivity, 37.8)).toBeCloseTo(btuInchPerHourSquareFootFahrenheitToWattsPerMetreKelvin(0.41), 3);
    expect(() => layerOf('no-such-material', 0.05)).toThrow(/material/);
  });
});
