import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { launchBrowser } from '../helpers/browser.js';
import { startTestServer } from '../helpers/test-server.js';

describe('the app in a real browser', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: Browser;
  let page: Page;

  beforeAll(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
    page = await browser.newPage();
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it('opens on the sign-in page when nobody is signed in', async () => {
    await page.goto(server.url);
    await page.waitForURL('**/sign-in');
    await expect(page.getByRole('heading', { name: 'Sign in' }).isVisible()).resolves.toBe(true);
  });

  it('shows the field error beside the field for an empty e-mail', async () => {
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page.getByText('Enter an e-mail address').isVisible()).resolves.toBe(true);
  });

  it('refuses a wrong password with one message for every cause', async () => {
    await page.getByLabel('E-mail').fill('admin@northmere.example');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect(page.getByRole('alert').textContent()).resolves.toContain('E-mail or password is not right');
  });

  it('signs the demo administrator in and shows their organisation', async () => {
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${server.url}/`);
    const org = await page.getByTestId('active-organisation').textContent();
    expect(org).toContain('Northmere Power Cooperative');
    // People-only seed: no units yet, and the overview says what to do next.
    await page.getByText('No generating units to show yet').waitFor();
    expect(await page.getByRole('link', { name: 'Go to plants' }).getAttribute('href')).toBe('/plants');
  });

  it('shows the not-found page for an unknown address', async () => {
    await page.goto(`${server.url}/no/such/page`);
    await expect(page.getByRole('heading', { name: 'Nothing here' }).isVisible()).resolves.toBe(true);
  });
});
