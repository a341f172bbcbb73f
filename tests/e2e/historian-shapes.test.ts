/**
 * Historian shapes in a real browser: a tall file from the demo generator (tag, time, value, quality) and the same
 * hours as one file per tag with offset times are each uploaded on a unit's data page, their tags mapped to
 * quantities on a 60-min grid, and imported; each import completes with every hour stored. The mapping screens are
 * photographed at 1280 and 800 px wide.
 */
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { DEMO_TAGS, writeDemoPerTagCsvs, writeDemoTallCsv } from '../../backend/src/seed/demo-data/demo-historian-shapes.js';
import type { DemoHour } from '../../backend/src/seed/demo-data/generate-demo-data.js';
import { launchBrowser } from '../helpers/browser.js';
import { startTestServer } from '../helpers/test-server.js';

type Server = Awaited<ReturnType<typeof startTestServer>>;

/** Fictional steady hours of a demo unit (the generator marks about 2 % of the values with status words). */
const HOURS: DemoHour[] = Array.from({ length: 48 }, (_, h) => ({
  timestampUtc: Date.UTC(2025, 6, 1) + h * 3_600_000,
  loadMw: 480 + 10 * Math.sin((2 * Math.PI * h) / 24),
  backpressureKpa: 6.8 + 0.2 * Math.sin((2 * Math.PI * h) / 24),
  cwInletC: 24 + Math.sin(h / 50),
  cwOutletC: 32 + Math.sin(h / 50),
  cwFlowM3s: 12,
  hotwellC: 38,
  dissolvedOxygenPpb: 7,
  airRemovalKgS: 0.002,
  barometerKpa: 101,
  truth: { cleanliness: 0.85, effectiveCleanliness: 0.85, dutyMw: 400, cwFlowM3s: 12, backpressureKpa: 6.8, offline: false, airLeak: false, fault: null },
}));
/** The demo tags and what each is, in the units the generator writes. */
const TAG_MAPPING: [tag: string, quantity: string, unit: string][] = [
  [DEMO_TAGS[0], 'grossLoad', 'MW'],
  [DEMO_TAGS[1], 'backpressure', 'inHg'],
  [DEMO_TAGS[2], 'cwInletTemperature', 'degF'],
  [DEMO_TAGS[3], 'cwOutletTemperature', 'degF'],
  [DEMO_TAGS[4], 'cwFlow', 'gpm'],
];

async function signIn(page: Page, server: Server, email: string) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL(`${server.url}/`);
}

describe('historian shapes imported in a real browser', () => {
  let server: Server;
  let browser: Browser;
  let page: Page;
  let dir: string;
  const contexts: BrowserContext[] = [];
  const headers = { 'x-cleancase-request': '1' };

  beforeAll(async () => {
    dir = await mkdtemp(path.join(tmpdir(), 'cleancase-e2e-shapes-'));
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
    if (dir) await rm(dir, { recursive: true, force: true });
  });

  async function newUnit(name: string): Promise<string> {
    const plant = (await (await page.request.post(`${server.url}/api/plants`, { headers, data: { name, timeZone: 'America/Chicago' } })).json()) as {
      id: string;
    };
    const unit = await page.request.post(`${server.url}/api/plants/${plant.id}/units`, { headers, data: { name: 'Unit 1' } });
    expect(unit.status()).toBe(201);
    return ((await unit.json()) as { id: string }).id;
  }

  /** Opens the unit's data page and waits for the upload form's heading (the page is loaded on first visit). */
  async function openDataPage(unitId: string) {
    await page.goto(`${server.url}/units/${unitId}/data`);
    await page.getByRole('heading', { name: '1. Choose the historian export' }).waitFor();
  }

  /** Maps the demo tags, chooses a 60-min grid by the nearest sample within 5 min, and photographs the screen at two widths. */
  async function mapTags(mapping: Locator, shot: string) {
    for (const [tag, quantity, unit] of TAG_MAPPING) {
      await mapping.getByLabel(`What column ${tag} is`).selectOption(quantity);
      await mapping.getByLabel(`Unit of column ${tag}`).selectOption(unit);
    }
    const grid = mapping.getByTestId('time-grid');
    await grid.getByLabel('Grid', { exact: true }).selectOption('60');
    await grid.getByLabel('Value at a grid time').selectOption('nearest');
    await grid.getByLabel('Samples at most this far from the grid time (min)').fill('5');
    await mapping.getByLabel('Timestamp format').selectOption('iso-8601-offset');
    expect(await mapping.getByTestId('mapping-problems').count()).toBe(0);
    await page.screenshot({ path: `/tmp/${shot}-1280.png`, fullPage: true });
    await page.setViewportSize({ width: 800, height: 900 });
    await page.screenshot({ path: `/tmp/${shot}-800.png`, fullPage: true });
    await page.setViewportSize({ width: 1280, height: 900 });
  }

  async function importAndCount(mapping: Locator, shot: string): Promise<number> {
    await mapping.getByRole('button', { name: 'Check and import' }).click();
    const summary = page.getByTestId('import-summary');
    await summary.waitFor({ timeout: 60_000 });
    await page.screenshot({ path: `/tmp/${shot}-summary.png`, fullPage: true });
    const stored = Number(
      (
        (await summary
          .locator('dt')
          .filter({ hasText: /^Stored$/ })
          .locator('xpath=following-sibling::dd')
          .textContent()) ?? ''
      ).replace(/,/g, ''),
    );
    return stored;
  }

  it('uploads a tall file, maps its tags on a grid and imports every hour', async () => {
    const unitId = await newUnit('Tall Creek');
    const file = await writeDemoTallCsv(HOURS, path.join(dir, 'u1-tags-july.csv'));
    await openDataPage(unitId);
    await page.getByLabel(/Historian file/).setInputFiles(file);
    await page.getByRole('button', { name: 'Upload and map columns' }).click();
    const mapping = page.getByRole('region', { name: 'Map the columns' });
    await mapping.waitFor();
    expect(await mapping.textContent()).toContain(`one row per tag per time; ${DEMO_TAGS.length} tags`);
    await mapTags(mapping, 'historian-tall-mapping');
    const stored = await importAndCount(mapping, 'historian-tall');
    expect(stored).toBe(HOURS.length);
    const imports = (await (await page.request.get(`${server.url}/api/units/${unitId}/imports`)).json()) as {
      imports: { status: string; counts: { stored: number } }[];
    };
    expect(imports.imports[0]).toMatchObject({ status: 'complete', counts: { stored: HOURS.length } });
  });

  it('uploads one file per tag with offset times, lists each file with its tag, maps the tags and imports every hour', async () => {
    const unitId = await newUnit('Per Tag Point');
    const files = await writeDemoPerTagCsvs(HOURS, path.join(dir, 'per-tag'));
    await openDataPage(unitId);
    await page.getByLabel(/Historian file/).setInputFiles(files);
    expect(await page.getByTestId('chosen-files').textContent()).toContain(`${DEMO_TAGS.length} files of one tag each`);
    await page.getByRole('button', { name: 'Upload and map columns' }).click();
    const mapping = page.getByRole('region', { name: 'Map the columns' });
    await mapping.waitFor();
    expect(await mapping.textContent()).toContain(`${DEMO_TAGS.length} files of one tag each`);
    const rows = mapping.getByTestId('tag-file-row');
    expect(await rows.count()).toBe(DEMO_TAGS.length);
    expect(await rows.first().textContent()).toContain(DEMO_TAGS[0]);
    // the first tag's times are 30 s before the hour, as the generator wrote them
    expect(await rows.first().textContent()).toContain('2025-06-30T23:59:30Z');
    await mapTags(mapping, 'historian-per-tag-mapping');
    const stored = await importAndCount(mapping, 'historian-per-tag');
    expect(stored).toBe(HOURS.length);
    const imports = (await (await page.request.get(`${server.url}/api/units/${unitId}/imports`)).json()) as {
      imports: { status: string; fileKind: string; counts: { stored: number } }[];
    };
    expect(imports.imports[0]).toMatchObject({ status: 'complete', fileKind: 'per-tag', counts: { stored: HOURS.length } });
  });
});
