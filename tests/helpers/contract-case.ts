import type { CalcCase } from '../../shared/calc/types';

/**
 * The worked example of the public calculation contract (README, "The contract"): a 114.3 mm steam pipe at
 * 250 °C, ε 0.1, still air at 30 °C, sized for a surface of at most 60 °C and rounded to a series.
 */
export const CONTRACT_EXAMPLE_CASE: CalcCase = {
  geometry: { type: 'pipe', outerDiameterM: 0.1143, orientation: 'horizontal' },
  processTemperatureC: 250,
  layers: [{ thicknessM: 0.05, conductivity: [0.035, 0.00015], maxServiceTemperatureC: 650 }],
  surfaceEmissivity: 0.1,
  ambient: { airTemperatureC: 30, radiantTemperatureC: 30, windSpeedMS: 0, relativeHumidityPct: 60 },
  solveFor: { criterion: 'surfaceTemperature', maxC: 60 },
  round: { seriesM: [0.025, 0.03, 0.04, 0.05, 0.06, 0.08, 0.1], maxSingleLayerM: 0.1 },
};
