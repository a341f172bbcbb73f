import { readFileSync } from 'node:fs';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { launchBrowser } from '../helpers/browser.js';
import { startTestServer } from '../helpers/test-server.js';

type Server = Awaited<ReturnType<typeof startTestServer>>;

const dollars = (text: string | null) =>
  Number(
    /(-?)\$([\d,]+)/
      .exec(text ?? '')
      ?.slice(1)
      .join('')
      .replace(/,/g, '') ?? Number.NaN,
  );

async function signedIn(browser: Browser, server: Server, email: string, width = 1280): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport: { width, height: 900 }, acceptDownloads: true });
  const page = await context.newPage();
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL(`${server.url}/`);
  return { context, page };
}

describe('a cleaning case from draft to approved report, in a real browser (full demo data)', () => {
  let server: Server;
  let browser: Browser;
  let analyst: Page;
  let unitId: string;
  let caseId: string;
  const title = 'Harrow Creek Unit 1: spring cleaning';

  beforeAll(async () => {
    server = await startTestServer({ demoData: 'full' });
    browser = await launchBrowser();
    analyst = (await signedIn(browser, server, 'analyst@northmere.example')).page;
    const plants = (await (await analyst.request.get(`${server.url}/api/plants`)).json()) as {
      plants: { name: string; units: { id: string; name: string }[] }[];
    };
    unitId = plants.plants.find((p) => p.name === 'Harrow Creek Station')!.units.find((u) => u.name === 'Unit 1')!.id;
  }, 300_000);

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it('the analyst builds a case on the unit, changes the fuel price and sees the NPV change with no request to the server', async () => {
    await analyst.goto(`${server.url}/units/${unitId}/cases`);
    // the tab's page loads on demand: wait for its own field before typing
    const titleField = analyst.getByLabel('Title of the new case');
    await titleField.waitFor();
    await titleField.fill(title);
    await analyst.getByRole('button', { name: 'New case' }).click();
    await analyst.waitForURL(/\/cases\/[0-9a-f-]{36}$/, { timeout: 30_000 });
    caseId = analyst.url().split('/').pop()!;
    await analyst.getByRole('heading', { name: title }).waitFor();
    const npv = analyst.getByTestId('case-npv');
    const saved = (await (await analyst.request.get(`${server.url}/api/cases/${caseId}`)).json()) as {
      results: { businessCase: { npv: number } };
      inputs: { drivers: { fuelPricePerMmbtu: number } };
    };
    expect(dollars(await npv.textContent())).toBe(Math.round(saved.results.businessCase.npv));
    expect(typeof saved.inputs.drivers.fuelPricePerMmbtu).toBe('number');
    await analyst.getByTestId('source-drivers.fuelPricePerMmbtu').getByText('prefilled').waitFor();

    const requests: string[] = [];
    analyst.on('request', (r) => requests.push(`${r.method()} ${r.url()}`));
    const before = await npv.textContent();
    const fuel = analyst.getByLabel(/^Fuel price/);
    await fuel.fill(String(saved.inputs.drivers.fuelPricePerMmbtu * 2));
    await analyst.getByTestId('case-unsaved').getByText('Unsaved changes').waitFor();
    await expect.poll(() => npv.textContent(), { timeout: 10_000 }).not.toBe(before);
    const timing = analyst.getByTestId('case-what-if-timing');
    await expect.poll(() => timing.getAttribute('data-ms')).not.toBe('');
    // the Monte Carlo of the new inputs follows, still without the server
    await analyst.getByTestId('case-monte-carlo').and(analyst.locator(':not([aria-busy])')).waitFor({ timeout: 30_000 });
    console.log(`what-if, first edit: ${await timing.textContent()} (worker computation ${await timing.getAttribute('data-compute-ms')} ms)`);
    // a second edit finds the worker warm: the figure a person sees while typing
    const first = await npv.textContent();
    await fuel.fill(String(saved.inputs.drivers.fuelPricePerMmbtu * 3));
    await expect.poll(() => npv.textContent(), { timeout: 10_000 }).not.toBe(first);
    await analyst.getByTestId('case-monte-carlo').and(analyst.locator(':not([aria-busy])')).waitFor({ timeout: 30_000 });
    console.log(`what-if, second edit: ${await timing.textContent()} (worker computation ${await timing.getAttribute('data-compute-ms')} ms)`);
    expect(requests.filter((r) => r.includes('/api/'))).toEqual([]);
    await analyst.getByTestId('source-drivers.fuelPricePerMmbtu').getByText('entered').waitFor();
  }, 120_000);

  it('saved, the page shows the server’s figures, equal to the ones computed in the browser; then the analyst submits', async () => {
    const npv = analyst.getByTestId('case-npv');
    const whatIfNpv = await npv.textContent();
    const whatIfFirst = await analyst.getByTestId('case-first-cleaning').textContent();
    const patched = analyst.waitForResponse((r) => r.url().endsWith(`/api/cases/${caseId}`) && r.request().method() === 'PATCH');
    await analyst.getByRole('button', { name: 'Save', exact: true }).click();
    expect((await patched).status()).toBe(200);
    await analyst.getByTestId('case-unsaved').waitFor({ state: 'detached' });
    const stored = (await (await analyst.request.get(`${server.url}/api/cases/${caseId}`)).json()) as {
      results: { businessCase: { npv: number } };
      inputSources: Record<string, { source: string }>;
    };
    expect(dollars(whatIfNpv)).toBe(Math.round(stored.results.businessCase.npv));
    expect(await npv.textContent()).toBe(whatIfNpv);
    expect(await analyst.getByTestId('case-first-cleaning').textContent()).toBe(whatIfFirst);
    expect(stored.inputSources['drivers.fuelPricePerMmbtu']?.source).toBe('entered');

    await analyst.screenshot({ path: '/tmp/case-1280.png', fullPage: true });
    await analyst.screenshot({ path: '/tmp/case-1280-top.png', clip: { x: 0, y: 0, width: 1280, height: 1200 } });
    await analyst.getByRole('region', { name: 'Results' }).screenshot({ path: '/tmp/case-1280-results.png' });
    await analyst.getByRole('button', { name: 'Submit for approval' }).click();
    await expect.poll(() => analyst.getByTestId('case-status').textContent()).toBe('Waiting for approval');
    // the author may not decide their own case, and the page says why
    expect(await analyst.getByRole('button', { name: 'Approve', exact: true }).count()).toBe(0);
    await analyst.getByText('nobody approves their own case').waitFor();
  }, 60_000);

  it('the approver reads the mail in the mailbox, follows its link and approves', async () => {
    const { page } = await signedIn(browser, server, 'approver@northmere.example', 800);
    await page.goto(`${server.url}/mailbox`);
    const message = page.getByTestId('mailbox-message').filter({ hasText: `Cleaning case for your decision: ${title}` });
    await message.first().waitFor({ timeout: 45_000 });
    await message.first().locator(`a[href$="/cases/${caseId}"]`).first().click();
    await page.waitForURL(`${server.url}/cases/${caseId}`);
    await page.getByRole('heading', { name: title }).waitFor();
    await page.screenshot({ path: '/tmp/case-800-approver.png', fullPage: true });
    await page.screenshot({ path: '/tmp/case-800-top.png', clip: { x: 0, y: 0, width: 800, height: 1400 } });
    await page.getByRole('button', { name: 'Approve', exact: true }).click();
    await expect.poll(() => page.getByTestId('case-status').textContent()).toBe('Approved');
    expect(await page.getByRole('button', { name: 'Send back…' }).count()).toBe(0);
  }, 90_000);

  it('the viewer finds the approved case in the list and downloads its PDF report', async () => {
    const { page } = await signedIn(browser, server, 'viewer@northmere.example');
    await page.goto(`${server.url}/cases`);
    await page.getByRole('heading', { name: 'Cleaning cases' }).waitFor();
    await page.getByRole('link', { name: title }).click();
    await page.getByRole('heading', { name: title }).waitFor();
    // a viewer changes nothing: no input fields, no approval buttons
    expect(await page.getByLabel(/^Fuel price/).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Approve', exact: true }).count()).toBe(0);
    const download = page.waitForEvent('download');
    await page.getByRole('link', { name: 'Report (PDF)' }).click();
    const file = await (await download).path();
    expect(readFileSync(file).subarray(0, 5).toString('latin1')).toBe('%PDF-');

    await page.getByRole('link', { name: 'Printable page' }).click();
    await page.getByTestId('case-recommendation').waitFor();
    await page.getByTestId('case-schedule').locator('svg').first().waitFor();
    await page.screenshot({ path: '/tmp/case-print.png', fullPage: true });
    await page.goto(`${server.url}/cases`);
    await page.getByRole('link', { name: title }).waitFor();
    await page.screenshot({ path: '/tmp/cases-list.png', fullPage: true });
  }, 60_000);
});
