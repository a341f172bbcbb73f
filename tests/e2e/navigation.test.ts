import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { launchBrowser } from '../helpers/browser.js';
import { startTestServer } from '../helpers/test-server.js';

type Server = Awaited<ReturnType<typeof startTestServer>>;
interface PlantJson {
  id: string;
  name: string;
  timeZone: string;
  units: { id: string; name: string }[];
}

const PLANT = 'Harrow Creek Station';

async function signIn(page: Page, server: Server, email: string) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL(`${server.url}/`);
}

describe('finding one’s way: plant page, one data tab, page names, form problems and the person’s menu (full demo data)', () => {
  let server: Server;
  let browser: Browser;
  const contexts: BrowserContext[] = [];
  let page: Page;
  let plants: PlantJson[];
  let plant: PlantJson;
  let unitId: string;

  const newPage = async (width: number, email = 'analyst@northmere.example') => {
    const context = await browser.newContext({ viewport: { width, height: 900 } });
    contexts.push(context);
    const p = await context.newPage();
    await signIn(p, server, email);
    return p;
  };

  beforeAll(async () => {
    server = await startTestServer({ demoData: 'full' });
    browser = await launchBrowser();
    page = await newPage(1280);
    plants = ((await (await page.request.get(`${server.url}/api/plants`)).json()) as { plants: PlantJson[] }).plants;
    plant = plants.find((p) => p.name === PLANT)!;
    unitId = plant.units.find((u) => u.name === 'Unit 1')!.id;
  }, 300_000);

  afterAll(async () => {
    for (const c of contexts) await c.close();
    await browser?.close();
    await server?.close();
  });

  it('the overview shows every unit’s cleanliness, fouling cost per day and data age, as its health figures say', async () => {
    await page.goto(`${server.url}/`);
    const cards = page.getByTestId('overview-unit');
    const unitCount = plants.reduce((n, p) => n + p.units.length, 0);
    await expect.poll(() => cards.count()).toBe(unitCount);
    await expect.poll(() => page.getByTestId('unit-data-age').count()).toBe(unitCount);
    const card = cards.filter({ hasText: PLANT }).filter({ has: page.getByRole('link', { name: 'Unit 1', exact: true }) });
    const health = (await (await page.request.get(`${server.url}/api/units/${unitId}/health`)).json()) as {
      headline: { cleanliness: number; foulingCostPerDay: number };
    };
    expect(await card.getByTestId('unit-cleanliness').textContent()).toBe(`${(health.headline.cleanliness * 100).toFixed(1)} %`);
    const cost = (await card.getByTestId('unit-cost-per-day').innerText()) ?? '';
    expect(Number(/\$([\d,]+)/.exec(cost)?.[1]?.replace(/,/g, ''))).toBe(Math.round(Math.abs(health.headline.foulingCostPerDay)));
    // the demo's data ends on its own fixed day, long before the machine's clock: its age reads in days
    expect(await card.getByTestId('unit-data-age').textContent()).toMatch(/^[\d,]+ days? old$/);
    await page.screenshot({ path: '/tmp/nav-overview-1280.png', fullPage: true });
  });

  it('the plant list keeps a direct link to each unit and leads to the plant page, which shows its units’ condition and its time zone', async () => {
    await page.goto(`${server.url}/plants`);
    const card = page.getByRole('article', { name: PLANT });
    await card.waitFor();
    expect(await card.getByRole('link', { name: 'Unit 1', exact: true }).getAttribute('href')).toBe(`/units/${unitId}`);
    await card.getByRole('link', { name: PLANT }).click();
    await page.waitForURL(`${server.url}/plants/${plant.id}`);
    await page.getByRole('heading', { name: PLANT, level: 1 }).waitFor();
    expect(await page.getByTestId('plant-time-zone').textContent()).toContain(plant.timeZone.replace(/_/g, ' '));
    const rows = page.getByTestId('plant-unit-row');
    await expect.poll(() => rows.count()).toBe(plant.units.length);
    await expect.poll(() => page.getByTestId('unit-cost-per-day').count()).toBe(plant.units.length);
    expect(await rows.first().getByTestId('unit-cleanliness').textContent()).toMatch(/^\d+\.\d %/);
    await page.screenshot({ path: '/tmp/nav-plant-1280.png', fullPage: true });
    await rows.getByRole('link', { name: 'Unit 1', exact: true }).click();
    await page.waitForURL(`${server.url}/units/${unitId}`);
    // the unit's place leads back to its plant
    await page.getByRole('link', { name: PLANT, exact: true }).click();
    await page.waitForURL(`${server.url}/plants/${plant.id}`);
  });

  it('a unit has one data tab with the upload and the history together; the old upload and history addresses lead there', async () => {
    await page.goto(`${server.url}/units/${unitId}`);
    const tabs = page.getByRole('navigation', { name: 'Unit' });
    await tabs.waitFor();
    expect(await tabs.getByRole('link', { name: 'Import', exact: true }).count()).toBe(0);
    expect(await tabs.getByRole('link', { name: 'Imports', exact: true }).count()).toBe(0);
    expect(await tabs.getByRole('link', { name: 'Cases', exact: true }).count()).toBe(1);
    await tabs.getByRole('link', { name: 'Data files' }).click();
    await page.waitForURL(`${server.url}/units/${unitId}/data`);
    await page.getByTestId('import-row').first().waitFor();
    expect(await page.getByRole('form', { name: 'Choose a file' }).count()).toBe(1);
    await page.screenshot({ path: '/tmp/nav-data-1280.png', fullPage: true });

    await page.goto(`${server.url}/units/${unitId}/imports`);
    await page.waitForURL(`${server.url}/units/${unitId}/data`);
    await page.goto(`${server.url}/units/${unitId}/import?import=00000000-0000-4000-8000-000000000000`);
    await page.waitForURL(`${server.url}/units/${unitId}/data?import=00000000-0000-4000-8000-000000000000`);
  });

  it('each page names itself in the browser tab', async () => {
    await page.goto(`${server.url}/plants`);
    await page.getByRole('heading', { name: 'Plants and units' }).waitFor();
    expect(await page.title()).toBe('Plants · Cleancase');
    await page.goto(`${server.url}/plants/${plant.id}`);
    await page.getByRole('heading', { name: PLANT, level: 1 }).waitFor();
    await expect.poll(() => page.title()).toBe(`${PLANT} · Cleancase`);
    await page.goto(`${server.url}/units/${unitId}/setup`);
    await expect.poll(() => page.title()).toBe(`Setup — Unit 1, ${PLANT} · Cleancase`);
    await page.getByRole('navigation', { name: 'Unit' }).getByRole('link', { name: 'Data files' }).click();
    await expect.poll(() => page.title()).toBe(`Data files — Unit 1, ${PLANT} · Cleancase`);
    await page.goto(`${server.url}/settings/members`);
    await expect.poll(() => page.title()).toBe('Members · Cleancase');
  });

  it('“New plant” is a button; the form it opens marks its required field, says a refused submit aloud and puts focus on the first problem', async () => {
    await page.goto(`${server.url}/plants`);
    await page.getByRole('button', { name: 'New plant' }).waitFor();
    expect(await page.getByRole('form', { name: 'New plant' }).count()).toBe(0);
    await page.getByRole('button', { name: 'New plant' }).click();
    const form = page.getByRole('form', { name: 'New plant' });
    await form.waitFor();
    const name = form.getByLabel('Plant name');
    expect(await name.getAttribute('aria-required')).toBe('true');
    // focus away from the name first, so landing on it is the form's doing
    await form.getByLabel('Search time zone').focus();
    await form.getByRole('button', { name: 'Create plant' }).click();
    await expect.poll(() => form.getByRole('alert').textContent()).toContain('needs attention');
    expect(await name.getAttribute('aria-invalid')).toBe('true');
    expect(await name.evaluate((el) => el === document.activeElement)).toBe(true);
    await page.screenshot({ path: '/tmp/nav-new-plant-error-1280.png', fullPage: true });
    await form.getByRole('button', { name: 'Cancel' }).click();
    expect(await page.getByRole('form', { name: 'New plant' }).count()).toBe(0);
  });

  it('leaving a form with changes not saved asks first; staying keeps them, leaving drops them', async () => {
    await page.goto(`${server.url}/plants`);
    await page.getByRole('button', { name: 'New plant' }).click();
    const form = page.getByRole('form', { name: 'New plant' });
    await form.getByLabel('Plant name').fill('Quarry Bend Station');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Cases' }).click();
    const dialog = page.getByRole('alertdialog', { name: 'Leave without saving?' });
    await dialog.waitFor();
    await page.screenshot({ path: '/tmp/nav-unsaved-1280.png' });
    expect(page.url()).toBe(`${server.url}/plants`);
    await dialog.getByRole('button', { name: 'Stay and keep editing' }).click();
    expect(await form.getByLabel('Plant name').inputValue()).toBe('Quarry Bend Station');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Cases' }).click();
    await dialog.getByRole('button', { name: 'Leave and drop changes' }).click();
    await page.waitForURL(`${server.url}/cases`);
  });

  it('the local mailbox is not in the main navigation but in the person’s own menu', async () => {
    await page.goto(`${server.url}/`);
    const main = page.getByRole('navigation', { name: 'Main' });
    await main.waitFor();
    expect(await main.getByRole('link', { name: /mailbox/i }).count()).toBe(0);
    await page.getByRole('banner').getByRole('button', { name: 'Priya Ramanathan' }).click();
    await page.screenshot({ path: '/tmp/nav-person-menu-1280.png' });
    await page.getByRole('link', { name: 'Local mailbox' }).click();
    await page.waitForURL(`${server.url}/mailbox`);
    await page.getByRole('heading', { name: 'Local mailbox' }).waitFor();
  });

  it('the person’s menu is worked with the arrow keys: down opens it at its first entry, up and down move, Escape closes', async () => {
    await page.goto(`${server.url}/`);
    const button = page.getByRole('banner').getByRole('button', { name: 'Priya Ramanathan' });
    await button.focus();
    await page.keyboard.press('ArrowDown');
    await page.getByRole('link', { name: 'Your profile' }).waitFor();
    const focused = () => page.evaluate(() => document.activeElement?.textContent?.trim());
    await expect.poll(focused).toBe('Your profile');
    await page.keyboard.press('ArrowDown');
    expect(await focused()).toBe('Local mailbox');
    await page.keyboard.press('End');
    expect(await focused()).toBe('Sign out');
    await page.keyboard.press('ArrowDown');
    expect(await focused()).toBe('Your profile');
    await page.keyboard.press('ArrowUp');
    expect(await focused()).toBe('Sign out');
    await page.keyboard.press('Escape');
    expect(await page.getByRole('link', { name: 'Your profile' }).count()).toBe(0);
    expect(await focused()).toBe('Priya Ramanathan▾');
  });

  it('every chart of the unit opens as a table from the keyboard, one row per day or month drawn', async () => {
    await page.goto(`${server.url}/units/${unitId}`);
    const chart = page.getByTestId('chart-cleanliness');
    await chart.waitFor();
    const toggle = chart.getByRole('button', { name: 'Show as a table' });
    await toggle.focus();
    await page.keyboard.press('Enter');
    const table = chart.getByTestId('chart-table');
    await table.waitFor();
    const points = Number(await chart.getAttribute('data-points'));
    // one row per day drawn, then the forecast's days
    expect(await table.locator('tbody tr').count()).toBeGreaterThanOrEqual(points);
    expect(await table.locator('tbody tr').first().textContent()).toMatch(/\d+\.\d %/);
    expect(await chart.getByRole('button', { name: 'Hide the table' }).getAttribute('aria-expanded')).toBe('true');
    const breakdown = page.getByTestId('chart-breakdown');
    await breakdown.getByRole('button', { name: 'Show as a table' }).click();
    expect(await breakdown.getByTestId('chart-table').locator('tbody tr').count()).toBe(Number(await breakdown.getAttribute('data-points')));
    // the backpressure and fouling-cost charts: one row per day drawn
    for (const id of ['chart-backpressure', 'chart-cost']) {
      const other = page.getByTestId(id);
      await other.getByRole('button', { name: 'Show as a table' }).click();
      expect(await other.getByTestId('chart-table').locator('tbody tr').count(), id).toBe(Number(await other.getAttribute('data-points')));
    }
    expect(await page.getByTestId('chart-cost').getByTestId('chart-table').locator('tbody tr').first().textContent()).toMatch(/\$[\d,]+/);
    await page.screenshot({ path: '/tmp/nav-chart-table-1280.png', fullPage: true });
  });

  it('at tablet width the plant page, the data tab and the overview still read (screenshots)', async () => {
    const tablet = await newPage(800);
    await tablet.goto(`${server.url}/plants/${plant.id}`);
    await tablet.getByTestId('unit-data-age').first().waitFor();
    await tablet.screenshot({ path: '/tmp/nav-plant-800.png', fullPage: true });
    await tablet.goto(`${server.url}/units/${unitId}/data`);
    await tablet.getByTestId('import-row').first().waitFor();
    await tablet.screenshot({ path: '/tmp/nav-data-800.png', fullPage: true });
    await tablet.goto(`${server.url}/`);
    await tablet.getByTestId('unit-data-age').first().waitFor();
    await tablet.screenshot({ path: '/tmp/nav-overview-800.png', fullPage: true });
    await tablet.goto(`${server.url}/plants`);
    await tablet.getByRole('button', { name: 'New plant' }).waitFor();
    await tablet.screenshot({ path: '/tmp/nav-plants-800.png', fullPage: true });
    expect(await tablet.getByRole('navigation', { name: 'Main' }).isVisible()).toBe(true);
    // the members table fits a tablet without scrolling sideways (its page is the administrator's)
    const adminTablet = await newPage(800, 'admin@northmere.example');
    await adminTablet.goto(`${server.url}/settings/members`);
    const members = adminTablet.getByRole('table').first();
    await members
      .getByRole('button', { name: /^Change access of / })
      .first()
      .waitFor();
    const fits = await members.evaluate((table) => table.parentElement!.scrollWidth <= table.parentElement!.clientWidth + 1);
    await adminTablet.screenshot({ path: '/tmp/nav-members-800.png', fullPage: true });
    expect(fits).toBe(true);
  });
});
