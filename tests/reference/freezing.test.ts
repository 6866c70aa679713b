import { analyse, type CalcCase } from '../../shared/calc';

const base = (Tw: number, Ta: number): CalcCase => ({
  geometry: { type: 'pipe', outerDiameterM: 0.0603, orientation: 'horizontal' },
  processTemperatureC: Tw,
  layers: [{ thicknessM: 0.1, conductivity: [0.04] }],
  surfaceEmissivity: 1,
  ambient: { airTemperatureC: Ta, windSpeedMS: 20 },
  stagnant: { innerDiameterM: 0.0525, pipeMassKgPerM: 5.44 },
});

describe('freezing time of standing water, quasi-steady lumped cooling', () => {
  it('when insulation dominates the resistance, then the time follows t = C·R′·ln((T₀ − T_a)/(0 − T_a))', () => {
    // Source: Incropera & DeWitt, 6th ed., §5.3, Eq. 5.6 (lumped capacitance, Newtonian cooling with constant
    // overall resistance) — the same closed form ISO 12241 uses for the time to reach freezing (from memory
    // for the ISO attribution). C = ρ_w·c_w·πd²/4 + m_p·c_p with 1000 kg/m³, 4190 and 460 J/(kg·K);
    // R′ = ln(r₂/r₁)/(2πk). At 20 m/s the surface resistance is < 0.5 % of R′ → 1 % tolerance.
    const C = 1000 * Math.PI * 0.25 * 0.0525 ** 2 * 4190 + 5.44 * 460;
    const R = Math.log((0.03015 + 0.1) / 0.03015) / (2 * Math.PI * 0.04);
    const expectedHours = (C * R * Math.log((20 - -20) / (0 - -20))) / 3600;
    const r = analyse(base(20, -20));
    expect(Math.abs((r.hoursToZeroC as number) / expectedHours - 1)).toBeLessThan(0.01);
  });

  it('when the air is not below 0 °C, then there is no freezing time and a warning says why', () => {
    const r = analyse(base(20, 2));
    expect(r.hoursToZeroC).toBeNull();
    expect(r.warnings.map((w) => w.code)).toContain('NO_FREEZING');
  });

  it('when the water starts at or below 0 °C, then the time is zero', () => {
    expect(analyse(base(0, -10)).hoursToZeroC).toBe(0);
  });
});
