import crypto from 'node:crypto';
import os from 'node:os';
import { registerVerdict } from '../../shared/calc/register';
import type { Config } from '../config';
import type { Db } from '../db/db';
import type { Logger } from '../logger';
import type { Mailer } from '../mail/mailer';
import { reminderMail } from './register-mail';
import { addDays, dayOf } from './register-words';
import { claimReminders, findReminder, finishReminder, queueDueReminders, releaseReminders, retryReminder, type ReminderDetail } from './reminders.repository';

/** Due-soon reminders go out this many days before the due date (and on it). */
export const DUE_SOON_DAYS = 2;
const MAX_ATTEMPTS = 5;
const BATCH = 20;

export type TickResult = { queued: number; sent: number; skipped: number; failed: number; retried: number };

export type ReminderScheduler = {
  /** One pass: queue what is due by the clock, then send what is queued. Passes of one scheduler never overlap. */
  tick: () => Promise<TickResult>;
  /** Runs a pass soon (after an assignment or a fix was recorded). */
  poke: () => void;
  /** Runs a pass every `intervalMs`. */
  start: () => void;
  /** Finishes the pass in hand, hands back anything claimed but not sent, and stops. */
  stop: () => Promise<void>;
  owner: string;
};

/** Whether a claimed reminder still applies to its entry as it is now. */
function stillApplies(r: ReminderDetail): boolean {
  if (!r.recipientInTeam) return false;
  switch (r.kind) {
    case 'assigned':
      return r.status === 'actionAssigned' && r.ownerUserId === r.recipientUserId;
    case 'dueSoon':
    case 'overdue':
      return r.status === 'actionAssigned' && r.ownerUserId === r.recipientUserId && r.dueDate === r.key;
    case 'verifyRequest':
      return r.status === 'madeSafe';
  }
}

/**
 * The register's reminder job: assignment mail, due-soon and overdue reminders, and requests to verify. Its
 * state lives in MariaDB (`register_reminders`), so every process may run one: a reminder is queued once per
 * entry, kind, key and recipient (unique index) and claimed in a transaction (SKIP LOCKED, under a lease)
 * before it is sent. A process that stops between sending and recording the send leaves the row claimed until
 * its lease runs out; that narrow window is the only way a mail can go twice, and none is ever lost.
 * Time comes from `now` so tests can move the clock.
 */
export function createReminderScheduler(opts: {
  db: Db;
  mailer: Mailer;
  config: Pick<Config, 'appUrl'>;
  logger: Logger;
  now: () => number;
  intervalMs?: number;
  leaseMs?: number;
}): ReminderScheduler {
  const { db, mailer, config, logger, now } = opts;
  const intervalMs = opts.intervalMs ?? 60_000;
  const leaseMs = opts.leaseMs ?? 120_000;
  const owner = `${os.hostname()}:${process.pid}:${crypto.randomBytes(4).toString('hex')}`;
  let stopped = false;
  let timer: ReturnType<typeof setInterval> | null = null;
  let chain: Promise<unknown> = Promise.resolve();

  async function send(r: ReminderDetail): Promise<void> {
    const t = now();
    const verdict = registerVerdict(
      {
        temperatureC: r.measuredTemperatureC,
        method: r.method,
        emissivitySetting: r.emissivitySetting,
        surfaceMaterial: r.surfaceMaterial,
        surfaceFinishId: r.surfaceFinishId,
        withinReach: r.withinReach,
        contactSeconds: r.contactSeconds,
      },
      (r.designBases.touch ?? {}) as { contactSeconds?: number; maxSurfaceC?: number },
    );
    const daysToDue = r.dueDate ? Math.round((Date.parse(`${r.dueDate}T00:00:00Z`) - Date.parse(`${dayOf(t)}T00:00:00Z`)) / 86_400_000) : null;
    await mailer.send(
      reminderMail({
        kind: r.kind,
        to: r.recipientEmail,
        recipientName: r.recipientName,
        unitSystem: r.unitSystem,
        entryId: r.entryId,
        teamId: r.teamId,
        siteName: r.siteName,
        location: r.location,
        measuredTemperatureC: r.measuredTemperatureC,
        method: r.method,
        limitC: verdict.limitC,
        action: r.action,
        dueDate: r.dueDate,
        statusNote: r.statusNote,
        byName: r.kind === 'verifyRequest' ? r.lastChangedByName : r.assignedByName,
        daysToDue,
        link: `${config.appUrl}/register/${r.entryId}`,
      }),
    );
  }

  async function pass(): Promise<TickResult> {
    const result: TickResult = { queued: 0, sent: 0, skipped: 0, failed: 0, retried: 0 };
    const today = dayOf(now());
    result.queued = await queueDueReminders(db, today, addDays(today, DUE_SOON_DAYS), new Date(now()));
    for (;;) {
      if (stopped) break;
      const ids = await claimReminders(db, owner, new Date(now()), leaseMs, BATCH);
      if (ids.length === 0) break;
      for (const id of ids) {
        if (stopped) break;
        const r = await findReminder(db, id, owner);
        if (!r) continue;
        if (!stillApplies(r)) {
          await finishReminder(db, id, owner, 'skipped', new Date(now()));
          result.skipped++;
          continue;
        }
        try {
          await send(r);
        } catch (e) {
          const message = (e as Error).message || 'sending failed';
          if (r.attempts >= MAX_ATTEMPTS) {
            await finishReminder(db, id, owner, 'failed', new Date(now()), message);
            result.failed++;
            logger.error(`register reminder ${id} failed for good: ${message}`);
          } else {
            // 1, 4, 9, 16 minutes
            await retryReminder(db, id, owner, new Date(now() + r.attempts * r.attempts * 60_000), message);
            result.retried++;
          }
          continue;
        }
        await finishReminder(db, id, owner, 'sent', new Date(now()));
        result.sent++;
      }
    }
    return result;
  }

  const tick = (): Promise<TickResult> => {
    const run = chain.then(pass);
    chain = run.catch(() => undefined);
    return run;
  };

  return {
    owner,
    tick,
    poke: () => {
      if (stopped) return;
      tick().catch((e: Error) => logger.error('register reminders:', e.message));
    },
    start: () => {
      if (timer || stopped) return;
      const t = setInterval(() => {
        if (!stopped) tick().catch((e: Error) => logger.error('register reminders:', e.message));
      }, intervalMs);
      (t as { unref?: () => void }).unref?.();
      timer = t;
      tick().catch((e: Error) => logger.error('register reminders:', e.message));
    },
    stop: async () => {
      stopped = true;
      if (timer) clearInterval(timer);
      timer = null;
      await chain;
      await releaseReminders(db, owner).catch(() => undefined);
    },
  };
}
