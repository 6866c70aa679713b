/** The demo register seeded with the invented plant: every status, photos that the server serves, calculated risks. */
import request from 'supertest';
import demo from '../../seeds/demo-credentials.json';
import { type ApiContext, createApiContext } from '../helpers/api';

jest.setTimeout(120_000);

let ctx: ApiContext;
beforeAll(async () => {
  ctx = await createApiContext({ seed: true });
}, 120_000);
afterAll(async () => {
  await ctx.close();
});

async function signedIn(role: string) {
  const agent = request.agent(ctx.app);
  const session = await agent.get('/api/v1/auth/session').expect(200);
  const email = demo.users.find((u) => u.role === role)!.email;
  const res = await agent.post('/api/v1/auth/signin').set('X-CSRF-Token', session.body.csrfToken).send({ email, password: demo.password }).expect(200);
  return { agent, csrf: res.body.csrfToken as string };
}

describe('the demo register', () => {
  it('when the demo is seeded, then the register holds entries in every status, each with its history, and calculated risks', async () => {
    const { agent } = await signedIn('safety');
    const body = (await agent.get('/api/v1/register?status=open,actionAssigned,madeSafe,verified,accepted&limit=500').expect(200)).body;
    const measured = body.entries.filter((e: { source: string }) => e.source === 'measured');
    expect(new Set(measured.map((e: { status: string }) => e.status))).toEqual(new Set(['open', 'actionAssigned', 'madeSafe', 'verified', 'accepted']));
    expect(body.counts.calculated).toBeGreaterThan(0);
    for (const e of measured) {
      const detail = (await agent.get(`/api/v1/register/entries/${e.id}`).expect(200)).body.entry;
      expect(detail.history[0]).toMatchObject({ action: 'created' });
      expect(detail.history.filter((h: { toStatus: string | null }) => h.toStatus).pop().toStatus).toBe(detail.status);
    }
    // The seeded steam accumulator stands on the register as an entry, not as a calculated row.
    const accumulator = measured.find((e: { item: { tag: string } | null }) => e.item?.tag === 'V-111');
    expect(accumulator).toMatchObject({ method: 'calculated', status: 'actionAssigned', verdict: { verdict: 'fail' } });
    const rows = (await agent.get(`/api/v1/register?siteId=${accumulator.siteId}&source=calculated&limit=500`).expect(200)).body.entries;
    expect(rows.map((r: { item: { id: number } }) => r.item.id)).not.toContain(accumulator.item.id);
  });

  it('when a demo photo is asked for, then the server serves the JPEG it drew; the contractor sees only the sites they quote', async () => {
    const { agent } = await signedIn('viewer');
    const body = (await agent.get('/api/v1/register?status=active,closed&limit=500').expect(200)).body;
    const withPhoto = body.entries.find((e: { photoCount: number }) => e.photoCount > 0);
    const detail = (await agent.get(`/api/v1/register/entries/${withPhoto.id}`).expect(200)).body.entry;
    const image = await agent.get(detail.photos[0].url).expect(200);
    expect(image.headers['content-type']).toBe('image/jpeg');
    const contractor = await signedIn('contractor');
    const theirs = (await contractor.agent.get('/api/v1/register?status=active,closed&limit=500').expect(200)).body.entries;
    expect(new Set(theirs.map((e: { siteName: string }) => e.siteName))).toEqual(new Set(['Boiler house', 'Tank farm']));
  });
});
