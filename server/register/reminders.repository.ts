import type { MeasurementMethod } from '../../shared/calc/register';
import type { ContactMaterial } from '../../shared/calc/types';
import type { UnitSystem } from '../../shared/schemas/common';
import type { EntryRecord } from './register.repository';
import type { RegisterStatus } from '../../shared/schemas/register';
import type { DesignBases } from '../../shared/schemas/sites';
import { type Db, parseJson } from '../db/db';
import type { ReminderKind } from './register-mail';

/**
 * The register's mail outbox. One row per entry, kind, key and recipient (a unique index), so a reminder is
 * queued once however many processes look for due work; a row is claimed under a lease before it is sent, so
 * two processes never send the same row, and one whose process stopped mid-way is sent by the next.
 */

export async function queueReminders(
  db: Db,
  rows: { teamId: number; entryId: number; kind: ReminderKind; key: string; recipientUserId: number; status?: 'pending' | 'skipped' }[],
  now: Date,
): Promise<void> {
  if (rows.length === 0) return;
  await db('register_reminders')
    .insert(
      rows.map((r) => ({
        team_id: r.teamId,
        entry_id: r.entryId,
        kind: r.kind,
        reminder_key: r.key,
        recipient_user_id: r.recipientUserId,
        status: r.status ?? 'pending',
        not_before: now,
        created_at: now,
      })),
    )
    .onConflict(['entry_id', 'kind', 'reminder_key', 'recipient_user_id'])
    .ignore();
}

/**
 * Queues the due-soon and overdue reminders of assigned entries (to their owners), once per entry and due
 * date: `today` and `soonUntil` are UTC days (YYYY-MM-DD). Returns how many new rows were queued.
 */
export async function queueDueReminders(db: Db, today: string, soonUntil: string, now: Date): Promise<number> {
  const sql = (kind: ReminderKind, condition: string) => `
    INSERT IGNORE INTO register_reminders (team_id, entry_id, kind, reminder_key, recipient_user_id, status, not_before, created_at)
    SELECT e.team_id, e.id, '${kind}', DATE_FORMAT(e.due_date, '%Y-%m-%d'), e.owner_user_id, 'pending', ?, ?
    FROM register_entries e
    WHERE e.status = 'actionAssigned' AND e.owner_user_id IS NOT NULL AND e.due_date IS NOT NULL AND ${condition}`;
  const [overdue] = await db.raw(sql('overdue', 'e.due_date < ?'), [now, now, today]);
  const [soon] = await db.raw(sql('dueSoon', 'e.due_date >= ? AND e.due_date <= ?'), [now, now, today, soonUntil]);
  return Number((overdue as { affectedRows?: number }).affectedRows ?? 0) + Number((soon as { affectedRows?: number }).affectedRows ?? 0);
}

/** Claims up to `limit` reminders that are due (or whose sender's lease ran out) for `owner`. */
export async function claimReminders(db: Db, owner: string, now: Date, leaseMs: number, limit: number): Promise<number[]> {
  return db.transaction(async (trx) => {
    const rows = await trx('register_reminders')
      .where((w) =>
        w.where((x) => x.where('status', 'pending').andWhere('not_before', '<=', now)).orWhere((x) => x.where('status', 'sending').andWhere('lease_until', '<', now)),
      )
      .orderBy('id')
      .limit(limit)
      .forUpdate()
      .skipLocked()
      .select('id');
    const ids = rows.map((r: { id: number }) => Number(r.id));
    if (ids.length === 0) return [];
    await trx('register_reminders')
      .whereIn('id', ids)
      .update({ status: 'sending', claimed_by: owner, lease_until: new Date(now.getTime() + leaseMs), attempts: trx.raw('attempts + 1') });
    return ids;
  });
}

/** Everything a claimed reminder's mail needs, read as it is now. */
export type ReminderDetail = Pick<
  EntryRecord,
  'status' | 'ownerUserId' | 'dueDate' | 'siteName' | 'location' | 'measuredTemperatureC' | 'method' | 'emissivitySetting' | 'surfaceMaterial' | 'surfaceFinishId' | 'withinReach' | 'contactSeconds' | 'action' | 'statusNote'
> & {
  id: number;
  kind: ReminderKind;
  key: string;
  attempts: number;
  recipientUserId: number;
  recipientName: string;
  recipientEmail: string;
  /** The recipient is still a member of the entry's team. */
  recipientInTeam: boolean;
  unitSystem: UnitSystem;
  entryId: number;
  teamId: number;
  designBases: DesignBases;
  assignedByName: string | null;
  lastChangedByName: string | null;
};

export async function findReminder(db: Db, id: number, owner: string): Promise<ReminderDetail | undefined> {
  const r = await db('register_reminders as m')
    .join('register_entries as e', 'e.id', 'm.entry_id')
    .join('sites as s', 's.id', 'e.site_id')
    .join('users as u', 'u.id', 'm.recipient_user_id')
    .leftJoin('memberships as ms', (j) => j.on('ms.user_id', 'm.recipient_user_id').andOn('ms.team_id', 'e.team_id'))
    .leftJoin('user_settings as us', 'us.user_id', 'm.recipient_user_id')
    .leftJoin('users as a', 'a.id', 'e.assigned_by')
    .leftJoin('users as c', 'c.id', 'e.updated_by')
    .where({ 'm.id': id, 'm.claimed_by': owner, 'm.status': 'sending' })
    .first(
      'm.id',
      'm.kind',
      'm.reminder_key',
      'm.attempts',
      'm.recipient_user_id',
      'u.name as recipient_name',
      'u.email as recipient_email',
      'ms.user_id as member_user_id',
      'us.unit_system',
      'e.id as entry_id',
      'e.team_id',
      'e.status',
      'e.owner_user_id',
      db.raw("DATE_FORMAT(e.due_date, '%Y-%m-%d') as due_date_text"),
      's.name as site_name',
      's.design_bases',
      'e.location',
      'e.measured_temperature_c',
      'e.method',
      'e.emissivity_setting',
      'e.surface_material',
      'e.surface_finish_id',
      'e.within_reach',
      'e.contact_seconds',
      'e.action',
      'e.status_note',
      'a.name as assigned_by_name',
      'c.name as changed_by_name',
    );
  if (!r) return undefined;
  return {
    id: Number(r.id),
    kind: r.kind as ReminderKind,
    key: r.reminder_key as string,
    attempts: Number(r.attempts),
    recipientUserId: r.recipient_user_id as number,
    recipientName: r.recipient_name as string,
    recipientEmail: r.recipient_email as string,
    recipientInTeam: r.member_user_id != null,
    unitSystem: r.unit_system === 'US' ? 'US' : 'SI',
    entryId: r.entry_id as number,
    teamId: r.team_id as number,
    status: r.status as RegisterStatus,
    ownerUserId: (r.owner_user_id as number | null) ?? null,
    dueDate: (r.due_date_text as string | null) ?? null,
    siteName: r.site_name as string,
    designBases: parseJson<DesignBases>(r.design_bases, {}),
    location: r.location as string,
    measuredTemperatureC: Number(r.measured_temperature_c),
    method: r.method as MeasurementMethod,
    emissivitySetting: r.emissivity_setting == null ? null : Number(r.emissivity_setting),
    surfaceMaterial: r.surface_material as ContactMaterial,
    surfaceFinishId: (r.surface_finish_id as string | null) ?? null,
    withinReach: !!r.within_reach,
    contactSeconds: r.contact_seconds == null ? null : Number(r.contact_seconds),
    action: r.action as string,
    statusNote: r.status_note as string,
    assignedByName: (r.assigned_by_name as string | null) ?? null,
    lastChangedByName: (r.changed_by_name as string | null) ?? null,
  };
}

/** Ends a claimed reminder: sent, skipped (no longer applies) or failed for good. */
export async function finishReminder(db: Db, id: number, owner: string, status: 'sent' | 'skipped' | 'failed', now: Date, error?: string): Promise<boolean> {
  const n = await db('register_reminders')
    .where({ id, claimed_by: owner, status: 'sending' })
    .update({ status, sent_at: status === 'sent' ? now : null, lease_until: null, last_error: error ? error.slice(0, 500) : null });
  return n > 0;
}

/** Hands a reminder back for a later attempt. */
export async function retryReminder(db: Db, id: number, owner: string, notBefore: Date, error: string): Promise<void> {
  await db('register_reminders')
    .where({ id, claimed_by: owner, status: 'sending' })
    .update({ status: 'pending', claimed_by: null, lease_until: null, not_before: notBefore, last_error: error.slice(0, 500) });
}

/** Gives back what this owner holds (a graceful stop), so another process sends it without waiting. */
export async function releaseReminders(db: Db, owner: string): Promise<void> {
  await db('register_reminders').where({ claimed_by: owner, status: 'sending' }).update({ status: 'pending', claimed_by: null, lease_until: null });
}
