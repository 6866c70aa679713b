/**
 * Quick sizing as its users find it, on a phone (390×844) and a wide screen (1440×900): one touch-safety verdict
 * from the limit that governs, the worst verdict in the pinned summary, service limits at the layer, US customary
 * all the way (inch series, cents, names, the link), cold service costed as chiller electricity and judged as cold
 * contact, a target out of reach with its best value and the charts, and the keyboard on lists and chips.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';

import { encodeCaseQuery } from '../../src/calc/case-url';
import { defaultDraft, draftOptions, draftToCase, type Draft } from '../../src/calc/quick-case';

import {
  SCREENSHOT_DIR,
  VIEWPORTS,
  assertNoCspViolations,
  assertNoPageErrors,
  assertOnlyLoopback,
  assertWebAppBuilt,
  openBrowser,
  screenshot,
  startTestServer,
  viewportTag,
  type OpenedBrowser,
  type TestServer,
  type Viewport,
} from './harness';

jest.setTimeout(120_000);

let server: TestServer;

beforeAll(async () => {
  assertWebAppBuilt();
  server = await startTestServer();
});

afterAll(async () => {
  await server?.close();
});

const byTestId = (page: Page, id: string) => page.locator(`[data-testid="${id}"]`).first();

async function open(page: Page, draft?: Draft, units?: 'SI' | 'US'): Promise<void> {
  const query = draft ? `?${encodeCaseQuery(draftToCase(draft), draftOptions(draft), units)}` : '';
  await page.goto(`${server.url}/quick-sizing${query}`, { waitUntil: 'load' });
  await page.waitForSelector('[data-testid="qs-screen"][data-ready="true"]');
  await settled(page);
}

async function settled(page: Page): Promise<void> {
  await page.waitForSelector('[data-testid="qs-results"][data-pending="false"], [data-testid="qs-invalid"], [data-testid="qs-calc-error"]');
}

/** Waits for the next result after an edit (the link follows every new result). */
async function afterEdit(page: Page, edit: () => Promise<void>): Promise<void> {
  const before = await page.evaluate(() => location.search);
  await edit();
  await page.waitForFunction((b) => location.search !== b, before);
  await settled(page);
}

async function text(page: Page, id: string): Promise<string> {
  return (await byTestId(page, id).textContent()) ?? '';
}

async function si(page: Page, id: string): Promise<number> {
  return Number(await byTestId(page, id).getAttribute('data-si'));
}

/** The state the phone's pinned summary shows, or null on a wide screen (no pinned summary there). */
async function pinnedState(page: Page): Promise<string | null> {
  const bar = page.locator('[data-testid="qs-summary"]');
  return (await bar.count()) > 0 ? bar.getAttribute('data-state') : null;
}

describe.each([
  ['phone', VIEWPORTS.phone],
  ['wide', VIEWPORTS.desktop],
] as const)('quick sizing verdicts on a %s screen', (name, viewport: Viewport) => {
  const tag = viewportTag(viewport);
  let b: OpenedBrowser;
  const page = () => b.page;

  beforeAll(async () => {
    b = await openBrowser({ viewport });
  });
  afterAll(async () => {
    await b?.close();
  });

  it(`when a limit looser than the burn threshold is entered, then one touch verdict names the threshold that governs, and a pass never sits beside a fail (${tag})`, async () => {
    const p = page();
    // 20 mm of mineral fibre on NPS 4 at 180 °C, checked against a 60 °C limit: the 5 s metal threshold (58.0 °C) governs.
    const d: Draft = { ...defaultDraft(), mode: 'check', maxSurfaceC: 60, layers: [{ ...defaultDraft().layers[0], thicknessM: 0.02 }] };
    await open(p, d, 'SI');
    const verdict = byTestId(p, 'qs-verdict');
    expect(await verdict.getAttribute('data-state')).toBe('fail');
    const words = await verdict.textContent();
    expect(words).toMatch(/is above the burn threshold of 58\.0 °C for 5 s contact with bare metal \(stricter than the 60\.0 °C limit entered, so it governs\): a touch can burn/);
    // One verdict for touch safety: no second badge that could say the opposite.
    expect(await p.locator('[data-testid="qs-touch"]').count()).toBe(0);
    expect(await text(p, 'qs-result-burnThreshold')).toBe('58.0');
    expect(await p.getByText('Limit that governs: the burn threshold').count()).toBe(1);
    if (name === 'phone') {
      expect(await pinnedState(p)).toBe('fail');
      expect(await text(p, 'qs-summary-reason')).toBe('Safe to touch: not met');
    }
    await screenshot(p, `qs-verdicts-${tag}-01-burn-threshold-governs`);

    // Sized instead, the thickness is worked out for the threshold that governs and passes as shown.
    await afterEdit(p, () => byTestId(p, 'qs-mode-size').click());
    expect(await byTestId(p, 'qs-verdict').getAttribute('data-state')).toBe('pass');
    const surface = Number(await text(p, 'qs-result-surfaceTemperature'));
    expect(surface).toBeLessThan(58.0);
    expect(await byTestId(p, 'qs-verdict').textContent()).toMatch(/meets “Safe to touch”: \d+\.\d °C is below the burn threshold of 58\.0 °C/);
    assertNoPageErrors(p);
  });

  it(`when another purpose passes but the surface can burn, then the pinned summary shows the worst verdict with its reason (${tag})`, async () => {
    const p = page();
    // Heat conservation met at 20 mm, yet the 62.8 °C surface is above the 5 s metal threshold.
    const d: Draft = { ...defaultDraft(), purpose: 'conservation', mode: 'check', maxHeatLossWPerM: 200, layers: [{ ...defaultDraft().layers[0], thicknessM: 0.02 }] };
    await open(p, d, 'SI');
    expect(await byTestId(p, 'qs-verdict').getAttribute('data-state')).toBe('pass');
    expect(await byTestId(p, 'qs-touch').getAttribute('data-state')).toBe('fail');
    expect(await text(p, 'qs-touch')).toMatch(/Touch safety: \d+\.\d °C is above the burn threshold of 58\.0 °C/);
    if (name === 'phone') {
      expect(await pinnedState(p)).toBe('fail');
      expect(await text(p, 'qs-summary-reason')).toBe('Touch: above the burn threshold');
    }
    await screenshot(p, `qs-verdicts-${tag}-02-worst-verdict-pinned`);
  });

  it(`when a material runs above its service temperature, then it is said at the layer and in the summary, in the units shown (${tag})`, async () => {
    const p = page();
    await open(p, { ...defaultDraft(), mode: 'check', processTemperatureC: 600 }, 'US');
    // Choose the foam by keyboard: the list opens on Enter, typing jumps, Enter takes it.
    const material = byTestId(p, 'qs-input-layers[0].material');
    await material.focus();
    await p.keyboard.press('Enter');
    await p.getByRole('listbox').waitFor();
    const options = await p.getByRole('option').allTextContents();
    // Names and ratings in the user's units.
    expect(options.join(' ')).toContain('Mineral-fibre pipe insulation, up to 849 °F');
    expect(options.join(' ')).not.toMatch(/°C/);
    await afterEdit(p, async () => {
      await p.keyboard.press('r');
      const active = await material.getAttribute('aria-activedescendant');
      expect(await p.locator(`[id="${active}"]`).textContent()).toContain('Rigid polyisocyanurate');
      await p.keyboard.press('Enter');
    });
    expect(await p.getByRole('listbox').count()).toBe(0);
    const atLayer = await text(p, 'qs-layer-0-service-limit');
    expect(atLayer).toMatch(/Layer 1 \(rigid polyisocyanurate foam pipe insulation\) runs at 1,112\.0 °F at its inner face, above the 300 °F it is rated for/);
    expect(await text(p, 'qs-service-limit-0')).toBe(atLayer);
    if (name === 'phone') {
      expect(await pinnedState(p)).toBe('fail');
      expect(await text(p, 'qs-summary-reason')).toContain('Layer 1 above its service temperature');
    }
    await byTestId(p, 'qs-layer-0').screenshot({ path: path.join(SCREENSHOT_DIR, `qs-verdicts-${tag}-03-service-limit-at-layer.png`) });

    // Sized, a target the series cannot make speaks in the form's words, never in contract field names.
    await afterEdit(p, () => byTestId(p, 'qs-mode-size').click());
    await afterEdit(p, () => byTestId(p, 'qs-input-limit').fill('100'));
    const shown = await byTestId(p, 'qs-screen').innerText();
    expect(shown).toMatch(/No thickness meets|The calculation refused/);
    expect(shown).not.toMatch(/maxSingleLayerM|round\.seriesM|\bseriesM\b|solveFor|layers\[/);
    // The calculation's own warnings are in the form's words and units too.
    const warnings = await byTestId(p, 'qs-warnings').innerText();
    expect(warnings).toMatch(/°F/);
    expect(warnings).not.toMatch(/°C/);
    assertNoPageErrors(p);
  });

  it(`when US customary is chosen, then the series is in half inches, prices in cents, and the link keeps the units (${tag})`, async () => {
    const p = page();
    await open(p);
    await afterEdit(p, () => byTestId(p, 'qs-units-US').click());
    await p.waitForSelector('[data-testid="qs-screen"][data-system="US"]');
    expect(await byTestId(p, 'qs-input-series').textContent()).toContain('Half-inch steps');
    const thickness = await text(p, 'qs-result-thickness');
    expect(thickness).toMatch(/^\d+(½)?$/);
    expect(await byTestId(p, 'qs-input-energy.pricePerKWh').inputValue()).toBe('14.65');
    expect(await p.locator('[data-testid="qs-section-assumptions"]').textContent()).toContain('$/MMBtu');
    expect(new URL(p.url()).searchParams.get('u')).toBe('US');
    const link = p.url();
    const other = await b.context.newPage();
    try {
      await other.goto(link, { waitUntil: 'load' });
      await other.waitForSelector('[data-testid="qs-screen"][data-ready="true"][data-system="US"]');
      await settled(other);
      expect(await text(other, 'qs-result-thickness')).toBe(thickness);
    } finally {
      await other.close();
    }
    await screenshot(p, `qs-verdicts-${tag}-04-us-customary`);
    // Back to SI: millimetre steps again.
    await afterEdit(p, () => byTestId(p, 'qs-units-SI').click());
    expect(await byTestId(p, 'qs-input-series').textContent()).toContain('Metric steps');
    expect(new URL(p.url()).searchParams.get('u')).toBe('SI');
  });

  it(`when the service is cold, then the gain is costed as chiller electricity with editable assumptions, and touch is judged as cold contact (${tag})`, async () => {
    const p = page();
    await open(p);
    await afterEdit(p, () => byTestId(p, 'qs-purpose-condensation').click());
    await afterEdit(p, () => byTestId(p, 'qs-typical').click());
    // Cold service: no hot-surface burn threshold, a cold-contact judgement instead.
    expect(await p.locator('[data-testid="qs-result-burnThreshold"]').count()).toBe(0);
    expect(await byTestId(p, 'qs-touch').textContent()).toMatch(/colder than the air, so a touch is judged as cold contact/);
    expect(await text(p, 'qs-result-coldContact')).toBe('−7.0');
    expect(await p.locator('[data-testid="qs-input-contactSeconds"]').count()).toBe(0);
    // Chiller assumptions shown and editable; the boiler's are not in play.
    expect(await p.locator('[data-testid="qs-input-energy.efficiency"]').count()).toBe(0);
    expect(await byTestId(p, 'qs-energy').textContent()).toContain('Electricity for the chiller to remove the heat gain');
    const before = await si(p, 'qs-result-energy');
    await afterEdit(p, () => byTestId(p, 'qs-input-energy.coolingCop').fill('7'));
    expect(await si(p, 'qs-result-energy')).toBeCloseTo(before / 2, 6);
    await byTestId(p, 'qs-section-assumptions').screenshot({ path: path.join(SCREENSHOT_DIR, `qs-verdicts-${tag}-05-cooling-assumptions.png`) });
    await byTestId(p, 'qs-energy').screenshot({ path: path.join(SCREENSHOT_DIR, `qs-verdicts-${tag}-06-cooling-costs.png`) });
  });

  it(`when no thickness reaches the target, then the best value within reach is shown with its unit, and the charts stay (${tag})`, async () => {
    const p = page();
    await open(p);
    await afterEdit(p, () => byTestId(p, 'qs-input-limit').fill('20'));
    const verdict = (await byTestId(p, 'qs-verdict').textContent()) ?? '';
    expect(verdict).toMatch(/No thickness meets “Safe to touch”: the lowest surface temperature within reach is \d+\.\d °C with 500 mm, the thickest searched — \d+\.\d K above the 20\.0 °C it must not exceed/);
    expect(await text(p, 'qs-shortfall')).toContain('lower conductivity');
    expect(await p.locator('[data-testid="qs-charts"]').count()).toBe(1);
    expect(await text(p, 'qs-result-best')).toMatch(/^\d+\.\d$/);
    if (name === 'phone') expect(await pinnedState(p)).toBe('fail');
    await screenshot(p, `qs-verdicts-${tag}-07-out-of-reach`);
  });

  it(`when lists and chips are used from the keyboard, then Escape and outside clicks close lists, one at a time, and arrows and Space pick chips (${tag})`, async () => {
    const p = page();
    await open(p);
    const finish = byTestId(p, 'qs-input-finish');
    const series = byTestId(p, 'qs-input-series');
    await finish.focus();
    await p.keyboard.press('ArrowDown');
    expect(await finish.getAttribute('aria-expanded')).toBe('true');
    await p.keyboard.press('Escape');
    expect(await finish.getAttribute('aria-expanded')).toBe('false');
    expect(await p.getByRole('listbox').count()).toBe(0);
    // Opening a second list closes the first.
    await finish.click();
    await series.click();
    expect(await p.getByRole('listbox').count()).toBe(1);
    expect(await finish.getAttribute('aria-expanded')).toBe('false');
    // A click elsewhere closes it.
    await p.getByRole('heading', { name: 'Quick sizing', exact: true }).click();
    expect(await p.getByRole('listbox').count()).toBe(0);

    // Chips: one tab stop per group; arrows move and check, Space checks.
    const pipe = byTestId(p, 'qs-kind-pipe');
    expect(await pipe.getAttribute('tabindex')).toBe('0');
    expect(await byTestId(p, 'qs-kind-vessel').getAttribute('tabindex')).toBe('-1');
    await pipe.focus();
    await afterEdit(p, () => p.keyboard.press('ArrowRight'));
    expect(await byTestId(p, 'qs-kind-vessel').getAttribute('aria-checked')).toBe('true');
    expect(await p.evaluate(() => document.activeElement?.getAttribute('data-testid'))).toBe('qs-kind-vessel');
    await afterEdit(p, () => p.keyboard.press('ArrowLeft'));
    expect(await pipe.getAttribute('aria-checked')).toBe('true');
    await byTestId(p, 'qs-mode-check').focus();
    await afterEdit(p, () => p.keyboard.press(' '));
    expect(await byTestId(p, 'qs-mode-check').getAttribute('aria-checked')).toBe('true');
    assertNoPageErrors(p);
  });

  it(`when a custom conductivity and a price are entered, then the labels read as conductivity and money, not kelvin or a bare rate (${tag})`, async () => {
    const p = page();
    await open(p);
    await byTestId(p, 'qs-input-layers[0].material').click();
    await afterEdit(p, () => byTestId(p, 'qs-input-layers[0].material-option-custom').click());
    expect(await p.getByText('Conductivity at 0 °C (c0), layer 1', { exact: false }).count()).toBeGreaterThan(0);
    expect(await p.locator('[data-testid="qs-section-layers"]').textContent()).not.toMatch(/\bK at 0/);
    expect(await p.locator('[data-testid="qs-section-assumptions"]').textContent()).toContain('$/kWh');
    await byTestId(p, 'qs-input-energy.pricePerKWh').fill('500');
    await p.waitForSelector('[data-testid="qs-invalid"]');
    expect(await p.getByText('The energy price must be at most 100 $/kWh.', { exact: false }).count()).toBeGreaterThan(0);
    assertNoCspViolations(p);
    assertNoPageErrors(p);
    assertOnlyLoopback(b.requests);
  });
});
