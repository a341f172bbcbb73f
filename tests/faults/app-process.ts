/**
 * Real Cleancase processes (backend/src/server.ts) and a private MariaDB instance for the fault tests: what a
 * fault does to one process's memory or to the database must not be hidden by an in-process app, and stopping
 * a database must not touch the one the other test files share.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { rm } from 'node:fs/promises';
import path from 'node:path';
import request from 'supertest';
import type { DbConnection } from '../../backend/src/data-source.js';
import { freePort } from '../../scripts/lib/free-port.js';
import { startMariaDb, type MariaDbInstance, type MariaDbOptions } from '../../scripts/lib/mariadb.js';
import { CSRF, TEST_PASSWORD } from '../factories/accounts.js';

export const ROOT = path.resolve(import.meta.dirname, '..', '..');

export interface AppProcess {
  url: string;
  child: ChildProcess;
  output: () => string;
}

/** One app process with its job worker, serving on a free port; `extraEnv` adds settings (for example STRIPE_API_BASE). */
export async function startAppProcess(db: DbConnection, uploadDir: string, extraEnv: Record<string, string> = {}): Promise<AppProcess> {
  const port = await freePort();
  const env = {
    PATH: process.env.PATH ?? '',
    NODE_ENV: 'test',
    HOST: '127.0.0.1',
    PORT: String(port),
    SMTP_SINK_PORT: String(await freePort()),
    DB_HOST: db.host,
    DB_PORT: String(db.port),
    DB_NAME: db.database,
    DB_USER: db.user,
    DB_PASSWORD: db.password,
    DEMO_DATA: 'none',
    JOB_WORKER: 'on',
    LOG_LEVEL: 'warn',
    UPLOAD_DIR: uploadDir,
    FRONTEND_DIST_DIR: path.join(uploadDir, 'no-front-end'),
    ...extraEnv,
  };
  const child = spawn(process.execPath, ['--import', 'tsx', 'backend/src/server.ts'], { cwd: ROOT, env, stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  child.stdout?.on('data', (b: Buffer) => (output += b.toString()));
  child.stderr?.on('data', (b: Buffer) => (output += b.toString()));
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`the app process did not start in 60 s:\n${output}`)), 60_000);
    const check = () => {
      if (output.includes('Cleancase is serving on')) {
        clearTimeout(timer);
        resolve();
      }
    };
    child.stdout?.on('data', check);
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`the app process ended (${code}) before serving:\n${output}`));
    });
  });
  return { url: `http://127.0.0.1:${port}`, child, output: () => output };
}

/** SIGTERM, SIGKILL after 10 s; resolves once the process has exited. */
export async function stopAppProcess(p: AppProcess | undefined, signal: NodeJS.Signals = 'SIGTERM'): Promise<void> {
  if (!p || p.child.exitCode !== null || p.child.signalCode !== null) return;
  const exited = new Promise<void>((resolve) => p.child.once('exit', () => resolve()));
  p.child.kill(signal);
  const timer = setTimeout(() => p.child.kill('SIGKILL'), 10_000);
  await exited;
  clearTimeout(timer);
}

/** Polls `read` every 200 ms until `done`; fails naming `what` and the last value after `timeoutMs`. */
export async function until<T>(what: string, read: () => Promise<T>, done: (v: T) => boolean, timeoutMs = 60_000): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    let v: T | undefined;
    let failure: unknown;
    try {
      v = await read();
      if (done(v)) return v;
    } catch (err) {
      failure = err;
    }
    if (Date.now() > end) throw new Error(`${what}: still not there after ${timeoutMs / 1000} s (last: ${failure ? String(failure) : JSON.stringify(v)})`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** The session cookie of a sign-in on `url`, as a Cookie header. */
export async function signedInCookie(url: string, email: string): Promise<string> {
  const res = await request(url).post('/api/session').set(CSRF).send({ email, password: TEST_PASSWORD });
  const cookies = ((res.headers['set-cookie'] as unknown as string[] | undefined) ?? []).map((c) => c.split(';')[0]);
  if (res.status !== 200 || cookies.length === 0) throw new Error(`sign-in failed: ${res.status} ${JSON.stringify(res.body)}`);
  return cookies.join('; ');
}

/** A MariaDB of this test file alone (own folder under .data/, own port) that the test may stop and start again. */
export interface PrivateDatabase {
  connection: DbConnection;
  instance: () => MariaDbInstance;
  stop: () => Promise<void>;
  start: () => Promise<void>;
  /** Stops it and removes its folder. */
  remove: () => Promise<void>;
}

export async function startPrivateDatabase(label: string): Promise<PrivateDatabase> {
  const options: MariaDbOptions = {
    // Named like the shared test database's folder, so npm test stops it should this file die without its clean-up.
    dataDir: path.join(ROOT, '.data', `cleancase-test-db-${process.env.CLEANCASE_TEST_RUN ?? 'adhoc'}-fault-${label}-${randomBytes(3).toString('hex')}`),
    port: await freePort(),
    database: 'cleancase_fault',
    user: 'cleancase_fault',
    password: 'fault-test-only-password',
  };
  let instance = await startMariaDb(options);
  let running = true;
  return {
    connection: { host: instance.host, port: instance.port, database: instance.database, user: instance.user, password: instance.password },
    instance: () => instance,
    stop: async () => {
      if (running) await instance.stop();
      running = false;
    },
    start: async () => {
      if (!running) instance = await startMariaDb(options);
      running = true;
    },
    remove: async () => {
      if (running) await instance.stop();
      running = false;
      await rm(options.dataDir, { recursive: true, force: true });
    },
  };
}
