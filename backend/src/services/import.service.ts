/**
 * Historian imports: upload → mapping (guessed, or the unit's saved one) → a background job that checks the
 * whole file first (a wrong file imports nothing and lists every error by row and column) and only then
 * stores the rows under one import id (a failure part-way deletes them all) → a queued recompute of derived data.
 * Re-imported rows identical to stored ones are skipped; rows at a stored time with other values are
 * reported as conflicts and not stored. Undo deletes an import's rows and recomputes.
 */
import { rm } from 'node:fs/promises';
import { In, type DataSource, type EntityManager } from 'typeorm';
import { User } from '../entities/user.entity.js';
import { importMappingSchema } from '@shared/schemas/import-mapping.js';
import { checkImportFile, formatRowErrorReportCsv, guessMapping, importSamples, openTable, type ImportSample, type RowError } from '../import/index.js';
import { DataImport } from '../entities/data-import.entity.js';
import { GeneratingUnit } from '../entities/generating-unit.entity.js';
import { AppError, badRequest, notFound } from '../http/app-error.js';
import { enqueueJob, enqueueRecompute, LostJobLockError, reportProgress, withLease, type JobLease } from '../jobs/job-queue.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { findUnit, findUnitWithPlant } from '../repositories/plant.repository.js';
import { recordAudit } from './audit.service.js';

export interface UploadedFile {
  path: string;
  originalname: string;
  size: number;
}

export interface ImportView {
  id: string;
  unitId: string;
  fileName: string;
  fileBytes: number;
  fileKind: string | null;
  status: DataImport['status'];
  progress: number;
  message: string | null;
  counts: Record<string, unknown> | null;
  errorCount: number;
  errors: RowError[];
  notes: DataImport['notes'];
  firstTimestamp: string | null;
  lastTimestamp: string | null;
  createdAt: string;
  finishedAt: string | null;
  mapping: unknown;
  uploadedBy: string | null;
}

const ERRORS_IN_VIEW = 200;

export function importView(i: DataImport, allErrors = false, uploadedBy: string | null = null): ImportView {
  const errors = (Array.isArray(i.errors) ? i.errors : []) as RowError[];
  return {
    id: i.id,
    unitId: i.unitId,
    fileName: i.fileName,
    fileBytes: i.fileBytes,
    fileKind: i.fileKind,
    status: i.status,
    progress: i.progress,
    message: i.message,
    counts: i.counts,
    errorCount: i.errorCount,
    errors: allErrors ? errors : errors.slice(0, ERRORS_IN_VIEW),
    notes: i.notes,
    firstTimestamp: i.firstTimestamp?.toISOString() ?? null,
    lastTimestamp: i.lastTimestamp?.toISOString() ?? null,
    createdAt: i.createdAt.toISOString(),
    finishedAt: i.finishedAt?.toISOString() ?? null,
    mapping: i.mapping,
    uploadedBy,
  };
}

async function unitInScope(ds: DataSource, scope: TenantScope, unitId: string): Promise<GeneratingUnit> {
  const unit = await findUnit(ds.manager, scope, unitId);
  if (!unit) throw notFound('No such unit');
  return unit;
}

export async function findImport(ds: DataSource, scope: TenantScope, importId: string): Promise<DataImport> {
  const imp = await ds.getRepository(DataImport).findOneBy({ id: importId, organisationId: scope.organisationId });
  if (!imp || !(await findUnit(ds.manager, scope, imp.unitId))) throw notFound('No such import');
  return imp;
}

/** Stores the upload, reads its header and first rows, and proposes a mapping (the unit's saved one when it fits). */
export async function receiveUpload(ds: DataSource, scope: TenantScope, unitId: string, file: UploadedFile) {
  const found = await findUnitWithPlant(ds.manager, scope, unitId);
  if (!found) {
    await rm(file.path, { force: true });
    throw notFound('No such unit');
  }
  const { unit, plant } = found;
  let table;
  try {
    table = await openTable(file.path);
  } catch (err) {
    await rm(file.path, { force: true });
    throw badRequest(`This file cannot be read as a table: ${err instanceof Error ? err.message : String(err)}`);
  }
  const headers = table.headers;
  const sampleRows = table.sampleRows.slice(0, 10);
  const kind = table.kind;
  await table.close();
  const guess = guessMapping(headers, sampleRows, { timeZone: plant.timeZone });
  const saved = unit.savedMapping ? importMappingSchema.safeParse(unit.savedMapping) : null;
  const savedFits = saved?.success && headersCover(saved.data, headers);
  const imp = await ds.getRepository(DataImport).save({
    organisationId: scope.organisationId,
    unitId,
    uploadedByUserId: scope.userId,
    fileName: file.originalname.slice(0, 255),
    fileBytes: file.size,
    fileKind: kind,
    status: 'mapping',
    mapping: savedFits ? saved!.data : guess.mapping,
    counts: null,
    errors: null,
    errorCount: 0,
    notes: null,
    progress: 0,
    message: null,
    storedPath: file.path,
    firstTimestamp: null,
    lastTimestamp: null,
    finishedAt: null,
  });
  return { import: importView(imp), headers, sampleRows, guess, proposedMapping: imp.mapping, mappingSource: savedFits ? 'saved' : 'guessed' };
}

/** Whether every column a mapping names is among the file's headers. */
function headersCover(mapping: unknown, headers: string[]): boolean {
  const named = JSON.stringify(mapping).match(/"column":"([^"]*)"/g) ?? [];
  return named.every((m) => headers.includes(JSON.parse(`{${m}}`).column));
}

/** Confirms the mapping and queues the import job. */
export async function startImport(ds: DataSource, scope: TenantScope, importId: string, mapping: unknown): Promise<ImportView> {
  const imp = await findImport(ds, scope, importId);
  if (imp.status !== 'mapping') throw new AppError(409, `This import is ${imp.status} already`);
  const parsed = importMappingSchema.safeParse(mapping);
  if (!parsed.success) {
    throw badRequest('The column mapping is incomplete', { fieldErrors: parsed.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message })) });
  }
  await ds.transaction(async (em) => {
    await em.getRepository(DataImport).update({ id: imp.id }, { status: 'checking', mapping: parsed.data, progress: 0, message: 'Waiting to start' });
    await em.getRepository(GeneratingUnit).update({ id: imp.unitId }, { savedMapping: parsed.data });
    await enqueueJob(em, { organisationId: imp.organisationId, unitId: imp.unitId, kind: 'import', payload: { importId: imp.id } });
    await recordAudit(em, { organisationId: scope.organisationId, userId: scope.userId, action: 'import.started', entityType: 'import', entityId: imp.id, details: { fileName: imp.fileName } });
  });
  return importView(await ds.getRepository(DataImport).findOneByOrFail({ id: imp.id }));
}

export async function listImports(ds: DataSource, scope: TenantScope, unitId: string): Promise<ImportView[]> {
  await unitInScope(ds, scope, unitId);
  const rows = await ds.getRepository(DataImport).find({ where: { unitId, organisationId: scope.organisationId }, order: { createdAt: 'DESC' }, take: 200 });
  const ids = [...new Set(rows.map((r) => r.uploadedByUserId).filter((id): id is string => !!id))];
  const names = new Map((ids.length ? await ds.getRepository(User).findBy({ id: In(ids) }) : []).map((u) => [u.id, u.name]));
  return rows.map((r) => importView(r, false, r.uploadedByUserId ? (names.get(r.uploadedByUserId) ?? null) : null));
}

export async function errorReportCsv(ds: DataSource, scope: TenantScope, importId: string): Promise<{ fileName: string; csv: string }> {
  const imp = await findImport(ds, scope, importId);
  const errors = (Array.isArray(imp.errors) ? imp.errors : []) as RowError[];
  return { fileName: `${imp.fileName.replace(/\.[^.]+$/, '')}-errors.csv`, csv: formatRowErrorReportCsv(errors, Math.max(0, imp.errorCount - errors.length)) };
}

/** Undo: delete the import's rows (the record stays, marked undone) and recompute the unit. */
export async function undoImport(ds: DataSource, scope: TenantScope, importId: string): Promise<ImportView> {
  const imp = await findImport(ds, scope, importId);
  if (imp.status !== 'complete' && imp.status !== 'rejected' && imp.status !== 'failed' && imp.status !== 'mapping') {
    throw new AppError(409, `An import that is ${imp.status} cannot be undone`);
  }
  await ds.transaction(async (em) => {
    await em.query('DELETE FROM performance_sample WHERE importId = ?', [imp.id]);
    await em.getRepository(DataImport).update({ id: imp.id }, { status: 'undone', message: 'Undone: its rows were removed', finishedAt: new Date() });
    await enqueueRecompute(em, imp.organisationId, imp.unitId, 'import undone');
    await recordAudit(em, { organisationId: scope.organisationId, userId: scope.userId, action: 'import.undone', entityType: 'import', entityId: imp.id, details: { fileName: imp.fileName } });
  });
  if (imp.storedPath) await rm(imp.storedPath, { force: true });
  return importView(await ds.getRepository(DataImport).findOneByOrFail({ id: imp.id }));
}

const SAMPLE_COLUMNS = [
  'unitId', 'importId', 'timestampUtc', 'loadMw', 'backpressureKpa', 'cwInletC', 'cwOutletC', 'cwFlowM3s', 'flowAssumed',
  'hotwellC', 'dissolvedOxygenPpb', 'airRemovalKgS', 'barometerKpa', 'cwDifferentialPressureKpa', 'condensateFlowKgS', 'validity', 'setupVersion',
] as const;

const sameValue = (a: number | null, b: number | null | undefined) => (a === null || a === undefined ? b === null || b === undefined : b !== null && b !== undefined && Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a)));

/** Test hook: throw after this many batches to prove a failure leaves nothing behind. */
export const importFaults = { failAfterBatches: null as number | null };

/** Deletes what a failed import stored and marks it failed; the rows go as a whole (one import id). */
async function failImport(em: EntityManager, importId: string, reason: string): Promise<void> {
  await em.query('DELETE FROM performance_sample WHERE importId = ?', [importId]);
  await em.getRepository(DataImport).update({ id: importId }, { status: 'failed', progress: 1, message: `The import stopped and stored nothing: ${reason}`.slice(0, 500), finishedAt: new Date() });
}

/** An import job given up after its workers kept dying: nothing of it stays. */
export async function giveUpImport(em: EntityManager, importId: string, reason: string): Promise<void> {
  const imp = await em.getRepository(DataImport).findOneBy({ id: importId });
  if (!imp || (imp.status !== 'checking' && imp.status !== 'importing')) return;
  await failImport(em, importId, reason);
  await em.getRepository(DataImport).update({ id: importId }, { storedPath: null });
  if (imp.storedPath) await rm(imp.storedPath, { force: true });
}

/**
 * The import job: check, then store, then queue the recompute of derived data (as every other change does).
 * Any failure leaves no rows and a failed import. A run that takes over from a worker that died starts again
 * from the check, after removing what the earlier run stored.
 */
export async function runImportJob(ds: DataSource, job: JobLease, importId: string): Promise<void> {
  const imp = await ds.getRepository(DataImport).findOneBy({ id: importId });
  // A run after the work was finished (its worker died before saying so) or undone has nothing to do.
  if (!imp || (imp.status !== 'checking' && imp.status !== 'importing')) return;
  try {
    await checkThenStore(ds, job, imp);
  } catch (err) {
    // The worker that took the job over carries on: touch nothing.
    if (err instanceof LostJobLockError) throw err;
    await withLease(ds, job, (em) => failImport(em, imp.id, err instanceof Error ? err.message : String(err)));
    if (imp.storedPath) await rm(imp.storedPath, { force: true });
    throw err;
  }
}

async function checkThenStore(ds: DataSource, job: JobLease, imp: DataImport): Promise<void> {
  const unit = await ds.getRepository(GeneratingUnit).findOneByOrFail({ id: imp.unitId });
  const repo = ds.getRepository(DataImport);
  if (!imp.storedPath) throw new Error('the uploaded file is gone');
  const storedPath = imp.storedPath;
  const progress = async (fraction: number, message: string) => {
    await reportProgress(ds, job, fraction, message);
    await repo.update({ id: imp.id }, { progress: fraction, message });
  };

  await withLease(ds, job, (em) => em.query('DELETE FROM performance_sample WHERE importId = ?', [imp.id]));
  await progress(0.02, 'Checking every row');
  const check = await checkImportFile(storedPath, { mapping: imp.mapping });
  const notes = { assumptions: check.assumptions, warnings: check.warnings };
  if (!check.ok) {
    const errors = check.fileError ? [{ row: check.fileError.line ?? 0, column: '', value: '', message: check.fileError.message }] : check.errors;
    await withLease(ds, job, (em) =>
      em.getRepository(DataImport).update(
        { id: imp.id },
        {
          status: 'rejected',
          errors: errors as unknown as object,
          errorCount: check.fileError ? 1 : check.errors.length + check.errorsNotListed,
          notes,
          progress: 1,
          message: check.fileError ? check.fileError.message : `The file was not imported: ${(check.errors.length + check.errorsNotListed).toLocaleString('en-US')} problems to fix`,
          counts: { rowsRead: check.dataRows },
          finishedAt: new Date(),
          storedPath: null,
        },
      ),
    );
    await rm(storedPath, { force: true });
    return;
  }

  await repo.update({ id: imp.id }, { status: 'importing', notes });
  let stored = 0;
  let skippedIdentical = 0;
  let conflicting = 0;
  const conflicts: { timestampUtc: string }[] = [];
  let batches = 0;
  const summary = await importSamples(storedPath, {
    mapping: imp.mapping,
    fileOrder: check.order,
    steadiness: { ratingMw: unit.turbine?.ratingMw, minLoadFraction: unit.turbine?.minimumLoadFraction },
    onBatch: async (samples: ImportSample[]) => {
      if (importFaults.failAfterBatches !== null && batches >= importFaults.failAfterBatches) throw new Error('injected fault during import');
      batches++;
      const times = samples.map((s) => new Date(s.timestampUtc));
      const existing: { ts: Date; loadMw: number; backpressureKpa: number; cwInletC: number; cwOutletC: number; cwFlowM3s: number }[] = await ds.query(
        `SELECT timestampUtc AS ts, loadMw, backpressureKpa, cwInletC, cwOutletC, cwFlowM3s FROM performance_sample WHERE unitId = ? AND timestampUtc BETWEEN ? AND ?`,
        [unit.id, times[0], times[times.length - 1]],
      );
      const byTime = new Map(existing.map((e) => [new Date(e.ts).getTime(), e]));
      const fresh: ImportSample[] = [];
      for (const s of samples) {
        const old = byTime.get(s.timestampUtc);
        if (!old) fresh.push(s);
        else if (sameValue(old.loadMw, s.loadMw) && sameValue(old.backpressureKpa, s.backpressureKpa) && sameValue(old.cwInletC, s.cwInletC) && sameValue(old.cwOutletC, s.cwOutletC) && sameValue(old.cwFlowM3s, s.cwFlowM3s)) skippedIdentical++;
        else {
          conflicting++;
          if (conflicts.length < 200) conflicts.push({ timestampUtc: new Date(s.timestampUtc).toISOString() });
        }
      }
      if (fresh.length) {
        const values: unknown[] = [];
        for (const s of fresh) {
          values.push(unit.id, imp.id, new Date(s.timestampUtc), s.loadMw, s.backpressureKpa, s.cwInletC, s.cwOutletC, s.cwFlowM3s, s.flowAssumed,
            s.hotwellC ?? null, s.dissolvedOxygenPpb ?? null, s.airRemovalKgS ?? null, s.barometerKpa ?? null, s.cwDifferentialPressureKpa ?? null, s.condensateFlowKgS ?? null,
            s.validity, unit.setupVersion);
        }
        // Written only while this worker still holds the job: a worker that lost it stores nothing more.
        await withLease(ds, job, (em) => em.query(`INSERT INTO performance_sample (${SAMPLE_COLUMNS.join(', ')}) VALUES ${fresh.map(() => `(${SAMPLE_COLUMNS.map(() => '?').join(',')})`).join(',')}`, values));
        stored += fresh.length;
      }
      await progress(0.05 + 0.9 * (stored + skippedIdentical + conflicting) / Math.max(1, check.dataRows), `Stored ${stored.toLocaleString('en-US')} of ${check.dataRows.toLocaleString('en-US')} rows`);
    },
  });
  await withLease(ds, job, async (em) => {
    await em.getRepository(DataImport).update(
      { id: imp.id },
      {
        status: 'complete',
        progress: 1,
        message: null,
        finishedAt: new Date(),
        storedPath: null,
        counts: { rowsRead: summary.rowsRead, stored, skippedIdentical, conflicting, conflicts, rowsOk: summary.rowsOk, rowsByReason: summary.rowsByReason, flowAssumedRows: summary.flowAssumedRows },
        firstTimestamp: summary.firstTimestampUtc !== null ? new Date(summary.firstTimestampUtc) : null,
        lastTimestamp: summary.lastTimestampUtc !== null ? new Date(summary.lastTimestampUtc) : null,
        notes: { assumptions: summary.assumptions, warnings: check.warnings },
      },
    );
    await enqueueRecompute(em, imp.organisationId, unit.id, 'import complete');
  });
  await rm(storedPath, { force: true });
}
