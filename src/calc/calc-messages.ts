/**
 * The calculation package speaks in contract field paths and SI (`round.seriesM`, `layers[0].conductivity`,
 * "°C"); the form speaks in its own words and the units on screen. This module carries calc errors and
 * warnings over: field paths become the form's labels and the draft field to mark, temperatures and
 * thicknesses move to the unit system shown, and the messages the form can say better are rewritten.
 */
import type { Warning } from '../../shared/calc/types';

import { fixed, formatThickness } from './format';
import { limitKey, type Draft } from './quick-case';
import { unitOf, type UnitSystem } from './units';
import { fieldLabel } from './validation';

const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/**
 * The draft field a contract path belongs to (`geometry.outerDiameterM` → `pipeOuterDiameterM`), or null when
 * the form has no field for it.
 */
export function draftFieldOf(casePath: string, d: Pick<Draft, 'kind' | 'purpose'>): string | null {
  const path = casePath.replace(/^\[\d+\]\./, '');
  const layer = /^layers\[(\d+)\]\.(thicknessM|maxServiceTemperatureC|minServiceTemperatureC|conductivity)(\[\d+\])?/.exec(path);
  if (layer) {
    const [, i, key, index] = layer;
    if (key === 'conductivity') return `layers[${i}].conductivity${index ?? '[0]'}`;
    return `layers[${i}].${key}`;
  }
  if (/^layers\[\d+\]$/.test(path) || path === 'layers') return 'layers';
  const direct: Record<string, string> = {
    processTemperatureC: 'processTemperatureC',
    surfaceEmissivity: 'emissivity',
    'geometry.outerDiameterM': 'pipeOuterDiameterM',
    'geometry.heightM': d.kind === 'pipe' ? 'pipeHeightM' : 'wallHeightM',
    'geometry.characteristicLengthM': 'wallCharacteristicLengthM',
    'geometry.lengthAlongWindM': d.kind === 'pipe' ? 'pipeHeightM' : 'wallHeightM',
    'geometry.diameterM': 'vesselDiameterM',
    'geometry.lengthM': 'vesselLengthM',
    'ambient.airTemperatureC': 'airTemperatureC',
    'ambient.radiantTemperatureC': 'radiantTemperatureC',
    'ambient.windSpeedMS': 'windSpeedMS',
    'ambient.relativeHumidityPct': 'relativeHumidityPct',
    'run.lengthM': 'runLengthM',
    'run.massFlowKgPerS': 'massFlowKgPerS',
    'run.specificHeatJPerKgK': 'specificHeatJPerKgK',
    'stagnant.innerDiameterM': 'innerDiameterM',
    'stagnant.pipeMassKgPerM': 'pipeMassKgPerM',
    'contact.seconds': 'contactSeconds',
    'contact.material': 'contactMaterial',
  };
  if (path in direct) return direct[path];
  if (path === 'solveFor' || path.startsWith('solveFor.')) return limitKey(d);
  if (path === 'round' || path.startsWith('round.') || path === 'seriesM' || path === 'maxSingleLayerM') return 'energy.seriesId';
  return null;
}

/** The form's words for a draft field, for any field a calc message may name. */
export function formLabelOf(d: Draft, draftField: string, system: UnitSystem): string {
  const known = fieldLabel(d, draftField, system);
  if (known) return known;
  const layer = /^layers\[(\d+)\]/.exec(draftField);
  if (layer) return `layer ${Number(layer[1]) + 1}`;
  const extra: Record<string, string> = {
    layers: 'the insulation layers',
    'energy.seriesId': 'the thickness series',
    contactMaterial: 'the surface material touched',
    emissivity: 'the emissivity of the finish',
  };
  return extra[draftField] ?? 'this input';
}

// A contract path inside a message: `layers[0].conductivity[1]`, `ambient.radiantTemperatureC`, `round.seriesM`…
const PATH = /(?:\[\d+\]\.)?(?:(?:geometry|ambient|solveFor|round|run|stagnant|contact)(?:\.[A-Za-z]+(?:\[\d+\])?)+|layers\[\d+\](?:\.[A-Za-z]+(?:\[\d+\])?)*|\b(?:processTemperatureC|surfaceEmissivity|maxSingleLayerM|seriesM)\b)/g;
// A temperature or a range of them in °C, as the calc writes them ("600.0 °C", "−40…50 °C").
const TEMPERATURE = /([−-]?\d+(?:\.\d+)?)(?:…([−-]?\d+(?:\.\d+)?))? °C/g;
// A length in millimetres ("114 mm").
const MILLIMETRES = /(\d+(?:\.\d+)?) mm\b/g;

const toNumber = (s: string) => Number(s.replace('−', '-'));

/** Temperatures written in °C inside a text ("up to 454 °C", "−40…50 °C"), in the units shown, at the same precision. */
export function temperaturesInText(text: string, system: UnitSystem): string {
  const unit = unitOf('temperature', system);
  // Keep the precision the calc wrote (whole degrees stay whole).
  const one = (s: string) => fixed(unit.fromSI(toNumber(s)), (s.split('.')[1] ?? '').length);
  return text.replace(TEMPERATURE, (_m, a: string, b?: string) => (b !== undefined ? `${one(a)}…${one(b)} ${unit.suffix}` : `${one(a)} ${unit.suffix}`));
}

/** A calc message in the form's words: field paths become labels, temperatures and thicknesses the units shown. */
export function inFormWords(message: string, d: Draft, system: UnitSystem): string {
  let out = message.replace(PATH, (path) => {
    const field = draftFieldOf(path, d);
    return field ? formLabelOf(d, field, system) : 'this input';
  });
  out = temperaturesInText(out, system);
  if (system === 'US') out = out.replace(MILLIMETRES, (_m, mm: string) => formatThickness(Number(mm) / 1000, system).text);
  return cap(out.trim());
}

/** A calc error in the form's words, with the draft field to mark (null when none fits). */
export function calcErrorInFormWords(error: { code: string; field: string; message: string }, d: Draft, system: UnitSystem): { field: string | null; message: string } {
  const field = draftFieldOf(error.field, d);
  if (error.code === 'CONDUCTIVITY_NOT_POSITIVE') {
    const layer = /^layers\[(\d+)\]/.exec(error.field);
    const n = layer ? Number(layer[1]) + 1 : null;
    return {
      field,
      message: `The conductivity of ${n ? `layer ${n}` : 'a layer'} must stay above zero over the temperatures it sees; check its coefficients.`,
    };
  }
  return { field, message: inFormWords(error.message, d, system) };
}

/** Codes whose message the screen writes itself from the result (service limits at the layer). */
const SHOWN_ELSEWHERE = new Set(['MAX_SERVICE_TEMPERATURE_EXCEEDED', 'MIN_SERVICE_TEMPERATURE_EXCEEDED']);

/**
 * The calc's warnings in the form's words. Service-limit warnings are left out when `serviceLimitsShown` (the
 * screen states them at each layer and in the summary).
 */
export function warningsInFormWords(warnings: readonly Warning[], d: Draft, system: UnitSystem, serviceLimitsShown: boolean): Warning[] {
  const out: Warning[] = [];
  for (const w of warnings) {
    if (serviceLimitsShown && SHOWN_ELSEWHERE.has(w.code)) continue;
    switch (w.code) {
      case 'COLD_SURFACE_SKY_RADIATION':
        out.push({
          code: w.code,
          message: `This cold surface exchanges radiation with surroundings at the air temperature. Outdoors a clear night sky can be ${system === 'US' ? '18–36 °F' : '10–20 K'} colder than the air, which cools the surface further and adds to the risk of condensation; set the surroundings temperature (radiant) lower to check.`,
        });
        break;
      case 'ROUNDED_BUILD_UP_FAILS':
        out.push({ code: w.code, message: 'The rounded build-up is thicker than the thickest searched and does not meet the purpose; choose a material with lower conductivity.' });
        break;
      default:
        out.push({ code: w.code, message: inFormWords(w.message, d, system) });
    }
  }
  return out;
}
