/**
 * Sites and the team in a real browser, against the seeded demo team: an owner opens a site, edits
 * it and deletes another, removes a member (and is refused removing the last owner), follows a caught
 * mail's link; a safety officer edits the touch-safety basis alone; a viewer sees no edit controls;
 * a site's address survives a hard reload; quick sizing sits inside the navigation once signed in; an owner
 * adds a contractor to a site (who then sees it) and takes them off; absurd design-basis values are refused and
 * unusual ones warned about; a role change waits for a confirmation that says what the role may do; the delete
 * confirmation fits a phone.
 * Once on a phone (390×844) and once on a wide screen (1440×900), each against its own fresh team.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';

import {
  assertNoCspViolations,
  assertNoPageErrors,
  assertOnlyLoopback,
  assertWebAppBuilt,
  fill,
  gotoApp,
  openBrowser,
  screenshot,
  startTestServer,
  VIEWPORTS,
  viewportTag,
  type OpenedBrowser,
  type TestServer,
} from './harness';

jest.setTimeout(180_000);

type DemoCredentials = { teamName: string; password: string; users: { role: string; name: string; email: string }[] };
const demo = JSON.parse(fs.readFileSync(path.resolve(__dirname, '../../seeds/demo-credentials.json'), 'utf8')) as DemoCredentials;
const user = (role: string) => {
  const u = demo.users.find((x) => x.role === role);
  if (!u) throw new Error(`No demo ${role}`);
  return u;
};

/**
 * Signs out by forgetting the cookie. The page is left first: a request still in flight from the old
 * page would otherwise bring the session cookie back with its answer.
 */
async function forgetSession(page: Page) {
  await page.waitForLoadState('networkidle');
  await page.goto('about:blank');
  await page.context().clearCookies();
}

async function signInAs(page: Page, server: TestServer, role: string) {
  await forgetSession(page);
  await gotoApp(page, `${server.url}/`);
  await fill(page, 'signin-email', user(role).email);
  await fill(page, 'signin-password', demo.password);
  await page.getByTestId('signin-submit').click();
  await page.waitForURL('**/sites');
  await page.getByTestId('sites-list').waitFor();
}

async function siteId(server: TestServer, name: string): Promise<number> {
  const row = (await server.db('sites').where({ name }).first('id')) as { id: number } | undefined;
  if (!row) throw new Error(`No site ${name}`);
  return row.id;
}

describe.each([
  ['phone', VIEWPORTS.phone],
  ['wide', VIEWPORTS.desktop],
])('on a %s screen', (_label, viewport) => {
  const tag = viewportTag(viewport);
  let server: TestServer;
  let opened: OpenedBrowser;

  beforeAll(async () => {
    assertWebAppBuilt();
    server = await startTestServer({ seed: true });
    opened = await openBrowser({ viewport });
  });

  afterAll(async () => {
    await opened?.close();
    await server?.close();
  });

  it('when the owner edits a site description, then it is kept after a reload, and a deleted site leaves the list', async () => {
    const { page } = opened;
    await signInAs(page, server, 'owner');
    const id = await siteId(server, 'Boiler house');

    // Rows carry name, description and the date the site was created.
    const row = page.getByTestId(`site-${id}`);
    await expect(row.innerText()).resolves.toMatch(/Boiler house[\s\S]*fire-tube steam boilers[\s\S]*Created \d{1,2} [A-Z][a-z]{2} \d{4}/);
    await expect(page.getByRole('button', { name: 'Create a site' }).count()).resolves.toBe(1);
    await screenshot(page, `team-sites-${tag}-01-sites-owner`);

    await row.click();
    await page.waitForURL(`**/sites/${id}`);
    await page.getByRole('heading', { name: 'Boiler house', exact: true }).waitFor();
    // The seeded boiler house is indoors: 40 °C touch basis, 70 % humidity for condensation.
    await expect(page.getByTestId('basis-touch-airTemperatureC-value').innerText()).resolves.toBe('40 °C');
    await expect(page.getByTestId('basis-condensation-relativeHumidityPct-value').innerText()).resolves.toBe('70 %');
    await expect(page.getByTestId('basis-energy-heatSourceEfficiency-value').innerText()).resolves.toBe('85 %');
    await screenshot(page, `team-sites-${tag}-02-site-detail`);

    // A bad number is refused at its field, naming it; nothing is sent.
    await page.getByTestId('site-edit').click();
    await fill(page, 'basis-touch-windSpeedMS', 'calm');
    await page.getByTestId('site-save').click();
    await page.getByText('Touch safety: wind speed must be a number').waitFor();
    await fill(page, 'basis-touch-windSpeedMS', '0');

    const description = `Two fire-tube boilers and the condensate return, walked ${tag}.`;
    await fill(page, 'site-edit-description', description);
    await screenshot(page, `team-sites-${tag}-03-site-edit`);
    await page.getByTestId('site-save').click();
    await page.getByTestId('site-edit-form').waitFor({ state: 'detached' });
    await page.getByText(description).waitFor();

    // A hard reload of the site's own address serves the app and shows the stored description.
    const response = await page.goto(`${server.url}/sites/${id}`, { waitUntil: 'load' });
    expect(response?.status()).toBe(200);
    await page.waitForLoadState('networkidle');
    await page.getByText(description).waitFor();
    const stored = (await server.db('sites').where({ id }).first('description', 'design_bases')) as { description: string };
    expect(stored.description).toBe(description);
    await screenshot(page, `team-sites-${tag}-04-site-reloaded`);

    // Deleting asks first, then goes back to the list without the site.
    const chilled = await siteId(server, 'Chilled water');
    await gotoApp(page, `${server.url}/sites/${chilled}`);
    await page.getByTestId('site-delete').click();
    await page.getByTestId('site-delete-confirm').waitFor();
    // The confirmation fits the screen, its last words included.
    const confirmBox = await page.getByTestId('site-delete-confirm').boundingBox();
    expect(confirmBox && confirmBox.x >= 0 && confirmBox.x + confirmBox.width <= viewport.width).toBe(true);
    const undone = await page.getByText('This cannot be undone.').boundingBox();
    expect(undone && undone.x + undone.width <= viewport.width).toBe(true);
    const danger = page.getByTestId('site-delete-confirm-button');
    expect(await danger.boundingBox().then((b) => b && b.x + b.width <= viewport.width)).toBe(true);
    await screenshot(page, `team-sites-${tag}-05-delete-confirm`);
    await page.getByTestId('site-delete-confirm-button').click();
    await page.waitForURL((u) => new URL(u).pathname === '/sites');
    await page.getByTestId(`site-${id}`).waitFor();
    await expect(page.getByTestId(`site-${chilled}`).count()).resolves.toBe(0);
    await expect(server.db('sites').where({ id: chilled }).first('id')).resolves.toBeUndefined();

    // A site that is gone says so at its address.
    await gotoApp(page, `${server.url}/sites/${chilled}`);
    await page.getByTestId('site-missing').waitFor();

    assertNoCspViolations(page);
    assertNoPageErrors(page);
  });

  it('when the owner adds a contractor to a site, then the contractor sees it and its bases in their units; taken off, it is gone', async () => {
    const { page } = opened;
    const contractor = user('contractor');
    const id = await siteId(server, 'Thermal-oil loop');
    await gotoApp(page, `${server.url}/sites/${id}`);
    const people = page.getByTestId('site-people');
    await people.getByTestId('site-people-empty').waitFor();
    // The winter basis is there, with the seeded coldest conditions.
    await expect(page.getByTestId('basis-winter-airTemperatureC-value').innerText()).resolves.toBe('−12 °C');
    // Contractors come first in the list of people who can be added.
    await expect(people.getByTestId('site-people-choose').innerText()).resolves.toContain(`${contractor.name} — Contractor`);
    await people.getByTestId('site-people-add').click();
    await people.getByTestId('site-people-added').waitFor();
    await expect(people.getByTestId(`site-person-${contractor.email}`).innerText()).resolves.toContain('Contractor');
    const rows = await server.db('site_members as sm').join('users as u', 'u.id', 'sm.user_id').where({ 'sm.site_id': id, 'u.email': contractor.email }).count({ n: '*' });
    expect(Number((rows[0] as { n: number | string }).n)).toBe(1);
    await screenshot(page, `team-sites-${tag}-05a-site-people`);

    // The contractor now sees the site, with prices converted to cents in their US units.
    await signInAs(page, server, 'contractor');
    await page.getByTestId(`site-${id}`).click();
    await page.waitForURL(`**/sites/${id}`);
    await expect(page.getByTestId('basis-energy-energyPricePerKWh-value').innerText()).resolves.toBe('13.19 EUR/MMBtu');
    await expect(page.getByTestId('basis-energy-electricityPricePerKWh-value').innerText()).resolves.toBe('55.68 EUR/MMBtu');
    await expect(page.getByTestId('basis-winter-airTemperatureC-value').innerText()).resolves.toBe('10.4 °F');
    await expect(page.getByTestId('site-people').count()).resolves.toBe(0);
    await screenshot(page, `team-sites-${tag}-05b-contractor-site`);

    // Taken off again, after a confirmation.
    await signInAs(page, server, 'owner');
    await gotoApp(page, `${server.url}/sites/${id}`);
    await page.getByRole('button', { name: `Remove ${contractor.name} from Thermal-oil loop` }).click();
    await page.getByRole('button', { name: `Yes, remove ${contractor.name} from Thermal-oil loop` }).click();
    await page.getByTestId('site-people-empty').waitFor();
    const left = await server.db('site_members').where({ site_id: id }).count({ n: '*' });
    expect(Number((left[0] as { n: number | string }).n)).toBe(0);
    await signInAs(page, server, 'contractor');
    await expect(page.getByTestId(`site-${id}`).count()).resolves.toBe(0);
    await signInAs(page, server, 'owner');
    assertNoCspViolations(page);
    assertNoPageErrors(page);
  });

  it('when design bases get absurd values, then they are refused with the bound; unusual ones are saved with a warning', async () => {
    const { page } = opened;
    const id = await siteId(server, 'Process unit 2');
    await gotoApp(page, `${server.url}/sites/${id}`);
    await page.getByTestId('site-edit').click();
    await fill(page, 'basis-touch-airTemperatureC', '999');
    await fill(page, 'basis-energy-windSpeedMS', '59');
    await page.getByTestId('site-save').click();
    await page.getByText('Touch safety: air temperature must be at most 60 °C (the hottest credible air where people work)').waitFor();
    await page.getByText('Energy: wind speed must be at most 30 m/s (beyond storm force)').waitFor();
    await screenshot(page, `team-sites-${tag}-05c-bounds-refused`);
    // Nothing was sent; and the server holds the same bounds.
    const stored = (await server.db('sites').where({ id }).first('design_bases')) as { design_bases: unknown };
    const before = typeof stored.design_bases === 'string' ? JSON.parse(stored.design_bases) : stored.design_bases;
    expect(before.touch.airTemperatureC).toBe(35);
    const patch = (body: unknown) =>
      page.evaluate(
        async ({ siteId, payload }) => {
          const session = (await (await fetch('/api/v1/auth/session')).json()) as { csrfToken: string };
          const res = await fetch(`/api/v1/sites/${siteId}`, {
            method: 'PATCH',
            headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': session.csrfToken },
            body: JSON.stringify(payload),
          });
          return { status: res.status, body: (await res.json()) as { errors?: { code: string; field: string; message: string }[] } };
        },
        { siteId: id, payload: body },
      );
    const refused = await patch({ designBases: { touch: { airTemperatureC: 999 } } });
    expect(refused.status).toBe(400);
    expect(refused.body.errors?.[0]).toMatchObject({ code: 'VALIDATION_FAILED', field: 'designBases.touch.airTemperatureC', message: expect.stringContaining('at most 60 °C') });

    await fill(page, 'basis-touch-airTemperatureC', '35');
    await fill(page, 'basis-energy-windSpeedMS', '3.5');
    await fill(page, 'basis-touch-windSpeedMS', '4');
    await page.getByTestId('basis-touch-windSpeedMS-warning').waitFor();
    await expect(page.getByTestId('basis-touch-windSpeedMS-warning').innerText()).resolves.toContain('still air, the worst case');
    await fill(page, 'basis-energy-coolingCop', '5');
    await screenshot(page, `team-sites-${tag}-05d-unusual-warned`);
    await page.getByTestId('site-save').click();
    await page.getByTestId('site-edit-form').waitFor({ state: 'detached' });
    await expect(page.getByTestId('basis-touch-windSpeedMS-value').innerText()).resolves.toBe('4 m/s');
    await expect(page.getByTestId('basis-energy-coolingCop-value').innerText()).resolves.toBe('5');
    const after = (await server.db('sites').where({ id }).first('design_bases')) as { design_bases: unknown };
    const bases = typeof after.design_bases === 'string' ? JSON.parse(after.design_bases) : after.design_bases;
    expect(bases.touch.windSpeedMS).toBe(4);
    expect(bases.energy.coolingCop).toBe(5);
    // The server takes a winter basis of its own, too.
    const winter = await patch({ designBases: { winter: { airTemperatureC: -20, windSpeedMS: 7 } } });
    expect(winter.status).toBe(200);
    await gotoApp(page, `${server.url}/sites/${id}`);
    await expect(page.getByTestId('basis-winter-airTemperatureC-value').innerText()).resolves.toBe('−20 °C');
    assertNoCspViolations(page);
    assertNoPageErrors(page);
  });

  it('when the owner starts a role change, then nothing changes until it is confirmed, and the confirmation says what the role may do', async () => {
    const { page } = opened;
    const engineer = user('engineer');
    await gotoApp(page, `${server.url}/team`);
    const row = page.getByTestId(`member-${engineer.email}`);
    await row.getByRole('button', { name: `Change role of ${engineer.name}` }).click();
    await row.getByRole('radio', { name: 'Owner' }).click();
    const confirm = row.getByTestId(`role-confirm-${engineer.email}`);
    await confirm.waitFor();
    await expect(confirm.innerText()).resolves.toContain('invite people, change roles (their own too) and remove members');
    await expect(confirm.getByTestId('role-confirm-owner-note').innerText()).resolves.toContain('could then change your role or remove you');
    await screenshot(page, `team-sites-${tag}-05e-role-confirm`);
    const role = async () =>
      ((await server.db('memberships as m').join('users as u', 'u.id', 'm.user_id').where('u.email', engineer.email).first('m.role')) as { role: string }).role;
    expect(await role()).toBe('engineer');
    await row.getByRole('button', { name: `Keep ${engineer.name} as Engineer` }).click();
    await confirm.waitFor({ state: 'detached' });
    expect(await role()).toBe('engineer');
    assertNoCspViolations(page);
    assertNoPageErrors(page);
  });

  it('when the owner removes a member after confirming, then the member is gone, and removing the last owner is refused with the reason', async () => {
    const { page } = opened;
    const contractor = user('contractor');
    const owner = user('owner');
    await page.getByRole('link', { name: 'Team', exact: true }).click();
    await page.waitForURL('**/team');
    const row = page.getByTestId(`member-${contractor.email}`);
    await row.waitFor();

    // The first press only asks; keeping the member changes nothing.
    await page.getByRole('button', { name: `Remove ${contractor.name} from the team` }).click();
    await page.getByTestId(`remove-confirm-${contractor.email}`).waitFor();
    await screenshot(page, `team-sites-${tag}-06-remove-confirm`);
    await page.getByRole('button', { name: `Keep ${contractor.name}` }).click();
    await page.getByTestId(`remove-confirm-${contractor.email}`).waitFor({ state: 'detached' });
    await row.waitFor();

    await page.getByRole('button', { name: `Remove ${contractor.name} from the team` }).click();
    await page.getByRole('button', { name: `Yes, remove ${contractor.name}` }).click();
    await row.waitFor({ state: 'detached' });
    await gotoApp(page, `${server.url}/team`);
    await page.getByTestId(`member-${owner.email}`).waitFor();
    await expect(page.getByTestId(`member-${contractor.email}`).count()).resolves.toBe(0);
    const memberships = await server.db('memberships as m').join('users as u', 'u.id', 'm.user_id').where('u.email', contractor.email).count({ n: '*' });
    expect(Number((memberships[0] as { n: number | string }).n)).toBe(0);

    // The only owner cannot leave: the server's reason is shown and the owner stays.
    await page.getByRole('button', { name: `Remove ${owner.name} from the team` }).click();
    await page.getByRole('button', { name: `Yes, remove ${owner.name}` }).click();
    const ownerRow = page.getByTestId(`member-${owner.email}`);
    await ownerRow.getByText('A team needs at least one owner').waitFor();
    await expect(ownerRow.getByRole('alert').innerText()).resolves.toContain('Not removed');
    await screenshot(page, `team-sites-${tag}-07-last-owner-refused`);

    assertNoCspViolations(page);
    assertNoPageErrors(page);
  });

  it("when caught mail holds this app's link, then it is a same-tab link and other addresses stay text", async () => {
    const { page } = opened;
    const email = `new-engineer-${tag}@ashcombe.example`;
    await fill(page, 'invite-email', email);
    await page.getByTestId('invite-submit').click();
    await page.getByTestId('invite-sent').waitFor();
    const mail = await server.mail.waitFor(email);
    const link = mail.text.match(/https?:\/\/\S+token=[A-Za-z0-9_-]+/)?.[0];
    expect(link && new URL(link).origin).toBe(server.url);

    const panel = page.getByTestId('caught-mail');
    await panel.getByRole('button', { name: 'Refresh' }).click();
    const anchor = panel.locator(`a[href="${new URL(link!).pathname}${new URL(link!).search}"]`).first();
    await anchor.waitFor();
    await expect(anchor.getAttribute('target')).resolves.toBeNull();
    // Every anchor in the panel stays on this origin.
    const hrefs = await panel.locator('a').evaluateAll((as) => as.map((a) => (a as HTMLAnchorElement).href));
    expect(hrefs.length).toBeGreaterThan(0);
    expect(hrefs.every((h) => new URL(h).origin === server.url)).toBe(true);
    await screenshot(page, `team-sites-${tag}-08-caught-mail-link`);

    const pages = page.context().pages().length;
    await anchor.click();
    await page.waitForURL((u) => new URL(u).pathname === '/accept-invite');
    expect(new URL(page.url()).searchParams.get('token')).toBe(new URL(link!).searchParams.get('token'));
    expect(page.context().pages().length).toBe(pages);
    assertNoCspViolations(page);
    assertNoPageErrors(page);
  });

  it('when signed in, then quick sizing sits inside the navigation with Quick sizing current; anonymous, it keeps its sign-in link', async () => {
    const { page } = opened;
    await gotoApp(page, `${server.url}/quick-sizing`);
    await page.waitForSelector('[data-testid="qs-screen"][data-ready="true"]');
    const nav = page.getByRole('navigation', { name: 'Main' });
    await nav.waitFor();
    await expect(nav.getByRole('link', { name: 'Quick sizing' }).getAttribute('aria-current')).resolves.toBe('page');
    await expect(nav.getByRole('link', { name: 'Sites' }).getAttribute('aria-current')).resolves.toBeNull();
    await page.getByText('Your sites', { exact: true }).waitFor();
    const navBox = await nav.boundingBox();
    if (viewport.width < 900) {
      // Phones keep the pinned results above the bottom bar, not under it.
      const summary = await page.getByTestId('qs-summary').boundingBox();
      expect(summary && navBox && summary.y + summary.height <= navBox.y + 1).toBe(true);
    } else {
      // Wide screens: a full-height rail with the page beside it, as on every signed-in page.
      const content = await page.getByTestId('qs-screen').boundingBox();
      expect(navBox && navBox.height >= viewport.height - 1).toBe(true);
      expect(content && navBox && content.x >= navBox.x + navBox.width - 1 && content.y < navBox.y + 1).toBe(true);
    }
    await screenshot(page, `team-sites-${tag}-09-quick-sizing-signed-in`);

    await nav.getByRole('link', { name: 'Team' }).click();
    await page.waitForURL('**/team');

    await forgetSession(page);
    await gotoApp(page, `${server.url}/quick-sizing`);
    await page.waitForSelector('[data-testid="qs-screen"][data-ready="true"]');
    await page.getByText('Sign in', { exact: true }).waitFor();
    await expect(page.getByRole('navigation', { name: 'Main' }).count()).resolves.toBe(0);
    await screenshot(page, `team-sites-${tag}-10-quick-sizing-anonymous`);
    assertNoCspViolations(page);
    assertNoPageErrors(page);
  });

  it('when a safety officer edits a site, then only the touch-safety basis is offered and saved', async () => {
    const { page } = opened;
    await signInAs(page, server, 'safety');
    await expect(page.getByRole('button', { name: 'Create a site' }).count()).resolves.toBe(0);
    const id = await siteId(server, 'Tank farm');
    await page.getByTestId(`site-${id}`).click();
    await page.waitForURL(`**/sites/${id}`);
    await page.getByRole('button', { name: 'Edit touch-safety basis' }).click();
    await page.getByTestId('basis-touch-airTemperatureC').waitFor();
    await expect(page.getByTestId('site-edit-name').count()).resolves.toBe(0);
    await expect(page.getByTestId('basis-energy-airTemperatureC').count()).resolves.toBe(0);
    await expect(page.getByTestId('site-delete').count()).resolves.toBe(0);
    await fill(page, 'basis-touch-airTemperatureC', '45');
    await screenshot(page, `team-sites-${tag}-11-safety-edit`);
    await page.getByTestId('site-save').click();
    await page.getByTestId('site-edit-form').waitFor({ state: 'detached' });
    await expect(page.getByTestId('basis-touch-airTemperatureC-value').innerText()).resolves.toBe('45 °C');
    const row = (await server.db('sites').where({ id }).first('design_bases')) as { design_bases: unknown };
    const bases = (typeof row.design_bases === 'string' ? JSON.parse(row.design_bases) : row.design_bases) as {
      touch: { airTemperatureC: number; contactSeconds: number };
      energy: { airTemperatureC: number };
    };
    expect(bases.touch.airTemperatureC).toBe(45);
    expect(bases.touch.contactSeconds).toBe(5);
    expect(bases.energy.airTemperatureC).toBe(9);
    assertNoCspViolations(page);
    assertNoPageErrors(page);
  });

  it('when a viewer opens a site, then there are no edit controls, and a hard reload of its address keeps the page', async () => {
    const { page } = opened;
    await signInAs(page, server, 'viewer');
    await expect(page.getByRole('button', { name: 'Create a site' }).count()).resolves.toBe(0);
    const id = await siteId(server, 'Thermal-oil loop');
    await page.getByTestId(`site-${id}`).click();
    await page.waitForURL(`**/sites/${id}`);
    await page.getByTestId('basis-touch').waitFor();
    await expect(page.getByTestId('basis-touch-airTemperatureC-value').innerText()).resolves.toBe('35 °C');
    for (const control of ['site-edit', 'site-delete', 'site-edit-form']) {
      await expect(page.getByTestId(control).count()).resolves.toBe(0);
    }
    await expect(page.getByRole('button', { name: /Edit|Delete|Set the/ }).count()).resolves.toBe(0);
    await screenshot(page, `team-sites-${tag}-12-viewer-site`);

    await page.reload({ waitUntil: 'load' });
    await page.waitForLoadState('networkidle');
    await page.getByRole('heading', { name: 'Thermal-oil loop', exact: true }).waitFor();
    await expect(page.getByTestId('site-edit').count()).resolves.toBe(0);
    await screenshot(page, `team-sites-${tag}-13-viewer-reloaded`);
    assertNoCspViolations(page);
    assertNoPageErrors(page);
    assertOnlyLoopback(opened.requests);
  });
});
