import crypto from 'node:crypto';
import os from 'node:os';
import type { Db } from '../db/db';
import type { Logger } from '../logger';
import { claimJob, finishJob, recordProgress, releaseJob, type Job } from './jobs.repository';

/** What a job handler may do while it runs. */
export type JobControl = {
  /** Records `doneDelta` more items finished up to `cursorId` and renews the lease (throws when it was lost). */
  progress: (doneDelta: number, cursorId: number, db?: Db) => Promise<void>;
  /** True once the runner is stopping: finish the current step and return. */
  stopping: () => boolean;
};

export type JobHandler = (job: Job, ctl: JobControl) => Promise<void>;

export type JobRunner = {
  /** Polls for work every `pollMs` (and picks up jobs whose process stopped). */
  start: () => void;
  /** Looks for work now (after a job was queued). */
  poke: () => void;
  /** Stops after the current step; a job in hand goes back to the queue with its progress. */
  stop: () => Promise<void>;
  /** Resolves when nothing is running. */
  idle: () => Promise<void>;
  owner: string;
};

class LeaseLost extends Error {}
class Stopping extends Error {}

/**
 * Runs jobs kept in MariaDB. Any number of processes may run one each: a job is claimed under a lease that
 * each step renews, so a job whose process dies is taken up by another (or by the same after a restart) once
 * the lease runs out, from its last progress mark.
 */
export function createJobRunner(opts: {
  db: Db;
  logger: Logger;
  handlers: Record<string, JobHandler>;
  leaseMs?: number;
  pollMs?: number;
}): JobRunner {
  const { db, logger, handlers } = opts;
  const leaseMs = opts.leaseMs ?? 30_000;
  const pollMs = opts.pollMs ?? 2_000;
  const owner = `${os.hostname()}:${process.pid}:${crypto.randomBytes(4).toString('hex')}`;
  const kinds = Object.keys(handlers);
  let polling = false;
  let stopped = false;
  let running: Promise<void> | null = null;
  let timer: ReturnType<typeof setTimeout> | null = null;
  let again = false;

  const schedule = () => {
    if (stopped || !polling || timer) return;
    const t = setTimeout(() => {
      timer = null;
      kick();
    }, pollMs);
    (t as { unref?: () => void }).unref?.();
    timer = t;
  };

  async function runOne(job: Job): Promise<void> {
    const handler = handlers[job.kind];
    const ctl: JobControl = {
      progress: async (doneDelta, cursorId, tx = db) => {
        if (!(await recordProgress(tx, job.id, owner, leaseMs, doneDelta, cursorId))) throw new LeaseLost();
      },
      stopping: () => stopped,
    };
    try {
      await handler(job, {
        ...ctl,
        progress: async (d, c, tx) => {
          await ctl.progress(d, c, tx);
          if (stopped) throw new Stopping();
        },
      });
      await finishJob(db, job.id, owner, 'done', null);
    } catch (e) {
      if (e instanceof Stopping) {
        await releaseJob(db, job.id, owner).catch(() => undefined);
      } else if (e instanceof LeaseLost) {
        logger.info(`job ${job.id}: lease taken over by another process`);
      } else {
        logger.error(`job ${job.id} (${job.kind}) failed:`, e);
        await finishJob(db, job.id, owner, 'failed', 'The job stopped on an unexpected error; start it again, and report it if it repeats.').catch(() => undefined);
      }
    }
  }

  async function loop(): Promise<void> {
    do {
      again = false;
      for (;;) {
        if (stopped) return;
        let job: Job | undefined;
        try {
          job = await claimJob(db, owner, leaseMs, kinds);
        } catch (e) {
          logger.error('job runner: cannot claim jobs:', (e as Error).message);
          return;
        }
        if (!job) break;
        await runOne(job);
      }
    } while (again && !stopped);
  }

  function kick(): void {
    if (stopped) return;
    if (running) {
      again = true;
      return;
    }
    running = loop().finally(() => {
      running = null;
      schedule();
    });
  }

  return {
    owner,
    start: () => {
      polling = true;
      kick();
    },
    poke: kick,
    stop: async () => {
      stopped = true;
      if (timer) clearTimeout(timer);
      timer = null;
      await running;
    },
    idle: async () => {
      while (running) await running;
    },
  };
}
