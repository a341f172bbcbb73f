import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { launchBrowser } from '../helpers/browser.js';
import { startTestServer } from '../helpers/test-server.js';

type Server = Awaited<ReturnType<typeof startTestServer>>;

/**
 * The first link of the newest message to `to` whose subject matches, as the local sink printed it in the
 * terminal (kept in MariaDB): the addressee cannot sign in yet, so the mailbox page is not theirs to read.
 */
async function linkMailedTo(server: Server, to: string, subject: RegExp): Promise<string> {
  // Long enough for one retried delivery (the outbox waits 30 s after a failed attempt).
  const deadline = Date.now() + 45_000;
  while (Date.now() < deadline) {
    const message = (await server.mailTo(to)).find((m) => subject.test(m.subject));
    const link = message?.text.match(/https?:\/\/\S+/)?.[0];
    if (link) return link;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`no message to ${to} matching ${subject}; waiting in the outbox: ${JSON.stringify(await server.mailWaiting())}`);
}

async function signIn(page: Page, server: Server, email: string, password: string) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL(`${server.url}/`);
}

async function switchOrganisation(page: Page, name: string) {
  await page.getByTestId('active-organisation').click();
  await page
    .getByRole('list', { name: 'Your organisations' })
    .getByRole('button', { name: new RegExp(name) })
    .click();
  await page.waitForURL(/\/$/);
  await expect.poll(() => page.getByTestId('active-organisation').textContent()).toContain(name);
}

describe('account screens in a real browser', () => {
  let server: Server;
  let browser: Browser;
  const contexts: BrowserContext[] = [];
  const freshPage = async () => {
    const context = await browser.newContext();
    contexts.push(context);
    return context.newPage();
  };

  beforeAll(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    for (const c of contexts) await c.close();
    await browser?.close();
    await server?.close();
  });

  describe('a new organisation invites a colleague', () => {
    let founder: Page;
    const organisationName = 'Estuary Generating Station';
    const colleague = 'shift.engineer@estuary.example';

    it('signing up lands on the overview of the new organisation as its administrator', async () => {
      founder = await freshPage();
      await founder.goto(`${server.url}/sign-in`);
      await founder.getByRole('link', { name: 'Create an account' }).click();
      await founder.waitForURL('**/sign-up');
      await founder.getByLabel('Your name').fill('Aino Laaksonen');
      await founder.getByLabel('Work e-mail').fill('aino@estuary.example');
      await founder.getByLabel('Password').fill('backpressure-watch-2026');
      await founder.getByLabel('Organisation name').fill(organisationName);
      await founder.getByRole('button', { name: /Create account/ }).click();
      await founder.waitForURL(`${server.url}/`);
      await expect.poll(() => founder.getByRole('heading', { level: 1 }).textContent()).toContain(organisationName);
      const active = await founder.getByTestId('active-organisation').textContent();
      expect(active).toContain(organisationName);
      expect(active).toContain('Administrator');
    });

    it('a sign-up with a very common password shows the server’s reason beside the password field', async () => {
      const page = await freshPage();
      await page.goto(`${server.url}/sign-up`);
      await page.getByLabel('Your name').fill('Someone Else');
      await page.getByLabel('Work e-mail').fill('someone@estuary.example');
      await page.getByLabel('Password').fill('password');
      await page.getByLabel('Organisation name').fill('Another Plant');
      await page.getByRole('button', { name: /Create account/ }).click();
      const password = page.getByLabel('Password');
      await expect.poll(() => password.getAttribute('aria-invalid')).toBe('true');
      const describedBy = await password.getAttribute('aria-describedby');
      await expect.poll(() => page.locator(`[id="${describedBy!.split(' ')[0]}"]`).textContent()).toMatch(/at least 8|common/);
      expect(page.url()).toContain('/sign-up');
    });

    it('refuses to demote the only unrestricted administrator and shows why', async () => {
      await founder.getByRole('link', { name: 'Settings' }).click();
      await founder.getByRole('navigation', { name: 'Settings' }).getByRole('link', { name: 'People and roles' }).click();
      await founder.getByRole('button', { name: 'Change access of Aino Laaksonen' }).click();
      const editor = founder.getByRole('row').filter({ hasText: 'aino@estuary.example' });
      await editor.getByLabel('Role').selectOption('viewer');
      await editor.getByRole('button', { name: 'Save', exact: true }).click();
      await expect
        .poll(() => founder.getByRole('alert').filter({ hasText: 'at least one administrator' }).textContent())
        .toContain('needs at least one administrator');
      await editor.getByRole('button', { name: 'Cancel' }).click();
    });

    it('invites a colleague as analyst; the invitation waits in the pending list', async () => {
      const invite = founder.locator('form', { hasText: 'Invite a colleague' });
      await invite.getByLabel('E-mail').fill(colleague);
      await invite.getByLabel('Role').selectOption('analyst');
      await invite.getByRole('button', { name: 'Send invitation' }).click();
      await expect.poll(() => invite.getByRole('status').textContent()).toContain(`Invitation sent to ${colleague}`);
      const pending = founder.getByRole('table').filter({ hasText: colleague });
      await pending.waitFor();
      await expect.poll(() => pending.getByRole('row').filter({ hasText: colleague }).textContent()).toContain('Analyst');
    });

    it('the colleague opens the mailed link in another browser, creates an account and joins as analyst', async () => {
      const page = await freshPage();
      const link = await linkMailedTo(server, colleague, new RegExp(organisationName));
      expect(link.startsWith(`${server.url}/invitation?token=`)).toBe(true);
      await page.goto(link);
      await expect.poll(() => page.getByTestId('invitation-organisation').textContent()).toBe(organisationName);
      await page.getByLabel('Your name').fill('Kwabena Asante');
      await page.getByLabel('Password').fill('tube-bundle-sweeper-7');
      await page.getByRole('button', { name: 'Create account and join' }).click();
      await page.waitForURL(`${server.url}/`);
      const active = await page.getByTestId('active-organisation').textContent();
      expect(active).toContain(organisationName);
      expect(active).toContain('Analyst');
      // Analysts get no member management: the settings list says why instead of linking.
      await page.goto(`${server.url}/settings/members`);
      await page.getByText('People and roles is not available to you').waitFor();
    });

    it('the administrator then sees the colleague among the members and no longer among pending invitations', async () => {
      await founder.reload();
      const members = founder.getByRole('table').first();
      await members.getByRole('row').filter({ hasText: colleague }).waitFor();
      await founder.getByText('No invitations are waiting for an answer').waitFor();
    });
  });

  describe('the consultant works for two organisations', () => {
    let page: Page;

    beforeAll(async () => {
      page = await freshPage();
      await signIn(page, server, 'consultant@tidewater.example', DEMO_PASSWORD);
    });

    it('after switching to the consultancy, its two client groups are listed', async () => {
      await switchOrganisation(page, 'Tidewater Performance Partners');
      await page.goto(`${server.url}/settings/client-groups`);
      const rows = page.getByTestId('client-group-row');
      await rows.first().waitFor();
      const names = await rows.locator('td:first-child').allTextContents();
      expect(names.sort()).toEqual(['Brightwater Municipal Utility', 'Calder Valley Energy']);
      // An analyst may look but not manage; the reason is given.
      await page.getByText('Only administrators create, rename and delete client groups.').waitFor();
    });

    it('after switching to the utility, no client group of the consultancy shows anywhere on the page', async () => {
      await switchOrganisation(page, 'Northmere Power Cooperative');
      await page.goto(`${server.url}/settings/client-groups`);
      await page.getByText('No client groups').first().waitFor();
      const body = await page.locator('body').textContent();
      expect(body).not.toContain('Calder Valley Energy');
      expect(body).not.toContain('Brightwater Municipal Utility');
      await expect(page.getByTestId('client-group-row').count()).resolves.toBe(0);
    });

    it('switching inside the page (no reload) also leaves nothing of the other tenant on screen', async () => {
      await switchOrganisation(page, 'Tidewater Performance Partners');
      await page.getByRole('link', { name: 'Settings' }).click();
      await page.getByRole('navigation', { name: 'Settings' }).getByRole('link', { name: 'Client groups' }).click();
      await page.getByTestId('client-group-row').first().waitFor();
      await switchOrganisation(page, 'Northmere Power Cooperative');
      await page.getByRole('link', { name: 'Settings' }).click();
      await page.getByRole('navigation', { name: 'Settings' }).getByRole('link', { name: 'Client groups' }).click();
      await page.getByText('No client groups').first().waitFor();
      const body = await page.locator('body').textContent();
      expect(body).not.toContain('Calder Valley Energy');
      expect(body).not.toContain('Brightwater Municipal Utility');
    });
  });

  describe('sign-in returns to where the person was going', () => {
    it('a signed-out visit to a settings page goes through sign-in and back to that page', async () => {
      const page = await freshPage();
      await page.goto(`${server.url}/settings/profile`);
      await page.waitForURL(/\/sign-in\?next=/);
      await page.getByLabel('E-mail').fill('approver@northmere.example');
      await page.getByLabel('Password').fill(DEMO_PASSWORD);
      await page.getByRole('button', { name: 'Sign in', exact: true }).click();
      await page.waitForURL(`${server.url}/settings/profile`);
      await page.getByRole('heading', { name: 'Your profile' }).waitFor();
    });

    it('a next address pointing to another site is ignored', async () => {
      const page = await freshPage();
      await page.goto(`${server.url}/sign-in?next=${encodeURIComponent('//elsewhere.example/steal')}`);
      await page.getByLabel('E-mail').fill('viewer@northmere.example');
      await page.getByLabel('Password').fill(DEMO_PASSWORD);
      await page.getByRole('button', { name: 'Sign in', exact: true }).click();
      await page.waitForURL(`${server.url}/`);
      expect(new URL(page.url()).host).toBe(new URL(server.url).host);
    });

    it('a failed Google sign-in is explained on the sign-in page', async () => {
      const page = await freshPage();
      await page.goto(`${server.url}/sign-in?google=failed`);
      await expect.poll(() => page.getByRole('alert').textContent()).toContain('Signing in with Google did not work');
      await expect(page.getByRole('link', { name: 'Sign in with Google' }).getAttribute('href')).resolves.toBe('/api/auth/google');
    });
  });

  describe('forgotten password', () => {
    const email = 'analyst@northmere.example';
    const newPassword = 'cooling-water-inlet-19C';

    it('a reset link from the mailbox sets a new password that then signs in, and the old one no longer does', async () => {
      const page = await freshPage();
      await page.goto(`${server.url}/sign-in`);
      await page.getByRole('link', { name: 'Forgot your password?' }).click();
      // The page loads on demand: until it shows, the sign-in form (with its own E-mail field) is still on screen.
      await page.getByRole('heading', { name: 'Forgot your password?' }).waitFor();
      await page.getByLabel('E-mail').fill(email);
      await page.getByRole('button', { name: 'Send the reset link' }).click();
      await expect.poll(() => page.getByRole('status').textContent()).toContain('If an account uses this e-mail');

      const link = await linkMailedTo(server, email, /Reset your Cleancase password/);
      await page.goto(link);
      await page.getByLabel('New password').fill(newPassword);
      await page.getByRole('button', { name: 'Save the new password' }).click();
      await page.getByRole('link', { name: 'Sign in with your new password' }).click();
      await page.waitForURL(/\/sign-in/);
      await page.getByRole('button', { name: 'Sign in', exact: true }).waitFor();

      await page.getByLabel('E-mail').fill(email);
      await page.getByLabel('Password').fill(DEMO_PASSWORD);
      await page.getByRole('button', { name: 'Sign in', exact: true }).click();
      await expect.poll(() => page.getByRole('alert').textContent()).toContain('E-mail or password is not right');

      await page.getByLabel('Password').fill(newPassword);
      await page.getByRole('button', { name: 'Sign in', exact: true }).click();
      await page.waitForURL(`${server.url}/`);
      await expect.poll(() => page.getByTestId('active-organisation').textContent()).toContain('Northmere Power Cooperative');

      // Signed in, the addressee finds the same mail on the local mailbox page, and only their own.
      await page.goto(`${server.url}/mailbox`);
      const messages = page.getByTestId('mailbox-message');
      await messages
        .filter({ hasText: /Reset your Cleancase password/ })
        .first()
        .waitFor();
      for (const text of await messages.allTextContents()) expect(text).toContain(email);
    }, 120_000);

    it('the same reset link does not work twice', async () => {
      const page = await freshPage();
      const link = await linkMailedTo(server, email, /Reset your Cleancase password/);
      await page.goto(link);
      await page.getByLabel('New password').fill('another-long-passphrase');
      await page.getByRole('button', { name: 'Save the new password' }).click();
      await page.getByRole('alert').waitFor();
      await page.getByRole('link', { name: 'Ask for a new link' }).waitFor();
    }, 90_000);
  });
});
