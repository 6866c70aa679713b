/**
 * Generic materials, finishes and thickness series for the quick-sizing form. Stand-in until
 * shared/calc/library/ is available. Values are typical of each material class (from memory, not a
 * product's data sheet); the plant's specification governs.
 */
import type { FinishOption, MaterialOption, SeriesOption } from './library';

export const materials: MaterialOption[] = [
  { id: 'mineral-wool-pipe', name: 'Mineral wool pipe section', conductivity: [0.034, 0.0001, 2.5e-7], maxServiceTemperatureC: 650, source: 'Typical of the class (from memory)' },
  { id: 'calcium-silicate', name: 'Calcium silicate', conductivity: [0.052, 0.0001, 1e-7], maxServiceTemperatureC: 650, source: 'Typical of the class (from memory)' },
  { id: 'cellular-glass', name: 'Cellular glass', conductivity: [0.038, 0.00012, 3e-7], maxServiceTemperatureC: 430, source: 'Typical of the class (from memory)' },
  { id: 'elastomeric-foam', name: 'Flexible elastomeric foam', conductivity: [0.033, 0.0001], maxServiceTemperatureC: 105, source: 'Typical of the class (from memory)' },
  { id: 'pir-foam', name: 'Polyisocyanurate foam', conductivity: [0.023, 0.00009], maxServiceTemperatureC: 120, source: 'Typical of the class (from memory)' },
  { id: 'aerogel-blanket', name: 'Aerogel blanket', conductivity: [0.015, 0.00004, 6e-8], maxServiceTemperatureC: 650, source: 'Typical of the class (from memory)' },
];

export const finishes: FinishOption[] = [
  { id: 'aluminium-new', name: 'Aluminium jacket, bright', emissivity: 0.1 },
  { id: 'aluminium-weathered', name: 'Aluminium jacket, weathered', emissivity: 0.2 },
  { id: 'stainless', name: 'Stainless steel jacket', emissivity: 0.15 },
  { id: 'galvanised', name: 'Galvanised steel jacket', emissivity: 0.28 },
  { id: 'painted', name: 'Painted metal or mastic', emissivity: 0.9 },
  { id: 'pvc', name: 'Plastic jacket', emissivity: 0.9 },
];

const mm = (values: number[]) => values.map((v) => v / 1000);

export const thicknessSeries: SeriesOption[] = [
  { id: 'metric', name: 'Metric steps (20–200 mm)', seriesM: mm([20, 25, 30, 40, 50, 60, 70, 80, 90, 100, 120, 140, 160, 180, 200]), maxSingleLayerM: 0.1 },
  { id: 'inch-half', name: 'Half-inch steps (½–8 in)', seriesM: [0.5, 1, 1.5, 2, 2.5, 3, 3.5, 4, 4.5, 5, 5.5, 6, 7, 8].map((i) => i * 0.0254), maxSingleLayerM: 4 * 0.0254 },
];
