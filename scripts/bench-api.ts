/**
 * Responsiveness of the API under a large calculation batch: while one POST /api/v1/calculations of
 * 10,000 cases runs, GET /api/v1/health and a single-case POST /api/v1/calculations (the interactive
 * lane) are each sent every 50 ms; prints the batch time and both latencies (median, max; target: every
 * one under 200 ms). Needs the benchmark database (scripts/bench.sh). `--json` prints one JSON object.
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
    const single = JSON.stringify(makeCases('solve', 1, 11)[0]);
    const body = JSON.stringify(cases);
    const post = (payload: string) =>
      fetch(`${server.url}/api/v1/calculations`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: payload });
    // Both worker threads started, as in a server that has been running (a thread takes ~0.4 s to start).
    await Promise.all([post(JSON.stringify(cases.slice(0, 500))), post(single)].map(async (r) => (await r).text()));

    let done = false;
    const t0 = performance.now();
    const batch = post(body).then(async (res) => {
      const items = (await res.json()) as unknown[];
      done = true;
      return { status: res.status, items: items.length, seconds: (performance.now() - t0) / 1000 };
    });
    const sample = async (request: () => Promise<Response>) => {
      const latencies: number[] = [];
      while (!done) {
        const s = performance.now();
        const res = await request();
        await res.text();
        if (!done) latencies.push(performance.now() - s);
        await new Promise((r) => setTimeout(r, 50));
      }
      return latencies.sort((a, b) => a - b);
    };
    const [health, singleCase, result] = await Promise.all([
      sample(() => fetch(`${server.url}/api/v1/health`)),
      sample(() => post(single)),
      batch,
    ]);
    const figures = {
      batchStatus: result.status,
      batchItems: result.items,
      batchSeconds: Number(result.seconds.toFixed(3)),
      healthSamples: health.length,
      healthMedianMs: median(health),
      healthMaxMs: max(health),
      singleCaseSamples: singleCase.length,
      singleCaseMedianMs: median(singleCase),
      singleCaseMaxMs: max(singleCase),
      targetMs: 200,
    };
    console.log(JSON.stringify(figures));
  } finally {
    await server.close();
  }
}

void main();
