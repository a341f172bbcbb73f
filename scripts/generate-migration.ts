/**
 * `npm run migration:generate -- <Name>`: starts a throwaway MariaDB, applies the existing migrations, asks
 * TypeORM for the SQL that brings the schema in line with the entities, and writes it as a new migration
 * in backend/src/migrations/ (then add it to migrations/index.ts). Review the SQL before committing.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { buildDataSource } from '../backend/src/data-source.js';
import { freePort } from './lib/free-port.js';
import { startMariaDb } from './lib/mariadb.js';

const name = process.argv[2];
if (!name || !/^[A-Z][A-Za-z0-9]+$/.test(name)) {
  console.error('usage: npm run migration:generate -- PascalCaseName');
  process.exit(2);
}
const dataDir = mkdtempSync(path.join(os.tmpdir(), 'cleancase-gen-'));
const db = await startMariaDb({ dataDir, port: await freePort(), database: 'gen', user: 'gen', password: 'gen-password' });
try {
  const ds = buildDataSource({ host: db.host, port: db.port, database: 'gen', user: 'gen', password: 'gen-password' });
  await ds.initialize();
  await ds.runMigrations({ transaction: 'each' });
  const log = await ds.driver.createSchemaBuilder().log();
  await ds.destroy();
  if (log.upQueries.length === 0) {
    console.log('The schema already matches the entities: no migration written.');
  } else {
    const stamp = Date.now();
    const esc = (q: string) => q.replace(/\\/g, '\\\\').replace(/`/g, '\\`');
    const up = log.upQueries.map((q) => `    await q.query(\`${esc(q.query)}\`);`).join('\n');
    const down = [...log.downQueries]
      .reverse()
      .map((q) => `    await q.query(\`${esc(q.query)}\`);`)
      .join('\n');
    const file = path.join(
      import.meta.dirname,
      '..',
      'backend',
      'src',
      'migrations',
      `${stamp}-${name.replace(/([a-z0-9])([A-Z])/g, '$1-$2').toLowerCase()}.ts`,
    );
    writeFileSync(
      file,
      `import type { MigrationInterface, QueryRunner } from 'typeorm';\n\nexport class ${name}${stamp} implements MigrationInterface {\n  name = '${name}${stamp}';\n\n  async up(q: QueryRunner): Promise<void> {\n${up}\n  }\n\n  async down(q: QueryRunner): Promise<void> {\n${down}\n  }\n}\n`,
    );
    console.log(`Wrote ${path.relative(process.cwd(), file)}: add ${name}${stamp} to backend/src/migrations/index.ts`);
  }
} finally {
  await db.stop();
  rmSync(dataDir, { recursive: true, force: true });
}
