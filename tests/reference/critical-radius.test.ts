import { analyse, heatFlowCylindricalLayer, type CalcCase } from '../../shared/calc';

describe('critical radius of insulation', () => {
  it('when a 5 mm radius tube has k = 0.055 insulation and h = 5 W/m²K, then heat loss peaks at r_cr = k/h = 11 mm', () => {
    // Source: Incropera & DeWitt, 6th ed., Eq. 3.35, r_cr = k/h, derived by setting d(R′_cond + R′_conv)/dr = 0
    // (the derivation is the reference; the inputs r_i = 5 mm, k = 0.055 W/(m·K), h = 5 W/(m²·K) are chosen
    // here). The test maximises q′ = ΔT/(R′_cond + R′_conv) with the package's cylindrical-layer law and a
    // fixed h; a 0.1 mm scan step → 1 % tolerance.
    const ri = 0.005;
    const k = 0.055;
    const h = 5;
    let best = 0;
    let bestR = ri;
    for (let r = ri + 1e-4; r < 0.05; r += 1e-4) {
      const Rcond = 1 / heatFlowCylindricalLayer([k], 1, 0, ri, r); // ΔT = 1 K
      const q = 1 / (Rcond + 1 / (2 * Math.PI * r * h));
      if (q > best) {
        best = q;
        bestR = r;
      }
    }
    expect(Math.abs(bestR / 0.011 - 1)).toBeLessThan(0.01);
  });

  const tube = (t: number, solve?: CalcCase['solveFor'], round?: CalcCase['round']): CalcCase => ({
    geometry: { type: 'pipe', outerDiameterM: 0.006, orientation: 'horizontal' },
    processTemperatureC: 120,
    layers: [{ thicknessM: t, conductivity: [0.1] }],
    // A bright metal jacket: with little radiation the outer coefficient is small, so r_cr = k/h lies
    // well outside the 3 mm tube radius.
    surfaceEmissivity: 0.1,
    ambient: { airTemperatureC: 20 },
    ...(solve ? { solveFor: solve } : {}),
    ...(round ? { round } : {}),
  });
  const loss = (t: number) => analyse(tube(t)).heatLossWPerM as number;

  it('when a 6 mm tube gets k = 0.1 insulation in still air, then heat loss first rises with thickness', () => {
    // Source: Incropera 6th ed. §3.3.2: below r_cr = k/h adding insulation increases the heat loss.
    const bare = loss(0);
    expect(loss(0.001)).toBeGreaterThan(bare);
    expect(loss(0.002)).toBeGreaterThan(loss(0.001));
    expect(loss(0.1)).toBeLessThan(bare);
  });

  it('when the limit equals the bare loss, then the solved and rounded thickness is past the hump and meets it', () => {
    // The bare tube itself meets the limit, but thin layers do not: t* must sit above the whole failing range.
    const limit = loss(0) * 1.001;
    const series = [0.01, 0.02, 0.025, 0.03, 0.04, 0.05, 0.06, 0.08, 0.1];
    const r = analyse(tube(0, { criterion: 'heatLoss', maxWPerM: limit }, { seriesM: series }));
    const tStar = r.thicknessM as number;
    expect(tStar).toBeGreaterThan(0.003);
    expect(r.heatLossWPerM as number).toBeLessThanOrEqual(limit);
    for (const t of [tStar, tStar + 0.001, tStar + 0.01, 0.2, 0.5]) expect(loss(t)).toBeLessThanOrEqual(limit * (1 + 1e-6));
    expect(loss(tStar - 0.0005)).toBeGreaterThan(limit);
    for (const t of series.filter((s) => s >= tStar)) expect(loss(t)).toBeLessThanOrEqual(limit);
  });
});
