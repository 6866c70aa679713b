/**
 * Standard insulation thickness series and the default multi-layer rule.
 *
 * @remarks
 * Common practice, not a standard: metric pipe and equipment insulation is made in the thicknesses below and US
 * product in ½-inch steps; above about 100 mm (4 in) insulation is applied in two layers with staggered joints,
 * so that joints do not line up into a path for heat and moisture. A site can set its own series and rule.
 */

import { CalcInputError } from '../errors';
import type { Rounding } from '../types';
import { METRES_PER_INCH } from '../units';

/** Metric thicknesses [mm], common practice. */
export const METRIC_THICKNESSES_MM: readonly number[] = [
  20, 25, 30, 40, 50, 60, 70, 80, 90, 100, 120, 140, 150, 160, 180, 200, 220, 240, 250, 300,
];

/** US thicknesses [in]: ½-inch steps from 1 in to 6 in, common practice. */
export const US_THICKNESSES_IN: readonly number[] = [1, 1.5, 2, 2.5, 3, 3.5, 4, 4.5, 5, 5.5, 6];

/** Default largest single layer (above it: two layers), metric [m]; common practice. */
export const DEFAULT_MAX_SINGLE_LAYER_M = 0.1;

/** Default largest single layer for US series [m] (4 in), common practice. */
export const DEFAULT_MAX_SINGLE_LAYER_US_M = 4 * METRES_PER_INCH;

/** Default metric rounding: series in metres and the two-layer rule above 100 mm. */
export const METRIC_ROUNDING: Rounding = {
  seriesM: METRIC_THICKNESSES_MM.map((mm) => mm / 1000),
  maxSingleLayerM: DEFAULT_MAX_SINGLE_LAYER_M,
};

/** Default US rounding: ½-inch steps 1–6 in, two layers above 4 in. */
export const US_ROUNDING: Rounding = {
  seriesM: US_THICKNESSES_IN.map((inch) => inch * METRES_PER_INCH),
  maxSingleLayerM: DEFAULT_MAX_SINGLE_LAYER_US_M,
};

/**
 * Builds a rounding from a site's own series in millimetres.
 *
 * @param thicknessesMm - available thicknesses [mm], positive
 * @param maxSingleLayerMm - above this use two layers [mm] (default 100)
 * @returns the rounding, series ascending and without duplicates [m]
 * @example roundingFromMillimetres([25, 50, 40]).seriesM // [0.025, 0.04, 0.05]
 */
export function roundingFromMillimetres(thicknessesMm: readonly number[], maxSingleLayerMm = 100): Rounding {
  if (!Array.isArray(thicknessesMm) || thicknessesMm.length === 0) {
    throw new CalcInputError('seriesM', 'seriesM needs at least one thickness');
  }
  for (const t of thicknessesMm) {
    if (!Number.isFinite(t) || t <= 0) throw new CalcInputError('seriesM', 'every thickness in seriesM must be a positive number');
  }
  if (!Number.isFinite(maxSingleLayerMm) || maxSingleLayerMm <= 0) {
    throw new CalcInputError('maxSingleLayerM', 'maxSingleLayerM must be a positive number');
  }
  const unique = [...new Set(thicknessesMm)].sort((a, b) => a - b);
  return { seriesM: unique.map((mm) => mm / 1000), maxSingleLayerM: maxSingleLayerMm / 1000 };
}
