import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { backpressureAtCleanlinessKpa, cwRiseK, type CondenserGeometry } from '../../shared/domain/condenser/index.js';
import { liquidDensityKgM3 } from '../../shared/domain/steam/index.js';
import { CO2_KG_PER_MMBTU } from '../../shared/domain/turbine/emission-factors.js';
import { cToF, deltaKToF, fToC, ftToM, gpmToM3s, inHgToKpa, kpaToInHg, KPA_PER_INHG } from '../../shared/units.js';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { launchBrowser } from '../helpers/browser.js';
import { startTestServer } from '../helpers/test-server.js';

type Server = Awaited<ReturnType<typeof startTestServer>>;

/** The condenser the analyst types in (US units), the same one the CSV rows are made from. */
const TUBES = 22_000;
const OD_IN = 1.0;
const LENGTH_FT = 44.95;
const DESIGN_FLOW_GPM = 164_800;
const geometry: CondenserGeometry = {
  surfaceM2: TUBES * Math.PI * (OD_IN * 0.0254) * ftToM(LENGTH_FT),
  tubeCount: TUBES,
  passes: 2,
  tubeOdMm: OD_IN * 25.4,
  tubeBwg: 22,
  tubeMaterial: 'titanium',
};
const PLUGGED = 140;
const ROWS = 72;
const BAD_RISE_ROW = 30;

const HEADER = 'Timestamp,Gross MW,BP inHgA,CW In °F,CW Out °F,CW Flow gpm';

/**
 * Three days of hourly rows in US units, made physical by the project's condenser model: for each hour
 * the CW rise follows from the duty (Q = W·cp·ΔT) and the backpressure from the model at CF 0.8.
 * Row BAD_RISE_ROW has its outlet below the inlet, a point the import must store but leave out.
 */
function historianCsv(options: { textInNumberAtRow?: number } = {}): string {
  const lines = [HEADER];
  const start = Date.UTC(2025, 5, 2, 5); // 2025-06-02 00:00 in Chicago (CDT, UTC−5)
  for (let i = 0; i < ROWS; i++) {
    const loadMw = 480 + 2 * Math.sin(i / 5);
    const cwInletC = fToC(72 + 4 * Math.sin((2 * Math.PI * i) / 24));
    const cwFlowM3s = gpmToM3s(DESIGN_FLOW_GPM);
    const dutyMw = 1.15 * loadMw;
    const riseK = cwRiseK(cwInletC, liquidDensityKgM3(cwInletC) * cwFlowM3s, dutyMw);
    const bpKpa = backpressureAtCleanlinessKpa({ geometry, cwInletC, cwFlowM3s, dutyMw, pluggedTubes: PLUGGED, cleanliness: 0.8 });
    const inletF = cToF(cwInletC);
    const outletF = i === BAD_RISE_ROW ? inletF - 0.3 : inletF + deltaKToF(riseK);
    const local = new Date(start + i * 3_600_000 - 5 * 3_600_000).toISOString().slice(0, 19);
    const load = i === options.textInNumberAtRow ? '48o.2' : loadMw.toFixed(1);
    lines.push([`${local}-05:00`, load, kpaToInHg(bpKpa).toFixed(3), inletF.toFixed(2), outletF.toFixed(2), DESIGN_FLOW_GPM.toFixed(0)].join(','));
  }
  return `${lines.join('\n')}\n`;
}

async function signIn(page: Page, server: Server, email: string) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL(`${server.url}/`);
}

const field = (scope: Locator, name: string) => scope.getByLabel(name, { exact: true });

describe('unit setup, import and undo in a real browser', () => {
  let server: Server;
  let browser: Browser;
  let page: Page;
  let unitId: string;
  const contexts: BrowserContext[] = [];
  const unitJson = async () => (await page.request.get(`${server.url}/api/units/${unitId}`)).json();

  beforeAll(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    contexts.push(context);
    page = await context.newPage();
    await signIn(page, server, 'analyst@northmere.example');
  });
  afterAll(async () => {
    for (const c of contexts) await c.close();
    await browser?.close();
    await server?.close();
  });

  it('the analyst creates a plant in its own time zone and adds a unit from the Plants page', async () => {
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Plants' }).click();
    await page.waitForURL('**/plants');
    await page.getByRole('button', { name: 'New plant' }).click();
    const form = page.getByRole('form', { name: 'New plant' });
    await form.getByLabel('Plant name').fill('Larchmoor Station');
    await form.getByLabel('Search time zone').fill('Chicago');
    await expect.poll(() => form.getByLabel('Time zone', { exact: true }).inputValue()).toBe('America/Chicago');
    await form.getByRole('button', { name: 'Create plant' }).click();

    const card = page.getByRole('article', { name: 'Larchmoor Station' });
    await card.waitFor();
    expect(await card.textContent()).toContain('America/Chicago');
    await card.getByLabel('New unit').fill('Unit 1');
    await card.getByRole('button', { name: 'Add unit' }).click();
    const row = card.getByTestId('unit-row').filter({ hasText: 'Unit 1' });
    await row.waitFor();
    expect(await row.textContent()).toContain('Needs setup');
    await page.screenshot({ path: '/tmp/plants.png', fullPage: true });
    await row.getByRole('link', { name: 'Unit 1' }).click();
    await page.waitForURL(/\/units\/[0-9a-f-]{36}$/);
    unitId = page.url().split('/units/')[1]!;
    await expect.poll(() => page.getByTestId('setup-missing').textContent()).toContain('the condenser');
  });

  it('an empty condenser form shows each problem beside its field and sends nothing', async () => {
    await page.getByRole('navigation', { name: 'Unit' }).getByRole('link', { name: 'Setup' }).click();
    const condenser = page.getByRole('form', { name: 'Condenser' });
    await condenser.getByRole('button', { name: 'Save condenser' }).click();
    await expect.poll(() => field(condenser, 'Tube count').getAttribute('aria-invalid')).toBe('true');
    expect(await condenser.textContent()).toContain('Enter the tube count');
    expect((await unitJson()).condenser).toBeNull();
  });

  it('saves the condenser typed in US units; the server holds SI and the surface is N·π·OD·L', async () => {
    const condenser = page.getByRole('form', { name: 'Condenser' });
    await field(condenser, 'Passes').fill('2');
    await field(condenser, 'Tube count').fill('22,000');
    await field(condenser, 'Tube outside diameter (in)').fill('1.000');
    await condenser.getByLabel('Wall gauge (BWG)').selectOption('22');
    await condenser.getByLabel('Tube material').selectOption('titanium');
    await field(condenser, 'Effective tube length (ft)').fill(String(LENGTH_FT));
    await condenser.getByRole('button', { name: /Compute from tube count/ }).click();
    // closed form: 22,000 × π × (1/12 ft) × 44.95 ft = 258,893.4 ft², filled in to six significant digits, grouped
    await expect.poll(() => field(condenser, 'Outside surface (HEI basis) (ft²)').inputValue()).toBe('258\u202f893');
    expect(await condenser.textContent()).toContain('An inside area would overstate U and the cleanliness factor by OD/dᵢ');
    await field(condenser, 'CW flow (gpm)').fill('164,800');
    await field(condenser, 'CW inlet temperature (°F)').fill('75');
    await field(condenser, 'Condenser duty (MW)').fill('598');
    await field(condenser, 'Backpressure (inHgA)').fill('2.5');
    await field(condenser, 'Cleanliness (%)').fill('90');
    await field(condenser, 'Plugged tubes now').fill(String(PLUGGED));
    await condenser.getByRole('button', { name: 'Save condenser' }).click();
    await expect.poll(() => condenser.getByRole('status').filter({ hasText: 'Condenser saved' }).count()).toBe(1);
    await page.getByTestId('recompute-status').first().waitFor();
    await page.screenshot({ path: '/tmp/unit-setup-condenser.png', fullPage: true });

    const saved = (await unitJson()).condenser;
    expect(saved.tubeOdMm).toBeCloseTo(25.4, 6);
    expect(saved.tubeLengthM).toBeCloseTo(ftToM(LENGTH_FT), 3);
    expect(saved.surfaceM2).toBeCloseTo(geometry.surfaceM2, -1);
    expect(saved.designBackpressureKpa).toBeCloseTo(2.5 * KPA_PER_INHG, 4);
    expect(saved.designCwFlowM3s).toBeCloseTo(gpmToM3s(DESIGN_FLOW_GPM), 4);
    expect(saved.designCwInletC).toBeCloseTo(fToC(75), 4);
    expect(saved.designCleanliness).toBeCloseTo(0.9, 9);
    expect(saved.referenceCleanliness).toBeNull();
  });

  it('saves the turbine with the maker’s curve pasted as CSV, drawn one line per load', async () => {
    const turbine = page.getByRole('form', { name: 'Turbine' });
    await field(turbine, 'Rating (MW)').fill('520');
    await field(turbine, 'Design heat rate (Btu/kWh)').fill('9650');
    for (const [i, duty] of ['300', '448', '598'].entries()) await turbine.getByLabel(`Duty at row ${i + 1}`).fill(duty);
    // the generic curve is the starting point and is drawn, labelled as generic
    expect(await turbine.textContent()).toContain("generic — replace with the turbine maker's curve");
    await turbine.locator('svg').first().waitFor();

    await turbine.getByText('Paste or upload points (CSV)').click();
    await turbine
      .getByLabel('Pasted curve points')
      .fill(['load fraction,backpressure,change %', '1.0,1.5,-0.6', '1.0,2.0,0', '1.0,3.0,1.5', '0.5,1.5,-0.8', '0.5,2.0,0', '0.5,3.0,2.2'].join('\n'));
    await turbine.getByRole('button', { name: 'Read pasted points' }).click();
    await expect.poll(() => turbine.getByTestId('curve-point').count()).toBe(6);
    expect(await turbine.getByRole('status').filter({ hasText: 'Read 6 points' }).textContent()).toContain('1 line without three numbers skipped');
    await expect.poll(() => turbine.getByRole('img', { name: /against backpressure/ }).textContent()).toContain('50 % load');
    await turbine.getByRole('button', { name: 'Save turbine' }).click();
    await expect.poll(() => turbine.getByRole('status').filter({ hasText: 'Turbine saved' }).count()).toBe(1);

    const saved = (await unitJson()).turbine;
    expect(saved.ratingMw).toBe(520);
    expect(saved.heatBalanceDuty).toEqual([
      { loadFraction: 0.5, dutyMw: 300 },
      { loadFraction: 0.75, dutyMw: 448 },
      { loadFraction: 1, dutyMw: 598 },
    ]);
    expect(saved.correctionCurve.isGeneric).toBe(false);
    expect(saved.correctionCurve.curves.map((c: { loadFraction: number }) => c.loadFraction)).toEqual([0.5, 1]);
    expect(saved.correctionCurve.curves[1].points[0].backpressureKpa).toBeCloseTo(inHgToKpa(1.5), 6);
  });

  it('choosing the fuel fills its CO2 factor with the source; economics saves and the setup is complete', async () => {
    const economics = page.getByRole('form', { name: 'Economics' });
    await economics.getByLabel('Fuel', { exact: true }).selectOption('sub-bituminous-coal');
    await expect.poll(() => field(economics, 'CO2 factor (kg/MMBtu)').inputValue()).toBe(String(CO2_KG_PER_MMBTU['sub-bituminous-coal']));
    expect(await economics.textContent()).toContain('40 CFR Part 98');
    await field(economics, 'Fuel price (USD/MMBtu)').fill('2.10');
    await field(economics, 'Replacement power price (USD/MWh)').fill('52');
    await field(economics, 'Capacity-limited share of hours (%)').fill('15');
    await economics.getByRole('button', { name: 'Save economics' }).click();
    await expect.poll(() => economics.getByRole('status').filter({ hasText: 'Economics saved' }).count()).toBe(1);
    const unit = await unitJson();
    expect(unit.setupComplete).toBe(true);
    expect(unit.economics.capacityLimitedShare).toBeCloseTo(0.15, 9);
    expect(unit.economics.discountRate).toBeCloseTo(0.08, 9);
    await page.screenshot({ path: '/tmp/unit-setup.png', fullPage: true });
  });

  it('uploads a historian CSV, maps its columns and imports it; the summary counts the left-out row by its reason', async () => {
    await page.getByRole('navigation', { name: 'Unit' }).getByRole('link', { name: 'Data files' }).click();
    await page.getByLabel(/Historian file/).setInputFiles({ name: 'larchmoor-u1-june.csv', mimeType: 'text/csv', buffer: Buffer.from(historianCsv()) });
    await page.getByRole('button', { name: 'Upload and map columns' }).click();

    const mapping = page.getByRole('region', { name: 'Map the columns' });
    await mapping.waitFor();
    const choose = async (column: string, role: string, unit?: string) => {
      await mapping.getByLabel(`What column ${column} is`).selectOption(role);
      if (unit) await mapping.getByLabel(`Unit of column ${column}`).selectOption(unit);
    };
    await choose('Timestamp', 'timestamp');
    await choose('Gross MW', 'grossLoad', 'MW');
    await choose('BP inHgA', 'backpressure', 'inHg');
    await choose('CW In °F', 'cwInletTemperature', 'degF');
    await choose('CW Out °F', 'cwOutletTemperature', 'degF');
    await choose('CW Flow gpm', 'cwFlow', 'gpm');
    await mapping.getByLabel('Timestamp format').selectOption('iso-8601-offset');
    expect(await mapping.getByTestId('mapping-problems').count()).toBe(0);
    await page.screenshot({ path: '/tmp/unit-import-mapping.png', fullPage: true });
    await mapping.getByRole('button', { name: 'Check and import' }).click();

    const summary = page.getByTestId('import-summary');
    await summary.waitFor({ timeout: 45_000 });
    await page.screenshot({ path: '/tmp/unit-import-summary.png', fullPage: true });
    const count = async (label: string) =>
      Number(
        (
          (await summary
            .locator('dt')
            .filter({ hasText: new RegExp(`^${label}$`) })
            .locator('xpath=following-sibling::dd')
            .textContent()) ?? ''
        ).replace(/,/g, ''),
      );
    expect(await count('Rows read')).toBe(ROWS);
    expect(await count('Stored')).toBe(ROWS);
    const riseRow = summary.getByTestId('reason-row').filter({ hasText: 'CW outlet temperature is not above the inlet temperature' });
    expect(await riseRow.locator('td').last().textContent()).toBe('1');
    expect((await unitJson()).samples.count).toBe(ROWS);
  });

  it('lists the import in the history and undoes it: its rows are gone', async () => {
    await page.getByRole('navigation', { name: 'Unit' }).getByRole('link', { name: 'Data files' }).click();
    const row = page.getByTestId('import-row').filter({ hasText: 'larchmoor-u1-june.csv' });
    await row.waitFor();
    expect(await row.textContent()).toContain('Imported');
    expect(await row.locator('td').nth(3).textContent()).toBe(String(ROWS));
    await row.getByRole('button', { name: 'Undo' }).click();
    expect(await row.textContent()).toContain('removes the rows this import brought and recomputes');
    await row.getByRole('button', { name: 'Undo import' }).click();
    await expect.poll(() => row.textContent()).toContain('Undone');
    await page.screenshot({ path: '/tmp/unit-imports.png', fullPage: true });
    await expect.poll(async () => (await unitJson()).samples.count).toBe(0);
  });

  it('a file with text in a number is refused whole: the error is listed by row and column and nothing is stored', async () => {
    await page.getByRole('navigation', { name: 'Unit' }).getByRole('link', { name: 'Data files' }).click();
    await page
      .getByLabel(/Historian file/)
      .setInputFiles({ name: 'larchmoor-bad.csv', mimeType: 'text/csv', buffer: Buffer.from(historianCsv({ textInNumberAtRow: 10 })) });
    await page.getByRole('button', { name: 'Upload and map columns' }).click();
    const mapping = page.getByRole('region', { name: 'Map the columns' });
    await mapping.waitFor();
    // the unit's saved mapping from the last import fits these columns and is offered
    expect(await mapping.textContent()).toContain('Filled in from this unit’s last import');
    await mapping.getByRole('button', { name: 'Check and import' }).click();

    const rejected = page.getByTestId('import-rejected');
    await rejected.waitFor({ timeout: 45_000 });
    expect(await rejected.textContent()).toContain('Nothing was imported');
    await page.screenshot({ path: '/tmp/unit-import-rejected.png', fullPage: true });
    const errorRow = rejected.getByTestId('error-row').first();
    // header on line 1, data row index 10 on line 12
    expect(await errorRow.locator('td').nth(0).textContent()).toBe('12');
    expect(await errorRow.locator('td').nth(1).textContent()).toBe('Gross MW');
    expect(await errorRow.locator('td').nth(2).textContent()).toContain('48o.2');
    const report = await page.request.get(`${server.url}${await rejected.getByRole('link', { name: 'Download all errors (CSV)' }).getAttribute('href')}`);
    expect(report.status()).toBe(200);
    expect(await report.text()).toContain('48o.2');
    expect((await unitJson()).samples.count).toBe(0);
  });

  it('records a past cleaning (no safety banner: that belongs where work is planned), and lists it on the timeline with its cost', async () => {
    await page.getByRole('navigation', { name: 'Unit' }).getByRole('link', { name: 'Events' }).click();
    const form = page.getByRole('form', { name: 'Add an event' });
    expect(await form.getByTestId('cleaning-caution').count()).toBe(0);
    await form.getByLabel('Date', { exact: true }).fill('2025-06-05');
    await field(form, 'Cost (USD)').fill('48,200');
    await form.getByLabel('Cleaning method').selectOption('hp-water-lancing');
    await field(form, 'Cleanliness before (%)').fill('71');
    await field(form, 'Cleanliness after (%)').fill('92');
    await form.getByRole('button', { name: 'Add event' }).click();
    const row = page.getByTestId('event-row').filter({ hasText: 'Cleaning' });
    await row.waitFor();
    expect(await row.textContent()).toContain('$48,200');
    expect(await row.textContent()).toContain('92 %');
    await page.screenshot({ path: '/tmp/unit-events.png', fullPage: true });
    await page.getByRole('navigation', { name: 'Unit' }).getByRole('link', { name: 'Condition and cost' }).click();
    await page.getByTestId('setup-summary').waitFor();
    await page.screenshot({ path: '/tmp/unit-summary.png', fullPage: true });
  });

  it('a viewer of the same organisation sees the plant and the setup as text, with the reason instead of controls', async () => {
    const context = await browser.newContext();
    contexts.push(context);
    const viewer = await context.newPage();
    await signIn(viewer, server, 'viewer@northmere.example');
    await viewer.goto(`${server.url}/plants`);
    const card = viewer.getByRole('article', { name: 'Larchmoor Station' });
    await card.waitFor();
    expect(await viewer.getByRole('form', { name: 'New plant' }).count()).toBe(0);
    expect(await viewer.getByRole('button', { name: 'New plant' }).count()).toBe(0);
    expect(await viewer.getByText('Only administrators and analysts create, change and delete plants and units.').isVisible()).toBe(true);
    expect(await card.getByRole('button', { name: 'Delete plant' }).count()).toBe(0);
    await viewer.goto(`${server.url}/units/${unitId}/setup`);
    await viewer.getByTestId('condenser-values').waitFor();
    expect(await viewer.getByRole('button', { name: 'Save condenser' }).count()).toBe(0);
  });
});
