/**
 * Uploaded files waiting to be mapped hold disk space until they are imported or undone. Three bounds keep that
 * finite: an organisation may keep UPLOAD_WAITING_LIMIT_BYTES waiting (a further upload is refused before a byte
 * is stored), an upload left unmapped for UPLOAD_WAITING_DAYS is discarded with its file (hourly, by every app
 * process that runs background work; the delete is by id and status, so two processes never discard twice), and
 * deleting a unit or plant removes the files of its uploads.
 */
import { rm } from 'node:fs/promises';
import { In, LessThan, Not, IsNull, type DataSource, type EntityManager } from 'typeorm';
import { DataImport } from '../entities/data-import.entity.js';
import { AppError } from '../http/app-error.js';
import { everySoOften } from '../jobs/every-so-often.js';

/** 2 GB: four of the largest single uploads, far more than a planner maps at once. */
export const UPLOAD_WAITING_LIMIT_BYTES = 2 * 1024 ** 3;
export const UPLOAD_WAITING_DAYS = 7;
const DAY_MS = 86_400_000;
const CHECK_EVERY_MS = 60 * 60 * 1000;

/** Refuses an upload while the organisation has its limit of bytes waiting to be mapped. */
export async function assertRoomForUpload(em: EntityManager, organisationId: string): Promise<void> {
  const [row] = (await em.query(`SELECT COALESCE(SUM(fileBytes), 0) AS waiting FROM data_import WHERE organisationId = ? AND status = 'mapping'`, [
    organisationId,
  ])) as { waiting: string | number }[];
  const waiting = Number(row?.waiting ?? 0);
  if (waiting >= UPLOAD_WAITING_LIMIT_BYTES) {
    throw new AppError(
      409,
      `Your organisation has ${(waiting / 1024 ** 3).toFixed(1)} GB of uploaded files waiting to be mapped (at most ${UPLOAD_WAITING_LIMIT_BYTES / 1024 ** 3} GB): import or undo some of them first (nothing was stored)`,
    );
  }
}

/** Removes stored uploads (a file, or a folder of one file per tag); one that is gone already is fine. */
export async function removeUploadFiles(paths: readonly (string | null)[]): Promise<void> {
  await Promise.all(paths.filter((p): p is string => !!p).map((p) => rm(p, { force: true, recursive: true }).catch(() => undefined)));
}

/** The stored uploads of the units' imports, to remove once the units' deletion is committed. */
export async function uploadPathsOfUnits(em: EntityManager, unitIds: readonly string[]): Promise<string[]> {
  if (unitIds.length === 0) return [];
  const rows = await em.getRepository(DataImport).find({ where: { unitId: In([...unitIds]), storedPath: Not(IsNull()) }, select: { storedPath: true } });
  return rows.map((r) => r.storedPath!);
}

/** Discards uploads left unmapped for a week; returns how many. */
export async function discardStaleUploads(ds: DataSource, now = new Date()): Promise<number> {
  const repo = ds.getRepository(DataImport);
  const stale = await repo.find({
    where: { status: 'mapping', createdAt: LessThan(new Date(now.getTime() - UPLOAD_WAITING_DAYS * DAY_MS)) },
    select: { id: true, storedPath: true },
  });
  let discarded = 0;
  for (const imp of stale) {
    // still waiting (not started meanwhile): only then is it this run's to discard
    const gone = await repo.delete({ id: imp.id, status: 'mapping' });
    if (!gone.affected) continue;
    discarded++;
    await removeUploadFiles([imp.storedPath]);
  }
  return discarded;
}

export function startUploadHousekeeping(ds: DataSource, log: (line: string) => void): { stop: () => void } {
  return everySoOften(() => discardStaleUploads(ds), 'upload housekeeping', log, CHECK_EVERY_MS, 30_000);
}
