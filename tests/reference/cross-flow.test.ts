import { analyse, combinedConvectionCoefficient, nusseltCylinderCrossFlowChurchillBernstein } from '../../shared/calc';
import { airA4, G } from './air-table-a4';

/** Churchill & Bernstein (1977), J. Heat Transfer 99, 300–306, Eq. for all Re·Pr ≥ 0.2, written out here. */
function churchillBernstein(Re: number, Pr: number): number {
  return (
    0.3 +
    ((0.62 * Re ** 0.5 * Pr ** (1 / 3)) / (1 + (0.4 / Pr) ** (2 / 3)) ** 0.25) * (1 + (Re / 282000) ** (5 / 8)) ** (4 / 5)
  );
}

describe('cylinder in cross-flow, Churchill & Bernstein', () => {
  it('when Re = 6071 and Pr = 0.7, then Nu_D = 40.6', () => {
    // Source: Incropera & DeWitt, 6th ed., Example 7.4 (heated cylinder in a wind tunnel, V = 10 m/s,
    // D = 12.7 mm): Churchill–Bernstein Nu_D = 40.6; also C. Bell, ht, conv_external.py doctest
    // Nu_cylinder_Churchill_Bernstein(6071, 0.7) = 40.63708594124974. 1e-9 relative against the doctest.
    const Nu = nusseltCylinderCrossFlowChurchillBernstein(6071, 0.7);
    expect(Math.abs(Nu / 40.63708594124974 - 1)).toBeLessThan(1e-9);
    expect(Nu).toBeCloseTo(40.6, 1);
  });

  it.each([[10], [1e3], [1e5], [1e6]])('when Re = %p, then Nu matches the paper formula recomputed', (Re) => {
    // Source: Churchill & Bernstein (1977), Eq. (recomputed in this file); 1e-12 relative.
    expect(nusseltCylinderCrossFlowChurchillBernstein(Re, 0.71) / churchillBernstein(Re, 0.71)).toBeCloseTo(1, 12);
  });

  it('when the 12.7 mm cylinder of Example 7.4 (128.4 °C, air 26.2 °C, 10 m/s) is analysed, then h matches the recomputed combination', () => {
    // Source: Incropera 6th ed. Example 7.4 conditions; Churchill–Bernstein with Table A.4 air at the film
    // temperature, natural part by Churchill & Chu (1975), combined by the cube rule (Churchill 1977),
    // recomputed. Both interpolate Table A.4 linearly → 0.3 %.
    const D = 0.0127;
    const Ts = 128.4;
    const Ta = 26.2;
    const Tf = (Ts + Ta) / 2 + 273.15;
    const { k, nu, Pr } = airA4(Tf);
    const hf = (churchillBernstein((10 * D) / nu, Pr) * k) / D;
    const Ra = (G * (Ts - Ta) * D ** 3 * Pr) / (Tf * nu ** 2);
    const hn = (((0.6 + (0.387 * Ra ** (1 / 6)) / (1 + (0.559 / Pr) ** (9 / 16)) ** (8 / 27)) ** 2) * k) / D;
    const r = analyse({
      geometry: { type: 'pipe', outerDiameterM: D, orientation: 'horizontal' },
      processTemperatureC: Ts,
      layers: [],
      surfaceEmissivity: 0,
      ambient: { airTemperatureC: Ta, windSpeedMS: 10 },
    });
    expect(Math.abs(r.convectionCoefficientWPerM2K / Math.cbrt(hf ** 3 + hn ** 3) - 1)).toBeLessThan(0.003);
    // The published forced-only value, h = Nu·k/D with Nu 40.6 and k = 0.030 (350 K): ≈ 96 W/m²K; the
    // natural part adds well under 1 %.
    expect(Math.abs(r.convectionCoefficientWPerM2K / ((40.6 * 0.03) / D) - 1)).toBeLessThan(0.02);
  });

  it('when forced and natural coefficients are 3 and 4, then the cube rule gives 91^(1/3)', () => {
    // Source: Incropera 6th ed. Eq. 9.63 with n = 3 (recomputed).
    expect(combinedConvectionCoefficient(3, 4)).toBeCloseTo(Math.cbrt(27 + 64), 12);
  });
});
