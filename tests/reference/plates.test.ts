import {
  analyse,
  nusseltFlatPlateMixedBoundaryLayer,
  nusseltHorizontalPlateLowerHotMcAdams,
  nusseltHorizontalPlateUpperHotMcAdams,
} from '../../shared/calc';
import { airA4, G } from './air-table-a4';

function bareFlat(orientation: 'faceUp' | 'faceDown' | 'vertical', L: number, Ts: number, Ta: number, wind = 0) {
  return analyse({
    geometry:
      orientation === 'vertical'
        ? { type: 'flat', orientation, heightM: L }
        : { type: 'flat', orientation, characteristicLengthM: L },
    processTemperatureC: Ts,
    layers: [],
    surfaceEmissivity: 0,
    ambient: { airTemperatureC: Ta, windSpeedMS: wind },
  });
}

function rayleigh(Ts: number, Ta: number, L: number) {
  const Tf = (Ts + Ta) / 2 + 273.15;
  const p = airA4(Tf);
  return { ...p, Ra: (G * Math.abs(Ts - Ta) * L ** 3 * p.Pr) / (Tf * p.nu ** 2) };
}

describe('horizontal plates, McAdams / Lloyd & Moran', () => {
  it('when Pr = 5.54 and Gr = 3.21e8 on a hot upper face, then Nu = 181.73', () => {
    // Source: C. Bell, ht, conv_free_immersed.py, doctest Nu_horizontal_plate_McAdams(5.54, 3.21e8,
    // buoyancy=True) = 181.73121274384457 (McAdams, Heat Transmission, 3rd ed.). 1e-9 relative.
    expect(Math.abs(nusseltHorizontalPlateUpperHotMcAdams(5.54 * 3.21e8) / 181.73121274384457 - 1)).toBeLessThan(1e-9);
  });

  it('when Pr = 5.54 and Gr = 3.21e8 on a hot lower face, then Nu = 55.45', () => {
    // Source: C. Bell, ht, doctest Nu_horizontal_plate_McAdams(5.54, 3.21e8, buoyancy=False) = 55.44564799362829.
    expect(Math.abs(nusseltHorizontalPlateLowerHotMcAdams(5.54 * 3.21e8) / 55.44564799362829 - 1)).toBeLessThan(1e-9);
  });

  it('when a duct top at 45 °C faces 15 °C air (L = 0.375 m), then h follows 0.15·Ra^⅓', () => {
    // Source: Incropera 6th ed. Eq. 9.31 (Lloyd & Moran 1974), conditions of Example 9.3 (duct in a crawl
    // space), recomputed with Table A.4 rows → 0.3 %.
    const { k, Ra } = rayleigh(45, 15, 0.375);
    expect(Ra).toBeGreaterThan(1e7);
    const r = bareFlat('faceUp', 0.375, 45, 15);
    expect(Math.abs(r.convectionCoefficientWPerM2K / ((0.15 * Math.cbrt(Ra) * k) / 0.375) - 1)).toBeLessThan(0.003);
  });

  it('when the duct bottom at 45 °C faces 15 °C air, then h follows 0.27·Ra^¼', () => {
    // Source: Incropera 6th ed. Eq. 9.32 (McAdams), conditions of Example 9.3, recomputed → 0.3 %.
    const { k, Ra } = rayleigh(45, 15, 0.375);
    const r = bareFlat('faceDown', 0.375, 45, 15);
    expect(Math.abs(r.convectionCoefficientWPerM2K / ((0.27 * Ra ** 0.25 * k) / 0.375) - 1)).toBeLessThan(0.003);
  });

  it('when a cold plate faces down, then it behaves like a hot plate facing up (0.54·Ra^¼ below 1e7)', () => {
    // Source: Incropera 6th ed. §9.6.3: "lower surface of a cold plate" uses Eqs. 9.30–9.31; recomputed.
    const { k, Ra } = rayleigh(5, 25, 0.1);
    expect(Ra).toBeLessThan(1e7);
    const r = bareFlat('faceDown', 0.1, 5, 25);
    expect(Math.abs(r.convectionCoefficientWPerM2K / ((0.54 * Ra ** 0.25 * k) / 0.1) - 1)).toBeLessThan(0.003);
  });
});

describe('flat plate in wind, mixed laminar–turbulent boundary layer', () => {
  it.each([
    [1e5, 0.664 * 1e5 ** 0.5],
    [1e6, 0.037 * 1e6 ** 0.8 - 871],
    [1e7, 0.037 * 1e7 ** 0.8 - 871],
  ])('when Re = %p, then Nu/Pr^⅓ = %p', (Re, NuOverPr) => {
    // Source: Incropera 6th ed. Eq. 7.30 (laminar) and Eq. 7.38 with Re_x,c = 5·10⁵, A = 871; recomputed.
    expect(nusseltFlatPlateMixedBoundaryLayer(Re, 0.7) / (NuOverPr * Math.cbrt(0.7))).toBeCloseTo(1, 12);
  });

  it('when a 3 m wall at 60 °C sees 8 m/s wind at 10 °C, then h is the mixed-layer forced value combined with Churchill–Chu', () => {
    // Source: Incropera 6th ed. Eqs. 7.38, 9.26, 9.63 (recomputed with Table A.4 air rows) → 0.3 %.
    const L = 3;
    const Ts = 60;
    const Ta = 10;
    const { k, nu, Pr, Ra } = rayleigh(Ts, Ta, L);
    const Re = (8 * L) / nu;
    expect(Re).toBeGreaterThan(5e5);
    const hf = ((0.037 * Re ** 0.8 - 871) * Pr ** (1 / 3) * k) / L;
    const hn = (((0.825 + (0.387 * Ra ** (1 / 6)) / (1 + (0.492 / Pr) ** (9 / 16)) ** (8 / 27)) ** 2) * k) / L;
    const r = bareFlat('vertical', L, Ts, Ta, 8);
    expect(Math.abs(r.convectionCoefficientWPerM2K / Math.cbrt(hf ** 3 + hn ** 3) - 1)).toBeLessThan(0.003);
  });
});
