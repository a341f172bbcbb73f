/**
 * One connection pool per process: the session store runs its statements on the data source's own mysql2 pool
 * (so two processes on one MariaDB hold two pools, not four), and only one mysql2 is installed.
 */
import { createRequire } from 'node:module';
import path from 'node:path';
import type { MysqlDriver } from 'typeorm/driver/mysql/MysqlDriver.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSessionStore } from '../../backend/src/http/session-store.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => t?.close());

describe('the session store', () => {
  it('runs on the data source’s pool and leaves it open when it closes', async () => {
    const store = createSessionStore(t.dataSource);
    const pool = (t.dataSource.driver as MysqlDriver).pool as unknown;
    expect((store as unknown as { connection: unknown }).connection).toBe(pool);
    await new Promise<void>((resolve, reject) =>
      store.set('shared-pool-check', { cookie: { originalMaxAge: 60_000 } } as never, (e) => (e ? reject(e) : resolve())),
    );
    const rows: { session_id: string }[] = await t.dataSource.query("SELECT session_id FROM sessions WHERE session_id = 'shared-pool-check'");
    expect(rows).toHaveLength(1);
    await store.close();
    // The app's pool still answers after the store closed.
    expect(await t.dataSource.query('SELECT 1 AS one')).toEqual([{ one: 1 }]);
  });

  it('uses the one mysql2 the app uses (no second copy under express-mysql-session)', () => {
    const root = path.resolve(import.meta.dirname, '..', '..');
    const fromApp = createRequire(path.join(root, 'package.json')).resolve('mysql2');
    const fromStore = createRequire(createRequire(path.join(root, 'package.json')).resolve('express-mysql-session')).resolve('mysql2');
    expect(fromStore).toBe(fromApp);
  });
});
