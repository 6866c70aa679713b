/**
 * Quick sizing in Chromium, on a phone (390×844) and a wide screen (1440×900): every geometry × purpose,
 * typing, live numbers and charts, the SI/US switch without drift, shared links, and the numbers on
 * screen against POST /api/v1/calculations for the same case.
 */
import path from 'node:path';
import type { Page } from 'playwright-core';

import type { CalcCase, CalcOutcome } from '../../shared/calc/types';
import { encodeCaseQuery } from '../../src/calc/case-url';
import { defaultDraft, draftOptions, draftToCase, purposeAvailable, type GeometryKind, type PurposeId } from '../../src/calc/quick-case';
import { formatInputNumber } from '../../src/calc/units';

import {
  SCREENSHOT_DIR,
  VIEWPORTS,
  assertNoCspViolations,
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

const KINDS: GeometryKind[] = ['pipe', 'vessel', 'wall'];
const PURPOSES: PurposeId[] = ['personnel', 'conservation', 'condensation', 'holding', 'frost'];

/** A process temperature to type for each purpose (SI), different from its typical case. */
const TYPED_PROCESS_C: Record<PurposeId, string> = {
  personnel: '220',
  conservation: '300',
  condensation: '2',
  holding: '170',
  frost: '15',
};

let server: TestServer;
const browsers: Partial<Record<'phone' | 'desktop', OpenedBrowser>> = {};

beforeAll(async () => {
  // E2E_DIST_DIR lets a developer test an export made elsewhere without touching dist/.
  const distDir = process.env.E2E_DIST_DIR;
  if (!distDir) assertWebAppBuilt();
  server = await startTestServer(distDir ? { config: { distDir } } : {});
  browsers.phone = await openBrowser({ viewport: VIEWPORTS.phone });
  browsers.desktop = await openBrowser({ viewport: VIEWPORTS.desktop });
});

afterAll(async () => {
  await browsers.phone?.close();
  await browsers.desktop?.close();
  await server?.close();
});

async function openQuickSizing(page: Page, query = ''): Promise<void> {
  await page.goto(`${server.url}/quick-sizing${query}`, { waitUntil: 'load' });
  await page.waitForSelector('[data-testid="qs-screen"][data-ready="true"]');
  await settled(page);
}

/** Waits until the live calculation has caught up with the last edit. */
async function settled(page: Page): Promise<void> {
  await page.waitForSelector('[data-testid="qs-results"][data-pending="false"], [data-testid="qs-invalid"], [data-testid="qs-calc-error"]');
}

const byTestId = (page: Page, id: string) => page.locator(`[data-testid="${id}"]`).first();

async function si(page: Page, id: string): Promise<number> {
  const v = await byTestId(page, id).getAttribute('data-si');
  if (v === null || v === '') throw new Error(`${id} has no data-si`);
  return Number(v);
}

async function inputValues(page: Page): Promise<Record<string, string>> {
  const pairs = await page.$$eval('input[data-testid^="qs-input-"]', (els) => els.map((e) => [e.getAttribute('data-testid') ?? '', (e as HTMLInputElement).value]));
  return Object.fromEntries(pairs);
}

async function resultValues(page: Page): Promise<Record<string, { si: string | null; text: string }>> {
  const rows = await page.$$eval('[data-testid^="qs-result-"][data-si]', (els) =>
    els.map((e) => [e.getAttribute('data-testid') ?? '', { si: e.getAttribute('data-si'), text: e.textContent ?? '' }] as const),
  );
  return Object.fromEntries(rows);
}

async function chartPaths(page: Page, chart: string): Promise<string[]> {
  return page.$$eval(`[data-testid="${chart}"] path`, (els) => els.map((e) => e.getAttribute('d') ?? ''));
}

async function typeInto(page: Page, id: string, text: string): Promise<void> {
  const before = await page.evaluate(() => location.search);
  await byTestId(page, id).fill(text);
  // The link follows each new result, so a changed link means the debounced calculation has landed.
  await page.waitForFunction((b) => location.search !== b, before);
  await settled(page);
}

/** Sets up geometry and purpose: by clicking where the purpose applies, by a shared link where it does not. */
async function setUp(page: Page, kind: GeometryKind, purpose: PurposeId): Promise<void> {
  if (purposeAvailable(purpose, kind)) {
    await openQuickSizing(page);
    await byTestId(page, `qs-kind-${kind}`).click();
    await byTestId(page, `qs-purpose-${purpose}`).click();
    await byTestId(page, 'qs-typical').click();
    await page.waitForFunction(() => document.querySelector('[data-testid="qs-results"]')?.getAttribute('data-pending') === 'false');
    return;
  }
  // A vessel or wall cannot be sized for a purpose worked out along a pipe: the chip says so.
  await openQuickSizing(page);
  await byTestId(page, `qs-kind-${kind}`).click();
  const chip = byTestId(page, `qs-purpose-${purpose}`);
  expect(await chip.getAttribute('aria-disabled')).toBe('true');
  expect(await chip.textContent()).toContain('pipes only');
  // A shared link can still carry it; the build-up is then checked as entered, with a caution.
  const d = { ...defaultDraft(), kind, purpose, mode: 'check' as const };
  await openQuickSizing(page, `?${encodeCaseQuery(draftToCase(d), draftOptions(d))}`);
  await page.waitForSelector('[data-testid="qs-purpose-unavailable"]');
  expect(await byTestId(page, 'qs-verdict').getAttribute('data-state')).toBe('caution');
}

describe.each([
  ['phone', VIEWPORTS.phone],
  ['desktop', VIEWPORTS.desktop],
] as const)('quick sizing on a %s', (name, viewport: Viewport) => {
  const tag = viewportTag(viewport);
  const page = () => browsers[name]!.page;

  const combos = KINDS.flatMap((k) => PURPOSES.map((p) => [k, p] as const));

  it.each(combos)(
    `when a %s is set up for %s, then typing changes the numbers and charts, units switch and back without drift, and its link opens the same case (${tag})`,
    async (kind, purpose) => {
      const p = page();
      await setUp(p, kind, purpose);
      await byTestId(p, 'qs-results').waitFor();

      // Numbers and charts are there.
      const surfaceBefore = await si(p, 'qs-result-surfaceTemperature');
      const heatBefore = await si(p, 'qs-result-heatLoss');
      const chartBefore = await chartPaths(p, 'qs-chart-surface');
      const summaryBefore = await byTestId(p, 'qs-chart-surface-summary').textContent();
      expect(chartBefore.some((d) => d.length > 20)).toBe(true);

      // Typing a new process temperature changes them.
      await typeInto(p, 'qs-input-processTemperatureC', TYPED_PROCESS_C[purpose]);
      await p.waitForFunction((before) => document.querySelector('[data-testid="qs-result-heatLoss"]')?.getAttribute('data-si') !== before, String(heatBefore));
      expect(await si(p, 'qs-result-heatLoss')).not.toBe(heatBefore);
      const surfaceAfter = await si(p, 'qs-result-surfaceTemperature');
      expect(Number.isFinite(surfaceAfter)).toBe(true);
      void surfaceBefore;
      expect(await chartPaths(p, 'qs-chart-surface')).not.toEqual(chartBefore);
      expect(await byTestId(p, 'qs-chart-surface-summary').textContent()).not.toBe(summaryBefore);

      // Units: to US customary and back, nothing drifts.
      const inputsSI = await inputValues(p);
      const resultsSI = await resultValues(p);
      expect(inputsSI['qs-input-processTemperatureC']).toBe(TYPED_PROCESS_C[purpose]);
      await byTestId(p, 'qs-units-US').click();
      await p.waitForSelector('[data-testid="qs-screen"][data-system="US"]');
      await settled(p);
      const inputsUS = await inputValues(p);
      expect(inputsUS['qs-input-processTemperatureC']).toBe(formatInputNumber(Number(TYPED_PROCESS_C[purpose]) * 1.8 + 32));
      expect(await byTestId(p, 'qs-result-surfaceTemperature').locator('xpath=..').textContent()).toContain('°F');
      await screenshot(p, `quick-sizing-${kind}-${purpose}-US-${tag}`);
      await byTestId(p, 'qs-units-SI').click();
      await p.waitForSelector('[data-testid="qs-screen"][data-system="SI"]');
      await settled(p);
      expect(await inputValues(p)).toEqual(inputsSI);
      expect(await resultValues(p)).toEqual(resultsSI);

      // The page's link carries the case; opening it shows the same inputs and results.
      const link = p.url();
      expect(link).toContain('case=');
      const other = await browsers[name]!.context.newPage();
      try {
        await openQuickSizing(other, new URL(link).search);
        expect(await inputValues(other)).toEqual(inputsSI);
        expect(await resultValues(other)).toEqual(resultsSI);
      } finally {
        await other.close();
      }

      await screenshot(p, `quick-sizing-${kind}-${purpose}-${tag}`);
      // The page scrolls inside its own view, so the results and charts get pictures of their own.
      await byTestId(p, 'qs-results').screenshot({ path: path.join(SCREENSHOT_DIR, `quick-sizing-${kind}-${purpose}-results-${tag}.png`) });
      await byTestId(p, 'qs-charts').screenshot({ path: path.join(SCREENSHOT_DIR, `quick-sizing-${kind}-${purpose}-charts-${tag}.png`) });
      assertNoCspViolations(p);
    },
  );

  it(`when the screen opens, then the layout suits the width (${tag})`, async () => {
    const p = page();
    await openQuickSizing(p);
    const inputs = await byTestId(p, 'qs-section-geometry').boundingBox();
    const results = await byTestId(p, 'qs-results').boundingBox();
    expect(inputs && results).toBeTruthy();
    if (name === 'phone') {
      // One column, and the answer pinned at the bottom where the thumb is.
      expect(Math.abs(inputs!.x - results!.x)).toBeLessThan(2);
      const bar = await byTestId(p, 'qs-summary').boundingBox();
      expect(bar).toBeTruthy();
      expect(Math.abs(bar!.y + bar!.height - viewport.height)).toBeLessThan(2);
      expect(await byTestId(p, 'qs-result-thickness-pinned').textContent()).toBe(await byTestId(p, 'qs-result-thickness').textContent().then((t) => `${t} mm`));
    } else {
      // Inputs and results side by side, content capped in width.
      expect(results!.x).toBeGreaterThan(inputs!.x + inputs!.width);
      expect(results!.x + results!.width - inputs!.x).toBeLessThanOrEqual(1160 + 1);
      expect(await p.locator('[data-testid="qs-summary"]').count()).toBe(0);
    }
    await screenshot(p, `quick-sizing-start-${tag}`);
  });
});

describe('quick sizing against the API', () => {
  const available = KINDS.flatMap((k) => PURPOSES.filter((p) => purposeAvailable(p, k)).map((p) => [k, p] as const));

  it.each(available)('when a %s is sized for %s, then the numbers on screen equal POST /api/v1/calculations for the same case', async (kind, purpose) => {
    const p = browsers.desktop!.page;
    await setUp(p, kind, purpose);
    await typeInto(p, 'qs-input-processTemperatureC', TYPED_PROCESS_C[purpose]);
    const c = JSON.parse(new URL(p.url()).searchParams.get('case') ?? 'null') as CalcCase;
    expect(c.processTemperatureC).toBe(Number(TYPED_PROCESS_C[purpose]));

    const res = await fetch(`${server.url}/api/v1/calculations`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(c) });
    expect(res.status).toBe(200);
    const api = (await res.json()) as CalcOutcome;
    if ('error' in api) throw new Error(`API refused the case: ${api.error.message}`);

    const heat = kind === 'pipe' ? api.heatLossWPerM : kind === 'wall' ? api.heatFluxWPerM2 : api.heatLossW;
    expect(await si(p, 'qs-result-surfaceTemperature')).toBeCloseTo(api.surfaceTemperatureC, 9);
    expect(await si(p, 'qs-result-heatLoss')).toBeCloseTo(heat!, 9);
    expect(await si(p, 'qs-result-totalThickness')).toBeCloseTo(api.totalThicknessM, 12);
    expect(await si(p, 'qs-result-convection')).toBeCloseTo(api.convectionCoefficientWPerM2K, 9);
    expect(await si(p, 'qs-result-radiation')).toBeCloseTo(api.radiationCoefficientWPerM2K, 9);
    if (api.dewPointC !== undefined) expect(await si(p, 'qs-result-dewPoint')).toBeCloseTo(api.dewPointC, 9);
    if (api.burn) expect(await si(p, 'qs-result-burnThreshold')).toBeCloseTo(api.burn.thresholdC, 9);
    if (api.outletTemperatureC !== undefined) expect(await si(p, 'qs-result-outletTemperature')).toBeCloseTo(api.outletTemperatureC, 9);
    if (typeof api.hoursToZeroC === 'number') expect(await si(p, 'qs-result-hoursToZero')).toBeCloseTo(api.hoursToZeroC, 9);
    // The formatted figures follow from the same values.
    expect(await byTestId(p, 'qs-result-surfaceTemperature').textContent()).toBe(api.surfaceTemperatureC.toFixed(1).replace('-', '−'));
  });
});

describe('quick sizing when something is wrong', () => {
  it('when a field holds no number, then that field says so and the results wait for it', async () => {
    const p = browsers.desktop!.page;
    await openQuickSizing(p);
    await byTestId(p, 'qs-input-processTemperatureC').fill('hot');
    await p.waitForSelector('[data-testid="qs-invalid"]');
    expect(await p.getByText('Error: Enter process temperature as a number.').count()).toBeGreaterThan(0);
    await byTestId(p, 'qs-input-processTemperatureC').fill('180');
    await p.waitForSelector('[data-testid="qs-results"]');
  });

  it('when a value is out of range, then the message names the field and the bound in the units shown', async () => {
    const p = browsers.desktop!.page;
    await openQuickSizing(p);
    await byTestId(p, 'qs-input-relativeHumidityPct').fill('140');
    await p.waitForSelector('[data-testid="qs-invalid"]');
    expect(await p.getByText('Error: The relative humidity must be at most 100 %.').count()).toBeGreaterThan(0);
  });

  it('when the target cannot be reached, then the screen says why, how close it gets and what would help, and keeps the charts', async () => {
    const p = browsers.desktop!.page;
    await openQuickSizing(p);
    await typeInto(p, 'qs-input-limit', '20'); // below the 25 °C air: no insulation makes a hot surface that cool
    await p.waitForSelector('[data-testid="qs-shortfall"]');
    const verdict = (await byTestId(p, 'qs-verdict').textContent()) ?? '';
    expect(verdict).toContain('No thickness meets “Safe to touch”');
    expect(verdict).toMatch(/\d+\.\d K above the 20\.0 °C it must not exceed/);
    const text = (await byTestId(p, 'qs-shortfall').textContent()) ?? '';
    expect(text).toContain('lower conductivity');
    expect(text).toContain('emissivity');
    expect(text).toContain('Raise the surface limit');
    expect(await chartPaths(p, 'qs-chart-surface')).not.toHaveLength(0);
    await screenshot(p, 'quick-sizing-impossible-1440x900');
  });

  it('when a shared link is damaged, then the page says so and opens a starting case', async () => {
    const p = browsers.phone!.page;
    const damaged = { ...draftToCase(defaultDraft()), geometry: { type: 'cone' } };
    await openQuickSizing(p, `?case=${encodeURIComponent(JSON.stringify(damaged))}`);
    expect(await byTestId(p, 'qs-link-problem').textContent()).toContain('geometry.type');
    await byTestId(p, 'qs-results').waitFor();
  });

  it('when the page is used, then nothing is requested outside this machine', () => {
    assertOnlyLoopback();
  });
});
