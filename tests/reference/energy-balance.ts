/**
 * An outside recomputation of a result's energy balance from its reported figures alone, for tests:
 * the heat conducted through each layer, from the Kirchhoff integral of k(T) between the layer's reported
 * faces (ASTM C680 §7; cylinders 2π·ΔK/ln(r₂/r₁), slabs ΔK/t, vessel heads ΔK·√(A₁A₂)/t), against the heat
 * leaving the surface, h_c·(Ts − T_air) + ε·σ·(Ts⁴ − T_rad⁴) with the reported h_c and surface temperature.
 * The first layer's inner face is the process temperature less the drop across the inside film and pipe
 * wall. Nothing here calls the package's physics; only the vessel head areas (geometry, checked in
 * vessel-heads.test.ts) come from it.
 */
import { headArea } from '../../shared/calc/vessel-heads';
import type { CalcCase, CalcResult } from '../../shared/calc/types';
import { SIGMA } from './air-table-a4';

const KELVIN = 273.15;

/** K(T) = ∫₀ᵀ k dτ for k = Σ cᵢ·Tⁱ, term by term. */
function kirchhoff(c: readonly number[], T: number): number {
  let s = 0;
  for (let i = 0; i < c.length; i++) s += (c[i] * T ** (i + 1)) / (i + 1);
  return s;
}

function k(c: readonly number[], T: number): number {
  let s = 0;
  for (let i = 0; i < c.length; i++) s += c[i] * T ** i;
  return s;
}

/** The build-up a result reports on: fixed layers, then the solved layer as solved or rounded; no empty layers. */
export function reportedLayers(c: CalcCase, r: CalcResult): { thicknessM: number; conductivity: number[] }[] {
  let layers = c.layers.map((l) => ({ thicknessM: l.thicknessM, conductivity: l.conductivity }));
  if (c.solveFor) {
    const solvedK = layers[layers.length - 1].conductivity;
    const solved = r.roundedLayersM ?? ((r.thicknessM as number) > 0 ? [r.thicknessM as number] : []);
    layers = [...layers.slice(0, -1), ...solved.map((t) => ({ thicknessM: t, conductivity: solvedK }))];
  }
  return layers.filter((l) => l.thicknessM > 0);
}

export type BalanceRecomputed = {
  /** Heat flow leaving the surface by convection and radiation [W/m, W/m² or W of the reported part]. */
  surface: number;
  /** Heat flow the result reports for that surface. */
  reported: number;
  /** Heat flow conducted through each layer, inside out. */
  layers: number[];
  /**
   * Worst relative mismatch, each layer's allowed as 1e-6·|Q| plus its conductance times 1e-9 K (the
   * rounding of temperatures); ≤ 1e-6 passes.
   */
  worst: number;
};

/**
 * Recomputes the energy balance of a result from its reported figures.
 *
 * @param c - the case as sent
 * @param r - its result
 * @returns surface and per-layer heat flows and the worst relative mismatch
 */
export function recomputeBalance(c: CalcCase, r: CalcResult): BalanceRecomputed {
  const g = c.geometry;
  const layers = reportedLayers(c, r);
  if (r.interfaceTemperaturesC.length !== layers.length) throw new Error('one interface temperature per layer expected');
  const Ts = r.surfaceTemperatureC;
  const Ta = c.ambient.airTemperatureC;
  const Tr = c.ambient.radiantTemperatureC ?? Ta;
  const qSurface = r.convectionCoefficientWPerM2K * (Ts - Ta) + c.surfaceEmissivity * SIGMA * ((Ts + KELVIN) ** 4 - (Tr + KELVIN) ** 4);
  const film = c.insideFilmWPerM2K;
  // Per layer: Q = ΔK / factor; area of the outer surface per unit of Q; series resistance inside layer 1.
  const factors: number[] = [];
  let area: number;
  let series = 0;
  let reported: number;
  if (g.type === 'flat') {
    for (const l of layers) factors.push(l.thicknessM);
    area = 1;
    if (film) series = 1 / film;
    reported = r.heatFluxWPerM2 as number;
  } else if (g.type === 'pipe') {
    let rad = g.outerDiameterM / 2;
    for (const l of layers) {
      factors.push(Math.log((rad + l.thicknessM) / rad) / (2 * Math.PI));
      rad += l.thicknessM;
    }
    area = 2 * Math.PI * rad;
    let innerD = g.outerDiameterM;
    if (c.pipeWall) {
      innerD = c.pipeWall.innerDiameterM;
      series += Math.log(g.outerDiameterM / innerD) / (2 * Math.PI * c.pipeWall.conductivityWPerMK);
    }
    if (film) series += 1 / (film * Math.PI * innerD);
    reported = r.heatLossWPerM as number;
  } else {
    // The reported coefficients and faces are those of the hottest part.
    const parts = r.parts ?? [];
    const gov = parts.findIndex((p) => p.surfaceTemperatureC === Ts);
    const part = parts[gov];
    reported = part.heatLossW;
    area = part.areaM2;
    if (part.name === 'shell') {
      let rad = g.diameterM / 2;
      for (const l of layers) {
        factors.push(Math.log((rad + l.thicknessM) / rad) / (2 * Math.PI * g.lengthM));
        rad += l.thicknessM;
      }
      if (film) series = 1 / (film * Math.PI * g.diameterM * g.lengthM);
    } else {
      let offset = 0;
      for (const l of layers) {
        const A1 = headArea(g.headType, g.diameterM, offset);
        offset += l.thicknessM;
        factors.push(l.thicknessM / Math.sqrt(A1 * headArea(g.headType, g.diameterM, offset)));
      }
      if (film) series = 1 / (film * headArea(g.headType, g.diameterM, 0));
    }
  }
  const Q = area * qSurface;
  const surfaceConductance = area * (Math.abs(r.convectionCoefficientWPerM2K) + Math.abs(r.radiationCoefficientWPerM2K));
  let worst = (Math.abs(reported - Q) / (1e-6 * Math.abs(Q) + surfaceConductance * 1e-9)) * 1e-6;
  const flows: number[] = [];
  let Tin = c.processTemperatureC - Q * series;
  layers.forEach((l, i) => {
    const Tout = r.interfaceTemperaturesC[i];
    const dK = kirchhoff(l.conductivity, Tin) - kirchhoff(l.conductivity, Tout);
    flows.push(dK / factors[i]);
    // |Q_i − Q| ≤ 1e-6·|Q| + (k/f)·1e-9 K, multiplied through by f so that a vanishing layer stays finite.
    const kMax = Math.max(Math.abs(k(l.conductivity, Tin)), Math.abs(k(l.conductivity, Tout)));
    const f = factors[i];
    worst = Math.max(worst, (Math.abs(dK - Q * f) / (1e-6 * Math.abs(Q) * f + kMax * 1e-9)) * 1e-6);
    Tin = Tout;
  });
  if (layers.length === 0) {
    // Bare: the surface is the process side less the film and wall drop.
    const dT = Math.abs(c.processTemperatureC - Q * series - Ts);
    worst = Math.max(worst, (dT / (1e-6 * Math.abs(Q) * series + 1e-9)) * 1e-6);
  }
  return { surface: Q, reported, layers: flows, worst };
}
