import type { Db } from '../db/db';

export type AuditEntry = {
  teamId?: number | null;
  userId?: number | null;
  action: string;
  targetType?: string;
  targetId?: string | number;
  details?: Record<string, unknown>;
  ip?: string;
};

export async function insertAudit(db: Db, e: AuditEntry): Promise<void> {
  await db('audit_log').insert({
    team_id: e.teamId ?? null,
    user_id: e.userId ?? null,
    action: e.action,
    target_type: e.targetType ?? null,
    target_id: e.targetId == null ? null : String(e.targetId),
    details: e.details ? JSON.stringify(e.details) : null,
    ip: e.ip ?? null,
  });
}
