/**
 * First paint of Quick sizing, cold, in headless Chromium: builds nothing, serves the exported dist/
 * through the test server (its own fresh database), opens /quick-sizing in a new browser with an empty
 * cache and reads the paint entries. Three cold opens; the median is reported (target < 1500 ms).
 *
 *   node_modules/.bin/tsx scripts/bench-quick-sizing.ts [--json]
 *
 * Also reports when the page became interactive (the case link read and live results running).
 * BENCH_DIST_DIR points at another export. Needs the test MariaDB (DB_PORT, default 3317) and /usr/bin/chromium; `--json` prints one JSON line.
 */
import fs from 'node:fs';
import path from 'node:path';
import { chromium } from 'playwright-core';

import { CHROMIUM_ARGS, CHROMIUM_PATH } from '../tests/e2e/harness';
import { startTestServer } from '../tests/helpers/test-server';

const RUNS = 3;
const asJson = process.argv.includes('--json');

type Run = { firstPaintMs: number | null; firstContentfulPaintMs: number | null; interactiveMs: number | null };

const median = (xs: (number | null)[]) => {
  const v = xs.filter((x): x is number => x !== null).sort((a, b) => a - b);
  return v.length === 0 ? null : Math.round(v[Math.floor(v.length / 2)]);
};

async function main() {
  // BENCH_DIST_DIR measures an export made elsewhere (default: the project's dist/).
  const dist = process.env.BENCH_DIST_DIR ? path.resolve(process.env.BENCH_DIST_DIR) : path.resolve(__dirname, '..', 'dist');
  if (!fs.existsSync(path.join(dist, 'quick-sizing.html'))) {
    throw new Error('dist/quick-sizing.html is missing: export the web app first (npm run build:web).');
  }
  const server = await startTestServer({ config: { distDir: dist } });
  const runs: Run[] = [];
  try {
    for (let i = 0; i < RUNS; i++) {
      // A new browser each time: nothing cached, nothing warmed.
      const browser = await chromium.launch({ executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS, headless: true });
      try {
        const context = await browser.newContext({ viewport: { width: 390, height: 844 }, deviceScaleFactor: 1 });
        const page = await context.newPage();
        await page.goto(`${server.url}/quick-sizing`, { waitUntil: 'load' });
        await page.waitForSelector('[data-testid="qs-screen"][data-ready="true"]', { timeout: 30_000 });
        const interactiveMs = await page.evaluate(() => performance.now());
        // Paint entries appear once the frame is presented; give the browser a frame to report them.
        await page.waitForFunction(() => performance.getEntriesByType('paint').length >= 2, null, { timeout: 10_000 }).catch(() => undefined);
        const paints = await page.evaluate(() => performance.getEntriesByType('paint').map((e) => ({ name: e.name, t: e.startTime })));
        const fp = paints.find((p) => p.name === 'first-paint')?.t ?? null;
        const fcp = paints.find((p) => p.name === 'first-contentful-paint')?.t ?? null;
        runs.push({ firstPaintMs: fp, firstContentfulPaintMs: fcp, interactiveMs });
        await context.close();
      } finally {
        await browser.close();
      }
    }
  } finally {
    await server.close();
  }
  const result = {
    firstPaintMs: median(runs.map((r) => r.firstPaintMs)),
    firstContentfulPaintMs: median(runs.map((r) => r.firstContentfulPaintMs)),
    interactiveMs: median(runs.map((r) => r.interactiveMs)),
    runs: runs.map((r) => ({
      firstPaintMs: r.firstPaintMs === null ? null : Math.round(r.firstPaintMs),
      firstContentfulPaintMs: r.firstContentfulPaintMs === null ? null : Math.round(r.firstContentfulPaintMs),
      interactiveMs: r.interactiveMs === null ? null : Math.round(r.interactiveMs),
    })),
    targetMs: 1500,
  };
  if (asJson) {
    console.log(JSON.stringify(result));
  } else {
    console.log(`quick sizing, cold, 390×844, median of ${RUNS}:`);
    console.log(`  first paint             ${result.firstPaintMs ?? '–'} ms`);
    console.log(`  first contentful paint  ${result.firstContentfulPaintMs ?? '–'} ms (target < ${result.targetMs} ms)`);
    console.log(`  interactive (live)      ${result.interactiveMs ?? '–'} ms`);
  }
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
