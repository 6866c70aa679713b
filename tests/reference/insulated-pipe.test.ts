import { analyse } from '../../shared/calc';
import { CONTRACT_EXAMPLE_CASE as designCase } from '../helpers/contract-case';

describe('insulated steam pipe', () => {
  it('when the contract example (4" pipe at 250 °C, ε 0.1, surface ≤ 60 °C) is solved and rounded, then it reproduces the independent model', () => {
    // Source: the worked example of Lagline's public calculation contract (README, "The contract"), whose
    // numbers were computed by an independent model: 98.2 W/m, 56.5 °C, h_c 4.31, h_r 0.72, t* 0.052 m, rounded 0.06 m, dew point 21.4 °C.
    // Three significant figures; tolerance 2 % (0.5 K on temperatures) allows for a different air table.
    const r = analyse(designCase);
    expect(Math.abs((r.heatLossWPerM as number) / 98.2 - 1)).toBeLessThan(0.02);
    expect(Math.abs(r.surfaceTemperatureC - 56.5)).toBeLessThan(0.5);
    expect(r.interfaceTemperaturesC).toHaveLength(1);
    expect(Math.abs(r.convectionCoefficientWPerM2K / 4.31 - 1)).toBeLessThan(0.02);
    expect(Math.abs(r.radiationCoefficientWPerM2K / 0.72 - 1)).toBeLessThan(0.02);
    expect(Math.abs((r.thicknessM as number) - 0.052)).toBeLessThan(0.001);
    expect(r.roundedLayersM).toEqual([0.06]);
    expect(r.totalThicknessM).toBeCloseTo(0.06, 12);
    expect(Math.abs((r.dewPointC as number) - 21.4)).toBeLessThan(0.05);
    expect(r.warnings).toEqual([]);
  });

  it('when k is linear in T, then the layer heat flow equals 2π·k(T_mean)·ΔT/ln(r₂/r₁)', () => {
    // Source: ASTM C680-19 §7 and Incropera 6th ed. Table 3.3 / Eq. 3.27: for linear k(T) the Kirchhoff
    // integral equals k at the arithmetic mean temperature; recomputed from the reported surface
    // temperature (the inner face is at the process temperature: no film, no wall). 1e-6 relative.
    const { solveFor, round, ...fixed } = designCase;
    void solveFor;
    void round;
    const r = analyse(fixed);
    const Ts = r.surfaceTemperatureC;
    const km = 0.035 + 0.00015 * ((250 + Ts) / 2);
    const expected = (2 * Math.PI * km * (250 - Ts)) / Math.log((0.05715 + 0.05) / 0.05715);
    expect(Math.abs((r.heatLossWPerM as number) / expected - 1)).toBeLessThan(1e-6);
  });

  it('when two constant-k layers, a steel wall and an inside film are in series, then q′ = ΔT/ΣR′', () => {
    // Source: Incropera 6th ed. Eq. 3.32 (radial series resistances R′ = ln(r₂/r₁)/(2πk), R′ = 1/(h·2πr));
    // recomputed from the reported surface temperature. 1e-6 relative.
    const r = analyse({
      geometry: { type: 'pipe', outerDiameterM: 0.1683, orientation: 'horizontal' },
      processTemperatureC: 400,
      layers: [
        { thicknessM: 0.05, conductivity: [0.06] },
        { thicknessM: 0.04, conductivity: [0.04] },
      ],
      insideFilmWPerM2K: 500,
      pipeWall: { innerDiameterM: 0.1541, conductivityWPerMK: 45 },
      surfaceEmissivity: 0.3,
      ambient: { airTemperatureC: 15, windSpeedMS: 3 },
    });
    const r0 = 0.1683 / 2;
    const R =
      1 / (500 * Math.PI * 0.1541) +
      Math.log(0.1683 / 0.1541) / (2 * Math.PI * 45) +
      Math.log((r0 + 0.05) / r0) / (2 * Math.PI * 0.06) +
      Math.log((r0 + 0.09) / (r0 + 0.05)) / (2 * Math.PI * 0.04);
    expect(Math.abs((r.heatLossWPerM as number) / ((400 - r.surfaceTemperatureC) / R) - 1)).toBeLessThan(1e-6);
    // Interface between the layers from the same series law.
    const T1 = 400 - (r.heatLossWPerM as number) * (R - Math.log((r0 + 0.09) / (r0 + 0.05)) / (2 * Math.PI * 0.04));
    expect(r.interfaceTemperaturesC[0]).toBeCloseTo(T1, 4);
  });
});
