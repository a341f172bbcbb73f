import { randomBytes } from 'node:crypto';
import { spawnSync } from 'node:child_process';
import { inject } from 'vitest';
import type { DataSource } from 'typeorm';
import { buildDataSource, type DbConnection } from '../../backend/src/data-source.js';

/** Creates an empty database on the test instance for one test file (root over the socket). */
export function createEmptyDatabase(prefix = 'cc'): DbConnection {
  const info = inject('testDb');
  const name = `${prefix}_${randomBytes(4).toString('hex')}`;
  const sql = `CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
    GRANT ALL PRIVILEGES ON \`${name}\`.* TO '${info.user}'@'localhost';
    GRANT ALL PRIVILEGES ON \`${name}\`.* TO '${info.user}'@'127.0.0.1';`;
  const r = spawnSync('mariadb', ['--protocol=socket', `--socket=${info.socket}`, '-uroot', '-e', sql], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`could not create test database: ${r.stderr}`);
  return { host: info.host, port: info.port, user: info.user, password: info.password, database: name };
}

/** A fresh, fully migrated database for one test file. */
export async function migratedDataSource(prefix?: string): Promise<{ dataSource: DataSource; connection: DbConnection }> {
  const connection = createEmptyDatabase(prefix);
  const dataSource = buildDataSource(connection);
  await dataSource.initialize();
  await dataSource.runMigrations({ transaction: 'each' });
  return { dataSource, connection };
}
