/**
 * Editing a site writes and audits only what really changes, and refuses fields outside the caller's
 * reach (a safety officer: the touch-safety basis only).
 */
import { addMember, type Agent, type ApiContext, createApiContext, signUpOwner } from '../helpers/api';

jest.setTimeout(60_000);

let ctx: ApiContext;
let owner: Agent;
let safety: Agent;
let engineer: Agent;
let siteId: number;

beforeAll(async () => {
  ctx = await createApiContext();
  owner = (await signUpOwner(ctx, { teamName: 'Audit Works' })).agent;
  safety = (await addMember(ctx, owner, 'safety')).agent;
  engineer = (await addMember(ctx, owner, 'engineer')).agent;
  const site = await owner
    .post('/api/v1/sites')
    .set('X-CSRF-Token', owner.csrf)
    .send({ name: 'Boiler row', designBases: { touch: { airTemperatureC: 35, windSpeedMS: 0, surfaceEmissivity: 0.9, contactSeconds: 5 } } })
    .expect(201);
  siteId = site.body.site.id;
});
afterAll(async () => {
  await ctx.close();
});

const updates = () => ctx.db('audit_log').where({ action: 'site.updated', target_type: 'site', target_id: String(siteId) }).orderBy('id');
const patch = (agent: Agent, body: object) => agent.patch(`/api/v1/sites/${siteId}`).set('X-CSRF-Token', agent.csrf).send(body);
const details = (row: { details: unknown }) => (typeof row.details === 'string' ? JSON.parse(row.details) : row.details);

describe('editing a site', () => {
  it('when a safety officer sends an edit that changes nothing, then 200 with the site as it is and no audit row', async () => {
    const { members: _members, ...before } = (await owner.get(`/api/v1/sites/${siteId}`).expect(200)).body.site;
    const auditBefore = await updates();
    for (const body of [{}, { designBases: {} }, { designBases: { touch: before.designBases.touch } }]) {
      const res = await patch(safety, body);
      expect(res.status).toBe(200);
      expect(res.body.site).toEqual(before);
    }
    expect(await updates()).toHaveLength(auditBefore.length);
    const after = (await owner.get(`/api/v1/sites/${siteId}`).expect(200)).body.site;
    expect(after.updatedAt).toBe(before.updatedAt);
  });

  it('when a safety officer sends fields outside the touch basis, then 403 names them and nothing is written', async () => {
    const auditBefore = await updates();
    for (const body of [{ name: 'Boiler row' }, { description: '' }, { designBases: { energy: { airTemperatureC: 10 } } }, { designBases: { touch: { airTemperatureC: 40 }, condensation: { airTemperatureC: 30, relativeHumidityPct: 80 } } }]) {
      const res = await patch(safety, body);
      expect(res.status).toBe(403);
      expect(res.body.errors[0].code).toBe('FORBIDDEN');
    }
    expect((await patch(safety, { name: 'x' })).body.errors[0].message).toMatch(/name/);
    expect(await updates()).toHaveLength(auditBefore.length);
    const site = (await owner.get(`/api/v1/sites/${siteId}`).expect(200)).body.site;
    expect(site.designBases.touch.airTemperatureC).toBe(35);
  });

  it('when the touch basis really changes, then one audit row lists exactly what changed, from what to what', async () => {
    const auditBefore = await updates();
    const res = await patch(safety, { designBases: { touch: { airTemperatureC: 41, windSpeedMS: 0, surfaceEmissivity: 0.9, contactSeconds: 5 } } }).expect(200);
    expect(res.body.site.designBases.touch.airTemperatureC).toBe(41);
    const rows = await updates();
    expect(rows).toHaveLength(auditBefore.length + 1);
    expect(details(rows[rows.length - 1])).toEqual({
      changed: ['designBases.touch.airTemperatureC'],
      changes: { 'designBases.touch.airTemperatureC': { from: 35, to: 41 } },
    });
  });

  it('when an engineer renames the site and resends an unchanged basis, then only the name is recorded; the same edit again records nothing', async () => {
    const current = (await owner.get(`/api/v1/sites/${siteId}`).expect(200)).body.site;
    const auditBefore = await updates();
    const body = { name: 'Boiler row east', designBases: { energy: current.designBases.energy } };
    await patch(engineer, body).expect(200);
    await patch(engineer, body).expect(200);
    const rows = await updates();
    expect(rows).toHaveLength(auditBefore.length + 1);
    expect(details(rows[rows.length - 1])).toEqual({ changed: ['name'], changes: { name: { from: current.name, to: 'Boiler row east' } } });
  });

  it('when a basis is replaced without a value it had, then the dropped value is listed as a change', async () => {
    const auditBefore = await updates();
    await patch(owner, { designBases: { touch: { airTemperatureC: 41, windSpeedMS: 0, surfaceEmissivity: 0.9 } } }).expect(200);
    const rows = await updates();
    expect(rows).toHaveLength(auditBefore.length + 1);
    expect(details(rows[rows.length - 1]).changes).toEqual({ 'designBases.touch.contactSeconds': { from: 5, to: null } });
  });
});
