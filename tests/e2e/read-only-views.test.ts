import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CO2_FACTORS_SOURCE } from '@shared/domain/turbine/emission-factors';
import { GENERAL_CAUTION, TYPICAL_CLEANING_METHODS } from '@shared/schemas/cleaning-method';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { TEST_CONDENSER, TEST_ECONOMICS, TEST_TURBINE } from '../factories/units.js';
import { launchBrowser } from '../helpers/browser.js';
import { csvLines, physicalHistory, US_MAPPING } from '../helpers/historian-files.js';
import { startTestServer } from '../helpers/test-server.js';

type Server = Awaited<ReturnType<typeof startTestServer>>;

const CSRF = { 'x-cleancase-request': '1' };
const PLANT = 'Ashgrove Read Station';
const FILE = 'ashgrove-june.csv';
const GROUP = 'Ashgrove Owners';
const WRITE_REASON = 'Only administrators and analysts';

async function signIn(page: Page, server: Server, email: string) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL(`${server.url}/`);
}

/** Everything in the page's main area a person could press or type into. */
const controls = (page: Page) => page.locator('main').locator('button, input, select, textarea');
const controlNames = async (page: Page) =>
  (await controls(page).all()).map(async (c) => (await c.getAttribute('aria-label')) ?? (await c.textContent())?.trim() ?? '');

describe('read-only views: a viewer and an approver see values and reasons, not controls they cannot use', () => {
  let server: Server;
  let browser: Browser;
  const contexts: BrowserContext[] = [];
  const pages: Record<'analyst' | 'viewer' | 'approver', Page> = {} as never;
  let unitId: string;

  const newPage = async (email: string, width = 1280) => {
    const context = await browser.newContext({ viewport: { width, height: 900 } });
    contexts.push(context);
    const page = await context.newPage();
    await signIn(page, server, email);
    return page;
  };

  beforeAll(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
    pages.analyst = await newPage('analyst@northmere.example');
    const api = pages.analyst.request;
    // an analyst sets up a unit with data, an import and a cleaning, as in real use
    const plant = (await (await api.post(`${server.url}/api/plants`, { headers: CSRF, data: { name: PLANT, timeZone: 'America/Chicago' } })).json()) as {
      id: string;
    };
    const unit = (await (await api.post(`${server.url}/api/plants/${plant.id}/units`, { headers: CSRF, data: { name: 'Unit 1' } })).json()) as { id: string };
    unitId = unit.id;
    for (const [part, body] of [
      ['condenser', TEST_CONDENSER],
      ['turbine', TEST_TURBINE],
      ['economics', TEST_ECONOMICS],
    ] as const) {
      expect((await api.put(`${server.url}/api/units/${unitId}/${part}`, { headers: CSRF, data: body })).status()).toBe(200);
    }
    const rows = physicalHistory({ startUtc: Date.UTC(2025, 5, 2, 5), hours: 48, condenser: TEST_CONDENSER, turbine: TEST_TURBINE });
    const upload = await api.post(`${server.url}/api/units/${unitId}/uploads`, {
      headers: CSRF,
      multipart: { file: { name: FILE, mimeType: 'text/csv', buffer: Buffer.from(csvLines(rows).join('\r\n') + '\r\n') } },
    });
    expect(upload.status()).toBe(201);
    const importId = ((await upload.json()) as { import: { id: string } }).import.id;
    expect((await api.post(`${server.url}/api/imports/${importId}/start`, { headers: CSRF, data: { mapping: US_MAPPING } })).status()).toBe(202);
    let found = { status: '', message: null as string | null };
    for (let tries = 0; tries < 120 && !['complete', 'failed', 'rejected'].includes(found.status); tries++) {
      found = (await (await api.get(`${server.url}/api/imports/${importId}`)).json()) as typeof found;
      if (found.status !== 'complete') await new Promise((r) => setTimeout(r, 500));
    }
    expect(found.status, `the import finishes (${found.message ?? 'no message'})`).toBe('complete');
    const event = await api.post(`${server.url}/api/units/${unitId}/events`, {
      headers: CSRF,
      data: { kind: 'cleaning', startDate: '2025-06-03', methodId: 'hp-water-lancing', cost: 48_200, cleanlinessBefore: 0.71, cleanlinessAfter: 0.92 },
    });
    expect(event.status()).toBe(201);
    const admin = await newPage('admin@northmere.example');
    expect((await admin.request.post(`${server.url}/api/client-groups`, { headers: CSRF, data: { name: GROUP } })).status()).toBe(201);
    pages.viewer = await newPage('viewer@northmere.example');
    pages.approver = await newPage('approver@northmere.example');
  }, 180_000);

  afterAll(async () => {
    for (const c of contexts) await c.close();
    await browser?.close();
    await server?.close();
  });

  /** Opens a page and waits for what only that page shows, so nothing is read from the page before it. */
  const open = async (page: Page, path: string, ready: (p: Page) => Locator) => {
    await page.goto(`${server.url}${path}`);
    await ready(page).first().waitFor();
  };

  describe.each(['viewer', 'approver'] as const)('as the %s', (who) => {
    it('the plants list shows the plant and its unit with no change, delete, rename or add controls, and says who may', async () => {
      const page = pages[who];
      await open(page, '/plants', (p) => p.getByRole('heading', { name: 'Plants and units' }));
      const card = page.getByRole('article', { name: PLANT });
      await card.waitFor();
      expect(await controls(page).count(), (await Promise.all(await controlNames(page))).join(', ')).toBe(0);
      expect(await card.getByRole('link', { name: 'Unit 1' }).count()).toBe(1);
      expect(await card.textContent()).toContain('340 MW');
      expect(await page.getByTestId('read-only-reason').textContent()).toBe(`${WRITE_REASON} create, change and delete plants and units.`);
    });

    it('the unit setup shows every saved value as text, no field or save button, and the CO2 factor’s source with a check against the fuel', async () => {
      const page = pages[who];
      await open(page, `/units/${unitId}/setup`, (p) => p.getByTestId('economics-values'));
      expect(await controls(page).count(), (await Promise.all(await controlNames(page))).join(', ')).toBe(0);
      const condenser = (await page.getByTestId('condenser-values').textContent()) ?? '';
      expect(condenser).toContain('18,000'); // tube count
      expect(condenser).toContain('Titanium');
      expect(condenser).toContain('22 BWG');
      expect(condenser).toContain('90 %'); // design cleanliness
      const turbine = (await page.getByTestId('turbine-values').textContent()) ?? '';
      expect(turbine).toContain('340.0 MW');
      expect(turbine).toContain('9,400 Btu/kWh');
      expect(await page.getByTestId('turbine-values').getByTestId('duty-row').count()).toBe(TEST_TURBINE.heatBalanceDuty.length);
      const economics = (await page.getByTestId('economics-values').textContent()) ?? '';
      expect(economics).toContain('Bituminous coal');
      expect(economics).toContain(CO2_FACTORS_SOURCE);
      expect(economics).toContain('check it against your fuel’s analysis');
      expect(economics).not.toContain('from memory');
      expect(await page.getByTestId('read-only-reason').textContent()).toBe(`${WRITE_REASON} change this unit’s setup.`);
    });

    it('the data files tab lists the file and its counts with no file picker, upload or undo, and says who may import', async () => {
      const page = pages[who];
      await open(page, `/units/${unitId}/data`, (p) => p.getByTestId('import-row'));
      expect(await controls(page).count(), (await Promise.all(await controlNames(page))).join(', ')).toBe(0);
      expect(await page.locator('input[type=file]').count()).toBe(0);
      const row = (await page.getByTestId('import-row').textContent()) ?? '';
      expect(row).toContain(FILE);
      expect(row).toContain('48'); // rows stored
      expect(await page.getByTestId('read-only-reason').textContent()).toBe(`${WRITE_REASON} import files and undo imports.`);
    });

    it('the events list shows the cleaning by its method’s name with no form, change or delete', async () => {
      const page = pages[who];
      await open(page, `/units/${unitId}/events`, (p) => p.getByTestId('event-row'));
      expect(await controls(page).count(), (await Promise.all(await controlNames(page))).join(', ')).toBe(0);
      const row = (await page.getByTestId('event-row').textContent()) ?? '';
      expect(row).toContain('High-pressure water lancing');
      expect(row).not.toContain('hp-water-lancing');
      expect(row).toContain('48,200');
      expect(await page.getByTestId('read-only-reason').textContent()).toBe(`${WRITE_REASON} record, change and delete events.`);
    });

    it('the unit summary offers no "Import more" link', async () => {
      const page = pages[who];
      await open(page, `/units/${unitId}`, (p) => p.getByRole('heading', { name: 'Performance data' }));
      expect(await page.getByRole('link', { name: 'Import more' }).count()).toBe(0);
      expect(await page.getByRole('link', { name: 'Import data' }).count()).toBe(0);
    });

    it('the cleaning-method library keeps the cautions and the methods, whose only buttons open their cautions', async () => {
      const page = pages[who];
      await open(page, '/settings/cleaning-methods', (p) => p.getByTestId('cleaning-method-row'));
      expect(await controls(page).count()).toBe(TYPICAL_CLEANING_METHODS.length);
      for (const m of TYPICAL_CLEANING_METHODS) expect(await page.getByRole('button', { name: m.name, exact: true }).count()).toBe(1);
      expect(await page.getByTestId('library-caution').textContent()).toContain(GENERAL_CAUTION);
      expect(await page.getByTestId('read-only-reason').textContent()).toBe(`${WRITE_REASON} add, change and delete cleaning methods.`);
    });

    it('people and roles is closed with its reason and no controls', async () => {
      const page = pages[who];
      await open(page, '/settings/members', (p) => p.getByText('People and roles is not available to you'));
      expect(await controls(page).count()).toBe(0);
      expect(await page.locator('main').textContent()).toContain('Only administrators can do this');
    });

    it('client groups are listed by name with no create, rename or delete', async () => {
      const page = pages[who];
      await open(page, '/settings/client-groups', (p) => p.getByTestId('client-group-row'));
      expect(await controls(page).count(), (await Promise.all(await controlNames(page))).join(', ')).toBe(0);
      expect(await page.getByTestId('client-group-row').textContent()).toContain(GROUP);
      expect(await page.getByTestId('read-only-reason').textContent()).toBe('Only administrators create, rename and delete client groups.');
    });

    it('API tokens stay theirs to create: every member may use the calculation API', async () => {
      const page = pages[who];
      await open(page, '/settings/api-tokens', (p) => p.getByRole('heading', { name: 'API tokens' }));
      expect(await page.getByLabel('Token name').count()).toBe(1);
      expect(await page.getByRole('button', { name: 'Create token' }).isEnabled()).toBe(true);
    });
  });

  it('the viewer may not open the audit log: its reason and no controls', async () => {
    const page = pages.viewer;
    await open(page, '/settings/audit', (p) => p.getByText('The audit log is not available to you'));
    expect(await controls(page).count()).toBe(0);
    expect(await page.locator('main').textContent()).toContain('Only administrators and approvers can do this');
  });

  it('the approver reads the audit log as sentences with names, not codes or ids', async () => {
    const page = pages.approver;
    await open(page, '/settings/audit', (p) => p.getByTestId('audit-entry'));
    const entries = await page.getByTestId('audit-entry').allTextContents();
    const all = entries.join('\n');
    expect(all).toContain(`Priya Ramanathan imported the file “${FILE}”.`);
    expect(all).toContain(`Priya Ramanathan saved the condenser setup of ${PLANT} — Unit 1.`);
    expect(all).toContain(`Priya Ramanathan added the plant “${PLANT}”.`);
    expect(all).toContain(`Ingrid Halvorsen created the client group “${GROUP}”.`);
    expect(all).not.toMatch(/import\.started|unit\.condenser-saved|plant\.created/);
    expect(all).not.toMatch(/\b[0-9a-f]{8}\b/);
  });

  it('an analyst still has every control: add and change plants, save the setup, pick a file, undo, record and change events, change methods', async () => {
    const page = pages.analyst;
    await open(page, '/plants', (p) => p.getByRole('button', { name: 'New plant' }));
    const card = page.getByRole('article', { name: PLANT });
    expect(await card.getByRole('button', { name: `Change ${PLANT}` }).isEnabled()).toBe(true);
    expect(await card.getByRole('button', { name: 'Delete plant' }).isEnabled()).toBe(true);
    expect(await card.getByRole('button', { name: 'Rename Unit 1' }).isEnabled()).toBe(true);
    expect(await page.getByTestId('read-only-reason').count()).toBe(0);

    await open(page, `/units/${unitId}/setup`, (p) => p.getByRole('form', { name: 'Economics' }));
    for (const part of ['condenser', 'turbine', 'economics']) expect(await page.getByRole('button', { name: `Save ${part}` }).isEnabled()).toBe(true);
    expect(await page.getByRole('form', { name: 'Economics' }).textContent()).toContain('check it against your fuel’s analysis');

    await open(page, `/units/${unitId}/data`, (p) => p.getByTestId('import-row'));
    expect(await page.locator('input[type=file]').isEnabled()).toBe(true);
    expect(await page.getByRole('button', { name: 'Undo' }).isEnabled()).toBe(true);

    await open(page, `/units/${unitId}/events`, (p) => p.getByTestId('event-row'));
    expect(await page.getByRole('form', { name: 'Add an event' }).count()).toBe(1);
    expect(await page.getByRole('button', { name: /^Change the Cleaning/ }).isEnabled()).toBe(true);

    await open(page, '/settings/cleaning-methods', (p) => p.getByTestId('cleaning-method-row'));
    expect(await page.getByRole('button', { name: /^Change / }).count()).toBe(TYPICAL_CLEANING_METHODS.length);
  });

  it('the form that records past events carries no safety banner; the library where cleanings are planned keeps the cautions', async () => {
    const page = pages.analyst;
    await open(page, `/units/${unitId}/events`, (p) => p.getByRole('form', { name: 'Add an event' }));
    const form = page.getByRole('form', { name: 'Add an event' });
    expect(await form.textContent()).not.toContain('Safety');
    expect(await form.textContent()).not.toContain(GENERAL_CAUTION);
    await open(page, '/settings/cleaning-methods', (p) => p.getByTestId('library-caution'));
    expect(await page.getByTestId('library-caution').textContent()).toContain('local codes');
  });

  it('a new method’s key is made from its name, unique in the library, shown but not typed, and the API keeps it', async () => {
    const page = pages.analyst;
    await open(page, '/settings/cleaning-methods', (p) => p.getByRole('form', { name: 'Add a cleaning method' }));
    const form = page.getByRole('form', { name: 'Add a cleaning method' });
    expect(await form.getByLabel('Key').count()).toBe(0);
    await form.getByLabel('Name').fill('High-pressure water lancing');
    // the seeded library holds "hp-water-lancing"; the made key is the name's own, and unique
    await expect.poll(() => form.getByTestId('method-key').textContent()).toContain('high-pressure-water-lancing');
    await form.getByLabel('Name').fill('Sponge balls, weekly');
    await expect.poll(() => form.getByTestId('method-key').textContent()).toContain('sponge-balls-weekly');
    await form.getByLabel('Fixed cost').fill('9000');
    await form.getByLabel('Cost per tube').fill('0');
    await form.getByLabel('Duration').fill('2');
    await form.getByLabel('Cleanliness recovered').fill('82');
    await form.getByRole('button', { name: 'Add method' }).click();
    await page.getByTestId('cleaning-method-row').filter({ hasText: 'Sponge balls, weekly' }).waitFor();
    const listed = (await (await page.request.get(`${server.url}/api/cleaning-methods`)).json()) as { methods: { id: string; name: string }[] };
    expect(listed.methods.find((m) => m.name === 'Sponge balls, weekly')?.id).toBe('sponge-balls-weekly');
    // the same name again gets the next free key
    await form.getByLabel('Name').fill('Sponge balls, weekly');
    await expect.poll(() => form.getByTestId('method-key').textContent()).toContain('sponge-balls-weekly-2');
  });

  it('takes screenshots of the viewer’s setup and events at desktop and tablet widths', async () => {
    for (const width of [1280, 800]) {
      const page = width === 1280 ? pages.viewer : await newPage('viewer@northmere.example', width);
      await open(page, `/units/${unitId}/setup`, (p) => p.getByTestId('turbine-values').locator('svg'));
      await page.screenshot({ path: `/tmp/read-only-setup-${width}.png`, fullPage: true });
      await open(page, `/units/${unitId}/events`, (p) => p.getByTestId('event-row'));
      await page.screenshot({ path: `/tmp/read-only-events-${width}.png`, fullPage: true });
    }
  });
});
