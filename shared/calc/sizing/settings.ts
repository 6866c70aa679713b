/**
 * A site's sizing settings as stored (thicknesses in millimetres, as people write them) and the defaults a new
 * site starts from.
 */

import { DEFAULT_MAX_THICKNESS_M } from '../analyse';
import { METRIC_THICKNESSES_MM } from '../library/series';
import type { BuildUp, SizingSettings } from './types';

/** Stored form of a site's sizing settings. */
export type StoredSizingSettings = {
  /** Thickness series [mm], ascending. */
  seriesMm: number[];
  /** Above this the sized layer is applied as two layers [mm]. */
  maxSingleLayerMm: number;
  /** Largest thickness of the sized layer considered [mm]. */
  maxThicknessMm: number;
  /** Heat conservation without an item limit: |q| at most this percentage of the bare item's [%]. */
  heatConservationMaxPercentOfBare: number;
  defaultBuildUps: { hot: BuildUp; cold: BuildUp };
};

/**
 * Defaults of a new site, common practice: the metric series, two layers above 100 mm, heat conservation to
 * at most 10 % of the bare heat flow (90 % effective) where an item sets no limit, mineral fibre pipe
 * insulation (ASTM C547 Type II, to 650 °C) under an oxidised aluminium jacket for hot service, flexible
 * elastomeric foam (ASTM C534) under a PVC jacket for cold service. Every value is editable per site.
 */
export const DEFAULT_SIZING_SETTINGS: StoredSizingSettings = {
  seriesMm: [...METRIC_THICKNESSES_MM],
  maxSingleLayerMm: 100,
  maxThicknessMm: DEFAULT_MAX_THICKNESS_M * 1000,
  heatConservationMaxPercentOfBare: 10,
  defaultBuildUps: {
    hot: { layers: [{ materialId: 'mineral-fibre-pipe-c547-type-ii' }], finishId: 'aluminium-oxidised' },
    cold: { layers: [{ materialId: 'flexible-elastomeric-c534-grade-1-type-i' }], finishId: 'pvc-jacket' },
  },
};

/**
 * Stored settings (possibly partial, from an older site) → the SI settings sizing uses.
 *
 * @param stored - the site's settings; missing members take the defaults
 * @returns series and limits in metres, the fraction of bare, the default build-ups
 * @example toSizingSettings({}).seriesM[0] // 0.02
 */
export function toSizingSettings(stored: Partial<StoredSizingSettings> | null | undefined): SizingSettings {
  const s = { ...DEFAULT_SIZING_SETTINGS, ...(stored ?? {}) };
  return {
    seriesM: [...s.seriesMm].sort((a, b) => a - b).map((mm) => mm / 1000),
    maxSingleLayerM: s.maxSingleLayerMm / 1000,
    maxThicknessM: s.maxThicknessMm / 1000,
    heatConservationMaxFractionOfBare: s.heatConservationMaxPercentOfBare / 100,
    defaultBuildUps: { ...DEFAULT_SIZING_SETTINGS.defaultBuildUps, ...(s.defaultBuildUps ?? {}) },
  };
}
