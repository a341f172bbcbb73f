import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { launchBrowser } from '../helpers/browser.js';
import { startTestServer } from '../helpers/test-server.js';

type Server = Awaited<ReturnType<typeof startTestServer>>;

const dayText = (day: string) =>
  new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(new Date(`${day}T00:00:00Z`));
const addDays = (day: string, n: number) => new Date(Date.parse(`${day}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);
const dollars = (text: string) => Number(/\$([\d,]+)/.exec(text)?.[1]?.replace(/,/g, '') ?? Number.NaN);

async function signIn(page: Page, server: Server, email: string) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL(`${server.url}/`);
}

describe('condenser health view in a real browser (full demo data)', () => {
  let server: Server;
  let browser: Browser;
  let page: Page;
  let unitPath: string;
  let unitId: string;
  let lastDay: string;

  beforeAll(async () => {
    server = await startTestServer({ demoData: 'full' });
    browser = await launchBrowser();
    page = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage();
    await signIn(page, server, 'analyst@northmere.example');
    const plants = (await (await page.request.get(`${server.url}/api/plants`)).json()) as { plants: { name: string; units: { id: string; name: string }[] }[] };
    unitId = plants.plants.find((p) => p.name === 'Harrow Creek Station')!.units.find((u) => u.name === 'Unit 1')!.id;
    unitPath = `/units/${unitId}`;
  }, 300_000);

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  const healthApi = async (query = '') => (await page.request.get(`${server.url}/api/units/${unitId}/health${query}`)).json();

  it('shows the headline figures the API computed: cleanliness, cost per day in dollars, next cleaning date', async () => {
    await page.goto(`${server.url}${unitPath}`);
    const api = await healthApi();
    lastDay = api.headline.asOf;
    const cleanliness = page.getByTestId('headline-cleanliness');
    await expect.poll(() => cleanliness.textContent()).toContain(`${(api.headline.cleanliness * 100).toFixed(1)} %`);
    const cost = (await page.getByTestId('headline-fouling-cost').textContent()) ?? '';
    expect(cost).toMatch(/\$[\d,]+\s*a day/);
    expect(dollars(cost)).toBe(Math.round(api.headline.foulingCostPerDay));
    expect(api.headline.nextCleaning.status).toBe('planned');
    expect(await page.getByTestId('headline-next-cleaning').textContent()).toContain(dayText(api.headline.nextCleaning.next.date));
    // the head opens with one sentence: condition, cost per day, what to do by the plan's first date; then two groups, no all-caps labels
    const sentence = (await page.getByTestId('headline-sentence').textContent()) ?? '';
    expect(sentence).toContain(`cleanliness was ${Math.round(api.headline.cleanliness * 100)} %`);
    expect(dollars(sentence)).toBe(Math.round(api.headline.foulingCostPerDay));
    expect(sentence).toContain(`by ${dayText(api.headline.nextCleaning.plan[0].date)}`);
    expect(await page.getByTestId('headline-condition').getByRole('heading').textContent()).toBe('Condition of the tubes');
    expect(await page.getByTestId('headline-money').getByRole('heading').textContent()).toBe('Money and the next cleaning');
    expect(await page.locator('[data-testid="health-view"] .uppercase').count()).toBe(0);
    expect(await page.getByRole('navigation', { name: 'Unit' }).getByRole('link', { name: 'Condition and cost' }).getAttribute('href')).toBe(unitPath);
    // The demo's data ended long before the machine's clock: the plan starts today, not in the past, and says
    // what data it rests on; it lists its dates and answers with both kinds of method.
    const today = new Date().toISOString().slice(0, 10);
    expect(api.headline.nextCleaning.next.date >= addDays(today, -1)).toBe(true);
    expect(await page.getByTestId('next-cleaning-stale').textContent()).toContain(`Built on data to ${dayText(api.headline.nextCleaning.dataTo)}`);
    expect(await page.getByTestId('next-cleaning-plan').textContent()).toContain(dayText(api.headline.nextCleaning.plan[0].date));
    const options = (await page.getByTestId('next-cleaning-options').textContent()) ?? '';
    expect(options).toContain('While running');
    expect(options).toContain('In an outage');
    // data of the demo ends long before the machine's clock: the freshness warning is on
    expect(await page.getByTestId('headline-freshness').textContent()).toMatch(/days old: import recent data/);
    // the default period is the last year of data, and every chart has drawn its figure
    expect(await page.getByTestId('period-span').textContent()).toBe(`${dayText(addDays(lastDay, -364))} – ${dayText(lastDay)}`);
    for (const chart of ['chart-cleanliness', 'chart-backpressure', 'chart-breakdown', 'chart-cost']) {
      await page.getByTestId(chart).locator('svg').first().waitFor();
    }
    expect(await page.getByTestId('chart-cleanliness').getAttribute('data-points')).toBe('365');
    expect(await page.getByTestId('chart-backpressure').textContent()).toContain('Backpressure (inHgA)');
    // one way to show time: the figures' moment names its zone, month axes carry the full year
    expect(await page.getByTestId('figures-computed').textContent()).toMatch(/Figures computed \d{1,2} \w{3,4} \d{4}, \d\d:\d\d UTC/);
    expect(await page.getByTestId('chart-breakdown').textContent()).toMatch(/[A-Z][a-z]{2} 20\d\d/);
    // charts at a glance: the forecast band is labelled with its width, the fouling cost is given per cleaning cycle
    expect(await page.getByTestId('chart-cleanliness').textContent()).toMatch(/90 % band \d+\.\d–\d+\.\d %/);
    const cycles = (await page.getByTestId('cost-cycles').textContent()) ?? '';
    const cleaningInPeriod = api.headline.lastCleaning.date;
    expect(cycles).toContain(
      `${dayText(cleaningInPeriod)} – ${dayText(lastDay)}: $${Math.round(api.headline.foulingCostSinceCleaning).toLocaleString('en-US')}`,
    );
  });

  it('takes screenshots at desktop and tablet widths', async () => {
    await page.screenshot({ path: '/tmp/health-desktop.png', fullPage: true });
    const tablet = await browser.newContext({ viewport: { width: 800, height: 1180 } });
    const tabletPage = await tablet.newPage();
    await signIn(tabletPage, server, 'analyst@northmere.example');
    await tabletPage.goto(`${server.url}${unitPath}`);
    await tabletPage.getByTestId('chart-cost').locator('svg').first().waitFor();
    await tabletPage.screenshot({ path: '/tmp/health-tablet.png', fullPage: true });
    await tablet.close();
  });

  it('when the period changes to 90 days, the address and the charts follow', async () => {
    await page.getByRole('button', { name: 'Last 90 days' }).click();
    await page.waitForURL(/period=90d/);
    // the new period's figures come from the server; on a busy machine that can take a few seconds
    await expect.poll(() => page.getByTestId('period-span').textContent(), { timeout: 15_000 }).toBe(`${dayText(addDays(lastDay, -89))} – ${dayText(lastDay)}`);
    await expect.poll(() => page.getByTestId('chart-cleanliness').getAttribute('data-points')).toBe('90');
    await page.getByRole('button', { name: 'Week' }).click();
    await page.waitForURL(/by=week/);
    // 90 days span 13 or 14 ISO weeks
    await expect.poll(async () => Number(await page.getByTestId('chart-breakdown').getAttribute('data-points'))).toBeGreaterThanOrEqual(13);
    expect(Number(await page.getByTestId('chart-breakdown').getAttribute('data-points'))).toBeLessThanOrEqual(14);
    // the address alone reproduces the view
    await page.reload();
    await expect.poll(() => page.getByTestId('period-span').textContent()).toBe(`${dayText(addDays(lastDay, -89))} – ${dayText(lastDay)}`);
    expect(await page.getByRole('button', { name: 'Week' }).getAttribute('aria-pressed')).toBe('true');
  });

  it('over all data, lists the July–August 2024 air in-leakage with its evidence and that cleaning would not recover it', async () => {
    await page.getByRole('button', { name: 'All data' }).click();
    await page.waitForURL(/period=all/);
    const period = page.getByTestId('air-leak-period').first();
    await period.waitFor();
    const text = (await page.getByTestId('air-leak-panel').textContent()) ?? '';
    expect(text).toMatch(/Jul 2024 – \d{1,2} Aug 2024/);
    expect(text).toMatch(/subcooling|dissolved oxygen|air-removal/);
    expect(text).toContain('Cleaning would not recover this');
    const exported = await page.request.get(`${server.url}${await page.getByRole('link', { name: 'Daily figures (CSV)' }).getAttribute('href')}`);
    expect(exported.status()).toBe(200);
    expect(exported.headers()['content-type']).toContain('text/csv');
  });

  it('after a cleaning is added a week before the last data day, the recompute runs and the trend restarts from it', async () => {
    await page.getByRole('button', { name: 'Last 365 days of data' }).click();
    await page.waitForURL(/period=1y/);
    const sinceBefore = (await page.getByTestId('since-cleaning').textContent()) ?? '';
    const cleaningDay = addDays(lastDay, -7);
    expect(sinceBefore).not.toContain(dayText(cleaningDay));

    await page.getByRole('button', { name: 'Add cleaning' }).click();
    const form = page.getByRole('form', { name: 'Add a cleaning' });
    await form.getByLabel('Cleaning date').fill(cleaningDay);
    await form.getByLabel('Cost (USD)').fill('150000');
    await form.getByRole('button', { name: 'Save cleaning' }).click();
    // the page says the figures are being recomputed, then refreshes itself when the work is done
    const progress = page.getByTestId('recompute-status').filter({ hasText: 'Recomputing' });
    await progress.waitFor({ timeout: 30_000 });
    await progress.waitFor({ state: 'detached', timeout: 180_000 });
    await expect.poll(() => page.getByTestId('trend-note').textContent(), { timeout: 30_000 }).toContain(`Trend since ${dayText(cleaningDay)}`);

    const since = page.getByTestId('since-cleaning');
    expect(await since.textContent()).toContain(dayText(cleaningDay));
    const sinceAfter = (await since.textContent()) ?? '';
    expect(dollars(sinceAfter)).toBeLessThan(dollars(sinceBefore));
    const api = await healthApi();
    expect(api.headline.lastCleaning.date).toBe(cleaningDay);
    expect(api.trend.startDay).toBe(cleaningDay);
    // the new cleaning is on the chart and in the events list
    expect(await page.getByTestId('chart-cleanliness').textContent()).toContain(
      `Cleaning ${new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' }).format(new Date(`${cleaningDay}T00:00:00Z`))}`,
    );
    expect(await page.getByTestId('events-strip').textContent()).toContain(dayText(cleaningDay));
  }, 240_000);
});
