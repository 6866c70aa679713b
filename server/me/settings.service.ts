import type { UnitSystem } from '../../shared/schemas/common';
import type { Caller } from '../auth/auth.service';
import type { Db } from '../db/db';
import { findSettings, upsertSettings } from './settings.repository';

export const getSettings = (deps: { db: Db }, caller: Caller) => findSettings(deps.db, caller.userId);

export async function updateSettings(deps: { db: Db }, caller: Caller, s: { unitSystem: UnitSystem }) {
  await upsertSettings(deps.db, caller.userId, s);
  return findSettings(deps.db, caller.userId);
}
