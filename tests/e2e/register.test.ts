/**
 * The hot-surface register in a real browser, against the seeded demo plant:
 * - on a phone (390×844) a safety officer records a hot flange with a photo in a few taps, one-handed (large
 *   targets, the save button low on the screen), and the next entry starts from the site and method used;
 * - on a wide screen (1440×900) an entry goes through the whole workflow — open, action assigned (by the safety
 *   officer), made safe (by the engineer who owns the action), verified (by the safety officer) — and a second one
 *   is sent back, accepted and reopened; the list filters and exports, and the site page links to the register.
 */
import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
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
  type OpenedBrowser,
  type TestServer,
} from './harness';

jest.setTimeout(240_000);

type DemoCredentials = { password: string; users: { role: string; name: string; email: string }[] };
const demo = JSON.parse(fs.readFileSync(path.resolve(__dirname, '../../seeds/demo-credentials.json'), 'utf8')) as DemoCredentials;
const user = (role: string) => demo.users.find((u) => u.role === role)!;

async function signInAs(page: Page, server: TestServer, role: string) {
  await page.waitForLoadState('networkidle');
  await page.goto('about:blank');
  await page.context().clearCookies();
  await gotoApp(page, `${server.url}/`);
  await fill(page, 'signin-email', user(role).email);
  await fill(page, 'signin-password', demo.password);
  await page.getByTestId('signin-submit').click();
  await page.waitForURL('**/sites');
}

async function siteId(server: TestServer, name: string): Promise<number> {
  return ((await server.db('sites').where({ name }).first('id')) as { id: number }).id;
}

/**
 * Every visible control of the page that is smaller than the 44 px a thumb needs. A text input counts by its own
 * size (the element a tap focuses), not by the box drawn around it.
 */
async function smallTargets(page: Page, within: string): Promise<string[]> {
  return page.evaluate((sel) => {
    const root = document.querySelector(sel);
    if (!root) return ['(no root)'];
    const out: string[] = [];
    for (const el of Array.from(root.querySelectorAll('a, button, [role="button"], [role="radio"], [role="link"], input:not([type="file"]), textarea'))) {
      const r = (el as HTMLElement).getBoundingClientRect();
      if (r.width === 0 || r.height === 0) continue;
      if (r.height < 44 || r.width < 44) out.push(`${(el as HTMLElement).getAttribute('aria-label') || (el as HTMLElement).innerText || el.tagName} ${Math.round(r.width)}×${Math.round(r.height)}`);
    }
    return out;
  }, within);
}

async function photoFile(): Promise<string> {
  const file = path.resolve(__dirname, '../../test-output/register-flange.jpg');
  fs.mkdirSync(path.dirname(file), { recursive: true });
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="1600" height="1200"><rect width="1600" height="1200" fill="#3b4a55"/><rect y="500" width="1600" height="220" fill="#d9531e"/><rect x="720" y="420" width="80" height="380" fill="#b23a12"/><rect x="820" y="420" width="80" height="380" fill="#b23a12"/></svg>`;
  await sharp(Buffer.from(svg)).jpeg({ quality: 80 }).withMetadata({ orientation: 1 }).toFile(file);
  return file;
}

describe('field entry on a phone (390×844)', () => {
  let server: TestServer;
  let opened: OpenedBrowser;
  beforeAll(async () => {
    assertWebAppBuilt();
    server = await startTestServer({ seed: true });
    opened = await openBrowser({ viewport: VIEWPORTS.phone });
  });
  afterAll(async () => {
    await opened?.close();
    await server?.close();
  });

  it('when a safety officer records a hot flange with a photo, then it is saved with its verdict and photo in a few taps, one-handed', async () => {
    const { page } = opened;
    await signInAs(page, server, 'safety');
    // Five destinations in the bottom bar, the register among them.
    const nav = page.getByRole('navigation', { name: 'Main' });
    await expect(nav.getByRole('link').count()).resolves.toBe(5);
    await nav.getByRole('link', { name: /Register/ }).click();
    await page.waitForURL('**/register');
    await page.getByTestId('register-list').waitFor();
    await screenshot(page, 'register-390x844-01-list');

    // The primary action sits low on the screen, where the thumb is.
    const newButton = page.getByTestId('register-new');
    const box = (await newButton.boundingBox())!;
    expect(box.y).toBeGreaterThan(844 / 2);
    expect(box.height).toBeGreaterThanOrEqual(44);
    await newButton.click();
    await page.waitForURL('**/register/new');
    await page.getByTestId('entry-form').waitFor();

    const boiler = await siteId(server, 'Boiler house');
    await page.getByTestId('entry-site').click();
    await page.getByTestId(`entry-site-option-${boiler}`).click();
    await fill(page, 'entry-location', 'Flange F-12 by the feed pump');
    await fill(page, 'entry-temperature', '92');
    await page.getByTestId('entry-method').getByRole('radio', { name: 'Infrared', exact: true }).click();
    await fill(page, 'entry-emissivity', '0.95');
    await page.getByTestId('entry-material').getByRole('radio', { name: 'Coated metal', exact: true }).click();
    await page.getByTestId('entry-photo-input').setInputFiles(await photoFile());
    await page.getByRole('img', { name: /Photo 1/ }).waitFor();
    // The verdict follows the reading before anything is saved.
    await page.getByTestId('entry-verdict').getByText('Fail').waitFor();
    const save = page.getByTestId('entry-save');
    const saveBox = (await save.boundingBox())!;
    expect(saveBox.y + saveBox.height).toBeGreaterThan(844 * 0.75);
    expect(saveBox.height).toBeGreaterThanOrEqual(44);
    expect(await smallTargets(page, '[data-testid="entry-new"]')).toEqual([]);
    await screenshot(page, 'register-390x844-02-field-entry');

    await save.click();
    await page.waitForURL(/\/register\/\d+$/);
    await page.getByTestId('entry-verdict-card').waitFor();
    await expect(page.getByTestId('entry-reading').innerText()).resolves.toBe('92.0 °C');
    await page.getByTestId('entry-verdict-badge').getByText('Fail').waitFor();
    await page.getByTestId('entry-photo-0').waitFor();
    const id = Number(new URL(page.url()).pathname.split('/').pop());
    const row = await server.db('register_entries').where({ id }).first();
    expect(row).toMatchObject({ site_id: boiler, location: 'Flange F-12 by the feed pump', method: 'infrared', emissivity_setting: 0.95, surface_material: 'coatedMetal', status: 'open' });
    const photo = await server.db('register_photos').where({ entry_id: id }).first();
    expect(photo).toMatchObject({ original_width: 1600, original_height: 1200, width: 1600 });
    // The page asked for the thumbnail, and the server gives it to this signed-in officer.
    await page.waitForLoadState('networkidle');
    expect(opened.requests.some((u) => u.endsWith(`/api/v1/register/photos/${photo.id}/thumbnail`))).toBe(true);
    const thumb = await page.request.get(`${server.url}/api/v1/register/photos/${photo.id}/thumbnail`);
    expect(thumb.status()).toBe(200);
    expect(thumb.headers()['content-type']).toBe('image/jpeg');
    await screenshot(page, 'register-390x844-03-entry');

    // The next entry starts from the site and method used last time (kept on this device).
    await gotoApp(page, `${server.url}/register/new`);
    await page.getByTestId('entry-form').waitFor();
    await expect(page.getByTestId('entry-site').getAttribute('aria-label')).resolves.toBe('Site: Boiler house');
    await expect(page.getByTestId('entry-method').getByRole('radio', { name: 'Infrared', exact: true }).getAttribute('aria-checked')).resolves.toBe('true');
    await expect(page.getByTestId('entry-emissivity').inputValue()).resolves.toBe('0.95');

    // A wrong file is refused before it is sent, with the reason.
    const textFile = path.resolve(__dirname, '../../test-output/register-notes.txt');
    fs.writeFileSync(textFile, 'not a photo');
    await page.getByTestId('entry-photo-input').setInputFiles(textFile);
    await expect(page.getByTestId('entry-photo-problem').innerText()).resolves.toMatch(/not a JPEG, PNG or WebP photo/);
    // A missing temperature is caught at its field.
    await fill(page, 'entry-location', 'Valve bonnet');
    await page.getByTestId('entry-save').click();
    await page.getByText('Error: Surface temperature is required').waitFor();
    await screenshot(page, 'register-390x844-04-field-entry-errors');

    assertNoCspViolations(page);
    assertNoPageErrors(page);
    assertOnlyLoopback(opened.requests);
  });
});

describe('the whole workflow on a wide screen (1440×900)', () => {
  let server: TestServer;
  let opened: OpenedBrowser;
  beforeAll(async () => {
    assertWebAppBuilt();
    server = await startTestServer({ seed: true });
    opened = await openBrowser({ viewport: VIEWPORTS.desktop });
  });
  afterAll(async () => {
    await opened?.close();
    await server?.close();
  });

  const step = async (page: Page, name: string) => {
    await page.getByTestId(`step-${name}`).click();
    await page.getByTestId(`step-form-${name}`).waitFor();
  };
  const confirm = async (page: Page, status: string) => {
    await page.getByTestId('step-confirm').click();
    await page.locator(`[data-testid="entry-screen"][data-status="${status}"]`).waitFor();
  };

  it('when an entry goes open → action assigned → made safe → verified, then each step shows, with who took it, and the register follows', async () => {
    const { page } = opened;
    const tank = await siteId(server, 'Tank farm');
    await signInAs(page, server, 'safety');
    // From the site page to its register section.
    await gotoApp(page, `${server.url}/sites/${tank}`);
    await page.getByTestId('site-register').waitFor();
    await page.getByTestId('site-register-counts').waitFor();
    await page.getByTestId('site-register-new').click();
    await page.waitForURL('**/register/new?siteId=*');
    await page.getByTestId('entry-form').waitFor();
    await fill(page, 'entry-location', 'Heating coil inlet valve TK-302');
    await fill(page, 'entry-temperature', '135');
    await page.getByTestId('entry-more').click();
    await fill(page, 'entry-description', 'Bare valve body at the foot of the tank stair.');
    await screenshot(page, 'register-1440x900-01-new-entry');
    await page.getByTestId('entry-save').click();
    await page.locator('[data-testid="entry-screen"][data-status="open"]').waitFor();
    const id = Number(new URL(page.url()).pathname.split('/').pop());
    await screenshot(page, 'register-1440x900-02-open');

    // The safety officer assigns the action to the engineer.
    await step(page, 'assign');
    await page.getByTestId('step-owner').click();
    const engineer = user('engineer');
    const engineerId = ((await server.db('users').where({ email: engineer.email }).first('id')) as { id: number }).id;
    await page.getByTestId(`step-owner-option-${engineerId}`).click();
    await page.getByTestId('step-due-quick').getByRole('radio', { name: 'In a week' }).click();
    await fill(page, 'step-text', 'Fit a removable insulation jacket on the valve.');
    await screenshot(page, 'register-1440x900-03-assign');
    await confirm(page, 'actionAssigned');
    await expect(page.getByTestId('entry-owner').innerText()).resolves.toContain(engineer.name);
    await page.getByTestId('history-assign').waitFor();
    const mail = await server.mail.waitFor(engineer.email, { subject: /Action for you/ });
    expect(mail.text).toContain(`${server.url}/register/${id}`);
    await screenshot(page, 'register-1440x900-04-assigned');

    // The engineer follows the mail's link and records what was done.
    await signInAs(page, server, 'engineer');
    await gotoApp(page, mail.text.match(/https?:\/\/\S+\/register\/\d+/)![0]);
    await page.locator('[data-testid="entry-screen"][data-status="actionAssigned"]').waitFor();
    await expect(page.getByTestId('step-verify').count()).resolves.toBe(0);
    await step(page, 'madeSafe');
    await fill(page, 'step-text', 'Removable jacket fitted and strapped.');
    await confirm(page, 'madeSafe');
    await screenshot(page, 'register-1440x900-05-made-safe');
    await server.mail.waitFor(user('safety').email, { subject: /Please verify/ });

    // The safety officer verifies with a new reading; one still too hot is refused first.
    await signInAs(page, server, 'safety');
    await gotoApp(page, `${server.url}/register/${id}`);
    await page.locator('[data-testid="entry-screen"][data-status="madeSafe"]').waitFor();
    await step(page, 'verify');
    await fill(page, 'step-reading', '80');
    await page.getByTestId('step-confirm').click();
    await expect(page.getByTestId('step-problem').innerText()).resolves.toMatch(/still above/);
    await fill(page, 'step-reading', '39');
    await fill(page, 'step-text', 'Jacket checked on the walk.');
    await confirm(page, 'verified');
    await expect(page.getByTestId('entry-verification').innerText()).resolves.toContain('39.0 °C');
    const history = await page.getByTestId('entry-history').innerText();
    expect(history).toMatch(/Recorded[\s\S]*Assign → Action assigned[\s\S]*Record made safe → Made safe[\s\S]*Verify → Verified/);
    expect(history).toContain(user('engineer').name);
    // A verified entry can only be reopened.
    await expect(page.getByTestId('step-buttons').getByRole('button').allInnerTexts()).resolves.toEqual(['Reopen']);
    await screenshot(page, 'register-1440x900-06-verified');
    const stored = await server.db('register_entries').where({ id }).first();
    expect(stored).toMatchObject({ status: 'verified', verification_temperature_c: 39 });
    expect((await server.db('register_history').where({ entry_id: id }).orderBy('id').select('action')).map((h: { action: string }) => h.action)).toEqual([
      'created',
      'assign',
      'madeSafe',
      'verify',
    ]);

    assertNoCspViolations(page);
    assertNoPageErrors(page);
  });

  it('when an entry is sent back, accepted with a reason and reopened, then the status follows each step', async () => {
    const { page } = opened;
    // The seeded manway on the tank farm waits for verification.
    const manway = ((await server.db('register_entries').where('location', 'like', 'Bitumen tank TK-301%').first('id')) as { id: number }).id;
    await gotoApp(page, `${server.url}/register/${manway}`);
    await page.locator('[data-testid="entry-screen"][data-status="madeSafe"]').waitFor();
    await step(page, 'sendBack');
    await fill(page, 'step-text', 'Guard leaves a gap at the hinge side.');
    await confirm(page, 'actionAssigned');
    await step(page, 'accept');
    await fill(page, 'step-text', 'Tank taken out of service; manway locked.');
    await confirm(page, 'accepted');
    await expect(page.getByTestId('entry-status-note').innerText()).resolves.toContain('Tank taken out of service');
    await screenshot(page, 'register-1440x900-07-accepted');
    await step(page, 'reopen');
    await fill(page, 'step-text', 'Tank back in service.');
    await confirm(page, 'open');

    assertNoCspViolations(page);
    assertNoPageErrors(page);
  });

  it('when the register is filtered, then the rows follow; calculated risks are marked; the PDF downloads', async () => {
    const { page } = opened;
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Register' }).click();
    await page.waitForURL('**/register');
    await page.getByTestId('register-list').waitFor();
    // Calculated risks from the seeded sizing are in the list, marked; one is taken onto the register.
    const risks = page.locator('[data-testid^="register-row-item-"][data-source="calculated"]');
    await expect(risks.count()).resolves.toBeGreaterThan(0);
    const riskKey = (await risks.first().getAttribute('data-testid'))!.replace('register-row-', '');
    const itemId = Number(riskKey.replace('item-', ''));
    await risks.first().click();
    await page.waitForURL('**/register/new?*method=calculated*');
    await page.getByText('Calculated by sizing').waitFor();
    await page.getByTestId('entry-save').click();
    await page.locator('[data-testid="entry-screen"][data-status="open"]').waitFor();
    const recorded = await server.db('register_entries').where({ item_id: itemId }).first();
    expect(recorded).toMatchObject({ method: 'calculated', status: 'open' });
    await screenshot(page, 'register-1440x900-08a-calculated-recorded');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Register' }).click();
    await page.getByTestId('register-list').waitFor();
    await expect(page.getByTestId(`register-row-${riskKey}`).count()).resolves.toBe(0);
    await page.getByTestId(`register-row-entry-${recorded.id}`).waitFor();
    await page.getByTestId('register-verdict').getByRole('radio', { name: 'Caution', exact: true }).click();
    await page.locator('[data-testid^="register-row-"][data-source="calculated"]').first().waitFor({ state: 'detached' });
    await page.getByText('Strainer F-204 cover').waitFor();
    await screenshot(page, 'register-1440x900-08-filtered');
    await page.getByTestId('register-verdict').getByRole('radio', { name: 'Any verdict' }).click();
    await page.getByTestId('register-status').getByRole('radio', { name: 'Closed', exact: true }).click();
    await page.getByText('Heating coil inlet valve TK-302').waitFor();
    const href = await page.getByTestId('register-export-pdf').getAttribute('href');
    expect(href).toBe('/api/v1/register/export.pdf?status=closed');
    const pdf = await page.request.get(`${server.url}${href}`);
    expect(pdf.status()).toBe(200);
    expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');
    await screenshot(page, 'register-1440x900-09-closed');

    assertNoCspViolations(page);
    assertNoPageErrors(page);
    assertOnlyLoopback(opened.requests);
  });
});
