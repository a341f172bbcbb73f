/**
 * Time to the first chart of a unit's health view ("Condition and cost", /units/:id) in headless Chromium on the
 * demo data. Every run builds the front end afresh into a temporary folder (so the figure is of the code as it is,
 * never of a stale frontend/dist), starts a throwaway MariaDB, seeds the demo scenario as `npm start` does on an
 * empty database (the full demo: three years of hourly data per unit up to yesterday, imported and recomputed), and
 * serves it from the production entry (backend/src/server.ts) in a process of its own, without a job worker, so no
 * background work runs beside the page loads.
 *
 * Each load is a fresh browser context (1280 × 900) signed in as the demo analyst through the API (a sign-in
 * through the form would fill the context's cache). The page opens Harrow Creek Station, Unit 1, with its default
 * period (the last year of data).
 *
 * The marker: the first chart of the view is the cleanliness factor chart; it counts as drawn with data once its SVG
 * holds a line path with at least two points (`path[d*="L"]`: the fitted trend or the forecast, drawn by the
 * chart's own line layer; axes and grid are <line> elements, so nothing else matches). A MutationObserver installed
 * before any of the page's scripts sees the path enter the document; the figure is the time, on the page's own clock
 * (performance.now(), zero at navigation start), of the task after the next animation frame, i.e. once the frame
 * holding the path has been rendered.
 *
 *  - cold: an empty browser cache (every script, style and font fetched);
 *  - warm: the same context has loaded the page once before, so the HTTP cache holds the scripts and styles
 *    (index.html is revalidated; API answers are never cached by the browser);
 *  - the very first load after the server started is reported apart: it also waits for the server to compute the
 *    unit's health figures (its per-unit cache is empty then); every later load finds them cached on the server.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Browser } from 'playwright-core';
import type { BenchRow } from '../run.js';
import { buildDataSource } from '../../backend/src/data-source.js';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { seedDemoIfEmpty } from '../../backend/src/seed/demo-seed.js';
import { freePort } from '../../scripts/lib/free-port.js';
import { startMariaDb, type MariaDbInstance } from '../../scripts/lib/mariadb.js';
import { median } from '../../shared/domain/statistics.js';
import { launchBrowser } from '../../tests/helpers/browser.js';

const LOADS = 7;
const TARGET_MS = 1500;
const EMAIL = 'analyst@northmere.example';
const PLANT = 'Harrow Creek Station';
const UNIT = 'Unit 1';
const VIEWPORT = { width: 1280, height: 900 };
const root = path.resolve(import.meta.dirname, '..', '..');

/** Runs in every document before its own scripts: records when the first chart's data line is in the DOM and rendered. */
const MARKER = `(() => {
  const selector = '[data-testid="chart-cleanliness"] svg path[d*="L"]';
  const observer = new MutationObserver(() => {
    if (!document.querySelector(selector)) return;
    observer.disconnect();
    const inDomMs = performance.now();
    requestAnimationFrame(() => {
      const channel = new MessageChannel();
      channel.port1.onmessage = () => {
        window.__cleancaseFirstChart = { inDomMs, renderedMs: performance.now(), pathLength: document.querySelector(selector).getAttribute('d').length };
      };
      channel.port2.postMessage(null);
    });
  });
  observer.observe(document, { childList: true, subtree: true, attributes: true, attributeFilter: ['d'] });
})();`;

interface FirstChart {
  inDomMs: number;
  renderedMs: number;
  pathLength: number;
}

function buildFrontEnd(outDir: string): void {
  const built = spawnSync(path.join(root, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'error', '--outDir', outDir, '--emptyOutDir'], {
    cwd: root,
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  if (built.status !== 0) throw new Error('vite build failed');
}

async function seedDemo(db: MariaDbInstance): Promise<void> {
  const ds = buildDataSource(db);
  await ds.initialize();
  try {
    await ds.runMigrations({ transaction: 'each' });
    if (!(await seedDemoIfEmpty(ds, () => undefined, true))) throw new Error('the bench database was not empty');
  } finally {
    await ds.destroy();
  }
}

async function startServer(db: MariaDbInstance, distDir: string, uploadDir: string): Promise<{ child: ChildProcess; base: string }> {
  const port = await freePort();
  const env = {
    PATH: process.env.PATH ?? '',
    NODE_ENV: 'development',
    HOST: '127.0.0.1',
    PORT: String(port),
    SMTP_SINK_PORT: '0',
    DB_HOST: db.host,
    DB_PORT: String(db.port),
    DB_NAME: db.database,
    DB_USER: db.user,
    DB_PASSWORD: db.password,
    DEMO_DATA: 'none',
    JOB_WORKER: 'off',
    LOG_LEVEL: 'warn',
    UPLOAD_DIR: uploadDir,
    FRONTEND_DIST_DIR: distDir,
    // Nothing listens there: billing says Stripe is not answering, at once, and nothing else waits for it.
    STRIPE_API_BASE: 'http://127.0.0.1:9',
  };
  const child = spawn(process.execPath, ['--import', 'tsx', 'backend/src/server.ts'], { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  child.stdout!.on('data', (b: Buffer) => (output += b.toString()));
  child.stderr!.on('data', (b: Buffer) => (output += b.toString()));
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`the app did not start in 60 s:\n${output}`)), 60_000);
    child.stdout!.on('data', () => {
      if (!output.includes('Cleancase is serving on')) return;
      clearTimeout(timer);
      resolve();
    });
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`the app ended (${code}) before serving:\n${output}`));
    });
  });
  return { child, base: `http://127.0.0.1:${port}` };
}

/** One load in a fresh context: signed in through the API; with `warm`, the page is opened once first to fill the HTTP cache. */
async function timeFirstChart(browser: Browser, base: string, unitPath: string | null, warm: boolean): Promise<{ chart: FirstChart; unitPath: string }> {
  const context = await browser.newContext({ viewport: VIEWPORT });
  try {
    await context.addInitScript(MARKER);
    const signIn = await context.request.post(`${base}/api/session`, {
      headers: { 'x-cleancase-request': '1' },
      data: { email: EMAIL, password: DEMO_PASSWORD },
    });
    if (!signIn.ok()) throw new Error(`the demo analyst's sign-in answered ${signIn.status()}`);
    if (!unitPath) {
      const { plants } = (await (await context.request.get(`${base}/api/plants`)).json()) as {
        plants: { name: string; units: { id: string; name: string }[] }[];
      };
      const unit = plants.find((p) => p.name === PLANT)?.units.find((u) => u.name === UNIT);
      if (!unit) throw new Error(`the demo has no ${PLANT} ${UNIT}`);
      unitPath = `/units/${unit.id}`;
    }
    const page = await context.newPage();
    const chart = async () =>
      (await (
        await page.waitForFunction(() => (globalThis as unknown as { __cleancaseFirstChart?: FirstChart }).__cleancaseFirstChart, null, { timeout: 60_000 })
      ).jsonValue()) as FirstChart;
    if (warm) {
      await page.goto(`${base}${unitPath}`);
      await chart();
    }
    await page.goto(`${base}${unitPath}`, { waitUntil: 'commit' });
    const drawn = await chart();
    // The chart drew its figure, not an empty frame: the period has daily points and the line has many segments.
    const points = Number(await page.getByTestId('chart-cleanliness').getAttribute('data-points'));
    if (!(points > 100) || drawn.pathLength < 200) throw new Error(`the first chart drew ${points} days and a path of ${drawn.pathLength} characters`);
    return { chart: drawn, unitPath };
  } finally {
    await context.close();
  }
}

export default async function browserFirstChart(): Promise<BenchRow[]> {
  const work = mkdtempSync(path.join(os.tmpdir(), 'cleancase-bench-first-chart-'));
  let db: MariaDbInstance | null = null;
  let server: ChildProcess | null = null;
  let browser: Browser | null = null;
  try {
    const distDir = path.join(work, 'dist');
    buildFrontEnd(distDir);
    db = await startMariaDb({
      dataDir: path.join(work, 'mariadb'),
      port: await freePort(),
      database: 'bench_demo',
      user: 'bench_demo',
      password: 'bench-demo-password-2026',
    });
    const seedStarted = performance.now();
    await seedDemo(db);
    const seedSeconds = (performance.now() - seedStarted) / 1000;
    const started = await startServer(db, distDir, path.join(work, 'uploads'));
    server = started.child;
    browser = await launchBrowser();

    const first = await timeFirstChart(browser, started.base, null, false);
    const cold: FirstChart[] = [];
    const warm: FirstChart[] = [];
    for (let i = 0; i < LOADS; i++) {
      cold.push((await timeFirstChart(browser, started.base, first.unitPath, false)).chart);
      warm.push((await timeFirstChart(browser, started.base, first.unitPath, true)).chart);
    }
    const mid = (xs: FirstChart[]) => median(xs.map((x) => x.renderedMs))!;
    // Other work on the machine shows in these figures: the load average says how busy it was.
    console.log(
      `health view first chart: load average ${os.loadavg()[0]!.toFixed(1)} on ${os.cpus().length} cores; demo seeded in ${seedSeconds.toFixed(0)} s; rendered at (ms) cold ${cold.map((c) => c.renderedMs.toFixed(0)).join(', ')}; ` +
        `warm ${warm.map((c) => c.renderedMs.toFixed(0)).join(', ')}; in the DOM (median) cold ${median(cold.map((c) => c.inDomMs))!.toFixed(0)}, ` +
        `warm ${median(warm.map((c) => c.inDomMs))!.toFixed(0)}`,
    );
    return [
      {
        name: `health view: time to first chart, cold cache (median of ${LOADS} loads)`,
        value: mid(cold),
        unit: 'ms',
        target: { value: TARGET_MS, higherIsBetter: false },
      },
      {
        name: `health view: time to first chart, warm cache (median of ${LOADS} loads)`,
        value: mid(warm),
        unit: 'ms',
        target: { value: TARGET_MS, higherIsBetter: false },
      },
      {
        name: 'health view: time to first chart, first load after the server started',
        value: first.chart.renderedMs,
        unit: 'ms',
      },
    ];
  } finally {
    await browser?.close();
    if (server && server.exitCode === null) {
      server.kill('SIGTERM');
      await once(server, 'exit');
    }
    await db?.stop();
    rmSync(work, { recursive: true, force: true });
  }
}
