import { INSULATION_MATERIALS } from '../../shared/calc/library/materials';
import { FINISHES } from '../../shared/calc/library/finishes';
import { BUILT_IN_SIZING_FINISHES, fitTeamConductivity } from '../../shared/calc/sizing/library';
import { CalcInputError } from '../../shared/calc/errors';
import type { TeamFinishCreateInput, TeamFinishPatchInput, TeamMaterialCreateInput, TeamMaterialPatchInput } from '../../shared/schemas/lines';
import { insertAudit } from '../audit/audit.repository';
import type { Caller } from '../auth/auth.service';
import { type Db, inTransaction } from '../db/db';
import { errors } from '../errors';
import { refreshTeamInputHashes } from '../sizing/sizing-context';
import * as repo from './library.repository';

/** The built-in library with sources and how well each table is known, and the team's own entries. */
export async function getLibrary(deps: { db: Db }, caller: Caller) {
  const [teamMaterials, teamFinishes] = await Promise.all([repo.listTeamMaterials(deps.db, caller.teamId), repo.listTeamFinishes(deps.db, caller.teamId)]);
  return {
    materials: INSULATION_MATERIALS.map((m) => ({ ...m, origin: 'builtIn' as const })),
    finishes: FINISHES.map((f) => ({
      ...f,
      contactMaterial: BUILT_IN_SIZING_FINISHES.find((x) => x.id === f.id)?.contactMaterial,
      origin: 'builtIn' as const,
    })),
    teamMaterials: teamMaterials.map((m) => ({ ...m, origin: 'team' as const })),
    teamFinishes: teamFinishes.map((f) => ({ ...f, origin: 'team' as const })),
  };
}

function fitOrRefuse(points: { meanTemperatureC: number; conductivityWPerMK: number }[], minC: number, maxC: number) {
  try {
    return fitTeamConductivity(points, [minC, maxC]);
  } catch (e) {
    if (e instanceof CalcInputError) throw errors.badRequest('VALIDATION_FAILED', e.message, e.field);
    throw e;
  }
}

async function assertNameFree(db: Db, table: 'team_materials' | 'team_finishes', teamId: number, name: string, exceptId?: number) {
  if (await repo.nameTaken(db, table, teamId, name, exceptId)) throw errors.conflict('NAME_TAKEN', 'The team already has an entry with this name.', 'name');
}

export async function createMaterial(deps: { db: Db }, caller: Caller, input: TeamMaterialCreateInput, ip?: string) {
  return inTransaction(deps.db, async (trx) => {
    await assertNameFree(trx, 'team_materials', caller.teamId, input.name);
    const fit = fitOrRefuse(input.tablePoints, input.minServiceTemperatureC, input.maxServiceTemperatureC);
    const id = await repo.insertTeamMaterial(trx, caller.teamId, caller.userId, {
      name: input.name,
      source: input.source,
      tablePoints: input.tablePoints,
      conductivity: fit.conductivity,
      fitMaxErrorPct: fit.maxErrorPct,
      maxServiceTemperatureC: input.maxServiceTemperatureC,
      minServiceTemperatureC: input.minServiceTemperatureC,
      densityKgPerM3: input.densityKgPerM3 ?? null,
      notes: input.notes ?? '',
    });
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'material.created', targetType: 'material', targetId: id, details: { name: input.name }, ip });
    return { material: await repo.findTeamMaterial(trx, caller.teamId, id), fit };
  });
}

export async function updateMaterial(deps: { db: Db }, caller: Caller, id: number, patch: TeamMaterialPatchInput, ip?: string) {
  return inTransaction(deps.db, async (trx) => {
    const m = await repo.findTeamMaterial(trx, caller.teamId, id);
    if (!m) throw errors.notFound('The material');
    if (patch.name !== undefined && patch.name !== m.name) await assertNameFree(trx, 'team_materials', caller.teamId, patch.name, id);
    const next = {
      name: patch.name ?? m.name,
      source: patch.source ?? m.source,
      tablePoints: patch.tablePoints ?? m.tablePoints,
      maxServiceTemperatureC: patch.maxServiceTemperatureC ?? m.maxServiceTemperatureC,
      minServiceTemperatureC: patch.minServiceTemperatureC ?? m.minServiceTemperatureC,
      densityKgPerM3: patch.densityKgPerM3 === undefined ? m.densityKgPerM3 : patch.densityKgPerM3,
      notes: patch.notes ?? m.notes,
    };
    if (next.minServiceTemperatureC >= next.maxServiceTemperatureC) {
      throw errors.badRequest('VALIDATION_FAILED', 'Minimum service temperature must be below the maximum', 'minServiceTemperatureC');
    }
    const fit = fitOrRefuse(next.tablePoints, next.minServiceTemperatureC, next.maxServiceTemperatureC);
    const fields = (Object.keys(next) as (keyof typeof next)[]).filter((k) => JSON.stringify(next[k]) !== JSON.stringify(m[k]));
    if (fields.length === 0) return { material: m, fit };
    await repo.updateTeamMaterial(trx, caller.teamId, id, { ...next, conductivity: fit.conductivity, fitMaxErrorPct: fit.maxErrorPct });
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'material.updated', targetType: 'material', targetId: id, details: { fields }, ip });
    // The curve or limits feed every item built with it: those read as stale now.
    await refreshTeamInputHashes(trx, caller.teamId);
    return { material: await repo.findTeamMaterial(trx, caller.teamId, id), fit };
  });
}

export async function deleteMaterial(deps: { db: Db }, caller: Caller, id: number, ip?: string): Promise<void> {
  await inTransaction(deps.db, async (trx) => {
    const m = await repo.findTeamMaterial(trx, caller.teamId, id);
    if (!m) throw errors.notFound('The material');
    if (await repo.libraryIdInUse(trx, caller.teamId, m.materialId)) {
      throw errors.conflict('IN_USE', 'Items or a site default still use this material; change their build-ups first.');
    }
    await repo.deleteTeamMaterial(trx, caller.teamId, id);
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'material.deleted', targetType: 'material', targetId: id, details: { name: m.name }, ip });
  });
}

function finishWrite(input: { name: string; source: string; emissivity: number; emissivityLow?: number; emissivityHigh?: number; contactMaterial: repo.TeamFinish['contactMaterial'] }): repo.FinishWrite {
  return {
    name: input.name,
    source: input.source,
    emissivity: input.emissivity,
    emissivityRange: [input.emissivityLow ?? input.emissivity, input.emissivityHigh ?? input.emissivity],
    contactMaterial: input.contactMaterial,
  };
}

export async function createFinish(deps: { db: Db }, caller: Caller, input: TeamFinishCreateInput, ip?: string) {
  return inTransaction(deps.db, async (trx) => {
    await assertNameFree(trx, 'team_finishes', caller.teamId, input.name);
    const id = await repo.insertTeamFinish(trx, caller.teamId, caller.userId, finishWrite(input));
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'finish.created', targetType: 'finish', targetId: id, details: { name: input.name }, ip });
    return repo.findTeamFinish(trx, caller.teamId, id);
  });
}

export async function updateFinish(deps: { db: Db }, caller: Caller, id: number, patch: TeamFinishPatchInput, ip?: string) {
  return inTransaction(deps.db, async (trx) => {
    const f = await repo.findTeamFinish(trx, caller.teamId, id);
    if (!f) throw errors.notFound('The finish');
    if (patch.name !== undefined && patch.name !== f.name) await assertNameFree(trx, 'team_finishes', caller.teamId, patch.name, id);
    const emissivity = patch.emissivity ?? f.emissivity;
    const next = finishWrite({
      name: patch.name ?? f.name,
      source: patch.source ?? f.source,
      emissivity,
      emissivityLow: patch.emissivityLow ?? Math.min(f.emissivityRange[0], emissivity),
      emissivityHigh: patch.emissivityHigh ?? Math.max(f.emissivityRange[1], emissivity),
      contactMaterial: patch.contactMaterial ?? f.contactMaterial,
    });
    if (next.emissivityRange[0] > next.emissivity || next.emissivityRange[1] < next.emissivity) {
      throw errors.badRequest('VALIDATION_FAILED', 'The typical emissivity must lie within its range.', 'emissivity');
    }
    const before = finishWrite({ ...f, emissivityLow: f.emissivityRange[0], emissivityHigh: f.emissivityRange[1] });
    const fields = (Object.keys(next) as (keyof repo.FinishWrite)[]).filter((k) => JSON.stringify(next[k]) !== JSON.stringify(before[k]));
    if (fields.length === 0) return f;
    await repo.updateTeamFinish(trx, caller.teamId, id, next);
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'finish.updated', targetType: 'finish', targetId: id, details: { fields }, ip });
    await refreshTeamInputHashes(trx, caller.teamId);
    return repo.findTeamFinish(trx, caller.teamId, id);
  });
}

export async function deleteFinish(deps: { db: Db }, caller: Caller, id: number, ip?: string): Promise<void> {
  await inTransaction(deps.db, async (trx) => {
    const f = await repo.findTeamFinish(trx, caller.teamId, id);
    if (!f) throw errors.notFound('The finish');
    if (await repo.libraryIdInUse(trx, caller.teamId, f.finishId)) {
      throw errors.conflict('IN_USE', 'Items or a site default still use this finish; change their build-ups first.');
    }
    await repo.deleteTeamFinish(trx, caller.teamId, id);
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'finish.deleted', targetType: 'finish', targetId: id, details: { name: f.name }, ip });
  });
}
