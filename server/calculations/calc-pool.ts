import { setMaxListeners } from 'node:events';
import path from 'node:path';
import { Piscina } from 'piscina';
import type { Config } from '../config';
import type { SizedItem } from '../../shared/calc/sizing/batch';
import type { SizingContext, SizingTask } from '../../shared/calc/sizing/types';
import { errors } from '../errors';

export type CalcPool = {
  /** Runs the cases in worker threads, in chunks so other requests interleave; results in order. */
  run: (cases: unknown[]) => Promise<unknown[]>;
  /**
   * Sizes a site's items in worker threads, a few chunks at a time so interactive requests keep their turn;
   * results in order.
   */
  runSizing: (ctx: SizingContext, tasks: SizingTask[]) => Promise<SizedItem[]>;
  /** Chunks queued or running now. */
  pending: () => number;
  close: () => Promise<void>;
};

/** Items per worker task when sizing a site. */
const SIZING_CHUNK = 50;

const queueFull = () => errors.unavailable('BUSY', 'The calculation queue is full; try again in a moment.');

/** Error paths from a chunk start at [0]; make them index the whole batch. */
function renumber(result: unknown, offset: number): unknown {
  const err = (result as { error?: { field?: unknown } } | null)?.error;
  if (!offset || !err || typeof err.field !== 'string') return result;
  const field = err.field.replace(/^\[(\d+)\]/, (_m, i: string) => `[${Number(i) + offset}]`);
  return { ...(result as object), error: { ...err, field } };
}

export function createCalcPool(config: Pick<Config, 'calc'>, workerFile = path.join(__dirname, 'calc.worker-boot.js')): CalcPool {
  let pool: Piscina | undefined;
  let inFlight = 0;
  const get = () =>
    (pool ??= new Piscina({
      filename: workerFile,
      minThreads: 0,
      maxThreads: config.calc.maxThreads,
      maxQueue: config.calc.maxQueue,
      idleTimeout: 60_000,
    }));
  return {
    run: async (cases) => {
      const p = get();
      const size = config.calc.chunkSize;
      const chunks: unknown[][] = [];
      for (let i = 0; i < cases.length; i += size) chunks.push(cases.slice(i, i + size));
      // Refuse up front rather than half-run a batch the queue cannot take.
      if (p.queueSize + chunks.length > config.calc.maxQueue) {
        throw queueFull();
      }
      const abort = new AbortController();
      setMaxListeners(0, abort.signal);
      const runOne = async (c: unknown[]) => {
        inFlight++;
        try {
          return (await p.run(c, { signal: abort.signal })) as unknown[];
        } finally {
          inFlight--;
        }
      };
      try {
        const parts = await Promise.all(chunks.map(runOne));
        return parts.flatMap((part, k) => part.map((r) => renumber(r, k * size)));
      } catch (e) {
        abort.abort();
        if (e instanceof Error && /queue is at limit/i.test(e.message)) {
          throw queueFull();
        }
        throw e;
      }
    },
    runSizing: async (ctx, tasks) => {
      const p = get();
      const size = SIZING_CHUNK;
      const out = new Array<SizedItem>(tasks.length);
      let next = 0;
      const worker = async () => {
        while (next < tasks.length) {
          const start = next;
          next += size;
          inFlight++;
          try {
            const part = (await p.run({ kind: 'sizeItems', ctx, tasks: tasks.slice(start, start + size) })) as SizedItem[];
            for (let k = 0; k < part.length; k++) out[start + k] = part[k];
          } finally {
            inFlight--;
          }
        }
      };
      await Promise.all(Array.from({ length: Math.max(1, config.calc.maxThreads) }, worker));
      return out;
    },
    pending: () => inFlight,
    close: async () => {
      if (pool) await pool.destroy();
      pool = undefined;
    },
  };
}
