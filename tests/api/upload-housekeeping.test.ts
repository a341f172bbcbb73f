/**
 * Uploaded files waiting to be mapped hold disk space: an organisation may keep a bounded amount of them waiting
 * (a further upload is refused in our words until some are imported or undone), uploads left unmapped for a week are
 * discarded with their files, and deleting a unit or plant removes the files of its uploads.
 */
import { existsSync } from 'node:fs';
import { mkdir, readdir, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DataImport } from '../../backend/src/entities/data-import.entity.js';
import { discardStaleUploads, UPLOAD_WAITING_LIMIT_BYTES } from '../../backend/src/services/upload-housekeeping.js';
import { createTenant, CSRF, signedInAgent } from '../factories/accounts.js';
import { createPlant, createUnit } from '../factories/units.js';
import { makeTempDir, physicalHistory, writeHistorianCsv } from '../helpers/historian-files.js';
import { TEST_CONDENSER, TEST_TURBINE } from '../factories/units.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

let t: TestApp;
let tmp: Awaited<ReturnType<typeof makeTempDir>>;
let csv: string;
beforeAll(async () => {
  t = await createTestApp();
  tmp = await makeTempDir();
  csv = await writeHistorianCsv(
    tmp.file('day.csv'),
    physicalHistory({ startUtc: Date.UTC(2025, 0, 1), hours: 24, condenser: TEST_CONDENSER, turbine: TEST_TURBINE }),
  );
});
afterAll(async () => {
  await tmp?.cleanup();
  await t?.close();
});

const uploadDir = () => path.resolve(t.config.UPLOAD_DIR);

async function waitingImport(organisationId: string, unitId: string, fileBytes: number, storedPath: string | null, createdAt?: Date) {
  const repo = t.dataSource.getRepository(DataImport);
  const saved = await repo.save({
    organisationId,
    unitId,
    uploadedByUserId: null,
    fileName: 'waiting.csv',
    fileBytes,
    fileKind: 'csv',
    status: 'mapping',
    mapping: {},
    counts: null,
    errors: null,
    errorCount: 0,
    notes: null,
    progress: 0,
    message: null,
    storedPath,
    firstTimestamp: null,
    lastTimestamp: null,
    finishedAt: null,
  } as Partial<DataImport>);
  if (createdAt) await t.dataSource.query('UPDATE data_import SET createdAt = ? WHERE id = ?', [createdAt, saved.id]);
  return saved;
}

async function storedFile(name: string): Promise<string> {
  const dir = path.join(uploadDir(), 'housekeeping-test');
  await mkdir(dir, { recursive: true });
  const file = path.join(dir, name);
  await writeFile(file, 'Timestamp,BP\n');
  return file;
}

describe('uploads waiting to be mapped', () => {
  it('refuses a further upload once the organisation has its limit of bytes waiting, and stores nothing', async () => {
    const tenant = await createTenant(t.dataSource, 'uploads-waiting');
    const unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    const analyst = await signedInAgent(t.app, tenant.users.analyst.email);
    await waitingImport(tenant.organisation.id, unit.id, UPLOAD_WAITING_LIMIT_BYTES, null);
    const before = await readdir(uploadDir()).catch(() => []);
    const res = await analyst.post(`/api/units/${unit.id}/uploads`).set(CSRF).attach('file', csv);
    expect(res.status, JSON.stringify(res.body)).toBe(409);
    expect(res.body.error ?? res.body.message).toMatch(/waiting to be mapped/);
    expect(await t.dataSource.getRepository(DataImport).countBy({ unitId: unit.id })).toBe(1);
    expect(await readdir(uploadDir()).catch(() => [])).toEqual(before);
    // another organisation is not held back by this one's waiting files
    const other = await createTenant(t.dataSource, 'uploads-waiting-other');
    const otherUnit = await createUnit(t.dataSource, await createPlant(t.dataSource, other.organisation.id));
    const otherAnalyst = await signedInAgent(t.app, other.users.analyst.email);
    expect((await otherAnalyst.post(`/api/units/${otherUnit.id}/uploads`).set(CSRF).attach('file', csv)).status).toBe(201);
  });

  it('discards uploads left unmapped for a week with their files, and keeps newer ones and finished imports', async () => {
    const tenant = await createTenant(t.dataSource, 'uploads-stale');
    const unit = await createUnit(t.dataSource, await createPlant(t.dataSource, tenant.organisation.id));
    const now = new Date('2026-12-02T12:00:00Z');
    const oldFile = await storedFile('old.upload');
    const newFile = await storedFile('new.upload');
    const old = await waitingImport(tenant.organisation.id, unit.id, 100, oldFile, new Date('2026-11-24T12:00:00Z'));
    const recent = await waitingImport(tenant.organisation.id, unit.id, 100, newFile, new Date('2026-12-01T12:00:00Z'));
    const done = await waitingImport(tenant.organisation.id, unit.id, 100, null, new Date('2026-10-01T12:00:00Z'));
    await t.dataSource.getRepository(DataImport).update({ id: done.id }, { status: 'complete' });
    expect(await discardStaleUploads(t.dataSource, now)).toBeGreaterThanOrEqual(1);
    expect(await t.dataSource.getRepository(DataImport).findOneBy({ id: old.id })).toBeNull();
    expect(existsSync(oldFile)).toBe(false);
    expect(await t.dataSource.getRepository(DataImport).findOneBy({ id: recent.id })).not.toBeNull();
    expect(existsSync(newFile)).toBe(true);
    expect(await t.dataSource.getRepository(DataImport).findOneBy({ id: done.id })).not.toBeNull();
  });

  it('deleting a unit removes the files of its uploads waiting to be mapped', async () => {
    const tenant = await createTenant(t.dataSource, 'uploads-unit-deleted');
    const plant = await createPlant(t.dataSource, tenant.organisation.id);
    const unit = await createUnit(t.dataSource, plant);
    const admin = await signedInAgent(t.app, tenant.users.admin.email);
    const up = await admin.post(`/api/units/${unit.id}/uploads`).set(CSRF).attach('file', csv);
    expect(up.status).toBe(201);
    const stored = (await t.dataSource.getRepository(DataImport).findOneByOrFail({ id: up.body.import.id })).storedPath!;
    expect(existsSync(stored)).toBe(true);
    expect((await admin.delete(`/api/units/${unit.id}`).set(CSRF)).status).toBe(204);
    expect(existsSync(stored)).toBe(false);
    // and a plant's
    const unit2 = await createUnit(t.dataSource, plant);
    const up2 = await admin.post(`/api/units/${unit2.id}/uploads`).set(CSRF).attach('file', csv);
    const stored2 = (await t.dataSource.getRepository(DataImport).findOneByOrFail({ id: up2.body.import.id })).storedPath!;
    expect((await admin.delete(`/api/plants/${plant.id}`).set(CSRF)).status).toBe(204);
    expect(existsSync(stored2)).toBe(false);
  });
});
