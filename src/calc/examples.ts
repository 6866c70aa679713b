/**
 * Typical conditions for each purpose, offered as a starting point (invented, representative values;
 * never applied without the person asking).
 */
import { finishById, materialById } from './library';
import type { Draft, PurposeId } from './quick-case';

function layerOf(id: string, thicknessM = 0.05) {
  const m = materialById(id);
  if (!m) return null;
  return { materialId: id, conductivity: [...m.conductivity], maxServiceTemperatureC: m.maxServiceTemperatureC ?? null, thicknessM };
}

function finish(id: string): Partial<Draft> {
  const f = finishById(id);
  return f ? { finishId: id, emissivity: f.emissivity } : {};
}

/** The inputs to change for a purpose's typical case. */
export function typicalConditions(purpose: PurposeId): Partial<Draft> {
  switch (purpose) {
    case 'personnel': {
      const l = layerOf('mineral-fibre-pipe-c547-type-i');
      return { processTemperatureC: 180, airTemperatureC: 35, radiantTemperatureC: 35, windSpeedMS: 0, relativeHumidityPct: 50, maxSurfaceC: 55, ...(l ? { layers: [l] } : {}), ...finish('aluminium-oxidised') };
    }
    case 'conservation': {
      const l = layerOf('mineral-fibre-pipe-c547-type-i');
      return { processTemperatureC: 250, airTemperatureC: 15, radiantTemperatureC: 15, windSpeedMS: 3, relativeHumidityPct: 70, maxHeatLossWPerM: 80, maxHeatFluxWPerM2: 100, maxHeatLossW: 8000, ...(l ? { layers: [l] } : {}), ...finish('aluminium-oxidised') };
    }
    case 'condensation': {
      const l = layerOf('flexible-elastomeric-c534-grade-1-type-i', 0.025);
      return { processTemperatureC: 6, airTemperatureC: 30, radiantTemperatureC: 30, windSpeedMS: 0, relativeHumidityPct: 80, condensationMarginK: 2, ...(l ? { layers: [l] } : {}), ...finish('pvc-jacket') };
    }
    case 'holding': {
      const l = layerOf('mineral-fibre-pipe-c547-type-i');
      return { processTemperatureC: 150, airTemperatureC: 10, radiantTemperatureC: 10, windSpeedMS: 2, relativeHumidityPct: 70, runLengthM: 200, massFlowKgPerS: 2, specificHeatJPerKgK: 2300, maxChangeK: 5, ...(l ? { layers: [l] } : {}), ...finish('aluminium-oxidised') };
    }
    case 'frost': {
      const l = layerOf('cellular-glass-c552-grade-6');
      return { processTemperatureC: 10, airTemperatureC: -20, radiantTemperatureC: -20, windSpeedMS: 5, relativeHumidityPct: 80, minHours: 8, ...(l ? { layers: [l] } : {}), ...finish('aluminium-oxidised') };
    }
  }
}
