import { assertStrongPassword } from '../../server/auth/passwords';
import demo from '../../seeds/demo-credentials.json';
import { startTestServer, type TestServer } from '../helpers/test-server';

jest.setTimeout(60_000);

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer({ seed: true });
}, 60_000);
afterAll(async () => {
  await server.close();
});

/** A tiny cookie-keeping client over fetch, as a browser would behave. */
async function signIn(email: string, password: string) {
  const first = await fetch(`${server.url}/api/v1/auth/session`);
  const cookie = first.headers.get('set-cookie')!.split(';')[0];
  const { csrfToken } = await first.json();
  const res = await fetch(`${server.url}/api/v1/auth/signin`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Cookie: cookie, 'X-CSRF-Token': csrfToken },
    body: JSON.stringify({ email, password }),
  });
  return { res, cookie: res.headers.get('set-cookie')?.split(';')[0] ?? cookie };
}

describe('demo data and the test server', () => {
  it('when the demo is seeded, then every role can sign in with the shared demo password', async () => {
    expect(() => assertStrongPassword(demo.password, demo.users.map((u) => u.email))).not.toThrow();
    for (const u of demo.users) {
      const { res } = await signIn(u.email, demo.password);
      expect(res.status).toBe(200);
      const body = await res.json();
      expect(body).toMatchObject({ role: u.role, team: { name: demo.teamName } });
    }
  });

  it('when the demo contractor lists sites, then only the two sites they quote appear; the engineer sees all five', async () => {
    const contractor = await signIn('contractor@lagline.test', demo.password);
    const mine = await (await fetch(`${server.url}/api/v1/sites`, { headers: { Cookie: contractor.cookie } })).json();
    expect(mine.sites.map((s: { name: string }) => s.name).sort()).toEqual(['Boiler house', 'Tank farm']);
    const engineer = await signIn('engineer@lagline.test', demo.password);
    const all = await (await fetch(`${server.url}/api/v1/sites`, { headers: { Cookie: engineer.cookie } })).json();
    expect(all.sites).toHaveLength(5);
    expect(all.sites[0].designBases.touch.airTemperatureC).toEqual(expect.any(Number));
  });

  it('when the demo is seeded, then the boiler house carries revision A, prepared, checked and approved by three demo users', async () => {
    const engineer = await signIn('engineer@lagline.test', demo.password);
    const site = await server.db('sites').where({ name: 'Boiler house' }).first('id');
    const res = await fetch(`${server.url}/api/v1/sites/${site.id}/revisions`, { headers: { Cookie: engineer.cookie } });
    const { revisions } = await res.json();
    expect(revisions).toHaveLength(1);
    expect(revisions[0]).toMatchObject({
      number: 'A',
      status: 'issued',
      prepared: { name: 'Idris Pembleton' },
      checked: { name: 'Ewan Strathdee' },
      approved: { name: 'Morwenna Tregear' },
    });
    expect(revisions[0].itemCount).toBeGreaterThan(100);
  });

  it('when a reset is requested on the test server, then the caught mail links back to that server', async () => {
    const first = await fetch(`${server.url}/api/v1/auth/session`);
    const cookie = first.headers.get('set-cookie')!.split(';')[0];
    const { csrfToken } = await first.json();
    const res = await fetch(`${server.url}/api/v1/auth/password-reset`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Cookie: cookie, 'X-CSRF-Token': csrfToken },
      body: JSON.stringify({ email: 'viewer@lagline.test' }),
    });
    expect(res.status).toBe(202);
    const mail = await server.mail.waitFor('viewer@lagline.test');
    expect(mail.text).toContain(`${server.url}/reset-password?token=`);
  });
});
