/**
 * A trial organisation subscribes in the browser: the banner of the trial's last days, the billing page, Stripe's
 * Checkout page (the local stand-in's), back on the billing page with the new plan's limits once Stripe's events
 * arrive by webhook, then ending the subscription at the period end.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { DEMO_TRIAL } from '../../backend/src/seed/demo-billing-seed.js';
import { launchBrowser } from '../helpers/browser.js';
import { startTestServer } from '../helpers/test-server.js';

type Server = Awaited<ReturnType<typeof startTestServer>>;

describe('billing in the browser', () => {
  let server: Server;
  let browser: Browser;
  let page: Page;

  beforeAll(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
    page = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it('takes the trial organisation through checkout on the stand-in to the new limits, then ends the subscription', async () => {
    await page.goto(`${server.url}/sign-in`);
    await page.getByLabel('E-mail').fill(DEMO_TRIAL.admin.email);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(`${server.url}/`);

    const banner = page.getByTestId('billing-banner');
    await expect.poll(() => banner.textContent()).toMatch(/The trial ends in 2 days/);
    await banner.getByRole('link', { name: 'Choose a plan' }).click();

    await page.getByRole('heading', { name: 'Billing', level: 1 }).waitFor();
    expect(await page.getByTestId('billing-status').textContent()).toContain('trialing');
    expect(await page.getByTestId('usage-units').textContent()).toBe('0 of 40');

    await page.getByRole('button', { name: 'Subscribe to Station' }).click();
    await page.waitForURL(/127\.0\.0\.1:\d+\/pay\/cs_test_/);
    expect(await page.textContent('body')).toContain('690.00 USD');
    await page.getByRole('button', { name: 'Pay with the test card' }).click();
    await page.waitForURL(`${server.url}/settings/billing?checkout=done`);

    // Stripe's events reach the app by webhook; the page looks again until they have.
    await expect.poll(() => page.getByTestId('billing-status').textContent(), { timeout: 20_000 }).toContain('active');
    expect(await page.getByTestId('billing-plan').textContent()).toBe('Station, billed every month');
    expect(await page.getByTestId('usage-units').textContent()).toBe('0 of 10');
    expect(await page.getByTestId('billing-next-invoice').textContent()).toMatch(/\$690\.00 on /);
    expect(await page.getByRole('link', { name: /^CC-\d+$/ }).count()).toBe(1);
    await expect.poll(() => banner.count()).toBe(0);

    await page.getByRole('button', { name: 'End the subscription' }).click();
    await page.getByRole('button', { name: 'End it at the period end' }).click();
    await expect.poll(() => page.getByTestId('billing-next-invoice').textContent()).toMatch(/None: the subscription ends on/);
    await page.getByRole('button', { name: 'Keep the subscription' }).waitFor();
    expect(await page.getByTestId('billing-status').textContent()).toContain('active');
  });
});
