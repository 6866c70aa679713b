/**
 * npm run bench — speed figures for the calculation core and the command-line entry point.
 *   analyse / solve in process: cases per second, median and p95 per case [ms]
 *   calc CLI wall time for 10,000 analyses and 1,000 thickness solves, process start included [s]
 *   API health and single-case latency while a 10,000-case batch runs [ms]
 *   quick-sizing first paint in headless Chromium (when the web app is built and Chromium exists) [ms]
 *   register photo from a 40-megapixel JPEG and PNG: time [ms] and peak resident memory [MB]
 *   insulation schedule of 10,000 lines rendered to PDF [s] (target < 20 s)
 * `--json` prints one JSON object of named figures instead of the table.
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { runCase } from '../shared/calc';
import { makeCases } from './bench-cases';

const root = path.resolve(__dirname, '..');
const asJson = process.argv.includes('--json');

function percentile(sorted: number[], p: number): number {
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[i];
}

function timeEach(kind: 'analyse' | 'solve', count: number, seed: number) {
  const cases = makeCases(kind, count, seed);
  const times: number[] = [];
  let errors = 0;
  const t0 = performance.now();
  for (const c of cases) {
    const s = performance.now();
    const r = runCase(c);
    times.push(performance.now() - s);
    if ('error' in r) errors++;
  }
  const total = (performance.now() - t0) / 1000;
  times.sort((a, b) => a - b);
  return {
    cases: count,
    errors,
    casesPerSecond: Math.round(count / total),
    medianMs: Number(percentile(times, 50).toFixed(4)),
    p95Ms: Number(percentile(times, 95).toFixed(4)),
  };
}

function cliWall(kind: 'analyse' | 'solve', count: number, seed: number) {
  const input = JSON.stringify(makeCases(kind, count, seed));
  const t0 = performance.now();
  const r = spawnSync('npm', ['run', '--silent', 'calc'], { cwd: root, input, maxBuffer: 1 << 28 });
  const wallS = (performance.now() - t0) / 1000;
  let items = -1;
  try {
    items = (JSON.parse(r.stdout.toString()) as unknown[]).length;
  } catch {
    items = -1;
  }
  return { cases: count, wallSeconds: Number(wallS.toFixed(3)), exitCode: r.status, itemsOut: items };
}

/** Runs a companion benchmark script and reads the one JSON object on its last output line. */
function runJsonScript(script: string, args: string[], env: NodeJS.ProcessEnv): Record<string, unknown> {
  const r = spawnSync(path.join(root, 'node_modules', '.bin', 'tsx'), [path.join(root, 'scripts', script), ...args], {
    cwd: root,
    env,
    timeout: 300_000,
  });
  try {
    const lines = r.stdout.toString().trim().split('\n');
    return JSON.parse(lines[lines.length - 1]);
  } catch {
    return { note: `failed: ${r.stderr.toString().slice(0, 300)}` };
  }
}

function firstPaint(): Record<string, unknown> {
  if (!existsSync(path.join(root, 'dist')) || !existsSync('/usr/bin/chromium')) {
    return { firstPaintMs: null, firstContentfulPaintMs: null, note: 'skipped: needs dist/ (npm run build:web) and /usr/bin/chromium' };
  }
  return runJsonScript('bench-quick-sizing.ts', ['--json'], process.env);
}

function apiUnderLoad(): Record<string, unknown> {
  return runJsonScript('bench-api.ts', [], { ...process.env, NODE_ENV: 'test' });
}

function lineLists(): Record<string, unknown> {
  return runJsonScript('bench-lines.ts', [], { ...process.env, NODE_ENV: 'test' });
}
const schedulePdf = runJsonScript('bench-reports.ts', ['10000'], process.env);

const figures = {
  schedulePdf10kS: (schedulePdf.schedulePdf10kS as number | undefined) ?? null,
  schedulePdf10k: schedulePdf,
  analyse: timeEach('analyse', 5000, 1),
  solve: timeEach('solve', 500, 2),
  cliAnalyse10000: cliWall('analyse', 10_000, 3),
  cliSolve1000: cliWall('solve', 1000, 4),
  apiHealthDuring10000Batch: apiUnderLoad(),
  ...lineLists(),
  quickSizingPaint: process.argv.includes('--no-browser') ? null : firstPaint(),
  registerPhoto40mp: runJsonScript('bench-photos.ts', [], process.env),
};

if (asJson) {
  process.stdout.write(JSON.stringify(figures) + '\n');
} else {
  const a = figures.analyse;
  const s = figures.solve;
  console.log('Lagline benchmark (seeded cases spanning the domain; nothing cached between cases)');
  console.log(`analyse  ${a.casesPerSecond} cases/s   median ${a.medianMs} ms   p95 ${a.p95Ms} ms   (${a.cases} cases, ${a.errors} errors)`);
  console.log(`solve    ${s.casesPerSecond} cases/s   median ${s.medianMs} ms   p95 ${s.p95Ms} ms   (${s.cases} cases, ${s.errors} errors)`);
  console.log(`calc CLI 10,000 analyses: ${figures.cliAnalyse10000.wallSeconds} s wall (target ≤ 2.5 s)`);
  console.log(`calc CLI 1,000 solves:    ${figures.cliSolve1000.wallSeconds} s wall (target ≤ 2.5 s)`);
  const h = figures.apiHealthDuring10000Batch;
  if (h) {
    console.log(`API: 10,000-case batch ${h.batchSeconds ?? '–'} s; health during it median ${h.healthMedianMs ?? '–'} ms, max ${h.healthMaxMs ?? '–'} ms over ${h.healthSamples ?? 0} requests (target < 200 ms)${h.note ? ' — ' + h.note : ''}`);
    console.log(`API: single case during the batch median ${h.singleCaseMedianMs ?? '–'} ms, max ${h.singleCaseMaxMs ?? '–'} ms over ${h.singleCaseSamples ?? 0} requests (target < 200 ms)`);
  }
  const l = figures as Record<string, unknown>;
  console.log(`line list: 10,000 lines sized through the job in ${l.sizeSite10kLinesS ?? '–'} s (target ≤ 10 s); health during it median ${l.healthDuringSizingMedianMs ?? '–'} ms, max ${l.healthDuringSizingMaxMs ?? '–'} ms (target < 200 ms); first page of 1,000 lines ${l.listPage1000Ms ?? '–'} ms (target ≤ 300 ms)`);
  const r = figures.schedulePdf10k;
  console.log(`insulation schedule PDF, 10,000 lines: ${figures.schedulePdf10kS ?? '–'} s wall, ${r.schedulePdf10kCpuS ?? '–'} s CPU, ${r.pages ?? '–'} pages (target < 20 s)${r.note ? ' — ' + r.note : ''}`);
  const p = figures.quickSizingPaint;
  if (p) console.log(`quick sizing first contentful paint: ${p.firstContentfulPaintMs ?? '–'} ms (target < 1500 ms)${p.note ? ' — ' + p.note : ''}`);
  const ph = figures.registerPhoto40mp as { jpeg40mp?: { ms: number; rssRiseMB: number }; png40mp?: { ms: number; rssRiseMB: number }; note?: string };
  if (ph.jpeg40mp && ph.png40mp) {
    console.log(`register photo, 40 MP: JPEG ${ph.jpeg40mp.ms} ms, memory +${ph.jpeg40mp.rssRiseMB} MB; PNG ${ph.png40mp.ms} ms, memory +${ph.png40mp.rssRiseMB} MB (target < 150 MB)`);
  } else console.log(`register photo, 40 MP: ${ph.note ?? 'no figures'}`);
}
