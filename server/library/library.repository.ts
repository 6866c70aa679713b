import type { ConductivityPoint } from '../../shared/calc/library/materials';
import type { ContactMaterial } from '../../shared/calc/types';
import { type Db, parseJson } from '../db/db';

export type TeamMaterial = {
  id: number;
  /** Id used in build-ups: `team-material-<id>`. */
  materialId: string;
  name: string;
  source: string;
  tablePoints: ConductivityPoint[];
  conductivity: number[];
  fitMaxErrorPct: number;
  maxServiceTemperatureC: number;
  minServiceTemperatureC: number;
  densityKgPerM3: number | null;
  notes: string;
  createdAt: string;
  updatedAt: string;
};

export type TeamFinish = {
  id: number;
  finishId: string;
  name: string;
  source: string;
  emissivity: number;
  emissivityRange: [number, number];
  contactMaterial: ContactMaterial;
  createdAt: string;
  updatedAt: string;
};

type MaterialRow = {
  id: number;
  name: string;
  source: string;
  table_points: unknown;
  conductivity: unknown;
  fit_max_error_pct: number;
  max_service_temperature_c: number;
  min_service_temperature_c: number;
  density_kg_per_m3: number | null;
  notes: string;
  created_at: Date;
  updated_at: Date;
};

type FinishRow = {
  id: number;
  name: string;
  source: string;
  emissivity: number;
  emissivity_low: number;
  emissivity_high: number;
  contact_material: ContactMaterial;
  created_at: Date;
  updated_at: Date;
};

export const teamMaterialId = (id: number) => `team-material-${id}`;
export const teamFinishId = (id: number) => `team-finish-${id}`;

const toMaterial = (r: MaterialRow): TeamMaterial => ({
  id: r.id,
  materialId: teamMaterialId(r.id),
  name: r.name,
  source: r.source,
  tablePoints: parseJson<ConductivityPoint[]>(r.table_points, []),
  conductivity: parseJson<number[]>(r.conductivity, []),
  fitMaxErrorPct: r.fit_max_error_pct,
  maxServiceTemperatureC: r.max_service_temperature_c,
  minServiceTemperatureC: r.min_service_temperature_c,
  densityKgPerM3: r.density_kg_per_m3,
  notes: r.notes,
  createdAt: new Date(r.created_at).toISOString(),
  updatedAt: new Date(r.updated_at).toISOString(),
});

const toFinish = (r: FinishRow): TeamFinish => ({
  id: r.id,
  finishId: teamFinishId(r.id),
  name: r.name,
  source: r.source,
  emissivity: r.emissivity,
  emissivityRange: [r.emissivity_low, r.emissivity_high],
  contactMaterial: r.contact_material,
  createdAt: new Date(r.created_at).toISOString(),
  updatedAt: new Date(r.updated_at).toISOString(),
});

export async function listTeamMaterials(db: Db, teamId: number): Promise<TeamMaterial[]> {
  return ((await db('team_materials').where({ team_id: teamId }).orderBy('name')) as MaterialRow[]).map(toMaterial);
}

export async function findTeamMaterial(db: Db, teamId: number, id: number): Promise<TeamMaterial | undefined> {
  const r = await db('team_materials').where({ team_id: teamId, id }).first();
  return r ? toMaterial(r) : undefined;
}

export type MaterialWrite = {
  name: string;
  source: string;
  tablePoints: ConductivityPoint[];
  conductivity: number[];
  fitMaxErrorPct: number;
  maxServiceTemperatureC: number;
  minServiceTemperatureC: number;
  densityKgPerM3: number | null;
  notes: string;
};

const materialRow = (m: MaterialWrite) => ({
  name: m.name,
  source: m.source,
  table_points: JSON.stringify(m.tablePoints),
  conductivity: JSON.stringify(m.conductivity),
  fit_max_error_pct: m.fitMaxErrorPct,
  max_service_temperature_c: m.maxServiceTemperatureC,
  min_service_temperature_c: m.minServiceTemperatureC,
  density_kg_per_m3: m.densityKgPerM3,
  notes: m.notes,
});

export async function insertTeamMaterial(db: Db, teamId: number, userId: number, m: MaterialWrite): Promise<number> {
  const [id] = await db('team_materials').insert({ team_id: teamId, created_by: userId, ...materialRow(m) });
  return id;
}

export async function updateTeamMaterial(db: Db, teamId: number, id: number, m: MaterialWrite): Promise<void> {
  await db('team_materials').where({ team_id: teamId, id }).update({ ...materialRow(m), updated_at: db.fn.now(3) });
}

export async function deleteTeamMaterial(db: Db, teamId: number, id: number): Promise<number> {
  return db('team_materials').where({ team_id: teamId, id }).delete();
}

export async function listTeamFinishes(db: Db, teamId: number): Promise<TeamFinish[]> {
  return ((await db('team_finishes').where({ team_id: teamId }).orderBy('name')) as FinishRow[]).map(toFinish);
}

export async function findTeamFinish(db: Db, teamId: number, id: number): Promise<TeamFinish | undefined> {
  const r = await db('team_finishes').where({ team_id: teamId, id }).first();
  return r ? toFinish(r) : undefined;
}

export type FinishWrite = { name: string; source: string; emissivity: number; emissivityRange: [number, number]; contactMaterial: ContactMaterial };

const finishRow = (f: FinishWrite) => ({
  name: f.name,
  source: f.source,
  emissivity: f.emissivity,
  emissivity_low: f.emissivityRange[0],
  emissivity_high: f.emissivityRange[1],
  contact_material: f.contactMaterial,
});

export async function insertTeamFinish(db: Db, teamId: number, userId: number, f: FinishWrite): Promise<number> {
  const [id] = await db('team_finishes').insert({ team_id: teamId, created_by: userId, ...finishRow(f) });
  return id;
}

export async function updateTeamFinish(db: Db, teamId: number, id: number, f: FinishWrite): Promise<void> {
  await db('team_finishes').where({ team_id: teamId, id }).update({ ...finishRow(f), updated_at: db.fn.now(3) });
}

export async function deleteTeamFinish(db: Db, teamId: number, id: number): Promise<number> {
  return db('team_finishes').where({ team_id: teamId, id }).delete();
}

export async function nameTaken(db: Db, table: 'team_materials' | 'team_finishes', teamId: number, name: string, exceptId?: number): Promise<boolean> {
  const q = db(table).where({ team_id: teamId, name }).first('id');
  if (exceptId !== undefined) q.whereNot({ id: exceptId });
  return !!(await q);
}

/**
 * Whether any item or site default of the team uses a library id in its build-up (a JSON text search:
 * ids are quoted in the JSON, so `team-material-1` never matches `team-material-12`).
 */
export async function libraryIdInUse(db: Db, teamId: number, libraryId: string): Promise<boolean> {
  const needle = `%"${libraryId}"%`;
  const item = await db('items').where({ team_id: teamId }).andWhere('build_up', 'like', needle).first('id');
  if (item) return true;
  const site = await db('sites').where({ team_id: teamId }).andWhere('sizing_settings', 'like', needle).first('id');
  return !!site;
}
