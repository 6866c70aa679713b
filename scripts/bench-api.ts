/**
 * Responsiveness of the API under a large calculation batch. While one POST /api/v1/calculations of
 * 10,000 cases runs on a freshly started server, GET /api/v1/health is sent every 50 ms; then, with the
 * worker threads started, a second such batch runs while a single case is posted every 50 ms (the
 * interactive lane). Prints each batch's time and both latencies (median, max; target: every one under
 * 200 ms). Needs the benchmark database (scripts/bench.sh). `--json` prints one JSON object.
 */
import { performance } from 'node:perf_hooks';
import { startTestServer } from '../tests/helpers';
import { makeCases } from './bench-cases';

const median = (sorted: number[]) => (sorted.length ? Number(sorted[Math.floor(sorted.length / 2)].toFixed(1)) : null);
const max = (sorted: number[]) => (sorted.length ? Number(sorted[sorted.length - 1].toFixed(1)) : null);

async function main(): Promise<void> {
  const server = await startTestServer();
  try {
    const cases = makeCases('analyse', 10_000, 7);
    const body = JSON.stringify(cases);
    const single = JSON.stringify(makeCases('solve', 1, 11)[0]);
    const post = (payload: string) =>
      fetch(`${server.url}/api/v1/calculations`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: payload });

    /** Runs one batch while `probe` is sent every 50 ms; the probe's latencies (sorted) and the batch. */
    const duringBatch = async (probe: () => Promise<Response>) => {
      let done = false;
      const t0 = performance.now();
      const batch = post(body).then(async (res) => {
        const items = (await res.json()) as unknown[];
        done = true;
        return { status: res.status, items: items.length, seconds: (performance.now() - t0) / 1000 };
      });
      const latencies: number[] = [];
      while (!done) {
        const s = performance.now();
        const res = await probe();
        await res.text();
        if (!done) latencies.push(performance.now() - s);
        await new Promise((r) => setTimeout(r, 50));
      }
      return { batch: await batch, latencies: latencies.sort((a, b) => a - b) };
    };

    const health = await duringBatch(() => fetch(`${server.url}/api/v1/health`));
    // Both lanes' threads started (a thread takes ~0.4 s to start), as in a server that has been running.
    await Promise.all([post(JSON.stringify(cases.slice(0, 500))), post(single)].map(async (r) => (await r).text()));
    const singles = await duringBatch(() => post(single));
    const figures = {
      batchStatus: health.batch.status,
      batchItems: health.batch.items,
      batchSeconds: Number(health.batch.seconds.toFixed(3)),
      healthSamples: health.latencies.length,
      healthMedianMs: median(health.latencies),
      healthMaxMs: max(health.latencies),
      singleCaseBatchSeconds: Number(singles.batch.seconds.toFixed(3)),
      singleCaseSamples: singles.latencies.length,
      singleCaseMedianMs: median(singles.latencies),
      singleCaseMaxMs: max(singles.latencies),
      targetMs: 200,
    };
    console.log(JSON.stringify(figures));
  } finally {
    await server.close();
  }
}

void main();
