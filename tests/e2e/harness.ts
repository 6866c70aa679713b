/**
 * Browser harness for end-to-end tests: Debian's Chromium through playwright-core, against a whole
 * Lagline from `startTestServer()` (fresh database, mail catcher, the exported web app in dist/).
 *
 * Every browser opened here records each request URL (anything not on loopback is refused and makes
 * `assertOnlyLoopback()` fail) and every content-security-policy violation the page reports.
 */
import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

import { startTestServer, type TestServer } from '../helpers/test-server';
import { tokenFromMail } from '../helpers/mail';

export { startTestServer, tokenFromMail, type TestServer };

const ROOT = path.resolve(__dirname, '../..');
export const SCREENSHOT_DIR = path.join(ROOT, 'test-output', 'screenshots');
export const CHROMIUM_PATH = process.env.CHROMIUM_PATH || '/usr/bin/chromium';
export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--disable-dev-shm-usage',
];

export const VIEWPORTS = {
  phone: { width: 390, height: 844 },
  desktop: { width: 1440, height: 900 },
} as const;

export type Viewport = { width: number; height: number };

export type CspViolation = {
  pageUrl: string;
  violatedDirective: string;
  blockedURI: string;
  sourceFile?: string;
  lineNumber?: number;
  sample?: string;
};

export type OpenedBrowser = {
  browser: Browser;
  context: BrowserContext;
  page: Page;
  /** Every URL this browser requested, in order. */
  requests: string[];
  /** Violations reported by any page of this browser. */
  cspViolations: CspViolation[];
  /** Uncaught errors thrown in the page. */
  pageErrors: string[];
  close: () => Promise<void>;
};

const allRequests: string[] = [];
const violationsByContext = new WeakMap<BrowserContext, CspViolation[]>();
const pageErrorsByContext = new WeakMap<BrowserContext, string[]>();

const LOOPBACK_HOSTS = new Set(['127.0.0.1', 'localhost', '[::1]', '::1']);
const LOCAL_SCHEMES = new Set(['data:', 'blob:', 'about:']);

/** True for URLs that never leave the machine: loopback HTTP(S) and in-page schemes. */
export function isLoopbackUrl(url: string): boolean {
  let u: URL;
  try {
    u = new URL(url);
  } catch {
    return false;
  }
  if (LOCAL_SCHEMES.has(u.protocol)) return true;
  return (u.protocol === 'http:' || u.protocol === 'https:' || u.protocol === 'ws:') && LOOPBACK_HOSTS.has(u.hostname);
}

// Runs in the page before any of its scripts; reports violations to the test through a binding
// (a binding survives navigations, a window array would not).
const CSP_LISTENER = `
document.addEventListener('securitypolicyviolation', function (e) {
  try {
    window.__laglineReportCsp({
      pageUrl: location.href,
      violatedDirective: e.violatedDirective,
      blockedURI: e.blockedURI,
      sourceFile: e.sourceFile,
      lineNumber: e.lineNumber,
      sample: e.sample,
    });
  } catch (err) {}
});
`;

/** Opens Chromium with one page at the given viewport, recording requests and CSP violations. */
export async function openBrowser(opts: { viewport?: Viewport } = {}): Promise<OpenedBrowser> {
  const browser = await chromium.launch({ executablePath: CHROMIUM_PATH, args: CHROMIUM_ARGS, headless: true });
  const context = await browser.newContext({
    viewport: opts.viewport ?? VIEWPORTS.desktop,
    deviceScaleFactor: 1,
    locale: 'en-GB',
    timezoneId: 'UTC',
    serviceWorkers: 'block',
  });
  const requests: string[] = [];
  const cspViolations: CspViolation[] = [];
  violationsByContext.set(context, cspViolations);

  context.on('request', (req) => {
    requests.push(req.url());
    allRequests.push(req.url());
  });
  // Nothing may leave the machine: refuse it (and assertOnlyLoopback reports it).
  await context.route((url) => !isLoopbackUrl(url.toString()), (route) => route.abort('blockedbyclient'));
  await context.exposeBinding('__laglineReportCsp', (_source, v: CspViolation) => {
    cspViolations.push(v);
  });
  await context.addInitScript({ content: CSP_LISTENER });

  const page = await context.newPage();
  const pageErrors: string[] = [];
  pageErrorsByContext.set(context, pageErrors);
  page.on('pageerror', (e) => pageErrors.push(`${page.url()}: ${e.message}`));
  page.on('console', (msg) => {
    // Chromium also logs refusals; keep them in case a violation fires before the listener exists.
    const text = msg.text();
    if (msg.type() === 'error' && /Content Security Policy/i.test(text)) {
      cspViolations.push({ pageUrl: page.url(), violatedDirective: 'console', blockedURI: '', sample: text.slice(0, 300) });
    }
  });

  return {
    browser,
    context,
    page,
    requests,
    cspViolations,
    pageErrors,
    close: async () => {
      await context.close().catch(() => undefined);
      await browser.close().catch(() => undefined);
    },
  };
}

/** Fails when the page's browser recorded any content-security-policy violation. */
export function assertNoCspViolations(page: Page): void {
  const violations = violationsByContext.get(page.context()) ?? [];
  if (violations.length > 0) {
    throw new Error(`Content security policy violations:\n${violations.map((v) => JSON.stringify(v)).join('\n')}`);
  }
}

/** Fails when the page threw an uncaught error (a render crash, a failed handler). */
export function assertNoPageErrors(page: Page): void {
  const errors = pageErrorsByContext.get(page.context()) ?? [];
  if (errors.length > 0) throw new Error(`Uncaught errors in the page:\n${errors.join('\n')}`);
}

/**
 * Presses Tab until the focused element's accessible text is `name` (at most `maxTabs` times), so a
 * test can prove a control is reachable by keyboard; returns how many presses it took.
 */
export async function tabTo(page: Page, name: string | RegExp, maxTabs = 40): Promise<number> {
  for (let i = 1; i <= maxTabs; i++) {
    await page.keyboard.press('Tab');
    const label = await page.evaluate(() => {
      const el = document.activeElement as HTMLElement | null;
      return el ? (el.getAttribute('aria-label') || el.innerText || '').trim() : '';
    });
    if (typeof name === 'string' ? label === name : name.test(label)) return i;
  }
  throw new Error(`Could not reach "${String(name)}" with ${maxTabs} presses of Tab`);
}

/** Fails when any browser opened by this harness (or the given list) requested a non-loopback URL. */
export function assertOnlyLoopback(urls: readonly string[] = allRequests): void {
  const outside = urls.filter((u) => !isLoopbackUrl(u));
  if (outside.length > 0) throw new Error(`Requests left the machine:\n${[...new Set(outside)].join('\n')}`);
}

/** Every request URL recorded so far by browsers from this harness. */
export function recordedRequests(): readonly string[] {
  return allRequests;
}

/** Saves a full-page screenshot as test-output/screenshots/<name>.png and returns its path. */
export async function screenshot(page: Page, name: string): Promise<string> {
  fs.mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const file = path.join(SCREENSHOT_DIR, `${name.replace(/[^A-Za-z0-9._-]+/g, '-')}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Fails early with a clear message when the web app has not been exported. */
export function assertWebAppBuilt(): void {
  const index = path.join(ROOT, 'dist', 'index.html');
  if (!fs.existsSync(index)) {
    throw new Error('dist/ is missing: run `CI=1 EXPO_OFFLINE=1 EXPO_NO_TELEMETRY=1 npx expo export --platform web` first.');
  }
}

/**
 * Navigates and waits until the bundle has run and the session answered, so typing is not lost to
 * hydration of the static HTML.
 */
export async function gotoApp(page: Page, url: string): Promise<void> {
  await page.goto(url, { waitUntil: 'load' });
  await page.waitForLoadState('networkidle');
}

/** A name for screenshots and addresses that differs per viewport: "390x844". */
/** Clicks into the field with this testID and replaces its text, as a person would. */
export async function fill(page: Page, testId: string, value: string): Promise<void> {
  const input = page.getByTestId(testId);
  await input.click();
  await input.fill(value);
}

export function viewportTag(v: Viewport): string {
  return `${v.width}x${v.height}`;
}

type DemoCredentials = { password: string; users: { role: string; name: string; email: string }[] };

/** The demo's sign-ins (seeds/demo-credentials.json): one person per role. */
export function demoCredentials(): DemoCredentials {
  return JSON.parse(fs.readFileSync(path.join(ROOT, 'seeds', 'demo-credentials.json'), 'utf8')) as DemoCredentials;
}

/** Signs in as the demo's first member with this role (a fresh session) and waits for the sites list. */
export async function signInAsDemo(page: Page, serverUrl: string, role: string): Promise<void> {
  const demo = demoCredentials();
  const user = demo.users.find((u) => u.role === role);
  if (!user) throw new Error(`The demo has no ${role}`);
  await page.context().clearCookies();
  await gotoApp(page, `${serverUrl}/`);
  await fill(page, 'signin-email', user.email);
  await fill(page, 'signin-password', demo.password);
  await page.getByTestId('signin-submit').click();
  await page.waitForURL('**/sites');
  await page.getByTestId('sites-list').waitFor();
}
