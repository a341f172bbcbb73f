/**
 * Historian imports: upload → mapping (guessed, or the unit's saved one) → a background job that checks the
 * whole file first (a wrong file imports nothing and lists every error by row and column) and only then
 * stores the rows under one import id (a failure part-way deletes them all) → a queued recompute of derived data.
 * Re-imported rows identical to stored ones are skipped; rows at a stored time with other values are
 * reported as conflicts and not stored. Undo deletes an import's rows and recomputes. The job itself is
 * services/import-job/run-import-job.ts.
 */
import { mkdir, open, rename, rm } from 'node:fs/promises';
import path from 'node:path';
import type { DataSource } from 'typeorm';
import { z } from 'zod';
import { importMappingSchema, type ImportMapping, type ImportMappingInput } from '@shared/schemas/import-mapping.js';
import { importCounts, importView as importViewSchema, rowError, type ImportCounts, type ImportView } from '@shared/schemas/imports.js';
import { formatRowErrorReportCsv, guessMapping, openTable, type RowError } from '../import/index.js';
import { averagingFromText, detectTallShape, guessTallMapping, listTags, medianSpacingOf } from '../import/tall-detection.js';
import { surveyTagFiles, TAG_FILE_COLUMNS, TagFilesRefusal, type TagFileEntry, type UploadedTagFile } from '../import/per-tag-files.js';
import { displayName, isWorkbook, readZipDirectory, startsLikeZip, unzipTagFiles, ZipRefusal } from '../import/zip-upload.js';
import { NO_ROOM } from '../http/upload.js';
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
  return { ...head, tall, files: null as TagFileEntry[] | null };
}

/** Files of one tag each read as one tall table (see import/per-tag-files.ts): its columns, first rows and tags. */
function tagFilesPreview(entries: TagFileEntry[]): Awaited<ReturnType<typeof readPreview>> {
  const quality = entries.some((e) => e.qualityColumn !== null);
  const c = TAG_FILE_COLUMNS;
  const first = entries[0]!;
  return {
    kind: 'csv',
    headers: [c.timestamp, c.tag, c.value, ...(quality ? [c.quality] : [])],
    units: [],
    titleLines: [],
    sampleRows: first.times.map((t, i) => [t, first.tag, first.samples[i] ?? '', ...(quality ? [''] : [])]),
    sheets: [],
    sheet: null,
    tall: {
      shape: { timestampColumn: c.timestamp, tagColumn: c.tag, valueColumn: c.value, qualityColumn: quality ? c.quality : null },
      tags: entries.map((e) => ({ name: e.tag, rows: e.rows, samples: e.samples })),
      medianSpacingMinutes: medianSpacingOf(entries.map((e) => e.times)),
      moreTags: false,
    },
    files: entries,
  };
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
  shape: preview.files ? ('per-tag-files' as const) : preview.tall ? ('tall' as const) : ('wide' as const),
  tags: preview.tall?.tags ?? [],
  moreTags: preview.tall?.moreTags ?? false,
  files: (preview.files ?? []).map((e) => ({
    name: e.name,
    tag: e.tag,
    rows: e.rows,
    bytes: e.bytes,
    firstTime: e.firstTime,
    lastTime: e.lastTime,
    hasQuality: e.qualityColumn !== null,
  })),
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

/** Whether an uploaded file is a ZIP of files (not an XLSX workbook, which is a ZIP too): its directory read. */
async function zipOfFiles(file: UploadedFile): Promise<boolean> {
  const fh = await open(file.path, 'r');
  const head = Buffer.alloc(4);
  try {
    await fh.read(head, 0, 4, 0);
  } finally {
    await fh.close();
  }
  if (!startsLikeZip(head) || /\.xls[xm]$/i.test(file.originalname)) return false;
  try {
    return !isWorkbook(await readZipDirectory(file.path));
  } catch (err) {
    // a damaged workbook is told by the workbook reader, as before; a damaged ZIP in our words
    if (err instanceof ZipRefusal && /\.zip$/i.test(file.originalname)) throw err;
    return false;
  }
}

/**
 * Files of one tag each (several, or one ZIP of them) into a folder of their own beside them, as 1.upload, 2.upload, …
 * and surveyed. Anything refused leaves nothing: the folder and every uploaded file are removed.
 */
async function storeTagFiles(files: UploadedFile[], zip: boolean): Promise<{ folder: string; entries: TagFileEntry[] }> {
  const folder = path.join(path.dirname(files[0]!.path), `${Date.now()}-${Math.random().toString(36).slice(2)}.files`);
  try {
    await mkdir(folder);
    let stored: UploadedTagFile[];
    if (zip) {
      stored = await unzipTagFiles(files[0]!.path, folder);
      await rm(files[0]!.path, { force: true });
    } else {
      stored = [];
      for (const [k, f] of files.entries()) {
        // the name as sent is shown and may name the tag: no control characters, no path, at most 120 characters
        const name = displayName(f.originalname);
        if (await zipOfFiles(f)) throw new TagFilesRefusal(`"${name}" is a ZIP: upload a ZIP on its own, or the files in it`);
        const numbered = path.join(folder, `${k + 1}.upload`);
        await rename(f.path, numbered);
        stored.push({ name, path: numbered, bytes: f.size });
      }
    }
    return { folder, entries: await surveyTagFiles(folder, stored) };
  } catch (err) {
    await rm(folder, { recursive: true, force: true });
    await Promise.all(files.map((f) => rm(f.path, { force: true })));
    if (err instanceof ZipRefusal) throw new AppError(err.status, `${err.message} (nothing was stored)`);
    if (err instanceof TagFilesRefusal) throw badRequest(`${err.message} (nothing was stored)`);
    const code = (err as { code?: unknown } | null)?.code;
    if (code === 'ENOSPC' || code === 'EDQUOT') throw new AppError(507, NO_ROOM);
    throw err;
  }
}

/**
 * Stores the upload, reads its header and first rows, and proposes a mapping (the unit's saved one when it fits).
 * Several files, or one ZIP of files, are files of one tag each: they form one import (a folder of them).
 */
export async function receiveUpload(ds: DataSource, scope: TenantScope, unitId: string, files: UploadedFile[]) {
  const file = files[0]!;
  const { unit, plant } = await foundInScope(findUnitWithPlant(ds.manager, scope, unitId), 'No such unit').catch(async (err: unknown) => {
    await Promise.all(files.map((f) => rm(f.path, { force: true })));
    throw err;
  });
  let zip = false;
  if (files.length === 1) {
    try {
      zip = await zipOfFiles(file);
    } catch (err) {
      await rm(file.path, { force: true });
      throw err instanceof ZipRefusal ? new AppError(err.status, `${err.message} (nothing was stored)`) : err;
    }
  }
  if (files.length > 1 || zip) {
    const { folder, entries } = await storeTagFiles(files, zip);
    const preview = tagFilesPreview(entries);
    const fileName = zip ? displayName(file.originalname) : `${files.length} files: ${files.map((f) => displayName(f.originalname)).join(', ')}`;
    try {
      return await saveUpload(ds, scope, unit, plant.timeZone, preview, {
        fileName,
        fileBytes: files.reduce((n, f) => n + f.size, 0),
        fileKind: 'per-tag',
        storedPath: folder,
      });
    } catch (err) {
      await rm(folder, { recursive: true, force: true });
      throw err;
    }
  }
  let preview;
  try {
    preview = await readPreview(file.path);
  } catch (err) {
    await rm(file.path, { force: true });
    throw badRequest(`This file cannot be read as a table: ${err instanceof Error ? err.message : String(err)}`);
  }
  return saveUpload(ds, scope, unit, plant.timeZone, preview, {
    fileName: file.originalname,
    fileBytes: file.size,
    fileKind: preview.kind,
    storedPath: file.path,
  });
}

async function saveUpload(
  ds: DataSource,
  scope: TenantScope,
  unit: GeneratingUnit,
  timeZone: string,
  preview: Awaited<ReturnType<typeof readPreview>>,
  stored: { fileName: string; fileBytes: number; fileKind: string; storedPath: string },
) {
  const proposed = proposeMapping(preview, unit, timeZone);
  const imp = await ds.getRepository(DataImport).save({
    organisationId: scope.organisationId,
    unitId: unit.id,
    uploadedByUserId: scope.userId,
    fileName: stored.fileName.slice(0, 255),
    fileBytes: stored.fileBytes,
    fileKind: stored.fileKind,
    status: 'mapping',
    mapping: proposed.mapping,
    counts: null,
    errors: null,
    errorCount: 0,
    notes: null,
    progress: 0,
    message: null,
    storedPath: stored.storedPath,
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
  if (imp.fileKind === 'per-tag' && !parsed.data.tall) {
    throw badRequest('Files of one tag each are mapped tag by tag: choose the time grid and map each tag to a quantity', {
      fieldErrors: [{ path: 'tall', message: 'choose the time grid for the files of one tag each' }],
    });
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
  // a file, or a folder of files of one tag each
  if (imp.storedPath) await rm(imp.storedPath, { force: true, recursive: true });
  return importView(await ds.getRepository(DataImport).findOneByOrFail({ id: imp.id }));
}
