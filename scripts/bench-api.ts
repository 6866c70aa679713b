/**
 * Responsiveness of the API under a large calculation batch: while one POST /api/v1/calculations of
 * 10,000 cases runs, GET /api/v1/health is sent every 50 ms; prints the batch time and the health
 * latencies (median, max; target: every one under 200 ms). Needs the benchmark database (scripts/bench.sh).
 * `--json` prints one JSON object.
 */
import { performance } from 'node:perf_hooks';
import { startTestServer } from '../tests/helpers';
import { makeCases } from './bench-cases';

async function main(): Promise<void> {
  const server = await startTestServer();
  try {
    const body = JSON.stringify(makeCases('analyse', 10_000, 7));
    const latencies: number[] = [];
    let done = false;
    const t0 = performance.now();
    const batch = fetch(`${server.url}/api/v1/calculations`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body,
    }).then(async (res) => {
      const items = (await res.json()) as unknown[];
      done = true;
      return { status: res.status, items: items.length, seconds: (performance.now() - t0) / 1000 };
    });
    while (!done) {
      const s = performance.now();
      const res = await fetch(`${server.url}/api/v1/health`);
      await res.text();
      if (!done) latencies.push(performance.now() - s);
      await new Promise((r) => setTimeout(r, 50));
    }
    const result = await batch;
    latencies.sort((a, b) => a - b);
    const figures = {
      batchStatus: result.status,
      batchItems: result.items,
      batchSeconds: Number(result.seconds.toFixed(3)),
      healthSamples: latencies.length,
      healthMedianMs: latencies.length ? Number(latencies[Math.floor(latencies.length / 2)].toFixed(1)) : null,
      healthMaxMs: latencies.length ? Number(latencies[latencies.length - 1].toFixed(1)) : null,
      targetMs: 200,
    };
    console.log(JSON.stringify(figures));
  } finally {
    await server.close();
  }
}

void main();
