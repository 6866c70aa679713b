/**
 * The add/edit form of a line or vessel: raw text in the user's units, converted to the API's SI body and
 * checked with the same yup schema the server uses; every error lands on the field it is about.
 */
import type { AnySchema } from 'yup';

import { lineCreateSchema, linePatchSchema, vesselCreateSchema, vesselPatchSchema } from '../../../shared/schemas/lines';
import { formatInputNumber, fromDisplay, parseNumber, toDisplay, type Quantity, type UnitSystem } from '../../calc/units';
import type { BuildUp, ItemKind, Line, Purpose, Vessel } from '../../api/types';
import { validateWithSchema } from '../forms/validate';

import { buildUpToDraft, clean, draftToBuildUp, type BuildUpDraft } from './build-up';

export interface ItemFormValues {
  tag: string;
  service: string;
  sizeGivenAs: 'nps' | 'dn' | 'od';
  nps: string;
  dn: string;
  outerDiameter: string;
  diameter: string;
  length: string;
  height: string;
  orientation: 'horizontal' | 'vertical';
  headType: 'ellipsoidal2to1' | 'hemispherical' | 'flat';
  location: 'indoor' | 'outdoor';
  operatingTemperature: string;
  purposes: Purpose[];
  heatLimit: string;
  holdingMassFlow: string;
  holdingSpecificHeat: string;
  holdingMaxChange: string;
  frostMinHours: string;
  frostBore: string;
  frostPipeMass: string;
  frostStart: string;
  valves: string;
  flanges: string;
  elbows: string;
  tees: string;
  fittingsInsulated: 'yes' | 'no';
  buildUp: BuildUpDraft;
  notes: string;
}

export type ItemFormErrors = Partial<Record<string, string>>;

/** Number fields: their quantity (for units) and label (for messages). */
export const NUMBER_FIELDS = {
  outerDiameter: { quantity: 'diameter', label: 'Outside diameter' },
  diameter: { quantity: 'length', label: 'Diameter' },
  length: { quantity: 'length', label: 'Length' },
  height: { quantity: 'length', label: 'Vertical run' },
  operatingTemperature: { quantity: 'temperature', label: 'Operating temperature' },
  heatLimit: { quantity: 'heatLossPerLength', label: 'Heat-loss limit' },
  holdingMassFlow: { quantity: 'massFlow', label: 'Mass flow' },
  holdingSpecificHeat: { quantity: 'specificHeat', label: 'Specific heat' },
  holdingMaxChange: { quantity: 'temperatureDelta', label: 'Largest temperature change' },
  frostMinHours: { quantity: 'hours', label: 'Minimum hours' },
  frostBore: { quantity: 'diameter', label: 'Bore' },
  frostPipeMass: { quantity: 'massPerLength', label: 'Pipe mass' },
  frostStart: { quantity: 'temperature', label: 'Water start temperature' },
  valves: { quantity: 'ratio', label: 'Valves' },
  flanges: { quantity: 'ratio', label: 'Flange pairs' },
  elbows: { quantity: 'ratio', label: 'Elbows' },
  tees: { quantity: 'ratio', label: 'Tees' },
} as const satisfies Record<string, { quantity: Quantity; label: string }>;

export type NumberFieldName = keyof typeof NUMBER_FIELDS;

/** The quantity of a number field for an item kind (a vessel's heat-loss limit is for the whole vessel). */
export function quantityOf(field: NumberFieldName, kind: ItemKind): Quantity {
  if (field === 'heatLimit' && kind === 'vessel') return 'heatFlow';
  return NUMBER_FIELDS[field].quantity;
}

/** What an item's fields held when the form opened: the text shown and the stored SI value behind it. */
export interface FormStart {
  values: ItemFormValues;
  si: Partial<Record<NumberFieldName, number>>;
  buildUp: BuildUp | null;
}

export function emptyItemForm(kind: ItemKind): ItemFormValues {
  return {
    tag: '',
    service: '',
    sizeGivenAs: 'nps',
    nps: '4',
    dn: '100',
    outerDiameter: '',
    diameter: '',
    length: '',
    height: '',
    orientation: kind === 'vessel' ? 'vertical' : 'horizontal',
    headType: 'ellipsoidal2to1',
    location: 'outdoor',
    operatingTemperature: '',
    purposes: kind === 'vessel' ? ['personnelProtection', 'heatConservation'] : ['personnelProtection', 'heatConservation'],
    heatLimit: '',
    holdingMassFlow: '',
    holdingSpecificHeat: '',
    holdingMaxChange: '',
    frostMinHours: '',
    frostBore: '',
    frostPipeMass: '',
    frostStart: '',
    valves: '0',
    flanges: '0',
    elbows: '0',
    tees: '0',
    fittingsInsulated: 'yes',
    buildUp: { mode: 'siteDefault', fixed: false, layers: [], finishId: '' },
    notes: '',
  };
}

/** The form of a stored line or vessel, in the user's units. */
export function itemToForm(item: Line | Vessel, kind: ItemKind, system: UnitSystem, siteDefault?: BuildUp): FormStart {
  const v = emptyItemForm(kind);
  const si: FormStart['si'] = {};
  const put = (field: NumberFieldName, value: number | null | undefined) => {
    if (value === null || value === undefined || !Number.isFinite(value)) return;
    si[field] = value;
    v[field] = formatInputNumber(toDisplay(quantityOf(field, kind), system, value));
  };
  v.tag = item.tag;
  v.service = item.service ?? '';
  v.orientation = item.orientation;
  v.location = item.location;
  v.purposes = [...item.purposes];
  v.notes = item.notes ?? '';
  put('length', item.lengthM);
  put('operatingTemperature', item.operatingTemperatureC);
  const pp = item.purposeParameters ?? {};
  put('heatLimit', kind === 'vessel' ? pp.heatConservation?.maxHeatLossW : pp.heatConservation?.maxHeatLossWPerM);
  if (kind === 'line') {
    const l = item as Line;
    v.sizeGivenAs = l.sizeGivenAs;
    if (l.nps) v.nps = l.nps;
    if (l.dn !== null) v.dn = String(l.dn);
    put('outerDiameter', l.outerDiameterM);
    put('height', l.heightM);
    put('holdingMassFlow', pp.temperatureHolding?.massFlowKgPerS);
    put('holdingSpecificHeat', pp.temperatureHolding?.specificHeatJPerKgK);
    put('holdingMaxChange', pp.temperatureHolding?.maxChangeK);
    put('frostMinHours', pp.frostProtection?.minHours);
    put('frostBore', pp.frostProtection?.innerDiameterM);
    put('frostPipeMass', pp.frostProtection?.pipeMassKgPerM);
    put('frostStart', pp.frostProtection?.startTemperatureC);
    for (const k of ['valves', 'flanges', 'elbows', 'tees'] as const) put(k, l.fittings[k]);
    v.fittingsInsulated = l.fittingsInsulated ? 'yes' : 'no';
  } else {
    const ve = item as Vessel;
    put('diameter', ve.diameterM);
    v.headType = ve.headType;
  }
  v.buildUp = buildUpToDraft(item.buildUp, system, siteDefault);
  return { values: v, si, buildUp: item.buildUp };
}

/** Where a schema path lands in the form. */
export function formFieldOfPath(path: string, kind: ItemKind, sizeGivenAs: ItemFormValues['sizeGivenAs']): string {
  const direct: Record<string, string> = {
    outerDiameterM: 'outerDiameter',
    diameterM: 'diameter',
    lengthM: 'length',
    heightM: 'height',
    operatingTemperatureC: 'operatingTemperature',
    'purposeParameters.heatConservation.maxHeatLossWPerM': 'heatLimit',
    'purposeParameters.heatConservation.maxHeatLossW': 'heatLimit',
    'purposeParameters.temperatureHolding.massFlowKgPerS': 'holdingMassFlow',
    'purposeParameters.temperatureHolding.specificHeatJPerKgK': 'holdingSpecificHeat',
    'purposeParameters.temperatureHolding.maxChangeK': 'holdingMaxChange',
    'purposeParameters.frostProtection.minHours': 'frostMinHours',
    'purposeParameters.frostProtection.innerDiameterM': 'frostBore',
    'purposeParameters.frostProtection.pipeMassKgPerM': 'frostPipeMass',
    'purposeParameters.frostProtection.startTemperatureC': 'frostStart',
    'fittings.valves': 'valves',
    'fittings.flanges': 'flanges',
    'fittings.elbows': 'elbows',
    'fittings.tees': 'tees',
  };
  if (path in direct) return direct[path];
  // The schema reports "give the size once" at nps, whichever way the size was given.
  if (path === 'nps' || path === 'dn') return kind === 'line' ? (sizeGivenAs === 'od' ? 'outerDiameter' : sizeGivenAs) : path;
  if (/^purposes(\[\d+\])?$/.test(path)) return 'purposes';
  if (path.startsWith('purposeParameters.temperatureHolding')) return 'holdingMaxChange';
  if (path.startsWith('purposeParameters.frostProtection')) return 'frostMinHours';
  return path;
}

export interface FormConversion {
  /** The API body (SI), or null when something stops it. */
  input: Record<string, unknown> | null;
  errors: ItemFormErrors;
}

const PARAM_FIELDS: Partial<Record<Purpose, NumberFieldName[]>> = {
  heatConservation: ['heatLimit'],
  temperatureHolding: ['holdingMassFlow', 'holdingSpecificHeat', 'holdingMaxChange'],
  frostProtection: ['frostMinHours', 'frostBore', 'frostPipeMass', 'frostStart'],
};

/**
 * The form's values → the create (or, with `start`, the patch) body in SI, checked with the shared schema.
 * A number left exactly as it was shown keeps its stored SI value, so saving in US units changes nothing
 * that was not touched (and marks nothing stale by rounding).
 */
export function formToItemInput(values: ItemFormValues, kind: ItemKind, system: UnitSystem, start?: FormStart & { version?: number }): FormConversion {
  const errors: ItemFormErrors = {};
  const number = (field: NumberFieldName): number | undefined => {
    const text = values[field].trim();
    if (text === '') return undefined;
    if (start && start.values[field] === values[field] && start.si[field] !== undefined) return start.si[field];
    const n = parseNumber(text);
    if (n === null) {
      errors[field] = `${NUMBER_FIELDS[field].label} must be a number`;
      return undefined;
    }
    return clean(fromDisplay(quantityOf(field, kind), system, n));
  };
  const body: Record<string, unknown> = { tag: values.tag.trim() };
  if (values.service.trim() || start) body.service = values.service.trim();
  const put = (key: string, v: unknown) => {
    if (v !== undefined) body[key] = v;
  };

  if (kind === 'line') {
    if (values.sizeGivenAs === 'nps') put('nps', values.nps || undefined);
    else if (values.sizeGivenAs === 'dn') {
      const dn = parseNumber(values.dn);
      if (values.dn.trim() && dn === null) errors.dn = 'DN must be a number';
      put('dn', dn ?? undefined);
    } else put('outerDiameterM', number('outerDiameter'));
    put('orientation', values.orientation);
    if (values.orientation === 'vertical') put('heightM', number('height'));
    else if (start) body.heightM = null;
  } else {
    put('diameterM', number('diameter'));
    put('orientation', values.orientation);
    put('headType', values.headType);
  }
  put('lengthM', number('length'));
  put('operatingTemperatureC', number('operatingTemperature'));
  put('location', values.location);
  body.purposes = values.purposes;

  const params: Record<string, Record<string, number>> = {};
  const purposes = new Set(values.purposes);
  if (purposes.has('heatConservation')) {
    const limit = number('heatLimit');
    if (limit !== undefined) params.heatConservation = kind === 'vessel' ? { maxHeatLossW: limit } : { maxHeatLossWPerM: limit };
  }
  if (kind === 'line' && purposes.has('temperatureHolding')) {
    const h: Record<string, number> = {};
    const m = number('holdingMassFlow');
    const c = number('holdingSpecificHeat');
    const d = number('holdingMaxChange');
    if (m !== undefined) h.massFlowKgPerS = m;
    if (c !== undefined) h.specificHeatJPerKgK = c;
    if (d !== undefined) h.maxChangeK = d;
    if (Object.keys(h).length === 0) errors.holdingMaxChange = 'Give the flow, specific heat and largest change for process temperature holding';
    params.temperatureHolding = h;
  }
  if (kind === 'line' && purposes.has('frostProtection')) {
    const f: Record<string, number> = {};
    const pairs: [NumberFieldName, string][] = [
      ['frostMinHours', 'minHours'],
      ['frostBore', 'innerDiameterM'],
      ['frostPipeMass', 'pipeMassKgPerM'],
      ['frostStart', 'startTemperatureC'],
    ];
    for (const [field, key] of pairs) {
      const n = number(field);
      if (n !== undefined) f[key] = n;
    }
    if (f.minHours === undefined && !errors.frostMinHours) errors.frostMinHours = 'Give the minimum hours before standing water reaches 0 °C';
    params.frostProtection = f;
  }
  // Parameters of purposes the item does not carry are not asked for; their fields are ignored.
  for (const [p, fields] of Object.entries(PARAM_FIELDS)) if (!purposes.has(p as Purpose)) for (const f of fields ?? []) delete errors[f];
  if (Object.keys(params).length > 0 || start) body.purposeParameters = params;

  if (kind === 'line') {
    const fittings: Record<string, number> = {};
    for (const k of ['valves', 'flanges', 'elbows', 'tees'] as const) {
      const n = number(k);
      if (n !== undefined) fittings[k] = n;
    }
    body.fittings = fittings;
    body.fittingsInsulated = values.fittingsInsulated === 'yes';
  }

  const b = draftToBuildUp(values.buildUp, system, start?.buildUp);
  Object.assign(errors, b.errors);
  if (Object.keys(b.errors).length === 0) body.buildUp = b.buildUp;
  if (values.notes.trim() || start) body.notes = values.notes;
  if (start?.version !== undefined) body.version = start.version;

  const schema: AnySchema = kind === 'line' ? (start ? linePatchSchema : lineCreateSchema) : start ? vesselPatchSchema : vesselCreateSchema;
  const schemaErrors = validateWithSchema(schema, body);
  for (const [path, message] of Object.entries(schemaErrors)) {
    const field = formFieldOfPath(path, kind, values.sizeGivenAs);
    if (!errors[field] && message) errors[field] = message;
  }
  return { input: Object.keys(errors).length === 0 ? body : null, errors };
}
