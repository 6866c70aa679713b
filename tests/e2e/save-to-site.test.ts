/**
 * Quick sizing → a site's line list, in Chromium, on the seeded demo as the demo engineer: size a pipe in quick
 * sizing for heat conservation, save it to the boiler house as a new line (a tag already in use is refused at
 * the tag), find it in the line list, see its inputs as saved, size the site (on a wide screen from the
 * prepare-revision screen, where the new line blocks the revision until then), and see the same purpose govern.
 * Once on a phone (390×844), given by NPS in still air, and once on a wide screen (1440×900), given by DN with
 * wind (so the location is asked), each against its own fresh demo. Along the way: every text input is at least
 * the 44 px a thumb needs on a phone, and the field keeps its 44 px look on a wide screen.
 */
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
  signInAsDemo,
  startTestServer,
  VIEWPORTS,
  viewportTag,
  type OpenedBrowser,
  type TestServer,
} from './harness';

jest.setTimeout(300_000);

/** A JSON column as stored (the driver may hand it back parsed or as text). */
const json = (v: unknown): unknown => (typeof v === 'string' ? JSON.parse(v) : v);

/** Waits until quick sizing's live calculation has caught up with the last edit. */
async function settled(page: Page) {
  await page.waitForSelector('[data-testid="qs-results"][data-pending="false"]');
}

async function typeCase(page: Page, testId: string, value: string) {
  await page.getByTestId(testId).first().fill(value);
  await settled(page);
}

/** Heights of every visible text input under `within` and of the field box around it [px]. */
async function inputHeights(page: Page, within: string): Promise<{ name: string; input: number; box: number }[]> {
  return page.evaluate((sel) => {
    const root = document.querySelector(sel);
    if (!root) return [];
    return Array.from(root.querySelectorAll('input:not([type="file"]):not([type="checkbox"]), textarea'))
      .map((el) => {
        const r = (el as HTMLElement).getBoundingClientRect();
        const box = (el.parentElement as HTMLElement).getBoundingClientRect();
        return { name: el.getAttribute('aria-label') ?? el.tagName, input: r.height, box: box.height, visible: r.width > 0 && r.height > 0 };
      })
      .filter((x) => x.visible)
      .map(({ name, input, box }) => ({ name, input: Math.round(input), box: Math.round(box) }));
  }, within);
}

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

  it('when the engineer saves a quick case to a site, then it is a new line with its inputs, and after sizing the same purpose governs', async () => {
    const { page } = opened;
    const site = (await server.db('sites').where({ name: 'Boiler house' }).first('id', 'name')) as { id: number; name: string };
    const taken = (await server.db('items').where({ site_id: site.id, kind: 'line' }).orderBy('tag').first('tag')) as { tag: string };
    const newTag = `QS-${tag}`;

    await signInAsDemo(page, server.url, 'engineer');
    await gotoApp(page, `${server.url}/quick-sizing`);
    await page.waitForSelector('[data-testid="qs-screen"][data-ready="true"]');
    await settled(page);

    // Size a pipe in quick sizing: heat conservation at 60 W/m, 250 °C.
    await page.getByTestId('qs-purpose-conservation').click();
    await settled(page);
    await typeCase(page, 'qs-input-limit', '60');
    await typeCase(page, 'qs-input-processTemperatureC', '250');
    if (!phone) {
      await page.getByTestId('qs-size-by-dn').click();
      await settled(page);
      await typeCase(page, 'qs-input-windSpeedMS', '3');
    }
    await page.getByTestId('qs-result-thickness').first().waitFor();
    const quickThickness = Number(await page.getByTestId('qs-result-thickness').first().getAttribute('data-si'));
    expect(quickThickness).toBeGreaterThan(0);
    await screenshot(page, `save-to-site-${tag}-01-quick-case`);

    // Save it: the form says what is saved and what the site decides instead.
    await page.getByTestId('qs-save-to-site').click();
    await page.getByTestId('qs-save-form').waitFor();
    const summary = await page.getByTestId('qs-save-summary').innerText();
    expect(summary).toContain(phone ? 'Line NPS 4, horizontal' : 'Line DN 100, horizontal');
    expect(summary).toContain('Heat conservation: at most 60.0 W/m');
    expect(summary).toMatch(/the site’s design bases apply/);
    await page.getByTestId('qs-save-site').click();
    await page.getByTestId(`qs-save-site-option-${site.id}`).click();
    await fill(page, 'qs-save-tag', taken.tag);
    await fill(page, 'qs-save-service', 'Steam from the quick case');
    await fill(page, 'qs-save-length', '120');
    if (phone) {
      await expect(page.getByTestId('qs-save-indoor').innerText()).resolves.toMatch(/indoor \(the case has no wind\)/);
    } else {
      await page.getByTestId('qs-save-location').getByRole('radio', { name: /^Outdoor/ }).click();
    }
    if (phone) {
      // On a phone every text input is itself at least 44 px tall, not just the box drawn around it.
      const small = (await inputHeights(page, '[data-testid="qs-save-form"]')).filter((x) => x.input < 44);
      expect(small).toEqual([]);
    }
    await screenshot(page, `save-to-site-${tag}-02-save-form`);

    // A tag already used in the site is refused by the server, at the tag.
    await page.getByTestId('qs-save-submit').click();
    await page.getByText(`Error: The site already has a line tagged "${taken.tag}".`).waitFor();
    await screenshot(page, `save-to-site-${tag}-03-tag-taken`);
    await fill(page, 'qs-save-tag', newTag);
    await page.getByTestId('qs-save-submit').click();
    await page.getByTestId('qs-saved').waitFor();
    const stored = (await server.db('items').where({ site_id: site.id, kind: 'line', tag: newTag }).first()) as Record<string, unknown>;
    expect(stored).toMatchObject({
      service: 'Steam from the quick case',
      size_kind: phone ? 'nps' : 'dn',
      length_m: 120,
      operating_temperature_c: 250,
      location: phone ? 'indoor' : 'outdoor',
    });
    expect(json(stored.purposes)).toEqual(['heatConservation']);
    expect(json(stored.purpose_parameters)).toEqual({ heatConservation: { maxHeatLossWPerM: 60 } });
    expect(json(stored.build_up)).toEqual({ layers: [{ materialId: 'mineral-fibre-pipe-c547-type-i' }], finishId: 'aluminium-oxidised' });
    await screenshot(page, `save-to-site-${tag}-04-saved`);

    // Open it from the site's line list.
    await page.getByTestId('qs-saved-list').click();
    await page.waitForURL(`**/sites/${site.id}/lines`);
    await page.getByTestId('item-list').getByTestId(/^row-/).first().waitFor();
    if (phone) await page.getByTestId('toggle-filters').click();
    await fill(page, 'list-search', newTag);
    await page.getByTestId('list-count').filter({ hasText: /^1 line match$/ }).waitFor();
    await expect(page.getByTestId(`state-${newTag}`).getAttribute('data-state')).resolves.toBe('unsized');
    await screenshot(page, `save-to-site-${tag}-05-in-list`);
    await page.getByTestId(`open-${newTag}`).click();
    await page.waitForURL(`**/lines/${stored.id}`);
    await page.getByTestId('item-unsized').waitFor();
    const inputs = await page.getByTestId('item-inputs').innerText();
    expect(inputs).toContain(phone ? 'NPS 4' : 'DN 100');
    expect(inputs).toMatch(/120 m/);
    expect(inputs).toContain('250.0 °C');
    expect(inputs).toContain(phone ? 'Indoor' : 'Outdoor');
    expect(inputs).toContain('Heat conservation');
    expect(inputs).toContain('60.0 W/m');
    expect(inputs).toContain('Saved from quick sizing.');

    // Size the site: from the line's page on a phone; on a wide screen from the prepare-revision screen, where the
    // new line blocks the next revision until it is sized.
    if (phone) {
      await page.getByTestId('size-all').click();
      await page.getByTestId('sizing-done').waitFor({ timeout: 180_000 });
    } else {
      await gotoApp(page, `${server.url}/sites/${site.id}/revisions/prepare`);
      await page.getByTestId(`blocker-${newTag}`).waitFor();
      await expect(page.getByTestId(`blocker-${newTag}`).innerText()).resolves.toContain('Not sized');
      await screenshot(page, `save-to-site-${tag}-05b-prepare-blocked`);
      await page.getByTestId('prepare-blocked').getByTestId('size-all').click();
      await page.getByTestId('sizing-done').waitFor({ timeout: 180_000 });
      await page.getByTestId('prepare-blocked').waitFor({ state: 'detached' });
      await screenshot(page, `save-to-site-${tag}-05c-prepare-sized`);
      await gotoApp(page, `${server.url}/lines/${stored.id}`);
    }
    await page.getByTestId('item-governing').waitFor();
    await expect(page.getByTestId('item-unsized').count()).resolves.toBe(0);
    await expect(page.getByTestId('item-governing').innerText()).resolves.toContain('Heat conservation governs');
    const result = (await server.db('item_results').where({ item_id: stored.id }).first('governing_purpose', 'total_thickness_m')) as { governing_purpose: string; total_thickness_m: number };
    expect(result.governing_purpose).toBe('heatConservation');
    expect(result.total_thickness_m).toBeGreaterThan(0);
    await screenshot(page, `save-to-site-${tag}-06-sized`);

    // The line form: text inputs are 44 px targets on a phone; on a wide screen the field keeps its 44 px box.
    await page.getByTestId('item-edit').click();
    await page.getByTestId('item-form').waitFor();
    const heights = await inputHeights(page, '[data-testid="item-form"]');
    expect(heights.length).toBeGreaterThan(5);
    if (phone) expect(heights.filter((x) => x.input < 44)).toEqual([]);
    else expect(heights.filter((x) => x.name !== 'Notes (optional)' && (x.box !== 44 || x.input !== 44))).toEqual([]);
    await screenshot(page, `save-to-site-${tag}-07-line-form`);

    assertNoCspViolations(page);
    assertNoPageErrors(page);
    assertOnlyLoopback(opened.requests);
  });

  it('when a wall is sized in quick sizing, then saving is not offered, with the reason', async () => {
    const { page } = opened;
    await gotoApp(page, `${server.url}/quick-sizing`);
    await page.waitForSelector('[data-testid="qs-screen"][data-ready="true"]');
    await page.getByTestId('qs-kind-wall').click();
    await settled(page);
    await expect(page.getByTestId('qs-save-to-site').getAttribute('aria-disabled')).resolves.toBe('true');
    await expect(page.getByTestId('qs-save-note').innerText()).resolves.toMatch(/not a line-list item/);
    assertNoPageErrors(page);
  });
});
