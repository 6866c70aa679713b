/**
 * The quick-sizing form's model. The draft holds SI values (null while a field does not hold a number)
 * plus the choices that a case alone does not carry (library ids, how the pipe size was given). It maps
 * to and from the calculation contract's CalcCase.
 */
import { touchSafetyVerdict } from '../../shared/calc/burn';
import type { CalcCase, CalcResult, Contact, ContactMaterial, Criterion, Geometry, Layer } from '../../shared/calc/types';

import {
  finishById,
  finishMatching,
  materialById,
  materialMatching,
  pipeSizeByOuterDiameter,
  pipeSizes,
  seriesById,
  seriesMatching,
  thicknessSeries,
} from './library';
import type { UnitSystem } from './units';

export type GeometryKind = 'pipe' | 'vessel' | 'wall';
export type PurposeId = 'personnel' | 'conservation' | 'condensation' | 'holding' | 'frost';
export type Mode = 'size' | 'check';
export type PipeSizeBy = 'nps' | 'dn' | 'od';

/** A number field: SI value, or null when the field does not hold a number. */
export type Num = number | null;

export type LayerDraft = {
  /** Library material id, or 'custom'. */
  materialId: string;
  conductivity: Num[];
  maxServiceTemperatureC: Num;
  thicknessM: Num;
};

export type EnergyAssumptions = {
  seriesId: string;
  operatingHoursPerYear: Num;
  /** Price of delivered fuel energy per kWh, in `currency`. */
  pricePerKWh: Num;
  currency: string;
  /** Heat-source efficiency, 0–1. */
  efficiency: Num;
  /** kg CO₂ per kWh of fuel. */
  co2KgPerKWh: Num;
  co2Basis: string;
  /** Cold service: coefficient of performance of the chiller that removes the heat gain. */
  coolingCop: Num;
  /** Cold service: price of electricity per kWh, in `currency`. */
  electricityPricePerKWh: Num;
  /** Cold service: kg CO₂ per kWh of electricity. */
  electricityCo2KgPerKWh: Num;
  electricityCo2Basis: string;
};

export type Draft = {
  kind: GeometryKind;
  pipeSizeBy: PipeSizeBy;
  pipeOuterDiameterM: Num;
  pipeOrientation: 'horizontal' | 'vertical';
  pipeHeightM: Num;
  vesselDiameterM: Num;
  vesselLengthM: Num;
  vesselOrientation: 'horizontal' | 'vertical';
  headType: 'flat' | 'ellipsoidal2to1' | 'hemispherical';
  wallOrientation: 'vertical' | 'faceUp' | 'faceDown';
  wallHeightM: Num;
  wallCharacteristicLengthM: Num;
  processTemperatureC: Num;
  layers: LayerDraft[];
  finishId: string;
  emissivity: Num;
  airTemperatureC: Num;
  radiantTemperatureC: Num;
  windSpeedMS: Num;
  relativeHumidityPct: Num;
  purpose: PurposeId;
  mode: Mode;
  maxSurfaceC: Num;
  maxHeatLossWPerM: Num;
  maxHeatFluxWPerM2: Num;
  maxHeatLossW: Num;
  condensationMarginK: Num;
  maxChangeK: Num;
  minHours: Num;
  runLengthM: Num;
  massFlowKgPerS: Num;
  specificHeatJPerKgK: Num;
  innerDiameterM: Num;
  pipeMassKgPerM: Num;
  contactMaterial: ContactMaterial;
  contactSeconds: Num;
  energy: EnergyAssumptions;
};

export const PURPOSES: { id: PurposeId; label: string; hint: string; pipesOnly: boolean }[] = [
  { id: 'personnel', label: 'Safe to touch', hint: 'Keep the outer surface cool enough that a brief touch does not burn.', pipesOnly: false },
  { id: 'conservation', label: 'Save heat', hint: 'Keep the heat flowing out below a set amount.', pipesOnly: false },
  { id: 'condensation', label: 'Stay dry', hint: 'Keep a cold surface warmer than the dew point, with a margin.', pipesOnly: false },
  { id: 'holding', label: 'Hold the process temperature', hint: 'Keep the drop along a flowing run within a limit.', pipesOnly: true },
  { id: 'frost', label: 'Hold off freezing', hint: 'Keep standing water above 0 °C for a minimum time.', pipesOnly: true },
];

export const PURPOSE_TRADE_TERMS: Record<PurposeId, string> = {
  personnel: 'personnel protection',
  conservation: 'heat conservation',
  condensation: 'condensation control',
  holding: 'process temperature holding',
  frost: 'frost protection',
};

export const CONTACT_MATERIALS: { id: ContactMaterial; label: string }[] = [
  { id: 'uncoatedMetal', label: 'Bare metal' },
  { id: 'coatedMetal', label: 'Painted or coated metal' },
  { id: 'ceramicGlassStone', label: 'Ceramic, glass or stone' },
  { id: 'plastic', label: 'Plastic' },
  { id: 'wood', label: 'Wood' },
];

/** The standard thickness series of a unit system: millimetre steps for SI, half-inch steps for US customary. */
export function standardSeriesId(system: UnitSystem): string {
  return system === 'US' ? 'inch' : 'metric';
}

function defaultEnergy(): EnergyAssumptions {
  return {
    seriesId: standardSeriesId('SI'),
    operatingHoursPerYear: 8000,
    pricePerKWh: 0.05,
    currency: 'USD',
    efficiency: 0.85,
    co2KgPerKWh: 0.202,
    co2Basis: 'Natural gas burnt in a boiler, per kWh of fuel (typical published factor)',
    coolingCop: 3.5,
    electricityPricePerKWh: 0.15,
    electricityCo2KgPerKWh: 0.4,
    electricityCo2Basis: 'Grid electricity, location-based average (example value; use your supplier’s or national factor)',
  };
}

/** A sensible starting case: NPS 4 steam line at 180 °C, mineral wool, aluminium jacket, still air. */
export function defaultDraft(): Draft {
  const mat = materialById('mineral-fibre-pipe-c547-type-i') ?? { conductivity: [0.04], maxServiceTemperatureC: undefined, id: 'custom' };
  const nps4 = pipeSizes.find((p) => p.nps === '4');
  return {
    kind: 'pipe',
    pipeSizeBy: 'nps',
    pipeOuterDiameterM: nps4?.outerDiameterM ?? 0.1143,
    pipeOrientation: 'horizontal',
    pipeHeightM: 5,
    vesselDiameterM: 2,
    vesselLengthM: 6,
    vesselOrientation: 'vertical',
    headType: 'ellipsoidal2to1',
    wallOrientation: 'vertical',
    wallHeightM: 2,
    wallCharacteristicLengthM: 0.5,
    processTemperatureC: 180,
    layers: [{ materialId: mat.id, conductivity: [...mat.conductivity], maxServiceTemperatureC: mat.maxServiceTemperatureC ?? null, thicknessM: 0.05 }],
    finishId: 'aluminium-oxidised',
    emissivity: finishById('aluminium-oxidised')?.emissivity ?? 0.15,
    airTemperatureC: 25,
    radiantTemperatureC: 25,
    windSpeedMS: 0,
    relativeHumidityPct: 60,
    purpose: 'personnel',
    mode: 'size',
    maxSurfaceC: 55,
    maxHeatLossWPerM: 60,
    maxHeatFluxWPerM2: 50,
    maxHeatLossW: 5000,
    condensationMarginK: 2,
    maxChangeK: 5,
    minHours: 12,
    runLengthM: 200,
    massFlowKgPerS: 0.5,
    specificHeatJPerKgK: 4190,
    innerDiameterM: 0.1023,
    pipeMassKgPerM: 16.1,
    contactMaterial: 'uncoatedMetal',
    contactSeconds: 5,
    energy: defaultEnergy(),
  };
}

/**
 * Cold service: the process runs below the air, so heat flows in (a gain removed by a chiller) and a touch is
 * judged as cold contact, not against hot burn thresholds.
 */
export function isColdService(d: Pick<Draft, 'processTemperatureC' | 'airTemperatureC'>): boolean {
  return d.processTemperatureC !== null && d.airTemperatureC !== null && d.processTemperatureC < d.airTemperatureC;
}

/** The contact the draft describes (material and time). */
export function contactOf(d: Pick<Draft, 'contactMaterial' | 'contactSeconds'>): Contact {
  return { material: d.contactMaterial, seconds: must(d.contactSeconds, 'contactSeconds') };
}

/**
 * The highest surface temperature "Safe to touch" is solved for: the stricter of the limit entered and the burn
 * threshold for the contact, taken so that the rounded figure passes whether it is shown in °C or °F (the case
 * stays the same in both unit systems).
 */
export function touchSolveLimitC(d: Draft): number {
  const limitC = must(d.maxSurfaceC, 'maxSurfaceC');
  const air = must(d.airTemperatureC, 'airTemperatureC');
  const contact = contactOf(d);
  const highest = (scale: 'C' | 'F') =>
    touchSafetyVerdict({ surfaceTemperatureC: Math.max(air, limitC), airTemperatureC: air, limitC, contact, precision: { decimals: 1, scale } }).maxPassingSurfaceC ?? limitC;
  return Math.min(highest('C'), highest('F'));
}

/** The purposes that can be worked out for this geometry. */
export function purposeAvailable(purpose: PurposeId, kind: GeometryKind): boolean {
  const p = PURPOSES.find((x) => x.id === purpose);
  return !p?.pipesOnly || kind === 'pipe';
}

function must(n: Num, field: string): number {
  if (n === null || !Number.isFinite(n)) throw new DraftIncomplete(field);
  return n;
}

/** A field the case needs is empty or not a number (validation reports it by name). */
export class DraftIncomplete extends Error {
  constructor(public field: string) {
    super(`Missing ${field}`);
  }
}

function geometryOf(d: Draft): Geometry {
  if (d.kind === 'pipe') {
    const g: Geometry = { type: 'pipe', outerDiameterM: must(d.pipeOuterDiameterM, 'pipeOuterDiameterM'), orientation: d.pipeOrientation };
    if (d.pipeOrientation === 'vertical') g.heightM = must(d.pipeHeightM, 'pipeHeightM');
    return g;
  }
  if (d.kind === 'vessel') {
    return {
      type: 'vessel',
      diameterM: must(d.vesselDiameterM, 'vesselDiameterM'),
      lengthM: must(d.vesselLengthM, 'vesselLengthM'),
      orientation: d.vesselOrientation,
      headType: d.headType,
    };
  }
  if (d.wallOrientation === 'vertical') return { type: 'flat', orientation: 'vertical', heightM: must(d.wallHeightM, 'wallHeightM') };
  return { type: 'flat', orientation: d.wallOrientation, characteristicLengthM: must(d.wallCharacteristicLengthM, 'wallCharacteristicLengthM') };
}

/** The purpose as a solve criterion (SI). */
function criterionOf(d: Draft): Criterion {
  switch (d.purpose) {
    case 'personnel':
      return { criterion: 'surfaceTemperature', maxC: isColdService(d) ? must(d.maxSurfaceC, 'maxSurfaceC') : touchSolveLimitC(d) };
    case 'conservation':
      if (d.kind === 'pipe') return { criterion: 'heatLoss', maxWPerM: must(d.maxHeatLossWPerM, 'maxHeatLossWPerM') };
      if (d.kind === 'wall') return { criterion: 'heatLoss', maxWPerM2: must(d.maxHeatFluxWPerM2, 'maxHeatFluxWPerM2') };
      return { criterion: 'heatLoss', maxW: must(d.maxHeatLossW, 'maxHeatLossW') };
    case 'condensation':
      return { criterion: 'condensation', marginK: must(d.condensationMarginK, 'condensationMarginK') };
    case 'holding':
      return { criterion: 'temperatureChange', maxChangeK: must(d.maxChangeK, 'maxChangeK') };
    case 'frost':
      return { criterion: 'freezeTime', minHours: must(d.minHours, 'minHours') };
  }
}

/** The build-up as contract layers (SI); every coefficient must be present. */
function layersOf(d: Draft): Layer[] {
  return d.layers.map((l, i) => {
    const conductivity = l.conductivity.map((c, j) => must(c, `layers[${i}].conductivity[${j}]`));
    while (conductivity.length > 1 && conductivity[conductivity.length - 1] === 0) conductivity.pop();
    const layer: Layer = { thicknessM: must(l.thicknessM, `layers[${i}].thicknessM`), conductivity };
    if (l.maxServiceTemperatureC !== null) layer.maxServiceTemperatureC = l.maxServiceTemperatureC;
    // A library material as chosen (curve not edited) also carries its lower limit and the range of its table.
    const m = materialById(l.materialId);
    if (m && materialMatching(conductivity, layer.maxServiceTemperatureC)?.id === m.id) {
      if (m.minServiceTemperatureC !== undefined) layer.minServiceTemperatureC = m.minServiceTemperatureC;
      if (m.conductivityDataRangeC) layer.conductivityDataRangeC = [...m.conductivityDataRangeC];
    }
    return layer;
  });
}

export function roundingOf(d: Draft) {
  const s = seriesById(d.energy.seriesId) ?? thicknessSeries[0];
  return s.maxSingleLayerM === undefined ? { seriesM: s.seriesM } : { seriesM: s.seriesM, maxSingleLayerM: s.maxSingleLayerM };
}

/**
 * The draft as a calculation case (SI). In sizing mode the outer layer is solved for the purpose and
 * rounded to the series; in checking mode the build-up is evaluated as entered. Throws DraftIncomplete.
 */
export function draftToCase(d: Draft): CalcCase {
  const c: CalcCase = {
    geometry: geometryOf(d),
    processTemperatureC: must(d.processTemperatureC, 'processTemperatureC'),
    layers: layersOf(d),
    surfaceEmissivity: must(d.emissivity, 'emissivity'),
    ambient: {
      airTemperatureC: must(d.airTemperatureC, 'airTemperatureC'),
      radiantTemperatureC: d.radiantTemperatureC ?? must(d.airTemperatureC, 'airTemperatureC'),
      windSpeedMS: d.windSpeedMS ?? 0,
    },
  };
  if (d.relativeHumidityPct !== null) c.ambient.relativeHumidityPct = d.relativeHumidityPct;
  if (d.mode === 'size' && purposeAvailable(d.purpose, d.kind)) {
    c.solveFor = criterionOf(d);
    c.round = roundingOf(d);
  }
  if (d.kind === 'pipe' && d.purpose === 'holding') {
    c.run = { lengthM: must(d.runLengthM, 'runLengthM'), massFlowKgPerS: must(d.massFlowKgPerS, 'massFlowKgPerS'), specificHeatJPerKgK: must(d.specificHeatJPerKgK, 'specificHeatJPerKgK') };
  }
  if (d.kind === 'pipe' && d.purpose === 'frost') {
    c.stagnant = { innerDiameterM: must(d.innerDiameterM, 'innerDiameterM'), pipeMassKgPerM: must(d.pipeMassKgPerM, 'pipeMassKgPerM') };
  }
  // Hot-surface burn thresholds apply to hot service only; cold contact is judged on screen (see present.ts).
  const contact = contactOf(d);
  if (!isColdService(d)) c.contact = contact;
  return c;
}

/** Options a case does not carry; they travel in the link's `o` parameter. */
export type DraftOptions = {
  purpose?: PurposeId;
  mode?: Mode;
  /**
   * The purpose's limit as entered (SI): in checking mode the case has no solveFor, and a touch limit may be
   * solved for a stricter burn threshold than the one entered.
   */
  limit?: number;
  pipeSizeBy?: PipeSizeBy;
  energy?: Partial<EnergyAssumptions>;
  /** The contact of a cold-service case (which carries no hot-surface burn check). */
  contact?: Contact;
};

export function draftOptions(d: Draft): DraftOptions {
  const o: DraftOptions = { purpose: d.purpose, mode: d.mode, pipeSizeBy: d.pipeSizeBy, energy: { ...d.energy } };
  const lim = limitValue(d);
  if (lim !== null) o.limit = lim;
  if (isColdService(d) && d.contactSeconds !== null) o.contact = { material: d.contactMaterial, seconds: d.contactSeconds };
  delete o.energy?.seriesId; // the series travels in the case's round, or here when checking
  if (d.mode === 'check' && o.energy) o.energy.seriesId = d.energy.seriesId;
  return o;
}

/** The SI limit of the draft's purpose. */
export function limitValue(d: Draft): Num {
  switch (d.purpose) {
    case 'personnel':
      return d.maxSurfaceC;
    case 'conservation':
      return d.kind === 'pipe' ? d.maxHeatLossWPerM : d.kind === 'wall' ? d.maxHeatFluxWPerM2 : d.maxHeatLossW;
    case 'condensation':
      return d.condensationMarginK;
    case 'holding':
      return d.maxChangeK;
    case 'frost':
      return d.minHours;
  }
}

export function limitKey(d: Pick<Draft, 'purpose' | 'kind'>): keyof Draft {
  switch (d.purpose) {
    case 'personnel':
      return 'maxSurfaceC';
    case 'conservation':
      return d.kind === 'pipe' ? 'maxHeatLossWPerM' : d.kind === 'wall' ? 'maxHeatFluxWPerM2' : 'maxHeatLossW';
    case 'condensation':
      return 'condensationMarginK';
    case 'holding':
      return 'maxChangeK';
    case 'frost':
      return 'minHours';
  }
}

/** Rebuild a draft from a shared case (and its options); unknown pieces fall back to the defaults. */
export function draftFromCase(c: CalcCase, o: DraftOptions = {}): Draft {
  const d = defaultDraft();
  const g = c.geometry;
  if (g.type === 'pipe') {
    d.kind = 'pipe';
    d.pipeOuterDiameterM = g.outerDiameterM;
    d.pipeOrientation = g.orientation;
    if (g.heightM !== undefined) d.pipeHeightM = g.heightM;
    d.pipeSizeBy = o.pipeSizeBy ?? (pipeSizeByOuterDiameter(g.outerDiameterM) ? 'nps' : 'od');
    if (d.pipeSizeBy !== 'od' && !pipeSizeByOuterDiameter(g.outerDiameterM)) d.pipeSizeBy = 'od';
  } else if (g.type === 'vessel') {
    d.kind = 'vessel';
    d.vesselDiameterM = g.diameterM;
    d.vesselLengthM = g.lengthM;
    d.vesselOrientation = g.orientation;
    d.headType = g.headType;
  } else {
    d.kind = 'wall';
    d.wallOrientation = g.orientation;
    if (g.heightM !== undefined) d.wallHeightM = g.heightM;
    if (g.characteristicLengthM !== undefined) d.wallCharacteristicLengthM = g.characteristicLengthM;
  }
  d.processTemperatureC = c.processTemperatureC;
  d.layers = c.layers.map((l) => {
    const match = materialMatching(l.conductivity, l.maxServiceTemperatureC);
    const conductivity: Num[] = [...l.conductivity];
    // A custom material always offers c0, c1 and c2 to edit.
    while (!match && conductivity.length < 3) conductivity.push(0);
    return {
    materialId: match?.id ?? 'custom',
    conductivity,
    maxServiceTemperatureC: l.maxServiceTemperatureC ?? null,
    thicknessM: l.thicknessM,
    };
  });
  d.emissivity = c.surfaceEmissivity;
  d.finishId = finishMatching(c.surfaceEmissivity)?.id ?? 'custom';
  d.airTemperatureC = c.ambient.airTemperatureC;
  d.radiantTemperatureC = c.ambient.radiantTemperatureC ?? c.ambient.airTemperatureC;
  d.windSpeedMS = c.ambient.windSpeedMS ?? 0;
  d.relativeHumidityPct = c.ambient.relativeHumidityPct ?? null;
  if (c.run) {
    d.runLengthM = c.run.lengthM;
    d.massFlowKgPerS = c.run.massFlowKgPerS;
    d.specificHeatJPerKgK = c.run.specificHeatJPerKgK;
  }
  if (c.stagnant) {
    d.innerDiameterM = c.stagnant.innerDiameterM;
    d.pipeMassKgPerM = c.stagnant.pipeMassKgPerM;
  }
  const contact = c.contact ?? o.contact;
  if (contact) {
    d.contactMaterial = contact.material;
    d.contactSeconds = contact.seconds;
  }
  if (o.energy) d.energy = { ...d.energy, ...o.energy };
  if (c.round) d.energy.seriesId = seriesMatching(c.round.seriesM)?.id ?? d.energy.seriesId;
  const s = c.solveFor;
  if (s) {
    d.mode = 'size';
    switch (s.criterion) {
      case 'surfaceTemperature':
        d.purpose = 'personnel';
        d.maxSurfaceC = s.maxC;
        break;
      case 'heatLoss':
        d.purpose = 'conservation';
        if (s.maxWPerM !== undefined) d.maxHeatLossWPerM = s.maxWPerM;
        if (s.maxWPerM2 !== undefined) d.maxHeatFluxWPerM2 = s.maxWPerM2;
        if (s.maxW !== undefined) d.maxHeatLossW = s.maxW;
        break;
      case 'condensation':
        d.purpose = 'condensation';
        d.condensationMarginK = s.marginK;
        break;
      case 'temperatureChange':
        d.purpose = 'holding';
        d.maxChangeK = s.maxChangeK;
        break;
      case 'freezeTime':
        d.purpose = 'frost';
        d.minHours = s.minHours;
        break;
    }
  } else {
    d.mode = o.mode ?? 'check';
    d.purpose = o.purpose ?? (c.run ? 'holding' : c.stagnant ? 'frost' : d.purpose);
  }
  if (typeof o.limit === 'number' && Number.isFinite(o.limit) && (!s || o.purpose === undefined || o.purpose === d.purpose)) {
    (d as Record<string, unknown>)[limitKey(d)] = o.limit;
  }
  return d;
}

/** Whether a result meets the purpose's limit (for checking mode and the sized build-up alike). */
export function meetsPurpose(d: Draft, r: CalcResult): boolean | null {
  const lim = limitValue(d);
  if (lim === null) return null;
  switch (d.purpose) {
    case 'personnel':
      return r.surfaceTemperatureC <= lim + 1e-9;
    case 'conservation': {
      const q = d.kind === 'pipe' ? r.heatLossWPerM : d.kind === 'wall' ? r.heatFluxWPerM2 : r.heatLossW;
      return q === undefined ? null : Math.abs(q) <= lim + 1e-9;
    }
    case 'condensation':
      if (r.dewPointC === undefined) return null;
      return r.surfaceTemperatureC >= r.dewPointC + lim - 1e-9;
    case 'holding':
      if (r.outletTemperatureC === undefined || d.processTemperatureC === null) return null;
      return Math.abs(d.processTemperatureC - r.outletTemperatureC) <= lim + 1e-9;
    case 'frost':
      if (r.hoursToZeroC === undefined || r.hoursToZeroC === null) return null;
      return r.hoursToZeroC >= lim - 1e-9;
  }
}
