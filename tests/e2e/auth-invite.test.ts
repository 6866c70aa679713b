/**
 * A new team from nothing, in a real browser: create a team, invite an engineer, follow the caught
 * invitation e-mail, join, sign out and sign back in as the engineer. Once on a phone and once on a
 * wide screen, with a screenshot at each step.
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
  startTestServer,
  tabTo,
  tokenFromMail,
  VIEWPORTS,
  viewportTag,
  type OpenedBrowser,
  type TestServer,
} from './harness';

jest.setTimeout(180_000);

const OWNER_PASSWORD = 'copper kettle drifts over seven quiet hills';
const ENGINEER_PASSWORD = 'amber lantern beside the chilled water header';

let server: TestServer;

beforeAll(async () => {
  assertWebAppBuilt();
  server = await startTestServer();
});

afterAll(async () => {
  await server?.close();
});

async function signOut(page: Page) {
  await page.getByRole('link', { name: 'Settings' }).click();
  await page.waitForURL('**/settings');
  await page.getByTestId('sign-out').click();
  await page.waitForURL((u) => new URL(u).pathname === '/');
  await page.getByRole('heading', { name: 'Sign in' }).waitFor();
}

describe.each([
  ['phone', VIEWPORTS.phone],
  ['desktop', VIEWPORTS.desktop],
])('on a %s screen', (_label, viewport) => {
  const tag = viewportTag(viewport);
  const ownerEmail = `owner-${tag}@north-ridge.example`;
  const engineerEmail = `engineer-${tag}@north-ridge.example`;
  const teamName = `North Ridge Works ${tag}`;
  let opened: OpenedBrowser;

  beforeAll(async () => {
    opened = await openBrowser({ viewport });
  });

  afterAll(async () => {
    await opened?.close();
  });

  it('when an owner creates a team and invites an engineer, then the engineer joins through the e-mailed link and can sign in', async () => {
    const { page } = opened;

    // Sign-in page, signed out.
    await gotoApp(page, `${server.url}/`);
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await page.getByText('Quick sizing — no account needed').waitFor();
    await screenshot(page, `auth-invite-${tag}-01-sign-in`);

    // Create the team.
    await page.getByText('Create a team', { exact: true }).click();
    await page.waitForURL('**/sign-up');
    await page.getByTestId('signup-team').waitFor();
    await fill(page, 'signup-team', teamName);
    await fill(page, 'signup-name', 'Ada Okafor');
    await fill(page, 'signup-email', ownerEmail);
    await fill(page, 'signup-password', OWNER_PASSWORD);
    await screenshot(page, `auth-invite-${tag}-02-sign-up`);
    await page.getByTestId('signup-submit').click();

    // A new team has no sites yet: the empty state explains and offers to create one.
    await page.waitForURL('**/sites');
    await page.getByTestId('sites-empty').waitFor();
    await expect(page.getByRole('button', { name: 'Create a site' }).isVisible()).resolves.toBe(true);
    await screenshot(page, `auth-invite-${tag}-03-sites-empty`);

    // The empty state's one action fills it.
    await page.getByRole('button', { name: 'Create a site' }).click();
    await fill(page, 'site-name', 'Boiler house');
    await page.getByTestId('site-submit').click();
    await page.getByTestId('sites-list').getByText('Boiler house').waitFor();
    await screenshot(page, `auth-invite-${tag}-03b-site-created`);

    // Invite an engineer from the Team page, reached with the keyboard alone.
    await tabTo(page, 'Team');
    await page.keyboard.press('Enter');
    await page.waitForURL('**/team');
    await page.getByTestId('invite-email').waitFor();
    await fill(page, 'invite-email', engineerEmail);
    await page.getByRole('radio', { name: /^Engineer\./ }).click();
    await page.getByTestId('invite-submit').click();
    await page.getByTestId('invite-sent').waitFor();
    await page.getByText(engineerEmail, { exact: true }).first().waitFor();
    await screenshot(page, `auth-invite-${tag}-04-invited`);

    // The invitation e-mail is caught, and shows in the owner's caught-mail panel too.
    const mail = await server.mail.waitFor(engineerEmail);
    const { link, token } = tokenFromMail(mail);
    expect(new URL(link).pathname).toBe('/accept-invite');
    expect(token.length).toBeGreaterThan(16);
    await page.getByTestId('caught-mail').getByRole('button', { name: 'Refresh' }).click();
    await page.getByTestId('caught-mail').getByText(`To ${engineerEmail}`, { exact: false }).first().waitFor();
    await screenshot(page, `auth-invite-${tag}-05-caught-mail`);

    // The owner signs out; the engineer opens the link.
    await signOut(page);
    await gotoApp(page, link);
    await page.getByRole('heading', { name: `Join ${teamName}` }).waitFor();
    await expect(page.getByTestId('invite-role').innerText()).resolves.toContain('Engineer');
    await fill(page, 'accept-name', 'Bram Lindqvist');
    await fill(page, 'accept-password', ENGINEER_PASSWORD);
    await screenshot(page, `auth-invite-${tag}-06-accept-invite`);
    await page.getByTestId('accept-submit').click();
    await page.waitForURL('**/sites');
    // The new member sees the team's site straight away.
    await page.getByTestId('sites-list').getByText('Boiler house').waitFor();
    await screenshot(page, `auth-invite-${tag}-07-joined`);

    // Sign out, then sign in again as the engineer.
    await signOut(page);
    await fill(page, 'signin-email', engineerEmail);
    await fill(page, 'signin-password', ENGINEER_PASSWORD);
    await page.getByTestId('signin-submit').click();
    await page.waitForURL('**/sites');
    await page.getByRole('link', { name: 'Settings' }).click();
    await page.waitForURL('**/settings');
    await page.getByText(`Engineer in ${teamName}`).waitFor();
    await screenshot(page, `auth-invite-${tag}-08-engineer-signed-in`);

    // The unit system is stored for the user: it survives a reload.
    await page.getByRole('radio', { name: /^US customary/ }).click();
    await page.getByTestId('units-message').waitFor();
    await gotoApp(page, `${server.url}/settings`);
    await expect(page.getByRole('radio', { name: /^US customary/ }).getAttribute('aria-checked')).resolves.toBe('true');
    await expect(page.getByRole('radio', { name: /^SI\./ }).getAttribute('aria-checked')).resolves.toBe('false');

    // The team now lists both people with their roles.
    await page.getByRole('link', { name: 'Team' }).click();
    await page.getByTestId(`member-${engineerEmail}`).waitFor();
    await expect(page.getByTestId(`member-${engineerEmail}`).innerText()).resolves.toContain('Engineer');
    await expect(page.getByTestId(`member-${ownerEmail}`).innerText()).resolves.toContain('Owner');
    await screenshot(page, `auth-invite-${tag}-09-team-as-engineer`);

    assertNoCspViolations(page);
    assertNoPageErrors(page);
    assertOnlyLoopback(opened.requests);
  });

  it('when the invitation link is opened a second time, then it is refused as no longer valid', async () => {
    const { page } = opened;
    const mail = await server.mail.waitFor(engineerEmail);
    await page.context().clearCookies();
    await gotoApp(page, tokenFromMail(mail).link);
    await page.getByText('This invitation is no longer valid').waitFor();
    await screenshot(page, `auth-invite-${tag}-10-used-link`);
    assertNoCspViolations(page);
    assertNoPageErrors(page);
  });

  it('when the owner forgets the password, then the e-mailed reset link sets a new one that signs in', async () => {
    const { page } = opened;
    const newPassword = 'granite steps under the condensate return line';
    await page.context().clearCookies();
    await gotoApp(page, `${server.url}/`);
    await page.getByText('Forgot your password?').click();
    await page.waitForURL('**/forgot-password');
    await fill(page, 'forgot-email', ownerEmail);
    await page.getByTestId('forgot-submit').click();
    await page.getByTestId('reset-sent').waitFor();
    await screenshot(page, `auth-invite-${tag}-11-reset-requested`);

    const mail = await server.mail.waitFor(ownerEmail, { subject: /password/i });
    const { link } = tokenFromMail(mail);
    expect(new URL(link).pathname).toBe('/reset-password');
    await gotoApp(page, link);
    await fill(page, 'reset-password', newPassword);
    await fill(page, 'reset-confirm', newPassword);
    await page.getByTestId('reset-submit').click();
    await page.getByTestId('reset-done').waitFor();
    await screenshot(page, `auth-invite-${tag}-12-reset-done`);

    await page.getByText('Go to sign in').click();
    await page.waitForURL((u) => new URL(u).pathname === '/');
    await fill(page, 'signin-email', ownerEmail);
    await fill(page, 'signin-password', OWNER_PASSWORD);
    await page.getByTestId('signin-submit').click();
    await page.getByText('That e-mail address and password do not match an account.').waitFor();
    await fill(page, 'signin-password', newPassword);
    await page.getByTestId('signin-submit').click();
    await page.waitForURL('**/sites');
    assertNoCspViolations(page);
    assertNoPageErrors(page);
  });

  it('when the owner changes a role and revokes an invitation, then the team list shows both changes', async () => {
    const { page } = opened;
    const strayEmail = `stray-${tag}@north-ridge.example`;
    await page.getByRole('link', { name: 'Team' }).click();
    await page.waitForURL('**/team');

    const engineerRow = page.getByTestId(`member-${engineerEmail}`);
    await engineerRow.getByRole('button', { name: 'Change role of Bram Lindqvist' }).click();
    await engineerRow.getByRole('radio', { name: 'Safety officer' }).click();
    // A role change is confirmed first, with what the role may do.
    await engineerRow.getByRole('button', { name: 'Yes, make Bram Lindqvist Safety officer' }).click();
    // The picker closes once the server has saved the role.
    await engineerRow.getByRole('radiogroup').waitFor({ state: 'detached' });
    await expect(engineerRow.innerText()).resolves.toContain('Safety officer');

    await fill(page, 'invite-email', strayEmail);
    await page.getByRole('radio', { name: /^Viewer\./ }).click();
    await page.getByTestId('invite-submit').click();
    await page.getByTestId('invitation-list').getByText(strayEmail).waitFor();
    await screenshot(page, `auth-invite-${tag}-13-role-changed`);
    await page.getByRole('button', { name: `Revoke the invitation for ${strayEmail}` }).click();
    await page.getByTestId('invitations-empty').waitFor();

    // The server holds the same picture after a reload.
    await gotoApp(page, `${server.url}/team`);
    await expect(page.getByTestId(`member-${engineerEmail}`).innerText()).resolves.toContain('Safety officer');
    await page.getByTestId('invitations-empty').waitFor();
    await screenshot(page, `auth-invite-${tag}-14-invitation-revoked`);
    assertNoCspViolations(page);
    assertNoPageErrors(page);
  });
});

afterAll(() => {
  assertOnlyLoopback();
});
