/**
 * The line list in a real browser, on the seeded demo, signed in as the demo engineer: open a site,
 * filter its lines, open one, edit it, see it marked stale, size the site again from the app (a job with
 * a progress bar), and see the new thickness, the same the server stored. Once on a phone (390×844) and
 * once on a wide screen (1440×900), each against its own fresh demo.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';

import { itemInsertRow } from '../../server/lines/items.repository';

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

jest.setTimeout(240_000);

type DemoCredentials = { password: string; users: { role: string; email: string }[] };
const demo = JSON.parse(fs.readFileSync(path.resolve(__dirname, '../../seeds/demo-credentials.json'), 'utf8')) as DemoCredentials;
const engineer = demo.users.find((u) => u.role === 'engineer')!;

async function signIn(page: Page, server: TestServer) {
  await gotoApp(page, `${server.url}/`);
  await fill(page, 'signin-email', engineer.email);
  await fill(page, 'signin-password', demo.password);
  await page.getByTestId('signin-submit').click();
  await page.waitForURL('**/sites');
  await page.getByTestId('sites-list').waitFor();
}

/** Millimetres from a thickness as shown in SI ("60 mm", "120 mm · 2 layers"). */
const mmOf = (text: string) => Number(/([\d,]+)\s*mm/.exec(text)?.[1].replace(/,/g, '') ?? NaN);

describe.each([
  ['phone', VIEWPORTS.phone],
  ['wide', VIEWPORTS.desktop],
])('on a %s screen', (label, viewport) => {
  const tag = viewportTag(viewport);
  const phone = label === 'phone';
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

  it('when the engineer filters, opens and edits a line, then it reads stale until the site is sized again, and then shows the new thickness', async () => {
    const { page } = opened;
    const site = (await server.db('sites').where({ name: 'Boiler house' }).first('id')) as { id: number };
    // An indoor line on the site's default build-up, sized by the seed, meeting its purposes, with
    // personnel protection governing: a hotter service must need more insulation to stay safe to touch.
    const line = (await server
      .db('items as i')
      .join('item_results as r', 'r.item_id', 'i.id')
      .where({ 'i.site_id': site.id, 'i.kind': 'line', 'i.location': 'indoor', 'r.failing': 0, 'r.governing_purpose': 'personnelProtection' })
      .whereNull('i.build_up')
      .where('r.total_thickness_m', '>', 0)
      .orderBy('i.tag')
      .first('i.id', 'i.tag', 'r.total_thickness_m')) as { id: number; tag: string; total_thickness_m: number };

    await signIn(page, server);
    await page.getByTestId(`site-${site.id}`).click();
    await page.waitForURL(`**/sites/${site.id}`);
    await page.getByTestId('site-sections').waitFor();
    await screenshot(page, `line-list-${tag}-01-site-sections`);

    await page.getByTestId('site-section-lines').click();
    await page.waitForURL(`**/sites/${site.id}/lines`);
    await page.getByTestId('item-list').getByTestId(/^row-/).first().waitFor();
    await screenshot(page, `line-list-${tag}-02-lines`);

    // Filter: indoor lines whose tag or service mentions LP steam's code, then the one tag.
    if (phone) await page.getByTestId('toggle-filters').click();
    await page.getByTestId('filter-location-indoor').click();
    await fill(page, 'list-search', line.tag);
    await page.getByTestId('list-count').filter({ hasText: /^1 line match$/ }).waitFor();
    await page.getByTestId(`row-${line.tag}`).waitFor();
    await expect(page.getByTestId(`row-${line.tag}`).innerText()).resolves.toMatch(/Indoor/);
    await expect(page.getByTestId(`state-${line.tag}`).getAttribute('data-state')).resolves.toBe('current');
    await screenshot(page, `line-list-${tag}-03-filtered`);

    await page.getByTestId(`open-${line.tag}`).click();
    await page.waitForURL(`**/lines/${line.id}`);
    const thickness = page.getByTestId('item-result-thickness');
    await thickness.waitFor();
    const before = mmOf((await thickness.getAttribute('data-text')) ?? '');
    expect(before).toBe(Math.round(line.total_thickness_m * 1000));
    await page.getByTestId('item-charts').waitFor();
    await screenshot(page, `line-list-${tag}-04-line`);

    // Edit: a much hotter service needs more insulation. A bad number is refused at its field first.
    await page.getByTestId('item-edit').click();
    await page.getByTestId('item-form').waitFor();
    await fill(page, 'item-operatingTemperature', 'hot');
    await page.getByTestId('item-save').click();
    await page.getByText('Error: Operating temperature must be a number').waitFor();
    await fill(page, 'item-operatingTemperature', '320');
    await screenshot(page, `line-list-${tag}-05-edit`);
    await page.getByTestId('item-save').click();
    await page.getByTestId('item-form').waitFor({ state: 'detached' });

    // Stale: said in words and marked with an icon, and the server agrees.
    await page.getByTestId('item-stale').waitFor();
    await expect(page.getByTestId('item-state').getAttribute('data-state')).resolves.toBe('stale');
    await expect(page.getByTestId('item-state').innerText()).resolves.toContain('Stale');
    const stored = (await server.db('items').where({ id: line.id }).first('operating_temperature_c')) as { operating_temperature_c: number };
    expect(stored.operating_temperature_c).toBe(320);
    await screenshot(page, `line-list-${tag}-06-stale`);

    // Size again from the app: the job runs in the background with a progress bar, then the page refreshes.
    await page.getByTestId('size-all').click();
    await page.getByTestId('sizing-done').waitFor({ timeout: 120_000 });
    await page.getByTestId('item-stale').waitFor({ state: 'detached' });
    await expect(page.getByTestId('item-state').getAttribute('data-state')).resolves.not.toBe('stale');
    const after = mmOf((await thickness.getAttribute('data-text')) ?? '');
    const result = (await server.db('item_results').where({ item_id: line.id }).first('total_thickness_m')) as { total_thickness_m: number };
    expect(after).toBe(Math.round(result.total_thickness_m * 1000));
    expect(after).toBeGreaterThan(before);
    await screenshot(page, `line-list-${tag}-07-resized`);

    // Back in the list, the row shows the new thickness and is current.
    await page.getByTestId('section-tab-lines').click();
    await page.waitForURL(`**/sites/${site.id}/lines`);
    if (phone) await page.getByTestId('toggle-filters').click();
    await fill(page, 'list-search', line.tag);
    await page.getByTestId('list-count').filter({ hasText: /^1 line match$/ }).waitFor();
    await expect(page.getByTestId(`thickness-${line.tag}`).innerText()).resolves.toMatch(new RegExp(`^${after} mm`));
    await expect(page.getByTestId(`state-${line.tag}`).getAttribute('data-state')).resolves.not.toBe('stale');
    await screenshot(page, `line-list-${tag}-08-list-after`);

    assertNoCspViolations(page);
    assertNoPageErrors(page);
  });

  it('when the overview, library and sizing settings are opened, then they show the site’s totals, the library with its sources and the settings', async () => {
    const { page } = opened;
    const site = (await server.db('sites').where({ name: 'Boiler house' }).first('id')) as { id: number };
    if (!phone) {
      // Sorting by keyboard: Enter on a column head sorts by it, Enter again reverses; the server sorts.
      await gotoApp(page, `${server.url}/sites/${site.id}/lines`);
      await page.getByTestId('item-list').getByTestId(/^row-/).first().waitFor();
      const head = page.getByTestId('sort-lengthM');
      await head.focus();
      await page.keyboard.press('Enter');
      await page.getByRole('columnheader', { name: /^Length, sorted ascending/ }).waitFor();
      await page.keyboard.press('Enter');
      await page.getByRole('columnheader', { name: /^Length, sorted descending/ }).waitFor();
      const longest = (await server.db('items').where({ site_id: site.id, kind: 'line' }).orderBy([{ column: 'length_m', order: 'desc' }, { column: 'id', order: 'desc' }]).first('tag')) as { tag: string };
      // The rows shown stay until the sorted page arrives; then the longest line comes first.
      await page.waitForFunction(
        (first) => document.querySelector('[data-testid="item-list"] [data-testid^="row-"]')?.getAttribute('data-testid') === first,
        `row-${longest.tag}`,
      );
      await screenshot(page, `line-list-${tag}-09a-sorted`);
    }
    await gotoApp(page, `${server.url}/sites/${site.id}/overview`);
    await page.getByTestId('overview-totals').waitFor();
    await expect(page.getByTestId('overview-heatLoss').innerText()).resolves.toMatch(/^[\d,.]+$/);
    await page.getByTestId('overview-chart').waitFor();
    await screenshot(page, `line-list-${tag}-09-overview`);

    await page.getByTestId('section-tab-library').click();
    await page.waitForURL('**/library**');
    await page.getByTestId('builtin-materials').waitFor();
    await expect(page.getByTestId('team-materials').innerText()).resolves.toContain('Flexible aerogel blanket');
    await screenshot(page, `line-list-${tag}-10-library`);

    await gotoApp(page, `${server.url}/sites/${site.id}/sizing`);
    await page.getByTestId('sizing-settings-view').waitFor();
    await expect(page.getByTestId('sizing-settings-view').innerText()).resolves.toMatch(/20 mm, 25 mm/);
    await screenshot(page, `line-list-${tag}-11-sizing-settings`);

    assertNoCspViolations(page);
    assertNoPageErrors(page);
    assertOnlyLoopback(opened.requests);
  });

  it('when a site holds 10,000 lines, then the page keeps only a window of rows and scrolling pages through to the last', async () => {
    const { page } = opened;
    const team = (await server.db('teams').first('id')) as { id: number };
    const [siteId] = await server.db('sites').insert({ team_id: team.id, name: `Big plant ${tag}`, description: '', design_bases: JSON.stringify({}) });
    const rows = Array.from({ length: 10_000 }, (_, i) =>
      itemInsertRow(team.id, siteId, 'line', null, {
        tag: `BIG-${String(i).padStart(5, '0')}`,
        service: i % 2 ? 'Steam' : 'Condensate',
        sizeKind: 'nps',
        nps: '2',
        dn: 50,
        outerDiameterM: 0.0603,
        lengthM: 10 + (i % 90),
        orientation: 'horizontal',
        heightM: null,
        headType: null,
        location: i % 3 ? 'outdoor' : 'indoor',
        operatingTemperatureC: 120 + (i % 60),
        purposes: ['personnelProtection'],
        purposeParameters: {},
        fittings: { valves: 0, flanges: 0, elbows: 0, tees: 0 },
        fittingsInsulated: true,
        buildUp: null,
        notes: '',
        inputHash: 'unsized',
      }),
    );
    for (let i = 0; i < rows.length; i += 1000) await server.db('items').insert(rows.slice(i, i + 1000));

    await gotoApp(page, `${server.url}/sites/${siteId}/lines`);
    await page.getByTestId('row-BIG-00000').waitFor();
    await expect(page.getByTestId('list-count').innerText()).resolves.toBe('500+ lines');
    const list = page.getByTestId('item-list');
    const rendered = () => page.getByTestId(/^row-BIG-/).count();
    let most = await rendered();
    for (let i = 0; i < 60 && (await page.getByTestId('row-BIG-09999').count()) === 0; i++) {
      await list.evaluate((el) => {
        el.scrollTop = el.scrollHeight;
      });
      await page.waitForTimeout(150);
      most = Math.max(most, await rendered());
    }
    await page.getByTestId('row-BIG-09999').waitFor();
    await expect(page.getByTestId('list-count').innerText()).resolves.toBe('10,000 lines');
    // Virtualised: never more than a few screens of rows in the page, however long the list.
    expect(most).toBeLessThan(300);
    await expect(page.getByTestId('state-BIG-09999').innerText()).resolves.toBe('Not sized');
    await screenshot(page, `line-list-${tag}-12-ten-thousand`);
    assertNoPageErrors(page);
  });
});
