import path from 'node:path';
import { Piscina } from 'piscina';
import type { Config } from '../config';
import { errors } from '../errors';
import type { CalcTask, CalcTaskResult } from './calc-tasks';

/**
 * interactive: someone is waiting for the answer (a single case). It runs ahead of all batch work and
 * has a thread of its own that batch work never fills, so it never waits behind a big batch.
 * batch: large or background work (a 10,000-case batch, the chunks of a whole-site sizing job), shared
 * round-robin between owners so one caller's flood does not hold up another's batch.
 */
export type CalcLane = 'interactive' | 'batch';

export type RunOptions = {
  /** Default 'batch'. */
  lane?: CalcLane;
  /** Whose work it is (e.g. `user:12`, `ip:203.0.113.5`); batch work takes turns by owner. Default: the job alone. */
  owner?: string;
  /** Aborting drops the work's queued tasks (the client went away); running ones finish unseen. */
  signal?: AbortSignal;
};

export type CalcPool = {
  /** Runs the cases in worker threads, in chunks (so other work interleaves); results in order. */
  run: (cases: unknown[], options?: RunOptions) => Promise<unknown[]>;
  /** Runs one task (one chunk of work of any kind) in a lane. */
  submit: <T extends CalcTask>(task: T, options?: RunOptions) => Promise<CalcTaskResult<T>>;
  /** Tasks queued or running now, in both lanes. */
  pending: () => number;
  close: () => Promise<void>;
};

const queueFull = () => errors.unavailable('BUSY', 'The calculation queue is full; try again in a moment.');
const cancelled = () => errors.unavailable('CANCELLED', 'The calculation was cancelled.');

/** Error paths from a chunk start at [0]; make them index the whole batch. */
function renumber(result: unknown, offset: number): unknown {
  const err = (result as { error?: { field?: unknown } } | null)?.error;
  if (!offset || !err || typeof err.field !== 'string') return result;
  const field = err.field.replace(/^\[(\d+)\]/, (_m, i: string) => `[${Number(i) + offset}]`);
  return { ...(result as object), error: { ...err, field } };
}

type Job = { lane: CalcLane; owner: string; cancelled: boolean };
type Queued = { job: Job; task: CalcTask; resolve: (value: unknown) => void; reject: (err: unknown) => void };

export function createCalcPool(config: Pick<Config, 'calc'>, workerFile = path.join(__dirname, 'calc.worker-boot.js')): CalcPool {
  const batchThreads = config.calc.maxThreads;
  const totalThreads = batchThreads + 1;
  let pool: Piscina | undefined;
  const get = () =>
    (pool ??= new Piscina({
      filename: workerFile,
      minThreads: 0,
      maxThreads: totalThreads,
      // Never more tasks in flight than threads: the queues below decide what runs next.
      maxQueue: totalThreads,
      idleTimeout: 60_000,
    }));

  const interactive: Queued[] = [];
  /** Per owner, in turn order: the owner served next is first; after a task it moves to the back. */
  const batch = new Map<string, Queued[]>();
  let batchQueued = 0;
  const running = { interactive: 0, batch: 0 };
  let jobs = 0;

  const takeBatch = (): Queued | undefined => {
    for (const [owner, queue] of batch) {
      const item = queue.shift();
      batch.delete(owner);
      if (queue.length) batch.set(owner, queue);
      if (item) {
        batchQueued--;
        return item;
      }
    }
    return undefined;
  };

  const start = (item: Queued) => {
    const lane = item.job.lane;
    running[lane]++;
    get()
      .run(item.task)
      .then(item.resolve, item.reject)
      .finally(() => {
        running[lane]--;
        pump();
      });
  };

  function pump(): void {
    while (running.interactive + running.batch < totalThreads) {
      const item = interactive.shift() ?? (running.batch < batchThreads ? takeBatch() : undefined);
      if (!item) return;
      start(item);
    }
  }

  /** Drops a job's queued tasks, rejecting them. */
  const cancel = (job: Job, err: unknown) => {
    if (job.cancelled) return;
    job.cancelled = true;
    const dropped: Queued[] = [];
    if (job.lane === 'interactive') {
      for (let i = interactive.length - 1; i >= 0; i--) if (interactive[i].job === job) dropped.push(...interactive.splice(i, 1));
    } else {
      const queue = batch.get(job.owner) ?? [];
      const kept = queue.filter((q) => q.job !== job);
      dropped.push(...queue.filter((q) => q.job === job));
      batchQueued -= queue.length - kept.length;
      if (kept.length) batch.set(job.owner, kept);
      else batch.delete(job.owner);
    }
    for (const q of dropped) q.reject(err);
  };

  /** Queues every task of one job at once, or none when the lane's queue cannot take them all. */
  async function runJob(tasks: CalcTask[], options: RunOptions): Promise<unknown[]> {
    if (options.signal?.aborted) throw cancelled();
    const job: Job = { lane: options.lane ?? 'batch', owner: options.owner ?? `job:${++jobs}`, cancelled: false };
    const queued = job.lane === 'interactive' ? interactive.length : batchQueued;
    if (queued + tasks.length > config.calc.maxQueue) throw queueFull();
    const promises = tasks.map(
      (task) =>
        new Promise<unknown>((resolve, reject) => {
          const item: Queued = { job, task, resolve, reject };
          if (job.lane === 'interactive') interactive.push(item);
          else {
            const queue = batch.get(job.owner);
            if (queue) queue.push(item);
            else batch.set(job.owner, [item]);
            batchQueued++;
          }
        }),
    );
    const onAbort = () => cancel(job, cancelled());
    options.signal?.addEventListener('abort', onAbort, { once: true });
    pump();
    try {
      return await Promise.all(promises);
    } catch (e) {
      cancel(job, e);
      throw e;
    } finally {
      options.signal?.removeEventListener('abort', onAbort);
    }
  }

  return {
    run: async (cases, options = {}) => {
      if (!cases.length) return [];
      const size = config.calc.chunkSize;
      const tasks: CalcTask[] = [];
      for (let i = 0; i < cases.length; i += size) tasks.push({ kind: 'cases', cases: cases.slice(i, i + size) });
      const parts = (await runJob(tasks, options)) as unknown[][];
      return parts.flatMap((part, k) => part.map((r) => renumber(r, k * size)));
    },
    submit: async <T extends CalcTask>(task: T, options: RunOptions = {}) => {
      const [result] = await runJob([task], options);
      return result as CalcTaskResult<T>;
    },
    pending: () => interactive.length + batchQueued + running.interactive + running.batch,
    close: async () => {
      const closing = errors.unavailable('SHUTTING_DOWN', 'The server is shutting down; try again in a moment.');
      for (const q of interactive.splice(0)) q.reject(closing);
      for (const queue of batch.values()) for (const q of queue) q.reject(closing);
      batch.clear();
      batchQueued = 0;
      if (pool) await pool.destroy();
      pool = undefined;
    },
  };
}
