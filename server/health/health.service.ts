import type { Db } from '../db/db';
import { pingDatabase } from './health.repository';

export async function checkHealth(deps: { db: Db }) {
  const up = await pingDatabase(deps.db);
  return { ok: up, body: { status: up ? 'ok' : 'degraded', database: up ? 'up' : 'down' } as const };
}
