import { conductivityAt } from '../conduction';
import { FINISHES, finishById, finishEmissivityForBasis } from './finishes';
import { fitConductivityPolynomial, INSULATION_MATERIALS } from './materials';
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
