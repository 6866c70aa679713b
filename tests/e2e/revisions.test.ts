/**
 * Revisions in a real browser, on the seeded demo: the engineer prepares revision B of the boiler house, the
 * second engineer checks it, the owner approves it (three demo users; the preparer is told they cannot check
 * their own work); after an edit to the draft the comparison shows the change, thickness marked; the issued
 * schedule downloads as a PDF whose pages are saved as images beside the screenshots. Then, on a phone, a
 * viewer reads the history and the comparison as cards without any signing control.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';

import { pdfText } from '../helpers/pdf-text';
import {
  assertNoCspViolations,
  assertNoPageErrors,
  assertOnlyLoopback,
  assertWebAppBuilt,
  fill,
  gotoApp,
  openBrowser,
  screenshot,
  SCREENSHOT_DIR,
  startTestServer,
  VIEWPORTS,
  type OpenedBrowser,
  type TestServer,
} from './harness';

jest.setTimeout(240_000);

type Demo = { password: string; users: { role: string; name: string; email: string }[] };
const demo = JSON.parse(fs.readFileSync(path.resolve(__dirname, '../../seeds/demo-credentials.json'), 'utf8')) as Demo;
const byEmail = (email: string) => demo.users.find((u) => u.email === email)!;
const ENGINEER = 'engineer@lagline.test';
const CHECKER = 'checker@lagline.test';
const OWNER = 'owner@lagline.test';
const VIEWER = 'viewer@lagline.test';

let server: TestServer;
let siteId: number;

async function signInAs(page: Page, email: string) {
  await page.waitForLoadState('networkidle');
  await page.goto('about:blank');
  await page.context().clearCookies();
  await gotoApp(page, `${server.url}/`);
  await fill(page, 'signin-email', email);
  await fill(page, 'signin-password', demo.password);
  await page.getByTestId('signin-submit').click();
  await page.waitForURL('**/sites');
  await page.getByTestId('sites-list').waitFor();
}

/** A call to the API from inside the page, with its session and CSRF token, as the app makes them. */
async function apiFromPage<T>(page: Page, method: string, url: string, body?: unknown): Promise<{ status: number; body: T }> {
  return page.evaluate(
    async ({ method, url, body }) => {
      const session = await (await fetch('/api/v1/auth/session')).json();
      const res = await fetch(url, {
        method,
        headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': session.csrfToken },
        body: body === undefined ? undefined : JSON.stringify(body),
      });
      return { status: res.status, body: res.status === 204 ? null : await res.json() };
    },
    { method, url, body },
  ) as Promise<{ status: number; body: T }>;
}

async function openRevision(page: Page, number: string) {
  await gotoApp(page, `${server.url}/sites/${siteId}/revisions`);
  await page.getByTestId(`revision-${number}-open`).click();
  await page.getByTestId('revision-screen').waitFor();
}

beforeAll(async () => {
  assertWebAppBuilt();
  server = await startTestServer({ seed: true });
  siteId = ((await server.db('sites').where({ name: 'Boiler house' }).first('id')) as { id: number }).id;
});
afterAll(async () => {
  await server?.close();
});

describe('on a wide screen', () => {
  let opened: OpenedBrowser;
  beforeAll(async () => {
    opened = await openBrowser({ viewport: VIEWPORTS.desktop });
  });
  afterAll(async () => {
    await opened?.close();
  });

  it('when three demo users prepare, check and approve, then revision B is issued with their names and times', async () => {
    const { page } = opened;
    await signInAs(page, ENGINEER);
    await gotoApp(page, `${server.url}/sites/${siteId}`);
    await page.getByTestId('site-section-revisions').click();
    await page.waitForURL(`**/sites/${siteId}/revisions`);
    await page.getByTestId('revision-A').waitFor();
    await expect(page.getByTestId('revision-A-status').innerText()).resolves.toContain('Issued');
    await expect(page.getByTestId('revision-A-signatures-checked').innerText()).resolves.toMatch(/^Ewan Strathdee · \d{1,2} [A-Z][a-z]{2} \d{4}, \d{2}:\d{2} UTC$/);
    await page.getByTestId('draft-ready').waitFor();
    await screenshot(page, 'revisions-wide-01-history');

    await page.getByTestId('prepare-open').click();
    await page.waitForURL(`**/sites/${siteId}/revisions/prepare`);
    await page.getByRole('radio', { name: /Issued for review\. It will be Rev B\./ }).waitFor();
    await fill(page, 'prepare-description', 'Second issue: condensate return re-routed.');
    await screenshot(page, 'revisions-wide-02-prepare');
    await page.getByTestId('prepare-submit').click();
    await page.getByTestId('revision-screen').waitFor();
    await page.getByRole('heading', { name: 'Rev B — Issued for review' }).waitFor();
    await expect(page.getByTestId('revision-status').innerText()).resolves.toContain('Awaiting check');
    // The preparer may not check their own revision.
    await expect(page.getByTestId('sign-not-yours').innerText()).resolves.toContain('You prepared this revision');
    await expect(page.getByTestId('sign-check').count()).resolves.toBe(0);
    await screenshot(page, 'revisions-wide-03-prepared');

    await signInAs(page, CHECKER);
    await openRevision(page, 'B');
    await page.getByTestId('sign-check').click();
    await page.getByTestId('sign-check-confirm').click();
    await page.getByText('Awaiting approval').waitFor();
    await expect(page.getByTestId('revision-signatures-checked').innerText()).resolves.toContain(byEmail(CHECKER).name);
    // The checker may not approve what they checked.
    await expect(page.getByTestId('sign-not-yours').innerText()).resolves.toContain('You checked this revision');

    await signInAs(page, OWNER);
    await openRevision(page, 'B');
    await page.getByTestId('sign-approve').click();
    await screenshot(page, 'revisions-wide-04-approve');
    await page.getByTestId('sign-approve-confirm').click();
    await page.getByTestId('revision-issued').waitFor();
    const names = await page.getByTestId('revision-signatures').innerText();
    for (const email of [ENGINEER, CHECKER, OWNER]) expect(names).toContain(byEmail(email).name);
    await screenshot(page, 'revisions-wide-05-issued');

    const rev = await server.db('revisions').where({ site_id: siteId, number: 'B' }).first('status', 'prepared_by_name', 'checked_by_name', 'approved_by_name');
    expect(rev).toEqual({ status: 'issued', prepared_by_name: byEmail(ENGINEER).name, checked_by_name: byEmail(CHECKER).name, approved_by_name: byEmail(OWNER).name });
  });

  it('when the draft is edited after issue, then the comparison with revision B shows the change with the thickness marked', async () => {
    const { page } = opened;
    const lines = await apiFromPage<{ lines: { id: number; tag: string; operatingTemperatureC: number }[] }>(page, 'GET', `/api/v1/sites/${siteId}/lines?q=HS-&limit=1&sort=tag`);
    const line = lines.body.lines[0];
    expect((await apiFromPage(page, 'PATCH', `/api/v1/lines/${line.id}`, { operatingTemperatureC: 320 })).status).toBe(200);
    const job = await apiFromPage<{ job: { id: number } }>(page, 'POST', `/api/v1/sites/${siteId}/sizing`, {});
    for (let i = 0; i < 600; i++) {
      const j = await apiFromPage<{ job: { status: string } }>(page, 'GET', `/api/v1/jobs/${job.body.job.id}`);
      if (j.body.job.status === 'done') break;
      await page.waitForTimeout(100);
    }
    await gotoApp(page, `${server.url}/sites/${siteId}/revisions`);
    await page.getByTestId('revision-B-compare').click();
    await page.waitForURL(/\/compare\?from=\d+&to=draft/);
    await page.getByTestId('compare-counts').waitFor();
    await expect(page.getByTestId('compare-counts').innerText()).resolves.toMatch(/^0 added · 0 removed · 1 changed \(1 with a new thickness\) · \d+ unchanged$/);
    await page.getByTestId('changes-table').waitFor();
    const row = await page.getByTestId(`change-${line.tag}`).innerText();
    expect(row).toContain('Changed');
    const table = await page.getByTestId('changes-table').innerText();
    expect(table).toMatch(new RegExp(`Operating temperature\\s+${line.operatingTemperatureC.toFixed(1)} °C\\s+320\\.0 °C`));
    expect(table).toContain('Thickness changed');
    await screenshot(page, 'revisions-wide-06-compare');

    // The comparison downloads as CSV too.
    const [csv] = await Promise.all([page.waitForEvent('download'), page.getByTestId('compare-csv').click()]);
    const csvText = fs.readFileSync((await csv.path()) as string, 'utf8');
    expect(csvText.startsWith('\uFEFFChange,Kind,Tag,Field,From,To,Thickness changed\r\n')).toBe(true);
    const csvTag = /[",]/.test(line.tag) ? `"${line.tag.replace(/"/g, '""')}"` : line.tag;
    expect(csvText).toContain(`changed,line,${csvTag},Operating temperature,${line.operatingTemperatureC.toFixed(1)} °C,320.0 °C,false\r\n`);
  });

  it('when the issued schedule is downloaded, then it is the PDF of revision B, and its pages are saved as images', async () => {
    const { page } = opened;
    const id = ((await server.db('revisions').where({ site_id: siteId, number: 'B' }).first('id')) as { id: number }).id;
    await gotoApp(page, `${server.url}/sites/${siteId}/revisions`);
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId(`download-rev-${id}-insulation-schedule-pdf`).click()]);
    expect(download.suggestedFilename()).toBe('Boiler_house_rev-B_insulation-schedule_SI.pdf');
    const outDir = path.join(SCREENSHOT_DIR, '..', 'downloads');
    fs.mkdirSync(outDir, { recursive: true });
    const file = path.join(outDir, download.suggestedFilename());
    await download.saveAs(file);
    const bytes = fs.readFileSync(file);
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-');
    const text = await pdfText(bytes);
    expect(text.pages[0].text).toMatch(/REVISION\nRev B — Issued for review\n/);
    expect(text.pages[0].text).toMatch(/STATUS\nIssued\n/);
    for (const email of [ENGINEER, CHECKER, OWNER]) expect(text.pages[0].text).toContain(byEmail(email).name);
    expect(text.text).toContain(`page ${text.total} of ${text.total}`);
    // Page images for a person to look at, next to the screenshots.
    fs.mkdirSync(SCREENSHOT_DIR, { recursive: true });
    execFileSync('pdftoppm', ['-png', '-r', '60', file, path.join(SCREENSHOT_DIR, 'revisions-schedule-rev-B-page')]);
    const images = fs.readdirSync(SCREENSHOT_DIR).filter((f) => f.startsWith('revisions-schedule-rev-B-page') && f.endsWith('.png'));
    expect(images.length).toBe(text.total);
    assertNoCspViolations(page);
    assertNoPageErrors(page);
  });
});

describe('on a phone', () => {
  let opened: OpenedBrowser;
  beforeAll(async () => {
    opened = await openBrowser({ viewport: VIEWPORTS.phone });
  });
  afterAll(async () => {
    await opened?.close();
  });

  it('when a viewer opens the history and the comparison, then they read cards and see no signing control', async () => {
    const { page } = opened;
    await signInAs(page, VIEWER);
    await gotoApp(page, `${server.url}/sites/${siteId}/revisions`);
    await page.getByTestId('revision-B').waitFor();
    await expect(page.getByTestId('prepare-open').count()).resolves.toBe(0);
    await screenshot(page, 'revisions-phone-01-history');
    await page.getByTestId('draft-compare').click();
    await page.getByTestId('changes-cards').waitFor();
    await expect(page.getByTestId('compare-counts').innerText()).resolves.toContain('1 changed');
    await screenshot(page, 'revisions-phone-02-compare');
    await openRevision(page, 'B');
    await expect(page.getByTestId('sign-check').count()).resolves.toBe(0);
    await expect(page.getByTestId('withdraw').count()).resolves.toBe(0);
    await screenshot(page, 'revisions-phone-03-revision');
    assertNoCspViolations(page);
    assertNoPageErrors(page);
    assertOnlyLoopback();
  });
});
