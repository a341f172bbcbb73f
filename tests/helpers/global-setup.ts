/**
 * Vitest global setup for database-backed suites: a private MariaDB on a free port with a throwaway data
 * folder, stopped and removed at the end even when tests fail. Each test file gets a fresh database.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { freePort } from '../../scripts/lib/free-port.js';
import { startMariaDb } from '../../scripts/lib/mariadb.js';
import { startStripeFake } from '../../scripts/lib/local-services.js';

export interface TestDbInfo {
  host: string;
  port: number;
  user: string;
  password: string;
  socket: string;
}

declare module 'vitest' {
  export interface ProvidedContext {
    testDb: TestDbInfo;
    /** The Stripe stand-in every test app talks to (one process for the run; each test makes its own customers). */
    stripeApiBase: string;
  }
}

export default async function setup(project: TestProject) {
  const dataDir = mkdtempSync(path.join(os.tmpdir(), `cleancase-test-db-${process.env.CLEANCASE_TEST_RUN ?? 'adhoc'}-`));
  const db = await startMariaDb({ dataDir, port: await freePort(), database: 'cleancase_test', user: 'cleancase_test', password: 'test-only-password' });
  project.provide('testDb', { host: db.host, port: db.port, user: db.user, password: db.password, socket: db.socket });
  const stripe = await startStripeFake(await freePort());
  project.provide('stripeApiBase', stripe.apiBase);
  return async () => {
    await stripe.stop();
    await db.stop();
    rmSync(dataDir, { recursive: true, force: true });
  };
}
