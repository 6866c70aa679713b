/**
 * Whole-item sizing: an item of a site (line or vessel), its purposes and build-up, and the site's design
 * bases → one calculation case per purpose against the matching basis → the thickest governs → the governing
 * build-up evaluated for heat loss (energy basis) and surface temperature (touch basis for hot service,
 * condensation basis for cold).
 *
 * The work is split in two: {@link planItemSizing} turns the inputs into the exact cases and parameters the
 * numbers depend on (no physics, cheap), and {@link sizeItem} runs them. The fingerprint of the plan
 * ({@link sizingInputHash}) is what makes a stored result stale: it changes exactly when an input that changes
 * a number changes (a tag, a service name or a note never does).
 *
 * Conventions (common practice, stated here once):
 * - Hot service is an operating temperature at or above the energy basis's air temperature; cold below it.
 * - Indoor items see no wind and surroundings at the air temperature; outdoor items the basis's wind.
 * - Personnel protection: still air unless the touch basis says otherwise, the finish's lowest credible
 *   emissivity (a bright jacket runs hotter), the limit the lower of the site's touch limit and the burn
 *   threshold for the finish's surface group and the contact time (ISO 13732-1; ASTM C1055 5 s by default).
 * - Condensation control: still air and the finish's lowest credible emissivity (a bright cold jacket runs
 *   colder). Heat conservation and the annual figures: the energy basis and the finish's typical emissivity.
 * - Process temperature holding and frost protection: the winter basis.
 * - A bare item (for the saving against bare) has an oxidised carbon-steel surface.
 */

import { COLD_CONTACT_WARNING_C, touchSafetyVerdict } from '../burn';
import { DEFAULT_MAX_THICKNESS_M } from '../analyse';
import { lineHeatFlowW } from '../energy';
import { pipeInnerDiameterM, pipeMassPerMetreKg, pipeSizeByNps } from '../pipe-sizes';
import { runCase } from '../run-case';
import { dewPointC } from '../dew-point';
import type { Ambient, CalcCase, CalcResult, Criterion, Geometry, Layer, Warning } from '../types';
import { canonicalJson, fingerprint } from './hash';
import {
  PIPE_ONLY_PURPOSES,
  PURPOSES,
  type BasisEvaluation,
  type BasisName,
  type BuildUp,
  type ItemSizing,
  type Purpose,
  type PurposeOutcome,
  type SizingContext,
  type SizingFinish,
  type SizingItem,
  type SizingMaterial,
  type SizingTask,
} from './types';

/** Bumped whenever the rules below change a number, so every stored result becomes stale. */
export const SIZING_RULES_VERSION = 1;

/** Surface of a bare item for the saving against bare: oxidised carbon steel, ε = 0.8 (typical, built-in finish). */
export const BARE_SURFACE_EMISSIVITY = 0.8;

/** Default margin above the dew point when the condensation basis gives none [K] (common practice). */
const DEFAULT_MARGIN_K = 1;

type PlannedPurpose = {
  purpose: Purpose;
  basis: BasisName;
  target: string;
  /** The case to run; absent when the outcome is known without physics. */
  case?: CalcCase;
  /** Heat conservation by the site's rule: the limit is this fraction of the bare heat flow. */
  fractionOfBare?: number;
  /** Check of a fixed build-up: what must hold. */
  check?: Criterion;
  outcome?: Omit<PurposeOutcome, 'purpose' | 'basis' | 'target'>;
};

type PlannedEvaluation = { basis: BasisName; ambient: Ambient; emissivity: number };

/** The exact inputs of one item's sizing. */
export type SizingPlan = {
  version: number;
  kind: SizingItem['kind'];
  service: 'hot' | 'cold';
  buildUpSource: 'item' | 'siteDefault';
  fixed: boolean;
  finishId: string;
  geometry: Geometry;
  processTemperatureC: number;
  /** Layers kept as given (all of a fixed build-up; the inner ones otherwise). */
  fixedLayers: { materialId: string; layer: Layer }[];
  /** The sized layer's material (absent for a fixed build-up). */
  sized?: { materialId: string; layer: Omit<Layer, 'thicknessM'> };
  round: { seriesM: number[]; maxSingleLayerM: number };
  maxThicknessM: number;
  purposes: PlannedPurpose[];
  evaluations: PlannedEvaluation[];
  /** Ambient of the bare item at the energy basis. */
  bareAmbient?: Ambient;
  burnLimit?: { limitC: number; maxPassingC: number; source: string };
  line?: { lengthM: number; valves: number; flanges: number; fittings: number; insulated: boolean };
  operatingHoursPerYear: number | null;
  warnings: Warning[];
};

/** Invalid inputs to item sizing (a missing material, a build-up without thicknesses). */
export class SizingInputError extends Error {
  constructor(
    readonly field: string,
    message: string,
    readonly code = 'INVALID_INPUT',
  ) {
    super(message);
    this.name = 'SizingInputError';
    Object.setPrototypeOf(this, SizingInputError.prototype);
  }
}

const fmt = (x: number, digits = 1) => (Math.round(x * 10 ** digits) / 10 ** digits).toString();

function layerOfMaterial(m: SizingMaterial, thicknessM: number): Layer {
  const layer: Layer = { thicknessM, conductivity: [...m.conductivity] };
  if (m.maxServiceTemperatureC !== undefined) layer.maxServiceTemperatureC = m.maxServiceTemperatureC;
  if (m.minServiceTemperatureC !== undefined) layer.minServiceTemperatureC = m.minServiceTemperatureC;
  if (m.conductivityDataRangeC) layer.conductivityDataRangeC = [m.conductivityDataRangeC[0], m.conductivityDataRangeC[1]];
  return layer;
}

function geometryOf(item: SizingItem): Geometry {
  if (item.kind === 'vessel') {
    return {
      type: 'vessel',
      diameterM: item.outerDiameterM,
      lengthM: item.lengthM,
      orientation: item.orientation,
      headType: item.headType ?? 'ellipsoidal2to1',
    };
  }
  if (item.orientation === 'vertical') {
    return { type: 'pipe', outerDiameterM: item.outerDiameterM, orientation: 'vertical', heightM: item.heightM ?? item.lengthM };
  }
  return { type: 'pipe', outerDiameterM: item.outerDiameterM, orientation: 'horizontal' };
}

function ambientOf(item: SizingItem, air: number, wind: number | undefined, radiant?: number, rh?: number): Ambient {
  const a: Ambient = { airTemperatureC: air, windSpeedMS: item.location === 'indoor' ? 0 : (wind ?? 0) };
  if (radiant !== undefined && item.location === 'outdoor') a.radiantTemperatureC = radiant;
  if (rh !== undefined) a.relativeHumidityPct = rh;
  return a;
}

/** The service is hot when the item runs at or above the annual-average air (the energy basis). */
export function serviceOf(item: Pick<SizingItem, 'operatingTemperatureC'>, ctx: Pick<SizingContext, 'bases'>): 'hot' | 'cold' {
  const reference = ctx.bases.energy?.airTemperatureC ?? ctx.bases.touch?.airTemperatureC ?? 20;
  return item.operatingTemperatureC >= reference ? 'hot' : 'cold';
}

function missing(basis: BasisName, what: string): Omit<PurposeOutcome, 'purpose' | 'basis' | 'target'> {
  return {
    status: 'error',
    error: { code: 'BASIS_MISSING', field: `designBases.${basis}`, message: `Set the site's ${what} basis to size for this purpose.` },
    message: `The site has no ${what} basis.`,
  };
}

function paramMissing(purpose: Purpose, message: string): Omit<PurposeOutcome, 'purpose' | 'basis' | 'target'> {
  return { status: 'error', error: { code: 'PARAMETER_MISSING', field: `purposeParameters.${purpose}`, message }, message };
}

/**
 * Turns an item and its site into the exact cases of its sizing (no physics).
 *
 * @param task - the item and its own build-up (null: the site's default for its service)
 * @param ctx - the site's design bases, series and defaults, and the library
 * @returns the plan; throws {@link SizingInputError} naming the field for a material or finish the library
 *   lacks and for a build-up whose inner layers have no thickness
 */
export function planItemSizing(task: SizingTask, ctx: SizingContext): SizingPlan {
  const { item } = task;
  const { bases, settings, library } = ctx;
  const service = serviceOf(item, ctx);
  const buildUp: BuildUp = task.buildUp ?? settings.defaultBuildUps[service];
  const field = task.buildUp ? 'buildUp' : `sizingSettings.defaultBuildUps.${service}`;
  const finish: SizingFinish | undefined = library.finishes.find((f) => f.id === buildUp.finishId);
  if (!finish) throw new SizingInputError(`${field}.finishId`, `There is no finish "${buildUp.finishId}" in the library.`, 'UNKNOWN_FINISH');
  const material = (id: string, i: number) => {
    const m = library.materials.find((x) => x.id === id);
    if (!m) throw new SizingInputError(`${field}.layers[${i}].materialId`, `There is no material "${id}" in the library.`, 'UNKNOWN_MATERIAL');
    return m;
  };
  const fixed = !!buildUp.fixed;
  if (!fixed && buildUp.layers.length === 0) {
    throw new SizingInputError(`${field}.layers`, 'A build-up to size needs at least one layer (the outermost is sized).', 'REQUIRED');
  }
  const given = fixed ? buildUp.layers : buildUp.layers.slice(0, -1);
  const fixedLayers = given.map((l, i) => {
    if (l.thicknessM === undefined || !(l.thicknessM > 0)) {
      throw new SizingInputError(`${field}.layers[${i}].thicknessM`, `Layer ${i + 1} needs its thickness (only the outermost layer is sized).`, 'REQUIRED');
    }
    return { materialId: l.materialId, layer: layerOfMaterial(material(l.materialId, i), l.thicknessM) };
  });
  let sized: SizingPlan['sized'];
  if (!fixed) {
    const last = buildUp.layers[buildUp.layers.length - 1];
    const { thicknessM: _ignored, ...layer } = layerOfMaterial(material(last.materialId, buildUp.layers.length - 1), 0);
    sized = { materialId: last.materialId, layer };
  }

  const geometry = geometryOf(item);
  const round = { seriesM: [...settings.seriesM], maxSingleLayerM: settings.maxSingleLayerM };
  const maxThicknessM = settings.maxThicknessM || DEFAULT_MAX_THICKNESS_M;
  const warnings: Warning[] = [];
  const base = (ambient: Ambient, emissivity: number): CalcCase => ({
    geometry,
    processTemperatureC: item.operatingTemperatureC,
    layers: [...fixedLayers.map((l) => l.layer), ...(sized ? [{ ...sized.layer, thicknessM: 0 }] : [])],
    surfaceEmissivity: emissivity,
    ambient,
  });
  const withCriterion = (c: CalcCase, crit: Criterion, extra: Partial<CalcCase> = {}): { case: CalcCase; check?: Criterion } =>
    fixed ? { case: { ...c, ...extra }, check: crit } : { case: { ...c, ...extra, solveFor: { ...crit, maxThicknessM }, round } };

  let burnLimit: SizingPlan['burnLimit'];
  const touch = bases.touch;
  if (touch && service === 'hot') {
    // The one governing limit of touch safety, the same rule quick sizing and the register use; sizing aims
    // for the highest surface that still passes as shown.
    const v = touchSafetyVerdict({
      surfaceTemperatureC: touch.airTemperatureC,
      airTemperatureC: touch.airTemperatureC,
      limitC: touch.maxSurfaceC,
      limitSource: "the site's touch limit",
      contact: { material: finish.contactMaterial, seconds: touch.contactSeconds },
    });
    burnLimit = { limitC: v.limitC, maxPassingC: v.maxPassingSurfaceC ?? v.limitC, source: v.source };
  }
  const touchAmbient = touch ? ambientOf(item, touch.airTemperatureC, touch.windSpeedMS ?? 0, touch.radiantTemperatureC) : undefined;
  const touchEmissivity = touch?.surfaceEmissivity ?? finish.emissivityRange[0];
  const energy = bases.energy;
  const energyAmbient = energy ? ambientOf(item, energy.airTemperatureC, energy.windSpeedMS) : undefined;
  const cond = bases.condensation;
  const condAmbient = cond ? ambientOf(item, cond.airTemperatureC, 0, undefined, cond.relativeHumidityPct) : undefined;
  const winter = bases.winter;
  const winterAmbient = winter ? ambientOf(item, winter.airTemperatureC, winter.windSpeedMS) : undefined;

  const purposes: PlannedPurpose[] = [];
  for (const purpose of PURPOSES) {
    if (!item.purposes.includes(purpose)) continue;
    if (item.kind === 'vessel' && PIPE_ONLY_PURPOSES.includes(purpose)) {
      purposes.push({ purpose, basis: 'winter', target: 'lines only', outcome: { status: 'notApplicable', message: 'This purpose applies to lines only.' } });
      continue;
    }
    switch (purpose) {
      case 'personnelProtection': {
        if (!touch || !touchAmbient || (service === 'hot' && !burnLimit)) {
          purposes.push({ purpose, basis: 'touch', target: 'a touch-safe surface', outcome: missing('touch', 'touch-safety') });
        } else if (service === 'cold') {
          purposes.push({
            purpose,
            basis: 'touch',
            target: 'a touch-safe surface',
            outcome: { status: 'notApplicable', message: 'Cold service: hot-surface burn thresholds do not apply (see the cold-contact caution).' },
          });
        } else {
          const limit = burnLimit as NonNullable<SizingPlan['burnLimit']>;
          const target = `surface at most ${fmt(limit.maxPassingC)} °C`;
          if (item.operatingTemperatureC <= limit.maxPassingC) {
            purposes.push({ purpose, basis: 'touch', target, outcome: { status: fixed ? 'met' : 'sized', thicknessM: 0, totalThicknessM: 0, message: 'The operating temperature is within the touch limit.' } });
          } else {
            purposes.push({ purpose, basis: 'touch', target, ...withCriterion(base(touchAmbient, touchEmissivity), { criterion: 'surfaceTemperature', maxC: limit.maxPassingC }) });
          }
        }
        break;
      }
      case 'heatConservation': {
        if (!energy || !energyAmbient) {
          purposes.push({ purpose, basis: 'energy', target: 'a heat-loss limit', outcome: missing('energy', 'energy') });
          break;
        }
        const p = item.purposeParameters.heatConservation;
        const own = item.kind === 'vessel' ? p?.maxHeatLossW : p?.maxHeatLossWPerM;
        const unit = item.kind === 'vessel' ? 'W' : 'W/m';
        const key = item.kind === 'vessel' ? 'maxW' : 'maxWPerM';
        const c = base(energyAmbient, finish.emissivity);
        if (own !== undefined) {
          purposes.push({ purpose, basis: 'energy', target: `heat flow at most ${fmt(own, 3)} ${unit}`, ...withCriterion(c, { criterion: 'heatLoss', [key]: own }) });
        } else {
          const fraction = settings.heatConservationMaxFractionOfBare;
          purposes.push({
            purpose,
            basis: 'energy',
            target: `heat flow at most ${fmt(fraction * 100, 0)} % of the bare item's`,
            fractionOfBare: fraction,
            ...withCriterion(c, { criterion: 'heatLoss', [key]: 1 }),
          });
        }
        break;
      }
      case 'condensationControl': {
        if (!cond || !condAmbient) {
          purposes.push({ purpose, basis: 'condensation', target: 'a dry surface', outcome: missing('condensation', 'condensation') });
          break;
        }
        const marginK = cond.marginK ?? DEFAULT_MARGIN_K;
        const dew = dewPointC(cond.airTemperatureC, cond.relativeHumidityPct);
        const target = `surface at least ${fmt(marginK)} K above the dew point (${fmt(dew)} °C)`;
        if (item.operatingTemperatureC >= dew + marginK) {
          purposes.push({ purpose, basis: 'condensation', target, outcome: { status: fixed ? 'met' : 'sized', thicknessM: 0, totalThicknessM: 0, message: 'The operating temperature is above the dew point with its margin.' } });
        } else {
          purposes.push({ purpose, basis: 'condensation', target, ...withCriterion(base(condAmbient, finish.emissivityRange[0]), { criterion: 'condensation', marginK }) });
        }
        break;
      }
      case 'temperatureHolding': {
        const p = item.purposeParameters.temperatureHolding;
        if (!winter || !winterAmbient) {
          purposes.push({ purpose, basis: 'winter', target: 'a limited temperature change', outcome: missing('winter', 'winter') });
        } else if (!p) {
          purposes.push({ purpose, basis: 'winter', target: 'a limited temperature change', outcome: paramMissing(purpose, 'Give the flow, specific heat and largest temperature change for process temperature holding.') });
        } else {
          const run = { lengthM: item.lengthM, massFlowKgPerS: p.massFlowKgPerS, specificHeatJPerKgK: p.specificHeatJPerKgK };
          purposes.push({
            purpose,
            basis: 'winter',
            target: `temperature change over ${fmt(item.lengthM, 0)} m at most ${fmt(p.maxChangeK)} K`,
            ...withCriterion(base(winterAmbient, finish.emissivity), { criterion: 'temperatureChange', maxChangeK: p.maxChangeK }, { run }),
          });
        }
        break;
      }
      case 'frostProtection': {
        const p = item.purposeParameters.frostProtection;
        if (!winter || !winterAmbient) {
          purposes.push({ purpose, basis: 'winter', target: 'time before freezing', outcome: missing('winter', 'winter') });
          break;
        }
        if (!p) {
          purposes.push({ purpose, basis: 'winter', target: 'time before freezing', outcome: paramMissing(purpose, 'Give the minimum hours before standing water reaches 0 °C.') });
          break;
        }
        const target = `at least ${fmt(p.minHours)} h before standing water reaches 0 °C`;
        if (winter.airTemperatureC >= 0) {
          purposes.push({ purpose, basis: 'winter', target, outcome: { status: fixed ? 'met' : 'sized', thicknessM: 0, totalThicknessM: 0, message: 'The winter air is not below 0 °C: standing water does not freeze.' } });
          break;
        }
        let innerDiameterM = p.innerDiameterM;
        let pipeMassKgPerM = p.pipeMassKgPerM;
        if ((innerDiameterM === undefined || pipeMassKgPerM === undefined) && item.nps) {
          const size = pipeSizeByNps(item.nps);
          const inner = pipeInnerDiameterM(size, 'standard');
          if (inner !== null) {
            innerDiameterM ??= inner;
            pipeMassKgPerM ??= pipeMassPerMetreKg(item.outerDiameterM, (item.outerDiameterM - inner) / 2);
          }
        }
        if (innerDiameterM === undefined || pipeMassKgPerM === undefined) {
          purposes.push({ purpose, basis: 'winter', target, outcome: paramMissing(purpose, 'Give the bore and the pipe mass per metre (they default to the standard wall only for lines given by NPS or DN).') });
          break;
        }
        const start = p.startTemperatureC ?? item.operatingTemperatureC;
        purposes.push({
          purpose,
          basis: 'winter',
          target,
          ...withCriterion(
            { ...base(winterAmbient, finish.emissivity), processTemperatureC: start },
            { criterion: 'freezeTime', minHours: p.minHours },
            { stagnant: { innerDiameterM, pipeMassKgPerM } },
          ),
        });
        break;
      }
    }
  }

  const evaluations: PlannedEvaluation[] = [];
  if (energyAmbient) evaluations.push({ basis: 'energy', ambient: energyAmbient, emissivity: finish.emissivity });
  if (service === 'hot' && touchAmbient) evaluations.push({ basis: 'touch', ambient: touchAmbient, emissivity: touchEmissivity });
  if (service === 'cold' && condAmbient) evaluations.push({ basis: 'condensation', ambient: condAmbient, emissivity: finish.emissivityRange[0] });
  const coldContactC = COLD_CONTACT_WARNING_C[finish.contactMaterial];
  if (item.operatingTemperatureC < coldContactC) {
    warnings.push({
      code: 'COLD_CONTACT',
      message: `The service runs at ${fmt(item.operatingTemperatureC)} °C: a bare or damaged surface below about ${fmt(coldContactC)} °C can freeze skin on contact (cold-contact practice, ISO 13732-3).`,
    });
  }

  return {
    version: SIZING_RULES_VERSION,
    kind: item.kind,
    service,
    buildUpSource: task.buildUp ? 'item' : 'siteDefault',
    fixed,
    finishId: finish.id,
    geometry,
    processTemperatureC: item.operatingTemperatureC,
    fixedLayers,
    ...(sized ? { sized } : {}),
    round,
    maxThicknessM,
    purposes,
    evaluations,
    ...(energyAmbient ? { bareAmbient: energyAmbient } : {}),
    ...(burnLimit ? { burnLimit } : {}),
    ...(item.kind === 'line'
      ? {
          line: {
            lengthM: item.lengthM,
            valves: item.fittings.valves,
            flanges: item.fittings.flanges,
            fittings: item.fittings.elbows + item.fittings.tees,
            insulated: item.fittingsInsulated,
          },
        }
      : {}),
    operatingHoursPerYear: energy ? (energy.operatingHoursPerYear ?? null) : null,
    warnings,
  };
}

/** Fingerprint of a plan (see {@link sizingInputHash}). */
export const planFingerprint = (plan: SizingPlan): string => fingerprint(canonicalJson(plan));

/**
 * Fingerprint of everything an item's sizing depends on: equal fingerprints, equal numbers.
 *
 * @param task - the item and its build-up
 * @param ctx - the site's bases, settings and library
 * @returns 16 hex digits; for inputs that cannot be planned, the fingerprint of the error (so fixing it changes it)
 */
export function sizingInputHash(task: SizingTask, ctx: SizingContext): string {
  try {
    return planFingerprint(planItemSizing(task, ctx));
  } catch (e) {
    if (e instanceof SizingInputError) return fingerprint(canonicalJson({ version: SIZING_RULES_VERSION, error: e.field, message: e.message }));
    throw e;
  }
}

function heatFlowOf(r: CalcResult): number {
  return (r.heatLossWPerM ?? r.heatLossW ?? r.heatFluxWPerM2) as number;
}

function isError(r: ReturnType<typeof runCase>): r is { error: { code: string; field: string; message: string } } {
  return 'error' in r;
}

/** Does a result of a fixed build-up meet the criterion? */
function meets(check: Criterion, r: CalcResult, processC: number, heatLimit: number | undefined): boolean {
  switch (check.criterion) {
    case 'surfaceTemperature':
      return r.surfaceTemperatureC <= check.maxC + 1e-9;
    case 'heatLoss':
      return Math.abs(heatFlowOf(r)) <= (heatLimit as number) + 1e-9;
    case 'condensation':
      return Math.min(r.surfaceTemperatureC, ...(r.parts ?? []).map((p) => p.surfaceTemperatureC)) >= (r.dewPointC as number) + check.marginK - 1e-9;
    case 'temperatureChange':
      return Math.abs(processC - (r.outletTemperatureC as number)) <= check.maxChangeK + 1e-9;
    case 'freezeTime':
      return r.hoursToZeroC === null || (r.hoursToZeroC as number) >= check.minHours - 1e-9;
  }
}

function dedupe(ws: Warning[]): Warning[] {
  const seen = new Set<string>();
  return ws.filter((w) => {
    const k = `${w.code}|${w.message}`;
    if (seen.has(k)) return false;
    seen.add(k);
    return true;
  });
}

/**
 * Sizes one item: every purpose against its basis, the thickest governs, evaluated at the energy basis (heat
 * loss, annual energy, saving against bare) and at the touch or condensation basis (surface temperature, burn
 * verdict).
 *
 * @param task - the item and its own build-up (null: the site's default)
 * @param ctx - the site's bases, settings and library
 * @returns the outcome with every purpose's thickness, the governing purpose, and which purposes fail
 * @remarks A purpose fails when nothing up to the largest thickness meets it, when its basis or parameters are
 *   missing, or (fixed build-ups) when the build-up as given does not meet it. Throws {@link SizingInputError}
 *   for inputs that cannot be planned.
 */
export function sizeItem(task: SizingTask, ctx: SizingContext): ItemSizing {
  const plan = planItemSizing(task, ctx);
  const isLine = plan.kind === 'line';
  const warnings: Warning[] = [...plan.warnings];

  let bareHeatFlow: number | undefined;
  const bare = (): number | undefined => {
    if (bareHeatFlow !== undefined || !plan.bareAmbient) return bareHeatFlow;
    const r = runCase({ geometry: plan.geometry, processTemperatureC: plan.processTemperatureC, layers: [], surfaceEmissivity: BARE_SURFACE_EMISSIVITY, ambient: plan.bareAmbient });
    if (!isError(r)) bareHeatFlow = heatFlowOf(r);
    return bareHeatFlow;
  };

  const outcomes: PurposeOutcome[] = plan.purposes.map((p) => {
    const head = { purpose: p.purpose, basis: p.basis, target: p.target };
    if (p.outcome) return { ...head, ...p.outcome };
    let c = p.case as CalcCase;
    let heatLimit: number | undefined;
    if (p.fractionOfBare !== undefined || p.check?.criterion === 'heatLoss' || c.solveFor?.criterion === 'heatLoss') {
      const crit = (p.check ?? c.solveFor) as Extract<Criterion, { criterion: 'heatLoss' }>;
      heatLimit = p.fractionOfBare !== undefined ? (bare() ?? NaN) * p.fractionOfBare : (crit.maxWPerM ?? crit.maxW);
      if (!(Math.abs(heatLimit as number) > 0)) {
        return { ...head, status: 'error', message: 'The bare heat flow could not be worked out.', error: { code: 'CALCULATION_FAILED', field: 'heatConservation', message: 'The bare heat flow could not be worked out.' } };
      }
      heatLimit = Math.abs(heatLimit as number);
      if (p.fractionOfBare !== undefined) {
        const key = isLine ? 'maxWPerM' : 'maxW';
        if (c.solveFor) c = { ...c, solveFor: { ...c.solveFor, [key]: heatLimit } as CalcCase['solveFor'] };
      }
    }
    const r = runCase(c);
    if (isError(r)) {
      const impossible = r.error.code === 'TARGET_NOT_REACHABLE' || r.error.code === 'SERIES_TOO_THIN';
      return { ...head, status: impossible ? 'impossible' : 'error', message: r.error.message, error: r.error };
    }
    if (p.check) {
      const ok = meets(p.check, r, plan.processTemperatureC, heatLimit);
      return { ...head, status: ok ? 'met' : 'notMet', totalThicknessM: r.totalThicknessM, message: ok ? undefined : `The build-up as given misses: ${p.target}.` };
    }
    const fixedTotal = plan.fixedLayers.reduce((s, l) => s + l.layer.thicknessM, 0);
    const rounded = r.roundedLayersM ?? [];
    return { ...head, status: 'sized', thicknessM: r.thicknessM, roundedLayersM: rounded, totalThicknessM: fixedTotal + rounded.reduce((s, t) => s + t, 0) };
  });

  // The thickest sized purpose governs; ties go to the purpose listed first.
  let governing: PurposeOutcome | undefined;
  for (const o of outcomes) {
    if (o.status !== 'sized' && o.status !== 'met' && o.status !== 'notMet') continue;
    if (!governing || (o.totalThicknessM ?? 0) > (governing.totalThicknessM ?? 0) + 1e-12) governing = o;
  }

  const layers = plan.fixedLayers.map((l) => ({ materialId: l.materialId, thicknessM: l.layer.thicknessM, layer: l.layer }));
  if (plan.sized && governing?.roundedLayersM) {
    for (const t of governing.roundedLayersM) layers.push({ materialId: plan.sized.materialId, thicknessM: t, layer: { ...plan.sized.layer, thicknessM: t } });
  }
  const caseLayers = layers.map((l) => l.layer);

  const evaluations: BasisEvaluation[] = [];
  for (const e of plan.evaluations) {
    const r = runCase({ geometry: plan.geometry, processTemperatureC: plan.processTemperatureC, layers: caseLayers, surfaceEmissivity: e.emissivity, ambient: e.ambient });
    if (isError(r)) {
      warnings.push({ code: r.error.code, message: `${e.basis} basis: ${r.error.message}` });
      continue;
    }
    evaluations.push({
      basis: e.basis,
      heatFlow: heatFlowOf(r),
      surfaceTemperatureC: r.surfaceTemperatureC,
      interfaceTemperaturesC: r.interfaceTemperaturesC,
      ...(r.dewPointC !== undefined ? { dewPointC: r.dewPointC } : {}),
      warnings: r.warnings,
    });
    warnings.push(...r.warnings);
  }
  const at = (b: BasisName) => evaluations.find((e) => e.basis === b);
  const energyEval = at('energy');
  const surfaceEval = plan.service === 'hot' ? (at('touch') ?? energyEval) : (at('condensation') ?? energyEval);

  const out: ItemSizing = {
    service: plan.service,
    buildUpSource: plan.buildUpSource,
    purposes: outcomes,
    governingPurpose: governing?.purpose ?? null,
    layers: layers.map(({ materialId, thicknessM }) => ({ materialId, thicknessM })),
    layersM: layers.map((l) => l.thicknessM),
    totalThicknessM: layers.reduce((s, l) => s + l.thicknessM, 0),
    finishId: plan.finishId,
    surfaceTemperatureC: surfaceEval?.surfaceTemperatureC ?? null,
    surfaceBasis: surfaceEval?.basis ?? null,
    burnVerdict: 'notApplicable',
    annualEnergyKWh: null,
    bareAnnualEnergyKWh: null,
    failing: outcomes.filter((o) => o.status === 'impossible' || o.status === 'error' || o.status === 'notMet').map((o) => o.purpose),
    evaluations,
    warnings: dedupe(warnings),
  };
  const touchEval = at('touch');
  const touchBasis = ctx.bases.touch;
  if (plan.burnLimit && touchEval && touchBasis) {
    const finish = ctx.library.finishes.find((f) => f.id === plan.finishId) as SizingFinish;
    const v = touchSafetyVerdict({
      surfaceTemperatureC: touchEval.surfaceTemperatureC,
      airTemperatureC: touchBasis.airTemperatureC,
      limitC: touchBasis.maxSurfaceC,
      limitSource: "the site's touch limit",
      contact: { material: finish.contactMaterial, seconds: touchBasis.contactSeconds },
    });
    out.burnVerdict = v.verdict === 'fail' ? 'fail' : 'pass';
    out.burn = { limitC: v.limitC, source: v.source };
  }
  if (energyEval) {
    const bareFlow = bare();
    if (isLine) {
      const l = plan.line as NonNullable<SizingPlan['line']>;
      const counts = { valves: l.valves, flangePairs: l.flanges, fittings: l.fittings };
      out.heatLossWPerM = energyEval.heatFlow;
      out.heatLossW = lineHeatFlowW({ heatLossWPerM: energyEval.heatFlow, bareHeatLossWPerM: bareFlow ?? energyEval.heatFlow, lengthM: l.lengthM, counts, componentsInsulated: l.insulated }).totalW;
      if (bareFlow !== undefined) {
        out.bareHeatLossWPerM = bareFlow;
        out.bareHeatLossW = lineHeatFlowW({ heatLossWPerM: bareFlow, bareHeatLossWPerM: bareFlow, lengthM: l.lengthM, counts, componentsInsulated: false }).totalW;
      }
    } else {
      out.heatLossW = energyEval.heatFlow;
      if (bareFlow !== undefined) out.bareHeatLossW = bareFlow;
    }
    if (plan.operatingHoursPerYear !== null) {
      const h = plan.operatingHoursPerYear;
      out.annualEnergyKWh = (Math.abs(out.heatLossW as number) * h) / 1000;
      if (out.bareHeatLossW !== undefined) out.bareAnnualEnergyKWh = (Math.abs(out.bareHeatLossW) * h) / 1000;
    }
  }
  return out;
}
