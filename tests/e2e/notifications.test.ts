/** Settings, Notifications in a real browser at tablet width: choose, save, reload, the choices stay; a bad day count is said beside its field. */
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { launchBrowser } from '../helpers/browser.js';
import { startTestServer } from '../helpers/test-server.js';

type Server = Awaited<ReturnType<typeof startTestServer>>;

describe('notification settings in a real browser', () => {
  let server: Server;
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;

  beforeAll(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
    context = await browser.newContext({ viewport: { width: 820, height: 1180 } }); // a tablet held upright
    page = await context.newPage();
  });
  afterAll(async () => {
    await context?.close();
    await browser?.close();
    await server?.close();
  });

  async function signIn(email: string) {
    await page.goto(`${server.url}/sign-in`);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(`${server.url}/`);
  }

  it('the viewer chooses alerts for a unit and the weekly digest; after a reload they stay', async () => {
    // The administrator adds a plant with two units (the people-only demo has none).
    await signIn('admin@northmere.example');
    const headers = { 'x-cleancase-request': '1' };
    const plant = await page.request.post(`${server.url}/api/plants`, { headers, data: { name: 'Greywater Point', timeZone: 'America/Chicago' } });
    expect(plant.status()).toBe(201);
    const plantId = ((await plant.json()) as { id: string }).id;
    for (const name of ['Unit 1', 'Unit 2'])
      expect((await page.request.post(`${server.url}/api/plants/${plantId}/units`, { headers, data: { name } })).status()).toBe(201);
    await context.clearCookies();

    await page.goto(`${server.url}/sign-in`);
    await page.getByLabel('E-mail').fill('viewer@northmere.example');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(`${server.url}/`);
    await page.goto(`${server.url}/settings`);
    await page.getByRole('navigation', { name: 'Settings' }).getByRole('link', { name: 'Notifications' }).click();
    await page.getByRole('heading', { name: 'Notifications', level: 1 }).waitFor();

    // Each condition is explained in one sentence.
    expect(await page.getByText('suspect air in-leakage or the instruments').count()).toBe(1);
    const form = page.getByRole('form', { name: 'Notifications' });
    const unitRows = form.getByTestId('unit-alert-row');
    await form.waitFor();
    if ((await unitRows.count()) === 0) throw new Error(`no unit rows: ${await page.locator('main').textContent()}`);
    const firstUnit = (await unitRows.first().getAttribute('aria-label')) ?? '';
    expect(firstUnit).not.toBe('');

    await form.getByRole('checkbox', { name: 'Weekly digest' }).check();
    await form.getByRole('checkbox', { name: `Data stopped: ${firstUnit}`, exact: true }).check();
    await form.getByRole('checkbox', { name: `Cleaning now pays: ${firstUnit}`, exact: true }).check();
    const days = form.getByLabel(`Days without data before "data stopped": ${firstUnit}`, { exact: true });
    await days.fill('90');
    await form.getByRole('button', { name: 'Save notifications' }).click();
    await page.getByText('must be between 1 and 60').waitFor();
    expect(await days.getAttribute('aria-invalid')).toBe('true');
    expect(await page.getByTestId('form-problems').textContent()).toContain('One field needs attention');

    await days.fill('5');
    await form.getByRole('button', { name: 'Save notifications' }).click();
    await page.getByText('Saved.').waitFor();

    // Nothing runs past the page's width at tablet size.
    expect(await page.evaluate(() => document.documentElement.scrollWidth <= document.documentElement.clientWidth)).toBe(true);

    await page.reload();
    await page.getByRole('heading', { name: 'Notifications', level: 1 }).waitFor();
    const again = page.getByRole('form', { name: 'Notifications' });
    expect(await again.getByRole('checkbox', { name: 'Weekly digest' }).isChecked()).toBe(true);
    expect(await again.getByRole('checkbox', { name: `Data stopped: ${firstUnit}`, exact: true }).isChecked()).toBe(true);
    expect(await again.getByRole('checkbox', { name: `Cleaning now pays: ${firstUnit}`, exact: true }).isChecked()).toBe(true);
    expect(await again.getByRole('checkbox', { name: `Backpressure unexplained: ${firstUnit}`, exact: true }).isChecked()).toBe(false);
    expect(await again.getByLabel(`Days without data before "data stopped": ${firstUnit}`, { exact: true }).inputValue()).toBe('5');
  });
});
