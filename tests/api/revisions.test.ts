/**
 * Revisions of a site's line list: preparing (snapshot, numbering, blockers), checking and approving by three
 * different members, read-only once issued (by the API and by the database), withdrawing, numbering schemes,
 * and the comparison of two revisions or a revision with the draft (JSON and CSV).
 */
import { parseJson } from '../../server/db/db';
import { upsertResults } from '../../server/lines/items.repository';
import { addMember, type Agent, type ApiContext, createApiContext, signUpOwner } from '../helpers/api';
import { sizeSiteAndWait } from '../helpers/sizing';

jest.setTimeout(180_000);

let ctx: ApiContext;
let owner: Agent;
let preparer: Agent;
let checker: Agent;
let safety: Agent;
let viewer: Agent;
let siteId: number;

const BASES = {
  touch: { airTemperatureC: 35, windSpeedMS: 0, contactSeconds: 5 },
  energy: { airTemperatureC: 10, windSpeedMS: 3, operatingHoursPerYear: 8000, energyPricePerKWh: 0.05, currency: 'EUR', heatSourceEfficiency: 0.85, co2KgPerKWh: 0.2 },
  condensation: { airTemperatureC: 30, relativeHumidityPct: 80, marginK: 1 },
};

const post = (a: Agent, path: string, body: object = {}) => a.post(path).set('X-CSRF-Token', a.csrf).send(body);
const patch = (a: Agent, path: string, body: object) => a.patch(path).set('X-CSRF-Token', a.csrf).send(body);
const del = (a: Agent, path: string) => a.delete(path).set('X-CSRF-Token', a.csrf);

const sizeSite = (a: Agent, site = siteId) => sizeSiteAndWait(a, site);

async function line(a: Agent, body: object, site = siteId) {
  return (await post(a, `/api/v1/sites/${site}/lines`, { lengthM: 50, purposes: ['personnelProtection', 'heatConservation'], ...body }).expect(201)).body.line;
}

beforeAll(async () => {
  ctx = await createApiContext();
  const o = await signUpOwner(ctx, { teamName: 'Revision team' });
  owner = o.agent;
  preparer = (await addMember(ctx, owner, 'engineer')).agent;
  checker = (await addMember(ctx, owner, 'engineer')).agent;
  safety = (await addMember(ctx, owner, 'safety')).agent;
  viewer = (await addMember(ctx, owner, 'viewer')).agent;
  siteId = (await post(owner, '/api/v1/sites', { name: 'Revision site', designBases: BASES }).expect(201)).body.site.id;
  await line(preparer, { tag: 'HS-001', service: 'HP steam', nps: '4', operatingTemperatureC: 190, fittings: { valves: 2, flanges: 4 } });
  await line(preparer, { tag: 'HS-002', service: 'HP steam', nps: '2', operatingTemperatureC: 190 });
  await line(preparer, { tag: 'CR-010', service: 'Condensate', nps: '1-1/2', operatingTemperatureC: 95 });
  await post(preparer, `/api/v1/sites/${siteId}/vessels`, { tag: 'V-01', service: 'Flash vessel', diameterM: 1.2, lengthM: 2.5, operatingTemperatureC: 150, purposes: ['personnelProtection'] }).expect(201);
});
afterAll(async () => {
  await ctx.close();
});

describe('preparing a revision', () => {
  it('when items are unsized, then preparing is refused with every tag and why, and nothing is stored', async () => {
    const ready = (await viewer.get(`/api/v1/sites/${siteId}/revisions/readiness`).expect(200)).body.readiness;
    expect(ready).toMatchObject({ ready: false, itemCount: 4, blockerCount: 4, nextNumbers: { review: 'A', construction: '0' } });
    expect(ready.blockers.map((b: { tag: string; reason: string }) => `${b.tag}:${b.reason}`).sort()).toEqual(['CR-010:unsized', 'HS-001:unsized', 'HS-002:unsized', 'V-01:unsized']);

    const res = await post(preparer, `/api/v1/sites/${siteId}/revisions`, { purpose: 'review' }).expect(409);
    expect(res.body.errors[0]).toMatchObject({ code: 'ITEMS_NOT_READY' });
    expect(res.body.errors.slice(1).map((e: { code: string; field: string }) => `${e.code} ${e.field}`).sort()).toEqual([
      'ITEM_UNSIZED lines[CR-010]',
      'ITEM_UNSIZED lines[HS-001]',
      'ITEM_UNSIZED lines[HS-002]',
      'ITEM_UNSIZED vessels[V-01]',
    ]);
    expect(res.body.errors[1].message).toMatch(/has not been sized/);
    expect(await ctx.db('revisions').count({ n: '*' })).toEqual([{ n: 0 }]);
  });

  it('when an item is stale, then issuing is refused naming that tag; after sizing again it is ready', async () => {
    await sizeSite(preparer);
    const lines = (await owner.get(`/api/v1/sites/${siteId}/lines`).expect(200)).body.lines as { id: number; tag: string }[];
    const hs2 = lines.find((l) => l.tag === 'HS-002')!;
    await patch(preparer, `/api/v1/lines/${hs2.id}`, { operatingTemperatureC: 200 }).expect(200);
    const res = await post(preparer, `/api/v1/sites/${siteId}/revisions`, { purpose: 'review' }).expect(409);
    expect(res.body.errors.slice(1)).toEqual([expect.objectContaining({ code: 'ITEM_STALE', field: 'lines[HS-002]', message: expect.stringMatching(/HS-002 changed since it was sized/) })]);
    await sizeSite(preparer);
    const ready = (await owner.get(`/api/v1/sites/${siteId}/revisions/readiness`).expect(200)).body.readiness;
    expect(ready).toMatchObject({ ready: true, blockerCount: 0, blockers: [] });
  });

  it('when an item could not be sized, then it blocks too, with the reason sizing gave', async () => {
    const cr = await ctx.db('items').where({ site_id: siteId, tag: 'CR-010' }).first('id', 'input_hash');
    await upsertResults(ctx.db, [{ itemId: cr.id, siteId, inputHash: cr.input_hash, result: { error: { code: 'CALCULATION_FAILED', field: 'layers[0]', message: 'the surface balance did not converge' } }, sizedAt: new Date() }]);
    const ready = (await owner.get(`/api/v1/sites/${siteId}/revisions/readiness`).expect(200)).body.readiness;
    expect(ready.blockers).toEqual([expect.objectContaining({ tag: 'CR-010', reason: 'error', message: 'Line CR-010 could not be sized: the surface balance did not converge.' })]);
    const res = await post(preparer, `/api/v1/sites/${siteId}/revisions`, { purpose: 'review' }).expect(409);
    expect(res.body.errors[1]).toMatchObject({ code: 'ITEM_SIZING_ERROR', field: 'lines[CR-010]' });
    await sizeSite(preparer);
    expect((await owner.get(`/api/v1/sites/${siteId}/revisions/readiness`).expect(200)).body.readiness.ready).toBe(true);
  });

  it('when an engineer prepares, then revision A holds a snapshot of every item with its result, the bases and settings', async () => {
    const res = await post(preparer, `/api/v1/sites/${siteId}/revisions`, { purpose: 'review', description: 'First issue for comment' }).expect(201);
    const r = res.body.revision;
    expect(r).toMatchObject({
      number: 'A',
      purpose: 'review',
      purposeLabel: 'Issued for review',
      status: 'prepared',
      itemCount: 4,
      description: 'First issue for comment',
      prepared: { name: 'Test engineer', at: expect.any(String) },
      checked: null,
      approved: null,
      issuedAt: null,
      designBases: BASES,
      sizingSettings: expect.objectContaining({ seriesMm: expect.any(Array), maxSingleLayerMm: 100 }),
    });
    expect(r.snapshotHash).toMatch(/^[0-9a-f]{64}$/);
    expect(r.totals).toMatchObject({ lines: 3, vessels: 1 });
    expect(r.totals.heatLossW).toBeGreaterThan(0);
    const stored = await ctx.db('revision_items').where({ revision_id: r.id }).orderBy('position').select('tag', 'item', 'result');
    expect(stored.map((s: { tag: string }) => s.tag)).toEqual(['HS-001', 'HS-002', 'CR-010', 'V-01']);
    const current = await ctx.db('item_results as r').join('items as i', 'i.id', 'r.item_id').where('i.tag', 'HS-002').first('r.result');
    expect(parseJson(stored[1].result, null)).toEqual(parseJson(current.result, {}));
    expect(parseJson(stored[1].item, null)).toMatchObject({ tag: 'HS-002', operatingTemperatureC: 200, nps: '2' });
  });

  it('when a revision is in progress, then another cannot be prepared', async () => {
    const res = await post(owner, `/api/v1/sites/${siteId}/revisions`, { purpose: 'construction' }).expect(409);
    expect(res.body.errors[0]).toMatchObject({ code: 'REVISION_IN_PROGRESS', message: expect.stringMatching(/Revision A is waiting to be checked/) });
  });

  it('when the body is wrong, then 400 names the field', async () => {
    const res = await post(owner, `/api/v1/sites/${siteId}/revisions`, { purpose: 'approval', colour: 'red' }).expect(400);
    expect(res.body.errors.map((e: { field: string }) => e.field).sort()).toEqual(['colour', 'purpose']);
  });
});

describe('sign-off', () => {
  let id: number;
  let hash: string;
  beforeAll(async () => {
    const list = (await owner.get(`/api/v1/sites/${siteId}/revisions`).expect(200)).body.revisions;
    id = list[0].id;
    hash = list[0].snapshotHash;
  });

  it('when the preparer checks their own revision, then it is refused (same person twice)', async () => {
    const res = await post(preparer, `/api/v1/revisions/${id}/check`, { snapshotHash: hash }).expect(409);
    expect(res.body.errors[0]).toMatchObject({ code: 'SAME_SIGNATORY', message: expect.stringMatching(/You prepared revision A/) });
  });

  it('when a safety officer or a viewer signs, then 403 (the role may not issue revisions)', async () => {
    for (const a of [safety, viewer]) {
      const res = await post(a, `/api/v1/revisions/${id}/check`, { snapshotHash: hash }).expect(403);
      expect(res.body.errors[0].code).toBe('FORBIDDEN');
      await post(a, `/api/v1/revisions/${id}/approve`, { snapshotHash: hash }).expect(403);
      await post(a, `/api/v1/sites/${siteId}/revisions`, { purpose: 'review' }).expect(403);
    }
  });

  it('when approval comes before the check, or a signature names another snapshot, then it is refused', async () => {
    expect((await post(owner, `/api/v1/revisions/${id}/approve`, { snapshotHash: hash }).expect(409)).body.errors[0].code).toBe('NOT_CHECKED');
    const wrong = await post(checker, `/api/v1/revisions/${id}/check`, { snapshotHash: 'f'.repeat(64) }).expect(409);
    expect(wrong.body.errors[0]).toMatchObject({ code: 'SNAPSHOT_MISMATCH', field: 'snapshotHash' });
    expect((await post(checker, `/api/v1/revisions/${id}/check`, {}).expect(400)).body.errors[0].field).toBe('snapshotHash');
  });

  it('when a second engineer checks, then the revision is checked and records who and when', async () => {
    const before = Date.now();
    const r = (await post(checker, `/api/v1/revisions/${id}/check`, { snapshotHash: hash }).expect(200)).body.revision;
    expect(r).toMatchObject({ status: 'checked', checked: { name: 'Test engineer' }, approved: null });
    expect(r.checked.userId).not.toBe(r.prepared.userId);
    expect(new Date(r.checked.at).getTime()).toBeGreaterThanOrEqual(before - 1000);
    expect((await post(owner, `/api/v1/revisions/${id}/check`, { snapshotHash: hash }).expect(409)).body.errors[0].code).toBe('ALREADY_CHECKED');
    // Once checked, the description is signed too.
    expect((await patch(preparer, `/api/v1/revisions/${id}`, { description: 'changed' }).expect(409)).body.errors[0].code).toBe('REVISION_SIGNED');
  });

  it('when the checker or the preparer approves, then it is refused; the owner approves and it is issued', async () => {
    expect((await post(checker, `/api/v1/revisions/${id}/approve`, { snapshotHash: hash }).expect(409)).body.errors[0]).toMatchObject({
      code: 'SAME_SIGNATORY',
      message: expect.stringMatching(/You checked/),
    });
    expect((await post(preparer, `/api/v1/revisions/${id}/approve`, { snapshotHash: hash }).expect(409)).body.errors[0]).toMatchObject({
      code: 'SAME_SIGNATORY',
      message: expect.stringMatching(/You prepared/),
    });
    const r = (await post(owner, `/api/v1/revisions/${id}/approve`, { snapshotHash: hash }).expect(200)).body.revision;
    expect(r).toMatchObject({ status: 'issued', approved: { name: 'Test Owner' }, issuedAt: r.approved.at });
    const names = new Set([r.prepared.userId, r.checked.userId, r.approved.userId]);
    expect(names.size).toBe(3);
    const audit = await ctx.db('audit_log').where({ target_type: 'revision', target_id: String(id) }).orderBy('id').select('action');
    expect(audit.map((a: { action: string }) => a.action)).toEqual(['revision.prepared', 'revision.checked', 'revision.issued']);
  });

  it('when anyone edits, withdraws or signs an issued revision, then 409 REVISION_ISSUED and nothing changes', async () => {
    const before = await ctx.db('revisions').where({ id }).first();
    const attempts = [
      patch(owner, `/api/v1/revisions/${id}`, { description: 'Rewritten history' }),
      del(owner, `/api/v1/revisions/${id}`),
      post(checker, `/api/v1/revisions/${id}/check`, { snapshotHash: hash }),
      post(preparer, `/api/v1/revisions/${id}/approve`, { snapshotHash: hash }),
    ];
    for (const attempt of attempts) {
      const res = await attempt;
      expect(res.status).toBe(409);
      expect(res.body.errors[0]).toMatchObject({ code: 'REVISION_ISSUED', message: expect.stringMatching(/Revision A was issued on \d{4}-\d{2}-\d{2} and is read-only/) });
    }
    expect(await ctx.db('revisions').where({ id }).first()).toEqual(before);
  });

  it('when code goes around the API, then the database itself refuses to change or delete an issued revision', async () => {
    await expect(ctx.db('revisions').where({ id }).update({ description: 'sneaky' })).rejects.toThrow(/REVISION_ISSUED/);
    await expect(ctx.db('revisions').where({ id }).delete()).rejects.toThrow(/REVISION_ISSUED/);
    await expect(ctx.db('revision_items').where({ revision_id: id }).update({ tag: 'X' })).rejects.toThrow(/REVISION_ITEM_FROZEN/);
    await expect(ctx.db('revision_items').where({ revision_id: id }).delete()).rejects.toThrow(/REVISION_ISSUED/);
    expect((await ctx.db('revision_items').where({ revision_id: id }).count({ n: '*' }))[0].n).toBe(4);
  });

  it('when the draft changes after issue, then the issued snapshot stays as it was signed', async () => {
    const rev = (await owner.get(`/api/v1/revisions/${id}`).expect(200)).body.revision;
    const lines = (await owner.get(`/api/v1/sites/${siteId}/lines`).expect(200)).body.lines as { id: number; tag: string }[];
    await patch(preparer, `/api/v1/lines/${lines.find((l) => l.tag === 'HS-001')!.id}`, { operatingTemperatureC: 250 }).expect(200);
    await sizeSite(preparer);
    const item = await ctx.db('revision_items').where({ revision_id: id, tag: 'HS-001' }).first('item');
    expect(parseJson<{ operatingTemperatureC: number }>(item.item, { operatingTemperatureC: 0 }).operatingTemperatureC).toBe(190);
    expect((await owner.get(`/api/v1/revisions/${id}`).expect(200)).body.revision.snapshotHash).toBe(rev.snapshotHash);
  });
});

describe('numbering and withdrawing', () => {
  it('when revisions follow, then review letters go on (B), construction counts from 0, and a withdrawn number is free again', async () => {
    const b = (await post(preparer, `/api/v1/sites/${siteId}/revisions`, { purpose: 'review' }).expect(201)).body.revision;
    expect(b.number).toBe('B');
    await del(checker, `/api/v1/revisions/${b.id}`).expect(204);
    expect(await ctx.db('revisions').where({ id: b.id }).first()).toBeUndefined();
    expect(await ctx.db('revision_items').where({ revision_id: b.id }).first()).toBeUndefined();
    const zero = (await post(preparer, `/api/v1/sites/${siteId}/revisions`, { purpose: 'construction' }).expect(201)).body.revision;
    expect(zero.number).toBe('0');
    expect((await patch(preparer, `/api/v1/revisions/${zero.id}`, { description: 'For the insulation contract' }).expect(200)).body.revision.description).toBe('For the insulation contract');
    await del(preparer, `/api/v1/revisions/${zero.id}`).expect(204);
    const ready = (await owner.get(`/api/v1/sites/${siteId}/revisions/readiness`).expect(200)).body.readiness;
    expect(ready.nextNumbers).toEqual({ review: 'B', construction: '0' });
  });

  it("when the site sets its own scheme, then revisions take the prefix and counter; a bad scheme is refused naming the field", async () => {
    expect((await owner.get(`/api/v1/sites/${siteId}/revision-scheme`).expect(200)).body.scheme).toEqual({ kind: 'trade' });
    const bad = await owner.put(`/api/v1/sites/${siteId}/revision-scheme`).set('X-CSRF-Token', owner.csrf).send({ kind: 'counter', prefix: 'P 1', start: 1, digits: 2 }).expect(400);
    expect(bad.body.errors[0].field).toBe('prefix');
    await viewer.put(`/api/v1/sites/${siteId}/revision-scheme`).set('X-CSRF-Token', viewer.csrf).send({ kind: 'trade' }).expect(403);
    const ok = await owner.put(`/api/v1/sites/${siteId}/revision-scheme`).set('X-CSRF-Token', owner.csrf).send({ kind: 'counter', prefix: 'P-', start: 1, digits: 2 }).expect(200);
    expect(ok.body.scheme).toEqual({ kind: 'counter', prefix: 'P-', start: 1, digits: 2 });
    const p = (await post(preparer, `/api/v1/sites/${siteId}/revisions`, { purpose: 'review' }).expect(201)).body.revision;
    expect(p.number).toBe('P-01');
    await del(preparer, `/api/v1/revisions/${p.id}`).expect(204);
    await owner.put(`/api/v1/sites/${siteId}/revision-scheme`).set('X-CSRF-Token', owner.csrf).send({ kind: 'trade' }).expect(200);
  });

  it('when the site has no items, then preparing is refused', async () => {
    const empty = (await post(owner, '/api/v1/sites', { name: 'Empty site', designBases: BASES }).expect(201)).body.site.id;
    expect((await post(owner, `/api/v1/sites/${empty}/revisions`, { purpose: 'review' }).expect(409)).body.errors[0].code).toBe('EMPTY_LINE_LIST');
  });
});

describe('comparison', () => {
  let revA: number;
  beforeAll(async () => {
    revA = (await owner.get(`/api/v1/sites/${siteId}/revisions`).expect(200)).body.revisions.find((r: { number: string }) => r.number === 'A').id;
  });

  it('when the draft has changed, then the comparison lists added, removed and changed lines field by field, thickness flagged', async () => {
    const lines = (await owner.get(`/api/v1/sites/${siteId}/lines`).expect(200)).body.lines as { id: number; tag: string }[];
    await del(preparer, `/api/v1/lines/${lines.find((l) => l.tag === 'CR-010')!.id}`).expect(204);
    await line(preparer, { tag: '=HYPERLINK("http://x")', service: 'Vent', nps: '1', operatingTemperatureC: 160 });
    await sizeSite(preparer);

    const c = (await viewer.get(`/api/v1/sites/${siteId}/revisions/compare?from=${revA}&to=draft&units=SI`).expect(200)).body.comparison;
    expect(c.from).toMatchObject({ kind: 'revision', id: revA, number: 'A', status: 'issued' });
    expect(c.to).toEqual({ kind: 'draft' });
    expect(c.counts).toMatchObject({ added: 1, removed: 1, changed: 1, unchanged: 2 });
    const byTag = Object.fromEntries(c.changes.map((x: { tag: string }) => [x.tag, x]));
    expect(byTag['CR-010']).toMatchObject({ change: 'removed', kind: 'line' });
    expect(byTag['=HYPERLINK("http://x")']).toMatchObject({ change: 'added' });
    const hs1 = byTag['HS-001'];
    expect(hs1.change).toBe('changed');
    const temp = hs1.fields.find((f: { field: string }) => f.field === 'operatingTemperatureC');
    expect(temp).toMatchObject({ from: 190, to: 250, fromText: '190.0 °C', toText: '250.0 °C', thickness: false });
    // 60 K hotter needs more insulation for the same touch limit.
    expect(hs1.thicknessChanged).toBe(true);
    expect(hs1.totalThicknessM.to).toBeGreaterThan(hs1.totalThicknessM.from);
    expect(hs1.fields.find((f: { field: string }) => f.field === 'totalThicknessM')).toMatchObject({ thickness: true });

    const us = (await viewer.get(`/api/v1/sites/${siteId}/revisions/compare?from=${revA}&units=US`).expect(200)).body.comparison;
    const tempUs = us.changes.find((x: { tag: string }) => x.tag === 'HS-001').fields.find((f: { field: string }) => f.field === 'operatingTemperatureC');
    expect(tempUs).toMatchObject({ fromText: '374.0 °F', toText: '482.0 °F' });
  });

  it('when the comparison is downloaded as CSV, then it is RFC 4180 with a BOM, one row per changed field, formulas neutralised', async () => {
    const res = await viewer.get(`/api/v1/sites/${siteId}/revisions/compare.csv?from=${revA}&units=SI`).expect(200);
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="Revision_site_rev-A_to_draft_comparison\.csv"/);
    const text = res.text;
    expect(text.startsWith('\uFEFFChange,Kind,Tag,Field,From,To,Thickness changed\r\n')).toBe(true);
    expect(text).toContain('changed,line,HS-001,Operating temperature,190.0 °C,250.0 °C,false\r\n');
    expect(text).toMatch(/changed,line,HS-001,Total thickness,\d+ mm,\d+ mm,true\r\n/);
    expect(text).toContain(`added,line,"'=HYPERLINK(""http://x"")",`);
    expect(text).toMatch(/removed,line,CR-010,,"NPS 1-1\/2 · 95 °C · Mineral-fibre [^"]+ \d+ mm",,false\r\n/);
  });

  it('when two revisions are compared, or the query is wrong, then it answers accordingly', async () => {
    const same = (await owner.get(`/api/v1/sites/${siteId}/revisions/compare?from=${revA}&to=${revA}`).expect(200)).body.comparison;
    expect(same.counts).toEqual({ added: 0, removed: 0, changed: 0, unchanged: 4, thicknessChanged: 0 });
    expect((await owner.get(`/api/v1/sites/${siteId}/revisions/compare?from=abc`).expect(400)).body.errors[0].field).toBe('from');
    expect((await owner.get(`/api/v1/sites/${siteId}/revisions/compare?units=metric`).expect(400)).body.errors[0].field).toBe('units');
    expect((await owner.get(`/api/v1/sites/${siteId}/revisions/compare?colour=red`).expect(400)).body.errors[0].field).toBe('colour');
    await owner.get(`/api/v1/sites/${siteId}/revisions/compare?from=999999`).expect(404);
  });
});

describe('who sees revisions', () => {
  it("when another team or an uninvited contractor asks, then 404; an invited contractor reads them", async () => {
    const other = await signUpOwner(ctx, { teamName: 'Other revision team' });
    const revs = (await owner.get(`/api/v1/sites/${siteId}/revisions`).expect(200)).body.revisions;
    await other.agent.get(`/api/v1/sites/${siteId}/revisions`).expect(404);
    await other.agent.get(`/api/v1/revisions/${revs[0].id}`).expect(404);
    await post(other.agent, `/api/v1/revisions/${revs[0].id}/check`, { snapshotHash: revs[0].snapshotHash }).expect(404);
    const contractor = await addMember(ctx, owner, 'contractor');
    await contractor.agent.get(`/api/v1/sites/${siteId}/revisions`).expect(404);
    await contractor.agent.get(`/api/v1/revisions/${revs[0].id}`).expect(404);
    await post(owner, `/api/v1/sites/${siteId}/members`, { userId: contractor.userId }).expect(201);
    expect((await contractor.agent.get(`/api/v1/sites/${siteId}/revisions`).expect(200)).body.revisions).toHaveLength(revs.length);
  });
});
