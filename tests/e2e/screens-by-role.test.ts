/**
 * Every main screen of the demo data as each demo role sees it, at desktop (1280 px) and tablet (800 px) width: a
 * full-page screenshot of each under test-results/screens/<role>/ for people to look at, and per screen what issue 16
 * promises for that role: the page names itself in the tab title, no edit controls for someone who cannot edit
 * (with the one-line reason where an action is expected), the plain sentence at the head of the unit's view, MW
 * and t CO2 beside the fouling cost, the two "left out" counts saying what they count, dates in the one format,
 * no "−$0" or "−0 MW". One browser; one page per role, reused for both widths.
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, it, type ExpectStatic, type TestContext } from 'vitest';
import { formatQuantity } from '@shared/text/physical-cost-text';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { launchBrowser } from '../helpers/browser.js';
import { startTestServer } from '../helpers/test-server.js';

type Server = Awaited<ReturnType<typeof startTestServer>>;

const SHOTS = path.resolve(import.meta.dirname, '..', '..', 'test-results', 'screens');
const WIDTHS = [1280, 800] as const;

interface Role {
  /** folder of its screenshots */
  key: string;
  email: string;
  /** may change plants, units, setup, data and events (data.write) */
  edits: boolean;
  /** may read the audit log (audit.read) */
  audit: boolean;
}

const ROLES: Role[] = [
  { key: 'admin', email: 'admin@northmere.example', edits: true, audit: true },
  { key: 'analyst', email: 'analyst@northmere.example', edits: true, audit: false },
  { key: 'approver', email: 'approver@northmere.example', edits: false, audit: true },
  { key: 'viewer', email: 'viewer@northmere.example', edits: false, audit: false },
  { key: 'consultant', email: 'consultant@tidewater.example', edits: true, audit: false },
  { key: 'client-viewer', email: 'viewer@caldervalley.example', edits: false, audit: false },
];

/** Buttons and fields that change data: none may be offered to someone who cannot edit (data.write). */
const EDIT_NAMES = /^(save|delete|remove|change|rename|undo|import|upload|choose file|add|new plant|new unit|record|edit)\b/i;
/** Dates other than "14 Mar 2026" in the page's text: ISO days and US-style numeric dates. */
const OTHER_DATE_FORMATS = [/\b20\d\d-\d\d-\d\d\b/, /\b\d{1,2}\/\d{1,2}\/\d{2,4}\b/];
/** A chart axis label that can be read as a day ("Sep 25" for September 2025). */
const DAY_LIKE_AXIS_LABEL = /^(Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec) \d{2}$/;
const MINUS_ZERO = /[−-]\s?[$€£]0\b|[−-]0(\.0+)? (MW|t CO2)\b/;

async function signIn(page: Page, server: Server, email: string) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL(`${server.url}/`);
}

/** The main area's text outside the charts, and each chart text label on its own. */
const mainText = async (page: Page) =>
  page.locator('main').evaluate((main) => {
    const copy = main.cloneNode(true) as HTMLElement;
    for (const svg of copy.querySelectorAll('svg')) svg.remove();
    return (copy.textContent ?? '').replace(/\s+/g, ' ');
  });
const chartLabels = (page: Page) => page.locator('main svg text').evaluateAll((els) => els.map((e) => (e.textContent ?? '').trim()));

/** Names of the edit controls in the page's main area (buttons, links styled as actions, file pickers, fields). */
async function editControls(page: Page): Promise<string[]> {
  return page
    .locator('main')
    .locator('button, input[type=file], [role=button]')
    .evaluateAll((els) => els.map((e) => (e.getAttribute('aria-label') ?? e.textContent ?? '').trim()).filter((n) => n.length > 0))
    .then((names) => names.filter((n) => EDIT_NAMES.test(n)));
}

interface Screen {
  key: string;
  path: string;
  /** what only this screen shows once its data has loaded */
  ready: (page: Page) => ReturnType<Page['locator']>;
  /** the tab title: "<name> · Cleancase" */
  title: RegExp;
  /** a place where an editor changes data, so a read-only person sees the one-line reason */
  editScreen?: boolean;
  /** controls a read-only person may still use here (their own profile; an approver's comment on a case) */
  allowed?: RegExp;
  check?: (page: Page) => Promise<void>;
}

interface Demo {
  plantId: string;
  plantName: string;
  unitId: string;
  caseId: string | null;
  outageCount: number;
}

describe('every main screen, for every demo role, at desktop and tablet width (demo data)', () => {
  let server: Server;
  let browser: Browser;
  const contexts: BrowserContext[] = [];

  beforeAll(async () => {
    server = await startTestServer({ demoData: 'full' });
    browser = await launchBrowser();
    mkdirSync(SHOTS, { recursive: true });
  }, 300_000);

  afterAll(async () => {
    for (const c of contexts) await c.close();
    await browser?.close();
    await server?.close();
  });

  /** The first plant with a unit that has data, that unit, a case and the outages, all as this person sees them. */
  async function demoOf(page: Page, expect: ExpectStatic): Promise<Demo> {
    const get = async <T>(p: string) => (await (await page.request.get(`${server.url}${p}`)).json()) as T;
    const { plants } = await get<{ plants: { id: string; name: string; units: { id: string; name: string }[] }[] }>('/api/plants');
    const plant = plants.find((p) => p.units.length > 0)!;
    expect(plant, 'the person sees a plant with a unit').toBeTruthy();
    const { cases } = await get<{ cases: { id: string }[] }>('/api/cases');
    const { outages } = await get<{ outages: unknown[] }>('/api/outages');
    return { plantId: plant.id, plantName: plant.name, unitId: plant.units[0]!.id, caseId: cases[0]?.id ?? null, outageCount: outages.length };
  }

  function screensFor(role: Role, demo: Demo, page: Page, expect: ExpectStatic): Screen[] {
    const api = async <T>(p: string) => (await (await page.request.get(`${server.url}${p}`)).json()) as T;
    const u = `/units/${demo.unitId}`;
    const screens: Screen[] = [
      {
        key: 'portfolio',
        path: '/',
        ready: (p) => p.getByTestId('overview-unit'),
        title: /^Portfolio · Cleancase$/,
        check: async (p) => {
          const { units } = await api<{
            units: { unitId: string; foulingCostPerDay: number | null; foulingPhysical?: { perDay: { lostMw: number | null } | null } | null }[];
          }>('/api/portfolio');
          const costed = units.filter((x) => x.foulingCostPerDay !== null && x.foulingPhysical?.perDay);
          expect(costed.length, 'units with a fouling cost').toBeGreaterThan(0);
          for (const x of costed) {
            const cell = (await p.locator(`[data-unit-id="${x.unitId}"]`).getByTestId('unit-physical').textContent()) ?? '';
            expect(cell).toMatch(/t CO2 a day|MW (lost|gained) when capacity-limited|no MW or CO2 lost/);
          }
        },
      },
      {
        key: 'plant',
        path: `/plants/${demo.plantId}`,
        ready: (p) => p.getByTestId('unit-physical'),
        title: new RegExp(`^${demo.plantName}`),
        check: async (p) => expect(await p.getByTestId('unit-physical').first().textContent()).toMatch(/MW|t CO2/),
      },
      {
        key: 'unit-condition-and-cost',
        path: u,
        ready: (p) => p.getByTestId('fouling-physical'),
        title: /Condition and cost/,
        check: async (p) => {
          const health = await api<{ headline: { foulingPhysical: { capacityLimitedShare: number; perDay: { lostMw: number; co2Tonnes: number } } } }>(
            `/api/units/${demo.unitId}/health`,
          );
          const sentence = (await p.getByTestId('headline-sentence').textContent()) ?? '';
          expect(sentence).toMatch(/^(On \d{1,2} [A-Z][a-z]{2} \d{4}, the last day of data, c|C)leanliness (is|was) \d+ %.*\.$/);
          const physical = health.headline.foulingPhysical;
          const output = (await p.getByTestId('fouling-physical-output').textContent()) ?? '';
          if (physical.capacityLimitedShare > 0) expect(output).toContain(`${formatQuantity(physical.perDay.lostMw)} MW`);
          const co2 = (await p.getByTestId('fouling-physical-co2').textContent()) ?? '';
          if (physical.capacityLimitedShare < 1) expect(co2).toContain(`${formatQuantity(physical.perDay.co2Tonnes)} t CO2 a day`);
          expect(await p.getByTestId('left-out-note').textContent()).toMatch(
            /^Counted over the period shown \(\d{1,2} [A-Z][a-z]{2} \d{4} – \d{1,2} [A-Z][a-z]{2} \d{4}\)/,
          );
          expect(await p.getByTestId('cost-physical').textContent()).toMatch(/t CO2 from extra fuel/);
        },
      },
      {
        key: 'unit-setup',
        path: `${u}/setup`,
        ready: (p) => (role.edits ? p.getByRole('form', { name: 'Condenser' }) : p.getByTestId('economics-values')),
        title: /Setup/,
        editScreen: true,
        check: async (p) => {
          const values = await p.locator('main input').evaluateAll((els) => els.map((e) => (e as HTMLInputElement).value));
          if (!role.edits) expect(values).toEqual([]);
          // a converted value is filled in to six significant digits with its thousands grouped (no "164843.4")
          for (const v of values) expect(v).not.toMatch(/^-?\d{5,}([.,]\d+)?$/);
        },
      },
      {
        key: 'unit-data-files',
        path: `${u}/data`,
        ready: (p) => p.getByTestId('import-row'),
        title: /Data files/,
        editScreen: true,
        check: async (p) => {
          expect(await p.getByTestId('left-out-note').textContent()).toContain('when it was imported');
          expect(await p.locator('main input[type=file]').count()).toBe(role.edits ? 1 : 0);
        },
      },
      { key: 'unit-events', path: `${u}/events`, ready: (p) => p.getByTestId('event-row'), title: /Events/, editScreen: true },
      {
        key: 'cleaning-methods',
        path: '/settings/cleaning-methods',
        ready: (p) => p.getByRole('heading', { name: 'Cleaning methods', level: 1 }),
        title: /^Cleaning methods/,
      },
      {
        key: 'cases',
        path: '/cases',
        ready: (p) => p.getByRole('heading', { name: 'Cleaning cases', level: 1 }),
        title: /^Cases · Cleancase$/,
        // someone who cannot start a case is not told to start one
        check: async (p) => {
          if (!role.edits) expect(await mainText(p)).not.toContain('start one from its Cases tab');
        },
      },
      { key: 'outages', path: '/outages', ready: (p) => p.getByRole('heading', { name: 'Outages', level: 1 }), title: /^Outages · Cleancase$/ },
      {
        key: 'settings',
        path: '/settings/profile',
        ready: (p) => p.getByRole('heading', { name: 'Your profile', level: 1 }),
        title: /^Your profile · Cleancase$/,
        allowed: /^(Save|Change password)$/, // everyone keeps their own name, password and units
      },
    ];
    if (demo.caseId)
      screens.splice(8, 0, {
        key: 'case',
        path: `/cases/${demo.caseId}`,
        ready: (p) => p.getByTestId('case-physical'),
        title: /Case/,
        allowed: role.key === 'approver' ? /^Add comment$/ : undefined,
        check: async (p) => expect(await p.getByTestId('case-physical').textContent()).toMatch(/t CO2|not shown: /),
      });
    if (role.audit)
      screens.push({
        key: 'audit-log',
        path: '/settings/audit',
        ready: (p) => p.getByRole('heading', { name: 'Audit log', level: 1 }),
        title: /^Audit log · Cleancase$/,
        // the filter's days are typed as every day is shown, not in the browser's own date box
        check: async (p) => expect(await p.getByLabel('From', { exact: true }).getAttribute('placeholder')).toBe('14 Mar 2026'),
      });
    return screens;
  }

  // Two people at a time: the machine's two cores render both pages while the server answers.
  const slots = { free: 2, waiting: [] as (() => void)[] };
  const take = () => (slots.free > 0 ? ((slots.free -= 1), Promise.resolve()) : new Promise<void>((resolve) => slots.waiting.push(resolve)));
  const give = () => (slots.waiting.length > 0 ? slots.waiting.shift()!() : (slots.free += 1));

  it.concurrent.for(ROLES)(
    'as $key: every screen names itself, shows what issue 16 promises for the role, and is saved at 1280 and 800 px',
    // a role's time includes its wait for a free slot
    { timeout: 600_000 },
    async (role: Role, { expect }: TestContext) => {
      await take();
      try {
        await visitEveryScreen(role, expect);
      } finally {
        give();
      }
    },
  );

  /** `expect` is the test's own: the roles run side by side. */
  async function visitEveryScreen(role: Role, expect: ExpectStatic) {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    contexts.push(context);
    const page = await context.newPage();
    await signIn(page, server, role.email);
    const demo = await demoOf(page, expect);
    mkdirSync(path.join(SHOTS, role.key), { recursive: true });
    const problems: string[] = [];
    for (const screen of screensFor(role, demo, page, expect)) {
      await page.setViewportSize({ width: 1280, height: 900 });
      await page.goto(`${server.url}${screen.path}`);
      await screen.ready(page).first().waitFor({ timeout: 20_000 });
      await expect.poll(() => page.title(), { message: `${screen.key}: tab title` }).toMatch(screen.title);
      const text = await mainText(page);
      for (const f of OTHER_DATE_FORMATS) if (f.test(text)) problems.push(`${screen.key}: a date not in the one format: “${f.exec(text)?.[0]}”`);
      for (const label of await chartLabels(page)) if (DAY_LIKE_AXIS_LABEL.test(label)) problems.push(`${screen.key}: an axis label read as a day: “${label}”`);
      if (MINUS_ZERO.test(text)) problems.push(`${screen.key}: a minus zero: “${MINUS_ZERO.exec(text)?.[0]}”`);
      if (!role.edits) {
        const offered = (await editControls(page)).filter((n) => !screen.allowed?.test(n));
        if (offered.length > 0) problems.push(`${screen.key}: edit controls offered to a read-only ${role.key}: ${offered.join(', ')}`);
        if (screen.editScreen && (await page.getByTestId('read-only-reason').count()) === 0)
          problems.push(`${screen.key}: no one-line reason for a read-only ${role.key}`);
      }
      await screen.check?.(page);
      for (const width of WIDTHS) {
        if (width !== 1280) {
          await page.setViewportSize({ width, height: 900 });
          await screen.ready(page).first().waitFor();
        }
        await page.screenshot({ path: path.join(SHOTS, role.key, `${screen.key}-${width}.png`), fullPage: true });
      }
    }
    if (!role.audit) {
      // the settings list names the audit log and says who may read it, instead of a link that fails
      await page.setViewportSize({ width: 1280, height: 900 });
      await page.goto(`${server.url}/settings/profile`);
      const nav = page.getByRole('navigation', { name: 'Settings' });
      await nav.waitFor();
      expect(await nav.getByRole('link', { name: 'Audit log' }).count()).toBe(0);
      expect(await nav.textContent()).toMatch(/Audit log(Only administrators and approvers can do this|Only for members who see every client group)/);
    }
    expect(problems).toEqual([]);
  }
});
