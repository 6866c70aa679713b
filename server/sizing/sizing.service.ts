import Decimal from 'decimal.js';
import { annualCo2, chillerElectricityKWh, energyCost, fuelEnergyKWh } from '../../shared/calc/energy';
import type { SizedItem } from '../../shared/calc/sizing/batch';
import type { SizingContext, SizingTask } from '../../shared/calc/sizing/types';
import type { SizingSettingsInput } from '../../shared/schemas/lines';
import { insertAudit } from '../audit/audit.repository';
import type { Caller } from '../auth/auth.service';
import type { CalcPool } from '../calculations/calc-pool';
import { type Db, inTransaction } from '../db/db';
import { errors } from '../errors';
import type { JobControl } from '../jobs/job-runner';
import { findActiveJob, findJob, insertJob, type Job } from '../jobs/jobs.repository';
import { countSiteItems, listSiteItems, siteCounts, siteTotalsByService, upsertResults } from '../lines/items.repository';
import { visibleTo } from '../lines/items.service';
import { findSite } from '../sites/sites.repository';
import { loadSizingContext, refreshSiteInputHashes, storedSettingsOf, taskOf } from './sizing-context';
import { readSiteSizing, writeSiteSizingSettings } from './sizing.repository';

export const SITE_SIZING = 'siteSizing';

/** Items read, sized and stored per step of the job (one transaction each). */
const STEP_ITEMS = 500;
/** Items per worker task. */
const CHUNK_ITEMS = 50;

/** Sizes items in the pool's batch lane, in chunks that take turns with other batch work; results in order. */
async function sizeInPool(calc: CalcPool, ctx: SizingContext, tasks: SizingTask[], owner: string): Promise<SizedItem[]> {
  const chunks: SizingTask[][] = [];
  for (let i = 0; i < tasks.length; i += CHUNK_ITEMS) chunks.push(tasks.slice(i, i + CHUNK_ITEMS));
  const parts = await Promise.all(chunks.map((c) => calc.submit({ kind: 'sizeItems', ctx, tasks: c }, { lane: 'batch', owner })));
  return parts.flat();
}

async function siteOrNotFound(db: Db, caller: Caller, siteId: number) {
  const site = await findSite(db, caller.teamId, siteId, visibleTo(caller));
  if (!site) throw errors.notFound('The site');
  return site;
}

export function jobView(j: Job) {
  return {
    id: j.id,
    kind: j.kind,
    siteId: j.siteId,
    status: j.status,
    done: Math.min(j.done, j.total),
    total: j.total,
    error: j.error,
    createdAt: j.createdAt,
    startedAt: j.startedAt,
    finishedAt: j.finishedAt,
  };
}

/** Queues the sizing of a whole site (or hands back the one already queued or running). */
export async function startSiteSizing(deps: { db: Db }, caller: Caller, siteId: number, ip?: string) {
  return inTransaction(deps.db, async (trx) => {
    await siteOrNotFound(trx, caller, siteId);
    const active = await findActiveJob(trx, siteId, SITE_SIZING);
    if (active) return { job: jobView(active), created: false };
    const total = await countSiteItems(trx, siteId);
    const id = await insertJob(trx, { teamId: caller.teamId, siteId, kind: SITE_SIZING, params: {}, total, createdBy: caller.userId });
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'site.sizing_started', targetType: 'site', targetId: siteId, details: { jobId: id, items: total }, ip });
    return { job: jobView((await findJob(trx, caller.teamId, id)) as Job), created: true };
  });
}

export async function getJob(deps: { db: Db }, caller: Caller, id: number) {
  const job = await findJob(deps.db, caller.teamId, id);
  if (!job || (job.siteId !== null && !(await findSite(deps.db, caller.teamId, job.siteId, visibleTo(caller))))) throw errors.notFound('The job');
  return jobView(job);
}

/**
 * The job's work: the site's items in id order from the progress mark, STEP_ITEMS at a time, sized in the
 * worker pool and stored with the fingerprint of the inputs they came from, one transaction per step.
 */
export function siteSizingHandler(deps: { db: Db; calc: CalcPool }) {
  return async (job: Job, ctl: JobControl): Promise<void> => {
    const siteId = job.siteId as number;
    const ctx = await loadSizingContext(deps.db, job.teamId, siteId);
    let cursor = job.cursorId;
    for (;;) {
      const items = await listSiteItems(deps.db, siteId, { afterId: cursor, limit: STEP_ITEMS });
      if (items.length === 0) return;
      const sized = await sizeInPool(deps.calc, ctx, items.map(taskOf), `site:${siteId}`);
      const sizedAt = new Date();
      cursor = items[items.length - 1].id;
      await deps.db.transaction(async (trx) => {
        await upsertResults(
          trx,
          items.map((it, k) => ({ itemId: it.id, siteId, inputHash: sized[k].inputHash || it.inputHash, result: sized[k].result, sizedAt })),
        );
        await ctl.progress(items.length, cursor, trx);
      });
    }
  };
}

export async function getSizingSettings(deps: { db: Db }, caller: Caller, siteId: number) {
  await siteOrNotFound(deps.db, caller, siteId);
  const row = await readSiteSizing(deps.db, caller.teamId, siteId);
  return storedSettingsOf(row?.sizingSettings ?? null);
}

/** Changes a site's series, rules or default build-ups; the items whose numbers change read as stale. */
export async function updateSizingSettings(deps: { db: Db }, caller: Caller, siteId: number, patch: SizingSettingsInput, ip?: string) {
  return inTransaction(deps.db, async (trx) => {
    await siteOrNotFound(trx, caller, siteId);
    const row = await readSiteSizing(trx, caller.teamId, siteId);
    const before = storedSettingsOf(row?.sizingSettings ?? null);
    const next = {
      ...before,
      ...patch,
      seriesMm: patch.seriesMm ? [...new Set(patch.seriesMm)].sort((a, b) => a - b) : before.seriesMm,
      defaultBuildUps: { ...before.defaultBuildUps, ...(patch.defaultBuildUps ?? {}) },
    };
    const fields = (Object.keys(next) as (keyof typeof next)[]).filter((k) => JSON.stringify(next[k]) !== JSON.stringify(before[k]));
    if (fields.length === 0) return before;
    const ctx = await loadSizingContext(trx, caller.teamId, siteId);
    for (const kind of ['hot', 'cold'] as const) {
      const b = next.defaultBuildUps[kind];
      b.layers.forEach((l, i) => {
        if (!ctx.library.materials.some((m) => m.id === l.materialId)) {
          throw errors.badRequest('UNKNOWN_MATERIAL', `There is no material "${l.materialId}" in the library.`, `defaultBuildUps.${kind}.layers[${i}].materialId`);
        }
        if (i < b.layers.length - 1 && !(l.thicknessM && l.thicknessM > 0)) {
          throw errors.badRequest('REQUIRED', `Layer ${i + 1} needs its thickness (only the outermost layer is sized).`, `defaultBuildUps.${kind}.layers[${i}].thicknessM`);
        }
      });
      if (!b.fixed && b.layers.length === 0) throw errors.badRequest('REQUIRED', 'A default build-up needs at least one layer.', `defaultBuildUps.${kind}.layers`);
      if (!ctx.library.finishes.some((f) => f.id === b.finishId)) {
        throw errors.badRequest('UNKNOWN_FINISH', `There is no finish "${b.finishId}" in the library.`, `defaultBuildUps.${kind}.finishId`);
      }
    }
    if (next.maxSingleLayerMm > next.maxThicknessMm) {
      throw errors.badRequest('VALIDATION_FAILED', 'The largest single layer must not exceed the largest thickness.', 'maxSingleLayerMm');
    }
    await writeSiteSizingSettings(trx, caller.teamId, siteId, next);
    await refreshSiteInputHashes(trx, caller.teamId, siteId);
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'site.sizing_settings_updated', targetType: 'site', targetId: siteId, details: { fields }, ip });
    return next;
  });
}

type EnergyBasisFields = {
  operatingHoursPerYear?: number;
  energyPricePerKWh?: number;
  currency?: string;
  heatSourceEfficiency?: number;
  co2KgPerKWh?: number;
  co2Basis?: string;
  coolingCop?: number;
  electricityPricePerKWh?: number;
  electricityCo2KgPerKWh?: number;
  electricityCo2Basis?: string;
};

type YearCost = { cost: Decimal; co2Tonnes: number };

/**
 * Cost and CO₂ of a year's heat at the site's energy basis: a loss is made up by the heat source (fuel at its
 * efficiency), a gain on cold service is removed by a chiller (electricity at its COP) when the basis gives the
 * chiller's figures, else it is charged like a loss.
 */
function yearCost(heatKWh: number, service: 'hot' | 'cold' | null, basis: EnergyBasisFields): YearCost {
  const chiller = service === 'cold' && basis.coolingCop !== undefined && basis.electricityPricePerKWh !== undefined;
  const price = chiller ? basis.electricityPricePerKWh : basis.energyPricePerKWh;
  const factor = chiller ? basis.electricityCo2KgPerKWh : basis.co2KgPerKWh;
  if (price === undefined) return { cost: new Decimal(0), co2Tonnes: 0 };
  const purchasedKWh = chiller ? chillerElectricityKWh(heatKWh, basis.coolingCop as number) : fuelEnergyKWh(heatKWh, basis.heatSourceEfficiency ?? 1);
  return {
    cost: energyCost(purchasedKWh, { amount: String(price), per: 'kWh' }).amount,
    co2Tonnes: factor === undefined ? 0 : annualCo2(purchasedKWh, { kgCo2PerKWh: factor, basis: "the site's energy basis" }).tonnes,
  };
}

/** Totals of a site for its overview: heat loss, energy, cost, CO₂, saving against bare, failing, stale, unsized. */
export async function siteOverview(deps: { db: Db }, caller: Caller, siteId: number) {
  const site = await siteOrNotFound(deps.db, caller, siteId);
  const [counts, byService] = await Promise.all([siteCounts(deps.db, siteId), siteTotalsByService(deps.db, siteId)]);
  const energy = (site.designBases.energy ?? {}) as EnergyBasisFields;
  const sum = (k: 'heatLossW' | 'bareHeatLossW' | 'annualEnergyKWh' | 'bareAnnualEnergyKWh') => byService.reduce((s, r) => s + r[k], 0);
  const annual = sum('annualEnergyKWh');
  const bareAnnual = sum('bareAnnualEnergyKWh');
  const add = (k: 'annualEnergyKWh' | 'bareAnnualEnergyKWh') => {
    if (energy.energyPricePerKWh === undefined) return null;
    const parts = byService.map((r) => yearCost(r[k], r.serviceKind, energy));
    return {
      cost: parts.reduce((sum, c) => sum.plus(c.cost), new Decimal(0)).toFixed(2),
      co2Tonnes: energy.co2KgPerKWh === undefined ? null : parts.reduce((sum, c) => sum + c.co2Tonnes, 0),
    };
  };
  const cost = add('annualEnergyKWh');
  const bareCost = add('bareAnnualEnergyKWh');
  const services = new Map<string, { service: string; heatLossW: number; annualEnergyKWh: number; items: number }>();
  for (const r of byService) {
    const name = r.service || '(no service)';
    const s = services.get(name) ?? { service: name, heatLossW: 0, annualEnergyKWh: 0, items: 0 };
    s.heatLossW += r.heatLossW;
    s.annualEnergyKWh += r.annualEnergyKWh;
    s.items += r.items;
    services.set(name, s);
  }
  const kinds = { line: { items: 0, unsized: 0, stale: 0, failing: 0 }, vessel: { items: 0, unsized: 0, stale: 0, failing: 0 } };
  for (const c of counts) kinds[c.kind] = { items: c.items, unsized: c.unsized, stale: c.stale, failing: c.failing };
  return {
    siteId,
    counts: kinds,
    heatLossKW: sum('heatLossW') / 1000,
    bareHeatLossKW: sum('bareHeatLossW') / 1000,
    annualEnergyMWh: annual / 1000,
    bareAnnualEnergyMWh: bareAnnual / 1000,
    currency: energy.currency ?? null,
    annualCost: cost?.cost ?? null,
    bareAnnualCost: bareCost?.cost ?? null,
    annualCo2Tonnes: cost?.co2Tonnes ?? null,
    bareAnnualCo2Tonnes: bareCost?.co2Tonnes ?? null,
    basis: {
      operatingHoursPerYear: energy.operatingHoursPerYear ?? null,
      energyPricePerKWh: energy.energyPricePerKWh ?? null,
      heatSourceEfficiency: energy.heatSourceEfficiency ?? null,
      co2KgPerKWh: energy.co2KgPerKWh ?? null,
      co2Basis: energy.co2Basis ?? null,
      coolingCop: energy.coolingCop ?? null,
      electricityPricePerKWh: energy.electricityPricePerKWh ?? null,
      electricityCo2KgPerKWh: energy.electricityCo2KgPerKWh ?? null,
    },
    byService: [...services.values()].sort((a, b) => Math.abs(b.heatLossW) - Math.abs(a.heatLossW)),
  };
}
