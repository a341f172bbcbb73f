/**
 * The unit's forms help the person filling them in: required fields are marked, a refused save is said aloud and
 * puts focus on the first problem, leaving with unsaved changes asks first, and days are typed as every page shows
 * them ("14 Mar 2026"), not in the browser's own date format.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { TEST_CONDENSER, TEST_ECONOMICS, TEST_TURBINE } from '../factories/units.js';
import { launchBrowser } from '../helpers/browser.js';
import { startTestServer } from '../helpers/test-server.js';

const CSRF = { 'x-cleancase-request': '1' };

describe('form aids on the unit’s setup and events', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: Browser;
  let page: Page;
  let unitId: string;

  beforeAll(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    page = await context.newPage();
    await page.goto(`${server.url}/sign-in`);
    await page.getByLabel('E-mail').fill('analyst@northmere.example');
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(`${server.url}/`);
    const api = page.request;
    const plant = (await (
      await api.post(`${server.url}/api/plants`, { headers: CSRF, data: { name: 'Form Aids Station', timeZone: 'Europe/Dublin' } })
    ).json()) as {
      id: string;
    };
    unitId = ((await (await api.post(`${server.url}/api/plants/${plant.id}/units`, { headers: CSRF, data: { name: 'Unit 1' } })).json()) as { id: string }).id;
    for (const [part, body] of [
      ['condenser', TEST_CONDENSER],
      ['turbine', TEST_TURBINE],
      ['economics', TEST_ECONOMICS],
    ] as const) {
      expect((await api.put(`${server.url}/api/units/${unitId}/${part}`, { headers: CSRF, data: body })).status()).toBe(200);
    }
  }, 120_000);

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it('the condenser form marks required fields, says a refused save aloud, focuses the first problem and asks before changes are dropped', async () => {
    await page.goto(`${server.url}/units/${unitId}/setup`);
    const form = page.getByRole('form', { name: 'Condenser' });
    await form.waitFor();
    const tubeCount = form.getByLabel('Tube count');
    expect(await tubeCount.getAttribute('aria-required')).toBe('true');
    expect(await form.getByLabel('Effective tube length').getAttribute('aria-required')).toBeNull();
    await tubeCount.fill('');
    await form.getByRole('button', { name: 'Save condenser' }).click();
    await expect.poll(() => form.getByTestId('form-problems').textContent()).toMatch(/field needs attention|fields need attention/);
    await expect.poll(() => tubeCount.evaluate((el) => el === document.activeElement)).toBe(true);
    // leaving with the unsaved change asks first
    await page.getByRole('navigation', { name: 'Unit' }).getByRole('link', { name: 'Data files' }).click();
    const dialog = page.getByRole('alertdialog');
    await dialog.waitFor();
    await dialog.getByRole('button', { name: 'Stay and keep editing' }).click();
    expect(await tubeCount.inputValue()).toBe('');
    await page.getByRole('navigation', { name: 'Unit' }).getByRole('link', { name: 'Data files' }).click();
    await dialog.getByRole('button', { name: 'Leave and drop changes' }).click();
    await page.waitForURL(`${server.url}/units/${unitId}/data`);
  });

  it('an event’s day is typed as pages show days; numbers alone are refused beside the box, and the saved event reads the same', async () => {
    await page.goto(`${server.url}/units/${unitId}/events`);
    const form = page.getByRole('form', { name: 'Add an event' });
    await form.waitFor();
    const day = form.getByLabel('Date', { exact: true });
    expect(await day.getAttribute('type')).not.toBe('date');
    await day.fill('03/04/2025');
    await expect.poll(() => form.textContent()).toMatch(/day and month in doubt/);
    await day.fill('4 mar 2025');
    await day.blur();
    expect(await day.inputValue()).toBe('4 Mar 2025');
    await form.getByRole('button', { name: 'Add event' }).click();
    await page.getByText('Event added.').waitFor();
    await page.getByText('4 Mar 2025').first().waitFor();
  });
});
