import { conductivityAt } from '../conduction';
import { FINISHES, finishById, finishEmissivityForBasis } from './finishes';
import { analyse } from '../analyse';
import { conductivityDataRange, fitConductivityPolynomial, INSULATION_MATERIALS, insulationMaterialById, layerOf } from './materials';
import { METRIC_ROUNDING, roundingFromMillimetres, US_ROUNDING } from './series';

describe('fitConductivityPolynomial', () => {
  it('when points lie exactly on a quadratic, then the fit recovers its coefficients', () => {
    const exact = [0.03, 1e-4, 2e-7];
    const points = [-50, 0, 100, 250, 400].map((t) => ({ meanTemperatureC: t, conductivityWPerMK: conductivityAt(exact, t) }));
    const fit = fitConductivityPolynomial(points, 2);
    expect(fit[0]).toBeCloseTo(exact[0], 10);
    expect(fit[1]).toBeCloseTo(exact[1], 12);
    expect(fit[2]).toBeCloseTo(exact[2], 14);
  });

  it('when there are too few points, then it throws', () => {
    expect(() => fitConductivityPolynomial([{ meanTemperatureC: 0, conductivityWPerMK: 0.04 }], 1)).toThrow(/at least 2/);
  });

  it('when material ids are listed, then they are unique', () => {
    expect(new Set(INSULATION_MATERIALS.map((m) => m.id)).size).toBe(INSULATION_MATERIALS.length);
  });
});

const BY_ID = INSULATION_MATERIALS.map((m) => [m.id, m] as const);

describe('built-in materials: each k(T) against its own table', () => {
  // Each material keeps the table points its curve was fitted to; the check is that the curve reproduces every
  // point within 2 %: the tables give k to two significant figures (e.g. 0.25 Btu·in/(h·ft²·°F)), so a value is
  // known to about ±0.005 / 0.25 = ±2 %. Which points were checked against a published reproduction of the ASTM
  // table, and which are recalled, is each point's `confirmed` flag and the material's `confidence`; the
  // confirmed points are also asserted against their published values in tests/reference/materials.test.ts.
  it.each(BY_ID)(
    'when %s k(T) is evaluated at each table point, then it is within 2 % of the table',
    (_id, material) => {
      expect(material.tablePoints.length).toBeGreaterThanOrEqual(3);
      for (const point of material.tablePoints) {
        const k = conductivityAt(material.conductivity, point.meanTemperatureC);
        expect(Math.abs(k / point.conductivityWPerMK - 1)).toBeLessThanOrEqual(0.02);
      }
    },
  );

  it.each(BY_ID)(
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

  it.each(BY_ID)(
    'when %s is listed, then its source names its ASTM specification and its provenance matches its confidence',
    (_id, material) => {
      expect(material.source).toMatch(/ASTM C\d+/);
      expect(material.maxServiceTemperatureC).toBeGreaterThan(material.minServiceTemperatureC);
      const confirmed = material.tablePoints.filter((p) => p.confirmed === true).length;
      switch (material.confidence) {
        case 'confirmed':
          expect(confirmed).toBe(material.tablePoints.length);
          expect(material.source).toMatch(/confirmed against/);
          expect(material.source).not.toMatch(/from memory/);
          break;
        case 'partlyConfirmed':
          expect(confirmed).toBeGreaterThan(0);
          expect(confirmed).toBeLessThan(material.tablePoints.length);
          expect(material.source).toMatch(/confirmed against/);
          expect(material.source).toMatch(/from memory/);
          break;
        default:
          expect(confirmed).toBe(0);
          expect(material.source).toMatch(/from memory/);
      }
    },
  );

  it('when no brand could slip in, then names are generic type names', () => {
    for (const m of INSULATION_MATERIALS) {
      expect(m.name).toMatch(
        /^(Mineral-fibre|Calcium silicate|Cellular glass|Rigid polyisocyanurate|Flexible elastomeric|Expanded perlite|Flexible aerogel)/,
      );
    }
  });

  it('when a layer is made of a library material, then it carries the lower service limit and the table range', () => {
    const m = insulationMaterialById('flexible-elastomeric-c534-grade-1-type-i');
    const layer = layerOf(m, 0.025);
    expect(layer.minServiceTemperatureC).toBe(m.minServiceTemperatureC);
    // The table runs from -100 °F to 75 °F.
    expect(layer.conductivityDataRangeC?.[0]).toBeCloseTo(-73.33, 2);
    expect(layer.conductivityDataRangeC?.[1]).toBeCloseTo(23.89, 2);
    expect(conductivityDataRange(m)).toEqual(layer.conductivityDataRangeC);
  });

  it('when the elastomeric tube insulates a line far colder than its table, then the result warns of the extrapolated k(T)', () => {
    const at = (processTemperatureC: number) =>
      analyse({
        geometry: { type: 'pipe', outerDiameterM: 0.0603, orientation: 'horizontal' },
        processTemperatureC,
        layers: [layerOf('flexible-elastomeric-c534-grade-1-type-i', 0.025)],
        surfaceEmissivity: 0.9,
        ambient: { airTemperatureC: 25, relativeHumidityPct: 70 },
      }).warnings.map((w) => w.code);
    expect(at(-180)).toContain('CONDUCTIVITY_EXTRAPOLATED');
    expect(at(5)).not.toContain('CONDUCTIVITY_EXTRAPOLATED');
  });
});

describe('finishes', () => {
  it('when any finish is listed, then its emissivity lies within its range, both within (0, 1]', () => {
    for (const f of FINISHES) {
      expect(f.emissivityRange[0]).toBeGreaterThan(0);
      expect(f.emissivityRange[1]).toBeLessThanOrEqual(1);
      expect(f.emissivity).toBeGreaterThanOrEqual(f.emissivityRange[0]);
      expect(f.emissivity).toBeLessThanOrEqual(f.emissivityRange[1]);
    }
  });

  it('when any finish is listed, then its source says whether its numbers were confirmed or are from memory', () => {
    for (const f of FINISHES) {
      expect(f.source).toMatch(/confirmed against|from memory/);
      if (!/confirmed against/.test(f.source)) expect(f.source).toMatch(/not confirmed/);
    }
  });

  it('when the aluminium finishes are read, then their ends match the published total normal emissivities', () => {
    // Source: Hottel's table (McAdams, Heat Transmission, 3rd ed.), as reproduced in open emissivity tables:
    // aluminium, highly polished plate 0.039–0.057, commercial sheet 0.09; oxidised at 600 °C 0.11–0.19,
    // heavily oxidised 0.20–0.31. Rounded to two decimals.
    expect(finishById('aluminium-polished').emissivityRange).toEqual([0.04, 0.09]);
    expect(finishById('aluminium-oxidised').emissivityRange[1]).toBe(0.31);
    // Galvanised sheet iron: fairly bright 0.228, grey oxidised 0.276 (same table).
    expect(finishById('galvanised-steel-new').emissivity).toBe(0.23);
    expect(finishEmissivityForBasis('galvanised-steel-weathered', 'touchSafety')).toBe(0.28);
  });

  it('when a touch-safety basis is used, then the lowest credible emissivity is taken', () => {
    expect(finishEmissivityForBasis('aluminium-oxidised', 'touchSafety')).toBe(0.1);
    expect(finishEmissivityForBasis('aluminium-oxidised', 'energy')).toBe(0.15);
    expect(() => finishById('gold-leaf')).toThrow(/finish/);
  });
});

describe('thickness series', () => {
  it('when the default series are read, then they ascend and the two-layer rule is 100 mm / 4 in', () => {
    for (const r of [METRIC_ROUNDING, US_ROUNDING]) {
      for (let i = 1; i < r.seriesM.length; i += 1) expect(r.seriesM[i]).toBeGreaterThan(r.seriesM[i - 1]);
    }
    expect(METRIC_ROUNDING.maxSingleLayerM).toBe(0.1);
    expect(US_ROUNDING.maxSingleLayerM).toBeCloseTo(0.1016, 12);
    expect(US_ROUNDING.seriesM[0]).toBeCloseTo(0.0254, 12);
    expect(US_ROUNDING.seriesM[US_ROUNDING.seriesM.length - 1]).toBeCloseTo(0.1524, 12);
  });

  it('when a site gives its own series, then it is sorted, deduplicated and in metres', () => {
    expect(roundingFromMillimetres([50, 25, 40, 25], 80)).toEqual({ seriesM: [0.025, 0.04, 0.05], maxSingleLayerM: 0.08 });
    expect(() => roundingFromMillimetres([])).toThrow(/seriesM/);
    expect(() => roundingFromMillimetres([25, -5])).toThrow(/seriesM/);
  });
});
