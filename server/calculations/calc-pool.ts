import path from 'node:path';
import { Piscina } from 'piscina';
import type { Config } from '../config';
import { errors } from '../errors';

export type CalcPool = {
  /** Runs the cases in worker threads, in chunks so other requests interleave; results in order. */
  run: (cases: unknown[]) => Promise<unknown[]>;
  close: () => Promise<void>;
};

export function createCalcPool(config: Pick<Config, 'calc'>, workerFile = path.join(__dirname, 'calc.worker-boot.js')): CalcPool {
  let pool: Piscina | undefined;
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
        throw errors.unavailable('BUSY', 'The calculation queue is full; try again in a moment.');
      }
      const abort = new AbortController();
      try {
        const parts = await Promise.all(chunks.map((c) => p.run(c, { signal: abort.signal }) as Promise<unknown[]>));
        return parts.flat();
      } catch (e) {
        abort.abort();
        if (e instanceof Error && /queue is at limit/i.test(e.message)) {
          throw errors.unavailable('BUSY', 'The calculation queue is full; try again in a moment.');
        }
        throw e;
      }
    },
    close: async () => {
      if (pool) await pool.destroy();
      pool = undefined;
    },
  };
}
