import { afterAll, describe, expect, it } from 'vitest';
import { buildDataSource } from '../../backend/src/data-source.js';
import { createEmptyDatabase } from '../helpers/test-database.js';

describe('migrations', () => {
  const connection = createEmptyDatabase('mig');
  const dataSource = buildDataSource(connection);
  afterAll(async () => {
    if (dataSource.isInitialized) await dataSource.destroy();
  });

  const tables = async () =>
    (await dataSource.query('SELECT table_name AS t FROM information_schema.tables WHERE table_schema = ? ORDER BY t', [connection.database])).map(
      (r: { t: string }) => r.t,
    );

  it('run all the way up, all the way down, and up again to the same schema', async () => {
    await dataSource.initialize();
    const applied = await dataSource.runMigrations({ transaction: 'each' });
    expect(applied.length).toBe(dataSource.migrations.length);
    const afterFirstUp = await tables();
    expect(afterFirstUp).toEqual(expect.arrayContaining(['organisation', 'user', 'membership', 'audit_event', 'sessions', 'migrations']));

    for (let i = 0; i < applied.length; i++) await dataSource.undoLastMigration({ transaction: 'each' });
    expect(await tables()).toEqual(['migrations']);

    await dataSource.runMigrations({ transaction: 'each' });
    expect(await tables()).toEqual(afterFirstUp);
  });

  it('leave entity metadata and schema in agreement (no pending schema change)', async () => {
    const sql = await dataSource.driver.createSchemaBuilder().log();
    expect(sql.upQueries.map((q) => q.query)).toEqual([]);
  });
});
