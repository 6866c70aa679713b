/**
 * The library as the quick-sizing form sees it: materials with k(T), finishes with emissivity,
 * thickness series and pipe sizes. A thin adapter over shared/calc's data, so the form's shapes stay
 * stable while the data grows.
 */
import * as pipeSizeData from './pipe-size-source';
import * as librarySource from './library-source';

export type MaterialOption = {
  id: string;
  name: string;
  /** k(T) coefficients [W/(m·K)], T in °C. */
  conductivity: number[];
  maxServiceTemperatureC?: number;
  minServiceTemperatureC?: number;
  /** Mean temperatures [°C] between which k(T) rests on the material's table. */
  conductivityDataRangeC?: [number, number];
  source?: string;
  /** One line for the form: the specification and how well its table is known. */
  provenance?: string;
};

export type FinishOption = { id: string; name: string; emissivity: number; source?: string };

export type SeriesOption = { id: string; name: string; seriesM: number[]; maxSingleLayerM?: number };

export type PipeSize = {
  nps: string;
  dn: number;
  outerDiameterM: number;
  /** Standard-wall inside diameter [m], when tabulated. */
  innerDiameterM: number | null;
  /** Standard-wall mass of carbon steel pipe [kg/m], when tabulated. */
  massPerMetreKg: number | null;
};

export const materials: MaterialOption[] = librarySource.materials;
export const finishes: FinishOption[] = librarySource.finishes;
export const thicknessSeries: SeriesOption[] = librarySource.thicknessSeries;
export const pipeSizes: PipeSize[] = pipeSizeData.pipeSizes;

export function materialById(id: string): MaterialOption | undefined {
  return materials.find((m) => m.id === id);
}
export function finishById(id: string): FinishOption | undefined {
  return finishes.find((f) => f.id === id);
}
export function seriesById(id: string): SeriesOption | undefined {
  return thicknessSeries.find((s) => s.id === id);
}

const near = (a: number, b: number, tol: number) => Math.abs(a - b) <= tol;

/** The library material whose coefficients these are (a shared link carries coefficients, not ids). */
export function materialMatching(conductivity: readonly number[], maxC?: number): MaterialOption | undefined {
  return materials.find(
    (m) =>
      m.conductivity.length === conductivity.length &&
      m.conductivity.every((c, i) => near(c, conductivity[i], Math.abs(c) * 1e-9 + 1e-15)) &&
      m.maxServiceTemperatureC === maxC,
  );
}
export function finishMatching(emissivity: number): FinishOption | undefined {
  return finishes.find((f) => near(f.emissivity, emissivity, 1e-9));
}
export function seriesMatching(seriesM: readonly number[]): SeriesOption | undefined {
  return thicknessSeries.find((s) => s.seriesM.length === seriesM.length && s.seriesM.every((t, i) => near(t, seriesM[i], 1e-9)));
}
export function pipeSizeByOuterDiameter(outerDiameterM: number): PipeSize | undefined {
  return pipeSizes.find((p) => near(p.outerDiameterM, outerDiameterM, 1e-6));
}
