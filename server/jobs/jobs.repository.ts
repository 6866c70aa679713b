import { type Db, parseJson } from '../db/db';

export type JobStatus = 'queued' | 'running' | 'done' | 'failed';

export type Job = {
  id: number;
  teamId: number;
  siteId: number | null;
  kind: string;
  status: JobStatus;
  params: Record<string, unknown>;
  done: number;
  total: number;
  cursorId: number;
  error: string | null;
  attempts: number;
  createdBy: number | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
};

type Row = Record<string, unknown>;

const isoOrNull = (d: unknown) => (d ? new Date(d as Date).toISOString() : null);

function toJob(r: Row): Job {
  return {
    id: r.id as number,
    teamId: r.team_id as number,
    siteId: (r.site_id as number | null) ?? null,
    kind: r.kind as string,
    status: r.status as JobStatus,
    params: parseJson<Record<string, unknown>>(r.params, {}),
    done: r.done as number,
    total: r.total as number,
    cursorId: r.cursor_id as number,
    error: (r.error as string | null) ?? null,
    attempts: r.attempts as number,
    createdBy: (r.created_by as number | null) ?? null,
    createdAt: new Date(r.created_at as Date).toISOString(),
    startedAt: isoOrNull(r.started_at),
    finishedAt: isoOrNull(r.finished_at),
  };
}

export async function insertJob(
  db: Db,
  j: { teamId: number; siteId: number | null; kind: string; params: Record<string, unknown>; total: number; createdBy: number | null },
): Promise<number> {
  const [id] = await db('jobs').insert({ team_id: j.teamId, site_id: j.siteId, kind: j.kind, params: JSON.stringify(j.params), total: j.total, created_by: j.createdBy });
  return id;
}

export async function findJob(db: Db, teamId: number, id: number): Promise<Job | undefined> {
  const r = await db('jobs').where({ team_id: teamId, id }).first();
  return r ? toJob(r) : undefined;
}

/** A queued or running job of this kind for the site, if any. */
export async function findActiveJob(db: Db, siteId: number, kind: string): Promise<Job | undefined> {
  const r = await db('jobs').where({ site_id: siteId, kind }).whereIn('status', ['queued', 'running']).orderBy('id').first();
  return r ? toJob(r) : undefined;
}

/**
 * Claims the oldest job that is queued, or running under a lease that has run out (its process stopped),
 * for `owner`. SKIP LOCKED lets several processes claim at once without waiting on each other or taking the
 * same job.
 */
export async function claimJob(db: Db, owner: string, leaseMs: number, kinds: string[]): Promise<Job | undefined> {
  return db.transaction(async (trx) => {
    const r = await trx('jobs')
      .whereIn('kind', kinds)
      .where((w) => w.where('status', 'queued').orWhere((x) => x.where('status', 'running').andWhere('lease_expires_at', '<', trx.raw('NOW(3)'))))
      .orderBy('id')
      .forUpdate()
      .skipLocked()
      .first('id');
    if (!r) return undefined;
    await trx('jobs')
      .where({ id: r.id })
      .update({
        status: 'running',
        lease_owner: owner,
        lease_expires_at: trx.raw('DATE_ADD(NOW(3), INTERVAL ? MICROSECOND)', [leaseMs * 1000]),
        attempts: trx.raw('attempts + 1'),
        started_at: trx.raw('COALESCE(started_at, NOW(3))'),
      });
    return toJob(await trx('jobs').where({ id: r.id }).first());
  });
}

/** Records progress and renews the lease; false when the lease was lost to another process. */
export async function recordProgress(db: Db, id: number, owner: string, leaseMs: number, doneDelta: number, cursorId: number): Promise<boolean> {
  const n = await db('jobs')
    .where({ id, lease_owner: owner, status: 'running' })
    .update({
      done: db.raw('done + ?', [doneDelta]),
      total: db.raw('GREATEST(total, done)'),
      cursor_id: cursorId,
      lease_expires_at: db.raw('DATE_ADD(NOW(3), INTERVAL ? MICROSECOND)', [leaseMs * 1000]),
    });
  return n > 0;
}

export async function finishJob(db: Db, id: number, owner: string, status: 'done' | 'failed', error: string | null): Promise<void> {
  await db('jobs')
    .where({ id, lease_owner: owner })
    .update({ status, error, finished_at: db.fn.now(3), lease_owner: null, lease_expires_at: null, total: db.raw('GREATEST(total, done)') });
}

/** Hands a job back to the queue (a graceful stop), keeping its progress mark. */
export async function releaseJob(db: Db, id: number, owner: string): Promise<void> {
  await db('jobs').where({ id, lease_owner: owner, status: 'running' }).update({ status: 'queued', lease_owner: null, lease_expires_at: null });
}
