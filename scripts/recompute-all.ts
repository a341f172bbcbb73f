/**
 * `npm run recompute`: recomputes the derived data of every unit in the local database (after a change to
 * the calculation code; setup changes recompute on their own). Uses the private instance of `npm start`.
 */
import path from 'node:path';
import { loadConfig } from '../backend/src/config.js';
import { buildDataSource } from '../backend/src/data-source.js';
import { recomputeUnit } from '../backend/src/services/derived/recompute-unit.js';
import { startMariaDb } from './lib/mariadb.js';

const config = loadConfig();
const db = config.DB_EXTERNAL
  ? null
  : await startMariaDb({
      dataDir: path.resolve(import.meta.dirname, '..', config.DB_DATA_DIR),
      port: config.DB_PORT,
      database: config.DB_NAME,
      user: config.DB_USER,
      password: config.DB_PASSWORD,
    });
const ds = buildDataSource({ host: config.DB_HOST, port: config.DB_PORT, database: config.DB_NAME, user: config.DB_USER, password: config.DB_PASSWORD });
await ds.initialize();
try {
  await ds.runMigrations({ transaction: 'each' });
  const units: { id: string; name: string }[] = await ds.query('SELECT id, name FROM generating_unit ORDER BY name');
  for (const u of units) {
    const started = Date.now();
    const outcome = await recomputeUnit(ds, u.id);
    console.log(
      `${u.name}: ${outcome.samples} samples, ${outcome.days} days, ${outcome.cycles.length} cleaning cycles in ${((Date.now() - started) / 1000).toFixed(1)} s`,
    );
  }
} finally {
  await ds.destroy();
  await db?.stop();
}
