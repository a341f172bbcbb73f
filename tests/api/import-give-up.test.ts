/**
 * An import job given up after its workers kept dying leaves nothing behind: its rows, and its upload whether a
 * single file or the folder of one file per tag.
 */
import { existsSync } from 'node:fs';
import { mkdir, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DataImport } from '../../backend/src/entities/data-import.entity.js';
import { giveUpImport } from '../../backend/src/services/import-job/run-import-job.js';
import { createTenant } from '../factories/accounts.js';
import { createPlant, createUnit } from '../factories/units.js';
import { makeTempDir } from '../helpers/historian-files.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
let tmp: Awaited<ReturnType<typeof makeTempDir>>;
beforeAll(async () => {
  t = await createTestApp();
  tmp = await makeTempDir();
});
afterAll(async () => {
  await tmp?.cleanup();
  await t?.close();
});

describe('giving up an import', () => {
  it('removes the folder of one-tag files and marks the import failed', async () => {
    const tenant = await createTenant(t.dataSource, 'give-up-folder');
    const unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    const folder = tmp.file('upload-folder');
    await mkdir(folder);
    await writeFile(path.join(folder, '1.upload'), 'Timestamp,BP\n2026-01-01T00:00:00Z,5\n');
    await writeFile(path.join(folder, 'files.json'), '[]');
    const imp = await t.dataSource.getRepository(DataImport).save({
      organisationId: tenant.organisation.id,
      unitId: unit.id,
      uploadedByUserId: null,
      fileName: '2 files',
      fileBytes: 40,
      fileKind: 'csv',
      status: 'importing',
      mapping: {},
      counts: null,
      errors: null,
      errorCount: 0,
      notes: null,
      progress: 0.5,
      message: null,
      storedPath: folder,
      firstTimestamp: null,
      lastTimestamp: null,
      finishedAt: null,
    } as Partial<DataImport>);
    await giveUpImport(t.dataSource.manager, imp.id, 'the worker kept stopping');
    expect(existsSync(folder)).toBe(false);
    const after = await t.dataSource.getRepository(DataImport).findOneByOrFail({ id: imp.id });
    expect(after.status).toBe('failed');
    expect(after.storedPath).toBeNull();
    expect(after.message).toMatch(/stored nothing: the worker kept stopping/);
  });
});
