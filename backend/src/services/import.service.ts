/**
 * Historian imports: upload → mapping (guessed, or the unit's saved one) → a background job that checks the
 * whole file first (a wrong file imports nothing and lists every error by row and column) and only then
 * stores the rows under one import id (a failure part-way deletes them all) → a queued recompute of derived data.
 * Re-imported rows identical to stored ones are skipped; rows at a stored time with other values are
 * reported as conflicts and not stored. Undo deletes an import's rows and recomputes. The job itself is
 * services/import-job/run-import-job.ts.
 */
import { rm } from 'node:fs/promises';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { importMappingSchema, type ImportMapping, type ImportMappingInput } from '@shared/schemas/import-mapping.js';
import { importCounts, importView as importViewSchema, rowError, type ImportCounts, type ImportView } from '@shared/schemas/imports.js';
import { formatRowErrorReportCsv, guessMapping, openTable, type RowError } from '../import/index.js';
import { averagingFromText, detectTallShape, guessTallMapping, listTags } from '../import/tall-detection.js';
import { DataImport } from '../entities/data-import.entity.js';
import { GeneratingUnit } from '../entities/generating-unit.entity.js';
import { AppError, badRequest } from '../http/app-error.js';
import { enqueueJob, enqueueRecompute } from '../jobs/job-queue.js';
import type { TenantScope } from '../policies/tenant-scope.js';
import { foundInScope } from '../repositories/found-in-scope.js';
import { findImportInScope, importsOfUnitInScope } from '../repositories/import.repository.js';
import { findUnit, findUnitWithPlant } from '../repositories/plant.repository.js';
import { deleteSamplesOfImport } from '../repositories/sample.repository.js';
import { recordAudit } from './audit.service.js';

export interface UploadedFile {
  path: string;
  originalname: string;
  size: number;
}

const ERRORS_IN_VIEW = 200;

/** The JSON columns read with their schemas: a value that does not fit is shown as none, never passed on as it is. */
const storedErrors = z.array(rowError);
const storedCounts = importCounts.nullable();
const errorsOf = (i: DataImport): RowError[] => storedErrors.safeParse(i.errors ?? []).data ?? [];
const countsOf = (i: DataImport): ImportCounts | null => storedCounts.safeParse(i.counts ?? null).data ?? null;
const mappingOf = (i: DataImport): ImportMappingInput | null => importViewSchema.shape.mapping.safeParse(i.mapping ?? null).data ?? null;

export function importView(i: DataImport, allErrors = false, uploadedBy: string | null = null): ImportView {
  const errors = errorsOf(i);
  return {
    id: i.id,
    unitId: i.unitId,
    fileName: i.fileName,
    fileBytes: i.fileBytes,
    fileKind: i.fileKind,
    status: i.status,
    progress: i.progress,
    message: i.message,
    counts: countsOf(i),
    errorCount: i.errorCount,
    errors: allErrors ? errors : errors.slice(0, ERRORS_IN_VIEW),
    notes: i.notes,
    firstTimestamp: i.firstTimestamp?.toISOString() ?? null,
    lastTimestamp: i.lastTimestamp?.toISOString() ?? null,
    createdAt: i.createdAt.toISOString(),
    finishedAt: i.finishedAt?.toISOString() ?? null,
    mapping: mappingOf(i),
    uploadedBy,
  };
}

export const findImport = (ds: DataSource, scope: TenantScope, importId: string): Promise<DataImport> =>
  foundInScope(findImportInScope(ds.manager, scope, importId), 'No such import');

/** The unit an upload goes to, checked before a byte of the file is stored. */
export const unitForUpload = (ds: DataSource, scope: TenantScope, unitId: string): Promise<GeneratingUnit> =>
  foundInScope(findUnit(ds.manager, scope, unitId), 'No such unit');

/** Reads a stored upload's header, units row, title lines and first rows (XLSX: the given sheet, else the first). */
async function readPreview(filePath: string, sheet?: string) {
  const table = await openTable(filePath, sheet !== undefined ? { sheet } : {});
  let head;
  try {
    head = {
      kind: table.kind,
      headers: table.headers,
      units: table.units,
      titleLines: table.titleLines,
      sampleRows: table.sampleRows.slice(0, 10),
      sheets: table.sheets ?? [],
      sheet: table.sheet ?? null,
    };
  } finally {
    await table.close();
  }
  // a tall file (one row per tag per time): one more pass lists its tags for the mapping
  const tallShape = detectTallShape(head.headers, head.sampleRows);
  const tall = tallShape ? { shape: tallShape, ...(await listTags(filePath, tallShape, head.sheet ?? undefined)) } : null;
  return { ...head, tall };
}

/** The proposed mapping of a preview: the unit's saved one when it fits the file, else a guess (which reads the units row). */
function proposeMapping(preview: Awaited<ReturnType<typeof readPreview>>, unit: GeneratingUnit, timeZone: string) {
  const tallGuess = preview.tall
    ? guessTallMapping(preview.tall.shape, preview.headers, preview.sampleRows, preview.tall.tags, preview.tall.medianSpacingMinutes, timeZone)
    : null;
  const guess = tallGuess ? { ...tallGuess.guess, mapping: tallGuess.mapping } : guessMapping(preview.headers, preview.sampleRows, { timeZone });
  const saved = unit.savedMapping ? importMappingSchema.safeParse(unit.savedMapping) : null;
  const savedFits =
    saved?.success &&
    (preview.tall
      ? !!saved.data.tall &&
        tallMappingFits(
          saved.data,
          preview.headers,
          preview.tall.tags.map((t) => t.name),
        )
      : !saved.data.tall && headersCover(saved.data, preview.headers));
  const sheet = preview.sheet !== null && preview.sheets.length > 1 ? { sheet: preview.sheet } : {};
  const averaging = averagingFromText([...preview.titleLines, ...preview.headers]);
  if (averaging !== undefined && !savedFits) guess.mapping = { ...guess.mapping, averagingMinutes: averaging };
  const mapping = savedFits ? { ...saved!.data, ...sheet } : { ...guess.mapping, ...sheet };
  return { guess, mapping, source: savedFits ? ('saved' as const) : ('guessed' as const) };
}

const previewAnswer = (imp: DataImport, preview: Awaited<ReturnType<typeof readPreview>>, proposed: ReturnType<typeof proposeMapping>) => ({
  import: importView(imp),
  shape: preview.tall ? ('tall' as const) : ('wide' as const),
  tags: preview.tall?.tags ?? [],
  moreTags: preview.tall?.moreTags ?? false,
  headers: preview.headers,
  units: preview.units,
  titleLines: preview.titleLines,
  sheets: preview.sheets,
  sheet: preview.sheet,
  sampleRows: preview.sampleRows,
  guess: proposed.guess,
  proposedMapping: imp.mapping,
  mappingSource: proposed.source,
});

/** Stores the upload, reads its header and first rows, and proposes a mapping (the unit's saved one when it fits). */
export async function receiveUpload(ds: DataSource, scope: TenantScope, unitId: string, file: UploadedFile) {
  const { unit, plant } = await foundInScope(findUnitWithPlant(ds.manager, scope, unitId), 'No such unit').catch(async (err: unknown) => {
    await rm(file.path, { force: true });
    throw err;
  });
  let preview;
  try {
    preview = await readPreview(file.path);
  } catch (err) {
    await rm(file.path, { force: true });
    throw badRequest(`This file cannot be read as a table: ${err instanceof Error ? err.message : String(err)}`);
  }
  const proposed = proposeMapping(preview, unit, plant.timeZone);
  const imp = await ds.getRepository(DataImport).save({
    organisationId: scope.organisationId,
    unitId,
    uploadedByUserId: scope.userId,
    fileName: file.originalname.slice(0, 255),
    fileBytes: file.size,
    fileKind: preview.kind,
    status: 'mapping',
    mapping: proposed.mapping,
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
  return previewAnswer(imp, preview, proposed);
}

/** Reads another sheet of an uploaded workbook for the mapping step (the import is still being mapped). */
export async function chooseSheet(ds: DataSource, scope: TenantScope, importId: string, sheet: string) {
  const imp = await findImport(ds, scope, importId);
  if (imp.status !== 'mapping') throw new AppError(409, `This import is ${imp.status} already`);
  if (imp.fileKind !== 'xlsx') throw badRequest('Only an XLSX workbook has sheets to choose from');
  if (!imp.storedPath) throw new AppError(409, 'The uploaded file is gone: upload it again');
  const { unit, plant } = await foundInScope(findUnitWithPlant(ds.manager, scope, imp.unitId), 'No such unit');
  let preview;
  try {
    preview = await readPreview(imp.storedPath, sheet);
  } catch (err) {
    throw badRequest(`This sheet cannot be read as a table: ${err instanceof Error ? err.message : String(err)}`);
  }
  const proposed = proposeMapping(preview, unit, plant.timeZone);
  proposed.mapping = { ...proposed.mapping, sheet };
  await ds.getRepository(DataImport).update({ id: imp.id }, { mapping: proposed.mapping });
  return previewAnswer(await ds.getRepository(DataImport).findOneByOrFail({ id: imp.id }), preview, proposed);
}

/** Whether a saved tall mapping reads this tall file: its columns are in the header and its tags in the file. */
function tallMappingFits(mapping: ImportMapping, headers: string[], tags: string[]): boolean {
  const columns = [mapping.timestamp.column, mapping.tall!.tagColumn, mapping.tall!.valueColumn, ...(mapping.quality ? [mapping.quality.column] : [])];
  return columns.every((c) => headers.includes(c)) && Object.values(mapping.columns).every((ref) => !ref || tags.includes(ref.column));
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
    // Only from 'mapping': of two starts sent at once (a double click) the second changes nothing and is told so.
    const started = await em
      .getRepository(DataImport)
      .update({ id: imp.id, status: 'mapping' }, { status: 'checking', mapping: parsed.data, progress: 0, message: 'Waiting to start' });
    if (!started.affected) throw new AppError(409, 'This import was started already (a moment ago, perhaps by a second click)');
    await em.getRepository(GeneratingUnit).update({ id: imp.unitId }, { savedMapping: parsed.data });
    await enqueueJob(em, { organisationId: imp.organisationId, unitId: imp.unitId, kind: 'import', payload: { importId: imp.id } });
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'import.started',
      entityType: 'import',
      entityId: imp.id,
      details: { fileName: imp.fileName },
    });
  });
  return importView(await ds.getRepository(DataImport).findOneByOrFail({ id: imp.id }));
}

export async function listImports(ds: DataSource, scope: TenantScope, unitId: string): Promise<ImportView[]> {
  const rows = await foundInScope(importsOfUnitInScope(ds.manager, scope, unitId), 'No such unit');
  return rows.map(({ record, uploadedBy }) => importView(record, false, uploadedBy));
}

export async function errorReportCsv(ds: DataSource, scope: TenantScope, importId: string): Promise<{ fileName: string; csv: string }> {
  const imp = await findImport(ds, scope, importId);
  const errors = errorsOf(imp);
  return { fileName: `${imp.fileName.replace(/\.[^.]+$/, '')}-errors.csv`, csv: formatRowErrorReportCsv(errors, Math.max(0, imp.errorCount - errors.length)) };
}

/** Undo: delete the import's rows (the record stays, marked undone) and recompute the unit. */
export async function undoImport(ds: DataSource, scope: TenantScope, importId: string): Promise<ImportView> {
  const imp = await findImport(ds, scope, importId);
  if (imp.status !== 'complete' && imp.status !== 'rejected' && imp.status !== 'failed' && imp.status !== 'mapping') {
    throw new AppError(409, `An import that is ${imp.status} cannot be undone`);
  }
  await ds.transaction(async (em) => {
    await deleteSamplesOfImport(em, imp.id);
    await em.getRepository(DataImport).update({ id: imp.id }, { status: 'undone', message: 'Undone: its rows were removed', finishedAt: new Date() });
    await enqueueRecompute(em, imp.organisationId, imp.unitId, 'import undone');
    await recordAudit(em, {
      organisationId: scope.organisationId,
      userId: scope.userId,
      action: 'import.undone',
      entityType: 'import',
      entityId: imp.id,
      details: { fileName: imp.fileName },
    });
  });
  if (imp.storedPath) await rm(imp.storedPath, { force: true });
  return importView(await ds.getRepository(DataImport).findOneByOrFail({ id: imp.id }));
}
