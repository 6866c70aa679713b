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
    // overall resistance), the same closed form as ASHRAE Handbook—Fundamentals, "Insulation for Mechanical
    // Systems", Eq. 1 (see the published example below). C = ρ_w·c_w·πd²/4 + m_p·c_p with 1000 kg/m³, 4190 and 460 J/(kg·K);
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

describe('freezing time of standing water, ASHRAE Handbook—Fundamentals worked values', () => {
  // Source: ASHRAE Handbook—Fundamentals (2009), ch. 23 "Insulation for Mechanical Systems", Eq. 1 (p. 23.4)
  // θ = ρ·c_p·π(D₁/2)²·R_T·ln[(t_i − t_a)/(t_f − t_a)] and its freeze-protection table (water at 42 °F
  // suddenly exposed to −18 °F, insulation k = 0.30 Btu·in/(h·ft²·°F)): an NPS 2 steel pipe with 1.5 in of
  // insulation reaches 32 °F in 1.4 h. Values as reproduced by Warren Forensics, "How long before the pipes
  // freeze?" (2014-03-18), which applies the same equation to an ambient of 20 °F: 4.6 h. The equation and
  // its assumptions (pipe-wall resistance and capacitance and the outer air film neglected, latent heat not
  // considered) are also stated on the NIBS Whole Building Design Guide, Mechanical Insulation Design Guide,
  // "Estimate Time to Freezing for Water in an Insulated Pipe".
  //
  // Mapping to Lagline: NPS 2 (OD 2.375 in, ID 2.067 in, ASME B36.10 Sch 40); one layer 1.5 in thick with
  // k = 0.30 × 0.144228 W/(m·K); pipeMassKgPerM 0 removes the steel's heat capacity; no pipeWall input means
  // no wall resistance; a 20 m/s wind and ε = 1 make the outer film ≈ 1 % of R_T (ASHRAE drops it). Lagline
  // integrates to 0 °C, the same end point as 32 °F and, like the handbook, without latent heat.
  const IN = 0.0254;
  const fToC = (f: number) => (f - 32) / 1.8;
  const ashraeCase = (ambientF: number): CalcCase => ({
    geometry: { type: 'pipe', outerDiameterM: 2.375 * IN, orientation: 'horizontal' },
    processTemperatureC: fToC(42),
    layers: [{ thicknessM: 1.5 * IN, conductivity: [0.3 * 0.144227889] }],
    surfaceEmissivity: 1,
    ambient: { airTemperatureC: fToC(ambientF), windSpeedMS: 20 },
    stagnant: { innerDiameterM: 2.067 * IN, pipeMassKgPerM: 0 },
  });
  /** ASHRAE Eq. 1 in its own inch-pound units: ρ 62.4 lb/ft³, c_p 1.0 Btu/(lb·°F), k in Btu·in/(h·ft²·°F). */
  const ashraeHours = (ambientF: number) => {
    const D1 = 2.067 / 12;
    const RT = (12 * Math.log(5.375 / 2.375)) / (2 * Math.PI * 0.3);
    return 62.4 * 1.0 * Math.PI * (D1 / 2) ** 2 * RT * Math.log((42 - ambientF) / (32 - ambientF));
  };

  it.each([
    [-18, 1.4],
    [20, 4.6],
  ])('when an insulated NPS 2 pipe of water at 42 °F meets air at %p °F, then it reaches 32 °F in about %p h', (ambientF, published) => {
    // Published to two significant figures: the value must round to it (half a unit in the last place).
    const hours = analyse(ashraeCase(ambientF)).hoursToZeroC as number;
    expect(Math.abs(hours - published)).toBeLessThan(0.05);
  });

  it.each([-18, 20])('when the ASHRAE Eq. 1 is evaluated for air at %p °F, then Lagline agrees within the outer-film share', (ambientF) => {
    // The handbook drops the outer film; here it is ≈ 1.1 % of R_T, and 1000 kg/m³·4190 J/(kg·K) vs
    // 62.4 lb/ft³·1.0 Btu/(lb·°F) adds 0.1 %. Lagline must be longer (the film adds resistance) by < 1.5 %.
    const ratio = (analyse(ashraeCase(ambientF)).hoursToZeroC as number) / ashraeHours(ambientF);
    expect(ratio).toBeGreaterThan(1);
    expect(ratio - 1).toBeLessThan(0.015);
  });
});
