/**
 * Quick sizing → a site's line list: the draft of a quick case, and what the person chose when saving it (the
 * site's tag, service, length, location, library stand-ins for custom entries), as the body of
 * `POST /sites/:siteId/lines` or `/vessels` (shapes of shared/schemas/lines, SI). Pure: no I/O, no clock.
 *
 * What a line list holds differs from a quick case: the site's design bases set the air, wind, humidity and
 * touch limit; its sizing settings set the thickness series; build-ups name library materials and finishes.
 * The mapping carries what the line list has a field for and says what stays behind.
 */
import { ValidationError, type AnySchema } from 'yup';

import { conductivityAt } from '../../shared/calc/conduction';
import type { Purpose } from '../../shared/calc/sizing/types';
import { ITEM_LIMITS, lineCreateSchema, vesselCreateSchema, type LineCreateInput, type VesselCreateInput } from '../../shared/schemas/lines';

import { finishById, finishes, materialById, materials, pipeSizeByOuterDiameter, type FinishOption, type MaterialOption } from './library';
import { isColdService, purposeAvailable, type Draft, type LayerDraft, type PurposeId } from './quick-case';

/** Quick sizing's purposes as the line list names them (the trade terms of {@link PURPOSE_TRADE_TERMS}). */
export const LINE_LIST_PURPOSE: Record<PurposeId, Purpose> = {
  personnel: 'personnelProtection',
  conservation: 'heatConservation',
  condensation: 'condensationControl',
  holding: 'temperatureHolding',
  frost: 'frostProtection',
};

/** Team materials and finishes are named `team-material-<id>` / `team-finish-<id>` by the API. */
const TEAM_MATERIAL = /^team-material-\d+$/;
const TEAM_FINISH = /^team-finish-\d+$/;

/** What the person gives when saving, beyond the quick case (SI). */
export interface SaveChoices {
  tag: string;
  service?: string;
  /**
   * A line's length [m]. Not asked for process temperature holding: the run's length is the line's (the drop
   * is worked out over it). Vessels take the shell length of the case.
   */
  lengthM?: number | null;
  /** Asked only when the case has wind; a case in still air is indoor. */
  location?: 'indoor' | 'outdoor' | null;
  /** Stand-ins for custom layers, by layer index: a built-in or team material id. */
  materialFor?: Record<number, string | undefined>;
  /** Stand-in for a custom finish: a built-in or team finish id. */
  finishFor?: string | null;
  notes?: string;
}

/** Why a draft cannot be saved as it is; `field` names the choice (or the case's field) it is about. */
export interface SaveProblem {
  field: string;
  code: string;
  message: string;
}

/** Inputs of the quick case the line list has no field for; the site's own data applies instead. */
export type LeftBehind =
  /** Air, radiant surroundings, wind and humidity: the site's design bases apply. */
  | { code: 'conditions' }
  /** The highest surface temperature typed: the site's touch basis (and the finish's burn threshold) sets it. */
  | { code: 'touchLimit'; valueSI: number | null }
  /** The margin above the dew point: the site's condensation basis sets it. */
  | { code: 'condensationMargin'; valueSI: number | null }
  /** The surface touched and the contact time: the finish's surface group and the touch basis set them. */
  | { code: 'contact' }
  /** The thickness series: the site's sizing settings set it. */
  | { code: 'series' }
  /** Hours, prices, efficiency and CO₂ factors: the site's energy basis sets them. */
  | { code: 'energy' }
  /** Heat conservation without a limit: the site's rule (a share of the bare heat loss) applies. */
  | { code: 'heatLimitRule' }
  /** Personnel protection on cold service: the line list does not size it (cold contact is a caution). */
  | { code: 'coldPersonnel' };

export interface SaveMapping {
  /** The line-list kind the case becomes (null for a wall, which is none). */
  itemKind: 'line' | 'vessel' | null;
  /** The create body; null while any problem stands. */
  body: LineCreateInput | VesselCreateInput | null;
  /** The body as far as it is built, problems or not: what would be saved, for showing before it can be. */
  proposed: Partial<LineCreateInput & VesselCreateInput>;
  problems: SaveProblem[];
  purpose: Purpose;
  /** The build-up is saved as existing insulation (checked), not sized: the case was a check. */
  fixed: boolean;
  leftBehind: LeftBehind[];
}

/** Whether a case of this shape can go to a line list, and if not why (walls are not line-list items). */
export function saveableKind(kind: Draft['kind']): { itemKind: 'line' | 'vessel' } | { itemKind: null; reason: string } {
  if (kind === 'pipe') return { itemKind: 'line' };
  if (kind === 'vessel') return { itemKind: 'vessel' };
  return {
    itemKind: null,
    reason: 'A wall or flat surface is not a line-list item: a site’s line list holds lines (pipes) and vessels. Copy the page link to keep this case.',
  };
}

const present = (n: number | null | undefined): n is number => n !== null && n !== undefined && Number.isFinite(n);

/** The first message per path of a shared schema (the one the server runs). */
function schemaProblems(schema: AnySchema, body: unknown): SaveProblem[] {
  try {
    schema.validateSync(body, { abortEarly: false });
    return [];
  } catch (e) {
    if (!(e instanceof ValidationError)) throw e;
    const seen = new Set<string>();
    const out: SaveProblem[] = [];
    for (const item of e.inner.length > 0 ? e.inner : [e]) {
      const field = item.path ?? '';
      if (seen.has(field)) continue;
      seen.add(field);
      out.push({ field, code: 'VALIDATION_FAILED', message: item.message });
    }
    return out;
  }
}

/**
 * A material a line list can hold for layer i of the draft: its own library id, or the stand-in chosen for a
 * custom k(T).
 */
function layerMaterial(l: LayerDraft, i: number, choices: SaveChoices, problems: SaveProblem[]): string {
  if (l.materialId !== 'custom' && materialById(l.materialId)) return l.materialId;
  const chosen = choices.materialFor?.[i];
  if (chosen && (materialById(chosen) || TEAM_MATERIAL.test(chosen))) return chosen;
  problems.push({
    field: `layers[${i}].materialId`,
    code: 'CUSTOM_MATERIAL',
    message: `Layer ${i + 1} has a custom k(T): a line list holds library and team materials only. Choose the nearest library material or a team material.`,
  });
  return '';
}

function finishOf(d: Draft, choices: SaveChoices, problems: SaveProblem[]): string {
  if (d.finishId !== 'custom' && finishById(d.finishId)) return d.finishId;
  const chosen = choices.finishFor;
  if (chosen && (finishById(chosen) || TEAM_FINISH.test(chosen))) return chosen;
  problems.push({
    field: 'finishId',
    code: 'CUSTOM_FINISH',
    message: 'The finish has a custom emissivity: a line list holds library and team finishes only. Choose the nearest library finish or a team finish.',
  });
  return '';
}

/**
 * The create body of a line or vessel for a quick case.
 *
 * - Geometry as the form had it: NPS, DN or outside diameter (and the vertical run) for a pipe; diameter, shell
 *   length, axis and heads for a vessel. A wall is refused.
 * - Operating temperature: the process temperature.
 * - Purpose: the line list's name for it, with the limit where the line list has a field for one (heat-loss
 *   limit per metre or per vessel; flow, specific heat and largest drop for holding; hours, bore and pipe mass
 *   for frost protection).
 * - Build-up: the layers' library materials and the finish; sizing mode sizes the outer layer (inner layers keep
 *   their thickness), checking mode saves the whole build-up as existing insulation. A custom material or
 *   finish is refused unless a library or team stand-in is chosen.
 * - Location: indoor when the case has no wind, else as chosen.
 *
 * @param d - the quick-sizing draft (SI)
 * @param choices - tag, service, length, location and stand-ins chosen when saving (SI)
 * @returns the body (null while any problem stands), the problems by field, and what stays behind
 */
export function saveToSiteBody(d: Draft, choices: SaveChoices): SaveMapping {
  const purpose = LINE_LIST_PURPOSE[d.purpose];
  const problems: SaveProblem[] = [];
  const kind = saveableKind(d.kind);
  const fixed = d.mode === 'check';
  const leftBehind: LeftBehind[] = [{ code: 'conditions' }];
  if (kind.itemKind === null) {
    return { itemKind: null, body: null, proposed: {}, problems: [{ field: 'kind', code: 'NOT_A_LINE_LIST_ITEM', message: kind.reason }], purpose, fixed, leftBehind };
  }
  const itemKind = kind.itemKind;
  if (!purposeAvailable(d.purpose, d.kind)) {
    problems.push({
      field: 'purpose',
      code: 'PURPOSE_LINES_ONLY',
      message: 'Process temperature holding and frost protection are worked out along a pipe: a vessel cannot carry them. Choose another purpose first.',
    });
  }

  const body: Record<string, unknown> = { tag: choices.tag.trim() };
  const service = choices.service?.trim();
  if (service) body.service = service;

  if (itemKind === 'line') {
    const od = d.pipeOuterDiameterM;
    const size = present(od) ? pipeSizeByOuterDiameter(od) : undefined;
    if (d.pipeSizeBy === 'nps' && size) body.nps = size.nps;
    else if (d.pipeSizeBy === 'dn' && size) body.dn = size.dn;
    else if (present(od)) body.outerDiameterM = od;
    else problems.push({ field: 'pipeOuterDiameterM', code: 'REQUIRED', message: 'Give the pipe size in the case first.' });
    body.orientation = d.pipeOrientation;
    if (d.pipeOrientation === 'vertical' && present(d.pipeHeightM)) body.heightM = d.pipeHeightM;
    const lengthM = d.purpose === 'holding' ? d.runLengthM : choices.lengthM;
    if (present(lengthM)) body.lengthM = lengthM;
    else if (d.purpose === 'holding') problems.push({ field: 'runLengthM', code: 'REQUIRED', message: 'Give the length of the run in the case first.' });
    else problems.push({ field: 'lengthM', code: 'REQUIRED', message: 'Give the line’s length: the whole line’s heat loss and yearly energy rest on it.' });
  } else {
    if (present(d.vesselDiameterM)) body.diameterM = d.vesselDiameterM;
    if (present(d.vesselLengthM)) body.lengthM = d.vesselLengthM;
    body.orientation = d.vesselOrientation;
    body.headType = d.headType;
  }
  if (present(d.processTemperatureC)) body.operatingTemperatureC = d.processTemperatureC;

  const still = !present(d.windSpeedMS) || d.windSpeedMS === 0;
  if (still) body.location = 'indoor';
  else if (choices.location) body.location = choices.location;
  else problems.push({ field: 'location', code: 'REQUIRED', message: 'The case has wind: say whether the item is outdoors (the site’s wind applies) or indoors (still air).' });

  body.purposes = [purpose];
  const params: Record<string, Record<string, number>> = {};
  switch (d.purpose) {
    case 'personnel':
      leftBehind.push({ code: 'touchLimit', valueSI: d.maxSurfaceC }, { code: 'contact' });
      if (isColdService(d)) leftBehind.push({ code: 'coldPersonnel' });
      break;
    case 'conservation': {
      const limit = itemKind === 'line' ? d.maxHeatLossWPerM : d.maxHeatLossW;
      if (present(limit)) params.heatConservation = itemKind === 'line' ? { maxHeatLossWPerM: limit } : { maxHeatLossW: limit };
      else leftBehind.push({ code: 'heatLimitRule' });
      break;
    }
    case 'condensation':
      leftBehind.push({ code: 'condensationMargin', valueSI: d.condensationMarginK });
      break;
    case 'holding':
      if (itemKind === 'line') {
        params.temperatureHolding = {
          ...(present(d.massFlowKgPerS) ? { massFlowKgPerS: d.massFlowKgPerS } : {}),
          ...(present(d.specificHeatJPerKgK) ? { specificHeatJPerKgK: d.specificHeatJPerKgK } : {}),
          ...(present(d.maxChangeK) ? { maxChangeK: d.maxChangeK } : {}),
        };
      }
      break;
    case 'frost':
      if (itemKind === 'line') {
        params.frostProtection = {
          ...(present(d.minHours) ? { minHours: d.minHours } : {}),
          ...(present(d.innerDiameterM) ? { innerDiameterM: d.innerDiameterM } : {}),
          ...(present(d.pipeMassKgPerM) ? { pipeMassKgPerM: d.pipeMassKgPerM } : {}),
        };
      }
      break;
  }
  if (Object.keys(params).length > 0) body.purposeParameters = params;
  leftBehind.push({ code: 'series' }, { code: 'energy' });

  // The outer layer is the one sized; a check takes the build-up as it is.
  const sizedIndex = fixed ? -1 : d.layers.length - 1;
  const layers = d.layers.map((l, i) => {
    const materialId = layerMaterial(l, i, choices, problems);
    if (i === sizedIndex) return { materialId };
    if (!present(l.thicknessM)) {
      problems.push({ field: `layers[${i}].thicknessM`, code: 'REQUIRED', message: `Give the thickness of layer ${i + 1} in the case first.` });
      return { materialId };
    }
    return { materialId, thicknessM: l.thicknessM };
  });
  if (layers.length > ITEM_LIMITS.buildUpLayersMax) {
    problems.push({ field: 'layers', code: 'TOO_MANY_LAYERS', message: `A line list holds at most ${ITEM_LIMITS.buildUpLayersMax} layers.` });
  }
  body.buildUp = { layers, finishId: finishOf(d, choices, problems), ...(fixed ? { fixed: true } : {}) };
  if (choices.notes) body.notes = choices.notes.slice(0, ITEM_LIMITS.notesMax);

  const schema: AnySchema = itemKind === 'line' ? lineCreateSchema : vesselCreateSchema;
  const seen = new Set(problems.map((p) => p.field));
  for (const p of schemaProblems(schema, body)) {
    // A build-up entry already refused above says why in its own words.
    if (p.field.startsWith('buildUp.') && [...seen].some((f) => f.startsWith('layers') || f === 'finishId')) continue;
    if (p.field.startsWith('purposes') && seen.has('purpose')) continue;
    if (!seen.has(p.field)) problems.push(p);
  }
  return {
    itemKind,
    body: problems.length === 0 ? (body as LineCreateInput | VesselCreateInput) : null,
    proposed: body as Partial<LineCreateInput & VesselCreateInput>,
    problems,
    purpose,
    fixed,
    leftBehind,
  };
}

/**
 * Where a field of the create body (as the server or the schema names it) is shown when saving: the choices the
 * person makes there, or `case` for a field that comes from the quick case itself.
 */
export function saveFieldOf(path: string): 'tag' | 'service' | 'length' | 'location' | 'finish' | `material-${number}` | 'case' {
  if (path === 'tag' || path === 'service' || path === 'location') return path;
  if (path === 'lengthM') return 'length';
  if (path === 'finishId' || path === 'buildUp.finishId') return 'finish';
  const layer = /^(?:buildUp\.)?layers\[(\d+)\]\.materialId$/.exec(path);
  if (layer) return `material-${Number(layer[1])}`;
  return 'case';
}

/** Relative difference of two conductivity curves at a temperature. */
function kGap(a: readonly number[], b: readonly number[], atC: number): number {
  const ka = conductivityAt(a, atC);
  const kb = conductivityAt(b, atC);
  return Math.abs(ka - kb) / Math.max(Math.abs(kb), 1e-9);
}

/**
 * The library material nearest a custom layer: the smallest relative difference in k at the layer's mean
 * temperature (half way between process and air), among materials rated for the process temperature when there
 * are any.
 *
 * @param layer - the custom layer (its k(T) coefficients; null when a coefficient is missing)
 * @param d - the draft, for the process and air temperatures [°C]
 * @returns the nearest built-in material, or undefined when the layer's curve is incomplete
 */
export function nearestLibraryMaterial(layer: Pick<LayerDraft, 'conductivity'>, d: Pick<Draft, 'processTemperatureC' | 'airTemperatureC'>): MaterialOption | undefined {
  if (!layer.conductivity.every(present)) return undefined;
  const k = layer.conductivity as number[];
  const process = d.processTemperatureC ?? 20;
  const meanC = (process + (d.airTemperatureC ?? process)) / 2;
  const rated = materials.filter((m) => (m.maxServiceTemperatureC ?? Infinity) >= process && (m.minServiceTemperatureC ?? -Infinity) <= process);
  const pool = rated.length > 0 ? rated : materials;
  let best: MaterialOption | undefined;
  let gap = Infinity;
  for (const m of pool) {
    const g = kGap(m.conductivity, k, meanC);
    if (g < gap) {
      gap = g;
      best = m;
    }
  }
  return best;
}

/** The library finish whose typical emissivity is nearest a custom one. */
export function nearestLibraryFinish(emissivity: number | null): FinishOption | undefined {
  if (!present(emissivity)) return undefined;
  let best: FinishOption | undefined;
  for (const f of finishes) if (!best || Math.abs(f.emissivity - emissivity) < Math.abs(best.emissivity - emissivity)) best = f;
  return best;
}
