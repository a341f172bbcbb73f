import { readFileSync } from 'node:fs';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { OutageView } from '@shared/schemas/outages';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { launchBrowser } from '../helpers/browser.js';
import { startTestServer } from '../helpers/test-server.js';

type Server = Awaited<ReturnType<typeof startTestServer>>;

const OUTAGE = 'Harrow Creek spring outage 2026';
const CASE_TITLE = 'Unit 1: condenser cleaning plan for the next two years';
const PLANT = 'Harrow Creek Station';

/** "$412,000" → 412000; NaN when the text holds no dollar figure. */
const dollars = (text: string | null) => Number(/\$([\d,]+)/.exec(text ?? '')?.[1]?.replace(/,/g, '') ?? Number.NaN);

describe('an outage from candidate work to approved scope and report, in a real browser (full demo data)', () => {
  let server: Server;
  let browser: Browser;
  const contexts: BrowserContext[] = [];
  let approver: Page;
  let unitId: string;
  let outageId: string;

  const signedIn = async (email: string, width = 1280): Promise<Page> => {
    const context = await browser.newContext({ viewport: { width, height: 900 }, acceptDownloads: true });
    contexts.push(context);
    const page = await context.newPage();
    await page.goto(`${server.url}/sign-in`);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL(`${server.url}/`);
    return page;
  };
  const outageNow = async (page: Page) => (await (await page.request.get(`${server.url}/api/outages/${outageId}`)).json()) as OutageView;

  beforeAll(async () => {
    server = await startTestServer({ demoData: 'full' });
    browser = await launchBrowser();
    approver = await signedIn('approver@northmere.example');
    const plants = (await (await approver.request.get(`${server.url}/api/plants`)).json()) as {
      plants: { name: string; units: { id: string; name: string }[] }[];
    };
    unitId = plants.plants.find((p) => p.name === PLANT)!.units.find((u) => u.name === 'Unit 1')!.id;
  }, 300_000);

  afterAll(async () => {
    for (const c of contexts) await c.close();
    await browser?.close();
    await server?.close();
  });

  it('the approver goes from the overview to the unit’s approved case, then to Outages', async () => {
    await approver.getByRole('heading', { level: 1 }).first().waitFor();
    await approver.locator(`main a[href="/units/${unitId}"]`).first().click();
    await approver.waitForURL(`${server.url}/units/${unitId}`);
    await approver.getByRole('navigation', { name: 'Unit' }).getByRole('link', { name: 'Cases' }).click();
    await approver.getByRole('link', { name: CASE_TITLE }).click();
    await approver.getByRole('heading', { name: CASE_TITLE }).waitFor();
    expect(await approver.getByTestId('case-status').textContent()).toBe('Approved');
    await approver.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Outages' }).click();
    await approver.getByRole('heading', { name: 'Outages', level: 1 }).waitFor();
  }, 60_000);

  it('the new-outage form refuses an empty submit beside each field, focuses the first, and asks before unsaved changes are dropped', async () => {
    await approver.getByRole('button', { name: 'New outage' }).click();
    const form = approver.getByRole('form', { name: 'New outage' });
    await form.getByRole('heading', { name: 'New outage' }).waitFor();
    await form.getByRole('button', { name: 'Create outage' }).click();
    await form
      .getByTestId('form-problems')
      .getByText(/fields need attention/)
      .waitFor();
    // every refused field says why beside itself, and focus lands on the first
    await form.getByText('Give the outage a name').waitFor();
    await form.getByText('Choose the units the outage takes off line').or(form.getByText('Choose at least one unit')).waitFor();
    await form.getByText('Enter the first day, e.g. 6 Apr 2026').waitFor();
    expect(await approver.evaluate(() => document.activeElement?.getAttribute('name'))).toBe('name');

    await form.getByLabel('Name').fill(OUTAGE);
    await approver.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Cases' }).click();
    const ask = approver.getByRole('alertdialog', { name: 'Leave without saving?' });
    await ask.waitFor();
    await ask.getByRole('button', { name: 'Stay and keep editing' }).click();
    expect(approver.url()).toBe(`${server.url}/outages`);
    expect(await form.getByLabel('Name').inputValue()).toBe(OUTAGE);
    // closed and opened again, the form starts clean
    await form.getByRole('button', { name: 'Cancel' }).click();
    await form.waitFor({ state: 'detached' });
    await approver.getByRole('button', { name: 'New outage' }).click();
    await approver.getByRole('form', { name: 'New outage' }).getByRole('heading', { name: 'New outage' }).waitFor();
  }, 60_000);

  it('the approver creates the outage on Unit 1 with a window in the app’s day format and a budget in the units’ currency', async () => {
    const form = approver.getByRole('form', { name: 'New outage' });
    await form.getByLabel('Name').fill(OUTAGE);
    await form.getByRole('group', { name: PLANT }).getByRole('checkbox', { name: 'Unit 1' }).check();
    await form.getByText('In USD, the units’ currency').waitFor();
    await form.getByLabel('First day').fill('6 Apr 2026');
    await form.getByLabel('Last day').fill('26 Apr 2026');
    await form.getByText('A window of 21 days, both ends inside').waitFor();
    await form.getByLabel('Budget').fill('250000');
    await form.getByRole('button', { name: 'Create outage' }).click();
    await approver.waitForURL(/\/outages\/[0-9a-f-]{36}$/, { timeout: 30_000 });
    outageId = approver.url().split('/').pop()!;
    await approver.getByRole('heading', { name: OUTAGE, level: 1 }).waitFor();
    expect(await approver.getByTestId('outage-window').textContent()).toBe('6 Apr 2026 – 26 Apr 2026 (21 days)');
    const saved = await outageNow(approver);
    expect([saved.startDate, saved.endDate, saved.budget, saved.currency]).toEqual(['2026-04-06', '2026-04-26', 250000, 'USD']);
  }, 60_000);

  it('adds the approved case’s cleaning and two pieces of work entered by hand, one priced from a cleanliness recovered', async () => {
    await approver.getByRole('button', { name: 'Add work' }).click();
    const form = approver.getByTestId('outage-item-form');
    await form.getByRole('heading', { name: 'Add work' }).waitFor();
    // a case's cleaning: picked from the unit's approved cases, its benefit from the case
    await form.getByLabel('Kind of work').selectOption({ label: 'Cleaning from an approved case' });
    await form.getByLabel('Approved case').selectOption({ label: CASE_TITLE });
    await form.getByLabel('Crew lane').fill('Waterbox crew');
    await form.getByRole('button', { name: 'Add work', exact: true }).click();
    await expect.poll(() => approver.getByTestId('outage-item-row').count(), { timeout: 20_000 }).toBe(1);
    // the form says what was added and starts again on the same unit and lane
    await form.getByText('Added: The case’s cleaning.').waitFor();

    // work by hand with a benefit as money; an empty title is refused beside the field first
    await form.getByLabel('Kind of work').selectOption({ label: 'Tube plugging' });
    await form.getByLabel('Cost').fill('30000');
    await form.getByLabel('Duration').fill('3');
    await form.getByRole('textbox', { name: /^Benefit/ }).fill('60000');
    await form.getByRole('button', { name: 'Add work', exact: true }).click();
    await form.getByText('Give the work a title').waitFor();
    expect(await approver.evaluate(() => document.activeElement?.getAttribute('aria-invalid'))).toBe('true');
    await form.getByLabel('Title').fill('Plug leaking tubes, north waterbox');
    await form.getByRole('button', { name: 'Add work', exact: true }).click();
    await expect.poll(() => approver.getByTestId('outage-item-row').count(), { timeout: 20_000 }).toBe(2);
    await form.getByText('Added: Plug leaking tubes, north waterbox.').waitFor();

    // work by hand whose benefit the product prices from the cleanliness it recovers
    await form.getByLabel('Kind of work').selectOption({ label: 'Air in-leakage repair' });
    await form.getByLabel('Title').fill('Reseal the turbine gland and exhaust joint');
    await form.getByLabel('Cost').fill('45000');
    await form.getByLabel('Duration').fill('5');
    await form.getByLabel('Crew lane').fill('Mechanical crew');
    await form.getByLabel('As cleanliness recovered, priced with the unit’s model').check();
    await form.getByRole('textbox', { name: /^Cleanliness recovered/ }).fill('3');
    await form.getByLabel('Horizon').fill('365');
    await form.getByRole('button', { name: 'Add work', exact: true }).click();
    await expect.poll(() => approver.getByTestId('outage-item-row').count(), { timeout: 20_000 }).toBe(3);

    const saved = await outageNow(approver);
    expect(saved.items.map((i) => [i.kind, i.pricing.method])).toEqual([
      ['case-cleaning', 'case'],
      ['tube-plugging', 'entered'],
      ['air-in-leakage-repair', 'cleanliness'],
    ]);
    expect(saved.items.find((i) => i.kind === 'air-in-leakage-repair')?.benefitEntered).toEqual({ cleanlinessRecovered: 0.03, horizonDays: 365 });
    // the table shows each item's benefit and the sentence saying how it was priced
    for (const item of saved.items) {
      const row = approver.getByTestId('outage-item-row').filter({ hasText: item.title });
      await row.getByText(item.pricing.text).waitFor();
    }
    // the cautions for the work listed are on the page, deferring to codes, the maker and licensed practice
    const cautions = approver.getByTestId('outage-cautions');
    await cautions.getByText(/confined space/).waitFor();
    await cautions.getByText(/Lock out and tag out/).waitFor();
    await cautions.getByText(/High-pressure water/).waitFor();
    await cautions.getByText(/local codes/).waitFor();
  }, 120_000);

  it('proposes a scope: every item has its reason sentence, the totals match the server’s and fit the budget and window', async () => {
    await approver.getByRole('button', { name: 'Propose a scope' }).click();
    await expect.poll(() => approver.getByTestId('outage-reason').count(), { timeout: 30_000 }).toBe(3);
    const saved = await outageNow(approver);
    const proposal = saved.proposal!;
    expect(proposal).not.toBeNull();
    for (const item of saved.items) {
      const reason = proposal.reasons[item.id];
      expect(reason, `a reason for ${item.title}`).toBeTruthy();
      await approver.getByTestId('outage-reason').filter({ hasText: item.title }).getByText(reason!).waitFor();
    }
    expect(await approver.getByTestId('outage-chosen').getByTestId('outage-reason').count()).toBe(proposal.selectedItemIds.length);
    expect(dollars(await approver.getByTestId('outage-total-benefit').textContent())).toBe(Math.round(proposal.totalBenefit));
    expect(dollars(await approver.getByTestId('outage-total-cost').textContent())).toBe(Math.round(proposal.totalCost));
    expect(proposal.totalCost).toBeLessThanOrEqual(250000);
    expect(Math.max(...Object.values(proposal.laneDays))).toBeLessThanOrEqual(21);
    // the lanes as a drawing and, for keyboard and screen-reader users, as a table of the same placing
    const chart = approver.getByTestId('outage-lane-chart');
    await chart.locator('svg').waitFor();
    await chart.getByRole('button', { name: 'Show as a table' }).click();
    expect(await chart.getByTestId('chart-table').locator('tbody tr').count()).toBe(proposal.selectedItemIds.length);

    await approver.screenshot({ path: '/tmp/outage-1280.png', fullPage: true });
    await approver.screenshot({ path: '/tmp/outage-1280-top.png', clip: { x: 0, y: 0, width: 1280, height: 1300 } });
  }, 60_000);

  it('saves the proposal as a named scope and sees it in the comparison', async () => {
    await approver.getByLabel('Name for this scope').fill('Everything proposed');
    await approver.getByRole('button', { name: 'Save the proposal' }).click();
    const comparison = approver.getByTestId('outage-scope-comparison');
    await comparison.getByRole('columnheader', { name: /Everything proposed/ }).waitFor({ timeout: 20_000 });
    const saved = await outageNow(approver);
    expect(saved.scopes.map((s) => s.name)).toEqual(['Everything proposed']);
    expect(saved.scopes[0]!.itemIds.sort()).toEqual([...saved.proposal!.selectedItemIds].sort());
  }, 60_000);

  it('at tablet width the page reads without sideways scrolling of the page itself', async () => {
    const tablet = await signedIn('approver@northmere.example', 800);
    await tablet.goto(`${server.url}/outages/${outageId}`);
    await tablet.getByRole('heading', { name: OUTAGE, level: 1 }).waitFor();
    await tablet.getByTestId('outage-lane-chart').locator('svg').waitFor();
    await tablet.screenshot({ path: '/tmp/outage-800.png', fullPage: true });
    // nothing reaches past the right edge: wide tables scroll inside their own box
    const wide = await tablet.evaluate(() =>
      [...document.querySelectorAll('body *')]
        .filter((e) => e.getBoundingClientRect().right > 801 && !e.parentElement?.closest('.overflow-x-auto, .overflow-auto'))
        .map((e) => `${e.tagName}.${String(e.className).slice(0, 60)} right=${Math.round(e.getBoundingClientRect().right)}`)
        .slice(0, 8),
    );
    expect(wide).toEqual([]);
    expect(await tablet.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(800);
    await tablet.screenshot({ path: '/tmp/outage-800-top.png', clip: { x: 0, y: 0, width: 800, height: 1400 } });
    await tablet.goto(`${server.url}/outages`);
    await tablet.getByRole('heading', { name: 'Outages', level: 1 }).waitFor();
    await tablet.getByRole('button', { name: 'New outage' }).click();
    await tablet.getByRole('form', { name: 'New outage' }).waitFor();
    await tablet.screenshot({ path: '/tmp/outages-800-form.png', fullPage: true });
  }, 60_000);

  it('approves the proposed scope, then downloads the PDF report and opens the printable page', async () => {
    await approver.getByRole('button', { name: 'Approve the proposed scope' }).click();
    await expect.poll(() => approver.getByTestId('outage-status').first().textContent(), { timeout: 20_000 }).toBe('Scope approved');
    const saved = await outageNow(approver);
    expect(saved.status).toBe('approved');
    expect(saved.approvedBy?.name).toBe('Tomasz Wierzbicki');
    expect(saved.approved?.selectedItemIds.sort()).toEqual([...saved.proposal!.selectedItemIds].sort());
    // frozen: no planning controls remain
    expect(await approver.getByRole('button', { name: 'Add work' }).count()).toBe(0);
    expect(await approver.getByRole('button', { name: /Propose/ }).count()).toBe(0);

    const download = approver.waitForEvent('download');
    await approver.getByRole('link', { name: 'Report (PDF)' }).click();
    const file = await (await download).path();
    expect(readFileSync(file).subarray(0, 5).toString('latin1')).toBe('%PDF-');

    await approver.getByRole('link', { name: 'Printable page' }).click();
    await approver.waitForURL(`${server.url}/outages/${outageId}/print`);
    // the printable page's code loads on first visit: wait for its heading before reading it
    await approver.getByRole('heading', { name: OUTAGE, level: 1 }).waitFor({ timeout: 60_000 });
    await approver.getByTestId('outage-print').waitFor();
    await approver
      .getByTestId('outage-print-cautions')
      .getByText(/local codes/)
      .waitFor();
    expect(await approver.getByTestId('outage-print-summary').textContent()).toContain(`of 3 items chosen`);
    await approver.screenshot({ path: '/tmp/outage-print.png', fullPage: true });
    await approver.goto(`${server.url}/outages`);
    await approver.getByRole('link', { name: OUTAGE }).waitFor();
    await approver.screenshot({ path: '/tmp/outages-list.png', fullPage: true });
  }, 60_000);

  it('a viewer sees the approved outage and its report, and no planning controls', async () => {
    const viewer = await signedIn('viewer@northmere.example');
    await viewer.goto(`${server.url}/outages`);
    await viewer.getByRole('heading', { name: 'Outages', level: 1 }).waitFor();
    await viewer.getByRole('link', { name: OUTAGE }).waitFor();
    expect(await viewer.getByRole('button', { name: 'New outage' }).count()).toBe(0);
    await viewer.getByText('Only administrators, analysts and approvers plan outages.').waitFor();
    await viewer.getByRole('link', { name: OUTAGE }).click();
    await viewer.getByRole('heading', { name: OUTAGE, level: 1 }).waitFor();
    await viewer.getByTestId('outage-reason').first().waitFor();
    // the only control in the page is the chart's table switch: nothing to type into, choose, propose or approve
    const controls = viewer.locator('main').locator('button, input, select, textarea');
    const names = await Promise.all((await controls.all()).map(async (c) => (await c.textContent())?.trim() ?? ''));
    expect(names).toEqual(['Show as a table']);
    await viewer.getByRole('link', { name: 'Report (PDF)' }).waitFor();
    await viewer.screenshot({ path: '/tmp/outage-viewer.png', fullPage: true });
  }, 60_000);
});
