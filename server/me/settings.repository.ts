import type { UnitSystem } from '../../shared/schemas/common';
import type { Db } from '../db/db';

export async function findSettings(db: Db, userId: number): Promise<{ unitSystem: UnitSystem }> {
  const row = await db('user_settings').select('unit_system').where({ user_id: userId }).first();
  return { unitSystem: (row?.unit_system as UnitSystem | undefined) ?? 'SI' };
}

export async function upsertSettings(db: Db, userId: number, s: { unitSystem: UnitSystem }): Promise<void> {
  await db('user_settings')
    .insert({ user_id: userId, unit_system: s.unitSystem })
    .onConflict('user_id')
    .merge({ unit_system: s.unitSystem, updated_at: db.fn.now(3) });
}
