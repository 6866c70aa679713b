/**
 * The form's view of shared/calc's built-in library: materials with k(T), finishes with emissivity and
 * the two standard thickness series.
 */
import { conductivityDataRange, FINISHES, INSULATION_MATERIALS, METRIC_ROUNDING, US_ROUNDING } from '../../shared/calc/library';

import type { TableConfidence } from '../../shared/calc/library';

import type { FinishOption, MaterialOption, SeriesOption } from './library';

const PROVENANCE: Record<TableConfidence, string> = {
  confirmed: 'table checked against a published chart of the specification maxima.',
  partlyConfirmed: 'table partly checked, the rest recalled; verify against the current edition.',
  recalled: 'table values recalled, not checked; verify against the current edition.',
  approximate: 'table values recalled approximately, not checked; verify against the current edition.',
};

export const materials: MaterialOption[] = INSULATION_MATERIALS.map((m) => ({
  id: m.id,
  name: m.name,
  conductivity: [...m.conductivity],
  maxServiceTemperatureC: m.maxServiceTemperatureC,
  minServiceTemperatureC: m.minServiceTemperatureC,
  conductivityDataRangeC: conductivityDataRange(m),
  source: `${m.specification}. ${m.source}`,
  provenance: `k(T) from ${m.specification}: ${PROVENANCE[m.confidence]}`,
}));

export const finishes: FinishOption[] = FINISHES.map((f) => ({ id: f.id, name: f.name, emissivity: f.emissivity, source: f.source }));

export const thicknessSeries: SeriesOption[] = [
  { id: 'metric', name: 'Metric steps, 20–300 mm (two layers above 100 mm)', seriesM: [...METRIC_ROUNDING.seriesM], maxSingleLayerM: METRIC_ROUNDING.maxSingleLayerM },
  { id: 'inch', name: 'Half-inch steps, 1–6 in (two layers above 4 in)', seriesM: [...US_ROUNDING.seriesM], maxSingleLayerM: US_ROUNDING.maxSingleLayerM },
];
