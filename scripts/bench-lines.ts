/**
 * Line-list figures: 10,000 generated lines with mixed purposes sized and stored through the job
 * (POST /sites/:id/sizing until GET /jobs/:id says done, wall time), GET /api/v1/health every 50 ms while the
 * job runs (median and max latency), and the first page of 1,000 lines (median of five reads).
 * Needs the benchmark database (scripts/bench.sh). Prints one JSON object.
 */
import { performance } from 'node:perf_hooks';
import { itemInsertRow, type ItemWrite } from '../server/lines/items.repository';
import { insertSite } from '../server/sites/sites.repository';
import { loadSizingContext } from '../server/sizing/sizing-context';
import { sizingInputHash } from '../shared/calc/sizing/size-item';
import type { Purpose } from '../shared/calc/sizing/types';
import { pipeSizeByNps } from '../shared/calc/pipe-sizes';
import { startTestServer } from '../tests/helpers';
import { seededRandom } from './bench-cases';

const LINES = 10_000;
const NPS = ['1', '1-1/2', '2', '3', '4', '6', '8', '10', '12'];

/** Mixed purposes as a plant's line list has them: mostly hot lines, some cold, a few frost and holding. */
function generated(k: number, rnd: () => number): ItemWrite {
  const size = pipeSizeByNps(NPS[Math.floor(rnd() * NPS.length)]);
  const r = rnd();
  let t: number;
  let purposes: Purpose[];
  let purposeParameters: ItemWrite['purposeParameters'] = {};
  if (r < 0.55) {
    t = 90 + rnd() * 250;
    purposes = ['personnelProtection', 'heatConservation'];
  } else if (r < 0.7) {
    t = 60 + rnd() * 200;
    purposes = ['heatConservation'];
  } else if (r < 0.9) {
    t = -40 + rnd() * 50;
    purposes = ['condensationControl'];
  } else if (r < 0.95) {
    t = 5 + rnd() * 15;
    purposes = ['frostProtection'];
    purposeParameters = { frostProtection: { minHours: 6 + Math.floor(rnd() * 10) } };
  } else {
    t = 150 + rnd() * 150;
    purposes = ['personnelProtection', 'temperatureHolding'];
    purposeParameters = { temperatureHolding: { massFlowKgPerS: 0.5 + rnd() * 3, specificHeatJPerKgK: 2300, maxChangeK: 5 } };
  }
  return {
    tag: `B-${k}`,
    service: purposes.join('+'),
    sizeKind: 'nps',
    nps: size.nps,
    dn: size.dn,
    outerDiameterM: size.outerDiameterM,
    lengthM: 5 + Math.round(rnd() * 150),
    orientation: 'horizontal',
    heightM: null,
    headType: null,
    location: rnd() < 0.7 ? 'outdoor' : 'indoor',
    operatingTemperatureC: Math.round(t),
    purposes,
    purposeParameters,
    fittings: { valves: Math.floor(rnd() * 3), flanges: Math.floor(rnd() * 5), elbows: 0, tees: 0 },
    fittingsInsulated: true,
    buildUp: null,
    notes: '',
    inputHash: '',
  };
}

async function main(): Promise<void> {
  const server = await startTestServer();
  try {
    // An owner signed in through the API, as the app would be.
    const first = await fetch(`${server.url}/api/v1/auth/session`);
    let cookie = first.headers.get('set-cookie')!.split(';')[0];
    const { csrfToken } = (await first.json()) as { csrfToken: string };
    const signup = await fetch(`${server.url}/api/v1/auth/signup`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', cookie, 'x-csrf-token': csrfToken },
      body: JSON.stringify({ name: 'Bench Owner', email: 'bench@example.test', password: 'amber-ledger-quarry-61', teamName: 'Bench team' }),
    });
    cookie = signup.headers.get('set-cookie')?.split(';')[0] ?? cookie;
    const session = (await signup.json()) as { csrfToken: string; team: { id: number }; user: { id: number } };
    const teamId = session.team.id;
    const siteId = await insertSite(server.db, {
      teamId,
      name: 'Bench site',
      description: '',
      designBases: {
        touch: { airTemperatureC: 35, windSpeedMS: 0, contactSeconds: 5 },
        energy: { airTemperatureC: 10, windSpeedMS: 3, operatingHoursPerYear: 8000 },
        condensation: { airTemperatureC: 30, relativeHumidityPct: 80, marginK: 1 },
        winter: { airTemperatureC: -10, windSpeedMS: 5 },
      } as never,
      createdBy: session.user.id,
    });
    const ctx = await loadSizingContext(server.db, teamId, siteId);
    const rnd = seededRandom(11);
    const rows = [];
    for (let k = 0; k < LINES; k++) {
      const w = generated(k, rnd);
      const hash = sizingInputHash({ item: { ...w, kind: 'line' }, buildUp: null }, ctx);
      rows.push(itemInsertRow(teamId, siteId, 'line', session.user.id, { ...w, inputHash: hash }));
    }
    for (let k = 0; k < rows.length; k += 1000) await server.db('items').insert(rows.slice(k, k + 1000));

    const headers = { cookie, 'content-type': 'application/json', 'x-csrf-token': session.csrfToken };
    const latencies: number[] = [];
    const t0 = performance.now();
    const start = await fetch(`${server.url}/api/v1/sites/${siteId}/sizing`, { method: 'POST', headers, body: '{}' });
    const { job } = (await start.json()) as { job: { id: number } };
    let status = 'queued';
    let done = 0;
    while (status === 'queued' || status === 'running') {
      const s = performance.now();
      const h = await fetch(`${server.url}/api/v1/health`);
      await h.text();
      latencies.push(performance.now() - s);
      const j = (await (await fetch(`${server.url}/api/v1/jobs/${job.id}`, { headers })).json()) as { job: { status: string; done: number } };
      status = j.job.status;
      done = j.job.done;
      await new Promise((r) => setTimeout(r, 50));
    }
    const sizeSeconds = (performance.now() - t0) / 1000;

    const pageTimes: number[] = [];
    let pageCount = 0;
    for (let i = 0; i < 5; i++) {
      const s = performance.now();
      const res = await fetch(`${server.url}/api/v1/sites/${siteId}/lines?limit=1000`, { headers });
      const body = (await res.json()) as { lines: unknown[] };
      pageTimes.push(performance.now() - s);
      pageCount = body.lines.length;
    }
    latencies.sort((a, b) => a - b);
    pageTimes.sort((a, b) => a - b);
    console.log(
      JSON.stringify({
        sizeSite10kLinesS: Number(sizeSeconds.toFixed(2)),
        sizeSite10kLinesStatus: status,
        sizeSite10kLinesDone: done,
        sizeSite10kLinesTargetS: 10,
        healthDuringSizingMedianMs: latencies.length ? Number(latencies[Math.floor(latencies.length / 2)].toFixed(1)) : null,
        healthDuringSizingMaxMs: latencies.length ? Number(latencies[latencies.length - 1].toFixed(1)) : null,
        healthDuringSizingTargetMs: 200,
        listPage1000Ms: Number(pageTimes[2].toFixed(1)),
        listPage1000Rows: pageCount,
        listPage1000TargetMs: 300,
      }),
    );
  } finally {
    await server.close();
  }
}

void main();
