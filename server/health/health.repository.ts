import type { Db } from '../db/db';

export async function pingDatabase(db: Db, timeoutMs = 2000): Promise<boolean> {
  try {
    await db.raw('select 1').timeout(timeoutMs);
    return true;
  } catch {
    return false;
  }
}
