/**
 * The hot-surface register over HTTP: entries and their verdicts, every workflow step and who may take it,
 * the audit trail, filters and paging, calculated risks from whole-site sizing, and the CSV and PDF exports.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { execFileSync } from 'node:child_process';
import { burnThresholdWithSource } from '../../shared/calc/burn';
import { addMember, type Agent, type ApiContext, createApiContext, signUpOwner } from '../helpers/api';

jest.setTimeout(120_000);

let ctx: ApiContext;
let clock = Date.parse('2026-12-10T08:00:00Z');
let owner: Agent;
let safety: Agent;
let engineer: Agent;
let contractor: Agent;
let viewer: Agent;
const ids = {} as Record<'owner' | 'safety' | 'engineer' | 'contractor' | 'viewer', number>;
let siteId: number;
let otherSiteId: number;
let uploadDir: string;

const post = (a: Agent, p: string, body: object = {}) => a.post(p).set('X-CSRF-Token', a.csrf).send(body);
const patch = (a: Agent, p: string, body: object) => a.patch(p).set('X-CSRF-Token', a.csrf).send(body);

/** Touch basis: 35 °C air, 5 s contact (ASTM C1055), as a site starts. */
const BASES = {
  touch: { airTemperatureC: 35, windSpeedMS: 0, surfaceEmissivity: 0.9, contactSeconds: 5 },
  energy: { airTemperatureC: 10, windSpeedMS: 3, operatingHoursPerYear: 8000 },
  condensation: { airTemperatureC: 30, relativeHumidityPct: 80, marginK: 1 },
};
const HOT_FLANGE = { location: 'Flange F-12 by the feed pump', measuredTemperatureC: 96, method: 'contact', surfaceMaterial: 'uncoatedMetal', withinReach: true };

async function newEntry(a: Agent = safety, body: object = {}, site = siteId) {
  const res = await post(a, `/api/v1/sites/${site}/register`, { ...HOT_FLANGE, ...body });
  expect(res.status).toBe(201);
  return res.body.entry as { id: number; status: string; version: number };
}
/**
 * The text of a PDF, read by pdf-parse in a plain Node process (its PDF.js loads a worker through a dynamic
 * import, which jest's module system does not run).
 */
function pdfText(pdf: Buffer): string {
  const script =
    "const { PDFParse } = require('pdf-parse'); const c = []; process.stdin.on('data', (d) => c.push(d)); process.stdin.on('end', async () => {" +
    ' const p = new PDFParse({ data: new Uint8Array(Buffer.concat(c)) }); process.stdout.write((await p.getText()).text); await p.destroy(); });';
  return execFileSync(process.execPath, ['-e', script], { input: pdf, cwd: path.resolve(__dirname, '../..'), encoding: 'utf8' });
}
const step = (a: Agent, id: number, name: string, body: object) => post(a, `/api/v1/register/entries/${id}/${name}`, body);
const dueIn = (days: number) => new Date(clock + days * 86_400_000).toISOString().slice(0, 10);

beforeAll(async () => {
  uploadDir = fs.mkdtempSync(path.join(os.tmpdir(), 'lagline-register-'));
  ctx = await createApiContext({ now: () => clock, config: { uploadDir } });
  const o = await signUpOwner(ctx, { teamName: 'Register team' });
  owner = o.agent;
  ids.owner = o.userId;
  for (const role of ['safety', 'engineer', 'contractor', 'viewer'] as const) {
    const m = await addMember(ctx, owner, role);
    ids[role] = m.userId;
    if (role === 'safety') safety = m.agent;
    if (role === 'engineer') engineer = m.agent;
    if (role === 'contractor') contractor = m.agent;
    if (role === 'viewer') viewer = m.agent;
  }
  siteId = (await post(owner, '/api/v1/sites', { name: 'Boiler house', designBases: BASES }).expect(201)).body.site.id;
  otherSiteId = (await post(owner, '/api/v1/sites', { name: 'Tank farm', designBases: BASES }).expect(201)).body.site.id;
  await post(owner, `/api/v1/sites/${siteId}/members`, { userId: ids.contractor }).expect(201);
});
afterAll(async () => {
  await ctx.close();
  fs.rmSync(uploadDir, { recursive: true, force: true });
});

describe('entries and their verdicts', () => {
  it('when a safety officer records a hot flange, then it is open, judged against the 5 s metal limit, and its history says who created it', async () => {
    const res = await post(safety, `/api/v1/sites/${siteId}/register`, { ...HOT_FLANGE, description: 'Bare flange at knee height beside the walkway.' }).expect(201);
    const e = res.body.entry;
    const limit = burnThresholdWithSource('uncoatedMetal', 5).thresholdC;
    expect(e).toMatchObject({
      source: 'measured',
      siteId,
      siteName: 'Boiler house',
      status: 'open',
      measuredTemperatureC: 96,
      verdict: { verdict: 'fail', basis: 'hot', limitC: limit, governs: 'burnThreshold', contactSeconds: 5 },
      createdBy: { userId: ids.safety },
      photos: [],
    });
    expect(e.verdict.source).toMatch(/ISO 13732-1/);
    expect(e.history).toEqual([expect.objectContaining({ action: 'created', toStatus: 'open', by: { userId: ids.safety, name: 'Test safety' } })]);
    expect(e.allowed).toEqual(expect.arrayContaining(['edit', 'assign', 'madeSafe', 'accept']));
    expect(e.allowed).not.toContain('verify');
  });

  it("when the site's touch basis carries a touch limit and a contact time, then the entry's verdict follows them", async () => {
    const s = (await post(owner, '/api/v1/sites', { name: 'Limit site', designBases: { touch: { airTemperatureC: 30, contactSeconds: 60 } } }).expect(201)).body.site.id;
    // A touch limit the site schema may not know yet is read from the stored basis all the same.
    await ctx.db('sites').where({ id: s }).update({ design_bases: JSON.stringify({ touch: { airTemperatureC: 30, contactSeconds: 60, maxSurfaceC: 45 } }) });
    const e = (await post(safety, `/api/v1/sites/${s}/register`, { ...HOT_FLANGE, measuredTemperatureC: 48 }).expect(201)).body.entry;
    expect(e.verdict).toMatchObject({ verdict: 'fail', limitC: 45, governs: 'touchLimit' });
    const own = (await post(safety, `/api/v1/sites/${s}/register`, { ...HOT_FLANGE, measuredTemperatureC: 48, contactSeconds: 1, surfaceMaterial: 'wood' }).expect(201)).body.entry;
    expect(own.verdict).toMatchObject({ limitC: 45, governs: 'touchLimit' });
  });

  it('when an infrared reading on bright aluminium passes, then it is a caution that the reading is low; a cold surface carries the cold-contact note', async () => {
    const ir = (
      await post(safety, `/api/v1/sites/${siteId}/register`, {
        location: 'Jacketed header',
        measuredTemperatureC: 44,
        method: 'infrared',
        emissivitySetting: 0.95,
        surfaceMaterial: 'uncoatedMetal',
        surfaceFinishId: 'aluminium-polished',
        withinReach: true,
      }).expect(201)
    ).body.entry;
    expect(ir.verdict.verdict).toBe('caution');
    expect(ir.verdict.cautions[0].code).toBe('INFRARED_LOW_EMISSIVITY');
    const cold = (await post(safety, `/api/v1/sites/${siteId}/register`, { ...HOT_FLANGE, location: 'Glycol header', measuredTemperatureC: -18 }).expect(201)).body.entry;
    expect(cold.verdict).toMatchObject({ verdict: 'caution', basis: 'cold', limitC: null });
    expect(cold.verdict.cautions[0].code).toBe('COLD_CONTACT');
  });

  it('when a create is incomplete or wrong, then 400 names each field and nothing is stored', async () => {
    const before = await ctx.db('register_entries').count({ n: '*' }).first();
    const cases: [object, string][] = [
      [{ ...HOT_FLANGE, method: 'infrared' }, 'emissivitySetting'],
      [{ ...HOT_FLANGE, emissivitySetting: 0.9 }, 'emissivitySetting'],
      [{ ...HOT_FLANGE, measuredTemperatureC: undefined }, 'measuredTemperatureC'],
      [{ ...HOT_FLANGE, measuredTemperatureC: '96' }, 'measuredTemperatureC'],
      [{ ...HOT_FLANGE, location: '' }, 'location'],
      [{ ...HOT_FLANGE, surfaceMaterial: 'glass' }, 'surfaceMaterial'],
      [{ ...HOT_FLANGE, withinReach: undefined }, 'withinReach'],
      [{ ...HOT_FLANGE, surfaceFinishId: 'gold-leaf' }, 'surfaceFinishId'],
      [{ ...HOT_FLANGE, contactSeconds: 0 }, 'contactSeconds'],
      [{ ...HOT_FLANGE, method: 'calculated', measuredTemperatureC: undefined }, 'itemId'],
      [{ ...HOT_FLANGE, itemId: 999999 }, 'itemId'],
      [{ ...HOT_FLANGE, measuredAt: new Date(clock + 86_400_000).toISOString() }, 'measuredAt'],
      [{ ...HOT_FLANGE, teamId: 5 }, 'teamId'],
      [{ ...HOT_FLANGE, status: 'verified' }, 'status'],
    ];
    for (const [body, field] of cases) {
      const res = await post(safety, `/api/v1/sites/${siteId}/register`, body);
      expect({ field, status: res.status }).toEqual({ field, status: 400 });
      expect(res.body.errors.map((e: { field?: string }) => e.field)).toContain(field);
    }
    const after = await ctx.db('register_entries').count({ n: '*' }).first();
    expect(after).toEqual(before);
  });

  it('when a contractor records on a site they are not invited to, then 404; on their site it works; a viewer is refused', async () => {
    await post(contractor, `/api/v1/sites/${otherSiteId}/register`, HOT_FLANGE).expect(404);
    await newEntry(contractor);
    await post(viewer, `/api/v1/sites/${siteId}/register`, HOT_FLANGE).expect(403);
  });

  it('when someone of another team asks for an entry, then 404 and nothing of it', async () => {
    const e = await newEntry();
    const intruder = await signUpOwner(ctx, { teamName: 'Elsewhere' });
    for (const res of [
      await intruder.agent.get(`/api/v1/register/entries/${e.id}`),
      await patch(intruder.agent, `/api/v1/register/entries/${e.id}`, { location: 'x' }),
      await step(intruder.agent, e.id, 'accept', { reason: 'mine now' }),
      await post(intruder.agent, `/api/v1/sites/${siteId}/register`, HOT_FLANGE),
    ]) {
      expect(res.status).toBe(404);
      expect(JSON.stringify(res.body)).not.toContain('Flange');
    }
    const list = await intruder.agent.get('/api/v1/register').expect(200);
    expect(list.body.entries).toEqual([]);
  });
});

describe('the workflow', () => {
  it('when an entry goes open → action assigned → made safe → verified, then each step is recorded with who took it, and mail goes out', async () => {
    const e = await newEntry(safety);
    const assigned = (await step(safety, e.id, 'assign', { ownerUserId: ids.engineer, dueDate: dueIn(7), action: 'Fit a flange cover' }).expect(200)).body.entry;
    expect(assigned).toMatchObject({ status: 'actionAssigned', owner: { userId: ids.engineer, name: 'Test engineer' }, dueDate: dueIn(7), action: 'Fit a flange cover', overdue: false });
    await ctx.app.locals.reminders.tick();
    const engineerEmail = (await ctx.db('users').where({ id: ids.engineer }).first('email')).email as string;
    const mail = await ctx.mail.waitFor(engineerEmail, { subject: /Action for you/ });
    expect(mail.text).toContain('Fit a flange cover');
    expect(mail.text).toContain(`/register/${e.id}`);

    const safe = (await step(engineer, e.id, 'made-safe', { note: 'Removable cover fitted' }).expect(200)).body.entry;
    expect(safe).toMatchObject({ status: 'madeSafe', statusNote: 'Removable cover fitted' });
    await ctx.app.locals.reminders.tick();
    const safetyEmail = (await ctx.db('users').where({ id: ids.safety }).first('email')).email as string;
    const request = await ctx.mail.waitFor(safetyEmail, { subject: /Please verify/ });
    expect(request.text).toContain('Removable cover fitted');

    const verified = (await step(safety, e.id, 'verify', { note: 'Checked on the walk', measuredTemperatureC: 41, method: 'contact' }).expect(200)).body.entry;
    expect(verified).toMatchObject({ status: 'verified', verificationTemperatureC: 41, closedBy: { userId: ids.safety }, verification: { verdict: 'pass' } });
    expect(verified.history.map((h: { action: string; fromStatus: string; toStatus: string; by: { userId: number } }) => [h.action, h.fromStatus, h.toStatus, h.by.userId])).toEqual([
      ['created', null, 'open', ids.safety],
      ['assign', 'open', 'actionAssigned', ids.safety],
      ['madeSafe', 'actionAssigned', 'madeSafe', ids.engineer],
      ['verify', 'madeSafe', 'verified', ids.safety],
    ]);
    expect(verified.history[1].changes.ownerUserId).toEqual({ from: null, to: ids.engineer });
    expect(verified.allowed).not.toContain('edit');
  });

  it('when a step is taken from the wrong status, then 409 says why and the entry is unchanged', async () => {
    const e = await newEntry();
    const res = await step(safety, e.id, 'verify', {}).expect(409);
    expect(res.body.errors[0]).toMatchObject({ code: 'INVALID_TRANSITION', message: 'An entry that is open cannot be verified.' });
    await step(safety, e.id, 'send-back', { reason: 'no' }).expect(409);
    await step(safety, e.id, 'reopen', { reason: 'no' }).expect(409);
    const now = (await safety.get(`/api/v1/register/entries/${e.id}`).expect(200)).body.entry;
    expect(now).toMatchObject({ status: 'open', version: e.version });
    expect(now.history).toHaveLength(1);
  });

  it('when the action goes to a viewer, an uninvited contractor or a stranger, or is due in the past, then 400 names the field', async () => {
    const e = await newEntry();
    const intruder = await signUpOwner(ctx, { teamName: 'Strangers' });
    for (const [body, field] of [
      [{ ownerUserId: ids.viewer, dueDate: dueIn(3), action: 'x' }, 'ownerUserId'],
      [{ ownerUserId: intruder.userId, dueDate: dueIn(3), action: 'x' }, 'ownerUserId'],
      [{ ownerUserId: ids.engineer, dueDate: dueIn(-1), action: 'x' }, 'dueDate'],
      [{ ownerUserId: ids.engineer, dueDate: '2026-02-30', action: 'x' }, 'dueDate'],
      [{ ownerUserId: ids.engineer, dueDate: dueIn(3), action: '' }, 'action'],
    ] as [object, string][]) {
      const res = await step(safety, e.id, 'assign', body).expect(400);
      expect(res.body.errors[0].field).toBe(field);
    }
    const other = await newEntry(safety, {}, otherSiteId);
    const res = await step(safety, other.id, 'assign', { ownerUserId: ids.contractor, dueDate: dueIn(3), action: 'Fit cover' }).expect(400);
    expect(res.body.errors[0].message).toMatch(/not invited/);
    await step(safety, e.id, 'assign', { ownerUserId: ids.contractor, dueDate: dueIn(3), action: 'Fit cover' }).expect(200);
  });

  it('when a contractor made it safe on their site, then a safety officer may send it back; a verification reading still above the limit is refused', async () => {
    const e = await newEntry();
    await step(owner, e.id, 'assign', { ownerUserId: ids.contractor, dueDate: dueIn(5), action: 'Insulate the flange' }).expect(200);
    await step(contractor, e.id, 'made-safe', { note: 'Flange box fitted' }).expect(200);
    const tooHot = await step(safety, e.id, 'verify', { measuredTemperatureC: 75, method: 'contact' }).expect(409);
    expect(tooHot.body.errors[0]).toMatchObject({ code: 'STILL_ABOVE_LIMIT', field: 'measuredTemperatureC' });
    expect((await safety.get(`/api/v1/register/entries/${e.id}`)).body.entry.status).toBe('madeSafe');
    const back = (await step(safety, e.id, 'send-back', { reason: 'Box left open at the bottom' }).expect(200)).body.entry;
    expect(back).toMatchObject({ status: 'actionAssigned', statusNote: 'Box left open at the bottom', owner: { userId: ids.contractor } });
  });

  it('when an entry is accepted with a reason, then it is closed by whom and why; reopening brings it back; a closed entry cannot be edited', async () => {
    const e = await newEntry();
    await step(safety, e.id, 'accept', { reason: '' }).expect(400);
    const accepted = (await step(safety, e.id, 'accept', { reason: 'Behind the locked guard rail; only reached with a permit' }).expect(200)).body.entry;
    expect(accepted).toMatchObject({ status: 'accepted', statusNote: 'Behind the locked guard rail; only reached with a permit', closedBy: { userId: ids.safety } });
    expect(accepted.closedAt).toBe(new Date(clock).toISOString());
    const edit = await patch(safety, `/api/v1/register/entries/${e.id}`, { location: 'Moved' }).expect(409);
    expect(edit.body.errors[0].code).toBe('ENTRY_CLOSED');
    const reopened = (await step(owner, e.id, 'reopen', { reason: 'Guard rail removed for the shutdown' }).expect(200)).body.entry;
    expect(reopened).toMatchObject({ status: 'open', closedBy: null, closedAt: null });
  });

  it('when roles other than owner and safety assign, verify, accept or reopen, then 403 and nothing changes', async () => {
    const e = await newEntry();
    await step(safety, e.id, 'assign', { ownerUserId: ids.engineer, dueDate: dueIn(3), action: 'Cover it' }).expect(200);
    await step(engineer, e.id, 'made-safe', { note: 'Covered' }).expect(200);
    for (const a of [engineer, contractor, viewer]) {
      await step(a, e.id, 'verify', {}).expect(403);
      await step(a, e.id, 'send-back', { reason: 'x' }).expect(403);
      await step(a, e.id, 'accept', { reason: 'x' }).expect(403);
      await step(a, e.id, 'assign', { ownerUserId: ids.engineer, dueDate: dueIn(3), action: 'x' }).expect(403);
    }
    await step(viewer, e.id, 'made-safe', { note: 'x' }).expect(403);
    await step(owner, e.id, 'verify', {}).expect(200);
    for (const a of [engineer, contractor, viewer]) await step(a, e.id, 'reopen', { reason: 'x' }).expect(403);
    expect((await owner.get(`/api/v1/register/entries/${e.id}`)).body.entry.status).toBe('verified');
  });

  it('when an entry is corrected, then only real changes are written, with from and to in its history; a stale version is refused', async () => {
    const e = await newEntry();
    const same = (await patch(safety, `/api/v1/register/entries/${e.id}`, { location: HOT_FLANGE.location }).expect(200)).body.entry;
    expect(same.version).toBe(e.version);
    const res = (await patch(engineer, `/api/v1/register/entries/${e.id}`, { measuredTemperatureC: 88, method: 'infrared', emissivitySetting: 0.95, version: e.version }).expect(200)).body.entry;
    expect(res).toMatchObject({ measuredTemperatureC: 88, method: 'infrared', emissivitySetting: 0.95, version: e.version + 1 });
    const h = res.history[res.history.length - 1];
    expect(h).toMatchObject({ action: 'updated', by: { userId: ids.engineer } });
    expect(h.changes).toEqual({ measuredTemperatureC: { from: 96, to: 88 }, method: { from: 'contact', to: 'infrared' }, emissivitySetting: { from: null, to: 0.95 } });
    const stale = await patch(safety, `/api/v1/register/entries/${e.id}`, { location: 'x', version: e.version }).expect(409);
    expect(stale.body.errors[0].code).toBe('VERSION_CONFLICT');
    const back = (await patch(safety, `/api/v1/register/entries/${e.id}`, { method: 'contact' }).expect(200)).body.entry;
    expect(back.emissivitySetting).toBeNull();
    await patch(safety, `/api/v1/register/entries/${e.id}`, { method: 'infrared' }).expect(400);
  });

  it('when people comment, then the comments are kept in order with their authors; a viewer may read but not comment', async () => {
    const e = await newEntry();
    await post(engineer, `/api/v1/register/entries/${e.id}/comments`, { body: 'Cover on order, arrives Friday.' }).expect(201);
    await post(viewer, `/api/v1/register/entries/${e.id}/comments`, { body: 'x' }).expect(403);
    await post(safety, `/api/v1/register/entries/${e.id}/comments`, { body: '' }).expect(400);
    const got = (await viewer.get(`/api/v1/register/entries/${e.id}`).expect(200)).body.entry;
    expect(got.comments).toEqual([expect.objectContaining({ body: 'Cover on order, arrives Friday.', author: { userId: ids.engineer, name: 'Test engineer' } })]);
    expect(got.allowed).toEqual([]);
  });
});

describe('the list', () => {
  let listSite: number;
  const made: Record<string, number> = {};
  beforeAll(async () => {
    listSite = (await post(owner, '/api/v1/sites', { name: 'List site', designBases: BASES }).expect(201)).body.site.id;
    const mk = async (name: string, body: object) => (made[name] = (await newEntry(safety, { location: name, ...body }, listSite)).id);
    await mk('Hot valve', { measuredTemperatureC: 140 });
    await mk('Warm rail', { measuredTemperatureC: 45 });
    await mk('Shiny jacket', { measuredTemperatureC: 40, method: 'infrared', emissivitySetting: 0.95, surfaceFinishId: 'stainless-steel' });
    await mk('Late cover', { measuredTemperatureC: 90 });
    await mk('=cmd|calc', { measuredTemperatureC: 70, description: 'Formula-looking name' });
    await step(safety, made['Late cover'], 'assign', { ownerUserId: ids.engineer, dueDate: dueIn(1), action: 'Cover' }).expect(200);
    await step(safety, made['Warm rail'], 'accept', { reason: 'Below the limit' }).expect(200);
  });

  const list = async (a: Agent, query: string) => (await a.get(`/api/v1/register?siteId=${listSite}&${query}`).expect(200)).body;

  it('when filtered by status, owner, verdict, overdue or text, then exactly the matching entries come back', async () => {
    const locations = async (q: string) => (await list(viewer, q)).entries.map((e: { location: string }) => e.location).sort();
    expect(await locations('status=accepted')).toEqual(['Warm rail']);
    expect(await locations('status=active')).toEqual(['=cmd|calc', 'Hot valve', 'Late cover', 'Shiny jacket']);
    expect(await locations(`ownerId=${ids.engineer}`)).toEqual(['Late cover']);
    expect(await locations('verdict=caution')).toEqual(['Shiny jacket']);
    expect(await locations('verdict=pass')).toEqual(['Warm rail']);
    expect(await locations('q=valve')).toEqual(['Hot valve']);
    expect(await locations('overdue=true')).toEqual([]);
    clock += 3 * 86_400_000;
    try {
      expect(await locations('overdue=true')).toEqual(['Late cover']);
      const body = await list(viewer, '');
      expect(body.counts).toMatchObject({ open: 3, actionAssigned: 1, madeSafe: 0, verified: 0, accepted: 1, overdue: 1, calculated: 0 });
    } finally {
      clock -= 3 * 86_400_000;
    }
  });

  it('when the list is paged, then every entry comes once, in the same order, and a made-up cursor is refused', async () => {
    const all = (await list(owner, 'limit=500')).entries.map((e: { key: string }) => e.key);
    const seen: string[] = [];
    let cursor: string | null = null;
    do {
      const page: { entries: { key: string }[]; nextCursor: string | null } = await list(owner, `limit=2${cursor ? `&cursor=${cursor}` : ''}`);
      seen.push(...page.entries.map((e) => e.key));
      cursor = page.nextCursor;
    } while (cursor);
    expect(seen).toEqual(all);
    expect(all).toHaveLength(5);
    // Open work first, closed last.
    expect(all[all.length - 1]).toBe(`entry-${made['Warm rail']}`);
    await owner.get(`/api/v1/register?cursor=${Buffer.from('nope').toString('base64url')}`).expect(400);
    for (const q of ['status=done', 'verdict=red', 'overdue=maybe', 'limit=0', 'limit=501', 'colour=red', 'siteId=abc']) {
      const res = await owner.get(`/api/v1/register?${q}`).expect(400);
      expect(res.body.errors[0].field).toBe(q.split('=')[0]);
    }
    await owner.get('/api/v1/register?siteId=999999').expect(404);
  });

  it('when a contractor lists the register, then only entries of the sites they are invited to appear', async () => {
    const mine = await newEntry(contractor, { location: 'Contractor flange' });
    const body = (await contractor.get('/api/v1/register?limit=500').expect(200)).body;
    expect(body.entries.every((e: { siteId: number }) => e.siteId === siteId)).toBe(true);
    expect(body.entries.map((e: { id: number }) => e.id)).toContain(mine.id);
    await contractor.get(`/api/v1/register?siteId=${listSite}`).expect(404);
    await contractor.get(`/api/v1/register/entries/${made['Hot valve']}`).expect(404);
  });

  it('when the register is exported as CSV, then it has a header, SI values, one row per entry, and formulas are neutralised', async () => {
    const res = await owner.get(`/api/v1/register/export.csv?siteId=${listSite}`).expect(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="hot-surface-register-2026-12-10\.csv"/);
    const text = res.text;
    expect(text.startsWith('\uFEFFsource,entry_id,item_kind,item_tag,site,location,')).toBe(true);
    const lines = text.trim().split('\r\n');
    expect(lines).toHaveLength(6);
    expect(text).toContain("'=cmd|calc");
    expect(lines.find((l) => l.includes('Hot valve'))).toMatch(/,140,contact,/);
    await owner.get('/api/v1/register/export.csv?limit=5').expect(400);
  });

  it('when the register is exported as PDF, then it holds the entries, their limits and sources, in Source Sans 3, in the reader\'s units', async () => {
    const res = await owner.get(`/api/v1/register/export.pdf?siteId=${listSite}`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    expect(pdf.toString('latin1')).toMatch(/SourceSans3/);
    const text = pdfText(pdf);
    expect(text).toContain('Hot-surface register');
    expect(text).toContain('Hot valve');
    expect(text).toContain('140.0 °C');
    expect(text).toMatch(/Sources of the limits/);
    expect(text).toMatch(/ASTM C1055/);
    expect(text).toMatch(/competent person/);
    expect(text).not.toContain('Contractor flange');
    fs.mkdirSync(path.resolve(__dirname, '../../test-output'), { recursive: true });
    fs.writeFileSync(path.resolve(__dirname, '../../test-output/register-export.pdf'), pdf);

    // A reader who works in US customary units gets °F.
    await patch(viewer, '/api/v1/me/settings', { unitSystem: 'US' }).expect(200);
    const us = await viewer.get(`/api/v1/register/export.pdf?siteId=${listSite}`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    const usText = pdfText(us.body as Buffer);
    expect(usText).toContain('284.0 °F');
    expect(usText).toContain('temperatures in °F');
    await patch(viewer, '/api/v1/me/settings', { unitSystem: 'SI' }).expect(200);
  });
});

describe('calculated risks', () => {
  let calcSite: number;
  let lineId: number;
  async function sizeSite() {
    const res = await post(owner, `/api/v1/sites/${calcSite}/sizing`, {}).expect(202);
    for (let i = 0; i < 600; i++) {
      const job = (await owner.get(`/api/v1/jobs/${res.body.job.id}`).expect(200)).body.job;
      if (job.status === 'done') return;
      if (job.status === 'failed') throw new Error(job.error);
      await new Promise((r) => setTimeout(r, 50));
    }
    throw new Error('sizing did not finish');
  }
  const calculated = async () =>
    ((await owner.get(`/api/v1/register?siteId=${calcSite}&source=calculated`).expect(200)).body.entries as { key: string; item: { id: number }; verdict: { verdict: string; limitC: number } }[]).map(
      (r) => r.item.id,
    );

  beforeAll(async () => {
    calcSite = (await post(owner, '/api/v1/sites', { name: 'Calc site', designBases: BASES }).expect(201)).body.site.id;
    // A bare steam line (existing state, checked only) fails personnel protection.
    const line = await post(owner, `/api/v1/sites/${calcSite}/lines`, {
      tag: 'L-100',
      service: 'LP steam',
      nps: '4',
      lengthM: 30,
      operatingTemperatureC: 150,
      purposes: ['personnelProtection'],
      buildUp: { layers: [], finishId: 'carbon-steel-oxidised', fixed: true },
    }).expect(201);
    lineId = line.body.line.id;
    await post(owner, `/api/v1/sites/${calcSite}/lines`, { tag: 'L-101', service: 'Condensate', nps: '2', lengthM: 10, operatingTemperatureC: 90, purposes: ['personnelProtection'] }).expect(201);
    await sizeSite();
  });

  it('when sizing leaves a surface above the touch limit, then the line appears on the register as calculated, until it is re-sized below the limit', async () => {
    const row = (await owner.get(`/api/v1/register?siteId=${calcSite}`).expect(200)).body.entries.find((r: { source: string }) => r.source === 'calculated');
    // Bare oxidised carbon steel: an uncoated metal for the burn threshold.
    expect(row).toMatchObject({ source: 'calculated', id: null, item: { id: lineId, kind: 'line', tag: 'L-100' }, status: null, surfaceMaterial: 'uncoatedMetal', verdict: { verdict: 'fail' } });
    expect(row.measuredTemperatureC).toBeGreaterThan(row.verdict.limitC);
    expect(await calculated()).toEqual([lineId]);
    // Editing the line makes its result stale: a stale result is not a current risk.
    await patch(owner, `/api/v1/lines/${lineId}`, { operatingTemperatureC: 155 }).expect(200);
    expect(await calculated()).toEqual([]);
    await sizeSite();
    expect(await calculated()).toEqual([lineId]);
  });

  it('when the risk is recorded on the register and accepted, then it leaves as a calculated row; a change to the line brings it back', async () => {
    const created = (
      await post(safety, `/api/v1/sites/${calcSite}/register`, { location: 'L-100 by the stair', method: 'calculated', itemId: lineId, surfaceMaterial: 'uncoatedMetal', withinReach: true }).expect(201)
    ).body.entry;
    expect(created).toMatchObject({ method: 'calculated', item: { id: lineId, tag: 'L-100' }, verdict: { verdict: 'fail' } });
    expect(created.measuredTemperatureC).toBeGreaterThan(100);
    expect(await calculated()).toEqual([]);
    await step(safety, created.id, 'accept', { reason: 'Line is out of service until the spring' }).expect(200);
    expect(await calculated()).toEqual([]);
    await patch(owner, `/api/v1/lines/${lineId}`, { operatingTemperatureC: 160 }).expect(200);
    await sizeSite();
    expect(await calculated()).toEqual([lineId]);
  });

  it('when the line is insulated and re-sized, then its risk leaves the register', async () => {
    await patch(owner, `/api/v1/lines/${lineId}`, { buildUp: null }).expect(200);
    await sizeSite();
    expect(await calculated()).toEqual([]);
  });

  it('when a calculated entry is asked of an item without a current sizing, then 400 says so', async () => {
    const line = await post(owner, `/api/v1/sites/${calcSite}/lines`, { tag: 'L-102', nps: '2', lengthM: 5, operatingTemperatureC: 120, purposes: ['personnelProtection'] }).expect(201);
    const res = await post(safety, `/api/v1/sites/${calcSite}/register`, { location: 'L-102', method: 'calculated', itemId: line.body.line.id, surfaceMaterial: 'uncoatedMetal', withinReach: true }).expect(400);
    expect(res.body.errors[0]).toMatchObject({ code: 'NOT_SIZED', field: 'itemId' });
    // A line of another site cannot be linked.
    const wrong = await post(safety, `/api/v1/sites/${siteId}/register`, { ...HOT_FLANGE, itemId: lineId }).expect(400);
    expect(wrong.body.errors[0].field).toBe('itemId');
  });
});

describe('settings', () => {
  it('when the owner turns photo locations on, then everyone reads it; other roles cannot change it', async () => {
    expect((await viewer.get('/api/v1/register/settings').expect(200)).body.settings).toEqual({ keepPhotoLocation: false });
    await patch(safety, '/api/v1/register/settings', { keepPhotoLocation: true }).expect(403);
    await patch(owner, '/api/v1/register/settings', { keepPhotoLocation: 'yes' }).expect(400);
    expect((await patch(owner, '/api/v1/register/settings', { keepPhotoLocation: true }).expect(200)).body.settings).toEqual({ keepPhotoLocation: true });
    await patch(owner, '/api/v1/register/settings', { keepPhotoLocation: false }).expect(200);
  });
});
