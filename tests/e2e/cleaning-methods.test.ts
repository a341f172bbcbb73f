import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CAUTION_TEXT, GENERAL_CAUTION, TYPICAL_CLEANING_METHODS } from '@shared/schemas/cleaning-method';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { launchBrowser } from '../helpers/browser.js';
import { startTestServer } from '../helpers/test-server.js';

type Server = Awaited<ReturnType<typeof startTestServer>>;

async function signIn(page: Page, server: Server, email: string) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL(`${server.url}/`);
}

describe('the cleaning-method library in a real browser', () => {
  let server: Server;
  let browser: Browser;
  let page: Page;
  const contexts: BrowserContext[] = [];

  beforeAll(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
    const context = await browser.newContext();
    contexts.push(context);
    page = await context.newPage();
  });
  afterAll(async () => {
    for (const c of contexts) await c.close();
    await browser?.close();
    await server?.close();
  });

  const rows = () => page.getByTestId('cleaning-method-row');
  const lancing = () => rows().filter({ hasText: 'High-pressure water lancing' });

  it('the analyst finds the library under Settings, with the five seeded methods marked as typical values', async () => {
    await signIn(page, server, 'analyst@northmere.example');
    await page.goto(`${server.url}/settings`);
    await page.getByRole('navigation', { name: 'Settings' }).getByRole('link', { name: 'Cleaning methods' }).click();
    await page.waitForURL('**/settings/cleaning-methods');
    await rows().first().waitFor();
    expect(await rows().count()).toBe(TYPICAL_CLEANING_METHODS.length);
    expect(await page.getByTestId('typical-tag').count()).toBe(TYPICAL_CLEANING_METHODS.length);
    expect(await page.getByTestId('typical-tag').first().getAttribute('title')).toContain('own quotes');
    const row = await lancing().textContent();
    expect(row).toContain('Outage');
    expect(row).toContain('25,000');
    expect(row).toContain('92 %');
    expect(await rows().filter({ hasText: 'half-condenser' }).textContent()).toContain('Derate 50 %');
  });

  it('opening a method shows its cautions, the general one first, then water jetting', async () => {
    expect(await page.getByTestId('method-cautions').count()).toBe(0);
    await lancing().getByRole('button', { name: 'High-pressure water lancing', exact: true }).click();
    const cautions = page.getByTestId('method-cautions');
    await cautions.waitFor();
    const text = (await cautions.textContent()) ?? '';
    expect(text).toContain(CAUTION_TEXT['water-jetting']);
    expect(text.indexOf(GENERAL_CAUTION)).toBeGreaterThanOrEqual(0);
    expect(text.indexOf(GENERAL_CAUTION)).toBeLessThan(text.indexOf(CAUTION_TEXT['water-jetting']));
  });

  it('a new method’s key is made from its name and shown, not typed; nothing is sent before Add', async () => {
    const form = page.getByRole('form', { name: 'Add a cleaning method' });
    expect(await form.getByRole('textbox', { name: 'Key' }).count()).toBe(0);
    await form.getByLabel('Name').fill('My Method');
    await expect.poll(() => form.getByTestId('method-key').textContent()).toContain('my-method');
    expect(await rows().count()).toBe(TYPICAL_CLEANING_METHODS.length);
  });

  it('changing the fixed cost with typical left unticked saves the figure and drops the typical tag', async () => {
    await lancing().getByRole('button', { name: 'Change High-pressure water lancing' }).click();
    const form = page.getByRole('form', { name: 'Change High-pressure water lancing' });
    await form.waitFor();
    expect(await form.getByRole('checkbox', { name: 'Typical values' }).isChecked()).toBe(false);
    expect(await form.getByLabel('Cleanliness recovered').inputValue()).toBe('92');
    expect(await form.getByRole('checkbox', { name: 'High-pressure water jetting' }).isChecked()).toBe(true);
    await form.getByLabel('Fixed cost').fill('31,500');
    await form.getByRole('button', { name: 'Save method' }).click();
    await form.waitFor({ state: 'detached' });
    await expect.poll(() => lancing().textContent()).toContain('31,500');
    expect(await lancing().getByTestId('typical-tag').count()).toBe(0);
    expect(await page.getByTestId('typical-tag').count()).toBe(TYPICAL_CLEANING_METHODS.length - 1);
    // what the server kept, not only what the page shows
    const listed = (await (await page.request.get(`${server.url}/api/cleaning-methods`)).json()) as {
      methods: { id: string; fixedCost: number; typical: boolean; recoveredCleanliness: number }[];
    };
    const saved = listed.methods.find((m) => m.id === 'hp-water-lancing');
    expect(saved).toMatchObject({ fixedCost: 31_500, typical: false, recoveredCleanliness: 0.92 });
  });

  it('recording a past cleaning offers the library’s methods, without the safety banner kept for planned work', async () => {
    const headers = { 'x-cleancase-request': '1' };
    const plant = (await (
      await page.request.post(`${server.url}/api/plants`, { headers, data: { name: 'Fenwick Bay', timeZone: 'Europe/London' } })
    ).json()) as { id: string };
    const unitResponse = await page.request.post(`${server.url}/api/plants/${plant.id}/units`, { headers, data: { name: 'Unit 1' } });
    expect(unitResponse.status()).toBe(201);
    const unit = (await unitResponse.json()) as { id: string };
    await page.goto(`${server.url}/units/${unit.id}/events`);
    const form = page.getByRole('form', { name: 'Add an event' });
    const method = form.getByRole('combobox', { name: 'Cleaning method' });
    await method.waitFor();
    const offered = await method.locator('option').allTextContents();
    for (const m of TYPICAL_CLEANING_METHODS) expect(offered).toContain(m.name);
    await method.selectOption('hp-water-lancing');
    expect(await form.getByTestId('cleaning-caution').count()).toBe(0);
    expect(await form.textContent()).not.toContain(GENERAL_CAUTION);
    expect(await form.textContent()).not.toContain(CAUTION_TEXT['water-jetting']);
  });

  it('a viewer sees the library and its cautions with no change controls, and the reason', async () => {
    const context = await browser.newContext();
    contexts.push(context);
    const viewer = await context.newPage();
    await signIn(viewer, server, 'viewer@northmere.example');
    await viewer.goto(`${server.url}/settings/cleaning-methods`);
    await viewer.getByTestId('cleaning-method-row').first().waitFor();
    expect(await viewer.getByTestId('cleaning-method-row').count()).toBe(TYPICAL_CLEANING_METHODS.length);
    expect(await viewer.getByRole('form', { name: 'Add a cleaning method' }).count()).toBe(0);
    expect(await viewer.getByText('Only administrators and analysts add, change and delete cleaning methods.').isVisible()).toBe(true);
    expect(await viewer.getByTestId('library-caution').textContent()).toContain(GENERAL_CAUTION);
    expect(await viewer.getByRole('button', { name: /^Change / }).count()).toBe(0);
    expect(await viewer.getByRole('button', { name: 'Delete' }).count()).toBe(0);
  });
});
