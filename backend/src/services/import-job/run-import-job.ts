/**
 * The import job, in order: check the file → store its rows → mark it complete and queue the recompute of
 * derived data (as every other change does). A wide file in time order is checked and stored in one read; a
 * rejected file leaves none of its rows. Any failure leaves no rows and a failed import, handled in one place
 * below. A run that takes over from a worker that died starts again from the check.
 */
import { rm } from 'node:fs/promises';
import type { DataSource, EntityManager } from 'typeorm';
import { DataImport } from '../../entities/data-import.entity.js';
import { GeneratingUnit } from '../../entities/generating-unit.entity.js';
import { LostJobLockError, withLease, type JobLease } from '../../jobs/job-queue.js';
import { deleteSamplesOfImport } from '../../repositories/sample.repository.js';
import { checkFile, isTallMapping, rejectImport, startAfresh } from './check-file.js';
import { importProgress } from './import-progress.js';
import { completeAndQueueRecompute } from './queue-recompute.js';
import { checkAndStoreRows, storeRows } from './store-rows.js';
import { statusWordsOfOrganisation } from '../historian-status.service.js';

export async function runImportJob(ds: DataSource, job: JobLease, importId: string): Promise<void> {
  const imp = await ds.getRepository(DataImport).findOneBy({ id: importId });
  // A run after the work was finished (its worker died before saying so) or undone has nothing to do.
  if (!imp || (imp.status !== 'checking' && imp.status !== 'importing')) return;
  try {
    const unit = await ds.getRepository(GeneratingUnit).findOneByOrFail({ id: imp.unitId });
    if (!imp.storedPath) throw new Error('the uploaded file is gone');
    const statusWords = await statusWordsOfOrganisation(ds.manager, imp.organisationId);
    const step = { importId: imp.id, storedPath: imp.storedPath, mapping: imp.mapping, statusWords, progress: importProgress(ds, job, imp.id) };
    if (!isTallMapping(imp.mapping)) {
      // A wide file: checked and stored in one read; a right file out of time order goes in again, sorted.
      await startAfresh(ds, job, imp.id);
      await step.progress(0.02, 'Checking and storing every row');
      const { check, stored } = await checkAndStoreRows(ds, job, { ...step, unit, fileBytes: imp.fileBytes });
      if (!check.ok) await rejectImport(ds, job, imp.id, check);
      else if (stored) await completeAndQueueRecompute(ds, job, imp, stored, check);
      else {
        await startAfresh(ds, job, imp.id);
        await completeAndQueueRecompute(ds, job, imp, await storeRows(ds, job, { ...step, unit, check }), check);
      }
    } else {
      const { check, prepared } = await checkFile(ds, job, step);
      try {
        if (!check.ok || !prepared) await rejectImport(ds, job, imp.id, check);
        else {
          const read = { storedPath: prepared.path, mapping: prepared.mapping, statusWords: prepared.statusWords };
          await completeAndQueueRecompute(ds, job, imp, await storeRows(ds, job, { ...step, ...read, unit, check }), check, prepared.alignment);
        }
      } finally {
        await prepared?.dispose();
      }
    }
  } catch (err) {
    // The worker that took the job over carries on: touch nothing.
    if (err instanceof LostJobLockError) throw err;
    await withLease(ds, job, (em) => failImport(em, imp.id, err instanceof Error ? err.message : String(err)));
    if (imp.storedPath) await rm(imp.storedPath, { force: true, recursive: true });
    throw err;
  }
  // Checked and rejected, or stored: the upload (a file, or a folder of one file per tag) is not needed any more.
  await rm(imp.storedPath, { force: true, recursive: true });
}

/** Deletes what a failed import stored and marks it failed; the rows go as a whole (one import id). */
async function failImport(em: EntityManager, importId: string, reason: string): Promise<void> {
  await deleteSamplesOfImport(em, importId);
  await em
    .getRepository(DataImport)
    .update(
      { id: importId },
      { status: 'failed', progress: 1, message: `The import stopped and stored nothing: ${reason}`.slice(0, 500), finishedAt: new Date() },
    );
}

/** An import job given up after its workers kept dying: nothing of it stays. */
export async function giveUpImport(em: EntityManager, importId: string, reason: string): Promise<void> {
  const imp = await em.getRepository(DataImport).findOneBy({ id: importId });
  if (!imp || (imp.status !== 'checking' && imp.status !== 'importing')) return;
  await failImport(em, importId, reason);
  await em.getRepository(DataImport).update({ id: importId }, { storedPath: null });
  if (imp.storedPath) await rm(imp.storedPath, { force: true, recursive: true });
}
