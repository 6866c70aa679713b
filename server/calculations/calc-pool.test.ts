import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createCalcPool, type CalcPool } from './calc-pool';

jest.setTimeout(30_000);

/** A stand-in worker: each chunk holds one `{ tag, ms }` and answers its tag after ms. */
const WORKER = `module.exports = async (task) => {
  if (task.kind !== 'cases') throw new Error('unknown kind ' + task.kind);
  const [{ tag, ms }] = task.cases;
  await new Promise((r) => setTimeout(r, ms));
  return [tag];
};`;

let dir: string;
let workerFile: string;
const pools: CalcPool[] = [];

beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'lagline-pool-'));
  workerFile = path.join(dir, 'worker.js');
  fs.writeFileSync(workerFile, WORKER);
});
afterAll(async () => {
  for (const p of pools) await p.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

const pool = (calc: { maxThreads?: number; maxQueue?: number } = {}) => {
  const p = createCalcPool({ calc: { maxThreads: calc.maxThreads ?? 1, maxQueue: calc.maxQueue ?? 100, chunkSize: 1 } }, workerFile);
  pools.push(p);
  return p;
};

/** Submits one tagged chunk and records when it finishes. */
const track = (p: CalcPool, order: string[], tag: string, ms: number, options: Parameters<CalcPool['submit']>[1]) =>
  p.submit({ kind: 'cases', cases: [{ tag, ms }] }, options).then((r) => {
    order.push(tag);
    return r;
  });

describe('calculation pool lanes', () => {
  it('when two owners queue batch work, then they take turns instead of first come, first served', async () => {
    const p = pool();
    const order: string[] = [];
    const a = ['a1', 'a2', 'a3', 'a4', 'a5', 'a6'].map((t) => track(p, order, t, 40, { lane: 'batch', owner: 'A' }));
    const b = ['b1', 'b2'].map((t) => track(p, order, t, 40, { lane: 'batch', owner: 'B' }));
    await Promise.all([...a, ...b]);
    expect(order.indexOf('b2')).toBeLessThan(order.indexOf('a4'));
    expect(order.indexOf('b1')).toBeLessThan(order.indexOf('a3'));
  });

  it('when batch work fills the batch threads, then interactive work runs on its own thread ahead of the queued batch', async () => {
    const p = pool();
    const order: string[] = [];
    // Warm both threads first, so thread start-up does not blur the order.
    await Promise.all([track(p, [], 'w1', 1, { lane: 'batch' }), track(p, [], 'w2', 1, { lane: 'interactive' })]);
    const batch = ['c1', 'c2', 'c3', 'c4'].map((t) => track(p, order, t, 80, { lane: 'batch', owner: 'big' }));
    await new Promise((r) => setTimeout(r, 10));
    const single = await track(p, order, 'single', 1, { lane: 'interactive' });
    expect(single).toEqual(['single']);
    expect(order[0]).toBe('single');
    await Promise.all(batch);
    expect(order).toEqual(['single', 'c1', 'c2', 'c3', 'c4']);
  });

  it('when the batch queue is full, then batch work is refused with BUSY but interactive work still runs', async () => {
    const p = pool({ maxQueue: 2 });
    await expect(p.run([{ tag: 'x', ms: 1 }, { tag: 'y', ms: 1 }, { tag: 'z', ms: 1 }], { lane: 'batch' })).rejects.toMatchObject({ code: 'BUSY', status: 503 });
    const held = p.run([{ tag: 'x', ms: 60 }, { tag: 'y', ms: 60 }], { lane: 'batch' });
    // One of those runs, one waits: two more would overfill the queue of two.
    await expect(p.run([{ tag: 'z', ms: 1 }, { tag: 'w', ms: 1 }], { lane: 'batch' })).rejects.toMatchObject({ code: 'BUSY' });
    await expect(p.run([{ tag: 'now', ms: 1 }], { lane: 'interactive' })).resolves.toEqual(['now']);
    await expect(held).resolves.toEqual(['x', 'y']);
  });

  it('when the caller aborts, then its queued chunks are dropped and the work answers CANCELLED', async () => {
    const p = pool();
    const abort = new AbortController();
    const job = p.run(
      Array.from({ length: 20 }, (_, i) => ({ tag: `t${i}`, ms: 20 })),
      { lane: 'batch', signal: abort.signal },
    );
    await new Promise((r) => setTimeout(r, 30));
    abort.abort();
    await expect(job).rejects.toMatchObject({ code: 'CANCELLED' });
    expect(p.pending()).toBeLessThanOrEqual(1);
    await expect(p.run([{ tag: 'after', ms: 1 }])).resolves.toEqual(['after']);
  });

  it('when a task kind is unknown to the worker, then that work fails and the pool carries on', async () => {
    const p = pool();
    await expect(p.submit({ kind: 'nothing' } as never)).rejects.toThrow(/unknown kind/);
    await expect(p.run([{ tag: 'ok', ms: 1 }])).resolves.toEqual(['ok']);
  });
});
