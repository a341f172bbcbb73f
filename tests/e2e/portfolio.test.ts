/**
 * The portfolio in a real browser on the demo data: the consultant sees both client groups of the consultancy
 * with totals per group and for the organisation, sorts by a column (aria-sort follows) and filters by group;
 * a viewer limited to one client group sees only that group's units; a tablet-width page still reads.
 */
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { launchBrowser } from '../helpers/browser.js';
import { startTestServer } from '../helpers/test-server.js';

type Server = Awaited<ReturnType<typeof startTestServer>>;
interface PortfolioJson {
  units: { unitId: string; unitName: string; plantName: string; clientGroup: { name: string } | null; foulingCostPerDay: number | null }[];
  groups: { name: string }[];
}

const CONSULTANCY = 'Tidewater Performance Partners';
const CALDER = 'Calder Valley Energy';
const BRIGHTWATER = 'Brightwater Municipal Utility';

async function signIn(page: Page, server: Server, email: string) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL(`${server.url}/`);
}

async function switchOrganisation(page: Page, name: string) {
  if ((await page.getByTestId('active-organisation').textContent())?.includes(name)) return;
  await page.getByTestId('active-organisation').click();
  await page
    .getByRole('list', { name: 'Your organisations' })
    .getByRole('button', { name: new RegExp(name) })
    .click();
  await page.waitForURL(/\/$/);
  await expect.poll(() => page.getByTestId('active-organisation').textContent()).toContain(name);
}

const groupTotalTitles = (page: Page) => page.getByTestId('portfolio-totals-group').locator('h3').allTextContents();

describe('the portfolio in a browser (demo data)', () => {
  let server: Server;
  let browser: Browser;
  const contexts: BrowserContext[] = [];

  const newPage = async (email: string, width = 1280) => {
    const context = await browser.newContext({ viewport: { width, height: 900 } });
    contexts.push(context);
    const page = await context.newPage();
    await signIn(page, server, email);
    return page;
  };

  beforeAll(async () => {
    server = await startTestServer({ demoData: 'full' });
    browser = await launchBrowser();
  }, 300_000);
  afterAll(async () => {
    for (const c of contexts) await c.close();
    await browser?.close();
    await server?.close();
  });

  it('the consultant sees both client groups, their totals, and sorts and filters the units', async () => {
    const page = await newPage('consultant@tidewater.example');
    await switchOrganisation(page, CONSULTANCY);
    await page.getByRole('heading', { name: new RegExp(`Portfolio — ${CONSULTANCY}`) }).waitFor();
    const api = (await (await page.request.get(`${server.url}/api/portfolio`)).json()) as PortfolioJson;
    const rows = page.getByTestId('overview-unit');
    await expect.poll(() => rows.count()).toBe(api.units.length);
    expect(new Set(api.units.map((u) => u.clientGroup?.name))).toEqual(new Set([CALDER, BRIGHTWATER]));
    expect((await groupTotalTitles(page)).sort()).toEqual([BRIGHTWATER, CALDER]);
    const table = page.getByTestId('portfolio-table');
    expect(await table.textContent()).toContain(CALDER);
    expect(await table.textContent()).toContain(BRIGHTWATER);

    // sorting: the header is a button, aria-sort says the order, the rows follow it
    const costHeader = page.getByRole('columnheader', { name: /Fouling cost per day/ });
    await costHeader.getByRole('button').click();
    await expect.poll(() => costHeader.getAttribute('aria-sort')).toBe('descending');
    const byCost = [...api.units].filter((u) => u.foulingCostPerDay !== null).sort((a, b) => b.foulingCostPerDay! - a.foulingCostPerDay!);
    expect(await rows.first().getAttribute('data-unit-id')).toBe(byCost[0]?.unitId);
    await costHeader.getByRole('button').click();
    await expect.poll(() => costHeader.getAttribute('aria-sort')).toBe('ascending');
    expect(await page.getByRole('columnheader', { name: /Next outage/ }).getAttribute('aria-sort')).toBe('none');

    // filtering by client group keeps only that group's units
    await page.getByLabel('Client group').selectOption({ label: CALDER });
    const inCalder = api.units.filter((u) => u.clientGroup?.name === CALDER);
    await expect.poll(() => rows.count()).toBe(inCalder.length);
    expect(await table.textContent()).not.toContain(BRIGHTWATER);
    await page.getByRole('button', { name: 'Clear filters' }).click();
    await expect.poll(() => rows.count()).toBe(api.units.length);

    // each row leads to its unit
    const first = api.units[0]!;
    await page.locator(`[data-unit-id="${first.unitId}"]`).getByRole('link', { name: first.unitName, exact: true }).click();
    await page.waitForURL(`${server.url}/units/${first.unitId}`);
  });

  it('a viewer limited to one client group sees only that group’s units and totals', async () => {
    const page = await newPage('viewer@caldervalley.example');
    await page.getByRole('heading', { name: /^Portfolio/ }).waitFor();
    const api = (await (await page.request.get(`${server.url}/api/portfolio`)).json()) as PortfolioJson;
    expect(api.units.length).toBeGreaterThan(0);
    expect(api.units.every((u) => u.clientGroup?.name === CALDER)).toBe(true);
    const rows = page.getByTestId('overview-unit');
    await expect.poll(() => rows.count()).toBe(api.units.length);
    expect(await groupTotalTitles(page)).toEqual([CALDER]);
    const body = (await page.locator('main').textContent()) ?? (await page.locator('body').textContent()) ?? '';
    expect(body).not.toContain(BRIGHTWATER);
  });

  it('at tablet width the table scrolls inside its frame with the unit column in view, and the filters wrap', async () => {
    const page = await newPage('consultant@tidewater.example', 800);
    await switchOrganisation(page, CONSULTANCY);
    await page.getByTestId('portfolio-table').waitFor();
    // the page itself does not scroll sideways; the table does
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(800);
    const frame = page.getByTestId('portfolio-table');
    expect(await frame.evaluate((el) => el.scrollWidth > el.clientWidth)).toBe(true);
    await frame.evaluate((el) => el.scrollBy({ left: 400 }));
    const firstUnitLink = page.getByTestId('overview-unit').first().getByRole('link').first();
    const box = await firstUnitLink.boundingBox();
    expect(box && box.x >= 0 && box.x < 400).toBe(true);
    await page.screenshot({ path: '/tmp/portfolio-800.png', fullPage: true });
  });
});
