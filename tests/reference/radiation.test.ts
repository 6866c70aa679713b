import { STEFAN_BOLTZMANN, analyse, radiationCoefficient, radiativeHeatFlux } from '../../shared/calc';

describe('radiation, Stefan–Boltzmann', () => {
  it('when the constant is read, then it is the CODATA 2018 value', () => {
    // Source: E. Tiesinga et al., "CODATA recommended values of the fundamental physical constants: 2018",
    // Rev. Mod. Phys. 93, 025010 (2021): σ = 5.670 374 419… × 10⁻⁸ W m⁻² K⁻⁴ (exact to the digits given).
    expect(STEFAN_BOLTZMANN).toBe(5.670374419e-8);
  });

  it('when a 70 mm steam pipe at 200 °C (ε 0.8) faces 25 °C walls, then emissive power is 2270 W/m² and irradiation 447 W/m² (from memory)', () => {
    // Source: Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, 6th ed., Example 1.2 (D = 70 mm,
    // Ts = 473 K, ε = 0.8, Tsur = 298 K; inputs confirmed by the course code below): E = 2270 W/m²,
    // G = 447 W/m² (these two printed values still from memory). Three significant figures → 0.5 %.
    const E = radiativeHeatFlux(0.8, 473, 0);
    const Girr = radiativeHeatFlux(1, 298, 0);
    expect(Math.abs(E / 2270 - 1)).toBeLessThan(0.005);
    expect(Math.abs(Girr / 447 - 1)).toBeLessThan(0.005);
  });

  it('when the same pipe loses heat by radiation, then q′_rad = 421 W/m', () => {
    // Source: Incropera & DeWitt, 6th ed., Example 1.2: q′ = 577 + 421 = 998 W/m, the radiative part 421 W/m,
    // as reproduced by P. M. Barral, "TA216 — Tecnología de Calor Avanzada — Apps" (course software,
    // github.com/PabloMBarral/apps), core/heat_transfer/radiation.py example "Caño de vapor desnudo…
    // (basado en Incropera 1.2)" — ε 0.8, 473.15 K to 298.15 K, A = π·0.07 m²/m, "El libro: 421 W por metro
    // (más 577 W por convección)" — and tests/test_radiation.py. Three significant figures → 0.5 %.
    const q = radiativeHeatFlux(0.8, 473, 298) * Math.PI * 0.07;
    expect(Math.abs(q / 421 - 1)).toBeLessThan(0.005);
    // The convective part, h·πD·(Ts − T∞) with h = 15 W/(m²·K) — the published 577 W/m over π·0.07 m·175 K,
    // 15.0 — closes the published total of 998 W/m.
    expect(Math.abs((q + 15 * Math.PI * 0.07 * (473 - 298)) / 998 - 1)).toBeLessThan(0.005);
  });

  it('when surface and surroundings are at the same temperature, then h_r is the derivative 4εσT³', () => {
    // Source: Incropera & DeWitt, 6th ed., Eq. 1.9 h_r = εσ(Ts + Tsur)(Ts² + Tsur²), limit Ts → Tsur.
    expect(radiationCoefficient(0.9, 300, 300)).toBeCloseTo(4 * 0.9 * 5.670374419e-8 * 300 ** 3, 12);
  });

  it('when a bare black wall at 100 °C faces 20 °C surroundings, then h_r = σ(Ts⁴ − Tr⁴)/(Ts − Tr)', () => {
    // Source: Stefan–Boltzmann law (Incropera Eq. 1.7) with the contract's definition of h_r, recomputed.
    const r = analyse({
      geometry: { type: 'flat', orientation: 'vertical', heightM: 1 },
      processTemperatureC: 100,
      layers: [],
      surfaceEmissivity: 1,
      ambient: { airTemperatureC: 20, radiantTemperatureC: -10 },
    });
    const expected = (5.670374419e-8 * (373.15 ** 4 - 263.15 ** 4)) / (100 - -10);
    expect(r.radiationCoefficientWPerM2K).toBeCloseTo(expected, 9);
    const qConv = r.convectionCoefficientWPerM2K * (100 - 20);
    expect(r.heatFluxWPerM2 as number).toBeCloseTo(qConv + expected * 110, 6);
  });
});
