/**
 * The item page's live view of an item's sizing: the exact cases of each purpose (from the same
 * `planItemSizing` the server's job runs), evaluated in the browser for the charts, so a curve and the
 * stored thickness never have two sources.
 */
import { BARE_SURFACE_EMISSIVITY, SizingInputError, planItemSizing, type SizingPlan } from '../../../shared/calc/sizing/size-item';
import { toSizingSettings } from '../../../shared/calc/sizing/settings';
import type { SizingBases, SizingContext, SizingTask } from '../../../shared/calc/sizing/types';
import type { CalcCase, Criterion } from '../../../shared/calc/types';
import { sizingLibraryOf } from '../../api/library';
import type { DesignBases, ItemKind, LibraryPayload, Line, Purpose, SizingSettingsPayload, Vessel } from '../../api/types';
import { evaluateCase, type LiveOutput } from '../../calc/live';
import { draftFromCase, type Draft, type EnergyAssumptions, type PurposeId } from '../../calc/quick-case';
import { runCase } from '../../calc/run-case';

/** The quick-sizing purpose that draws the same charts. */
export const QUICK_PURPOSE: Record<Purpose, PurposeId> = {
  personnelProtection: 'personnel',
  heatConservation: 'conservation',
  condensationControl: 'condensation',
  temperatureHolding: 'holding',
  frostProtection: 'frost',
};

/** What sizing sees of a line or vessel (tag, service and notes never change a number). */
export function taskOfItem(item: Line | Vessel, kind: ItemKind): SizingTask {
  const line = kind === 'line' ? (item as Line) : null;
  return {
    item: {
      kind,
      outerDiameterM: line ? line.outerDiameterM : (item as Vessel).diameterM,
      nps: line ? line.nps : null,
      lengthM: item.lengthM,
      orientation: item.orientation,
      heightM: line ? line.heightM : null,
      headType: line ? null : (item as Vessel).headType,
      location: item.location,
      operatingTemperatureC: item.operatingTemperatureC,
      purposes: item.purposes,
      purposeParameters: item.purposeParameters ?? {},
      fittings: line ? line.fittings : { valves: 0, flanges: 0, elbows: 0, tees: 0 },
      fittingsInsulated: line ? line.fittingsInsulated : true,
    },
    buildUp: item.buildUp,
  };
}

/** A site's bases, settings and the team's library as sizing uses them. */
export function contextOf(designBases: DesignBases, settings: SizingSettingsPayload, library: LibraryPayload): SizingContext {
  return { bases: designBases as SizingBases, settings: toSizingSettings(settings), library: sizingLibraryOf(library) };
}

/** The site's energy basis as the annual-figures assumptions of the quick-sizing adapter. */
export function energyAssumptionsOf(energy: DesignBases['energy']): EnergyAssumptions | null {
  if (!energy) return null;
  return {
    seriesId: 'metric',
    operatingHoursPerYear: energy.operatingHoursPerYear ?? null,
    pricePerKWh: energy.energyPricePerKWh ?? null,
    currency: energy.currency ?? 'EUR',
    efficiency: energy.heatSourceEfficiency ?? null,
    co2KgPerKWh: energy.co2KgPerKWh ?? null,
    co2Basis: energy.co2Basis ?? '',
    coolingCop: energy.coolingCop ?? null,
    electricityPricePerKWh: energy.electricityPricePerKWh ?? null,
    electricityCo2KgPerKWh: energy.electricityCo2KgPerKWh ?? null,
    electricityCo2Basis: energy.electricityCo2Basis ?? '',
  };
}

export type PurposeView = {
  purpose: Purpose;
  /** The quick-sizing draft the charts read their labels and limit from. */
  draft: Draft;
  output: Exclude<LiveOutput, { kind: 'invalid' }>;
};

export type ItemAnalysis = { kind: 'ok'; plan: SizingPlan; views: PurposeView[] } | { kind: 'error'; field: string; message: string };

type Planned = SizingPlan['purposes'][number];

const heatFlowOf = (r: { heatLossWPerM?: number; heatLossW?: number }) => (r.heatLossWPerM ?? r.heatLossW) as number;

/** The limit a criterion sets, in the draft's terms (SI). */
function limitOf(c: Criterion): number | undefined {
  switch (c.criterion) {
    case 'surfaceTemperature':
      return c.maxC;
    case 'heatLoss':
      return c.maxWPerM ?? c.maxW ?? c.maxWPerM2;
    case 'condensation':
      return c.marginK;
    case 'temperatureChange':
      return c.maxChangeK;
    case 'freezeTime':
      return c.minHours;
  }
}

/**
 * A purpose's case with its limit resolved: heat conservation by the site's rule is a share of the bare
 * item's heat flow, as the job works it out.
 */
function resolvedCase(p: Planned, plan: SizingPlan): { case: CalcCase; check?: Criterion } | null {
  if (!p.case) return null;
  let c = p.case;
  let check = p.check;
  if (p.fractionOfBare !== undefined) {
    if (!plan.bareAmbient) return null;
    const bare = runCase({ geometry: plan.geometry, processTemperatureC: plan.processTemperatureC, layers: [], surfaceEmissivity: BARE_SURFACE_EMISSIVITY, ambient: plan.bareAmbient });
    if ('error' in bare) return null;
    const limit = Math.abs(heatFlowOf(bare)) * p.fractionOfBare;
    const key = plan.kind === 'line' ? 'maxWPerM' : 'maxW';
    if (c.solveFor) c = { ...c, solveFor: { criterion: 'heatLoss', [key]: limit, maxThicknessM: c.solveFor.maxThicknessM } as Criterion };
    if (check) check = { criterion: 'heatLoss', [key]: limit } as Criterion;
  }
  return { case: c, check };
}

/** Plans the item against its site and evaluates each purpose that has a case, for the charts. */
export function analyseItem(task: SizingTask, ctx: SizingContext): ItemAnalysis {
  let plan: SizingPlan;
  try {
    plan = planItemSizing(task, ctx);
  } catch (e) {
    if (e instanceof SizingInputError) return { kind: 'error', field: e.field, message: e.message };
    throw e;
  }
  const views: PurposeView[] = [];
  for (const p of plan.purposes) {
    const r = resolvedCase(p, plan);
    if (!r) continue;
    const purpose = QUICK_PURPOSE[p.purpose];
    const limit = r.check ? limitOf(r.check) : undefined;
    const draft = draftFromCase(r.case, { purpose, mode: r.case.solveFor ? 'size' : 'check', ...(limit !== undefined ? { limit } : {}) });
    views.push({ purpose: p.purpose, draft, output: evaluateCase(r.case, plan.round.seriesM, null) });
  }
  return { kind: 'ok', plan, views };
}
