/**
 * API latency on the 50-unit bench tenant (bench/lib/bench-tenant.ts: 10 years of hourly data per unit, built once
 * and kept under .data/bench): the API runs in a process of its own on loopback, autocannon drives 20 connections
 * for a bounded time per endpoint, and every response time is kept so the 95th percentile is exact (autocannon's
 * summary has no p95). Endpoints: a unit's health view over its last year, the same year's hourly backpressure
 * points, and the portfolio of all 50 units. The first request of each unit's health view (a cache miss: the
 * view computed from the stored daily figures) is timed apart, one unit after another. The plants list under the
 * same load is reported beside them as a reference for what the machine gave any request in the same run.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import path from 'node:path';
import { createInterface } from 'node:readline';
import autocannon from 'autocannon';
import type { BenchRow } from '../run.js';
import { addDays } from '../../shared/domain/calendar/plant-date.js';
import { quantileSorted } from '../../shared/domain/statistics.js';
import { openBenchTenant } from '../lib/bench-tenant.js';

const CONNECTIONS = 20;
const SECONDS = 10;

async function startServer(env: Record<string, string>): Promise<{ child: ChildProcess; base: string }> {
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(import.meta.dirname, '../lib/api-server.ts')], {
    env: { ...process.env, ...env },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const lines = createInterface({ input: child.stdout! });
  const first = await Promise.race([
    new Promise<string>((resolve) => lines.once('line', resolve)),
    once(child, 'exit').then(() => {
      throw new Error('the bench API process stopped before listening');
    }),
  ]);
  const { port } = JSON.parse(first) as { port: number };
  return { child, base: `http://127.0.0.1:${port}` };
}

async function signIn(base: string, email: string, password: string): Promise<string> {
  const res = await fetch(`${base}/api/session`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-cleancase-request': '1' },
    body: JSON.stringify({ email, password }),
  });
  if (!res.ok) throw new Error(`bench sign-in answered ${res.status}`);
  return res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
}

interface Load {
  p95Ms: number;
  p50Ms: number;
  perSecond: number;
  requests: number;
}

/** 20 connections for SECONDS on one address; every answer must be 200. */
async function load(url: string, cookie: string): Promise<Load> {
  const times: number[] = [];
  let failed = 0;
  const result = await new Promise<autocannon.Result>((resolve, reject) => {
    const instance = autocannon({ url, connections: CONNECTIONS, duration: SECONDS, headers: { cookie } }, (err, r) => (err ? reject(err) : resolve(r)));
    instance.on('response', (_client: unknown, status: number, _bytes: number, ms: number) => {
      times.push(ms);
      if (status !== 200) failed++;
    });
  });
  if (failed || result.errors || result.timeouts)
    throw new Error(`${url}: ${failed} answers other than 200, ${result.errors} errors, ${result.timeouts} timeouts`);
  times.sort((a, b) => a - b);
  return { p95Ms: quantileSorted(times, 0.95), p50Ms: quantileSorted(times, 0.5), perSecond: result.requests.average, requests: times.length };
}

export default async function apiLatency(): Promise<BenchRow[]> {
  const open = await openBenchTenant();
  const { tenant, db } = open;
  let server: ChildProcess | null = null;
  try {
    const started = await startServer({ DB_HOST: db.host, DB_PORT: String(db.port), DB_NAME: db.database, DB_USER: db.user, DB_PASSWORD: db.password });
    server = started.child;
    const { base } = started;
    const cookie = await signIn(base, tenant.email, tenant.password);
    const from = addDays(tenant.lastDay, -364);
    const year = `from=${from}&to=${tenant.lastDay}`;
    const get = async (p: string) => {
      const t0 = performance.now();
      const res = await fetch(`${base}${p}`, { headers: { cookie } });
      if (res.status !== 200) throw new Error(`${p} answered ${res.status}`);
      await res.arrayBuffer();
      return performance.now() - t0;
    };
    // the first request of each unit's year, one after another (each a cache miss)
    const cold: number[] = [];
    for (const id of tenant.unitIds) cold.push(await get(`/api/units/${id}/health?${year}`));
    cold.sort((a, b) => a - b);
    const unit = tenant.unitIds[0]!;
    const health = await load(`${base}/api/units/${unit}/health?${year}`, cookie);
    const samples = await load(`${base}/api/units/${unit}/samples?${year}&quantity=backpressure`, cookie);
    await get('/api/portfolio');
    const portfolio = await load(`${base}/api/portfolio`, cookie);
    // the same load on a light route, for scale: what the machine gives any request in this run
    const plants = await load(`${base}/api/plants`, cookie);
    const scale = `${tenant.unitIds.length} units, ${(tenant.samples / 1e6).toFixed(2)} M samples`;
    return [
      { name: `API unit health, one year, first request per unit (${scale}): p95`, value: quantileSorted(cold, 0.95), unit: 'ms' },
      {
        name: `API unit health, one year, ${CONNECTIONS} connections ${SECONDS} s: p95`,
        value: health.p95Ms,
        unit: 'ms',
        target: { value: 150, higherIsBetter: false },
      },
      { name: `API unit health, one year, ${CONNECTIONS} connections: requests/s`, value: health.perSecond, unit: 'req/s' },
      {
        name: `API samples, one year hourly, ${CONNECTIONS} connections ${SECONDS} s: p95`,
        value: samples.p95Ms,
        unit: 'ms',
        target: { value: 150, higherIsBetter: false },
      },
      { name: `API samples, one year hourly, ${CONNECTIONS} connections: requests/s`, value: samples.perSecond, unit: 'req/s' },
      {
        name: `API portfolio (${scale}), ${CONNECTIONS} connections ${SECONDS} s: p95`,
        value: portfolio.p95Ms,
        unit: 'ms',
        target: { value: 100, higherIsBetter: false },
      },
      { name: `API portfolio, ${CONNECTIONS} connections: requests/s`, value: portfolio.perSecond, unit: 'req/s' },
      { name: `API plants list (reference), ${CONNECTIONS} connections ${SECONDS} s: p95`, value: plants.p95Ms, unit: 'ms' },
      { name: `API plants list (reference), ${CONNECTIONS} connections: requests/s`, value: plants.perSecond, unit: 'req/s' },
    ];
  } finally {
    if (server && server.exitCode === null) {
      server.kill('SIGTERM');
      await once(server, 'exit');
    }
    await open.close();
  }
}
