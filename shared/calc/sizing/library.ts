/**
 * The library sizing draws on: the built-in materials and finishes plus a team's own, and the fit of a team
 * material's datasheet points to a k(T) polynomial.
 */

import { conductivityAt } from '../conduction';
import { CalcInputError } from '../errors';
import { FINISHES, type Finish } from '../library/finishes';
import { INSULATION_MATERIALS, conductivityDataRange, fitConductivityPolynomial, type ConductivityPoint } from '../library/materials';
import type { ContactMaterial } from '../types';
import type { SizingFinish, SizingLibraryData, SizingMaterial } from './types';


/**
 * The ISO 13732-1 surface group of a built-in finish: painted jackets count as coated metal, other metal as
 * uncoated metal, PVC, mastic and canvas as plastics. Common practice (a coating thicker than a paint film
 * lowers the contact temperature further).
 */
function contactMaterialOfFinish(f: Finish): ContactMaterial {
  if (f.id === 'painted-metal') return 'coatedMetal';
  return f.metallic ? 'uncoatedMetal' : 'plastic';
}

/** Built-in materials as sizing uses them. */
export const BUILT_IN_SIZING_MATERIALS: readonly SizingMaterial[] = INSULATION_MATERIALS.map((m) => ({
  id: m.id,
  name: m.name,
  conductivity: [...m.conductivity],
  maxServiceTemperatureC: m.maxServiceTemperatureC,
  minServiceTemperatureC: m.minServiceTemperatureC,
  conductivityDataRangeC: conductivityDataRange(m),
}));

/** Built-in finishes as sizing uses them. */
export const BUILT_IN_SIZING_FINISHES: readonly SizingFinish[] = FINISHES.map((f) => ({
  id: f.id,
  name: f.name,
  emissivity: f.emissivity,
  emissivityRange: [f.emissivityRange[0], f.emissivityRange[1]],
  contactMaterial: contactMaterialOfFinish(f),
}));

/**
 * The built-in library with a team's materials and finishes added (their ids start with `team-`, which no
 * built-in id does).
 *
 * @param team - the team's own materials and finishes
 * @returns the combined library
 * @example sizingLibrary().materials.length // the nine built-in materials
 */
export function sizingLibrary(team: Partial<SizingLibraryData> = {}): SizingLibraryData {
  return {
    materials: [...BUILT_IN_SIZING_MATERIALS, ...(team.materials ?? [])],
    finishes: [...BUILT_IN_SIZING_FINISHES, ...(team.finishes ?? [])],
  };
}

/** Quality of a k(T) fit to datasheet points. */
export type ConductivityFit = {
  /** Polynomial coefficients [W/(m·K)], T in °C. */
  conductivity: number[];
  degree: number;
  /** Largest |k_fit − k_point| / k_point over the points [%]. */
  maxErrorPct: number;
  /** Root mean square of the relative errors [%]. */
  rmsErrorPct: number;
  /** Coldest and hottest point [°C]: the curve rests on data between them. */
  dataRangeC: [number, number];
};

/** Largest relative error accepted before a higher degree is tried [%]. */
const GOOD_FIT_PCT = 2;

/**
 * Fits k(T) to a datasheet's table of (mean temperature, k): the lowest degree (1 to 3, at most points − 1)
 * whose largest relative error is within 2 %, else the best of them; relative least squares.
 *
 * @param points - at least two points [°C, W/(m·K)], distinct temperatures, k > 0
 * @param serviceRangeC - the material's [minimum, maximum] service temperature [°C]: k must stay positive over it
 * @returns coefficients, degree and fit errors [%]
 * @remarks Throws {@link CalcInputError} naming `tablePoints` (or `tablePoints[i]`) for unusable points and when
 *   the fitted curve is not positive over the service range.
 * @example fitTeamConductivity([{ meanTemperatureC: 0, conductivityWPerMK: 0.035 }, { meanTemperatureC: 100, conductivityWPerMK: 0.05 }], [-20, 200]).degree // 1
 */
export function fitTeamConductivity(points: readonly ConductivityPoint[], serviceRangeC: [number, number]): ConductivityFit {
  if (!Array.isArray(points) || points.length < 2) throw new CalcInputError('tablePoints', 'Give at least two table points (mean temperature, k).');
  points.forEach((p, i) => {
    if (!Number.isFinite(p.meanTemperatureC) || p.meanTemperatureC < -273 || p.meanTemperatureC > 2000) {
      throw new CalcInputError(`tablePoints[${i}].meanTemperatureC`, `Point ${i + 1}: the mean temperature must be a number from −273 to 2000 °C.`);
    }
    if (!Number.isFinite(p.conductivityWPerMK) || p.conductivityWPerMK < 0.001 || p.conductivityWPerMK > 10) {
      throw new CalcInputError(`tablePoints[${i}].conductivityWPerMK`, `Point ${i + 1}: k must be a number from 0.001 to 10 W/(m·K).`);
    }
  });
  const temps = points.map((p) => p.meanTemperatureC);
  if (new Set(temps).size !== temps.length) throw new CalcInputError('tablePoints', 'Two points have the same mean temperature.');
  let best: ConductivityFit | undefined;
  for (let degree = 1; degree <= Math.min(3, points.length - 1); degree++) {
    const conductivity = fitConductivityPolynomial(points, degree as 1 | 2 | 3);
    const errs = points.map((p) => (conductivityAt(conductivity, p.meanTemperatureC) - p.conductivityWPerMK) / p.conductivityWPerMK);
    const fit: ConductivityFit = {
      conductivity,
      degree,
      maxErrorPct: 100 * Math.max(...errs.map(Math.abs)),
      rmsErrorPct: 100 * Math.sqrt(errs.reduce((s, e) => s + e * e, 0) / errs.length),
      dataRangeC: [Math.min(...temps), Math.max(...temps)],
    };
    if (!best || fit.maxErrorPct < best.maxErrorPct - 1e-9) best = fit;
    if (fit.maxErrorPct <= GOOD_FIT_PCT) {
      best = fit;
      break;
    }
  }
  const fit = best as ConductivityFit;
  const [lo, hi] = serviceRangeC;
  for (let i = 0; i <= 64; i++) {
    const T = lo + ((hi - lo) * i) / 64;
    if (!(conductivityAt(fit.conductivity, T) > 0)) {
      throw new CalcInputError(
        'tablePoints',
        `The fitted curve gives k ≤ 0 at ${T.toFixed(0)} °C, inside the service range: add points near the ends of the range or narrow it.`,
      );
    }
  }
  return fit;
}
