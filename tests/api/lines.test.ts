import { sizeItem } from '../../shared/calc/sizing/size-item';
import { loadSizingContext, taskOf } from '../../server/sizing/sizing-context';
import { parseJson } from '../../server/db/db';
import { findItem } from '../../server/lines/items.repository';
import { addMember, type Agent, type ApiContext, createApiContext, signUpOwner } from '../helpers/api';

jest.setTimeout(120_000);

let ctx: ApiContext;
let owner: Agent;
let teamId: number;
let siteId: number;

const BASES = {
  touch: { airTemperatureC: 35, windSpeedMS: 0, contactSeconds: 5 },
  energy: { airTemperatureC: 10, windSpeedMS: 3, operatingHoursPerYear: 8000, energyPricePerKWh: 0.05, currency: 'EUR', heatSourceEfficiency: 0.85, co2KgPerKWh: 0.2 },
  condensation: { airTemperatureC: 30, relativeHumidityPct: 80, marginK: 1 },
};

const post = (a: Agent, path: string, body: object) => a.post(path).set('X-CSRF-Token', a.csrf).send(body);
const patch = (a: Agent, path: string, body: object) => a.patch(path).set('X-CSRF-Token', a.csrf).send(body);

async function waitForJob(a: Agent, id: number) {
  for (let i = 0; i < 600; i++) {
    const res = await a.get(`/api/v1/jobs/${id}`).expect(200);
    if (res.body.job.status === 'done' || res.body.job.status === 'failed') return res.body.job;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error('job did not finish');
}

async function sizeSite(a: Agent, site = siteId) {
  const res = await post(a, `/api/v1/sites/${site}/sizing`, {}).expect(202);
  expect(['queued', 'running', 'done']).toContain(res.body.job.status);
  return waitForJob(a, res.body.job.id);
}

beforeAll(async () => {
  ctx = await createApiContext();
  const o = await signUpOwner(ctx, { teamName: 'Line team' });
  owner = o.agent;
  teamId = o.teamId;
  const site = await post(owner, '/api/v1/sites', { name: 'Line site', designBases: BASES }).expect(201);
  siteId = site.body.site.id;
});
afterAll(async () => {
  await ctx.close();
});

describe('lines', () => {
  it('when a line is created by NPS, DN or outside diameter, then it is stored as given and in metres, unsized', async () => {
    const byNps = await post(owner, `/api/v1/sites/${siteId}/lines`, {
      tag: '4"-ST-001',
      service: 'Steam',
      nps: '4',
      lengthM: 120,
      operatingTemperatureC: 180,
      location: 'outdoor',
      purposes: ['heatConservation', 'personnelProtection'],
      fittings: { valves: 2, flanges: 4 },
      notes: 'Along rack 3',
    }).expect(201);
    expect(byNps.body.line).toMatchObject({
      tag: '4"-ST-001',
      nps: '4',
      sizeGivenAs: 'nps',
      outerDiameterM: 0.1143,
      lengthM: 120,
      location: 'outdoor',
      orientation: 'horizontal',
      purposes: ['personnelProtection', 'heatConservation'],
      fittings: { valves: 2, flanges: 4, elbows: 0, tees: 0 },
      sizing: null,
    });
    const byDn = await post(owner, `/api/v1/sites/${siteId}/lines`, { tag: 'DN40-A', dn: 40, lengthM: 10, operatingTemperatureC: 90, purposes: ['personnelProtection'] }).expect(201);
    expect(byDn.body.line).toMatchObject({ dn: 40, sizeGivenAs: 'dn', outerDiameterM: 0.0483 });
    const byOd = await post(owner, `/api/v1/sites/${siteId}/lines`, { tag: 'OD-A', outerDiameterM: 0.05, lengthM: 10, operatingTemperatureC: 90, purposes: ['personnelProtection'] }).expect(201);
    expect(byOd.body.line).toMatchObject({ nps: null, dn: null, sizeGivenAs: 'od', outerDiameterM: 0.05 });
    const got = await owner.get(`/api/v1/lines/${byNps.body.line.id}`).expect(200);
    expect(got.body.line.notes).toBe('Along rack 3');
  });

  it('when the input is bad, then 400 names the field and nothing is stored', async () => {
    const before = await ctx.db('items').count({ n: '*' });
    const cases: [object, string][] = [
      [{ tag: 'x'.repeat(10_000), nps: '2', lengthM: 1, operatingTemperatureC: 50, purposes: ['personnelProtection'] }, 'tag'],
      [{ tag: 'B1', nps: '2', lengthM: 'ten', operatingTemperatureC: 50, purposes: ['personnelProtection'] }, 'lengthM'],
      [{ tag: 'B2', nps: '2', lengthM: 1, operatingTemperatureC: 50, purposes: ['keepWarm'] }, 'purposes[0]'],
      [{ tag: 'B3', nps: '2', lengthM: 1, operatingTemperatureC: 50, purposes: ['personnelProtection'], colour: 'red' }, 'colour'],
      [{ tag: 'B4', nps: '2-3/4', lengthM: 1, operatingTemperatureC: 50, purposes: ['personnelProtection'] }, 'nps'],
      [{ tag: 'B5', nps: '2', dn: 50, lengthM: 1, operatingTemperatureC: 50, purposes: ['personnelProtection'] }, 'nps'],
      [{ tag: 'B6', nps: '2', lengthM: -1, operatingTemperatureC: 50, purposes: ['personnelProtection'] }, 'lengthM'],
      [{ tag: 'B7', nps: '2', lengthM: 1, operatingTemperatureC: 5000, purposes: ['personnelProtection'] }, 'operatingTemperatureC'],
      [{ tag: 'B8', nps: '2', lengthM: 1, operatingTemperatureC: 50, purposes: [] }, 'purposes'],
      [{ tag: 'B9', nps: '2', lengthM: 1, operatingTemperatureC: 50, purposes: ['personnelProtection'], buildUp: { layers: [{ materialId: 'unobtainium' }], finishId: 'pvc-jacket' } }, 'buildUp.layers[0].materialId'],
      [
        {
          tag: 'B10',
          nps: '2',
          lengthM: 1,
          operatingTemperatureC: 50,
          purposes: ['personnelProtection'],
          buildUp: { layers: [{ materialId: 'calcium-silicate-c533-type-i' }, { materialId: 'mineral-fibre-pipe-c547-type-i' }], finishId: 'pvc-jacket' },
        },
        'buildUp.layers[0].thicknessM',
      ],
    ];
    for (const [body, field] of cases) {
      const res = await post(owner, `/api/v1/sites/${siteId}/lines`, body);
      expect(res.status).toBe(400);
      expect(res.body.errors.map((e: { field?: string }) => e.field)).toContain(field);
    }
    const vessel = await post(owner, `/api/v1/sites/${siteId}/vessels`, { tag: 'V-X', diameterM: 2, lengthM: 4, operatingTemperatureC: 80, purposes: ['frostProtection'] });
    expect(vessel.status).toBe(400);
    expect(vessel.body.errors[0].field).toBe('purposes[0]');
    const after = await ctx.db('items').count({ n: '*' });
    expect(after).toEqual(before);
  });

  it('when a tag is used twice in a site, then 409 names the tag', async () => {
    const body = { tag: 'DUP-1', nps: '2', lengthM: 5, operatingTemperatureC: 60, purposes: ['personnelProtection'] };
    await post(owner, `/api/v1/sites/${siteId}/lines`, body).expect(201);
    const res = await post(owner, `/api/v1/sites/${siteId}/lines`, body).expect(409);
    expect(res.body.errors[0]).toMatchObject({ code: 'TAG_TAKEN', field: 'tag' });
  });

  it('when another team asks for this team\'s site, line or job, then 404', async () => {
    const other = await signUpOwner(ctx, { teamName: 'Other line team' });
    const line = await post(owner, `/api/v1/sites/${siteId}/lines`, { tag: 'PRIV-1', nps: '2', lengthM: 5, operatingTemperatureC: 60, purposes: ['personnelProtection'] }).expect(201);
    await other.agent.get(`/api/v1/sites/${siteId}/lines`).expect(404);
    await other.agent.get(`/api/v1/lines/${line.body.line.id}`).expect(404);
    await patch(other.agent, `/api/v1/lines/${line.body.line.id}`, { notes: 'mine now' }).expect(404);
    await other.agent.delete(`/api/v1/lines/${line.body.line.id}`).set('X-CSRF-Token', other.agent.csrf).expect(404);
    await post(other.agent, `/api/v1/sites/${siteId}/sizing`, {}).expect(404);
    const still = await owner.get(`/api/v1/lines/${line.body.line.id}`).expect(200);
    expect(still.body.line.notes).toBe('');
  });
});

describe('sizing a site', () => {
  it('when the site is sized, then every item has a result equal to shared/calc on its stored inputs', async () => {
    await post(owner, `/api/v1/sites/${siteId}/vessels`, { tag: 'V-101', diameterM: 2.4, lengthM: 6, orientation: 'vertical', headType: 'ellipsoidal2to1', operatingTemperatureC: 160, purposes: ['personnelProtection', 'heatConservation'] }).expect(201);
    await post(owner, `/api/v1/sites/${siteId}/lines`, { tag: 'CHW-001', nps: '6', lengthM: 80, operatingTemperatureC: 6, location: 'indoor', purposes: ['condensationControl'] }).expect(201);
    const job = await sizeSite(owner);
    expect(job.status).toBe('done');
    expect(job.done).toBe(job.total);
    const items = await ctx.db('items').where({ site_id: siteId }).select('id');
    const sctx = await loadSizingContext(ctx.db, teamId, siteId);
    for (const { id } of items) {
      const it = (await findItem(ctx.db, teamId, id))!;
      const stored = await ctx.db('item_results').where({ item_id: id }).first();
      expect(stored).toBeTruthy();
      expect(parseJson(stored.result, null)).toEqual(JSON.parse(JSON.stringify(sizeItem(taskOf(it), sctx))));
    }
    const list = await owner.get(`/api/v1/sites/${siteId}/lines?limit=1000`).expect(200);
    for (const l of list.body.lines) {
      expect(l.sizing).not.toBeNull();
      expect(l.sizing.stale).toBe(false);
    }
    const steam = list.body.lines.find((l: { tag: string }) => l.tag === '4"-ST-001');
    expect(steam.sizing.totalThicknessM).toBeGreaterThan(0);
    expect(steam.sizing.layersM.reduce((s: number, t: number) => s + t, 0)).toBeCloseTo(steam.sizing.totalThicknessM, 9);
    expect(steam.sizing.surfaceTemperatureC).toBeLessThanOrEqual(60);
    expect(steam.sizing.burnVerdict).toBe('pass');
    const cold = list.body.lines.find((l: { tag: string }) => l.tag === 'CHW-001');
    expect(cold.sizing.governingPurpose).toBe('condensationControl');
    const vessels = await owner.get(`/api/v1/sites/${siteId}/vessels`).expect(200);
    expect(vessels.body.vessels[0].sizing.heatLossW).toBeGreaterThan(0);
  });

  it('when a line, the site\'s bases or its settings change, then exactly the affected results are stale', async () => {
    await sizeSite(owner);
    const list = async () => (await owner.get(`/api/v1/sites/${siteId}/lines?limit=1000`).expect(200)).body.lines as { id: number; tag: string; sizing: { stale: boolean } | null }[];
    const staleTags = async () => (await list()).filter((l) => l.sizing?.stale).map((l) => l.tag).sort();
    expect(await staleTags()).toEqual([]);
    const steam = (await list()).find((l) => l.tag === '4"-ST-001')!;
    // A note changes no number.
    await patch(owner, `/api/v1/lines/${steam.id}`, { notes: 'insulate before winter' }).expect(200);
    expect(await staleTags()).toEqual([]);
    await patch(owner, `/api/v1/lines/${steam.id}`, { operatingTemperatureC: 200 }).expect(200);
    expect(await staleTags()).toEqual(['4"-ST-001']);
    await sizeSite(owner);
    // The condensation basis feeds only the cold line.
    await patch(owner, `/api/v1/sites/${siteId}`, { designBases: { condensation: { airTemperatureC: 32, relativeHumidityPct: 85, marginK: 1 } } }).expect(200);
    expect(await staleTags()).toEqual(['CHW-001']);
    await sizeSite(owner);
    const filtered = await owner.get(`/api/v1/sites/${siteId}/lines?status=stale`).expect(200);
    expect(filtered.body.lines).toEqual([]);
  });

  it('when the overview is read, then its totals add up the stored results', async () => {
    await sizeSite(owner);
    const res = await owner.get(`/api/v1/sites/${siteId}/overview`).expect(200);
    const o = res.body.overview;
    const rows = await ctx.db('item_results').where({ site_id: siteId }).select('heat_loss_w', 'annual_energy_kwh');
    const kw = rows.reduce((s: number, r: { heat_loss_w: number }) => s + r.heat_loss_w, 0) / 1000;
    expect(o.heatLossKW).toBeCloseTo(kw, 9);
    expect(o.bareHeatLossKW).toBeGreaterThan(o.heatLossKW);
    expect(o.counts.line.unsized).toBe(0);
    expect(Number(o.annualCost)).toBeGreaterThan(0);
    expect(o.byService.length).toBeGreaterThan(0);
  });

  it('when the list is paged with a cursor, then every line comes exactly once in sort order', async () => {
    const ids = new Set<number>();
    const temps: number[] = [];
    let cursor: string | null = null;
    do {
      const q: string = `/api/v1/sites/${siteId}/lines?limit=2&sort=-operatingTemperatureC${cursor ? `&cursor=${cursor}` : ''}`;
      const res = await owner.get(q).expect(200);
      for (const l of res.body.lines) {
        expect(ids.has(l.id)).toBe(false);
        ids.add(l.id);
        temps.push(l.operatingTemperatureC);
      }
      cursor = res.body.nextCursor;
    } while (cursor);
    const total = await ctx.db('items').where({ site_id: siteId, kind: 'line' }).count({ n: '*' });
    expect(ids.size).toBe(Number(total[0].n));
    expect(temps).toEqual([...temps].sort((a, b) => b - a));
    await owner.get(`/api/v1/sites/${siteId}/lines?cursor=garbage`).expect(400);
    await owner.get(`/api/v1/sites/${siteId}/lines?limit=1001`).expect(400);
    await owner.get(`/api/v1/sites/${siteId}/lines?sort=colour`).expect(400);
  });

  it('when a contractor reads an invited site, then they see its lines but cannot edit or size them', async () => {
    const contractor = await addMember(ctx, owner, 'contractor');
    await contractor.agent.get(`/api/v1/sites/${siteId}/lines`).expect(404);
    await post(owner, `/api/v1/sites/${siteId}/members`, { userId: contractor.userId }).expect(201);
    const list = await contractor.agent.get(`/api/v1/sites/${siteId}/lines`).expect(200);
    expect(list.body.lines.length).toBeGreaterThan(0);
    await patch(contractor.agent, `/api/v1/lines/${list.body.lines[0].id}`, { notes: 'x' }).expect(403);
    await post(contractor.agent, `/api/v1/sites/${siteId}/sizing`, {}).expect(403);
  });
});

describe('jobs across a restart', () => {
  it('when the process running a job stops, then a new process finishes it from its progress mark', async () => {
    const site = await post(owner, '/api/v1/sites', { name: 'Restart site', designBases: BASES }).expect(201);
    const sid = site.body.site.id;
    for (let i = 0; i < 30; i++) {
      await post(owner, `/api/v1/sites/${sid}/lines`, { tag: `R-${i}`, nps: '3', lengthM: 10, operatingTemperatureC: 100 + i, purposes: ['personnelProtection'] }).expect(201);
    }
    // Queue the job without anyone running it, as if the process stopped right after answering.
    const { startSiteSizing } = await import('../../server/sizing/sizing.service');
    const caller = { userId: (await ctx.db('users').first('id')).id as number, teamId, role: 'owner' as const, email: '', name: '' };
    const { job } = await startSiteSizing({ db: ctx.db }, caller, sid);
    // A process that claimed it and died: running, lease already expired, nothing done.
    await ctx.db('jobs').where({ id: job.id }).update({ status: 'running', lease_owner: 'dead-process', lease_expires_at: ctx.db.raw('NOW(3) - INTERVAL 1 SECOND') });
    const fresh = ctx.restart();
    fresh.locals.jobs.start();
    const done = await waitForJob(owner, job.id);
    expect(done.status).toBe('done');
    expect(done.done).toBe(30);
    const sized = await ctx.db('item_results').where({ site_id: sid }).count({ n: '*' });
    expect(Number(sized[0].n)).toBe(30);
    await fresh.locals.jobs.stop();
  });
});
