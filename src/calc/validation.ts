/**
 * Field-by-field validation of the quick-sizing draft with yup. Messages name the field (and layer) and
 * state bounds in the units on screen.
 */
import * as yup from 'yup';

import { currencySymbol, fixed } from './format';
import { isColdService, limitKey, purposeAvailable, type Draft } from './quick-case';
import { type Quantity, type UnitSystem, formatInputNumber, unitOf } from './units';

export type FieldErrors = Record<string, string>;

type Rule = {
  label: string;
  quantity: Quantity;
  min?: number;
  max?: number;
  exclusiveMin?: boolean;
  optional?: boolean;
  /** Put before the unit, e.g. the currency of a price ("$" → "$/kWh"). */
  unitPrefix?: string;
};

function show(quantity: Quantity, system: UnitSystem, si: number, unitPrefix = ''): string {
  const u = unitOf(quantity, system);
  const v = u.fromSI(si);
  const text = Math.abs(v) >= 100 ? fixed(v, 0) : formatInputNumber(v, 3).replace('-', '−');
  const unit = `${unitPrefix}${u.suffix}`;
  return `${text}${unit ? ` ${unit}` : ''}`;
}

function numberRule(r: Rule, system: UnitSystem) {
  let s = yup.number().typeError(`Enter ${r.label} as a number.`).nullable();
  if (!r.optional) s = s.test('present', `Enter ${r.label} as a number.`, (v) => v !== null && v !== undefined);
  if (r.min !== undefined) {
    const min = r.min;
    s = r.exclusiveMin
      ? s.test('min', `${cap(r.label)} must be more than ${show(r.quantity, system, min, r.unitPrefix)}.`, (v) => v === null || v === undefined || v > min)
      : s.test('min', `${cap(r.label)} must be at least ${show(r.quantity, system, min, r.unitPrefix)}.`, (v) => v === null || v === undefined || v >= min);
  }
  if (r.max !== undefined) {
    const max = r.max;
    s = s.test('max', `${cap(r.label)} must be at most ${show(r.quantity, system, max, r.unitPrefix)}.`, (v) => v === null || v === undefined || v <= max);
  }
  return s;
}

const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** The conductivity at 0 °C (the SI coefficient c0) in the words of the form: "k", spelt out, is not kelvin. */
export function conductivityAtZeroLabel(layer: number, system: UnitSystem): string {
  return `the conductivity at ${system === 'US' ? '32 °F' : '0 °C'} of layer ${layer}`;
}

/** The rules that apply to this draft (geometry and purpose decide which fields matter). */
function rulesFor(d: Draft, system: UnitSystem = 'SI'): Record<string, Rule> {
  const rules: Record<string, Rule> = {
    processTemperatureC: { label: 'the process temperature', quantity: 'temperature', min: -273, max: 1200 },
    emissivity: { label: 'the emissivity', quantity: 'ratio', min: 0.02, max: 1 },
    airTemperatureC: { label: 'the air temperature', quantity: 'temperature', min: -60, max: 80 },
    radiantTemperatureC: { label: 'the surroundings temperature', quantity: 'temperature', min: -100, max: 200 },
    windSpeedMS: { label: 'the wind speed', quantity: 'speed', min: 0, max: 40 },
    relativeHumidityPct: { label: 'the relative humidity', quantity: 'percent', min: 0, max: 100, optional: d.purpose !== 'condensation' },
    contactSeconds: { label: 'the contact time', quantity: 'seconds', min: 1, max: 28800 },
  };
  if (d.kind === 'pipe') {
    rules.pipeOuterDiameterM = { label: 'the pipe outside diameter', quantity: 'diameter', min: 0.005, max: 3 };
    if (d.pipeOrientation === 'vertical') rules.pipeHeightM = { label: 'the vertical run height', quantity: 'length', min: 0.1, max: 200 };
  } else if (d.kind === 'vessel') {
    rules.vesselDiameterM = { label: 'the vessel diameter', quantity: 'length', min: 0.1, max: 50 };
    rules.vesselLengthM = { label: 'the shell length', quantity: 'length', min: 0, max: 100 };
  } else if (d.wallOrientation === 'vertical') {
    rules.wallHeightM = { label: 'the wall height', quantity: 'length', min: 0.05, max: 100 };
  } else {
    rules.wallCharacteristicLengthM = { label: 'the area ÷ perimeter', quantity: 'length', min: 0.01, max: 50 };
  }
  d.layers.forEach((l, i) => {
    const n = `layer ${i + 1}`;
    const solved = d.mode === 'size' && i === d.layers.length - 1 && purposeAvailable(d.purpose, d.kind);
    if (!solved) rules[`layers[${i}].thicknessM`] = { label: `the thickness of ${n}`, quantity: 'thickness', min: 0.001, max: 1 };
    if (l.materialId === 'custom') {
      l.conductivity.forEach((_, j) => {
        rules[`layers[${i}].conductivity[${j}]`] = j === 0
          ? { label: conductivityAtZeroLabel(i + 1, system), quantity: 'conductivity', min: 0.001, max: 5 }
          : { label: `coefficient c${j} of the conductivity of ${n}`, quantity: 'ratio' };
      });
      rules[`layers[${i}].maxServiceTemperatureC`] = { label: `the maximum service temperature of ${n}`, quantity: 'temperature', optional: true, min: -273, max: 1500 };
    }
  });
  const lk = limitKey(d) as string;
  const limitRules: Record<string, Rule> = {
    maxSurfaceC: { label: 'the maximum surface temperature', quantity: 'temperature', min: -50, max: 400 },
    maxHeatLossWPerM: { label: 'the maximum heat loss', quantity: 'heatLossPerLength', min: 0, exclusiveMin: true, max: 1e5 },
    maxHeatFluxWPerM2: { label: 'the maximum heat loss', quantity: 'heatFlux', min: 0, exclusiveMin: true, max: 1e5 },
    maxHeatLossW: { label: 'the maximum heat loss', quantity: 'heatFlow', min: 0, exclusiveMin: true, max: 1e8 },
    condensationMarginK: { label: 'the margin above the dew point', quantity: 'temperatureDelta', min: 0, max: 20 },
    maxChangeK: { label: 'the maximum temperature drop', quantity: 'temperatureDelta', min: 0, exclusiveMin: true, max: 500 },
    minHours: { label: 'the minimum time before freezing', quantity: 'hours', min: 0, exclusiveMin: true, max: 1000 },
  };
  if (purposeAvailable(d.purpose, d.kind)) rules[lk] = limitRules[lk];
  if (d.kind === 'pipe' && d.purpose === 'holding') {
    rules.runLengthM = { label: 'the run length', quantity: 'length', min: 0, exclusiveMin: true, max: 1e5 };
    rules.massFlowKgPerS = { label: 'the mass flow', quantity: 'massFlow', min: 0, exclusiveMin: true, max: 1e4 };
    rules.specificHeatJPerKgK = { label: 'the specific heat', quantity: 'specificHeat', min: 100, max: 20000 };
  }
  if (d.kind === 'pipe' && d.purpose === 'frost') {
    rules.innerDiameterM = { label: 'the pipe inside diameter', quantity: 'diameter', min: 0.002, max: 3 };
    rules.pipeMassKgPerM = { label: 'the pipe mass per metre', quantity: 'massPerLength', min: 0, max: 2000 };
  }
  const e = 'energy.';
  const money = currencySymbol(d.energy.currency);
  rules[`${e}operatingHoursPerYear`] = { label: 'the operating hours', quantity: 'hours', min: 0, max: 8784 };
  if (isColdService(d)) {
    // A gain is removed by a chiller: only its assumptions are shown and needed.
    rules[`${e}coolingCop`] = { label: 'the chiller’s coefficient of performance', quantity: 'ratio', min: 0.3, max: 15 };
    rules[`${e}electricityPricePerKWh`] = { label: 'the electricity price', quantity: 'pricePerEnergy', min: 0, max: 100, unitPrefix: money };
    rules[`${e}electricityCo2KgPerKWh`] = { label: 'the CO₂ factor of electricity', quantity: 'co2Factor', min: 0, max: 2 };
  } else {
    rules[`${e}pricePerKWh`] = { label: 'the energy price', quantity: 'pricePerEnergy', min: 0, max: 100, unitPrefix: money };
    rules[`${e}efficiency`] = { label: 'the heat-source efficiency', quantity: 'fraction', min: 0.01, max: 1 };
    rules[`${e}co2KgPerKWh`] = { label: 'the CO₂ factor', quantity: 'co2Factor', min: 0, max: 5 };
  }
  return rules;
}

/**
 * The form's words for a field path of the draft ("the process temperature", "the thickness of layer 2"), or
 * null when the field has no rule in this draft.
 */
export function fieldLabel(d: Draft, path: string, system: UnitSystem): string | null {
  return rulesFor(d, system)[path]?.label ?? null;
}

function read(d: Draft, path: string): unknown {
  return path
    .replace(/\[(\d+)\]/g, '.$1')
    .split('.')
    .reduce<unknown>((o, k) => (o === null || o === undefined ? undefined : (o as Record<string, unknown>)[k]), d);
}

/** Every field error of the draft, keyed by field path; an empty object when the draft is complete. */
export function validateDraft(d: Draft, system: UnitSystem): FieldErrors {
  const errors: FieldErrors = {};
  const rules = rulesFor(d, system);
  for (const [path, rule] of Object.entries(rules)) {
    try {
      numberRule(rule, system).validateSync(read(d, path));
    } catch (e) {
      if (e instanceof yup.ValidationError) errors[path] = e.message;
      else throw e;
    }
  }
  if (d.kind === 'pipe' && d.purpose === 'frost' && d.innerDiameterM !== null && d.pipeOuterDiameterM !== null && d.innerDiameterM >= d.pipeOuterDiameterM) {
    errors.innerDiameterM = 'The pipe inside diameter must be less than its outside diameter.';
  }
  if (d.layers.length === 0 && d.mode === 'size') errors.layers = 'Add a layer to size.';
  return errors;
}
